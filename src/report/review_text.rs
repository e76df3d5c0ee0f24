//! `review` for the terminal: the gate's verdict, the rule changes in brief, lint counts,
//! then the preview as `preview` shows it.

use std::fmt::Write as _;

use super::preview_text::{self, Limits};
use super::style::{Style, clean_line};
use crate::review::ReviewReport;

pub fn render(report: &ReviewReport, style: Style, limits: Limits) -> String {
    let mut out = String::new();
    let _ = writeln!(
        out,
        "{} {} -> {}",
        style.bold("review"),
        clean_line(&report.base),
        clean_line(&report.head)
    );
    if report.gate.limits.is_empty() && report.gate.passed() {
        let _ = writeln!(
            out,
            "  gate     {}",
            style.dim("no limits set (add `gate:` to the base ruleset)")
        );
    } else if report.gate.passed() {
        let _ = writeln!(
            out,
            "  gate     {}",
            style.green("passed: every limit holds")
        );
    } else {
        let _ = writeln!(
            out,
            "  gate     {}",
            style.red(&format!(
                "blocked: {} limit(s) breached",
                report.gate.breaches.len()
            ))
        );
        for b in &report.gate.breaches {
            let _ = writeln!(out, "    {} {}", style.red(b.limit), clean_line(&b.reason));
        }
    }
    if report.gate_changed {
        let _ = writeln!(
            out,
            "  {}",
            style.yellow("note: this change edits the gate limits too")
        );
    }
    let counts = report.diff.counts();
    let changes: Vec<String> = counts
        .iter()
        .map(|((section, change), n)| format!("{n} {section} {change:?}").to_lowercase())
        .collect();
    let _ = writeln!(
        out,
        "  rules    {}",
        if changes.is_empty() {
            "no rule changes".into()
        } else {
            changes.join(", ")
        }
    );
    let c = &report.lint.counts;
    let _ = writeln!(
        out,
        "  lint     {} error(s), {} warning(s), {} info on the head (`lexdelta lint` shows them)\n",
        c.error, c.warning, c.info
    );
    out.push_str(&preview_text::render(&report.preview, style, limits));
    out
}
