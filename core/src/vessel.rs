//! Pressure vessels: thin-walled cylinder and sphere, and the thick-walled cylinder by Lamé's
//! equations.
//!
//! Coordinates: r radial, θ hoop, z axial; tension positive, pressures positive inward-acting
//! on their surface (internal pressure pushes the wall out).
//! - Thin cylinder (Barlow; e.g. Gere & Goodno, *Mechanics of Materials*, §8.3, from memory):
//!   σθ = p·r/t, σz = p·r/(2t) with closed ends (0 open), σr from −p (inner) to 0 (outer).
//! - Thin sphere (same source): σθ = σφ = p·r/(2t).
//! - Thick cylinder, Lamé 1852 (e.g. Timoshenko & Goodier, *Theory of Elasticity*, §28, from
//!   memory), inner radius a, outer b, pressures pi, po:
//!   σr = A − B/r²,  σθ = A + B/r²,  A = (pi·a² − po·b²)/(b² − a²),  B = (pi − po)·a²·b²/(b² − a²),
//!   σz = A with closed ends (plane sections, end load carried by the wall), 0 with open ends,
//!   and σz = ν(σr + σθ) = 2νA in plane strain (εz = 0: a long cylinder restrained axially,
//!   same source).
//!
//! A wall thicker than about a tenth of the radius makes the thin-wall formulas unreliable
//! (common practice); [`thin_wall_warning`] says so.

use crate::error::StressError;
use crate::tensor::StressTensor;
use core::fmt;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Whether the ends of a cylinder carry the pressure's axial load through the wall.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum Ends {
    /// Capped ends: σz = A (Lamé) or p·r/(2t) (thin).
    Closed,
    /// Open ends (e.g. a pipe with sliding seals): σz = 0.
    Open,
    /// Plane strain (axially restrained, εz = 0): σz = ν(σr + σθ). Lamé cylinders only.
    PlaneStrain,
}

/// Why vessel geometry was refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum VesselError {
    /// A dimension is not a positive finite number; names it.
    Dimension(&'static str),
    /// The inner radius is not smaller than the outer.
    InnerNotSmaller,
    /// The radius asked for lies outside the wall.
    OutsideWall,
    /// A pressure is not finite.
    Pressure(&'static str),
    /// A thin vessel's wall is not thinner than its radius.
    WallTooThick,
}

impl fmt::Display for VesselError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::Dimension(n) => write!(f, "{n} must be a positive number"),
            Self::InnerNotSmaller => {
                write!(f, "the inner radius must be smaller than the outer radius")
            }
            Self::OutsideWall => write!(
                f,
                "the point must lie in the wall, between the inner and outer radius"
            ),
            Self::Pressure(n) => write!(f, "{n} must be a finite number"),
            Self::WallTooThick => write!(
                f,
                "the wall thickness must be smaller than the radius (use the tube section for thick walls)"
            ),
        }
    }
}

/// Stresses at a point of a vessel wall, in the vessel's unit of pressure.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct WallStress {
    /// Radial stress σr.
    pub radial: f64,
    /// Hoop (circumferential) stress σθ.
    pub hoop: f64,
    /// Axial (or, for a sphere, the second tangential) stress σz.
    pub axial: f64,
}

impl WallStress {
    /// The tensor in point axes: x axial, y hoop, z radial (the axes of
    /// [`crate::section`]'s point frame, so a vessel and a tube read alike). No shear.
    ///
    /// # Errors
    /// [`StressError::NonFinite`] if a stress overflowed.
    pub fn tensor(&self) -> Result<StressTensor, StressError> {
        StressTensor::new(self.axial, self.hoop, self.radial, 0.0, 0.0, 0.0)
    }
}

fn positive(v: f64, name: &'static str) -> Result<f64, VesselError> {
    if v.is_finite() && v > 0.0 {
        Ok(v)
    } else {
        Err(VesselError::Dimension(name))
    }
}

fn thinner(r: f64, t: f64) -> Result<(), VesselError> {
    if t < r {
        Ok(())
    } else {
        Err(VesselError::WallTooThick)
    }
}

fn finite(v: f64, name: &'static str) -> Result<f64, VesselError> {
    if v.is_finite() {
        Ok(v)
    } else {
        Err(VesselError::Pressure(name))
    }
}

/// Thin cylinder of mean radius `r` and wall `t` under internal pressure `p`, at the outer
/// surface (σr = 0) or the inner surface (σr = −p).
///
/// # Errors
/// [`VesselError`] for a non-positive dimension, a wall not thinner than the radius, or a
/// non-finite pressure.
pub fn thin_cylinder(
    p: f64,
    r: f64,
    t: f64,
    ends: Ends,
    inner_surface: bool,
) -> Result<WallStress, VesselError> {
    let (p, r, t) = (
        finite(p, "pressure")?,
        positive(r, "radius")?,
        positive(t, "wall thickness")?,
    );
    thinner(r, t)?;
    Ok(WallStress {
        radial: if inner_surface { -p } else { 0.0 },
        hoop: p * r / t,
        axial: if ends == Ends::Closed {
            p * r / (2.0 * t)
        } else {
            0.0
        },
    })
}

/// Thin sphere of mean radius `r` and wall `t` under internal pressure `p`.
///
/// # Errors
/// [`VesselError`] for a non-positive dimension, a wall not thinner than the radius, or a
/// non-finite pressure.
pub fn thin_sphere(p: f64, r: f64, t: f64, inner_surface: bool) -> Result<WallStress, VesselError> {
    let (p, r, t) = (
        finite(p, "pressure")?,
        positive(r, "radius")?,
        positive(t, "wall thickness")?,
    );
    thinner(r, t)?;
    let s = p * r / (2.0 * t);
    Ok(WallStress {
        radial: if inner_surface { -p } else { 0.0 },
        hoop: s,
        axial: s,
    })
}

/// Lamé's thick cylinder at radius `r` (a ≤ r ≤ b); `nu` (Poisson's ratio) is used only with
/// [`Ends::PlaneStrain`].
///
/// # Errors
/// [`VesselError`] for bad dimensions, a radius outside the wall, or non-finite pressures.
pub fn lame(
    pi: f64,
    po: f64,
    a: f64,
    b: f64,
    r: f64,
    ends: Ends,
    nu: f64,
) -> Result<WallStress, VesselError> {
    let (pi, po) = (
        finite(pi, "internal pressure")?,
        finite(po, "external pressure")?,
    );
    let (a, b) = (positive(a, "inner radius")?, positive(b, "outer radius")?);
    if a >= b {
        return Err(VesselError::InnerNotSmaller);
    }
    if !(r.is_finite() && r >= a * (1.0 - 1e-12) && r <= b * (1.0 + 1e-12)) {
        return Err(VesselError::OutsideWall);
    }
    let d = b * b - a * a;
    let big_a = (pi * a * a - po * b * b) / d;
    let big_b = (pi - po) * a * a * b * b / d;
    Ok(WallStress {
        radial: big_a - big_b / (r * r),
        hoop: big_a + big_b / (r * r),
        axial: match ends {
            Ends::Closed => big_a,
            Ends::Open => 0.0,
            Ends::PlaneStrain => 2.0 * nu * big_a,
        },
    })
}

/// The common-practice warning for thin-wall formulas: wall thicker than a tenth of the radius.
#[must_use]
pub fn thin_wall_warning(r: f64, t: f64) -> Option<&'static str> {
    (t > 0.1 * r).then_some(
        "the wall is thicker than about a tenth of the radius: thin-wall formulas lose accuracy there (common practice); use the thick-walled (Lamé) cylinder",
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    #[test]
    fn thin_formulas() {
        let w = thin_cylinder(2.0, 500.0, 10.0, Ends::Closed, false).unwrap();
        assert_eq!((w.radial, w.hoop, w.axial), (0.0, 100.0, 50.0));
        assert_eq!(
            thin_cylinder(2.0, 500.0, 10.0, Ends::Open, true)
                .unwrap()
                .axial,
            0.0
        );
        assert_eq!(thin_sphere(3.0, 400.0, 8.0, false).unwrap().hoop, 75.0);
        assert_eq!(
            thin_cylinder(1.0, 0.0, 1.0, Ends::Open, false),
            Err(VesselError::Dimension("radius"))
        );
        assert!(
            thin_wall_warning(100.0, 12.0).is_some() && thin_wall_warning(100.0, 5.0).is_none()
        );
        assert_eq!(
            thin_sphere(1.0, 10.0, 10.0, false),
            Err(VesselError::WallTooThick)
        );
    }

    #[test]
    fn lame_refuses_bad_geometry() {
        assert_eq!(
            lame(1.0, 0.0, 50.0, 40.0, 45.0, Ends::Open, 0.3),
            Err(VesselError::InnerNotSmaller)
        );
        assert_eq!(
            lame(1.0, 0.0, 40.0, 50.0, 60.0, Ends::Open, 0.3),
            Err(VesselError::OutsideWall)
        );
        assert_eq!(
            lame(1.0, 0.0, -40.0, 50.0, 45.0, Ends::Open, 0.3),
            Err(VesselError::Dimension("inner radius"))
        );
        assert_eq!(
            lame(f64::NAN, 0.0, 40.0, 50.0, 45.0, Ends::Open, 0.3),
            Err(VesselError::Pressure("internal pressure"))
        );
    }

    #[test]
    fn lame_internal_pressure_peak_hoop_stress() {
        // Standard result (Timoshenko & Goodier §28, from memory): with internal pressure only, the
        // largest hoop stress is at the bore, σθ(a) = p(b² + a²)/(b² − a²).
        let (p, a, b) = (30.0, 40.0, 60.0);
        let w = lame(p, 0.0, a, b, a, Ends::Open, 0.3).unwrap();
        assert!((w.hoop - p * (b * b + a * a) / (b * b - a * a)).abs() < 1e-12);
        assert!((w.radial + p).abs() < 1e-12);
    }

    proptest! {
        #[test]
        fn lame_meets_its_boundary_conditions_and_equilibrium(
            pi in -100.0..100.0f64, po in -100.0..100.0f64, a in 1.0..100.0f64, k in 1.01..5.0f64, s in 0.0..1.0f64,
        ) {
            let b = a * k;
            let tol = 1e-9 * (1.0 + pi.abs() + po.abs()) * k * k;
            prop_assert!((lame(pi, po, a, b, a, Ends::Open, 0.3).unwrap().radial + pi).abs() < tol);
            prop_assert!((lame(pi, po, a, b, b, Ends::Open, 0.3).unwrap().radial + po).abs() < tol);
            // Radial equilibrium dσr/dr = (σθ − σr)/r, by a central difference.
            let r = a + s * (b - a);
            let h = 1e-4 * (b - a);
            let (r0, r1) = ((r - h).max(a), (r + h).min(b));
            let d = (lame(pi, po, a, b, r1, Ends::Open, 0.3).unwrap().radial - lame(pi, po, a, b, r0, Ends::Open, 0.3).unwrap().radial) / (r1 - r0);
            let w = lame(pi, po, a, b, r, Ends::Closed, 0.3).unwrap();
            prop_assert!((d - (w.hoop - w.radial) / r).abs() < 1e-5 * (1.0 + pi.abs() + po.abs()) * k * k / a);
            // σr + σθ is the same everywhere (2A), and equals 2σz for closed ends.
            prop_assert!((w.radial + w.hoop - 2.0 * w.axial).abs() < tol);
        }

        #[test]
        fn plane_strain_ends_give_nu_times_the_in_plane_sum(pi in 0.0..100.0f64, po in 0.0..100.0f64, a in 1.0..50.0f64, w in 0.5..50.0f64, f in 0.0..1.0f64, nu in 0.0..0.49f64) {
            // εz = 0 in Hooke's law: σz = ν(σr + σθ) (Timoshenko & Goodier §28, from memory).
            let b = a + w;
            let r = a + f * w;
            let ps = lame(pi, po, a, b, r, Ends::PlaneStrain, nu).unwrap();
            let tol = 1e-12 * (pi + po + 1.0) * (b * b / (w * a)).max(1.0);
            prop_assert!((ps.axial - nu * (ps.radial + ps.hoop)).abs() < tol);
            // and εz computed by Hooke's law from the three stresses is zero.
            let ez = ps.axial - nu * (ps.radial + ps.hoop);
            prop_assert!(ez.abs() < tol);
        }

        #[test]
        fn lame_tends_to_the_thin_wall_hoop_stress(p in 0.1..50.0f64, r in 10.0..1000.0f64) {
            let t = r * 1e-3;
            let thick = lame(p, 0.0, r - t / 2.0, r + t / 2.0, r, Ends::Closed, 0.3).unwrap();
            let thin = thin_cylinder(p, r, t, Ends::Closed, false).unwrap();
            prop_assert!((thick.hoop - thin.hoop).abs() < 1e-3 * thin.hoop);
            prop_assert!((thick.axial - thin.axial).abs() < 1e-3 * thin.axial);
        }
    }
}
