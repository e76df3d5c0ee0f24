//! `lint` for the terminal: findings grouped by file, each with its source line, a caret
//! under the term, related places and a hint.

use std::collections::HashMap;
use std::fmt::Write as _;

use super::style::{Style, clean_line};
use crate::lint::{CheckInfo, Finding, FormCount, LintReport, checks};
use crate::rules::SourceFile;
use crate::severity::Severity;

/// Forms listed under a finding.
const FORMS_SHOWN: usize = 8;

/// Renders a report; `sources` are the rule files' texts, for the source lines.
pub fn render(report: &LintReport, sources: &[SourceFile], style: Style) -> String {
    let texts: HashMap<&str, &str> = sources
        .iter()
        .map(|s| (s.name.as_str(), s.text.as_str()))
        .collect();
    // Each file's lines, split once (a finding's line is then a look-up, not a scan).
    let mut lines: HashMap<&str, Vec<&str>> = HashMap::new();
    let mut out = String::new();
    let mut current: Option<&str> = None;
    for finding in &report.findings {
        let file: &str = &finding.origin.file;
        if current != Some(file) {
            if current.is_some() {
                out.push('\n');
            }
            let n = report
                .findings
                .iter()
                .filter(|f| &*f.origin.file == file)
                .count();
            let _ = writeln!(
                out,
                "{} {}",
                style.bold(file),
                style.dim(&count(n, "finding", "findings"))
            );
            current = Some(file);
        }
        out.push('\n');
        let line = texts.get(file).and_then(|text| {
            let of_file = lines.entry(file).or_insert_with(|| text.lines().collect());
            of_file
                .get(finding.origin.line.saturating_sub(1) as usize)
                .copied()
        });
        finding_block(&mut out, finding, line, style);
    }
    if !report.findings.is_empty() {
        out.push('\n');
    }
    summary(&mut out, report, style);
    out
}

fn finding_block(out: &mut String, f: &Finding, line: Option<&str>, style: Style) {
    let severity = paint_severity(f.severity, style);
    let _ = writeln!(
        out,
        "{}: {}{}: {}",
        clean_line(&f.location()),
        severity,
        style.dim(&format!("[{}]", f.check)),
        style.bold(&clean_line(&f.message))
    );
    if let Some(line) = line {
        source_excerpt(out, f.origin.line, f.origin.column, line, style);
    }
    // A rule without an id is named by its file and line, which the location already says.
    if let Some(rule) = f.rule.as_ref().filter(|r| !r.starts_with(&*f.origin.file)) {
        let _ = writeln!(out, "  {} {rule}", style.dim("rule:"));
    }
    if !f.forms.is_empty() {
        let _ = writeln!(out, "  {} {}", style.dim("forms:"), forms_line(&f.forms));
    }
    for r in &f.related {
        let _ = writeln!(
            out,
            "  {} {}:{}:{}: {}",
            style.dim("related:"),
            clean_line(&r.origin.file),
            r.origin.line,
            r.origin.column,
            clean_line(&r.note)
        );
    }
    if let Some(help) = &f.help {
        let _ = writeln!(out, "  {} {}", style.cyan("help:"), clean_line(help));
    }
}

/// Source lines longer than this are quoted as a window around the column.
const MAX_QUOTED: usize = 100;

/// The line with its number, and a caret under the term the column points at.
fn source_excerpt(out: &mut String, number: u32, column: u32, line: &str, style: Style) {
    // A long line (a set of 100k members on one line) is quoted as a window around the
    // column, once per finding, not whole.
    let count = line.chars().count();
    let windowed;
    let (line, column) = if count > MAX_QUOTED {
        let col = (column.saturating_sub(1) as usize).min(count);
        let start = col.saturating_sub(MAX_QUOTED / 2);
        let window: String = line.chars().skip(start).take(MAX_QUOTED).collect();
        windowed = format!("…{window}…");
        (windowed.as_str(), (col - start + 2) as u32)
    } else {
        (line, column)
    };
    let line = &*clean_line(line);
    let number = number.to_string();
    let pad = " ".repeat(number.len());
    let before: String = line
        .chars()
        .take(column.saturating_sub(1) as usize)
        .map(|c| if c == '\t' { '\t' } else { ' ' })
        .collect();
    let rest: String = line
        .chars()
        .skip(column.saturating_sub(1) as usize)
        .collect();
    let carets = "^".repeat(scalar_width(&rest).max(1));
    let bar = style.dim("|");
    let _ = writeln!(out, "{pad} {bar}");
    let _ = writeln!(out, "{} {bar} {line}", style.dim(&number));
    let _ = writeln!(out, "{pad} {bar} {before}{}", style.yellow(&carets));
}

/// How many characters the YAML scalar at the start of `rest` takes: a quoted scalar to its
/// closing quote, a plain one up to the flow punctuation or comment that ends it.
fn scalar_width(rest: &str) -> usize {
    let mut chars = rest.chars();
    match chars.next() {
        Some(q @ ('"' | '\'')) => match chars.position(|c| c == q) {
            Some(end) => end + 2,
            None => rest.chars().count(),
        },
        Some(_) => {
            let mut width = 0;
            let mut last_kept = 0;
            let mut prev = ' ';
            for c in rest.chars() {
                if matches!(c, ',' | ']' | '}')
                    || (c == '#' && prev == ' ')
                    || (c == ':' && width > 0)
                {
                    break;
                }
                width += 1;
                if !c.is_whitespace() {
                    last_kept = width;
                }
                prev = c;
            }
            last_kept
        }
        None => 0,
    }
}

fn forms_line(forms: &[FormCount]) -> String {
    let mut parts: Vec<String> = forms
        .iter()
        .take(FORMS_SHOWN)
        .map(|f| {
            format!(
                "{} ({}, {})",
                f.form,
                count(f.documents as usize, "doc", "docs"),
                count(f.searches as usize, "search", "searches")
            )
        })
        .collect();
    if forms.len() > FORMS_SHOWN {
        parts.push(format!("… {} more", forms.len() - FORMS_SHOWN));
    }
    parts.join(", ")
}

fn summary(out: &mut String, report: &LintReport, style: Style) {
    let c = report.counts;
    let total = c.error + c.warning + c.info;
    let headline = if total == 0 {
        format!("no findings in {}", report.ruleset)
    } else {
        format!(
            "{}, {}, {} info in {}",
            count(c.error, "error", "errors"),
            count(c.warning, "warning", "warnings"),
            c.info,
            report.ruleset
        )
    };
    let silenced = if report.silenced > 0 {
        format!(" ({} silenced)", report.silenced)
    } else {
        String::new()
    };
    let _ = writeln!(out, "{}{}", style.bold(&headline), style.dim(&silenced));
    if let Some(v) = report.vocabulary {
        let _ = writeln!(
            out,
            "{}",
            style.dim(&format!(
                "vocabulary: {} surface forms from {} documents and {} searches",
                v.forms, v.documents, v.searches
            ))
        );
    }
    for s in &report.skipped {
        let _ = writeln!(
            out,
            "{}",
            style.dim(&format!("not run: {} ({})", s.check, s.reason))
        );
    }
}

fn paint_severity(severity: Severity, style: Style) -> String {
    match severity {
        Severity::Error => style.red(&style.bold("error")),
        Severity::Warning => style.yellow(&style.bold("warning")),
        Severity::Info => style.cyan("info"),
    }
}

fn count(n: usize, one: &str, many: &str) -> String {
    format!("{n} {}", if n == 1 { one } else { many })
}

/// `--list-checks`: every check with its default severity, what it needs and its summary.
pub fn render_check_list(style: Style) -> String {
    let infos: Vec<&CheckInfo> = checks::infos().collect();
    let width = infos.iter().map(|c| c.name.len()).max().unwrap_or(0);
    let mut out = String::new();
    for c in infos {
        let needs = match c.needs {
            crate::lint::Needs::Nothing => "",
            crate::lint::Needs::Vocabulary => " (needs a vocabulary)",
            crate::lint::Needs::Base => " (needs --base)",
        };
        let name = format!("{:width$}", c.name);
        let _ = writeln!(
            out,
            "{}  {:7}  {}{}",
            style.bold(&name),
            c.severity.name(),
            c.summary,
            style.dim(needs)
        );
    }
    out
}

/// `--explain NAME`: the check's full documentation, prose wrapped for a terminal.
pub fn render_explanation(info: &CheckInfo, style: Style) -> String {
    format!(
        "{} ({} by default)\n\n{}\n",
        style.bold(info.name),
        info.severity.name(),
        wrap(&info.explanation(), 88)
    )
}

/// Wraps prose lines at `width` columns; indented lines (examples) are left as they are.
fn wrap(text: &str, width: usize) -> String {
    let mut out = Vec::new();
    for line in text.lines() {
        if line.starts_with(' ') || line.chars().count() <= width {
            out.push(line.to_string());
            continue;
        }
        let mut current = String::new();
        for word in line.split(' ') {
            if !current.is_empty() && current.chars().count() + 1 + word.chars().count() > width {
                out.push(std::mem::take(&mut current));
            }
            if !current.is_empty() {
                current.push(' ');
            }
            current.push_str(word);
        }
        out.push(current);
    }
    out.join("\n")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn prose_wraps_and_examples_do_not() {
        let text = format!(
            "{}\n    keep: [this, line, exactly, as, it, is, however, long, it, gets, to, be]",
            "word ".repeat(30)
        );
        let wrapped = wrap(&text, 20);
        assert!(
            wrapped
                .lines()
                .all(|l| l.chars().count() <= 20 || l.starts_with("    "))
        );
        assert!(wrapped.ends_with("long, it, gets, to, be]"));
    }

    #[test]
    fn carets_cover_the_scalar() {
        assert_eq!(scalar_width("universal, accessible]"), 9);
        assert_eq!(scalar_width("\"a, b\"]"), 6);
        assert_eq!(scalar_width("light rail]"), 10);
        assert_eq!(scalar_width("left  # note"), 4);
        assert_eq!(scalar_width("stroller"), 8);
        assert_eq!(scalar_width(""), 0);
    }
}
