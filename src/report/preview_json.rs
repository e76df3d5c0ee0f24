//! `preview` as JSON: the [`PreviewReport`] value, pretty-printed.

use crate::preview::PreviewReport;

pub fn render(report: &PreviewReport) -> Result<String, serde_json::Error> {
    Ok(serde_json::to_string_pretty(report)? + "\n")
}
