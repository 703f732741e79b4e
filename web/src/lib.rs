//! The Stresscase page as a library, grouped by concern:
//!
//! - [`model`]: the case and its paths — reading typed text, the table of typed numbers, where
//!   the stress comes from, how it is judged, and the validated case. Plain Rust.
//! - [`formats`]: the file formats — the case link, the saved-case library, tables of many
//!   points. Plain Rust, fuzzed.
//! - [`panels`]: what the user sees, one Leptos component per panel, and the drawing helpers.
//! - [`edge`]: the browser edge — storage, URL, clipboard, files, and when an edit becomes a
//!   history entry.
//!
//! [`app`] composes them; `main.rs` only mounts [`app::App`]. Imports run one way: `formats`
//! reads `model`, `edge` stands alone, and `panels` and `app` use all three
//! (`tests/module_order.rs` fails on a cycle).

pub mod app;
pub mod edge;
pub mod formats;
pub mod model;
pub mod panels;
