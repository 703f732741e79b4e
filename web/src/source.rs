//! Where the stress comes from: typed components, loads on a section, a strain-gauge rosette, or
//! strains through Hooke's law. This module holds what the paths share — the choices, the one
//! table of typed numbers ([`INPUTS`]), the elastic constants in use, and the dispatch to each
//! path's `evaluate` in its own module (`section`, `rosette`, `strain`). No formula here: every
//! number comes from `stresscase-core`.

use stresscase_core::criteria::Criterion;
use stresscase_core::fatigue::{FatigueCriterion, Loading, Surface as FatSurface};
use stresscase_core::hooke::{Elastic, ElasticError};
use stresscase_core::material;
use stresscase_core::section::Face;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit, StrainUnit};
use stresscase_core::vessel::Ends;
use stresscase_core::{AngleUnit, StressTensor, StressUnit};

mod rosette;
mod section;
mod strain;

pub use rosette::RosetteOutcome;
pub use section::{
    governing, location_in, section, SectionOutcome, PLANE_STRAIN_ENDS, SCAN_SAMPLES,
};
pub use strain::StrainOutcome;

/// Where the stress tensor comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Source {
    /// The six components typed in.
    #[default]
    Typed,
    /// Loads on a section (or a pressure vessel).
    Section,
    /// Strain-gauge rosette readings.
    Rosette,
    /// A strain state, through Hooke's law.
    Strain,
}

/// The section kinds the page offers.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum SectionKind {
    /// Solid round shaft.
    #[default]
    SolidRound,
    /// Tube, thick or thin (Lamé for pressure).
    Tube,
    /// Solid rectangle.
    Rectangle,
    /// Thin-walled cylinder under internal pressure.
    ThinCylinder,
    /// Thin-walled sphere under internal pressure.
    ThinSphere,
}

/// Which surface of a thin vessel.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Surface {
    /// Outside (σr = 0).
    #[default]
    Outer,
    /// Inside (σr = −p).
    Inner,
}

/// Rosette gauge layout.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Layout {
    /// 0°, 45°, 90°.
    #[default]
    Rectangular,
    /// 0°, 60°, 120°.
    Delta,
    /// Angles typed by the user, 3 to 8 gauges.
    Custom,
}

/// The condition Hooke's law is applied under.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Condition {
    /// Plane stress: εx, εy, γxy given; σz = 0.
    #[default]
    PlaneStress,
    /// Plane strain: εz = γyz = γzx = 0.
    PlaneStrain,
    /// All six strains given.
    Full,
}

/// Where the elastic constants E, ν and α come from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ElasticFrom {
    /// The chosen built-in material's E, ν and α (the user's own material has none: typed).
    Material,
    /// Typed by the user. The default when a link says nothing (links written before the
    /// material supplied them carry their E, ν and α, or mean 200 GPa, 0.3 and 12 µε/K).
    #[default]
    Typed,
}

/// Most gauges a rosette may have on the page.
pub const MAX_GAUGES: u8 = 8;

/// Every choice (as opposed to a typed number) of the source paths.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Choices {
    /// The path.
    pub source: Source,
    /// Section kind.
    pub kind: SectionKind,
    /// Length unit of section dimensions and positions.
    pub length: LengthUnit,
    /// Force unit.
    pub force: ForceUnit,
    /// Moment unit.
    pub moment: MomentUnit,
    /// Pressure unit.
    pub pressure: StressUnit,
    /// Closed or open ends (pressure end load).
    pub ends: Ends,
    /// Rectangle face of the point.
    pub face: Face,
    /// Thin-vessel surface of the point.
    pub surface: Surface,
    /// Rosette layout.
    pub layout: Layout,
    /// Gauges in a custom rosette (3..=8).
    pub gauges: u8,
    /// Unit of gauge readings and strains.
    pub strain_unit: StrainUnit,
    /// Apply the transverse-sensitivity correction.
    pub correct: bool,
    /// Hooke's-law condition for the strain path.
    pub condition: Condition,
    /// Unit of Young's modulus.
    pub modulus_unit: StressUnit,
    /// Where E, ν and α come from.
    pub elastic: ElasticFrom,
    /// The material: a built-in row (index into `material::TABLE`) or the user's own.
    pub material: MaterialPick,
    /// Unit of the user's strengths and of a given endurance limit.
    pub strength_unit: StressUnit,
    /// The static criterion in use; `None` follows the material's ductility.
    pub criterion: Option<Criterion>,
    /// Whether the fatigue check is on.
    pub fatigue: bool,
    /// How the cycle's second state is given.
    pub cycle: Cycle,
    /// Endurance limit given, or estimated with Marin factors.
    pub endurance: Endurance,
    /// Surface finish for ka.
    pub finish: FatSurface,
    /// Loading for kb and kc.
    pub loading: Loading,
    /// The fatigue criterion whose factor is the fatigue verdict (first-cycle yield is always
    /// judged beside it).
    pub fatigue_criterion: FatigueCriterion,
}

/// The material of the case.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MaterialPick {
    /// A row of the built-in table.
    Table(usize),
    /// The user's own strengths.
    Own,
}

/// How the second state of the fatigue cycle is given; the state on screen is the first.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Cycle {
    /// The state on screen is the maximum; the minimum is R times it.
    #[default]
    Ratio,
    /// The state on screen is the maximum; the minimum is typed or taken from the screen.
    Minimum,
    /// The state on screen is the mean; the alternating amplitude is typed or taken.
    Alternating,
}

/// Where the endurance limit comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Endurance {
    /// Estimated for a steel: Se′ = 0.5 Sut with Marin factors.
    #[default]
    Estimate,
    /// Typed by the user.
    Given,
}

impl Default for Choices {
    fn default() -> Self {
        Self {
            source: Source::Typed,
            kind: SectionKind::SolidRound,
            length: LengthUnit::Mm,
            force: ForceUnit::KN,
            moment: MomentUnit::Nm,
            pressure: StressUnit::MPa,
            ends: Ends::Closed,
            face: Face::PosY,
            surface: Surface::Inner,
            layout: Layout::Rectangular,
            gauges: 4,
            strain_unit: StrainUnit::Micro,
            correct: false,
            condition: Condition::PlaneStress,
            modulus_unit: StressUnit::GPa,
            elastic: ElasticFrom::Typed,
            material: MaterialPick::Table(0),
            strength_unit: StressUnit::MPa,
            criterion: None,
            fatigue: false,
            cycle: Cycle::Ratio,
            endurance: Endurance::Estimate,
            finish: FatSurface::Machined,
            loading: Loading::Bending,
            fatigue_criterion: FatigueCriterion::Goodman,
        }
    }
}

/// A typed number of a source path.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Num {
    /// Diameter (solid), outer diameter (tube) or mean diameter (thin vessel).
    D,
    /// Inner diameter of a tube.
    Di,
    /// Rectangle depth along y.
    H,
    /// Rectangle width along z.
    B,
    /// Thin-vessel wall thickness.
    Wall,
    /// Axial force.
    N,
    /// Bending moment about y.
    My,
    /// Bending moment about z.
    Mz,
    /// Torque.
    T,
    /// Shear force along y.
    Vy,
    /// Shear force along z.
    Vz,
    /// Internal pressure.
    Pin,
    /// External pressure.
    Pout,
    /// Normal-stress concentration factor.
    Kt,
    /// Shear-stress concentration factor.
    Kts,
    /// Point angle φ on a round section.
    Phi,
    /// Point radius on a tube.
    R,
    /// Point coordinate along a rectangle face.
    Along,
    /// Gauge direction (0-based index).
    GaugeAngle(u8),
    /// Gauge reading (0-based index).
    GaugeReading(u8),
    /// Transverse-sensitivity coefficient Kt of the gauges, in percent.
    GaugeKt,
    /// Poisson's ratio of the gauge-factor calibration beam.
    GaugeNu0,
    /// εx.
    Ex,
    /// εy.
    Ey,
    /// εz.
    Ez,
    /// γxy.
    Gxy,
    /// γyz.
    Gyz,
    /// γzx.
    Gzx,
    /// Young's modulus.
    E,
    /// Poisson's ratio.
    Nu,
    /// Coefficient of thermal expansion, µε/K.
    Alpha,
    /// Temperature change, K.
    DeltaT,
    /// Own material: tensile yield strength Sy (optional for brittle materials).
    MatSy,
    /// Own material: ultimate tensile strength Sut.
    MatSut,
    /// Own material: ultimate compressive strength Suc (optional).
    MatSuc,
    /// Own material: elongation at fracture, percent.
    MatElong,
    /// Required factor of safety.
    Required,
    /// Stress ratio R = σmin/σmax of a proportional cycle.
    Ratio,
    /// The second state of the cycle (minimum or alternating), component 0..6 in tensor order.
    Second(u8),
    /// Endurance limit Se, given.
    Se,
    /// Diameter for the size factor, mm.
    FatD,
    /// Operating temperature, °C.
    FatTemp,
    /// Reliability, percent.
    FatRel,
}

/// What a number measures (its unit comes from the choices).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// Length unit.
    Length,
    /// Force unit.
    Force,
    /// Moment unit.
    Moment,
    /// Pressure unit.
    Pressure,
    /// Dimensionless ratio.
    Ratio,
    /// Percent.
    Percent,
    /// Angle unit of the case.
    Angle,
    /// Strain unit.
    Strain,
    /// Modulus unit.
    Modulus,
    /// µε/K.
    Expansion,
    /// K.
    Temperature,
    /// The material strength unit.
    Strength,
    /// The case's stress unit.
    CaseStress,
    /// Always millimetres (a correlation's own unit).
    Millimetre,
    /// Always °C (a correlation's own unit).
    Celsius,
}

/// How a number is labelled on the page.
#[derive(Debug, Clone, Copy)]
pub enum Label {
    /// Always the same words.
    Fixed(&'static str),
    /// Words that depend on the choices (e.g. "outer diameter D" for a tube).
    Choice(fn(&Choices) -> String),
    /// A component of the fatigue cycle's second state: "σx at the minimum" or "σx alternating".
    SecondState(&'static str),
}

/// One typed number of the case, declared once: its link key, element id, label, what it
/// measures (so its unit), its demo value and whether it may be left empty. The form, the link,
/// the page and the tests all read this table; a path uses a number by listing it in
/// [`Choices::active`] and reading it in its `evaluate`.
#[derive(Debug, Clone, Copy)]
pub struct Input {
    /// The number.
    pub num: Num,
    /// Key in a case link.
    pub key: &'static str,
    /// Element id on the page.
    pub id: &'static str,
    /// Label beside the field.
    pub label: Label,
    /// What it measures.
    pub quantity: Quantity,
    /// Demo value (an invented scenario: a 40 mm shaft of a conveyor drive, a hydraulic tube, a
    /// rosette on a press frame), in the default units; empty where nothing is invented.
    pub demo: &'static str,
    /// May be left empty (then absent from the case and its link).
    pub optional: bool,
}

fn diameter_label(c: &Choices) -> String {
    match c.kind {
        SectionKind::ThinCylinder | SectionKind::ThinSphere => "mean diameter Dm".into(),
        SectionKind::Tube => "outer diameter D".into(),
        _ => "diameter d".into(),
    }
}

fn pressure_label(c: &Choices) -> String {
    match c.kind {
        SectionKind::ThinCylinder | SectionKind::ThinSphere => "internal pressure p".into(),
        _ => "internal pressure pi".into(),
    }
}

fn along_label(c: &Choices) -> String {
    match c.face {
        Face::PosY | Face::NegY => "point z on the face".into(),
        Face::PosZ | Face::NegZ => "point y on the face".into(),
    }
}

/// Every number of the case, in link order.
#[rustfmt::skip]
pub static INPUTS: [Input; 62] = [
    Input { num: Num::D, key: "d", id: "in-d", label: Label::Choice(diameter_label), quantity: Quantity::Length, demo: "40", optional: false },
    Input { num: Num::Di, key: "di", id: "in-di", label: Label::Fixed("inner diameter Di"), quantity: Quantity::Length, demo: "28", optional: false },
    Input { num: Num::H, key: "h", id: "in-h", label: Label::Fixed("depth h (along y)"), quantity: Quantity::Length, demo: "60", optional: false },
    Input { num: Num::B, key: "b", id: "in-b", label: Label::Fixed("width b (along z)"), quantity: Quantity::Length, demo: "25", optional: false },
    Input { num: Num::Wall, key: "wall", id: "in-wall", label: Label::Fixed("wall thickness t"), quantity: Quantity::Length, demo: "4", optional: false },
    Input { num: Num::N, key: "N", id: "in-load-n", label: Label::Fixed("axial force N"), quantity: Quantity::Force, demo: "12", optional: false },
    Input { num: Num::My, key: "My", id: "in-load-my", label: Label::Fixed("bending moment My"), quantity: Quantity::Moment, demo: "0", optional: false },
    Input { num: Num::Mz, key: "Mz", id: "in-load-mz", label: Label::Fixed("bending moment Mz"), quantity: Quantity::Moment, demo: "380", optional: false },
    Input { num: Num::T, key: "T", id: "in-load-t", label: Label::Fixed("torque T"), quantity: Quantity::Moment, demo: "520", optional: false },
    Input { num: Num::Vy, key: "Vy", id: "in-load-vy", label: Label::Fixed("shear force Vy"), quantity: Quantity::Force, demo: "4.5", optional: false },
    Input { num: Num::Vz, key: "Vz", id: "in-load-vz", label: Label::Fixed("shear force Vz"), quantity: Quantity::Force, demo: "0", optional: false },
    Input { num: Num::Pin, key: "pin", id: "in-pin", label: Label::Choice(pressure_label), quantity: Quantity::Pressure, demo: "18", optional: false },
    Input { num: Num::Pout, key: "pout", id: "in-pout", label: Label::Fixed("external pressure po"), quantity: Quantity::Pressure, demo: "0", optional: false },
    Input { num: Num::Kt, key: "kt", id: "in-kt", label: Label::Fixed("Kt (normal)"), quantity: Quantity::Ratio, demo: "1", optional: false },
    Input { num: Num::Kts, key: "kts", id: "in-kts", label: Label::Fixed("Kts (shear)"), quantity: Quantity::Ratio, demo: "1", optional: false },
    Input { num: Num::Phi, key: "phi", id: "in-phi", label: Label::Fixed("point angle φ"), quantity: Quantity::Angle, demo: "180", optional: false },
    Input { num: Num::R, key: "r", id: "in-r", label: Label::Fixed("point radius r"), quantity: Quantity::Length, demo: "20", optional: false },
    Input { num: Num::Along, key: "at", id: "in-along", label: Label::Choice(along_label), quantity: Quantity::Length, demo: "0", optional: false },
    Input { num: Num::GaugeAngle(0), key: "a1", id: "in-ga1", label: Label::Fixed("gauge 1 angle"), quantity: Quantity::Angle, demo: "0", optional: false },
    Input { num: Num::GaugeReading(0), key: "e1", id: "in-ge1", label: Label::Fixed("gauge 1 reading"), quantity: Quantity::Strain, demo: "640", optional: false },
    Input { num: Num::GaugeAngle(1), key: "a2", id: "in-ga2", label: Label::Fixed("gauge 2 angle"), quantity: Quantity::Angle, demo: "45", optional: false },
    Input { num: Num::GaugeReading(1), key: "e2", id: "in-ge2", label: Label::Fixed("gauge 2 reading"), quantity: Quantity::Strain, demo: "215", optional: false },
    Input { num: Num::GaugeAngle(2), key: "a3", id: "in-ga3", label: Label::Fixed("gauge 3 angle"), quantity: Quantity::Angle, demo: "90", optional: false },
    Input { num: Num::GaugeReading(2), key: "e3", id: "in-ge3", label: Label::Fixed("gauge 3 reading"), quantity: Quantity::Strain, demo: "-180", optional: false },
    Input { num: Num::GaugeAngle(3), key: "a4", id: "in-ga4", label: Label::Fixed("gauge 4 angle"), quantity: Quantity::Angle, demo: "135", optional: false },
    Input { num: Num::GaugeReading(3), key: "e4", id: "in-ge4", label: Label::Fixed("gauge 4 reading"), quantity: Quantity::Strain, demo: "250", optional: false },
    Input { num: Num::GaugeAngle(4), key: "a5", id: "in-ga5", label: Label::Fixed("gauge 5 angle"), quantity: Quantity::Angle, demo: "30", optional: false },
    Input { num: Num::GaugeReading(4), key: "e5", id: "in-ge5", label: Label::Fixed("gauge 5 reading"), quantity: Quantity::Strain, demo: "420", optional: false },
    Input { num: Num::GaugeAngle(5), key: "a6", id: "in-ga6", label: Label::Fixed("gauge 6 angle"), quantity: Quantity::Angle, demo: "60", optional: false },
    Input { num: Num::GaugeReading(5), key: "e6", id: "in-ge6", label: Label::Fixed("gauge 6 reading"), quantity: Quantity::Strain, demo: "310", optional: false },
    Input { num: Num::GaugeAngle(6), key: "a7", id: "in-ga7", label: Label::Fixed("gauge 7 angle"), quantity: Quantity::Angle, demo: "120", optional: false },
    Input { num: Num::GaugeReading(6), key: "e7", id: "in-ge7", label: Label::Fixed("gauge 7 reading"), quantity: Quantity::Strain, demo: "-90", optional: false },
    Input { num: Num::GaugeAngle(7), key: "a8", id: "in-ga8", label: Label::Fixed("gauge 8 angle"), quantity: Quantity::Angle, demo: "150", optional: false },
    Input { num: Num::GaugeReading(7), key: "e8", id: "in-ge8", label: Label::Fixed("gauge 8 reading"), quantity: Quantity::Strain, demo: "120", optional: false },
    Input { num: Num::GaugeKt, key: "gkt", id: "in-gkt", label: Label::Fixed("transverse sensitivity Kt"), quantity: Quantity::Percent, demo: "1.2", optional: false },
    Input { num: Num::GaugeNu0, key: "gnu0", id: "in-gnu0", label: Label::Fixed("ν0 of the calibration beam"), quantity: Quantity::Ratio, demo: "0.285", optional: false },
    Input { num: Num::Ex, key: "ex", id: "in-ex", label: Label::Fixed("εx"), quantity: Quantity::Strain, demo: "520", optional: false },
    Input { num: Num::Ey, key: "ey", id: "in-ey", label: Label::Fixed("εy"), quantity: Quantity::Strain, demo: "-160", optional: false },
    Input { num: Num::Ez, key: "ez", id: "in-ez", label: Label::Fixed("εz"), quantity: Quantity::Strain, demo: "0", optional: false },
    Input { num: Num::Gxy, key: "gxy", id: "in-gxy", label: Label::Fixed("γxy"), quantity: Quantity::Strain, demo: "300", optional: false },
    Input { num: Num::Gyz, key: "gyz", id: "in-gyz", label: Label::Fixed("γyz"), quantity: Quantity::Strain, demo: "0", optional: false },
    Input { num: Num::Gzx, key: "gzx", id: "in-gzx", label: Label::Fixed("γzx"), quantity: Quantity::Strain, demo: "0", optional: false },
    Input { num: Num::E, key: "E", id: "in-e", label: Label::Fixed("Young's modulus E"), quantity: Quantity::Modulus, demo: "200", optional: false },
    Input { num: Num::Nu, key: "nu", id: "in-nu", label: Label::Fixed("Poisson's ratio ν"), quantity: Quantity::Ratio, demo: "0.3", optional: false },
    Input { num: Num::Alpha, key: "alpha", id: "in-alpha", label: Label::Fixed("expansion coefficient α"), quantity: Quantity::Expansion, demo: "12", optional: false },
    Input { num: Num::DeltaT, key: "dT", id: "in-dt", label: Label::Fixed("temperature change ΔT"), quantity: Quantity::Temperature, demo: "0", optional: false },
    Input { num: Num::MatSy, key: "msy", id: "in-msy", label: Label::Fixed("yield strength Sy (empty if none)"), quantity: Quantity::Strength, demo: "250", optional: true },
    Input { num: Num::MatSut, key: "msut", id: "in-msut", label: Label::Fixed("ultimate tensile Sut"), quantity: Quantity::Strength, demo: "420", optional: false },
    Input { num: Num::MatSuc, key: "msuc", id: "in-msuc", label: Label::Fixed("ultimate compressive Suc (optional)"), quantity: Quantity::Strength, demo: "", optional: true },
    Input { num: Num::MatElong, key: "melong", id: "in-melong", label: Label::Fixed("elongation at fracture"), quantity: Quantity::Percent, demo: "22", optional: false },
    Input { num: Num::Required, key: "nreq", id: "in-nreq", label: Label::Fixed("required factor of safety"), quantity: Quantity::Ratio, demo: "2", optional: false },
    Input { num: Num::Ratio, key: "R", id: "in-ratio", label: Label::Fixed("stress ratio R = σmin/σmax"), quantity: Quantity::Ratio, demo: "-1", optional: false },
    Input { num: Num::Second(0), key: "s2x", id: "in-s2x", label: Label::SecondState("σx"), quantity: Quantity::CaseStress, demo: "", optional: false },
    Input { num: Num::Second(1), key: "s2y", id: "in-s2y", label: Label::SecondState("σy"), quantity: Quantity::CaseStress, demo: "", optional: false },
    Input { num: Num::Second(2), key: "s2z", id: "in-s2z", label: Label::SecondState("σz"), quantity: Quantity::CaseStress, demo: "", optional: false },
    Input { num: Num::Second(3), key: "s2xy", id: "in-s2xy", label: Label::SecondState("τxy"), quantity: Quantity::CaseStress, demo: "", optional: false },
    Input { num: Num::Second(4), key: "s2yz", id: "in-s2yz", label: Label::SecondState("τyz"), quantity: Quantity::CaseStress, demo: "", optional: false },
    Input { num: Num::Second(5), key: "s2zx", id: "in-s2zx", label: Label::SecondState("τzx"), quantity: Quantity::CaseStress, demo: "", optional: false },
    Input { num: Num::Se, key: "se", id: "in-se", label: Label::Fixed("endurance limit Se (corrected)"), quantity: Quantity::Strength, demo: "160", optional: false },
    Input { num: Num::FatD, key: "fd", id: "in-fd", label: Label::Fixed("diameter for the size factor"), quantity: Quantity::Millimetre, demo: "40", optional: false },
    Input { num: Num::FatTemp, key: "ftemp", id: "in-ftemp", label: Label::Fixed("operating temperature"), quantity: Quantity::Celsius, demo: "20", optional: false },
    Input { num: Num::FatRel, key: "frel", id: "in-frel", label: Label::Fixed("reliability"), quantity: Quantity::Percent, demo: "90", optional: false },
];

impl Num {
    /// Its declaration in [`INPUTS`].
    #[must_use]
    pub fn input(self) -> &'static Input {
        INPUTS.iter().find(|i| i.num == self).unwrap_or(&INPUTS[0])
    }

    /// Every number, in link order.
    #[must_use]
    pub fn all() -> Vec<Num> {
        INPUTS.iter().map(|i| i.num).collect()
    }

    /// Numbers that may be left empty (then absent from the case and its link).
    #[must_use]
    pub fn is_optional(self) -> bool {
        self.input().optional
    }

    /// The key in a case link.
    #[must_use]
    pub fn key(self) -> &'static str {
        self.input().key
    }

    /// A stable element id for the page and its tests.
    #[must_use]
    pub fn id(self) -> &'static str {
        self.input().id
    }

    /// The label beside the field, for the given choices.
    #[must_use]
    pub fn label(self, c: &Choices) -> String {
        match self.input().label {
            Label::Fixed(s) => s.into(),
            Label::Choice(f) => f(c),
            Label::SecondState(name) => match c.cycle {
                Cycle::Alternating => format!("{name} alternating"),
                _ => format!("{name} at the minimum"),
            },
        }
    }

    /// What the number measures.
    #[must_use]
    pub fn quantity(self) -> Quantity {
        self.input().quantity
    }

    /// The unit text beside the field.
    #[must_use]
    pub fn unit(self, c: &Choices, angle: AngleUnit) -> &'static str {
        match self.quantity() {
            Quantity::Length => c.length.symbol(),
            Quantity::Force => c.force.symbol(),
            Quantity::Moment => c.moment.symbol(),
            Quantity::Pressure => c.pressure.symbol(),
            Quantity::Ratio => "(ratio)",
            Quantity::Percent => "%",
            Quantity::Angle => angle.symbol(),
            Quantity::Strain => c.strain_unit.symbol(),
            Quantity::Modulus => c.modulus_unit.symbol(),
            Quantity::Expansion => "µε/K",
            Quantity::Temperature => "K",
            Quantity::Strength => c.strength_unit.symbol(),
            Quantity::CaseStress => "",
            Quantity::Millimetre => "mm",
            Quantity::Celsius => "°C",
        }
    }

    /// The demo value, in the default units.
    #[must_use]
    pub fn demo_text(self) -> &'static str {
        self.input().demo
    }
}

/// The elastic constants every case carries (E, ν and α only when typed; see
/// [`Choices::elastic_typed`]).
pub const ELASTIC: [Num; 4] = [Num::E, Num::Nu, Num::Alpha, Num::DeltaT];

impl Choices {
    /// The numbers this set of choices uses, in the order they are shown.
    #[must_use]
    pub fn active(&self) -> Vec<Num> {
        let mut v = match self.source {
            Source::Typed => vec![],
            Source::Section => self.section_numbers(),
            Source::Rosette => self.rosette_numbers(),
            Source::Strain => match self.condition {
                Condition::Full => vec![Num::Ex, Num::Ey, Num::Ez, Num::Gxy, Num::Gyz, Num::Gzx],
                _ => vec![Num::Ex, Num::Ey, Num::Gxy],
            },
        };
        if self.elastic_typed() {
            v.extend([Num::E, Num::Nu, Num::Alpha]);
        }
        v.push(Num::DeltaT);
        v.push(Num::Required);
        if self.material == MaterialPick::Own {
            v.extend([Num::MatSy, Num::MatSut, Num::MatSuc, Num::MatElong]);
        }
        if self.fatigue {
            match self.cycle {
                Cycle::Ratio => v.push(Num::Ratio),
                Cycle::Minimum | Cycle::Alternating => v.extend((0..6).map(Num::Second)),
            }
            match self.endurance {
                Endurance::Given => v.push(Num::Se),
                Endurance::Estimate => v.extend([Num::FatD, Num::FatTemp, Num::FatRel]),
            }
        }
        v
    }

    fn section_numbers(&self) -> Vec<Num> {
        let loads = [Num::N, Num::My, Num::Mz, Num::T, Num::Vy, Num::Vz];
        let k = [Num::Kt, Num::Kts];
        match self.kind {
            SectionKind::SolidRound => {
                [&[Num::D][..], &loads, &[Num::Pout], &k, &[Num::Phi]].concat()
            }
            SectionKind::Tube => [
                &[Num::D, Num::Di][..],
                &loads,
                &[Num::Pin, Num::Pout],
                &k,
                &[Num::Phi, Num::R],
            ]
            .concat(),
            SectionKind::Rectangle => [&[Num::H, Num::B][..], &loads, &k, &[Num::Along]].concat(),
            SectionKind::ThinCylinder | SectionKind::ThinSphere => {
                vec![Num::D, Num::Wall, Num::Pin]
            }
        }
    }

    /// Whether E, ν and α are typed: chosen so, or the material is the user's own (which has
    /// no elastic constants of its own).
    #[must_use]
    pub fn elastic_typed(&self) -> bool {
        self.elastic == ElasticFrom::Typed || self.material == MaterialPick::Own
    }

    /// The built-in material row, if one is chosen.
    #[must_use]
    pub fn table_material(&self) -> Option<&'static material::TableMaterial> {
        match self.material {
            MaterialPick::Table(i) => material::TABLE.get(i),
            MaterialPick::Own => None,
        }
    }

    /// Gauges in use.
    #[must_use]
    pub fn gauge_count(&self) -> u8 {
        match self.layout {
            Layout::Rectangular | Layout::Delta => 3,
            Layout::Custom => self.gauges.clamp(3, MAX_GAUGES),
        }
    }

    fn rosette_numbers(&self) -> Vec<Num> {
        let mut v = Vec::new();
        for i in 0..self.gauge_count() {
            if self.layout == Layout::Custom {
                v.push(Num::GaugeAngle(i));
            }
            v.push(Num::GaugeReading(i));
        }
        if self.correct {
            v.extend([Num::GaugeKt, Num::GaugeNu0]);
        }
        v
    }

    /// Whether the section takes force and moment loads (not the thin vessels).
    #[must_use]
    pub fn has_loads(&self) -> bool {
        !matches!(
            self.kind,
            SectionKind::ThinCylinder | SectionKind::ThinSphere
        )
    }
}

/// Token tables for the choices, shared by the link writer and reader and the page's selects.
pub mod tokens {
    use super::{Condition, Cycle, ElasticFrom, Endurance, Layout, SectionKind, Source, Surface};
    use stresscase_core::criteria::Criterion;
    use stresscase_core::fatigue::{FatigueCriterion, Loading, Surface as FatSurface};
    use stresscase_core::section::Face;
    use stresscase_core::vessel::Ends;

    /// `src`.
    pub const SOURCE: [(Source, &str); 4] = [
        (Source::Typed, "typed"),
        (Source::Section, "section"),
        (Source::Rosette, "rosette"),
        (Source::Strain, "strain"),
    ];
    /// `kind`.
    pub const KIND: [(SectionKind, &str); 5] = [
        (SectionKind::SolidRound, "shaft"),
        (SectionKind::Tube, "tube"),
        (SectionKind::Rectangle, "rect"),
        (SectionKind::ThinCylinder, "thincyl"),
        (SectionKind::ThinSphere, "thinsph"),
    ];
    /// `ends` (plane strain only for Lamé cylinders: tube and solid shaft).
    pub const ENDS: [(Ends, &str); 3] = [
        (Ends::Closed, "closed"),
        (Ends::Open, "open"),
        (Ends::PlaneStrain, "pstrain"),
    ];
    /// `ec`: where E, ν and α come from.
    pub const ELASTIC_FROM: [(ElasticFrom, &str); 2] = [
        (ElasticFrom::Material, "mat"),
        (ElasticFrom::Typed, "typed"),
    ];
    /// `fcrit`: the fatigue criterion in use.
    pub const FATIGUE_CRITERION: [(FatigueCriterion, &str); 4] = [
        (FatigueCriterion::Goodman, "goodman"),
        (FatigueCriterion::Gerber, "gerber"),
        (FatigueCriterion::AsmeElliptic, "asme"),
        (FatigueCriterion::Soderberg, "soderberg"),
    ];
    /// `face`.
    pub const FACE: [(Face, &str); 4] = [
        (Face::PosY, "+y"),
        (Face::PosZ, "+z"),
        (Face::NegY, "-y"),
        (Face::NegZ, "-z"),
    ];
    /// `surf`.
    pub const SURFACE: [(Surface, &str); 2] =
        [(Surface::Outer, "outer"), (Surface::Inner, "inner")];
    /// `layout`.
    pub const LAYOUT: [(Layout, &str); 3] = [
        (Layout::Rectangular, "rect"),
        (Layout::Delta, "delta"),
        (Layout::Custom, "any"),
    ];
    /// `cond`.
    pub const CONDITION: [(Condition, &str); 3] = [
        (Condition::PlaneStress, "pstress"),
        (Condition::PlaneStrain, "pstrain"),
        (Condition::Full, "3d"),
    ];

    /// `crit`.
    pub const CRITERION: [(Option<Criterion>, &str); 6] = [
        (None, "auto"),
        (Some(Criterion::VonMises), "vm"),
        (Some(Criterion::Tresca), "tresca"),
        (Some(Criterion::MaxNormal), "normal"),
        (Some(Criterion::CoulombMohr), "cm"),
        (Some(Criterion::ModifiedMohr), "mm"),
    ];
    /// `cyc`.
    pub const CYCLE: [(Cycle, &str); 3] = [
        (Cycle::Ratio, "ratio"),
        (Cycle::Minimum, "min"),
        (Cycle::Alternating, "alt"),
    ];
    /// `sem`.
    pub const ENDURANCE: [(Endurance, &str); 2] = [
        (Endurance::Estimate, "estimate"),
        (Endurance::Given, "given"),
    ];
    /// `fsurf`.
    pub const FINISH: [(FatSurface, &str); 4] = [
        (FatSurface::Ground, "ground"),
        (FatSurface::Machined, "machined"),
        (FatSurface::HotRolled, "hotrolled"),
        (FatSurface::AsForged, "forged"),
    ];
    /// `fload`.
    pub const LOADING: [(Loading, &str); 3] = [
        (Loading::Bending, "bending"),
        (Loading::Axial, "axial"),
        (Loading::Torsion, "torsion"),
    ];

    /// The token of `v` in `table`.
    #[must_use]
    pub fn token<T: PartialEq + Copy>(table: &[(T, &'static str)], v: T) -> &'static str {
        table.iter().find(|(x, _)| *x == v).map_or("", |(_, t)| t)
    }

    /// The value of token `t` in `table`.
    #[must_use]
    pub fn value<T: Copy>(table: &[(T, &'static str)], t: &str) -> Option<T> {
        table.iter().find(|(_, s)| *s == t).map(|(x, _)| *x)
    }
}

/// The numbers a source reads, looked up by [`Num`]; absent numbers read as 0.
pub trait Numbers {
    /// The value of `n`.
    fn get(&self, n: Num) -> f64;
    /// True when an optional number was left empty.
    fn absent(&self, _n: Num) -> bool {
        false
    }
}

/// A problem with one source number.
#[derive(Debug, Clone, PartialEq)]
pub struct SourceProblem {
    /// The number it belongs to.
    pub num: Num,
    /// Why.
    pub message: String,
}

/// The refusal when a path's result leaves double range, attached to `num`.
fn overflow(num: Num) -> SourceProblem {
    problem(num, "the result overflows; check the magnitudes")
}

fn problem(num: Num, message: impl Into<String>) -> SourceProblem {
    SourceProblem {
        num,
        message: message.into(),
    }
}

/// The extra results of a source path.
#[derive(Debug, Clone, PartialEq)]
pub enum Outcome {
    /// Loads on a section.
    Section(SectionOutcome),
    /// Rosette readings.
    Rosette(RosetteOutcome),
    /// Strains through Hooke's law.
    Strain(StrainOutcome),
}

/// The elastic constants in use, and where they come from.
#[derive(Debug, Clone, PartialEq)]
pub struct ElasticUsed {
    /// As core's type (E in Pa).
    pub material: Elastic,
    /// E in the case's modulus unit.
    pub e: f64,
    /// Poisson's ratio.
    pub nu: f64,
    /// Coefficient of expansion, µε/K.
    pub alpha: f64,
    /// Free thermal strain α·ΔT (dimensionless).
    pub thermal: f64,
    /// The material they come from; `None` when typed.
    pub from: Option<&'static str>,
    /// The warning shown when typed values differ from the chosen material's by more than
    /// [`ELASTIC_MISMATCH`].
    pub mismatch: Option<String>,
}

/// Relative difference of a typed E or ν from the chosen material's above which the page warns.
pub const ELASTIC_MISMATCH: f64 = 0.05;

/// The elastic constants of the case: the chosen material's E, ν and α, or the typed ones (with a
/// warning when they differ from the chosen material's by more than 5 %).
///
/// # Errors
/// The refused constant, attached to its field.
pub fn elastic(c: &Choices, n: &impl Numbers) -> Result<ElasticUsed, SourceProblem> {
    let row = c.table_material();
    let (e, nu, alpha, from) = match row {
        Some(m) if !c.elastic_typed() => (
            StressUnit::GPa.convert(m.e, c.modulus_unit),
            m.nu,
            m.alpha,
            Some(m.name),
        ),
        _ => (n.get(Num::E), n.get(Num::Nu), n.get(Num::Alpha), None),
    };
    let material = Elastic::try_new(e * c.modulus_unit.pascals(), nu).map_err(|err| match err {
        ElasticError::Modulus(_) => problem(Num::E, "E must be a positive number"),
        ElasticError::Poisson(_) => problem(Num::Nu, err.to_string()),
    })?;
    if !alpha.is_finite() {
        return Err(problem(Num::Alpha, "α must be a finite number"));
    }
    let mismatch = match row {
        Some(m) if from.is_none() => {
            let e_gpa = c.modulus_unit.convert(e, StressUnit::GPa);
            let de = (e_gpa / m.e - 1.0).abs();
            let dnu = (nu / m.nu - 1.0).abs();
            (de > ELASTIC_MISMATCH || dnu > ELASTIC_MISMATCH).then(|| {
                format!(
                    "The typed E = {} GPa and ν = {} differ from {}'s E = {} GPa and ν = {} by {} % and {} %. Stresses from strains and the strain state use the typed values.",
                    crate::numfmt::format_sig(e_gpa, 4),
                    crate::numfmt::format_sig(nu, 3),
                    m.name,
                    crate::numfmt::format_sig(m.e, 4),
                    crate::numfmt::format_sig(m.nu, 3),
                    crate::numfmt::format_sig(100.0 * de, 2),
                    crate::numfmt::format_sig(100.0 * dnu, 2),
                )
            })
        }
        _ => None,
    };
    Ok(ElasticUsed {
        material,
        e,
        nu,
        alpha,
        thermal: alpha * 1e-6 * n.get(Num::DeltaT),
        from,
        mismatch,
    })
}

/// Runs the chosen path through core: the stress tensor in `unit`, and what else it found.
/// For [`Source::Typed`] this returns `Ok(None)`.
///
/// # Errors
/// Every problem found, each attached to its number.
pub fn evaluate(
    c: &Choices,
    n: &impl Numbers,
    unit: StressUnit,
    angle: AngleUnit,
) -> Result<Option<(StressTensor, Outcome)>, SourceProblem> {
    match c.source {
        Source::Typed => Ok(None),
        Source::Section => section::evaluate(c, n, unit, angle).map(Some),
        Source::Rosette => rosette::evaluate(c, n, unit, angle).map(Some),
        Source::Strain => strain::evaluate(c, n, unit).map(Some),
    }
}

/// Numbers as a plain map, for tests of the paths without a form.
#[cfg(test)]
pub(crate) mod test_numbers {
    use super::{Choices, Num, Numbers};
    use std::collections::BTreeMap;

    /// The numbers of a case, by [`Num`]; a missing one is absent.
    pub(crate) struct Map(pub(crate) BTreeMap<Num, f64>);

    impl Numbers for Map {
        fn get(&self, n: Num) -> f64 {
            self.0.get(&n).copied().unwrap_or(0.0)
        }
        fn absent(&self, n: Num) -> bool {
            !self.0.contains_key(&n)
        }
    }

    /// The demo value of every number the choices use (empty optional ones left absent).
    pub(crate) fn demo(c: &Choices) -> Map {
        Map(c
            .active()
            .into_iter()
            .filter_map(|n| n.demo_text().parse().ok().map(|v| (n, v)))
            .collect())
    }
}

#[cfg(test)]
mod tests {
    use super::test_numbers::demo;
    use super::*;

    #[test]
    fn every_source_and_kind_evaluates_its_demo() {
        for source in [Source::Section, Source::Rosette, Source::Strain] {
            for (kind, _) in tokens::KIND {
                for (layout, _) in tokens::LAYOUT {
                    for (condition, _) in tokens::CONDITION {
                        let c = Choices {
                            source,
                            kind,
                            layout,
                            condition,
                            ..Choices::default()
                        };
                        let n = demo(&c);
                        let r = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree);
                        assert!(
                            matches!(r, Ok(Some(_))),
                            "{source:?} {kind:?} {layout:?} {condition:?}: {r:?}"
                        );
                    }
                }
            }
        }
    }

    #[test]
    fn every_number_is_declared_once() {
        // Each row's number finds its own row, and every variant has one: the exhaustive match
        // stops the build when a variant is added until it is considered here.
        for (i, row) in INPUTS.iter().enumerate() {
            assert!(core::ptr::eq(row.num.input(), &INPUTS[i]), "{:?}", row.num);
        }
        let declared = |n: Num| INPUTS.iter().any(|i| i.num == n);
        let check = |n: Num| match n {
            Num::GaugeAngle(_) | Num::GaugeReading(_) => (0..MAX_GAUGES)
                .all(|i| declared(Num::GaugeAngle(i)) && declared(Num::GaugeReading(i))),
            Num::Second(_) => (0..6).all(|i| declared(Num::Second(i))),
            Num::D
            | Num::Di
            | Num::H
            | Num::B
            | Num::Wall
            | Num::N
            | Num::My
            | Num::Mz
            | Num::T
            | Num::Vy
            | Num::Vz
            | Num::Pin
            | Num::Pout
            | Num::Kt
            | Num::Kts
            | Num::Phi
            | Num::R
            | Num::Along
            | Num::GaugeKt
            | Num::GaugeNu0
            | Num::Ex
            | Num::Ey
            | Num::Ez
            | Num::Gxy
            | Num::Gyz
            | Num::Gzx
            | Num::E
            | Num::Nu
            | Num::Alpha
            | Num::DeltaT
            | Num::MatSy
            | Num::MatSut
            | Num::MatSuc
            | Num::MatElong
            | Num::Required
            | Num::Ratio
            | Num::Se
            | Num::FatD
            | Num::FatTemp
            | Num::FatRel => declared(n),
        };
        for n in Num::all() {
            assert!(check(n), "{n:?}");
        }
        assert_eq!(INPUTS.len(), 18 + 2 * usize::from(MAX_GAUGES) + 18 + 6 + 4);
    }

    #[test]
    fn keys_and_ids_are_unique() {
        let all = Num::all();
        let mut keys: Vec<_> = all.iter().map(|n| n.key()).collect();
        let mut ids: Vec<_> = all.iter().map(|n| n.id()).collect();
        keys.sort_unstable();
        keys.dedup();
        ids.sort_unstable();
        ids.dedup();
        assert_eq!(keys.len(), all.len());
        assert_eq!(ids.len(), all.len());
    }

    #[test]
    fn the_shaft_demo_matches_the_textbook_outer_fibre() {
        // 40 mm shaft, Mz = 380 N·m, T = 520 N·m, N = 12 kN, Vy = 4.5 kN at φ = 180° (y = −r):
        // σx = N/A + 32M/(πd³) and τ = 16T/(πd³) (standard formulas; the shear from Vy is zero on
        // the extreme fibre).
        let c = Choices {
            source: Source::Section,
            ..Choices::default()
        };
        let (t, _) = evaluate(&c, &demo(&c), StressUnit::MPa, AngleUnit::Degree)
            .unwrap()
            .unwrap();
        let d = 0.04_f64;
        let pi = core::f64::consts::PI;
        let sx = 12e3 / (pi * d * d / 4.0) + 32.0 * 380.0 / (pi * d * d * d);
        assert!((t.sx() - sx / 1e6).abs() < 1e-9, "{}", t.sx());
        assert!((t.txy() - 16.0 * 520.0 / (pi * d * d * d) / 1e6).abs() < 1e-9);
    }

    #[test]
    fn a_singular_custom_rosette_is_refused_on_the_angles() {
        let c = Choices {
            source: Source::Rosette,
            layout: Layout::Custom,
            gauges: 3,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::GaugeAngle(0), 0.0);
        n.0.insert(Num::GaugeAngle(1), 180.0);
        n.0.insert(Num::GaugeAngle(2), 360.0);
        let e = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree).unwrap_err();
        assert_eq!(e.num, Num::GaugeAngle(0));
        assert!(
            e.message.contains("three different directions"),
            "{}",
            e.message
        );
    }

    #[test]
    fn bad_geometry_names_its_field() {
        let c = Choices {
            source: Source::Section,
            kind: SectionKind::Tube,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::Di, 50.0);
        let e = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree).unwrap_err();
        assert_eq!(e.num, Num::Di);
        n.0.insert(Num::Di, 28.0);
        n.0.insert(Num::R, 25.0);
        let e = evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree).unwrap_err();
        assert_eq!(e.num, Num::R);
        assert!(e.message.contains("outside the section"), "{}", e.message);
        let c = Choices {
            source: Source::Strain,
            ..Choices::default()
        };
        let mut n = demo(&c);
        n.0.insert(Num::Nu, 0.5);
        assert_eq!(
            evaluate(&c, &n, StressUnit::MPa, AngleUnit::Degree)
                .unwrap_err()
                .num,
            Num::Nu
        );
    }
}
