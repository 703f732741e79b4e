//! Tables of many points in the built page, in headless Chromium: a generated 100 000-row
//! stress file with three bad rows (counts, refusals with their line numbers, the worst row and
//! its value against core run here on the same numbers), opening the worst row as the case, a
//! rosette logger file through the case's rosette (against core's rosette reduction), and a
//! pasted semicolon file with decimal commas.

use rand::{Rng, SeedableRng};
use std::fmt::Write as _;
use std::time::Duration;
use stresscase_core::criteria::Criterion;
use stresscase_core::hooke::Elastic;
use stresscase_core::material::Strengths;
use stresscase_core::points::{measure_all, worst_first, Measure};
use stresscase_core::rosette::{reduce, Gauge, RECTANGULAR};
use stresscase_core::{Principal, StressTensor};
use stresscase_tests::check::target_dir;
use stresscase_tests::page::Page;

const WAIT: Duration = Duration::from_secs(60);

fn status(p: &mut Page, attr: &str) -> String {
    p.text(&format!(
        "document.getElementById('table-status')?.dataset.{attr} ?? ''"
    ))
}

/// The first listed worst row: its file line and unrounded ranking value.
fn first_listed(p: &mut Page) -> (usize, f64) {
    let read = |p: &mut Page, what: &str| {
        p.text(&format!(
            "document.querySelector('#table-top li')?.dataset.{what} ?? ''"
        ))
    };
    let row = read(p, "row").parse().expect("a listed row");
    let value = read(p, "value").parse().expect("its value");
    (row, value)
}

fn wait_done(p: &mut Page) {
    p.b.wait_for(
        "document.getElementById('table-status')?.dataset.done === 'true'",
        WAIT,
    )
    .unwrap_or_else(|e| {
        panic!(
            "table not done: {e}; status: {}",
            p.text("document.getElementById('table-status')?.textContent ?? ''")
        )
    });
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_100k_row_stress_file_ranks_its_worst_row_and_opens_it() {
    // node, sx, sy, sz, txy, tyz, tzx in MPa (invented numbers); three bad rows.
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(100);
    let mut text = String::from("# node stresses, MPa\nnode,sx,sy,sz,txy,tyz,tzx\n");
    let mut tensors = Vec::new();
    let mut lines = Vec::new();
    let bad = [1_003, 50_017, 99_999];
    for i in 0..100_000 {
        let line = i + 3;
        if bad.contains(&line) {
            let _ = writeln!(text, "{},1,2,abc,4,5,6", i + 1);
            continue;
        }
        let c: [f64; 6] =
            std::array::from_fn(|_| (rng.random_range(-120.0..120.0) * 100.0_f64).round() / 100.0);
        let _ = writeln!(
            text,
            "{},{},{},{},{},{},{}",
            i + 1,
            c[0],
            c[1],
            c[2],
            c[3],
            c[4],
            c[5]
        );
        tensors.push(StressTensor::new(c[0], c[1], c[2], c[3], c[4], c[5]).unwrap());
        lines.push(line);
    }
    let dir = target_dir().join("page-table");
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("nodes.csv");
    std::fs::write(&path, &text).unwrap();

    let mut p = Page::open();
    p.capture_downloads(&dir);
    p.b.click("to-table").unwrap();
    p.b.choose_file("table-file", &path).unwrap();
    wait_done(&mut p);
    assert_eq!(status(&mut p, "rows"), "99997");
    assert_eq!(status(&mut p, "refused"), "3");
    let refusals = p.text("document.getElementById('table-refusals')?.textContent ?? ''");
    for line in bad {
        assert!(
            refusals.contains(&format!("line {line}, column 4")),
            "{refusals}"
        );
    }
    // The demo case's material: carbon steel AISI 1020 hot-rolled, Sy = 210 MPa (the page's
    // default row); von Mises is the criterion in use for it.
    let steel = Strengths::try_new(Some(210.0), 380.0, None, 25.0, None).unwrap();
    let m = measure_all(&tensors, Criterion::VonMises, &steel).unwrap();
    let worst = worst_first(&m, Measure::Factor)[0];
    let (row, value) = first_listed(&mut p);
    assert_eq!(row, lines[worst]);
    assert!(
        (value - m[worst].factor).abs() <= 1e-12 * m[worst].factor,
        "{value} vs {}",
        m[worst].factor
    );
    p.b.eval("document.getElementById('panel-table').scrollIntoView()")
        .unwrap();
    p.shot("table-100k");
    // Ranked by von Mises instead: the same worst row here (one criterion, one material).
    p.choose("table-rank", "vm");
    let (vm_row, vm) = first_listed(&mut p);
    assert_eq!(vm_row, lines[worst]);
    assert!((vm - m[worst].von_mises).abs() <= 1e-12 * vm);
    // Exports: every computed row with its measures, and the worst rows alone.
    p.b.click("table-export-all").unwrap();
    let all = String::from_utf8(p.downloaded("stresscase-all-rows.csv")).unwrap();
    let (head, body) = all.split_once('\n').unwrap();
    assert!(
        head.starts_with("# Stresscase: rows of nodes.csv"),
        "{head}"
    );
    let mut r = csv::Reader::from_reader(body.as_bytes());
    let h = r.headers().unwrap().clone();
    let col = |name: &str| h.iter().position(|x| x.starts_with(name)).unwrap();
    let (c_line, c_vm, c_n) = (col("line"), col("von_mises [MPa]"), col("factor_of_safety"));
    let mut n = 0;
    for (k, rec) in r.records().enumerate() {
        let rec = rec.unwrap();
        assert_eq!(rec[c_line].parse::<usize>().unwrap(), lines[k]);
        assert_eq!(
            rec[c_vm].parse::<f64>().unwrap(),
            m[k].von_mises,
            "line {}",
            lines[k]
        );
        assert_eq!(rec[c_n].parse::<f64>().unwrap(), m[k].factor);
        n += 1;
    }
    assert_eq!(n, 99_997);
    p.b.click("table-export-worst").unwrap();
    let worst_csv = String::from_utf8(p.downloaded("stresscase-worst-rows.csv")).unwrap();
    let mut r = csv::Reader::from_reader(worst_csv.split_once('\n').unwrap().1.as_bytes());
    let firsts: Vec<usize> = r
        .records()
        .map(|x| x.unwrap()[0].parse().unwrap())
        .collect();
    let order = worst_first(&m, Measure::VonMises);
    assert_eq!(
        firsts,
        order[..10].iter().map(|&k| lines[k]).collect::<Vec<_>>()
    );
    // Opened as the case: its tensor on screen.
    p.b.click("table-open-1").unwrap();
    p.wait_value("sigma1", Principal::of(&tensors[worst]).sigma1());
    let title = p.text("document.getElementById('in-title')?.value ?? ''");
    assert!(title.contains(&format!("line {}", lines[worst])), "{title}");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_rosette_logger_file_goes_through_the_cases_rosette() {
    let mut p = Page::open();
    p.b.click("src-rosette").unwrap();
    p.wait_for_id("in-ge1");
    // time, three gauges of a rectangular rosette in µε (invented logger numbers).
    let mut text = String::from("time [s];SG1;SG2;SG3\n");
    let mut rows = Vec::new();
    for i in 0..500 {
        let t = f64::from(i) * 0.002;
        let a = 400.0 * (t * 30.0).sin();
        let r = [a + 100.0, 0.4 * a, -0.3 * a - 50.0];
        rows.push(r);
        let _ = writeln!(
            text,
            "{};{};{};{}",
            format!("{t:.3}").replace('.', ","),
            r[0],
            r[1],
            r[2]
        );
    }
    let path = target_dir().join("page-table/logger.csv");
    std::fs::create_dir_all(path.parent().unwrap()).unwrap();
    std::fs::write(&path, &text).unwrap();
    p.b.choose_file("table-file", &path).unwrap();
    wait_done(&mut p);
    assert_eq!(status(&mut p, "rows"), "500");
    p.choose("table-rank", "vm");
    let (row, value) = first_listed(&mut p);
    // Core's rosette reduction with the page's elastic constants for the default material
    // (AISI 1020: E = 207 GPa, ν = 0.292, as the page shows them).
    let steel = Elastic::try_new(207e9, 0.292).unwrap();
    let vms: Vec<f64> = rows
        .iter()
        .map(|r| {
            let g: Vec<Gauge> = (0..3)
                .map(|k| Gauge {
                    angle: RECTANGULAR[k],
                    strain: r[k] * 1e-6,
                })
                .collect();
            let t = reduce(&g, None)
                .unwrap()
                .stress(&steel)
                .unwrap()
                .scaled(1e-6)
                .unwrap();
            stresscase_core::equivalent::Equivalent::of(&t).von_mises
        })
        .collect();
    let (k, best) = vms
        .iter()
        .enumerate()
        .fold((0, f64::MIN), |a, (i, &v)| if v > a.1 { (i, v) } else { a });
    assert_eq!(row, k + 2);
    assert!((value - best).abs() <= 1e-9 * best, "{value} vs {best}");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_pasted_semicolon_table_with_decimal_commas_reads() {
    let mut p = Page::open();
    p.b.type_into(
        "table-paste",
        "sx;sy;txy\n84,5;-22;37\n120,25;10;0\n1;x;3\n",
    )
    .unwrap();
    p.b.click("table-read").unwrap();
    wait_done(&mut p);
    assert_eq!(status(&mut p, "rows"), "2");
    assert_eq!(status(&mut p, "refused"), "1");
    p.b.set_viewport(390, 844, true).unwrap();
    p.b.eval("document.getElementById('panel-table').scrollIntoView()")
        .unwrap();
    p.shot("table-pasted-390");
    let rows = p.text(
        "Array.from(document.querySelectorAll('#table-top li')).map(l => l.dataset.row).join(',')",
    );
    assert_eq!(rows, "2,3"); // σvm 116.6 (line 2) before 115.6 MPa (line 3)
    let text = p.text("document.getElementById('table-status')?.textContent ?? ''");
    assert!(
        text.contains("semicolon-separated, decimal comma"),
        "{text}"
    );
    // Not a table: one message, nothing changed.
    p.b.type_into("table-paste", "Dear reader,\nthis is a letter.\n")
        .unwrap();
    p.b.click("table-read").unwrap();
    p.b.wait_for("!document.getElementById('table-problem').hidden", WAIT)
        .unwrap();
    assert_eq!(status(&mut p, "rows"), "2");
}
