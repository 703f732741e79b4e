//! The built page in a real headless Chromium (Debian's; no browser download), served on
//! 127.0.0.1 by the test itself. Every number read from the page is checked against
//! stresscase-core computed here. Screenshots go to `target/browser/`.
//!
//! These need the built folder: `cargo xtask test` builds it and runs them (`--ignored`).
//! `STRESSCASE_DIST` points at another build.

use serde_json::Value;
use stresscase_core::equivalent::Equivalent;
use stresscase_core::transform::{rotate_about_z, InPlane};
use stresscase_core::{Mohr3d, Principal, StressTensor, StressUnit};
use stresscase_tests::check::close;
use stresscase_tests::page::{Page, WAIT};

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn plane_case_typed_in_matches_core() {
    let mut p = Page::open();
    assert!(p
        .text("document.getElementById('caution').textContent")
        .contains("licensed engineer"));
    p.b.type_into("in-sx", "120").unwrap();
    p.b.type_into("in-sy", "\u{2212}35,5").unwrap(); // typographic minus and decimal comma
    p.b.type_into("in-txy", "4.8e1").unwrap();
    let t = StressTensor::plane(120.0, -35.5, 48.0).unwrap();
    let pr = Principal::of(&t).values();
    for (key, want) in [("sigma1", pr[0]), ("sigma2", pr[1]), ("sigma3", pr[2])] {
        p.wait_value(key, want);
    }
    let m = Mohr3d::of(&t);
    let ip = InPlane::of(&t);
    let eq = Equivalent::of(&t);
    for (key, want) in [
        ("tau_max", m.tau_max()),
        ("tau_in_plane", ip.radius),
        ("theta_p", ip.theta_p.to_degrees()),
        ("von_mises", eq.von_mises),
        ("tresca", eq.tresca),
    ] {
        p.wait_value(key, want);
    }
    assert!(p
        .text("document.querySelector('td[data-key=\"sigma1\"]').textContent")
        .ends_with("MPa"));
    for (role, c) in [("c13", m.c13), ("c12", m.c12), ("c23", m.c23)] {
        p.check_circle(role, c.centre, c.radius);
    }
    p.check_circle("inplane", ip.centre, ip.radius);
    assert!(p
        .text("document.getElementById('circle-legend').textContent")
        .contains("out-of-plane circles through σz = 0"));
    // Principal points sit on the σ axis at core's values, labelled with value and unit.
    for (role, v) in [("s1", pr[0]), ("s3", pr[2])] {
        let (ox, oy, k, ..) = p.circle("c13");
        let js = format!("(() => {{ const g = document.querySelector('g[data-role=\"{role}\"]'); return [+g.querySelector('circle').getAttribute('cx'), +g.querySelector('circle').getAttribute('cy'), g.textContent]; }})()");
        let got = p.b.eval(&js).unwrap();
        close(
            role,
            "σ from the point's cx",
            (got[0].as_f64().unwrap() - ox) / k,
            v,
            1e-6 / k,
        );
        close(
            role,
            "point on the σ axis",
            got[1].as_f64().unwrap(),
            oy,
            1e-9,
        );
        assert!(
            got[2].as_str().unwrap().ends_with("MPa"),
            "label {}",
            got[2]
        );
    }
    p.no_console_errors();
    p.shot("plane-case");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn full_3d_case_draws_three_circles_from_core() {
    let mut p = Page::open();
    p.b.click("mode-full").unwrap();
    p.b.wait_for("!document.getElementById('in-sz').disabled", WAIT)
        .unwrap();
    for (id, v) in [
        ("in-sx", "84"),
        ("in-sy", "-22"),
        ("in-sz", "25"),
        ("in-txy", "37"),
        ("in-tyz", "-14"),
        ("in-tzx", "30"),
    ] {
        p.b.type_into(id, v).unwrap();
    }
    let t = StressTensor::new(84.0, -22.0, 25.0, 37.0, -14.0, 30.0).unwrap();
    let pr = Principal::of(&t).values();
    for (key, want) in [("sigma1", pr[0]), ("sigma2", pr[1]), ("sigma3", pr[2])] {
        p.wait_value(key, want);
    }
    let m = Mohr3d::of(&t);
    p.wait_value("tau_max", m.tau_max());
    for (role, c) in [("c13", m.c13), ("c12", m.c12), ("c23", m.c23)] {
        p.check_circle(role, c.centre, c.radius);
    }
    // The diagram says which circle is which.
    assert!(p
        .text("document.getElementById('circle-legend').textContent")
        .contains("C13 through σ1 and σ3"));
    let has_inplane =
        p.b.eval("document.querySelector('circle[data-role=\"inplane\"]') !== null")
            .unwrap();
    assert_eq!(
        has_inplane,
        Value::Bool(false),
        "3D mode draws the three principal circles only"
    );
    p.no_console_errors();
    p.shot("full-3d-case");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn bad_entries_are_named_and_the_last_result_stays() {
    let mut p = Page::open();
    let demo = Principal::of(&StressTensor::plane(84.0, -22.0, 37.0).unwrap()).values();
    p.wait_value("sigma1", demo[0]);
    for (typed, says) in [
        ("12,5.3", "decimal mark"),
        ("1e400", "too large"),
        ("abc", "not a number"),
        ("", "enter a number"),
        ("<script>alert(1)</script>", "not a number"),
    ] {
        p.b.type_into("in-sx", typed).unwrap();
        let msg =
            p.b.wait_for("document.getElementById('in-sx-msg').textContent", WAIT)
                .unwrap();
        assert!(
            msg.as_str().unwrap_or("").contains(says),
            "for {typed:?} the message is {msg}"
        );
        assert_eq!(
            p.text("document.getElementById('in-sx').getAttribute('aria-invalid')"),
            "true"
        );
        let notice = p.text("document.getElementById('stale-notice')?.textContent ?? ''");
        assert!(
            notice.contains("stale") && notice.contains("σx"),
            "stale notice: {notice:?}"
        );
        assert!(
            p.b.eval("document.getElementById('panel-results').classList.contains('stale')")
                .unwrap()
                == Value::Bool(true)
        );
        // The last good result is still there.
        close(
            typed,
            "σ1 kept",
            p.value("sigma1"),
            demo[0],
            1e-9 * demo[0].abs(),
        );
    }
    assert_eq!(
        p.b.eval(
            "document.querySelectorAll('script[src*=alert]').length + (window.alerted ? 1 : 0)"
        )
        .unwrap(),
        Value::from(0)
    );
    p.shot("stale-input");
    p.b.type_into("in-sx", "100").unwrap();
    let fixed = Principal::of(&StressTensor::plane(100.0, -22.0, 37.0).unwrap()).values();
    p.wait_value("sigma1", fixed[0]);
    assert_eq!(
        p.b.eval("document.getElementById('stale-notice')").unwrap(),
        Value::Null
    );
    p.no_console_errors();
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn turning_the_element_and_changing_units() {
    let mut p = Page::open();
    let t = StressTensor::plane(84.0, -22.0, 37.0).unwrap();
    p.b.type_into("in-angle", "45").unwrap();
    let r = rotate_about_z(&t, 45f64.to_radians()).unwrap();
    p.wait_value("sx_t", r.sx());
    p.wait_value("txy_t", r.txy());
    // Drag the slider (the browser fires input events while dragging).
    p.b.eval("(() => { const s = document.getElementById('angle-slider'); s.value = '-60'; s.dispatchEvent(new Event('input', { bubbles: true })); })()").unwrap();
    let r = rotate_about_z(&t, (-60f64).to_radians()).unwrap();
    p.wait_value("sy_t", r.sy());
    assert_eq!(p.text("document.getElementById('in-angle').value"), "-60");
    p.b.click("to-principal").unwrap();
    p.b.wait_for(
        "Math.abs(+document.querySelector('td[data-key=\"txy_t\"]').dataset.value) < 0.01",
        WAIT,
    )
    .unwrap();
    // Unit change converts the inputs and every result.
    p.b.eval("(() => { const s = document.getElementById('unit'); s.value = 'ksi'; s.dispatchEvent(new Event('change', { bubbles: true })); })()").unwrap();
    let k = StressUnit::MPa.convert(1.0, StressUnit::Ksi);
    let s1 = Principal::of(&t).sigma1();
    p.wait_value("sigma1", s1 * k);
    assert!(p
        .text("document.querySelector('td[data-key=\"sigma1\"]').textContent")
        .ends_with("ksi"));
    let sx: f64 = p
        .text("document.getElementById('in-sx').value")
        .parse()
        .expect("converted σx reads");
    close("unit", "σx field in ksi", sx, 84.0 * k, 1e-9);
    p.no_console_errors();
    p.shot("turned-ksi");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn shear_axis_direction_is_chosen_and_labelled() {
    let mut p = Page::open();
    let x_below = "(() => { const s = document.getElementById('mohr-svg'); const c = s.querySelector('g[data-role=\"X\"] circle'); return +c.getAttribute('cy') > +s.dataset.originY; })()";
    // Default: positive τ drawn downward, and τxy = +37 MPa puts X below the σ axis.
    assert!(p
        .text("document.getElementById('tau-axis-label').textContent")
        .contains("downward"));
    assert_eq!(p.b.eval(x_below).unwrap(), Value::Bool(true));
    p.b.click("axis-up").unwrap();
    p.b.wait_for(
        "document.getElementById('tau-axis-label').textContent.includes('upward')",
        WAIT,
    )
    .unwrap();
    assert_eq!(p.b.eval(x_below).unwrap(), Value::Bool(false));
    assert!(p
        .text("document.getElementById('rotation-note').textContent")
        .contains("clockwise"));
    p.no_console_errors();
}
