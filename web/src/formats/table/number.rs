//! The short decimal numbers of a table, read exactly in one pass.
//!
//! A cell such as `-123.4567` or `1.5e3` whose digits, leading and trailing zeros included,
//! number at most 19 and make an integer `m ≤ 2⁵³` is `m × 10^e` with `|e| ≤ 22`: `m` and
//! `10^e` are both exact doubles, so one IEEE multiplication (or division, for `e < 0`) gives
//! the correctly rounded value — Clinger's fast path (W. D. Clinger, "How to read floating
//! point numbers accurately", PLDI 1990; the same path opens Rust's own parser, after
//! Lemire's "Number parsing at a gigabyte per second", 2021). Every other cell (more digits,
//! a larger exponent, `inf`, `.5`, a word) gives `None` and is read by the general parser, so
//! a value from here is bit for bit the one Rust's `str::parse::<f64>` gives (property-tested
//! below, and fuzzed by the `table_number` target).
//!
//! It exists for speed in the page: the page is built for size, and the general parser's
//! per-digit steps stay calls there; this is one loop with nothing to call.

/// 10⁰ … 10²², each exact as a double.
const POW10: [f64; 23] = [
    1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16,
    1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
];

/// Reads `[+-]digits[.digits][(e|E)[+-]digits]` (ASCII, nothing around it) exactly, when it
/// is short enough for the fast path; `None` otherwise (not an error: the caller reads it
/// the general way).
#[inline(always)]
pub fn read_short_decimal(b: &[u8]) -> Option<f64> {
    let mut i = 0;
    let negative = match b.first() {
        Some(b'-') => {
            i = 1;
            true
        }
        Some(b'+') => {
            i = 1;
            false
        }
        _ => false,
    };
    let mut m: u64 = 0;
    let start = i;
    while let Some(&c) = b.get(i) {
        let d = c.wrapping_sub(b'0');
        if d > 9 {
            break;
        }
        // At most 19 digits are taken (checked below), so this cannot overflow before the
        // check: 20 digits would, hence the wrapping arithmetic.
        m = m.wrapping_mul(10).wrapping_add(u64::from(d));
        i += 1;
    }
    let whole = i - start;
    let mut fraction = 0;
    if b.get(i) == Some(&b'.') {
        i += 1;
        let from = i;
        while let Some(&c) = b.get(i) {
            let d = c.wrapping_sub(b'0');
            if d > 9 {
                break;
            }
            m = m.wrapping_mul(10).wrapping_add(u64::from(d));
            i += 1;
        }
        fraction = i - from;
        if fraction == 0 {
            return None;
        }
    }
    if whole == 0 || whole + fraction > 19 || m > 1 << 53 {
        return None;
    }
    let mut exponent = -(fraction as i32);
    if let Some(&c) = b.get(i) {
        if c | 0x20 != b'e' {
            return None;
        }
        i += 1;
        let minus = match b.get(i) {
            Some(b'-') => {
                i += 1;
                true
            }
            Some(b'+') => {
                i += 1;
                false
            }
            _ => false,
        };
        let from = i;
        let mut e: i32 = 0;
        while let Some(&c) = b.get(i) {
            let d = c.wrapping_sub(b'0');
            if d > 9 || i - from >= 4 {
                return None;
            }
            e = e * 10 + i32::from(d);
            i += 1;
        }
        if i == from {
            return None;
        }
        exponent += if minus { -e } else { e };
    }
    let x = m as f64;
    let v = match exponent {
        0 => x,
        1..=22 => x * POW10[exponent as usize],
        -22..=-1 => x / POW10[exponent.unsigned_abs() as usize],
        _ => return None,
    };
    Some(if negative { -v } else { v })
}

#[cfg(test)]
mod tests {
    use super::read_short_decimal;
    use proptest::prelude::*;

    /// Bit for bit Rust's own parser (the reference), whenever the fast path answers.
    fn same_as_rust(s: &str) {
        if let Some(v) = read_short_decimal(s.as_bytes()) {
            let r: f64 = s
                .parse()
                .unwrap_or_else(|e| panic!("{s}: Rust refuses it ({e})"));
            assert_eq!(v.to_bits(), r.to_bits(), "{s}: {v} against Rust's {r}");
        }
    }

    #[test]
    fn plain_cells_take_the_fast_path_and_match_rust() {
        for s in [
            "0",
            "-0",
            "+0",
            "0.0",
            "-0.0",
            "1",
            "-1",
            "123.456",
            "-98.765",
            "1e3",
            "1E3",
            "1.5e-3",
            "-2.5E+2",
            "9007199254740992",
            "0.1",
            "0.2",
            "0.3",
            "1e22",
            "1e-22",
            "4.35",
            "1234567890123456e-5",
            "00012.5000",
        ] {
            assert!(read_short_decimal(s.as_bytes()).is_some(), "{s}");
            same_as_rust(s);
        }
    }

    #[test]
    fn anything_else_is_left_to_the_general_parser() {
        for s in [
            "",
            "-",
            "+",
            ".",
            ".5",
            "5.",
            "1e",
            "1e+",
            "e3",
            "inf",
            "NaN",
            "1,5",
            " 1",
            "1 ",
            "1x",
            "--1",
            "1e23",
            "1e-23",
            "9007199254740993",
            "123456789012345678e-5",
            "12345678901234567890",
            "1.0000000000000000000",
            "1e00001",
            "1.5e3.2",
            "0x10",
            "1_000",
        ] {
            assert!(read_short_decimal(s.as_bytes()).is_none(), "{s}");
        }
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(20_000))]

        /// Decimal texts of every shape the fast path might take or leave.
        #[test]
        fn any_decimal_reads_as_rust_reads_it(
            s in "[+-]?[0-9]{0,21}(\\.[0-9]{0,21})?([eE][+-]?[0-9]{0,4})?"
        ) {
            same_as_rust(&s);
        }

        /// Doubles printed the ways a program writes them.
        #[test]
        fn printed_doubles_read_back_exactly(v in any::<f64>().prop_filter("finite", |v| v.is_finite()), p in 0usize..12) {
            for s in [format!("{v}"), format!("{v:e}"), format!("{v:.p$}"), format!("{v:.p$e}")] {
                same_as_rust(&s);
            }
        }

        /// Arbitrary bytes: never a panic, never a value Rust would not give.
        #[test]
        fn any_bytes_are_safe(b in proptest::collection::vec(any::<u8>(), 0..32)) {
            if let Some(v) = read_short_decimal(&b) {
                let s = core::str::from_utf8(&b).expect("the fast path reads ASCII only");
                prop_assert_eq!(v.to_bits(), s.parse::<f64>().unwrap().to_bits());
            }
        }
    }
}
