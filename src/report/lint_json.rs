//! `lint` as JSON: the report value as it is, with the tool's name and version, for scripts.

use serde::Serialize;

use crate::lint::LintReport;

#[derive(Serialize)]
struct Document<'a> {
    tool: &'static str,
    version: &'static str,
    #[serde(flatten)]
    report: &'a LintReport,
}

/// Pretty-printed, with a final newline; field order is fixed by the types, so the output
/// is byte-identical across runs.
pub fn render(report: &LintReport) -> Result<String, serde_json::Error> {
    let document = Document {
        tool: "lexdelta",
        version: env!("CARGO_PKG_VERSION"),
        report,
    };
    Ok(serde_json::to_string_pretty(&document)? + "\n")
}
