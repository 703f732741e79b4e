//! One file per panel the user sees, named after it.

pub mod case_shelf;
pub mod caution;
pub mod element_turn;
pub mod link_notice;
pub mod mohr_diagram;
pub mod number_field;
pub mod plane_probe;
pub mod results;
pub mod stale_notice;
pub mod stress_element;
pub mod stress_entry;
