//! Principal stresses σ1 ≥ σ2 ≥ σ3 and their directions.
//!
//! The principal stresses are the eigenvalues of the symmetric tensor, the roots of
//! det(σ − λI) = λ³ − I1 λ² + I2 λ − I3 = 0; the directions are its unit eigenvectors
//! (Cauchy; e.g. Timoshenko & Goodier, *Theory of Elasticity*, §77, from memory).
//!
//! Two solvers, both accurate to a small multiple of machine precision times ‖σ‖ (Frobenius):
//!
//! - [`Principal::of`] (values and directions) uses the cyclic Jacobi method on the tensor scaled to
//!   unit size (Jacobi 1846; the rotation formulas as in Golub & Van Loan, *Matrix Computations*,
//!   §8.5, from memory). It is unconditionally stable, also for repeated roots.
//! - [`principal_values`] and the batch [`principal_values_into`] use the closed-form solution of
//!   the deviatoric characteristic cubic λ³ − J2 λ − J3 = 0: with r = √(J2/3) and
//!   c = J3/(2r³) = cos 3θ, the roots are 2r·cos(θ − 2πk/3) (the trigonometric solution, e.g.
//!   Smith 1961, *Comm. ACM* 4(4):168, from memory). Instead of acos/cos we refine the root that is
//!   well separated from the other two by Newton's method from a cubic Hermite starting value, then
//!   deflate to a quadratic. The safeguard: when the two remaining roots are closer than
//!   [`CLOSE_ROOT_GAP`]·r, the cubic's coefficients no longer pin them down to full precision
//!   (a double root moves by √ε), so those tensors fall back to Jacobi.

use crate::error::StressError;
use crate::fmath;
use crate::tensor::StressTensor;
use nalgebra::Vector3;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Below this gap between the close pair of normalised roots (in units of r = √(J2/3)), the
/// closed-form path hands the tensor to Jacobi. The closed-form error in the pair grows like
/// ε/gap; at this gap it is still ~1e-14·‖σ‖, a hundredfold inside the 1e-12·‖σ‖ target.
pub const CLOSE_ROOT_GAP: f64 = 0.05;

/// Principal stresses and directions of one tensor.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Principal {
    values: [f64; 3],
    directions: [Vector3<f64>; 3],
}

impl Principal {
    /// Principal values and directions by the Jacobi method.
    ///
    /// The directions n1, n2, n3 belong to σ1, σ2, σ3, are unit length, mutually orthogonal and
    /// right-handed (n1 × n2 = n3). Each of n1 and n2 has its largest-magnitude component positive,
    /// so the result is repeatable. For repeated roots any orthonormal basis of the eigenspace is
    /// valid; the one returned is whatever Jacobi converges to.
    #[must_use]
    pub fn of(tensor: &StressTensor) -> Self {
        let m = tensor.max_abs();
        if m == 0.0 {
            return Self {
                values: [0.0; 3],
                directions: [Vector3::x(), Vector3::y(), Vector3::z()],
            };
        }
        let scaled = tensor.to_array().map(|row| row.map(|v| v / m));
        let (vals, vecs) = jacobi(scaled);
        let mut order = [0usize, 1, 2];
        order.sort_by(|&i, &j| vals[j].total_cmp(&vals[i]));
        let column = |k: usize| Vector3::new(vecs[0][k], vecs[1][k], vecs[2][k]);
        let n1 = canonical_sign(column(order[0]));
        let n2 = canonical_sign(column(order[1]));
        let n3 = n1.cross(&n2);
        let n3 = n3 / n3.norm();
        Self {
            values: [vals[order[0]] * m, vals[order[1]] * m, vals[order[2]] * m],
            directions: [n1, n2, n3],
        }
    }

    /// [σ1, σ2, σ3], descending, in the tensor's unit.
    #[must_use]
    pub fn values(&self) -> [f64; 3] {
        self.values
    }

    /// [n1, n2, n3], the unit directions of σ1, σ2, σ3 in the tensor's x, y, z axes.
    #[must_use]
    pub fn directions(&self) -> [Vector3<f64>; 3] {
        self.directions
    }

    /// σ1, the largest principal stress.
    #[must_use]
    pub fn sigma1(&self) -> f64 {
        self.values[0]
    }
    /// σ2, the intermediate principal stress.
    #[must_use]
    pub fn sigma2(&self) -> f64 {
        self.values[1]
    }
    /// σ3, the smallest principal stress.
    #[must_use]
    pub fn sigma3(&self) -> f64 {
        self.values[2]
    }
}

fn canonical_sign(v: Vector3<f64>) -> Vector3<f64> {
    let v = v / v.norm();
    let k = v.iamax();
    if v[k] < 0.0 {
        -v
    } else {
        v
    }
}

/// Cyclic Jacobi on a symmetric 3×3 with entries of order one. Returns the eigenvalues (unsorted)
/// and the matrix whose columns are the matching unit eigenvectors.
fn jacobi(mut a: [[f64; 3]; 3]) -> ([f64; 3], [[f64; 3]; 3]) {
    let mut v = [[1.0, 0.0, 0.0], [0.0, 1.0, 0.0], [0.0, 0.0, 1.0]];
    for _sweep in 0..32 {
        let off = a[0][1] * a[0][1] + a[0][2] * a[0][2] + a[1][2] * a[1][2];
        let diag = a[0][0] * a[0][0] + a[1][1] * a[1][1] + a[2][2] * a[2][2];
        if off <= 1e-40 * (diag + off) || off < 1e-300 {
            break;
        }
        for (p, q) in [(0usize, 1usize), (0, 2), (1, 2)] {
            let apq = a[p][q];
            if apq == 0.0 {
                continue;
            }
            let theta = (a[q][q] - a[p][p]) / (2.0 * apq);
            let t = if theta.abs() > 1e150 {
                0.5 / theta
            } else {
                let t = 1.0 / (theta.abs() + fmath::sqrt(theta * theta + 1.0));
                if theta < 0.0 {
                    -t
                } else {
                    t
                }
            };
            let c = 1.0 / fmath::sqrt(t * t + 1.0);
            let s = t * c;
            a[p][p] -= t * apq;
            a[q][q] += t * apq;
            a[p][q] = 0.0;
            a[q][p] = 0.0;
            let r = 3 - p - q;
            let arp = a[r][p];
            let arq = a[r][q];
            a[r][p] = c * arp - s * arq;
            a[p][r] = a[r][p];
            a[r][q] = s * arp + c * arq;
            a[q][r] = a[r][q];
            for row in &mut v {
                let vp = row[p];
                let vq = row[q];
                row[p] = c * vp - s * vq;
                row[q] = s * vp + c * vq;
            }
        }
    }
    ([a[0][0], a[1][1], a[2][2]], v)
}

/// Principal values [σ1, σ2, σ3] (descending) by the safeguarded closed form described in the
/// module docs. Agrees with [`Principal::of`] to ~1e-15·‖σ‖.
#[must_use]
pub fn principal_values(tensor: &StressTensor) -> [f64; 3] {
    let c = tensor.components();
    let m = max_abs(&c);
    if m == 0.0 {
        return [0.0; 3];
    }
    // Scale to max |entry| = 1 so squares and cubes neither overflow nor underflow. 1/m
    // overflows for m < 2^-1024, so tensors that small are first scaled exactly by 2^600.
    let (c, m, undo) = if m < 1e-290 {
        (c.map(|v| v * TWO_600), m * TWO_600, TWO_M600)
    } else {
        (c, m, 1.0)
    };
    let k = 1.0 / m;
    match closed_form(c.map(|v| v * k), 1.0) {
        (x, true) => x.map(|v| v * m * undo),
        (_, false) => Principal::of(tensor).values(),
    }
}

#[inline(always)]
fn max_abs(c: &[f64; 6]) -> f64 {
    let m = fmath::max(fmath::max(c[0].abs(), c[1].abs()), c[2].abs());
    let n = fmath::max(fmath::max(c[3].abs(), c[4].abs()), c[5].abs());
    fmath::max(m, n)
}

const TWO_600: f64 = 4.149_515_568_880_993e180; // 2^600, exact
const TWO_M600: f64 = 2.409_919_865_102_884e-181; // 2^-600, exact

/// Degree-4 Chebyshev fit (on [0, 1], error < 2e-5) of the largest root y(c) of y³ − 3y − 2c = 0,
/// i.e. y = 2·cos(acos(c)/3); coefficients of 1, c, …, c⁴ (fitted with numpy's Chebyshev.fit).
const Y_FIT: [f64; 5] = [
    1.73206895736883,
    0.33275165987900046,
    -0.09171179202793343,
    0.03500615800455041,
    -0.00812864736216668,
];

/// The closed form, free of branches so a loop over it vectorises. `floor2` is the square of the
/// tensor's size (max |entry|); the second result is false when the Jacobi fallback is needed:
/// the close pair is nearer than [`CLOSE_ROOT_GAP`]·r, or the deviator is below 1e-12 of the size.
#[inline(always)]
fn closed_form([a, b, c, d, e, f]: [f64; 6], size2: f64) -> ([f64; 3], bool) {
    let mean = (a + b + c) * (1.0 / 3.0);
    let (sa, sb, sc) = (a - mean, b - mean, c - mean);
    let j2 = 0.5 * (sa * sa + sb * sb + sc * sc) + d * d + e * e + f * f;
    let r = fmath::sqrt(j2 * (1.0 / 3.0));
    // J3 = det(s) with s = [[sa, d, f], [d, sb, e], [f, e, sc]].
    let j3 = sa * (sb * sc - e * e) - d * (d * sc - e * f) + f * (d * e - sb * f);
    let cos3 = (j3 / (2.0 * r * r * r)).clamp(-1.0, 1.0);
    let ca = cos3.abs();
    // Largest root y ∈ [√3, 2] of y³ − 3y − 2|c| = 0: fitted start, two Newton steps (< 1 ulp).
    let mut y = Y_FIT[0] + ca * (Y_FIT[1] + ca * (Y_FIT[2] + ca * (Y_FIT[3] + ca * Y_FIT[4])));
    y -= (y * y * y - 3.0 * y - 2.0 * ca) / (3.0 * y * y - 3.0);
    y -= (y * y * y - 3.0 * y - 2.0 * ca) / (3.0 * y * y - 3.0);
    // Deflate: x² + y x + (y² − 3) = 0 holds the other two roots, √(12 − 3y²) apart.
    let gap = fmath::sqrt(fmath::max(12.0 - 3.0 * y * y, 0.0));
    let neg = cos3 < 0.0;
    let x1 = if neg { 0.5 * (y + gap) } else { y };
    let x2 = if neg {
        0.5 * (y - gap)
    } else {
        0.5 * (gap - y)
    };
    let x3 = if neg { -y } else { -0.5 * (gap + y) };
    let ok = gap >= CLOSE_ROOT_GAP && j2 > 1e-24 * size2;
    ([mean + r * x1, mean + r * x2, mean + r * x3], ok)
}

/// Tensors handled together by the batch path: enough for the compiler to use vector registers.
const LANES: usize = 8;

/// Principal values of many tensors: `out[i] = principal_values(&tensors[i])`.
///
/// Single-threaded. Works on chunks of eight tensors with the branch-free closed form on
/// unscaled values for every tensor with max |entry| in [1e-50, 1e50] (so no square or cube
/// over- or underflows); the other tensors, and the rare ones that need the Jacobi fallback,
/// go through [`principal_values`]. A tensor's result depends on that tensor alone, not on
/// its neighbours or its place in the slice, so a table computed in pieces gives the same bits
/// as computed whole.
///
/// # Errors
/// [`StressError::LengthMismatch`] when `out` is not as long as `tensors`.
// Never inlined: the page builds its own code for size and core's for speed, and code inlined
// into a size-built caller is optimised as the caller is (no unrolled or vector loops).
#[inline(never)]
pub fn principal_values_into(
    tensors: &[StressTensor],
    out: &mut [[f64; 3]],
) -> Result<(), StressError> {
    if tensors.len() != out.len() {
        return Err(StressError::LengthMismatch {
            input: tensors.len(),
            output: out.len(),
        });
    }
    // A stand-in for lanes the closed form must not see; its result is thrown away.
    const STAND_IN: [f64; 6] = [1.0, 0.0, 0.0, 0.0, 0.0, 0.0];
    for (ts, os) in tensors.chunks(LANES).zip(out.chunks_mut(LANES)) {
        let mut comps = [STAND_IN; LANES];
        let mut inside = [false; LANES];
        let mut sizes = [1.0; LANES];
        for (i, t) in ts.iter().enumerate() {
            let c = t.components();
            let size = max_abs(&c);
            if (1e-50..=1e50).contains(&size) {
                comps[i] = c;
                inside[i] = true;
                sizes[i] = size;
            }
        }
        let mut found = [[0.0; 3]; LANES];
        let mut ok = [false; LANES];
        for i in 0..LANES {
            let (x, good) = closed_form(comps[i], sizes[i] * sizes[i]);
            found[i] = x;
            ok[i] = good;
        }
        for (i, (t, o)) in ts.iter().zip(os.iter_mut()).enumerate() {
            *o = if inside[i] && ok[i] {
                found[i]
            } else {
                principal_values(t)
            };
        }
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use nalgebra::{Matrix3, Rotation3};
    use proptest::prelude::*;
    use std::vec;
    use std::vec::Vec;

    fn tensor_from(m: &Matrix3<f64>) -> StressTensor {
        StressTensor::try_from_nalgebra(&(0.5 * (m + m.transpose()))).unwrap()
    }

    #[test]
    fn fitted_start_is_within_2e_5() {
        for i in 0..=1000 {
            let c = f64::from(i) / 1000.0;
            let exact = 2.0 * (c.acos() / 3.0).cos();
            let fit = Y_FIT[0] + c * (Y_FIT[1] + c * (Y_FIT[2] + c * (Y_FIT[3] + c * Y_FIT[4])));
            assert!((fit - exact).abs() < 2e-5, "c = {c}");
        }
    }

    proptest! {
        #[test]
        fn a_tensors_batch_result_does_not_depend_on_its_neighbours(
            c in proptest::array::uniform6(-500.0f64..500.0),
            before in 0usize..9,
            tiny in proptest::bool::ANY,
        ) {
            // The same tensor after `before` others (one of them zero, or tiny: the kind that
            // goes through the one-point path) gives the same bits as alone.
            let t = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let other = if tiny { 1e-60 } else { 0.0 };
            let mut ts = vec![StressTensor::new(other, 0.0, 0.0, 0.0, 0.0, 0.0).unwrap(); before];
            ts.push(t);
            let mut out = vec![[0.0; 3]; ts.len()];
            principal_values_into(&ts, &mut out).unwrap();
            let mut alone = [[0.0; 3]];
            principal_values_into(&[t], &mut alone).unwrap();
            let bits = |p: [f64; 3]| p.map(f64::to_bits);
            prop_assert_eq!(bits(out[before]), bits(alone[0]));
        }
    }

    #[test]
    fn batch_equals_single_for_every_chunk_shape() {
        // Mixed chunks: ordinary, near-repeated (fallback lanes), huge and tiny (scalar chunks).
        let mut ts = Vec::new();
        for i in 0..37 {
            let s = match i % 5 {
                0 => 1e-200,
                1 => 1e120,
                _ => 1.0,
            };
            let g = if i % 3 == 0 { 1e-9 } else { 0.7 };
            ts.push(StressTensor::new((3.0 + g) * s, 3.0 * s, -s, 0.0, 0.0, 0.0).unwrap());
            ts.push(
                StressTensor::new(
                    1.0 * s,
                    -2.0 * s,
                    0.5 * s,
                    0.3 * s,
                    -0.2 * s,
                    f64::from(i) * s,
                )
                .unwrap(),
            );
        }
        let mut out = vec![[0.0; 3]; ts.len()];
        principal_values_into(&ts, &mut out).unwrap();
        for (t, o) in ts.iter().zip(&out) {
            let single = principal_values(t);
            for k in 0..3 {
                assert!(
                    (o[k] - single[k]).abs() <= 1e-14 * t.frobenius_norm(),
                    "{t:?}: {o:?} vs {single:?}"
                );
            }
        }
    }

    #[test]
    fn constants_are_exact_powers_of_two() {
        assert_eq!(TWO_600, 2f64.powi(600));
        assert_eq!(TWO_M600, 2f64.powi(-600));
    }

    #[test]
    fn uniaxial_and_hydrostatic() {
        let t = StressTensor::plane(100.0, 0.0, 0.0).unwrap();
        assert_eq!(principal_values(&t), [100.0, 0.0, 0.0]);
        let p = Principal::of(&t);
        assert_eq!(p.values(), [100.0, 0.0, 0.0]);
        assert!((p.directions()[0] - Vector3::x()).norm() < 1e-15);
        let h = StressTensor::new(-7.0, -7.0, -7.0, 0.0, 0.0, 0.0).unwrap();
        assert_eq!(principal_values(&h), [-7.0; 3]);
        assert_eq!(Principal::of(&StressTensor::ZERO).values(), [0.0; 3]);
    }

    #[test]
    fn pure_shear_is_plus_minus_tau_at_45_degrees() {
        let t = StressTensor::plane(0.0, 0.0, 50.0).unwrap();
        let v = principal_values(&t);
        assert!(
            (v[0] - 50.0).abs() < 1e-13 && v[1].abs() < 1e-13 && (v[2] + 50.0).abs() < 1e-13,
            "{v:?}"
        );
        let p = Principal::of(&t);
        let n1 = p.directions()[0];
        let h = core::f64::consts::FRAC_1_SQRT_2;
        assert!((n1 - Vector3::new(h, h, 0.0)).norm() < 1e-14, "{n1}");
    }

    #[test]
    fn subnormal_and_huge_scales() {
        for s in [1e-310, 1e-200, 1e200, 1e307] {
            let t = StressTensor::new(3.0 * s, -s, 0.5 * s, s, 0.0, 0.25 * s).unwrap();
            let fast = principal_values(&t);
            let jac = Principal::of(&t).values();
            for k in 0..3 {
                assert!(
                    (fast[k] - jac[k]).abs() <= 1e-13 * t.frobenius_norm(),
                    "scale {s}: {fast:?} vs {jac:?}"
                );
            }
        }
    }

    #[test]
    fn batch_checks_lengths() {
        let t = [StressTensor::ZERO; 2];
        let mut out = [[0.0; 3]; 3];
        assert_eq!(
            principal_values_into(&t, &mut out),
            Err(StressError::LengthMismatch {
                input: 2,
                output: 3
            })
        );
        let mut out = [[1.0; 3]; 2];
        principal_values_into(&t, &mut out).unwrap();
        assert_eq!(out, [[0.0; 3]; 2]);
    }

    fn arb_tensor() -> impl Strategy<Value = StressTensor> {
        (prop::array::uniform6(-1.0e3..1.0e3f64), -6i32..6).prop_map(|(c, e)| {
            let s = 10f64.powi(e * 20);
            StressTensor::new(c[0] * s, c[1] * s, c[2] * s, c[3] * s, c[4] * s, c[5] * s).unwrap()
        })
    }

    fn arb_rotation() -> impl Strategy<Value = Rotation3<f64>> {
        (prop::array::uniform3(-1.0..1.0f64), -3.2..3.2f64).prop_filter_map("axis", |(a, ang)| {
            let v = Vector3::new(a[0], a[1], a[2]);
            (v.norm() > 1e-3)
                .then(|| Rotation3::from_axis_angle(&nalgebra::Unit::new_normalize(v), ang))
        })
    }

    proptest! {
        #[test]
        fn reconstruction_from_the_decomposition(t in arb_tensor()) {
            let p = Principal::of(&t);
            let [n1, n2, n3] = p.directions();
            let [s1, s2, s3] = p.values();
            let q = Matrix3::from_columns(&[n1, n2, n3]);
            let back = q * Matrix3::from_diagonal(&Vector3::new(s1, s2, s3)) * q.transpose();
            let err = (back - t.to_matrix()).norm();
            prop_assert!(err <= 1e-13 * t.frobenius_norm(), "err {err}");
        }

        #[test]
        fn directions_are_orthonormal_and_right_handed(t in arb_tensor()) {
            let [n1, n2, n3] = Principal::of(&t).directions();
            let q = Matrix3::from_columns(&[n1, n2, n3]);
            prop_assert!((q.transpose() * q - Matrix3::identity()).norm() < 1e-13);
            prop_assert!((q.determinant() - 1.0).abs() < 1e-13);
        }

        #[test]
        fn values_sorted_and_both_solvers_agree(t in arb_tensor()) {
            let fast = principal_values(&t);
            let jac = Principal::of(&t).values();
            prop_assert!(fast[0] >= fast[1] && fast[1] >= fast[2]);
            prop_assert!(jac[0] >= jac[1] && jac[1] >= jac[2]);
            for k in 0..3 {
                prop_assert!((fast[k] - jac[k]).abs() <= 1e-13 * t.frobenius_norm());
            }
        }

        #[test]
        fn invariant_under_rotation(t in arb_tensor(), r in arb_rotation()) {
            let m = r.matrix() * t.to_matrix() * r.matrix().transpose();
            let rotated = tensor_from(&m);
            let a = principal_values(&t);
            let b = principal_values(&rotated);
            for k in 0..3 {
                prop_assert!((a[k] - b[k]).abs() <= 1e-12 * t.frobenius_norm(), "{a:?} {b:?}");
            }
        }

        #[test]
        fn near_double_roots_stay_accurate(base in -10.0..10.0f64, gap_exp in -15i32..0, r in arb_rotation()) {
            let lam = Vector3::new(base + 10f64.powi(gap_exp), base, base - 5.0);
            let q = r.matrix();
            let m = q * Matrix3::from_diagonal(&lam) * q.transpose();
            let t = tensor_from(&m);
            let v = principal_values(&t);
            let j = Principal::of(&t).values();
            // The rounded tensor's exact eigenvalues differ from `lam` by O(ε‖σ‖) only.
            let tol = 1e-12 * t.frobenius_norm();
            for k in 0..3 {
                prop_assert!((v[k] - lam[k]).abs() <= tol, "fast {v:?} vs {lam}");
                prop_assert!((j[k] - lam[k]).abs() <= tol, "jacobi {j:?} vs {lam}");
            }
        }
    }
}
