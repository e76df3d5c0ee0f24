//! Reviewing a rule change like code: the rule-level diff, lint on the head, the preview of
//! base → head, and a gate with agreed limits.

pub mod diff;
pub mod gate;

pub use diff::{RuleDiff, diff};
