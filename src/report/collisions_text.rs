//! The collision report as text for a terminal.

use std::fmt::Write as _;

use super::Style;
use crate::audit::collisions::{GroupForm, MeaningClass};
use crate::audit::report::{CollisionReport, RankedCollision};

/// How many affected queries each group lists.
const QUERIES_SHOWN: usize = 5;

pub fn render(report: &CollisionReport, style: Style) -> String {
    let mut out = String::new();
    let _ = writeln!(
        out,
        "{}",
        style.bold(&format!(
            "conflation groups mixing meanings: {} of {} groups ({} forms, {} documents{})",
            report.risky,
            report.groups,
            report.forms,
            report.documents,
            match &report.query_log {
                Some(_) => format!(", {} queries, {} searches", report.queries, report.searches),
                None => String::new(),
            }
        ))
    );
    let _ = writeln!(
        out,
        "ruleset: {}  corpus: {}",
        report.ruleset, report.corpus
    );
    for c in &report.collisions {
        group(&mut out, c, style);
    }
    out
}

fn group(out: &mut String, c: &RankedCollision, style: Style) {
    let col = &c.collision;
    let _ = writeln!(
        out,
        "\n{}",
        style.bold(&format!(
            "{:>3}. {}  risk {:.1}  evenness {:.2}  {} forms, {} meanings",
            c.rank,
            col.key,
            col.risk,
            col.evenness,
            col.form_count(),
            col.classes.len()
        ))
    );
    for class in &col.classes {
        meaning(out, class);
    }
    if !col.unclassified.is_empty() {
        let _ = writeln!(out, "     not in WordNet: {}", forms(&col.unclassified));
    }
    match &c.suggestion {
        Some(s) => {
            let _ = writeln!(
                out,
                "     suggestion (verified; \"{}\" keeps the key):",
                s.kept
            );
            for line in s.yaml.lines() {
                let _ = writeln!(out, "       {}", style.green(line));
            }
        }
        None => {
            let _ = writeln!(out, "     {}", style.dim("no verified suggestion"));
        }
    }
    if let Some(e) = &c.effect {
        let _ = writeln!(
            out,
            "     effect: {} queries ({} searches) change their matches",
            e.queries.len(),
            e.searches
        );
        for q in e.queries.iter().take(QUERIES_SHOWN) {
            let _ = writeln!(
                out,
                "       {:>7}  {:<32} +{} -{}",
                q.searches, q.query, q.gained, q.lost
            );
        }
        if e.queries.len() > QUERIES_SHOWN {
            let _ = writeln!(out, "       ... {} more", e.queries.len() - QUERIES_SHOWN);
        }
    }
}

fn meaning(out: &mut String, class: &MeaningClass) {
    let _ = writeln!(
        out,
        "     {:<18} {:>7} docs {:>7} searches  {}",
        class.base,
        class.documents,
        class.searches,
        forms(&class.forms)
    );
}

fn forms(forms: &[GroupForm]) -> String {
    forms
        .iter()
        .map(|f| f.form.as_str())
        .collect::<Vec<_>>()
        .join(", ")
}
