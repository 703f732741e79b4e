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

/// Most values a typed load history may hold (a case link carries them all).
pub const MAX_HISTORY: usize = 5000;

/// Reads a typed load history: numbers separated by line breaks, spaces, tabs, commas or
/// semicolons. When the text has a semicolon, semicolons and white space separate and a comma
/// is a decimal comma (as spreadsheets write it where the comma is the decimal mark).
///
/// # Errors
/// The first value that does not read (1-based), fewer than two values, or more than
/// [`MAX_HISTORY`].
pub fn parse_history(raw: &str) -> Result<Vec<f64>, String> {
    let decimal_comma = raw.contains(';');
    let is_separator = |c: char| c.is_whitespace() || c == ';' || (c == ',' && !decimal_comma);
    let mut out = Vec::new();
    for (i, token) in raw
        .split(is_separator)
        .filter(|t| !t.is_empty())
        .enumerate()
    {
        if i >= MAX_HISTORY {
            return Err(format!(
                "more than {MAX_HISTORY} values; reduce the history to its peaks and valleys, or read it as a table"
            ));
        }
        let v = parse_number(token).map_err(|e| format!("value {} ('{token}'): {e}", i + 1))?;
        out.push(v);
    }
    if out.len() < 2 {
        return Err("give at least two values: the history's peaks and valleys, in order".into());
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reads_a_history_in_either_decimal_convention() {
        assert_eq!(
            parse_history("10, -20.5\n30 40"),
            Ok(vec![10.0, -20.5, 30.0, 40.0])
        );
        assert_eq!(
            parse_history("10;-20,5\n30;40"),
            Ok(vec![10.0, -20.5, 30.0, 40.0])
        );
        assert!(parse_history("10, x").unwrap_err().contains("value 2"));
        assert!(parse_history("10").is_err());
        let long = "1 ".repeat(MAX_HISTORY + 1);
        assert!(parse_history(&long).unwrap_err().contains("more than"));
    }

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
