//! The Stresscase page as a library, grouped by concern:
//!
//! - [`model`]: the case and its paths — reading typed text, the table of typed numbers, where
//!   the stress comes from, how it is judged, and the validated case. Plain Rust.
//! - [`formats`]: the two file formats, the case link and the saved-case library. Plain Rust,
//!   fuzzed.
//! - [`panels`]: what the user sees, one Leptos component per panel, and the drawing helpers.
//! - [`edge`]: the browser edge — storage, URL, clipboard, files, and when an edit becomes a
//!   history entry.
//!
//! [`app`] composes them; `main.rs` only mounts [`app::App`]. Imports run one way:
//! `model` ← `formats` ← `edge` ← `panels` ← `app`.

pub mod app;
pub mod edge;
pub mod formats;
pub mod model;
pub mod panels;
