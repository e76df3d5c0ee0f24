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

    /// The documents with at least `need` clauses, and clears the totals.
    fn take_hits(&mut self, need: usize) -> Vec<Hit> {
        let mut hits = Vec::new();
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
        hits
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
    let clauses = query.expansions.len();
    if clauses == 0 {
        return Ok(Vec::new());
    }
    let need = match scoring.mode {
        MatchMode::All => clauses,
        MatchMode::Any => 1,
        MatchMode::Min(k) => k.min(clauses),
    };
    if need == clauses {
        return retrieve_all(query, source, stats, scoring, weights);
    }
    let mut hits = SCRATCH.with_borrow_mut(|scratch| {
        scratch.fit(stats.num_docs as usize);
        let scored = score_clauses(query, source, stats, scoring, weights, scratch);
        // Always clear the scratch, even after an error, so the next query starts clean.
        let hits = scratch.take_hits(need);
        scored.map(|()| hits)
    })?;
    hits.sort_unstable_by_key(|h| h.doc);
    Ok(hits)
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
        let tf = tf as f64;
        match *self {
            FieldScore::Bm25 {
                weight_idf,
                k1_plus_1,
                k1_norms,
            } => weight_idf * (tf * k1_plus_1 / (tf + k1_norms[doc as usize])),
            FieldScore::Cosine { weight, idf, norms } => {
                let norm = norms[doc as usize];
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

/// All clauses must match: the candidates are the documents of the rarest clause, and each
/// further clause only looks its candidates up (galloping through its sorted postings), so
/// a frequent term costs what the rare one allows. Only the documents left after every
/// clause are scored. Scores are summed in query order, field by field, exactly as
/// [`score_clauses`] does.
fn retrieve_all(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
) -> Result<Vec<Hit>, IndexError> {
    let lists = query
        .expansions
        .iter()
        .map(|e| {
            (0..weights.len())
                .map(|field| clause_tf(e, field, source))
                .collect::<Result<Vec<_>, _>>()
        })
        .collect::<Result<Vec<_>, _>>()?;
    let size = |c: &Vec<Arc<Frequencies>>| c.iter().map(|p| p.len()).sum::<usize>();
    let mut by_size: Vec<usize> = (0..lists.len()).collect();
    by_size.sort_by_key(|&c| (size(&lists[c]), c));
    ALL_SCRATCH.with_borrow_mut(|scratch| {
        let AllScratch {
            candidates,
            matched,
            contrib,
        } = scratch;
        union_of_docs(&lists[by_size[0]], candidates);
        for &c in &by_size[1..] {
            matched.clear();
            matched.resize(candidates.len(), false);
            for list in &lists[c] {
                for_each_found(candidates, list, |i, _| matched[i] = true);
            }
            let mut kept = 0;
            for i in 0..candidates.len() {
                if matched[i] {
                    candidates[kept] = candidates[i];
                    kept += 1;
                }
            }
            candidates.truncate(kept);
            if kept == 0 {
                return Ok(Vec::new());
            }
        }
        let clauses = lists.len();
        contrib.clear();
        contrib.resize(candidates.len() * clauses, 0.0);
        for (c, fields) in lists.iter().enumerate() {
            for (field, list) in fields.iter().enumerate() {
                if list.is_empty() {
                    continue;
                }
                let scorer = FieldScore::new(scoring, stats, field, weights[field], list.len());
                for_each_found(candidates, list, |i, j| {
                    contrib[i * clauses + c] += scorer.score(candidates[i], list.tfs[j]);
                });
            }
        }
        Ok(candidates
            .iter()
            .zip(contrib.chunks_exact(clauses))
            .map(|(&doc, parts)| Hit {
                doc,
                score: parts.iter().fold(0.0, |sum, s| sum + s),
            })
            .collect())
    })
}

/// Buffers of [`retrieve_all`] kept per thread: a query of frequent terms holds
/// candidates by the hundred thousand, and fresh buffers cost more than the work.
#[derive(Default)]
struct AllScratch {
    candidates: Vec<u32>,
    matched: Vec<bool>,
    contrib: Vec<f64>,
}

thread_local! {
    static ALL_SCRATCH: std::cell::RefCell<AllScratch> = std::cell::RefCell::default();
}

/// Calls `found(i, j)` for every candidate `i` (ascending documents) that `list` holds, at
/// its index `j` in the list.
fn for_each_found(candidates: &[u32], list: &Frequencies, mut found: impl FnMut(usize, usize)) {
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

/// The documents of any of these lists (each ascending), ascending, without repeats,
/// into `out`.
fn union_of_docs(lists: &[Arc<Frequencies>], out: &mut Vec<u32>) {
    out.clear();
    for list in lists.iter().filter(|l| !l.is_empty()) {
        if out.is_empty() {
            out.extend_from_slice(&list.docs);
        } else {
            *out = merge_sorted(out, &list.docs);
        }
    }
}

/// Two ascending lists merged, a value in both kept once.
fn merge_sorted(a: &[u32], b: &[u32]) -> Vec<u32> {
    let mut out = Vec::with_capacity(a.len() + b.len());
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        out.push(x.min(y));
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
    out.extend_from_slice(&a[i..]);
    out.extend_from_slice(&b[j..]);
    out
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

    /// Postings held in memory: key → (doc, position) pairs, two fields.
    struct MapKeys {
        postings: Vec<FxHashMap<String, Arc<Postings>>>,
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
        MapKeys {
            postings: pairs
                .into_iter()
                .map(|m| {
                    m.into_iter()
                        .map(|(k, v)| (k, Arc::new(Postings::from_pairs(v))))
                        .collect()
                })
                .collect(),
            lengths,
        }
    }

    fn analyzer() -> Analyzer {
        let text = "format: 1\nrevision: 1\nsynonyms:\n  - id: colours\n    equivalent: [red, green tram]\n";
        let rs = load_sources(
            "t",
            vec![SourceFile {
                name: "t.yaml".into(),
                text: text.into(),
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
            let fast = retrieve_all(&q, &source, &stats, &scoring, &weights).unwrap();
            let dense = SCRATCH.with_borrow_mut(|scratch| {
                scratch.fit(docs.len());
                score_clauses(&q, &source, &stats, &scoring, &weights, scratch).unwrap();
                scratch.take_hits(q.expansions.len())
            });
            let ids: Vec<String> = (0..docs.len()).map(|d| format!("d{d:03}")).collect();
            let order = DocOrder::by_id(&ids);
            let (mut fast, mut dense) = (fast, dense);
            rank(&mut fast, &order);
            rank(&mut dense, &order);
            prop_assert_eq!(fast, dense);
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
        assert_eq!(
            merge_sorted(&[1, 4, 6], &[2, 4, 9, 11]),
            [1, 2, 4, 6, 9, 11]
        );
        assert_eq!(merge_sorted(&[], &[3]), [3]);
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
