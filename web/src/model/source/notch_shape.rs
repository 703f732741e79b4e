//! The section's Kt and Kts: typed, or from core's published fits for the notch's shape
//! ([`stresscase_core::concentration`]). The section on screen is the fit's nominal section: a
//! solid round section of the smaller (root) diameter for a stepped or grooved bar; a rectangle
//! whose depth h is the narrower width for a stepped flat bar, or the net width through the hole
//! for a plate with a hole (the plate's width is h plus the hole).
//!
//! One Kt multiplies the whole normal stress from N, My and Mz, so with both an axial force and
//! a bending moment the larger of the tension and bending fits is used (the conservative pick,
//! printed). Only the loads present are fitted: a fit out of range is refused only when its load
//! is there.

use super::{problem, Numbers, SourceProblem};
use crate::model::choices::{Choices, KtFrom, SectionKind};
use crate::model::inputs::Num;
use stresscase_core::concentration::{self, ConcentrationError, Fitted, Shape};
use stresscase_core::fatigue::Loading;

/// Kt and Kts in use, and the fits behind them.
#[derive(Debug, Clone, PartialEq)]
pub struct ShapeFactors {
    /// Kt for normal stress.
    pub kt: f64,
    /// Kts for shear stress.
    pub kts: f64,
    /// The fit Kt came from, with the loading it is for.
    pub normal: Option<(Loading, Fitted)>,
    /// The fit Kts came from.
    pub shear: Option<Fitted>,
    /// Notes printed beside the factors (which fit, what is left out).
    pub notes: Vec<&'static str>,
    /// The notch root radius the shape gives (the case's length unit), for Neuber's q.
    pub radius: Option<f64>,
}

/// Printed when both N and a bending moment act.
pub const LARGER_OF_TWO: &str = "Axial force and bending both act and one Kt multiplies their sum: the larger of the tension and bending fits is used (conservative).";
/// Printed when no normal load acts.
pub const NO_NORMAL: &str = "No axial force or bending moment: Kt is not needed and is taken as 1.";
/// Printed when a round bar has no torque or shear force.
pub const NO_SHEAR: &str = "No torque or shear force: Kts is not needed and is taken as 1.";
/// Printed when a shaft's torsion fit also multiplies transverse shear.
pub const SHEAR_FROM_TORSION: &str = "Kts from the torsion fit also multiplies the transverse shear from Vy and Vz (no fit covers it; that shear is zero where bending peaks).";
/// Printed for a flat bar or a plate: Kts is typed.
pub const KTS_TYPED: &str = "The fits for a flat bar or plate do not cover shear: Kts is typed.";

fn nonzero(n: &impl Numbers, c: &Choices, steady: &[Num], alternating: &[Num]) -> bool {
    steady.iter().any(|&k| n.get(k) != 0.0)
        || (c.loads_cycle() && !c.rotating_shaft() && alternating.iter().any(|&k| n.get(k) != 0.0))
}

/// The section's Kt and Kts.
///
/// # Errors
/// A shape that does not match the section, unusable dimensions, a ratio outside a fit's
/// range, or a load the shape has no fit for; each attached to its number.
pub fn factors(c: &Choices, n: &impl Numbers) -> Result<ShapeFactors, SourceProblem> {
    let typed = ShapeFactors {
        kt: n.get(Num::Kt),
        kts: n.get(Num::Kts),
        normal: None,
        shear: None,
        notes: vec![],
        radius: None,
    };
    let from = c.kt_from;
    if from == KtFrom::Typed {
        return Ok(typed);
    }
    let size_num = if from == KtFrom::Hole {
        Num::KtHole
    } else {
        Num::KtBig
    };
    if from.round() && c.kind != SectionKind::SolidRound {
        return Err(problem(
            size_num,
            "the fits for a stepped or grooved round bar need the solid round section (its diameter is the smaller one) — choose it, or type Kt",
        ));
    }
    if !from.round() && c.kind != SectionKind::Rectangle {
        return Err(problem(
            size_num,
            "the fits for a flat bar or plate need the rectangle section (its depth h is the narrower width) — choose it, or type Kt",
        ));
    }
    let axial = nonzero(n, c, &[Num::N], &[Num::Na]);
    let in_plane = nonzero(n, c, &[Num::Mz], &[Num::Mza]);
    let out_of_plane = nonzero(n, c, &[Num::My], &[Num::Mya]);
    let bending = in_plane || out_of_plane;
    let twist = nonzero(n, c, &[Num::T], &[Num::Ta]);
    let shear = twist || nonzero(n, c, &[Num::Vy, Num::Vz], &[Num::Vya, Num::Vza]);
    if !from.round() && out_of_plane {
        return Err(problem(
            Num::My,
            "the flat bar and plate fits cover in-plane bending (Mz) only — type Kt for bending about y",
        ));
    }
    if from == KtFrom::Hole && in_plane {
        return Err(problem(
            Num::Mz,
            "the plate-with-a-hole fit covers tension only — type Kt for bending",
        ));
    }
    let small = match c.kind {
        SectionKind::Rectangle => n.get(Num::H),
        _ => n.get(Num::D),
    };
    let (big, r) = (n.get(Num::KtBig), n.get(Num::KtR));
    let shape = match from {
        KtFrom::Shoulder => Shape::ShaftShoulder { big, small, r },
        KtFrom::Groove => Shape::ShaftGroove { big, small, r },
        KtFrom::FlatShoulder => Shape::PlateShoulder { big, small, r },
        KtFrom::Hole | KtFrom::Typed => Shape::PlateHole {
            width: small + n.get(Num::KtHole),
            hole: n.get(Num::KtHole),
        },
    };
    let refused = |e: ConcentrationError| {
        let num = match e {
            ConcentrationError::Outside { .. } if from == KtFrom::Hole => Num::KtHole,
            ConcentrationError::Outside { .. } => Num::KtR,
            ConcentrationError::Dimension(m) if m.contains("radius") => Num::KtR,
            _ => size_num,
        };
        problem(num, e.to_string())
    };
    let fit = |l| concentration::kt(shape, l).map_err(refused);
    let mut notes = vec![];
    let normal = match (axial, bending) {
        (true, true) => {
            notes.push(LARGER_OF_TWO);
            let (a, b) = (fit(Loading::Axial)?, fit(Loading::Bending)?);
            Some(if b.kt > a.kt {
                (Loading::Bending, b)
            } else {
                (Loading::Axial, a)
            })
        }
        (true, false) => Some((Loading::Axial, fit(Loading::Axial)?)),
        (false, true) => Some((Loading::Bending, fit(Loading::Bending)?)),
        (false, false) => {
            notes.push(NO_NORMAL);
            None
        }
    };
    let shear_fit = if from.round() {
        if shear {
            if n.get(Num::Vy) != 0.0 || n.get(Num::Vz) != 0.0 {
                notes.push(SHEAR_FROM_TORSION);
            }
            Some(fit(Loading::Torsion)?)
        } else {
            notes.push(NO_SHEAR);
            None
        }
    } else {
        notes.push(KTS_TYPED);
        None
    };
    Ok(ShapeFactors {
        kt: normal.map_or(1.0, |(_, f)| f.kt),
        kts: match shear_fit {
            Some(f) => f.kt,
            None if from.round() => 1.0,
            None => typed.kts,
        },
        normal,
        shear: shear_fit,
        notes,
        radius: Some(if from == KtFrom::Hole {
            0.5 * n.get(Num::KtHole)
        } else {
            r
        }),
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::source::test_numbers::Map as Nums;
    use std::collections::BTreeMap;

    fn shaft(pairs: &[(Num, f64)]) -> (Choices, Nums) {
        let c = Choices {
            source: crate::model::choices::Source::Section,
            kind: SectionKind::SolidRound,
            kt_from: KtFrom::Shoulder,
            ..Choices::default()
        };
        let mut m: BTreeMap<Num, f64> = [
            (Num::D, 40.0),
            (Num::KtBig, 60.0),
            (Num::KtR, 4.0),
            (Num::Kt, 9.0),
            (Num::Kts, 9.0),
        ]
        .into_iter()
        .collect();
        m.extend(pairs.iter().copied());
        (c, Nums(m))
    }

    fn core_kt(l: Loading) -> f64 {
        concentration::kt(
            Shape::ShaftShoulder {
                big: 60.0,
                small: 40.0,
                r: 4.0,
            },
            l,
        )
        .unwrap()
        .kt
    }

    #[test]
    fn the_fit_follows_the_loads_present() {
        let (c, n) = shaft(&[(Num::My, 100.0), (Num::T, 50.0)]);
        let f = factors(&c, &n).unwrap();
        assert_eq!(f.kt, core_kt(Loading::Bending));
        assert_eq!(f.kts, core_kt(Loading::Torsion));
        assert_eq!(f.radius, Some(4.0));

        let (c, n) = shaft(&[(Num::N, 1000.0), (Num::Mz, 100.0)]);
        let f = factors(&c, &n).unwrap();
        let (a, b) = (core_kt(Loading::Axial), core_kt(Loading::Bending));
        assert!(
            a > b,
            "tension concentrates more than bending at this shoulder"
        );
        assert_eq!(f.kt, a);
        assert!(f.notes.contains(&LARGER_OF_TWO));
        assert_eq!((f.kts, f.shear), (1.0, None));
        assert!(f.notes.contains(&NO_SHEAR));
    }

    #[test]
    fn a_shape_that_does_not_match_the_section_is_refused() {
        let (mut c, n) = shaft(&[(Num::My, 100.0)]);
        c.kind = SectionKind::Tube;
        assert_eq!(factors(&c, &n).unwrap_err().num, Num::KtBig);
        c.kind = SectionKind::SolidRound;
        c.kt_from = KtFrom::Hole;
        assert_eq!(factors(&c, &n).unwrap_err().num, Num::KtHole);
    }

    #[test]
    fn a_ratio_outside_the_fit_is_refused_only_when_its_load_acts() {
        // t/r = 10/0.5 = 20: inside the bending range (to 20), outside torsion's (to 4).
        let (c, n) = shaft(&[(Num::My, 100.0), (Num::KtR, 0.5)]);
        assert!(factors(&c, &n).is_ok());
        let (c, n) = shaft(&[(Num::My, 100.0), (Num::KtR, 0.5), (Num::T, 1.0)]);
        let e = factors(&c, &n).unwrap_err();
        assert_eq!(e.num, Num::KtR);
        assert!(e.message.contains("0.25 to 4"), "{}", e.message);
    }

    #[test]
    fn a_plate_with_a_hole_takes_tension_only_and_keeps_the_typed_kts() {
        let c = Choices {
            source: crate::model::choices::Source::Section,
            kind: SectionKind::Rectangle,
            kt_from: KtFrom::Hole,
            ..Choices::default()
        };
        let n = Nums(
            [
                (Num::H, 48.0),
                (Num::KtHole, 12.0),
                (Num::N, 1e4),
                (Num::Kts, 1.3),
            ]
            .into_iter()
            .collect(),
        );
        let f = factors(&c, &n).unwrap();
        let want = concentration::kt(
            Shape::PlateHole {
                width: 60.0,
                hole: 12.0,
            },
            Loading::Axial,
        )
        .unwrap()
        .kt;
        assert_eq!((f.kt, f.kts, f.radius), (want, 1.3, Some(6.0)));
        let mut bent = n;
        bent.0.insert(Num::Mz, 5.0);
        assert_eq!(factors(&c, &bent).unwrap_err().num, Num::Mz);
    }
}
