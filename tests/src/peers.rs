//! The Python peers the benchmarks run beside our code on the same data.

use crate::check::data_path;
use std::path::Path;
use std::process::Command;

/// Runs `peers/<script>` single-threaded (OMP, OpenBLAS and MKL held to one thread) with
/// `args`, and returns the JSON line it prints.
///
/// # Panics
/// When python3 or the peer's modules are missing, or the peer fails.
#[must_use]
pub fn run(script: &str, args: &[&Path]) -> serde_json::Value {
    let peer = Command::new(std::env::var("PYTHON").unwrap_or_else(|_| "python3".into()))
        .arg(data_path(&format!("peers/{script}")))
        .args(args)
        .env("OMP_NUM_THREADS", "1")
        .env("OPENBLAS_NUM_THREADS", "1")
        .env("MKL_NUM_THREADS", "1")
        .output()
        .expect("run python3 (peer)");
    assert!(
        peer.status.success(),
        "{script} failed: {}",
        String::from_utf8_lossy(&peer.stderr)
    );
    serde_json::from_slice(peer.stdout.trim_ascii()).expect("peer JSON")
}

/// `peers/pandas_table.py` (`pandas.read_csv` + numpy) on a table file: best seconds, rows,
/// and the worst row with its von Mises.
#[must_use]
pub fn pandas_table(path: &Path) -> serde_json::Value {
    run("pandas_table.py", &[path])
}
