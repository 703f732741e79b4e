//! A history of plane stress states judged plane by plane: the normal stress on planes through
//! the point whose normals lie in the x–y plane, every few degrees, each history counted by
//! rainflow ([`crate::rainflow`]) and summed by Miner's rule ([`crate::damage`]); the plane with
//! the most damage governs.
//!
//! Formula (Cauchy's formula for the normal n = (cos θ, sin θ, 0), θ from x towards y; e.g.
//! Socie & Marquis, *Multiaxial Fatigue*, ch. 5, from memory):
//! σn(θ) = σx·cos²θ + σy·sin²θ + 2·τxy·sin θ·cos θ. Planes θ and θ + 180° are the same plane,
//! so θ runs over [0°, 180°).
//!
//! Limits, stated with every result: only the normal stress on each plane is counted (a
//! normal-stress critical-plane method; shear-driven cracking is not judged), only planes
//! perpendicular to the x–y plane (a free surface in x–y), and Miner's rule on each plane.

use alloc::vec::Vec;

use crate::damage::{HistoryLife, Miner};
use crate::fmath;
use crate::mean_stress::MeanStress;
use crate::rainflow::{count, HistoryError};
use crate::sn_curve::SnLine;

/// A plane's damage from its normal-stress history.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlaneDamage {
    /// The plane's normal angle from x towards y, radians, in [0, π).
    pub theta: f64,
    /// Miner's sum over the plane's counted cycles.
    pub damage: f64,
    /// The life of the history on this plane.
    pub life: HistoryLife,
}

/// The normal stress on the plane at `theta` (radians) of each state (σx, σy, τxy), into `out`.
pub fn normal_history(states: &[[f64; 3]], theta: f64, out: &mut Vec<f64>) {
    let (s, c) = (fmath::sin(theta), fmath::cos(theta));
    let (cc, ss, sc2) = (c * c, s * s, 2.0 * s * c);
    out.clear();
    out.extend(
        states
            .iter()
            .map(|[sx, sy, txy]| sx * cc + sy * ss + txy * sc2),
    );
}

/// Every plane every `step_deg` degrees from 0 to 180 (at least 1°), with its damage.
///
/// # Errors
/// [`HistoryError`] when a plane's history does not count (a non-finite value).
pub fn scan(
    states: &[[f64; 3]],
    step_deg: f64,
    mean_stress: MeanStress,
    line: &SnLine,
    sut: f64,
) -> Result<Vec<PlaneDamage>, HistoryError> {
    let step = if step_deg.is_finite() {
        step_deg.max(1.0)
    } else {
        2.0
    };
    // Truncation: the count of whole steps in 180°.
    #[allow(clippy::cast_possible_truncation, clippy::cast_sign_loss)]
    let planes = fmath::ceil(180.0 / step - 1e-9) as usize;
    let mut history = Vec::with_capacity(states.len());
    let mut out = Vec::with_capacity(planes);
    for k in 0..planes {
        let theta = (k as f64 * step).to_radians();
        normal_history(states, theta, &mut history);
        let cycles = count(&history)?;
        let m = Miner::sum(&cycles, mean_stress, line, sut);
        out.push(PlaneDamage {
            theta,
            damage: m.total,
            life: m.life(),
        });
    }
    Ok(out)
}

/// The plane that governs: a plane without a life from Miner's rule first, else the most
/// damage; the smaller angle on a tie.
#[must_use]
pub fn governing(planes: &[PlaneDamage]) -> Option<&PlaneDamage> {
    // A plane is worse when it has no life and the other has, or on equal footing more damage.
    let worse = |p: &PlaneDamage, than: &PlaneDamage| {
        let (a, b) = (
            p.life == HistoryLife::NotGiven,
            than.life == HistoryLife::NotGiven,
        );
        (a && !b) || (a == b && p.damage > than.damage)
    };
    planes
        .iter()
        .fold(None, |best: Option<&PlaneDamage>, p| match best {
            Some(b) if !worse(p, b) => Some(b),
            _ => Some(p),
        })
}

#[cfg(test)]
mod tests {
    use super::*;
    use core::f64::consts::PI;

    #[test]
    fn uniaxial_cycling_governs_on_its_own_plane() {
        // σx cycling ±300 with τxy = 0: the plane θ = 0 sees the full range, θ = 90° nothing.
        let states: Vec<[f64; 3]> = (0..40)
            .map(|i| [if i % 2 == 0 { 300.0 } else { -300.0 }, 0.0, 0.0])
            .collect();
        let line = SnLine::through_strengths(0.9, 600.0, 200.0).unwrap();
        let planes = scan(&states, 2.0, MeanStress::Goodman, &line, 600.0).unwrap();
        assert_eq!(planes.len(), 90);
        let g = governing(&planes).unwrap();
        assert_eq!(g.theta, 0.0);
        assert_eq!(planes[45].damage, 0.0); // θ = 90°
    }

    #[test]
    fn pure_shear_governs_at_45_degrees() {
        let states: Vec<[f64; 3]> = (0..40)
            .map(|i| [0.0, 0.0, if i % 2 == 0 { 250.0 } else { -250.0 }])
            .collect();
        let line = SnLine::through_strengths(0.9, 600.0, 200.0).unwrap();
        let planes = scan(&states, 1.0, MeanStress::Goodman, &line, 600.0).unwrap();
        assert_eq!(planes.len(), 180);
        let g = governing(&planes).unwrap();
        // θ = 45° and 135° see ±250 equally; the smaller angle is reported.
        assert!(
            (g.theta - PI / 4.0).abs() < 1e-12,
            "{}",
            g.theta.to_degrees()
        );
        let mut h = Vec::new();
        normal_history(&states, PI / 4.0, &mut h);
        assert!((h[0] - 250.0).abs() < 1e-9);
    }
}
