//! The fatigue check: the cycle whose first state is the one on screen (its second state from a
//! ratio R or typed), the endurance limit (given, or estimated with Marin factors), and every
//! fatigue criterion's factor of safety. No formula here: every number comes from
//! `stresscase-core`.

use super::strength::is_steel;
use crate::model::choices::{Choices, Cycle, Endurance, KtFrom, NotchQ};
use crate::model::inputs::Num;
use crate::model::source::{self, problem, shape_factors, Numbers, SourceProblem};
use stresscase_core::fatigue::{self, FatigueCriterion, FatigueError, Loading, Marin};
use stresscase_core::material::Strengths;
use stresscase_core::notch;
use stresscase_core::section::Rank;
use stresscase_core::{AngleUnit, StressTensor, StressUnit};

/// The fatigue part of a judgement, stresses in the case's unit.
#[derive(Debug, Clone, PartialEq)]
pub struct FatigueOutcome {
    /// The cycle as mean and alternating tensors.
    pub cycle: fatigue::Cycle,
    /// von Mises alternating equivalent σa,eq.
    pub sa: f64,
    /// von Mises mean equivalent σm,eq, signed by I1.
    pub sm: f64,
    /// The endurance limit used.
    pub se: f64,
    /// Se′ and the Marin factors, when estimated.
    pub estimate: Option<(f64, Marin)>,
    /// Each criterion's factor of safety (`None`: unloaded, or the material has no Sy).
    pub factors: Vec<(FatigueCriterion, Option<f64>)>,
    /// The fatigue criterion whose factor is the verdict.
    pub in_use: FatigueCriterion,
    /// R = σmin/σmax of a proportional cycle; `None` when the second state is typed (then the
    /// cycle at other points of a section is unknown).
    pub ratio: Option<f64>,
    /// A caution about the estimate (set when the material is not a steel).
    pub caution: Option<&'static str>,
    /// On a section with loads: the notch factors the fatigue states use.
    pub notch: Option<NotchFactors>,
}

/// The fatigue factors of a section's notch: Kf = 1 + q·(Kt − 1), Kfs = 1 + qs·(Kts − 1).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct NotchFactors {
    /// Kt (normal).
    pub kt: f64,
    /// Kts (shear).
    pub kts: f64,
    /// q (normal).
    pub q: f64,
    /// qs (shear).
    pub qs: f64,
    /// Kf.
    pub kf: f64,
    /// Kfs.
    pub kfs: f64,
    /// Neuber's constants √a and √as (√mm) when q and qs come from Neuber's equation.
    pub neuber: Option<(f64, f64)>,
}

/// The notch factors of the case's section (`sut` in `unit`).
fn notch_factors(
    c: &Choices,
    n: &impl Numbers,
    sut: f64,
    unit: StressUnit,
) -> Result<NotchFactors, SourceProblem> {
    let shape = shape_factors(c, n)?;
    let (kt, kts) = (shape.kt, shape.kts);
    let (q, qs, neuber) = match c.notch_q {
        NotchQ::Typed => (n.get(Num::Q), n.get(Num::Qs), None),
        NotchQ::Neuber => {
            let sut_mpa = unit.convert(sut, StressUnit::MPa);
            // The shape's own radius when Kt comes from a fit, else the typed one.
            let (r, r_num) = match shape.radius {
                Some(r) if c.kt_from == KtFrom::Hole => (r, Num::KtHole),
                Some(r) => (r, Num::KtR),
                None => (n.get(Num::NotchR), Num::NotchR),
            };
            let r_mm = r * c.length.metres() * 1000.0;
            let constant =
                |l| notch::neuber_constant(sut_mpa, l).map_err(|e| problem(r_num, e.to_string()));
            let (a, a_s) = (constant(Loading::Bending)?, constant(Loading::Torsion)?);
            let q = |a| notch::sensitivity(a, r_mm).map_err(|e| problem(r_num, e.to_string()));
            (q(a)?, q(a_s)?, Some((a, a_s)))
        }
    };
    let kf = notch::fatigue_factor(kt, q).map_err(|e| {
        problem(
            if !(0.0..=1.0).contains(&q) {
                Num::Q
            } else if c.kt_from != KtFrom::Typed {
                Num::KtBig
            } else {
                Num::Kt
            },
            e.to_string(),
        )
    })?;
    let kfs = notch::fatigue_factor(kts, qs).map_err(|e| {
        problem(
            if (0.0..=1.0).contains(&qs) {
                Num::Kts
            } else {
                Num::Qs
            },
            e.to_string(),
        )
    })?;
    Ok(NotchFactors {
        kt,
        kts,
        q,
        qs,
        kf,
        kfs,
        neuber,
    })
}

impl FatigueOutcome {
    /// Whether a criterion's factor is judged (pass/fail): the one in use and the first-cycle
    /// yield check. The others are reference figures.
    #[must_use]
    pub fn judged(&self, c: FatigueCriterion) -> bool {
        c == self.in_use || c == FatigueCriterion::FirstCycleYield
    }

    /// The factor of the criterion in use (`None`: unloaded).
    #[must_use]
    pub fn factor_in_use(&self) -> Option<f64> {
        self.factors
            .iter()
            .find(|(c, _)| *c == self.in_use)
            .and_then(|(_, n)| *n)
    }

    /// How severe another state (same unit) is with this cycle's ratio R, Se and criterion:
    /// 1/n (0 when unloaded), ties to the larger mean equivalent. `None` without a proportional
    /// cycle.
    #[must_use]
    pub fn rank(&self, t: &StressTensor, s: &Strengths) -> Option<Rank> {
        let r = self.ratio?;
        let sut = s.ultimate_tensile();
        let rank = t
            .scaled(r)
            .and_then(|min| fatigue::Cycle::from_extremes(t, &min))
            .map(|cycle| {
                let (sa, sm) = cycle.equivalents();
                let sy = s.yield_strength().unwrap_or(sut);
                Rank {
                    severity: severity(fatigue::factor(self.in_use, sa, sm, self.se, sut, sy)),
                    tie: sm,
                }
            });
        Some(rank.unwrap_or(Rank {
            severity: f64::NAN,
            tie: 0.0,
        }))
    }
}

/// 1/n for a search (0 when unloaded), so the most severe point has the lowest factor.
fn severity(n: Option<f64>) -> f64 {
    n.map_or(0.0, |n| 1.0 / n)
}

/// The shown caution when Se is estimated for a material that is not a steel.
pub const NOT_A_STEEL: &str = "Se′ = 0.5·Sut is a correlation for steels. Aluminium alloys, brass and plastics have no endurance limit: give the fatigue strength at the design life instead.";

/// The fatigue check of the cycle whose first state is `tensor` (in `unit`), with the case's
/// material strengths `s` (in `unit`).
///
/// # Errors
/// The refused input, attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    on_screen: &StressTensor,
    (unit, angle): (StressUnit, AngleUnit),
    s: &Strengths,
) -> Result<FatigueOutcome, SourceProblem> {
    let overflow = |num| problem(num, "the cycle overflows; check the magnitudes");
    // On a section with loads the fatigue states come from the loads through Kf and Kfs.
    let notch = if c.notch_fatigue() {
        Some(notch_factors(c, n, s.ultimate_tensile(), unit)?)
    } else {
        None
    };
    let (first, loads_cycle) = match &notch {
        Some(f) => source::fatigue_states(c, n, unit, angle, f.kf, f.kfs)?,
        None => (*on_screen, None),
    };
    let tensor = &first;
    let second = || {
        StressTensor::new(
            n.get(Num::second(0)),
            n.get(Num::second(1)),
            n.get(Num::second(2)),
            n.get(Num::second(3)),
            n.get(Num::second(4)),
            n.get(Num::second(5)),
        )
        .map_err(|_| overflow(Num::second(0)))
    };
    let ratio = (c.cycle == Cycle::Ratio).then(|| n.get(Num::Ratio));
    let cycle = match c.cycle {
        Cycle::Ratio => {
            let r = n.get(Num::Ratio);
            if !(r.is_finite() && r <= 1.0) {
                return Err(problem(
                    Num::Ratio,
                    "R = σmin/σmax cannot exceed 1 (the state on screen is the maximum)",
                ));
            }
            let min = tensor.scaled(r).map_err(|_| overflow(Num::Ratio))?;
            fatigue::Cycle::from_extremes(tensor, &min).map_err(|_| overflow(Num::Ratio))?
        }
        Cycle::Minimum => fatigue::Cycle::from_extremes(tensor, &second()?)
            .map_err(|_| overflow(Num::second(0)))?,
        Cycle::Alternating => fatigue::Cycle {
            mean: *tensor,
            alternating: second()?,
        },
        Cycle::Loads => {
            let (mean, alternating) = loads_cycle
                .ok_or_else(|| problem(Num::N, "alternating loads need loads on a section"))?;
            fatigue::Cycle { mean, alternating }
        }
    };
    let (sa, sm) = cycle.equivalents();
    let to_mpa = unit.convert(1.0, StressUnit::MPa);
    let (se, estimate, caution) = match c.endurance {
        Endurance::Given => {
            let se = n.get(Num::Se) * c.strength_unit.convert(1.0, unit);
            if !(se.is_finite() && se > 0.0) {
                return Err(problem(
                    Num::Se,
                    "the endurance limit must be a positive number",
                ));
            }
            (se, None, None)
        }
        Endurance::Estimate => {
            let sut_mpa = s.ultimate_tensile() * to_mpa;
            let m = fatigue::marin(
                c.finish,
                sut_mpa,
                n.get(Num::FatD),
                c.loading,
                n.get(Num::FatTemp),
                n.get(Num::FatRel),
            )
            .map_err(|e| {
                let num = match e {
                    FatigueError::SizeRange => Num::FatD,
                    FatigueError::TemperatureRange => Num::FatTemp,
                    FatigueError::Reliability => Num::FatRel,
                    FatigueError::NotPositive(_) => Num::MatSut,
                };
                problem(num, e.to_string())
            })?;
            let se_prime = fatigue::unmodified_endurance_mpa(sut_mpa) / to_mpa;
            (
                m.product() * se_prime,
                Some((se_prime, m)),
                (!is_steel(c)).then_some(NOT_A_STEEL),
            )
        }
    };
    let sut = s.ultimate_tensile();
    let factors = FatigueCriterion::ALL
        .iter()
        .map(|&f| {
            let needs_sy = !matches!(f, FatigueCriterion::Goodman | FatigueCriterion::Gerber);
            let sy = s.yield_strength();
            let n = match (needs_sy, sy) {
                (true, None) => None,
                _ => fatigue::factor(f, sa, sm, se, sut, sy.unwrap_or(sut)),
            };
            (f, n)
        })
        .collect();
    Ok(FatigueOutcome {
        cycle,
        sa,
        sm,
        se,
        estimate,
        factors,
        in_use: c.fatigue_criterion,
        ratio,
        caution,
        notch,
    })
}
