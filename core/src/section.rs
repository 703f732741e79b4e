//! Round sections (solid shaft and tube) under combined loads: section properties, the stress
//! tensor at a point of the inner or outer surface, and a scan around the perimeter for the
//! critical point.
//!
//! Axes: x along the member (the outward normal of the cut face), y and z in the section,
//! right-handed; the point at perimeter angle φ is (y, z) = r·(cos φ, sin φ). Loads on the +x
//! face, positive by the right-hand rule: axial force N (tension +), bending moments My, Mz,
//! torque T about x, shear forces Vy, Vz. Stresses (elementary beam theory; e.g. Gere & Goodno,
//! *Mechanics of Materials*, ch. 3, 5 and 8, from memory):
//! - σx = Kt·(N/A + My·z/I − Mz·y/I)
//! - torsion: τxy = −T·z/J, τxz = T·y/J (J = 2I, the polar moment)
//! - transverse shear (Jourawski): τxy = Vy·Q(y)/(I·t(y)), τxz = Vz·Q(z)/(I·t(z)), with Q the first
//!   moment of the area beyond the chord through the point and t that chord's width — the
//!   average over the chord, at that point, not only its maximum
//! - shear stresses times Kts.
//!
//! Units: forces and moments in any consistent set (N and N·mm with mm give MPa).

use crate::equivalent::Equivalent;
use crate::fmath;
use crate::principal::principal_values;
use crate::tensor::StressTensor;
use alloc::vec::Vec;
use core::f64::consts::PI;
use core::fmt;

/// Why a section or its loads were refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum SectionError {
    /// A dimension is not a positive finite number; names it.
    Dimension(&'static str),
    /// The bore is not smaller than the outside diameter.
    InnerNotSmaller,
    /// A load or factor is not finite, or a concentration factor is below 1; names it.
    Load(&'static str),
    /// The inner surface of a solid section was asked for.
    NoBore,
}

impl fmt::Display for SectionError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::Dimension(n) => write!(f, "{n} must be a positive number"),
            Self::InnerNotSmaller => write!(
                f,
                "the inner diameter must be smaller than the outer diameter"
            ),
            Self::Load(n) => write!(
                f,
                "{n} must be a finite number (concentration factors at least 1)"
            ),
            Self::NoBore => write!(f, "a solid shaft has no inner surface"),
        }
    }
}

/// A solid round (inner radius 0) or a tube.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Round {
    ro: f64,
    ri: f64,
}

/// Area and second moments of a section.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Properties {
    /// Area A.
    pub area: f64,
    /// Second moment about any diameter, I = Iy = Iz.
    pub i: f64,
    /// Polar moment J = 2I (also the torsion constant of a round section).
    pub j: f64,
}

/// The loads on the section (see module docs for signs).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Loads {
    /// Axial force N.
    pub n: f64,
    /// Bending moment about y.
    pub my: f64,
    /// Bending moment about z.
    pub mz: f64,
    /// Torque about x.
    pub t: f64,
    /// Shear force along y.
    pub vy: f64,
    /// Shear force along z.
    pub vz: f64,
}

/// Stress concentration factors applied at the point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Concentration {
    /// Kt for normal stress, ≥ 1.
    pub normal: f64,
    /// Kts for shear stress, ≥ 1.
    pub shear: f64,
}

impl Default for Concentration {
    fn default() -> Self {
        Self {
            normal: 1.0,
            shear: 1.0,
        }
    }
}

/// The critical points found by [`Round::scan`].
#[derive(Debug, Clone, PartialEq)]
pub struct Scan {
    /// (φ, von Mises, σ1) at each sample.
    pub samples: Vec<(f64, f64, f64)>,
    /// (φ, value) of the highest von Mises stress, refined between samples.
    pub max_von_mises: (f64, f64),
    /// (φ, value) of the highest principal stress σ1, refined between samples.
    pub max_principal: (f64, f64),
}

fn positive(v: f64, name: &'static str) -> Result<f64, SectionError> {
    if v.is_finite() && v > 0.0 {
        Ok(v)
    } else {
        Err(SectionError::Dimension(name))
    }
}

impl Round {
    /// A solid shaft of diameter `d`.
    ///
    /// # Errors
    /// [`SectionError::Dimension`] when `d` is not positive.
    pub fn solid(d: f64) -> Result<Self, SectionError> {
        Ok(Self {
            ro: positive(d, "diameter")? / 2.0,
            ri: 0.0,
        })
    }

    /// A tube of outer diameter `d_outer` and inner diameter `d_inner`.
    ///
    /// # Errors
    /// [`SectionError`] for a non-positive size or a bore not smaller than the outside.
    pub fn tube(d_outer: f64, d_inner: f64) -> Result<Self, SectionError> {
        let ro = positive(d_outer, "outer diameter")? / 2.0;
        let ri = positive(d_inner, "inner diameter")? / 2.0;
        if ri >= ro {
            return Err(SectionError::InnerNotSmaller);
        }
        Ok(Self { ro, ri })
    }

    /// A, I and J: A = π(ro² − ri²), I = π(ro⁴ − ri⁴)/4, J = 2I.
    #[must_use]
    pub fn properties(&self) -> Properties {
        let (o2, i2) = (self.ro * self.ro, self.ri * self.ri);
        let i = PI * (o2 * o2 - i2 * i2) / 4.0;
        Properties {
            area: PI * (self.ro * self.ro - self.ri * self.ri),
            i,
            j: 2.0 * i,
        }
    }

    /// Q(u)/t(u) for the chord at distance |u| from the neutral axis:
    /// Q = ⅔[(ro² − u²)^{3/2} − (ri² − u²)₊^{3/2}], t = 2[√(ro² − u²) − √(ri² − u²)₊].
    fn q_over_t(&self, u: f64) -> f64 {
        let u2 = u * u;
        let o = (self.ro * self.ro - u2).max(0.0);
        let i = (self.ri * self.ri - u2).max(0.0);
        if self.ri == 0.0 {
            return o / 3.0;
        }
        let t = 2.0 * (fmath::sqrt(o) - fmath::sqrt(i));
        if t <= 0.0 {
            return 0.0;
        }
        2.0 / 3.0 * (o * fmath::sqrt(o) - i * fmath::sqrt(i)) / t
    }

    /// The stress tensor (section axes) at perimeter angle `phi` on the outer surface, or the
    /// inner one of a tube.
    ///
    /// # Errors
    /// [`SectionError`] for non-finite loads, factors below 1, or the bore of a solid shaft.
    pub fn stress_at(
        &self,
        loads: &Loads,
        k: Concentration,
        phi: f64,
        outer: bool,
    ) -> Result<StressTensor, SectionError> {
        for (v, name) in [
            (loads.n, "N"),
            (loads.my, "My"),
            (loads.mz, "Mz"),
            (loads.t, "T"),
            (loads.vy, "Vy"),
            (loads.vz, "Vz"),
            (phi, "φ"),
        ] {
            if !v.is_finite() {
                return Err(SectionError::Load(name));
            }
        }
        if !(k.normal.is_finite() && k.normal >= 1.0) {
            return Err(SectionError::Load("Kt"));
        }
        if !(k.shear.is_finite() && k.shear >= 1.0) {
            return Err(SectionError::Load("Kts"));
        }
        if !outer && self.ri == 0.0 {
            return Err(SectionError::NoBore);
        }
        let p = self.properties();
        let r = if outer { self.ro } else { self.ri };
        let (y, z) = (r * fmath::cos(phi), r * fmath::sin(phi));
        let sx = k.normal * (loads.n / p.area + loads.my * z / p.i - loads.mz * y / p.i);
        let txy = k.shear * (-loads.t * z / p.j + loads.vy * self.q_over_t(y) / p.i);
        let txz = k.shear * (loads.t * y / p.j + loads.vz * self.q_over_t(z) / p.i);
        StressTensor::new(sx, 0.0, 0.0, txy, 0.0, txz)
            .map_err(|_| SectionError::Load("the loads (overflow)"))
    }

    /// Samples `samples` points around the chosen surface and refines the highest von Mises and
    /// principal stress between samples (golden-section search), so a smooth maximum is found to
    /// ~1e-12 of its angle.
    ///
    /// # Errors
    /// As [`stress_at`](Self::stress_at).
    pub fn scan(
        &self,
        loads: &Loads,
        k: Concentration,
        outer: bool,
        samples: usize,
    ) -> Result<Scan, SectionError> {
        let n = samples.max(8);
        let step = 2.0 * PI / n as f64;
        let at = |phi: f64| -> Result<(f64, f64), SectionError> {
            let s = self.stress_at(loads, k, phi, outer)?;
            Ok((Equivalent::of(&s).von_mises, principal_values(&s)[0]))
        };
        let mut out = Vec::with_capacity(n);
        for i in 0..n {
            let phi = step * i as f64;
            let (vm, s1) = at(phi)?;
            out.push((phi, vm, s1));
        }
        let refine = |pick: fn(&(f64, f64)) -> f64| -> Result<(f64, f64), SectionError> {
            let best = out
                .iter()
                .max_by(|a, b| pick(&(a.1, a.2)).total_cmp(&pick(&(b.1, b.2))))
                .map_or(0.0, |s| s.0);
            let (mut lo, mut hi) = (best - step, best + step);
            let g = 0.5 * (fmath::sqrt(5.0) - 1.0);
            let (mut c, mut d) = (hi - g * (hi - lo), lo + g * (hi - lo));
            let (mut fc, mut fd) = (pick(&at(c)?), pick(&at(d)?));
            for _ in 0..80 {
                if fc > fd {
                    hi = d;
                    d = c;
                    fd = fc;
                    c = hi - g * (hi - lo);
                    fc = pick(&at(c)?);
                } else {
                    lo = c;
                    c = d;
                    fc = fd;
                    d = lo + g * (hi - lo);
                    fd = pick(&at(d)?);
                }
            }
            let phi = 0.5 * (lo + hi);
            let v = pick(&at(phi)?);
            let sampled = out
                .iter()
                .map(|s| pick(&(s.1, s.2)))
                .fold(f64::NEG_INFINITY, f64::max);
            Ok(((phi % (2.0 * PI) + 2.0 * PI) % (2.0 * PI), v.max(sampled)))
        };
        let max_von_mises = refine(|p| p.0)?;
        let max_principal = refine(|p| p.1)?;
        Ok(Scan {
            samples: out,
            max_von_mises,
            max_principal,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    #[test]
    fn properties_match_the_published_formulas() {
        // A = πd²/4, I = πd⁴/64, J = πd⁴/32 (any handbook, e.g. Roark's Formulas, table A.1).
        let p = Round::solid(40.0).unwrap().properties();
        assert!((p.area - PI * 1600.0 / 4.0).abs() < 1e-9);
        assert!((p.i - PI * 40f64.powi(4) / 64.0).abs() < 1e-6);
        assert!((p.j - PI * 40f64.powi(4) / 32.0).abs() < 1e-6);
        let t = Round::tube(60.0, 50.0).unwrap().properties();
        assert!((t.i - PI * (60f64.powi(4) - 50f64.powi(4)) / 64.0).abs() < 1e-6);
        assert_eq!(Round::tube(50.0, 60.0), Err(SectionError::InnerNotSmaller));
        assert_eq!(Round::solid(0.0), Err(SectionError::Dimension("diameter")));
    }

    #[test]
    fn transverse_shear_peaks_match_the_textbook_factors() {
        // Solid circle: τmax = 4V/(3A) at the neutral axis; thin tube: τmax ≈ 2V/A (Gere & Goodno
        // §5.9, from memory).
        let s = Round::solid(40.0).unwrap();
        let v = Loads {
            vy: 1000.0,
            ..Loads::default()
        };
        let at_na = s
            .stress_at(&v, Concentration::default(), PI / 2.0, true)
            .unwrap();
        assert!((at_na.txy() - 4.0 * 1000.0 / (3.0 * s.properties().area)).abs() < 1e-12);
        // On the extreme fibre (φ = 0) the shear from Vy vanishes.
        assert!(
            s.stress_at(&v, Concentration::default(), 0.0, true)
                .unwrap()
                .txy()
                .abs()
                < 1e-15
        );
        let t = Round::tube(100.0, 98.0).unwrap();
        let tau = t
            .stress_at(&v, Concentration::default(), PI / 2.0, true)
            .unwrap()
            .txy();
        assert!((tau / (2.0 * 1000.0 / t.properties().area) - 1.0).abs() < 0.01);
    }

    #[test]
    fn torsion_and_bending_at_the_surface() {
        // τ = 16T/(πd³), σ = 32M/(πd³) at the outer fibre of a solid shaft (standard formulas).
        let s = Round::solid(30.0).unwrap();
        let l = Loads {
            mz: 2.0e5,
            t: 1.5e5,
            ..Loads::default()
        };
        let st = s.stress_at(&l, Concentration::default(), PI, true).unwrap();
        let d3 = 30f64.powi(3);
        assert!((st.sx() - 32.0 * 2.0e5 / (PI * d3)).abs() < 1e-9);
        assert!((st.tzx().hypot(st.txy()) - 16.0 * 1.5e5 / (PI * d3)).abs() < 1e-9);
        let k = Concentration {
            normal: 2.0,
            shear: 1.5,
        };
        let sk = s.stress_at(&l, k, PI, true).unwrap();
        assert!((sk.sx() - 2.0 * st.sx()).abs() < 1e-9 && (sk.tzx() - 1.5 * st.tzx()).abs() < 1e-9);
        assert_eq!(
            s.stress_at(
                &l,
                Concentration {
                    normal: 0.5,
                    shear: 1.0
                },
                0.0,
                true
            ),
            Err(SectionError::Load("Kt"))
        );
        assert_eq!(
            s.stress_at(&l, Concentration::default(), 0.0, false),
            Err(SectionError::NoBore)
        );
    }

    proptest! {
        #[test]
        fn the_scan_never_misses_the_combined_bending_and_torsion_maximum(
            d in 5.0..200.0f64, my in -1e6..1e6f64, mz in -1e6..1e6f64, t in -1e6..1e6f64, samples in 8usize..40,
        ) {
            let s = Round::solid(d).unwrap();
            let scan = s.scan(&Loads { my, mz, t, ..Loads::default() }, Concentration::default(), true, samples).unwrap();
            // Analytic: σ = 32M/(πd³) with M = √(My² + Mz²), τ = 16T/(πd³), σvm = √(σ² + 3τ²) and
            // σ1 = σ/2 + √((σ/2)² + τ²) at the fibre of greatest bending (Shigley §7-4, from memory).
            let d3 = PI * d * d * d;
            let sig = 32.0 * my.hypot(mz) / d3;
            let tau = 16.0 * t / d3;
            let vm = (sig * sig + 3.0 * tau * tau).sqrt();
            let s1 = sig / 2.0 + ((sig / 2.0).powi(2) + tau * tau).sqrt();
            prop_assert!((scan.max_von_mises.1 - vm).abs() <= 1e-9 * vm + 1e-12, "{} vs {vm}", scan.max_von_mises.1);
            prop_assert!((scan.max_principal.1 - s1).abs() <= 1e-9 * s1 + 1e-12, "{} vs {s1}", scan.max_principal.1);
        }
    }
}
