//! The scoring model: which documents match (all, any or at least N clauses), the
//! ranking function (BM25 or cosine), each side's collection statistics, and how one field
//! scores one clause.

use std::fmt;
use std::str::FromStr;

use serde::Serialize;

use super::super::keys::KeySource;
use crate::index::IndexError;

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

/// How one field scores a clause's postings: the formula with the clause's df fixed.
pub(super) enum FieldScore<'a> {
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
    pub(super) fn new(
        scoring: &Scoring,
        stats: &'a Stats,
        field: usize,
        weight: f64,
        df: usize,
    ) -> Self {
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

    pub(super) fn score(&self, doc: u32, tf: u32) -> f64 {
        self.score_with(self.norms()[doc as usize], tf)
    }

    /// Per document, the value [`FieldScore::score_with`] takes: BM25's length norm, or
    /// the cosine norm.
    pub(super) fn norms(&self) -> &'a [f64] {
        match *self {
            FieldScore::Bm25 { k1_norms, .. } => k1_norms,
            FieldScore::Cosine { norms, .. } => norms,
        }
    }

    /// The score of `tf` in a document whose [`FieldScore::norms`] value is `norm`.
    pub(super) fn score_with(&self, norm: f64, tf: u32) -> f64 {
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
