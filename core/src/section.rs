//! Prismatic sections under combined loads: solid round, tube and solid rectangle. Section
//! properties, the stress tensor at a chosen point, and a scan for the critical point.
//!
//! **Section axes:** x along the member (the outward normal of the cut face), y and z in the
//! section, right-handed. Loads act on the +x face, positive by the right-hand rule: axial force
//! N (tension +), bending moments My and Mz, torque T about x, shear forces Vy and Vz. A round
//! section's point at perimeter angle φ and radius r is (y, z) = r·(cos φ, sin φ); φ turns from +y
//! towards +z. A rectangle has depth h along y and width b along z.
//!
//! **Point axes** (the tensor returned): x along the member; y along the perimeter in the sense
//! of increasing φ (from +y towards +z); z = x × y, pointing into the section (towards the axis
//! of a round section). At a free outer surface σz = 0, so the element is the one a strain gauge
//! sees, with y the hoop direction of a round section.
//!
//! **Formulas** (elementary beam theory; e.g. Gere & Goodno, *Mechanics of Materials*, ch. 3, 5,
//! 8; Timoshenko & Goodier, *Theory of Elasticity*, §28, §109; all from memory):
//! - σx = Kt·(N/A + My·z/Iy − Mz·y/Iz)
//! - round torsion: τ = Kts·T·r/J along +y (point axes), J = π(ro⁴ − ri⁴)/2
//! - rectangle torsion (Saint-Venant, Prandtl stress function, series solution): on the face
//!   u = ±A of the rectangle |u| ≤ A, |v| ≤ C, the tangential shear is
//!   τ = (T/Jt)·A·[2 − (16/π²)·Σ_{n odd} cosh(nπv/2A) / (n²·cosh(nπC/2A))], with the torsion
//!   constant Jt = (16/3)·a³c·[1 − (192/π⁵)(a/c)·Σ_{n odd} tanh(nπc/2a)/n⁵], a ≤ c the half sides;
//!   zero at the corners
//! - transverse shear (Jourawski): the average over the chord through the point,
//!   τ = V·Q/(I·t), Q the first moment of the area beyond the chord and t its width. On a
//!   rectangle it is exact in direction (along the face). On a round section the stress at the
//!   chord's end is taken tangent to the perimeter with that average as its component along V
//!   (the usual approximate theory), so the free surface stays free of shear
//! - pressure (round sections only): Lamé's σr and σθ through the wall ([`crate::vessel::lame`];
//!   a solid shaft under external pressure p has σr = σθ = −p), and the end-load σx = A for
//!   closed ends. Kt and Kts are not applied to pressure stresses.
//!
//! Units: core works in any consistent set; the page passes metres, newtons and pascals.

use crate::equivalent::Equivalent;
use crate::fmath;
use crate::principal::principal_values;
use crate::tensor::StressTensor;
use crate::vessel::{self, Ends};
use alloc::vec::Vec;
use core::f64::consts::PI;
use core::fmt;
#[cfg(feature = "serde")]
use serde::{Deserialize, Serialize};

/// Why a section, its loads or the point were refused.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum SectionError {
    /// A dimension is not a positive finite number; names it.
    Dimension(&'static str),
    /// The bore is not smaller than the outside diameter.
    InnerNotSmaller,
    /// A load or factor is not finite, or a concentration factor is below 1; names it.
    Load(&'static str),
    /// A bore quantity (inner surface, internal pressure) was asked of a solid section.
    NoBore,
    /// The point is not on the section; names the coordinate.
    OffSection(&'static str),
    /// Pressure on a section that does not take it (a rectangle).
    PressureNotAllowed,
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
            Self::NoBore => write!(
                f,
                "a solid shaft has no bore: no inner surface and no internal pressure"
            ),
            Self::OffSection(n) => write!(f, "{n} puts the point outside the section"),
            Self::PressureNotAllowed => {
                write!(
                    f,
                    "pressure is only taken by round sections (shafts and tubes)"
                )
            }
        }
    }
}

/// A solid round (inner radius 0) or a tube.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Round {
    ro: f64,
    ri: f64,
}

/// A solid rectangle: depth `h` along y, width `b` along z.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rectangle {
    h: f64,
    b: f64,
}

/// The sections this module knows.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Section {
    /// Solid shaft or tube.
    Round(Round),
    /// Solid rectangle.
    Rectangle(Rectangle),
}

/// Area, second moments and torsion constant of a section.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Properties {
    /// Area A.
    pub area: f64,
    /// Second moment about y, Iy (bending by My).
    pub iy: f64,
    /// Second moment about z, Iz (bending by Mz).
    pub iz: f64,
    /// Torsion constant Jt (T = G·θ′·Jt); the polar moment J for a round section.
    pub jt: f64,
}

/// The loads on the section (see module docs for signs).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
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

/// Pressure on a round section's surfaces, positive pushing on the surface.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub struct Pressure {
    /// Pressure in the bore (tubes only).
    pub inner: f64,
    /// Pressure on the outside (e.g. a shrink fit).
    pub outer: f64,
    /// Whether the pressure's end load is carried by the wall (or the member is in plane strain).
    pub ends: Ends,
    /// Poisson's ratio, used only with [`Ends::PlaneStrain`] (σz = ν(σr + σθ)).
    pub nu: f64,
}

impl Pressure {
    /// No pressure.
    pub const NONE: Pressure = Pressure {
        inner: 0.0,
        outer: 0.0,
        ends: Ends::Open,
        nu: 0.3,
    };

    fn is_none(&self) -> bool {
        self.inner == 0.0 && self.outer == 0.0
    }
}

/// Stress concentration factors applied at the point.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
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

/// A face of a rectangle, named by its outward normal.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum Face {
    /// The face y = +h/2.
    PosY,
    /// The face z = +b/2.
    PosZ,
    /// The face y = −h/2.
    NegY,
    /// The face z = −b/2.
    NegZ,
}

impl Face {
    /// The faces in the order the perimeter runs (increasing φ).
    pub const ALL: [Face; 4] = [Face::PosY, Face::PosZ, Face::NegY, Face::NegZ];
}

/// Where on a section a point is.
#[derive(Debug, Clone, Copy, PartialEq)]
#[cfg_attr(feature = "serde", derive(Serialize, Deserialize))]
pub enum Location {
    /// Round section: perimeter angle φ (radians, from +y towards +z) and radius r.
    Round {
        /// φ, radians.
        phi: f64,
        /// r, in the section's length unit.
        r: f64,
    },
    /// Rectangle: a face and the coordinate along it (z on the ±y faces, y on the ±z faces).
    Rectangle {
        /// The face.
        face: Face,
        /// z (on ±y faces) or y (on ±z faces).
        along: f64,
    },
}

/// One point of a scan curve.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Sample {
    /// Position along the curve: φ in radians (round) or the perimeter length s (rectangle).
    pub position: f64,
    /// von Mises stress there.
    pub von_mises: f64,
    /// Largest principal stress σ1 there.
    pub sigma1: f64,
}

/// Which line of points a scan curve follows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Path {
    /// The outer surface of a round section, against φ.
    Outer,
    /// The bore of a tube, against φ.
    Bore,
    /// The perimeter of a rectangle, against s measured from the corner (y, z) = (h/2, −b/2)
    /// in the sense of increasing φ.
    Perimeter,
}

/// Samples along one path.
#[derive(Debug, Clone, PartialEq)]
pub struct Curve {
    /// The path.
    pub path: Path,
    /// Samples in order of position.
    pub samples: Vec<Sample>,
}

/// A critical point found by a scan.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Critical {
    /// Where it is.
    pub at: Location,
    /// Its position on the scan's plot axis (φ in radians, or s).
    pub position: f64,
    /// The value there.
    pub value: f64,
}

/// What [`Section::scan`] finds.
#[derive(Debug, Clone, PartialEq)]
pub struct Scan {
    /// The sampled curves (outer surface and bore, or the perimeter).
    pub curves: Vec<Curve>,
    /// The point of highest von Mises stress, refined between samples (and through the wall of a
    /// tube).
    pub max_von_mises: Critical,
    /// The point of highest principal stress σ1, refined likewise.
    pub max_principal: Critical,
}

fn positive(v: f64, name: &'static str) -> Result<f64, SectionError> {
    if v.is_finite() && v > 0.0 {
        Ok(v)
    } else {
        Err(SectionError::Dimension(name))
    }
}

impl Round {
    /// The radii a scan samples: the outer surface, and for a tube nine radii through the wall
    /// from the outside in.
    fn scan_radii(&self) -> Vec<f64> {
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

    fn stress_at(
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
    fn scan_positions(&self, n: usize) -> Vec<f64> {
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

    fn stress_at(
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

fn check_loads(loads: &Loads, k: Concentration, p: &Pressure) -> Result<(), SectionError> {
    for (v, name) in [
        (loads.n, "N"),
        (loads.my, "My"),
        (loads.mz, "Mz"),
        (loads.t, "T"),
        (loads.vy, "Vy"),
        (loads.vz, "Vz"),
        (p.inner, "internal pressure"),
        (p.outer, "external pressure"),
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
    Ok(())
}

/// Golden-section search for the maximum of `f` on [lo, hi]; returns (x, f(x)).
fn golden_max<F>(mut lo: f64, mut hi: f64, f: F) -> Result<(f64, f64), SectionError>
where
    F: Fn(f64) -> Result<f64, SectionError>,
{
    let g = 0.5 * (fmath::sqrt(5.0) - 1.0);
    let (mut c, mut d) = (hi - g * (hi - lo), lo + g * (hi - lo));
    let (mut fc, mut fd) = (f(c)?, f(d)?);
    for _ in 0..80 {
        if fc > fd {
            hi = d;
            d = c;
            fd = fc;
            c = hi - g * (hi - lo);
            fc = f(c)?;
        } else {
            lo = c;
            c = d;
            fc = fd;
            d = lo + g * (hi - lo);
            fd = f(d)?;
        }
    }
    let x = 0.5 * (lo + hi);
    Ok((x, f(x)?))
}

/// von Mises and σ1 of a tensor.
fn measures(s: &StressTensor) -> (f64, f64) {
    (Equivalent::of(s).von_mises, principal_values(s)[0])
}

impl Section {
    /// Area, second moments and torsion constant.
    #[must_use]
    pub fn properties(&self) -> Properties {
        match self {
            Self::Round(r) => r.properties(),
            Self::Rectangle(r) => r.properties(),
        }
    }

    /// The stress tensor in point axes (module docs) at `at`.
    ///
    /// # Errors
    /// [`SectionError`] for non-finite loads, factors below 1, a point off the section, a bore
    /// quantity on a solid shaft, or pressure on a rectangle.
    pub fn stress_at(
        &self,
        loads: &Loads,
        pressure: &Pressure,
        k: Concentration,
        at: Location,
    ) -> Result<StressTensor, SectionError> {
        check_loads(loads, k, pressure)?;
        match (self, at) {
            (Self::Round(s), Location::Round { phi, r }) => s.stress_at(loads, pressure, k, phi, r),
            (Self::Rectangle(s), Location::Rectangle { face, along }) => {
                if !pressure.is_none() {
                    return Err(SectionError::PressureNotAllowed);
                }
                s.stress_at(loads, k, face, along)
            }
            (Self::Round(_), Location::Rectangle { .. }) => Err(SectionError::OffSection("face")),
            (Self::Rectangle(_), Location::Round { .. }) => Err(SectionError::OffSection("φ")),
        }
    }

    /// Samples the perimeter (`samples` points on each path, at least 8) and refines the highest
    /// von Mises and principal stress between samples by golden-section search; a tube is also
    /// scanned through its wall at nine radii and refined in r.
    ///
    /// # Errors
    /// As [`stress_at`](Self::stress_at).
    pub fn scan(
        &self,
        loads: &Loads,
        pressure: &Pressure,
        k: Concentration,
        samples: usize,
    ) -> Result<Scan, SectionError> {
        let n = samples.max(8);
        match self {
            Self::Round(s) => self.scan_round(s, loads, pressure, k, n),
            Self::Rectangle(s) => self.scan_rectangle(s, loads, pressure, k, n),
        }
    }

    /// The point where `rank` is most severe (see [`Rank`]): the same samples as
    /// [`scan`](Self::scan), the best of them by severity with ties to the larger tie-breaker,
    /// then golden-section refinement around it (and through the wall of a tube). The returned
    /// `value` is the severity there.
    ///
    /// This ranks points by the decision being made, e.g. severity = 1/n for a factor of safety
    /// and tie = mean stress, so that of two equally loaded fibres the tensile one governs.
    ///
    /// # Errors
    /// As [`stress_at`](Self::stress_at).
    pub fn governing(
        &self,
        loads: &Loads,
        pressure: &Pressure,
        k: Concentration,
        samples: usize,
        rank: &dyn Fn(&StressTensor) -> Rank,
    ) -> Result<Critical, SectionError> {
        let n = samples.max(8);
        match self {
            Self::Round(s) => self.search_round(s, loads, pressure, k, n, rank),
            Self::Rectangle(s) => self.search_rectangle(s, loads, pressure, k, n, rank),
        }
    }

    fn search_round(
        &self,
        s: &Round,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        n: usize,
        rank: &dyn Fn(&StressTensor) -> Rank,
    ) -> Result<Critical, SectionError> {
        let at = |phi: f64, r: f64| self.stress_at(loads, p, k, Location::Round { phi, r });
        let severity = |phi: f64, r: f64| Ok(rank(&at(phi, r)?).severity_or_least());
        let step = 2.0 * PI / n as f64;
        let radii = s.scan_radii();
        let mut best: Option<(Rank, f64, f64)> = None;
        for &r in &radii {
            for j in 0..n {
                let phi = step * j as f64;
                let here = rank(&at(phi, r)?);
                if best.is_none_or(|(b, _, _)| here.beats(&b)) {
                    best = Some((here, phi, r));
                }
            }
        }
        let (first, mut phi, mut r) = best.unwrap_or((Rank::LEAST, 0.0, s.ro));
        let mut value = first.severity_or_least();
        for _ in 0..3 {
            let (x, v) = golden_max(phi - step, phi + step, |f| severity(f, r))?;
            if v > value {
                (phi, value) = (x, v);
            }
            if radii.len() > 1 {
                let h = (s.ro - s.ri) / 8.0;
                let (lo, hi) = ((r - h).max(s.ri), (r + h).min(s.ro));
                let (x, v) = golden_max(lo, hi, |rr| severity(phi, rr))?;
                if v > value {
                    (r, value) = (x, v);
                }
                // The surfaces themselves are candidates (a maximum is often on one).
                for edge in [s.ri, s.ro] {
                    let v = severity(phi, edge)?;
                    if v > value {
                        (r, value) = (edge, v);
                    }
                }
            }
        }
        let phi = fmath::wrap(phi, 2.0 * PI);
        Ok(Critical {
            at: Location::Round { phi, r },
            position: phi,
            value,
        })
    }

    fn search_rectangle(
        &self,
        s: &Rectangle,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        n: usize,
        rank: &dyn Fn(&StressTensor) -> Rank,
    ) -> Result<Critical, SectionError> {
        let len = s.perimeter();
        let at = |pos: f64| self.stress_at(loads, p, k, s.location_at(pos));
        let mut best: Option<(Rank, f64)> = None;
        for pos in s.scan_positions(n) {
            let here = rank(&at(pos)?);
            if best.is_none_or(|(b, _)| here.beats(&b)) {
                best = Some((here, pos));
            }
        }
        let (first, start) = best.unwrap_or((Rank::LEAST, 0.0));
        let step = len / n as f64;
        let (x, v) = golden_max(start - step, start + step, |pos| {
            Ok(rank(&at(pos)?).severity_or_least())
        })?;
        let (pos, value) = if v > first.severity_or_least() {
            (fmath::wrap(x, len), v)
        } else {
            (fmath::wrap(start, len), first.severity_or_least())
        };
        Ok(Critical {
            at: s.location_at(pos),
            position: pos,
            value,
        })
    }

    fn scan_round(
        &self,
        s: &Round,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        n: usize,
    ) -> Result<Scan, SectionError> {
        let step = 2.0 * PI / n as f64;
        let sample = |phi: f64, r: f64| -> Result<Sample, SectionError> {
            let (von_mises, sigma1) =
                measures(&self.stress_at(loads, p, k, Location::Round { phi, r })?);
            Ok(Sample {
                position: phi,
                von_mises,
                sigma1,
            })
        };
        let path = |r: f64| -> Result<Vec<Sample>, SectionError> {
            (0..n).map(|j| sample(step * j as f64, r)).collect()
        };
        let mut curves = alloc::vec![Curve {
            path: Path::Outer,
            samples: path(s.ro)?,
        }];
        if s.ri > 0.0 {
            curves.push(Curve {
                path: Path::Bore,
                samples: path(s.ri)?,
            });
        }
        let (vm, s1) = rank_by_measures();
        Ok(Scan {
            curves,
            max_von_mises: self.search_round(s, loads, p, k, n, &vm)?,
            max_principal: self.search_round(s, loads, p, k, n, &s1)?,
        })
    }

    fn scan_rectangle(
        &self,
        s: &Rectangle,
        loads: &Loads,
        p: &Pressure,
        k: Concentration,
        n: usize,
    ) -> Result<Scan, SectionError> {
        let len = s.perimeter();
        let mut samples = Vec::new();
        for pos in s.scan_positions(n) {
            let (von_mises, sigma1) = measures(&self.stress_at(loads, p, k, s.location_at(pos))?);
            samples.push(Sample {
                position: pos,
                von_mises,
                sigma1,
            });
        }
        // Close the loop for the plot.
        if let Some(first) = samples.first().copied() {
            samples.push(Sample {
                position: len,
                ..first
            });
        }
        let (vm, s1) = rank_by_measures();
        Ok(Scan {
            max_von_mises: self.search_rectangle(s, loads, p, k, n, &vm)?,
            max_principal: self.search_rectangle(s, loads, p, k, n, &s1)?,
            curves: alloc::vec![Curve {
                path: Path::Perimeter,
                samples,
            }],
        })
    }
}

/// The two rankings of [`Section::scan`]: highest von Mises, highest σ1 (no tie-breaker: the
/// first sample in scan order wins a tie).
fn rank_by_measures() -> (
    impl Fn(&StressTensor) -> Rank,
    impl Fn(&StressTensor) -> Rank,
) {
    (
        |t: &StressTensor| Rank {
            severity: measures(t).0,
            tie: 0.0,
        },
        |t: &StressTensor| Rank {
            severity: measures(t).1,
            tie: 0.0,
        },
    )
}

/// How severe a point is for a decision (larger is worse, e.g. 1/n for a factor of safety n),
/// and a tie-breaker (larger wins among equally severe points, e.g. the mean stress, so that a
/// tensile fibre beats an equally loaded compressive one).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rank {
    /// Larger is worse. NaN counts as the least severe.
    pub severity: f64,
    /// Decides between severities within [`TIE_TOLERANCE`] of each other; larger wins.
    pub tie: f64,
}

/// Relative difference below which two severities are a tie (well above the round-off of
/// stresses at mirror-image points, far below any engineering difference).
pub const TIE_TOLERANCE: f64 = 1e-9;

impl Rank {
    const LEAST: Rank = Rank {
        severity: f64::MIN,
        tie: f64::MIN,
    };

    fn severity_or_least(&self) -> f64 {
        if self.severity.is_nan() {
            f64::MIN
        } else {
            self.severity.clamp(f64::MIN, f64::MAX)
        }
    }

    /// Whether this point is more severe than `other`, ties going to the larger tie-breaker.
    #[must_use]
    pub fn beats(&self, other: &Rank) -> bool {
        let (a, b) = (self.severity_or_least(), other.severity_or_least());
        let scale = a.abs().max(b.abs());
        if (a - b).abs() <= TIE_TOLERANCE * scale {
            self.tie > other.tie
        } else {
            a > b
        }
    }
}

/// The common-practice reminder of Saint-Venant's principle, always true of these formulas.
pub const SAINT_VENANT: &str = "These are nominal beam-theory stresses. Within about one section depth of a load point, a support, a hole, a shoulder or a groove they are not the real stresses unless a stress concentration factor is applied (Saint-Venant's principle, common practice).";

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn outer(s: &Round, phi: f64) -> Location {
        Location::Round {
            phi,
            r: s.outer_radius(),
        }
    }

    #[test]
    fn properties_match_the_published_formulas() {
        // A = πd²/4, I = πd⁴/64, J = πd⁴/32 (any handbook, e.g. Roark's Formulas, table A.1).
        let p = Round::solid(40.0).unwrap().properties();
        assert!((p.area - PI * 1600.0 / 4.0).abs() < 1e-9);
        assert!((p.iz - PI * 40f64.powi(4) / 64.0).abs() < 1e-6);
        assert!((p.jt - PI * 40f64.powi(4) / 32.0).abs() < 1e-6);
        let t = Round::tube(60.0, 50.0).unwrap().properties();
        assert!((t.iy - PI * (60f64.powi(4) - 50f64.powi(4)) / 64.0).abs() < 1e-6);
        assert_eq!(Round::tube(50.0, 60.0), Err(SectionError::InnerNotSmaller));
        assert_eq!(Round::solid(0.0), Err(SectionError::Dimension("diameter")));
        // Rectangle: A = bh, Iz = bh³/12, Iy = hb³/12 (same tables).
        let r = Rectangle::new(60.0, 20.0).unwrap().properties();
        assert_eq!(r.area, 1200.0);
        assert!((r.iz - 20.0 * 60f64.powi(3) / 12.0).abs() < 1e-6);
        assert!((r.iy - 60.0 * 20f64.powi(3) / 12.0).abs() < 1e-6);
        assert_eq!(
            Rectangle::new(10.0, -1.0),
            Err(SectionError::Dimension("width b"))
        );
    }

    #[test]
    fn transverse_shear_peaks_match_the_textbook_factors() {
        // Solid circle: τmax = 4V/(3A) at the neutral axis; thin tube: τmax ≈ 2V/A; rectangle:
        // 3V/(2A) (Gere & Goodno §5.8–5.9, from memory).
        let s = Round::solid(40.0).unwrap();
        let sec = Section::Round(s);
        let v = Loads {
            vy: 1000.0,
            ..Loads::default()
        };
        let k = Concentration::default();
        let at_na = sec
            .stress_at(&v, &Pressure::NONE, k, outer(&s, PI / 2.0))
            .unwrap();
        // At φ = 90° the tangent is −y, so the shear along +y reads as −τ in point axes.
        assert!((at_na.txy() + 4.0 * 1000.0 / (3.0 * s.properties().area)).abs() < 1e-12);
        let at_fibre = sec
            .stress_at(&v, &Pressure::NONE, k, outer(&s, 0.0))
            .unwrap();
        assert!(at_fibre.txy().abs() < 1e-15);
        let t = Round::tube(100.0, 98.0).unwrap();
        let tau = Section::Round(t)
            .stress_at(&v, &Pressure::NONE, k, outer(&t, PI / 2.0))
            .unwrap()
            .txy();
        assert!((tau.abs() / (2.0 * 1000.0 / t.properties().area) - 1.0).abs() < 0.01);
        let r = Rectangle::new(60.0, 20.0).unwrap();
        let side = Section::Rectangle(r)
            .stress_at(
                &v,
                &Pressure::NONE,
                k,
                Location::Rectangle {
                    face: Face::PosZ,
                    along: 0.0,
                },
            )
            .unwrap();
        assert!((side.txy().abs() - 1.5 * 1000.0 / 1200.0).abs() < 1e-12);
    }

    #[test]
    fn torsion_and_bending_at_the_surface() {
        // τ = 16T/(πd³), σ = 32M/(πd³) at the outer fibre of a solid shaft (standard formulas).
        let s = Round::solid(30.0).unwrap();
        let sec = Section::Round(s);
        let l = Loads {
            mz: 2.0e5,
            t: 1.5e5,
            ..Loads::default()
        };
        let st = sec
            .stress_at(&l, &Pressure::NONE, Concentration::default(), outer(&s, PI))
            .unwrap();
        let d3 = 30f64.powi(3);
        assert!((st.sx() - 32.0 * 2.0e5 / (PI * d3)).abs() < 1e-9);
        assert!((st.txy() - 16.0 * 1.5e5 / (PI * d3)).abs() < 1e-9);
        assert!(st.is_plane(), "a free outer surface is in plane stress");
        let k = Concentration {
            normal: 2.0,
            shear: 1.5,
        };
        let sk = sec
            .stress_at(&l, &Pressure::NONE, k, outer(&s, PI))
            .unwrap();
        assert!((sk.sx() - 2.0 * st.sx()).abs() < 1e-9 && (sk.txy() - 1.5 * st.txy()).abs() < 1e-9);
        let bad = Concentration {
            normal: 0.5,
            shear: 1.0,
        };
        assert_eq!(
            sec.stress_at(&l, &Pressure::NONE, bad, outer(&s, 0.0)),
            Err(SectionError::Load("Kt"))
        );
        assert_eq!(
            sec.stress_at(
                &l,
                &Pressure::NONE,
                Concentration::default(),
                Location::Round { phi: 0.0, r: 16.0 }
            ),
            Err(SectionError::OffSection("r"))
        );
        let internal = Pressure {
            inner: 5.0,
            ..Pressure::NONE
        };
        assert_eq!(
            sec.stress_at(&l, &internal, Concentration::default(), outer(&s, 0.0)),
            Err(SectionError::NoBore)
        );
    }

    #[test]
    fn pressure_adds_lame_stresses_in_point_axes() {
        let t = Round::tube(80.0, 50.0).unwrap();
        let p = Pressure {
            inner: 30.0,
            outer: 0.0,
            ends: Ends::Closed,
            nu: 0.3,
        };
        let s = Section::Round(t)
            .stress_at(
                &Loads::default(),
                &p,
                Concentration::default(),
                Location::Round { phi: 1.0, r: 25.0 },
            )
            .unwrap();
        let w = vessel::lame(30.0, 0.0, 25.0, 40.0, 25.0, Ends::Closed, 0.3).unwrap();
        assert_eq!((s.sx(), s.sy(), s.sz()), (w.axial, w.hoop, w.radial));
        // A shrink fit on a solid shaft: uniform σr = σθ = −p.
        let shaft = Round::solid(40.0).unwrap();
        let fit = Pressure {
            inner: 0.0,
            outer: 60.0,
            ends: Ends::Open,
            nu: 0.3,
        };
        let s = Section::Round(shaft)
            .stress_at(
                &Loads::default(),
                &fit,
                Concentration::default(),
                Location::Round { phi: 0.3, r: 7.0 },
            )
            .unwrap();
        assert_eq!((s.sx(), s.sy(), s.sz()), (0.0, -60.0, -60.0));
        let rect = Section::Rectangle(Rectangle::new(10.0, 10.0).unwrap());
        assert_eq!(
            rect.stress_at(
                &Loads::default(),
                &fit,
                Concentration::default(),
                Location::Rectangle {
                    face: Face::PosY,
                    along: 0.0
                }
            ),
            Err(SectionError::PressureNotAllowed)
        );
    }

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

    #[test]
    fn governing_breaks_a_tie_towards_tension_and_follows_the_ranking() {
        // Ø40 mm shaft, Mz = 1 kN·m, T = 1.5 kN·m: the fibres at φ = 0 and 180° carry equal and
        // opposite bending stress 32M/(πd³) with the same torsion shear 16T/(πd³) (Gere &
        // Goodno §3.3, §5.5, from memory), so their von Mises stresses are equal.
        let sec = Section::Round(Round::solid(0.04).unwrap());
        let l = Loads {
            mz: 1000.0,
            t: 1500.0,
            ..Loads::default()
        };
        let k = Concentration::default();
        let mean = |t: &StressTensor| (t.sx() + t.sy() + t.sz()) / 3.0;
        let vm = |t: &StressTensor| Rank {
            severity: Equivalent::of(t).von_mises,
            tie: mean(t),
        };
        let g = sec.governing(&l, &Pressure::NONE, k, 72, &vm).unwrap();
        let t = sec.stress_at(&l, &Pressure::NONE, k, g.at).unwrap();
        let d3 = 0.04_f64.powi(3);
        let sigma = 32.0 * 1000.0 / (PI * d3);
        assert!((t.sx() - sigma).abs() < 1e-6 * sigma, "{t:?}");
        // The opposite tie-breaker picks the compressive fibre.
        let vm_c = |t: &StressTensor| Rank {
            severity: Equivalent::of(t).von_mises,
            tie: -mean(t),
        };
        let g = sec.governing(&l, &Pressure::NONE, k, 72, &vm_c).unwrap();
        let t = sec.stress_at(&l, &Pressure::NONE, k, g.at).unwrap();
        assert!((t.sx() + sigma).abs() < 1e-6 * sigma, "{t:?}");
        // A ranking that penalises compression (no tie) finds the tensile fibre on its own.
        let s1 = |t: &StressTensor| Rank {
            severity: principal_values(t)[0],
            tie: 0.0,
        };
        let g = sec.governing(&l, &Pressure::NONE, k, 72, &s1).unwrap();
        let t = sec.stress_at(&l, &Pressure::NONE, k, g.at).unwrap();
        assert!(t.sx() > 0.0);
        // The scan's von Mises maximum is the governing point of a von Mises ranking.
        let scan = sec.scan(&l, &Pressure::NONE, k, 72).unwrap();
        assert!((scan.max_von_mises.value - Equivalent::of(&t).von_mises).abs() < 1e-6 * sigma);
    }

    proptest! {
        #[test]
        fn the_scan_never_misses_the_combined_bending_and_torsion_maximum(
            d in 5.0..200.0f64, my in -1e6..1e6f64, mz in -1e6..1e6f64, t in -1e6..1e6f64, samples in 8usize..40,
        ) {
            let s = Section::Round(Round::solid(d).unwrap());
            let scan = s.scan(&Loads { my, mz, t, ..Loads::default() }, &Pressure::NONE, Concentration::default(), samples).unwrap();
            // Analytic: σ = 32M/(πd³) with M = √(My² + Mz²), τ = 16T/(πd³), σvm = √(σ² + 3τ²) and
            // σ1 = σ/2 + √((σ/2)² + τ²) at the fibre of greatest bending (Shigley §7-4, from memory).
            let d3 = PI * d * d * d;
            let sig = 32.0 * my.hypot(mz) / d3;
            let tau = 16.0 * t / d3;
            let vm = (sig * sig + 3.0 * tau * tau).sqrt();
            let s1 = sig / 2.0 + ((sig / 2.0).powi(2) + tau * tau).sqrt();
            prop_assert!((scan.max_von_mises.value - vm).abs() <= 1e-9 * vm + 1e-12, "{} vs {vm}", scan.max_von_mises.value);
            prop_assert!((scan.max_principal.value - s1).abs() <= 1e-9 * s1 + 1e-12, "{} vs {s1}", scan.max_principal.value);
        }

        #[test]
        fn the_rectangle_scan_finds_bending_plus_torsion_at_mid_long_face(
            h in 5.0..50.0f64, ratio in 1.0..6.0f64, mz in -1e6..1e6f64, t in -1e6..1e6f64, samples in 8usize..40,
        ) {
            // Long faces ±y carry both the greatest bending stress (6Mz/(bh²)) and the greatest
            // torsion shear (mid-face), so the maximum is √(σ² + 3τ²) there.
            let r = Rectangle::new(h, h * ratio).unwrap();
            let sec = Section::Rectangle(r);
            let loads = Loads { mz, t, ..Loads::default() };
            let scan = sec.scan(&loads, &Pressure::NONE, Concentration::default(), samples).unwrap();
            let sig = 6.0 * mz.abs() / (h * ratio * h * h);
            let tau = sec.stress_at(&loads, &Pressure::NONE, Concentration::default(), Location::Rectangle { face: Face::PosY, along: 0.0 }).unwrap().txy();
            let vm = (sig * sig + 3.0 * tau * tau).sqrt();
            prop_assert!((scan.max_von_mises.value - vm).abs() <= 1e-7 * vm + 1e-9, "{} vs {vm}", scan.max_von_mises.value);
        }

        #[test]
        fn the_tube_scan_covers_the_wall(
            p in 1.0..200.0f64, t in -1e6..1e6f64, m in -1e6..1e6f64,
        ) {
            let tube = Round::tube(60.0, 30.0).unwrap();
            let sec = Section::Round(tube);
            let pr = Pressure { inner: p, outer: 0.0, ends: Ends::Closed, nu: 0.3 };
            let loads = Loads { t, mz: m, ..Loads::default() };
            let scan = sec.scan(&loads, &pr, Concentration::default(), 24).unwrap();
            // No point of a fine (φ, r) grid beats the scan's maximum.
            let mut best = f64::NEG_INFINITY;
            for i in 0..=40 {
                for j in 0..180 {
                    let r = 15.0 + 15.0 * f64::from(i) / 40.0;
                    let phi = 2.0 * PI * f64::from(j) / 180.0;
                    let s = sec.stress_at(&loads, &pr, Concentration::default(), Location::Round { phi, r }).unwrap();
                    best = best.max(Equivalent::of(&s).von_mises);
                }
            }
            prop_assert!(scan.max_von_mises.value >= best * (1.0 - 1e-9), "{} < {best}", scan.max_von_mises.value);
        }
    }
}
