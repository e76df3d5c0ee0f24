//! `lint` as SARIF 2.1.0 (the OASIS standard for static analysis results), so code review
//! tools can show findings on the rule files' lines.
//!
//! One run; `tool.driver.rules` lists every check (generated from the check metadata) and
//! each result points at its rule by `ruleId` and `ruleIndex`. Locations are URIs relative to
//! the directory given as `root` (the repository or working directory), with forward
//! slashes; columns count Unicode code points, as the YAML positions do.

use std::path::{Component, Path};

use serde_json::{Value, json};

use crate::lint::{Finding, LintReport, Related, checks};
use crate::rules::Origin;
use crate::severity::Severity;

const SCHEMA: &str =
    "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json";

/// Renders the report; file names are made relative to `root` where they lie inside it.
pub fn render(report: &LintReport, root: &Path) -> Result<String, serde_json::Error> {
    let rules: Vec<Value> = checks::infos()
        .map(|c| {
            json!({
                "id": c.name,
                "name": c.name,
                "shortDescription": { "text": c.summary },
                "fullDescription": { "text": c.finds },
                "help": { "text": c.explanation() },
                "defaultConfiguration": { "level": level(c.severity) },
            })
        })
        .collect();
    let results: Vec<Value> = report.findings.iter().map(|f| result(f, root)).collect();
    let log = json!({
        "$schema": SCHEMA,
        "version": "2.1.0",
        "runs": [{
            "tool": {
                "driver": {
                    "name": "lexdelta",
                    "version": env!("CARGO_PKG_VERSION"),
                    "rules": rules,
                }
            },
            "columnKind": "unicodeCodePoints",
            "results": results,
            "properties": {
                "ruleset": report.ruleset,
                "silenced": report.silenced,
                "notRun": report.skipped.iter().map(|s| s.check).collect::<Vec<_>>(),
            },
        }],
    });
    Ok(serde_json::to_string_pretty(&log)? + "\n")
}

fn level(severity: Severity) -> &'static str {
    match severity {
        Severity::Error => "error",
        Severity::Warning => "warning",
        Severity::Info => "note",
    }
}

fn result(f: &Finding, root: &Path) -> Value {
    let rule_index = checks::infos().position(|c| c.name == f.check).unwrap_or(0);
    let mut result = json!({
        "ruleId": f.check,
        "ruleIndex": rule_index,
        "level": level(f.severity),
        "message": { "text": f.message },
        "locations": [{ "physicalLocation": physical(&f.origin, root) }],
    });
    if !f.related.is_empty() {
        let related: Vec<Value> = f
            .related
            .iter()
            .enumerate()
            .map(|(i, r)| related_location(i, r, root))
            .collect();
        result["relatedLocations"] = Value::Array(related);
    }
    let mut properties = serde_json::Map::new();
    if let Some(rule) = &f.rule {
        properties.insert("rule".into(), json!(rule));
    }
    if let Some(help) = &f.help {
        properties.insert("help".into(), json!(help));
    }
    if !f.members.is_empty() {
        properties.insert("members".into(), json!(f.members));
    }
    if !f.forms.is_empty() {
        properties.insert("forms".into(), json!(f.forms));
    }
    if !properties.is_empty() {
        result["properties"] = Value::Object(properties);
    }
    result
}

fn related_location(i: usize, r: &Related, root: &Path) -> Value {
    json!({
        "id": i,
        "physicalLocation": physical(&r.origin, root),
        "message": { "text": r.note },
    })
}

fn physical(origin: &Origin, root: &Path) -> Value {
    json!({
        "artifactLocation": { "uri": uri(&origin.file, root) },
        "region": {
            "startLine": origin.line.max(1),
            "startColumn": origin.column.max(1),
        },
    })
}

/// A relative URI reference with forward slashes for files under `root`; a `file:` URI for
/// absolute paths elsewhere. Characters that would end or escape a URI path are
/// percent-encoded.
pub fn uri(file: &str, root: &Path) -> String {
    let path = Path::new(file);
    let relative = if path.is_absolute() {
        match path.strip_prefix(root) {
            Ok(rest) => rest.to_path_buf(),
            Err(_) => return format!("file://{}", encode(&slashes(path))),
        }
    } else {
        path.to_path_buf()
    };
    let encoded = encode(&slashes(&relative));
    // A relative reference whose first segment holds a colon ("HEAD:rules/a.yaml") would
    // read as a scheme; "./" keeps it a path.
    match encoded.split('/').next() {
        Some(first) if first.contains(':') => format!("./{encoded}"),
        _ => encoded,
    }
}

/// The path's parts joined by `/`, without `.` parts.
fn slashes(path: &Path) -> String {
    let mut parts: Vec<String> = Vec::new();
    let mut absolute = false;
    for c in path.components() {
        match c {
            Component::RootDir => absolute = true,
            Component::CurDir | Component::Prefix(_) => {}
            Component::ParentDir => parts.push("..".into()),
            Component::Normal(p) => parts.push(p.to_string_lossy().replace('\\', "/")),
        }
    }
    let joined = parts.join("/");
    if absolute {
        format!("/{joined}")
    } else {
        joined
    }
}

fn encode(path: &str) -> String {
    let mut out = String::with_capacity(path.len());
    for c in path.chars() {
        match c {
            ' ' => out.push_str("%20"),
            '%' => out.push_str("%25"),
            '#' => out.push_str("%23"),
            '?' => out.push_str("%3F"),
            '[' => out.push_str("%5B"),
            ']' => out.push_str("%5D"),
            c => out.push(c),
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn uris_are_relative_with_forward_slashes() {
        let root = Path::new("/work/repo");
        assert_eq!(
            uri("/work/repo/rules/synonyms.yaml", root),
            "rules/synonyms.yaml"
        );
        assert_eq!(uri("./rules/a b.yaml", root), "rules/a%20b.yaml");
        assert_eq!(
            uri("demo-corpus/proposed/exempt.yaml", root),
            "demo-corpus/proposed/exempt.yaml"
        );
        assert_eq!(uri("/elsewhere/x.yaml", root), "file:///elsewhere/x.yaml");
        assert_eq!(uri("HEAD:rules/x.yaml", root), "./HEAD:rules/x.yaml");
    }
}
