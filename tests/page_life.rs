//! The life in cycles in the built page, in headless Chromium: a pasted load history (its
//! cycles, damage, repeats and hours, the S–N diagram and the cycle matrix against core's
//! rainflow count and Miner's sum on the same numbers, checked in `life_reference.rs` against
//! the `rainflow` and `fatpack` packages), the history in the case link and back, a refused
//! value marking the results stale, the fatigue check's own cycle on the estimated line, and a
//! stepped shaft under rotating bending and steady torque (Kt and Kts from the shoulder's fits,
//! a fillet outside a fit's range refused, Kf and Kfs by Neuber's equation at the fillet radius,
//! both states, the fatigue factor and the life) against the beam and torsion formulas, and a
//! rosette logger table's critical-plane damage and governing plane against core's rosette
//! reduction, plane scan, rainflow count and Miner's sum.

use std::fmt::Write as _;
use stresscase_core::concentration::{self, Shape};
use stresscase_core::critical_plane;
use stresscase_core::damage::{HistoryLife, Miner};
use stresscase_core::fatigue::{
    factor, marin, unmodified_endurance_mpa, Cycle, FatigueCriterion, Loading, Surface,
};
use stresscase_core::mean_stress::{MeanStress, Reversed};
use stresscase_core::notch::{fatigue_factor, neuber_constant, sensitivity};
use stresscase_core::rainflow::count;
use stresscase_core::sn_curve::{estimated_fraction, Life, SnLine};
use stresscase_core::StressTensor;
use stresscase_tests::check::rectangular_rosette_mpa;
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
    let link = p.link();
    assert!(
        link.contains("life=on")
            && link.contains("lof=history")
            && link.contains("hist=0,400,-100"),
        "{link}"
    );
    let mut q = Page::open_at("/", &link);
    q.wait_value("hist_damage", m.total);
    // The life panel with its drawings passes the accessibility rules.
    let v = p.axe_violations();
    assert!(v.is_empty(), "axe-core: {v:#?}");
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
    let link = p.link();
    assert!(
        link.contains("life=on") && !link.contains("hist="),
        "{link}"
    );
    p.no_console_errors();
    p.shot("life-cycle");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_stepped_shaft_under_rotating_bending_and_steady_torque() {
    // The demo shaft: Ø40 mm at the fillet, N = 12 kN, T = 520 N·m, here Mz = 900 N·m; the
    // shoulder steps up to Ø48 mm with a 2 mm fillet, so Kt and Kts come from the fits.
    let mut p = Page::open();
    p.b.click("src-section").unwrap();
    p.wait_for_id("in-kt");
    p.b.type_into("in-load-mz", "900").unwrap();
    p.choose("kt-from", "shoulder");
    p.wait_for_id("in-kt-big");
    p.b.type_into("in-kt-big", "48").unwrap();
    p.b.type_into("in-kt-r", "2").unwrap();
    // The fits (checked in core against their published properties): with both N and a
    // bending moment, the larger of the tension and bending fits.
    let shape = Shape::ShaftShoulder {
        big: 48.0,
        small: 40.0,
        r: 2.0,
    };
    let fitted = |l| concentration::kt(shape, l).unwrap().kt;
    let kt = fitted(Loading::Axial).max(fitted(Loading::Bending));
    let kts = fitted(Loading::Torsion);
    p.wait_value("kt-fit", kt);
    p.wait_value("kts-fit", kts);
    p.b.click("static-kt").unwrap(); // ductile steel: Kt not applied statically
    p.choose("material", "1045cd");
    p.b.click("fatigue-on").unwrap();
    p.wait_for_id("cycle-kind");
    p.choose("cycle-kind", "loads");
    p.b.click("rotating-shaft").unwrap();
    p.choose("notch-q", "neuber");
    p.b.click("life-on").unwrap();
    p.wait_for_id("sn-line");
    // Neuber's equation with Shigley's fit (checked in life_reference.rs), at the fillet's
    // radius: the shape gives it, so no notch radius is typed.
    assert_eq!(p.text("String(document.getElementById('in-nr'))"), "null");
    let q = sensitivity(neuber_constant(SUT, Loading::Bending).unwrap(), 2.0).unwrap();
    let qs = sensitivity(neuber_constant(SUT, Loading::Torsion).unwrap(), 2.0).unwrap();
    let (kf, kfs) = (
        fatigue_factor(kt, q).unwrap(),
        fatigue_factor(kts, qs).unwrap(),
    );
    p.wait_value("fat_q", q);
    p.wait_value("fat_qs", qs);
    p.wait_value("fat_kf", kf);
    p.wait_value("fat_kfs", kfs);
    // Both states from the beam and torsion formulas: bending 32M/(πd³) fully reversed, axial
    // N/A and torsion 16T/(πd³) steady; von Mises of each.
    let d: f64 = 0.040;
    let pi_d3 = std::f64::consts::PI * d.powi(3);
    let bending = 32.0 * 900.0 / pi_d3 / 1e6;
    let axial = 12e3 / (std::f64::consts::PI * d * d / 4.0) / 1e6;
    let torsion = 16.0 * 520.0 / pi_d3 / 1e6;
    let sa = kf * bending;
    let sm = ((kf * axial).powi(2) + 3.0 * (kfs * torsion).powi(2)).sqrt();
    p.wait_value("fat_sa", sa);
    p.wait_value("fat_sm", sm);
    let se = marin(Surface::Machined, SUT, 40.0, Loading::Bending, 20.0, 90.0)
        .unwrap()
        .product()
        * unmodified_endurance_mpa(SUT);
    p.wait_value(
        "nf_goodman",
        factor(FatigueCriterion::Goodman, sa, sm, se, SUT, 530.0).unwrap(),
    );
    // The life of that cycle on the estimated line, Goodman-corrected.
    let f = estimated_fraction(SUT, se).unwrap();
    let line = SnLine::through_strengths(f, SUT, se).unwrap();
    let Reversed::Amplitude(sar) = MeanStress::Goodman.reversed(sa, sm, SUT) else {
        panic!("no amplitude")
    };
    p.wait_value("life_sar", sar);
    let Life::Cycles(n) = line.life(sar) else {
        panic!(
            "the shaft should have a finite life, not {:?}",
            line.life(sar)
        )
    };
    p.wait_value("life_n", n);
    let link = p.link();
    assert!(
        link.contains("cyc=loads")
            && link.contains("rot=on")
            && link.contains("nq=neuber")
            && link.contains("skt=off")
            && link.contains("ktf=shoulder")
            && link.contains("ktD=48")
            && link.contains("ktr=2")
            && !link.contains("nr="),
        "{link}"
    );
    // The calc sheet names the shape and each fitted factor with its source.
    let sheet = p.text(
        "document.getElementById('sheet-head').textContent + document.getElementById('sheet-tail').textContent",
    );
    assert!(
        sheet.contains("Kt and Kts from")
            && sheet.contains("a shoulder fillet on a round bar")
            && sheet.contains("Peterson's SCF"),
        "{sheet}"
    );
    p.no_console_errors();
    p.shot("life-shaft");
    // The link opens the same case: the same factors from the same fits.
    let mut q = Page::open_at("/", &link);
    q.wait_value("kt-fit", kt);
    q.wait_value("fat_kf", kf);
    // A fillet too sharp for the torsion fit's range is refused with the range, and the
    // factors and results go stale.
    q.b.type_into("in-kt-r", "0.5").unwrap();
    q.b.wait_for(
        "document.getElementById('in-kt-r-msg').textContent.includes('0.25 to 4')",
        std::time::Duration::from_secs(10),
    )
    .unwrap();
    q.b.wait_for(
        "document.getElementById('notch-fit').classList.contains('stale')",
        std::time::Duration::from_secs(10),
    )
    .unwrap();
    let v = q.axe_violations();
    assert!(v.is_empty(), "axe-core: {v:#?}");
    q.no_console_errors();
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_rosette_logger_tables_critical_plane_damage() {
    let mut p = Page::open();
    p.b.click("src-rosette").unwrap();
    p.wait_for_id("in-ge1");
    p.choose("material", "1045cd"); // E = 207 GPa, ν = 0.292 from the material
                                    // time and three gauges of a rectangular rosette in µε (invented logger numbers): a
                                    // cycling load whose principal direction swings, on a mean strain.
    let mut text = String::from("time [s],SG1,SG2,SG3\n");
    let mut rows = Vec::new();
    for i in 0..400 {
        let t = f64::from(i) * 0.01;
        let a = 900.0 * (t * 7.0).sin() + 250.0 * (t * 23.0).sin();
        let r = [a + 300.0, 0.6 * a + 120.0, -0.2 * a];
        rows.push(r);
        let _ = writeln!(text, "{t:.2},{:.3},{:.3},{:.3}", r[0], r[1], r[2]);
    }
    let path = stresscase_tests::check::target_dir().join("page-life/logger.csv");
    std::fs::create_dir_all(path.parent().unwrap()).unwrap();
    std::fs::write(&path, &text).unwrap();
    p.b.choose_file("table-file", &path).unwrap();
    p.b.wait_for(
        "document.getElementById('table-status')?.dataset.done === 'true'",
        std::time::Duration::from_secs(30),
    )
    .unwrap();
    p.choose("table-history-from", "plane");
    p.b.click("table-use-history").unwrap();
    p.wait_for_id("sn-line");
    // Core: the rows' plane states (as written to the file, 3 decimals), every plane 2°
    // apart, the governing one, and its history counted and damaged on the estimated line.
    let states: Vec<[f64; 3]> = text
        .lines()
        .skip(1)
        .map(|l| {
            let v: Vec<f64> = l.split(',').map(|x| x.parse().unwrap()).collect();
            let c = rectangular_rosette_mpa([v[1], v[2], v[3]], 207e9, 0.292).components();
            [c[0], c[1], c[3]]
        })
        .collect();
    let se = marin(Surface::Machined, SUT, 40.0, Loading::Bending, 20.0, 90.0)
        .unwrap()
        .product()
        * unmodified_endurance_mpa(SUT);
    let line = SnLine::through_strengths(estimated_fraction(SUT, se).unwrap(), SUT, se).unwrap();
    let planes = critical_plane::scan(&states, 2.0, MeanStress::Goodman, &line, SUT).unwrap();
    let g = critical_plane::governing(&planes).unwrap();
    assert!(g.damage > 0.0, "pick strains that do damage");
    p.wait_value("plane_theta", g.theta.to_degrees());
    p.wait_value("hist_damage", g.damage);
    p.wait_value("hist_points", 400.0);
    // The time column gives the duration: 4 s for 400 rows 0.01 s apart.
    if let HistoryLife::Repeats(r) = g.life {
        p.wait_value("hist_hours", r * 4.0 / 3600.0);
    }
    // Not in the link: the link says lof=table and holds no values.
    let link = p.link();
    assert!(
        link.contains("lof=table") && !link.contains("hist="),
        "{link}"
    );
    p.shot("life-table-plane");
    // Another material computes the rows again: the history taken from the old rows is
    // dropped, and the life panel says so instead of keeping a damage.
    p.choose("material", "1045hr");
    p.b.wait_for(
        "document.getElementById('table-history-status').textContent.includes('computed again') \
         && !document.querySelector('td[data-key=\"hist_damage\"]') \
         && document.querySelector('td[data-key=\"hist_from\"]').textContent.includes('no table history')",
        std::time::Duration::from_secs(20),
    )
    .unwrap();
    p.no_console_errors();
}
