//! Keystroke to the last DOM change in the built page, in headless Chromium: σx on the typed
//! path, the torque on the tube path (the perimeter and wall scan), a gauge reading on the
//! rosette path, and σx again with a 100 000-row table loaded. Each keystroke sets the field
//! and fires its `input` event at t0; a `MutationObserver` notes the time of every DOM change;
//! the figure is the last change minus t0, once the page has been quiet for 150 ms. Prints the
//! median and 90th percentile per path for the folder in `STRESSCASE_DIST` (default `dist/`)
//! and, when `STRESSCASE_DIST_BASE` names another build, for that one too, side by side in the
//! same run. Figures, not a timed test.
//!
//! Run: `cargo bench -p stresscase-tests --bench page_keystroke` after `cargo xtask build`.
//! `STRESSCASE_KEYS` changes the keystrokes per path (default 60).

use std::path::{Path, PathBuf};
use stresscase_tests::browser::Chromium;
use stresscase_tests::page::Page;
use stresscase_tests::serve::StaticServer;

const OBSERVE: &str = r"
window.__lastChange = 0;
new MutationObserver(() => { window.__lastChange = performance.now(); })
  .observe(document.body, { subtree: true, childList: true, attributes: true, characterData: true });
";

/// Sets `#id` to `value`, fires `input`, waits until quiet; returns ms to the last DOM change.
fn keystroke(p: &mut Page, id: &str, value: &str) -> f64 {
    let js = format!(
        "new Promise(done => {{ const e = document.getElementById({id:?}); \
         window.__lastChange = 0; const t0 = performance.now(); e.value = {value:?}; \
         e.dispatchEvent(new Event('input', {{ bubbles: true }})); \
         const wait = () => {{ const now = performance.now(); \
           if (now - Math.max(t0, window.__lastChange) > 150) done(Math.max(0, window.__lastChange - t0)); \
           else setTimeout(wait, 20); }}; setTimeout(wait, 20); }})"
    );
    p.b.eval(&js)
        .ok()
        .and_then(|v| v.as_f64())
        .unwrap_or(f64::NAN)
}

fn percentile(sorted: &[f64], q: f64) -> f64 {
    if sorted.is_empty() {
        return f64::NAN;
    }
    let i = ((sorted.len() - 1) as f64 * q).round() as usize;
    sorted[i]
}

fn path(p: &mut Page, id: &str, values: [&str; 2], keys: usize) -> (f64, f64) {
    p.b.eval(OBSERVE).expect("observer");
    // Warm up, then measure.
    for i in 0..5 {
        keystroke(p, id, values[i % 2]);
    }
    let mut t: Vec<f64> = (0..keys)
        .map(|i| keystroke(p, id, values[i % 2]))
        .filter(|v| v.is_finite())
        .collect();
    t.sort_by(f64::total_cmp);
    (percentile(&t, 0.5), percentile(&t, 0.9))
}

fn measure(dist: &Path, keys: usize) -> Vec<(&'static str, f64, f64)> {
    let server = StaticServer::start(dist, "/").expect("serve");
    let mut p = Page::with_browser(Chromium::launch().expect("chromium"), &server.url);
    let mut out = Vec::new();
    let (m, q) = path(&mut p, "in-sx", ["84", "85"], keys);
    out.push(("typed σx", m, q));
    p.b.click("src-section").expect("section path");
    p.wait_for_id("section-kind");
    p.choose("section-kind", "tube");
    p.wait_for_id("in-di");
    let (m, q) = path(&mut p, "in-load-t", ["520", "530"], keys);
    out.push(("tube torque", m, q));
    p.b.click("src-rosette").expect("rosette path");
    p.wait_for_id("in-ge1");
    let (m, q) = path(&mut p, "in-ge1", ["640", "650"], keys);
    out.push(("rosette gauge 1", m, q));
    // Back to typed components, with a 100 000-row table loaded (its rows do not depend on the
    // typed components, so typing must not recompute them).
    p.b.click("src-typed").expect("typed path");
    p.wait_for_id("in-sx");
    p.b.choose_file("table-file", &table_file())
        .expect("choose the table");
    p.b.wait_for(
        "document.getElementById('table-status')?.dataset.done === 'true'",
        std::time::Duration::from_secs(60),
    )
    .expect("table computed");
    let (m, q) = path(&mut p, "in-sx", ["84", "85"], keys);
    out.push(("σx, 100k-row table", m, q));
    out
}

/// 100 000 rows of a node id and six stress components, MPa (random, seeded), written once.
fn table_file() -> PathBuf {
    use rand::{Rng, SeedableRng};
    use std::fmt::Write as _;
    let path = stresscase_tests::check::target_dir().join("bench/keystroke-table-100000.csv");
    if !path.is_file() {
        let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(100);
        let mut s = String::from("node,sx,sy,sz,txy,tyz,tzx\n");
        for i in 0..100_000 {
            let _ = write!(s, "{}", i + 1);
            for _ in 0..6 {
                let _ = write!(s, ",{:.2}", rng.random_range(-120.0..120.0));
            }
            s.push('\n');
        }
        std::fs::create_dir_all(path.parent().expect("a folder")).expect("bench folder");
        std::fs::write(&path, s).expect("write the table");
    }
    path
}

fn main() {
    let keys: usize = stresscase_tests::check::env_count("STRESSCASE_KEYS", 60);
    let dist = stresscase_tests::page::dist();
    let base = stresscase_tests::page::base_dist();
    let now = measure(&dist, keys);
    let before = base.as_ref().map(|b| measure(b, keys));
    println!("keystroke to last DOM change, {keys} keystrokes per path (ms)");
    match before {
        Some(before) => {
            println!(
                "{:<18} {:>14} {:>14}",
                "path", "base med / p90", "this med / p90"
            );
            for ((name, m, q), (_, bm, bq)) in now.iter().zip(before) {
                println!("{name:<18} {bm:>6.1} / {bq:<6.1} {m:>6.1} / {q:<6.1}");
            }
        }
        None => {
            println!("{:<18} {:>8} {:>8}", "path", "median", "p90");
            for (name, m, q) in now {
                println!("{name:<18} {m:>8.1} {q:>8.1}");
            }
        }
    }
}
