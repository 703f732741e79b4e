//! Validated case → results: everything core says about the case, in one [`Evaluation`]. The
//! source path gives the tensor (or the typed components do), then the strain state, the
//! judgement, the governing points, and every view of the tensor. A core refusal is attached to
//! the field it comes from.

use crate::model::case::{Case, CaseForm, Field, FieldProblem, Mode};
use crate::model::choices::Choices;
use crate::model::source::{self, ElasticUsed, Outcome};
use nalgebra::Vector3;
use stresscase_core::equivalent::Equivalent;
use stresscase_core::hooke::Strain;
use stresscase_core::invariants::{deviatoric, Invariants, Magnitudes};
use stresscase_core::transform::{face_normal_about_z, rotate_about_z, InPlane, PlaneTraction};
use stresscase_core::{
    AngleUnit, Mohr3d, PlaneMohr, Principal, ShearAxis, StressTensor, StressUnit,
};

/// Everything core says about the case, in the case's stress unit (angles in radians).
#[derive(Debug, Clone, PartialEq)]
pub struct Evaluation {
    /// Unit of every stress below.
    pub unit: StressUnit,
    /// Plane or 3D: as entered for typed components; for a derived tensor, plane exactly when
    /// σz = τyz = τzx = 0.
    pub mode: Mode,
    /// The source path and its choices (units of the source results).
    pub choices: Choices,
    /// What the source path found besides the tensor (None for typed components).
    pub outcome: Option<Outcome>,
    /// The strain state of this stress by Hooke's law with the case's E, ν and α·ΔT
    /// (dimensionless, engineering shear).
    pub strain: Strain,
    /// The elastic constants used, and where they come from.
    pub elastic: ElasticUsed,
    /// The material's verdict on this state, and the fatigue check.
    pub judgement: crate::model::judge::Judgement,
    /// Sections: where on the section the decision is hardest.
    pub governing: Option<crate::model::judge::Governing>,
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
    /// I1, I2, I3, J2, J3, σh.
    pub invariants: Invariants,
    /// I2, I3, J2, J3 in range-safe form (reported beyond double range, never as 0 or inf).
    pub magnitudes: Magnitudes,
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

impl CaseForm {
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
        let from_source = |p: source::SourceProblem| {
            vec![FieldProblem {
                field: Field::Src(p.num),
                message: p.message,
            }]
        };
        let derived = source::evaluate(&self.choices, self, self.unit, self.angle_unit)
            .map_err(from_source)?;
        let (tensor, outcome, mode) = match derived {
            Some((t, o)) => {
                let mode = if t.is_plane() {
                    Mode::Plane
                } else {
                    Mode::Full
                };
                (t, Some(o), mode)
            }
            None => (
                StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5])
                    .map_err(|e| fail(Field::Sx, e))?,
                None,
                self.mode,
            ),
        };
        let elastic = source::elastic(&self.choices, self).map_err(from_source)?;
        let strain = tensor
            .scaled(self.unit.pascals())
            .map(|t| elastic.material.strain(&t, elastic.thermal))
            .map_err(|e| fail(Field::Sx, e))?;
        let mut judgement =
            crate::model::judge::judge(&self.choices, self, &tensor, (self.unit, self.angle_unit))
                .map_err(from_source)?;
        crate::model::judge::judge_life(
            &mut judgement,
            &self.choices,
            self,
            self.unit,
            &self.history,
        )
        .map_err(|p| vec![p])?;
        let governing = crate::model::judge::governing(
            &self.choices,
            self,
            (self.unit, self.angle_unit),
            &judgement,
        )
        .map_err(from_source)?;
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
            mode,
            choices: self.choices,
            outcome,
            strain,
            elastic,
            judgement,
            governing,
            shear_axis: self.shear_axis,
            tensor,
            theta,
            principal: Principal::of(&tensor),
            out_of_plane_governs: mode == Mode::Plane
                && mohr3d.out_of_plane_shear_governs(&in_plane),
            in_plane,
            plane_mohr,
            mohr3d,
            invariants: Invariants::of(&tensor),
            magnitudes: Magnitudes::of(&tensor),
            deviatoric,
            equivalent: Equivalent::of(&tensor),
            rotated,
            probe,
            faces_3d,
            angle_unit: self.angle_unit,
        })
    }
}
