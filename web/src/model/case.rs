//! The case on screen as plain data: what the user typed (the form's strings), the choices made,
//! and the validated [`Case`] they read into (raw text → validated case; `evaluation` takes it
//! on to the results). No browser types here, so all of it is tested natively.

use crate::model::choices::{Choices, Cycle, ElasticFrom, MaterialPick, Source};
use crate::model::entry::{parse_history, parse_number};
use crate::model::inputs::{Num, Quantity};
use crate::model::numfmt::{format_for_entry, write_number};
use crate::model::source::Numbers;
use std::collections::BTreeMap;
use stresscase_core::units::{ForceUnit, LengthUnit, MomentUnit, StrainUnit};
use stresscase_core::{AngleUnit, ShearAxis, StressUnit};

/// Longest title, in characters.
pub const MAX_TITLE: usize = 200;
/// Longest note, in characters.
pub const MAX_NOTE: usize = 2000;

/// Why a plane normal is refused, as the page and the link reader say it.
pub const ZERO_NORMAL: &str = "n: the plane normal has zero length";

/// Checks a title or note: length, no control characters, no script-like content.
///
/// # Errors
/// The reason, naming nothing (the caller names the field).
pub fn check_text(text: &str, max: usize) -> Result<(), &'static str> {
    if text.chars().count() > max {
        return Err(if max == MAX_TITLE {
            "longer than 200 characters"
        } else {
            "longer than 2000 characters"
        });
    }
    if text
        .chars()
        .any(|c| c.is_control() && c != '\n' && c != '\t')
    {
        return Err("contains control characters");
    }
    let lower = text.to_lowercase();
    if lower.contains("<script") || lower.contains("javascript:") {
        return Err("contains <script or javascript:, which a case never needs");
    }
    Ok(())
}

/// A case as values: what a link or a saved case holds.
#[derive(Debug, Clone, PartialEq)]
pub struct Case {
    /// Short description of the part and point.
    pub title: String,
    /// Longer free text.
    pub note: String,
    /// Plane or 3D.
    pub mode: Mode,
    /// Stress unit.
    pub unit: StressUnit,
    /// σx, σy, σz, τxy, τyz, τzx in `unit` (out-of-plane ones zero in plane mode).
    pub stress: [f64; 6],
    /// Element turn in `angle_unit`.
    pub angle: f64,
    /// Angle unit.
    pub angle_unit: AngleUnit,
    /// Plane normal (any non-zero length).
    pub normal: [f64; 3],
    /// Shear plotting convention.
    pub shear_axis: ShearAxis,
    /// Where the stress comes from, and that path's choices.
    pub choices: Choices,
    /// The numbers the path uses (exactly [`Choices::active`]), in their entry units.
    pub numbers: BTreeMap<Num, f64>,
    /// The typed load history in `unit` (empty unless the life is of a history).
    pub history: Vec<f64>,
}

impl Case {
    /// The built-in demo case.
    #[must_use]
    pub fn demo() -> Self {
        Self::from_form(&CaseForm::demo())
            .unwrap_or_else(|_| unreachable!("the demo form is valid"))
    }

    /// Reads a form; every active field must be valid.
    ///
    /// # Errors
    /// Each invalid field with its reason.
    pub fn from_form(form: &CaseForm) -> Result<Self, Vec<FieldProblem>> {
        let mut problems = Vec::new();
        let mut read = |field: Field| -> f64 {
            if !form.is_active(field) {
                return 0.0;
            }
            crate::model::case::read_field(field, form.text(field)).unwrap_or_else(|message| {
                problems.push(FieldProblem { field, message });
                0.0
            })
        };
        let stress = Field::STRESS.map(&mut read);
        let angle = read(Field::Angle);
        let normal = Field::NORMAL.map(&mut read);
        let numbers: BTreeMap<Num, f64> = form
            .choices
            .active()
            .into_iter()
            .filter(|&n| !(n.is_optional() && form.text(Field::Src(n)).trim().is_empty()))
            .map(|n| (n, read(Field::Src(n))))
            .collect();
        if normal == [0.0; 3] && !problems.iter().any(|p| Field::NORMAL.contains(&p.field)) {
            problems.push(FieldProblem {
                field: Field::Nx,
                message: ZERO_NORMAL.into(),
            });
        }
        for (field, text, max) in [
            (Field::Title, &form.title, MAX_TITLE),
            (Field::Note, &form.note, MAX_NOTE),
        ] {
            if let Err(why) = check_text(text, max) {
                problems.push(FieldProblem {
                    field,
                    message: why.into(),
                });
            }
        }
        let history = if form.choices.history_on() {
            parse_history(&form.history).unwrap_or_else(|message| {
                problems.push(FieldProblem {
                    field: Field::History,
                    message,
                });
                Vec::new()
            })
        } else {
            Vec::new()
        };
        if !problems.is_empty() {
            return Err(problems);
        }
        // A derived tensor has no typed mode or components of its own.
        let typed = form.choices.source == Source::Typed;
        // The user's own material has no elastic constants: they are typed.
        let mut choices = form.choices;
        if choices.material == MaterialPick::Own {
            choices.elastic = crate::model::choices::ElasticFrom::Typed;
        }
        Ok(Self {
            title: form.title.clone(),
            note: form.note.clone(),
            mode: if typed { form.mode } else { Mode::Plane },
            unit: form.unit,
            stress,
            angle,
            angle_unit: form.angle_unit,
            normal,
            shear_axis: form.shear_axis,
            choices,
            numbers,
            history,
        })
    }

    /// The form showing this case (numbers written in their shortest exact form).
    #[must_use]
    pub fn to_form(&self) -> CaseForm {
        let mut f = CaseForm::demo();
        f.title.clone_from(&self.title);
        f.note.clone_from(&self.note);
        f.mode = self.mode;
        f.unit = self.unit;
        for (field, v) in Field::STRESS.into_iter().zip(self.stress) {
            f.set_text(field, write_number(v));
        }
        f.angle = write_number(self.angle);
        f.angle_unit = self.angle_unit;
        f.normal = self.normal.map(write_number);
        f.shear_axis = self.shear_axis;
        f.choices = self.choices;
        for (&n, &v) in &self.numbers {
            f.nums.insert(n, write_number(v));
        }
        if !self.history.is_empty() {
            f.history = self
                .history
                .iter()
                .map(|&v| write_number(v))
                .collect::<Vec<_>>()
                .join(", ");
        }
        f
    }
}

/// Plane stress (σz = τyz = τzx = 0) or the full 3D tensor.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Mode {
    /// Only σx, σy, τxy are entered; the out-of-plane components are zero.
    #[default]
    Plane,
    /// All six components.
    Full,
}

/// Every input field, for attaching a message to the one that is wrong.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Field {
    /// σx
    Sx,
    /// σy
    Sy,
    /// σz
    Sz,
    /// τxy
    Txy,
    /// τyz
    Tyz,
    /// τzx
    Tzx,
    /// Element turn θ (degrees).
    Angle,
    /// Plane normal, x component.
    Nx,
    /// Plane normal, y component.
    Ny,
    /// Plane normal, z component.
    Nz,
    /// Case title (text).
    Title,
    /// Case note (text).
    Note,
    /// The typed load history (numbers in the case unit).
    History,
    /// A number of a source path (section, rosette, strains, elastic constants).
    Src(Num),
}

impl Field {
    /// The six stress fields in tensor order σx, σy, σz, τxy, τyz, τzx.
    pub const STRESS: [Field; 6] = [
        Field::Sx,
        Field::Sy,
        Field::Sz,
        Field::Txy,
        Field::Tyz,
        Field::Tzx,
    ];
    /// The three normal components.
    pub const NORMAL: [Field; 3] = [Field::Nx, Field::Ny, Field::Nz];

    /// The label shown beside the field.
    #[must_use]
    pub fn label(self) -> &'static str {
        match self {
            Field::Sx => "σx",
            Field::Sy => "σy",
            Field::Sz => "σz",
            Field::Txy => "τxy",
            Field::Tyz => "τyz",
            Field::Tzx => "τzx",
            Field::Angle => "θ",
            Field::Nx => "nx",
            Field::Ny => "ny",
            Field::Nz => "nz",
            Field::Title => "title",
            Field::Note => "note",
            Field::History => "load history",
            Field::Src(n) => n.key(),
        }
    }

    /// A stable id for the page (used by tests and labels).
    #[must_use]
    pub fn id(self) -> &'static str {
        match self {
            Field::Sx => "in-sx",
            Field::Sy => "in-sy",
            Field::Sz => "in-sz",
            Field::Txy => "in-txy",
            Field::Tyz => "in-tyz",
            Field::Tzx => "in-tzx",
            Field::Angle => "in-angle",
            Field::Nx => "in-nx",
            Field::Ny => "in-ny",
            Field::Nz => "in-nz",
            Field::Title => "in-title",
            Field::Note => "in-note",
            Field::History => "in-history",
            Field::Src(n) => n.id(),
        }
    }

    /// True for fields that are out-of-plane stress components (unused in plane mode).
    #[must_use]
    pub fn out_of_plane(self) -> bool {
        matches!(self, Field::Sz | Field::Tyz | Field::Tzx)
    }
}

/// A refused field and the reason, ready to show beside it.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct FieldProblem {
    /// Which field.
    pub field: Field,
    /// Why, in words.
    pub message: String,
}

/// The case as entered.
#[derive(Debug, Clone, PartialEq)]
pub struct CaseForm {
    /// One-line description of the part and point.
    pub title: String,
    /// Free text about the case.
    pub note: String,
    /// The load history as typed (used when the life is of a history).
    pub history: String,
    /// Plane or 3D.
    pub mode: Mode,
    /// Unit of every stress field.
    pub unit: StressUnit,
    /// σx, σy, σz, τxy, τyz, τzx as typed.
    pub stress: [String; 6],
    /// Element turn θ in `angle_unit`, counter-clockwise positive, as typed.
    pub angle: String,
    /// Unit of θ and of every angle shown.
    pub angle_unit: AngleUnit,
    /// Plane normal components as typed (any length; normalised).
    pub normal: [String; 3],
    /// How positive shear is drawn.
    pub shear_axis: ShearAxis,
    /// Where the stress comes from, and the choices of that path.
    pub choices: Choices,
    /// The text of every source number (kept when the path changes, so nothing typed is lost).
    pub nums: BTreeMap<Num, String>,
    /// What was last typed into each stress field and in which unit, so unit changes always
    /// convert from the typed value and changing back restores it exactly.
    typed: [(String, StressUnit); 6],
}

impl CaseForm {
    /// The built-in demo: an invented part and numbers, not from any reference.
    #[must_use]
    pub fn demo() -> Self {
        let stress: [String; 6] = [
            "84".into(),
            "-22".into(),
            "0".into(),
            "37".into(),
            "0".into(),
            "0".into(),
        ];
        Self {
            typed: stress.clone().map(|s| (s, StressUnit::MPa)),
            title: "Demo (invented): weld toe of the lifting-eye plate on a 3-tonne hoist crossbeam, top surface point".into(),
            note: String::new(),
            // Invented: one lift of the hoist, peaks and valleys at the weld toe.
            history: "0, 120, 15, 135, -40, 110, 5, 150, 30, 95, -25, 140, 0".into(),
            mode: Mode::Plane,
            unit: StressUnit::MPa,
            stress,
            angle: "30".into(),
            angle_unit: AngleUnit::Degree,
            normal: ["1".into(), "1".into(), "1".into()],
            shear_axis: ShearAxis::PositiveDown,
            // A new case takes E, ν and α from its material.
            choices: Choices {
                elastic: ElasticFrom::Material,
                ..Choices::default()
            },
            nums: Num::all()
                .into_iter()
                .map(|n| (n, n.demo_text().to_string()))
                .collect(),
        }
    }

    /// The label of a field as the page shows it (some depend on the section kind).
    #[must_use]
    pub fn label(&self, field: Field) -> String {
        match field {
            Field::Src(n) => n.label(&self.choices),
            f => f.label().to_string(),
        }
    }

    /// The unit shown beside a field ("" for a pure number such as a normal component).
    #[must_use]
    pub fn unit_of(&self, field: Field) -> &'static str {
        match field {
            Field::Angle => self.angle_unit.symbol(),
            Field::Nx | Field::Ny | Field::Nz | Field::Title | Field::Note => "",
            Field::Src(n) if n.quantity() == Quantity::CaseStress => self.unit.symbol(),
            Field::Src(n) => n.unit(&self.choices, self.angle_unit),
            _ => self.unit.symbol(),
        }
    }

    /// Changes the length unit, converting typed lengths.
    pub fn change_length_unit(&mut self, to: LengthUnit) {
        self.convert_quantity(Quantity::Length, self.choices.length.metres() / to.metres());
        self.choices.length = to;
    }

    /// Changes the force unit, converting typed forces.
    pub fn change_force_unit(&mut self, to: ForceUnit) {
        self.convert_quantity(Quantity::Force, self.choices.force.newtons() / to.newtons());
        self.choices.force = to;
    }

    /// Changes the moment unit, converting typed moments.
    pub fn change_moment_unit(&mut self, to: MomentUnit) {
        let k = self.choices.moment.newton_metres() / to.newton_metres();
        self.convert_quantity(Quantity::Moment, k);
        self.choices.moment = to;
    }

    /// Changes the pressure unit, converting typed pressures.
    pub fn change_pressure_unit(&mut self, to: StressUnit) {
        self.convert_quantity(Quantity::Pressure, self.choices.pressure.convert(1.0, to));
        self.choices.pressure = to;
    }

    /// Changes how the fatigue cycle's second state is given. A typed second state means the
    /// minimum in one mode and the amplitude in the other, so it is cleared (and asked for again)
    /// whenever the meaning changes: the same numbers are never re-read with a new meaning.
    pub fn set_cycle(&mut self, to: Cycle) {
        let from = self.choices.cycle;
        if self.choices.set_cycle_kind(to) && to != from {
            for i in 0..6 {
                self.nums.insert(Num::second(i), String::new());
            }
        }
    }

    /// Chooses where E, ν and α come from. Switching to typed values starts from the chosen
    /// material's (in the modulus unit), so the numbers do not jump.
    pub fn set_elastic(&mut self, to: ElasticFrom) {
        if to == ElasticFrom::Typed && !self.choices.elastic_typed() {
            if let Some(m) = self.choices.table_material() {
                let e = StressUnit::GPa.convert(m.e, self.choices.modulus_unit);
                self.nums.insert(Num::E, format_for_entry(e));
                self.nums.insert(Num::Nu, format_for_entry(m.nu));
                self.nums.insert(Num::Alpha, format_for_entry(m.alpha));
            }
        }
        self.choices.elastic = to;
    }

    /// Changes the unit of E, converting it.
    pub fn change_modulus_unit(&mut self, to: StressUnit) {
        self.convert_quantity(
            Quantity::Modulus,
            self.choices.modulus_unit.convert(1.0, to),
        );
        self.choices.modulus_unit = to;
    }

    /// Changes the unit of the user's strengths and endurance limit, converting them.
    pub fn change_strength_unit(&mut self, to: StressUnit) {
        self.convert_quantity(
            Quantity::Strength,
            self.choices.strength_unit.convert(1.0, to),
        );
        self.choices.strength_unit = to;
    }

    /// Changes the strain unit, converting readings and strains.
    pub fn change_strain_unit(&mut self, to: StrainUnit) {
        self.convert_quantity(
            Quantity::Strain,
            self.choices.strain_unit.factor() / to.factor(),
        );
        self.choices.strain_unit = to;
    }

    /// Multiplies every number field of `quantity` that reads by `factor` (a unit change).
    pub fn convert_quantity(&mut self, quantity: Quantity, factor: f64) {
        for (n, text) in &mut self.nums {
            if n.quantity() == quantity {
                if let Ok(v) = parse_number(text) {
                    *text = format_for_entry(v * factor);
                }
            }
        }
    }

    /// The raw text of a field.
    #[must_use]
    pub fn text(&self, field: Field) -> &str {
        match field {
            Field::Angle => &self.angle,
            Field::Nx => &self.normal[0],
            Field::Ny => &self.normal[1],
            Field::Nz => &self.normal[2],
            Field::Title => &self.title,
            Field::Note => &self.note,
            Field::History => &self.history,
            Field::Src(n) => self.nums.get(&n).map_or("", String::as_str),
            f => &self.stress[stress_index(f)],
        }
    }

    /// Replaces the raw text of a field.
    pub fn set_text(&mut self, field: Field, text: String) {
        match field {
            Field::Angle => self.angle = text,
            Field::Nx => self.normal[0] = text,
            Field::Ny => self.normal[1] = text,
            Field::Nz => self.normal[2] = text,
            Field::Title => self.title = text,
            Field::Note => self.note = text,
            Field::History => self.history = text,
            Field::Src(n) => {
                self.nums.insert(n, text);
            }
            f => {
                let i = stress_index(f);
                self.typed[i] = (text.clone(), self.unit);
                self.stress[i] = text;
            }
        }
    }

    /// Whether a field takes part in the current mode.
    #[must_use]
    pub fn is_active(&self, field: Field) -> bool {
        match field {
            Field::Src(n) => self.choices.uses(n),
            Field::History => self.choices.history_on(),
            f if Field::STRESS.contains(&f) => {
                self.choices.source == Source::Typed
                    && !(self.mode == Mode::Plane && f.out_of_plane())
            }
            _ => true,
        }
    }

    /// Changes the stress unit keeping the physical stresses: every field that reads as a number
    /// is rewritten in the new unit; fields that do not read are left as typed.
    pub fn change_unit(&mut self, to: StressUnit) {
        for (shown, (typed, typed_unit)) in self.stress.iter_mut().zip(&self.typed) {
            if *typed_unit == to {
                shown.clone_from(typed);
            } else if let Ok(v) = parse_number(typed) {
                *shown = format_for_entry(typed_unit.convert(v, to));
            }
        }
        self.convert_quantity(Quantity::CaseStress, self.unit.convert(1.0, to));
        if let Ok(h) = parse_history(&self.history) {
            let k = self.unit.convert(1.0, to);
            self.history = h
                .iter()
                .map(|&v| format_for_entry(v * k))
                .collect::<Vec<_>>()
                .join(", ");
        }
        self.unit = to;
    }

    /// Changes the angle unit, converting θ, the section point angle and gauge angles that read.
    pub fn change_angle_unit(&mut self, to: AngleUnit) {
        let from = self.angle_unit;
        let convert = |text: &mut String| {
            if let Ok(v) = parse_number(text) {
                *text = format_for_entry(to.from_radians(from.to_radians(v)));
            }
        };
        convert(&mut self.angle);
        for (n, text) in &mut self.nums {
            if n.quantity() == Quantity::Angle {
                convert(text);
            }
        }
        self.angle_unit = to;
    }

    /// Sets θ from radians, rounded for display (0.01° or 1e-4 rad).
    pub fn set_angle_radians(&mut self, radians: f64) {
        let v = self.angle_unit.from_radians(radians);
        let step = match self.angle_unit {
            AngleUnit::Degree => 100.0,
            AngleUnit::Radian => 10_000.0,
        };
        self.angle = format_for_entry((v * step).round() / step);
    }

    /// Sets all six stress fields at once (as if typed in the current unit).
    #[cfg(test)]
    pub fn set_stress(&mut self, values: [String; 6]) {
        for (f, v) in Field::STRESS.into_iter().zip(values) {
            self.set_text(f, v);
        }
    }

    /// The problem with one field, if any.
    #[must_use]
    pub fn problem(&self, field: Field) -> Option<String> {
        match field {
            _ if !self.is_active(field) => None,
            Field::Src(n) if n.is_optional() && self.text(field).trim().is_empty() => None,
            Field::Title => check_text(&self.title, MAX_TITLE).err().map(str::to_string),
            Field::Note => check_text(&self.note, MAX_NOTE).err().map(str::to_string),
            Field::History => parse_history(&self.history).err(),
            _ => read_field(field, self.text(field)).err(),
        }
    }
}

/// Reads a number field, with the reason when it does not read. An empty component of the
/// fatigue cycle's second state asks for it instead of suggesting a zero.
///
/// # Errors
/// The reason, in words.
pub fn read_field(field: Field, text: &str) -> Result<f64, String> {
    parse_number(text).map_err(|e| match field {
        Field::Src(n) if n.is_second() && text.trim().is_empty() => {
            "not given yet: type it, or press “Take the state on screen”".to_string()
        }
        _ => e.to_string(),
    })
}

fn stress_index(f: Field) -> usize {
    Field::STRESS.iter().position(|&g| g == f).unwrap_or(0)
}

impl Numbers for Case {
    fn get(&self, n: Num) -> f64 {
        self.numbers.get(&n).copied().unwrap_or(0.0)
    }
    fn absent(&self, n: Num) -> bool {
        !self.numbers.contains_key(&n)
    }
}

#[cfg(test)]
mod tests;
