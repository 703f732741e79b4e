//! The case link's own tests: round trips, limits, and properties over arbitrary cases.
use super::*;
use crate::model::choices::{Choices, Endurance, Layout, MaterialPick, MAX_GAUGES};
use proptest::prelude::*;
use stresscase_core::material;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit, StrainUnit};

#[test]
fn demo_link_reads_back() {
    let c = Case::demo();
    let link = c.to_link();
    assert!(
        link.starts_with("v=1&title=Demo%20%28invented%29"),
        "{link}"
    );
    assert!(
        link.contains(
            "&mode=plane&unit=MPa&sx=84&sy=-22&txy=37&theta=30&au=deg&n=1,1,1&shear=down"
        ),
        "{link}"
    );
    assert_eq!(Case::from_link(&format!("#{link}")), Ok(c));
}

#[test]
fn the_longest_valid_case_fits_in_a_link() {
    // Found by fuzzing: a note at its limit in non-Latin script once outgrew the link limit.
    let mut c = Case::demo();
    c.mode = Mode::Full;
    c.title = "\u{1F529}".repeat(MAX_TITLE);
    c.note = "\u{1F529}".repeat(MAX_NOTE);
    c.stress = [-1.2345678901234567e-300; 6];
    c.normal = [-2.2250738585072014e-308; 3];
    c.angle = -1.2345678901234567e-300;
    let link = c.to_link();
    assert!(link.len() <= MAX_LINK_LEN, "{}", link.len());
    assert_eq!(Case::from_link(&link), Ok(c.clone()));
    // The paths with the most numbers: an 8-gauge rosette with the correction, and a
    // pressurised tube; both with an own material and a typed fatigue cycle.
    let long = -1.2345678901234567e-300;
    for source in [Source::Rosette, Source::Section] {
        c.mode = Mode::Plane;
        c.stress = [0.0; 6];
        c.choices = Choices {
            source,
            kind: if source == Source::Section {
                crate::model::choices::SectionKind::Tube
            } else {
                Choices::default().kind
            },
            layout: if source == Source::Rosette {
                Layout::Custom
            } else {
                Choices::default().layout
            },
            gauges: if source == Source::Rosette {
                MAX_GAUGES
            } else {
                Choices::default().gauges
            },
            correct: source == Source::Rosette,
            material: MaterialPick::Own,
            fatigue: true,
            cycle: crate::model::choices::Cycle::Minimum,
            endurance: Endurance::Given,
            life: true,
            life_of: crate::model::choices::LifeOf::History,
            sn: crate::model::choices::SnFrom::Own,
            mean_stress: crate::model::choices::MeanStressPick::Morrow,
            ..Choices::default()
        };
        c.numbers = c.choices.active().into_iter().map(|n| (n, long)).collect();
        c.history = vec![long; crate::model::entry::MAX_HISTORY];
        let link = c.to_link();
        assert!(link.len() <= MAX_LINK_LEN, "{source:?}: {}", link.len());
        assert!(
            Case::from_link(&link) == Ok(c.clone()),
            "{source:?} does not read back"
        );
    }
}

#[test]
fn percent_encoded_keys_read_like_plain_ones() {
    let plain = "v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3";
    let encoded = "%76=1&mode=plane&unit=MPa&%73x=1&sy=2&txy=3";
    assert_eq!(Case::from_link(encoded), Case::from_link(plain));
    let e = Case::from_link("v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3&%3Cimg%20src=1").unwrap_err();
    assert_eq!(e.to_string(), "unknown key '<img src'");
}

#[test]
fn every_link_key_is_distinct() {
    let mut k = all_keys();
    let n = k.len();
    k.sort_unstable();
    k.dedup();
    assert_eq!(k.len(), n, "a key is used twice");
}

#[test]
fn numbers_are_short_and_exact() {
    for v in [
        84.0,
        -35.5,
        1e150,
        -1e-150,
        0.1 + 0.2,
        6894.757293168361,
        5e-324,
        f64::MAX,
    ] {
        let s = write_number(v);
        assert_eq!(s.parse::<f64>().unwrap(), v, "{s}");
        assert!(s.len() <= 24, "{s}");
    }
    assert_eq!(write_number(-0.0), "0");
    assert_eq!(write_number(1e150), "1e150");
}

fn arb_text(max: usize) -> impl Strategy<Value = String> {
    proptest::string::string_regex(&format!(
        "[ -~\u{00e9}\u{03c3}\u{2264}\n]{{0,{}}}",
        max.min(60)
    ))
    .unwrap()
    .prop_filter("script-free", move |s| check_text(s, max).is_ok())
}

fn arb_num() -> impl Strategy<Value = f64> {
    prop_oneof![
        (-1e4..1e4f64),
        any::<f64>().prop_filter("finite", |v| v.is_finite()),
        Just(0.0),
    ]
}

pub(crate) fn arb_choices() -> impl Strategy<Value = Choices> {
    use crate::model::choices::{Condition, Layout, Surface};
    use stresscase_core::section::Face;
    use stresscase_core::vessel::Ends;
    (
        (
            0usize..4,
            0usize..5,
            0usize..3,
            0usize..4,
            0usize..6,
            0usize..6,
        ),
        (any::<bool>(), 0usize..4, any::<bool>(), 0usize..3, 3u8..=8),
        (
            any::<bool>(),
            any::<bool>(),
            0usize..3,
            0usize..6,
            any::<bool>(),
            0usize..4,
        ),
        (
            0usize..=material::TABLE.len(),
            0usize..6,
            0usize..6,
            any::<bool>(),
            0usize..4,
            any::<bool>(),
            0usize..4,
            0usize..3,
        ),
        (
            any::<bool>(),
            0usize..3,
            0usize..3,
            0usize..4,
            any::<bool>(),
            0usize..2,
            any::<bool>(),
            0usize..5,
        ),
    )
        .prop_map(
            |(
                (src, kind, lu, fu, mu, pu),
                (ends, face, surf, layout, ng),
                (su, tsc, cond, eu, ec, fcrit),
                (mat, msu, crit, fat, cyc, sem, fin, load),
                (life, lof, sn, msc, rot, nq, skt, ktf),
            )| {
                Choices {
                    source: tokens::SOURCE[src].0,
                    kind: tokens::KIND[kind].0,
                    length: LengthUnit::ALL[lu],
                    force: ForceUnit::ALL[fu],
                    moment: MomentUnit::ALL[mu],
                    pressure: StressUnit::ALL[pu],
                    ends: if ends {
                        Ends::Closed
                    } else {
                        Ends::PlaneStrain
                    },
                    face: [Face::PosY, Face::PosZ, Face::NegY, Face::NegZ][face],
                    surface: if surf { Surface::Inner } else { Surface::Outer },
                    layout: [Layout::Rectangular, Layout::Delta, Layout::Custom][layout],
                    gauges: ng,
                    strain_unit: if su {
                        StrainUnit::Micro
                    } else {
                        StrainUnit::Unit
                    },
                    correct: tsc,
                    condition: [
                        Condition::PlaneStress,
                        Condition::PlaneStrain,
                        Condition::Full,
                    ][cond],
                    modulus_unit: StressUnit::ALL[eu],
                    material: if mat == material::TABLE.len() {
                        MaterialPick::Own
                    } else {
                        MaterialPick::Table(mat)
                    },
                    strength_unit: StressUnit::ALL[msu],
                    criterion: tokens::CRITERION[crit].0,
                    fatigue: fat,
                    cycle: tokens::CYCLE[cyc].0,
                    endurance: tokens::ENDURANCE[usize::from(sem)].0,
                    finish: tokens::FINISH[fin].0,
                    loading: tokens::LOADING[load].0,
                    elastic: tokens::ELASTIC_FROM[usize::from(ec)].0,
                    fatigue_criterion: tokens::FATIGUE_CRITERION[fcrit].0,
                    life,
                    life_of: tokens::LIFE_OF[lof].0,
                    sn: tokens::SN_FROM[sn].0,
                    mean_stress: tokens::MEAN_STRESS[msc].0,
                    rotating: rot,
                    notch_q: tokens::NOTCH_Q[nq].0,
                    static_kt: skt,
                    kt_from: tokens::KT_FROM[ktf].0,
                }
            },
        )
        .prop_map(|mut c| {
            // Choices a path does not use are not kept in a link: normalise them away.
            let d = Choices::default();
            c.keep_cycle_valid();
            let used: Vec<&str> = choice_pairs(&c).into_iter().map(|(k, _)| k).collect();
            if !used.contains(&"kind") {
                c.kind = d.kind;
            }
            if !used.contains(&"lu") {
                c.length = d.length;
            }
            if !used.contains(&"fu") {
                c.force = d.force;
            }
            if !used.contains(&"mu") {
                c.moment = d.moment;
            }
            if !used.contains(&"pu") {
                c.pressure = d.pressure;
            }
            if !used.contains(&"ends") {
                c.ends = d.ends;
            }
            if !used.contains(&"face") {
                c.face = d.face;
            }
            if !used.contains(&"surf") {
                c.surface = d.surface;
            }
            if !used.contains(&"layout") {
                c.layout = d.layout;
            }
            if !used.contains(&"ng") {
                c.gauges = d.gauges;
            }
            if !used.contains(&"su") {
                c.strain_unit = d.strain_unit;
            }
            if !used.contains(&"tsc") {
                c.correct = d.correct;
            }
            if !used.contains(&"cond") {
                c.condition = d.condition;
            }
            if !used.contains(&"msu") {
                c.strength_unit = d.strength_unit;
            }
            if !used.contains(&"cyc") {
                c.cycle = d.cycle;
            }
            if !used.contains(&"sem") {
                c.endurance = d.endurance;
            }
            if !used.contains(&"fsurf") {
                c.finish = d.finish;
            }
            if !used.contains(&"fload") {
                c.loading = d.loading;
            }
            if !used.contains(&"ec") {
                c.elastic = d.elastic;
            }
            if !used.contains(&"fcrit") {
                c.fatigue_criterion = d.fatigue_criterion;
            }
            if !used.contains(&"life") {
                c.life = d.life;
            }
            if !used.contains(&"rot") {
                c.rotating = d.rotating;
            }
            if !used.contains(&"nq") {
                c.notch_q = d.notch_q;
            }
            if !used.contains(&"ktf") {
                c.kt_from = d.kt_from;
            }
            if !used.contains(&"skt") {
                c.static_kt = d.static_kt;
            }
            if !used.contains(&"lof") {
                c.life_of = d.life_of;
                c.sn = d.sn;
                c.mean_stress = d.mean_stress;
            }
            if c.kind == crate::model::choices::SectionKind::ThinCylinder {
                c.ends = Ends::Closed;
            }
            c
        })
}

fn arb_case() -> impl Strategy<Value = Case> {
    (
        (
            arb_text(MAX_TITLE),
            arb_text(MAX_NOTE),
            any::<bool>(),
            0usize..6,
        ),
        prop::array::uniform6(arb_num()),
        (
            arb_num(),
            any::<bool>(),
            prop::array::uniform3(arb_num()),
            any::<bool>(),
        ),
        (
            arb_choices(),
            prop::collection::vec(arb_num(), 80),
            prop::collection::vec(arb_num(), 2..40),
        ),
    )
        .prop_filter_map(
            "non-zero normal",
            |(
                (title, note, full, u),
                mut stress,
                (angle, rad, normal, up),
                (choices, nums, history),
            )| {
                if normal == [0.0; 3] {
                    return None;
                }
                let typed = choices.source == Source::Typed;
                let mode = if full && typed {
                    Mode::Full
                } else {
                    Mode::Plane
                };
                if mode == Mode::Plane {
                    stress[2] = 0.0;
                    stress[4] = 0.0;
                    stress[5] = 0.0;
                }
                if !typed {
                    stress = [0.0; 6];
                }
                let numbers = choices.active().into_iter().zip(nums).collect();
                Some(Case {
                    title,
                    note,
                    mode,
                    unit: StressUnit::ALL[u],
                    stress,
                    angle,
                    angle_unit: if rad {
                        AngleUnit::Radian
                    } else {
                        AngleUnit::Degree
                    },
                    normal,
                    shear_axis: if up {
                        ShearAxis::PositiveUp
                    } else {
                        ShearAxis::PositiveDown
                    },
                    choices,
                    numbers,
                    history: if choices.history_on() {
                        history
                    } else {
                        Vec::new()
                    },
                })
            },
        )
}

proptest! {
    #[test]
    fn any_case_round_trips_through_its_link(c in arb_case()) {
        let link = c.to_link();
        prop_assert!(link.len() <= MAX_LINK_LEN);
        prop_assert_eq!(Case::from_link(&link), Ok(c.clone()));
        // And through the form the page shows.
        prop_assert_eq!(Case::from_form(&c.to_form()), Ok(c));
    }

    #[test]
    fn any_text_is_refused_or_read_never_panics(s in ".{0,300}") {
        let _ = Case::from_link(&s);
        let _ = Case::from_link(&format!("v=1&{s}"));
    }
}
