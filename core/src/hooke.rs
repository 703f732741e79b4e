//! Isotropic linear elasticity, both ways: strain tensor ⇄ stress tensor in 3D, plane stress and
//! plane strain, with an optional free thermal strain α·ΔT.
//!
//! Shear strains are **engineering** shear strains γij = 2εij throughout (γ = τ/G).
//! Generalised Hooke's law (e.g. Timoshenko & Goodier, *Theory of Elasticity*, §5, from memory):
//! - εx = [σx − ν(σy + σz)]/E + αΔT (likewise y, z),  γxy = τxy/G,  G = E/(2(1 + ν))
//! - σ = λ·tr(ε′)·I + 2G·ε′ with ε′ = ε − αΔT·I and λ = Eν/((1 + ν)(1 − 2ν))
//! - plane stress (σz = τyz = τzx = 0): σx = E/(1 − ν²)·[(εx + νεy) − (1 + ν)αΔT], likewise σy,
//!   and εz = −ν/(1 − ν)·(εx + εy) + (1 + ν)/(1 − ν)·αΔT
//! - plane strain (εz = γyz = γzx = 0): the 3D law with εz = 0, giving σz = ν(σx + σy) − EαΔT
//!
//! Stresses are in the unit of E; strains are dimensionless (multiply by 1e6 for microstrain).

use crate::error::StressError;
use crate::tensor::StressTensor;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// An isotropic linear-elastic material: Young's modulus E (> 0, any stress unit) and Poisson's
/// ratio ν (−1 < ν < 0.5).
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Elastic {
    e: f64,
    nu: f64,
}

/// Why elastic constants were refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ElasticError {
    /// E is not a positive finite number.
    Modulus(f64),
    /// ν is outside (−1, 0.5) or not finite.
    Poisson(f64),
}

impl core::fmt::Display for ElasticError {
    fn fmt(&self, f: &mut core::fmt::Formatter<'_>) -> core::fmt::Result {
        match self {
            Self::Modulus(e) => write!(f, "E must be a positive number (got {e})"),
            Self::Poisson(nu) => write!(
                f,
                "ν must lie strictly between −1 and 0.5 for an isotropic solid (got {nu})"
            ),
        }
    }
}

/// A strain tensor with engineering shear strains, dimensionless.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Strain {
    /// εx
    pub ex: f64,
    /// εy
    pub ey: f64,
    /// εz
    pub ez: f64,
    /// γxy = 2εxy
    pub gxy: f64,
    /// γyz = 2εyz
    pub gyz: f64,
    /// γzx = 2εzx
    pub gzx: f64,
}

impl Strain {
    /// The tensor components εx, εy, εz, εxy, εyz, εzx (halved shears), for principal strains.
    #[must_use]
    pub fn tensor_components(&self) -> [f64; 6] {
        [
            self.ex,
            self.ey,
            self.ez,
            0.5 * self.gxy,
            0.5 * self.gyz,
            0.5 * self.gzx,
        ]
    }
}

impl Strain {
    /// Principal strains ε1 ≥ ε2 ≥ ε3 (the strain tensor with halved shears has the same
    /// eigen-algebra as a stress tensor).
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if a component is not finite.
    pub fn principal(&self) -> Result<[f64; 3], StressError> {
        let [a, b, c, d, e, f] = self.tensor_components();
        StressTensor::new(a, b, c, d, e, f).map(|t| crate::principal::principal_values(&t))
    }
}

impl Elastic {
    /// Validated constants.
    ///
    /// # Errors
    /// [`ElasticError`] naming the constant that is out of range.
    pub fn try_new(e: f64, nu: f64) -> Result<Self, ElasticError> {
        if !(e.is_finite() && e > 0.0) {
            return Err(ElasticError::Modulus(e));
        }
        if !(nu.is_finite() && nu > -1.0 && nu < 0.5) {
            return Err(ElasticError::Poisson(nu));
        }
        Ok(Self { e, nu })
    }

    /// Young's modulus E.
    #[must_use]
    pub fn e(&self) -> f64 {
        self.e
    }

    /// Poisson's ratio ν.
    #[must_use]
    pub fn nu(&self) -> f64 {
        self.nu
    }

    /// Shear modulus G = E/(2(1 + ν)).
    #[must_use]
    pub fn g(&self) -> f64 {
        self.e / (2.0 * (1.0 + self.nu))
    }

    /// Lamé's first constant λ = Eν/((1 + ν)(1 − 2ν)).
    #[must_use]
    pub fn lambda(&self) -> f64 {
        self.e * self.nu / ((1.0 + self.nu) * (1.0 - 2.0 * self.nu))
    }

    /// Strain from stress in 3D, with free thermal strain `thermal` = αΔT.
    #[must_use]
    pub fn strain(&self, s: &StressTensor, thermal: f64) -> Strain {
        let (e, nu, g) = (self.e, self.nu, self.g());
        Strain {
            ex: (s.sx() - nu * (s.sy() + s.sz())) / e + thermal,
            ey: (s.sy() - nu * (s.sz() + s.sx())) / e + thermal,
            ez: (s.sz() - nu * (s.sx() + s.sy())) / e + thermal,
            gxy: s.txy() / g,
            gyz: s.tyz() / g,
            gzx: s.tzx() / g,
        }
    }

    /// Stress from strain in 3D, with free thermal strain `thermal` = αΔT.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if a strain is not finite or a stress overflows.
    pub fn stress(&self, eps: &Strain, thermal: f64) -> Result<StressTensor, StressError> {
        let (l, g) = (self.lambda(), self.g());
        let (ex, ey, ez) = (eps.ex - thermal, eps.ey - thermal, eps.ez - thermal);
        let tr = ex + ey + ez;
        StressTensor::new(
            l * tr + 2.0 * g * ex,
            l * tr + 2.0 * g * ey,
            l * tr + 2.0 * g * ez,
            g * eps.gxy,
            g * eps.gyz,
            g * eps.gzx,
        )
    }

    /// Plane stress from in-plane strains εx, εy, γxy: the stress tensor (σz = 0) and the
    /// out-of-plane strain εz it implies.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if a strain is not finite or a stress overflows.
    pub fn plane_stress(
        &self,
        ex: f64,
        ey: f64,
        gxy: f64,
        thermal: f64,
    ) -> Result<(StressTensor, f64), StressError> {
        let (e, nu) = (self.e, self.nu);
        let k = e / (1.0 - nu * nu);
        let th = (1.0 + nu) * thermal;
        let sx = k * ((ex + nu * ey) - th);
        let sy = k * ((ey + nu * ex) - th);
        let ez = -nu / (1.0 - nu) * (ex + ey) + (1.0 + nu) / (1.0 - nu) * thermal;
        Ok((StressTensor::plane(sx, sy, self.g() * gxy)?, ez))
    }

    /// Plane strain (εz = γyz = γzx = 0) from εx, εy, γxy: the full stress tensor, σz included.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if a strain is not finite or a stress overflows.
    pub fn plane_strain(
        &self,
        ex: f64,
        ey: f64,
        gxy: f64,
        thermal: f64,
    ) -> Result<StressTensor, StressError> {
        self.stress(
            &Strain {
                ex,
                ey,
                gxy,
                ..Strain::default()
            },
            thermal,
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn steel() -> Elastic {
        Elastic::try_new(200e3, 0.3).unwrap() // MPa; common practice values for steel
    }

    #[test]
    fn constants_are_validated() {
        assert_eq!(Elastic::try_new(0.0, 0.3), Err(ElasticError::Modulus(0.0)));
        assert_eq!(
            Elastic::try_new(-1.0, 0.3),
            Err(ElasticError::Modulus(-1.0))
        );
        assert_eq!(Elastic::try_new(1.0, 0.5), Err(ElasticError::Poisson(0.5)));
        assert_eq!(
            Elastic::try_new(1.0, -1.0),
            Err(ElasticError::Poisson(-1.0))
        );
        assert!(Elastic::try_new(f64::NAN, 0.3).is_err());
        assert!((steel().g() - 200e3 / 2.6).abs() < 1e-9);
    }

    #[test]
    fn uniaxial_stress_gives_poisson_contraction() {
        let eps = steel().strain(&StressTensor::plane(200.0, 0.0, 0.0).unwrap(), 0.0);
        assert!((eps.ex - 1e-3).abs() < 1e-15);
        assert!((eps.ey + 0.3e-3).abs() < 1e-15 && (eps.ez + 0.3e-3).abs() < 1e-15);
    }

    #[test]
    fn free_thermal_expansion_is_stress_free() {
        let m = steel();
        let th = 12e-6 * 80.0; // α·ΔT
        let s = m
            .stress(
                &Strain {
                    ex: th,
                    ey: th,
                    ez: th,
                    ..Strain::default()
                },
                th,
            )
            .unwrap();
        assert!(s.max_abs() < 1e-9);
        // Fully restrained heating: σ = −EαΔT/(1 − 2ν) in every direction (standard result).
        let r = m.stress(&Strain::default(), th).unwrap();
        assert!((r.sx() + 200e3 * th / (1.0 - 0.6)).abs() < 1e-9);
    }

    #[test]
    fn principal_strains_of_pure_shear() {
        // γxy = γ alone: ε1,3 = ±γ/2 (strain transformation, e.g. Gere & Goodno §7.7, from memory).
        let e = Strain {
            gxy: 4e-4,
            ..Strain::default()
        };
        let p = e.principal().unwrap();
        assert!((p[0] - 2e-4).abs() < 1e-18 && p[1].abs() < 1e-18 && (p[2] + 2e-4).abs() < 1e-18);
    }

    #[test]
    fn plane_strain_sigma_z() {
        let m = steel();
        let s = m.plane_strain(1e-3, -2e-4, 5e-4, 0.0).unwrap();
        assert!((s.sz() - 0.3 * (s.sx() + s.sy())).abs() < 1e-9);
    }

    proptest! {
        #[test]
        fn strain_and_stress_are_inverse(c in prop::array::uniform6(-500.0..500.0f64), th in -1e-3..1e-3f64, nu in -0.9..0.49f64) {
            let m = Elastic::try_new(70e3, nu).unwrap();
            let s = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap();
            let back = m.stress(&m.strain(&s, th), th).unwrap();
            for (a, b) in s.components().iter().zip(back.components()) {
                prop_assert!((a - b).abs() < 1e-7 * (1.0 + a.abs()) / (0.5 - nu).min(1.0), "{a} vs {b}");
            }
        }

        #[test]
        fn plane_stress_has_no_sigma_z_and_matches_3d(ex in -1e-3..1e-3f64, ey in -1e-3..1e-3f64, g in -1e-3..1e-3f64, th in -1e-4..1e-4f64) {
            let m = steel();
            let (s, ez) = m.plane_stress(ex, ey, g, th).unwrap();
            prop_assert!(s.is_plane());
            // The 3D law with the reported εz gives the same stresses and σz = 0.
            let full = m.stress(&Strain { ex, ey, ez, gxy: g, ..Strain::default() }, th).unwrap();
            prop_assert!(full.sz().abs() < 1e-9);
            prop_assert!((full.sx() - s.sx()).abs() < 1e-9 && (full.sy() - s.sy()).abs() < 1e-9);
        }
    }
}
