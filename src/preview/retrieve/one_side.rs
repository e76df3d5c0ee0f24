//! One side's matches of a query: the candidate strategy when every clause must match,
//! dense per-document accumulators otherwise.

use super::super::keys::KeySource;
use super::candidates::{ALL_SCRATCH, AllScratch, filter_by_every_clause, score_documents};
use super::clauses::{clause_lists, clause_tf, needs_every_clause};
#[cfg(doc)]
use super::top_hits;
use super::{DocOrder, FieldScore, Hit, MatchMode, Scoring, Stats, rank};
use crate::analysis::AnalyzedQuery;
use crate::index::IndexError;

/// Dense per-document accumulators reused across queries: a query touches a small share
/// of the corpus, and hashing every posting was most of the retrieval time. Every slot a
/// query sets is listed, and reset from that list, so no query pays for the whole corpus.
#[derive(Default)]
pub(super) struct Scratch {
    /// Per document: clauses matched and score so far (documents listed in `docs`).
    count: Vec<u32>,
    score: Vec<f64>,
    docs: Vec<u32>,
    /// Per document: the current clause's score, and whether the clause matched it.
    clause: Vec<f64>,
    in_clause: Vec<bool>,
    clause_docs: Vec<u32>,
}

impl Scratch {
    pub(super) fn fit(&mut self, n: usize) {
        if self.count.len() < n {
            self.count.resize(n, 0);
            self.score.resize(n, 0.0);
            self.clause.resize(n, 0.0);
            self.in_clause.resize(n, false);
        }
    }

    fn add_to_clause(&mut self, doc: u32, s: f64) {
        let d = doc as usize;
        if !self.in_clause[d] {
            self.in_clause[d] = true;
            self.clause_docs.push(doc);
        }
        self.clause[d] += s;
    }

    /// Folds the current clause into the query's totals and clears it.
    fn close_clause(&mut self) {
        for &doc in &self.clause_docs {
            let d = doc as usize;
            if self.count[d] == 0 {
                self.docs.push(doc);
            }
            self.count[d] += 1;
            self.score[d] += self.clause[d];
            self.clause[d] = 0.0;
            self.in_clause[d] = false;
        }
        self.clause_docs.clear();
    }

    /// The documents with at least `need` clauses, into `hits`, and clears the totals.
    pub(super) fn take_hits(&mut self, need: usize, hits: &mut Vec<Hit>) {
        hits.clear();
        for &doc in &self.docs {
            let d = doc as usize;
            if self.count[d] as usize >= need {
                hits.push(Hit {
                    doc,
                    score: self.score[d],
                });
            }
            self.count[d] = 0;
            self.score[d] = 0.0;
        }
        self.docs.clear();
    }
}

thread_local! {
    pub(super) static SCRATCH: std::cell::RefCell<Scratch> = std::cell::RefCell::default();
}

/// Every document matching `query`, best first (ties as [`top_hits`] breaks them).
pub fn retrieve(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    order: &DocOrder,
) -> Result<Vec<Hit>, IndexError> {
    let mut hits = matches(query, source, stats, scoring, weights)?;
    rank(&mut hits, order);
    Ok(hits)
}

/// Every document matching `query` with its score, in document order: what a comparison
/// of two sides needs, without ranking every match ([`top_hits`] ranks the first k).
pub fn matches(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
) -> Result<Vec<Hit>, IndexError> {
    let mut hits = Vec::new();
    matches_into(query, source, stats, scoring, weights, &mut hits)?;
    Ok(hits)
}

/// [`matches()`] into `hits` (cleared first): a buffer the caller reuses from query to query,
/// as a million-document query's hits are megabytes of fresh pages otherwise.
pub fn matches_into(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    hits: &mut Vec<Hit>,
) -> Result<(), IndexError> {
    hits.clear();
    let clauses = query.expansions.len();
    if clauses == 0 {
        return Ok(());
    }
    if needs_every_clause(query, scoring) {
        return retrieve_all(query, source, stats, scoring, weights, hits);
    }
    let need = match scoring.mode {
        MatchMode::All => clauses,
        MatchMode::Any => 1,
        MatchMode::Min(k) => k.min(clauses),
    };
    SCRATCH.with_borrow_mut(|scratch| {
        scratch.fit(stats.num_docs as usize);
        let scored = score_clauses(query, source, stats, scoring, weights, scratch);
        // Always clear the scratch, even after an error, so the next query starts clean.
        scratch.take_hits(need, hits);
        scored
    })?;
    hits.sort_unstable_by_key(|h| h.doc);
    Ok(())
}

/// Any or min:N: every posting of every clause is scored into the dense accumulators.
pub(super) fn score_clauses(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    scratch: &mut Scratch,
) -> Result<(), IndexError> {
    for expansion in &query.expansions {
        for (field, &weight) in weights.iter().enumerate() {
            let list = match clause_tf(expansion, field, source) {
                Ok(list) => list,
                Err(e) => {
                    scratch.close_clause();
                    return Err(e);
                }
            };
            if list.is_empty() {
                continue;
            }
            let scorer = FieldScore::new(scoring, stats, field, weight, list.len());
            for (&doc, &tf) in list.docs.iter().zip(&list.tfs) {
                scratch.add_to_clause(doc, scorer.score(doc, tf));
            }
        }
        scratch.close_clause();
    }
    Ok(())
}

/// All clauses must match: the candidates are the documents of the rarest clause, and each
/// further clause only looks its candidates up (galloping through its sorted postings, or
/// through the candidates when the clause is the shorter list), so a frequent term costs
/// what the rare one allows. Only the documents left after every clause are scored, summed
/// in query order, field by field, exactly as [`score_clauses`] does.
pub(super) fn retrieve_all(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    hits: &mut Vec<Hit>,
) -> Result<(), IndexError> {
    let lists = clause_lists(query, source, weights.len())?;
    ALL_SCRATCH.with_borrow_mut(|scratch| {
        filter_by_every_clause(&lists, None, scratch);
        let AllScratch {
            candidates,
            contrib,
            norms,
            ..
        } = scratch;
        score_documents(
            &lists,
            candidates,
            stats,
            scoring,
            weights,
            (contrib, norms),
            hits,
        );
        Ok(())
    })
}

#[cfg(test)]
mod tests {
    use super::super::Ranking;
    use super::super::test_support::*;
    use super::*;
    use proptest::prelude::*;

    proptest! {
        /// The candidate strategy of `all` gives the very hits (same scores, bit for bit) as
        /// scoring every posting into the accumulators and keeping documents with every
        /// clause.
        #[test]
        fn all_mode_equals_dense_scoring(
            docs in prop::collection::vec(
                prop::collection::vec(prop::collection::vec(0u8..6, 0..8), 2..=2), 1..40),
            query in prop::collection::vec(0usize..6, 1..4),
            cosine in any::<bool>(),
        ) {
            let source = source(&docs);
            let scoring = Scoring {
                ranking: if cosine { Ranking::Cosine } else { Ranking::Bm25 },
                ..Scoring::default()
            };
            let stats = Stats::compute(&source, &scoring).unwrap();
            let text: Vec<&str> = query.iter().map(|&w| WORDS[w]).collect();
            let q = analyzer().analyze_query(&text.join(" "));
            let weights = [2.0, 1.0];
            let mut fast = Vec::new();
            retrieve_all(&q, &source, &stats, &scoring, &weights, &mut fast).unwrap();
            let mut dense = Vec::new();
            SCRATCH.with_borrow_mut(|scratch| {
                scratch.fit(docs.len());
                score_clauses(&q, &source, &stats, &scoring, &weights, scratch).unwrap();
                scratch.take_hits(q.expansions.len(), &mut dense);
            });
            let ids: Vec<String> = (0..docs.len()).map(|d| format!("d{d:03}")).collect();
            let order = DocOrder::by_id(&ids);
            rank(&mut fast, &order);
            rank(&mut dense, &order);
            prop_assert_eq!(fast, dense);
        }
    }
}
