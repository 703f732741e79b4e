//! The case on screen as plain data: what the user typed (strings), the choices made, and the
//! evaluation that core returns for it. No browser types here, so all of it is tested natively.

use crate::entry::parse_number;
use crate::link::{check_text, Case, MAX_NOTE, MAX_TITLE};
use crate::numfmt::format_for_entry;
use nalgebra::Vector3;
use stresscase_core::equivalent::Equivalent;
use stresscase_core::invariants::{deviatoric, Invariants};
use stresscase_core::transform::{face_normal_about_z, rotate_about_z, InPlane, PlaneTraction};
use stresscase_core::{
    AngleUnit, Mohr3d, PlaneMohr, Principal, ShearAxis, StressTensor, StressUnit,
};

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
            mode: Mode::Plane,
            unit: StressUnit::MPa,
            stress,
            angle: "30".into(),
            angle_unit: AngleUnit::Degree,
            normal: ["1".into(), "1".into(), "1".into()],
            shear_axis: ShearAxis::PositiveDown,
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
        !(self.mode == Mode::Plane && field.out_of_plane())
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
        self.unit = to;
    }

    /// Changes the angle unit, converting θ if it reads as a number.
    pub fn change_angle_unit(&mut self, to: AngleUnit) {
        if let Ok(v) = parse_number(&self.angle) {
            self.angle = format_for_entry(to.from_radians(self.angle_unit.to_radians(v)));
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
            Field::Title => check_text(&self.title, MAX_TITLE).err().map(str::to_string),
            Field::Note => check_text(&self.note, MAX_NOTE).err().map(str::to_string),
            _ => parse_number(self.text(field)).err().map(|e| e.to_string()),
        }
    }

    /// Validates every active field and, when all read, evaluates the case with core.
    ///
    /// # Errors
    /// Every field that is wrong, with its reason (in field order).
    pub fn evaluate(&self) -> Result<Evaluation, Vec<FieldProblem>> {
        Case::from_form(self)?.evaluate()
    }
}

impl Case {
    /// Evaluates the case with core.
    ///
    /// # Errors
    /// A core refusal (overflow of an extreme entry, zero normal), attached to the field it
    /// comes from.
    pub fn evaluate(&self) -> Result<Evaluation, Vec<FieldProblem>> {
        let c = self.stress;
        let n = self.normal;
        let angle = self.angle;
        let fail = |field: Field, e: stresscase_core::StressError| {
            vec![FieldProblem {
                field,
                message: e.to_string(),
            }]
        };
        let tensor = StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5])
            .map_err(|e| fail(Field::Sx, e))?;
        let theta = self.angle_unit.to_radians(angle);
        let probe = PlaneTraction::on(&tensor, Vector3::new(n[0], n[1], n[2]))
            .map_err(|e| fail(Field::Nx, e))?;
        let plane_mohr = PlaneMohr::of(&tensor, theta).map_err(|e| fail(Field::Angle, e))?;
        let rotated = rotate_about_z(&tensor, theta).map_err(|e| fail(Field::Angle, e))?;
        let deviatoric = deviatoric(&tensor).map_err(|e| fail(Field::Sx, e))?;
        let face = |angle: f64| {
            PlaneTraction::on(&tensor, face_normal_about_z(angle))
                .map_err(|e| fail(Field::Angle, e))
        };
        let half_turn = core::f64::consts::FRAC_PI_2;
        let faces_3d = [
            face(0.0)?,
            face(half_turn)?,
            face(theta)?,
            face(theta + half_turn)?,
        ];
        let mohr3d = Mohr3d::of(&tensor);
        let in_plane = InPlane::of(&tensor);
        Ok(Evaluation {
            unit: self.unit,
            mode: self.mode,
            shear_axis: self.shear_axis,
            tensor,
            theta,
            principal: Principal::of(&tensor),
            out_of_plane_governs: self.mode == Mode::Plane
                && mohr3d.out_of_plane_shear_governs(&in_plane),
            in_plane,
            plane_mohr,
            mohr3d,
            invariants: Invariants::of(&tensor),
            deviatoric,
            equivalent: Equivalent::of(&tensor),
            rotated,
            probe,
            faces_3d,
            angle_unit: self.angle_unit,
        })
    }
}

fn stress_index(f: Field) -> usize {
    Field::STRESS.iter().position(|&g| g == f).unwrap_or(0)
}

/// Everything core says about the case, in the case's stress unit (angles in radians).
#[derive(Debug, Clone, PartialEq)]
pub struct Evaluation {
    /// Unit of every stress below.
    pub unit: StressUnit,
    /// Mode it was entered in.
    pub mode: Mode,
    /// Shear plotting convention.
    pub shear_axis: ShearAxis,
    /// The validated tensor.
    pub tensor: StressTensor,
    /// Element turn, radians.
    pub theta: f64,
    /// σ1 ≥ σ2 ≥ σ3 and directions.
    pub principal: Principal,
    /// In-plane circle, principal and shear angles.
    pub in_plane: InPlane,
    /// In-plane diagram points.
    pub plane_mohr: PlaneMohr,
    /// The three circles.
    pub mohr3d: Mohr3d,
    /// Plane mode only: the absolute max shear acts out of plane and exceeds the in-plane one.
    pub out_of_plane_governs: bool,
    /// I1, I2, I3, J2, J3, σm.
    pub invariants: Invariants,
    /// s = σ − σm I.
    pub deviatoric: StressTensor,
    /// von Mises, Tresca, octahedral, triaxiality, Lode angle.
    pub equivalent: Equivalent,
    /// The tensor in axes turned by θ about z.
    pub rotated: StressTensor,
    /// Traction on the plane with the entered normal.
    pub probe: PlaneTraction,
    /// Tractions on the x, y, x′ and y′ faces (normals in the x–y plane), for the 3D diagram,
    /// where a face plots at (σn, |τn|).
    pub faces_3d: [PlaneTraction; 4],
    /// Unit for angles shown.
    pub angle_unit: AngleUnit,
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn demo_evaluates() {
        let e = CaseForm::demo().evaluate().unwrap();
        assert_eq!(e.tensor, StressTensor::plane(84.0, -22.0, 37.0).unwrap());
        assert!(e.principal.sigma1() > 84.0);
        assert!(!e.out_of_plane_governs); // σa > 0 > σb
    }

    #[test]
    fn every_bad_field_is_named() {
        let mut f = CaseForm::demo();
        f.set_text(Field::Sx, "abc".into());
        f.set_text(Field::Angle, "".into());
        let errs = f.evaluate().unwrap_err();
        assert_eq!(
            errs.iter().map(|p| p.field).collect::<Vec<_>>(),
            vec![Field::Sx, Field::Angle]
        );
        assert!(f.problem(Field::Sx).is_some());
        assert!(f.problem(Field::Sy).is_none());
    }

    #[test]
    fn plane_mode_ignores_out_of_plane_fields() {
        let mut f = CaseForm::demo();
        f.set_text(Field::Sz, "junk".into());
        assert!(f.evaluate().is_ok());
        assert!(f.problem(Field::Sz).is_none());
        f.mode = Mode::Full;
        assert!(f.evaluate().is_err());
        assert!(f.problem(Field::Sz).is_some());
    }

    #[test]
    fn zero_normal_is_reported_on_the_normal() {
        let mut f = CaseForm::demo();
        for n in Field::NORMAL {
            f.set_text(n, "0".into());
        }
        let errs = f.evaluate().unwrap_err();
        assert_eq!(errs[0].field, Field::Nx);
        assert!(errs[0].message.contains("zero length"));
    }

    #[test]
    fn unit_change_keeps_the_physical_state() {
        let mut f = CaseForm::demo();
        let before = f.evaluate().unwrap();
        f.change_unit(StressUnit::Ksi);
        let after = f.evaluate().unwrap();
        let k = StressUnit::MPa.convert(1.0, StressUnit::Ksi);
        assert!((after.principal.sigma1() - before.principal.sigma1() * k).abs() < 1e-9);
        f.change_unit(StressUnit::Psi);
        f.change_unit(StressUnit::GPa);
        f.change_unit(StressUnit::MPa);
        assert_eq!(f.text(Field::Sx), "84");
        assert_eq!(f.text(Field::Txy), "37");
        // A field that does not read is left as typed.
        f.set_text(Field::Sy, "oops".into());
        f.change_unit(StressUnit::Ksi);
        assert_eq!(f.text(Field::Sy), "oops");
    }

    #[test]
    fn angle_unit_change_keeps_the_turn() {
        let mut f = CaseForm::demo();
        let before = f.evaluate().unwrap().theta;
        f.change_angle_unit(AngleUnit::Radian);
        assert!(f.angle.starts_with("0.5235987"), "{}", f.angle);
        assert!((f.evaluate().unwrap().theta - before).abs() < 1e-11);
        f.set_angle_radians(1.0);
        assert_eq!(f.angle, "1");
    }

    #[test]
    fn extreme_but_finite_entries_do_not_panic() {
        let mut f = CaseForm::demo();
        f.mode = Mode::Full;
        for (i, s) in Field::STRESS.iter().enumerate() {
            f.set_text(
                *s,
                if i % 2 == 0 {
                    "1.7e308".into()
                } else {
                    "-1.7e308".into()
                },
            );
        }
        // Either a clear refusal or a result; never a panic.
        let _ = f.evaluate();
        f.set_text(Field::Angle, "1e300".into());
        let _ = f.evaluate();
    }
}
