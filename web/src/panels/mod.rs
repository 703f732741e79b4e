//! One file per panel the user sees, named after it, and `plot`, the drawing helpers they share.

pub mod calc_sheet;
pub mod case_shelf;
pub mod caution;
pub mod choice_select;
pub mod elastic_entry;
pub mod element_turn;
pub mod export_buttons;
pub mod fatigue_check;
pub mod headline;
pub mod link_notice;
pub mod mohr_diagram;
pub mod number_field;
pub mod plane_probe;
pub mod plot;
pub mod results;
pub mod rosette_entry;
pub mod scan_plot;
pub mod section_loads;
pub mod section_sketch;
pub mod source_pick;
pub mod stale_notice;
pub mod strain_circle;
pub mod strain_entry;
pub mod stress_element;
pub mod stress_entry;
pub mod verdict;
