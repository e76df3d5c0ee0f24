//! `preview` as JSON: the [`PreviewReport`] value, pretty-printed.

use serde_json::Value;

use crate::preview::PreviewReport;

/// What the JSON leaves out.
#[derive(Clone, Copy, Debug, Default)]
pub struct Omit {
    /// Each changed query's top-k lists (`top_before`, `top_after`): most of a large
    /// report's bytes, and not needed when only the labels, counts and metrics are read.
    pub top_lists: bool,
}

const TOP_LISTS: [&str; 2] = ["top_before", "top_after"];

pub fn render(report: &PreviewReport, omit: Omit) -> Result<String, serde_json::Error> {
    if !omit.top_lists {
        return Ok(serde_json::to_string_pretty(report)? + "\n");
    }
    let mut value = serde_json::to_value(report)?;
    if let Some(queries) = value.get_mut("queries").and_then(Value::as_array_mut) {
        for query in queries.iter_mut().filter_map(Value::as_object_mut) {
            for key in TOP_LISTS {
                query.remove(key);
            }
        }
    }
    if let Some(object) = value.as_object_mut() {
        // Say what was left out, so a reader never takes a missing list for an empty one.
        object.insert("omitted".into(), TOP_LISTS.into());
    }
    Ok(serde_json::to_string_pretty(&value)? + "\n")
}
