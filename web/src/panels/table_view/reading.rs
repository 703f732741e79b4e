//! Getting a table in: a chosen file read as the browser streams its bytes (never held whole
//! as text; the browser paints and takes input after every few MB), or pasted text read at
//! once.

use crate::edge::browser;
use crate::formats::table::{guess_kinds, read, sniff, Shape, StreamReader, Table, TableError};
use crate::model::table::ColumnKind;
use std::sync::Arc;

/// Largest table file the page reads, in bytes.
pub const MAX_TABLE_FILE: usize = 256 * 1024 * 1024;

/// Bytes read from a file between two hand-backs to the browser (about 20 ms of reading).
const BYTES_PER_TURN: usize = 4 * 1024 * 1024;

/// A table read, with the kinds the user confirmed.
#[derive(Clone)]
pub struct Loaded {
    /// Where it came from (file name, or "pasted text").
    pub from: String,
    pub shape: Shape,
    pub table: Arc<Table>,
    pub kinds: Vec<ColumnKind>,
}

impl Loaded {
    /// The columns' names: the header's, else "column 1", "column 2", ...
    pub fn names(&self) -> Vec<String> {
        self.shape.header.clone().unwrap_or_else(|| {
            (1..=self.table.columns)
                .map(|j| format!("column {j}"))
                .collect()
        })
    }
}

/// The shape of a table, its guessed kinds and its label column.
fn shape_of(text: &str) -> Result<(Shape, Vec<ColumnKind>, Option<usize>), TableError> {
    let shape = sniff(text)?;
    let kinds = guess_kinds(&shape);
    let label = kinds.iter().position(|k| *k == ColumnKind::Label);
    Ok((shape, kinds, label))
}

/// Reads pasted `text` as a table, or says why not.
pub fn load(text: &str, from: String) -> Result<Loaded, String> {
    let (shape, kinds, label) = shape_of(text).map_err(|e| e.to_string())?;
    let table = read(text, &shape, label);
    Ok(Loaded {
        from,
        shape,
        table: Arc::new(table),
        kinds,
    })
}

/// Reads `file` (`size` bytes) as the browser streams it: its shape from the first chunk(s),
/// then every chunk's complete lines as they come. Hands control back to the browser (to
/// paint and take input) after each [`BYTES_PER_TURN`] of bytes, sets `progress` (0–1) then and asks
/// `cancelled`; `Ok(None)` when cancelled.
pub async fn load_file(
    file: web_sys::File,
    name: String,
    size: f64,
    progress: impl Fn(f64),
    cancelled: impl Fn() -> bool,
) -> Result<Option<Loaded>, String> {
    if size > MAX_TABLE_FILE as f64 {
        return Err(format!(
            "the file is {size} bytes; a table file is at most {MAX_TABLE_FILE}"
        ));
    }
    let mut stream = browser::start_file_stream(&file)?;
    // The first bytes, until they hold a row to learn the shape from (or the file ends).
    let mut head = Vec::new();
    let mut ended = false;
    let (shape, kinds, label) = loop {
        match stream.next().await? {
            Some(chunk) => head.extend_from_slice(&chunk),
            None => ended = true,
        }
        let upto = memchr::memrchr(b'\n', &head).map_or(head.len(), |i| i + 1);
        let text = if ended { &head[..] } else { &head[..upto] };
        if memchr::memchr(0, text).is_some() {
            stream.stop();
            return Err(TableError::Binary.to_string());
        }
        match shape_of(&String::from_utf8_lossy(text)) {
            Ok(s) => break s,
            Err(TableError::Empty) if !ended => {}
            Err(e) => {
                stream.stop();
                return Err(e.to_string());
            }
        }
    };
    let mut reader = StreamReader::new(&shape, label);
    // Room for the rows the file holds at the first bytes' bytes per line.
    let lines = crate::formats::table::line_ends(&head).max(1);
    let estimate = size / head.len().max(1) as f64 * lines as f64 * 1.02;
    reader.reserve_rows((estimate as usize).min(size as usize / 2));
    if let Err(e) = reader.push(&head) {
        stream.stop();
        return Err(e.to_string());
    }
    let mut read = head.len();
    drop(head);
    let mut since_turn = read;
    while !ended {
        let Some(chunk) = stream.next().await? else {
            ended = true;
            continue;
        };
        read += chunk.len();
        since_turn += chunk.len();
        if let Err(e) = reader.push(&chunk) {
            stream.stop();
            return Err(e.to_string());
        }
        if since_turn >= BYTES_PER_TURN {
            since_turn = 0;
            progress(read as f64 / size);
            browser::yield_to_browser().await;
            if cancelled() {
                stream.stop();
                return Ok(None);
            }
        }
    }
    // A cancel pressed while the last bytes were read.
    if cancelled() {
        return Ok(None);
    }
    Ok(Some(Loaded {
        from: name,
        shape,
        table: Arc::new(reader.finish()),
        kinds,
    }))
}
