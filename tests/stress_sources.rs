//! Where the stress comes from — sections under load, pressure vessels, rosettes and Hooke's law —
//! checked against published tables and formulas (source beside each check) and, for the
//! least-squares rosette, against an independent linear-algebra crate (faer).

use core::f64::consts::PI;
use faer::linalg::solvers::SolveLstsq;
use faer::Mat;
use stresscase_core::hooke::{Elastic, Strain};
use stresscase_core::rosette::{reduce, Gauge, Transverse, DELTA, RECTANGULAR};
use stresscase_core::section::{
    Concentration, Face, Loads, Location, Pressure, Rectangle, Round, Section,
};
use stresscase_core::vessel::{lame, thin_cylinder, Ends};
use stresscase_core::StressTensor;
use stresscase_tests::check::close;

/// Saint-Venant torsion of a rectangle, long side b, short side a: τmax = T/(α·a²·b) at the middle
/// of the long side, θ′ = T/(β·a³·b·G). Timoshenko & Goodier, *Theory of Elasticity*, §109,
/// table (the same coefficients in Roark's Formulas, table 10.1), from memory.
#[test]
fn rectangle_torsion_coefficients_match_the_published_table() {
    let table = [
        (1.0, 0.208, 0.1406),
        (1.5, 0.231, 0.196),
        (2.0, 0.246, 0.229),
        (3.0, 0.267, 0.263),
        (4.0, 0.282, 0.281),
        (5.0, 0.291, 0.291),
        (10.0, 0.312, 0.312),
    ];
    for (ratio, alpha, beta) in table {
        let (a, b) = (10.0, 10.0 * ratio);
        // Short side along y, so the long faces are ±y.
        let r = Rectangle::new(a, b).unwrap();
        let t = 1.0e6;
        let tau = Section::Rectangle(r)
            .stress_at(
                &Loads {
                    t,
                    ..Loads::default()
                },
                &Pressure::NONE,
                Concentration::default(),
                Location::Rectangle {
                    face: Face::PosY,
                    along: 0.0,
                },
            )
            .unwrap()
            .txy();
        let case = format!("b/a = {ratio}");
        close(
            &case,
            "α = T/(τmax a² b)",
            t / (tau * a * a * b),
            alpha,
            0.0011,
        );
        let jt = r.properties().jt;
        close(&case, "β = Jt/(a³ b)", jt / (a * a * a * b), beta, 0.0011);
    }
}

/// Thin strip limit: Jt → a³b/3 and τmax → 3T/(a²b) (Timoshenko & Goodier §109, from memory).
#[test]
fn a_thin_strip_tends_to_one_third() {
    let r = Rectangle::new(1.0, 200.0).unwrap();
    let jt = r.properties().jt;
    // β = (1/3)(1 − 0.630 a/b), the published thin-strip correction (same source).
    close("strip", "β", jt / 200.0, (1.0 - 0.630 / 200.0) / 3.0, 1e-4);
}

/// Solid shaft under bending and torsion: σ = 32M/(πd³), τ = 16T/(πd³) at the outer fibre, and
/// the principal stresses σ/2 ± √((σ/2)² + τ²) (Shigley's *Mechanical Engineering Design*, §3-12
/// and §3-7, from memory). Invented numbers: d = 35 mm, M = 420 N·m, T = 610 N·m, in N and mm.
#[test]
fn shaft_under_bending_and_torsion() {
    let d = 35.0;
    let (m, t) = (420.0e3, 610.0e3); // N·mm
    let shaft = Round::solid(d).unwrap();
    let loads = Loads {
        mz: m,
        t,
        ..Loads::default()
    };
    let sec = Section::Round(shaft);
    // The extreme fibre in tension for +Mz is y < 0, i.e. φ = π.
    let s = sec
        .stress_at(
            &loads,
            &Pressure::NONE,
            Concentration::default(),
            Location::Round {
                phi: PI,
                r: d / 2.0,
            },
        )
        .unwrap();
    let d3 = PI * d * d * d;
    close("shaft", "σx", s.sx(), 32.0 * m / d3, 1e-9);
    close("shaft", "τxy", s.txy(), 16.0 * t / d3, 1e-9);
    let scan = sec
        .scan(&loads, &Pressure::NONE, Concentration::default(), 36)
        .unwrap();
    let sig = 32.0 * m / d3;
    let tau = 16.0 * t / d3;
    close(
        "shaft",
        "scan σ1",
        scan.max_principal.value,
        sig / 2.0 + (sig * sig / 4.0 + tau * tau).sqrt(),
        1e-9,
    );
    close(
        "shaft",
        "scan von Mises",
        scan.max_von_mises.value,
        (sig * sig + 3.0 * tau * tau).sqrt(),
        1e-9,
    );
}

/// Lamé thick cylinder, internal pressure only: σθ(a) = p(b² + a²)/(b² − a²),
/// σθ(b) = 2pa²/(b² − a²), σr(a) = −p, σr(b) = 0, closed-end σz = pa²/(b² − a²)
/// (Timoshenko & Goodier §28; Shigley §3-16, from memory).
#[test]
fn lame_surfaces_match_the_closed_forms() {
    let (p, a, b) = (42.0, 25.0, 45.0);
    let d = b * b - a * a;
    let bore = lame(p, 0.0, a, b, a, Ends::Closed, 0.3).unwrap();
    let out = lame(p, 0.0, a, b, b, Ends::Closed, 0.3).unwrap();
    close("Lamé", "σθ(a)", bore.hoop, p * (b * b + a * a) / d, 1e-12);
    close("Lamé", "σθ(b)", out.hoop, 2.0 * p * a * a / d, 1e-12);
    close("Lamé", "σr(a)", bore.radial, -p, 1e-12);
    close("Lamé", "σr(b)", out.radial, 0.0, 1e-12);
    close("Lamé", "σz", bore.axial, p * a * a / d, 1e-12);
    // The same through the tube section with pressure: the bore is the critical point.
    let tube = Section::Round(Round::tube(2.0 * b, 2.0 * a).unwrap());
    let pr = Pressure {
        inner: p,
        outer: 0.0,
        ends: Ends::Closed,
        nu: 0.3,
    };
    let scan = tube
        .scan(&Loads::default(), &pr, Concentration::default(), 16)
        .unwrap();
    let at_bore = StressTensor::new(bore.axial, bore.hoop, bore.radial, 0.0, 0.0, 0.0).unwrap();
    let vm = stresscase_core::equivalent::Equivalent::of(&at_bore).von_mises;
    close(
        "Lamé tube",
        "scan von Mises",
        scan.max_von_mises.value,
        vm,
        1e-9 * vm,
    );
    match scan.max_von_mises.at {
        Location::Round { r, .. } => close("Lamé tube", "critical radius", r, a, 1e-9),
        other => panic!("{other:?}"),
    }
}

/// A thick wall with a thin-wall formula: at b/a = 1.1 Barlow's mean-radius hoop stress is within
/// a few percent of Lamé's peak (Shigley §3-14, from memory: the usual 5 % claim for t ≤ r/10,
/// common practice).
#[test]
fn thin_wall_formula_is_close_at_a_tenth() {
    let (p, a, b) = (10.0, 100.0, 110.0);
    let thick = lame(p, 0.0, a, b, a, Ends::Open, 0.3).unwrap().hoop;
    let thin = thin_cylinder(p, 0.5 * (a + b), b - a, Ends::Open, true)
        .unwrap()
        .hoop;
    assert!((thick - thin).abs() / thick < 0.06, "{thick} vs {thin}");
}

fn gauges(angles: &[f64], strains: &[f64]) -> Vec<Gauge> {
    angles
        .iter()
        .zip(strains)
        .map(|(&angle, &strain)| Gauge { angle, strain })
        .collect()
}

/// Rectangular and delta rosette reduction equations (Vishay Micro-Measurements Tech Note
/// TN-515, from memory): rectangular εx = εa, εy = εc, γxy = 2εb − εa − εc; principal strains
/// (εa + εc)/2 ± (1/√2)·√((εa − εb)² + (εb − εc)²); delta principal strains
/// (εa + εb + εc)/3 ± (√2/3)·√((εa − εb)² + (εb − εc)² + (εc − εa)²). Invented readings.
#[test]
fn rosette_principal_strains_match_the_tech_note_equations() {
    let (a, b, c) = (612e-6, -95e-6, 240e-6);
    let r = reduce(&gauges(&RECTANGULAR, &[a, b, c]), None).unwrap();
    let root = ((a - b).powi(2) + (b - c).powi(2)).sqrt() / 2f64.sqrt();
    close(
        "rectangular",
        "ε1",
        r.principal[0],
        (a + c) / 2.0 + root,
        1e-18,
    );
    close(
        "rectangular",
        "ε2",
        r.principal[1],
        (a + c) / 2.0 - root,
        1e-18,
    );
    let d = reduce(&gauges(&DELTA, &[a, b, c]), None).unwrap();
    let root = 2f64.sqrt() / 3.0 * ((a - b).powi(2) + (b - c).powi(2) + (c - a).powi(2)).sqrt();
    close(
        "delta",
        "ε1",
        d.principal[0],
        (a + b + c) / 3.0 + root,
        1e-18,
    );
    close(
        "delta",
        "ε2",
        d.principal[1],
        (a + b + c) / 3.0 - root,
        1e-18,
    );
}

/// Principal stresses from a rectangular rosette (TN-515, from memory):
/// σ1,2 = E/2·[(εa + εc)/(1 − ν) ± √2/(1 + ν)·√((εa − εb)² + (εb − εc)²)].
#[test]
fn rosette_principal_stresses_match_the_tech_note_equation() {
    let (e, nu) = (200e3, 0.3); // MPa
    let (a, b, c) = (612e-6, -95e-6, 240e-6);
    let r = reduce(&gauges(&RECTANGULAR, &[a, b, c]), None).unwrap();
    let s = r.stress(&Elastic::try_new(e, nu).unwrap()).unwrap();
    let p = stresscase_core::transform::InPlane::of(&s);
    let root = 2f64.sqrt() / (1.0 + nu) * ((a - b).powi(2) + (b - c).powi(2)).sqrt();
    close(
        "rectangular",
        "σ1",
        p.sigma_a,
        e / 2.0 * ((a + c) / (1.0 - nu) + root),
        1e-9,
    );
    close(
        "rectangular",
        "σ2",
        p.sigma_b,
        e / 2.0 * ((a + c) / (1.0 - nu) - root),
        1e-9,
    );
}

/// Four or more gauges: our SVD least squares against faer's QR least squares on the same
/// system (an independent linear-algebra crate), residuals included.
#[test]
fn least_squares_rosette_agrees_with_faer() {
    let angles = [0.0, 0.5, 1.1, 1.9, 2.6, 3.0];
    let readings = [410e-6, 380e-6, 120e-6, -150e-6, 20e-6, 395e-6];
    let ours = reduce(&gauges(&angles, &readings), None).unwrap();
    let a = Mat::<f64>::from_fn(angles.len(), 3, |i, j| {
        let (s, c) = angles[i].sin_cos();
        [c * c, s * s, s * c][j]
    });
    let b = Mat::<f64>::from_fn(angles.len(), 1, |i, _| readings[i]);
    let x = a.qr().solve_lstsq(&b);
    close("faer", "εx", ours.ex, x[(0, 0)], 1e-15);
    close("faer", "εy", ours.ey, x[(1, 0)], 1e-15);
    close("faer", "γxy", ours.gxy, x[(2, 0)], 1e-15);
    let predicted = &a * &x;
    for (i, res) in ours.residuals.iter().enumerate() {
        close(
            "faer",
            &format!("residual {i}"),
            *res,
            readings[i] - predicted[(i, 0)],
            1e-15,
        );
    }
}

/// Transverse-sensitivity correction of a single gauge in a uniaxial field (Vishay TN-509, from
/// memory): the indicated strain is ε̂ = εa·(1 + Kt·ε_t/ε_a)/(1 − ν0·Kt); for a uniaxial stress
/// along the gauge, ε_t/ε_a = −ν, so the error is Kt(ν0 − ν)/(1 − ν0Kt) — zero when ν = ν0.
#[test]
fn transverse_sensitivity_vanishes_on_the_calibration_material() {
    let nu0 = 0.285;
    let m = Elastic::try_new(200e3, nu0).unwrap();
    let eps = m.strain(&StressTensor::plane(150.0, 0.0, 0.0).unwrap(), 0.0);
    let kt = 0.04;
    // Gauges at 0/45/90 read their axial strain plus Kt × the strain across them, divided by
    // (1 − ν0·Kt); on the calibration material, the 0° gauge reads εx exactly.
    let read = |th: f64| {
        let along = |t: f64| {
            eps.ex * t.cos().powi(2) + eps.ey * t.sin().powi(2) + eps.gxy * t.sin() * t.cos()
        };
        (along(th) + kt * along(th + PI / 2.0)) / (1.0 - nu0 * kt)
    };
    close(
        "TN-509",
        "0° gauge on ν0 material",
        read(0.0),
        eps.ex,
        1e-18,
    );
    let r = reduce(
        &gauges(&RECTANGULAR, &RECTANGULAR.map(read)),
        Some(Transverse { kt, nu0 }),
    )
    .unwrap();
    close("TN-509", "corrected εy", r.ey, eps.ey, 1e-18);
}

/// Hooke's law, fully restrained heating: σ = −E·α·ΔT/(1 − 2ν) in every direction; plane strain
/// restraint in z only: σz = ν(σx + σy) − EαΔT (Timoshenko & Goodier §13, §151, from memory).
#[test]
fn thermal_restraint_stresses() {
    let m = Elastic::try_new(70e3, 0.33).unwrap(); // MPa, an aluminium alloy (typical)
    let th = 23e-6 * 50.0;
    let s = m.stress(&Strain::default(), th).unwrap();
    close("restrained", "σx", s.sx(), -70e3 * th / (1.0 - 0.66), 1e-9);
    let ps = m.plane_strain(4e-4, -1e-4, 0.0, th).unwrap();
    close(
        "plane strain",
        "σz",
        ps.sz(),
        0.33 * (ps.sx() + ps.sy()) - 70e3 * th,
        1e-9,
    );
}
