//! Per-query metrics of one ranked list against graded judgments.
//!
//! Conventions (they follow trec_eval, as carried by the `ir-measures` and
//! `pytrec-eval-terrier` Python packages that `tests/metrics_reference.rs` checks against):
//!
//! * A document is **relevant** when its grade is at least the relevance threshold
//!   ([`EvalParams::relevance_threshold`], default 1). Unjudged documents, and judged ones
//!   below the threshold (including negative grades), are non-relevant. `R` below is the
//!   number of relevant judged documents of the query, retrieved or not.
//! * A document repeated in a ranking counts only at its first rank; later copies keep their
//!   ranks but count as non-relevant and gain nothing.
//! * **P@k** = relevant in the top k / k. The divisor is k even when fewer than k documents
//!   were retrieved.
//! * **R@k** = relevant in the top k / R; **0 when R = 0**.
//! * **F1@k** = 2·P@k·R@k / (P@k + R@k); 0 when both are 0.
//! * **RR** = 1 / rank of the first relevant document in the **whole** ranking (0 when there
//!   is none); **RR@k** looks only at the top k.
//! * **AP** (trec_eval's average precision) = Σ over relevant retrieved ranks r of P@r,
//!   divided by R (so relevant documents never retrieved count as precision 0); 0 when
//!   R = 0. **AP@k** sums over ranks ≤ k only and still divides by R (trec_eval's
//!   `map_cut`).
//! * **nDCG@k** = DCG@k / IDCG@k with DCG@k = Σ_{r ≤ k} gain(r) / log2(r + 1). The gain is
//!   the grade itself ([`Gain::Linear`], the trec_eval / ir-measures `nDCG@k` definition) or
//!   2^grade − 1 ([`Gain::Exponential`]); grades ≤ 0 and unjudged documents gain 0. The
//!   ideal ranking sorts **all** judged documents of the query by gain. nDCG is 0 when the
//!   ideal gain is 0. The relevance threshold does not affect nDCG. Plain **nDCG** has no
//!   cut-off (the whole ranking against the whole ideal ranking).
//! * **JudgedShare@k** = judged documents in the top k / min(k, number retrieved); 0 for
//!   an empty ranking (the same quantity as ir-measures' `Judged@k`). It tells how far the
//!   other numbers can be trusted when a change retrieves documents nobody has judged.
//!
//! A query with no judgments scores 0 on every metric.

use std::fmt;
use std::str::FromStr;

use rustc_hash::FxHashSet;
use serde::{Deserialize, Serialize};

use super::error::MetricsError;
use super::judgments::QueryJudgments;

/// A per-query measure of a ranking. Cut-offs are 1-based numbers of documents, at least 1.
///
/// Displayed and parsed as `P@10`, `R@10`, `F1@10`, `RR`, `RR@10`, `AP`, `AP@100`, `nDCG`,
/// `nDCG@10`, `JudgedShare@10` (names are parsed case-insensitively); serialized as that
/// string.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Metric {
    /// Precision at k.
    Precision(usize),
    /// Recall at k.
    Recall(usize),
    /// Harmonic mean of precision and recall at k.
    F1(usize),
    /// Reciprocal rank of the first relevant document, optionally within the top k.
    ReciprocalRank(Option<usize>),
    /// trec_eval average precision, optionally over the top k.
    AveragePrecision(Option<usize>),
    /// Normalized discounted cumulative gain, optionally at k.
    Ndcg(Option<usize>),
    /// Share of the top k (or of all retrieved, if fewer) that is judged.
    JudgedShare(usize),
}

impl Metric {
    /// The cut-off, if the metric has one.
    pub fn cutoff(self) -> Option<usize> {
        match self {
            Metric::Precision(k) | Metric::Recall(k) | Metric::F1(k) | Metric::JudgedShare(k) => {
                Some(k)
            }
            Metric::ReciprocalRank(k) | Metric::AveragePrecision(k) | Metric::Ndcg(k) => k,
        }
    }

    /// Checks that the cut-off, if any, is at least 1.
    pub fn validate(self) -> Result<(), MetricsError> {
        if self.cutoff() == Some(0) {
            return Err(MetricsError::InvalidParameter {
                name: "metric cut-off",
                message: format!("{self} has a cut-off of 0; cut-offs start at 1"),
            });
        }
        Ok(())
    }
}

impl fmt::Display for Metric {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let name = match self {
            Metric::Precision(_) => "P",
            Metric::Recall(_) => "R",
            Metric::F1(_) => "F1",
            Metric::ReciprocalRank(_) => "RR",
            Metric::AveragePrecision(_) => "AP",
            Metric::Ndcg(_) => "nDCG",
            Metric::JudgedShare(_) => "JudgedShare",
        };
        match self.cutoff() {
            Some(k) => write!(f, "{name}@{k}"),
            None => f.write_str(name),
        }
    }
}

impl FromStr for Metric {
    type Err = MetricsError;

    fn from_str(s: &str) -> Result<Self, Self::Err> {
        let unknown = || MetricsError::UnknownMetric(s.to_owned());
        let (name, k) = match s.trim().split_once('@') {
            Some((name, k)) => {
                let k: usize = k.trim().parse().map_err(|_| unknown())?;
                (name.trim(), Some(k))
            }
            None => (s.trim(), None),
        };
        let needs_k = |k: Option<usize>| k.ok_or_else(unknown);
        let metric = match name.to_ascii_lowercase().as_str() {
            "p" => Metric::Precision(needs_k(k)?),
            "r" => Metric::Recall(needs_k(k)?),
            "f1" => Metric::F1(needs_k(k)?),
            "rr" => Metric::ReciprocalRank(k),
            "ap" => Metric::AveragePrecision(k),
            "ndcg" => Metric::Ndcg(k),
            "judgedshare" => Metric::JudgedShare(needs_k(k)?),
            _ => return Err(unknown()),
        };
        metric.validate()?;
        Ok(metric)
    }
}

impl Serialize for Metric {
    fn serialize<S: serde::Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        serializer.collect_str(self)
    }
}

impl<'de> Deserialize<'de> for Metric {
    fn deserialize<D: serde::Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        let s = String::deserialize(deserializer)?;
        s.parse().map_err(serde::de::Error::custom)
    }
}

/// How a grade becomes a gain in nDCG.
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Gain {
    /// gain = grade (trec_eval and ir-measures `nDCG`). The default.
    #[default]
    Linear,
    /// gain = 2^grade − 1.
    Exponential,
}

impl Gain {
    /// The gain of a grade; grades ≤ 0 gain 0.
    pub fn of(self, grade: i32) -> f64 {
        if grade <= 0 {
            return 0.0;
        }
        match self {
            Gain::Linear => f64::from(grade),
            Gain::Exponential => 2f64.powi(grade) - 1.0,
        }
    }
}

/// Parameters shared by all metrics.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub struct EvalParams {
    /// The lowest grade that counts as relevant for P, R, F1, RR and AP (trec_eval's `-l`).
    /// At least 1. Default 1.
    pub relevance_threshold: i32,
    /// The nDCG gain. Default [`Gain::Linear`].
    pub gain: Gain,
}

impl Default for EvalParams {
    fn default() -> Self {
        Self {
            relevance_threshold: 1,
            gain: Gain::Linear,
        }
    }
}

impl EvalParams {
    /// Checks the threshold is at least 1 (grade 0 always means "judged non-relevant").
    pub fn validate(&self) -> Result<(), MetricsError> {
        if self.relevance_threshold < 1 {
            return Err(MetricsError::InvalidParameter {
                name: "relevance threshold",
                message: format!("{} is below 1", self.relevance_threshold),
            });
        }
        Ok(())
    }
}

/// One query's ranking resolved against its judgments, ready to compute any metric.
///
/// Building it costs one pass over the ranking and one sort of the judged gains; each metric
/// then costs at most one pass over the top k.
#[derive(Debug, Clone, PartialEq)]
pub struct QueryRanking {
    /// Per rank (0-based): relevant at the threshold?
    relevant: Vec<bool>,
    /// Per rank: judged?
    judged: Vec<bool>,
    /// Per rank: nDCG gain.
    gains: Vec<f64>,
    /// Relevant judged documents of the query (R).
    num_relevant: usize,
    /// All judged gains > 0, highest first.
    ideal_gains: Vec<f64>,
}

/// 1 / log2(rank + 1) for a 0-based index i, i.e. 1 / log2(i + 2).
fn discount(i: usize) -> f64 {
    1.0 / ((i + 2) as f64).log2()
}

impl QueryRanking {
    /// Resolves `ranking` (document ids, best first) against `judgments` (`None`: the query
    /// has none, and every metric is 0).
    pub fn new<D: AsRef<str>>(
        ranking: &[D],
        judgments: Option<&QueryJudgments>,
        params: &EvalParams,
    ) -> Self {
        let n = ranking.len();
        let mut out = QueryRanking {
            relevant: Vec::with_capacity(n),
            judged: Vec::with_capacity(n),
            gains: Vec::with_capacity(n),
            num_relevant: 0,
            ideal_gains: Vec::new(),
        };
        let mut seen: FxHashSet<&str> = FxHashSet::default();
        for doc in ranking {
            let doc = doc.as_ref();
            let grade = judgments.and_then(|j| j.grade(doc));
            let first = seen.insert(doc);
            out.judged.push(grade.is_some());
            let grade = if first { grade } else { None };
            out.relevant
                .push(grade.is_some_and(|g| g >= params.relevance_threshold));
            out.gains.push(grade.map_or(0.0, |g| params.gain.of(g)));
        }
        if let Some(j) = judgments {
            out.num_relevant = j.num_relevant(params.relevance_threshold);
            out.ideal_gains = j
                .iter()
                .map(|(_, g)| params.gain.of(g))
                .filter(|&g| g > 0.0)
                .collect();
            out.ideal_gains.sort_by(|a, b| b.total_cmp(a));
        }
        out
    }

    /// Number of ranked documents.
    pub fn len(&self) -> usize {
        self.relevant.len()
    }

    /// Whether nothing was retrieved.
    pub fn is_empty(&self) -> bool {
        self.relevant.is_empty()
    }

    /// R: the query's relevant judged documents, retrieved or not.
    pub fn num_relevant(&self) -> usize {
        self.num_relevant
    }

    fn top(&self, k: Option<usize>) -> usize {
        k.map_or(self.len(), |k| k.min(self.len()))
    }

    fn relevant_in_top(&self, k: usize) -> usize {
        self.relevant[..self.top(Some(k))]
            .iter()
            .filter(|&&r| r)
            .count()
    }

    /// P@k (0 for k = 0).
    pub fn precision(&self, k: usize) -> f64 {
        if k == 0 {
            return 0.0;
        }
        self.relevant_in_top(k) as f64 / k as f64
    }

    /// R@k (0 when the query has no relevant document).
    pub fn recall(&self, k: usize) -> f64 {
        if self.num_relevant == 0 {
            return 0.0;
        }
        self.relevant_in_top(k) as f64 / self.num_relevant as f64
    }

    /// F1@k.
    pub fn f1(&self, k: usize) -> f64 {
        let (p, r) = (self.precision(k), self.recall(k));
        if p + r == 0.0 {
            0.0
        } else {
            2.0 * p * r / (p + r)
        }
    }

    /// RR, or RR@k with `Some(k)`.
    pub fn reciprocal_rank(&self, cutoff: Option<usize>) -> f64 {
        self.relevant[..self.top(cutoff)]
            .iter()
            .position(|&r| r)
            .map_or(0.0, |i| 1.0 / (i + 1) as f64)
    }

    /// AP, or AP@k with `Some(k)` (both divide by R).
    pub fn average_precision(&self, cutoff: Option<usize>) -> f64 {
        if self.num_relevant == 0 {
            return 0.0;
        }
        let mut hits = 0usize;
        let mut sum = 0.0;
        for (i, _) in self.relevant[..self.top(cutoff)]
            .iter()
            .enumerate()
            .filter(|(_, r)| **r)
        {
            hits += 1;
            sum += hits as f64 / (i + 1) as f64;
        }
        sum / self.num_relevant as f64
    }

    /// nDCG, or nDCG@k with `Some(k)`.
    pub fn ndcg(&self, cutoff: Option<usize>) -> f64 {
        let ideal_len = cutoff.map_or(self.ideal_gains.len(), |k| k.min(self.ideal_gains.len()));
        let idcg: f64 = self.ideal_gains[..ideal_len]
            .iter()
            .enumerate()
            .map(|(i, g)| g * discount(i))
            .sum();
        if idcg <= 0.0 {
            return 0.0;
        }
        let dcg: f64 = self.gains[..self.top(cutoff)]
            .iter()
            .enumerate()
            .filter(|(_, g)| **g != 0.0)
            .map(|(i, g)| g * discount(i))
            .sum();
        dcg / idcg
    }

    /// JudgedShare@k.
    pub fn judged_share(&self, k: usize) -> f64 {
        let top = self.top(Some(k));
        if top == 0 {
            return 0.0;
        }
        self.judged[..top].iter().filter(|&&j| j).count() as f64 / top as f64
    }

    /// The value of any metric.
    pub fn value(&self, metric: Metric) -> f64 {
        match metric {
            Metric::Precision(k) => self.precision(k),
            Metric::Recall(k) => self.recall(k),
            Metric::F1(k) => self.f1(k),
            Metric::ReciprocalRank(k) => self.reciprocal_rank(k),
            Metric::AveragePrecision(k) => self.average_precision(k),
            Metric::Ndcg(k) => self.ndcg(k),
            Metric::JudgedShare(k) => self.judged_share(k),
        }
    }
}

/// Computes `metrics` for one query (the values in the order of `metrics`).
pub fn evaluate_query<D: AsRef<str>>(
    ranking: &[D],
    judgments: Option<&QueryJudgments>,
    metrics: &[Metric],
    params: &EvalParams,
) -> Vec<f64> {
    let q = QueryRanking::new(ranking, judgments, params);
    metrics.iter().map(|&m| q.value(m)).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn close(a: f64, b: f64) {
        assert!((a - b).abs() < 1e-12, "{a} != {b}");
    }

    /// A worked example, computed by hand by the author of this module (not taken from any
    /// publication).
    ///
    /// Ranking: d1 d2 d3 d4 d5. Judgments: d1=3, d2=0, d3=2, d5=1, d6=2 (d6 not retrieved),
    /// d4 unjudged. At threshold 1 the relevant documents are d1, d3, d5, d6: R = 4.
    fn example() -> (Vec<&'static str>, QueryJudgments) {
        let mut j = QueryJudgments::default();
        for (d, g) in [("d1", 3), ("d2", 0), ("d3", 2), ("d5", 1), ("d6", 2)] {
            j.insert(d, g);
        }
        (vec!["d1", "d2", "d3", "d4", "d5"], j)
    }

    #[test]
    fn worked_example_binary_metrics() {
        let (ranking, j) = example();
        let q = QueryRanking::new(&ranking, Some(&j), &EvalParams::default());
        assert_eq!(q.num_relevant(), 4);
        // Relevant at ranks 1, 3, 5.
        // P@3 = 2/3; P@10 = 3/10 (the divisor stays 10 although only 5 were retrieved).
        close(q.precision(3), 2.0 / 3.0);
        close(q.precision(10), 0.3);
        // R@3 = 2/4; R@5 = 3/4.
        close(q.recall(3), 0.5);
        close(q.recall(5), 0.75);
        // F1@3 = 2 * (2/3) * (1/2) / (2/3 + 1/2) = (2/3) / (7/6) = 4/7.
        close(q.f1(3), 4.0 / 7.0);
        close(q.reciprocal_rank(None), 1.0);
        // AP = (P@1 + P@3 + P@5) / R = (1 + 2/3 + 3/5) / 4 = (34/15) / 4 = 17/30.
        close(q.average_precision(None), 17.0 / 30.0);
        // AP@3 = (1 + 2/3) / 4 = 5/12 (still divided by R).
        close(q.average_precision(Some(3)), 5.0 / 12.0);
        // JudgedShare@5 = 4/5 (d4 is unjudged); @10 also 4/5 (only 5 were retrieved).
        close(q.judged_share(5), 0.8);
        close(q.judged_share(10), 0.8);
    }

    #[test]
    fn worked_example_threshold_2() {
        let (ranking, j) = example();
        let params = EvalParams {
            relevance_threshold: 2,
            ..EvalParams::default()
        };
        let q = QueryRanking::new(&ranking, Some(&j), &params);
        // Relevant: d1, d3, d6 (R = 3); retrieved at ranks 1 and 3.
        // AP = (1/1 + 2/3) / 3 = 5/9.
        close(q.average_precision(None), 5.0 / 9.0);
        close(q.recall(5), 2.0 / 3.0);
        close(q.precision(5), 0.4);
    }

    #[test]
    fn worked_example_ndcg() {
        let (ranking, j) = example();
        let q = QueryRanking::new(&ranking, Some(&j), &EvalParams::default());
        let l = f64::log2;
        // Linear gains by rank: 3, 0, 2, 0, 1.
        // DCG@3 = 3/log2(2) + 0 + 2/log2(4) = 3 + 1 = 4.
        // Ideal gains (all judged): 3, 2, 2, 1, 0.
        // IDCG@3 = 3 + 2/log2(3) + 2/log2(4) = 4 + 1.2618595071429148 = 5.2618595071429155.
        // nDCG@3 = 4 / 5.2618595071429155 = 0.76018753343...
        close(q.ndcg(Some(3)), 4.0 / (3.0 + 2.0 / l(3.0) + 1.0));
        close(q.ndcg(Some(3)), 0.760_187_533_431_868_5);
        // DCG@5 = 4 + 1/log2(6) = 4.386852807234542; IDCG@5 = 5.2618595 + 1/log2(5)
        //       = 5.692536065216308; nDCG@5 = 0.77063241356...
        let dcg5 = 4.0 + 1.0 / l(6.0);
        let idcg5 = 3.0 + 2.0 / l(3.0) + 1.0 + 1.0 / l(5.0);
        close(q.ndcg(Some(5)), dcg5 / idcg5);
        // No cut-off: same as @5 here, as the ideal list has 4 non-zero gains.
        close(q.ndcg(None), dcg5 / idcg5);

        // Exponential gains 2^g - 1 by rank: 7, 0, 3, 0, 1; ideal 7, 3, 3, 1.
        // DCG@3 = 7 + 3/2 = 8.5; IDCG@3 = 7 + 3/log2(3) + 3/2 = 10.392789260714373;
        // nDCG@3 = 8.5 / 10.392789260714373 = 0.81787475785...
        let params = EvalParams {
            gain: Gain::Exponential,
            ..EvalParams::default()
        };
        let q = QueryRanking::new(&ranking, Some(&j), &params);
        close(q.ndcg(Some(3)), 8.5 / (8.5 + 3.0 / l(3.0)));
        close(q.ndcg(Some(3)), 0.817_874_757_850_688_1);
    }

    #[test]
    fn no_relevant_and_no_judgments_score_zero() {
        let mut j = QueryJudgments::default();
        j.insert("a", 0);
        j.insert("b", -1);
        for judged in [Some(&j), None] {
            let q = QueryRanking::new(&["a", "b"], judged, &EvalParams::default());
            for m in ["P@1", "R@5", "F1@5", "RR", "AP", "AP@1", "nDCG@5", "nDCG"] {
                assert_eq!(q.value(m.parse().unwrap()), 0.0, "{m}");
            }
        }
    }

    #[test]
    fn empty_ranking_scores_zero() {
        let (_, j) = example();
        let empty: [&str; 0] = [];
        let q = QueryRanking::new(&empty, Some(&j), &EvalParams::default());
        for m in [
            "P@1",
            "R@5",
            "F1@5",
            "RR",
            "RR@3",
            "AP",
            "nDCG@5",
            "nDCG",
            "JudgedShare@3",
        ] {
            assert_eq!(q.value(m.parse().unwrap()), 0.0, "{m}");
        }
    }

    #[test]
    fn reciprocal_rank_cutoff() {
        let mut j = QueryJudgments::default();
        j.insert("c", 1);
        let q = QueryRanking::new(&["a", "b", "c"], Some(&j), &EvalParams::default());
        close(q.reciprocal_rank(None), 1.0 / 3.0);
        close(q.reciprocal_rank(Some(3)), 1.0 / 3.0);
        close(q.reciprocal_rank(Some(2)), 0.0);
    }

    #[test]
    fn repeated_documents_count_once() {
        let mut j = QueryJudgments::default();
        j.insert("a", 2);
        j.insert("b", 1);
        let q = QueryRanking::new(&["a", "a", "b"], Some(&j), &EvalParams::default());
        close(q.precision(2), 0.5);
        close(q.recall(3), 1.0);
        // AP = (1/1 + 2/3) / 2.
        close(q.average_precision(None), (1.0 + 2.0 / 3.0) / 2.0);
        // DCG = 2 + 0 + 1/log2(4); IDCG = 2 + 1/log2(3).
        close(q.ndcg(None), 2.5 / (2.0 + 1.0 / 3f64.log2()));
    }

    #[test]
    fn perfect_ranking_scores_one() {
        let (_, j) = example();
        let q = QueryRanking::new(&["d1", "d3", "d6", "d5"], Some(&j), &EvalParams::default());
        close(q.average_precision(None), 1.0);
        close(q.ndcg(Some(2)), 1.0);
        close(q.ndcg(None), 1.0);
        close(q.recall(4), 1.0);
    }

    #[test]
    fn metric_names_round_trip() {
        for s in [
            "P@10",
            "R@1",
            "F1@5",
            "RR",
            "RR@10",
            "AP",
            "AP@100",
            "nDCG",
            "nDCG@20",
            "JudgedShare@10",
        ] {
            let m: Metric = s.parse().unwrap();
            assert_eq!(m.to_string(), s);
            assert_eq!(serde_json::to_string(&m).unwrap(), format!("\"{s}\""));
            let back: Metric = serde_json::from_str(&format!("\"{s}\"")).unwrap();
            assert_eq!(back, m);
        }
        assert_eq!("ndcg@5".parse::<Metric>().unwrap(), Metric::Ndcg(Some(5)));
        assert_eq!(" p @ 3 ".parse::<Metric>().unwrap(), Metric::Precision(3));
        for bad in ["P", "P@0", "nDCG@x", "MAP", "", "R@-1"] {
            assert!(bad.parse::<Metric>().is_err(), "{bad}");
        }
    }

    #[test]
    fn threshold_must_be_positive() {
        let p = EvalParams {
            relevance_threshold: 0,
            ..EvalParams::default()
        };
        assert!(p.validate().is_err());
        assert!(EvalParams::default().validate().is_ok());
    }
}
