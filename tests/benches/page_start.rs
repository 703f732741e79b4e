//! The built page's size and cold start, in headless Chromium: the packed `index.html` raw and
//! gzipped (level 9, as a compressing server would send it), and the time from navigation to
//! the first drawn Mohr's circle, opened from disk (file://) and over http, each the median of
//! several fresh browser profiles. A script injected before the page's own notes
//! `performance.now()` (which counts from the navigation) when the first circle appears.
//! Prints the folder in `STRESSCASE_DIST` (default `dist/`) and, when `STRESSCASE_DIST_BASE`
//! names another build, that one beside it in the same run, the starts alternating between
//! the two. Figures, not a timed test.
//!
//! Run: `cargo bench -p stresscase-tests --bench page_start` after `cargo xtask build`.
//! `STRESSCASE_STARTS` changes the starts per way of opening (default 7).

use std::io::Write as _;
use std::path::Path;
use std::time::Duration;
use stresscase_tests::browser::Chromium;
use stresscase_tests::serve::StaticServer;

const FIRST_CIRCLE: &str = r"
window.__firstCircle = 0;
new MutationObserver((_, o) => {
  if (document.querySelector('#mohr-svg circle')) { window.__firstCircle = performance.now(); o.disconnect(); }
}).observe(document, { subtree: true, childList: true });
";

/// Milliseconds from navigation to the first drawn circle at `url`, in a fresh profile.
fn one_start(url: &str) -> f64 {
    let mut b = Chromium::launch().expect("chromium");
    b.add_init_script(FIRST_CIRCLE).expect("init script");
    b.goto(url).expect("navigate");
    b.wait_for("window.__firstCircle > 0", Duration::from_secs(30))
        .expect("a circle is drawn");
    b.eval("window.__firstCircle")
        .ok()
        .and_then(|v| v.as_f64())
        .unwrap_or(f64::NAN)
}

fn median(mut v: Vec<f64>) -> f64 {
    v.sort_by(f64::total_cmp);
    v.get(v.len() / 2).copied().unwrap_or(f64::NAN)
}

struct Figures {
    raw_kb: f64,
    gzip_kb: f64,
    disk_ms: f64,
    http_ms: f64,
}

/// The figures of each folder in `dists`; the starts alternate between the folders (and
/// between disk and http), so a machine that slows down during the run slows every folder alike.
fn measure(dists: &[&Path], starts: usize) -> Vec<Figures> {
    let servers: Vec<StaticServer> = dists
        .iter()
        .map(|d| StaticServer::start(d, "/").expect("serve"))
        .collect();
    let file_urls: Vec<String> = dists
        .iter()
        .map(|d| {
            format!(
                "file://{}",
                d.join("index.html")
                    .canonicalize()
                    .expect("page path")
                    .display()
            )
        })
        .collect();
    let mut disk = vec![Vec::new(); dists.len()];
    let mut http = vec![Vec::new(); dists.len()];
    for _ in 0..starts {
        for k in 0..dists.len() {
            disk[k].push(one_start(&file_urls[k]));
            http[k].push(one_start(&servers[k].url));
        }
    }
    dists
        .iter()
        .zip(disk.into_iter().zip(http))
        .map(|(dist, (disk, http))| {
            let page = std::fs::read(dist.join("index.html")).expect("the built page");
            let mut gz = flate2::write::GzEncoder::new(Vec::new(), flate2::Compression::best());
            gz.write_all(&page).expect("gzip");
            let gzip = gz.finish().expect("gzip");
            Figures {
                raw_kb: page.len() as f64 / 1024.0,
                gzip_kb: gzip.len() as f64 / 1024.0,
                disk_ms: median(disk),
                http_ms: median(http),
            }
        })
        .collect()
}

fn main() {
    let starts: usize = stresscase_tests::check::env_count("STRESSCASE_STARTS", 7);
    let dist = stresscase_tests::page::dist();
    let base = stresscase_tests::page::base_dist();
    let mut dists = vec![dist.as_path()];
    dists.extend(base.as_deref());
    let mut figures = measure(&dists, starts).into_iter();
    let now = figures.next().expect("this build's figures");
    let before = figures.next();
    println!("packed page and cold start to the first drawn circle ({starts} fresh profiles each, median)");
    let rows = |f: &Figures| {
        [
            ("page raw (KB)", f.raw_kb),
            ("page gzipped (KB)", f.gzip_kb),
            ("from disk (ms)", f.disk_ms),
            ("over http (ms)", f.http_ms),
        ]
    };
    match before {
        Some(b) => {
            println!("{:<20} {:>10} {:>10}", "", "base", "this");
            for ((name, v), (_, bv)) in rows(&now).into_iter().zip(rows(&b)) {
                println!("{name:<20} {bv:>10.1} {v:>10.1}");
            }
        }
        None => {
            for (name, v) in rows(&now) {
                println!("{name:<20} {v:>10.1}");
            }
        }
    }
}
