//! A solid round section or a tube: properties, the stress tensor at a point of its perimeter or
//! wall (beam stresses, Saint-Venant torsion τ = T·r/J, transverse shear tangent to the
//! perimeter — Jourawski on a solid shaft, the radial-cut average in a tube — and Lamé
//! pressure with closed, open or plane-strain ends), in point axes. Formulas and sources in the
//! parent module's docs.

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
            // The surfaces exactly, so the scan's curves along them are samples of its grid.
            (0..9)
                .map(|i| match i {
                    0 => self.ro,
                    8 => self.ri,
                    _ => self.ro - (self.ro - self.ri) * f64::from(i) / 8.0,
                })
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

    /// Q(u)/t(u) of a solid circle for the chord at distance |u| from the neutral axis:
    /// Q = ⅔(ro² − u²)^{3/2}, t = 2√(ro² − u²), so Q/t = (ro² − u²)/3.
    fn q_over_t_solid(&self, u: f64) -> f64 {
        (self.ro * self.ro - u * u).max(0.0) / 3.0
    }

    /// The circumferential shear τxθ from the shear forces at the point at angle φ (sin φ = `s`,
    /// cos φ = `c`, coordinates y, z), positive along the tangent t = (−sin φ, cos φ).
    ///
    /// Solid shaft: the chord through the point carries the Jourawski average V·Q/(I·t); the
    /// stress at the chord's end is taken tangent to the perimeter with that average as its
    /// component along V, so τt = avg / (t's component along V). At the surface this is
    /// τ = V·ro²·|sin|/(3I), 4V/(3A) on the neutral axis.
    ///
    /// Tube: the wall is cut radially at φ; the part of the section between the cut and its
    /// mirror carries Q = ⅔(ro³ − ri³)·sin φ, shared by the two cuts of length ro − ri:
    /// τxθ = V·(ro³ − ri³)·sin φ / (3·I·(ro − ri)), uniform through the wall (the average on
    /// the radial cut, as thin-wall shear-flow theory takes it; 2V/A on the neutral axis of a
    /// thin tube, and the same as the chord average there for any tube). The chord construction
    /// is not used for a tube: on the bore, where the tangent turns perpendicular to V, it
    /// divides a finite average by a vanishing component and grows without bound.
    fn transverse_shear(&self, loads: &Loads, s: f64, c: f64, y: f64, z: f64) -> f64 {
        let pr = self.properties();
        if self.ri > 0.0 {
            let (o3, i3) = (self.ro * self.ro * self.ro, self.ri * self.ri * self.ri);
            let k = (o3 - i3) / (3.0 * (self.ro - self.ri));
            return k * (-loads.vy * s / pr.iz + loads.vz * c / pr.iy);
        }
        let along = |avg: f64, t_comp: f64| {
            if t_comp.abs() < 1e-12 {
                0.0
            } else {
                avg / t_comp
            }
        };
        along(loads.vy * self.q_over_t_solid(y) / pr.iz, -s)
            + along(loads.vz * self.q_over_t_solid(z) / pr.iy, c)
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
        let tau = loads.t * r / pr.jt + self.transverse_shear(loads, s, c, y, z);
        let (radial, hoop, axial) = self.pressure_stress(p, r)?;
        StressTensor::new(sx + axial, hoop, radial, k.shear * tau, 0.0, 0.0)
            .map_err(|_| SectionError::Load("the loads (overflow)"))
    }
}
