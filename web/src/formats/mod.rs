//! The two file formats: the case link (`link`, one case in a URL fragment) and the saved-case
//! library (`saved`, many cases as JSON in local storage or a file). Both only write and read a
//! [`crate::model::case::Case`]; neither computes.

pub mod link;
pub mod saved;
