//! Will it hold? The material of the case in the case's stress unit, every static criterion's
//! factor of safety against the required one, and the fatigue check of a cycle whose first state
//! is the one on screen. No formula here: every number comes from `stresscase-core`.

use crate::source::{Cycle, Endurance, MaterialPick, Num, Numbers, SourceProblem};
use stresscase_core::criteria::{self, Criterion, Verdict};
use stresscase_core::fatigue::{self, FatigueCriterion, FatigueError, Marin};
use stresscase_core::material::{self, Basis, MaterialError, Strengths};
use stresscase_core::{StressTensor, StressUnit};

use crate::source::Choices;

/// The fatigue part of a judgement, stresses in the case's unit.
#[derive(Debug, Clone, PartialEq)]
pub struct FatigueOutcome {
    /// The cycle as mean and alternating tensors.
    pub cycle: fatigue::Cycle,
    /// von Mises alternating equivalent σa′.
    pub sa: f64,
    /// von Mises mean equivalent σm′, signed by I1.
    pub sm: f64,
    /// The endurance limit used.
    pub se: f64,
    /// Se′ and the Marin factors, when estimated.
    pub estimate: Option<(f64, Marin)>,
    /// Each criterion's factor of safety (`None`: unloaded, or the material has no Sy).
    pub factors: Vec<(FatigueCriterion, Option<f64>)>,
    /// A caution about the estimate (set when the material is not a steel).
    pub caution: Option<&'static str>,
}

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
}

impl Judgement {
    /// The verdict of the criterion in use, if it applies to the material.
    #[must_use]
    pub fn in_use_verdict(&self) -> Option<&Verdict> {
        self.verdicts.iter().find(|v| v.criterion == self.in_use)
    }
}

fn problem(num: Num, message: impl Into<String>) -> SourceProblem {
    SourceProblem {
        num,
        message: message.into(),
    }
}

fn material_problem(e: MaterialError) -> SourceProblem {
    let num = match e {
        MaterialError::NotPositive("the ultimate tensile strength") => Num::MatSut,
        MaterialError::NotPositive("the ultimate compressive strength")
        | MaterialError::CompressionBelowTension => Num::MatSuc,
        MaterialError::NotPositive("the endurance limit") => Num::Se,
        MaterialError::Elongation => Num::MatElong,
        _ => Num::MatSy,
    };
    problem(num, e.to_string())
}

const STEELS: [&str; 7] = [
    "1020hr",
    "1020cd",
    "1045hr",
    "1045cd",
    "4140qt425",
    "304ann",
    "316ann",
];

/// The shown caution when Se is estimated for a material that is not a steel.
pub const NOT_A_STEEL: &str = "Se′ = 0.5·Sut is a correlation for steels. Aluminium alloys, brass and plastics have no endurance limit: give the fatigue strength at the design life instead.";

/// Judges `tensor` (in `unit`) with the case's material and settings.
///
/// # Errors
/// The refused input, attached to its number.
pub fn judge(
    c: &Choices,
    n: &impl Numbers,
    tensor: &StressTensor,
    unit: StressUnit,
) -> Result<Judgement, SourceProblem> {
    let (name, basis, source, strengths, steel) = match c.material {
        MaterialPick::Table(i) => {
            let m = material::TABLE
                .get(i)
                .ok_or_else(|| problem(Num::MatSut, "unknown material"))?;
            let s = m.strengths().map_err(material_problem)?;
            (
                m.name.to_string(),
                Some(m.basis),
                Some(m.source),
                s.scaled(StressUnit::MPa.convert(1.0, unit)),
                STEELS.contains(&m.key),
            )
        }
        MaterialPick::Own => {
            let get = |k: Num| {
                let v = n.get(k);
                (!(k.is_optional() && n.absent(k))).then_some(v)
            };
            let se = (c.fatigue && c.endurance == Endurance::Given).then(|| n.get(Num::Se));
            let s = Strengths::try_new(
                get(Num::MatSy),
                n.get(Num::MatSut),
                get(Num::MatSuc),
                n.get(Num::MatElong),
                se,
            )
            .map_err(material_problem)?;
            (
                "your material".to_string(),
                None,
                None,
                s.scaled(c.strength_unit.convert(1.0, unit)),
                true,
            )
        }
    };
    let required = n.get(Num::Required);
    if !(required.is_finite() && required >= 1.0) {
        return Err(problem(
            Num::Required,
            "the required factor of safety must be at least 1",
        ));
    }
    let suggested = Criterion::suggested(&strengths);
    let verdicts = criteria::verdicts(tensor, &strengths, required);
    let fatigue = if c.fatigue {
        Some(fatigue_check(c, n, tensor, unit, &strengths, steel)?)
    } else {
        None
    };
    Ok(Judgement {
        name,
        basis,
        source,
        strengths,
        suggested,
        in_use: c.criterion.unwrap_or(suggested),
        required,
        verdicts,
        fatigue,
    })
}

fn fatigue_check(
    c: &Choices,
    n: &impl Numbers,
    tensor: &StressTensor,
    unit: StressUnit,
    s: &Strengths,
    steel: bool,
) -> Result<FatigueOutcome, SourceProblem> {
    let overflow = |num| problem(num, "the cycle overflows; check the magnitudes");
    let second = || {
        StressTensor::new(
            n.get(Num::Second(0)),
            n.get(Num::Second(1)),
            n.get(Num::Second(2)),
            n.get(Num::Second(3)),
            n.get(Num::Second(4)),
            n.get(Num::Second(5)),
        )
        .map_err(|_| overflow(Num::Second(0)))
    };
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
            .map_err(|_| overflow(Num::Second(0)))?,
        Cycle::Alternating => fatigue::Cycle {
            mean: *tensor,
            alternating: second()?,
        },
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
                (!steel).then_some(NOT_A_STEEL),
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
        caution,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::source::test_numbers::demo;

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
}
