//! Case links stay stable: every fixture link of format v1 (`tests/data/case_links_v1.json`,
//! hand-written) opens exactly its recorded case in this and every later release; every link
//! in the bad-link corpus (`tests/data/bad_links_v1.txt` plus generated ones) is refused with a
//! message naming the problem. Saved-case files written by this release read back.

use serde_json::Value;
use std::collections::BTreeMap;
use stresscase_core::material;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit, StrainUnit};
use stresscase_core::{AngleUnit, ShearAxis, StressUnit};
use stresscase_tests::check::data_path;
use stresscase_web::formats::link::{Case, LinkError};
use stresscase_web::formats::saved::Library;
use stresscase_web::model::case::Mode;
use stresscase_web::model::choices::{tokens, Choices, ElasticFrom, MaterialPick};
use stresscase_web::model::inputs::Num;

fn expected(v: &Value) -> Case {
    let nums = |k: &str| -> Vec<f64> {
        v[k].as_array()
            .expect(k)
            .iter()
            .map(|x| x.as_f64().expect("number"))
            .collect()
    };
    let s = nums("stress");
    let n = nums("normal");
    // Cases without a "source" are typed components with the default elastic constants
    // (E = 200 GPa, ν = 0.3, α = 12 µε/K, ΔT = 0 K), material and required factor 2: the
    // documented defaults.
    let mut choices = Choices::default();
    let mut numbers: BTreeMap<Num, f64> = [
        (Num::E, 200.0),
        (Num::Nu, 0.3),
        (Num::Alpha, 12.0),
        (Num::DeltaT, 0.0),
        (Num::Required, 2.0),
    ]
    .into_iter()
    .collect();
    let mut history = Vec::new();
    if let Some(src) = v.get("source") {
        let word = |k: &str| src["choices"][k].as_str();
        if let Some(t) = word("life") {
            choices.life = t == "on";
        }
        if let Some(t) = word("lof") {
            choices.life_of = tokens::value(&tokens::LIFE_OF, t).expect("lof");
        }
        if let Some(t) = word("sn") {
            choices.sn = tokens::value(&tokens::SN_FROM, t).expect("sn");
        }
        if let Some(t) = word("msc") {
            choices.mean_stress = tokens::value(&tokens::MEAN_STRESS, t).expect("msc");
        }
        if let Some(h) = src.get("history") {
            history = h
                .as_array()
                .expect("history")
                .iter()
                .map(|x| x.as_f64().expect("number"))
                .collect();
        }
        let c = &mut choices;
        if let Some(t) = word("src") {
            c.source = tokens::value(&tokens::SOURCE, t).expect("src");
        }
        if let Some(t) = word("kind") {
            c.kind = tokens::value(&tokens::KIND, t).expect("kind");
        }
        if let Some(t) = word("lu") {
            c.length = LengthUnit::from_symbol(t).expect("lu");
        }
        if let Some(t) = word("fu") {
            c.force = ForceUnit::from_symbol(t).expect("fu");
        }
        if let Some(t) = word("mu") {
            c.moment = MomentUnit::from_token(t).expect("mu");
        }
        if let Some(t) = word("pu") {
            c.pressure = StressUnit::from_symbol(t).expect("pu");
        }
        if let Some(t) = word("ends") {
            c.ends = tokens::value(&tokens::ENDS, t).expect("ends");
        }
        if let Some(t) = word("face") {
            c.face = tokens::value(&tokens::FACE, t).expect("face");
        }
        if let Some(t) = word("surf") {
            c.surface = tokens::value(&tokens::SURFACE, t).expect("surf");
        }
        if let Some(t) = word("layout") {
            c.layout = tokens::value(&tokens::LAYOUT, t).expect("layout");
        }
        if let Some(t) = word("ng") {
            c.gauges = t.parse().expect("ng");
        }
        if let Some(t) = word("su") {
            c.strain_unit = StrainUnit::from_token(t).expect("su");
        }
        if let Some(t) = word("tsc") {
            c.correct = t == "on";
        }
        if let Some(t) = word("cond") {
            c.condition = tokens::value(&tokens::CONDITION, t).expect("cond");
        }
        if let Some(t) = word("eu") {
            c.modulus_unit = StressUnit::from_symbol(t).expect("eu");
        }
        if let Some(t) = word("mat") {
            c.material = if t == "own" {
                MaterialPick::Own
            } else {
                MaterialPick::Table(
                    material::TABLE
                        .iter()
                        .position(|m| m.key == t)
                        .expect("mat"),
                )
            };
        }
        if let Some(t) = word("msu") {
            c.strength_unit = StressUnit::from_symbol(t).expect("msu");
        }
        if let Some(t) = word("crit") {
            c.criterion = tokens::value(&tokens::CRITERION, t).expect("crit");
        }
        if let Some(t) = word("fat") {
            c.fatigue = t == "on";
        }
        if let Some(t) = word("cyc") {
            c.cycle = tokens::value(&tokens::CYCLE, t).expect("cyc");
        }
        if let Some(t) = word("sem") {
            c.endurance = tokens::value(&tokens::ENDURANCE, t).expect("sem");
        }
        if let Some(t) = word("fsurf") {
            c.finish = tokens::value(&tokens::FINISH, t).expect("fsurf");
        }
        if let Some(t) = word("fload") {
            c.loading = tokens::value(&tokens::LOADING, t).expect("fload");
        }
        if let Some(t) = word("ec") {
            c.elastic = tokens::value(&tokens::ELASTIC_FROM, t).expect("ec");
            if c.elastic == ElasticFrom::Material {
                // E, ν and α come from the material: they are not numbers of the case.
                for n in [Num::E, Num::Nu, Num::Alpha] {
                    numbers.remove(&n);
                }
            }
        }
        if let Some(t) = word("fcrit") {
            c.fatigue_criterion = tokens::value(&tokens::FATIGUE_CRITERION, t).expect("fcrit");
        }
        for (k, x) in src["numbers"].as_object().expect("numbers") {
            let num = Num::all()
                .into_iter()
                .find(|n| n.key() == k)
                .unwrap_or_else(|| panic!("no number with key {k}"));
            numbers.insert(num, x.as_f64().expect("number"));
        }
    }
    Case {
        title: v["title"].as_str().expect("title").into(),
        note: v["note"].as_str().expect("note").into(),
        mode: if v["mode"] == "3d" {
            Mode::Full
        } else {
            Mode::Plane
        },
        unit: StressUnit::from_symbol(v["unit"].as_str().expect("unit")).expect("known unit"),
        stress: [s[0], s[1], s[2], s[3], s[4], s[5]],
        angle: v["angle"].as_f64().expect("angle"),
        angle_unit: if v["angle_unit"] == "rad" {
            AngleUnit::Radian
        } else {
            AngleUnit::Degree
        },
        normal: [n[0], n[1], n[2]],
        shear_axis: if v["shear"] == "up" {
            ShearAxis::PositiveUp
        } else {
            ShearAxis::PositiveDown
        },
        choices,
        numbers,
        history,
    }
}

#[test]
fn v1_fixture_links_open_their_recorded_cases() {
    let text = std::fs::read_to_string(data_path("data/case_links_v1.json")).expect("fixture file");
    let file: Value = serde_json::from_str(&text).expect("fixture JSON");
    let links = file["links"].as_array().expect("links");
    assert!(links.len() >= 7);
    for entry in links {
        let link = entry["link"].as_str().expect("link");
        let want = expected(&entry["case"]);
        assert_eq!(Case::from_link(link).as_ref(), Ok(&want), "{link}");
        // What this release writes for the case reads back to it too.
        assert_eq!(Case::from_link(&want.to_link()), Ok(want));
    }
}

fn corpus() -> Vec<(String, String)> {
    let text = std::fs::read_to_string(data_path("data/bad_links_v1.txt")).expect("corpus file");
    let mut out: Vec<(String, String)> = text
        .lines()
        .filter(|l| !l.starts_with("# ") && !l.is_empty())
        .map(|l| {
            let (says, link) = l.split_once('\t').expect("tab-separated line");
            (says.to_string(), link.to_string())
        })
        .collect();
    // Generated: 300 KB of junk, an over-long valid-looking link (the limit is 256 KiB), a
    // huge number, a history of one value.
    out.push((
        "characters long".into(),
        format!("#{}", "x".repeat(300_000)),
    ));
    out.push((
        "characters long".into(),
        format!(
            "#v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3&note={}",
            "a".repeat(270_000)
        ),
    ));
    out.push((
        "a load history has 2 to 5000 values, found 1".into(),
        "#v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3&fat=on&R=0&fd=25&ftemp=20&frel=90&life=on&lof=history&hist=5".into(),
    ));
    out.push((
        "'hist' is not used".into(),
        "#v=1&mode=plane&unit=MPa&sx=1&sy=2&txy=3&fat=on&R=0&fd=25&ftemp=20&frel=90&life=on&hist=5,6".into(),
    ));
    out.push((
        "longer than 200 characters".into(),
        format!(
            "#v=1&title={}&mode=plane&unit=MPa&sx=1&sy=2&txy=3",
            "t".repeat(201)
        ),
    ));
    out.push((
        "longer than 2000 characters".into(),
        format!(
            "#v=1&note={}&mode=plane&unit=MPa&sx=1&sy=2&txy=3",
            "n".repeat(2001)
        ),
    ));
    out.push((
        "is not a finite number".into(),
        format!(
            "#v=1&mode=plane&unit=MPa&sx=1{}&sy=2&txy=3",
            "0".repeat(400)
        ),
    ));
    out
}

#[test]
fn bad_links_are_refused_with_a_reason() {
    let corpus = corpus();
    assert!(corpus.len() >= 50, "only {} bad links", corpus.len());
    for (says, link) in corpus {
        match Case::from_link(&link) {
            Ok(c) => panic!("accepted a bad link {link:.80}: {c:?}"),
            Err(e) => {
                let msg = e.to_string();
                assert!(
                    msg.contains(&says),
                    "{link:.80}: message {msg:?} lacks {says:?}"
                );
                assert!(msg.len() < 200, "message too long to show: {msg}");
            }
        }
    }
    assert_eq!(Case::from_link("#"), Err(LinkError::Empty));
}

#[test]
fn saved_cases_files_read_back() {
    let mut lib = Library::default();
    let text = std::fs::read_to_string(data_path("data/case_links_v1.json")).expect("fixture file");
    let file: Value = serde_json::from_str(&text).expect("fixture JSON");
    for (i, entry) in file["links"].as_array().expect("links").iter().enumerate() {
        lib.save(&format!("fixture {i}"), &expected(&entry["case"]))
            .expect("save");
    }
    let json = lib.to_json();
    assert_eq!(Library::from_json(&json), Ok(lib));
}
