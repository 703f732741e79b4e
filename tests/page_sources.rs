//! The stress from loads on a section, from a rosette and from strains, in the built page in
//! headless Chromium. Every number read from the page is compared with stresscase-core run here
//! on the same inputs (converted to SI by the exact unit factors).

use stresscase_core::equivalent::Equivalent;
use stresscase_core::hooke::Elastic;
use stresscase_core::rosette::{reduce, Gauge, DELTA};
use stresscase_core::section::{Concentration, Loads, Location, Pressure, Round, Section};
use stresscase_core::vessel::Ends;
use stresscase_core::{Mohr3d, Principal};
use stresscase_tests::page::Page;

const MPA: f64 = 1e6;

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn loads_on_a_tube_find_the_critical_point_and_its_circles() {
    let mut p = Page::open();
    p.b.click("src-section").unwrap();
    p.wait_for_id("section-kind");
    p.choose("section-kind", "tube");
    p.wait_for_id("in-di");
    // A pressurised tube in bending and torsion: mm, kN, N·m, MPa (invented numbers).
    for (id, v) in [
        ("in-d", "60"),
        ("in-di", "40"),
        ("in-load-n", "0"),
        ("in-load-mz", "900"),
        ("in-load-t", "1200"),
        ("in-load-vy", "0"),
        ("in-pin", "25"),
        ("in-phi", "0"),
        ("in-r", "30"),
    ] {
        p.b.type_into(id, v).unwrap();
    }
    let sec = Section::Round(Round::tube(0.060, 0.040).unwrap());
    let loads = Loads {
        mz: 900.0,
        t: 1200.0,
        ..Loads::default()
    };
    let pr = Pressure {
        inner: 25.0 * MPA,
        outer: 0.0,
        ends: Ends::Closed,
        nu: 0.3,
    };
    let k = Concentration::default();
    let scan = sec.scan(&loads, &pr, k, 72).unwrap();
    let max_vm = scan.max_von_mises.value / MPA;
    p.wait_number(
        "highest von Mises on the plot",
        "document.getElementById('scan-svg').dataset.maxVm",
        max_vm,
    );
    p.wait_value("scan_max_vm", max_vm);
    p.wait_value("scan_max_s1", scan.max_principal.value / MPA);
    // The point as typed: φ = 0 on the outer surface.
    let at = |phi: f64, r: f64| {
        sec.stress_at(&loads, &pr, k, Location::Round { phi, r })
            .unwrap()
    };
    let here = at(0.0, 0.030);
    p.wait_value("von_mises", Equivalent::of(&here).von_mises / MPA);
    // One click moves the point to the critical one; the stress view follows.
    p.b.click("use-max-vm").unwrap();
    p.wait_value("von_mises", max_vm);
    // On the section sketch the chosen point now sits on the highest-von-Mises mark.
    p.b.wait_for(
        "(() => { const q = (r) => document.querySelector(`#section-svg circle[data-role=\"${r}\"]`); const c = q('chosen'), m = q('max-vm'); return c !== null && m !== null && Math.hypot(c.cx.baseVal.value - m.cx.baseVal.value, c.cy.baseVal.value - m.cy.baseVal.value) < 0.5; })()",
        stresscase_tests::page::WAIT,
    )
    .expect("the sketch shows the chosen point at the critical one");
    let Location::Round { phi, r } = scan.max_von_mises.at else {
        panic!("round section")
    };
    let crit = at(phi, r).scaled(1.0 / MPA).unwrap();
    // The bore is critical: Lamé's hoop stress is largest there (Timoshenko & Goodier §28).
    assert!((r - 0.020).abs() < 1e-9, "critical radius {r}");
    let pv = Principal::of(&crit).values();
    // φ is rounded to 1e-4° when moved into the field, so compare to 1e-6 relative.
    for (key, want) in [("sigma1", pv[0]), ("sigma2", pv[1]), ("sigma3", pv[2])] {
        let got = p.value(key);
        assert!(
            (got - want).abs() <= 1e-6 * want.abs().max(1.0),
            "{key}: {got} vs {want}"
        );
    }
    let m = Mohr3d::of(&crit);
    for (role, c) in [("c13", m.c13), ("c12", m.c12), ("c23", m.c23)] {
        let (ox, _, kk, cx, _, rr) = p.circle(role);
        assert!(
            ((cx - ox) / kk - c.centre).abs() <= 1e-5 * c.centre.abs().max(1.0),
            "{role} centre"
        );
        assert!(
            (rr / kk - c.radius).abs() <= 1e-5 * c.radius.max(1.0),
            "{role} radius"
        );
    }
    assert!(p
        .text("document.querySelector('td[data-key=\"scan_max_vm_at\"]').textContent")
        .contains("r = 20.00 mm"));
    assert!(p
        .text("document.getElementById('section-warnings').textContent")
        .contains("Saint-Venant"));
    // The case link holds the section path.
    let link = p.link();
    assert!(
        link.contains("src=section") && link.contains("kind=tube") && link.contains("pin=25"),
        "{link}"
    );
    p.no_console_errors();
    p.shot("section-tube");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_delta_rosette_gives_principal_stresses() {
    let mut p = Page::open();
    p.b.click("src-rosette").unwrap();
    p.wait_for_id("rosette-layout");
    p.choose("rosette-layout", "delta");
    let readings = [400.0, -150.0, 620.0]; // µε, invented
    for (i, v) in readings.iter().enumerate() {
        p.b.type_into(&format!("in-ge{}", i + 1), &v.to_string())
            .unwrap();
    }
    // Typed constants of an aluminium alloy, not the chosen material's.
    p.choose("elastic-from", "typed");
    p.wait_for_id("in-e");
    p.choose("modulus-unit", "GPa");
    p.b.type_into("in-e", "71").unwrap();
    p.b.type_into("in-nu", "0.33").unwrap();
    let g: Vec<Gauge> = DELTA
        .iter()
        .zip(readings)
        .map(|(&angle, r)| Gauge {
            angle,
            strain: r * 1e-6,
        })
        .collect();
    let r = reduce(&g, None).unwrap();
    let s = r
        .stress(&Elastic::try_new(71e9, 0.33).unwrap())
        .unwrap()
        .scaled(1.0 / MPA)
        .unwrap();
    let pv = Principal::of(&s).values();
    for (key, want) in [("sigma1", pv[0]), ("sigma2", pv[1]), ("sigma3", pv[2])] {
        p.wait_value(key, want);
    }
    p.wait_value("ros_e1", r.principal[0] * 1e6);
    p.wait_value("ros_e2", r.principal[1] * 1e6);
    p.wait_value("ros_theta_p", r.theta_p.to_degrees());
    // The sketch shows three gauges at 0°, 60°, 120°, and the strain circle is drawn.
    assert_eq!(
        p.text("Array.from(document.querySelectorAll('#rosette-svg .gauge text')).map(t => t.textContent).join('|')"),
        "1 (0°)|2 (60.0°)|3 (120°)"
    );
    let (ox, k, cx, rr) = {
        let v = p
            .b
            .eval("(() => { const s = document.getElementById('strain-svg'); const c = s.querySelector('circle[data-role=\"strain\"]'); return [+s.dataset.originX, +s.dataset.pxPerUnit, +c.getAttribute('cx'), +c.getAttribute('r')]; })()")
            .unwrap();
        let f = |i: usize| v[i].as_f64().unwrap();
        (f(0), f(1), f(2), f(3))
    };
    let centre = 0.5 * (r.principal[0] + r.principal[1]) * 1e6;
    assert!(((cx - ox) / k - centre).abs() < 1e-6 * centre.abs().max(1.0));
    assert!((rr / k - 0.5 * r.gamma_max * 1e6).abs() < 1e-6 * r.gamma_max * 1e6);
    let link = p.link();
    assert!(
        link.contains("src=rosette") && link.contains("layout=delta"),
        "{link}"
    );
    p.no_console_errors();
    p.shot("rosette-delta");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_singular_rosette_says_why_and_keeps_the_last_result() {
    let mut p = Page::open();
    p.b.click("src-rosette").unwrap();
    p.wait_for_id("rosette-layout");
    p.choose("rosette-layout", "any");
    p.choose("gauge-count", "3");
    p.wait_for_id("in-ga3");
    let before = p.value("sigma1");
    for (id, v) in [("in-ga1", "0"), ("in-ga2", "180"), ("in-ga3", "360")] {
        p.b.type_into(id, v).unwrap();
    }
    p.b.wait_for(
        "(document.getElementById('in-ga1-msg')?.textContent ?? '').includes('three different directions')",
        stresscase_tests::page::WAIT,
    )
    .expect("the angle field says why");
    assert!(p
        .text("document.getElementById('stale-notice').textContent")
        .contains("gauge 1 angle"));
    // The last good result stays on screen.
    assert_eq!(p.value("sigma1"), before);
    // Spreading the angles brings the page back.
    p.b.type_into("in-ga2", "60").unwrap();
    p.b.type_into("in-ga3", "120").unwrap();
    p.b.wait_for(
        "document.getElementById('stale-notice') === null",
        stresscase_tests::page::WAIT,
    )
    .expect("fresh again");
    p.no_console_errors();
    p.shot("rosette-singular");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn strains_by_hookes_law_and_a_link_that_reopens_them() {
    let mut p = Page::open();
    p.b.click("src-strain").unwrap();
    p.wait_for_id("strain-condition");
    p.choose("strain-condition", "pstrain");
    p.choose("elastic-from", "typed");
    p.wait_for_id("in-e");
    for (id, v) in [
        ("in-ex", "350"),
        ("in-ey", "-120"),
        ("in-gxy", "410"),
        ("in-e", "200"),
        ("in-nu", "0.3"),
    ] {
        p.b.type_into(id, v).unwrap();
    }
    let m = Elastic::try_new(200e9, 0.3).unwrap();
    let s = m
        .plane_strain(350e-6, -120e-6, 410e-6, 0.0)
        .unwrap()
        .scaled(1.0 / MPA)
        .unwrap();
    // Plane strain gives σz = ν(σx + σy): the state is 3D and the derived σz is shown.
    p.wait_number(
        "derived σz",
        "document.getElementById('derived-sz').dataset.value",
        s.sz(),
    );
    let pv = Principal::of(&s).values();
    p.wait_value("sigma1", pv[0]);
    p.wait_value("sigma3", pv[2]);
    // Hooke's law back again: the strain rows read what was typed.
    p.wait_value("eps_x", 350.0);
    p.wait_value("gam_xy", 410.0);
    // Reopening the link restores the path and the numbers.
    p.link();
    let link = p.text("location.href");
    let mut q = Page::open_at("/", &link[link.find('#').unwrap()..]);
    q.wait_value("sigma1", pv[0]);
    assert_eq!(q.text("document.getElementById('in-ex').value"), "350");
    q.no_console_errors();
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_rectangle_in_bending_and_torsion_finds_its_critical_face() {
    use stresscase_core::section::{Face, Rectangle};
    let mut p = Page::open();
    p.b.click("src-section").unwrap();
    p.wait_for_id("section-kind");
    p.choose("section-kind", "rect");
    p.wait_for_id("in-h");
    // A 20 × 50 mm bar (depth along y, width along z): bending about z and torsion, N·m.
    for (id, v) in [
        ("in-h", "20"),
        ("in-b", "50"),
        ("in-load-n", "0"),
        ("in-load-mz", "300"),
        ("in-load-t", "250"),
        ("in-load-vy", "0"),
        ("in-along", "25"),
    ] {
        p.b.type_into(id, v).unwrap();
    }
    let sec = Section::Rectangle(Rectangle::new(0.020, 0.050).unwrap());
    let loads = Loads {
        mz: 300.0,
        t: 250.0,
        ..Loads::default()
    };
    let k = Concentration::default();
    let corner = sec
        .stress_at(
            &loads,
            &Pressure::NONE,
            k,
            Location::Rectangle {
                face: Face::PosY,
                along: 0.025,
            },
        )
        .unwrap();
    // At the corner the torsion shear vanishes (Saint-Venant): a uniaxial state.
    p.wait_value("von_mises", Equivalent::of(&corner).von_mises / MPA);
    assert!(corner.txy().abs() < 1e-6 * corner.sx().abs());
    let scan = sec.scan(&loads, &Pressure::NONE, k, 72).unwrap();
    p.wait_value("scan_max_vm", scan.max_von_mises.value / MPA);
    p.b.click("use-max-vm").unwrap();
    p.wait_value("von_mises", scan.max_von_mises.value / MPA);
    // The long faces (±y) carry the largest bending and torsion stresses: the critical point
    // is at the middle of one of them.
    let face = p.text("document.getElementById('face').value");
    assert!(face == "+y" || face == "-y", "face {face}");
    let along: f64 = p
        .text("document.getElementById('in-along').value")
        .parse()
        .unwrap();
    assert_eq!(along, 0.0, "z on the face");
    assert!(p
        .text("document.querySelector('td[data-key=\"scan_max_vm_at\"]').textContent")
        .ends_with("z = 0 mm"));
    assert_eq!(
        p.text("Array.from(document.querySelectorAll('#scan-svg .face-mark text')).map(t => t.textContent).join(',')"),
        "face +y,face +z,face −y,face −z"
    );
    p.no_console_errors();
    p.shot("section-rectangle");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_plate_with_a_hole_takes_its_kt_from_the_fit() {
    use stresscase_core::concentration::{self, Shape};
    use stresscase_core::fatigue::Loading;
    let mut p = Page::open();
    p.b.click("src-section").unwrap();
    p.wait_for_id("section-kind");
    p.choose("section-kind", "rect");
    p.wait_for_id("in-h");
    // An invented link plate 60 × 6 mm with a Ø12 mm hole pulled by 20 kN: the section on
    // screen is the net section beside the hole, 48 × 6 mm.
    for (id, v) in [
        ("in-h", "48"),
        ("in-b", "6"),
        ("in-load-n", "20"),
        ("in-load-my", "0"),
        ("in-load-mz", "0"),
        ("in-load-t", "0"),
        ("in-load-vy", "0"),
        ("in-load-vz", "0"),
    ] {
        p.b.type_into(id, v).unwrap();
    }
    p.choose("kt-from", "hole");
    p.wait_for_id("in-kt-hole");
    p.b.type_into("in-kt-hole", "12").unwrap();
    let kt = concentration::kt(
        Shape::PlateHole {
            width: 60.0,
            hole: 12.0,
        },
        Loading::Axial,
    )
    .unwrap()
    .kt;
    p.wait_value("kt-fit", kt);
    // Kts stays typed (no fit covers a plate's shear): the demo's 1.
    p.wait_value("kts-fit", 1.0);
    // The peak at the hole: Kt times the net-section stress N/(h·b).
    p.wait_value("von_mises", kt * 20e3 / (0.048 * 0.006) / MPA);
    // Bending is not covered by the hole's fit: refused on the moment, with the reason.
    p.b.type_into("in-load-mz", "10").unwrap();
    p.b.wait_for(
        "document.getElementById('in-load-mz-msg').textContent.includes('tension only')",
        std::time::Duration::from_secs(10),
    )
    .unwrap();
    p.no_console_errors();
    p.shot("section-plate-hole");
}
