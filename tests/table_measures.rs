//! Every computed column of a table (σ1, σ2, σ3, τmax, von Mises, Tresca, triaxiality, the von
//! Mises factor of safety) against numpy on the same tensors (`peers/numpy_table_measures.py`:
//! `eigvalsh` for the principal stresses, the component formula for von Mises, published
//! definitions for the rest). Random full and plane states over six decades.

use rand::{Rng, SeedableRng};
use std::process::Command;
use stresscase_core::criteria::Criterion;
use stresscase_core::material::Strengths;
use stresscase_core::points::measure_all;
use stresscase_core::StressTensor;
use stresscase_tests::check::{data_path, target_dir};

#[test]
fn every_column_matches_numpy() {
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(2027);
    let tensors: Vec<StressTensor> = (0..20_000)
        .map(|i| {
            let scale = 10f64.powi(rng.random_range(-2..4));
            let mut c: [f64; 6] = std::array::from_fn(|_| rng.random_range(-1.0..1.0) * scale);
            if i % 3 == 0 {
                c[2] = 0.0;
                c[4] = 0.0;
                c[5] = 0.0; // plane states
            }
            StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap()
        })
        .collect();
    let sy = 250.0;
    let steel = Strengths::try_new(Some(sy), 420.0, None, 22.0, None).unwrap();
    let ours = measure_all(&tensors, Criterion::VonMises, &steel).unwrap();

    let dir = target_dir().join("table-measures");
    std::fs::create_dir_all(&dir).unwrap();
    let (src, dst) = (dir.join("in.f64"), dir.join("out.f64"));
    let bytes: Vec<u8> = tensors
        .iter()
        .flat_map(|t| t.components())
        .flat_map(f64::to_le_bytes)
        .collect();
    std::fs::write(&src, bytes).unwrap();
    let out = Command::new("python3")
        .arg(data_path("peers/numpy_table_measures.py"))
        .arg(&src)
        .arg(&dst)
        .arg(sy.to_string())
        .output()
        .expect("python3 with numpy (cargo xtask test installs it)");
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let np: Vec<f64> = std::fs::read(&dst)
        .unwrap()
        .chunks_exact(8)
        .map(|b| f64::from_le_bytes(b.try_into().unwrap()))
        .collect();
    assert_eq!(np.len(), 8 * tensors.len());
    for (i, (t, m)) in tensors.iter().zip(&ours).enumerate() {
        let p = &np[8 * i..8 * i + 8];
        let size = t.max_abs();
        let ours = m.stresses();
        for (k, (a, b)) in ours.iter().zip(p).enumerate() {
            assert!(
                (a - b).abs() <= 1e-12 * size,
                "row {i} column {k}: {a} vs {b}"
            );
        }
        // Ratios: relative to their size, where von Mises is not tiny against the tensor.
        if m.von_mises > 1e-6 * size {
            assert!(
                (m.triaxiality - p[6]).abs() <= 1e-9 * (1.0 + p[6].abs()),
                "row {i}"
            );
            assert!(
                (m.factor - p[7]).abs() <= 1e-12 * p[7],
                "row {i}: {} vs {}",
                m.factor,
                p[7]
            );
        }
    }
}
