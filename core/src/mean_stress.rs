//! Mean-stress corrections for life: a cycle of amplitude σa about a mean σm turned into the
//! fully reversed amplitude σar that does the same damage on the S–N line.
//!
//! Formulas (Shigley's *Mechanical Engineering Design*, 9th ed., §6-14 and the strain-life
//! literature it cites; Dowling, *Mechanical Behavior of Materials*, ch. 9; all from memory):
//! - Goodman: σar = σa / (1 − σm/Sut)
//! - Gerber: σar = σa / (1 − (σm/Sut)²)
//! - Smith–Watson–Topper: σar = √(σmax·σa), σmax = σm + σa
//! - Morrow: σar = σa / (1 − σm/σ′f), σ′f the fatigue strength coefficient
//!
//! Sign conventions, stated beside every result: tension positive. A compressive mean (σm < 0)
//! gives σar = σa for Goodman, Gerber and Morrow (common practice: a compressive mean is not
//! taken to help). Smith–Watson–Topper with σmax ≤ 0 does no damage. A mean at or above Sut (or
//! at or above σ′f for Morrow) is failure on the first cycle, never a number.

use core::fmt;

use crate::fmath;

/// A mean-stress correction.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum MeanStress {
    /// σa / (1 − σm/Sut).
    Goodman,
    /// σa / (1 − (σm/Sut)²).
    Gerber,
    /// √((σm + σa)·σa).
    SmithWatsonTopper,
    /// σa / (1 − σm/σ′f), with the fatigue strength coefficient σ′f (same unit as the stresses).
    Morrow {
        /// σ′f.
        sigma_f: f64,
    },
}

impl MeanStress {
    /// The correction's name.
    #[must_use]
    pub fn name(&self) -> &'static str {
        match self {
            Self::Goodman => "Goodman",
            Self::Gerber => "Gerber",
            Self::SmithWatsonTopper => "Smith–Watson–Topper",
            Self::Morrow { .. } => "Morrow",
        }
    }

    /// The equivalent fully reversed amplitude of a cycle of amplitude `sa` (≥ 0) about mean
    /// `sm`, for a material of ultimate strength `sut` (> 0); all in one unit.
    #[must_use]
    pub fn reversed(&self, sa: f64, sm: f64, sut: f64) -> Reversed {
        if !(sa.is_finite() && sm.is_finite() && sa >= 0.0 && sut > 0.0) {
            return Reversed::Refused;
        }
        if sm >= sut {
            return Reversed::MeanBeyondStrength;
        }
        let amplitude = match *self {
            Self::Goodman if sm > 0.0 => sa / (1.0 - sm / sut),
            Self::Gerber if sm > 0.0 => sa / (1.0 - (sm / sut) * (sm / sut)),
            Self::Morrow { sigma_f } if !(sigma_f.is_finite() && sigma_f > 0.0) => {
                return Reversed::Refused
            }
            Self::Morrow { sigma_f } if sm >= sigma_f => return Reversed::MeanBeyondStrength,
            Self::Morrow { sigma_f } if sm > 0.0 => sa / (1.0 - sm / sigma_f),
            Self::SmithWatsonTopper => {
                let max = sm + sa;
                if max <= 0.0 {
                    return Reversed::NoDamage;
                }
                fmath::sqrt(max * sa)
            }
            _ => sa,
        };
        if amplitude.is_finite() {
            Reversed::Amplitude(amplitude)
        } else {
            Reversed::Refused
        }
    }
}

/// What a mean-stress correction makes of one cycle.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Reversed {
    /// The equivalent fully reversed amplitude σar.
    Amplitude(f64),
    /// Smith–Watson–Topper with σmax ≤ 0: the cycle never opens a crack; no damage.
    NoDamage,
    /// σm ≥ Sut (or σ′f): the mean alone breaks the part.
    MeanBeyondStrength,
    /// A stress or strength is not finite, an amplitude is negative, or a strength is not
    /// positive.
    Refused,
}

impl fmt::Display for Reversed {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::Amplitude(a) => write!(f, "{a}"),
            Self::NoDamage => write!(
                f,
                "no damage (the cycle's peak σmax = σm + σa is not tensile)"
            ),
            Self::MeanBeyondStrength => write!(f, "the mean stress reaches the strength: failure"),
            Self::Refused => write!(f, "the amplitude, mean or strength is not a usable number"),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    #[test]
    fn each_correction_meets_its_formula() {
        let (sa, sm, sut) = (100.0, 200.0, 800.0);
        assert_eq!(
            MeanStress::Goodman.reversed(sa, sm, sut),
            Reversed::Amplitude(100.0 / 0.75)
        );
        assert_eq!(
            MeanStress::Gerber.reversed(sa, sm, sut),
            Reversed::Amplitude(100.0 / (1.0 - 0.0625))
        );
        assert_eq!(
            MeanStress::SmithWatsonTopper.reversed(sa, sm, sut),
            Reversed::Amplitude((300.0f64 * 100.0).sqrt())
        );
        assert_eq!(
            MeanStress::Morrow { sigma_f: 1000.0 }.reversed(sa, sm, sut),
            Reversed::Amplitude(125.0)
        );
    }

    #[test]
    fn compressive_means_and_limits_are_stated_cases() {
        for c in [
            MeanStress::Goodman,
            MeanStress::Gerber,
            MeanStress::Morrow { sigma_f: 900.0 },
        ] {
            assert_eq!(c.reversed(50.0, -300.0, 800.0), Reversed::Amplitude(50.0));
            assert_eq!(c.reversed(50.0, 800.0, 800.0), Reversed::MeanBeyondStrength);
        }
        assert_eq!(
            MeanStress::SmithWatsonTopper.reversed(50.0, -60.0, 800.0),
            Reversed::NoDamage
        );
        assert_eq!(
            MeanStress::Morrow { sigma_f: 500.0 }.reversed(50.0, 600.0, 800.0),
            Reversed::MeanBeyondStrength
        );
        assert_eq!(
            MeanStress::Goodman.reversed(-1.0, 0.0, 800.0),
            Reversed::Refused
        );
        assert_eq!(
            MeanStress::Morrow { sigma_f: 0.0 }.reversed(1.0, 0.0, 800.0),
            Reversed::Refused
        );
    }

    proptest! {
        #[test]
        fn a_tensile_mean_never_lowers_the_amplitude(sa in 0.0f64..500.0, sm in 0.0f64..799.0) {
            for c in [MeanStress::Goodman, MeanStress::Gerber, MeanStress::Morrow { sigma_f: 1200.0 }] {
                let Reversed::Amplitude(a) = c.reversed(sa, sm, 800.0) else { panic!() };
                prop_assert!(a >= sa);
            }
            // Gerber's parabola lies outside Goodman's line: it corrects less.
            let (Reversed::Amplitude(g), Reversed::Amplitude(p)) =
                (MeanStress::Goodman.reversed(sa, sm, 800.0), MeanStress::Gerber.reversed(sa, sm, 800.0))
                else { panic!() };
            prop_assert!(p <= g);
        }
    }
}
