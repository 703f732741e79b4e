//! Scalar measures of a stress state used to judge it: von Mises equivalent stress, Tresca stress
//! intensity, octahedral stresses, stress triaxiality and the Lode angle.
//!
//! Formulas (von Mises 1913, Tresca 1864; as collected in e.g. Boresi & Schmidt, *Advanced
//! Mechanics of Materials*, ch. 4, from memory):
//! - σvm = √(3 J2) = √(½[(σ1−σ2)² + (σ2−σ3)² + (σ3−σ1)²])
//! - Tresca intensity σT = σ1 − σ3 (twice the absolute maximum shear)
//! - σoct = I1/3,  τoct = √(2 J2 / 3) = (√2/3)·σvm
//! - triaxiality η = σm / σvm
//! - Lode angle θL ∈ [0°, 60°] from cos 3θL = (3√3/2)·J3 / J2^{3/2}; θL = 0° for uniaxial tension,
//!   30° for pure shear, 60° for uniaxial compression (the convention of Bai & Wierzbicki 2008,
//!   *Int. J. Plasticity* 24:1071, from memory).
//!
//! η and θL are undefined for a hydrostatic state; they are `None` when σvm ≤ 1e-12·‖σ‖, where the
//! deviator is below the precision of the data.

use crate::fmath;
use crate::invariants::{mean_stress, sqrt_j2, Invariants};
use crate::principal::principal_values;
use crate::tensor::StressTensor;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// von Mises signed by the principal stress of largest magnitude: +σvm when |σ1| ≥ |σ3| and
/// σ1 ≥ 0, −σvm when the compressive σ3 is the larger in magnitude (a common practice for
/// counting a history of multiaxial states as one signal; a tie counts as tension, the safe
/// side).
#[must_use]
pub fn signed_von_mises(sigma1: f64, sigma3: f64, von_mises: f64) -> f64 {
    if sigma3.abs() > sigma1.abs() && sigma3 < 0.0 {
        -von_mises
    } else {
        von_mises
    }
}

/// von Mises equivalent stress σvm = √(3 J2) alone, without the principal stresses (see module
/// docs; J2 by its difference form, which never overflows for a finite tensor).
#[must_use]
pub fn von_mises(t: &StressTensor) -> f64 {
    fmath::sqrt(3.0) * sqrt_j2(t)
}

/// Below this fraction of ‖σ‖ the deviator counts as zero (see module docs).
pub const DEVIATOR_FLOOR: f64 = 1e-12;

/// The equivalent and scalar measures of one state, in the tensor's unit (angles in radians).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Equivalent {
    /// von Mises equivalent stress σvm ≥ 0.
    pub von_mises: f64,
    /// Tresca stress intensity σ1 − σ3 ≥ 0.
    pub tresca: f64,
    /// Octahedral normal stress, equal to the mean stress.
    pub octahedral_normal: f64,
    /// Octahedral shear stress ≥ 0.
    pub octahedral_shear: f64,
    /// Stress triaxiality σm/σvm; `None` for a hydrostatic state.
    pub triaxiality: Option<f64>,
    /// Lode angle θL in radians, 0 ≤ θL ≤ π/3; `None` for a hydrostatic state.
    pub lode_angle: Option<f64>,
}

impl Equivalent {
    /// Computes every measure.
    #[must_use]
    pub fn of(t: &StressTensor) -> Self {
        let [s1, _, s3] = principal_values(t);
        let von_mises = von_mises(t);
        let mean = mean_stress(t);
        let defined = von_mises > DEVIATOR_FLOOR * t.frobenius_norm();
        let lode_angle = defined.then(|| {
            // Scale first so J2^{3/2} cannot overflow.
            let k = 1.0 / t.max_abs();
            let Ok(u) = t.scaled(k) else { return 0.0 };
            let inv = Invariants::of(&u);
            let c =
                (1.5 * fmath::sqrt(3.0) * inv.j3 / (inv.j2 * fmath::sqrt(inv.j2))).clamp(-1.0, 1.0);
            fmath::acos(c) / 3.0
        });
        Self {
            von_mises,
            tresca: (s1 - s3).max(0.0),
            octahedral_normal: mean,
            octahedral_shear: fmath::sqrt(2.0) / 3.0 * von_mises,
            triaxiality: defined.then(|| mean / von_mises),
            lode_angle,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use core::f64::consts::PI;
    use proptest::prelude::*;

    fn close(a: f64, b: f64) -> bool {
        (a - b).abs() <= 1e-12 * (1.0 + a.abs().max(b.abs()))
    }

    #[test]
    fn uniaxial_tension_reference_values() {
        let e = Equivalent::of(&StressTensor::plane(90.0, 0.0, 0.0).unwrap());
        assert!(close(e.von_mises, 90.0));
        assert!(close(e.tresca, 90.0));
        assert!(close(e.triaxiality.unwrap(), 1.0 / 3.0));
        assert!(e.lode_angle.unwrap().abs() < 1e-7);
        let c = Equivalent::of(&StressTensor::plane(-90.0, 0.0, 0.0).unwrap());
        assert!((c.lode_angle.unwrap() - PI / 3.0).abs() < 1e-7);
    }

    #[test]
    fn pure_shear_reference_values() {
        let e = Equivalent::of(&StressTensor::plane(0.0, 0.0, 10.0).unwrap());
        assert!(close(e.von_mises, 10.0 * 3f64.sqrt()));
        assert!(close(e.tresca, 20.0));
        assert!(close(e.triaxiality.unwrap(), 0.0));
        assert!((e.lode_angle.unwrap() - PI / 6.0).abs() < 1e-12);
    }

    #[test]
    fn hydrostatic_has_no_triaxiality_or_lode_angle() {
        let e = Equivalent::of(&StressTensor::new(5.0, 5.0, 5.0, 0.0, 0.0, 0.0).unwrap());
        assert_eq!(e.von_mises, 0.0);
        assert_eq!(e.triaxiality, None);
        assert_eq!(e.lode_angle, None);
        assert_eq!(e.octahedral_normal, 5.0);
    }

    #[test]
    fn huge_values_do_not_overflow() {
        let e = Equivalent::of(&StressTensor::plane(1e300, -1e300, 0.0).unwrap());
        assert!(close(e.von_mises / 1e300, 3f64.sqrt()));
        assert!(e.lode_angle.is_some());
    }

    proptest! {
        #[test]
        fn principal_form_of_von_mises_agrees(c in prop::array::uniform6(-100.0..100.0f64)) {
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let [a, b, d] = principal_values(&t);
            let e = Equivalent::of(&t);
            let vm = (0.5 * ((a - b).powi(2) + (b - d).powi(2) + (d - a).powi(2))).sqrt();
            prop_assert!((e.von_mises - vm).abs() < 1e-11 * (1.0 + vm));
            // τoct = ⅓√((σ1−σ2)² + (σ2−σ3)² + (σ3−σ1)²)
            let toct = ((a - b).powi(2) + (b - d).powi(2) + (d - a).powi(2)).sqrt() / 3.0;
            prop_assert!((e.octahedral_shear - toct).abs() < 1e-11 * (1.0 + toct));
            // Tresca is never below von Mises, and at most 2/√3 times it.
            prop_assert!(e.tresca >= e.von_mises * (1.0 - 1e-12));
            prop_assert!(e.tresca <= e.von_mises * 2.0 / 3f64.sqrt() * (1.0 + 1e-12) + 1e-12);
        }
    }
}
