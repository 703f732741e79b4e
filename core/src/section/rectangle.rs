//! A solid rectangle: properties, Saint-Venant's exact torsion by the series solution of
//! Prandtl's stress function, positions along the perimeter, and the stress tensor at a point of
//! a face, in point axes. Formulas and sources in the parent module's docs.

use super::{positive, Concentration, Face, Loads, Location, Properties, SectionError};
use crate::fmath;
use crate::tensor::StressTensor;
use alloc::vec::Vec;
use core::f64::consts::PI;

/// A solid rectangle: depth `h` along y, width `b` along z.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rectangle {
    pub(super) h: f64,
    pub(super) b: f64,
}

/// Σ_{n odd} cosh(nπv/2A) / (n²·cosh(nπC/2A)) for |v| ≤ C, summed until the terms vanish;
/// exactly π²/8 at |v| = C.
fn face_series(v: f64, a: f64, c: f64) -> f64 {
    let v = v.abs().min(c);
    if v == c {
        return PI * PI / 8.0;
    }
    let mut sum = 0.0;
    let mut n = 1.0_f64;
    while n < 400_001.0 {
        let k = n * PI / (2.0 * a);
        // cosh(kv)/cosh(kc) = e^{k(v−c)}·(1 + e^{−2kv})/(1 + e^{−2kc}), overflow-free.
        let ratio = fmath::exp(k * (v - c)) * (1.0 + fmath::exp(-2.0 * k * v))
            / (1.0 + fmath::exp(-2.0 * k * c));
        let term = ratio / (n * n);
        sum += term;
        if term < 1e-17 * sum {
            break;
        }
        n += 2.0;
    }
    sum
}

impl Rectangle {
    /// The perimeter positions a scan samples: `n` uniform ones plus every corner and mid-face,
    /// in order.
    pub(super) fn scan_positions(&self, n: usize) -> Vec<f64> {
        let len = self.perimeter();
        let mut positions: Vec<f64> = (0..n).map(|i| len * i as f64 / n as f64).collect();
        let (h, b) = (self.h, self.b);
        positions.extend([
            0.0,
            0.5 * b,
            b,
            b + 0.5 * h,
            b + h,
            1.5 * b + h,
            2.0 * b + h,
            2.0 * b + 1.5 * h,
        ]);
        positions.sort_by(f64::total_cmp);
        positions.dedup_by(|a, b| (*a - *b).abs() < 1e-12 * len);
        positions
    }

    /// A rectangle of depth `h` (along y) and width `b` (along z).
    ///
    /// # Errors
    /// [`SectionError::Dimension`] when a side is not positive.
    pub fn new(h: f64, b: f64) -> Result<Self, SectionError> {
        Ok(Self {
            h: positive(h, "depth h")?,
            b: positive(b, "width b")?,
        })
    }

    /// Depth along y.
    #[must_use]
    pub fn depth(&self) -> f64 {
        self.h
    }

    /// Width along z.
    #[must_use]
    pub fn width(&self) -> f64 {
        self.b
    }

    /// A = bh, Iz = bh³/12, Iy = hb³/12, and Saint-Venant's torsion constant Jt (module docs).
    #[must_use]
    pub fn properties(&self) -> Properties {
        let (h, b) = (self.h, self.b);
        let (a, c) = (0.5 * h.min(b), 0.5 * h.max(b));
        let mut sum = 0.0;
        let mut n = 1.0_f64;
        while n < 2000.0 {
            sum += fmath::tanh(n * PI * c / (2.0 * a)) / (n * n * n * n * n);
            n += 2.0;
        }
        let pi5 = PI * PI * PI * PI * PI;
        Properties {
            area: b * h,
            iy: h * b * b * b / 12.0,
            iz: b * h * h * h / 12.0,
            jt: 16.0 / 3.0 * a * a * a * c * (1.0 - 192.0 / pi5 * (a / c) * sum),
        }
    }

    /// Tangential torsion shear per unit torque at `along` on `face`, positive in the sense of
    /// increasing φ for positive T.
    fn torsion_per_torque(&self, face: Face, along: f64, jt: f64) -> f64 {
        // The face u = ±A: A is the half side across it, C the half side along it.
        let (a, c) = match face {
            Face::PosY | Face::NegY => (0.5 * self.h, 0.5 * self.b),
            Face::PosZ | Face::NegZ => (0.5 * self.b, 0.5 * self.h),
        };
        let tau = a * (2.0 - 16.0 / (PI * PI) * face_series(along, a, c));
        tau.max(0.0) / jt
    }

    /// Perimeter length 2(h + b).
    #[must_use]
    pub fn perimeter(&self) -> f64 {
        2.0 * (self.h + self.b)
    }

    /// The location at perimeter length `s` from the corner (h/2, −b/2), increasing φ.
    #[must_use]
    pub fn location_at(&self, s: f64) -> Location {
        let (h, b) = (self.h, self.b);
        let s = fmath::wrap(s, self.perimeter());
        let (face, along) = if s <= b {
            (Face::PosY, -0.5 * b + s)
        } else if s <= b + h {
            (Face::PosZ, 0.5 * h - (s - b))
        } else if s <= 2.0 * b + h {
            (Face::NegY, 0.5 * b - (s - b - h))
        } else {
            (Face::NegZ, -0.5 * h + (s - 2.0 * b - h))
        };
        Location::Rectangle { face, along }
    }

    /// The perimeter length of a location (inverse of [`location_at`](Self::location_at)).
    #[must_use]
    pub fn position_of(&self, face: Face, along: f64) -> f64 {
        let (h, b) = (self.h, self.b);
        match face {
            Face::PosY => along + 0.5 * b,
            Face::PosZ => b + (0.5 * h - along),
            Face::NegY => b + h + (0.5 * b - along),
            Face::NegZ => 2.0 * b + h + (along + 0.5 * h),
        }
    }

    pub(super) fn stress_at(
        &self,
        loads: &Loads,
        k: Concentration,
        face: Face,
        along: f64,
    ) -> Result<StressTensor, SectionError> {
        let (h, b) = (self.h, self.b);
        let half = match face {
            Face::PosY | Face::NegY => 0.5 * b,
            Face::PosZ | Face::NegZ => 0.5 * h,
        };
        if !(along.is_finite() && along.abs() <= half * (1.0 + 1e-9)) {
            return Err(SectionError::OffSection(match face {
                Face::PosY | Face::NegY => "z",
                Face::PosZ | Face::NegZ => "y",
            }));
        }
        let along = along.clamp(-half, half);
        // Point (y, z) and perimeter tangent (ty, tz) in the sense of increasing φ.
        let (y, z, ty, tz) = match face {
            Face::PosY => (0.5 * h, along, 0.0, 1.0),
            Face::PosZ => (along, 0.5 * b, -1.0, 0.0),
            Face::NegY => (-0.5 * h, along, 0.0, -1.0),
            Face::NegZ => (along, -0.5 * b, 1.0, 0.0),
        };
        let p = self.properties();
        let sx = k.normal * (loads.n / p.area + loads.my * z / p.iy - loads.mz * y / p.iz);
        // Jourawski: τxy = Vy·Q(y)/(Iz·b), Q(y) = (b/2)(h²/4 − y²); likewise τxz.
        let txy = loads.vy * 0.5 * (0.25 * h * h - y * y) / p.iz;
        let txz = loads.vz * 0.5 * (0.25 * b * b - z * z) / p.iy;
        let tau = loads.t * self.torsion_per_torque(face, along, p.jt) + txy * ty + txz * tz;
        StressTensor::new(sx, 0.0, 0.0, k.shear * tau, 0.0, 0.0)
            .map_err(|_| SectionError::Load("the loads (overflow)"))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::section::{Pressure, Section};

    #[test]
    fn rectangle_torsion_vanishes_at_corners_and_peaks_mid_long_side() {
        let r = Rectangle::new(20.0, 60.0).unwrap(); // long faces are ±y (width 60 along z)
        let sec = Section::Rectangle(r);
        let l = Loads {
            t: 1e6,
            ..Loads::default()
        };
        let tau = |face, along| {
            sec.stress_at(
                &l,
                &Pressure::NONE,
                Concentration::default(),
                Location::Rectangle { face, along },
            )
            .unwrap()
            .txy()
        };
        assert_eq!(tau(Face::PosY, 30.0), 0.0);
        assert!(tau(Face::PosZ, 10.0).abs() < 1e-12);
        let mid_long = tau(Face::PosY, 0.0);
        assert!(mid_long > tau(Face::PosZ, 0.0) && mid_long > tau(Face::PosY, 20.0));
        assert!((tau(Face::NegY, 0.0) - mid_long).abs() < 1e-9 * mid_long);
        assert_eq!(
            sec.stress_at(
                &l,
                &Pressure::NONE,
                Concentration::default(),
                Location::Rectangle {
                    face: Face::PosY,
                    along: 31.0
                }
            ),
            Err(SectionError::OffSection("z"))
        );
    }

    #[test]
    fn perimeter_positions_round_trip() {
        let r = Rectangle::new(30.0, 50.0).unwrap();
        for i in 0..32 {
            let s = r.perimeter() * f64::from(i) / 32.0;
            let Location::Rectangle { face, along } = r.location_at(s) else {
                panic!()
            };
            assert!((r.position_of(face, along) - s).abs() < 1e-9, "{s}");
        }
    }
}
