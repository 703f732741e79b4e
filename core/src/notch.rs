//! Notch sensitivity: how much of a notch's theoretical factor Kt a steel feels in fatigue.
//!
//! Sources (Shigley's *Mechanical Engineering Design*, 9th ed., §6-10, from memory):
//! - Neuber's equation q = 1/(1 + √a/√r), r the notch root radius;
//! - Neuber's constant fitted against the ultimate strength (Sut in kpsi, √a in √in), valid for
//!   50 ≤ Sut ≤ 250 kpsi:
//!   bending or axial (eq. 6-35a) √a = 0.246 − 3.08·10⁻³·Sut + 1.51·10⁻⁵·Sut² − 2.67·10⁻⁸·Sut³;
//!   torsion (eq. 6-35b) √a = 0.190 − 2.51·10⁻³·Sut + 1.35·10⁻⁵·Sut² − 2.67·10⁻⁸·Sut³;
//! - the fatigue factors Kf = 1 + q·(Kt − 1) and Kfs = 1 + qs·(Kts − 1).
//!
//! Inputs here are in MPa and mm; the fits are evaluated in their own units (1 kpsi =
//! 6.894 757 MPa, 1 in = 25.4 mm) and the result converted back.

use core::fmt;

use crate::fatigue::Loading;
use crate::fmath;

/// MPa in one kpsi.
const MPA_PER_KPSI: f64 = 6.894_757_293_168_361;
/// Millimetres in one inch.
const MM_PER_IN: f64 = 25.4;

/// Why a notch sensitivity was refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum NotchError {
    /// Sut outside the fit's 50–250 kpsi (345–1724 MPa); the strength in MPa.
    StrengthRange(f64),
    /// The fit gives √a ≤ 0 at this strength (torsion near 250 kpsi); the strength in MPa.
    FitNotPositive(f64),
    /// A radius, strength or factor is not usable; names it.
    NotUsable(&'static str),
}

impl fmt::Display for NotchError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::StrengthRange(s) => write!(
                f,
                "Neuber's fit covers Sut from 50 to 250 kpsi (345 to 1724 MPa); this material's is {s:.0} MPa — type q instead"
            ),
            Self::FitNotPositive(s) => write!(
                f,
                "Neuber's fit gives no positive constant at Sut = {s:.0} MPa for this loading — type q instead"
            ),
            Self::NotUsable(n) => write!(f, "{n} must be a positive number"),
        }
    }
}

/// Neuber's constant √a in √mm for a steel of ultimate strength `sut_mpa`, in bending or axial
/// loading (`Loading::Bending`, `Loading::Axial`) or torsion.
///
/// # Errors
/// [`NotchError`] outside 50–250 kpsi or where the fit is not positive.
pub fn neuber_constant(sut_mpa: f64, loading: Loading) -> Result<f64, NotchError> {
    if !sut_mpa.is_finite() {
        return Err(NotchError::NotUsable("Sut"));
    }
    let s = sut_mpa / MPA_PER_KPSI;
    if !(50.0..=250.0).contains(&s) {
        return Err(NotchError::StrengthRange(sut_mpa));
    }
    let c0 = match loading {
        Loading::Torsion => [0.190, -2.51e-3, 1.35e-5, -2.67e-8],
        Loading::Bending | Loading::Axial => [0.246, -3.08e-3, 1.51e-5, -2.67e-8],
    };
    let sqrt_a_in = c0[0] + s * (c0[1] + s * (c0[2] + s * c0[3]));
    if sqrt_a_in <= 0.0 {
        return Err(NotchError::FitNotPositive(sut_mpa));
    }
    Ok(sqrt_a_in * fmath::sqrt(MM_PER_IN))
}

/// Neuber's q = 1/(1 + √a/√r) for a root radius `r_mm` and constant `sqrt_a` (√mm).
///
/// # Errors
/// [`NotchError::NotUsable`] for a radius or constant that is not positive.
pub fn sensitivity(sqrt_a: f64, r_mm: f64) -> Result<f64, NotchError> {
    if !(r_mm.is_finite() && r_mm > 0.0) {
        return Err(NotchError::NotUsable("the notch radius"));
    }
    if !(sqrt_a.is_finite() && sqrt_a > 0.0) {
        return Err(NotchError::NotUsable("Neuber's constant"));
    }
    Ok(1.0 / (1.0 + sqrt_a / fmath::sqrt(r_mm)))
}

/// The fatigue factor Kf = 1 + q·(Kt − 1) (Kfs from Kts and qs alike).
///
/// # Errors
/// [`NotchError::NotUsable`] for Kt < 1 or q outside [0, 1].
pub fn fatigue_factor(kt: f64, q: f64) -> Result<f64, NotchError> {
    if !(kt.is_finite() && kt >= 1.0) {
        return Err(NotchError::NotUsable("Kt (at least 1)"));
    }
    if !(0.0..=1.0).contains(&q) {
        return Err(NotchError::NotUsable("q (0 to 1)"));
    }
    Ok(1.0 + q * (kt - 1.0))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn neubers_constant_meets_the_published_fit() {
        // Sut = 100 kpsi, bending: √a = 0.246 − 0.308 + 0.151 − 0.0267 = 0.0623 √in.
        let a = neuber_constant(100.0 * MPA_PER_KPSI, Loading::Bending).unwrap();
        assert!((a / MM_PER_IN.sqrt() - 0.0623).abs() < 1e-12);
        // Torsion at 100 kpsi: 0.190 − 0.251 + 0.135 − 0.0267 = 0.0473 √in.
        let t = neuber_constant(100.0 * MPA_PER_KPSI, Loading::Torsion).unwrap();
        assert!((t / MM_PER_IN.sqrt() - 0.0473).abs() < 1e-12);
        assert_eq!(
            neuber_constant(300.0, Loading::Bending),
            Err(NotchError::StrengthRange(300.0))
        );
        let s = 250.0 * MPA_PER_KPSI;
        assert_eq!(
            neuber_constant(s, Loading::Torsion),
            Err(NotchError::FitNotPositive(s))
        );
        assert!(neuber_constant(s, Loading::Bending).is_ok());
    }

    #[test]
    fn sensitivity_and_factor_follow_neuber() {
        // r = 0.1 in with √a = 0.0623 √in: q = 1/(1 + 0.0623/√0.1) = 0.8354 (Shigley fig. 6-20
        // reads about 0.83 at 100 kpsi and r = 0.1 in, from memory).
        let a = neuber_constant(100.0 * MPA_PER_KPSI, Loading::Bending).unwrap();
        let q = sensitivity(a, 2.54).unwrap();
        assert!((q - 1.0 / (1.0 + 0.0623 / 0.1f64.sqrt())).abs() < 1e-12);
        assert!((q - 0.835).abs() < 0.001);
        assert!((fatigue_factor(2.0, q).unwrap() - (1.0 + q)).abs() < 1e-15);
        assert!(fatigue_factor(0.5, q).is_err());
        assert!(sensitivity(a, 0.0).is_err());
    }
}
