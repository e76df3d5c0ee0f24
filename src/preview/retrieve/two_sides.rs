//! Both sides' matches of one query found together: the clauses a change leaves alone
//! are the very same lists on both sides, so they filter both sides' candidates once.

use std::sync::Arc;

use super::super::keys::KeySource;
use super::candidates::{
    ALL_SCRATCH, AllScratch, BASE, HEAD, filter_by_every_clause, same_lists, score_clause_matrix,
    score_documents,
};
use super::clauses::{ClauseLists, clause_lists, needs_every_clause};
use super::{Hit, Scoring, Stats, matches_into};
use crate::analysis::AnalyzedQuery;
use crate::index::{Frequencies, IndexError};

/// One side of a comparison: the query as that side analyzes it, its postings and stats.
pub struct SideQuery<'a> {
    pub query: &'a AnalyzedQuery,
    pub source: &'a dyn KeySource,
    pub stats: &'a Stats,
}

/// Both sides' [`matches()`] of one query, into `base_hits` and `head_hits`. When both need
/// every clause, the two are found together: a clause both sides read from the very same
/// list (the clauses a change leaves alone) filters the candidates of both in one pass, so
/// a query whose change touches one clause pays for its other clauses once, not twice.
/// Each side is then scored alone, so the hits are exactly what [`matches()`] gives.
pub fn matches_both(
    base: &SideQuery,
    head: &SideQuery,
    scoring: &Scoring,
    weights: &[f64],
    base_hits: &mut Vec<Hit>,
    head_hits: &mut Vec<Hit>,
) -> Result<(), IndexError> {
    let joint = !base.query.expansions.is_empty()
        && !head.query.expansions.is_empty()
        && needs_every_clause(base.query, scoring)
        && needs_every_clause(head.query, scoring);
    if !joint {
        matches_into(
            base.query,
            base.source,
            base.stats,
            scoring,
            weights,
            base_hits,
        )?;
        return matches_into(
            head.query,
            head.source,
            head.stats,
            scoring,
            weights,
            head_hits,
        );
    }
    let lists_b = clause_lists(base.query, base.source, weights.len())?;
    let lists_h = clause_lists(head.query, head.source, weights.len())?;
    ALL_SCRATCH.with_borrow_mut(|scratch| {
        filter_by_every_clause(&lists_b, Some(&lists_h), scratch);
        if std::ptr::eq(base.stats, head.stats) {
            score_both(
                (&lists_b, &lists_h),
                base.stats,
                scoring,
                weights,
                scratch,
                (base_hits, head_hits),
            );
            return Ok(());
        }
        let AllScratch {
            candidates,
            sides,
            docs,
            contrib,
            norms,
            ..
        } = scratch;
        for (bit, lists, stats, hits) in [
            (BASE, &lists_b, base.stats, base_hits),
            (HEAD, &lists_h, head.stats, head_hits),
        ] {
            docs.clear();
            docs.extend(
                candidates
                    .iter()
                    .zip(sides.iter())
                    .filter(|(_, s)| **s & bit != 0)
                    .map(|(d, _)| *d),
            );
            score_documents(lists, docs, stats, scoring, weights, (contrib, norms), hits);
        }
        Ok(())
    })
}

/// Scores the candidates `filter_by_every_clause` left, for both sides at once, when both
/// sides share their statistics: a clause both read from the very same lists then gives a
/// document the very same score on both, so it is scored once. Every clause is scored for
/// every candidate (most candidates are documents of both sides), and each side sums its
/// own clauses in its query order, as [`score_documents`] sums.
fn score_both(
    (lists_b, lists_h): (&ClauseLists, &ClauseLists),
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    scratch: &mut AllScratch,
    (base_hits, head_hits): (&mut Vec<Hit>, &mut Vec<Hit>),
) {
    // The clauses scored: the base's, then those of the head no base clause shares.
    let mut scored: Vec<&Vec<Arc<Frequencies>>> = lists_b.iter().collect();
    let head_clauses: Vec<usize> = lists_h
        .iter()
        .map(|c| match lists_b.iter().position(|b| same_lists(b, c)) {
            Some(shared) => shared,
            None => {
                scored.push(c);
                scored.len() - 1
            }
        })
        .collect();
    let AllScratch {
        candidates,
        sides,
        contrib,
        norms,
        ..
    } = scratch;
    score_clause_matrix(
        &scored,
        candidates,
        stats,
        scoring,
        weights,
        (contrib, norms),
    );
    base_hits.clear();
    head_hits.clear();
    let width = scored.len();
    for ((&doc, &side), row) in candidates
        .iter()
        .zip(sides.iter())
        .zip(contrib.chunks_exact(width))
    {
        if side & BASE != 0 {
            let score = (0..lists_b.len()).fold(0.0, |sum, c| sum + row[c]);
            base_hits.push(Hit { doc, score });
        }
        if side & HEAD != 0 {
            let score = head_clauses.iter().fold(0.0, |sum, &c| sum + row[c]);
            head_hits.push(Hit { doc, score });
        }
    }
}

#[cfg(test)]
mod tests {
    use super::super::test_support::*;
    use super::super::{MatchMode, Ranking};
    use super::*;
    use proptest::prelude::*;

    proptest! {
        /// Both sides found together give each side's hits exactly (documents and score
        /// bits) as found alone: over one source, where the clauses a change leaves alone
        /// are the very same lists, and over two sources, where nothing is shared.
        #[test]
        fn both_sides_together_equal_each_side_alone(
            docs in prop::collection::vec(
                prop::collection::vec(prop::collection::vec(0u8..6, 0..8), 2..=2), 1..40),
            other_docs in prop::collection::vec(
                prop::collection::vec(prop::collection::vec(0u8..6, 0..8), 2..=2), 1..40),
            base_words in prop::collection::vec(0usize..6, 0..4),
            head_words in prop::collection::vec(0usize..6, 0..4),
            one_source in any::<bool>(),
            cosine in any::<bool>(),
            mode in 0usize..3,
        ) {
            let scoring = Scoring {
                ranking: if cosine { Ranking::Cosine } else { Ranking::Bm25 },
                mode: [MatchMode::All, MatchMode::Any, MatchMode::Min(2)][mode],
                ..Scoring::default()
            };
            let base_source = source(&docs);
            let other = if one_source { None } else { Some(source(&other_docs)) };
            let head_source = other.as_ref().unwrap_or(&base_source);
            let base_stats = Stats::compute(&base_source, &scoring).unwrap();
            let other_stats = Stats::compute(head_source, &scoring).unwrap();
            // Over one source the sides share their statistics, as a preview shares them.
            let head_stats = if one_source { &base_stats } else { &other_stats };
            let words = |w: &[usize]| w.iter().map(|&i| WORDS[i]).collect::<Vec<_>>().join(" ");
            let qb = analyzer().analyze_query(&words(&base_words));
            let qh = analyzer_with("synonyms:\n  - id: vehicles\n    equivalent: [bus, tram]\n")
                .analyze_query(&words(&head_words));
            let weights = [2.0, 1.0];
            let (mut alone_b, mut alone_h) = (Vec::new(), Vec::new());
            matches_into(&qb, &base_source, &base_stats, &scoring, &weights, &mut alone_b).unwrap();
            matches_into(&qh, head_source, head_stats, &scoring, &weights, &mut alone_h).unwrap();
            let (mut both_b, mut both_h) = (vec![Hit { doc: 7, score: 1.0 }], Vec::new());
            matches_both(
                &SideQuery { query: &qb, source: &base_source, stats: &base_stats },
                &SideQuery { query: &qh, source: head_source, stats: head_stats },
                &scoring,
                &weights,
                &mut both_b,
                &mut both_h,
            )
            .unwrap();
            let bits = |v: &[Hit]| v.iter().map(|h| (h.doc, h.score.to_bits())).collect::<Vec<_>>();
            prop_assert_eq!(bits(&both_b), bits(&alone_b));
            prop_assert_eq!(bits(&both_h), bits(&alone_h));
        }
    }
}
