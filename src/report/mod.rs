//! Renderers: each turns one result value into one output format, as a string. None of
//! them prints.

pub mod lint_dot;
pub mod lint_json;
pub mod lint_sarif;
pub mod lint_text;
pub mod style;
pub mod trace_text;

pub use style::{ColorChoice, Style};
