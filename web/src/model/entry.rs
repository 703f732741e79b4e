//! Reading what the user typed into a number field. Accepts a decimal point or a decimal comma,
//! an optional sign (also the typographic minus −) and scientific notation (`2.5e3`, `1,2E-4`).
//! Everything else is refused with a message that says what to type instead.

use core::fmt;

/// Why an entry is not a usable number.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EntryError {
    /// Nothing typed.
    Empty,
    /// Both `.` and `,` appear, or one of them twice.
    DecimalMarks,
    /// Characters that do not make a number.
    NotANumber,
    /// A number beyond ±1.8e308.
    TooLarge,
}

impl fmt::Display for EntryError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Self::Empty => "enter a number (0 if none)",
            Self::DecimalMarks => "use one decimal mark, either . or , — no thousands separators",
            Self::NotANumber => "not a number: digits, one decimal mark and an optional exponent, e.g. -12.5 or 3,2e3",
            Self::TooLarge => "too large: beyond ±1.8e308",
        })
    }
}

/// Parses a number as described in the module docs.
///
/// # Errors
/// The [`EntryError`] that says what is wrong.
pub fn parse_number(raw: &str) -> Result<f64, EntryError> {
    let s = raw.trim();
    if s.is_empty() {
        return Err(EntryError::Empty);
    }
    let s = s.replace('\u{2212}', "-");
    let commas = s.matches(',').count();
    let points = s.matches('.').count();
    if commas + points > 1 {
        return Err(EntryError::DecimalMarks);
    }
    let s = s.replace(',', ".");
    let mut seen_digit = false;
    let mut prev = ' ';
    for (i, ch) in s.chars().enumerate() {
        let ok = match ch {
            '0'..='9' => {
                seen_digit = true;
                true
            }
            '.' => true,
            'e' | 'E' => seen_digit,
            '+' | '-' => i == 0 || matches!(prev, 'e' | 'E'),
            _ => false,
        };
        if !ok {
            return Err(EntryError::NotANumber);
        }
        prev = ch;
    }
    let v: f64 = s.parse().map_err(|_| EntryError::NotANumber)?;
    if v.is_finite() {
        Ok(v)
    } else {
        Err(EntryError::TooLarge)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn accepts_the_usual_forms() {
        for (s, v) in [
            ("12", 12.0),
            (" -12.5 ", -12.5),
            ("12,5", 12.5),
            ("+3", 3.0),
            ("2.5e3", 2500.0),
            ("1,2E-4", 1.2e-4),
            ("\u{2212}7", -7.0),
            (".5", 0.5),
            ("5.", 5.0),
            ("1e-320", 1e-320),
        ] {
            assert_eq!(parse_number(s), Ok(v), "{s}");
        }
    }

    #[test]
    fn refuses_with_a_reason() {
        assert_eq!(parse_number(""), Err(EntryError::Empty));
        assert_eq!(parse_number("   "), Err(EntryError::Empty));
        assert_eq!(parse_number("1.000,5"), Err(EntryError::DecimalMarks));
        assert_eq!(parse_number("1,000,000"), Err(EntryError::DecimalMarks));
        for s in [
            "abc", "12 MPa", "inf", "NaN", "1e", "--1", "1-2", "e5", "0x10", "1_000", "<script>",
        ] {
            assert_eq!(parse_number(s), Err(EntryError::NotANumber), "{s}");
        }
        assert_eq!(parse_number("1e400"), Err(EntryError::TooLarge));
        assert!(!EntryError::NotANumber.to_string().is_empty());
    }
}
