//! Writing numbers for people: a fixed number of significant digits, plain notation for
//! everyday magnitudes and `×10ⁿ` beyond them, never "-0".

/// Significant digits shown for results.
pub const RESULT_DIGITS: usize = 5;

/// `v` with `sig` significant digits: plain for 1e-3 ≤ |v| < 1e6, else `m × 10ⁿ`.
#[must_use]
pub fn format_sig(v: f64, sig: usize) -> String {
    if !v.is_finite() {
        return if v.is_nan() {
            "—".into()
        } else if v > 0.0 {
            "∞".into()
        } else {
            "−∞".into()
        };
    }
    let sig = sig.clamp(1, 17);
    // Round once, to `sig` digits in scientific form, then decide the notation from the
    // rounded value (so 999.999 → 1000.0) and place its digits (no second rounding).
    let sci = format!("{:.*e}", sig - 1, v);
    let (mantissa, exp) = sci.split_once('e').unwrap_or((sci.as_str(), "0"));
    let exp: i32 = exp.parse().unwrap_or(0);
    let negative = mantissa.starts_with('-');
    let digits: String = mantissa.chars().filter(char::is_ascii_digit).collect();
    if digits.bytes().all(|d| d == b'0') {
        return "0".into();
    }
    let mut out = String::with_capacity(sig + 8);
    if negative {
        out.push('−');
    }
    if (-3..6).contains(&exp) {
        // Plain: `sig` significant digits, the decimal point moved by `exp`.
        if exp < 0 {
            out.push_str("0.");
            out.extend(core::iter::repeat_n('0', (-exp - 1) as usize));
            out.push_str(&digits);
        } else {
            let int = exp as usize + 1;
            if digits.len() > int {
                out.push_str(&digits[..int]);
                out.push('.');
                out.push_str(&digits[int..]);
            } else {
                out.push_str(&digits);
                out.extend(core::iter::repeat_n('0', int - digits.len()));
            }
        }
    } else {
        out.push_str(&mantissa[usize::from(negative)..]);
        out.push_str(" × 10");
        out.push_str(&superscript(exp));
    }
    out
}

/// Writes a number in its shortest form that reads back to the same f64.
#[must_use]
pub fn write_number(v: f64) -> String {
    if v == 0.0 {
        return "0".into();
    }
    let plain = format!("{v}");
    let sci = format!("{v:e}");
    if sci.len() < plain.len() {
        sci
    } else {
        plain
    }
}

/// A number beyond double range given as `mantissa`·10^`exponent`, in the same notation.
#[must_use]
pub fn format_decimal_power(mantissa: f64, exponent: i32, sig: usize) -> String {
    let m = format_sig(mantissa, sig);
    format!("{m} × 10{}", superscript(exponent))
}

/// `n` in superscript digits (for powers of ten).
#[must_use]
pub fn superscript(n: i32) -> String {
    n.to_string()
        .chars()
        .map(|c| match c {
            '-' => '⁻',
            '0' => '⁰',
            '1' => '¹',
            '2' => '²',
            '3' => '³',
            '4' => '⁴',
            '5' => '⁵',
            '6' => '⁶',
            '7' => '⁷',
            '8' => '⁸',
            _ => '⁹',
        })
        .collect()
}

/// A number typed back into an input after a unit change: 12 significant digits (the form converts
/// from the typed value, so digits are never lost by repeated changes), trailing zeros dropped, ASCII only so it parses again.
#[must_use]
pub fn format_for_entry(v: f64) -> String {
    if v == 0.0 {
        return "0".into();
    }
    let s = format!("{:.11e}", v);
    let back: f64 = s.parse().unwrap_or(v);
    let plain = format!("{back}");
    if plain.len() <= 16 {
        plain
    } else {
        let (m, e) = s.split_once('e').unwrap_or((s.as_str(), "0"));
        let m = m.trim_end_matches('0').trim_end_matches('.');
        format!("{m}e{e}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The former two-step writer (round in scientific form, then write the rounded value
    /// plainly with the float formatter), kept to check the digit-placing one against.
    fn format_sig_by_formatter(v: f64, sig: usize) -> String {
        let sig = sig.clamp(1, 17);
        let sci = format!("{:.*e}", sig - 1, v);
        let (mantissa, exp) = sci.split_once('e').unwrap();
        let exp: i32 = exp.parse().unwrap();
        let mantissa: f64 = mantissa.parse().unwrap();
        if mantissa == 0.0 {
            return "0".into();
        }
        let out = if (-3..6).contains(&exp) {
            let decimals = (sig as i32 - 1 - exp).max(0) as usize;
            format!("{:.*}", decimals, mantissa * 10f64.powi(exp))
        } else {
            format!("{:.*} × 10{}", sig - 1, mantissa, superscript(exp))
        };
        out.replace('-', "−")
    }

    proptest::proptest! {
        #[test]
        fn digits_are_placed_as_the_float_formatter_places_them(
            v in proptest::prop_oneof![
                -1e7..1e7f64, -1.0..1.0f64, -1e-2..1e-2f64,
                proptest::num::f64::NORMAL | proptest::num::f64::SUBNORMAL,
            ],
            sig in 1usize..=8,
        ) {
            proptest::prop_assert_eq!(format_sig(v, sig), format_sig_by_formatter(v, sig));
        }
    }

    #[test]
    fn significant_digits() {
        assert_eq!(format_sig(104.0312, 5), "104.03");
        assert_eq!(format_sig(-24.0312, 5), "−24.031");
        assert_eq!(format_sig(0.0, 5), "0");
        assert_eq!(format_sig(-0.0, 5), "0");
        assert_eq!(format_sig(-1e-20, 5), "−1.0000 × 10⁻²⁰");
        assert_eq!(format_sig(999.999, 4), "1000");
        assert_eq!(format_sig(2.5e9, 3), "2.50 × 10⁹");
        assert_eq!(format_sig(0.00123456, 3), "0.00123");
        assert_eq!(format_sig(f64::NAN, 3), "—");
    }

    #[test]
    fn entry_format_parses_back() {
        for v in [
            1.0,
            0.1 + 0.2,
            6894.757293168361,
            -1.5e-9,
            1e150,
            123456789012.0,
        ] {
            let s = format_for_entry(v);
            let back = crate::model::entry::parse_number(&s).unwrap();
            assert!((back - v).abs() <= 1e-11 * v.abs(), "{v} -> {s}");
        }
        assert_eq!(format_for_entry(0.30000000000000004), "0.3");
        assert_eq!(format_for_entry(1e150), "1e150");
    }
}
