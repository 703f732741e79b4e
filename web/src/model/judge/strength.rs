//! The static verdict: the case's material (a built-in row or the user's own strengths) in the
//! case's stress unit, and every applicable static criterion's factor of safety against the
//! required one. No formula here: every number comes from `stresscase-core`.

use super::Judgement;
use crate::model::choices::{Choices, Endurance, MaterialPick};
use crate::model::inputs::Num;
use crate::model::source::{problem, Numbers, SourceProblem};
use stresscase_core::criteria::{self, Criterion};
use stresscase_core::material::{self, MaterialError, Strengths};
use stresscase_core::{StressTensor, StressUnit};

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

/// Whether Se′ = 0.5·Sut applies to the case's material: a built-in steel, or the user's own
/// material (the user answers for it).
#[must_use]
pub fn is_steel(c: &Choices) -> bool {
    match c.material {
        MaterialPick::Table(i) => material::TABLE
            .get(i)
            .is_some_and(|m| STEELS.contains(&m.key)),
        MaterialPick::Own => true,
    }
}

/// The case's material in `unit`, and every static criterion's verdict on `tensor` (in `unit`)
/// against the required factor of safety: a [`Judgement`] without its fatigue part.
///
/// # Errors
/// The refused input, attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    tensor: &StressTensor,
    unit: StressUnit,
) -> Result<Judgement, SourceProblem> {
    let (name, basis, source, strengths) = match c.material {
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
    Ok(Judgement {
        name,
        basis,
        source,
        strengths,
        suggested,
        in_use: c.criterion.unwrap_or(suggested),
        required,
        verdicts,
        fatigue: None,
        life: None,
    })
}
