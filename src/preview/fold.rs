//! Folding the per-query outcomes, in plan order, into the report's changed queries and
//! traffic summary, the run files and the judged rankings.

use rustc_hash::FxHashMap;

use super::evaluate::QueryOutcome;
use super::plan::QueryPlan;
use super::report::{Label, LabelCount, QueryChange, RankedDoc, Summary};
use super::runs::{RunQuery, Runs};

/// A judged query's ranking on both sides: (judged id, base, head).
pub(super) type JudgedRanking = (String, Vec<String>, Vec<String>);

/// What the outcomes add up to.
pub(super) struct Folded {
    /// Every changed query of the log, most searched first.
    pub changes: Vec<QueryChange>,
    pub summary: Summary,
    /// Queries run on both sides.
    pub evaluated: usize,
    pub runs: Option<Runs>,
    pub judged: Vec<JudgedRanking>,
}

pub(super) fn fold(
    plan: &QueryPlan,
    outcomes: Vec<QueryOutcome>,
    searches: u64,
    want_runs: bool,
) -> Folded {
    let mut changes = Vec::new();
    let mut labels: FxHashMap<Label, (usize, u64)> = FxHashMap::default();
    let mut evaluated = 0;
    let mut runs = Runs::default();
    let mut judged = Vec::new();
    for (i, outcome) in outcomes.into_iter().enumerate() {
        let planned = &plan.queries[i];
        evaluated += usize::from(outcome.evaluated);
        changes.extend(outcome.change);
        if plan.in_log(i) {
            let slot = labels.entry(outcome.label).or_default();
            slot.0 += 1;
            slot.1 += planned.count;
        }
        if let Some(qid) = &planned.qid {
            let names = |v: &[RankedDoc]| v.iter().map(|d| d.id.clone()).collect();
            judged.push((qid.clone(), names(&outcome.top_b), names(&outcome.top_h)));
        }
        if want_runs {
            let qid = planned.qid.clone().unwrap_or_else(|| format!("q{}", i + 1));
            runs.base.push(RunQuery {
                qid: qid.clone(),
                docs: outcome.top_b,
            });
            runs.head.push(RunQuery {
                qid,
                docs: outcome.top_h,
            });
        }
    }
    changes.sort_by(|a, b| {
        b.searches
            .cmp(&a.searches)
            .then_with(|| a.query.cmp(&b.query))
    });
    Folded {
        changes,
        summary: summary(plan.log_len, searches, &labels),
        evaluated,
        runs: want_runs.then_some(runs),
        judged,
    }
}

fn summary(queries: usize, searches: u64, labels: &FxHashMap<Label, (usize, u64)>) -> Summary {
    let affected: u64 = labels
        .iter()
        .filter(|(l, _)| **l != Label::Unchanged)
        .map(|(_, v)| v.1)
        .sum();
    Summary {
        queries,
        searches,
        affected_searches: affected,
        affected_share: if searches == 0 {
            0.0
        } else {
            affected as f64 / searches as f64
        },
        labels: Label::ALL
            .iter()
            .map(|&label| {
                let (queries, searches) = labels.get(&label).copied().unwrap_or_default();
                LabelCount {
                    label,
                    queries,
                    searches,
                }
            })
            .collect(),
    }
}
