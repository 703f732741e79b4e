//! The browser edge: every call into the browser (`browser`) and the plain-Rust rule for when an
//! edit becomes a history entry (`history`).

pub mod browser;
pub mod history;
