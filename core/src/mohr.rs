//! Mohr's circles: the in-plane circle of a plane state with its face points, and the three
//! circles of a 3D state (Mohr 1882; e.g. Boresi & Schmidt, *Advanced Mechanics of Materials*,
//! §2.4, from memory).
//!
//! Points. The face whose outward normal n is at angle φ from x (about z) plots at
//! (σn, τnt), where t is n turned +90° and τnt = −(σx−σy)/2·sin 2φ + τxy·cos 2φ. So the x face is
//! X = (σx, τxy) and the y face is Y = (σy, −τxy): diametrically opposite, and turning the face by φ
//! moves its point by 2φ around the centre.
//!
//! Plotting shear: two conventions exist; see [`ShearAxis`]. The default draws positive τ
//! downward, which makes a counter-clockwise turn of the element a counter-clockwise turn on the
//! diagram.
//!
//! In 3D the admissible (σn, |τn|) of every plane lie in the region inside the large circle C13 and
//! outside the two small ones C12 and C23.

use crate::error::StressError;
use crate::fmath;
use crate::principal::Principal;
use crate::tensor::StressTensor;
use crate::transform::{rotate_about_z, InPlane};
use core::f64::consts::FRAC_1_SQRT_2;
use nalgebra::Vector3;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Which way positive shear stress points on the diagram's vertical axis.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum ShearAxis {
    /// Positive τ drawn downward. A counter-clockwise turn θ of the element moves its face point
    /// counter-clockwise by 2θ. The default.
    #[default]
    PositiveDown,
    /// Positive τ drawn upward (the usual orientation of a graph). A counter-clockwise turn θ of the
    /// element moves its face point clockwise by 2θ.
    PositiveUp,
}

impl ShearAxis {
    /// The height of shear `tau` above the σ axis on the drawn diagram.
    #[must_use]
    pub fn height(self, tau: f64) -> f64 {
        match self {
            Self::PositiveDown => -tau,
            Self::PositiveUp => tau,
        }
    }

    /// The axis label, stating the direction.
    #[must_use]
    pub fn label(self) -> &'static str {
        match self {
            Self::PositiveDown => "τ, positive downward ↓",
            Self::PositiveUp => "τ, positive upward ↑",
        }
    }

    /// The direction of positive shear in words ("positive downward ↓"), for any shear-like axis.
    #[must_use]
    pub fn direction(self) -> &'static str {
        match self {
            Self::PositiveDown => "positive downward ↓",
            Self::PositiveUp => "positive upward ↑",
        }
    }

    /// How turning the element turns the point on the diagram.
    #[must_use]
    pub fn rotation_note(self) -> &'static str {
        match self {
            Self::PositiveDown => {
                "a counter-clockwise turn θ of the element moves its point 2θ counter-clockwise"
            }
            Self::PositiveUp => {
                "a counter-clockwise turn θ of the element moves its point 2θ clockwise"
            }
        }
    }
}

/// A circle on the σ axis, in the tensor's unit.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct MohrCircle {
    /// Centre on the σ axis.
    pub centre: f64,
    /// Radius ≥ 0, the largest shear stress on the family of planes it describes.
    pub radius: f64,
}

impl MohrCircle {
    /// The circle through σ = a and σ = b on the σ axis.
    #[must_use]
    pub fn through(a: f64, b: f64) -> Self {
        Self {
            centre: 0.5 * a + 0.5 * b,
            radius: (0.5 * a - 0.5 * b).abs(),
        }
    }

    /// Signed distance of (σ, τ) from the circle: negative inside, positive outside.
    #[must_use]
    pub fn distance(&self, sigma: f64, tau: f64) -> f64 {
        fmath::hypot(sigma - self.centre, tau) - self.radius
    }
}

/// A point (σ, τ) on a diagram, in the tensor's unit; τ with the sign of the tensor convention.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct FacePoint {
    /// Normal stress on the face.
    pub sigma: f64,
    /// Shear stress τnt on the face (see module docs).
    pub tau: f64,
}

/// The in-plane circle of the x–y plane with the x, y and rotated faces.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct PlaneMohr {
    /// The circle through X and Y.
    pub circle: MohrCircle,
    /// In-plane principal and shear faces.
    pub in_plane: InPlane,
    /// X = (σx, τxy).
    pub x_face: FacePoint,
    /// Y = (σy, −τxy).
    pub y_face: FacePoint,
    /// X′ = (σx′, τx′y′) for the element turned by θ.
    pub x_rotated: FacePoint,
    /// Y′ = (σy′, −τx′y′).
    pub y_rotated: FacePoint,
    /// The turn θ in radians.
    pub theta: f64,
}

impl PlaneMohr {
    /// The in-plane diagram for the tensor's x–y components, with the element turned by `theta`
    /// radians about z.
    ///
    /// # Errors
    /// As [`rotate_about_z`].
    pub fn of(t: &StressTensor, theta: f64) -> Result<Self, StressError> {
        let in_plane = InPlane::of(t);
        let r = rotate_about_z(t, theta)?;
        Ok(Self {
            circle: MohrCircle {
                centre: in_plane.centre,
                radius: in_plane.radius,
            },
            in_plane,
            x_face: FacePoint {
                sigma: t.sx(),
                tau: t.txy(),
            },
            y_face: FacePoint {
                sigma: t.sy(),
                tau: -t.txy(),
            },
            x_rotated: FacePoint {
                sigma: r.sx(),
                tau: r.txy(),
            },
            y_rotated: FacePoint {
                sigma: r.sy(),
                tau: -r.txy(),
            },
            theta,
        })
    }
}

/// The three circles of a 3D state and the absolute maximum shear.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Mohr3d {
    /// σ1 ≥ σ2 ≥ σ3 with directions.
    pub principal: Principal,
    /// C12, through σ1 and σ2.
    pub c12: MohrCircle,
    /// C23, through σ2 and σ3.
    pub c23: MohrCircle,
    /// C13, through σ1 and σ3: the largest.
    pub c13: MohrCircle,
}

impl Mohr3d {
    /// The circles of `t`.
    #[must_use]
    pub fn of(t: &StressTensor) -> Self {
        let principal = Principal::of(t);
        let [s1, s2, s3] = principal.values();
        Self {
            principal,
            c12: MohrCircle::through(s1, s2),
            c23: MohrCircle::through(s2, s3),
            c13: MohrCircle::through(s1, s3),
        }
    }

    /// Absolute maximum shear stress τmax = (σ1 − σ3)/2, the radius of C13.
    #[must_use]
    pub fn tau_max(&self) -> f64 {
        self.c13.radius
    }

    /// The two unit normals of the planes carrying τmax: (n1 ± n3)/√2, at 45° to the σ1 and σ3
    /// directions and containing the σ2 direction. Normal stress on both is (σ1 + σ3)/2.
    #[must_use]
    pub fn tau_max_normals(&self) -> [Vector3<f64>; 2] {
        let [n1, _, n3] = self.principal.directions();
        [(n1 + n3) * FRAC_1_SQRT_2, (n1 - n3) * FRAC_1_SQRT_2]
    }

    /// True when (σ, τ) lies in the admissible region (inside C13, outside C12 and C23), allowing
    /// `tol` in stress units for round-off.
    #[must_use]
    pub fn admits(&self, sigma: f64, tau: f64, tol: f64) -> bool {
        self.c13.distance(sigma, tau) <= tol
            && self.c12.distance(sigma, tau) >= -tol
            && self.c23.distance(sigma, tau) >= -tol
    }

    /// For a plane state: true when the absolute maximum shear exceeds the maximum in-plane shear,
    /// i.e. the largest shear acts on a plane tilted out of x–y. This happens whenever σa and σb
    /// have the same sign (σz = 0 is then the smallest or the largest principal stress).
    #[must_use]
    pub fn out_of_plane_shear_governs(&self, in_plane: &InPlane) -> bool {
        self.tau_max() > in_plane.radius * (1.0 + 1e-12) + 1e-300
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::transform::PlaneTraction;
    use proptest::prelude::*;

    #[test]
    fn face_points_are_diametrically_opposite() {
        let t = StressTensor::plane(80.0, -20.0, 30.0).unwrap();
        let m = PlaneMohr::of(&t, 0.4).unwrap();
        for p in [m.x_face, m.y_face, m.x_rotated, m.y_rotated] {
            assert!(m.circle.distance(p.sigma, p.tau).abs() < 1e-12);
        }
        assert!((m.x_face.sigma + m.y_face.sigma - 2.0 * m.circle.centre).abs() < 1e-12);
        assert!((m.x_face.tau + m.y_face.tau).abs() < 1e-12);
    }

    #[test]
    fn turning_the_element_turns_the_point_by_twice_the_angle() {
        let t = StressTensor::plane(80.0, -20.0, 30.0).unwrap();
        let th = 0.3;
        let m = PlaneMohr::of(&t, th).unwrap();
        let c = m.circle.centre;
        for axis in [ShearAxis::PositiveDown, ShearAxis::PositiveUp] {
            let a0 = axis.height(m.x_face.tau).atan2(m.x_face.sigma - c);
            let a1 = axis.height(m.x_rotated.tau).atan2(m.x_rotated.sigma - c);
            let turned = a1 - a0;
            let expect = if axis == ShearAxis::PositiveDown {
                2.0 * th
            } else {
                -2.0 * th
            };
            assert!((turned - expect).abs() < 1e-12, "{axis:?}: {turned}");
        }
    }

    #[test]
    fn equal_biaxial_plane_stress_has_out_of_plane_max_shear() {
        // A thin sphere under pressure: σa = σb = σ, σz = 0. In-plane shear is zero everywhere but
        // τmax = σ/2 on planes at 45° to the wall (standard thin-shell result).
        let t = StressTensor::plane(60.0, 60.0, 0.0).unwrap();
        let ip = InPlane::of(&t);
        let m = Mohr3d::of(&t);
        assert_eq!(ip.radius, 0.0);
        assert!((m.tau_max() - 30.0).abs() < 1e-12);
        assert!(m.out_of_plane_shear_governs(&ip));
        let opposite = StressTensor::plane(60.0, -60.0, 0.0).unwrap();
        assert!(!Mohr3d::of(&opposite).out_of_plane_shear_governs(&InPlane::of(&opposite)));
    }

    proptest! {
        #[test]
        fn every_plane_lands_in_the_admissible_region(c in prop::array::uniform6(-100.0..100.0f64), n in prop::array::uniform3(-1.0..1.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let n = Vector3::new(n[0], n[1], n[2]);
            prop_assume!(n.norm() > 1e-3);
            let pt = PlaneTraction::on(&t, n).unwrap();
            let m = Mohr3d::of(&t);
            prop_assert!(m.admits(pt.normal, pt.shear, 1e-9 * (1.0 + t.frobenius_norm())));
        }

        #[test]
        fn tau_max_planes_carry_tau_max(c in prop::array::uniform6(-100.0..100.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let m = Mohr3d::of(&t);
            for n in m.tau_max_normals() {
                let pt = PlaneTraction::on(&t, n).unwrap();
                prop_assert!((pt.shear - m.tau_max()).abs() < 1e-9 * (1.0 + m.tau_max()));
                prop_assert!((pt.normal - m.c13.centre).abs() < 1e-9 * (1.0 + t.frobenius_norm()));
            }
        }

        #[test]
        fn centres_lie_between_their_principal_values(c in prop::array::uniform6(-100.0..100.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let m = Mohr3d::of(&t);
            // C12 and C23 fit inside C13: r12 + r23 = r13.
            prop_assert!((m.c12.radius + m.c23.radius - m.c13.radius).abs() < 1e-10 * (1.0 + m.c13.radius));
        }
    }
}
