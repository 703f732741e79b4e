//! The Stresscase page as a library: the case model, its link and saved-case formats, and the
//! Leptos panels. `main.rs` only mounts [`app::App`]. Everything outside `app`, `panels` and
//! `browser` is plain Rust, tested natively and fuzzed.

pub mod app;
pub mod browser;
pub mod case;
pub mod entry;
pub mod history;
pub mod judge;
pub mod link;
pub mod numfmt;
pub mod panels;
pub mod plot;
pub mod saved;
pub mod source;
