//! Folding the per-query outcomes, in plan order, into the report's changed queries and
//! traffic summary, the run files and the judged rankings.

use rustc_hash::FxHashMap;

use super::evaluate::QueryOutcome;
use super::plan::QueryPlan;
use super::report::{Label, LabelCount, QueryChange, QueryCount, RankedDoc, Summary};
use super::retrieve::Hit;
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
    ids: &[String],
    searches: u64,
    want_runs: bool,
) -> Folded {
    let mut changes = Vec::new();
    let mut labels: FxHashMap<Label, (usize, u64)> = FxHashMap::default();
    let mut rescored = QueryCount::default();
    let mut evaluated = 0;
    let mut runs = Runs::default();
    let mut judged = Vec::new();
    let names = |hits: &[Hit]| -> Vec<String> {
        hits.iter().map(|h| ids[h.doc as usize].clone()).collect()
    };
    let ranked = |hits: &[Hit]| -> Vec<RankedDoc> {
        hits.iter()
            .map(|h| RankedDoc {
                id: ids[h.doc as usize].clone(),
                score: h.score,
            })
            .collect()
    };
    for (i, outcome) in outcomes.into_iter().enumerate() {
        let planned = &plan.queries[i];
        evaluated += usize::from(outcome.evaluated);
        changes.extend(outcome.change);
        if plan.in_log(i) {
            let slot = labels.entry(outcome.label).or_default();
            slot.0 += 1;
            slot.1 += planned.count;
            if outcome.rescored {
                rescored.queries += 1;
                rescored.searches += planned.count;
            }
        }
        let ranked_h = outcome.ranked_h.as_ref().unwrap_or(&outcome.ranked_b);
        for qid in &planned.qids {
            judged.push((qid.clone(), names(&outcome.ranked_b), names(ranked_h)));
        }
        if want_runs {
            for qid in plan.run_ids(i) {
                runs.base.push(RunQuery {
                    qid: qid.clone(),
                    docs: ranked(&outcome.ranked_b),
                });
                runs.head.push(RunQuery {
                    qid,
                    docs: ranked(ranked_h),
                });
            }
        }
    }
    worst_first(&mut changes);
    // Run files list queries by id, as evaluators do: the same file whatever the log order.
    runs.base.sort_by(|a, b| a.qid.cmp(&b.qid));
    runs.head.sort_by(|a, b| a.qid.cmp(&b.qid));
    Folded {
        changes,
        summary: summary(plan.log_len, searches, &labels, rescored),
        evaluated,
        runs: want_runs.then_some(runs),
        judged,
    }
}

fn summary(
    queries: usize,
    searches: u64,
    labels: &FxHashMap<Label, (usize, u64)>,
    rescored: QueryCount,
) -> Summary {
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
        rescored,
    }
}

/// Orders changed queries worst news first: emptied, lost and judged-worse queries ahead of
/// the rest whatever their traffic (judged-worse ones by how far their quality fell), then
/// by searches, then by text.
pub(super) fn worst_first(changes: &mut [QueryChange]) {
    let drop = |q: &QueryChange| match (&q.judged, q.urgency()) {
        (Some(j), 2) => j.before - j.after,
        _ => 0.0,
    };
    changes.sort_by(|a, b| {
        a.urgency()
            .cmp(&b.urgency())
            .then_with(|| drop(b).total_cmp(&drop(a)))
            .then_with(|| b.searches.cmp(&a.searches))
            .then_with(|| a.query.cmp(&b.query))
    });
}
