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
//! squared and cubed values overflow to infinity past about 1e154 and 1e102 of the unit; no
//! engineering stress comes near.

use crate::error::StressError;
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
/// [`StressError::NonFinite`] only if a difference overflows (components beyond ~9e307).
pub fn deviatoric(t: &StressTensor) -> Result<StressTensor, StressError> {
    let m = mean_stress(t);
    StressTensor::new(
        t.sx() - m,
        t.sy() - m,
        t.sz() - m,
        t.txy(),
        t.tyz(),
        t.tzx(),
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
