//! Reading a large table a piece at a time, as its bytes arrive (the page reads a file as the
//! browser streams it, handing control back to the browser every few MB): complete lines are
//! read as they come, so the file's text is never held whole, and the table read in pieces
//! equals the table read whole (tested, and fuzzed with random cuts).

use super::{read_into, strip_bom_bytes, Cursor, Separator, Shape, Table, TableError};

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

/// Reads a table from its bytes in pieces of any size ([`StreamReader::push`]).
///
/// Each push reads the complete lines it makes (up to the last line feed) and keeps the rest
/// for the next. A quote character in a comma, semicolon or tab table (a quoted cell may span
/// lines) makes the reader keep everything from the piece it appears in and read that part
/// whole at [`StreamReader::finish`].
pub struct StreamReader {
    shape: Shape,
    label: Option<usize>,
    /// Bytes not read yet: a partial last line, or everything since a quote was met.
    carry: Vec<u8>,
    /// A quote was met: the rest is read whole at the end.
    whole: bool,
    /// No bytes read yet (a byte-order mark may still come).
    at_start: bool,
    at: Cursor,
    bytes_seen: usize,
    table: Table,
}

impl StreamReader {
    /// Ready to read a table in `shape`; `label` is the column read as text, if any.
    #[must_use]
    pub fn new(shape: &Shape, label: Option<usize>) -> Self {
        Self {
            shape: shape.clone(),
            label,
            carry: Vec::new(),
            whole: false,
            at_start: true,
            at: Cursor {
                skip_header: shape.header.is_some(),
                lines: 0,
            },
            bytes_seen: 0,
            table: Table {
                columns: shape.columns,
                ..Table::default()
            },
        }
    }

    /// Room for about `rows` rows, so the table grows once (an estimate from the file's size).
    pub fn reserve_rows(&mut self, rows: usize) {
        self.table
            .values
            .reserve(rows.saturating_mul(self.shape.columns));
        self.table.lines.reserve(rows);
    }

    /// Reads the complete lines `bytes` makes with what was kept from the last push.
    ///
    /// # Errors
    /// [`TableError::Binary`] for a NUL byte: the caller drops the reader (nothing is kept).
    pub fn push(&mut self, bytes: &[u8]) -> Result<(), TableError> {
        if memchr::memchr(0, bytes).is_some() {
            return Err(TableError::Binary);
        }
        self.bytes_seen += bytes.len();
        if !self.whole
            && self.shape.separator != Separator::Whitespace
            && memchr::memchr(b'"', bytes).is_some()
        {
            self.whole = true;
        }
        if self.whole {
            self.carry.extend_from_slice(bytes);
            return Ok(());
        }
        let Some(last) = memchr::memrchr(b'\n', bytes) else {
            self.carry.extend_from_slice(bytes);
            return Ok(());
        };
        // The line left over from the last push, completed; then the rest of this push's
        // complete lines where they are (not copied); the partial last line is kept.
        let mut from = 0;
        if !self.carry.is_empty() {
            from = memchr::memchr(b'\n', bytes).map_or(bytes.len(), |i| i + 1);
            self.carry.extend_from_slice(&bytes[..from]);
            let carry = core::mem::take(&mut self.carry);
            self.read_piece(&carry, false);
        }
        if from <= last {
            self.read_piece(&bytes[from..=last], false);
        }
        self.carry = bytes[last + 1..].to_vec();
        Ok(())
    }

    fn read_piece(&mut self, piece: &[u8], quoted: bool) {
        let piece = if core::mem::take(&mut self.at_start) {
            strip_bom_bytes(piece)
        } else {
            piece
        };
        read_into(
            &mut self.table,
            piece,
            &self.shape,
            self.label,
            &mut self.at,
            Some(quoted),
        );
    }

    /// Bytes pushed so far.
    #[must_use]
    pub fn bytes_seen(&self) -> usize {
        self.bytes_seen
    }

    /// Reads what is left and gives the table.
    #[must_use]
    pub fn finish(mut self) -> Table {
        let carry = core::mem::take(&mut self.carry);
        self.read_piece(&carry, self.whole);
        self.table
    }
}
