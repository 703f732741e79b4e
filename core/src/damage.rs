//! Damage of counted cycles by Miner's rule, and the life of a repeated history.
//!
//! Source: Palmgren–Miner linear damage rule, D = Σ nᵢ/Nᵢ (Miner, *J. Appl. Mech.* 12, 1945;
//! Shigley's *Mechanical Engineering Design*, 9th ed., §6-15; from memory). Each cycle's
//! amplitude σa = range/2 and mean σm go through the chosen mean-stress correction
//! ([`crate::mean_stress`]) to σar, and the S–N line ([`crate::sn_curve`]) gives Nᵢ; a half
//! cycle has nᵢ = ½. A cycle at or below the endurance limit, or one that the correction says
//! does no damage, adds nothing. The history repeated 1/D times reaches D = 1.
//!
//! Limits, stated with every result: the rule ignores the order of the cycles, and a cycle in
//! low-cycle fatigue or with a mean at the strength is not given a damage at all: the history
//! then has no life from this rule, only the flag.

use alloc::vec::Vec;

use crate::mean_stress::{MeanStress, Reversed};
use crate::rainflow::RainflowCycle;
use crate::sn_curve::{Life, SnLine};

/// What one counted cycle does.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum CycleDamage {
    /// Its damage n/N (0 at or below the endurance limit).
    Damage(f64),
    /// The correction says it does no damage (Smith–Watson–Topper, σmax ≤ 0).
    NoDamage,
    /// σar at or above the line's stress at 10³ cycles.
    LowCycle,
    /// Its mean reaches the strength.
    MeanBeyondStrength,
    /// A stress or strength could not be used.
    Refused,
}

/// The damage of one counted cycle.
#[must_use]
pub fn of_cycle(
    c: &RainflowCycle,
    mean_stress: MeanStress,
    line: &SnLine,
    sut: f64,
) -> CycleDamage {
    match mean_stress.reversed(c.amplitude(), c.mean, sut) {
        Reversed::Amplitude(sar) => match line.life(sar) {
            Life::Infinite => CycleDamage::Damage(0.0),
            Life::Cycles(n) => CycleDamage::Damage(c.count / n),
            Life::LowCycle => CycleDamage::LowCycle,
        },
        Reversed::NoDamage => CycleDamage::NoDamage,
        Reversed::MeanBeyondStrength => CycleDamage::MeanBeyondStrength,
        Reversed::Refused => CycleDamage::Refused,
    }
}

/// Miner's sum over a history's cycles.
#[derive(Debug, Clone, PartialEq)]
pub struct Miner {
    /// D = Σ nᵢ/Nᵢ over the cycles that have a damage.
    pub total: f64,
    /// Each cycle's damage, in the order of the cycles (0 where it has none).
    pub per_cycle: Vec<f64>,
    /// Cycles (counted in halves) that did damage.
    pub damaging: f64,
    /// Cycles at or below the endurance limit, or without damage by the correction.
    pub harmless: f64,
    /// Cycles in low-cycle fatigue.
    pub low_cycle: f64,
    /// Cycles whose mean reaches the strength.
    pub beyond_strength: f64,
    /// Cycles that could not be judged.
    pub refused: f64,
}

/// The life of a repeated history.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum HistoryLife {
    /// No cycle does damage.
    Infinite,
    /// Repeats of the history until D = 1.
    Repeats(f64),
    /// Some cycle is outside the line or breaks the part: no life from Miner's rule.
    NotGiven,
}

impl Miner {
    /// Sums the damage of `cycles`.
    #[must_use]
    pub fn sum(cycles: &[RainflowCycle], mean_stress: MeanStress, line: &SnLine, sut: f64) -> Self {
        let mut m = Self {
            total: 0.0,
            per_cycle: Vec::with_capacity(cycles.len()),
            damaging: 0.0,
            harmless: 0.0,
            low_cycle: 0.0,
            beyond_strength: 0.0,
            refused: 0.0,
        };
        for c in cycles {
            let d = match of_cycle(c, mean_stress, line, sut) {
                CycleDamage::Damage(d) => {
                    if d > 0.0 {
                        m.damaging += c.count;
                    } else {
                        m.harmless += c.count;
                    }
                    d
                }
                CycleDamage::NoDamage => {
                    m.harmless += c.count;
                    0.0
                }
                CycleDamage::LowCycle => {
                    m.low_cycle += c.count;
                    0.0
                }
                CycleDamage::MeanBeyondStrength => {
                    m.beyond_strength += c.count;
                    0.0
                }
                CycleDamage::Refused => {
                    m.refused += c.count;
                    0.0
                }
            };
            m.total += d;
            m.per_cycle.push(d);
        }
        m
    }

    /// The history's life in repeats: 1/D.
    #[must_use]
    pub fn life(&self) -> HistoryLife {
        if self.low_cycle > 0.0 || self.beyond_strength > 0.0 || self.refused > 0.0 {
            HistoryLife::NotGiven
        } else if self.total > 0.0 {
            HistoryLife::Repeats(1.0 / self.total)
        } else {
            HistoryLife::Infinite
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rainflow::count;

    #[test]
    fn damage_is_the_sum_of_count_over_life() {
        // Written out independently: line through (10³, 0.9·600) and (10⁶, 250).
        let line = SnLine::through_strengths(0.9, 600.0, 250.0).unwrap();
        let a = 540.0f64 * 540.0 / 250.0;
        let b = -(540.0f64 / 250.0).log10() / 3.0;
        let n = |s: f64| (s / a).powf(1.0 / b);
        // 0 → 600 → 0 → 400 → 0 counts as two half cycles of range 600 (mean 300) and one
        // cycle of range 400 (mean 200); with Sut = 900 both are above Se after Goodman.
        let h = [0.0, 600.0, 0.0, 400.0, 0.0];
        let cycles = count(&h).unwrap();
        let m = Miner::sum(&cycles, MeanStress::Goodman, &line, 600.0 * 1.5);
        let expect: f64 = cycles
            .iter()
            .map(|c| {
                let sar = c.amplitude() / (1.0 - c.mean / 900.0);
                if sar <= 250.0 {
                    0.0
                } else {
                    c.count / n(sar)
                }
            })
            .sum();
        assert!(
            (m.total - expect).abs() <= 1e-12 * expect,
            "{} vs {expect}",
            m.total
        );
        assert_eq!(m.life(), HistoryLife::Repeats(1.0 / m.total));
    }

    #[test]
    fn flags_stop_the_life() {
        let line = SnLine::through_strengths(0.9, 600.0, 250.0).unwrap();
        let big = count(&[-600.0, 600.0, -600.0]).unwrap();
        let m = Miner::sum(&big, MeanStress::Goodman, &line, 600.0);
        assert_eq!((m.low_cycle, m.life()), (1.0, HistoryLife::NotGiven));
        let small = count(&[-100.0, 100.0, -100.0]).unwrap();
        let m = Miner::sum(&small, MeanStress::Goodman, &line, 600.0);
        assert_eq!((m.harmless, m.life()), (1.0, HistoryLife::Infinite));
        let compressive = count(&[-300.0, -100.0, -300.0]).unwrap();
        let m = Miner::sum(&compressive, MeanStress::SmithWatsonTopper, &line, 600.0);
        assert_eq!(m.life(), HistoryLife::Infinite);
    }
}
