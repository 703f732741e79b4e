//! A strain state through Hooke's law: plane stress, plane strain or full 3D, with the free
//! thermal strain α·ΔT.

use super::{elastic, overflow, ElasticUsed, Numbers, Outcome, SourceProblem};
use crate::model::choices::{Choices, Condition};
use crate::model::inputs::Num;
use stresscase_core::hooke::Strain;
use stresscase_core::{StressTensor, StressUnit};

/// What a strain path computed besides the tensor.
#[derive(Debug, Clone, PartialEq)]
pub struct StrainOutcome {
    /// The full strain state used (εz from plane stress included), dimensionless.
    pub strain: Strain,
}

/// Strains through Hooke's law under the chosen condition; the tensor in `unit`.
///
/// # Errors
/// Every problem found, each attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
) -> Result<(StressTensor, Outcome), SourceProblem> {
    let to_unit = 1.0 / unit.pascals();
    let ElasticUsed {
        material, thermal, ..
    } = elastic(c, n)?;
    let s = c.strain_unit.factor();
    let (ex, ey, gxy) = (n.get(Num::Ex) * s, n.get(Num::Ey) * s, n.get(Num::Gxy) * s);
    let (tensor, strain) = match c.condition {
        Condition::PlaneStress => {
            let (t, ez) = material
                .plane_stress(ex, ey, gxy, thermal)
                .map_err(|_| overflow(Num::Ex))?;
            (
                t,
                Strain {
                    ex,
                    ey,
                    ez,
                    gxy,
                    ..Strain::default()
                },
            )
        }
        Condition::PlaneStrain => (
            material
                .plane_strain(ex, ey, gxy, thermal)
                .map_err(|_| overflow(Num::Ex))?,
            Strain {
                ex,
                ey,
                gxy,
                ..Strain::default()
            },
        ),
        Condition::Full => {
            let st = Strain {
                ex,
                ey,
                ez: n.get(Num::Ez) * s,
                gxy,
                gyz: n.get(Num::Gyz) * s,
                gzx: n.get(Num::Gzx) * s,
            };
            (
                material
                    .stress(&st, thermal)
                    .map_err(|_| overflow(Num::Ex))?,
                st,
            )
        }
    };
    let tensor = tensor.scaled(to_unit).map_err(|_| overflow(Num::Ex))?;
    Ok((tensor, Outcome::Strain(StrainOutcome { strain })))
}
