//! `review` as one self-contained HTML page: no external scripts, fonts or styles. Charts
//! are inline SVG drawn here; every piece of document, query or rule text is escaped.

use std::fmt::Write as _;

use crate::preview::{Label, QueryChange};
use crate::review::ReviewReport;
use crate::review::diff::{Change, RuleChange};

/// Escapes text for HTML element content and attribute values.
pub fn escape(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        match c {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&#39;"),
            _ => out.push(c),
        }
    }
    out
}

const STYLE: &str = "body{font:14px/1.45 system-ui,sans-serif;margin:2em auto;max-width:70em;color:#1d2330;padding:0 1em}\
h1{font-size:1.5em}h2{font-size:1.15em;margin-top:2em;border-bottom:1px solid #ccd}\
table{border-collapse:collapse;margin:.5em 0}td,th{padding:.25em .6em;border-bottom:1px solid #e3e5ee;text-align:left;vertical-align:top}\
th{background:#f3f4f8}td.n{text-align:right;font-variant-numeric:tabular-nums}\
.blocked{background:#fde8e8;border:1px solid #e0a0a0;padding:.6em 1em}.passed{background:#e6f6ea;border:1px solid #9fd1ab;padding:.6em 1em}\
.notice{background:#fff8e1;border:1px solid #e8d38a;padding:.6em 1em}.muted{color:#667}\
svg text{font:11px system-ui,sans-serif}details{margin:.4em 0}code{background:#f3f4f8;padding:0 .2em}";

pub fn render(report: &ReviewReport) -> String {
    let mut out = String::new();
    let _ = write!(
        out,
        "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>lexdelta review: {} → {}</title><style>{STYLE}</style></head><body>\n",
        escape(&report.base),
        escape(&report.head)
    );
    let _ = writeln!(
        out,
        "<h1>Review of <code>{}</code> → <code>{}</code></h1>",
        escape(&report.base),
        escape(&report.head)
    );
    gate(&mut out, report);
    let _ = writeln!(out, "<p class=\"notice\">{}</p>", escape(&report.notice));
    traffic_chart(&mut out, report);
    match_change_chart(&mut out, report);
    metric_chart(&mut out, report);
    groups(&mut out, report);
    queries_table(&mut out, report);
    lint_list(&mut out, report);
    out.push_str("</body></html>\n");
    out
}

fn gate(out: &mut String, r: &ReviewReport) {
    if r.gate.limits.is_empty() && r.gate.passed() {
        out.push_str("<p class=\"muted\">No gate limits are set.</p>\n");
    } else if r.gate.passed() {
        out.push_str("<p class=\"passed\"><strong>Gate passed</strong>: every limit holds.</p>\n");
    } else {
        let _ = write!(
            out,
            "<div class=\"blocked\"><strong>Gate blocked</strong>: {} limit(s) breached<ul>",
            r.gate.breaches.len()
        );
        for b in &r.gate.breaches {
            let _ = write!(
                out,
                "<li><code>{}</code> {}</li>",
                b.limit,
                escape(&b.reason)
            );
        }
        out.push_str("</ul></div>\n");
    }
}

/// Horizontal bars: searches per outcome label.
fn traffic_chart(out: &mut String, r: &ReviewReport) {
    let s = &r.preview.summary;
    let _ = writeln!(
        out,
        "<h2>Affected traffic</h2><p>{:.1}% of {} searches are affected (their matches or top \
         {} changed); {} more keep both, but their scores moved.</p>",
        s.affected_share * 100.0,
        s.searches,
        r.preview.settings.top_k,
        s.rescored.searches
    );
    let max = s
        .labels
        .iter()
        .map(|l| l.searches)
        .max()
        .unwrap_or(1)
        .max(1) as f64;
    let row_h = 22.0;
    let _ = write!(
        out,
        "<svg role=\"img\" aria-label=\"searches per outcome\" width=\"640\" height=\"{}\">",
        row_h * s.labels.len() as f64 + 4.0
    );
    for (i, l) in s.labels.iter().enumerate() {
        let y = i as f64 * row_h;
        let w = 420.0 * l.searches as f64 / max;
        let _ = write!(
            out,
            "<text x=\"0\" y=\"{:.0}\">{}</text><rect x=\"90\" y=\"{:.0}\" width=\"{w:.1}\" height=\"15\" fill=\"{}\"/><text x=\"{:.1}\" y=\"{:.0}\">{} searches, {} queries</text>",
            y + 13.0,
            l.label.name(),
            y + 2.0,
            label_colour(l.label),
            95.0 + w,
            y + 13.0,
            l.searches,
            l.queries
        );
    }
    out.push_str("</svg>\n");
}

fn label_colour(label: Label) -> &'static str {
    match label {
        Label::Rescued => "#2f8f4e",
        Label::Emptied => "#b3261e",
        Label::Gained => "#6aa4d8",
        Label::Lost => "#e07a5f",
        Label::Reordered => "#b8a04a",
        Label::Unchanged => "#c9ccd6",
    }
}

/// A histogram bucket: its label and which differences fall in it.
type Bucket = (&'static str, fn(i64) -> bool);

/// A histogram of (matches after − matches before) over the queries that were run.
fn match_change_chart(out: &mut String, r: &ReviewReport) {
    let deltas: Vec<i64> = r
        .preview
        .queries
        .iter()
        .filter(|q| q.label != Label::Unchanged)
        .map(|q| q.matches_after as i64 - q.matches_before as i64)
        .collect();
    out.push_str("<h2>Change in match counts</h2>\n");
    if deltas.is_empty() {
        out.push_str("<p>No query's match count changes.</p>\n");
        return;
    }
    // Buckets: ≤−10, −9..−1 grouped, 0, 1..9, ≥10 — read at a glance.
    let buckets: [Bucket; 7] = [
        ("≤ −10", |d| d <= -10),
        ("−9…−2", |d| (-9..=-2).contains(&d)),
        ("−1", |d| d == -1),
        ("0", |d| d == 0),
        ("+1", |d| d == 1),
        ("+2…+9", |d| (2..=9).contains(&d)),
        ("≥ +10", |d| d >= 10),
    ];
    let counts: Vec<usize> = buckets
        .iter()
        .map(|(_, f)| deltas.iter().filter(|d| f(**d)).count())
        .collect();
    let max = *counts.iter().max().unwrap_or(&1).max(&1) as f64;
    out.push_str(
        "<svg role=\"img\" aria-label=\"match count changes\" width=\"640\" height=\"190\">",
    );
    for (i, ((name, _), n)) in buckets.iter().zip(&counts).enumerate() {
        let h = 140.0 * *n as f64 / max;
        let x = 20.0 + i as f64 * 85.0;
        let _ = write!(
            out,
            "<rect x=\"{x:.0}\" y=\"{:.1}\" width=\"60\" height=\"{h:.1}\" fill=\"#6a7fd8\"/><text x=\"{:.0}\" y=\"{:.1}\">{n}</text><text x=\"{:.0}\" y=\"182\">{name}</text>",
            160.0 - h,
            x + 22.0,
            155.0 - h,
            x + 10.0
        );
    }
    out.push_str("</svg><p class=\"muted\">Queries run on both sides, by how many more (or fewer) documents they match.</p>\n");
}

/// Judged queries: nDCG before and after, as a dumbbell per query whose value moved.
fn metric_chart(out: &mut String, r: &ReviewReport) {
    let Some(q) = &r.preview.quality else { return };
    let Some(i) = q
        .metrics
        .iter()
        .position(|m| m.metric.to_string().starts_with("nDCG"))
    else {
        return;
    };
    let name = q.metrics[i].metric.to_string();
    let mut moved: Vec<(&str, f64, f64)> = q
        .per_query
        .iter()
        .filter(|j| (j.before[i] - j.after[i]).abs() > 1e-12)
        .map(|j| (j.query.as_str(), j.before[i], j.after[i]))
        .collect();
    moved.sort_by(|a, b| {
        (a.2 - a.1)
            .total_cmp(&(b.2 - b.1))
            .then_with(|| a.0.cmp(b.0))
    });
    let m = &q.metrics[i];
    let _ = writeln!(
        out,
        "<h2>{name} per judged query</h2><p>Mean {:.4} → {:.4} ({:+.4}, p = {:.3}); {} of {} judged queries moved.</p>",
        m.before,
        m.after,
        m.difference,
        m.p_value,
        moved.len(),
        q.judged_queries
    );
    if moved.is_empty() {
        return;
    }
    let row = 18.0;
    let _ = write!(
        out,
        "<svg role=\"img\" aria-label=\"{name} before and after\" width=\"660\" height=\"{:.0}\">",
        row * moved.len() as f64 + 24.0
    );
    let x = |v: f64| 230.0 + 400.0 * v;
    for t in [0.0, 0.5, 1.0] {
        let _ = write!(
            out,
            "<line x1=\"{0:.0}\" x2=\"{0:.0}\" y1=\"0\" y2=\"{1:.0}\" stroke=\"#e3e5ee\"/><text x=\"{0:.0}\" y=\"{2:.0}\">{t}</text>",
            x(t),
            row * moved.len() as f64,
            row * moved.len() as f64 + 16.0
        );
    }
    for (k, (query, before, after)) in moved.iter().enumerate() {
        let y = k as f64 * row + 10.0;
        let colour = if after < before { "#b3261e" } else { "#2f8f4e" };
        let _ = write!(
            out,
            "<text x=\"0\" y=\"{:.0}\">{}</text><line x1=\"{:.1}\" x2=\"{:.1}\" y1=\"{y:.0}\" y2=\"{y:.0}\" stroke=\"{colour}\" stroke-width=\"2\"/><circle cx=\"{:.1}\" cy=\"{y:.0}\" r=\"3\" fill=\"#888\"/><circle cx=\"{:.1}\" cy=\"{y:.0}\" r=\"4\" fill=\"{colour}\"/>",
            y + 4.0,
            escape(&truncate(query, 34)),
            x(*before),
            x(*after),
            x(*before),
            x(*after)
        );
    }
    out.push_str("</svg><p class=\"muted\">Grey dot: before; coloured dot: after (green better, red worse).</p>\n");
}

fn truncate(text: &str, n: usize) -> String {
    if text.chars().count() <= n {
        text.to_string()
    } else {
        text.chars().take(n - 1).collect::<String>() + "…"
    }
}

/// Each added or changed synonym set drawn as its members on a circle, joined as the
/// equivalent set joins them; added members green, removed ones red and dashed.
fn groups(out: &mut String, r: &ReviewReport) {
    let changed: Vec<&RuleChange> = r
        .diff
        .rules
        .iter()
        .filter(|c| c.section == "synonym" && c.change != Change::Removed)
        .collect();
    if changed.is_empty() {
        return;
    }
    out.push_str("<h2>Changed synonym rules</h2>\n");
    for c in changed {
        let members = &c.members;
        let mut all: Vec<(String, &str)> = members
            .iter()
            .map(|m| {
                let state = if c.change == Change::Added || c.members_added.contains(m) {
                    "added"
                } else {
                    "kept"
                };
                (m.clone(), state)
            })
            .collect();
        all.extend(c.members_removed.iter().map(|m| (m.clone(), "removed")));
        let at = c.head.as_ref().map(|o| o.to_string()).unwrap_or_default();
        let _ = write!(
            out,
            "<details open><summary><code>{}</code> ({}) — {}</summary>",
            escape(&c.label),
            escape(&at),
            if c.change == Change::Added {
                "added"
            } else {
                "changed"
            }
        );
        let n = all.len().max(1) as f64;
        let (cx, cy, rad) = (160.0, 95.0, 62.0);
        let pos: Vec<(f64, f64)> = (0..all.len())
            .map(|i| {
                let a = std::f64::consts::TAU * i as f64 / n - std::f64::consts::FRAC_PI_2;
                (cx + rad * a.cos(), cy + rad * a.sin())
            })
            .collect();
        out.push_str("<svg role=\"img\" width=\"320\" height=\"190\">");
        for i in 0..all.len() {
            for j in i + 1..all.len() {
                let dashed = all[i].1 == "removed" || all[j].1 == "removed";
                let _ = write!(
                    out,
                    "<line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\" stroke=\"{}\"{}/>",
                    pos[i].0,
                    pos[i].1,
                    pos[j].0,
                    pos[j].1,
                    if dashed { "#e0a0a0" } else { "#b8bfd8" },
                    if dashed {
                        " stroke-dasharray=\"4 3\""
                    } else {
                        ""
                    }
                );
            }
        }
        for ((name, state), (x, y)) in all.iter().zip(&pos) {
            let fill = match *state {
                "added" => "#2f8f4e",
                "removed" => "#b3261e",
                _ => "#51607e",
            };
            let _ = write!(
                out,
                "<circle cx=\"{x:.1}\" cy=\"{y:.1}\" r=\"5\" fill=\"{fill}\"/><text x=\"{:.1}\" y=\"{:.1}\" fill=\"{fill}\">{}</text>",
                x + 7.0,
                y + 4.0,
                escape(&truncate(name, 22))
            );
        }
        out.push_str("</svg></details>\n");
    }
}

fn queries_table(out: &mut String, r: &ReviewReport) {
    let changed: Vec<&QueryChange> = r
        .preview
        .queries
        .iter()
        .filter(|q| q.label != Label::Unchanged)
        .collect();
    let _ = writeln!(out, "<h2>Affected queries ({})</h2>", changed.len());
    out.push_str("<table><tr><th>query</th><th>outcome</th><th>searches</th><th>matches</th><th>RBO</th><th>gained / lost documents</th><th>caused by</th></tr>\n");
    for q in changed {
        let docs: Vec<String> = q
            .gained
            .iter()
            .map(|d| format!("+ {} {}", escape(&d.id), escape(&d.title)))
            .chain(
                q.lost
                    .iter()
                    .map(|d| format!("− {} {}", escape(&d.id), escape(&d.title))),
            )
            .collect();
        let causes: Vec<String> = q
            .causes
            .iter()
            .map(|c| {
                format!(
                    "<code>{}</code> {}",
                    escape(&c.rule),
                    escape(c.origin.as_deref().unwrap_or(""))
                )
            })
            .collect();
        let _ = writeln!(
            out,
            "<tr><td>{}</td><td style=\"color:{}\">{}</td><td class=\"n\">{}</td><td class=\"n\">{} → {}</td><td class=\"n\">{:.2}</td><td>{}</td><td>{}</td></tr>",
            escape(&q.query),
            label_colour(q.label),
            q.label.name(),
            q.searches,
            q.matches_before,
            q.matches_after,
            q.rbo,
            docs.join("<br>"),
            causes.join("<br>")
        );
    }
    out.push_str("</table>\n");
}

fn lint_list(out: &mut String, r: &ReviewReport) {
    let c = &r.lint.counts;
    let _ = writeln!(
        out,
        "<h2>Lint on the head</h2><p>{} error(s), {} warning(s), {} info.</p><ul>",
        c.error, c.warning, c.info
    );
    for f in &r.lint.findings {
        let _ = writeln!(
            out,
            "<li><strong>{}</strong> <code>{}</code> {}: {}</li>",
            f.severity,
            f.check,
            escape(&f.location()),
            escape(&f.message)
        );
    }
    out.push_str("</ul>\n");
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn markup_in_text_is_shown_as_text() {
        assert_eq!(
            escape("<script>alert('x')</script> & \"q\""),
            "&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; &amp; &quot;q&quot;"
        );
    }
}
