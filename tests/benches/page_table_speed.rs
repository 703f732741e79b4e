//! The table view in the built page, in headless Chromium: a file of 1 000 000 rows of six
//! stress components (the same file as `table_speed`, about 62 MB) from "file chosen" (the
//! input's `change` event) to every row computed and ranked (`#table-status` says
//! `data-done="true"`), beside `pandas.read_csv` plus numpy on the same file in the same run.
//! Prints both and the ratio, the page's own phase marks (reading, computing, showing), and
//! the Chromium renderer's resident memory before the file and at its peak (`/proc` on Linux)
//! against the file's size. Figures, not a timed test.
//!
//! `cargo xtask bench` runs it after building the page and running `table_speed` (which writes
//! the file); by hand: `cargo bench -p stresscase-tests --bench page_table_speed`.

use std::time::Duration;
use stresscase_tests::browser::Chromium;
use stresscase_tests::check::target_dir;
use stresscase_tests::page::Page;
use stresscase_tests::serve::StaticServer;

fn main() {
    let rows: usize = stresscase_tests::check::env_count("STRESSCASE_BENCH_ROWS", 1_000_000);
    let path = target_dir().join(format!("bench/table-{rows}.csv"));
    assert!(
        path.is_file(),
        "{} is missing: run the table_speed bench first",
        path.display()
    );
    let server = StaticServer::start(&stresscase_tests::page::dist(), "/").expect("serve");
    let mut times = Vec::new();
    let mut phase_lines = Vec::new();
    let mut peaks = Vec::new();
    for _ in 0..3 {
        let before = renderers();
        let mut p = Page::with_browser(Chromium::launch().expect("chromium"), &server.url);
        let ours: Vec<u32> = renderers()
            .into_iter()
            .filter(|r| !before.contains(r))
            .collect();
        let at_rest: Vec<(u32, u64)> = ours
            .iter()
            .filter_map(|&r| Some((r, status_kb(r, "VmRSS")?)))
            .collect();
        p.b.eval(
            "window.__t0 = 0; window.__t1 = 0; \
             document.getElementById('table-file').addEventListener('change', () => { window.__t0 = performance.now(); }, true); \
             new MutationObserver(() => { const s = document.getElementById('table-status'); \
               if (s && s.dataset.done === 'true' && !window.__t1) window.__t1 = performance.now(); }) \
               .observe(document.body, { subtree: true, childList: true, attributes: true });",
        )
        .expect("observe");
        p.b.choose_file("table-file", &path).expect("choose");
        p.b.wait_for("window.__t1 > 0", Duration::from_secs(120))
            .expect("table done");
        let ms = p.b.eval("window.__t1 - window.__t0").expect("time");
        times.push(ms.as_f64().unwrap_or(f64::NAN) / 1000.0);
        // The page's own marks: where the time goes.
        let phases = p.b.eval(
            "(() => { const m = n => (performance.getEntriesByName(n).pop() || {startTime: NaN}).startTime; \
               const c = m('table:chosen'), r = m('table:read'), k = m('table:computed'); \
               return [r - c, k - r, window.__t1 - k].map(x => (x / 1000).toFixed(3)).join(' s, ') + ' s'; })()",
        )
        .expect("marks");
        phase_lines.push(phases.as_str().unwrap_or("").to_string());
        let rows_done = p.text("document.getElementById('table-status').dataset.rows");
        assert_eq!(rows_done, rows.to_string());
        // The page's renderer (the one that grew most; Chromium may keep a spare): its
        // resident memory before the file and its high-water mark after (the kernel's count:
        // the page, its wasm memory, the file's slices and the DOM).
        let grown = at_rest
            .iter()
            .filter_map(|&(r, rest)| Some((rest, status_kb(r, "VmHWM")?)))
            .max_by_key(|&(rest, peak)| peak.saturating_sub(rest))
            .unwrap_or((0, 0));
        peaks.push(grown);
    }
    let best = times.iter().copied().fold(f64::INFINITY, f64::min);
    let info = stresscase_tests::peers::pandas_table(&path);
    let peer_s = info["seconds"].as_f64().expect("seconds");
    println!("{rows} rows × 6 components: file chosen → every row computed and ranked, best of 3");
    println!("{:<44} {:>9}", "", "seconds");
    println!("{:<44} {best:>9.3}", "the page (wasm, headless Chromium)");
    println!("{:<44} {peer_s:>9.3}", "pandas.read_csv + numpy (peer)");
    println!("page speed relative to the peer: {:.2}×", peer_s / best);
    for (i, p) in phase_lines.iter().enumerate() {
        println!("  run {}: reading, computing, showing: {p}", i + 1);
    }
    let file_mb = std::fs::metadata(&path).map_or(0.0, |m| m.len() as f64 / 1e6);
    for (i, (rest, peak)) in peaks.iter().enumerate() {
        let (rest, peak) = (*rest as f64 / 1e3, *peak as f64 / 1e3);
        println!(
            "  run {}: renderer resident memory {rest:.0} MB before the file, peak {peak:.0} MB: \
             the table added {:.0} MB = {:.2}× the {file_mb:.1} MB file",
            i + 1,
            peak - rest,
            (peak - rest) / file_mb
        );
    }
}

/// Chromium renderer processes now running (Linux `/proc`; none elsewhere).
fn renderers() -> Vec<u32> {
    let Ok(dir) = std::fs::read_dir("/proc") else {
        return Vec::new();
    };
    dir.filter_map(|e| e.ok()?.file_name().to_str()?.parse::<u32>().ok())
        .filter(|pid| {
            std::fs::read(format!("/proc/{pid}/cmdline"))
                .is_ok_and(|c| c.windows(15).any(|w| w == b"--type=renderer"))
        })
        .collect()
}

/// A `kB` figure from `/proc/PID/status` (`VmRSS`, `VmHWM`).
fn status_kb(pid: u32, key: &str) -> Option<u64> {
    let s = std::fs::read_to_string(format!("/proc/{pid}/status")).ok()?;
    s.lines()
        .find_map(|l| l.strip_prefix(key)?.strip_prefix(':'))?
        .trim()
        .trim_end_matches("kB")
        .trim()
        .parse()
        .ok()
}
