//! The Python peers the benchmarks run beside our code on the same data.

use crate::check::data_path;
use std::path::Path;
use std::process::Command;

/// Runs `peers/pandas_table.py` (`pandas.read_csv` + numpy, single-threaded) on a table file
/// and returns its JSON line: best seconds, rows, and the worst row with its von Mises.
///
/// # Panics
/// When python3, pandas or numpy is missing, or the peer fails.
#[must_use]
pub fn pandas_table(path: &Path) -> serde_json::Value {
    let peer = Command::new(std::env::var("PYTHON").unwrap_or_else(|_| "python3".into()))
        .arg(data_path("peers/pandas_table.py"))
        .arg(path)
        .env("OMP_NUM_THREADS", "1")
        .env("OPENBLAS_NUM_THREADS", "1")
        .output()
        .expect("python3 with pandas and numpy");
    assert!(
        peer.status.success(),
        "peer failed: {}",
        String::from_utf8_lossy(&peer.stderr)
    );
    serde_json::from_slice(peer.stdout.trim_ascii()).expect("peer JSON")
}
