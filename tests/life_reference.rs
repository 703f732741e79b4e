//! Life of a load history against outside references: rainflow counting against ASTM E1049's
//! own example and the `rainflow` package from PyPI, closed cycles against `fatpack`, Miner's
//! sum with Goodman and Smith–Watson–Topper against `fatpack`, the S–N line and Miner's rule
//! against the published equations written out here, and notch sensitivity against Neuber's
//! equation with the published fit (`peers/rainflow_damage.py` runs both packages).

use rand::{Rng, SeedableRng};
use stresscase_core::damage::{HistoryLife, Miner};
use stresscase_core::fatigue::Loading;
use stresscase_core::mean_stress::MeanStress;
use stresscase_core::notch;
use stresscase_core::rainflow::{count, RainflowCycle};
use stresscase_core::sn_curve::{estimated_fraction, SnLine};
use stresscase_tests::check::{close, target_dir};

/// Counts by range, sorted.
fn by_range(cycles: &[RainflowCycle]) -> Vec<(f64, f64)> {
    let mut out: Vec<(f64, f64)> = Vec::new();
    for c in cycles {
        match out.iter_mut().find(|(r, _)| *r == c.range) {
            Some(e) => e.1 += c.count,
            None => out.push((c.range, c.count)),
        }
    }
    out.sort_by(|a, b| a.0.total_cmp(&b.0));
    out
}

#[test]
fn the_standards_example_counts_as_published() {
    // ASTM E1049-85 (2017) §5.4.4, the rainflow example history and its table of counts (from
    // memory): range 3 → ½, 4 → 1½, 6 → ½, 8 → 1, 9 → ½; the starting point is the first point.
    let h = [-2.0, 1.0, -3.0, 5.0, -1.0, 3.0, -4.0, 4.0, -2.0];
    assert_eq!(
        by_range(&count(&h).unwrap()),
        [(3.0, 0.5), (4.0, 1.5), (6.0, 0.5), (8.0, 1.0), (9.0, 0.5)]
    );
}

/// Histories to compare: random floats (no repeated values), whole numbers with plateaus, and
/// a few hand-made ends.
fn histories(offset: f64) -> Vec<Vec<f64>> {
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(1049);
    let mut out = Vec::new();
    for i in 0..300 {
        let n = rng.random_range(3..400);
        out.push(
            (0..n)
                .map(|_| {
                    if i % 3 == 0 {
                        f64::from(rng.random_range(0..12)) * 25.0 + offset
                    } else {
                        rng.random_range(0.0..350.0) + offset
                    }
                })
                .collect(),
        );
    }
    for end in [
        vec![1.0, 5.0, 5.0],
        vec![0.0, 5.0, 3.0, 2.0],
        vec![3.0, 3.0, 3.0],
        vec![0.0, 4.0, 1.0, 4.0, 0.0, 4.0],
    ] {
        out.push(end.iter().map(|v| v * 10.0 + offset).collect());
    }
    out
}

/// Runs the peer on `hs` (written to `<tag>.f64`); one JSON value per history.
fn peer(tag: &str, hs: &[Vec<f64>], sut: f64, line: (f64, f64, f64)) -> Vec<serde_json::Value> {
    let dir = target_dir().join("life-reference");
    std::fs::create_dir_all(&dir).unwrap();
    let src = dir.join(format!("{tag}.f64"));
    let mut bytes = Vec::new();
    for h in hs {
        #[allow(clippy::cast_precision_loss)] // lengths are small
        bytes.extend((h.len() as f64).to_le_bytes());
        bytes.extend(h.iter().flat_map(|v| v.to_le_bytes()));
    }
    std::fs::write(&src, bytes).unwrap();
    let args = [
        sut.to_string(),
        line.0.to_string(),
        line.1.to_string(),
        line.2.to_string(),
    ];
    let out = std::process::Command::new("python3")
        .arg(stresscase_tests::check::data_path(
            "peers/rainflow_damage.py",
        ))
        .arg(&src)
        .args(&args)
        .output()
        .expect("python3 with rainflow and fatpack (cargo xtask test installs them)");
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout)
        .unwrap()
        .lines()
        .map(|l| serde_json::from_str(l).unwrap())
        .collect()
}

const SUT: f64 = 1000.0;
/// The user's Basquin curve: 2·10⁶ cycles at 100 MPa, slope 5.
const LINE: (f64, f64, f64) = (2e6, 100.0, 5.0);

#[test]
fn counts_and_damage_match_the_rainflow_and_fatpack_packages() {
    let hs = histories(50.0);
    let theirs = peer("random", &hs, SUT, LINE);
    assert_eq!(theirs.len(), hs.len());
    let line = SnLine::basquin(LINE.0, LINE.1, LINE.2, None).unwrap();
    for (k, (h, p)) in hs.iter().zip(&theirs).enumerate() {
        let ours = count(h).unwrap();
        // The package counts a constant history as a half cycle of range 0 (see below).
        let rf: Vec<&serde_json::Value> = p["cycles"]
            .as_array()
            .unwrap()
            .iter()
            .filter(|c| c[0].as_f64() != Some(0.0))
            .collect();
        assert_eq!(ours.len(), rf.len(), "history {k}: cycle count");
        let plateaus = k % 3 == 0 || k >= 300;
        for (i, (c, r)) in ours.iter().zip(&rf).enumerate() {
            let r: Vec<f64> = r
                .as_array()
                .unwrap()
                .iter()
                .map(|v| v.as_f64().unwrap())
                .collect();
            let case = format!("history {k}, cycle {i}");
            // serde_json reads floats to within an ulp or so.
            close(&case, "range", c.range, r[0], 1e-13 * r[0]);
            close(&case, "mean", c.mean, r[1], 1e-12 * r[1].abs());
            assert_eq!(c.count, r[2], "{case}: count");
            if !plateaus {
                // In a run of equal values the package keeps the last sample, we the first.
                #[allow(clippy::cast_precision_loss)]
                let (from, to) = (c.from as f64, c.to as f64);
                assert_eq!((from, to), (r[3], r[4]), "{case}: indices");
            }
        }
        // Miner's sum with each mean-stress correction fatpack covers.
        for (correction, key) in [
            (MeanStress::Goodman, "goodman"),
            (MeanStress::SmithWatsonTopper, "swt"),
        ] {
            let Some(want) = p[key].as_f64() else {
                continue; // no cycles
            };
            let m = Miner::sum(&ours, correction, &line, SUT);
            close(&format!("history {k}"), key, m.total, want, 1e-10 * want);
        }
        // fatpack's four-point method finds the same closed cycles when no two ranges tie.
        // With ties (the whole-number histories) it differs near the start: the three-point
        // method counts a range that contains the starting point as a half cycle, and in
        // 50, 325, 50, 325, … every such range does; the four-point method closes them as
        // full cycles.
        if plateaus {
            continue;
        }
        let mut closed_ours: Vec<(f64, f64)> = ours
            .iter()
            .filter(|c| c.count == 1.0)
            .map(|c| (h[c.from], h[c.to]))
            .collect();
        let mut closed_fp: Vec<(f64, f64)> = p["closed"]
            .as_array()
            .unwrap()
            .iter()
            .map(|c| (c[0].as_f64().unwrap(), c[1].as_f64().unwrap()))
            .collect();
        closed_ours.sort_by(|a, b| a.partial_cmp(b).unwrap());
        closed_fp.sort_by(|a, b| a.partial_cmp(b).unwrap());
        assert_eq!(closed_ours, closed_fp, "history {k}: closed cycles");
    }
}

#[test]
fn where_the_rainflow_package_ends_a_history_differently() {
    // A history of exactly two points: the standard counts its one range as a half cycle; the
    // package's reversal finder never yields the second point, so it counts nothing.
    let h = vec![10.0, 250.0];
    let p = peer("two-points", std::slice::from_ref(&h), SUT, LINE);
    assert!(p[0]["cycles"].as_array().unwrap().is_empty());
    let ours = count(&h).unwrap();
    assert_eq!((ours.len(), ours[0].range, ours[0].count), (1, 240.0, 0.5));
    // A constant history: no turning point after the first, so no cycle; the package always
    // yields the last point of three or more and counts a half cycle of range 0.
    let flat = vec![80.0; 3];
    let p = peer("constant", std::slice::from_ref(&flat), SUT, LINE);
    let theirs = p[0]["cycles"].as_array().unwrap();
    assert_eq!((theirs.len(), theirs[0][0].as_f64()), (1, Some(0.0)));
    assert!(count(&flat).unwrap().is_empty());
}

#[test]
fn the_sn_line_and_miners_rule_follow_the_published_equations() {
    // Shigley 9th ed. eqs. 6-10 to 6-16 and Miner's rule, written out here (from memory).
    let (sut, se) = (900.0f64, 320.0f64);
    let sigma_f = sut + 345.0;
    let b_f = -(sigma_f / se).log10() / (2e6f64).log10();
    let f = sigma_f / sut * 2000f64.powf(b_f);
    close(
        "f estimate",
        "f",
        estimated_fraction(sut, se).unwrap(),
        f,
        1e-14,
    );
    let a = (f * sut).powi(2) / se;
    let b = -(f * sut / se).log10() / 3.0;
    let line = SnLine::through_strengths(f, sut, se).unwrap();
    close("line", "a", line.a, a, 1e-12 * a);
    close("line", "b", line.b, b, 1e-14);
    // A block of cycles: (amplitude, mean, count); Gerber correction.
    let block = [
        (400.0, 100.0, 1.0),
        (350.0, 0.0, 0.5),
        (500.0, -50.0, 1.0),
        (200.0, 300.0, 1.0),
    ];
    let mut d = 0.0;
    let mut cycles = Vec::new();
    for &(sa, sm, n) in &block {
        let sar: f64 = if sm > 0.0 {
            sa / (1.0 - (sm / sut).powi(2))
        } else {
            sa
        };
        if sar > se {
            d += n / (sar / a).powf(1.0 / b);
        }
        cycles.push(RainflowCycle {
            range: 2.0 * sa,
            mean: sm,
            count: n,
            from: 0,
            to: 1,
        });
    }
    let m = Miner::sum(&cycles, MeanStress::Gerber, &line, sut);
    close("Miner, Gerber", "D", m.total, d, 1e-12 * d);
    assert_eq!(m.life(), HistoryLife::Repeats(1.0 / m.total));
}

#[test]
fn notch_sensitivity_follows_neubers_equation() {
    // Shigley 9th ed. eqs. 6-33 and 6-35a/b (from memory), Sut = 120 kpsi, r = 0.05 in.
    let s = 120.0f64;
    let sqrt_a = |c: [f64; 4]| c[0] + c[1] * s + c[2] * s * s + c[3] * s * s * s;
    let bend = sqrt_a([0.246, -3.08e-3, 1.51e-5, -2.67e-8]);
    let tors = sqrt_a([0.190, -2.51e-3, 1.35e-5, -2.67e-8]);
    let mpa = s * 6.894_757_293_168_361;
    for (loading, want) in [(Loading::Bending, bend), (Loading::Torsion, tors)] {
        let ours = notch::neuber_constant(mpa, loading).unwrap();
        let q = notch::sensitivity(ours, 0.05 * 25.4).unwrap();
        close("Neuber", "q", q, 1.0 / (1.0 + want / 0.05f64.sqrt()), 1e-12);
    }
}
