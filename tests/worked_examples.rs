//! Worked examples and published closed-form results, each with its source, plus the rules of
//! thumb a practising engineer checks a Mohr diagram by (marked "common practice").

use stresscase_core::equivalent::Equivalent;
use stresscase_core::transform::{rotate_about_z, InPlane, PlaneTraction};
use stresscase_core::{Mohr3d, PlaneMohr, Principal, ShearAxis, StressTensor};
use stresscase_tests::check::close;

/// Shigley's Mechanical Engineering Design (9th ed.), Example 3-4, from memory: σx = 80 MPa,
/// τxy = 50 MPa clockwise (on the x face, i.e. τxy = −50 MPa in tensor signs), σy = 0. Printed
/// results: σ1 = 104.03 MPa, σ2 = −24.03 MPa, τ1 = 64.03 MPa, σ1 at 25.7° clockwise from x.
#[test]
fn shigley_example_3_4_from_memory() {
    let t = StressTensor::plane(80.0, 0.0, -50.0).unwrap();
    let ip = InPlane::of(&t);
    close("Shigley 3-4", "σ1", ip.sigma_a, 104.03, 0.005);
    close("Shigley 3-4", "σ2", ip.sigma_b, -24.03, 0.005);
    close("Shigley 3-4", "τ1", ip.radius, 64.03, 0.005);
    close(
        "Shigley 3-4",
        "θp (ccw +)",
        ip.theta_p.to_degrees(),
        -25.7,
        0.05,
    );
}

/// Thin-walled cylinder under internal pressure (Barlow; e.g. Gere & Goodno, *Mechanics of
/// Materials*, §8.3, from memory): hoop σθ = pr/t, axial σa = pr/(2t), radial ≈ 0 at the outer
/// surface. The maximum in-plane shear is pr/(4t) but the absolute maximum is pr/(2t), on planes
/// at 45° through the wall — the out-of-plane shear that plane-stress users miss.
#[test]
fn thin_cylinder_absolute_shear_is_out_of_plane() {
    let (p, r, th) = (2.0, 500.0, 10.0); // MPa, mm, mm (invented numbers)
    let t = StressTensor::plane(p * r / th, p * r / (2.0 * th), 0.0).unwrap();
    let ip = InPlane::of(&t);
    let m = Mohr3d::of(&t);
    close(
        "cylinder",
        "τ in-plane",
        ip.radius,
        p * r / (4.0 * th),
        1e-12,
    );
    close(
        "cylinder",
        "τ absolute",
        m.tau_max(),
        p * r / (2.0 * th),
        1e-12,
    );
    assert!(m.out_of_plane_shear_governs(&ip));
}

/// Thin sphere (same source): σ = pr/(2t) in every tangential direction; in-plane shear zero,
/// absolute maximum pr/(4t).
#[test]
fn thin_sphere_has_zero_in_plane_shear() {
    let s = 3.0 * 400.0 / (2.0 * 8.0);
    let t = StressTensor::plane(s, s, 0.0).unwrap();
    close("sphere", "τ in-plane", InPlane::of(&t).radius, 0.0, 1e-12);
    close(
        "sphere",
        "τ absolute",
        Mohr3d::of(&t).tau_max(),
        s / 2.0,
        1e-12,
    );
}

/// Combined normal and shear stress at a shaft surface (bending + torsion; e.g. Shigley §5-4,
/// from memory): σvm = √(σ² + 3τ²), Tresca σ1 − σ3 = √(σ² + 4τ²), σ1,2 = σ/2 ± √((σ/2)² + τ²).
#[test]
fn shaft_surface_published_formulas() {
    for (s, tau) in [(120.0, 45.0), (-80.0, 60.0), (0.0, 35.0), (250.0, -10.0)] {
        let t = StressTensor::plane(s, 0.0, tau).unwrap();
        let e = Equivalent::of(&t);
        let case = format!("σ={s}, τ={tau}");
        close(
            &case,
            "von Mises",
            e.von_mises,
            (s * s + 3.0 * tau * tau).sqrt(),
            1e-12 * s.abs().max(tau.abs()),
        );
        close(
            &case,
            "Tresca",
            e.tresca,
            (s * s + 4.0 * tau * tau).sqrt(),
            1e-12 * s.abs().max(tau.abs()),
        );
        let [s1, _, s3] = Principal::of(&t).values();
        let r = ((s / 2.0).powi(2) + tau * tau).sqrt();
        close(&case, "σ1", s1, s / 2.0 + r, 1e-12 * r);
        close(&case, "σ3", s3, s / 2.0 - r, 1e-12 * r);
    }
}

/// Pure torsion (Timoshenko & Goodier §104, from memory): principal stresses ±τ on faces at 45°.
#[test]
fn pure_shear_principal_faces_at_45_degrees() {
    let t = StressTensor::plane(0.0, 0.0, 70.0).unwrap();
    let ip = InPlane::of(&t);
    close("torsion", "σa", ip.sigma_a, 70.0, 1e-12);
    close("torsion", "σb", ip.sigma_b, -70.0, 1e-12);
    close("torsion", "θp", ip.theta_p.to_degrees(), 45.0, 1e-12);
}

/// Octahedral plane (e.g. Boresi & Schmidt, *Advanced Mechanics of Materials*, §2.5, from memory):
/// on the plane with normal (1,1,1)/√3 in principal axes, σoct = I1/3 and τoct = (√2/3)·σvm.
#[test]
fn octahedral_plane_traction_matches_octahedral_stresses() {
    let t = StressTensor::new(90.0, -30.0, 15.0, 0.0, 0.0, 0.0).unwrap();
    let pt = PlaneTraction::on(&t, nalgebra::Vector3::new(1.0, 1.0, 1.0)).unwrap();
    let e = Equivalent::of(&t);
    close("octahedral", "σn", pt.normal, e.octahedral_normal, 1e-12);
    close("octahedral", "τn", pt.shear, e.octahedral_shear, 1e-12);
}

/// Common practice: every Mohr circle is centred on the σ axis — the in-plane circle at
/// (σx+σy)/2, each principal circle midway between its two principal stresses — and the X and Y
/// points lie on the in-plane circle, opposite each other.
#[test]
fn common_practice_circle_centres_lie_on_the_sigma_axis() {
    let t = StressTensor::plane(64.0, -18.0, 27.0).unwrap();
    let m = PlaneMohr::of(&t, 0.0).unwrap();
    close("centre", "in-plane centre", m.circle.centre, 23.0, 1e-12);
    for p in [m.x_face, m.y_face] {
        close(
            "centre",
            "distance of a face point",
            m.circle.distance(p.sigma, p.tau),
            0.0,
            1e-12,
        );
    }
    // The centre is where the shear is zero: the midpoint of X and Y has τ = 0.
    close(
        "centre",
        "τ at the midpoint of XY",
        0.5 * (m.x_face.tau + m.y_face.tau),
        0.0,
        1e-12,
    );
    let m3 = Mohr3d::of(&StressTensor::new(64.0, -18.0, 12.0, 27.0, -9.0, 4.0).unwrap());
    let [s1, s2, s3] = m3.principal.values();
    close("centre", "C12", m3.c12.centre, (s1 + s2) / 2.0, 1e-12);
    close("centre", "C23", m3.c23.centre, (s2 + s3) / 2.0, 1e-12);
    close("centre", "C13", m3.c13.centre, (s1 + s3) / 2.0, 1e-12);
}

/// Common practice: the maximum in-plane shear face is 45° from the principal faces.
#[test]
fn common_practice_max_shear_face_is_45_degrees_from_principal() {
    for (sx, sy, txy) in [(64.0, -18.0, 27.0), (-5.0, 40.0, -12.0), (10.0, 10.0, 3.0)] {
        let t = StressTensor::plane(sx, sy, txy).unwrap();
        let ip = InPlane::of(&t);
        let d = (ip.theta_p - ip.theta_s).to_degrees().rem_euclid(90.0);
        close("45°", "θp − θs mod 90°", d, 45.0, 1e-9);
        let at_s = rotate_about_z(&t, ip.theta_s).unwrap();
        close("45°", "τ on the θs face", at_s.txy(), ip.radius, 1e-9);
    }
}

/// Common practice: an angle on the circle is twice the physical angle of the element.
#[test]
fn common_practice_circle_angle_is_twice_the_element_angle() {
    let t = StressTensor::plane(64.0, -18.0, 27.0).unwrap();
    for theta_deg in [10.0_f64, 35.0, 80.0, -60.0] {
        let m = PlaneMohr::of(&t, theta_deg.to_radians()).unwrap();
        let c = m.circle.centre;
        let axis = ShearAxis::PositiveDown;
        let a0 = axis.height(m.x_face.tau).atan2(m.x_face.sigma - c);
        let a1 = axis.height(m.x_rotated.tau).atan2(m.x_rotated.sigma - c);
        let turned = (a1 - a0).to_degrees().rem_euclid(360.0);
        close(
            "2θ",
            &format!("θ = {theta_deg}°"),
            turned,
            (2.0 * theta_deg).rem_euclid(360.0),
            1e-9,
        );
    }
}
