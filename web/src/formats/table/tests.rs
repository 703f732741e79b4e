//! The table reader's own tests: each dialect, refusals, whole-text refusals, column kinds.

use super::*;
use crate::model::table::ColumnKind;

fn shape_and_table(text: &str) -> (Shape, Table) {
    let s = sniff(text).unwrap();
    let t = read(text, &s, None);
    (s, t)
}

#[test]
fn comma_with_header_comments_and_crlf() {
    let text = "# exported from the model\r\nnode,sx,sy,txy\r\n1,10,-2.5,3e1\r\n\r\n# a note\r\n2,\"11\",0,0\r\n";
    let (s, t) = shape_and_table(text);
    assert_eq!(s.separator, Separator::Comma);
    assert!(!s.decimal_comma);
    assert_eq!(
        s.header.as_deref(),
        Some(&["node", "sx", "sy", "txy"].map(String::from)[..])
    );
    assert_eq!(t.rows(), 2);
    assert_eq!(t.row(0), &[1.0, 10.0, -2.5, 30.0]);
    assert_eq!(t.row(1), &[2.0, 11.0, 0.0, 0.0]);
    assert_eq!(t.lines, vec![3, 6]);
    assert_eq!(t.refused_count, 0);
}

#[test]
fn semicolon_with_decimal_comma_and_bom() {
    let text = "\u{feff}Zeit;SG1;SG2;SG3\n0,000;612,5;-20,25;-180\n0,001;613;-20,5;-181,75\n";
    let (s, t) = shape_and_table(text);
    assert_eq!(s.separator, Separator::Semicolon);
    assert!(s.decimal_comma);
    assert_eq!(s.header.as_ref().unwrap()[0], "Zeit");
    assert_eq!(t.row(1), &[0.001, 613.0, -20.5, -181.75]);
}

#[test]
fn tab_and_whitespace_without_header() {
    let (s, t) = shape_and_table("1\t2\t3\n4\t5\t6\n");
    assert_eq!(
        (s.separator, s.header.is_none(), s.columns),
        (Separator::Tab, true, 3)
    );
    assert_eq!(t.values, vec![1.0, 2.0, 3.0, 4.0, 5.0, 6.0]);
    let (s, t) = shape_and_table("  1.5   2  3\n4 5    6\n");
    assert_eq!(s.separator, Separator::Whitespace);
    assert_eq!(t.row(0), &[1.5, 2.0, 3.0]);
    // One column is a table too (a history).
    let (s, t) = shape_and_table("12\n-3\n4.5\n");
    assert_eq!((s.columns, t.rows()), (1, 3));
}

#[test]
fn bad_rows_are_refused_with_line_column_and_reason() {
    let text = "sx,sy\n1,2\nabc,3\n4,\n5,inf\n6\n7,8\n";
    let (_, t) = shape_and_table(text);
    assert_eq!(t.rows(), 2);
    assert_eq!(t.lines, vec![2, 7]);
    assert_eq!(t.refused_count, 4);
    let got: Vec<(usize, usize, String)> = t
        .refused
        .iter()
        .map(|r| (r.line, r.column, r.reason.to_string()))
        .collect();
    assert_eq!(
        got,
        vec![
            (3, 1, "“abc” is not a number".to_string()),
            (4, 2, "the cell is empty".to_string()),
            (5, 2, "not a finite number".to_string()),
            (6, 2, "only 1 cells".to_string()),
        ]
    );
}

#[test]
fn a_label_column_is_kept_as_text() {
    let text = "point;sx\nA-12;1,5\nB 3;2\n";
    let s = sniff(text).unwrap();
    let t = read(text, &s, Some(0));
    assert_eq!(
        (t.label(0), t.label(1), t.label(2)),
        (Some("A-12"), Some("B 3"), None)
    );
    assert_eq!(t.row(0)[1], 1.5);
}

#[test]
fn texts_that_are_not_tables_are_refused_whole() {
    assert_eq!(sniff(""), Err(TableError::Empty));
    assert_eq!(sniff("# only\n\n   \n"), Err(TableError::Empty));
    assert_eq!(sniff("name,part\nshaft,A\n"), Err(TableError::NoNumbers));
    assert_eq!(
        sniff("Dear reader,\nthis is a letter.\n"),
        Err(TableError::NoNumbers)
    );
    assert_eq!(sniff("PK\u{3}\u{4}\0\0"), Err(TableError::Binary));
    assert_eq!(sniff("sx,sy\n"), Err(TableError::Empty));
}

#[test]
fn many_refusals_are_counted_but_few_kept() {
    let mut text = String::from("sx\n1\n");
    for _ in 0..250 {
        text.push_str("x\n");
    }
    let (_, t) = shape_and_table(&text);
    assert_eq!((t.refused_count, t.refused.len()), (250, KEEP_REFUSALS));
}

#[test]
fn column_kinds_are_guessed_from_common_header_names() {
    use ColumnKind::{Gauge, Label, Skip, Strain, Stress, Time};
    let kinds: Vec<ColumnKind> = [
        "Node ID",
        "S11 (MPa)",
        "S22",
        "S33",
        "S12",
        "S23",
        "S13",
        "time [s]",
        "SG1",
        "gauge 2",
        "C",
        "εx",
        "gamma_xy",
        "temperature",
    ]
    .iter()
    .map(|n| guess_kind(n))
    .collect();
    assert_eq!(
        kinds,
        vec![
            Label,
            Stress(0),
            Stress(1),
            Stress(2),
            Stress(3),
            Stress(4),
            Stress(5),
            Time,
            Gauge(0),
            Gauge(1),
            Gauge(2),
            Strain(0),
            Strain(3),
            Skip
        ]
    );
    assert_eq!(guess_kind("σx"), Stress(0));
    assert_eq!(guess_kind("tau_zx"), Stress(5));
    assert_eq!(guess_kind("g9"), Skip);
    let s = sniff("1 2 3\n4 5 6\n").unwrap();
    assert_eq!(guess_kinds(&s), vec![Stress(0), Stress(1), Stress(3)]);
}

#[test]
fn a_lone_carriage_return_ends_a_line_everywhere() {
    // Old Mac line ends, and a mix: each row keeps its own line number, in both readers.
    for text in ["sx;sy\r1;2\r3;4\r", "sx sy\r1 2\r\n3 4\n"] {
        let (_, t) = shape_and_table(text);
        assert_eq!(t.lines, vec![2, 3], "{text:?}");
        assert_eq!(t.values, vec![1.0, 2.0, 3.0, 4.0]);
    }
}

#[test]
fn a_table_read_in_pieces_is_the_table_read_whole() {
    let mut text = String::from("\u{feff}# logger\r\nid;a;b\r\n");
    for i in 0..3000 {
        match i % 500 {
            7 => text.push_str("# note\r\n\r\n"),
            9 => text.push_str(&format!("p{i};x;1\r\n")),
            11 => text.push_str(&format!("p{i};1\r")),
            _ => text.push_str(&format!("p{i};{i},5;-{i}\r\n")),
        }
    }
    let shape = sniff(&text).unwrap();
    let whole = read(&text, &shape, Some(0));
    assert_eq!((whole.refused_count, whole.rows()), (12, 3000 - 12 - 6)); // 6 comment lines
    for cut in [1, 2, 3, 7, 4096, 1 << 20] {
        same_table(&in_pieces(&text, &shape, Some(0), cut), &whole);
    }
}

/// `text` read by a [`StreamReader`] fed `cut` bytes at a time.
fn in_pieces(text: &str, shape: &Shape, label: Option<usize>, cut: usize) -> Table {
    let mut reader = StreamReader::new(shape, label);
    for piece in text.as_bytes().chunks(cut) {
        reader.push(piece).unwrap();
    }
    assert_eq!(reader.bytes_seen(), text.len());
    reader.finish()
}

/// Field by field (the label column holds NaN, which equals nothing).
fn same_table(t: &Table, whole: &Table) {
    let bits = |t: &Table| t.values.iter().map(|v| v.to_bits()).collect::<Vec<_>>();
    assert!(bits(t) == bits(whole), "values differ");
    assert!(t.lines == whole.lines, "lines differ");
    assert!(t.label_text == whole.label_text && t.label_ends == whole.label_ends);
    assert!(
        t.refused == whole.refused,
        "{:?} {:?}",
        t.refused,
        whole.refused
    );
    assert_eq!(t.refused_count, whole.refused_count);
}

#[test]
fn quoted_cells_spanning_lines_read_the_same_in_pieces() {
    let text = "id,sx,sy\n1,2,3\n\"a\nb\",4,5\n# c\n6,\"7\",8\r\n9,x,1\n";
    let shape = sniff(text).unwrap();
    let whole = read(text, &shape, Some(0));
    assert_eq!(whole.lines, vec![2, 3, 6]);
    for cut in 1..text.len() {
        same_table(&in_pieces(text, &shape, Some(0), cut), &whole);
    }
}

#[test]
fn a_byte_order_mark_inside_the_text_is_a_cells_text_in_every_reader() {
    // Only the file's first one is dropped; one at a later line's start (two files pasted
    // together) is refused as text, whole or in pieces, with quotes or without.
    for text in ["\u{feff}1;2\n\u{feff}3;4\n", "a;b\n1;2\n\u{feff}3;\"4\"\n"] {
        let shape = sniff(text).unwrap();
        let whole = read(text, &shape, None);
        assert_eq!(whole.refused_count, 1, "{text:?}");
        for cut in 1..text.len() {
            same_table(&in_pieces(text, &shape, None, cut), &whole);
        }
    }
}

#[test]
fn a_nul_byte_in_a_later_piece_refuses_the_file() {
    let shape = sniff("a,b\n1,2\n").unwrap();
    let mut r = StreamReader::new(&shape, None);
    assert!(r.push(b"a,b\n1,2\n").is_ok());
    assert_eq!(r.push(b"3,\x004\n"), Err(TableError::Binary));
}

proptest::proptest! {
    /// Without quotes the reader splits lines itself; with a quote added anywhere harmless
    /// (a quoted first header cell) the `csv` crate reads: both give the same rows.
    #[test]
    fn the_plain_path_reads_what_the_csv_path_reads(
        cells in proptest::collection::vec(
            proptest::prop_oneof![
                proptest::strategy::Just(String::new()),
                proptest::strategy::Just(" ".to_string()),
                "[-+]?[0-9]{1,4}(\\.[0-9]{0,3})?",
                "[a-z#]{1,3}",
            ],
            0..60,
        ),
        ends in proptest::collection::vec(0u8..6, 60),
    ) {
        let mut body = String::new();
        for (i, c) in cells.iter().enumerate() {
            body.push_str(c);
            let end = match ends[i] {
                0 => "\n",
                1 => "\r\n",
                2 => "\r",
                3 => "\n# note\n",
                _ => ",",
            };
            body.push_str(end);
        }
        let plain = format!("h1,h2,h3\n{body}");
        let quoted = format!("\"h1\",h2,h3\n{body}");
        let shape = Shape {
            separator: Separator::Comma,
            decimal_comma: false,
            header: Some(vec!["h1".into(), "h2".into(), "h3".into()]),
            columns: 3,
        };
        for label in [None, Some(1)] {
            same_table(&read(&plain, &shape, label), &read(&quoted, &shape, label));
        }
    }
}

proptest::proptest! {
    /// Any text, cut anywhere, reads as the same table as read whole (what the fuzz target
    /// checks, here from an alphabet dense in separators, quotes, comments and line ends).
    #[test]
    fn any_text_reads_the_same_in_pieces(
        head in "[a-c]{1,2}([,;][a-c\"]{1,2}){1,3}\n",
        body in "[0-9a#,;\"\r\n .\u{feff}]{0,80}",
        cut in 1usize..9,
    ) {
        let text = format!("{head}{body}");
        let Ok(shape) = sniff(&text) else { return Ok(()) };
        for label in [None, Some(0)] {
            same_table(&in_pieces(&text, &shape, label, cut), &read(&text, &shape, label));
        }
    }
}
