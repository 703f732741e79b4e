//! Loads on a section or a vessel: solid round, tube and rectangle through core's section module
//! (the tensor at the chosen point, the scan, the governing search), and thin cylinders and
//! spheres. Inputs converted to SI here; results back in the case's units.

use super::{elastic, overflow, problem, Numbers, Outcome, SourceProblem};
use crate::model::choices::{Choices, KtFrom, SectionKind, Source, Surface};
use crate::model::inputs::Num;
use stresscase_core::section::{
    Concentration, Critical, Loads, Location, Path, Pressure, Properties, Rank, Rectangle, Round,
    Scan, Section, SectionError, SAINT_VENANT,
};
use stresscase_core::units::LengthUnit;
use stresscase_core::vessel::{self, Ends, VesselError};
use stresscase_core::{AngleUnit, StressTensor, StressUnit};

/// What a section path computed besides the tensor.
#[derive(Debug, Clone, PartialEq)]
pub struct SectionOutcome {
    /// Section properties in SI (m², m⁴); None for thin vessels.
    pub properties: Option<Properties>,
    /// The scan with stresses in the case's unit and positions in radians (round) or the length
    /// unit (rectangle); None for thin vessels.
    pub scan: Option<Scan>,
    /// von Mises at the outer and inner surface of a thin vessel, case unit.
    pub vessel_surfaces: Option<[f64; 2]>,
    /// Warnings to show (each says whether it is common practice).
    pub warnings: Vec<&'static str>,
    /// Kt and Kts from the notch's shape and their fits; None when typed.
    pub shape: Option<Box<super::ShapeFactors>>,
}

/// Loads on a section or a vessel: the tensor at the chosen point (in `unit`), the scan and the
/// section's cautions.
///
/// # Errors
/// Every problem found, each attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    angle: AngleUnit,
) -> Result<(StressTensor, Outcome), SourceProblem> {
    let to_unit = 1.0 / unit.pascals();
    if matches!(c.kind, SectionKind::ThinCylinder | SectionKind::ThinSphere) {
        return thin_vessel(c, n, unit);
    }
    let s = section(c, n)?;
    let (loads, pressure, shape) = section_loads(c, n, elastic(c, n)?.nu)?;
    let k = Concentration {
        normal: shape.kt,
        shear: shape.kts,
    };
    let at = point(c, n, angle);
    let (loads, k) = static_loads(c, n, loads, k, at);
    let tensor = s
        .stress_at(&loads, &pressure, k, at)
        .map_err(|e| section_problem(e, c))?
        .scaled(to_unit)
        .map_err(|_| overflow(Num::N))?;
    let scan = s
        .scan(&loads, &pressure, k, SCAN_SAMPLES)
        .map_err(|e| section_problem(e, c))?;
    let mut warnings = vec![SAINT_VENANT];
    if c.rotating_shaft() {
        warnings.push(ROTATING);
    }
    if c.ends == Ends::PlaneStrain && (pressure.inner != 0.0 || pressure.outer != 0.0) {
        warnings.push(PLANE_STRAIN_ENDS);
    }
    if c.loads_cycle() {
        warnings.push(LOADS_CYCLE);
    }
    Ok((
        tensor,
        Outcome::Section(SectionOutcome {
            properties: Some(s.properties()),
            scan: Some(scan_in_units(scan, unit, c.length)),
            vessel_surfaces: None,
            warnings,
            shape: (c.kt_from != KtFrom::Typed).then(|| Box::new(shape)),
        }),
    ))
}

fn section_problem(e: SectionError, c: &Choices) -> SourceProblem {
    let num = match e {
        SectionError::Dimension("outer diameter" | "diameter") => Num::D,
        SectionError::Dimension("inner diameter") | SectionError::InnerNotSmaller => Num::Di,
        SectionError::Dimension("depth h") => Num::H,
        SectionError::Dimension(_) => Num::B,
        SectionError::Load("Kt") => Num::Kt,
        SectionError::Load("Kts") => Num::Kts,
        SectionError::Load("internal pressure") | SectionError::NoBore => Num::Pin,
        SectionError::Load("external pressure") | SectionError::PressureNotAllowed => Num::Pout,
        SectionError::Load("φ") => Num::Phi,
        SectionError::Load(_) => Num::N,
        SectionError::OffSection("r") if c.kind == SectionKind::Tube => Num::R,
        SectionError::OffSection(_) if c.kind == SectionKind::Rectangle => Num::Along,
        SectionError::OffSection(_) => Num::Phi,
    };
    problem(num, e.to_string())
}

fn vessel_problem(e: VesselError) -> SourceProblem {
    let num = match e {
        VesselError::Dimension("radius") => Num::D,
        VesselError::Pressure(_) => Num::Pin,
        _ => Num::Wall,
    };
    let message = match e {
        VesselError::Dimension("radius") => "the mean diameter must be a positive number".into(),
        other => other.to_string(),
    };
    problem(num, message)
}

/// Printed for a rotating shaft: how its cycle is formed.
pub const ROTATING: &str = "Rotating shaft: the resultant bending moment √(My² + Mz²) is fully reversed at the point (its peak in tension shown on screen), while the axial force, torque and pressure stay steady; transverse shear is left out of the cycle, as it is zero at the fibre where bending peaks.";

/// Printed with a loads cycle: what the state on screen is.
pub const LOADS_CYCLE: &str = "Loads that cycle: the state on screen and the static check are the peak, steady plus alternating loads; the fatigue check takes the steady and the alternating states at the point.";

/// The loads and factors of the state on screen: the peak of a loads cycle; Kt and Kts raise
/// it unless the user chose not to (common practice for a ductile material).
fn static_loads(
    c: &Choices,
    n: &impl Numbers,
    typed: Loads,
    k: Concentration,
    at: Location,
) -> (Loads, Concentration) {
    let loads = if c.loads_cycle() {
        let (steady, alternating) = cycle_loads(c, n, &typed, at);
        steady.plus(&alternating)
    } else {
        typed
    };
    let k = if c.static_kt {
        k
    } else {
        Concentration::default()
    };
    (loads, k)
}

/// The steady and alternating loads of a loads cycle, in SI: the typed loads and the typed
/// alternating ones, or on a rotating shaft the axial force and torque steady and the
/// resultant bending moment fully reversed, turned so that it peaks in tension at the point.
fn cycle_loads(c: &Choices, n: &impl Numbers, typed: &Loads, at: Location) -> (Loads, Loads) {
    if c.rotating_shaft() {
        let phi = match at {
            Location::Round { phi, .. } => phi,
            Location::Rectangle { .. } => 0.0,
        };
        return typed.rotating_at(phi);
    }
    let alternating = loads_in_si(
        c,
        n,
        [Num::Na, Num::Mya, Num::Mza, Num::Ta, Num::Vya, Num::Vza],
    );
    (*typed, alternating)
}

/// The loads typed in `nums` (N, My, Mz, T, Vy, Vz) converted to SI.
fn loads_in_si(c: &Choices, n: &impl Numbers, nums: [Num; 6]) -> Loads {
    let f = c.force.newtons();
    let mm = c.moment.newton_metres();
    let [nn, my, mz, t, vy, vz] = nums.map(|k| n.get(k));
    Loads {
        n: nn * f,
        my: my * mm,
        mz: mz * mm,
        t: t * mm,
        vy: vy * f,
        vz: vz * f,
    }
}

/// The fatigue states at the chosen point (in `unit`), with the fatigue factors `kf` and
/// `kfs` in place of Kt and Kts: the state of the typed loads (the peak of a loads cycle), and
/// for a loads cycle its steady (mean) and alternating states. Pressure is steady.
///
/// # Errors
/// A refused input, attached to its number.
pub fn fatigue_states(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    angle: AngleUnit,
    kf: f64,
    kfs: f64,
) -> Result<(StressTensor, Option<(StressTensor, StressTensor)>), SourceProblem> {
    let s = section(c, n)?;
    let (loads, pressure, _) = section_loads(c, n, elastic(c, n)?.nu)?;
    let at = point(c, n, angle);
    let k = Concentration {
        normal: kf,
        shear: kfs,
    };
    let state = |l: &Loads, p: &Pressure| {
        s.stress_at(l, p, k, at)
            .map_err(|e| section_problem(e, c))?
            .scaled(1.0 / unit.pascals())
            .map_err(|_| overflow(Num::N))
    };
    if !c.loads_cycle() {
        return Ok((state(&loads, &pressure)?, None));
    }
    let (steady, alternating) = cycle_loads(c, n, &loads, at);
    let mean = state(&steady, &pressure)?;
    let amplitude = state(&alternating, &Pressure::NONE)?;
    Ok((
        state(&steady.plus(&alternating), &pressure)?,
        Some((mean, amplitude)),
    ))
}

/// Printed with plane-strain ends: the assumption and where its ν comes from.
pub const PLANE_STRAIN_ENDS: &str = "Plane-strain ends: the member is taken as axially restrained (εz = 0), so the pressure adds σz = ν(σr + σθ), with ν from the elastic constants shown.";

/// Points sampled on each scan path.
pub const SCAN_SAMPLES: usize = 72;

/// Converts every stress of a scan from pascals to `unit` and rectangle positions from metres to
/// the length unit (round positions stay in radians).
fn scan_in_units(mut scan: Scan, unit: StressUnit, length: LengthUnit) -> Scan {
    let k = 1.0 / unit.pascals();
    let l = 1.0 / length.metres();
    for curve in &mut scan.curves {
        let pos = if curve.path == Path::Perimeter {
            l
        } else {
            1.0
        };
        for s in &mut curve.samples {
            s.von_mises *= k;
            s.sigma1 *= k;
            s.position *= pos;
        }
    }
    // Positions found by the search carry noise of about 1e-12 of the section's size: a point
    // at the middle of a face should read 0, not 1e-14.
    let size = scan
        .curves
        .iter()
        .flat_map(|c| c.samples.iter().map(|s| s.position.abs()))
        .fold(0.0_f64, f64::max);
    let snap = |v: f64, scale: f64| if v.abs() < 1e-9 * scale { 0.0 } else { v };
    for c in [&mut scan.max_von_mises, &mut scan.max_principal] {
        c.value *= k;
        c.at = match location_in(c.at, l) {
            Location::Rectangle { face, along } => Location::Rectangle {
                face,
                along: snap(along, size),
            },
            round => round,
        };
        if matches!(c.at, Location::Rectangle { .. }) {
            c.position *= l;
        }
    }
    scan
}

/// A location with its lengths multiplied by `l`.
#[must_use]
pub fn location_in(at: Location, l: f64) -> Location {
    match at {
        Location::Round { phi, r } => Location::Round { phi, r: r * l },
        Location::Rectangle { face, along } => Location::Rectangle {
            face,
            along: along * l,
        },
    }
}

/// The section the choices and numbers describe, in metres.
///
/// # Errors
/// The refused dimension.
pub fn section(c: &Choices, n: &impl Numbers) -> Result<Section, SourceProblem> {
    let m = c.length.metres();
    let s = match c.kind {
        SectionKind::SolidRound => Round::solid(n.get(Num::D) * m).map(Section::Round),
        SectionKind::Tube => Round::tube(n.get(Num::D) * m, n.get(Num::Di) * m).map(Section::Round),
        SectionKind::Rectangle => {
            Rectangle::new(n.get(Num::H) * m, n.get(Num::B) * m).map(Section::Rectangle)
        }
        SectionKind::ThinCylinder | SectionKind::ThinSphere => {
            return Err(problem(Num::D, "thin vessels have no section"))
        }
    };
    s.map_err(|e| section_problem(e, c))
}

/// Loads and pressure in SI, and Kt and Kts (typed, or from the notch's shape).
fn section_loads(
    c: &Choices,
    n: &impl Numbers,
    nu: f64,
) -> Result<(Loads, Pressure, super::ShapeFactors), SourceProblem> {
    let p = c.pressure.pascals();
    let loads = loads_in_si(c, n, [Num::N, Num::My, Num::Mz, Num::T, Num::Vy, Num::Vz]);
    let pressure = match c.kind {
        SectionKind::SolidRound => Pressure {
            inner: 0.0,
            outer: n.get(Num::Pout) * p,
            ends: c.ends,
            nu,
        },
        SectionKind::Tube => Pressure {
            inner: n.get(Num::Pin) * p,
            outer: n.get(Num::Pout) * p,
            ends: c.ends,
            nu,
        },
        _ => Pressure::NONE,
    };
    Ok((loads, pressure, super::notch_shape::factors(c, n)?))
}

/// The location of the chosen point, in metres and radians.
fn point(c: &Choices, n: &impl Numbers, angle: AngleUnit) -> Location {
    let m = c.length.metres();
    match c.kind {
        SectionKind::Rectangle => Location::Rectangle {
            face: c.face,
            along: n.get(Num::Along) * m,
        },
        SectionKind::Tube => Location::Round {
            phi: angle.to_radians(n.get(Num::Phi)),
            r: n.get(Num::R) * m,
        },
        _ => Location::Round {
            phi: angle.to_radians(n.get(Num::Phi)),
            r: 0.5 * n.get(Num::D) * m,
        },
    }
}

/// The point of the section where `rank` (given the tensor in `unit`) is most severe, found by
/// core's search over the same samples as the scan; positions as in the scan (radians, or the
/// length unit). `Ok(None)` for paths without a section.
///
/// # Errors
/// A refused input, attached to its number.
pub fn governing(
    c: &Choices,
    n: &impl Numbers,
    (unit, angle): (StressUnit, AngleUnit),
    fatigue_factors: Option<(f64, f64)>,
    rank: &dyn Fn(&StressTensor) -> Rank,
) -> Result<Option<Critical>, SourceProblem> {
    if c.source != Source::Section || !c.has_loads() {
        return Ok(None);
    }
    let s = section(c, n)?;
    let (typed, pressure, shape) = section_loads(c, n, elastic(c, n)?.nu)?;
    let k = Concentration {
        normal: shape.kt,
        shear: shape.kts,
    };
    // The states searched are those the ranking judges: the state on screen's loads and
    // factors for the static decision, the typed loads through Kf and Kfs in fatigue.
    let (loads, k) = match fatigue_factors {
        Some((kf, kfs)) => (
            typed,
            Concentration {
                normal: kf,
                shear: kfs,
            },
        ),
        None => static_loads(c, n, typed, k, point(c, n, angle)),
    };
    let to_unit = 1.0 / unit.pascals();
    let in_unit = |t: &StressTensor| match t.scaled(to_unit) {
        Ok(t) => rank(&t),
        Err(_) => Rank {
            severity: f64::NAN,
            tie: 0.0,
        },
    };
    let mut g = s
        .governing(&loads, &pressure, k, SCAN_SAMPLES, &in_unit)
        .map_err(|e| section_problem(e, c))?;
    let l = 1.0 / c.length.metres();
    g.at = location_in(g.at, l);
    if matches!(g.at, Location::Rectangle { .. }) {
        g.position *= l;
        // The search leaves noise of about 1e-12 of the section at a mid-face.
        if let Location::Rectangle { face, along } = g.at {
            let size = match s {
                Section::Rectangle(r) => r.depth().max(r.width()) * l,
                Section::Round(_) => 1.0,
            };
            if along.abs() < 1e-9 * size {
                g.at = Location::Rectangle { face, along: 0.0 };
            }
        }
    }
    Ok(Some(g))
}

fn thin_vessel(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
) -> Result<(StressTensor, Outcome), SourceProblem> {
    if c.ends == Ends::PlaneStrain && c.kind == SectionKind::ThinCylinder {
        return Err(problem(
            Num::Pin,
            "plane-strain ends apply to Lamé cylinders (tube, solid shaft); a thin cylinder has closed or open ends",
        ));
    }
    let m = c.length.metres();
    let (r, t) = (0.5 * n.get(Num::D) * m, n.get(Num::Wall) * m);
    let p = n.get(Num::Pin) * c.pressure.pascals();
    let wall = |inner: bool| match c.kind {
        SectionKind::ThinSphere => vessel::thin_sphere(p, r, t, inner),
        _ => vessel::thin_cylinder(p, r, t, c.ends, inner),
    };
    let to = |w: vessel::WallStress| {
        w.tensor()
            .and_then(|s| s.scaled(1.0 / unit.pascals()))
            .map_err(|_| overflow(Num::Pin))
    };
    let outer = to(wall(false).map_err(vessel_problem)?)?;
    let inner = to(wall(true).map_err(vessel_problem)?)?;
    let warnings = vessel::thin_wall_warning(r, t).into_iter().collect();
    let vm = |s: &StressTensor| stresscase_core::Equivalent::of(s).von_mises;
    let tensor = if c.surface == Surface::Inner {
        inner
    } else {
        outer
    };
    Ok((
        tensor,
        Outcome::Section(SectionOutcome {
            properties: None,
            scan: None,
            vessel_surfaces: Some([vm(&outer), vm(&inner)]),
            warnings,
            shape: None,
        }),
    ))
}
