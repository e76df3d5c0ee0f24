//! `preview` for the terminal: settings, the traffic summary, the changed queries with
//! their documents and causes, and judged quality.

use std::fmt::Write as _;

use super::style::{Style, clean_line, pad};
use crate::preview::{Cause, Label, PreviewReport, QueryChange, RuleChange, listed};

/// How many queries and documents the text shows.
#[derive(Clone, Copy, Debug)]
pub struct Limits {
    pub queries: usize,
    pub docs: usize,
}

fn thousands(n: u64) -> String {
    let s = n.to_string();
    let mut out = String::new();
    for (i, c) in s.chars().enumerate() {
        if i > 0 && (s.len() - i).is_multiple_of(3) {
            out.push(',');
        }
        out.push(c);
    }
    out
}

fn paint(style: Style, label: Label, text: &str) -> String {
    match label {
        Label::Rescued | Label::Gained => style.green(text),
        Label::Emptied | Label::Lost => style.red(text),
        Label::Reordered => style.yellow(text),
        Label::Unchanged => style.dim(text),
    }
}

fn cause_line(c: &Cause) -> String {
    let change = match c.change {
        RuleChange::Added => "added",
        RuleChange::Removed => "removed",
        RuleChange::Changed => "changed",
        RuleChange::SameRuleNewEffect => "same rule, new effect",
    };
    let kind = serde_json::to_value(c.kind)
        .ok()
        .and_then(|v| v.as_str().map(str::to_string))
        .unwrap_or_default();
    let mut line = format!("{} ({kind}, {change})", c.rule);
    if let Some(origin) = c.origin.as_ref().filter(|o| **o != c.rule) {
        let _ = write!(line, " at {origin}");
    }
    if !c.forms.is_empty() {
        let _ = write!(line, " via {}", c.forms.join(", "));
    }
    line
}

fn query(out: &mut String, q: &QueryChange, style: Style, limits: Limits) {
    let label = paint(style, q.label, q.label.name());
    let mixed = if q.mixed { ", mixed" } else { "" };
    let judged = match &q.judged {
        Some(j) if (j.after - j.before).abs() > 1e-12 => {
            let text = format!(", {} {:.4} -> {:.4}", j.metric, j.before, j.after);
            if j.after < j.before {
                style.red(&text)
            } else {
                text
            }
        }
        _ => String::new(),
    };
    let _ = writeln!(
        out,
        "  {}  [{label}{mixed}{judged}]  {} searches  matches {} -> {}  (+{} -{})  RBO {:.3}",
        style.bold(&clean_line(&q.query)),
        thousands(q.searches),
        q.matches_before,
        q.matches_after,
        q.gained_count,
        q.lost_count,
        q.rbo
    );
    for (name, docs, count) in [
        ("gained", &q.gained, q.gained_count),
        ("lost", &q.lost, q.lost_count),
    ] {
        if docs.is_empty() {
            continue;
        }
        let shown: Vec<String> = docs
            .iter()
            .take(limits.docs)
            .map(|d| format!("{} {}", clean_line(&d.id), clean_line(&d.title)))
            .collect();
        let more = count.saturating_sub(shown.len());
        let more = if more > 0 {
            format!("; and {more} more")
        } else {
            String::new()
        };
        let _ = writeln!(out, "      {name}: {}{more}", shown.join("; "));
    }
    if q.label == Label::Reordered && !q.top_after.is_empty() {
        let ids: Vec<_> = q
            .top_after
            .iter()
            .take(limits.docs)
            .map(|d| clean_line(&d.id))
            .collect();
        let _ = writeln!(out, "      top now: {}", ids.join(" "));
    }
    for c in &q.causes {
        let _ = writeln!(out, "      {} {}", style.dim("cause:"), cause_line(c));
    }
}

pub fn render(report: &PreviewReport, style: Style, limits: Limits) -> String {
    let mut out = String::new();
    let s = &report.settings;
    let _ = writeln!(
        out,
        "{} {} -> {}",
        style.bold("preview"),
        report.base.source,
        report.head.source
    );
    let fields: Vec<String> = report
        .corpus
        .fields
        .iter()
        .map(|f| format!("{}^{}", f.name, f.weight))
        .collect();
    let _ = writeln!(
        out,
        "  corpus   {}: {} documents, fields {} (surface index: {})",
        report.corpus.source,
        report.corpus.documents,
        fields.join(" "),
        report.corpus.index
    );
    let _ = writeln!(
        out,
        "  queries  {}: {} queries, {} searches",
        report.queries_source,
        thousands(report.summary.queries as u64),
        thousands(report.summary.searches)
    );
    let ranking = match s.scoring.ranking {
        crate::preview::Ranking::Bm25 => format!("BM25 k1={} b={}", s.scoring.k1, s.scoring.b),
        crate::preview::Ranking::Cosine => "log-tf idf cosine".to_string(),
    };
    let _ = writeln!(
        out,
        "  scoring  {ranking}, match {}, top {} shown (RBO p={}), rankings evaluated to depth {}",
        s.scoring.mode, s.top_k, s.rbo_p, s.depth
    );
    let e = &report.evaluation;
    let _ = writeln!(
        out,
        "  run      {} of {} queries run on both sides, {} unchanged without being run ({} surface forms change key, {} keys affected)",
        e.evaluated, e.queries, e.skipped, e.changed_forms, e.affected_keys
    );
    if let Some(reason) = &e.reason {
        let _ = writeln!(out, "           {}", style.yellow(reason));
    }
    out.push('\n');

    let sum = &report.summary;
    let _ = writeln!(
        out,
        "{} {} of {} searches ({:.1}%)",
        style.bold("affected"),
        thousands(sum.affected_searches),
        thousands(sum.searches),
        100.0 * sum.affected_share
    );
    for l in &sum.labels {
        let name = paint(style, l.label, l.label.name());
        let _ = writeln!(
            out,
            "  {}{:>7} queries {:>9} searches",
            pad(&name, l.label.name(), 10),
            thousands(l.queries as u64),
            thousands(l.searches)
        );
    }
    if sum.rescored.queries > 0 {
        let _ = writeln!(
            out,
            "  {}",
            style.dim(&format!(
                "of the unchanged, {} queries ({} searches) keep their matches and top {} but their scores moved",
                thousands(sum.rescored.queries as u64),
                thousands(sum.rescored.searches),
                s.top_k
            ))
        );
    }
    out.push('\n');

    if !report.queries.is_empty() {
        let listed: Vec<&QueryChange> = listed(&report.queries, limits.queries).collect();
        let urgent = listed.iter().filter(|q| q.urgency() < 3).count();
        let urgent = match urgent {
            1 => "1 query".to_string(),
            n => format!("{n} queries"),
        };
        let _ = writeln!(
            out,
            "{} ({} of {}: every emptied, lost or judged-worse query ({urgent}), then the most searched)",
            style.bold("changed queries"),
            listed.len(),
            report.queries.len()
        );
        for q in listed {
            query(&mut out, q, style, limits);
        }
        out.push('\n');
    }

    if let Some(quality) = &report.quality {
        let _ = writeln!(
            out,
            "{} ({} judged queries)",
            style.bold("judged quality"),
            quality.judged_queries,
        );
        let _ = writeln!(out, "  {}", style.dim(&quality.averaging));
        let _ = writeln!(out, "  {}", style.dim(&format!("p from {}", quality.test)));
        let _ = writeln!(
            out,
            "  {:<9} {:>8} {:>8} {:>9} {:>6} {:>6} {:>8}",
            "metric", "before", "after", "diff", "up", "down", "p"
        );
        for m in &quality.metrics {
            let _ = writeln!(
                out,
                "  {:<9} {:>8.4} {:>8.4} {:>+9.4} {:>6} {:>6} {:>8.4}",
                m.metric.to_string(),
                m.before,
                m.after,
                m.difference,
                m.improved,
                m.worsened,
                m.p_value
            );
        }
        if let Some(ndcg) = quality
            .metrics
            .iter()
            .position(|m| matches!(m.metric, crate::metrics::Metric::Ndcg(_)))
        {
            let mut moved: Vec<_> = quality
                .per_query
                .iter()
                .filter(|q| (q.after[ndcg] - q.before[ndcg]).abs() > 1e-12)
                .collect();
            moved.sort_by(|a, b| {
                let da = (a.after[ndcg] - a.before[ndcg]).abs();
                let db = (b.after[ndcg] - b.before[ndcg]).abs();
                db.total_cmp(&da).then_with(|| a.qid.cmp(&b.qid))
            });
            if !moved.is_empty() {
                let _ = writeln!(
                    out,
                    "  judged queries whose {} moved most:",
                    quality.metrics[ndcg].metric
                );
                for q in moved.iter().take(limits.queries.min(10)) {
                    let _ = writeln!(
                        out,
                        "    {} {:<28} {:.4} -> {:.4}",
                        clean_line(&q.qid),
                        clean_line(&q.query),
                        q.before[ndcg],
                        q.after[ndcg]
                    );
                }
            }
        }
        if !quality.without_text.is_empty() {
            let _ = writeln!(
                out,
                "  {} judged queries have no text and were not evaluated",
                quality.without_text.len()
            );
        }
        out.push('\n');
    }
    let _ = writeln!(out, "{} {}", style.yellow("note:"), report.notice);
    out
}
