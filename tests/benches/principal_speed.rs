//! Principal values of 1e6 random tensors: ours (closed form with Jacobi fallback, batch entry
//! point), our Jacobi, nalgebra's general `symmetric_eigen`, and numpy's batched `eigvalsh` as the
//! named peer — all single-threaded, on the same tensors, in the same run. Prints ns/tensor side by
//! side, the ratio to numpy, and the largest difference from numpy relative to ‖σ‖ (Frobenius).
//!
//! Run: `cargo xtask bench` (or `cargo bench -p stresscase-tests --bench principal_speed`; needs
//! python3 with numpy). `STRESSCASE_BENCH_N` changes the count.

use std::hint::black_box;
use stresscase_core::principal::{principal_values_into, Principal};
use stresscase_core::StressTensor;
use stresscase_tests::check::{best_of, target_dir};

fn main() {
    let n: usize = stresscase_tests::check::env_count("STRESSCASE_BENCH_N", 1_000_000);
    let tensors = stresscase_tests::check::random_tensors(n);

    let dir = target_dir().join("bench");
    std::fs::create_dir_all(&dir).expect("bench dir");
    let input = dir.join("tensors.f64");
    let output = dir.join("numpy_eigvalsh.f64");
    let bytes = stresscase_tests::check::tensor_bytes(&tensors);
    std::fs::write(&input, bytes).expect("write tensors");

    let info = stresscase_tests::peers::run("numpy_eigvalsh.py", &[&input, &output]);
    let numpy_ns = info["ns_per_tensor"].as_f64().expect("ns_per_tensor");
    let numpy_vals: Vec<f64> = std::fs::read(&output)
        .expect("peer output")
        .chunks_exact(8)
        .map(|b| f64::from_le_bytes(b.try_into().expect("8 bytes")))
        .collect();

    let reps = 5;
    let mut ours = vec![[0.0; 3]; n];
    let t_ours = best_of(reps, || {
        principal_values_into(black_box(&tensors), black_box(&mut ours)).expect("lengths")
    });
    let mut jac = vec![[0.0; 3]; n];
    let t_jac = best_of(reps, || {
        for (t, o) in tensors.iter().zip(jac.iter_mut()) {
            *o = Principal::of(black_box(t)).values();
        }
    });
    let mats: Vec<nalgebra::Matrix3<f64>> = tensors.iter().map(StressTensor::to_matrix).collect();
    let mut na = vec![0.0; n];
    let t_na = best_of(reps, || {
        for (m, o) in mats.iter().zip(na.iter_mut()) {
            *o = black_box(*m).symmetric_eigen().eigenvalues[0];
        }
    });

    let (mut err_numpy, mut err_jac) = (0.0_f64, 0.0_f64);
    for (i, t) in tensors.iter().enumerate() {
        let norm = t.frobenius_norm();
        let np = [
            numpy_vals[3 * i + 2],
            numpy_vals[3 * i + 1],
            numpy_vals[3 * i],
        ];
        for k in 0..3 {
            err_numpy = err_numpy.max((ours[i][k] - np[k]).abs() / norm);
            err_jac = err_jac.max((ours[i][k] - jac[i][k]).abs() / norm);
        }
    }

    let per = |t: f64| t * 1e9 / n as f64;
    println!("principal values of {n} random tensors, single thread, best of {reps}");
    println!("{:<44} {:>12} {:>14}", "solver", "ns/tensor", "vs numpy");
    for (name, ns) in [
        ("stresscase closed form + fallback (batch)", per(t_ours)),
        ("stresscase Jacobi (values + directions)", per(t_jac)),
        ("nalgebra symmetric_eigen", per(t_na)),
    ] {
        println!("{name:<44} {ns:>12.1} {:>13.1}x", numpy_ns / ns);
    }
    println!(
        "{:<44} {numpy_ns:>12.1} {:>13.1}x",
        format!(
            "numpy {} eigvalsh (peer)",
            info["numpy"].as_str().unwrap_or("?")
        ),
        1.0
    );
    println!("max |ours − numpy| / ‖σ‖  = {err_numpy:.2e}");
    println!("max |ours − Jacobi| / ‖σ‖ = {err_jac:.2e}");
    println!(
        "speed-up over numpy: {:.1}x (target 20x)",
        numpy_ns / per(t_ours)
    );
}
