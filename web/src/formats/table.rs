//! Tables of numbers from files or pasted text: finite-element exports and gauge-logger files.
//!
//! Accepted: comma, semicolon, tab or whitespace separated; with semicolons (as spreadsheets
//! write them in much of Europe) or tabs a decimal comma is read too (`1,5` = 1.5); a header
//! line or none; `#` comment lines; LF or CRLF line ends; a UTF-8 byte-order mark; quoted
//! fields (comma, semicolon and tab tables, by the `csv` crate). Blank lines are not rows.
//!
//! Every row is kept or refused with its 1-based line number in the file, the column and the
//! reason (a word, an empty cell, a non-finite number, too few cells); nothing is dropped
//! silently. Numbers are read by Rust's own float parser (correctly rounded; no extra crate).
//! A text that is empty, or has no numeric column, is refused as a whole.

use core::fmt;

mod export;
mod kinds;
mod pieces;

pub use export::write_results;
pub use kinds::{guess_kind, guess_kinds};
pub use pieces::{line_ends, pieces, PieceReader};

/// How the cells of a line are separated.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Separator {
    /// `,`
    Comma,
    /// `;` (decimal comma allowed)
    Semicolon,
    /// tab (decimal comma allowed)
    Tab,
    /// one or more spaces or tabs
    Whitespace,
}

impl Separator {
    /// How the page names it.
    #[must_use]
    pub fn name(self) -> &'static str {
        match self {
            Separator::Comma => "comma",
            Separator::Semicolon => "semicolon",
            Separator::Tab => "tab",
            Separator::Whitespace => "spaces",
        }
    }

    fn byte(self) -> u8 {
        match self {
            Separator::Comma => b',',
            Separator::Semicolon => b';',
            Separator::Tab | Separator::Whitespace => b'\t',
        }
    }
}

/// The shape of a table, found by [`sniff`] (the page shows it and lets the user change it).
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Shape {
    /// The separator.
    pub separator: Separator,
    /// Whether `1,5` reads as 1.5.
    pub decimal_comma: bool,
    /// The header's names, when the first row is a header.
    pub header: Option<Vec<String>>,
    /// Cells per row (the header's, or the first data row's).
    pub columns: usize,
}

/// Why a whole text is refused.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum TableError {
    /// Nothing but blank and comment lines.
    Empty,
    /// No column of the first rows reads as numbers.
    NoNumbers,
    /// Not text at all (a NUL byte: a binary file).
    Binary,
}

impl fmt::Display for TableError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            TableError::Empty => "the file has no rows: only blank or # comment lines",
            TableError::NoNumbers => "no column of numbers was found: this does not look like a table of stresses, strains or readings",
            TableError::Binary => "this is not a text file (it holds binary data)",
        })
    }
}

/// Why one row is refused.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Reason {
    /// A cell that is not a number (the text, shortened).
    NotANumber(String),
    /// An empty cell.
    Empty,
    /// inf or NaN.
    NotFinite,
    /// Fewer cells than the table has columns.
    TooFew(usize),
}

impl fmt::Display for Reason {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Reason::NotANumber(t) => write!(f, "“{t}” is not a number"),
            Reason::Empty => f.write_str("the cell is empty"),
            Reason::NotFinite => f.write_str("not a finite number"),
            Reason::TooFew(n) => write!(f, "only {n} cells"),
        }
    }
}

/// A refused row.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Refusal {
    /// 1-based line in the file.
    pub line: usize,
    /// 1-based column (for too few cells: the first missing one).
    pub column: usize,
    /// Why.
    pub reason: Reason,
}

/// How many refusals are kept with their details (all are counted).
pub const KEEP_REFUSALS: usize = 100;

/// The numbers of a table, row-major.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Table {
    /// Cells per row.
    pub columns: usize,
    /// `columns` numbers per kept row. A column the user marks as text (an id) is read as its
    /// text in `labels` and NaN here.
    pub values: Vec<f64>,
    /// The 1-based file line of each kept row.
    pub lines: Vec<u32>,
    /// The label column's texts of the kept rows, one after another (see [`Table::label`]).
    pub label_text: String,
    /// Where each kept row's label ends in `label_text`, when there is a label column.
    pub label_ends: Vec<u32>,
    /// The first [`KEEP_REFUSALS`] refused rows.
    pub refused: Vec<Refusal>,
    /// Every refused row, counted.
    pub refused_count: usize,
}

impl Table {
    /// Kept rows.
    #[must_use]
    pub fn rows(&self) -> usize {
        self.lines.len()
    }

    /// Row `i`'s label, when there is a label column.
    #[must_use]
    pub fn label(&self, i: usize) -> Option<&str> {
        let end = *self.label_ends.get(i)? as usize;
        let start = i.checked_sub(1).map_or(0, |p| self.label_ends[p] as usize);
        self.label_text.get(start..end)
    }

    /// Row `i`'s cells.
    #[must_use]
    pub fn row(&self, i: usize) -> &[f64] {
        &self.values[i * self.columns..(i + 1) * self.columns]
    }
}

/// Reads one cell as a finite number.
///
/// # Errors
/// The reason, for a refusal.
pub fn read_cell(cell: &str, decimal_comma: bool) -> Result<f64, Reason> {
    read_cell_bytes(cell.as_bytes(), decimal_comma)
}

/// [`read_cell`] on the cell's bytes (the reader's fast path): ASCII cells are parsed by
/// `fast-float2` (correctly rounded, like Rust's own parser, and faster); a cell with other
/// characters (a non-breaking space, say) goes through `str` trimming and Rust's parser.
fn read_cell_bytes(cell: &[u8], decimal_comma: bool) -> Result<f64, Reason> {
    let t = cell.trim_ascii();
    if !t.is_ascii() {
        let s = String::from_utf8_lossy(t);
        let s = s.trim();
        if s.is_ascii() {
            return read_cell_bytes(s.as_bytes(), decimal_comma);
        }
        return Err(Reason::NotANumber(s.chars().take(24).collect()));
    }
    if t.is_empty() {
        return Err(Reason::Empty);
    }
    let mut buf = [0u8; 64];
    let bytes = match t.iter().position(|&b| b == b',') {
        Some(i) if decimal_comma && t.len() <= buf.len() => {
            buf[..t.len()].copy_from_slice(t);
            buf[i] = b'.';
            &buf[..t.len()]
        }
        _ => t,
    };
    match fast_float2::parse::<f64, _>(bytes) {
        Ok(v) if v.is_finite() => Ok(v),
        Ok(_) => Err(Reason::NotFinite),
        Err(_) => Err(Reason::NotANumber(
            String::from_utf8_lossy(t).chars().take(24).collect(),
        )),
    }
}

/// The lines of a text, ended by `\n`, `\r\n` or a lone `\r` (as the `csv` reader ends records).
fn lines(text: &str) -> impl Iterator<Item = &str> {
    let mut rest = Some(text);
    core::iter::from_fn(move || {
        let s = rest?;
        match s.find(['\r', '\n']) {
            None => {
                rest = None;
                (!s.is_empty()).then_some(s)
            }
            Some(i) => {
                let skip = if s[i..].starts_with("\r\n") { 2 } else { 1 };
                rest = Some(&s[i + skip..]);
                Some(&s[..i])
            }
        }
    })
}

/// The text without a leading byte-order mark.
fn strip_bom(text: &str) -> &str {
    text.strip_prefix('\u{feff}').unwrap_or(text)
}

/// The first lines that are rows (not blank, not `#` comments), with their 1-based numbers.
fn first_rows(text: &str, n: usize) -> Vec<(usize, &str)> {
    lines(text)
        .enumerate()
        .filter(|(_, l)| !l.trim().is_empty() && !l.trim_start().starts_with('#'))
        .take(n)
        .map(|(i, l)| (i + 1, l))
        .collect()
}

/// Splits a line the simple way (for sniffing; quotes are honoured by the reader itself).
fn split(line: &str, sep: Separator) -> Vec<&str> {
    match sep {
        Separator::Whitespace => line.split_whitespace().collect(),
        s => line.split(char::from(s.byte())).collect(),
    }
}

/// Finds the separator, whether a decimal comma is used, and the header, from the first rows.
///
/// # Errors
/// [`TableError`] for a text that is not a table.
pub fn sniff(text: &str) -> Result<Shape, TableError> {
    if text.as_bytes().contains(&0) {
        return Err(TableError::Binary);
    }
    let text = strip_bom(text);
    let rows = first_rows(text, 20);
    if rows.is_empty() {
        return Err(TableError::Empty);
    }
    // The separator that splits the first row into more than one cell, and at least half of
    // the sampled rows into as many: the first of semicolon, tab, comma that does; else
    // whitespace; else one column.
    let fits = |sep: Separator| {
        let n = split(rows[0].1, sep).len();
        let same = rows
            .iter()
            .filter(|(_, l)| split(l, sep).len() == n)
            .count();
        n > 1 && 2 * same >= rows.len()
    };
    let separator = [
        Separator::Semicolon,
        Separator::Tab,
        Separator::Comma,
        Separator::Whitespace,
    ]
    .into_iter()
    .find(|&s| fits(s))
    .unwrap_or(Separator::Whitespace);
    let decimal_comma = matches!(
        separator,
        Separator::Semicolon | Separator::Tab | Separator::Whitespace
    ) && rows.iter().any(|(_, l)| {
        split(l, separator)
            .iter()
            .any(|c| c.contains(',') && read_cell(c, true).is_ok())
    });
    let cells = |l: &str| -> Vec<String> {
        split(l, separator)
            .into_iter()
            .map(|c| c.trim().trim_matches('"').to_string())
            .collect()
    };
    let first = cells(rows[0].1);
    let is_header = first.iter().any(|c| read_cell(c, decimal_comma).is_err());
    let data: Vec<Vec<String>> = rows
        .iter()
        .skip(usize::from(is_header))
        .map(|(_, l)| cells(l))
        .collect();
    let columns = first.len();
    let numeric = (0..columns).any(|j| {
        data.iter().any(|r| {
            r.get(j)
                .is_some_and(|c| read_cell(c, decimal_comma).is_ok())
        })
    });
    if !numeric {
        return Err(if data.is_empty() && is_header {
            TableError::Empty
        } else {
            TableError::NoNumbers
        });
    }
    Ok(Shape {
        separator,
        decimal_comma,
        header: is_header.then_some(first),
        columns,
    })
}

/// Reads every row of `text` in `shape`. `label` is the column (0-based) read as text, if any.
/// Extra cells beyond `shape.columns` are ignored.
#[must_use]
pub fn read(text: &str, shape: &Shape, label: Option<usize>) -> Table {
    let text = strip_bom(text);
    let mut t = Table {
        columns: shape.columns,
        ..Table::default()
    };
    let mut skip_header = shape.header.is_some();
    match shape.separator {
        Separator::Whitespace => {
            for (i, l) in lines(text).enumerate() {
                let s = l.trim();
                if s.is_empty() || s.starts_with('#') {
                    continue;
                }
                if skip_header {
                    skip_header = false;
                    continue;
                }
                take_row(
                    &mut t,
                    shape,
                    label,
                    i + 1,
                    s.split_whitespace().map(str::as_bytes),
                );
            }
        }
        sep => {
            let mut r = csv::ReaderBuilder::new()
                .delimiter(sep.byte())
                .has_headers(false)
                .flexible(true)
                .comment(Some(b'#'))
                .from_reader(text.as_bytes());
            let mut rec = csv::ByteRecord::new();
            let mut lines = LineIndex::new(text.as_bytes());
            loop {
                match r.read_byte_record(&mut rec) {
                    Ok(false) => break,
                    Ok(true) => {
                        let line = rec.position().map_or(0, |p| lines.line_at(p.byte()));
                        if rec.iter().all(|c| c.trim_ascii().is_empty()) {
                            continue;
                        }
                        if skip_header {
                            skip_header = false;
                            continue;
                        }
                        take_row(&mut t, shape, label, line, rec.iter());
                    }
                    Err(e) => {
                        // Reading bytes from memory has no other failure; kept for safety.
                        let line = e.position().map_or(0, |p| lines.line_at(p.byte()));
                        refuse(&mut t, line, 1, Reason::NotANumber("(not text)".into()));
                    }
                }
            }
        }
    }
    t
}

fn refuse(t: &mut Table, line: usize, column: usize, reason: Reason) {
    t.refused_count += 1;
    if t.refused.len() < KEEP_REFUSALS {
        t.refused.push(Refusal {
            line,
            column,
            reason,
        });
    }
}

/// Reads one row's cells into `t`: kept whole, or refused at its first bad cell.
fn take_row<'c>(
    t: &mut Table,
    shape: &Shape,
    label: Option<usize>,
    line: usize,
    cells: impl Iterator<Item = &'c [u8]>,
) {
    let start = t.values.len();
    let label_start = t.label_text.len();
    let mut n = 0;
    for (j, c) in cells.take(shape.columns).enumerate() {
        n = j + 1;
        if Some(j) == label {
            t.label_text.push_str(String::from_utf8_lossy(c).trim());
            t.values.push(f64::NAN);
            continue;
        }
        match read_cell_bytes(c, shape.decimal_comma) {
            Ok(v) => t.values.push(v),
            Err(reason) => {
                t.values.truncate(start);
                t.label_text.truncate(label_start);
                return refuse(t, line, j + 1, reason);
            }
        }
    }
    if n < shape.columns {
        t.values.truncate(start);
        t.label_text.truncate(label_start);
        return refuse(t, line, n + 1, Reason::TooFew(n));
    }
    t.lines.push(u32::try_from(line).unwrap_or(u32::MAX));
    if label.is_some() {
        t.label_ends
            .push(u32::try_from(t.label_text.len()).unwrap_or(u32::MAX));
    }
}

/// 1-based line numbers of byte offsets, for records met in order.
///
/// The `csv` reader's position is where it began looking for a record, before the line ends
/// and `#` comment lines it skipped, and its own line count leaves comments out: this skips
/// those and looks the line up among the line starts (found once, with `memchr`).
struct LineIndex<'a> {
    bytes: &'a [u8],
    starts: Vec<usize>,
    at: usize,
}

impl<'a> LineIndex<'a> {
    fn new(bytes: &'a [u8]) -> Self {
        let mut starts = vec![0];
        let mut skip_lf = usize::MAX;
        for i in memchr::memchr2_iter(b'\r', b'\n', bytes) {
            if i == skip_lf {
                continue;
            }
            if bytes[i] == b'\r' && bytes.get(i + 1) == Some(&b'\n') {
                skip_lf = i + 1;
                starts.push(i + 2);
            } else {
                starts.push(i + 1);
            }
        }
        Self {
            bytes,
            starts,
            at: 0,
        }
    }

    fn line_at(&mut self, byte: u64) -> usize {
        let bytes = self.bytes;
        let mut b = usize::try_from(byte)
            .unwrap_or(bytes.len())
            .min(bytes.len());
        loop {
            while b < bytes.len() && matches!(bytes[b], b'\r' | b'\n') {
                b += 1;
            }
            if b < bytes.len() && bytes[b] == b'#' {
                while b < bytes.len() && !matches!(bytes[b], b'\r' | b'\n') {
                    b += 1;
                }
                continue;
            }
            break;
        }
        while self.at + 1 < self.starts.len() && self.starts[self.at + 1] <= b {
            self.at += 1;
        }
        self.at + 1
    }
}

#[cfg(test)]
mod tests;
