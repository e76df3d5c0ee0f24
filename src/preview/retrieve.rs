//! Retrieval and scoring over a [`KeySource`]: the same code serves the fast path and the
//! reference path, so the two can differ only in the postings they are given.

use std::fmt;
use std::str::FromStr;
use std::sync::Arc;

use rayon::prelude::*;
use serde::Serialize;

use super::keys::KeySource;
use crate::analysis::{AnalyzedQuery, Expansion, Phrase};
use crate::index::{Frequencies, IndexError, Postings};

/// Which documents match: every clause, any clause, or at least N clauses (capped at the
/// number of clauses, so a short query can still match).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum MatchMode {
    All,
    Any,
    Min(usize),
}

impl fmt::Display for MatchMode {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            MatchMode::All => f.write_str("all"),
            MatchMode::Any => f.write_str("any"),
            MatchMode::Min(n) => write!(f, "min:{n}"),
        }
    }
}

impl Serialize for MatchMode {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.collect_str(self)
    }
}

impl FromStr for MatchMode {
    type Err = String;

    fn from_str(s: &str) -> Result<Self, String> {
        match s {
            "all" => Ok(MatchMode::All),
            "any" => Ok(MatchMode::Any),
            _ => match s.strip_prefix("min:").map(str::parse::<usize>) {
                Some(Ok(n)) if n >= 1 => Ok(MatchMode::Min(n)),
                _ => Err(format!("{s:?} is not all, any or min:N (N ≥ 1)")),
            },
        }
    }
}

/// The ranking function.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, clap::ValueEnum)]
#[serde(rename_all = "lowercase")]
pub enum Ranking {
    Bm25,
    Cosine,
}

/// How queries are matched and scored.
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
pub struct Scoring {
    pub ranking: Ranking,
    pub k1: f64,
    pub b: f64,
    #[serde(rename = "match")]
    pub mode: MatchMode,
}

impl Default for Scoring {
    fn default() -> Self {
        Scoring {
            ranking: Ranking::Bm25,
            k1: 1.2,
            b: 0.75,
            mode: MatchMode::All,
        }
    }
}

impl Scoring {
    /// The ranking function, spelled out for reports.
    pub fn definition(&self) -> String {
        match self.ranking {
            Ranking::Bm25 => format!(
                "BM25 (Robertson & Zaragoza 2009, \"The Probabilistic Relevance Framework: \
                 BM25 and Beyond\"), per field, summed with the field weights: \
                 idf = ln(1 + (N - df + 0.5)/(df + 0.5)), \
                 tf part = tf*(k1 + 1)/(tf + k1*(1 - b + b*dl/avgdl)), k1 = {}, b = {}; \
                 a clause (a query stretch with its synonym alternatives) counts as one term",
                self.k1, self.b
            ),
            Ranking::Cosine => "log-tf idf cosine, per field, summed with the field weights: \
                 w = (1 + ln tf)*ln(N/df), score = sum over matched clauses of w divided by the \
                 norm of the document's vector of w over all its keys under that ruleset"
                .to_string(),
        }
    }
}

/// A matching document and its score.
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
pub struct Hit {
    pub doc: u32,
    pub score: f64,
}

/// Collection statistics of one side.
#[derive(Debug, PartialEq)]
pub struct Stats {
    pub num_docs: u32,
    pub avgdl: Vec<f64>,
    /// BM25 only: per field, per document, `k1·(1 − b + b·dl/avgdl)`, the same for every
    /// query, so a posting's score costs one division.
    pub k1_norms: Vec<Vec<f64>>,
    /// Cosine only: per field, per document, the norm of its key-weight vector.
    pub norms: Option<Vec<Vec<f64>>>,
}

impl Stats {
    pub fn compute(source: &dyn KeySource, scoring: &Scoring) -> Result<Stats, IndexError> {
        let n = source.num_docs();
        let avgdl = (0..source.num_fields())
            .map(|f| {
                let total: u64 = source.doc_lengths(f).iter().map(|&l| l as u64).sum();
                if n == 0 { 0.0 } else { total as f64 / n as f64 }
            })
            .collect::<Vec<f64>>();
        let k1_norms = match scoring.ranking {
            Ranking::Bm25 => (0..source.num_fields())
                .map(|f| {
                    let avgdl = avgdl[f];
                    source
                        .doc_lengths(f)
                        .iter()
                        .map(|&dl| {
                            let norm = if avgdl > 0.0 {
                                1.0 - scoring.b + scoring.b * dl as f64 / avgdl
                            } else {
                                1.0
                            };
                            scoring.k1 * norm
                        })
                        .collect()
                })
                .collect(),
            Ranking::Cosine => Vec::new(),
        };
        let norms = match scoring.ranking {
            Ranking::Bm25 => None,
            Ranking::Cosine => Some(
                (0..source.num_fields())
                    .map(|f| {
                        let mut sq = vec![0.0f64; n as usize];
                        for key in source.keys(f) {
                            let p = source.frequencies(f, &key)?;
                            let idf = (n as f64 / p.len() as f64).ln();
                            for (doc, tf) in p.docs.iter().zip(&p.tfs) {
                                let w = (1.0 + (*tf as f64).ln()) * idf;
                                sq[*doc as usize] += w * w;
                            }
                        }
                        Ok(sq.into_iter().map(f64::sqrt).collect())
                    })
                    .collect::<Result<_, IndexError>>()?,
            ),
        };
        Ok(Stats {
            num_docs: n,
            avgdl,
            k1_norms,
            norms,
        })
    }
}

/// The order that breaks score ties: each document's place when sorted by id (then by
/// corpus position, so equal ids still order deterministically). Comparing two `u32`s
/// instead of two id strings matters: equal scores are common (same tf, same length).
#[derive(Clone, Debug)]
pub struct DocOrder(Vec<u32>);

impl DocOrder {
    pub fn by_id(ids: &[String]) -> DocOrder {
        let mut order: Vec<u32> = (0..ids.len() as u32).collect();
        order.par_sort_unstable_by(|&a, &b| ids[a as usize].cmp(&ids[b as usize]).then(a.cmp(&b)));
        let mut place = vec![0u32; ids.len()];
        for (i, doc) in order.into_iter().enumerate() {
            place[doc as usize] = i as u32;
        }
        DocOrder(place)
    }

    /// Each document's place, as [`DocOrder::by_id`] computed it (kept on disk).
    pub fn into_places(self) -> Vec<u32> {
        self.0
    }

    /// The order of places computed earlier by [`DocOrder::by_id`].
    pub fn from_places(places: Vec<u32>) -> DocOrder {
        DocOrder(places)
    }

    /// The document's place in id order.
    pub fn place(&self, doc: u32) -> u32 {
        self.0[doc as usize]
    }
}

/// Dense per-document accumulators reused across queries: a query touches a small share
/// of the corpus, and hashing every posting was most of the retrieval time. Every slot a
/// query sets is listed, and reset from that list, so no query pays for the whole corpus.
#[derive(Default)]
struct Scratch {
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
    fn fit(&mut self, n: usize) {
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
    fn take_hits(&mut self, need: usize, hits: &mut Vec<Hit>) {
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
    static SCRATCH: std::cell::RefCell<Scratch> = std::cell::RefCell::default();
}

/// Every document matching `query`, best first (ties by document id).
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

/// The best `k` of `hits`, best first, ties by document id: the order [`rank`] gives,
/// found in one pass over the hits with a buffer of k.
pub fn top_hits(hits: &[Hit], k: usize, order: &DocOrder) -> Vec<Hit> {
    let better = |a: &Hit, b: &Hit| {
        b.score
            .total_cmp(&a.score)
            .then_with(|| order.place(a.doc).cmp(&order.place(b.doc)))
    };
    let mut best: Vec<Hit> = Vec::with_capacity(k + 1);
    if k == 0 {
        return best;
    }
    for hit in hits {
        if best.len() == k && better(hit, &best[k - 1]).is_ge() {
            continue;
        }
        let at = best.partition_point(|b| better(b, hit).is_lt());
        best.insert(at, *hit);
        best.truncate(k);
    }
    best
}

/// How one field scores a clause's postings: the formula with the clause's df fixed.
enum FieldScore<'a> {
    /// `weight·idf`, `k1 + 1`, and the documents' `k1·(1 − b + b·dl/avgdl)`.
    Bm25 {
        weight_idf: f64,
        k1_plus_1: f64,
        k1_norms: &'a [f64],
    },
    Cosine {
        weight: f64,
        idf: f64,
        norms: &'a [f64],
    },
}

impl<'a> FieldScore<'a> {
    fn new(scoring: &Scoring, stats: &'a Stats, field: usize, weight: f64, df: usize) -> Self {
        let (n, df) = (stats.num_docs as f64, df as f64);
        match scoring.ranking {
            Ranking::Bm25 => FieldScore::Bm25 {
                weight_idf: weight * (1.0 + (n - df + 0.5) / (df + 0.5)).ln(),
                k1_plus_1: scoring.k1 + 1.0,
                k1_norms: &stats.k1_norms[field],
            },
            Ranking::Cosine => FieldScore::Cosine {
                weight,
                idf: (n / df).ln(),
                norms: &stats.norms.as_ref().expect("cosine stats")[field],
            },
        }
    }

    fn score(&self, doc: u32, tf: u32) -> f64 {
        self.score_with(self.norms()[doc as usize], tf)
    }

    /// Per document, the value [`FieldScore::score_with`] takes: BM25's length norm, or
    /// the cosine norm.
    fn norms(&self) -> &'a [f64] {
        match *self {
            FieldScore::Bm25 { k1_norms, .. } => k1_norms,
            FieldScore::Cosine { norms, .. } => norms,
        }
    }

    /// The score of `tf` in a document whose [`FieldScore::norms`] value is `norm`.
    fn score_with(&self, norm: f64, tf: u32) -> f64 {
        let tf = tf as f64;
        match *self {
            FieldScore::Bm25 {
                weight_idf,
                k1_plus_1,
                ..
            } => weight_idf * (tf * k1_plus_1 / (tf + norm)),
            FieldScore::Cosine { weight, idf, .. } => {
                let w = (1.0 + tf.ln()) * idf;
                let s = if norm > 0.0 { w / norm } else { 0.0 };
                weight * s
            }
        }
    }
}

/// Any or min:N: every posting of every clause is scored into the dense accumulators.
fn score_clauses(
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

/// A query's clause lists: per clause, per field, its documents and tfs.
type ClauseLists = Vec<Vec<Arc<Frequencies>>>;

fn clause_lists(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    fields: usize,
) -> Result<ClauseLists, IndexError> {
    query
        .expansions
        .iter()
        .map(|e| {
            (0..fields)
                .map(|field| clause_tf(e, field, source))
                .collect::<Result<Vec<_>, _>>()
        })
        .collect()
}

/// Whether `query` needs every clause under `scoring` (`min:N` asks for at most the number
/// of clauses, so a short query can still match).
fn needs_every_clause(query: &AnalyzedQuery, scoring: &Scoring) -> bool {
    let clauses = query.expansions.len();
    match scoring.mode {
        MatchMode::All => true,
        MatchMode::Any => clauses <= 1,
        MatchMode::Min(k) => k >= clauses,
    }
}

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

/// All clauses must match: the candidates are the documents of the rarest clause, and each
/// further clause only looks its candidates up (galloping through its sorted postings, or
/// through the candidates when the clause is the shorter list), so a frequent term costs
/// what the rare one allows. Only the documents left after every clause are scored, summed
/// in query order, field by field, exactly as [`score_clauses`] does.
fn retrieve_all(
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

/// Whether two clauses read the very same lists, field by field.
fn same_lists(a: &[Arc<Frequencies>], b: &[Arc<Frequencies>]) -> bool {
    a.iter().zip(b).all(|(x, y)| Arc::ptr_eq(x, y))
}

/// Which side a candidate is still a candidate of.
const BASE: u8 = 1;
const HEAD: u8 = 2;

/// Leaves in `scratch.candidates` (ascending) the documents that hold every clause of the
/// base, or of the head when given, with `scratch.sides` saying of which. A clause both
/// sides read from the same lists is looked up once for both.
fn filter_by_every_clause(
    base: &ClauseLists,
    head: Option<&ClauseLists>,
    scratch: &mut AllScratch,
) {
    let size = |c: &Vec<Arc<Frequencies>>| c.iter().map(|p| p.len()).sum::<usize>();
    // Every distinct clause once, with the sides that hold it.
    let mut clauses: Vec<(&Vec<Arc<Frequencies>>, u8)> = base.iter().map(|c| (c, BASE)).collect();
    for c in head.into_iter().flatten() {
        match clauses
            .iter_mut()
            .find(|(b, s)| *s == BASE && same_lists(b, c))
        {
            Some(shared) => shared.1 |= HEAD,
            None => clauses.push((c, HEAD)),
        }
    }
    let rarest = |bit: u8| {
        (0..clauses.len())
            .filter(|&i| clauses[i].1 & bit != 0)
            .min_by_key(|&i| (size(clauses[i].0), i))
    };
    let start_b = rarest(BASE).expect("a query with clauses");
    let start_h = head.map(|_| rarest(HEAD).expect("a query with clauses"));
    let AllScratch {
        candidates,
        merged,
        sides,
        merged_sides,
        matched,
        docs,
        ..
    } = scratch;
    // The candidates: the base's rarest clause's documents, and the head's.
    union_of_docs(clauses[start_b].0, candidates, merged);
    sides.clear();
    sides.resize(candidates.len(), BASE);
    if let Some(start_h) = start_h {
        if start_h == start_b {
            sides.iter_mut().for_each(|s| *s |= HEAD);
        } else {
            union_of_docs(clauses[start_h].0, docs, merged);
            merge_sides((candidates, sides), docs, (merged, merged_sides));
        }
    }
    let mut order: Vec<usize> = (0..clauses.len()).collect();
    order.sort_by_key(|&i| (size(clauses[i].0), i));
    for i in order {
        let (lists, mut bits) = clauses[i];
        // A side's own starting clause holds all its candidates already.
        if i == start_b {
            bits &= !BASE;
        }
        if Some(i) == start_h {
            bits &= !HEAD;
        }
        if bits == 0 {
            continue;
        }
        matched.clear();
        matched.resize(candidates.len(), false);
        for list in lists {
            if list.len() > candidates.len() && list.is_long() {
                // A long list: its bit set answers each candidate without a search.
                for (c, &doc) in candidates.iter().enumerate() {
                    matched[c] |= list.holds(doc);
                }
            } else {
                for_each_common(candidates, list, |c, _| matched[c] = true);
            }
        }
        let mut kept = 0;
        for c in 0..candidates.len() {
            let s = if matched[c] {
                sides[c]
            } else {
                sides[c] & !bits
            };
            if s != 0 {
                candidates[kept] = candidates[c];
                sides[kept] = s;
                kept += 1;
            }
        }
        candidates.truncate(kept);
        sides.truncate(kept);
        if kept == 0 {
            return;
        }
    }
}

/// Merges `other` (the head's starting documents) into `candidates` (the base's, all
/// marked [`BASE`]), marking each document with the sides it came from; `out` and
/// `out_sides` are buffers to merge into, as in [`merge_sorted`].
fn merge_sides(
    (candidates, sides): (&mut Vec<u32>, &mut Vec<u8>),
    other: &[u32],
    (out, out_sides): (&mut Vec<u32>, &mut Vec<u8>),
) {
    out.clear();
    out_sides.clear();
    let (a, b) = (&candidates[..], other);
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        out.push(x.min(y));
        out_sides.push(if x <= y { BASE } else { 0 } | if y <= x { HEAD } else { 0 });
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
    out.extend_from_slice(&a[i..]);
    out_sides.resize(out.len(), BASE);
    out.extend_from_slice(&b[j..]);
    out_sides.resize(out.len(), HEAD);
    std::mem::swap(candidates, out);
    std::mem::swap(sides, out_sides);
}

/// Scores `docs` (ascending, every clause present) into `hits`: per clause, per field in
/// field order, then the clauses summed in query order, as [`score_clauses`] sums.
fn score_documents(
    lists: &ClauseLists,
    docs: &[u32],
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    (contrib, norms): (&mut Vec<f64>, &mut Vec<f64>),
    hits: &mut Vec<Hit>,
) {
    hits.clear();
    let clauses: Vec<&Vec<Arc<Frequencies>>> = lists.iter().collect();
    if docs.is_empty() || clauses.is_empty() {
        return;
    }
    score_clause_matrix(&clauses, docs, stats, scoring, weights, (contrib, norms));
    hits.extend(
        docs.iter()
            .zip(contrib.chunks_exact(clauses.len()))
            .map(|(&doc, parts)| Hit {
                doc,
                score: parts.iter().fold(0.0, |sum, s| sum + s),
            }),
    );
}

/// Fills `contrib` (one row per document of `docs`, ascending; one column per clause)
/// with each clause's score in each document: its fields added in field order.
fn score_clause_matrix(
    clauses: &[&Vec<Arc<Frequencies>>],
    docs: &[u32],
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    (contrib, norms): (&mut Vec<f64>, &mut Vec<f64>),
) {
    let width = clauses.len();
    contrib.clear();
    contrib.resize(docs.len() * width, 0.0);
    // Field by field, the documents' norms are gathered once and read by every clause:
    // a million documents' norms do not stay in cache between clauses. A clause's fields
    // are still added in field order.
    for (field, &weight) in weights.iter().enumerate() {
        let mut gathered_yet = false;
        for (c, clause) in clauses.iter().enumerate() {
            let list = &clause[field];
            if list.is_empty() {
                continue;
            }
            let scorer = FieldScore::new(scoring, stats, field, weight, list.len());
            if !gathered_yet {
                let all = scorer.norms();
                norms.clear();
                norms.extend(docs.iter().map(|&d| all[d as usize]));
                gathered_yet = true;
            }
            for_each_common(docs, list, |i, j| {
                contrib[i * width + c] += scorer.score_with(norms[i], list.tfs[j]);
            });
        }
    }
}

/// Buffers of [`retrieve_all`] and [`matches_both`] kept per thread: a query of frequent
/// terms holds candidates by the hundred thousand, and fresh buffers cost more than the
/// work.
#[derive(Default)]
struct AllScratch {
    candidates: Vec<u32>,
    /// Per candidate, the sides ([`BASE`], [`HEAD`]) it is still a candidate of.
    sides: Vec<u8>,
    /// Where [`merge_sides`] merges the sides before swapping.
    merged_sides: Vec<u8>,
    /// Where [`union_of_docs`] merges before swapping.
    merged: Vec<u32>,
    matched: Vec<bool>,
    /// One side's documents, their per-clause scores, and one field's norms of them.
    docs: Vec<u32>,
    contrib: Vec<f64>,
    norms: Vec<f64>,
}

thread_local! {
    static ALL_SCRATCH: std::cell::RefCell<AllScratch> = std::cell::RefCell::default();
}

/// Calls `found(i, j)` for every candidate `i` (ascending documents) that `list` holds, at
/// its index `j` in the list, in ascending `i`. A long list gives each candidate's place
/// through its bit set; lists of like lengths are walked side by side; otherwise the
/// shorter is walked and the longer galloped through, so a short list costs its own
/// length, not the candidates'.
fn for_each_common(candidates: &[u32], list: &Frequencies, mut found: impl FnMut(usize, usize)) {
    if list.len() > candidates.len() && list.is_long() {
        // A long list: its bit set gives each candidate's place without a search.
        for (i, &doc) in candidates.iter().enumerate() {
            if let Some(j) = list.position(doc) {
                found(i, j);
            }
        }
        return;
    }
    let (short, long) = if list.len() < candidates.len() {
        (list.len(), candidates.len())
    } else {
        (candidates.len(), list.len())
    };
    if long <= short * WALK_RATIO {
        walk_common(candidates, &list.docs, found);
        return;
    }
    if list.len() < candidates.len() {
        let mut from = 0;
        for (j, &doc) in list.docs.iter().enumerate() {
            from = gallop(candidates, from, doc);
            if from == candidates.len() {
                break;
            }
            if candidates[from] == doc {
                found(from, j);
            }
        }
        return;
    }
    let mut from = 0;
    for (i, &doc) in candidates.iter().enumerate() {
        from = gallop(&list.docs, from, doc);
        if from == list.docs.len() {
            break;
        }
        if list.docs[from] == doc {
            found(i, from);
        }
    }
}

/// Up to this ratio of lengths, walking two lists side by side (a few predictable steps
/// per document) beats galloping through the longer (a search, its branches mispredicted,
/// per document of the shorter).
const WALK_RATIO: usize = 8;

/// Calls `found(i, j)` for every value in both `a[i]` and `b[j]` (both ascending), walking
/// both side by side.
fn walk_common(a: &[u32], b: &[u32], mut found: impl FnMut(usize, usize)) {
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        if x == y {
            found(i, j);
        }
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
}

/// The documents of any of these lists (each ascending), ascending, without repeats,
/// into `out`; `spare` is a buffer to merge into.
fn union_of_docs(lists: &[Arc<Frequencies>], out: &mut Vec<u32>, spare: &mut Vec<u32>) {
    out.clear();
    for list in lists.iter().filter(|l| !l.is_empty()) {
        if out.is_empty() {
            out.extend_from_slice(&list.docs);
        } else {
            merge_sorted(out, &list.docs, spare);
            std::mem::swap(out, spare);
        }
    }
}

/// Two ascending lists merged into `out` (cleared first), a value in both kept once.
fn merge_sorted(a: &[u32], b: &[u32], out: &mut Vec<u32>) {
    out.clear();
    out.reserve(a.len() + b.len());
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        out.push(x.min(y));
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
    out.extend_from_slice(&a[i..]);
    out.extend_from_slice(&b[j..]);
}

/// The first index at or after `from` whose document is not below `doc` (exponential then
/// binary search, so a run of nearby lookups costs little).
fn gallop(docs: &[u32], from: usize, doc: u32) -> usize {
    let mut step = 1;
    let mut hi = from;
    while hi < docs.len() && docs[hi] < doc {
        hi = from + step;
        step *= 2;
    }
    let lo = from + step / 4;
    let hi = hi.min(docs.len());
    let lo = lo.min(hi);
    lo + docs[lo..hi].partition_point(|&d| d < doc)
}

/// Sorts hits best first, ties broken by document id.
pub fn rank(hits: &mut [Hit], order: &DocOrder) {
    hits.sort_unstable_by(|a, b| {
        b.score
            .total_cmp(&a.score)
            .then_with(|| order.place(a.doc).cmp(&order.place(b.doc)))
    });
}

/// A clause's tf per document in one field: the number of positions where any of its
/// alternatives matches (sorted by document). Without a phrase among the alternatives this
/// is the sum of the distinct keys' tfs (a position holds one key), read without positions.
fn clause_tf(
    expansion: &Expansion,
    field: usize,
    source: &dyn KeySource,
) -> Result<Arc<Frequencies>, IndexError> {
    if expansion
        .alternatives
        .iter()
        .all(|a| a.phrase.keys.len() <= 1)
    {
        let mut keys: Vec<&str> = expansion
            .alternatives
            .iter()
            .flat_map(|a| a.phrase.keys.iter().map(|(_, k)| k.as_str()))
            .collect();
        keys.sort_unstable();
        keys.dedup();
        return source.frequencies_of_any(field, &keys);
    }
    let mut pairs = Vec::new();
    for alternative in &expansion.alternatives {
        phrase_matches(&alternative.phrase, field, source, &mut pairs)?;
    }
    Ok(Arc::new(Frequencies::from(&Postings::from_pairs(pairs))))
}

/// Appends `(doc, start position)` for every match of `phrase`.
fn phrase_matches(
    phrase: &Phrase,
    field: usize,
    source: &dyn KeySource,
    out: &mut Vec<(u32, u32)>,
) -> Result<(), IndexError> {
    let lists = phrase
        .keys
        .iter()
        .map(|(rel, key)| Ok((*rel, source.postings(field, key)?)))
        .collect::<Result<Vec<_>, IndexError>>()?;
    let Some(((_, first), rest)) = lists.split_first() else {
        return Ok(());
    };
    'docs: for (i, &doc) in first.docs.iter().enumerate() {
        let mut found = Vec::with_capacity(rest.len());
        for (rel, list) in rest {
            match list.docs.binary_search(&doc) {
                Ok(j) => found.push((*rel, list.positions_at(j))),
                Err(_) => continue 'docs,
            }
        }
        for &pos in first.positions_at(i) {
            if found
                .iter()
                .all(|(rel, positions)| positions.binary_search(&(pos + rel)).is_ok())
            {
                out.push((doc, pos));
            }
        }
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::analysis::Analyzer;
    use crate::rules::{SourceFile, load_sources};
    use proptest::prelude::*;
    use rustc_hash::FxHashMap;

    /// Postings held in memory: key → (doc, position) pairs, two fields. Frequencies are
    /// kept too, so two reads of a key give the very same list (as a view's caches do).
    struct MapKeys {
        postings: Vec<FxHashMap<String, Arc<Postings>>>,
        frequencies: Vec<FxHashMap<String, Arc<Frequencies>>>,
        lengths: Vec<Vec<u32>>,
    }

    impl KeySource for MapKeys {
        fn num_docs(&self) -> u32 {
            self.lengths[0].len() as u32
        }
        fn num_fields(&self) -> usize {
            self.lengths.len()
        }
        fn doc_lengths(&self, field: usize) -> &[u32] {
            &self.lengths[field]
        }
        fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError> {
            Ok(self.postings[field].get(key).cloned().unwrap_or_default())
        }
        fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
            Ok(self.frequencies[field]
                .get(key)
                .cloned()
                .unwrap_or_default())
        }
        fn keys(&self, field: usize) -> Vec<String> {
            let mut k: Vec<String> = self.postings[field].keys().cloned().collect();
            k.sort();
            k
        }
    }

    const WORDS: [&str; 6] = ["red", "blue", "green", "bus", "tram", "stop"];

    fn source(docs: &[Vec<Vec<u8>>]) -> MapKeys {
        let mut pairs: Vec<FxHashMap<String, Vec<(u32, u32)>>> = vec![Default::default(); 2];
        let mut lengths = vec![vec![0u32; docs.len()]; 2];
        for (d, fields) in docs.iter().enumerate() {
            for (f, words) in fields.iter().enumerate() {
                lengths[f][d] = words.len() as u32;
                for (pos, &w) in words.iter().enumerate() {
                    pairs[f]
                        .entry(WORDS[w as usize].to_string())
                        .or_default()
                        .push((d as u32, pos as u32));
                }
            }
        }
        let postings: Vec<FxHashMap<String, Arc<Postings>>> = pairs
            .into_iter()
            .map(|m| {
                m.into_iter()
                    .map(|(k, v)| (k, Arc::new(Postings::from_pairs(v))))
                    .collect()
            })
            .collect();
        let frequencies = postings
            .iter()
            .map(|m| {
                m.iter()
                    .map(|(k, p)| (k.clone(), Arc::new(Frequencies::from(&**p))))
                    .collect()
            })
            .collect();
        MapKeys {
            postings,
            frequencies,
            lengths,
        }
    }

    fn analyzer() -> Analyzer {
        analyzer_with("synonyms:\n  - id: colours\n    equivalent: [red, green tram]\n")
    }

    fn analyzer_with(rules: &str) -> Analyzer {
        let text = format!("format: 1\nrevision: 1\n{rules}");
        let rs = load_sources(
            "t",
            vec![SourceFile {
                name: "t.yaml".into(),
                text,
            }],
        )
        .unwrap();
        Analyzer::new(rs).unwrap()
    }

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

    proptest! {
        /// The one-pass top k is the first k of the full ranking.
        #[test]
        fn top_hits_is_the_ranking_prefix(
            scores in prop::collection::vec(0u8..5, 0..60),
            k in 0usize..12,
        ) {
            let hits: Vec<Hit> = scores
                .iter()
                .enumerate()
                .map(|(d, &s)| Hit { doc: d as u32, score: s as f64 / 2.0 })
                .collect();
            let ids: Vec<String> = (0..hits.len()).map(|d| format!("x{}", (d * 7) % 13)).collect();
            let order = DocOrder::by_id(&ids);
            let mut ranked = hits.clone();
            rank(&mut ranked, &order);
            ranked.truncate(k);
            prop_assert_eq!(top_hits(&hits, k, &order), ranked);
        }
    }

    #[test]
    fn merged_lists_keep_shared_documents_once() {
        let mut out = vec![99];
        merge_sorted(&[1, 4, 6], &[2, 4, 9, 11], &mut out);
        assert_eq!(out, [1, 2, 4, 6, 9, 11]);
        merge_sorted(&[], &[3], &mut out);
        assert_eq!(out, [3]);
    }

    #[test]
    fn gallop_finds_the_first_document_not_below() {
        let docs = [1, 3, 5, 7, 9, 11, 13, 15, 17];
        for from in 0..docs.len() {
            for doc in 0..20 {
                let want = from + docs[from..].partition_point(|&d| d < doc);
                assert_eq!(gallop(&docs, from, doc), want, "from {from} doc {doc}");
            }
        }
    }

    #[test]
    fn match_modes_parse() {
        assert_eq!("all".parse::<MatchMode>().unwrap(), MatchMode::All);
        assert_eq!("min:2".parse::<MatchMode>().unwrap(), MatchMode::Min(2));
        assert!("min:0".parse::<MatchMode>().is_err());
        assert!("most".parse::<MatchMode>().is_err());
    }
}
