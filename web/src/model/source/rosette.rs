//! Strain-gauge rosette readings: the gauges as laid out, the least-squares reduction in core,
//! and the plane-stress tensor by Hooke's law.

use super::{elastic, overflow, problem, Numbers, Outcome, SourceProblem};
use crate::model::choices::{Choices, Layout};
use crate::model::inputs::Num;
use stresscase_core::rosette::{self, Gauge, RosetteError, RosetteStrain, Transverse};
use stresscase_core::{AngleUnit, StressTensor, StressUnit};

/// What a rosette path computed besides the tensor.
#[derive(Debug, Clone, PartialEq)]
pub struct RosetteOutcome {
    /// The gauges as used (angles in radians, readings as strain).
    pub gauges: Vec<Gauge>,
    /// The reduced strain state (dimensionless).
    pub strain: RosetteStrain,
}

/// Rosette readings: the reduced strain and the plane-stress tensor (in `unit`) by Hooke's law
/// with the case's elastic constants.
///
/// # Errors
/// Every problem found, each attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    angle: AngleUnit,
) -> Result<(StressTensor, Outcome), SourceProblem> {
    let to_unit = 1.0 / unit.pascals();
    let material = elastic(c, n)?.material;
    let s = c.strain_unit.factor();
    let gauges: Vec<Gauge> = (0..c.gauge_count())
        .map(|i| Gauge {
            angle: match c.layout {
                Layout::Rectangular => rosette::RECTANGULAR[usize::from(i)],
                Layout::Delta => rosette::DELTA[usize::from(i)],
                Layout::Custom => angle.to_radians(n.get(Num::gauge_angle(i))),
            },
            strain: n.get(Num::gauge_reading(i)) * s,
        })
        .collect();
    let transverse = c.correct.then(|| Transverse {
        kt: n.get(Num::GaugeKt) / 100.0,
        nu0: n.get(Num::GaugeNu0),
    });
    let strain = rosette::reduce(&gauges, transverse).map_err(|e| {
        let num = match e {
            RosetteError::NonFinite(i) => Num::gauge_reading(u8::try_from(i).unwrap_or(0)),
            RosetteError::BadTransverse => Num::GaugeKt,
            _ if c.layout == Layout::Custom => Num::gauge_angle(0),
            _ => Num::gauge_reading(0),
        };
        problem(num, e.to_string())
    })?;
    let tensor = strain
        .stress(&material)
        .and_then(|t| t.scaled(to_unit))
        .map_err(|_| overflow(Num::gauge_reading(0)))?;
    Ok((tensor, Outcome::Rosette(RosetteOutcome { gauges, strain })))
}
