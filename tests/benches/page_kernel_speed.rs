//! The batch principal-stress kernel (`principal::principal_values_into`) on the same 1 000 000
//! random tensors, compiled two ways in the same run: for wasm32 with the page's profile
//! (`wasm-release`, core at opt-level 3, WebAssembly SIMD, then `wasm-opt -Oz` as the page
//! gets) and run in headless Chromium, and natively (`release`). Prints ns/tensor for each,
//! best of 9, and the ratio; the sums of all principal values must agree (within 1e-9 MPa per
//! tensor), or the figure is refused.
//!
//! The wasm module is core's `batch_kernel` example (the kernel alone, not the page); the
//! benchmark builds it and runs wasm-bindgen on it (both pinned by `cargo xtask setup`).
//!
//! Run: `cargo bench -p stresscase-tests --bench page_kernel_speed`. `STRESSCASE_BENCH_N`
//! changes the count.

use std::hint::black_box;
use std::path::Path;
use std::process::Command;
use std::time::Duration;
use stresscase_core::principal::principal_values_into;
use stresscase_tests::browser::Chromium;
use stresscase_tests::check::{best_of, target_dir};
use stresscase_tests::serve::StaticServer;

const REPS: usize = 9;

fn main() {
    let n: usize = stresscase_tests::check::env_count("STRESSCASE_BENCH_N", 1_000_000);
    let dir = target_dir().join("bench/kernel");
    std::fs::create_dir_all(&dir).expect("bench dir");
    build_wasm(&dir);

    // The same tensors as `principal_speed`.
    let tensors = stresscase_tests::check::random_tensors(n);
    let bytes = stresscase_tests::check::tensor_bytes(&tensors);
    std::fs::write(dir.join("tensors.f64"), bytes).expect("write tensors");
    std::fs::write(dir.join("index.html"), PAGE).expect("write page");

    let mut out = vec![[0.0; 3]; n];
    let native = best_of(REPS, || {
        principal_values_into(black_box(&tensors), black_box(&mut out)).expect("lengths");
    });
    let native_sum: f64 = out.iter().flatten().sum();

    let server = StaticServer::start(&dir, "/").expect("serve");
    let mut b = Chromium::launch().expect("chromium");
    b.goto(&server.url).expect("open");
    let r = b
        .wait_for("window.__kernel", Duration::from_secs(300))
        .expect("the wasm kernel ran");
    assert_eq!(r["n"].as_u64(), Some(n as u64), "{r}");
    let wasm_sum = r["sum"].as_f64().expect("sum");
    assert!(
        (wasm_sum - native_sum).abs() <= 1e-9 * n as f64,
        "wasm and native disagree: {wasm_sum} against {native_sum}"
    );
    let wasm = r["best_ms"].as_f64().expect("best_ms") / 1e3;

    let per = |t: f64| t * 1e9 / n as f64;
    println!("batch principal values of {n} random tensors, single thread, best of {REPS}");
    println!("{:<48} {:>10} {:>10}", "", "ms", "ns/tensor");
    println!(
        "{:<48} {:>10.1} {:>10.1}",
        "native (release)",
        native * 1e3,
        per(native)
    );
    println!(
        "{:<48} {:>10.1} {:>10.1}",
        "wasm in headless Chromium (page profile)",
        wasm * 1e3,
        per(wasm)
    );
    println!(
        "wasm / native: {:.2}× (target at most 2×); sums agree: {wasm_sum:.6e}",
        wasm / native
    );
}

/// Builds core's `batch_kernel` example for wasm32, then wasm-bindgen and wasm-opt as the page.
fn build_wasm(dir: &Path) {
    let cargo = std::env::var("CARGO").unwrap_or_else(|_| "cargo".into());
    let root = Path::new(env!("CARGO_MANIFEST_DIR")).join("..");
    let ok = Command::new(cargo)
        .current_dir(&root)
        .args([
            "build",
            "-p",
            "stresscase-core",
            "--example",
            "batch_kernel",
            "--target",
            "wasm32-unknown-unknown",
            "--profile",
            "wasm-release",
        ])
        .status()
        .is_ok_and(|s| s.success());
    assert!(ok, "building the batch_kernel example for wasm32 failed");
    let wasm = target_dir().join("wasm32-unknown-unknown/wasm-release/examples/batch_kernel.wasm");
    let ok = Command::new("wasm-bindgen")
        .args(["--target", "web", "--no-typescript", "--out-dir"])
        .arg(dir)
        .arg(&wasm)
        .status()
        .is_ok_and(|s| s.success());
    assert!(
        ok,
        "wasm-bindgen failed (is it installed? `cargo xtask setup`)"
    );
    let bg = dir.join("batch_kernel_bg.wasm");
    let ok = Command::new("wasm-opt")
        .args([
            "-Oz",
            "--enable-bulk-memory",
            "--enable-nontrapping-float-to-int",
        ])
        .arg(&bg)
        .arg("-o")
        .arg(&bg)
        .status()
        .is_ok_and(|s| s.success());
    assert!(ok, "wasm-opt failed (is it installed? `cargo xtask setup`)");
}

/// Loads the tensors, runs the kernel once to warm up, then times `REPS` passes.
const PAGE: &str = r#"<!doctype html><meta charset="utf-8"><title>batch kernel</title>
<script type="module">
import init, { load, run } from "./batch_kernel.js";
await init();
const buf = await (await fetch("tensors.f64")).arrayBuffer();
const n = load(new Float64Array(buf));
let sum = run();
let best = Infinity;
for (let i = 0; i < 9; i++) {
  const t0 = performance.now();
  sum = run();
  best = Math.min(best, performance.now() - t0);
}
window.__kernel = { n, sum, best_ms: best };
</script>"#;
