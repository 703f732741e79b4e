//! Will it hold? The judgements of the point, each in its own module with one `evaluate`:
//! `strength` (the material and every static criterion's factor of safety against the
//! required one) and `fatigue` (the cycle whose first state is the one on screen). This module
//! composes them into a [`Judgement`] and finds the governing points of a section. No formula
//! here: every number comes from `stresscase-core`.

mod fatigue;
mod life;
mod strength;

pub use fatigue::{FatigueOutcome, NotchFactors, NOT_A_STEEL};
pub use life::{
    history_outcome, plane_outcome, CycleLife, HistoryOutcome, LifeOutcome, LifeResult, LineFrom,
    PlaneLife, PLANE_STEP_DEG,
};

use crate::model::choices::{Choices, Source};
use crate::model::source::{self, Numbers, SourceProblem};
use stresscase_core::criteria::{self, Criterion, Verdict};
use stresscase_core::invariants::mean_stress;
use stresscase_core::material::{Basis, Strengths};
use stresscase_core::section::{Critical, Rank};
use stresscase_core::{principal_values, AngleUnit, StressTensor, StressUnit};

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
    units: (StressUnit, AngleUnit),
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
        source::governing(c, n, units, None, &|t| j.static_rank(t))?.map(factor)
    } else {
        None
    };
    let (fatigue_point, fatigue_note) = match &j.fatigue {
        Some(f) if f.ratio.is_some() => (
            source::governing(c, n, units, f.notch.map(|k| (k.kf, k.kfs)), &|t| {
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
    (unit, angle): (StressUnit, AngleUnit),
) -> Result<Judgement, SourceProblem> {
    let mut j = strength::evaluate(c, n, tensor, unit)?;
    if c.fatigue {
        j.fatigue = Some(fatigue::evaluate(
            c,
            n,
            tensor,
            (unit, angle),
            &j.strengths,
        )?);
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
        let j = judge(&c, &demo(&c), &t, (StressUnit::MPa, AngleUnit::Degree)).unwrap();
        let vm = j.in_use_verdict().unwrap();
        assert_eq!(vm.criterion, Criterion::VonMises);
        assert!((vm.factor.unwrap() - 2.0).abs() < 1e-12);
        // The same state in ksi gives the same factor.
        let k = StressUnit::MPa.convert(1.0, StressUnit::Ksi);
        let j2 = judge(
            &c,
            &demo(&c),
            &t.scaled(k).unwrap(),
            (StressUnit::Ksi, AngleUnit::Degree),
        )
        .unwrap();
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
            judge(&c, &n, &t, (StressUnit::MPa, AngleUnit::Degree))
                .unwrap_err()
                .num,
            Num::MatSut
        );
        n.0.insert(Num::MatSut, 200.0);
        n.0.remove(&Num::MatSy);
        n.0.insert(Num::MatElong, 0.5);
        n.0.insert(Num::MatSuc, 150.0);
        let e = judge(&c, &n, &t, (StressUnit::MPa, AngleUnit::Degree)).unwrap_err();
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
        let j = judge(&c, &demo(&c), &t, (StressUnit::MPa, AngleUnit::Degree)).unwrap();
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
        let j = judge(&c, &n, &t, (StressUnit::MPa, AngleUnit::Degree)).unwrap();
        let g = governing(&c, &n, (StressUnit::MPa, AngleUnit::Degree), &j)
            .unwrap()
            .unwrap();
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

    /// A solid shaft with the demo's numbers and these loads, fatigue on.
    fn shaft(c: Choices, loads: &[(Num, f64)]) -> (Judgement, StressTensor) {
        let mut n = demo(&c);
        for &(k, v) in loads {
            n.0.insert(k, v);
        }
        let (t, _) = source::evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree)
            .unwrap()
            .unwrap();
        (
            judge(&c, &n, &t, (StressUnit::MPa, AngleUnit::Degree)).unwrap(),
            t,
        )
    }

    #[test]
    fn a_rotating_shaft_reverses_its_bending_and_keeps_its_torque() {
        use crate::model::choices::{Cycle, NotchQ};
        // Ø40 mm, Mz = 380 N·m, T = 520 N·m, φ = 90° (on the neutral axis of Mz: the turned
        // moment must still peak there). σ = 32M/(πd³), τ = 16T/(πd³) (beam and torsion
        // formulas), times Kf and Kfs with q typed.
        let c = Choices {
            source: Source::Section,
            fatigue: true,
            cycle: Cycle::Loads,
            rotating: true,
            notch_q: NotchQ::Typed,
            ..Choices::default()
        };
        let loads = [
            (Num::N, 0.0),
            (Num::Vy, 0.0),
            (Num::Phi, 90.0),
            (Num::Kt, 2.0),
            (Num::Kts, 1.5),
            (Num::Q, 0.8),
            (Num::Qs, 0.9),
        ];
        let (j, on_screen) = shaft(c, &loads);
        let f = j.fatigue.unwrap();
        let d3 = std::f64::consts::PI * 0.04f64.powi(3);
        let (kf, kfs) = (1.0 + 0.8 * 1.0, 1.0 + 0.9 * 0.5);
        let sigma = 32.0 * 380.0 / d3 / 1e6;
        let tau = 16.0 * 520.0 / d3 / 1e6;
        let nf = f.notch.unwrap();
        assert!((nf.kf - kf).abs() < 1e-12 && (nf.kfs - kfs).abs() < 1e-12);
        let [ax, ay, az, axy, ayz, azx] = f.cycle.alternating.components();
        assert!(
            (ax - kf * sigma).abs() < 1e-9 * sigma,
            "{ax} vs {}",
            kf * sigma
        );
        assert_eq!([ay, az, axy, ayz, azx], [0.0; 5]);
        let [mx, _, _, mxy, _, _] = f.cycle.mean.components();
        assert!(mx.abs() < 1e-9 && (mxy - kfs * tau).abs() < 1e-9 * tau);
        assert!(f.ratio.is_none());
        // The state on screen is the peak with Kt and Kts (applied statically by default).
        let [sx, _, _, txy, _, _] = on_screen.components();
        assert!((sx - 2.0 * sigma).abs() < 1e-9 * sigma && (txy - 1.5 * tau).abs() < 1e-9 * tau);
    }

    #[test]
    fn typed_alternating_loads_and_no_static_kt() {
        use crate::model::choices::Cycle;
        let c = Choices {
            source: Source::Section,
            fatigue: true,
            cycle: Cycle::Loads,
            static_kt: false,
            ..Choices::default()
        };
        let loads = [
            (Num::N, 0.0),
            (Num::Vy, 0.0),
            (Num::Phi, 180.0),
            (Num::Mz, 200.0),
            (Num::Mza, 150.0),
            (Num::T, 0.0),
            (Num::Kt, 1.8),
        ];
        let (j, on_screen) = shaft(c, &loads);
        let f = j.fatigue.unwrap();
        let d3 = std::f64::consts::PI * 0.04f64.powi(3);
        let s = |m: f64| 32.0 * m / d3 / 1e6;
        // q = 1 by default: Kf = Kt on the fatigue states; the state on screen has no Kt.
        assert!((f.cycle.mean.components()[0] - 1.8 * s(200.0)).abs() < 1e-9 * s(200.0));
        assert!((f.cycle.alternating.components()[0] - 1.8 * s(150.0)).abs() < 1e-9 * s(150.0));
        assert!((on_screen.components()[0] - s(350.0)).abs() < 1e-9 * s(350.0));
    }

    #[test]
    fn the_governing_points_rank_the_states_they_decide() {
        use crate::model::choices::{Cycle, NotchQ};
        // Kt not applied statically, Kf = 1 + 0.5·(2 − 1) = 1.5 in fatigue: the governing
        // search must give the factors the page shows for the point it finds.
        let c = Choices {
            source: Source::Section,
            material: MaterialPick::Table(4),
            fatigue: true,
            cycle: Cycle::Ratio,
            notch_q: NotchQ::Typed,
            static_kt: false,
            ..Choices::default()
        };
        let loads = [
            (Num::N, 0.0),
            (Num::Mz, 1000.0),
            (Num::T, 0.0),
            (Num::Vy, 0.0),
            (Num::Phi, 180.0),
            (Num::Ratio, 0.0),
            (Num::Kt, 2.0),
            (Num::Q, 0.5),
        ];
        let mut n = demo(&c);
        for (k, v) in loads {
            n.0.insert(k, v);
        }
        let (j, _) = shaft(c, &loads);
        let g = governing(&c, &n, (StressUnit::MPa, AngleUnit::Degree), &j)
            .unwrap()
            .unwrap();
        let (_, ns) = g.static_point.unwrap();
        let (_, nf) = g.fatigue_point.unwrap();
        let on_screen = j.in_use_verdict().unwrap().factor.unwrap();
        let fatigue = j.fatigue.as_ref().unwrap().factor_in_use().unwrap();
        assert!(
            (ns.unwrap() - on_screen).abs() < 1e-6 * on_screen,
            "{ns:?} vs {on_screen}"
        );
        assert!(
            (nf.unwrap() - fatigue).abs() < 1e-6 * fatigue,
            "{nf:?} vs {fatigue}"
        );
    }
}
