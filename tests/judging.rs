//! Will it hold? Static criteria and fatigue checked against the published formulas written out
//! here independently (plane-stress forms), each with its source.

use stresscase_core::criteria::{failure_index, verdicts, Criterion};
use stresscase_core::fatigue::{self, factor, marin, FatigueCriterion, Loading, Surface};
use stresscase_core::material::{self, Strengths};
use stresscase_core::principal::principal_values;
use stresscase_core::StressTensor;
use stresscase_tests::check::close;

fn n(c: Criterion, t: &StressTensor, s: &Strengths) -> f64 {
    1.0 / failure_index(c, principal_values(t), s).unwrap()
}

/// Plane-stress von Mises σ′ = √(σx² − σxσy + σy² + 3τxy²) (Shigley's *Mechanical Engineering
/// Design*, eq. 5-15, from memory); n = Sy/σ′. Tresca in plane stress: n = Sy/(σ1 − σ3) with
/// σ3 = min(σB, 0) and σ1 = max(σA, 0) (eq. 5-3 and the three cases of §5-5, from memory).
/// Invented state on AISI 1045 cold-drawn.
#[test]
fn ductile_criteria_in_plane_stress() {
    let m = material::by_key("1045cd").unwrap();
    let s = m.strengths().unwrap();
    let sy = m.sy.unwrap();
    for (sx, sy_, txy) in [
        (120.0, -40.0, 65.0),
        (200.0, 90.0, 0.0),
        (-150.0, -60.0, 30.0),
    ] {
        let t = StressTensor::plane(sx, sy_, txy).unwrap();
        let vm = (sx * sx - sx * sy_ + sy_ * sy_ + 3.0 * txy * txy).sqrt();
        close(
            "eq. 5-15",
            "n von Mises",
            n(Criterion::VonMises, &t, &s),
            sy / vm,
            1e-9,
        );
        let c = 0.5 * (sx + sy_);
        let r = (0.25 * (sx - sy_).powi(2) + txy * txy).sqrt();
        let (a, b) = (c + r, c - r);
        let tresca = a.max(0.0) - b.min(0.0);
        close(
            "§5-5",
            "n Tresca",
            n(Criterion::Tresca, &t, &s),
            sy / tresca,
            1e-9,
        );
    }
}

/// Brittle Coulomb–Mohr in plane stress, σA ≥ σB (Shigley eq. 5-31a–c, from memory):
/// σA ≥ σB ≥ 0: n = Sut/σA; σA ≥ 0 ≥ σB: 1/n = σA/Sut − σB/Suc; 0 ≥ σA ≥ σB: n = −Suc/σB.
/// Grey cast iron class 30 from the built-in table.
#[test]
fn coulomb_mohr_quadrants() {
    let m = material::by_key("gci30").unwrap();
    let s = m.strengths().unwrap();
    let (sut, suc) = (m.sut, m.suc.unwrap());
    let cases = [
        ((60.0, 20.0), sut / 60.0),
        ((40.0, -120.0), 1.0 / (40.0 / sut + 120.0 / suc)),
        ((-30.0, -200.0), suc / 200.0),
    ];
    for ((a, b), want) in cases {
        let t = StressTensor::plane(a, b, 0.0).unwrap();
        close(
            "eq. 5-31",
            &format!("({a}, {b})"),
            n(Criterion::CoulombMohr, &t, &s),
            want,
            1e-9,
        );
    }
}

/// The decision: a point at exactly 1/n of the yield stress passes a required factor of n
/// and fails a higher one.
#[test]
fn pass_and_fail_follow_the_required_factor() {
    let s = material::by_key("1020hr").unwrap().strengths().unwrap();
    let t = StressTensor::plane(105.0, 0.0, 0.0).unwrap(); // Sy = 210 MPa
    let v = verdicts(&t, &s, 2.0);
    let vm = v
        .iter()
        .find(|v| v.criterion == Criterion::VonMises)
        .unwrap();
    close("1020 HR", "n", vm.factor.unwrap(), 2.0, 1e-12);
    assert!(vm.passes);
    assert!(!verdicts(&t, &s, 2.5)[0].passes);
}

/// Fatigue criteria (Shigley table 6-7 and eqs. 6-41 to 6-49, from memory), written out for an
/// invented cycle: modified Goodman σa/Se + σm/Sut = 1/n; Gerber nσa/Se + (nσm/Sut)² = 1;
/// ASME-elliptic (nσa/Se)² + (nσm/Sy)² = 1; Soderberg σa/Se + σm/Sy = 1/n; Langer
/// σa + σm = Sy/n.
#[test]
fn fatigue_criteria_meet_their_published_equations() {
    let (se, sut, sy) = (210.0, 630.0, 530.0);
    let (sa, sm) = (70.0, 110.0);
    let f = |c| factor(c, sa, sm, se, sut, sy).unwrap();
    close(
        "Goodman",
        "1/n",
        1.0 / f(FatigueCriterion::Goodman),
        sa / se + sm / sut,
        1e-12,
    );
    let g = f(FatigueCriterion::Gerber);
    close(
        "Gerber",
        "on the parabola",
        g * sa / se + (g * sm / sut).powi(2),
        1.0,
        1e-12,
    );
    let e = f(FatigueCriterion::AsmeElliptic);
    close(
        "ASME",
        "on the ellipse",
        (e * sa / se).powi(2) + (e * sm / sy).powi(2),
        1.0,
        1e-12,
    );
    close(
        "Soderberg",
        "1/n",
        1.0 / f(FatigueCriterion::Soderberg),
        sa / se + sm / sy,
        1e-12,
    );
    close(
        "Langer",
        "n",
        f(FatigueCriterion::FirstCycleYield),
        sy / (sa + sm),
        1e-12,
    );
}

/// Marin surface factor ka = a·Sut^b with Shigley's table 6-2 coefficients (from memory), and
/// the rotating-beam estimate Se′ = 0.5 Sut (eq. 6-8).
#[test]
fn marin_surface_factors() {
    let sut = 600.0;
    for (surface, a, b) in [
        (Surface::Ground, 1.58, -0.085),
        (Surface::Machined, 4.51, -0.265),
        (Surface::HotRolled, 57.7, -0.718),
        (Surface::AsForged, 272.0, -0.995),
    ] {
        let m = marin(surface, sut, 20.0, Loading::Bending, 20.0, 50.0).unwrap();
        close(
            "table 6-2",
            &format!("{surface:?} ka"),
            m.ka,
            (a * sut.powf(b)).min(1.0),
            1e-12,
        );
    }
    close(
        "eq. 6-8",
        "Se′",
        fatigue::unmodified_endurance_mpa(sut),
        300.0,
        0.0,
    );
}
