//! File formats (serde types and their conversion to the planning core).
//! No I/O here: callers read and write the text.

pub mod card_svg;
mod chart_svg;
pub mod cylinder_spec;
pub mod plan_text;
mod svg_page;
pub mod team_file;
