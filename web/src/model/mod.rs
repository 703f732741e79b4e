//! The case model: raw text → validated case → results, one way. `entry` reads one typed
//! number and `numfmt` writes one; `choices` and `inputs` declare what a case holds (every
//! typed number one row of `inputs`); `source` turns the case's inputs into a stress tensor
//! (one module per path) and `judge` judges it against the material (static and fatigue);
//! `case` holds the form and validates it into a [`case::Case`]; `evaluation` takes that to
//! every result; `table` does the same for each row of a table of many points.

pub mod case;
pub mod choices;
pub mod entry;
pub mod evaluation;
pub mod inputs;
pub mod judge;
pub mod numfmt;
pub mod source;
pub mod table;
