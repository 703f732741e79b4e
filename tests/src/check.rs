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

/// The least time of `reps` runs of `f`, seconds.
pub fn best_of<F: FnMut()>(reps: usize, mut f: F) -> f64 {
    (0..reps)
        .map(|_| {
            let t = std::time::Instant::now();
            f();
            t.elapsed().as_secs_f64()
        })
        .fold(f64::INFINITY, f64::min)
}

/// A count a benchmark takes from the environment variable `name`, else `default`.
#[must_use]
pub fn env_count(name: &str, default: usize) -> usize {
    std::env::var(name)
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(default)
}

/// The principal-value benchmarks' tensors: `n` random states with every component uniform in
/// ±100 MPa, the same for the same `n` (seeded).
#[must_use]
pub fn random_tensors(n: usize) -> Vec<stresscase_core::StressTensor> {
    use rand::{Rng, SeedableRng};
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(2026);
    (0..n)
        .map(|_| {
            let c: [f64; 6] = std::array::from_fn(|_| rng.random_range(-100.0..100.0));
            stresscase_core::StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).expect("finite")
        })
        .collect()
}

/// The components of `tensors` as little-endian f64 bytes, six a tensor, for a peer to read.
#[must_use]
pub fn tensor_bytes(tensors: &[stresscase_core::StressTensor]) -> Vec<u8> {
    tensors
        .iter()
        .flat_map(|t| t.components())
        .flat_map(f64::to_le_bytes)
        .collect()
}

/// A logger's stress trace for the life benchmarks, MPa: a random walk between −100 and 400
/// with noise of ±60, the same for the same `n` (seeded).
#[must_use]
pub fn random_walk(n: usize) -> Vec<f64> {
    use rand::{Rng, SeedableRng};
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(1049);
    let mut level: f64 = 150.0;
    (0..n)
        .map(|_| {
            level = (level + rng.random_range(-20.0..20.0)).clamp(-100.0, 400.0);
            level + rng.random_range(-60.0..60.0)
        })
        .collect()
}

/// The plane stress, MPa, of a rectangular (0°, 45°, 90°) rosette's readings in µε, by core's
/// rosette reduction with E (Pa) and ν.
///
/// # Panics
/// For readings or constants core refuses.
#[must_use]
pub fn rectangular_rosette_mpa(
    readings: [f64; 3],
    e: f64,
    nu: f64,
) -> stresscase_core::StressTensor {
    use stresscase_core::rosette::{reduce, Gauge, RECTANGULAR};
    let g: Vec<Gauge> = (0..3)
        .map(|k| Gauge {
            angle: RECTANGULAR[k],
            strain: readings[k] * 1e-6,
        })
        .collect();
    let elastic = stresscase_core::hooke::Elastic::try_new(e, nu).expect("elastic constants");
    reduce(&g, None)
        .expect("a rosette reduction")
        .stress(&elastic)
        .expect("a stress")
        .scaled(1e-6)
        .expect("in MPa")
}
