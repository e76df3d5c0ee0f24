//! `review` as Markdown sized for a pull-request comment: the verdict and summary first,
//! then the most-searched affected queries with the rules that caused them, details folded.

use std::fmt::Write as _;

use crate::preview::{Label, QueryChange, listed};
use crate::review::ReviewReport;
use crate::review::diff::Change;

/// How much the comment shows before folding.
#[derive(Clone, Copy, Debug)]
pub struct Limits {
    pub queries: usize,
    pub docs: usize,
}

pub fn render(report: &ReviewReport, limits: Limits) -> String {
    let mut out = String::new();
    verdict(&mut out, report);
    summary(&mut out, report);
    quality(&mut out, report);
    affected(&mut out, report, limits);
    rule_changes(&mut out, report);
    lint(&mut out, report);
    let _ = writeln!(out, "\n> {}", report.notice);
    out
}

/// Markdown-escapes text from documents and queries so it cannot become markup.
pub fn escape(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        match c {
            '\\' | '`' | '*' | '_' | '[' | ']' | '<' | '>' | '|' | '#' | '!' | '~' => {
                out.push('\\');
                out.push(c);
            }
            '\n' | '\r' => out.push(' '),
            _ => out.push(c),
        }
    }
    out
}

/// `text` as an inline code span, whatever it holds: the fence is longer than any run of
/// backticks inside (a path or id holding a backtick cannot end the span early), line
/// breaks become spaces. Backslash escapes do not work inside code spans, so nothing else
/// is changed.
pub fn code(text: &str) -> String {
    let text: String = text
        .chars()
        .map(|c| if c == '\n' || c == '\r' { ' ' } else { c })
        .collect();
    let mut longest = 0;
    let mut run = 0;
    for c in text.chars() {
        run = if c == '`' { run + 1 } else { 0 };
        longest = longest.max(run);
    }
    let fence = "`".repeat(longest + 1);
    let pad = if text.starts_with('`') || text.ends_with('`') {
        " "
    } else {
        ""
    };
    format!("{fence}{pad}{text}{pad}{fence}")
}

/// [`code`] in a table cell: a `|` would end the cell even inside a code span, and the
/// table reads `\|` as a `|` of the cell's text.
fn code_cell(text: &str) -> String {
    code(text).replace('|', "\\|")
}

fn verdict(out: &mut String, r: &ReviewReport) {
    let _ = writeln!(
        out,
        "## lexdelta review: {} → {}\n",
        code(&r.base),
        code(&r.head)
    );
    if r.gate.limits.is_empty() && r.gate.passed() {
        out.push_str("**No gate limits are set** (add a `gate:` section to the base ruleset).\n\n");
    } else if r.gate.passed() {
        out.push_str("**Gate: passed** — every limit holds.\n\n");
    } else {
        let _ = writeln!(
            out,
            "**Gate: blocked** — {} limit(s) breached:\n",
            r.gate.breaches.len()
        );
        for b in &r.gate.breaches {
            let _ = writeln!(out, "- `{}`: {}", b.limit, escape(&b.reason));
        }
        out.push('\n');
    }
    if r.gate_changed {
        out.push_str(
            "⚠ This change also edits the gate limits; they apply from the next review.\n\n",
        );
    }
}

fn summary(out: &mut String, r: &ReviewReport) {
    let s = &r.preview.summary;
    let _ = writeln!(
        out,
        "**{:.1}%** of searches are affected ({} of {} in the query log; {} documents in the sample).\n",
        s.affected_share * 100.0,
        s.affected_searches,
        s.searches,
        r.preview.corpus.documents
    );
    out.push_str("| outcome | queries | searches |\n| --- | ---: | ---: |\n");
    for l in &s.labels {
        if l.label != Label::Unchanged {
            let _ = writeln!(
                out,
                "| {} | {} | {} |",
                l.label.name(),
                l.queries,
                l.searches
            );
        }
    }
    if s.rescored.queries > 0 {
        let _ = writeln!(
            out,
            "\nNot counted as affected: {} unchanged queries ({} searches) keep their matches and \
             top {} in the same order, but their scores moved.",
            s.rescored.queries, s.rescored.searches, r.preview.settings.top_k
        );
    }
    out.push('\n');
}

fn quality(out: &mut String, r: &ReviewReport) {
    let Some(q) = &r.preview.quality else {
        out.push_str("No relevance judgments were given, so judged quality is not shown.\n\n");
        return;
    };
    let _ = writeln!(
        out,
        "Judged quality over {} queries (p: paired randomization test):\n",
        q.judged_queries
    );
    out.push_str("| metric | before | after | change | p |\n| --- | ---: | ---: | ---: | ---: |\n");
    for m in &q.metrics {
        let mark = if m.p_value < 0.05 { " *" } else { "" };
        let _ = writeln!(
            out,
            "| {} | {:.4} | {:.4} | {:+.4} | {:.3}{mark} |",
            m.metric, m.before, m.after, m.difference, m.p_value
        );
    }
    out.push_str("\n\\* p < 0.05\n\n");
}

fn query_line(q: &QueryChange) -> String {
    let causes: Vec<String> = q
        .causes
        .iter()
        .map(|c| match &c.origin {
            Some(o) => format!("{} ({})", code_cell(&c.rule), escape(&o.to_string())),
            None => code_cell(&c.rule),
        })
        .collect();
    let outcome = match &q.judged {
        Some(j) if (j.after - j.before).abs() > 1e-12 => format!(
            "{}, {} {:.4} → {:.4}{}",
            q.label.name(),
            j.metric,
            j.before,
            j.after,
            if j.after < j.before { " ⚠" } else { "" }
        ),
        _ => q.label.name().to_string(),
    };
    format!(
        "| {} | {} | {} | {} → {} (+{} −{}) | {:.2} | {} |",
        escape(&q.query),
        outcome,
        q.searches,
        q.matches_before,
        q.matches_after,
        q.gained_count,
        q.lost_count,
        q.rbo,
        causes.join(", ")
    )
}

fn affected(out: &mut String, r: &ReviewReport, limits: Limits) {
    let changed: Vec<&QueryChange> = r
        .preview
        .queries
        .iter()
        .filter(|q| q.label != Label::Unchanged)
        .collect();
    if changed.is_empty() {
        out.push_str("No query's results change.\n\n");
        return;
    }
    let header = "| query | outcome | searches | matches | RBO | caused by |\n| --- | --- | ---: | --- | ---: | --- |\n";
    let _ = writeln!(
        out,
        "### Affected queries: every emptied, lost or judged-worse query, then the most searched\n"
    );
    out.push_str(header);
    let shown: Vec<&QueryChange> = listed(&r.preview.queries, limits.queries).collect();
    for q in &shown {
        let _ = writeln!(out, "{}", query_line(q));
    }
    out.push('\n');
    let worst: Vec<&&QueryChange> = changed
        .iter()
        .filter(|q| matches!(q.label, Label::Emptied | Label::Lost) || q.lost_count > 0)
        .collect();
    if !worst.is_empty() {
        let _ = writeln!(
            out,
            "<details><summary>Queries that lose documents ({})</summary>\n",
            worst.len()
        );
        out.push_str(header);
        for q in worst {
            let _ = writeln!(out, "{}", query_line(q));
        }
        out.push_str("\n</details>\n\n");
    }
    let _ = writeln!(
        out,
        "<details><summary>Gained and lost documents per query</summary>\n"
    );
    for q in &shown {
        let _ = writeln!(out, "- **{}**", escape(&q.query));
        for (sign, docs) in [("+", &q.gained), ("−", &q.lost)] {
            for d in docs.iter().take(limits.docs) {
                let _ = writeln!(out, "  - {sign} {} {}", code(&d.id), escape(&d.title));
            }
        }
    }
    out.push_str("\n</details>\n\n");
}

fn rule_changes(out: &mut String, r: &ReviewReport) {
    let counts = r.diff.counts();
    let line: Vec<String> = counts
        .iter()
        .map(|((section, change), n)| format!("{n} {section} {}", change_name(change)))
        .collect();
    let _ = writeln!(
        out,
        "<details><summary>Rule changes: {}</summary>\n",
        if line.is_empty() {
            "none".to_string()
        } else {
            line.join(", ")
        }
    );
    for p in &r.diff.pipeline {
        let _ = writeln!(
            out,
            "- pipeline `{}`: {} → {}",
            p.setting,
            escape(&p.before),
            escape(&p.after)
        );
    }
    for c in r.diff.rules.iter().take(200) {
        let at = c
            .head
            .as_ref()
            .or(c.base.as_ref())
            .map(|o| o.to_string())
            .unwrap_or_default();
        let what = match (&c.before, &c.after) {
            (Some(b), Some(a)) => format!("{} → {}", escape(b), escape(a)),
            (None, Some(a)) => escape(a),
            (Some(b), None) => escape(b),
            (None, None) => String::new(),
        };
        let _ = writeln!(
            out,
            "- {} {} {} ({}): {what}",
            change_name(&c.change),
            c.section,
            code(&c.label),
            escape(&at)
        );
    }
    if r.diff.rules.len() > 200 {
        let _ = writeln!(
            out,
            "- … and {} more (see the JSON report)",
            r.diff.rules.len() - 200
        );
    }
    for f in &r.diff.files {
        let _ = writeln!(
            out,
            "- file {} {}: revision {} → {}",
            code(&f.name),
            change_name(&f.change),
            f.base_revision.map_or("—".into(), |v| v.to_string()),
            f.head_revision.map_or("—".into(), |v| v.to_string())
        );
    }
    out.push_str("\n</details>\n\n");
}

fn change_name(change: &Change) -> &'static str {
    match change {
        Change::Added => "added",
        Change::Removed => "removed",
        Change::Changed => "changed",
    }
}

fn lint(out: &mut String, r: &ReviewReport) {
    let c = &r.lint.counts;
    let _ = writeln!(
        out,
        "<details><summary>Lint on the head: {} error(s), {} warning(s), {} info</summary>\n",
        c.error, c.warning, c.info
    );
    for f in r
        .lint
        .findings
        .iter()
        .filter(|f| f.severity >= crate::severity::Severity::Warning)
    {
        let _ = writeln!(
            out,
            "- **{}** `{}` {}: {}",
            f.severity,
            f.check,
            escape(&f.location()),
            escape(&f.message)
        );
    }
    out.push_str("\n</details>\n");
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn paths_stay_inside_their_code_spans() {
        assert_eq!(code("rules/a_b.yaml"), "`rules/a_b.yaml`");
        // A backtick in a path cannot close the span: the fence is longer.
        assert_eq!(code("evil`](x).yaml"), "``evil`](x).yaml``");
        assert_eq!(code("`x`"), "`` `x` ``");
        assert_eq!(code("a\nb"), "`a b`");
        assert_eq!(code_cell("a|b"), "`a\\|b`");
        assert_eq!(escape("a_b [x](y)"), "a\\_b \\[x\\](y)");
    }
}
