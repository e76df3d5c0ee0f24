//! `review` as JSON: the [`ReviewReport`] value, pretty-printed.

use crate::review::ReviewReport;

pub fn render(report: &ReviewReport) -> Result<String, serde_json::Error> {
    Ok(serde_json::to_string_pretty(report)? + "\n")
}
