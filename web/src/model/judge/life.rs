//! The life in cycles: the S–N line (through f·Sut at 10³ cycles and Se at 10⁶, or the user's
//! own Basquin curve), a mean-stress correction to a fully reversed amplitude, and either the
//! life of the fatigue check's cycle or the damage and life of a load history (rainflow
//! counting and Miner's rule): a typed one here, a table's through [`history_outcome`] and
//! [`plane_outcome`], which the panel calls with the same line. No formula here: every number
//! comes from `stresscase-core`.

use super::FatigueOutcome;
use crate::model::case::{Field, FieldProblem};
use crate::model::choices::{Choices, LifeOf, MeanStressPick, SnFrom};
use crate::model::inputs::Num;
use crate::model::source::Numbers;
use stresscase_core::critical_plane::{self, PlaneDamage};
use stresscase_core::damage::{HistoryLife, Miner};
use stresscase_core::mean_stress::{MeanStress, Reversed};
use stresscase_core::rainflow::{self, RainflowCycle};
use stresscase_core::sn_curve::{estimated_fraction, Life, SnLine};
use stresscase_core::StressUnit;

/// Where the S–N line came from, with its inputs in the case unit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum LineFrom {
    /// Through (10³, f·Sut) and (10⁶, Se), f estimated from Sut (Shigley).
    Estimated {
        /// The fraction f.
        f: f64,
    },
    /// The same line with f typed.
    Fraction {
        /// The fraction f.
        f: f64,
    },
    /// The user's curve N = Nref·(σar/Sref)^(−k).
    Own {
        /// Nref, cycles.
        n_ref: f64,
        /// Sref, case unit.
        s_ref: f64,
        /// k.
        k: f64,
    },
}

/// The life of the fatigue check's cycle.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CycleLife {
    /// σa,eq and σm,eq of the fatigue check (case unit).
    pub sa: f64,
    /// Mean.
    pub sm: f64,
    /// The equivalent fully reversed amplitude, or why there is none.
    pub reversed: Reversed,
    /// The life in cycles (only with an amplitude).
    pub life: Option<Life>,
}

/// The damage and life of a load history.
#[derive(Debug, Clone, PartialEq)]
pub struct HistoryOutcome {
    /// Values in the history.
    pub points: usize,
    /// Its turning points.
    pub turning: usize,
    /// The counted cycles (case unit).
    pub cycles: Vec<RainflowCycle>,
    /// Miner's sum and each cycle's damage.
    pub miner: Miner,
    /// Repeats of the history to failure.
    pub life: HistoryLife,
    /// The history's duration, hours, when given.
    pub hours: Option<f64>,
}

/// What the life is of.
#[derive(Debug, Clone, PartialEq)]
pub enum LifeResult {
    /// The fatigue check's cycle.
    Cycle(CycleLife),
    /// A typed history.
    History(HistoryOutcome),
    /// A history from the table (worked out beside the table, which the case does not hold);
    /// the typed duration, hours, if any.
    Table(Option<f64>),
}

/// The critical-plane count of a table's plane states.
#[derive(Debug, Clone, PartialEq)]
pub struct PlaneLife {
    /// Every plane's damage.
    pub planes: Vec<PlaneDamage>,
    /// The governing plane's angle, radians.
    pub theta: f64,
    /// The governing plane's history, counted and damaged.
    pub on_plane: HistoryOutcome,
}

/// Counts and damages a history `values` (case unit) on `line` with `mean_stress` (`sut` in
/// the case unit); `hours` is how long one history lasts.
///
/// # Errors
/// A value that does not count.
pub fn history_outcome(
    values: &[f64],
    (line, mean_stress, sut): (&SnLine, MeanStress, f64),
    hours: Option<f64>,
) -> Result<HistoryOutcome, rainflow::HistoryError> {
    let turning = rainflow::turning_points(values)?.len();
    let cycles = rainflow::count(values)?;
    let miner = Miner::sum(&cycles, mean_stress, line, sut);
    let life = miner.life();
    Ok(HistoryOutcome {
        points: values.len(),
        turning,
        cycles,
        miner,
        life,
        hours,
    })
}

/// The critical-plane count of plane states (σx, σy, τxy) in the case unit: every plane every
/// 2°, and the governing plane's history in full.
///
/// # Errors
/// A value that does not count, in words.
pub fn plane_outcome(
    states: &[[f64; 3]],
    l: &LifeOutcome,
    hours: Option<f64>,
) -> Result<PlaneLife, String> {
    let planes = critical_plane::scan(states, PLANE_STEP_DEG, l.mean_stress, &l.line, l.sut)
        .map_err(|e| e.to_string())?;
    let theta = critical_plane::governing(&planes).map_or(0.0, |p| p.theta);
    let mut history = Vec::new();
    critical_plane::normal_history(states, theta, &mut history);
    Ok(PlaneLife {
        on_plane: history_outcome(&history, (&l.line, l.mean_stress, l.sut), hours)
            .map_err(|e| e.to_string())?,
        planes,
        theta,
    })
}

/// Degrees between the planes of the critical-plane count.
pub const PLANE_STEP_DEG: f64 = 2.0;

/// The life part of a judgement, stresses in the case unit.
#[derive(Debug, Clone, PartialEq)]
pub struct LifeOutcome {
    /// The S–N line.
    pub line: SnLine,
    /// Where it came from.
    pub from: LineFrom,
    /// The mean-stress correction.
    pub mean_stress: MeanStress,
    /// Sut used by the correction.
    pub sut: f64,
    /// The endurance limit of the fatigue check (the estimated line's lower end).
    pub se: f64,
    /// The result.
    pub result: LifeResult,
}

fn at(num: Num, message: impl Into<String>) -> FieldProblem {
    FieldProblem {
        field: Field::Src(num),
        message: message.into(),
    }
}

/// The life of the fatigue check's cycle or of `history` (case unit), with the case's choices,
/// numbers and fatigue outcome; `sut` in the case unit.
///
/// # Errors
/// The refused input, attached to its field.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    fatigue: &FatigueOutcome,
    sut: f64,
    unit: StressUnit,
    history: &[f64],
) -> Result<LifeOutcome, FieldProblem> {
    let strength = |num: Num| c.strength_unit.convert(n.get(num), unit);
    // A line problem belongs to the number that set it: f when typed, else Se when given.
    let se_field = if c.endurance == crate::model::choices::Endurance::Given {
        Num::Se
    } else {
        Num::FatRel
    };
    let (line, from) = match c.sn {
        SnFrom::Estimate | SnFrom::Fraction => {
            let f = if c.sn == SnFrom::Fraction {
                n.get(Num::LifeF)
            } else {
                estimated_fraction(
                    unit.convert(sut, StressUnit::MPa),
                    unit.convert(fatigue.se, StressUnit::MPa),
                )
                .map_err(|e| at(se_field, e.to_string()))?
            };
            let line = SnLine::through_strengths(f, sut, fatigue.se).map_err(|e| {
                at(
                    if c.sn == SnFrom::Fraction {
                        Num::LifeF
                    } else {
                        se_field
                    },
                    e.to_string(),
                )
            })?;
            let from = if c.sn == SnFrom::Fraction {
                LineFrom::Fraction { f }
            } else {
                LineFrom::Estimated { f }
            };
            (line, from)
        }
        SnFrom::Own => {
            let (n_ref, s_ref, k) = (n.get(Num::SnN), strength(Num::SnS), n.get(Num::SnK));
            let limit = (!n.absent(Num::SnLimit)).then(|| strength(Num::SnLimit));
            let line = SnLine::basquin(n_ref, s_ref, k, limit).map_err(|e| {
                let num = match e {
                    stresscase_core::sn_curve::SnError::NotPositive("the reference cycles") => {
                        Num::SnN
                    }
                    stresscase_core::sn_curve::SnError::NotPositive("the slope k") => Num::SnK,
                    stresscase_core::sn_curve::SnError::NotPositive("the endurance limit") => {
                        Num::SnLimit
                    }
                    _ => Num::SnS,
                };
                at(num, e.to_string())
            })?;
            (line, LineFrom::Own { n_ref, s_ref, k })
        }
    };
    let mean_stress = match c.mean_stress {
        MeanStressPick::Goodman => MeanStress::Goodman,
        MeanStressPick::Gerber => MeanStress::Gerber,
        MeanStressPick::SmithWatsonTopper => MeanStress::SmithWatsonTopper,
        MeanStressPick::Morrow => {
            let sigma_f = strength(Num::SigmaF);
            if !(sigma_f.is_finite() && sigma_f > 0.0) {
                return Err(at(Num::SigmaF, "σ′f must be a positive number"));
            }
            MeanStress::Morrow { sigma_f }
        }
    };
    let result = match c.life_of {
        LifeOf::Cycle => {
            let reversed = mean_stress.reversed(fatigue.sa, fatigue.sm, sut);
            let life = match reversed {
                Reversed::Amplitude(a) => Some(line.life(a)),
                _ => None,
            };
            LifeResult::Cycle(CycleLife {
                sa: fatigue.sa,
                sm: fatigue.sm,
                reversed,
                life,
            })
        }
        LifeOf::History | LifeOf::Table => {
            let hours = (!n.absent(Num::HistHours)).then(|| n.get(Num::HistHours));
            if let Some(h) = hours {
                if !(h.is_finite() && h > 0.0) {
                    return Err(at(
                        Num::HistHours,
                        "the duration must be a positive number of hours",
                    ));
                }
            }
            if c.life_of == LifeOf::Table {
                LifeResult::Table(hours)
            } else {
                LifeResult::History(
                    history_outcome(history, (&line, mean_stress, sut), hours).map_err(|e| {
                        FieldProblem {
                            field: Field::History,
                            message: e.to_string(),
                        }
                    })?,
                )
            }
        }
    };
    Ok(LifeOutcome {
        line,
        from,
        mean_stress,
        sut,
        se: fatigue.se,
        result,
    })
}
