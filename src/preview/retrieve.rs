//! Retrieval and scoring over a [`KeySource`]: the same code serves the fast path and the
//! reference path, so the two can differ only in the postings they are given.

use std::fmt;
use std::str::FromStr;

use rustc_hash::FxHashMap;
use serde::Serialize;

use super::keys::KeySource;
use crate::analysis::{AnalyzedQuery, Expansion, Phrase};
use crate::index::{IndexError, Postings};

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
            .collect();
        let norms = match scoring.ranking {
            Ranking::Bm25 => None,
            Ranking::Cosine => Some(
                (0..source.num_fields())
                    .map(|f| {
                        let mut sq = vec![0.0f64; n as usize];
                        for key in source.keys(f) {
                            let p = source.postings(f, &key)?;
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
            norms,
        })
    }
}

/// Every document matching `query`, best first (ties by document id).
pub fn retrieve(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    ids: &[String],
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
    let n = stats.num_docs as f64;
    let mut acc: FxHashMap<u32, (usize, f64)> = FxHashMap::default();
    for expansion in &query.expansions {
        let mut clause: FxHashMap<u32, f64> = FxHashMap::default();
        for (field, &weight) in weights.iter().enumerate() {
            let tfs = clause_tf(expansion, field, source)?;
            if tfs.is_empty() {
                continue;
            }
            let df = tfs.len() as f64;
            let lengths = source.doc_lengths(field);
            match scoring.ranking {
                Ranking::Bm25 => {
                    let idf = (1.0 + (n - df + 0.5) / (df + 0.5)).ln();
                    let avgdl = stats.avgdl[field];
                    for (doc, tf) in tfs {
                        let tf = tf as f64;
                        let dl = lengths[doc as usize] as f64;
                        let norm = if avgdl > 0.0 {
                            1.0 - scoring.b + scoring.b * dl / avgdl
                        } else {
                            1.0
                        };
                        let part = tf * (scoring.k1 + 1.0) / (tf + scoring.k1 * norm);
                        *clause.entry(doc).or_insert(0.0) += weight * idf * part;
                    }
                }
                Ranking::Cosine => {
                    let idf = (n / df).ln();
                    let norms = &stats.norms.as_ref().expect("cosine stats")[field];
                    for (doc, tf) in tfs {
                        let norm = norms[doc as usize];
                        let w = (1.0 + (tf as f64).ln()) * idf;
                        let s = if norm > 0.0 { w / norm } else { 0.0 };
                        *clause.entry(doc).or_insert(0.0) += weight * s;
                    }
                }
            }
        }
        for (doc, s) in clause {
            let slot = acc.entry(doc).or_insert((0, 0.0));
            slot.0 += 1;
            slot.1 += s;
        }
    }
    let mut hits: Vec<Hit> = acc
        .into_iter()
        .filter(|(_, (count, _))| *count >= need)
        .map(|(doc, (_, score))| Hit { doc, score })
        .collect();
    rank(&mut hits, ids);
    Ok(hits)
}

/// Sorts hits best first, ties broken by document id.
pub fn rank(hits: &mut [Hit], ids: &[String]) {
    hits.sort_unstable_by(|a, b| {
        b.score
            .total_cmp(&a.score)
            .then_with(|| ids[a.doc as usize].cmp(&ids[b.doc as usize]))
    });
}

/// A clause's tf per document in one field: the number of positions where any of its
/// alternatives matches (sorted by document).
fn clause_tf(
    expansion: &Expansion,
    field: usize,
    source: &dyn KeySource,
) -> Result<Vec<(u32, u32)>, IndexError> {
    if let [only] = expansion.alternatives.as_slice()
        && let [(_, key)] = only.phrase.keys.as_slice()
    {
        let p = source.postings(field, key)?;
        return Ok(p.docs.iter().copied().zip(p.tfs.iter().copied()).collect());
    }
    let mut pairs = Vec::new();
    for alternative in &expansion.alternatives {
        phrase_matches(&alternative.phrase, field, source, &mut pairs)?;
    }
    let merged = Postings::from_pairs(pairs);
    Ok(merged.docs.into_iter().zip(merged.tfs).collect())
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

    #[test]
    fn match_modes_parse() {
        assert_eq!("all".parse::<MatchMode>().unwrap(), MatchMode::All);
        assert_eq!("min:2".parse::<MatchMode>().unwrap(), MatchMode::Min(2));
        assert!("min:0".parse::<MatchMode>().is_err());
        assert!("most".parse::<MatchMode>().is_err());
    }
}
