//! Tables of many points in the built page, in headless Chromium: a generated 100 000-row
//! stress file with three bad rows (counts, refusals with their line numbers, the worst row and
//! its value against core run here on the same numbers), opening the worst row as the case, a
//! rosette logger file through the case's rosette (against core's rosette reduction) and its
//! plot against time, a pasted semicolon file with decimal commas, a large file read while the
//! page keeps answering and then cancelled, and a file of several pieces with a byte-order
//! mark, CRLF and quoted labels only after the first piece, in the folder opened from disk.

use rand::{Rng, SeedableRng};
use std::fmt::Write as _;
use std::time::Duration;
use stresscase_core::criteria::Criterion;
use stresscase_core::material::Strengths;
use stresscase_core::points::{measure_all, worst_first, Measure};
use stresscase_core::{Principal, StressTensor};
use stresscase_tests::check::{rectangular_rosette_mpa, target_dir};
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

/// A data attribute of the element `#id`, read as a number.
fn data_number(p: &mut Page, id: &str, attr: &str) -> f64 {
    let s = p.text(&format!(
        "document.getElementById('{id}')?.dataset.{attr} ?? ''"
    ));
    s.parse()
        .unwrap_or_else(|_| panic!("#{id} data-{attr} is {s:?}"))
}

/// Records, from now on, each distinct text the table's status shows while a progress bar is
/// up (read back by [`busy_texts`]).
fn watch_progress(p: &mut Page) {
    p.b.eval(
        "window.busyTexts = new Set(); new MutationObserver(() => { \
           if (document.getElementById('table-progress')) \
             window.busyTexts.add(document.getElementById('table-status').textContent); \
         }).observe(document.body, { subtree: true, childList: true, attributes: true })",
    )
    .unwrap();
}

fn busy_texts(p: &mut Page) -> String {
    p.text("Array.from(window.busyTexts ?? []).join(' | ')")
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
    watch_progress(&mut p);
    p.b.choose_file("table-file", &path).unwrap();
    wait_done(&mut p);
    // More rows than one chunk: computed a chunk at a time, with the progress bar up.
    let seen = busy_texts(&mut p);
    assert!(seen.contains("Computing the rows"), "{seen}");
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
    // The pictures: the factor against the line, its range the rows' own (every row here is
    // loaded, so every factor is finite), the required factor drawn; every row in the histogram.
    let required: f64 = p
        .text("document.getElementById('in-nreq')?.value ?? ''")
        .parse()
        .unwrap();
    let factors: Vec<f64> = m.iter().map(|x| x.factor).collect();
    let least = factors.iter().copied().fold(f64::INFINITY, f64::min);
    let most = factors.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    assert_eq!(
        p.text("document.getElementById('table-trace')?.dataset.x ?? ''"),
        "line"
    );
    assert_eq!(data_number(&mut p, "table-trace", "min"), least);
    assert_eq!(data_number(&mut p, "table-trace", "max"), most);
    assert_eq!(data_number(&mut p, "table-trace", "allowable"), required);
    let binned = data_number(&mut p, "table-histogram", "count")
        + data_number(&mut p, "table-histogram", "above")
        + data_number(&mut p, "table-histogram", "notFinite");
    assert_eq!(binned, 99_997.0);
    assert_eq!(
        data_number(&mut p, "table-histogram", "allowable"),
        required
    );
    p.b.eval("document.getElementById('panel-table').scrollIntoView()")
        .unwrap();
    p.shot("table-100k");
    // Ranked by von Mises instead: the same worst row here (one criterion, one material), and
    // the pictures redrawn for it with the allowable Sy/n.
    p.choose("table-rank", "vm");
    let (vm_row, vm) = first_listed(&mut p);
    assert_eq!(vm_row, lines[worst]);
    assert!((vm - m[worst].von_mises).abs() <= 1e-12 * vm);
    assert_eq!(
        data_number(&mut p, "table-trace", "max"),
        m[worst].von_mises
    );
    assert_eq!(
        data_number(&mut p, "table-trace", "allowable"),
        210.0 / required
    );
    p.b.eval("document.getElementById('table-trace')?.scrollIntoView()")
        .unwrap();
    p.shot("table-100k-pictures");
    // The loaded table view (its kinds, refusals, list and pictures) passes the accessibility
    // rules the rest of the page does.
    let a11y = p.axe_violations();
    assert!(a11y.is_empty(), "axe-core: {a11y:#?}");
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
    let vms: Vec<f64> = rows
        .iter()
        .map(|r| {
            let t = rectangular_rosette_mpa(*r, 207e9, 0.292);
            stresscase_core::equivalent::Equivalent::of(&t).von_mises
        })
        .collect();
    let (k, best) = vms
        .iter()
        .enumerate()
        .fold((0, f64::MIN), |a, (i, &v)| if v > a.1 { (i, v) } else { a });
    assert_eq!(row, k + 2);
    assert!((value - best).abs() <= 1e-9 * best, "{value} vs {best}");
    // Drawn against the time column; its greatest value is the worst row's.
    assert_eq!(
        p.text("document.getElementById('table-trace')?.dataset.x ?? ''"),
        "time"
    );
    let drawn_max = data_number(&mut p, "table-trace", "max");
    assert!(
        (drawn_max - best).abs() <= 1e-9 * best,
        "{drawn_max} vs {best}"
    );
    let label = p.text("document.getElementById('table-trace')?.getAttribute('aria-label') ?? ''");
    assert!(label.contains("time [s]"), "{label}");
}

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_large_file_being_read_leaves_the_page_responsive_and_can_be_cancelled() {
    // 600 000 rows (about 30 MB, invented numbers), read on a CPU slowed eightfold so the
    // reading lasts seconds.
    let path = target_dir().join("page-table/large.csv");
    std::fs::create_dir_all(path.parent().unwrap()).unwrap();
    let mut text = String::with_capacity(32 << 20);
    text.push_str("sx,sy,sz,txy,tyz,tzx\n");
    for i in 0..600_000_u32 {
        let a = f64::from(i % 977) * 0.25;
        let _ = writeln!(text, "{a},{},-12.5,{},3.25,0", 40.0 - a, a * 0.5);
    }
    std::fs::write(&path, &text).unwrap();
    let mut p = Page::open();
    p.b.call(
        "Emulation.setCPUThrottlingRate",
        serde_json::json!({ "rate": 8 }),
    )
    .unwrap();
    p.b.choose_file("table-file", &path).unwrap();
    p.b.wait_for("!!document.getElementById('table-cancel')", WAIT)
        .unwrap();
    // Typing elsewhere on the page is answered while the file is read.
    p.b.type_into("in-sx", "321").unwrap();
    p.b.type_into("in-sy", "0").unwrap();
    p.b.type_into("in-txy", "0").unwrap();
    p.wait_value("sigma1", 321.0);
    assert!(
        p.text("String(!!document.getElementById('table-cancel'))") == "true",
        "the file was read before the page answered"
    );
    p.b.click("table-cancel").unwrap();
    p.b.wait_for("!document.getElementById('table-problem').hidden", WAIT)
        .unwrap();
    let said = p.text("document.getElementById('table-problem').textContent");
    assert!(said.contains("cancelled"), "{said}");
    assert!(
        said.contains("nothing was changed") || said.contains("cleared"),
        "{said}"
    );
    assert_eq!(status(&mut p, "rows"), "0");
    assert_eq!(status(&mut p, "done"), "false");
    assert_eq!(
        p.text("String(!!document.getElementById('table-cancel'))"),
        "false"
    );
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

#[test]
#[ignore = "needs the built page: run `cargo xtask test`"]
fn a_file_with_a_byte_order_mark_crlf_and_late_quoted_labels_reads_in_pieces_from_disk() {
    // Over 4 MB, so the page reads it in several pieces as the browser streams it (each up to
    // a few MB); the first quote comes after the first piece, and one quoted label spans two
    // lines (invented node names and numbers).
    let mut text = String::from("\u{feff}# plate, MPa\r\nnode,sx,sy,txy\r\n");
    let mut line = 2;
    let mut rows = Vec::new();
    let mut bad_line = 0;
    for i in 0..200_000_u32 {
        line += 1;
        let sx = f64::from(i % 1_013) * 0.125 - 40.0;
        let sy = f64::from(i % 739) * -0.0625 + 11.0;
        let txy = f64::from(i % 97) * 0.5;
        let label = match i {
            _ if i < 180_000 => format!("n{i}"),
            185_000 => {
                // Read as one row whose line is where it starts.
                let l = format!("\"web {i},\r\nflange\"");
                line += 1;
                rows.push((
                    line - 1,
                    StressTensor::new(sx, sy, 0.0, txy, 0.0, 0.0).unwrap(),
                ));
                let _ = write!(text, "{l},{sx},{sy},{txy}\r\n");
                continue;
            }
            _ => format!("\"node {i}, web\""),
        };
        if i == 187_001 {
            bad_line = line;
            let _ = write!(text, "{label},{sx},\"x\",{txy}\r\n");
            continue;
        }
        let _ = write!(text, "{label},{sx},{sy},{txy}\r\n");
        rows.push((line, StressTensor::new(sx, sy, 0.0, txy, 0.0, 0.0).unwrap()));
    }
    assert!(text.find('"').unwrap() > 4 << 20);
    let path = target_dir().join("page-table/late-quotes.csv");
    std::fs::create_dir_all(path.parent().unwrap()).unwrap();
    std::fs::write(&path, &text).unwrap();

    // The folder opened from disk (file://): the file is streamed there too.
    let url = format!(
        "file://{}",
        stresscase_tests::page::dist()
            .join("index.html")
            .canonicalize()
            .unwrap()
            .display()
    );
    let mut p = Page::with_browser(stresscase_tests::browser::Chromium::launch().unwrap(), &url);
    p.b.choose_file("table-file", &path).unwrap();
    wait_done(&mut p);
    assert_eq!(status(&mut p, "rows"), rows.len().to_string());
    assert_eq!(status(&mut p, "refused"), "1");
    let refusals = p.text("document.getElementById('table-refusals')?.textContent ?? ''");
    assert!(
        refusals.contains(&format!("line {bad_line}, column 3")),
        "{refusals}"
    );
    p.choose("table-rank", "vm");
    let vm = |t: &StressTensor| stresscase_core::equivalent::Equivalent::of(t).von_mises;
    let (want_line, want) = rows
        .iter()
        .map(|(l, t)| (*l, vm(t)))
        .fold((0, f64::MIN), |a, b| if b.1 > a.1 { b } else { a });
    let (row, value) = first_listed(&mut p);
    assert_eq!(row, want_line);
    assert!((value - want).abs() <= 1e-12 * want, "{value} vs {want}");
    p.no_console_errors();
}
