//! Rainflow counting and Miner's sum of a 1 000 000-point history in the built page, in
//! headless Chromium, beside the same count natively and the `rainflow` package from PyPI in
//! the same run. The history is a one-column table (the same random walk as `rainflow_speed`)
//! read under "Many points" and taken as the load history; the page's own marks time the count
//! and damage (`life:count` to `life:counted`), and a `MutationObserver` times the click to the
//! damage shown. Figures, not a timed test.
//!
//! `cargo xtask bench` runs it after building the page; by hand:
//! `cargo bench -p stresscase-tests --bench page_life_speed`.

use std::fmt::Write as _;
use std::time::{Duration, Instant};
use stresscase_core::damage::Miner;
use stresscase_core::mean_stress::MeanStress;
use stresscase_core::rainflow::count;
use stresscase_core::sn_curve::SnLine;
use stresscase_tests::check::{random_walk, target_dir};
use stresscase_tests::page::Page;

fn main() {
    let n: usize = stresscase_tests::check::env_count("STRESSCASE_BENCH_N", 1_000_000);
    let history = random_walk(n);
    let dir = target_dir().join("bench");
    std::fs::create_dir_all(&dir).expect("bench dir");
    let csv = dir.join(format!("history-{n}.csv"));
    let mut text = String::with_capacity(n * 12);
    text.push_str("sx\n");
    for v in &history {
        let _ = writeln!(text, "{v:.3}");
    }
    std::fs::write(&csv, &text).expect("write history");
    let read: Vec<f64> = text
        .lines()
        .skip(1)
        .map(|l| l.parse().expect("number"))
        .collect();
    let bin = dir.join(format!("history-{n}.f64"));
    std::fs::write(
        &bin,
        read.iter()
            .flat_map(|v| v.to_le_bytes())
            .collect::<Vec<u8>>(),
    )
    .expect("write f64");
    let peer = stresscase_tests::peers::run("rainflow_speed.py", &[&bin]);
    let t_peer = peer["seconds"].as_f64().expect("seconds");
    let line = SnLine::through_strengths(0.9, 380.0, 120.0).expect("line");
    let t0 = Instant::now();
    let c = count(&read).expect("finite");
    let d = Miner::sum(&c, MeanStress::Goodman, &line, 380.0).total;
    let t_native = t0.elapsed().as_secs_f64();
    std::hint::black_box(d);

    let mut counts = Vec::new();
    let mut shown = Vec::new();
    for _ in 0..3 {
        let mut p = Page::open();
        p.b.choose_file("table-file", &csv).expect("choose");
        p.b.wait_for(
            "document.getElementById('table-status')?.dataset.done === 'true'",
            Duration::from_secs(120),
        )
        .expect("table done");
        p.choose("table-history-from", "c0");
        p.b.eval(
            "window.__shown = 0; new MutationObserver(() => { \
               if (!window.__shown && document.querySelector('td[data-key=\"hist_damage\"]')) window.__shown = performance.now(); \
             }).observe(document.body, { subtree: true, childList: true, attributes: true }); \
             window.__click = performance.now();",
        )
        .expect("observe");
        p.b.click("table-use-history").expect("click");
        p.b.wait_for("window.__shown > 0", Duration::from_secs(60))
            .expect("damage shown");
        let m = p.b.eval(
            "(() => { const m = n => (performance.getEntriesByName(n).pop() || {startTime: NaN}).startTime; \
               return [m('life:counted') - m('life:count'), window.__shown - window.__click]; })()",
        )
        .expect("marks");
        counts.push(m[0].as_f64().unwrap_or(f64::NAN));
        shown.push(m[1].as_f64().unwrap_or(f64::NAN));
    }
    let best = |v: &[f64]| v.iter().copied().fold(f64::INFINITY, f64::min);
    println!("rainflow + Miner of a {n}-point history (a one-column table), best of 3:");
    println!(
        "  page (wasm), count + damage            {:>8.1} ms  (target ≤ 100 ms)",
        best(&counts)
    );
    println!(
        "  page, click to the damage shown        {:>8.1} ms",
        best(&shown)
    );
    println!(
        "  native, count + damage                 {:>8.1} ms",
        t_native * 1e3
    );
    println!(
        "  rainflow {} (PyPI), count              {:>8.1} ms",
        peer["rainflow"].as_str().unwrap_or("?"),
        t_peer * 1e3
    );
}
