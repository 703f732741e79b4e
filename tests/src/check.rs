//! One approximate-equality helper for reference tables, so every failure prints the case, both
//! values, the difference and the tolerance.

/// Panics with a readable message when `|got − want| > tol`.
#[track_caller]
pub fn close(case: &str, what: &str, got: f64, want: f64, tol: f64) {
    let diff = (got - want).abs();
    assert!(
        diff <= tol && got.is_finite(),
        "{case}: {what} = {got:e}, expected {want:e} (difference {diff:e} > tolerance {tol:e})"
    );
}

/// Path of a file under `tests/`.
#[must_use]
pub fn data_path(rel: &str) -> std::path::PathBuf {
    std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join(rel)
}

/// The workspace's `target/` folder (where screenshots and bench files go).
#[must_use]
pub fn target_dir() -> std::path::PathBuf {
    std::env::var_os("CARGO_TARGET_DIR")
        .map(std::path::PathBuf::from)
        .unwrap_or_else(|| std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("../target"))
}
