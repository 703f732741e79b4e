//! Lighthouse's performance and accessibility scores of the built page on its mobile setting,
//! served by a static server that does not compress (the slow case: the whole page goes over
//! the simulated slow network as it is). Runs the `lighthouse` npm package with Debian's
//! Chromium, several times, and prints the median scores and paint times for the folder in
//! `STRESSCASE_DIST` (default `dist/`) and, when `STRESSCASE_DIST_BASE` names another build,
//! that one beside it in the same run. Figures, not a timed test; without `lighthouse` on the
//! path it says how to install it and prints nothing else.
//!
//! Run: `cargo bench -p stresscase-tests --bench page_lighthouse` after `cargo xtask build`.
//! `STRESSCASE_LIGHTHOUSE_RUNS` changes the runs per build (default 3).

use serde_json::Value;
use std::path::Path;
use std::process::Command;
use stresscase_tests::browser::chromium_path;
use stresscase_tests::serve::StaticServer;

/// (performance, accessibility, first contentful paint ms, total blocking time ms) of one run.
fn one_run(url: &str, out: &Path) -> Option<[f64; 4]> {
    let status = Command::new("lighthouse")
        .arg(url)
        .args([
            "--only-categories=performance,accessibility",
            "--chrome-flags=--headless --no-sandbox",
            "--output=json",
            "--quiet",
        ])
        .arg(format!("--output-path={}", out.display()))
        .env("CHROME_PATH", chromium_path())
        .status()
        .ok()?;
    if !status.success() {
        return None;
    }
    let r: Value = serde_json::from_slice(&std::fs::read(out).ok()?).ok()?;
    let score = |c: &str| r["categories"][c]["score"].as_f64().map(|s| 100.0 * s);
    let ms = |a: &str| r["audits"][a]["numericValue"].as_f64();
    Some([
        score("performance")?,
        score("accessibility")?,
        ms("first-contentful-paint")?,
        ms("total-blocking-time")?,
    ])
}

fn median(mut v: Vec<f64>) -> f64 {
    v.sort_by(f64::total_cmp);
    v.get(v.len() / 2).copied().unwrap_or(f64::NAN)
}

fn measure(dist: &Path, runs: usize) -> [f64; 4] {
    let server = StaticServer::start(dist, "/").expect("serve");
    let out =
        std::env::temp_dir().join(format!("stresscase-lighthouse-{}.json", std::process::id()));
    let all: Vec<[f64; 4]> = (0..runs)
        .filter_map(|_| one_run(&server.url, &out))
        .collect();
    let _ = std::fs::remove_file(&out);
    std::array::from_fn(|i| median(all.iter().map(|r| r[i]).collect()))
}

fn main() {
    if Command::new("lighthouse")
        .arg("--version")
        .output()
        .is_err()
    {
        println!("lighthouse: not installed (npm install -g lighthouse); no scores");
        return;
    }
    let runs: usize = stresscase_tests::check::env_count("STRESSCASE_LIGHTHOUSE_RUNS", 3);
    let dist = stresscase_tests::page::dist();
    let base = stresscase_tests::page::base_dist();
    let now = measure(&dist, runs);
    let before = base.as_ref().map(|b| measure(b, runs));
    println!("Lighthouse, mobile setting, uncompressed static server ({runs} runs each, median)");
    let names = [
        "performance score",
        "accessibility score",
        "first contentful paint (ms)",
        "total blocking time (ms)",
    ];
    match before {
        Some(b) => {
            println!("{:<28} {:>8} {:>8}", "", "base", "this");
            for (i, name) in names.iter().enumerate() {
                println!("{name:<28} {:>8.0} {:>8.0}", b[i], now[i]);
            }
        }
        None => {
            for (i, name) in names.iter().enumerate() {
                println!("{name:<28} {:>8.0}", now[i]);
            }
        }
    }
}
