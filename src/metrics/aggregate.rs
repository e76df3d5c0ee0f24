//! Evaluating many queries at once: per-query values and their means.
//!
//! Which queries count is set by [`QueryScope`]:
//!
//! * [`QueryScope::Judged`] (the default) evaluates **every query that has judgments**. A
//!   judged query with no ranking, or an empty one, scores 0 on every metric and is listed
//!   in [`MetricSet::no_results`]. This is what `trec_eval -c` does, and what ir-measures
//!   reports; it is also what a before/after comparison needs, since both sides then have
//!   the same queries even when a change empties a result list.
//! * [`QueryScope::JudgedAndRetrieved`] evaluates only judged queries with at least one
//!   result (`trec_eval` without `-c`).
//!
//! Either way, rankings of queries without judgments are not evaluated; they are listed in
//! [`MetricSet::unjudged`]. A judged query none of whose documents is relevant still counts
//! (it scores 0 on every metric), as in trec_eval. The mean over no queries is 0.

use rustc_hash::{FxHashMap, FxHashSet};
use serde::{Deserialize, Serialize};

use super::error::MetricsError;
use super::judgments::Judgments;
use super::ranked::{EvalParams, Metric, QueryRanking};

/// Which queries are evaluated and averaged.
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum QueryScope {
    /// All judged queries; those without results score 0 (`trec_eval -c`).
    #[default]
    Judged,
    /// Judged queries with at least one result.
    JudgedAndRetrieved,
}

/// What to evaluate.
#[derive(Debug, Clone, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(default)]
pub struct EvalConfig {
    /// The metrics, in report order.
    pub metrics: Vec<Metric>,
    /// Relevance threshold and nDCG gain.
    pub params: EvalParams,
    /// Which queries count.
    pub scope: QueryScope,
}

impl Default for EvalConfig {
    /// P@10, R@10, RR, AP, nDCG@10 and JudgedShare@10, with default parameters and scope.
    fn default() -> Self {
        Self::new(vec![
            Metric::Precision(10),
            Metric::Recall(10),
            Metric::ReciprocalRank(None),
            Metric::AveragePrecision(None),
            Metric::Ndcg(Some(10)),
            Metric::JudgedShare(10),
        ])
    }
}

impl EvalConfig {
    /// The given metrics with default parameters and scope.
    pub fn new(metrics: Vec<Metric>) -> Self {
        Self {
            metrics,
            params: EvalParams::default(),
            scope: QueryScope::default(),
        }
    }

    /// Checks the parameters and every metric's cut-off.
    pub fn validate(&self) -> Result<(), MetricsError> {
        self.params.validate()?;
        self.metrics.iter().try_for_each(|m| m.validate())
    }
}

/// One metric over all evaluated queries.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct MetricScores {
    /// The metric.
    pub metric: Metric,
    /// The mean of `per_query` (0 when there are no queries).
    pub mean: f64,
    /// One value per query, in the order of [`MetricSet::queries`].
    pub per_query: Vec<f64>,
}

/// Per-query values and means of several metrics: the result of [`evaluate`].
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct MetricSet {
    /// The parameters used.
    pub params: EvalParams,
    /// The query scope used.
    pub scope: QueryScope,
    /// The evaluated query ids, sorted; `per_query` vectors follow this order.
    pub queries: Vec<String>,
    /// Judged queries with no (or an empty) ranking: scored 0 under [`QueryScope::Judged`],
    /// left out under [`QueryScope::JudgedAndRetrieved`]. Sorted.
    pub no_results: Vec<String>,
    /// Queries ranked but not judged, hence not evaluated. Sorted.
    pub unjudged: Vec<String>,
    /// One entry per metric, in the order of [`EvalConfig::metrics`].
    pub metrics: Vec<MetricScores>,
}

impl MetricSet {
    /// The scores of `metric`, if it was evaluated.
    pub fn scores(&self, metric: Metric) -> Option<&MetricScores> {
        self.metrics.iter().find(|s| s.metric == metric)
    }

    /// The mean of `metric`, if it was evaluated.
    pub fn mean(&self, metric: Metric) -> Option<f64> {
        self.scores(metric).map(|s| s.mean)
    }

    /// The value of `metric` for `query`, if both were evaluated.
    pub fn value(&self, query: &str, metric: Metric) -> Option<f64> {
        let i = self
            .queries
            .binary_search_by(|q| q.as_str().cmp(query))
            .ok()?;
        self.scores(metric).map(|s| s.per_query[i])
    }

    /// Number of evaluated queries.
    pub fn num_queries(&self) -> usize {
        self.queries.len()
    }
}

fn mean(values: &[f64]) -> f64 {
    if values.is_empty() {
        0.0
    } else {
        values.iter().sum::<f64>() / values.len() as f64
    }
}

/// Evaluates rankings (query id → document ids, best first) against judgments.
///
/// `rankings` is anything that iterates over (query id, ranking) pairs, e.g.
/// `&BTreeMap<String, Vec<String>>` or a `Vec<(&str, Vec<&str>)>`. A query id given twice
/// is an error.
pub fn evaluate<I, Q, L, D>(
    rankings: I,
    judgments: &Judgments,
    config: &EvalConfig,
) -> Result<MetricSet, MetricsError>
where
    I: IntoIterator<Item = (Q, L)>,
    Q: AsRef<str>,
    L: AsRef<[D]>,
    D: AsRef<str>,
{
    config.validate()?;
    let mut values: FxHashMap<String, Vec<f64>> = FxHashMap::default();
    let mut unjudged = Vec::new();
    let mut seen = FxHashSet::default();
    for (query, ranking) in rankings {
        let query = query.as_ref();
        if !seen.insert(query.to_owned()) {
            return Err(MetricsError::DuplicateRanking(query.to_owned()));
        }
        let Some(judged) = judgments.query(query) else {
            unjudged.push(query.to_owned());
            continue;
        };
        let ranking = ranking.as_ref();
        if ranking.is_empty() {
            continue; // listed in `no_results` below
        }
        let q = QueryRanking::new(ranking, Some(judged), &config.params);
        values.insert(
            query.to_owned(),
            config.metrics.iter().map(|&m| q.value(m)).collect(),
        );
    }
    unjudged.sort();

    let mut queries = Vec::new();
    let mut no_results = Vec::new();
    let mut columns: Vec<Vec<f64>> = vec![Vec::new(); config.metrics.len()];
    for query in judgments.query_ids() {
        match values.get(query) {
            Some(row) => {
                queries.push(query.to_owned());
                for (column, v) in columns.iter_mut().zip(row) {
                    column.push(*v);
                }
            }
            None => {
                no_results.push(query.to_owned());
                if config.scope == QueryScope::Judged {
                    queries.push(query.to_owned());
                    for column in &mut columns {
                        column.push(0.0);
                    }
                }
            }
        }
    }

    let metrics = config
        .metrics
        .iter()
        .zip(columns)
        .map(|(&metric, per_query)| MetricScores {
            metric,
            mean: mean(&per_query),
            per_query,
        })
        .collect();
    Ok(MetricSet {
        params: config.params,
        scope: config.scope,
        queries,
        no_results,
        unjudged,
        metrics,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::collections::BTreeMap;

    fn judgments() -> Judgments {
        let mut j = Judgments::new();
        j.insert("q1", "a", 1);
        j.insert("q1", "b", 0);
        j.insert("q2", "c", 2);
        j.insert("q3", "d", 0); // judged, nothing relevant
        j
    }

    #[test]
    fn judged_scope_scores_missing_queries_zero() {
        let mut runs: BTreeMap<String, Vec<String>> = BTreeMap::new();
        runs.insert("q1".into(), vec!["b".into(), "a".into()]);
        runs.insert("q3".into(), vec!["d".into()]);
        runs.insert("q9".into(), vec!["a".into()]); // not judged
        let config = EvalConfig::new(vec![Metric::ReciprocalRank(None), Metric::Precision(1)]);
        let set = evaluate(&runs, &judgments(), &config).unwrap();
        assert_eq!(set.queries, ["q1", "q2", "q3"]);
        assert_eq!(set.no_results, ["q2"]);
        assert_eq!(set.unjudged, ["q9"]);
        let rr = set.scores(Metric::ReciprocalRank(None)).unwrap();
        assert_eq!(rr.per_query, [0.5, 0.0, 0.0]);
        assert!((rr.mean - 0.5 / 3.0).abs() < 1e-15);
        assert_eq!(set.value("q1", Metric::ReciprocalRank(None)), Some(0.5));
        assert_eq!(set.value("q9", Metric::ReciprocalRank(None)), None);
        assert_eq!(set.mean(Metric::Precision(1)), Some(0.0));
        assert_eq!(set.mean(Metric::Precision(2)), None);
    }

    #[test]
    fn retrieved_scope_drops_missing_queries() {
        let runs = vec![("q1", vec!["a"]), ("q2", vec![])];
        let config = EvalConfig {
            scope: QueryScope::JudgedAndRetrieved,
            ..EvalConfig::new(vec![Metric::AveragePrecision(None)])
        };
        let set = evaluate(runs, &judgments(), &config).unwrap();
        assert_eq!(set.queries, ["q1"]);
        assert_eq!(set.no_results, ["q2", "q3"]);
        assert_eq!(set.metrics[0].mean, 1.0);
    }

    #[test]
    fn no_queries_mean_zero() {
        let runs: Vec<(&str, Vec<&str>)> = vec![];
        let set = evaluate(runs, &Judgments::new(), &EvalConfig::default()).unwrap();
        assert!(set.queries.is_empty());
        assert!(set.metrics.iter().all(|m| m.mean == 0.0));
    }

    #[test]
    fn rejects_duplicates_and_bad_config() {
        let runs = vec![("q1", vec!["a"]), ("q1", vec!["b"])];
        assert!(matches!(
            evaluate(runs, &judgments(), &EvalConfig::default()),
            Err(MetricsError::DuplicateRanking(q)) if q == "q1"
        ));
        let runs = vec![("q1", vec!["a"])];
        let config = EvalConfig::new(vec![Metric::Precision(0)]);
        assert!(evaluate(runs, &judgments(), &config).is_err());
    }

    #[test]
    fn serializes_to_json() {
        let runs = vec![("q1", vec!["a"])];
        let config = EvalConfig::new(vec![Metric::Ndcg(Some(10))]);
        let set = evaluate(runs, &judgments(), &config).unwrap();
        let json = serde_json::to_value(&set).unwrap();
        assert_eq!(json["metrics"][0]["metric"], "nDCG@10");
        assert_eq!(json["params"]["gain"], "linear");
        assert_eq!(json["scope"], "judged");
        let back: MetricSet = serde_json::from_value(json).unwrap();
        assert_eq!(back, set);
    }
}
