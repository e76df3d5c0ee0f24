//! Evaluating the planned queries on both sides, in parallel: which documents each side
//! matches, its top k, and for a changed query what was gained, lost and why.

use rayon::prelude::*;

use super::attribution::Sides;
use super::change::{ChangeSet, same_expansions, touched_keys};
use super::plan::QueryPlan;
use super::report::{DocRef, Label, QueryChange, RankedDoc};
use super::retrieve::{DocOrder, Hit, SideQuery, matches_both, matches_into, top_hits};
use super::views::Side;
use super::{PreviewError, PreviewOptions};
use crate::analysis::AnalyzedQuery;
use crate::corpus::Corpus;
use crate::metrics::{self, MetricsError};

/// One query's result on both sides, before it is folded into the report.
pub(super) struct QueryOutcome {
    pub evaluated: bool,
    pub label: Label,
    /// The matches and the top k are the same on both sides, but scores moved.
    pub rescored: bool,
    /// Both sides' rankings to the evaluation depth, for judged queries and run files
    /// (empty otherwise); `None` for the head when it is the base's.
    pub ranked_b: Vec<Hit>,
    pub ranked_h: Option<Vec<Hit>>,
    /// Listed in the report: a changed query of the log.
    pub change: Option<QueryChange>,
}

/// What evaluating a query reads.
pub(super) struct Engine<'a> {
    pub base: Side<'a>,
    pub head: Side<'a>,
    pub change: &'a ChangeSet,
    pub attribution: Sides<'a>,
    pub corpus: &'a Corpus,
    pub ids: &'a [String],
    pub order: &'a DocOrder,
    pub weights: &'a [f64],
    pub options: &'a PreviewOptions,
}

thread_local! {
    /// Per thread, the base and head hits of the query being evaluated.
    static HIT_BUFFERS: std::cell::Cell<(Vec<Hit>, Vec<Hit>)> = const { std::cell::Cell::new((Vec::new(), Vec::new())) };
}

impl Engine<'_> {
    /// Evaluates every planned query independently, in parallel; the outcomes come back in
    /// plan order, so the report does not depend on the number of threads.
    pub fn evaluate_all(&self, plan: &QueryPlan) -> Result<Vec<QueryOutcome>, PreviewError> {
        (0..plan.queries.len())
            .into_par_iter()
            .map(|i| {
                // Each thread reuses its two hit buffers: taken out for the query, put back after.
                let (mut hb, mut hh) = HIT_BUFFERS.take();
                let outcome = self.evaluate(plan, i, &mut hb, &mut hh);
                HIT_BUFFERS.set((hb, hh));
                outcome
            })
            .collect()
    }

    /// Whether any planned query matches a document on either side: a changed query that
    /// matches settles it; otherwise queries are run until one matches (all of them only
    /// when none does).
    pub fn finds_anything(
        &self,
        plan: &QueryPlan,
        changes: &[QueryChange],
    ) -> Result<bool, PreviewError> {
        if changes
            .iter()
            .any(|c| c.matches_before > 0 || c.matches_after > 0)
        {
            return Ok(true);
        }
        let found = (0..plan.queries.len())
            .into_par_iter()
            .map(|i| {
                let mut hits = Vec::new();
                for side in [&self.base, &self.head] {
                    let query = side.analyzer.analyze_query(&plan.queries[i].text);
                    self.run_side(side, &query, &mut hits)?;
                    if !hits.is_empty() {
                        return Ok(true);
                    }
                }
                Ok(false)
            })
            .find_any(|r: &Result<bool, PreviewError>| !matches!(r, Ok(false)))
            .transpose()?;
        Ok(found.is_some())
    }

    /// Hits in document order; only the top k is ever ranked.
    fn run_side(
        &self,
        side: &Side,
        query: &AnalyzedQuery,
        hits: &mut Vec<Hit>,
    ) -> Result<(), PreviewError> {
        Ok(matches_into(
            query,
            side.keys,
            side.stats,
            &self.options.scoring,
            self.weights,
            hits,
        )?)
    }

    /// The ranking to the evaluation depth (at least the top k), or `None` when nobody
    /// reads it.
    fn ranked(&self, hits: &[Hit], needed: bool) -> Option<Vec<Hit>> {
        let deep = self.options.depth.max(self.options.top_k);
        needed.then(|| top_hits(hits, deep, self.order))
    }

    /// A ranking cut at the evaluation depth (it may have been ranked deeper, to show the
    /// top k): what judged metrics and run files read.
    fn to_depth(&self, ranked: Option<Vec<Hit>>) -> Option<Vec<Hit>> {
        ranked.map(|mut r| {
            r.truncate(self.options.depth);
            r
        })
    }

    /// The top k shown: a prefix of the deep ranking when there is one.
    fn top(&self, hits: &[Hit], ranked: Option<&Vec<Hit>>) -> Vec<RankedDoc> {
        let k = self.options.top_k;
        let shown = match ranked {
            Some(r) => r[..k.min(r.len())].to_vec(),
            None => top_hits(hits, k, self.order),
        };
        shown
            .iter()
            .map(|h| RankedDoc {
                id: self.ids[h.doc as usize].clone(),
                score: h.score,
            })
            .collect()
    }

    fn doc_ref(&self, d: u32) -> DocRef {
        DocRef {
            id: self.ids[d as usize].clone(),
            title: self.corpus.documents[d as usize].title.clone(),
        }
    }

    fn evaluate(
        &self,
        plan: &QueryPlan,
        i: usize,
        hb: &mut Vec<Hit>,
        hh: &mut Vec<Hit>,
    ) -> Result<QueryOutcome, PreviewError> {
        let planned = &plan.queries[i];
        let text = planned.text.as_str();
        let qb = self.base.analyzer.analyze_query(text);
        let qh = self.head.analyzer.analyze_query(text);
        let differs = !same_expansions(&qb, &qh);
        let must = self.change.evaluate_all.is_some()
            || differs
            || touched_keys(&qb)
                .chain(touched_keys(&qh))
                .any(|k| self.change.affected_keys.contains(k));
        let needs_ranking = !planned.qids.is_empty() || self.options.want_runs;
        if !must {
            if needs_ranking {
                self.run_side(&self.base, &qb, hb)?;
            }
            return Ok(QueryOutcome {
                evaluated: false,
                label: Label::Unchanged,
                rescored: false,
                ranked_b: self
                    .to_depth(self.ranked(hb, needs_ranking))
                    .unwrap_or_default(),
                ranked_h: None,
                change: None,
            });
        }
        matches_both(
            &SideQuery {
                query: &qb,
                source: self.base.keys,
                stats: self.base.stats,
            },
            &SideQuery {
                query: &qh,
                source: self.head.keys,
                stats: self.head.stats,
            },
            &self.options.scoring,
            self.weights,
            hb,
            hh,
        )?;
        let (ranked_b, ranked_h) = (
            self.ranked(hb, needs_ranking),
            self.ranked(hh, needs_ranking),
        );
        let (top_b, top_h) = (
            self.top(hb, ranked_b.as_ref()),
            self.top(hh, ranked_h.as_ref()),
        );
        let (ranked_b, ranked_h) = (self.to_depth(ranked_b), self.to_depth(ranked_h));
        let (gained, lost) = gained_and_lost(hb, hh);
        let mut change = diff(
            text,
            planned.count,
            planned.qids.first(),
            (hb.len(), hh.len()),
            (gained.len(), lost.len()),
            top_b,
            top_h,
            self.options,
        )?;
        let label = change.label;
        let rescored = label == Label::Unchanged && scores_moved(&change);
        let listed = label != Label::Unchanged && plan.in_log(i);
        if listed {
            let shown = |docs: Vec<u32>| {
                first_by_place(docs, self.options.docs_shown, self.order)
                    .into_iter()
                    .map(|d| self.doc_ref(d))
                    .collect()
            };
            change.gained = shown(gained);
            change.lost = shown(lost);
            change.causes = self.attribution.attribute(text, &qb, &qh);
        }
        Ok(QueryOutcome {
            evaluated: true,
            label,
            rescored,
            ranked_b: ranked_b.unwrap_or_default(),
            ranked_h,
            change: listed.then_some(change),
        })
    }
}

/// Whether an unchanged query's scores moved: the same top k in the same order, with a
/// score that differs beyond rounding.
fn scores_moved(change: &QueryChange) -> bool {
    change
        .top_before
        .iter()
        .zip(&change.top_after)
        .any(|(x, y)| (x.score - y.score).abs() > 1e-9 * x.score.abs().max(1.0))
}

/// The documents only `after` holds (gained) and only `before` holds (lost), both hit
/// lists being in document order.
fn gained_and_lost(before: &[Hit], after: &[Hit]) -> (Vec<u32>, Vec<u32>) {
    let (mut gained, mut lost) = (Vec::new(), Vec::new());
    let (mut i, mut j) = (0, 0);
    while i < before.len() || j < after.len() {
        match (before.get(i), after.get(j)) {
            (Some(b), Some(a)) if b.doc == a.doc => {
                i += 1;
                j += 1;
            }
            (Some(b), Some(a)) if b.doc < a.doc => {
                lost.push(b.doc);
                i += 1;
            }
            (Some(b), None) => {
                lost.push(b.doc);
                i += 1;
            }
            (_, Some(a)) => {
                gained.push(a.doc);
                j += 1;
            }
            (None, None) => unreachable!("the loop runs while either list has hits"),
        }
    }
    (gained, lost)
}

/// The first `n` documents in id order.
fn first_by_place(mut docs: Vec<u32>, n: usize, order: &DocOrder) -> Vec<u32> {
    if docs.len() > n && n > 0 {
        docs.select_nth_unstable_by_key(n - 1, |&d| order.place(d));
    }
    docs.truncate(n);
    docs.sort_unstable_by_key(|&d| order.place(d));
    docs
}

#[allow(clippy::too_many_arguments)]
fn diff(
    text: &str,
    searches: u64,
    qid: Option<&String>,
    (matches_before, matches_after): (usize, usize),
    (gained, lost): (usize, usize),
    top_before: Vec<RankedDoc>,
    top_after: Vec<RankedDoc>,
    options: &PreviewOptions,
) -> Result<QueryChange, MetricsError> {
    // The top k changed when its documents or their order did; scores alone do not count.
    let same_top = top_before.len() == top_after.len()
        && top_before.iter().zip(&top_after).all(|(x, y)| x.id == y.id);
    let label = match (matches_before, matches_after) {
        (0, n) if n > 0 => Label::Rescued,
        (n, 0) if n > 0 => Label::Emptied,
        _ if gained > lost => Label::Gained,
        _ if lost > 0 => Label::Lost,
        _ if !same_top => Label::Reordered,
        _ => Label::Unchanged,
    };
    let names = |v: &[RankedDoc]| v.iter().map(|d| d.id.clone()).collect::<Vec<_>>();
    let rbo = metrics::rbo_ext(&names(&top_before), &names(&top_after), options.rbo_p)?;
    Ok(QueryChange {
        query: text.to_string(),
        qid: qid.cloned(),
        searches,
        label,
        mixed: gained > 0 && lost > 0,
        matches_before,
        matches_after,
        gained_count: gained,
        lost_count: lost,
        gained: Vec::new(),
        lost: Vec::new(),
        rbo,
        top_before,
        top_after,
        causes: Vec::new(),
        judged: None,
    })
}
