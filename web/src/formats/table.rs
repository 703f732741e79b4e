//! Tables of numbers from files or pasted text: finite-element exports and gauge-logger files.
//!
//! Accepted: comma, semicolon, tab or whitespace separated; with semicolons (as spreadsheets
//! write them in much of Europe) or tabs a decimal comma is read too (`1,5` = 1.5); a header
//! line or none; `#` comment lines; LF or CRLF line ends; a UTF-8 byte-order mark; quoted
//! fields (comma, semicolon and tab tables, by the `csv` crate). Blank lines are not rows.
//!
//! Every row is kept or refused with its 1-based line number in the file, the column and the
//! reason (a word, an empty cell, a non-finite number, too few cells); nothing is dropped
//! silently. A short plain decimal (most cells) is read exactly in one pass
//! ([`read_short_decimal`]); every other cell by the `fast-float2` crate (correctly rounded,
//! like Rust's own parser, and faster). A `#` comment runs to the next line feed, as the `csv`
//! crate reads it, so an old-style lone CR does not end it.
//! A text that is empty, or has no numeric column, is refused as a whole.

use core::fmt;

mod export;
mod kinds;
mod number;
mod pieces;

pub use export::write_results;
pub use kinds::{guess_kind, guess_kinds};
pub use number::read_short_decimal;
pub use pieces::{line_ends, StreamReader};

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
    // The common case first: a plain number.
    if let Ok(v) = fast_float2::parse::<f64, _>(t) {
        return if v.is_finite() {
            Ok(v)
        } else {
            Err(Reason::NotFinite)
        };
    }
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
    if decimal_comma && t.len() <= buf.len() {
        if let Some(i) = t.iter().position(|&b| b == b',') {
            buf[..t.len()].copy_from_slice(t);
            buf[i] = b'.';
            match fast_float2::parse::<f64, _>(&buf[..t.len()]) {
                Ok(v) if v.is_finite() => return Ok(v),
                Ok(_) => return Err(Reason::NotFinite),
                Err(_) => {}
            }
        }
    }
    Err(Reason::NotANumber(
        String::from_utf8_lossy(t).chars().take(24).collect(),
    ))
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

/// [`strip_bom`] on bytes.
fn strip_bom_bytes(bytes: &[u8]) -> &[u8] {
    bytes.strip_prefix(b"\xEF\xBB\xBF").unwrap_or(bytes)
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
    let mut t = Table {
        columns: shape.columns,
        ..Table::default()
    };
    let mut at = Cursor {
        skip_header: shape.header.is_some(),
        lines: 0,
    };
    read_into(
        &mut t,
        strip_bom(text).as_bytes(),
        shape,
        label,
        &mut at,
        None,
    );
    t
}

/// Where a reading in pieces stands: whether the header line is still to come, and the line
/// ends read so far.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Cursor {
    pub skip_header: bool,
    pub lines: usize,
}

/// Reads the rows of `bytes` (whole lines of a text, the first of them line `at.lines + 1` of
/// the file) into `t`, and moves `at` past them (the header skipped, the line ends counted).
///
/// Comma, semicolon and tab tables with a quote character go through the `csv` crate (a quoted
/// cell may hold separators and line ends); without one, each line is split at the separator
/// directly, which reads the same rows (tested against the `csv` path) several times faster.
/// `quoted` says whether `bytes` holds a quote, when the caller knows (`None`: look).
pub(crate) fn read_into(
    t: &mut Table,
    bytes: &[u8],
    shape: &Shape,
    label: Option<usize>,
    at: &mut Cursor,
    quoted: Option<bool>,
) {
    let skip_header = &mut at.skip_header;
    let lines_before = at.lines;
    let quoted = quoted.unwrap_or_else(|| memchr::memchr(b'"', bytes).is_some());
    at.lines += match shape.separator {
        Separator::Whitespace => {
            let text = String::from_utf8_lossy(bytes);
            for (i, l) in lines(&text).enumerate() {
                let s = l.trim();
                if s.is_empty() || s.starts_with('#') {
                    continue;
                }
                if core::mem::take(skip_header) {
                    continue;
                }
                take_row(
                    t,
                    shape,
                    label,
                    lines_before + i + 1,
                    s.split_whitespace().map(str::as_bytes),
                );
            }
            pieces::line_ends(bytes)
        }
        sep if !quoted => read_plain(
            t,
            bytes,
            sep.byte(),
            shape,
            label,
            skip_header,
            lines_before,
        ),
        sep => {
            // The `csv` crate drops a byte-order mark at the start of what it reads; one that
            // is not at the file's start (the caller strips that) is a cell's text, so it gets
            // a blank line in front, which the reader skips.
            let lead: &[u8] = if bytes.starts_with(b"\xEF\xBB\xBF") {
                b"\n"
            } else {
                b""
            };
            let shift = lead.len() as u64;
            let mut r = csv::ReaderBuilder::new()
                .delimiter(sep.byte())
                .has_headers(false)
                .flexible(true)
                .comment(Some(b'#'))
                .from_reader(std::io::Read::chain(lead, bytes));
            let mut rec = csv::ByteRecord::new();
            let mut lines = LineIndex::new(bytes);
            loop {
                match r.read_byte_record(&mut rec) {
                    Ok(false) => break,
                    Ok(true) => {
                        let line = rec
                            .position()
                            .map_or(0, |p| lines.line_at(p.byte().saturating_sub(shift)));
                        if rec.iter().all(|c| c.trim_ascii().is_empty()) {
                            continue;
                        }
                        if core::mem::take(skip_header) {
                            continue;
                        }
                        take_row(t, shape, label, lines_before + line, rec.iter());
                    }
                    Err(e) => {
                        // Reading bytes from memory has no other failure; kept for safety.
                        let line = e
                            .position()
                            .map_or(0, |p| lines.line_at(p.byte().saturating_sub(shift)));
                        refuse(
                            t,
                            lines_before + line,
                            1,
                            Reason::NotANumber("(not text)".into()),
                        );
                    }
                }
            }
            pieces::line_ends(bytes)
        }
    };
}

/// A separated text without quotes, a line at a time, as the `csv` crate reads it: lines end
/// at `\n`, `\r\n` or a lone `\r`; a line starting with `#` is a comment,
/// which runs to the next `\n` (a lone `\r` does not end it there); a line whose cells
/// are all blank is not a row. Gives the line ends it read (as [`pieces::line_ends`] counts
/// them).
fn read_plain(
    t: &mut Table,
    bytes: &[u8],
    sep: u8,
    shape: &Shape,
    label: Option<usize>,
    skip_header: &mut bool,
    lines_before: usize,
) -> usize {
    let mut rest = bytes;
    let mut ends = 0;
    while !rest.is_empty() {
        let line = lines_before + ends + 1;
        if rest[0] == b'#' {
            // A comment runs to the next line feed (a lone CR does not end it), as the `csv`
            // crate reads it; a lone CR inside still counts as a line end.
            let end = memchr::memchr(b'\n', rest).map_or(rest.len(), |i| i + 1);
            ends += pieces::line_ends(&rest[..end]);
            rest = &rest[end..];
            continue;
        }
        let (l, next) = match memchr::memchr2(b'\r', b'\n', rest) {
            None => (rest, &rest[rest.len()..]),
            Some(i) => {
                ends += 1;
                let end = if rest[i] == b'\r' && rest.get(i + 1) == Some(&b'\n') {
                    i + 2
                } else {
                    i + 1
                };
                (&rest[..i], &rest[end..])
            }
        };
        rest = next;
        if l.iter().all(|&b| b == sep || b.is_ascii_whitespace()) {
            continue;
        }
        if core::mem::take(skip_header) {
            continue;
        }
        take_row(t, shape, label, line, l.split(|&b| b == sep));
    }
    ends
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
        // Most cells are short plain decimals, read exactly in one pass; the rest the general
        // way.
        match read_short_decimal(c).map_or_else(|| read_cell_bytes(c, shape.decimal_comma), Ok) {
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
                // A comment runs to the next line feed, as the `csv` crate reads it.
                b = memchr::memchr(b'\n', &bytes[b..]).map_or(bytes.len(), |i| b + i);
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
