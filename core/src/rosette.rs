//! Strain-gauge rosettes: from gauge readings to the in-plane strain state εx, εy, γxy.
//!
//! Each gauge at angle θ (counter-clockwise from x, radians) reads the normal strain
//! ε(θ) = εx·cos²θ + εy·sin²θ + γxy·sinθ·cosθ (strain transformation; e.g. Dally & Riley,
//! *Experimental Stress Analysis*, ch. 9, from memory). Three gauges in three different directions
//! determine the state; four or more are reduced by least squares (SVD), and the residual of
//! each gauge is reported — a large one flags a bad gauge or a non-uniform field.
//!
//! Transverse sensitivity (Vishay Micro-Measurements Tech Note TN-509, from memory): a gauge with
//! transverse-sensitivity coefficient Kt, calibrated on a beam with Poisson's ratio ν0, reads
//! ε̂ = [ε(θ) + Kt·ε(θ + 90°)] / (1 − ν0·Kt). With the correction on, that model is solved
//! instead, so the correction works for any layout, not only the tabulated ones.
//!
//! Rectangular (0/45/90) and delta (0/60/120) rosettes are the special cases of the same solve.
//! Strains are dimensionless; shear strain is engineering γ.

use crate::error::StressError;
use crate::fmath;
use crate::hooke::Elastic;
use crate::tensor::StressTensor;
use crate::transform::InPlane;
use alloc::vec::Vec;
use core::fmt;
use nalgebra::{DMatrix, DVector};

/// One gauge: its direction and its reading.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Gauge {
    /// Direction, radians counter-clockwise from x.
    pub angle: f64,
    /// Reading, strain (not microstrain).
    pub strain: f64,
}

/// The gauges' transverse sensitivity and the ν0 of their calibration beam.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Transverse {
    /// Transverse-sensitivity coefficient Kt (a fraction, e.g. 0.012 for 1.2 %).
    pub kt: f64,
    /// Poisson's ratio of the calibration beam (0.285 in the usual calibration, common practice).
    pub nu0: f64,
}

/// Why a rosette could not be reduced.
#[derive(Debug, Clone, PartialEq)]
pub enum RosetteError {
    /// Fewer than three gauges.
    TooFew(usize),
    /// Gauge `index` (0-based) has a reading or angle that is not a finite number.
    NonFinite(usize),
    /// The directions do not determine the state (condition number given).
    Singular(f64),
    /// Kt outside (−1, 1) or ν0 outside (−1, 0.5).
    BadTransverse,
}

impl fmt::Display for RosetteError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::TooFew(n) => write!(f, "a rosette needs at least three gauges; {n} given"),
            Self::NonFinite(i) => write!(f, "gauge {}: angle and reading must be finite numbers", i + 1),
            Self::Singular(c) if c.is_infinite() => write!(
                f,
                "the gauge directions cannot separate εx, εy and γxy: three different directions are needed (θ and θ + 180° count as one)"
            ),
            Self::Singular(c) => write!(
                f,
                "the gauge directions are too close to separate εx, εy and γxy (condition number {c:.1e}); spread them at least a few degrees apart"
            ),
            Self::BadTransverse => write!(f, "transverse sensitivity Kt must lie in (−1, 1) and ν0 in (−1, 0.5)"),
        }
    }
}

/// The reduced rosette.
#[derive(Debug, Clone, PartialEq)]
pub struct RosetteStrain {
    /// εx
    pub ex: f64,
    /// εy
    pub ey: f64,
    /// γxy (engineering)
    pub gxy: f64,
    /// Reading minus the reading the solved state predicts, per gauge (zero for three gauges).
    pub residuals: Vec<f64>,
    /// In-plane principal strains [ε1, ε2], ε1 ≥ ε2.
    pub principal: [f64; 2],
    /// Angle from x to the ε1 direction, radians in (−π/2, π/2]; 0 and meaningless when
    /// `isotropic`.
    pub theta_p: f64,
    /// The in-plane strain is isotropic (εx = εy, γxy = 0 to round-off of the reduction): every
    /// direction is principal, and no principal angle exists.
    pub isotropic: bool,
    /// Maximum in-plane shear strain γmax = ε1 − ε2.
    pub gamma_max: f64,
}

/// Relative size (to the largest reading) below which the reduced in-plane strain circle counts
/// as a point: round-off of the least-squares solve, far below any gauge's resolution.
pub const ISOTROPIC_TOLERANCE: f64 = 1e-12;

/// Above this condition number the layout is refused as too close to singular.
pub const MAX_CONDITION: f64 = 1e6;

/// Reduces gauge readings to the strain state.
///
/// # Errors
/// [`RosetteError`]: too few gauges, non-finite input, a singular layout, or bad Kt/ν0.
pub fn reduce(
    gauges: &[Gauge],
    transverse: Option<Transverse>,
) -> Result<RosetteStrain, RosetteError> {
    if gauges.len() < 3 {
        return Err(RosetteError::TooFew(gauges.len()));
    }
    if let Some(i) = gauges
        .iter()
        .position(|g| !(g.angle.is_finite() && g.strain.is_finite()))
    {
        return Err(RosetteError::NonFinite(i));
    }
    let (kt, scale) = match transverse {
        None => (0.0, 1.0),
        Some(t) => {
            if !(t.kt.is_finite()
                && t.kt.abs() < 1.0
                && t.nu0.is_finite()
                && t.nu0 > -1.0
                && t.nu0 < 0.5)
            {
                return Err(RosetteError::BadTransverse);
            }
            (t.kt, 1.0 - t.nu0 * t.kt)
        }
    };
    let n = gauges.len();
    // Row i: the reading × (1 − ν0 Kt) = [cos² + Kt sin², sin² + Kt cos², (1 − Kt) sin cos]·(εx, εy, γ).
    let a = DMatrix::from_fn(n, 3, |i, j| {
        let (s, c) = (fmath::sin(gauges[i].angle), fmath::cos(gauges[i].angle));
        match j {
            0 => c * c + kt * s * s,
            1 => s * s + kt * c * c,
            _ => (1.0 - kt) * s * c,
        }
    });
    let b = DVector::from_fn(n, |i, _| gauges[i].strain * scale);
    let svd = a.clone().svd(true, true);
    let sv = &svd.singular_values;
    let (hi, lo) = (sv.max(), sv.min());
    if lo <= hi * 1e-12 {
        return Err(RosetteError::Singular(f64::INFINITY));
    }
    if hi / lo > MAX_CONDITION {
        return Err(RosetteError::Singular(hi / lo));
    }
    let x = svd
        .solve(&b, 0.0)
        .map_err(|_| RosetteError::Singular(f64::INFINITY))?;
    let predicted = &a * &x;
    let residuals = (0..n).map(|i| (b[i] - predicted[i]) / scale).collect();
    let (ex, ey, gxy) = (x[0], x[1], x[2]);
    // The strain tensor's in-plane part has the same algebra as a stress tensor with τ = γ/2.
    let ip = StressTensor::plane(ex, ey, 0.5 * gxy)
        .map(|t| InPlane::of(&t))
        .map_err(|_| RosetteError::NonFinite(0))?;
    let size = gauges.iter().fold(0.0_f64, |m, g| m.max(g.strain.abs()));
    let isotropic = ip.isotropic || ip.radius <= ISOTROPIC_TOLERANCE * size;
    Ok(RosetteStrain {
        ex,
        ey,
        gxy,
        residuals,
        principal: [ip.sigma_a, ip.sigma_b],
        // The least-squares solve leaves round-off of about 1e-15 of the readings.
        isotropic,
        theta_p: if isotropic { 0.0 } else { ip.theta_p },
        gamma_max: 2.0 * ip.radius,
    })
}

impl RosetteStrain {
    /// Normal strain ε and half the engineering shear strain γ/2 on the direction at `angle`
    /// (radians from x): the point of that direction on the strain Mohr circle, by the same
    /// transformation as stress with τ = γ/2.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] for a non-finite angle.
    pub fn on_direction(&self, angle: f64) -> Result<(f64, f64), StressError> {
        let t = StressTensor::plane(self.ex, self.ey, 0.5 * self.gxy)?;
        let r = crate::transform::rotate_about_z(&t, angle)?;
        Ok((r.sx(), r.txy()))
    }

    /// The plane-stress state at the gauged surface by Hooke's law.
    ///
    /// # Errors
    /// [`StressError`] if a stress overflows.
    pub fn stress(&self, material: &Elastic) -> Result<StressTensor, StressError> {
        material
            .plane_stress(self.ex, self.ey, self.gxy, 0.0)
            .map(|(s, _)| s)
    }
}

/// Gauge angles of a rectangular rosette: 0°, 45°, 90°.
pub const RECTANGULAR: [f64; 3] = [
    0.0,
    core::f64::consts::FRAC_PI_4,
    core::f64::consts::FRAC_PI_2,
];
/// Gauge angles of a delta rosette: 0°, 60°, 120°.
pub const DELTA: [f64; 3] = [
    0.0,
    core::f64::consts::FRAC_PI_3,
    2.0 * core::f64::consts::FRAC_PI_3,
];

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;
    use std::string::ToString;
    use std::vec;

    fn gauges(angles: &[f64], readings: &[f64]) -> Vec<Gauge> {
        angles
            .iter()
            .zip(readings)
            .map(|(&angle, &strain)| Gauge { angle, strain })
            .collect()
    }

    fn reading(ex: f64, ey: f64, g: f64, th: f64) -> f64 {
        ex * th.cos().powi(2) + ey * th.sin().powi(2) + g * th.sin() * th.cos()
    }

    #[test]
    fn rectangular_rosette_matches_its_reduction_equations() {
        // εx = εa, εy = εc, γxy = 2εb − εa − εc (Vishay TN-515, from memory).
        let (a, b, c) = (850e-6, 210e-6, -320e-6);
        let r = reduce(&gauges(&RECTANGULAR, &[a, b, c]), None).unwrap();
        assert!((r.ex - a).abs() < 1e-15 && (r.ey - c).abs() < 1e-15);
        assert!((r.gxy - (2.0 * b - a - c)).abs() < 1e-15);
        assert!(r.residuals.iter().all(|x| x.abs() < 1e-15));
    }

    #[test]
    fn delta_rosette_matches_its_reduction_equations() {
        // εx = εa, εy = (2εb + 2εc − εa)/3, γxy = 2(εb − εc)/√3 (Vishay TN-515, from memory).
        let (a, b, c) = (400e-6, -150e-6, 620e-6);
        let r = reduce(&gauges(&DELTA, &[a, b, c]), None).unwrap();
        assert!((r.ex - a).abs() < 1e-15);
        assert!((r.ey - (2.0 * b + 2.0 * c - a) / 3.0).abs() < 1e-15);
        assert!((r.gxy - 2.0 * (b - c) / 3f64.sqrt()).abs() < 1e-15);
    }

    #[test]
    fn transverse_correction_matches_the_rectangular_formulas() {
        // TN-509 (from memory), rectangular rosette, all gauges with the same Kt:
        // εx = (1 − ν0Kt)/(1 − Kt²)·(ε̂a − Kt ε̂c), εy likewise, and
        // ε45 = (1 − ν0Kt)/(1 − Kt²)·[ε̂b − Kt(ε̂a + ε̂c − ε̂b)].
        let (a, b, c) = (850e-6, 210e-6, -320e-6);
        let t = Transverse {
            kt: 0.03,
            nu0: 0.285,
        };
        let r = reduce(&gauges(&RECTANGULAR, &[a, b, c]), Some(t)).unwrap();
        let k = (1.0 - t.nu0 * t.kt) / (1.0 - t.kt * t.kt);
        assert!((r.ex - k * (a - t.kt * c)).abs() < 1e-15);
        assert!((r.ey - k * (c - t.kt * a)).abs() < 1e-15);
        let e45 = k * (b - t.kt * (a + c - b));
        assert!((reading(r.ex, r.ey, r.gxy, RECTANGULAR[1]) - e45).abs() < 1e-15);
    }

    #[test]
    fn equal_readings_are_isotropic_with_no_principal_angle() {
        // All gauges reading the same strain: εx = εy, γxy = 0 for any layout (the strain
        // transformation, e.g. Gere & Goodno §7.7, from memory), so every direction is principal.
        for layout in [&RECTANGULAR[..], &DELTA[..], &[0.1, 0.9, 2.0, 2.7][..]] {
            let r = reduce(&gauges(layout, &vec![250e-6; layout.len()]), None).unwrap();
            assert!(r.isotropic, "{layout:?}: {r:?}");
            assert!((r.principal[0] - 250e-6).abs() < 1e-15);
            assert!(r.gamma_max.abs() < 1e-15);
        }
        let r = reduce(&gauges(&DELTA, &[400e-6, -100e-6, 250e-6]), None).unwrap();
        assert!(!r.isotropic);
    }

    #[test]
    fn singular_layouts_are_refused_with_the_reason() {
        let e = reduce(
            &gauges(&[0.0, core::f64::consts::PI, 1.0], &[1e-4, 1e-4, 2e-4]),
            None,
        )
        .unwrap_err();
        assert_eq!(e, RosetteError::Singular(f64::INFINITY));
        assert!(e.to_string().contains("three different directions"));
        let near = reduce(&gauges(&[0.0, 1e-4, 2e-4], &[1e-4, 1e-4, 1e-4]), None).unwrap_err();
        assert!(
            matches!(near, RosetteError::Singular(c) if c.is_finite()),
            "{near:?}"
        );
        assert_eq!(
            reduce(&gauges(&[0.0, 1.0], &[0.0, 0.0]), None),
            Err(RosetteError::TooFew(2))
        );
        assert_eq!(
            reduce(&gauges(&[0.0, 1.0, f64::NAN], &[0.0; 3]), None),
            Err(RosetteError::NonFinite(2))
        );
        let bad = Some(Transverse {
            kt: 1.5,
            nu0: 0.285,
        });
        assert_eq!(
            reduce(&gauges(&RECTANGULAR, &[0.0; 3]), bad),
            Err(RosetteError::BadTransverse)
        );
    }

    #[test]
    fn each_gauge_direction_lies_on_the_strain_circle() {
        let r = reduce(&gauges(&RECTANGULAR, &[850e-6, 210e-6, -320e-6]), None).unwrap();
        let (c, rad) = (0.5 * (r.principal[0] + r.principal[1]), 0.5 * r.gamma_max);
        for th in [0.0, 0.3, 1.2, 2.9] {
            let (e, g2) = r.on_direction(th).unwrap();
            assert!(((e - c).hypot(g2) - rad).abs() < 1e-15);
            assert!((e - reading(r.ex, r.ey, r.gxy, th)).abs() < 1e-15);
        }
    }

    #[test]
    fn a_bad_gauge_shows_in_the_residuals() {
        let (ex, ey, g) = (500e-6, -100e-6, 300e-6);
        // Four gauges: one redundancy, so a bad gauge is detected (not located).
        let four = [0.0, 0.7, 1.4, 2.3];
        let mut rd: Vec<f64> = four.iter().map(|&t| reading(ex, ey, g, t)).collect();
        assert!(reduce(&gauges(&four, &rd), None)
            .unwrap()
            .residuals
            .iter()
            .all(|r| r.abs() < 1e-15));
        rd[3] += 200e-6;
        let bad = reduce(&gauges(&four, &rd), None).unwrap();
        assert!(
            bad.residuals.iter().any(|r| r.abs() > 20e-6),
            "{:?}",
            bad.residuals
        );
        // Six gauges 30° apart: the bad one has the largest residual.
        let six: Vec<f64> = (0..6)
            .map(|k| f64::from(k) * core::f64::consts::PI / 6.0)
            .collect();
        let mut rd: Vec<f64> = six.iter().map(|&t| reading(ex, ey, g, t)).collect();
        rd[3] += 200e-6;
        let r = reduce(&gauges(&six, &rd), None).unwrap();
        let worst = r
            .residuals
            .iter()
            .enumerate()
            .max_by(|a, b| a.1.abs().total_cmp(&b.1.abs()))
            .unwrap()
            .0;
        assert_eq!(worst, 3, "{:?}", r.residuals);
    }

    proptest! {
        #[test]
        fn a_known_stress_state_comes_back_from_its_gauge_readings(
            sx in -300.0..300.0f64, sy in -300.0..300.0f64, txy in -150.0..150.0f64,
            base in 0.0..3.2f64, kt in -0.05..0.05f64, correct in any::<bool>(),
        ) {
            let m = Elastic::try_new(205e3, 0.29).unwrap();
            let s = StressTensor::plane(sx, sy, txy).unwrap();
            let eps = m.strain(&s, 0.0);
            let t = Transverse { kt, nu0: 0.285 };
            let angles = [base, base + 0.9, base + 2.1];
            let g: Vec<Gauge> = angles.iter().map(|&th| {
                let along = reading(eps.ex, eps.ey, eps.gxy, th);
                let across = reading(eps.ex, eps.ey, eps.gxy, th + core::f64::consts::FRAC_PI_2);
                let strain = if correct { (along + kt * across) / (1.0 - t.nu0 * kt) } else { along };
                Gauge { angle: th, strain }
            }).collect();
            let r = reduce(&g, correct.then_some(t)).unwrap();
            let back = r.stress(&m).unwrap();
            for (a, b) in s.components().iter().zip(back.components()) {
                prop_assert!((a - b).abs() < 1e-8, "{a} vs {b}");
            }
            prop_assert!(r.principal[0] >= r.principal[1]);
            prop_assert!((r.gamma_max - (r.principal[0] - r.principal[1])).abs() < 1e-15);
            let _ = vec![0];
        }
    }
}
