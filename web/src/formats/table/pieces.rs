//! Reading a large table a piece at a time, so the page can hand control back to the browser
//! between pieces: where to cut the text, how many lines each piece adds, and appending the
//! pieces' tables into one that equals the table read whole.

use super::{read, strip_bom, Shape, Table, KEEP_REFUSALS};

/// Where to cut `text` into pieces of about `bytes` each, for reading a large table a piece at
/// a time (between pieces the page hands control back to the browser): the byte offsets of the
/// pieces' starts, each just after a line feed. A text with a quote character is not cut (a
/// quoted cell may span lines), nor is one shorter than two pieces.
#[must_use]
pub fn pieces(text: &str, bytes: usize) -> Vec<usize> {
    let b = text.as_bytes();
    let mut starts = vec![0];
    if b.contains(&b'"') || b.len() < 2 * bytes.max(1) {
        return starts;
    }
    let mut at = bytes.max(1);
    while at < b.len() {
        match memchr::memchr(b'\n', &b[at..]) {
            Some(i) if at + i + 1 < b.len() => {
                starts.push(at + i + 1);
                at += i + 1 + bytes;
            }
            _ => break,
        }
    }
    starts
}

/// Line ends in `bytes` (`\n`, `\r\n` or a lone `\r`, each once): the lines a piece of text
/// that ends just after a line feed adds.
#[must_use]
pub fn line_ends(bytes: &[u8]) -> usize {
    let lf = memchr::memchr_iter(b'\n', bytes).count();
    let lone_cr = memchr::memchr_iter(b'\r', bytes)
        .filter(|&i| bytes.get(i + 1) != Some(&b'\n'))
        .count();
    lf + lone_cr
}

/// Reads a table a piece at a time ([`pieces`]): each [`PieceReader::step`] reads one piece
/// and appends it, so a caller can hand control back between pieces.
pub struct PieceReader<'a> {
    body: &'a str,
    shape: Shape,
    label: Option<usize>,
    starts: Vec<usize>,
    next: usize,
    lines_before: usize,
    table: Table,
}

impl<'a> PieceReader<'a> {
    /// Ready to read `text` in `shape` in pieces of about `bytes`.
    #[must_use]
    pub fn new(text: &'a str, shape: &Shape, label: Option<usize>, bytes: usize) -> Self {
        let body = strip_bom(text);
        Self {
            body,
            shape: shape.clone(),
            label,
            starts: pieces(body, bytes),
            next: 0,
            lines_before: 0,
            table: Table {
                columns: shape.columns,
                ..Table::default()
            },
        }
    }

    /// How many pieces the text is cut into.
    #[must_use]
    pub fn pieces(&self) -> usize {
        self.starts.len()
    }

    /// Reads the next piece; the fraction of the text read so far, or `None` when all is read.
    pub fn step(&mut self) -> Option<f64> {
        let &s = self.starts.get(self.next)?;
        let end = self
            .starts
            .get(self.next + 1)
            .copied()
            .unwrap_or(self.body.len());
        let shape = Shape {
            header: if self.next == 0 {
                self.shape.header.clone()
            } else {
                None
            },
            ..self.shape.clone()
        };
        let piece = &self.body[s..end];
        self.table
            .append(read(piece, &shape, self.label), self.lines_before);
        self.lines_before += line_ends(piece.as_bytes());
        self.next += 1;
        Some(end as f64 / self.body.len().max(1) as f64)
    }

    /// The table read so far.
    #[must_use]
    pub fn finish(self) -> Table {
        self.table
    }
}

impl Table {
    /// Appends the rows of `next`, a table read from a later piece of the same text whose
    /// first line is line `lines_before + 1` of the whole.
    pub fn append(&mut self, next: Table, lines_before: usize) {
        let shift = u32::try_from(lines_before).unwrap_or(u32::MAX);
        self.values.extend_from_slice(&next.values);
        self.lines
            .extend(next.lines.iter().map(|l| l.saturating_add(shift)));
        let text_shift = u32::try_from(self.label_text.len()).unwrap_or(u32::MAX);
        self.label_text.push_str(&next.label_text);
        self.label_ends
            .extend(next.label_ends.iter().map(|e| e.saturating_add(text_shift)));
        for mut r in next.refused {
            if self.refused.len() < KEEP_REFUSALS {
                r.line += lines_before;
                self.refused.push(r);
            }
        }
        self.refused_count += next.refused_count;
    }
}
