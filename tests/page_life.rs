//! The life in cycles in the built page, in headless Chromium: a pasted load history (its
//! cycles, damage, repeats and hours, the S–N diagram and the cycle matrix against core's
//! rainflow count and Miner's sum on the same numbers, checked in `life_reference.rs` against
//! the `rainflow` and `fatpack` packages), the history in the case link and back, a refused
//! value marking the results stale, and the fatigue check's own cycle on the estimated line.

use stresscase_core::damage::{HistoryLife, Miner};
use stresscase_core::fatigue::{marin, unmodified_endurance_mpa, Cycle, Loading, Surface};
use stresscase_core::mean_stress::MeanStress;
use stresscase_core::rainflow::count;
use stresscase_core::sn_curve::{estimated_fraction, Life, SnLine};
use stresscase_core::StressTensor;
use stresscase_tests::page::Page;

/// An invented history at a bracket weld, MPa.
const HISTORY: [f64; 11] = [
    0.0, 400.0, -100.0, 350.0, 50.0, 480.0, -200.0, 300.0, 20.0, 260.0, 0.0,
];
const SUT: f64 = 630.0; // the built-in cold-drawn 1045 the tests pick
const SE: f64 = 250.0;

fn setup_history(p: &mut Page) {
    p.choose("material", "1045cd");
    p.b.click("fatigue-on").unwrap();
    p.wait_for_id("endurance-kind");
    p.choose("endurance-kind", "given");
    p.b.type_into("in-se", &SE.to_string()).unwrap();
    p.b.click("life-on").unwrap();
    p.choose("life-of", "history");
    p.choose("sn-line", "f");
    p.b.type_into("in-lf", "0.9").unwrap();
    p.choose("mean-stress", "goodman");
    let text = HISTORY.map(|v| v.to_string()).join("\n");
    p.b.type_into("in-history", &text).unwrap();
    p.b.type_into("in-hdur", "0.5").unwrap();
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_pasted_history_gives_its_cycles_damage_and_life() {
    let mut p = Page::open();
    setup_history(&mut p);
    let cycles = count(&HISTORY).unwrap();
    let line = SnLine::through_strengths(0.9, SUT, SE).unwrap();
    let m = Miner::sum(&cycles, MeanStress::Goodman, &line, SUT);
    let HistoryLife::Repeats(repeats) = m.life() else {
        panic!("the invented history should have a life: {m:?}")
    };
    p.wait_value("hist_damage", m.total);
    p.wait_value("hist_repeats", repeats);
    p.wait_value("hist_hours", repeats * 0.5);
    let counted: f64 = cycles.iter().map(|c| c.count).sum();
    p.wait_value("hist_cycles", counted);
    p.wait_value("hist_points", HISTORY.len() as f64);
    p.wait_value("life_a", line.a);
    p.wait_value("life_b", line.b);
    // Every counted cycle is a mark on the S–N diagram; the matrix holds every count.
    p.wait_number(
        "S–N marks",
        "document.getElementById('sn-svg')?.dataset.points",
        cycles.len() as f64,
    );
    p.wait_number(
        "matrix total",
        "document.getElementById('cycle-matrix-svg')?.dataset.total",
        counted,
    );
    p.wait_number(
        "damage bins total",
        "document.getElementById('damage-bins-svg')?.dataset.total",
        m.total,
    );
    // The history travels in the case link and reads back the same.
    let link = p.text("location.hash");
    assert!(
        link.contains("life=on")
            && link.contains("lof=history")
            && link.contains("hist=0,400,-100"),
        "{link}"
    );
    let mut q = Page::open_at("/", &link);
    q.wait_value("hist_damage", m.total);
    // A value that does not read is refused with its place, and the results go stale.
    p.b.type_into("in-history", "0, 400, 4OO, 20").unwrap();
    p.b.wait_for(
        "document.getElementById('in-history-msg').textContent.includes('value 3')",
        std::time::Duration::from_secs(10),
    )
    .unwrap();
    p.b.wait_for(
        "document.getElementById('life-table').classList.contains('stale')",
        std::time::Duration::from_secs(10),
    )
    .unwrap();
    p.no_console_errors();
    p.shot("life-history");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn the_fatigue_cycle_gets_a_life_on_the_estimated_line() {
    let mut p = Page::open();
    let t = StressTensor::plane(240.0, 0.0, 90.0).unwrap();
    for (id, v) in [("in-sx", "240"), ("in-sy", "0"), ("in-txy", "90")] {
        p.b.type_into(id, v).unwrap();
    }
    p.choose("material", "1045cd");
    p.b.click("fatigue-on").unwrap();
    p.wait_for_id("in-ratio");
    p.b.type_into("in-ratio", "-1").unwrap(); // fully reversed
    p.b.click("life-on").unwrap();
    p.wait_for_id("sn-line");
    let c = Cycle::from_extremes(&t, &t.scaled(-1.0).unwrap()).unwrap();
    let (sa, _) = c.equivalents();
    // The page's default endurance estimate: machined, d = 40 mm, bending, 20 °C, 90 %.
    let se = marin(Surface::Machined, SUT, 40.0, Loading::Bending, 20.0, 90.0)
        .unwrap()
        .product()
        * unmodified_endurance_mpa(SUT);
    let f = estimated_fraction(SUT, se).unwrap();
    let line = SnLine::through_strengths(f, SUT, se).unwrap();
    p.wait_value("life_f", f);
    p.wait_value("life_sar", sa);
    match line.life(sa) {
        Life::Cycles(n) => {
            p.wait_value("life_n", n);
        }
        other => panic!("pick a stress with a finite life, not {other:?}"),
    }
    let link = p.text("location.hash");
    assert!(
        link.contains("life=on") && !link.contains("hist="),
        "{link}"
    );
    p.no_console_errors();
    p.shot("life-cycle");
}
