//! Stress invariants, mean (hydrostatic) stress and the deviatoric tensor.
//!
//! With the characteristic equation written λ³ − I1 λ² + I2 λ − I3 = 0 (e.g. Malvern,
//! *Introduction to the Mechanics of a Continuous Medium*, §3.4, from memory):
//! - I1 = σx + σy + σz
//! - I2 = σxσy + σyσz + σzσx − τxy² − τyz² − τzx²
//! - I3 = det σ
//!
//! Deviatoric stress s = σ − σm·I with σm = I1/3, and its invariants (same source)
//! - J2 = ½ sij sij = ⅙[(σx−σy)² + (σy−σz)² + (σz−σx)²] + τxy² + τyz² + τzx² ≥ 0
//! - J3 = det s
//!
//! Units: I1 and σm in the tensor's unit, I2 and J2 in its square, I3 and J3 in its cube. The
//! squared and cubed values leave double range past about 1e154 and 1e102 of the unit (and below
//! about 1e-154 and 1e-103 they underflow). [`Invariants::of`] then holds ±inf or 0;
//! [`Magnitudes::of`] computes them on the tensor scaled to unit size and reports any value out
//! of range as a decimal mantissa and exponent, never as 0, inf or NaN.

use crate::error::StressError;
use crate::fmath;
use crate::tensor::StressTensor;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// The invariants of one stress tensor.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Invariants {
    /// I1 = tr σ (unit).
    pub i1: f64,
    /// I2 (unit²).
    pub i2: f64,
    /// I3 = det σ (unit³).
    pub i3: f64,
    /// J2 of the deviator (unit²), never negative.
    pub j2: f64,
    /// J3 = det s (unit³).
    pub j3: f64,
    /// Mean (hydrostatic) stress σm = I1/3 (unit); also the octahedral normal stress.
    pub mean: f64,
}

fn det(a: &[[f64; 3]; 3]) -> f64 {
    a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1])
        - a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0])
        + a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0])
}

impl Invariants {
    /// Computes all invariants from the components.
    #[must_use]
    pub fn of(t: &StressTensor) -> Self {
        let [x, y, z, xy, yz, zx] = t.components();
        let i1 = x + y + z;
        let i2 = x * y + y * z + z * x - xy * xy - yz * yz - zx * zx;
        let i3 = det(&t.to_array());
        let m = i1 / 3.0;
        let s = [[x - m, xy, zx], [xy, y - m, yz], [zx, yz, z - m]];
        let j2 = j2_of(t);
        let j3 = det(&s);
        Self {
            i1,
            i2,
            i3,
            j2,
            j3,
            mean: i1 / 3.0,
        }
    }
}

/// A value that may lie outside double range: either an ordinary `f64`, or ±m·10^e.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum Magnitude {
    /// Representable (zero only when the value is exactly zero).
    Finite(f64),
    /// Beyond double range: `mantissa`·10^`exponent`, 1 ≤ |mantissa| < 10.
    OutOfRange {
        /// Signed mantissa, 1 ≤ |m| < 10.
        mantissa: f64,
        /// Decimal exponent.
        exponent: i32,
        /// True when too large (overflow), false when too small (underflow).
        overflow: bool,
    },
}

impl Magnitude {
    /// `x`·`m`^`power` for `m` > 0, where `x` is of order one (a scaled invariant): the ordinary
    /// product when it is a normal f64, else the decimal form.
    #[must_use]
    pub fn scaled(x: f64, m: f64, power: i32) -> Self {
        let v = x * powi(m, power);
        if x == 0.0 || (v.is_finite() && v.abs() >= f64::MIN_POSITIVE) {
            return Self::Finite(v);
        }
        let l = fmath::log10(x.abs()) + f64::from(power) * fmath::log10(m);
        let e = fmath::floor(l);
        let mut mantissa = fmath::powf(10.0, l - e);
        let mut exponent = e as i32;
        if mantissa >= 10.0 {
            mantissa /= 10.0;
            exponent += 1;
        }
        Self::OutOfRange {
            mantissa: if x < 0.0 { -mantissa } else { mantissa },
            exponent,
            overflow: l > 0.0,
        }
    }
}

fn powi(m: f64, power: i32) -> f64 {
    (0..power).fold(1.0, |acc, _| acc * m)
}

/// I2, I3, J2 and J3 computed on the tensor scaled to unit size, so that none is lost to
/// overflow or underflow (I3 of a tensor of size 1e150 is 1e450; of size 1e-150, 1e-450).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Magnitudes {
    /// I2 (unit²).
    pub i2: Magnitude,
    /// I3 (unit³).
    pub i3: Magnitude,
    /// J2 (unit²).
    pub j2: Magnitude,
    /// J3 (unit³).
    pub j3: Magnitude,
}

impl Magnitudes {
    /// The invariants of `t` in range-safe form.
    #[must_use]
    pub fn of(t: &StressTensor) -> Self {
        let (m, c) = scaled(t);
        if m == 0.0 {
            let z = Magnitude::Finite(0.0);
            return Self {
                i2: z,
                i3: z,
                j2: z,
                j3: z,
            };
        }
        let unit =
            StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap_or(StressTensor::ZERO);
        let inv = Invariants::of(&unit);
        Self {
            i2: Magnitude::scaled(inv.i2, m, 2),
            i3: Magnitude::scaled(inv.i3, m, 3),
            j2: Magnitude::scaled(inv.j2, m, 2),
            j3: Magnitude::scaled(inv.j3, m, 3),
        }
    }
}

/// J2 by the difference form, which has no cancellation near hydrostatic states.
fn j2_of(t: &StressTensor) -> f64 {
    let (m, [x, y, z, xy, yz, zx]) = scaled(t);
    let j = ((x - y) * (x - y) + (y - z) * (y - z) + (z - x) * (z - x)) / 6.0
        + xy * xy
        + yz * yz
        + zx * zx;
    j * m * m
}

/// √J2, computed on the tensor scaled to unit size so it never overflows for a finite tensor.
#[must_use]
pub fn sqrt_j2(t: &StressTensor) -> f64 {
    let (m, [x, y, z, xy, yz, zx]) = scaled(t);
    let j = ((x - y) * (x - y) + (y - z) * (y - z) + (z - x) * (z - x)) / 6.0
        + xy * xy
        + yz * yz
        + zx * zx;
    m * crate::fmath::sqrt(j)
}

/// (max|σij|, components / max|σij|); (0, zeros) for the zero tensor.
pub(crate) fn scaled(t: &StressTensor) -> (f64, [f64; 6]) {
    let m = t.max_abs();
    if m == 0.0 {
        (0.0, [0.0; 6])
    } else {
        (m, t.components().map(|v| v / m))
    }
}

/// Mean (hydrostatic) stress σm = (σx + σy + σz)/3, in the tensor's unit.
#[must_use]
pub fn mean_stress(t: &StressTensor) -> f64 {
    t.sx() / 3.0 + t.sy() / 3.0 + t.sz() / 3.0
}

/// The deviatoric tensor s = σ − σm·I (same unit). Its trace is zero to round-off.
///
/// # Errors
/// [`StressError::Overflow`] only if a difference overflows (components beyond ~9e307).
pub fn deviatoric(t: &StressTensor) -> Result<StressTensor, StressError> {
    let m = mean_stress(t);
    StressTensor::derived(
        [
            t.sx() - m,
            t.sy() - m,
            t.sz() - m,
            t.txy(),
            t.tyz(),
            t.tzx(),
        ],
        "the deviatoric stress",
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::principal::principal_values;
    use proptest::prelude::*;

    #[test]
    fn uniaxial_invariants() {
        let t = StressTensor::plane(30.0, 0.0, 0.0).unwrap();
        let inv = Invariants::of(&t);
        assert_eq!((inv.i1, inv.i2, inv.i3), (30.0, 0.0, 0.0));
        assert!((inv.j2 - 300.0).abs() < 1e-12); // σ²/3
        assert!((inv.j3 - 2000.0).abs() < 1e-9); // 2σ³/27
        assert_eq!(inv.mean, 10.0);
    }

    #[test]
    fn invariants_beyond_double_range_are_reported_not_lost() {
        // Uniaxial σ: I3 = 0 exactly; J2 = σ²/3, J3 = 2σ³/27 (Malvern §3.4, from memory).
        // A triaxial diagonal state σ·(1, 2, 3): I3 = 6σ³, I2 = 11σ².
        for (k, want_exp) in [(1e150, 450), (1e-150, -450)] {
            let t = StressTensor::new(k, 2.0 * k, 3.0 * k, 0.0, 0.0, 0.0).unwrap();
            let plain = Invariants::of(&t);
            assert!(plain.i3 == 0.0 || !plain.i3.is_finite(), "{}", plain.i3);
            let m = Magnitudes::of(&t);
            match m.i3 {
                Magnitude::OutOfRange {
                    mantissa,
                    exponent,
                    overflow,
                } => {
                    assert!((mantissa - 6.0).abs() < 1e-12, "{mantissa}");
                    assert_eq!(exponent, want_exp);
                    assert_eq!(overflow, k > 1.0);
                }
                other => panic!("{k}: {other:?}"),
            }
            // I2 = 11σ²: 1.1e301 and 1.1e-299 are still ordinary doubles.
            match m.i2 {
                Magnitude::Finite(v) => assert!((v / (11.0 * k * k) - 1.0).abs() < 1e-12),
                other => panic!("{other:?}"),
            }
        }
        // An exact zero stays an exact zero.
        let t = StressTensor::plane(1e-150, 0.0, 0.0).unwrap();
        assert_eq!(Magnitudes::of(&t).i3, Magnitude::Finite(0.0));
        assert_eq!(
            Magnitudes::of(&StressTensor::ZERO).j2,
            Magnitude::Finite(0.0)
        );
        // Ordinary sizes agree with the plain invariants.
        let t = StressTensor::new(84.0, -22.0, 5.0, 37.0, 3.0, -4.0).unwrap();
        let (p, m) = (Invariants::of(&t), Magnitudes::of(&t));
        match m.i3 {
            Magnitude::Finite(v) => assert!((v - p.i3).abs() < 1e-9 * p.i3.abs()),
            other => panic!("{other:?}"),
        }
    }

    proptest! {
        #[test]
        fn invariants_match_principal_values(c in prop::array::uniform6(-100.0..100.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let [a, b, d] = principal_values(&t);
            let inv = Invariants::of(&t);
            let n = t.frobenius_norm().max(1.0);
            prop_assert!((inv.i1 - (a + b + d)).abs() < 1e-11 * n);
            prop_assert!((inv.i2 - (a * b + b * d + d * a)).abs() < 1e-11 * n * n);
            prop_assert!((inv.i3 - a * b * d).abs() < 1e-11 * n * n * n);
            let m = inv.mean;
            prop_assert!((inv.j3 - (a - m) * (b - m) * (d - m)).abs() < 1e-11 * n * n * n);
            // J2 = I1²/3 − I2 (Malvern, same section).
            prop_assert!((inv.j2 - (inv.i1 * inv.i1 / 3.0 - inv.i2)).abs() < 1e-10 * n * n);
            let s = deviatoric(&t).unwrap();
            prop_assert!((s.sx() + s.sy() + s.sz()).abs() < 1e-12 * n);
        }
    }
}
