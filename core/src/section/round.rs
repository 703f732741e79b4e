//! A solid round section or a tube: properties, the stress tensor at a point of its perimeter or
//! wall (beam stresses, Saint-Venant torsion τ = T·r/J, Jourawski transverse shear tangent to
//! the perimeter, Lamé pressure with closed, open or plane-strain ends), in point axes. Formulas
//! and sources in the parent module's docs.

use super::{positive, Concentration, Loads, Pressure, Properties, SectionError};
use crate::fmath;
use crate::tensor::StressTensor;
use crate::vessel::{self, Ends};
use alloc::vec::Vec;
use core::f64::consts::PI;

/// A solid round (inner radius 0) or a tube.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Round {
    pub(super) ro: f64,
    pub(super) ri: f64,
}

impl Round {
    /// The radii a scan samples: the outer surface, and for a tube nine radii through the wall
    /// from the outside in.
    pub(super) fn scan_radii(&self) -> Vec<f64> {
        if self.ri > 0.0 {
            (0..9)
                .map(|i| self.ro - (self.ro - self.ri) * f64::from(i) / 8.0)
                .collect()
        } else {
            alloc::vec![self.ro]
        }
    }

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

    /// Outer radius.
    #[must_use]
    pub fn outer_radius(&self) -> f64 {
        self.ro
    }

    /// Inner radius (0 for a solid shaft).
    #[must_use]
    pub fn inner_radius(&self) -> f64 {
        self.ri
    }

    /// A = π(ro² − ri²), I = π(ro⁴ − ri⁴)/4 about any diameter, J = 2I.
    #[must_use]
    pub fn properties(&self) -> Properties {
        let (o2, i2) = (self.ro * self.ro, self.ri * self.ri);
        let i = PI * (o2 * o2 - i2 * i2) / 4.0;
        Properties {
            area: PI * (o2 - i2),
            iy: i,
            iz: i,
            jt: 2.0 * i,
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

    /// (σr, σθ, σx) from pressure at radius r.
    fn pressure_stress(&self, p: &Pressure, r: f64) -> Result<(f64, f64, f64), SectionError> {
        if self.ri == 0.0 {
            if p.inner != 0.0 {
                return Err(SectionError::NoBore);
            }
            let axial = match p.ends {
                Ends::Closed => -p.outer,
                Ends::Open => 0.0,
                Ends::PlaneStrain => -2.0 * p.nu * p.outer,
            };
            return Ok((-p.outer, -p.outer, axial));
        }
        let w = vessel::lame(p.inner, p.outer, self.ri, self.ro, r, p.ends, p.nu)
            .map_err(|_| SectionError::OffSection("r"))?;
        Ok((w.radial, w.hoop, w.axial))
    }

    pub(super) fn stress_at(
        &self,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        phi: f64,
        r: f64,
    ) -> Result<StressTensor, SectionError> {
        if !phi.is_finite() {
            return Err(SectionError::Load("φ"));
        }
        let slack = 1e-9 * self.ro;
        if !(r.is_finite() && r > 0.0 && r >= self.ri - slack && r <= self.ro + slack) {
            return Err(SectionError::OffSection("r"));
        }
        let r = r.clamp(self.ri.max(f64::MIN_POSITIVE), self.ro);
        let pr = self.properties();
        let (s, c) = (fmath::sin(phi), fmath::cos(phi));
        let (y, z) = (r * c, r * s);
        let sx = k.normal * (loads.n / pr.area + loads.my * z / pr.iy - loads.mz * y / pr.iz);
        // Tangent t = (−sin φ, cos φ): the chord-average shear along V is t's component times τt.
        let along = |avg: f64, t_comp: f64| {
            if t_comp.abs() < 1e-12 {
                0.0
            } else {
                avg / t_comp
            }
        };
        let tau = loads.t * r / pr.jt
            + along(loads.vy * self.q_over_t(y) / pr.iz, -s)
            + along(loads.vz * self.q_over_t(z) / pr.iy, c);
        let (radial, hoop, axial) = self.pressure_stress(p, r)?;
        StressTensor::new(sx + axial, hoop, radial, k.shear * tau, 0.0, 0.0)
            .map_err(|_| SectionError::Load("the loads (overflow)"))
    }
}
