//! Stresses on rotated faces: the plane-stress transformation about z, in-plane principal and
//! maximum-shear angles, rotation of the full tensor, and the traction on any plane.
//!
//! Angle convention: θ > 0 turns the x′ axis counter-clockwise from x towards y, about +z.
//! The plane transformation equations (e.g. Gere & Goodno, *Mechanics of Materials*, §7.2,
//! from memory):
//! - σx′ = (σx+σy)/2 + (σx−σy)/2·cos 2θ + τxy·sin 2θ
//! - σy′ = (σx+σy)/2 − (σx−σy)/2·cos 2θ − τxy·sin 2θ
//! - τx′y′ = −(σx−σy)/2·sin 2θ + τxy·cos 2θ
//!
//! and, for a 3D tensor turned about z, τx′z′ = τzx·cos θ + τyz·sin θ, τy′z′ = −τzx·sin θ + τyz·cos θ,
//! σz′ = σz. A general rotation gives σ′ = Rᵀ σ R, R's columns being the new axes in the old ones.

use crate::error::StressError;
use crate::fmath;
use crate::tensor::StressTensor;
use core::f64::consts::FRAC_PI_4;
use nalgebra::{Rotation3, Vector3};
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// The tensor expressed in axes x′, y′, z turned by `theta` (radians) about z.
///
/// # Errors
/// [`StressError::NonFinite`] if `theta` is not finite; [`StressError::Overflow`] if a
/// component overflows (|σ| near f64::MAX).
pub fn rotate_about_z(t: &StressTensor, theta: f64) -> Result<StressTensor, StressError> {
    if !theta.is_finite() {
        return Err(StressError::NonFinite { component: "θ" });
    }
    let (s2, c2) = (fmath::sin(2.0 * theta), fmath::cos(2.0 * theta));
    let (s1, c1) = (fmath::sin(theta), fmath::cos(theta));
    // Halves first, so that components near f64::MAX do not overflow on the way.
    let avg = 0.5 * t.sx() + 0.5 * t.sy();
    let half = 0.5 * t.sx() - 0.5 * t.sy();
    let sxp = avg + half * c2 + t.txy() * s2;
    let syp = avg - half * c2 - t.txy() * s2;
    let txyp = -half * s2 + t.txy() * c2;
    let txzp = t.tzx() * c1 + t.tyz() * s1;
    let tyzp = -t.tzx() * s1 + t.tyz() * c1;
    StressTensor::derived([sxp, syp, t.sz(), txyp, tyzp, txzp], "the turned element")
}

/// Unit normal of the x′ face of an element turned by `theta` radians about z: (cos θ, sin θ, 0).
#[must_use]
pub fn face_normal_about_z(theta: f64) -> Vector3<f64> {
    Vector3::new(fmath::cos(theta), fmath::sin(theta), 0.0)
}

/// The tensor in axes turned by `r` (columns of `r` are the new axes): σ′ = Rᵀ σ R.
///
/// # Errors
/// [`StressError::Overflow`] only if a component overflows (|σ| near f64::MAX).
pub fn rotate(t: &StressTensor, r: &Rotation3<f64>) -> Result<StressTensor, StressError> {
    let m = r.matrix().transpose() * t.to_matrix() * r.matrix();
    StressTensor::try_from_nalgebra(&(0.5 * (m + m.transpose()))).map_err(|e| match e {
        StressError::NonFinite { .. } => StressError::Overflow {
            what: "the rotated tensor",
        },
        other => other,
    })
}

/// In-plane (x–y) results of a plane state: the circle, principal and maximum-shear faces.
///
/// For a 3D tensor these are the stationary values over faces turned about z; they are principal
/// stresses only when τyz = τzx = 0.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct InPlane {
    /// Centre of the in-plane circle, (σx+σy)/2.
    pub centre: f64,
    /// Radius √(((σx−σy)/2)² + τxy²), also the maximum in-plane shear stress.
    pub radius: f64,
    /// Larger in-plane principal stress σa = centre + radius.
    pub sigma_a: f64,
    /// Smaller in-plane principal stress σb = centre − radius.
    pub sigma_b: f64,
    /// Angle θp (radians, in (−π/2, π/2]) from x to the face carrying σa:
    /// θp = ½·atan2(2τxy, σx−σy).
    pub theta_p: f64,
    /// Angle θs = θp − π/4 (radians, wrapped into (−π/2, π/2]) to the face on which τx′y′ = +radius;
    /// the normal stress there is `centre`.
    pub theta_s: f64,
    /// The in-plane state is isotropic (σx = σy, τxy = 0 to round-off: the circle is a point).
    /// Every in-plane direction is then principal; θp and θs are set to 0 and mean nothing.
    pub isotropic: bool,
}

/// Relative size below which an in-plane circle's radius counts as zero (round-off of the
/// components, about 100 ulp): the state is then isotropic in the plane.
pub const ISOTROPIC_TOLERANCE: f64 = 1e-14;

fn wrap_half_turn(a: f64) -> f64 {
    use core::f64::consts::PI;
    let mut a = a;
    while a <= -PI / 2.0 {
        a += PI;
    }
    while a > PI / 2.0 {
        a -= PI;
    }
    a
}

impl InPlane {
    /// From σx, σy, τxy of the tensor.
    #[must_use]
    pub fn of(t: &StressTensor) -> Self {
        let centre = 0.5 * t.sx() + 0.5 * t.sy();
        let half = 0.5 * t.sx() - 0.5 * t.sy();
        let radius = fmath::hypot(half, t.txy());
        let size = t.sx().abs().max(t.sy().abs()).max(t.txy().abs());
        let isotropic = radius <= ISOTROPIC_TOLERANCE * size;
        let theta_p = if isotropic {
            0.0
        } else {
            wrap_half_turn(0.5 * fmath::atan2(t.txy(), half))
        };
        Self {
            centre,
            radius,
            sigma_a: centre + radius,
            sigma_b: centre - radius,
            theta_p,
            theta_s: if isotropic {
                0.0
            } else {
                wrap_half_turn(theta_p - FRAC_PI_4)
            },
            isotropic,
        }
    }
}

/// The stress vector on a plane and its split into normal and shear parts.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct PlaneTraction {
    /// The unit normal actually used (the input normalised).
    pub normal_vector: Vector3<f64>,
    /// Traction t = σ·n (Cauchy's formula), in the tensor's unit.
    pub traction: Vector3<f64>,
    /// Normal stress σn = n·σ·n, tension positive.
    pub normal: f64,
    /// Magnitude of the shear stress, τn = |t − σn n| ≥ 0.
    pub shear: f64,
    /// Unit direction of the shear stress in the plane; `None` when τn is zero to round-off.
    pub shear_direction: Option<Vector3<f64>>,
}

impl PlaneTraction {
    /// The traction on the plane with normal `n` (any non-zero finite length, 1e-320 and 1e308
    /// included: it is scaled by its largest component before it is normalised, so squaring
    /// neither underflows nor overflows).
    ///
    /// # Errors
    /// [`StressError::DegenerateNormal`] when `n` is zero or not finite;
    /// [`StressError::Overflow`] when the traction overflows (components near f64::MAX).
    pub fn on(t: &StressTensor, n: Vector3<f64>) -> Result<Self, StressError> {
        let big = n.amax();
        if !(big.is_finite() && big > 0.0) || n.iter().any(|v| !v.is_finite()) {
            return Err(StressError::DegenerateNormal);
        }
        let n = n / big;
        let n = n / n.norm();
        let traction = t.traction(&n);
        if traction.iter().any(|v| !v.is_finite()) {
            return Err(StressError::Overflow {
                what: "the traction on the plane",
            });
        }
        let normal = n.dot(&traction);
        let shear_vec = traction - n * normal;
        let shear = shear_vec.norm();
        let floor = 1e-14 * t.frobenius_norm();
        Ok(Self {
            normal_vector: n,
            traction,
            normal,
            shear,
            shear_direction: (shear > floor).then(|| shear_vec / shear),
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use core::f64::consts::{FRAC_PI_2, PI};
    use proptest::prelude::*;

    fn arb_plane() -> impl Strategy<Value = StressTensor> {
        prop::array::uniform3(-500.0..500.0f64)
            .prop_map(|c| StressTensor::plane(c[0], c[1], c[2]).unwrap())
    }

    proptest! {
        #[test]
        fn rotation_about_z_matches_the_general_rotation(c in prop::array::uniform6(-100.0..100.0f64), th in -PI..PI) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let a = rotate_about_z(&t, th).unwrap();
            let b = rotate(&t, &Rotation3::from_axis_angle(&Vector3::z_axis(), th)).unwrap();
            for (x, y) in a.components().iter().zip(b.components()) {
                prop_assert!((x - y).abs() < 1e-11, "{a:?} vs {b:?}");
            }
        }

        #[test]
        fn rotate_then_unrotate(c in prop::array::uniform6(-100.0..100.0f64), th in -PI..PI) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let back = rotate_about_z(&rotate_about_z(&t, th).unwrap(), -th).unwrap();
            for (x, y) in t.components().iter().zip(back.components()) {
                prop_assert!((x - y).abs() < 1e-11);
            }
        }

        #[test]
        fn principal_face_has_no_shear_and_shear_face_has_max(t in arb_plane()) {
            let ip = InPlane::of(&t);
            let p = rotate_about_z(&t, ip.theta_p).unwrap();
            prop_assert!(p.txy().abs() < 1e-10);
            prop_assert!((p.sx() - ip.sigma_a).abs() < 1e-10);
            let s = rotate_about_z(&t, ip.theta_s).unwrap();
            prop_assert!((s.txy() - ip.radius).abs() < 1e-10);
            prop_assert!((s.sx() - ip.centre).abs() < 1e-10);
            // Invariant under rotation: σx′ + σy′ = σx + σy.
            prop_assert!((p.sx() + p.sy() - t.sx() - t.sy()).abs() < 1e-10);
        }

        #[test]
        fn traction_splits_consistently(c in prop::array::uniform6(-100.0..100.0f64), n in prop::array::uniform3(-1.0..1.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let n = Vector3::new(n[0], n[1], n[2]);
            prop_assume!(n.norm() > 1e-3);
            let pt = PlaneTraction::on(&t, n).unwrap();
            let tn = pt.traction.norm();
            prop_assert!((pt.normal * pt.normal + pt.shear * pt.shear - tn * tn).abs() < 1e-9 * (1.0 + tn * tn));
        }
    }

    #[test]
    fn angles_are_wrapped() {
        let ip = InPlane::of(&StressTensor::plane(-10.0, 10.0, 0.0).unwrap());
        assert!((ip.theta_p - FRAC_PI_2).abs() < 1e-15); // σa = 10 acts on the y face
        assert!((ip.theta_s - FRAC_PI_4).abs() < 1e-15);
        assert_eq!(InPlane::of(&StressTensor::ZERO).theta_p, 0.0);
    }

    #[test]
    fn zero_normal_is_refused() {
        let t = StressTensor::plane(1.0, 2.0, 3.0).unwrap();
        assert_eq!(
            PlaneTraction::on(&t, Vector3::zeros()),
            Err(StressError::DegenerateNormal)
        );
        assert_eq!(
            PlaneTraction::on(&t, Vector3::new(f64::NAN, 0.0, 0.0)),
            Err(StressError::DegenerateNormal)
        );
    }

    #[test]
    fn extreme_normals_are_normalised() {
        // A normal of 1e308 components overflowed the squared length, and one of 1e-320
        // (subnormal) underflowed it to zero; both are valid directions.
        let t = StressTensor::plane(84.0, -22.0, 37.0).unwrap();
        let want = PlaneTraction::on(&t, Vector3::new(1.0, 1.0, 1.0)).unwrap();
        for k in [1e308, 1.7e308, 1e-320, 5e-324] {
            let got = PlaneTraction::on(&t, Vector3::new(k, k, k)).unwrap();
            assert!(
                (got.normal_vector - want.normal_vector).norm() < 1e-15,
                "{k}"
            );
            assert!((got.normal - want.normal).abs() < 1e-12, "{k}");
            assert!((got.normal_vector.norm() - 1.0).abs() < 1e-15);
        }
        let got = PlaneTraction::on(&t, Vector3::new(1e-320, 0.0, 0.0)).unwrap();
        assert_eq!(got.normal_vector, Vector3::new(1.0, 0.0, 0.0));
        assert_eq!(got.normal, 84.0);
    }

    #[test]
    fn an_isotropic_plane_state_is_flagged() {
        // σx = σy, τxy = 0: every in-plane direction is principal (the circle is a point).
        for (x, y, s) in [(50.0, 50.0, 0.0), (0.0, 0.0, 0.0), (-3e-200, -3e-200, 0.0)] {
            let ip = InPlane::of(&StressTensor::plane(x, y, s).unwrap());
            assert!(ip.isotropic, "{x} {y} {s}");
        }
        // Round-off of summed components (0.1 + 0.2 vs 0.3) is still isotropic.
        let ip = InPlane::of(&StressTensor::plane(0.1 + 0.2, 0.3, 0.0).unwrap());
        assert!(ip.isotropic);
        let ip = InPlane::of(&StressTensor::plane(50.0, 50.0, 1e-9).unwrap());
        assert!(!ip.isotropic);
        assert!((ip.theta_p - FRAC_PI_4).abs() < 1e-12);
    }

    #[test]
    fn an_overflowing_turn_says_overflow() {
        // Finite components whose turned values exceed f64::MAX: an overflow, not a bad σx.
        let t = StressTensor::plane(1.7e308, -1.7e308, 1.7e308).unwrap();
        let e = rotate_about_z(&t, 0.3).unwrap_err();
        assert!(matches!(e, StressError::Overflow { .. }), "{e:?}");
        assert!(std::format!("{e}").contains("overflows"), "{e}");
        // The halves-first form keeps σx = σy = 1.7e308 in range.
        let t = StressTensor::plane(1.7e308, 1.7e308, 0.0).unwrap();
        assert!(rotate_about_z(&t, 0.3).is_ok());
    }
}
