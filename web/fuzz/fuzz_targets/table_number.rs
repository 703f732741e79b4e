//! The table reader's one-pass decimal reader against Rust's own parser (the reference): for
//! any bytes, a value it gives is bit for bit what `str::parse::<f64>` gives, and what the
//! reader's general path (`read_cell`) gives.
#![no_main]

use stresscase_web::formats::table::{read_cell, read_short_decimal};

libfuzzer_sys::fuzz_target!(|data: &[u8]| {
    let Some(v) = read_short_decimal(data) else {
        return;
    };
    let s = core::str::from_utf8(data).expect("the one-pass reader reads ASCII only");
    let rust: f64 = s.parse().expect("Rust's parser reads it too");
    assert_eq!(v.to_bits(), rust.to_bits(), "{s}: {v} against Rust's {rust}");
    let general = read_cell(s, false).expect("the general path reads it too");
    assert_eq!(v.to_bits(), general.to_bits(), "{s}: {v} against {general}");
});
