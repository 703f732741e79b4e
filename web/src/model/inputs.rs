//! Every typed number of the case, declared once. One row of the [`inputs!`] table below gives a
//! number its name ([`Num`]), link key, element id, label, what it measures (so its unit), demo
//! value, whether it may be left empty, where on the page its field is drawn, and when it is
//! used. The form, the panels, the link, the calc sheet and the tests read this table; the path
//! that uses a number reads it in its `evaluate`. Adding a number to a path is one row here plus
//! its use there. (Over 600 lines on purpose: most of the file is the one table, which is the
//! point of having one.)

use super::choices::{
    Choices, Condition, Cycle, Endurance, KtFrom, Layout, MaterialPick, MeanStressPick, NotchQ,
    SectionKind, SnFrom, Source,
};
use stresscase_core::section::Face;
use stresscase_core::AngleUnit;
use SectionKind::{Rectangle, SolidRound, ThinCylinder, ThinSphere, Tube};

/// Declares [`Num`] and [`INPUTS`] from one list of rows:
/// `Name: key, id, label, quantity, demo, needed|optional, place, used_when;`
macro_rules! inputs {
    ($(
        $(#[doc = $doc:literal])*
        $num:ident: $key:literal, $id:literal, $label:expr, $quantity:ident, $demo:literal,
        $need:ident, $place:ident, $used:expr;
    )*) => {
        /// A typed number of the case; each is declared by its row of [`INPUTS`].
        #[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord)]
        pub enum Num {
            $($(#[doc = $doc])* $num,)*
        }

        /// Every number of the case, in link order, which is also the order the form and the
        /// calc sheet show them.
        pub static INPUTS: &[Input] = &[$(
            Input {
                num: Num::$num,
                key: $key,
                id: $id,
                label: $label,
                quantity: Quantity::$quantity,
                demo: $demo,
                optional: optional!($need),
                place: Place::$place,
                used: $used,
            },
        )*];
    };
}

/// `needed` or `optional` in a row of [`inputs!`], as the row's `optional` flag.
macro_rules! optional {
    (needed) => {
        false
    };
    (optional) => {
        true
    };
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
    /// A number of cycles.
    Cycles,
    /// Hours.
    Hours,
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

/// Where on the page a number's field is drawn: each is a group of fields in one panel, shown
/// in table order.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Place {
    /// Section: dimensions.
    Dimensions,
    /// Section: forces and moments.
    Loads,
    /// Section: pressures.
    Pressures,
    /// Section: stress concentration factors.
    Concentration,
    /// Section: the point on the section.
    Point,
    /// Rosette: the gauges' angles and readings.
    Gauges,
    /// Rosette: the transverse-sensitivity correction.
    GaugeCorrection,
    /// Strains.
    Strains,
    /// Elastic constants and temperature change.
    Elastic,
    /// Static verdict: the required factor of safety.
    Required,
    /// Static verdict: the user's own material.
    OwnMaterial,
    /// Fatigue: the stress ratio.
    CycleRatio,
    /// Fatigue: the cycle's second state.
    SecondState,
    /// Fatigue: the endurance limit, given or estimated.
    Endurance,
    /// Fatigue: the alternating loads of a section.
    AltLoads,
    /// Fatigue: the notch sensitivity of a section's notch.
    Notch,
    /// Life: the S–N line and the mean-stress correction.
    LifeLine,
    /// Life: the history's duration.
    LifeHistory,
}

impl Place {
    /// Its numbers, in table order.
    #[must_use]
    pub fn numbers(self) -> Vec<Num> {
        INPUTS
            .iter()
            .filter(|i| i.place == self)
            .map(|i| i.num)
            .collect()
    }
}

/// One typed number of the case: its link key, element id, label, what it measures (so its
/// unit), its demo value, whether it may be left empty, and when the case uses it.
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
    /// Where on the page its field is drawn.
    pub place: Place,
    /// Whether a case with these choices uses it.
    pub used: fn(&Choices) -> bool,
}

use Label::{Choice, Fixed, SecondState};

inputs! {
    // Loads on a section or vessel (source/section.rs).
    /// Diameter (solid), outer diameter (tube) or mean diameter (thin vessel).
    D: "d", "in-d", Choice(diameter_label), Length, "40", needed, Dimensions,
        |c| on_section(c, &[SolidRound, Tube, ThinCylinder, ThinSphere]);
    /// Inner diameter of a tube.
    Di: "di", "in-di", Fixed("inner diameter Di"), Length, "28", needed, Dimensions,
        |c| on_section(c, &[Tube]);
    /// Rectangle depth along y.
    H: "h", "in-h", Fixed("depth h (along y)"), Length, "60", needed, Dimensions,
        |c| on_section(c, &[Rectangle]);
    /// Rectangle width along z.
    B: "b", "in-b", Fixed("width b (along z)"), Length, "25", needed, Dimensions,
        |c| on_section(c, &[Rectangle]);
    /// Thin-vessel wall thickness.
    Wall: "wall", "in-wall", Fixed("wall thickness t"), Length, "4", needed, Dimensions,
        |c| on_section(c, &[ThinCylinder, ThinSphere]);
    /// Axial force.
    N: "N", "in-load-n", Fixed("axial force N"), Force, "12", needed, Loads,
        |c| on_section(c, LOADED);
    /// Bending moment about y.
    My: "My", "in-load-my", Fixed("bending moment My"), Moment, "0", needed, Loads,
        |c| on_section(c, LOADED);
    /// Bending moment about z.
    Mz: "Mz", "in-load-mz", Fixed("bending moment Mz"), Moment, "380", needed, Loads,
        |c| on_section(c, LOADED);
    /// Torque.
    T: "T", "in-load-t", Fixed("torque T"), Moment, "520", needed, Loads,
        |c| on_section(c, LOADED);
    /// Shear force along y.
    Vy: "Vy", "in-load-vy", Fixed("shear force Vy"), Force, "4.5", needed, Loads,
        |c| on_section(c, LOADED);
    /// Shear force along z.
    Vz: "Vz", "in-load-vz", Fixed("shear force Vz"), Force, "0", needed, Loads,
        |c| on_section(c, LOADED);
    /// Internal pressure.
    Pin: "pin", "in-pin", Choice(pressure_label), Pressure, "18", needed, Pressures,
        |c| on_section(c, &[Tube, ThinCylinder, ThinSphere]);
    /// External pressure.
    Pout: "pout", "in-pout", Fixed("external pressure po"), Pressure, "0", needed, Pressures,
        |c| on_section(c, &[SolidRound, Tube]);
    /// Normal-stress concentration factor.
    Kt: "kt", "in-kt", Fixed("Kt (normal)"), Ratio, "1", needed, Concentration,
        |c| on_section(c, LOADED) && c.kt_from == KtFrom::Typed;
    /// Shear-stress concentration factor (typed also with a flat bar's shape: no fit for its
    /// torsion).
    Kts: "kts", "in-kts", Fixed("Kts (shear)"), Ratio, "1", needed, Concentration,
        |c| on_section(c, LOADED) && !c.kt_from.round();
    /// The notch's larger size: a stepped or grooved bar's diameter D, a flat bar's width H.
    KtBig: "ktD", "in-kt-big", Choice(kt_big_label), Length, "48", needed, Concentration,
        |c| on_section(c, LOADED) && c.kt_from.has_radius();
    /// The fillet or groove root radius.
    KtR: "ktr", "in-kt-r", Choice(kt_radius_label), Length, "2", needed, Concentration,
        |c| on_section(c, LOADED) && c.kt_from.has_radius();
    /// The hole's diameter in a plate.
    KtHole: "kth", "in-kt-hole", Fixed("hole diameter"), Length, "10", needed, Concentration,
        |c| on_section(c, LOADED) && c.kt_from == KtFrom::Hole;
    /// Point angle φ on a round section.
    Phi: "phi", "in-phi", Fixed("point angle φ"), Angle, "180", needed, Point,
        |c| on_section(c, &[SolidRound, Tube]);
    /// Point radius on a tube.
    R: "r", "in-r", Fixed("point radius r"), Length, "20", needed, Point,
        |c| on_section(c, &[Tube]);
    /// Point coordinate along a rectangle face.
    Along: "at", "in-along", Choice(along_label), Length, "0", needed, Point,
        |c| on_section(c, &[Rectangle]);
    // Rosette readings (source/rosette.rs).
    /// Gauge direction 1.
    GaugeAngle1: "a1", "in-ga1", Fixed("gauge 1 angle"), Angle, "0", needed, Gauges,
        custom_angle::<0>;
    /// Gauge reading 1.
    GaugeReading1: "e1", "in-ge1", Fixed("gauge 1 reading"), Strain, "640", needed, Gauges,
        gauge::<0>;
    /// Gauge direction 2.
    GaugeAngle2: "a2", "in-ga2", Fixed("gauge 2 angle"), Angle, "45", needed, Gauges,
        custom_angle::<1>;
    /// Gauge reading 2.
    GaugeReading2: "e2", "in-ge2", Fixed("gauge 2 reading"), Strain, "215", needed, Gauges,
        gauge::<1>;
    /// Gauge direction 3.
    GaugeAngle3: "a3", "in-ga3", Fixed("gauge 3 angle"), Angle, "90", needed, Gauges,
        custom_angle::<2>;
    /// Gauge reading 3.
    GaugeReading3: "e3", "in-ge3", Fixed("gauge 3 reading"), Strain, "-180", needed, Gauges,
        gauge::<2>;
    /// Gauge direction 4.
    GaugeAngle4: "a4", "in-ga4", Fixed("gauge 4 angle"), Angle, "135", needed, Gauges,
        custom_angle::<3>;
    /// Gauge reading 4.
    GaugeReading4: "e4", "in-ge4", Fixed("gauge 4 reading"), Strain, "250", needed, Gauges,
        gauge::<3>;
    /// Gauge direction 5.
    GaugeAngle5: "a5", "in-ga5", Fixed("gauge 5 angle"), Angle, "30", needed, Gauges,
        custom_angle::<4>;
    /// Gauge reading 5.
    GaugeReading5: "e5", "in-ge5", Fixed("gauge 5 reading"), Strain, "420", needed, Gauges,
        gauge::<4>;
    /// Gauge direction 6.
    GaugeAngle6: "a6", "in-ga6", Fixed("gauge 6 angle"), Angle, "60", needed, Gauges,
        custom_angle::<5>;
    /// Gauge reading 6.
    GaugeReading6: "e6", "in-ge6", Fixed("gauge 6 reading"), Strain, "310", needed, Gauges,
        gauge::<5>;
    /// Gauge direction 7.
    GaugeAngle7: "a7", "in-ga7", Fixed("gauge 7 angle"), Angle, "120", needed, Gauges,
        custom_angle::<6>;
    /// Gauge reading 7.
    GaugeReading7: "e7", "in-ge7", Fixed("gauge 7 reading"), Strain, "-90", needed, Gauges,
        gauge::<6>;
    /// Gauge direction 8.
    GaugeAngle8: "a8", "in-ga8", Fixed("gauge 8 angle"), Angle, "150", needed, Gauges,
        custom_angle::<7>;
    /// Gauge reading 8.
    GaugeReading8: "e8", "in-ge8", Fixed("gauge 8 reading"), Strain, "120", needed, Gauges,
        gauge::<7>;
    /// Transverse-sensitivity coefficient Kt of the gauges, in percent.
    GaugeKt: "gkt", "in-gkt", Fixed("transverse sensitivity Kt"), Percent, "1.2", needed, GaugeCorrection,
        |c| c.source == Source::Rosette && c.correct;
    /// Poisson's ratio of the gauge-factor calibration beam.
    GaugeNu0: "gnu0", "in-gnu0", Fixed("ν0 of the calibration beam"), Ratio, "0.285", needed, GaugeCorrection,
        |c| c.source == Source::Rosette && c.correct;
    // Strains through Hooke's law (source/strain.rs).
    /// εx.
    Ex: "ex", "in-ex", Fixed("εx"), Strain, "520", needed, Strains,
        |c| c.source == Source::Strain;
    /// εy.
    Ey: "ey", "in-ey", Fixed("εy"), Strain, "-160", needed, Strains,
        |c| c.source == Source::Strain;
    /// εz.
    Ez: "ez", "in-ez", Fixed("εz"), Strain, "0", needed, Strains,
        strain_3d;
    /// γxy.
    Gxy: "gxy", "in-gxy", Fixed("γxy"), Strain, "300", needed, Strains,
        |c| c.source == Source::Strain;
    /// γyz.
    Gyz: "gyz", "in-gyz", Fixed("γyz"), Strain, "0", needed, Strains,
        strain_3d;
    /// γzx.
    Gzx: "gzx", "in-gzx", Fixed("γzx"), Strain, "0", needed, Strains,
        strain_3d;
    // Elastic constants, shared by the rosette and strain paths and the strain state (source.rs).
    /// Young's modulus.
    E: "E", "in-e", Fixed("Young's modulus E"), Modulus, "200", needed, Elastic,
        Choices::elastic_typed;
    /// Poisson's ratio.
    Nu: "nu", "in-nu", Fixed("Poisson's ratio ν"), Ratio, "0.3", needed, Elastic,
        Choices::elastic_typed;
    /// Coefficient of thermal expansion, µε/K.
    Alpha: "alpha", "in-alpha", Fixed("expansion coefficient α"), Expansion, "12", needed, Elastic,
        Choices::elastic_typed;
    /// Temperature change, K.
    DeltaT: "dT", "in-dt", Fixed("temperature change ΔT"), Temperature, "0", needed, Elastic,
        |_| true;
    // The static verdict and its material (judge/strength.rs).
    /// Required factor of safety.
    Required: "nreq", "in-nreq", Fixed("required factor of safety"), Ratio, "2", needed, Required,
        |_| true;
    /// Own material: tensile yield strength Sy (optional for brittle materials).
    MatSy: "msy", "in-msy", Fixed("yield strength Sy (empty if none)"), Strength, "250", optional, OwnMaterial,
        own_material;
    /// Own material: ultimate tensile strength Sut.
    MatSut: "msut", "in-msut", Fixed("ultimate tensile Sut"), Strength, "420", needed, OwnMaterial,
        own_material;
    /// Own material: ultimate compressive strength Suc (optional).
    MatSuc: "msuc", "in-msuc", Fixed("ultimate compressive Suc (optional)"), Strength, "", optional, OwnMaterial,
        own_material;
    /// Own material: elongation at fracture, percent.
    MatElong: "melong", "in-melong", Fixed("elongation at fracture"), Percent, "22", needed, OwnMaterial,
        own_material;
    // The fatigue check (judge/fatigue.rs).
    /// Stress ratio R = σmin/σmax of a proportional cycle.
    Ratio: "R", "in-ratio", Fixed("stress ratio R = σmin/σmax"), Ratio, "-1", needed, CycleRatio,
        |c| c.fatigue && c.cycle == Cycle::Ratio;
    /// The cycle's second state (minimum or alternating): σx.
    SecondX: "s2x", "in-s2x", SecondState("σx"), CaseStress, "", needed, SecondState,
        second_state;
    /// The cycle's second state (minimum or alternating): σy.
    SecondY: "s2y", "in-s2y", SecondState("σy"), CaseStress, "", needed, SecondState,
        second_state;
    /// The cycle's second state (minimum or alternating): σz.
    SecondZ: "s2z", "in-s2z", SecondState("σz"), CaseStress, "", needed, SecondState,
        second_state;
    /// The cycle's second state (minimum or alternating): τxy.
    SecondXy: "s2xy", "in-s2xy", SecondState("τxy"), CaseStress, "", needed, SecondState,
        second_state;
    /// The cycle's second state (minimum or alternating): τyz.
    SecondYz: "s2yz", "in-s2yz", SecondState("τyz"), CaseStress, "", needed, SecondState,
        second_state;
    /// The cycle's second state (minimum or alternating): τzx.
    SecondZx: "s2zx", "in-s2zx", SecondState("τzx"), CaseStress, "", needed, SecondState,
        second_state;
    /// Endurance limit Se, given.
    Se: "se", "in-se", Fixed("endurance limit Se (corrected)"), Strength, "160", needed, Endurance,
        |c| c.fatigue && c.endurance == Endurance::Given;
    /// Diameter for the size factor, mm.
    FatD: "fd", "in-fd", Fixed("diameter for the size factor"), Millimetre, "40", needed, Endurance,
        estimated_endurance;
    /// Operating temperature, °C.
    FatTemp: "ftemp", "in-ftemp", Fixed("operating temperature"), Celsius, "20", needed, Endurance,
        estimated_endurance;
    /// Reliability, percent.
    FatRel: "frel", "in-frel", Fixed("reliability"), Percent, "90", needed, Endurance,
        estimated_endurance;
    // Section loads that cycle, and the notch in fatigue (judge/fatigue.rs, source/section.rs).
    /// Alternating axial force.
    Na: "Na", "in-load-na", Fixed("axial force Na, alternating"), Force, "0", needed, AltLoads,
        alternating_loads;
    /// Alternating bending moment about y.
    Mya: "Mya", "in-load-mya", Fixed("bending moment Mya, alternating"), Moment, "0", needed, AltLoads,
        alternating_loads;
    /// Alternating bending moment about z.
    Mza: "Mza", "in-load-mza", Fixed("bending moment Mza, alternating"), Moment, "380", needed, AltLoads,
        alternating_loads;
    /// Alternating torque.
    Ta: "Ta", "in-load-ta", Fixed("torque Ta, alternating"), Moment, "0", needed, AltLoads,
        alternating_loads;
    /// Alternating shear force along y.
    Vya: "Vya", "in-load-vya", Fixed("shear force Vya, alternating"), Force, "0", needed, AltLoads,
        alternating_loads;
    /// Alternating shear force along z.
    Vza: "Vza", "in-load-vza", Fixed("shear force Vza, alternating"), Force, "0", needed, AltLoads,
        alternating_loads;
    /// Notch sensitivity q for normal stress, typed.
    Q: "q", "in-q", Fixed("notch sensitivity q (normal)"), Ratio, "1", needed, Notch,
        |c| c.notch_fatigue() && c.notch_q == NotchQ::Typed;
    /// Notch sensitivity qs for shear stress, typed.
    Qs: "qs", "in-qs", Fixed("notch sensitivity qs (shear)"), Ratio, "1", needed, Notch,
        |c| c.notch_fatigue() && c.notch_q == NotchQ::Typed;
    /// Notch root radius, for Neuber's equation.
    NotchR: "nr", "in-nr", Fixed("notch root radius r"), Length, "2", needed, Notch,
        |c| c.notch_fatigue() && c.notch_q == NotchQ::Neuber && c.kt_from == KtFrom::Typed;
    // The life in cycles (judge/life.rs).
    /// Fatigue strength fraction f at 10³ cycles, typed.
    LifeF: "lf", "in-lf", Fixed("strength fraction f at 10³ cycles"), Ratio, "0.9", needed, LifeLine,
        |c| c.life_on() && c.sn == SnFrom::Fraction;
    /// Own S–N curve: the reference life.
    SnN: "snn", "in-snn", Fixed("reference life Nref"), Cycles, "1000000", needed, LifeLine,
        own_curve;
    /// Own S–N curve: the fully reversed amplitude at the reference life.
    SnS: "sns", "in-sns", Fixed("amplitude at Nref (fully reversed)"), Strength, "210", needed, LifeLine,
        own_curve;
    /// Own S–N curve: Basquin's slope k (N ∝ σ^−k).
    SnK: "snk", "in-snk", Fixed("slope k (N ∝ σar^−k)"), Ratio, "8", needed, LifeLine,
        own_curve;
    /// Own S–N curve: its endurance limit (empty: the line goes on).
    SnLimit: "snl", "in-snl", Fixed("endurance limit of the curve (empty: none)"), Strength, "", optional, LifeLine,
        own_curve;
    /// Morrow's fatigue strength coefficient σ′f.
    SigmaF: "sfp", "in-sfp", Fixed("fatigue strength coefficient σ′f"), Strength, "900", needed, LifeLine,
        |c| c.life_on() && c.mean_stress == MeanStressPick::Morrow;
    /// How long the history lasts, hours (optional).
    HistHours: "hdur", "in-hdur", Fixed("duration of the history (empty: not known)"), Hours, "", optional, LifeHistory,
        Choices::any_history_on;
}

fn alternating_loads(c: &Choices) -> bool {
    c.loads_cycle() && !c.rotating_shaft()
}

fn own_curve(c: &Choices) -> bool {
    c.life_on() && c.sn == SnFrom::Own
}

/// The section kinds that take force and moment loads.
const LOADED: &[SectionKind] = &[SolidRound, Tube, Rectangle];

fn on_section(c: &Choices, kinds: &[SectionKind]) -> bool {
    c.source == Source::Section && kinds.contains(&c.kind)
}

/// Gauge `I` (0-based) is read.
fn gauge<const I: u8>(c: &Choices) -> bool {
    c.source == Source::Rosette && I < c.gauge_count()
}

/// Gauge `I`'s direction is typed (custom layouts only).
fn custom_angle<const I: u8>(c: &Choices) -> bool {
    gauge::<I>(c) && c.layout == Layout::Custom
}

fn strain_3d(c: &Choices) -> bool {
    c.source == Source::Strain && c.condition == Condition::Full
}

fn own_material(c: &Choices) -> bool {
    c.material == MaterialPick::Own
}

fn second_state(c: &Choices) -> bool {
    c.fatigue && matches!(c.cycle, Cycle::Minimum | Cycle::Alternating)
}

fn estimated_endurance(c: &Choices) -> bool {
    c.fatigue && c.endurance == Endurance::Estimate
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

fn kt_big_label(c: &Choices) -> String {
    match c.kt_from {
        KtFrom::Groove => "bar diameter D outside the groove".into(),
        KtFrom::FlatShoulder => "wider width H (the section's depth h is the narrower)".into(),
        _ => "larger diameter D (the section's d is the smaller)".into(),
    }
}

fn kt_radius_label(c: &Choices) -> String {
    match c.kt_from {
        KtFrom::Groove => "groove root radius r".into(),
        _ => "fillet radius r".into(),
    }
}

fn along_label(c: &Choices) -> String {
    match c.face {
        Face::PosY | Face::NegY => "point z on the face".into(),
        Face::PosZ | Face::NegZ => "point y on the face".into(),
    }
}

impl Num {
    /// Its declaration in [`INPUTS`] (rows are in variant order, so this is an index).
    #[must_use]
    pub fn input(self) -> &'static Input {
        &INPUTS[self as usize]
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
            Quantity::Cycles => "cycles",
            Quantity::Hours => "h",
        }
    }

    /// The demo value, in the default units.
    #[must_use]
    pub fn demo_text(self) -> &'static str {
        self.input().demo
    }
}

impl Num {
    /// Gauge `i`'s direction (0-based; clamped to the last gauge).
    #[must_use]
    pub const fn gauge_angle(i: u8) -> Num {
        GAUGE_ANGLES[if i < 8 { i as usize } else { 7 }]
    }

    /// Gauge `i`'s reading (0-based; clamped to the last gauge).
    #[must_use]
    pub const fn gauge_reading(i: u8) -> Num {
        GAUGE_READINGS[if i < 8 { i as usize } else { 7 }]
    }

    /// Component `i` (tensor order σx, σy, σz, τxy, τyz, τzx; clamped) of the cycle's second
    /// state.
    #[must_use]
    pub const fn second(i: u8) -> Num {
        SECOND[if i < 6 { i as usize } else { 5 }]
    }

    /// Whether this is a component of the cycle's second state.
    #[must_use]
    pub fn is_second(self) -> bool {
        SECOND.contains(&self)
    }
}

const GAUGE_ANGLES: [Num; 8] = [
    Num::GaugeAngle1,
    Num::GaugeAngle2,
    Num::GaugeAngle3,
    Num::GaugeAngle4,
    Num::GaugeAngle5,
    Num::GaugeAngle6,
    Num::GaugeAngle7,
    Num::GaugeAngle8,
];

const GAUGE_READINGS: [Num; 8] = [
    Num::GaugeReading1,
    Num::GaugeReading2,
    Num::GaugeReading3,
    Num::GaugeReading4,
    Num::GaugeReading5,
    Num::GaugeReading6,
    Num::GaugeReading7,
    Num::GaugeReading8,
];

const SECOND: [Num; 6] = [
    Num::SecondX,
    Num::SecondY,
    Num::SecondZ,
    Num::SecondXy,
    Num::SecondYz,
    Num::SecondZx,
];

/// The elastic constants every case carries (E, ν and α only when typed; see
/// [`Choices::elastic_typed`]).
pub const ELASTIC: [Num; 4] = [Num::E, Num::Nu, Num::Alpha, Num::DeltaT];

impl Choices {
    /// The numbers this set of choices uses, in the order they are shown.
    #[must_use]
    pub fn active(&self) -> Vec<Num> {
        INPUTS
            .iter()
            .filter(|i| (i.used)(self))
            .map(|i| i.num)
            .collect()
    }

    /// Whether the current choices use `n` (the same as `active().contains(&n)`, without
    /// going through every input).
    #[must_use]
    pub fn uses(&self, n: Num) -> bool {
        (n.input().used)(self)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::choices::MAX_GAUGES;

    proptest::proptest! {
        #[test]
        fn a_number_is_used_exactly_when_it_is_active(c in crate::formats::link::tests::arb_choices()) {
            let active = c.active();
            for row in INPUTS {
                proptest::prop_assert_eq!(c.uses(row.num), active.contains(&row.num), "{:?}", row.num);
            }
        }
    }

    #[test]
    fn every_number_is_declared_once() {
        // Each row's number finds its own row (the macro makes one variant per row).
        for (i, row) in INPUTS.iter().enumerate() {
            assert!(core::ptr::eq(row.num.input(), &INPUTS[i]), "{:?}", row.num);
        }
        // The families the page indexes: every gauge has an angle and a reading, the second
        // state has six components, each distinct.
        let family = |f: fn(u8) -> Num, n: u8| {
            let mut v: Vec<Num> = (0..n).map(f).collect();
            v.dedup();
            v.len()
        };
        assert_eq!(
            family(Num::gauge_angle, MAX_GAUGES),
            usize::from(MAX_GAUGES)
        );
        assert_eq!(
            family(Num::gauge_reading, MAX_GAUGES),
            usize::from(MAX_GAUGES)
        );
        assert_eq!(family(Num::second, 6), 6);
        assert_eq!(Place::Gauges.numbers().len(), 2 * usize::from(MAX_GAUGES));
        assert_eq!(Place::SecondState.numbers().len(), 6);
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
}
