//! The case model: raw text → validated case → results, one way. `entry` reads one typed
//! number, `numfmt` writes one, `source` turns the case's inputs into a stress tensor (one
//! module per path), `judge` judges it against the material (static and fatigue), and `case`
//! holds the form, validates it into a [`case::Case`] and composes the evaluation.

pub mod case;
pub mod choices;
pub mod entry;
pub mod evaluation;
pub mod inputs;
pub mod judge;
pub mod numfmt;
pub mod source;
pub mod table;
