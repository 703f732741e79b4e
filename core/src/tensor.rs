//! The symmetric Cauchy stress tensor at a point.
//!
//! Sign convention: tension positive. `τij` (here `xy`, `yz`, `zx`) is the shear stress on the face
//! whose outward normal is +i, acting in the +j direction; equilibrium of moments makes τij = τji
//! (e.g. Timoshenko & Goodier, *Theory of Elasticity*, §1–§4, from memory). Values are in whatever
//! unit the caller uses; every result keeps that unit.

use crate::error::StressError;
use crate::fmath;
use nalgebra::{Matrix3, Vector3};
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Relative tolerance for accepting a 3×3 matrix as symmetric: `|a_ij − a_ji| ≤ 1e-9·max|a|`.
pub const SYMMETRY_TOLERANCE: f64 = 1e-9;

/// A symmetric stress tensor: six finite components. Construct it with [`StressTensor::new`],
/// [`StressTensor::plane`] or [`StressTensor::try_from_matrix`].
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct StressTensor {
    xx: f64,
    yy: f64,
    zz: f64,
    xy: f64,
    yz: f64,
    zx: f64,
}

fn finite(value: f64, component: &'static str) -> Result<f64, StressError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(StressError::NonFinite { component })
    }
}

impl StressTensor {
    /// The zero tensor.
    pub const ZERO: StressTensor = StressTensor {
        xx: 0.0,
        yy: 0.0,
        zz: 0.0,
        xy: 0.0,
        yz: 0.0,
        zx: 0.0,
    };

    /// A general 3D state from σx, σy, σz, τxy, τyz, τzx.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] naming the first component that is NaN or infinite.
    pub fn new(
        sx: f64,
        sy: f64,
        sz: f64,
        txy: f64,
        tyz: f64,
        tzx: f64,
    ) -> Result<Self, StressError> {
        Ok(Self {
            xx: finite(sx, "σx")?,
            yy: finite(sy, "σy")?,
            zz: finite(sz, "σz")?,
            xy: finite(txy, "τxy")?,
            yz: finite(tyz, "τyz")?,
            zx: finite(tzx, "τzx")?,
        })
    }

    /// Plane stress in the x–y plane: σz = τyz = τzx = 0.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] naming the component.
    pub fn plane(sx: f64, sy: f64, txy: f64) -> Result<Self, StressError> {
        Self::new(sx, sy, 0.0, txy, 0.0, 0.0)
    }

    /// From a 3×3 array `m[row][col]`; the off-diagonal pairs must agree within
    /// [`SYMMETRY_TOLERANCE`]·max|m|. The stored shear is the mean of each pair.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] or [`StressError::NotSymmetric`] with the offending entry.
    pub fn try_from_matrix(m: [[f64; 3]; 3]) -> Result<Self, StressError> {
        const NAMES: [[&str; 3]; 3] = [
            ["σx", "τxy", "τxz"],
            ["τyx", "σy", "τyz"],
            ["τzx", "τzy", "σz"],
        ];
        let mut scale = 0.0_f64;
        for (i, row) in m.iter().enumerate() {
            for (j, &v) in row.iter().enumerate() {
                finite(v, NAMES[i][j])?;
                scale = scale.max(v.abs());
            }
        }
        let tolerance = SYMMETRY_TOLERANCE * scale;
        for (i, j) in [(0, 1), (1, 2), (0, 2)] {
            let mismatch = (m[i][j] - m[j][i]).abs();
            if mismatch > tolerance {
                return Err(StressError::NotSymmetric {
                    row: i,
                    col: j,
                    mismatch,
                    tolerance,
                });
            }
        }
        let avg = |a: f64, b: f64| a * 0.5 + b * 0.5;
        Self::new(
            m[0][0],
            m[1][1],
            m[2][2],
            avg(m[0][1], m[1][0]),
            avg(m[1][2], m[2][1]),
            avg(m[2][0], m[0][2]),
        )
    }

    /// From a nalgebra matrix (see [`try_from_matrix`](Self::try_from_matrix)).
    ///
    /// # Errors
    /// As [`try_from_matrix`](Self::try_from_matrix).
    pub fn try_from_nalgebra(m: &Matrix3<f64>) -> Result<Self, StressError> {
        Self::try_from_matrix([
            [m[(0, 0)], m[(0, 1)], m[(0, 2)]],
            [m[(1, 0)], m[(1, 1)], m[(1, 2)]],
            [m[(2, 0)], m[(2, 1)], m[(2, 2)]],
        ])
    }

    /// σx.
    #[must_use]
    pub fn sx(&self) -> f64 {
        self.xx
    }
    /// σy.
    #[must_use]
    pub fn sy(&self) -> f64 {
        self.yy
    }
    /// σz.
    #[must_use]
    pub fn sz(&self) -> f64 {
        self.zz
    }
    /// τxy = τyx.
    #[must_use]
    pub fn txy(&self) -> f64 {
        self.xy
    }
    /// τyz = τzy.
    #[must_use]
    pub fn tyz(&self) -> f64 {
        self.yz
    }
    /// τzx = τxz.
    #[must_use]
    pub fn tzx(&self) -> f64 {
        self.zx
    }

    /// The components in the order σx, σy, σz, τxy, τyz, τzx.
    #[must_use]
    pub fn components(&self) -> [f64; 6] {
        [self.xx, self.yy, self.zz, self.xy, self.yz, self.zx]
    }

    /// True when σz, τyz and τzx are all exactly zero (a plane-stress state in x–y).
    #[must_use]
    pub fn is_plane(&self) -> bool {
        self.zz == 0.0 && self.yz == 0.0 && self.zx == 0.0
    }

    /// The 3×3 array `[row][col]`.
    #[must_use]
    pub fn to_array(&self) -> [[f64; 3]; 3] {
        [
            [self.xx, self.xy, self.zx],
            [self.xy, self.yy, self.yz],
            [self.zx, self.yz, self.zz],
        ]
    }

    /// The tensor as a nalgebra matrix.
    #[must_use]
    pub fn to_matrix(&self) -> Matrix3<f64> {
        Matrix3::new(
            self.xx, self.xy, self.zx, //
            self.xy, self.yy, self.yz, //
            self.zx, self.yz, self.zz,
        )
    }

    /// Largest absolute component, max|σij|; zero only for the zero tensor.
    #[must_use]
    pub fn max_abs(&self) -> f64 {
        self.components()
            .iter()
            .fold(0.0_f64, |m, v| m.max(v.abs()))
    }

    /// Frobenius norm ‖σ‖ = √(σij σij), computed without overflow for any finite tensor.
    #[must_use]
    pub fn frobenius_norm(&self) -> f64 {
        let m = self.max_abs();
        if m == 0.0 {
            return 0.0;
        }
        let [a, b, c, d, e, f] = self.components().map(|v| v / m);
        m * fmath::sqrt(a * a + b * b + c * c + 2.0 * (d * d + e * e + f * f))
    }

    /// The tensor with every component multiplied by `k`.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if `k` is not finite; [`StressError::Overflow`] if a product
    /// overflows.
    pub fn scaled(&self, k: f64) -> Result<Self, StressError> {
        if !k.is_finite() {
            return Err(StressError::NonFinite {
                component: "the scale factor",
            });
        }
        let [a, b, c, d, e, f] = self.components().map(|v| v * k);
        Self::new(a, b, c, d, e, f).map_err(|_| StressError::Overflow {
            what: "the scaled stress",
        })
    }

    /// A tensor computed from finite ones: a non-finite component can only be an overflow.
    ///
    /// # Errors
    /// [`StressError::Overflow`] naming `what` when a component is not finite.
    pub fn derived(c: [f64; 6], what: &'static str) -> Result<Self, StressError> {
        Self::new(c[0], c[1], c[2], c[3], c[4], c[5]).map_err(|_| StressError::Overflow { what })
    }

    /// Component-wise sum.
    ///
    /// # Errors
    /// [`StressError::Overflow`] if a sum overflows.
    pub fn try_add(&self, other: &Self) -> Result<Self, StressError> {
        let a = self.components();
        let b = other.components();
        Self::derived(
            [
                a[0] + b[0],
                a[1] + b[1],
                a[2] + b[2],
                a[3] + b[3],
                a[4] + b[4],
                a[5] + b[5],
            ],
            "the sum of the stresses",
        )
    }

    /// The traction vector t = σ·n on the plane with normal `n` (not normalised here; pass a unit
    /// vector for the stress vector on that plane). Cauchy's formula.
    #[must_use]
    pub fn traction(&self, n: &Vector3<f64>) -> Vector3<f64> {
        self.to_matrix() * n
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn plane_has_zero_out_of_plane_components() {
        let t = StressTensor::plane(10.0, -5.0, 3.0).unwrap();
        assert!(t.is_plane());
        assert_eq!(t.components(), [10.0, -5.0, 0.0, 3.0, 0.0, 0.0]);
    }

    #[test]
    fn non_finite_is_refused_with_its_name() {
        assert_eq!(
            StressTensor::new(1.0, f64::NAN, 0.0, 0.0, 0.0, 0.0),
            Err(StressError::NonFinite { component: "σy" })
        );
        assert_eq!(
            StressTensor::plane(1.0, 0.0, f64::INFINITY),
            Err(StressError::NonFinite { component: "τxy" })
        );
    }

    #[test]
    fn non_symmetric_matrix_is_refused() {
        let err =
            StressTensor::try_from_matrix([[1.0, 2.0, 0.0], [2.5, 1.0, 0.0], [0.0, 0.0, 0.0]])
                .unwrap_err();
        match err {
            StressError::NotSymmetric {
                row: 0,
                col: 1,
                mismatch,
                ..
            } => assert!((mismatch - 0.5).abs() < 1e-15),
            other => panic!("unexpected {other:?}"),
        }
        // Within tolerance is accepted and averaged.
        let t = StressTensor::try_from_matrix([
            [100.0, 2.0, 0.0],
            [2.0 + 1e-9, 1.0, 0.0],
            [0.0, 0.0, 0.0],
        ])
        .unwrap();
        assert!((t.txy() - (2.0 + 0.5e-9)).abs() < 1e-15);
    }

    #[test]
    fn matrix_round_trip() {
        let t = StressTensor::new(1.0, 2.0, 3.0, 4.0, 5.0, 6.0).unwrap();
        assert_eq!(StressTensor::try_from_matrix(t.to_array()).unwrap(), t);
        assert_eq!(StressTensor::try_from_nalgebra(&t.to_matrix()).unwrap(), t);
    }

    #[test]
    fn frobenius_norm_survives_huge_values() {
        let t = StressTensor::new(1e300, 0.0, 0.0, 1e300, 0.0, 0.0).unwrap();
        assert!((t.frobenius_norm() / 1e300 - 3f64.sqrt()).abs() < 1e-15);
        assert_eq!(StressTensor::ZERO.frobenius_norm(), 0.0);
    }

    #[test]
    fn scaling_overflow_is_an_error() {
        let t = StressTensor::plane(1e300, 0.0, 0.0).unwrap();
        assert!(t.scaled(1e10).is_err());
    }
}
