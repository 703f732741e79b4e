//! Any text as a table: sniffing and reading never panic, every row is kept or refused (the
//! kept rows hold the table's column count of finite numbers, their lines rise), and the
//! refusals kept never exceed those counted. Read in pieces (cut where the first input byte
//! says) it is the same table as read whole.
#![no_main]

use stresscase_web::formats::table::{read, sniff, StreamReader, Table, KEEP_REFUSALS};

libfuzzer_sys::fuzz_target!(|data: &[u8]| {
    let text = String::from_utf8_lossy(data);
    let Ok(shape) = sniff(&text) else { return };
    let cut = usize::from(data.first().copied().unwrap_or(1)).max(1);
    for label in [None, Some(0)] {
        let t = read(&text, &shape, label);
        assert_eq!(t.values.len(), t.rows() * t.columns);
        assert!(t.lines.windows(2).all(|w| w[0] < w[1]));
        assert!(t.refused.len() <= KEEP_REFUSALS.min(t.refused_count));
        let labelled = if label.is_some() { t.rows() } else { 0 };
        assert_eq!(t.label_ends.len(), labelled);
        assert!((0..t.rows()).all(|i| t.label(i).is_some() == label.is_some()));
        for (i, v) in t.values.iter().enumerate() {
            assert!(v.is_finite() || (label == Some(i % t.columns)), "{v}");
        }
        let mut r = StreamReader::new(&shape, label);
        for piece in text.as_bytes().chunks(cut) {
            // Lossy text has no NUL the sniffer let through.
            assert!(r.push(piece).is_ok());
        }
        same(&r.finish(), &t);
    }
});

fn same(a: &Table, b: &Table) {
    let bits = |t: &Table| t.values.iter().map(|v| v.to_bits()).collect::<Vec<_>>();
    assert!(bits(a) == bits(b), "values differ");
    assert_eq!(a.lines, b.lines);
    assert_eq!(a.label_text, b.label_text);
    assert_eq!(a.label_ends, b.label_ends);
    assert_eq!(a.refused, b.refused);
    assert_eq!(a.refused_count, b.refused_count);
}
