//! The static verdict: the case's material (a built-in row or the user's own strengths) in the
//! case's stress unit, and every applicable static criterion's factor of safety against the
//! required one. No formula here: every number comes from `stresscase-core`.

use crate::model::choices::{Choices, Endurance, MaterialPick};
use crate::model::inputs::Num;
use crate::model::source::{problem, Numbers, SourceProblem};
use stresscase_core::criteria::{self, Criterion, Verdict};
use stresscase_core::material::{self, Basis, MaterialError, Strengths};
use stresscase_core::{StressTensor, StressUnit};

/// The material and the static verdicts, stresses in the case's unit.
#[derive(Debug, Clone, PartialEq)]
pub struct StaticOutcome {
    /// Material name.
    pub name: String,
    /// Typical or minimum (built-in rows only).
    pub basis: Option<Basis>,
    /// Source of the built-in row.
    pub source: Option<&'static str>,
    /// Strengths in the case's unit.
    pub strengths: Strengths,
    /// Whether Se′ = 0.5·Sut applies (a steel, or the user's own material).
    pub steel: bool,
    /// The criterion the material's ductility suggests.
    pub suggested: Criterion,
    /// The criterion in use (the user's choice, else the suggested one).
    pub in_use: Criterion,
    /// The required factor of safety.
    pub required: f64,
    /// Every applicable criterion.
    pub verdicts: Vec<Verdict>,
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

/// The case's material in `unit`, and every static criterion's verdict on `tensor` (in `unit`)
/// against the required factor of safety.
///
/// # Errors
/// The refused input, attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    tensor: &StressTensor,
    unit: StressUnit,
) -> Result<StaticOutcome, SourceProblem> {
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
    Ok(StaticOutcome {
        name,
        basis,
        source,
        strengths,
        steel,
        suggested,
        in_use: c.criterion.unwrap_or(suggested),
        required,
        verdicts,
    })
}
