//! The answer first and the calc sheet, in the built page: the headline strip on the first
//! screen at 1366, 768 and 390 px, no sideways scrolling, readable diagram text on a phone,
//! accessibility rules (axe-core from npm, injected by the test), the printed sheet (DevTools
//! `Page.printToPDF`, read back with poppler's `pdftotext` and `pdfinfo`), and the exports (SVG,
//! PNG at twice the screen size, CSV). Screenshots go to `target/screens/`, PDFs to
//! `target/sheets/`.

use std::path::Path;
use std::process::Command;
use stresscase_tests::check::target_dir;
use stresscase_tests::page::{Page, WAIT};

const KEYS: [&str; 6] = [
    "sigma1",
    "sigma2",
    "sigma3",
    "tau_abs_max",
    "von_mises",
    "n_static",
];

fn num(p: &mut Page, js: &str) -> f64 {
    p.b.eval(js)
        .unwrap()
        .as_f64()
        .unwrap_or_else(|| panic!("not a number: {js}"))
}

fn settle(p: &mut Page) {
    // Two animation frames: layout after a viewport change.
    p.b.eval("new Promise(r => requestAnimationFrame(() => requestAnimationFrame(() => r(true))))")
        .unwrap();
}

/// Fails when the page is wider than the window, naming the elements that stick out.
fn no_sideways_scroll(p: &mut Page, what: &str) {
    let (sw, cw) = (
        num(p, "document.documentElement.scrollWidth"),
        num(p, "document.documentElement.clientWidth"),
    );
    if sw > cw {
        let wide = p.text(&format!(
            "JSON.stringify(Array.from(document.querySelectorAll('body *')).filter(e => e.getBoundingClientRect().right > {cw} + 0.5 && e.getClientRects().length > 0).slice(0, 12).map(e => (e.id || e.className || e.tagName) + ':' + Math.round(e.getBoundingClientRect().right)))"
        ));
        panic!("{what}: the page is {sw} px wide in a {cw} px window; too wide: {wide}");
    }
}

/// Fails on visible diagram text below 11 CSS px, the drawing's scale and rotation included.
fn no_small_diagram_text(p: &mut Page, what: &str) {
    let small = p.text(
        "JSON.stringify(Array.from(document.querySelectorAll('svg[id] text')).filter(t => t.getClientRects().length > 0 && t.textContent.trim() !== '').map(t => [t.closest('svg').id, t.textContent, parseFloat(getComputedStyle(t).fontSize) * Math.hypot(t.getScreenCTM().a, t.getScreenCTM().b)]).filter(x => x[2] < 10.99))",
    );
    assert_eq!(small, "[]", "{what}: diagram text below 11 px: {small}");
}

/// Checks the headline's figures against the results table.
fn headline_matches_results(p: &mut Page) {
    for key in KEYS {
        let js = format!(
            "document.querySelector('#headline [data-key=\"{key}\"]')?.dataset.value ?? null"
        );
        let v = p.text(&js);
        assert!(!v.is_empty(), "#headline has no {key}");
        if key != "n_static" {
            let head: f64 = v.parse().unwrap();
            let table = p.value(key.replace("tau_abs_max", "tau_max").as_str());
            assert_eq!(head, table, "{key}: headline {head} vs results {table}");
        }
    }
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn the_answer_is_on_the_first_screen_at_every_width() {
    let mut p = Page::open();
    for (w, h, mobile) in [(1366, 768, false), (768, 1024, false), (390, 844, true)] {
        p.b.set_viewport(w, h, mobile).unwrap();
        settle(&mut p);
        p.b.eval("window.scrollTo(0, 0)").unwrap();
        settle(&mut p);
        headline_matches_results(&mut p);
        let bottom = num(
            &mut p,
            "document.getElementById('headline').getBoundingClientRect().bottom",
        );
        assert!(
            bottom <= f64::from(h),
            "{w}×{h}: the headline ends at {bottom}"
        );
        no_sideways_scroll(&mut p, &format!("{w} px"));
        if w <= 400 {
            no_small_diagram_text(&mut p, &format!("{w} px"));
        }
        if w == 1366 {
            // The inputs and the diagram are on screen together.
            for id in ["mohr-svg", "in-sx", "in-txy"] {
                let top = num(
                    &mut p,
                    &format!("document.getElementById('{id}').getBoundingClientRect().top"),
                );
                assert!(top >= 0.0 && top < f64::from(h) - 40.0, "#{id} at {top}");
            }
        }
        p.b.screenshot_viewport(&target_dir().join(format!("screens/layout-{w}.png")))
            .unwrap();
        // The headline stays in view while the page scrolls.
        p.b.eval("window.scrollTo(0, 1600)").unwrap();
        settle(&mut p);
        let top = num(
            &mut p,
            "document.getElementById('headline').getBoundingClientRect().top",
        );
        assert!(top.abs() < 1.0, "{w}: the headline scrolled away ({top})");
        p.b.screenshot_viewport(&target_dir().join(format!("screens/layout-{w}-scrolled.png")))
            .unwrap();
        p.b.eval("window.scrollTo(0, 0)").unwrap();
    }
    // The other paths fit the narrow screens too, their drawings included.
    for (w, h) in [(390, 844), (768, 1024)] {
        p.b.set_viewport(w, h, w < 500).unwrap();
        for (button, drawing) in [("src-section", "scan-svg"), ("src-rosette", "strain-svg")] {
            p.b.click(button).unwrap();
            p.wait_for_id(drawing);
            settle(&mut p);
            let what = format!("{w} px, {button}");
            no_sideways_scroll(&mut p, &what);
            if w < 500 {
                no_small_diagram_text(&mut p, &what);
            }
            p.b.screenshot(&target_dir().join(format!("screens/{button}-{w}.png")))
                .unwrap();
        }
    }
    p.b.click("src-typed").unwrap();
    // Stale marks the headline too.
    p.b.type_into("in-sx", "x").unwrap();
    p.b.wait_for(
        "document.getElementById('headline').classList.contains('stale')",
        WAIT,
    )
    .expect("stale headline");
    p.no_console_errors();
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn accessibility_rules_find_nothing_serious() {
    let mut p = Page::open();
    p.b.bypass_csp().unwrap();
    let url = p.text("location.href");
    p.b.goto("about:blank").unwrap();
    p.go(&url);
    // Every control has a visible label; panel titles are headings.
    for id in ["angle-slider", "save-name"] {
        let label = p.text(&format!(
            "document.querySelector('label[for=\"{id}\"]')?.textContent ?? ''"
        ));
        assert!(!label.trim().is_empty(), "#{id} has no visible label");
    }
    assert!(
        num(
            &mut p,
            "document.querySelectorAll('.panel legend h2').length"
        ) >= 5.0,
        "panel titles are not headings"
    );
    let mut all = p.axe_violations();
    // The decision panels with fatigue on, and a section with its plot.
    p.b.click("fatigue-on").unwrap();
    p.wait_for_id("in-ratio");
    p.b.click("src-section").unwrap();
    p.wait_for_id("scan-svg");
    all.extend(p.axe_violations());
    p.b.set_viewport(390, 844, true).unwrap();
    settle(&mut p);
    all.extend(p.axe_violations());
    assert!(all.is_empty(), "axe-core: {all:#?}");
}

fn pdf_text(pdf: &Path) -> (String, u32) {
    let out = Command::new("pdftotext")
        .args(["-layout"])
        .arg(pdf)
        .arg("-")
        .output()
        .expect("pdftotext (Debian's poppler-utils; `cargo xtask test` installs it)");
    assert!(out.status.success(), "pdftotext failed");
    let info = Command::new("pdfinfo").arg(pdf).output().expect("pdfinfo");
    let info = String::from_utf8_lossy(&info.stdout).into_owned();
    let pages = info
        .lines()
        .find_map(|l| l.strip_prefix("Pages:"))
        .and_then(|v| v.trim().parse().ok())
        .expect("page count");
    (String::from_utf8_lossy(&out.stdout).into_owned(), pages)
}

/// Prints the case on A4 and Letter and checks the sheet; returns the A4 page count.
fn check_sheet(p: &mut Page, name: &str) -> u32 {
    p.b.eval("window.scrollTo(0, 0)").unwrap();
    let title = p.text("document.querySelector('.sheet-title').textContent");
    let link = p.text("document.getElementById('sheet-link').textContent");
    assert!(link.contains("#v=1&"), "{link}");
    p.link();
    assert_eq!(link, p.text("location.href"));
    let s1 = p.text("document.querySelector('#headline [data-key=\"sigma1\"]').textContent");
    let n = p.text("document.querySelector('#headline [data-key=\"n_static\"]').textContent");
    let mut pages_a4 = 0;
    for (paper, w, h) in [("a4", 8.27, 11.69), ("letter", 8.5, 11.0)] {
        let pdf = target_dir().join(format!("sheets/{name}-{paper}.pdf"));
        p.b.print_pdf(&pdf, w, h).unwrap();
        let (text, pages) = pdf_text(&pdf);
        if paper == "a4" {
            pages_a4 = pages;
        }
        let squeezed: String = text.chars().filter(|c| !c.is_whitespace()).collect();
        let has = |what: &str| squeezed.contains(&what.replace(char::is_whitespace, ""));
        assert!(has(&title), "{name} {paper}: no title {title:?}");
        assert!(has(&s1), "{name} {paper}: no σ1 {s1:?}");
        assert!(has(&n), "{name} {paper}: no factor of safety {n:?}");
        assert!(has("licensed engineer"), "{name} {paper}: no caution");
        assert!(has(&link), "{name} {paper}: the link is cut\n{text}");
        assert!(has("Printed"), "{name} {paper}: no date");
        for absent in [
            "Print calc sheet",
            "Save as SVG",
            "Copy link",
            "Choose File",
            "Move the point",
        ] {
            assert!(
                !has(absent),
                "{name} {paper}: prints the control {absent:?}"
            );
        }
        assert!(pages <= 4, "{name} {paper}: {pages} pages");
        // Page 1: title, date, inputs, headline results and verdict, the Mohr diagram.
        let first = Command::new("pdftotext")
            .args(["-f", "1", "-l", "1"])
            .arg(&pdf)
            .arg("-")
            .output()
            .expect("pdftotext");
        let first: String = String::from_utf8_lossy(&first.stdout)
            .chars()
            .filter(|c| !c.is_whitespace())
            .collect();
        for want in [
            title.as_str(),
            "Printed",
            "Inputs",
            s1.as_str(),
            n.as_str(),
            "Mohrdiagram",
        ] {
            let want: String = want.chars().filter(|c| !c.is_whitespace()).collect();
            assert!(
                first.contains(&want),
                "{name} {paper}: page 1 lacks {want:?}"
            );
        }
    }
    // The QR code of the link, made in the page.
    assert!(num(p, "+document.getElementById('sheet-qr').dataset.modules") >= 21.0);
    pages_a4
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn the_calc_sheet_prints_the_case_with_its_link() {
    let mut counts = Vec::new();
    let mut p = Page::open();
    let n = check_sheet(&mut p, "default");
    assert!(n <= 3, "the default case prints on {n} pages");
    counts.push(("default", n));
    // A shaft under loads.
    p.b.click("src-section").unwrap();
    p.wait_for_id("scan-svg");
    p.b.type_into("in-title", "Conveyor drive shaft, keyway end (invented)")
        .unwrap();
    p.b.wait_for(
        "document.querySelector('.sheet-title').textContent.startsWith('Conveyor')",
        WAIT,
    )
    .unwrap();
    counts.push(("shaft", check_sheet(&mut p, "shaft")));
    // A rosette with fatigue on.
    p.b.click("src-rosette").unwrap();
    p.wait_for_id("rosette-layout");
    p.b.click("fatigue-on").unwrap();
    p.wait_for_id("in-ratio");
    counts.push(("rosette", check_sheet(&mut p, "rosette")));
    // A link too long for a QR code says so instead of a code.
    p.b.type_into(
        "in-note",
        &"Kraftfluss — Prüfung der Schweißnaht. ".repeat(50),
    )
    .unwrap();
    p.b.wait_for("document.getElementById('sheet-qr-none') !== null", WAIT)
        .expect("no QR for a long link");
    let pdf = target_dir().join("sheets/long-note-a4.pdf");
    p.b.print_pdf(&pdf, 8.27, 11.69).unwrap();
    let (text, _) = pdf_text(&pdf);
    assert!(text.contains("No QR code"), "{text}");
    assert!(
        text.contains("Prüfung der Schweißnaht"),
        "the note is not printed"
    );
    let summary: Vec<String> = counts
        .iter()
        .map(|(n, c)| format!("{n}: {c} A4 pages"))
        .collect();
    std::fs::write(target_dir().join("sheets/pages.txt"), summary.join("\n")).unwrap();
    eprintln!("printed sheets: {}", summary.join(", "));
    p.no_console_errors();
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn drawings_export_as_svg_and_png_and_results_as_csv() {
    use base64::Engine as _;
    let dir = target_dir().join(format!("browser/exports-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    let mut p = Page::open();
    p.capture_downloads(&dir);
    // SVG: a self-contained document that parses and holds the three circles.
    p.b.click("export-svg-mohr").unwrap();
    let svg = String::from_utf8(p.downloaded("stresscase-mohr.svg")).unwrap();
    std::fs::create_dir_all(&dir).unwrap();
    std::fs::write(dir.join("stresscase-mohr.svg"), &svg).unwrap();
    assert!(svg.starts_with("<?xml") && svg.contains("<style>"));
    let parsed = p.text(&format!(
        "(() => {{ const d = new DOMParser().parseFromString({svg:?}, 'image/svg+xml'); if (d.querySelector('parsererror')) return 'parse error'; return String(d.querySelectorAll('circle[data-role]').length); }})()"
    ));
    assert!(
        parsed.parse::<u32>().is_ok_and(|n| n >= 3),
        "exported SVG: {parsed}"
    );
    // PNG at twice the drawing's size on screen, decoded by the browser.
    let (w, h) = (
        num(
            &mut p,
            "Math.round(document.getElementById('mohr-svg').getBoundingClientRect().width)",
        ),
        num(
            &mut p,
            "Math.round(document.getElementById('mohr-svg').getBoundingClientRect().height)",
        ),
    );
    p.b.click("export-png-mohr").unwrap();
    let png = p.downloaded("stresscase-mohr.png");
    std::fs::write(dir.join("stresscase-mohr.png"), &png).unwrap();
    assert_eq!(&png[..8], b"\x89PNG\r\n\x1a\n");
    let b64 = base64::engine::general_purpose::STANDARD.encode(&png);
    let size = p.text(&format!(
        "new Promise(r => {{ const i = new Image(); i.onload = () => r(i.naturalWidth + 'x' + i.naturalHeight); i.onerror = () => r('undecodable'); i.src = 'data:image/png;base64,{b64}'; }})"
    ));
    assert_eq!(size, format!("{}x{}", 2.0 * w, 2.0 * h));
    // CSV: every numeric row of the results table, with the link in the header line.
    p.b.click("export-csv").unwrap();
    let csv_text = String::from_utf8(p.downloaded("stresscase-results.csv")).unwrap();
    std::fs::write(dir.join("stresscase-results.csv"), &csv_text).unwrap();
    let (head, body) = csv_text.split_once('\n').unwrap();
    p.link();
    let href = p.text("location.href");
    assert_eq!(head, format!("# Stresscase results; case link: {href}"));
    let mut r = csv::Reader::from_reader(body.as_bytes());
    let mut checked = 0;
    for rec in r.records() {
        let rec = rec.unwrap();
        let (value, unit, key) = (&rec[1], &rec[2], &rec[3]);
        let cell = p.text(&format!(
            "(() => {{ const c = document.querySelector('#panel-results td[data-key=\"{key}\"]'); return c ? c.dataset.value + '|' + c.textContent : ''; }})()"
        ));
        let (page_value, page_text) = cell.split_once('|').unwrap_or_default();
        if let (Ok(a), Ok(b)) = (value.parse::<f64>(), page_value.parse::<f64>()) {
            assert_eq!(a, b, "{key}");
            assert!(
                page_text.contains(unit),
                "{key}: unit {unit} vs {page_text}"
            );
            checked += 1;
        }
    }
    assert!(checked >= 30, "only {checked} numeric rows");
    p.no_console_errors();
}
