//! The table view in the built page, in headless Chromium: a file of 1 000 000 rows of six
//! stress components (the same file as `table_speed`, about 62 MB) from "file chosen" (the
//! input's `change` event) to every row computed and ranked (`#table-status` says
//! `data-done="true"`), beside `pandas.read_csv` plus numpy on the same file in the same run.
//! Prints both and the ratio. Figures, not a timed test.
//!
//! Run after `cargo xtask build` and `cargo bench -p stresscase-tests --bench table_speed`
//! (which writes the file): `cargo bench -p stresscase-tests --bench page_table_speed`.

use std::time::Duration;
use stresscase_tests::browser::Chromium;
use stresscase_tests::check::target_dir;
use stresscase_tests::page::Page;
use stresscase_tests::serve::StaticServer;

fn main() {
    let rows: usize = std::env::var("STRESSCASE_BENCH_ROWS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(1_000_000);
    let path = target_dir().join(format!("bench/table-{rows}.csv"));
    assert!(
        path.is_file(),
        "{} is missing: run the table_speed bench first",
        path.display()
    );
    let server = StaticServer::start(&stresscase_tests::page::dist(), "/").expect("serve");
    let mut times = Vec::new();
    for _ in 0..3 {
        let mut p = Page::with_browser(Chromium::launch().expect("chromium"), &server.url);
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
        let rows_done = p.text("document.getElementById('table-status').dataset.rows");
        assert_eq!(rows_done, rows.to_string());
    }
    let best = times.iter().copied().fold(f64::INFINITY, f64::min);
    let info = stresscase_tests::peers::pandas_table(&path);
    let peer_s = info["seconds"].as_f64().expect("seconds");
    println!("{rows} rows × 6 components: file chosen → every row computed and ranked, best of 3");
    println!("{:<44} {:>9}", "", "seconds");
    println!("{:<44} {best:>9.3}", "the page (wasm, headless Chromium)");
    println!("{:<44} {peer_s:>9.3}", "pandas.read_csv + numpy (peer)");
    println!("page speed relative to the peer: {:.2}×", peer_s / best);
}
