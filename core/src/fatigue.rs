//! Fatigue under a stress cycle: von Mises alternating and mean equivalents, the endurance limit
//! estimated with Marin factors, and the fatigue criteria with their factors of safety.
//!
//! Sources (Shigley's *Mechanical Engineering Design*, ch. 6, all from memory):
//! - cycle: σm = (σmax + σmin)/2, σa = (σmax − σmin)/2, component by component; equivalents
//!   σa′ = von Mises of the alternating tensor, σm′ = von Mises of the mean tensor. Sign
//!   treatment (stated, common practice): σm′ takes the sign of the mean tensor's first
//!   invariant I1, so a compressive mean is negative
//! - unmodified endurance limit of steels: Se′ = 0.5·Sut for Sut ≤ 1400 MPa, else 700 MPa
//! - Marin: Se = ka·kb·kc·kd·ke·Se′ with ka = a·Sut^b (MPa; ground 1.58, −0.085; machined or
//!   cold-drawn 4.51, −0.265; hot-rolled 57.7, −0.718; as-forged 272, −0.995), kb = 1.24·d^−0.107
//!   for 2.79 ≤ d ≤ 51 mm and 1.51·d^−0.157 for 51 < d ≤ 254 mm (rotating round, bending or
//!   torsion; 1 for axial), kc = 1 bending, 0.85 axial, 0.59 torsion, kd from the temperature
//!   polynomial in °F (70 to 1000 °F), ke = 1, 0.897, 0.868, 0.814, 0.753, 0.702 for 50, 90, 95,
//!   99, 99.9 and 99.99 % reliability
//! - criteria on the load line through the origin (σa/σm constant as the loads grow):
//!   modified Goodman 1/n = σa/Se + σm/Sut; Soderberg 1/n = σa/Se + σm/Sy;
//!   Gerber n = ½(Sut/σm)²(σa/Se)[−1 + √(1 + (2σm·Se/(Sut·σa))²)];
//!   ASME-elliptic 1/n² = (σa/Se)² + (σm/Sy)²; first-cycle yield (Langer) n = Sy/(σa + |σm|).
//!   A compressive mean (σm′ < 0) is taken as not helping: n = Se/σa for every fatigue criterion.

use crate::equivalent::Equivalent;
use crate::error::StressError;
use crate::fmath;
use crate::invariants::Invariants;
use crate::tensor::StressTensor;
use core::fmt;

/// A stress cycle as its mean and alternating tensors.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Cycle {
    /// Mean tensor.
    pub mean: StressTensor,
    /// Alternating (half-range) tensor.
    pub alternating: StressTensor,
}

impl Cycle {
    /// From the two extreme states of the cycle.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if a component overflows.
    pub fn from_extremes(max: &StressTensor, min: &StressTensor) -> Result<Self, StressError> {
        Ok(Self {
            mean: max.try_add(min)?.scaled(0.5)?,
            alternating: max.try_add(&min.scaled(-1.0)?)?.scaled(0.5)?,
        })
    }

    /// The von Mises equivalents (σa′ ≥ 0, σm′ signed by I1 of the mean).
    #[must_use]
    pub fn equivalents(&self) -> (f64, f64) {
        let a = Equivalent::of(&self.alternating).von_mises;
        let m = Equivalent::of(&self.mean).von_mises;
        let sign = if Invariants::of(&self.mean).i1 < 0.0 {
            -1.0
        } else {
            1.0
        };
        (a, sign * m)
    }
}

/// Surface finish for the surface factor ka.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Surface {
    /// Ground.
    Ground,
    /// Machined or cold-drawn.
    Machined,
    /// Hot-rolled.
    HotRolled,
    /// As forged.
    AsForged,
}

/// Kind of loading, for the load and size factors.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Loading {
    /// Bending.
    Bending,
    /// Axial.
    Axial,
    /// Torsion.
    Torsion,
}

/// Why an endurance estimate was refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum FatigueError {
    /// Diameter outside 2.79–254 mm for the size factor.
    SizeRange,
    /// Temperature outside 20–540 °C (70–1000 °F) for the temperature factor.
    TemperatureRange,
    /// Reliability not one of the tabulated values.
    Reliability,
    /// A strength or stress is not a positive finite number; names it.
    NotPositive(&'static str),
}

impl fmt::Display for FatigueError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::SizeRange => write!(
                f,
                "the size factor's correlation covers diameters of 2.79 to 254 mm"
            ),
            Self::TemperatureRange => write!(
                f,
                "the temperature factor's correlation covers 20 to 540 °C"
            ),
            Self::Reliability => write!(
                f,
                "reliability must be one of 50, 90, 95, 99, 99.9, 99.99 %"
            ),
            Self::NotPositive(n) => write!(f, "{n} must be a positive number"),
        }
    }
}

/// The Marin factors.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Marin {
    /// Surface factor ka.
    pub ka: f64,
    /// Size factor kb.
    pub kb: f64,
    /// Load factor kc.
    pub kc: f64,
    /// Temperature factor kd.
    pub kd: f64,
    /// Reliability factor ke.
    pub ke: f64,
}

impl Marin {
    /// Their product.
    #[must_use]
    pub fn product(&self) -> f64 {
        self.ka * self.kb * self.kc * self.kd * self.ke
    }
}

/// Se′ for a steel of ultimate strength `sut_mpa` (MPa).
#[must_use]
pub fn unmodified_endurance_mpa(sut_mpa: f64) -> f64 {
    if sut_mpa <= 1400.0 {
        0.5 * sut_mpa
    } else {
        700.0
    }
}

/// The Marin factors for a steel part (`sut_mpa` MPa, diameter `d_mm` mm, `temp_c` °C,
/// `reliability` in percent).
///
/// # Errors
/// [`FatigueError`] when an input is outside its correlation.
pub fn marin(
    surface: Surface,
    sut_mpa: f64,
    d_mm: f64,
    loading: Loading,
    temp_c: f64,
    reliability: f64,
) -> Result<Marin, FatigueError> {
    if !(sut_mpa.is_finite() && sut_mpa > 0.0) {
        return Err(FatigueError::NotPositive("the ultimate tensile strength"));
    }
    let (a, b) = match surface {
        Surface::Ground => (1.58, -0.085),
        Surface::Machined => (4.51, -0.265),
        Surface::HotRolled => (57.7, -0.718),
        Surface::AsForged => (272.0, -0.995),
    };
    let ka = (a * fmath::powf(sut_mpa, b)).min(1.0);
    let kb = match loading {
        Loading::Axial => 1.0,
        _ if (2.79..=51.0).contains(&d_mm) => 1.24 * fmath::powf(d_mm, -0.107),
        _ if d_mm > 51.0 && d_mm <= 254.0 => 1.51 * fmath::powf(d_mm, -0.157),
        _ => return Err(FatigueError::SizeRange),
    };
    let kc = match loading {
        Loading::Bending => 1.0,
        Loading::Axial => 0.85,
        Loading::Torsion => 0.59,
    };
    if !(20.0..=540.0).contains(&temp_c) {
        return Err(FatigueError::TemperatureRange);
    }
    let tf = temp_c * 1.8 + 32.0;
    let kd = 0.975 + 0.432e-3 * tf - 0.115e-5 * tf * tf + 0.104e-8 * tf * tf * tf
        - 0.595e-12 * tf * tf * tf * tf;
    let ke = [
        (50.0, 1.0),
        (90.0, 0.897),
        (95.0, 0.868),
        (99.0, 0.814),
        (99.9, 0.753),
        (99.99, 0.702),
    ]
    .iter()
    .find(|(r, _)| (r - reliability).abs() < 1e-9)
    .map(|(_, k)| *k)
    .ok_or(FatigueError::Reliability)?;
    Ok(Marin { ka, kb, kc, kd, ke })
}

/// A fatigue criterion (or the first-cycle yield check).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum FatigueCriterion {
    /// Modified Goodman.
    Goodman,
    /// Gerber parabola.
    Gerber,
    /// ASME-elliptic.
    AsmeElliptic,
    /// Soderberg.
    Soderberg,
    /// First-cycle yield (Langer line).
    FirstCycleYield,
}

impl FatigueCriterion {
    /// All, in display order.
    pub const ALL: [FatigueCriterion; 5] = [
        Self::Goodman,
        Self::Gerber,
        Self::AsmeElliptic,
        Self::Soderberg,
        Self::FirstCycleYield,
    ];

    /// Its name.
    #[must_use]
    pub fn name(self) -> &'static str {
        match self {
            Self::Goodman => "modified Goodman",
            Self::Gerber => "Gerber",
            Self::AsmeElliptic => "ASME-elliptic",
            Self::Soderberg => "Soderberg",
            Self::FirstCycleYield => "first-cycle yield (Langer)",
        }
    }

    /// A stable short key.
    #[must_use]
    pub fn key(self) -> &'static str {
        match self {
            Self::Goodman => "goodman",
            Self::Gerber => "gerber",
            Self::AsmeElliptic => "asme",
            Self::Soderberg => "soderberg",
            Self::FirstCycleYield => "langer",
        }
    }

    /// The envelope's alternating strength at mean stress `m` (≥ 0), for plotting.
    #[must_use]
    pub fn envelope_at(self, m: f64, se: f64, sut: f64, sy: f64) -> f64 {
        let v = match self {
            Self::Goodman => se * (1.0 - m / sut),
            Self::Gerber => se * (1.0 - (m / sut) * (m / sut)),
            Self::AsmeElliptic => se * fmath::sqrt((1.0 - (m / sy) * (m / sy)).max(0.0)),
            Self::Soderberg => se * (1.0 - m / sy),
            Self::FirstCycleYield => sy - m,
        };
        v.max(0.0)
    }
}

/// The factor of safety of criterion `c` for equivalents (σa′, σm′) with Se, Sut, Sy; `None`
/// when the point is unloaded.
#[must_use]
pub fn factor(c: FatigueCriterion, sa: f64, sm: f64, se: f64, sut: f64, sy: f64) -> Option<f64> {
    let sa = sa.max(0.0);
    let n = match c {
        FatigueCriterion::FirstCycleYield => sy / (sa + sm.abs()),
        _ if sm <= 0.0 => se / sa,
        FatigueCriterion::Goodman => 1.0 / (sa / se + sm / sut),
        FatigueCriterion::Soderberg => 1.0 / (sa / se + sm / sy),
        FatigueCriterion::AsmeElliptic => {
            1.0 / fmath::sqrt((sa / se) * (sa / se) + (sm / sy) * (sm / sy))
        }
        FatigueCriterion::Gerber if sa == 0.0 => sut / sm,
        FatigueCriterion::Gerber => {
            let r = 2.0 * sm * se / (sut * sa);
            0.5 * (sut / sm) * (sut / sm) * (sa / se) * (-1.0 + fmath::sqrt(1.0 + r * r))
        }
    };
    (n.is_finite() && n > 0.0).then_some(n)
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    #[test]
    fn marin_factors_match_the_published_correlations() {
        // Machined, Sut = 690 MPa: ka = 4.51·690^−0.265 ≈ 0.798 (Shigley example 6-3: 0.797 at
        // 100 kpsi, from memory). d = 32 mm bending: kb = 1.24·32^−0.107 ≈ 0.856.
        let m = marin(Surface::Machined, 690.0, 32.0, Loading::Bending, 20.0, 50.0).unwrap();
        assert!((m.ka - 0.798).abs() < 0.001, "{}", m.ka);
        assert!((m.kb - 0.856).abs() < 0.001, "{}", m.kb);
        assert!((m.kd - 1.0).abs() < 0.01, "{}", m.kd);
        let ax = marin(
            Surface::HotRolled,
            400.0,
            1000.0,
            Loading::Axial,
            20.0,
            99.0,
        )
        .unwrap();
        assert_eq!((ax.kb, ax.kc, ax.ke), (1.0, 0.85, 0.814));
        assert_eq!(
            marin(Surface::Ground, 400.0, 300.0, Loading::Bending, 20.0, 50.0),
            Err(FatigueError::SizeRange)
        );
        assert_eq!(
            marin(Surface::Ground, 400.0, 30.0, Loading::Bending, 20.0, 80.0),
            Err(FatigueError::Reliability)
        );
        assert_eq!(unmodified_endurance_mpa(1600.0), 700.0);
        assert_eq!(unmodified_endurance_mpa(600.0), 300.0);
    }

    #[test]
    fn criteria_meet_their_published_forms() {
        let (se, sut, sy) = (200.0, 600.0, 450.0);
        let (sa, sm) = (90.0, 150.0);
        let n = |c| factor(c, sa, sm, se, sut, sy).unwrap();
        assert!((1.0 / n(FatigueCriterion::Goodman) - (sa / se + sm / sut)).abs() < 1e-15);
        assert!((1.0 / n(FatigueCriterion::Soderberg) - (sa / se + sm / sy)).abs() < 1e-15);
        // Gerber: n·σa/Se + (n·σm/Sut)² = 1 on the load line.
        let g = n(FatigueCriterion::Gerber);
        assert!((g * sa / se + (g * sm / sut).powi(2) - 1.0).abs() < 1e-12);
        let e = n(FatigueCriterion::AsmeElliptic);
        assert!(((e * sa / se).powi(2) + (e * sm / sy).powi(2) - 1.0).abs() < 1e-12);
        assert!((n(FatigueCriterion::FirstCycleYield) - sy / (sa + sm)).abs() < 1e-12);
        // Ordering on this load line: Soderberg ≤ Goodman ≤ Gerber.
        assert!(n(FatigueCriterion::Soderberg) <= n(FatigueCriterion::Goodman));
        assert!(n(FatigueCriterion::Goodman) <= n(FatigueCriterion::Gerber));
        // Fully reversed: every fatigue criterion gives Se/σa; compressive mean the same.
        for c in [
            FatigueCriterion::Goodman,
            FatigueCriterion::Gerber,
            FatigueCriterion::AsmeElliptic,
            FatigueCriterion::Soderberg,
        ] {
            assert!((factor(c, sa, 0.0, se, sut, sy).unwrap() - se / sa).abs() < 1e-12);
            assert!((factor(c, sa, -80.0, se, sut, sy).unwrap() - se / sa).abs() < 1e-12);
            assert!((c.envelope_at(0.0, se, sut, sy) - se).abs() < 1e-12);
        }
        assert_eq!(
            factor(FatigueCriterion::Goodman, 0.0, 0.0, se, sut, sy),
            None
        );
    }

    #[test]
    fn a_cycle_splits_into_mean_and_alternating() {
        let max = StressTensor::plane(200.0, 0.0, 60.0).unwrap();
        let min = StressTensor::plane(-40.0, 0.0, 20.0).unwrap();
        let c = Cycle::from_extremes(&max, &min).unwrap();
        assert_eq!(c.mean, StressTensor::plane(80.0, 0.0, 40.0).unwrap());
        assert_eq!(
            c.alternating,
            StressTensor::plane(120.0, 0.0, 20.0).unwrap()
        );
        let (a, m) = c.equivalents();
        assert!((a - (120f64.powi(2) + 3.0 * 400.0).sqrt()).abs() < 1e-9);
        assert!((m - (6400f64 + 3.0 * 1600.0).sqrt()).abs() < 1e-9);
        let comp = Cycle::from_extremes(
            &StressTensor::plane(-10.0, 0.0, 0.0).unwrap(),
            &StressTensor::plane(-90.0, 0.0, 0.0).unwrap(),
        )
        .unwrap();
        assert!(comp.equivalents().1 < 0.0);
    }

    proptest! {
        #[test]
        fn the_fatigue_factor_scales_as_one_over_k(sa in 1.0..300.0f64, sm in -300.0..300.0f64, k in 0.05..20.0f64) {
            for c in FatigueCriterion::ALL {
                if c == FatigueCriterion::Gerber { continue; }
                let a = factor(c, sa, sm, 250.0, 700.0, 500.0).unwrap();
                let b = factor(c, k * sa, k * sm, 250.0, 700.0, 500.0).unwrap();
                prop_assert!((b - a / k).abs() <= 1e-9 * a / k, "{c:?}");
            }
        }
    }
}
