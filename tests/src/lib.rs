//! Helpers shared by the cross-crate tests: a tolerance check that prints the difference, a
//! minimal Chromium driver over the DevTools protocol, and a static file server for the built page.

pub mod browser;
pub mod check;
pub mod page;
pub mod peers;
pub mod serve;
