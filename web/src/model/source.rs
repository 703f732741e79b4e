//! Where the stress comes from: typed components, loads on a section, a strain-gauge rosette, or
//! strains through Hooke's law. Each path has its own module (`section`, `rosette`, `strain`)
//! with one `evaluate` from validated numbers to core's results; this module holds what they
//! share (the numbers' accessor, the refusal type, the elastic constants in use) and the
//! dispatch. No formula here: every number comes from `stresscase-core`.

use super::choices::{Choices, Source};
use super::inputs::Num;
use stresscase_core::hooke::{Elastic, ElasticError};
use stresscase_core::{AngleUnit, StressTensor, StressUnit};

mod notch_shape;
mod rosette;
mod section;

pub use notch_shape::{factors as shape_factors, ShapeFactors};

pub use section::fatigue_states;
mod strain;

pub use rosette::RosetteOutcome;
pub use section::{
    governing, location_in, section, SectionOutcome, PLANE_STRAIN_ENDS, SCAN_SAMPLES,
};
pub use strain::StrainOutcome;

/// The numbers a source reads, looked up by [`Num`]; absent numbers read as 0.
pub trait Numbers {
    /// The value of `n`.
    fn get(&self, n: Num) -> f64;
    /// True when an optional number was left empty.
    fn absent(&self, _n: Num) -> bool {
        false
    }
}

/// A problem with one source number.
#[derive(Debug, Clone, PartialEq)]
pub struct SourceProblem {
    /// The number it belongs to.
    pub num: Num,
    /// Why.
    pub message: String,
}

/// The refusal when a path's result leaves double range, attached to `num`.
fn overflow(num: Num) -> SourceProblem {
    problem(num, "the result overflows; check the magnitudes")
}

/// A refusal of `num`, with the reason.
pub(crate) fn problem(num: Num, message: impl Into<String>) -> SourceProblem {
    SourceProblem {
        num,
        message: message.into(),
    }
}

/// The extra results of a source path.
#[derive(Debug, Clone, PartialEq)]
pub enum Outcome {
    /// Loads on a section.
    Section(SectionOutcome),
    /// Rosette readings.
    Rosette(RosetteOutcome),
    /// Strains through Hooke's law.
    Strain(StrainOutcome),
}

/// The elastic constants in use, and where they come from.
#[derive(Debug, Clone, PartialEq)]
pub struct ElasticUsed {
    /// As core's type (E in Pa).
    pub material: Elastic,
    /// E in the case's modulus unit.
    pub e: f64,
    /// Poisson's ratio.
    pub nu: f64,
    /// Coefficient of expansion, µε/K.
    pub alpha: f64,
    /// Free thermal strain α·ΔT (dimensionless).
    pub thermal: f64,
    /// The material they come from; `None` when typed.
    pub from: Option<&'static str>,
    /// The warning shown when typed values differ from the chosen material's by more than
    /// [`ELASTIC_MISMATCH`].
    pub mismatch: Option<String>,
}

/// Relative difference of a typed E or ν from the chosen material's above which the page warns.
pub const ELASTIC_MISMATCH: f64 = 0.05;

/// The elastic constants of the case: the chosen material's E, ν and α, or the typed ones (with a
/// warning when they differ from the chosen material's by more than 5 %).
///
/// # Errors
/// The refused constant, attached to its field.
pub fn elastic(c: &Choices, n: &impl Numbers) -> Result<ElasticUsed, SourceProblem> {
    let row = c.table_material();
    let (e, nu, alpha, from) = match row {
        Some(m) if !c.elastic_typed() => (
            StressUnit::GPa.convert(m.e, c.modulus_unit),
            m.nu,
            m.alpha,
            Some(m.name),
        ),
        _ => (n.get(Num::E), n.get(Num::Nu), n.get(Num::Alpha), None),
    };
    let material = Elastic::try_new(e * c.modulus_unit.pascals(), nu).map_err(|err| match err {
        ElasticError::Modulus(_) => problem(Num::E, "E must be a positive number"),
        ElasticError::Poisson(_) => problem(Num::Nu, err.to_string()),
    })?;
    if !alpha.is_finite() {
        return Err(problem(Num::Alpha, "α must be a finite number"));
    }
    let mismatch = match row {
        Some(m) if from.is_none() => {
            let e_gpa = c.modulus_unit.convert(e, StressUnit::GPa);
            let de = (e_gpa / m.e - 1.0).abs();
            let dnu = (nu / m.nu - 1.0).abs();
            (de > ELASTIC_MISMATCH || dnu > ELASTIC_MISMATCH).then(|| {
                format!(
                    "The typed E = {} GPa and ν = {} differ from {}'s E = {} GPa and ν = {} by {} % and {} %. Stresses from strains and the strain state use the typed values.",
                    crate::model::numfmt::format_sig(e_gpa, 4),
                    crate::model::numfmt::format_sig(nu, 3),
                    m.name,
                    crate::model::numfmt::format_sig(m.e, 4),
                    crate::model::numfmt::format_sig(m.nu, 3),
                    crate::model::numfmt::format_sig(100.0 * de, 2),
                    crate::model::numfmt::format_sig(100.0 * dnu, 2),
                )
            })
        }
        _ => None,
    };
    Ok(ElasticUsed {
        material,
        e,
        nu,
        alpha,
        thermal: alpha * 1e-6 * n.get(Num::DeltaT),
        from,
        mismatch,
    })
}

/// Runs the chosen path through core: the stress tensor in `unit`, and what else it found.
/// For [`Source::Typed`] this returns `Ok(None)`.
///
/// # Errors
/// Every problem found, each attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    angle: AngleUnit,
) -> Result<Option<(StressTensor, Outcome)>, SourceProblem> {
    match c.source {
        Source::Typed => Ok(None),
        Source::Section => section::evaluate(c, n, unit, angle).map(Some),
        Source::Rosette => rosette::evaluate(c, n, unit, angle).map(Some),
        Source::Strain => strain::evaluate(c, n, unit).map(Some),
    }
}

/// Numbers as a plain map, for tests of the paths without a form.
#[cfg(test)]
pub(crate) mod test_numbers {
    use super::{Choices, Num, Numbers};
    use std::collections::BTreeMap;

    /// The numbers of a case, by [`Num`]; a missing one is absent.
    pub(crate) struct Map(pub(crate) BTreeMap<Num, f64>);

    impl Numbers for Map {
        fn get(&self, n: Num) -> f64 {
            self.0.get(&n).copied().unwrap_or(0.0)
        }
        fn absent(&self, n: Num) -> bool {
            !self.0.contains_key(&n)
        }
    }

    /// The demo value of every number the choices use (empty optional ones left absent).
    pub(crate) fn demo(c: &Choices) -> Map {
        Map(c
            .active()
            .into_iter()
            .filter_map(|n| n.demo_text().parse().ok().map(|v| (n, v)))
            .collect())
    }
}

#[cfg(test)]
mod tests {
    use super::test_numbers::demo;
    use super::*;
    use crate::model::choices::{tokens, Layout, SectionKind};

    #[test]
    fn every_source_and_kind_evaluates_its_demo() {
        for source in [Source::Section, Source::Rosette, Source::Strain] {
            for (kind, _) in tokens::KIND {
                for (layout, _) in tokens::LAYOUT {
                    for (condition, _) in tokens::CONDITION {
                        let c = Choices {
                            source,
                            kind,
                            layout,
                            condition,
                            ..Choices::default()
                        };
                        let n = demo(&c);
                        let r = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree);
                        assert!(
                            matches!(r, Ok(Some(_))),
                            "{source:?} {kind:?} {layout:?} {condition:?}: {r:?}"
                        );
                    }
                }
            }
        }
    }

    #[test]
    fn the_shaft_demo_matches_the_textbook_outer_fibre() {
        // 40 mm shaft, Mz = 380 N·m, T = 520 N·m, N = 12 kN, Vy = 4.5 kN at φ = 180° (y = −r):
        // σx = N/A + 32M/(πd³) and τ = 16T/(πd³) (standard formulas; the shear from Vy is zero on
        // the extreme fibre).
        let c = Choices {
            source: Source::Section,
            ..Choices::default()
        };
        let (t, _) = evaluate(&c, &demo(&c), StressUnit::MPa, AngleUnit::Degree)
            .unwrap()
            .unwrap();
        let d = 0.04_f64;
        let pi = core::f64::consts::PI;
        let sx = 12e3 / (pi * d * d / 4.0) + 32.0 * 380.0 / (pi * d * d * d);
        assert!((t.sx() - sx / 1e6).abs() < 1e-9, "{}", t.sx());
        assert!((t.txy() - 16.0 * 520.0 / (pi * d * d * d) / 1e6).abs() < 1e-9);
    }

    #[test]
    fn a_singular_custom_rosette_is_refused_on_the_angles() {
        let c = Choices {
            source: Source::Rosette,
            layout: Layout::Custom,
            gauges: 3,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::gauge_angle(0), 0.0);
        n.0.insert(Num::gauge_angle(1), 180.0);
        n.0.insert(Num::gauge_angle(2), 360.0);
        let e = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree).unwrap_err();
        assert_eq!(e.num, Num::gauge_angle(0));
        assert!(
            e.message.contains("three different directions"),
            "{}",
            e.message
        );
    }

    #[test]
    fn bad_geometry_names_its_field() {
        let c = Choices {
            source: Source::Section,
            kind: SectionKind::Tube,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::Di, 50.0);
        let e = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree).unwrap_err();
        assert_eq!(e.num, Num::Di);
        n.0.insert(Num::Di, 28.0);
        n.0.insert(Num::R, 25.0);
        let e = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree).unwrap_err();
        assert_eq!(e.num, Num::R);
        assert!(e.message.contains("outside the section"), "{}", e.message);
        let c = Choices {
            source: Source::Strain,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::Nu, 0.5);
        assert_eq!(
            evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree)
                .unwrap_err()
                .num,
            Num::Nu
        );
    }
}
