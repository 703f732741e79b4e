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
//!   rectangle it is exact in direction (along the face). On a solid round section the stress
//!   at the chord's end is taken tangent to the perimeter with that average as its component
//!   along V (the usual approximate theory), so the free surface stays free of shear. In a tube
//!   the cut is radial: τxθ = V·(ro³ − ri³)·sin φ / (3·I·(ro − ri)), the average through the wall
//!   (thin-wall shear flow; 2V/A on a thin tube's neutral axis), finite on the bore too
//! - pressure (round sections only): Lamé's σr and σθ through the wall ([`crate::vessel::lame`];
//!   a solid shaft under external pressure p has σr = σθ = −p), and the end-load σx = A for
//!   closed ends. Kt and Kts are not applied to pressure stresses.
//!
//! Units: core works in any consistent set; the page passes metres, newtons and pascals.
//!
//! The concepts live in submodules: [`Round`] (solid shaft and tube, with Lamé pressure and
//! Jourawski shear), [`Rectangle`] (with Saint-Venant's exact torsion), and the scan and the
//! decision-ranked search for the critical point ([`Scan`], [`Rank`]).

mod rectangle;
mod round;
mod scan;

pub use rectangle::Rectangle;
pub use round::Round;
pub use scan::{Critical, Curve, Path, Rank, Sample, Scan, TIE_TOLERANCE};

use crate::tensor::StressTensor;
use crate::vessel::Ends;
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

impl Loads {
    /// The sum of two sets of loads (a steady and an alternating part make the peak).
    #[must_use]
    pub fn plus(&self, o: &Loads) -> Loads {
        Loads {
            n: self.n + o.n,
            my: self.my + o.my,
            mz: self.mz + o.mz,
            t: self.t + o.t,
            vy: self.vy + o.vy,
            vz: self.vz + o.vz,
        }
    }

    /// A rotating round shaft's cycle at the perimeter angle `phi` (radians): the steady part
    /// (axial force and torque) and the fully reversed part, the resultant moment
    /// M = √(My² + Mz²) turned so that its bending stress peaks in tension at `phi`.
    ///
    /// On a round section σ = (My·sin φ − Mz·cos φ)·r/I (module sign conventions), so
    /// My′ = M·sin φ and Mz′ = −M·cos φ give σ = +M·r/I at φ. Transverse shear is left out of
    /// both parts: it rotates with the bending and is zero at the fibre where bending peaks
    /// (Jourawski), as in Shigley's shaft design (ch. 7, from memory).
    #[must_use]
    pub fn rotating_at(&self, phi: f64) -> (Loads, Loads) {
        let m = crate::fmath::hypot(self.my, self.mz);
        let steady = Loads {
            n: self.n,
            t: self.t,
            ..Loads::default()
        };
        let alternating = Loads {
            my: m * crate::fmath::sin(phi),
            mz: -m * crate::fmath::cos(phi),
            ..Loads::default()
        };
        (steady, alternating)
    }
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

fn positive(v: f64, name: &'static str) -> Result<f64, SectionError> {
    if v.is_finite() && v > 0.0 {
        Ok(v)
    } else {
        Err(SectionError::Dimension(name))
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
}

/// The common-practice reminder of Saint-Venant's principle, always true of these formulas.
pub const SAINT_VENANT: &str = "These are nominal beam-theory stresses. Within about one section depth of a load point, a support, a hole, a shoulder or a groove they are not the real stresses unless a stress concentration factor is applied (Saint-Venant's principle, common practice).";

#[cfg(test)]
mod tests {
    use super::*;
    use crate::vessel;
    use core::f64::consts::PI;

    fn outer(s: &Round, phi: f64) -> Location {
        Location::Round {
            phi,
            r: s.outer_radius(),
        }
    }

    #[test]
    fn a_rotating_shaft_peaks_in_tension_at_the_point() {
        // σ = M·c/I = 32M/(πd³) at the outer fibre (beam formula), at any φ.
        let s = Round::solid(0.05).unwrap();
        let l = Loads {
            n: 1e3,
            my: 300.0,
            mz: -400.0,
            t: 250.0,
            vy: 5e3,
            vz: 0.0,
        };
        for phi in [0.0, 0.7, PI / 2.0, 3.0, 5.5] {
            let (steady, alt) = l.rotating_at(phi);
            assert_eq!(
                (steady.n, steady.t, steady.my, steady.vy),
                (1e3, 250.0, 0.0, 0.0)
            );
            let t = Section::Round(s)
                .stress_at(
                    &alt,
                    &Pressure::NONE,
                    Concentration::default(),
                    outer(&s, phi),
                )
                .unwrap();
            let want = 32.0 * 500.0 / (PI * 0.05f64.powi(3));
            assert!((t.components()[0] - want).abs() < 1e-9 * want, "φ = {phi}");
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
    fn a_thick_tube_carries_finite_shear_on_its_bore() {
        // 60/40 tube, Vy = 4.5 kN. On the neutral axis the Jourawski average over the two wall
        // cuts is V·Q/(I·t) with Q = ⅔(ro³ − ri³) (the half annulus) and t = 2(ro − ri)
        // (standard section formulas, from memory); it is the same on the bore and outside.
        let t = Round::tube(60.0, 40.0).unwrap();
        let sec = Section::Round(t);
        let v = Loads {
            vy: 4500.0,
            ..Loads::default()
        };
        let k = Concentration::default();
        let i = t.properties().iz;
        let q = 2.0 / 3.0 * (30f64.powi(3) - 20f64.powi(3));
        let na = 4500.0 * q / (i * 2.0 * 10.0);
        let at = |phi: f64, r: f64| {
            sec.stress_at(&v, &Pressure::NONE, k, Location::Round { phi, r })
                .unwrap()
                .txy()
        };
        for r in [20.0, 25.0, 30.0] {
            assert!((at(PI / 2.0, r).abs() - na).abs() < 1e-9 * na, "r = {r}");
        }
        // Where the bore's tangent turns across V (φ → 0, π) the shear goes to zero, never up:
        // every point of the wall stays within the neutral-axis value.
        for step in 0..=20_000 {
            let phi = f64::from(step) * 2.0 * PI / 20_000.0;
            for phi in [phi, PI - 1e-12, PI + 1e-9, 1e-12] {
                for r in [20.0, 20.0 + 1e-9, 24.0] {
                    let tau = at(phi, r);
                    assert!(
                        tau.is_finite() && tau.abs() <= na * (1.0 + 1e-12),
                        "φ = {phi}, r = {r}: {tau}"
                    );
                }
            }
        }
        assert!(at(PI - 1e-12, 20.0).abs() < 1e-9 * na);
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
}
