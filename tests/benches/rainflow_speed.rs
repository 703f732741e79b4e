//! Rainflow counting and Miner's sum of a 1 000 000-point history natively, beside the
//! `rainflow` package from PyPI (pure Python) counting the same history in the same run. Prints
//! both times and the ratio, and checks that both count the same cycles.
//!
//! Run: `cargo xtask bench` (or `cargo bench -p stresscase-tests --bench rainflow_speed`; needs
//! python3 with numpy and rainflow). `STRESSCASE_BENCH_N` changes the length.

use std::hint::black_box;
use stresscase_core::damage::Miner;
use stresscase_core::mean_stress::MeanStress;
use stresscase_core::rainflow::count;
use stresscase_core::sn_curve::SnLine;
use stresscase_tests::check::{best_of, random_walk, target_dir};

fn main() {
    let n: usize = stresscase_tests::check::env_count("STRESSCASE_BENCH_N", 1_000_000);
    let history = random_walk(n);
    let dir = target_dir().join("bench");
    std::fs::create_dir_all(&dir).expect("bench dir");
    let input = dir.join("history.f64");
    let bytes: Vec<u8> = history.iter().flat_map(|v| v.to_le_bytes()).collect();
    std::fs::write(&input, bytes).expect("write history");
    let peer = stresscase_tests::peers::run("rainflow_speed.py", &[&input]);
    let t_peer = peer["seconds"].as_f64().expect("seconds");

    let line = SnLine::through_strengths(0.86, 900.0, 300.0).expect("line");
    let mut cycles = Vec::new();
    let t_count = best_of(5, || cycles = count(black_box(&history)).expect("finite"));
    let mut total = 0.0;
    let t_both = best_of(5, || {
        let c = count(black_box(&history)).expect("finite");
        total = Miner::sum(&c, MeanStress::Goodman, &line, 900.0).total;
    });
    let counted: f64 = cycles.iter().map(|c| c.count).sum();
    assert_eq!(
        cycles.len() as u64,
        peer["cycles"].as_u64().expect("cycles")
    );
    assert!((counted - peer["counted"].as_f64().expect("counted")).abs() < 1e-9);
    println!(
        "rainflow of {n} points ({} cycles, Miner D = {total:.4e}), best of 5 (peer 3):",
        cycles.len()
    );
    println!("  stresscase count            {:>9.1} ms", t_count * 1e3);
    println!("  stresscase count + Miner    {:>9.1} ms", t_both * 1e3);
    println!(
        "  rainflow {} (PyPI) count  {:>9.1} ms",
        peer["rainflow"].as_str().unwrap_or("?"),
        t_peer * 1e3
    );
    println!(
        "  ratio (peer / ours, count)  {:>9.1}×  (target ≥ 10×)",
        t_peer / t_count
    );
}
