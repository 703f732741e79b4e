//! The table reader against Python's own `csv` module (the standard library's reader, driven by
//! `peers/read_table_csv.py` the way our reader is documented to work) on generated files:
//! every separator, a decimal comma, header or none, `#` comments, blank lines, CRLF, a
//! byte-order mark, quoted fields, and bad rows (a word, an empty cell, inf, NaN, too few
//! cells) at random lines. Kept rows must match line for line and bit for bit (both parsers
//! round correctly); refused rows must match in line, column and kind of reason.

use rand::{Rng, SeedableRng};
use serde_json::Value;
use std::fmt::Write as _;
use std::process::Command;
use stresscase_tests::check::{data_path, target_dir};
use stresscase_web::formats::table::{read, sniff, Reason, Separator};

struct Dialect {
    name: &'static str,
    sep: &'static str,
    decimal_comma: bool,
}

const DIALECTS: [Dialect; 5] = [
    Dialect {
        name: "comma",
        sep: ",",
        decimal_comma: false,
    },
    Dialect {
        name: "semicolon",
        sep: ";",
        decimal_comma: true,
    },
    Dialect {
        name: "semicolon",
        sep: ";",
        decimal_comma: false,
    },
    Dialect {
        name: "tab",
        sep: "\t",
        decimal_comma: false,
    },
    Dialect {
        name: "spaces",
        sep: "   ",
        decimal_comma: false,
    },
];

fn number(rng: &mut impl Rng, decimal_comma: bool) -> String {
    let v: f64 = match rng.random_range(0..4) {
        0 => rng.random_range(-1000.0..1000.0),
        1 => f64::from(rng.random_range(-500..500)),
        2 => rng.random_range(-1.0..1.0) * 10f64.powi(rng.random_range(-12..12)),
        _ => 0.0,
    };
    let s = if rng.random_bool(0.2) {
        format!("{v:e}")
    } else {
        format!("{v}")
    };
    if decimal_comma {
        s.replacen('.', ",", 1)
    } else {
        s
    }
}

fn file(rng: &mut impl Rng, d: &Dialect, header: bool, columns: usize, rows: usize) -> String {
    let eol = if rng.random_bool(0.5) { "\r\n" } else { "\n" };
    let mut s = String::new();
    if rng.random_bool(0.5) {
        s.push('\u{feff}');
    }
    s.push_str("# generated table");
    s.push_str(eol);
    if header {
        let names: Vec<String> = (0..columns).map(|j| format!("c{j}")).collect();
        s.push_str(&names.join(d.sep));
        s.push_str(eol);
    }
    for i in 0..rows {
        if i % 97 == 5 {
            s.push_str(eol); // a blank line
        }
        if i % 131 == 7 {
            s.push_str("# a comment");
            s.push_str(eol);
        }
        let mut cells: Vec<String> = (0..columns).map(|_| number(rng, d.decimal_comma)).collect();
        // The first rows stay good so the shape can be found; then about 3 % are bad.
        if i > 20 && rng.random_bool(0.03) {
            let j = rng.random_range(0..columns);
            match rng.random_range(0..5) {
                0 => cells[j] = "abc".into(),
                1 => cells[j] = String::new(),
                2 => cells[j] = "inf".into(),
                3 => cells[j] = "NaN".into(),
                _ => cells.truncate(j.max(1)),
            }
        }
        if d.name != "spaces" && rng.random_bool(0.05) {
            cells[0] = format!("\"{}\"", cells[0]);
        }
        if d.name == "spaces" {
            // An empty cell cannot be written with spaces: it would just be fewer cells.
            for c in &mut cells {
                if c.is_empty() {
                    *c = "abc".into();
                }
            }
        }
        let _ = write!(s, "{}{eol}", cells.join(d.sep));
    }
    s
}

#[test]
fn every_dialect_reads_as_pythons_csv_module_reads_it() {
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(12);
    let dir = target_dir().join("table-reader");
    std::fs::create_dir_all(&dir).unwrap();
    let mut checked = 0;
    for (k, d) in DIALECTS.iter().enumerate() {
        for header in [true, false] {
            let columns = rng.random_range(2..8);
            let text = file(&mut rng, d, header, columns, 2000);
            let path = dir.join(format!("t{k}-{header}.txt"));
            std::fs::write(&path, &text).unwrap();
            let shape = sniff(&text).unwrap();
            let want_sep = match d.name {
                "comma" => Separator::Comma,
                "semicolon" => Separator::Semicolon,
                "tab" => Separator::Tab,
                _ => Separator::Whitespace,
            };
            assert_eq!(shape.separator, want_sep, "{}", d.name);
            assert_eq!(shape.header.is_some(), header, "{}", d.name);
            assert_eq!(shape.columns, columns);
            let table = read(&text, &shape, None);
            let out = Command::new("python3")
                .arg(data_path("peers/read_table_csv.py"))
                .arg(&path)
                .arg(d.name)
                .arg(if shape.decimal_comma { "1" } else { "0" })
                .arg(if header { "1" } else { "0" })
                .output()
                .expect("python3");
            assert!(
                out.status.success(),
                "{}",
                String::from_utf8_lossy(&out.stderr)
            );
            let py: Value = serde_json::from_slice(&out.stdout).unwrap();
            let kept = py["kept"].as_array().unwrap();
            assert_eq!(table.rows(), kept.len(), "{} header={header}", d.name);
            for (i, row) in kept.iter().enumerate() {
                assert_eq!(u64::from(table.lines[i]), row[0].as_u64().unwrap());
                let values: Vec<f64> = row[1]
                    .as_array()
                    .unwrap()
                    .iter()
                    .map(|v| v.as_str().unwrap().parse().unwrap())
                    .collect();
                assert_eq!(table.row(i), &values[..], "line {}", table.lines[i]);
                checked += values.len();
            }
            let refused = py["refused"].as_array().unwrap();
            assert_eq!(table.refused_count, refused.len());
            assert!(table.refused_count > 20, "the generator makes bad rows");
            for (r, p) in table.refused.iter().zip(refused) {
                let kind = match r.reason {
                    Reason::NotANumber(_) => "word",
                    Reason::Empty => "empty",
                    Reason::NotFinite => "nonfinite",
                    Reason::TooFew(_) => "toofew",
                };
                assert_eq!(
                    (r.line as u64, r.column as u64, kind),
                    (
                        p[0].as_u64().unwrap(),
                        p[1].as_u64().unwrap(),
                        p[2].as_str().unwrap()
                    ),
                );
            }
        }
    }
    assert!(checked > 50_000, "{checked}");
}
