//! `trace` as an aligned table for the terminal.

use std::fmt::Write as _;

use super::style::{Style, pad};
use crate::analysis::trace::{StepTrace, Trace};
use crate::analysis::{Side, Stage};

pub fn render(trace: &Trace, style: Style) -> String {
    let mut out = String::new();
    let p = &trace.pipeline;
    let _ = writeln!(out, "{} {:?}", style.bold("text "), trace.text);
    let _ = writeln!(
        out,
        "{} {}  ({} side; stemmer {}; {}; {}; {} stopwords; {})",
        style.bold("rules"),
        p.ruleset,
        match trace.side {
            Side::Index => "index",
            Side::Query => "query",
        },
        p.stemmer,
        if p.lowercase {
            "lowercase"
        } else {
            "case kept"
        },
        if p.fold_accents {
            "accents folded"
        } else {
            "accents kept"
        },
        p.stopwords,
        p.tokenizer
    );
    out.push('\n');
    if trace.tokens.is_empty() {
        out.push_str("no tokens\n");
        return out;
    }

    let headers = ["pos", "token", "surface", "key"];
    let rows: Vec<[String; 4]> = trace
        .tokens
        .iter()
        .map(|t| {
            [
                t.position.to_string(),
                t.raw.clone(),
                t.surface.clone(),
                t.key.clone().unwrap_or_else(|| "—".into()),
            ]
        })
        .collect();
    let widths: Vec<usize> = (0..4)
        .map(|c| {
            rows.iter()
                .map(|r| r[c].chars().count())
                .chain([headers[c].len()])
                .max()
                .unwrap_or(0)
        })
        .collect();
    let mut line = String::new();
    for (c, h) in headers.iter().enumerate() {
        line.push_str(&pad(&style.dim(h), h, widths[c] + 2));
    }
    let _ = writeln!(out, "{}{}", line, style.dim("what happened"));
    for (row, token) in rows.iter().zip(&trace.tokens) {
        let mut line = String::new();
        for (c, cell) in row.iter().enumerate() {
            let shown = match c {
                3 if token.key.is_some() => style.bold(cell),
                3 => style.dim(cell),
                _ => cell.clone(),
            };
            let width = if c == 0 { widths[c] } else { widths[c] + 2 };
            if c == 0 {
                line.push_str(&format!(
                    "{}{}  ",
                    " ".repeat(widths[0] - cell.len()),
                    shown
                ));
            } else {
                line.push_str(&pad(&shown, cell, width));
            }
        }
        let steps: Vec<String> = token.steps.iter().map(|s| describe(s, style)).collect();
        let _ = writeln!(out, "{}{}", line, steps.join(&style.dim(" · ")));
    }

    if trace.side == Side::Query {
        out.push('\n');
        if trace.expansions.is_empty() {
            let _ = writeln!(out, "{}", style.dim("no synonym rule applies"));
        } else {
            let _ = writeln!(out, "{}", style.bold("synonym expansion"));
            for e in &trace.expansions {
                let _ = writeln!(out, "  {:?} matches any of:", e.text);
                for a in &e.alternatives {
                    let kind = if a.phrase { " (phrase)" } else { "" };
                    let rules: Vec<String> = a.rules.iter().map(|r| r.describe()).collect();
                    let from = if rules.is_empty() {
                        style.dim("the query's own words")
                    } else {
                        style.cyan(&rules.join(", "))
                    };
                    let _ = writeln!(out, "    {}{kind}  ← {from}", style.bold(&a.keys));
                }
            }
        }
    }
    out
}

fn describe(step: &StepTrace, style: Style) -> String {
    let stage = match step.stage {
        Stage::Stopword => style.red(step.stage.name()),
        Stage::Exempt => style.yellow(step.stage.name()),
        Stage::Lemma => style.green(step.stage.name()),
        _ => step.stage.name().to_string(),
    };
    let what = match step.stage {
        Stage::Stopword => "dropped".to_string(),
        Stage::Exempt => "kept as written".to_string(),
        Stage::Stem if step.note == "stemmed" => format!("→ {}", step.output),
        Stage::Stem => step.note.clone(),
        _ => format!("→ {}", step.output),
    };
    match &step.rule {
        Some(rule) => format!("{stage} {what} [{}]", style.cyan(&rule.describe())),
        None => format!("{stage} {what}"),
    }
}
