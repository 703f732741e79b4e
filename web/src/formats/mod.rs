//! The file formats: the case link (`link`, one case in a URL fragment), the saved-case library
//! (`saved`, many cases as JSON in local storage or a file) — both only write and read a
//! [`crate::model::case::Case`] — and tables of many points (`table`: FE exports and logger
//! files, read into numbers with every refused row accounted for). None computes.

pub mod link;
pub mod saved;
pub mod table;
