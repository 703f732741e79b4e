//! Will it hold? The judgements of the point, each in its own module with one `evaluate`:
//! `strength` (the material and every static criterion's factor of safety against the
//! required one) and `fatigue` (the cycle whose first state is the one on screen). This module
//! composes them into a [`Judgement`] and finds the governing points of a section. No formula
//! here: every number comes from `stresscase-core`.

mod fatigue;
mod life;
mod strength;

pub use fatigue::{FatigueOutcome, NOT_A_STEEL};
pub use life::{CycleLife, HistoryOutcome, LifeOutcome, LifeResult, LineFrom};

use crate::model::choices::{Choices, Source};
use crate::model::source::{self, Numbers, SourceProblem};
use stresscase_core::criteria::{self, Criterion, Verdict};
use stresscase_core::invariants::mean_stress;
use stresscase_core::material::{Basis, Strengths};
use stresscase_core::section::{Critical, Rank};
use stresscase_core::{principal_values, StressTensor, StressUnit};

/// Where on a section the decision is hardest: the lowest static factor under the criterion in
/// use and, with a proportional fatigue cycle, the lowest fatigue factor. Positions as in the
/// scan (radians, or the length unit).
#[derive(Debug, Clone, PartialEq)]
pub struct Governing {
    /// The point of the lowest static factor, and that factor (`None`: unloaded everywhere).
    pub static_point: Option<(Critical, Option<f64>)>,
    /// The point of the lowest fatigue factor, and that factor.
    pub fatigue_point: Option<(Critical, Option<f64>)>,
    /// Why no fatigue point was searched for, when fatigue is on.
    pub fatigue_note: Option<&'static str>,
}

impl Governing {
    /// The point of the decision: of the two, the one with the lower factor (fatigue when tied).
    #[must_use]
    pub fn decision(&self) -> Option<&Critical> {
        let n = |p: &Option<(Critical, Option<f64>)>| {
            p.as_ref().map(|(_, n)| n.unwrap_or(f64::INFINITY))
        };
        match (&self.static_point, &self.fatigue_point) {
            (Some((s, _)), Some((f, _))) => {
                if n(&self.fatigue_point) <= n(&self.static_point) {
                    Some(f)
                } else {
                    Some(s)
                }
            }
            (Some((s, _)), None) => Some(s),
            (None, Some((f, _))) => Some(f),
            (None, None) => None,
        }
    }
}

/// Why the fatigue point is not searched for with a typed second state.
pub const NO_FATIGUE_SEARCH: &str = "The lowest fatigue factor around the section needs a proportional cycle (R = σmin/σmax): with a typed second state, the cycle elsewhere on the section is unknown.";

/// What the case's material and stress say about the point.
#[derive(Debug, Clone, PartialEq)]
pub struct Judgement {
    /// Material name.
    pub name: String,
    /// Typical or minimum (built-in rows only).
    pub basis: Option<Basis>,
    /// Source of the built-in row.
    pub source: Option<&'static str>,
    /// Strengths in the case's unit.
    pub strengths: Strengths,
    /// The criterion the material's ductility suggests.
    pub suggested: Criterion,
    /// The criterion in use (the user's choice, else the suggested one).
    pub in_use: Criterion,
    /// The required factor of safety.
    pub required: f64,
    /// Every applicable criterion.
    pub verdicts: Vec<Verdict>,
    /// The fatigue check, when on.
    pub fatigue: Option<FatigueOutcome>,
    /// The life in cycles, when asked for (with the fatigue check on).
    pub life: Option<LifeOutcome>,
}

impl Judgement {
    /// The verdict of the criterion in use, if it applies to the material.
    #[must_use]
    pub fn in_use_verdict(&self) -> Option<&Verdict> {
        self.verdicts.iter().find(|v| v.criterion == self.in_use)
    }

    /// How severe another state (same unit) is for the static decision: f = 1/n of the
    /// criterion in use, ties to the larger mean stress (tension governs).
    #[must_use]
    pub fn static_rank(&self, t: &StressTensor) -> Rank {
        Rank {
            severity: criteria::failure_index(self.in_use, principal_values(t), &self.strengths)
                .unwrap_or(f64::NAN),
            tie: mean_stress(t),
        }
    }

    /// How severe another state is in fatigue, with the same proportional cycle (R), Se and
    /// criterion: 1/n, ties to the larger mean equivalent. `None` without a proportional cycle.
    #[must_use]
    pub fn fatigue_rank(&self, t: &StressTensor) -> Option<Rank> {
        self.fatigue.as_ref()?.rank(t, &self.strengths)
    }
}

/// The governing points of a section case (`None` for other paths).
///
/// # Errors
/// A refused input, attached to its number.
pub fn governing(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    j: &Judgement,
) -> Result<Option<Governing>, SourceProblem> {
    if c.source != Source::Section || !c.has_loads() {
        return Ok(None);
    }
    let factor = |g: Critical| {
        let n = (g.value > 0.0)
            .then(|| 1.0 / g.value)
            .filter(|n| n.is_finite());
        (g, n)
    };
    let static_point = if j.in_use_verdict().is_some() {
        source::governing(c, n, unit, &|t| j.static_rank(t))?.map(factor)
    } else {
        None
    };
    let (fatigue_point, fatigue_note) = match &j.fatigue {
        Some(f) if f.ratio.is_some() => (
            source::governing(c, n, unit, &|t| {
                j.fatigue_rank(t).unwrap_or(Rank {
                    severity: f64::NAN,
                    tie: 0.0,
                })
            })?
            .map(factor),
            None,
        ),
        Some(_) => (None, Some(NO_FATIGUE_SEARCH)),
        None => (None, None),
    };
    Ok(Some(Governing {
        static_point,
        fatigue_point,
        fatigue_note,
    }))
}

/// Judges `tensor` (in `unit`) with the case's material and settings: the static verdicts, and
/// the fatigue check when it is on.
///
/// # Errors
/// The refused input, attached to its number (the material's and the static inputs first).
pub fn judge(
    c: &Choices,
    n: &impl Numbers,
    tensor: &StressTensor,
    unit: StressUnit,
) -> Result<Judgement, SourceProblem> {
    let mut j = strength::evaluate(c, n, tensor, unit)?;
    if c.fatigue {
        j.fatigue = Some(fatigue::evaluate(c, n, tensor, unit, &j.strengths)?);
    }
    Ok(j)
}

/// Adds the life in cycles to a judgement when the case asks for it: of the fatigue check's
/// cycle, or of `history` (in `unit`).
///
/// # Errors
/// The refused input, attached to its field.
pub fn judge_life(
    j: &mut Judgement,
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    history: &[f64],
) -> Result<(), crate::model::case::FieldProblem> {
    j.life = match (&j.fatigue, c.life_on()) {
        (Some(f), true) => Some(life::evaluate(
            c,
            n,
            f,
            j.strengths.ultimate_tensile(),
            unit,
            history,
        )?),
        _ => None,
    };
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::choices::MaterialPick;
    use crate::model::inputs::Num;
    use crate::model::source::test_numbers::demo;

    #[test]
    fn a_table_material_is_judged_in_the_case_unit() {
        let c = Choices::default(); // AISI 1020 hot-rolled, Sy = 210 MPa
        let t = StressTensor::plane(105.0, 0.0, 0.0).unwrap();
        let j = judge(&c, &demo(&c), &t, StressUnit::MPa).unwrap();
        let vm = j.in_use_verdict().unwrap();
        assert_eq!(vm.criterion, Criterion::VonMises);
        assert!((vm.factor.unwrap() - 2.0).abs() < 1e-12);
        // The same state in ksi gives the same factor.
        let k = StressUnit::MPa.convert(1.0, StressUnit::Ksi);
        let j2 = judge(&c, &demo(&c), &t.scaled(k).unwrap(), StressUnit::Ksi).unwrap();
        assert!((j2.in_use_verdict().unwrap().factor.unwrap() - 2.0).abs() < 1e-9);
    }

    #[test]
    fn bad_own_material_names_its_field() {
        let c = Choices {
            material: MaterialPick::Own,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::MatSut, -5.0);
        let t = StressTensor::plane(10.0, 0.0, 0.0).unwrap();
        assert_eq!(
            judge(&c, &n, &t, StressUnit::MPa).unwrap_err().num,
            Num::MatSut
        );
        n.0.insert(Num::MatSut, 200.0);
        n.0.remove(&Num::MatSy);
        n.0.insert(Num::MatElong, 0.5);
        n.0.insert(Num::MatSuc, 150.0);
        let e = judge(&c, &n, &t, StressUnit::MPa).unwrap_err();
        assert_eq!(e.num, Num::MatSuc);
        assert!(e.message.contains("compressive"), "{}", e.message);
    }

    #[test]
    fn a_fully_reversed_cycle_has_no_mean() {
        let c = Choices {
            fatigue: true,
            ..Choices::default()
        };
        let t = StressTensor::plane(80.0, 0.0, 30.0).unwrap();
        let j = judge(&c, &demo(&c), &t, StressUnit::MPa).unwrap();
        let f = j.fatigue.unwrap();
        assert!(f.sm.abs() < 1e-12);
        let goodman = f.factors[0].1.unwrap();
        assert!((goodman - f.se / f.sa).abs() < 1e-12);
        assert!(f.estimate.is_some() && f.caution.is_none());
    }

    #[test]
    fn the_decision_point_is_the_one_with_the_lower_factor() {
        use stresscase_core::section::Location;
        let at = |phi: f64, severity: f64| Critical {
            at: Location::Round { phi, r: 0.02 },
            position: phi,
            value: severity,
        };
        let g = Governing {
            static_point: Some((at(0.0, 0.5), Some(2.0))),
            fatigue_point: Some((at(3.0, 0.8), Some(1.25))),
            fatigue_note: None,
        };
        assert_eq!(g.decision().map(|c| c.position), Some(3.0));
        let g = Governing {
            static_point: Some((at(0.0, 0.9), Some(1.1))),
            ..g
        };
        assert_eq!(g.decision().map(|c| c.position), Some(0.0));
        // Unloaded in fatigue (n = ∞): the static point decides.
        let g = Governing {
            fatigue_point: Some((at(3.0, 0.0), None)),
            ..g
        };
        assert_eq!(g.decision().map(|c| c.position), Some(0.0));
    }

    #[test]
    fn a_shaft_in_bending_and_torsion_governs_on_its_tensile_fibre() {
        // Ø40 mm, Mz = 1 kN·m, T = 1.5 kN·m, 4140, fatigue R = 0: equal von Mises on both
        // fibres; the static tie and the fatigue factor both pick the tensile one.
        let c = Choices {
            source: Source::Section,
            material: MaterialPick::Table(4),
            fatigue: true,
            ..Choices::default()
        };
        let mut n = demo(&c);
        for (k, v) in [
            (Num::N, 0.0),
            (Num::Mz, 1000.0),
            (Num::T, 1500.0),
            (Num::Vy, 0.0),
            (Num::Ratio, 0.0),
        ] {
            n.0.insert(k, v);
        }
        let (t, _) = source::evaluate(&c, &n, StressUnit::MPa, stresscase_core::AngleUnit::Degree)
            .unwrap()
            .unwrap();
        let j = judge(&c, &n, &t, StressUnit::MPa).unwrap();
        let g = governing(&c, &n, StressUnit::MPa, &j).unwrap().unwrap();
        let tensile = |crit: &Critical| {
            let stresscase_core::section::Location::Round { phi, .. } = crit.at else {
                panic!()
            };
            // φ from +y: the +y fibre (φ = 0) is in compression under a positive Mz.
            (phi - core::f64::consts::PI).abs() < 1e-6
        };
        let (s, ns) = g.static_point.unwrap();
        let (f, nf) = g.fatigue_point.unwrap();
        assert!(tensile(&s) && tensile(&f), "{s:?} {f:?}");
        assert!(nf.unwrap() < 2.0 && ns.unwrap() > 2.0);
        assert!(tensile(g.decision().unwrap()));
    }
}
