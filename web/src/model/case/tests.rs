//! The case model's own tests: the form, validation, and evaluation through it.

use super::*;
use stresscase_core::StressTensor;

#[test]
fn demo_evaluates() {
    let e = CaseForm::demo().evaluate().unwrap();
    assert_eq!(e.tensor, StressTensor::plane(84.0, -22.0, 37.0).unwrap());
    assert!(e.principal.sigma1() > 84.0);
    assert!(!e.out_of_plane_governs); // σI > 0 > σII
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
fn source_unit_changes_keep_the_stress() {
    let mut f = CaseForm::demo();
    f.choices.source = Source::Section;
    f.choices.kind = crate::model::choices::SectionKind::Tube;
    let before = f.evaluate().unwrap().tensor;
    f.change_length_unit(LengthUnit::In);
    f.change_force_unit(ForceUnit::Lbf);
    f.change_moment_unit(MomentUnit::LbfFt);
    f.change_pressure_unit(StressUnit::Psi);
    f.change_angle_unit(AngleUnit::Radian);
    let after = f.evaluate().unwrap().tensor;
    for (a, b) in before.components().iter().zip(after.components()) {
        assert!((a - b).abs() <= 1e-9 * (1.0 + a.abs()), "{a} vs {b}");
    }
    f.choices.source = Source::Rosette;
    let before = f.evaluate().unwrap().tensor;
    f.change_strain_unit(StrainUnit::Unit);
    f.change_modulus_unit(StressUnit::Ksi);
    let after = f.evaluate().unwrap().tensor;
    for (a, b) in before.components().iter().zip(after.components()) {
        assert!((a - b).abs() <= 1e-9 * (1.0 + a.abs()), "{a} vs {b}");
    }
}

#[test]
fn a_core_refusal_is_attached_to_its_field() {
    let mut f = CaseForm::demo();
    f.choices.source = Source::Section;
    f.choices.kind = crate::model::choices::SectionKind::Tube;
    f.set_text(Field::Src(Num::Di), "45".into());
    let errs = f.evaluate().unwrap_err();
    assert_eq!(errs[0].field, Field::Src(Num::Di));
    // The typed stress fields are not in use on this path.
    f.set_text(Field::Sx, "junk".into());
    assert!(!f.is_active(Field::Sx));
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
