//! Renderers: each turns one result value into one output format, as a string. None of
//! them prints.

pub mod collisions_csv;
pub mod collisions_json;
pub mod collisions_text;
pub mod lint_dot;
pub mod lint_json;
pub mod lint_sarif;
pub mod lint_text;
pub mod preview_json;
pub mod preview_text;
pub mod review_html;
pub mod review_json;
pub mod review_markdown;
pub mod review_text;
pub mod stemcheck_text;
pub mod style;
pub mod trace_text;

pub use style::{ColorChoice, Style};
