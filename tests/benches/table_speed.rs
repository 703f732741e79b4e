//! A table of 1 000 000 rows of six stress components (about 58 MB of CSV, with a node id):
//! from the file's text to every row read, measured and ranked by von Mises — natively, with
//! the page's reader (`formats::table`) and core's measures (`core::points`) — beside the named
//! peer, `pandas.read_csv` plus numpy (`eigvalsh` and von Mises) on the same file in the same
//! run (`peers/pandas_table.py`). Prints both, the ratio, and the worst row of each.
//! The page's own figure (reading in wasm in the browser) comes with the table view.
//!
//! Run: `cargo bench -p stresscase-tests --bench table_speed` (needs python3 with pandas and
//! numpy). `STRESSCASE_BENCH_ROWS` changes the row count.

use rand::{Rng, SeedableRng};
use std::fmt::Write as _;
use std::time::Instant;
use stresscase_core::criteria::Criterion;
use stresscase_core::material::Strengths;
use stresscase_core::points::{measure_all, worst_first, Measure};
use stresscase_core::StressTensor;
use stresscase_tests::check::target_dir;
use stresscase_web::formats::table::{read, sniff};

fn main() {
    let rows: usize = stresscase_tests::check::env_count("STRESSCASE_BENCH_ROWS", 1_000_000);
    let dir = target_dir().join("bench");
    std::fs::create_dir_all(&dir).expect("bench dir");
    let path = dir.join(format!("table-{rows}.csv"));
    if !path.is_file() {
        let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(58);
        let mut s = String::with_capacity(rows * 60);
        s.push_str("node,sx,sy,sz,txy,tyz,tzx\n");
        for i in 0..rows {
            let _ = write!(s, "{}", i + 1);
            for _ in 0..6 {
                let v: f64 = rng.random_range(-300.0..300.0);
                let _ = write!(s, ",{v:.4}");
            }
            s.push('\n');
        }
        std::fs::write(&path, s).expect("write table");
    }
    let mb = std::fs::metadata(&path).map_or(0.0, |m| m.len() as f64 / 1e6);
    let steel = Strengths::try_new(Some(250.0), 420.0, None, 22.0, None).expect("steel");

    let reps = 3;
    let mut best = f64::INFINITY;
    let mut read_part = f64::INFINITY;
    let mut parse_part = f64::INFINITY;
    let mut worst = (0, 0.0);
    for _ in 0..reps {
        let t0 = Instant::now();
        let text = std::fs::read_to_string(&path).expect("read");
        let tp = Instant::now();
        let shape = sniff(&text).expect("a table");
        let t = read(&text, &shape, Some(0));
        parse_part = parse_part.min(tp.elapsed().as_secs_f64());
        let tensors: Vec<StressTensor> = (0..t.rows())
            .filter_map(|i| {
                let r = t.row(i);
                StressTensor::new(r[1], r[2], r[3], r[4], r[5], r[6]).ok()
            })
            .collect();
        let t1 = Instant::now();
        let m = measure_all(&tensors, Criterion::VonMises, &steel).expect("measures");
        let order = worst_first(&m, Measure::VonMises);
        best = best.min(t0.elapsed().as_secs_f64());
        read_part = read_part.min((t1 - t0).as_secs_f64());
        worst = (order[0], m[order[0]].von_mises);
    }

    let info = stresscase_tests::peers::pandas_table(&path);
    let peer_s = info["seconds"].as_f64().expect("seconds");
    println!("{rows} rows × 6 components ({mb:.1} MB CSV): file text → read, measured, ranked; best of {reps}");
    println!("{:<46} {:>9} {:>12}", "", "seconds", "worst row");
    println!(
        "{:<46} {best:>9.3} {:>5} {:.4}",
        "stresscase reader + core::points (native)", worst.0, worst.1
    );
    println!(
        "{:<46} {peer_s:>9.3} {:>5} {:.4}",
        "pandas.read_csv + numpy (peer)",
        info["worst"],
        info["worst_vm"].as_f64().unwrap_or(f64::NAN)
    );
    println!(
        "  of which the file into numbers: {read_part:.3} s (the reader alone: {parse_part:.3} s)"
    );
    println!("speed-up over the peer: {:.2}×", peer_s / best);
}
