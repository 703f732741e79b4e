//! Will it hold? in the built page: a material's factors of safety and envelope plot, the
//! fatigue check and its diagram, and bad material data refused with the reason. Every number
//! read from the page is compared with stresscase-core on the same state.

use stresscase_core::criteria::{verdicts, Criterion};
use stresscase_core::fatigue::{
    factor, marin, unmodified_endurance_mpa, Cycle, FatigueCriterion, Loading, Surface,
};
use stresscase_core::material;
use stresscase_core::StressTensor;
use stresscase_tests::page::{Page, WAIT};

/// The state every test types in (MPa).
fn typed(p: &mut Page) -> StressTensor {
    p.b.type_into("in-sx", "150").unwrap();
    p.b.type_into("in-sy", "-40").unwrap();
    p.b.type_into("in-txy", "55").unwrap();
    StressTensor::plane(150.0, -40.0, 55.0).unwrap()
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_material_gives_factors_of_safety_and_envelopes() {
    let mut p = Page::open();
    let t = typed(&mut p);
    p.choose("material", "1045cd");
    let s = material::by_key("1045cd").unwrap().strengths().unwrap();
    p.b.type_into("in-nreq", "2.5").unwrap();
    for v in verdicts(&t, &s, 2.5) {
        p.wait_value(&format!("n_{}", v.criterion.key()), v.factor.unwrap());
    }
    // Ductile: von Mises is suggested and in use; its envelope is drawn heavier.
    assert!(p
        .text("document.getElementById('verdict-headline').textContent")
        .starts_with("von Mises"));
    assert_eq!(
        p.text("document.querySelector('#envelope-svg polyline.in-use').dataset.criterion"),
        "vm"
    );
    assert!(p
        .b
        .eval("document.getElementById('load-line') !== null")
        .unwrap()
        .as_bool()
        .unwrap());
    // Choosing Tresca moves the verdict to Tresca.
    p.choose("criterion", "tresca");
    p.b.wait_for(
        "document.getElementById('verdict-headline').textContent.startsWith('Tresca')",
        WAIT,
    )
    .unwrap();
    assert!(p
        .text("document.getElementById('verdict-caution').textContent")
        .contains("licensed engineer"));
    let link = p.link();
    assert!(
        link.contains("mat=1045cd") && link.contains("crit=tresca"),
        "{link}"
    );
    // A brittle material: the yield criteria drop out and modified Mohr is suggested.
    p.choose("criterion", "auto");
    p.choose("material", "gci30");
    let b = material::by_key("gci30").unwrap().strengths().unwrap();
    let mm = verdicts(&t, &b, 2.5)
        .into_iter()
        .find(|v| v.criterion == Criterion::ModifiedMohr)
        .unwrap();
    p.wait_value("n_mm", mm.factor.unwrap());
    assert!(p
        .b
        .eval("document.querySelector('td[data-key=\"n_vm\"]') === null")
        .unwrap()
        .as_bool()
        .unwrap());
    p.no_console_errors();
    p.shot("verdict");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn fatigue_check_shows_factors_and_the_diagram() {
    let mut p = Page::open();
    let t = typed(&mut p);
    p.choose("material", "1045cd");
    p.b.click("fatigue-on").unwrap();
    p.wait_for_id("in-ratio");
    p.b.type_into("in-ratio", "0").unwrap(); // 0 to max
    p.b.type_into("in-fd", "30").unwrap();
    p.b.type_into("in-frel", "99").unwrap();
    let c = Cycle::from_extremes(&t, &StressTensor::ZERO).unwrap();
    let (sa, sm) = c.equivalents();
    let m = marin(Surface::Machined, 630.0, 30.0, Loading::Bending, 20.0, 99.0).unwrap();
    let se = m.product() * unmodified_endurance_mpa(630.0);
    p.wait_value("fat_sa", sa);
    p.wait_value("fat_sm", sm);
    p.wait_value("fat_se", se);
    for (key, cr) in [
        ("nf_goodman", FatigueCriterion::Goodman),
        ("nf_gerber", FatigueCriterion::Gerber),
        ("nf_asme", FatigueCriterion::AsmeElliptic),
        ("nf_soderberg", FatigueCriterion::Soderberg),
        ("nf_langer", FatigueCriterion::FirstCycleYield),
    ] {
        p.wait_value(key, factor(cr, sa, sm, se, 630.0, 530.0).unwrap());
    }
    assert_eq!(
        p.text("Array.from(document.querySelectorAll('#fatigue-svg polyline')).map(l => l.dataset.criterion).join(',')"),
        "goodman,gerber,asme,soderberg,langer"
    );
    let link = p.link();
    assert!(link.contains("fat=on") && link.contains("R=0"), "{link}");
    p.no_console_errors();
    p.shot("fatigue");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn bad_material_data_is_refused_with_the_reason() {
    let mut p = Page::open();
    p.choose("material", "own");
    p.wait_for_id("in-msut");
    let before = p.value("sigma1");
    p.b.type_into("in-msut", "-300").unwrap();
    p.b.wait_for(
        "(document.getElementById('in-msut-msg')?.textContent ?? '').includes('must be a positive number')",
        WAIT,
    )
    .expect("negative strength refused");
    assert!(p
        .b
        .eval("document.getElementById('stale-notice') !== null")
        .unwrap()
        .as_bool()
        .unwrap());
    assert_eq!(p.value("sigma1"), before);
    // A brittle material whose compressive strength is below its tensile strength.
    p.b.type_into("in-msy", "").unwrap();
    p.b.type_into("in-msut", "200").unwrap();
    p.b.type_into("in-melong", "0.5").unwrap();
    p.b.type_into("in-msuc", "150").unwrap();
    p.b.wait_for(
        "(document.getElementById('in-msuc-msg')?.textContent ?? '').includes('compressive strength is at least its tensile')",
        WAIT,
    )
    .expect("Suc < Sut refused");
    // Put right, the verdict is back.
    p.b.type_into("in-msuc", "700").unwrap();
    p.b.wait_for("document.getElementById('stale-notice') === null", WAIT)
        .expect("fresh again");
    p.no_console_errors();
}
