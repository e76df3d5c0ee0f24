//! The collision report as JSON: the report value itself, pretty-printed.

use crate::audit::report::CollisionReport;

pub fn render(report: &CollisionReport) -> String {
    serde_json::to_string_pretty(report).expect("the report serializes") + "\n"
}
