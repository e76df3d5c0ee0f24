//! Before/after comparison of two metric sets over the same queries.

use serde::{Deserialize, Serialize};

use super::aggregate::MetricSet;
use super::error::MetricsError;
use super::ranked::Metric;
use super::significance::{PairedTest, RandomizationTest, ZERO_DIFFERENCE};

/// How one metric moved between two evaluations of the same queries.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct MetricComparison {
    /// The metric.
    pub metric: Metric,
    /// Mean before.
    pub before: f64,
    /// Mean after.
    pub after: f64,
    /// `after − before`.
    pub difference: f64,
    /// Queries whose value went up (by more than [`ZERO_DIFFERENCE`]).
    pub improved: usize,
    /// Queries whose value went down (by more than [`ZERO_DIFFERENCE`]).
    pub worsened: usize,
    /// Queries whose value did not move.
    pub unchanged: usize,
    /// The paired randomization test of the per-query differences.
    pub significance: PairedTest,
    /// `after − before` per query, in the order of [`Comparison::queries`].
    pub per_query_difference: Vec<f64>,
}

/// The comparison of two [`MetricSet`]s: the result of [`compare`].
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Comparison {
    /// The paired queries, sorted.
    pub queries: Vec<String>,
    /// The test settings used.
    pub test: RandomizationTest,
    /// One entry per metric, in the order of the metric sets.
    pub metrics: Vec<MetricComparison>,
}

impl Comparison {
    /// The comparison of `metric`, if both sets have it.
    pub fn metric(&self, metric: Metric) -> Option<&MetricComparison> {
        self.metrics.iter().find(|m| m.metric == metric)
    }

    /// The queries of `metric` whose value changed, with their differences, largest drop
    /// first (ties by query id).
    pub fn changed_queries(&self, metric: Metric) -> Vec<(&str, f64)> {
        let Some(m) = self.metric(metric) else {
            return Vec::new();
        };
        let mut out: Vec<(&str, f64)> = self
            .queries
            .iter()
            .map(String::as_str)
            .zip(m.per_query_difference.iter().copied())
            .filter(|(_, d)| d.abs() > ZERO_DIFFERENCE)
            .collect();
        out.sort_by(|a, b| a.1.total_cmp(&b.1).then_with(|| a.0.cmp(b.0)));
        out
    }
}

/// Compares `after` with `before`, query by query, with a paired randomization test per
/// metric.
///
/// Both sets must come from the same queries, metrics (in the same order), parameters and
/// scope. With [`super::QueryScope::Judged`] (the default) they always have the same
/// queries when evaluated against the same judgments.
pub fn compare(
    before: &MetricSet,
    after: &MetricSet,
    test: &RandomizationTest,
) -> Result<Comparison, MetricsError> {
    test.validate()?;
    if before.params != after.params || before.scope != after.scope {
        return Err(MetricsError::Incomparable(
            "they were evaluated with different parameters or query scopes".into(),
        ));
    }
    if before.queries != after.queries {
        let only_before: Vec<&str> = before
            .queries
            .iter()
            .filter(|q| after.queries.binary_search(q).is_err())
            .map(String::as_str)
            .collect();
        let only_after: Vec<&str> = after
            .queries
            .iter()
            .filter(|q| before.queries.binary_search(q).is_err())
            .map(String::as_str)
            .collect();
        let show = |v: &[&str]| {
            let mut s = v.iter().take(5).copied().collect::<Vec<_>>().join(", ");
            if v.len() > 5 {
                s.push_str(&format!(" and {} more", v.len() - 5));
            }
            if s.is_empty() { "none".to_owned() } else { s }
        };
        return Err(MetricsError::Incomparable(format!(
            "different queries (only before: {}; only after: {}); evaluate both with the \
             judged-queries scope",
            show(&only_before),
            show(&only_after)
        )));
    }
    let names = |s: &MetricSet| s.metrics.iter().map(|m| m.metric).collect::<Vec<_>>();
    if names(before) != names(after) {
        return Err(MetricsError::Incomparable(
            "they hold different metrics".into(),
        ));
    }

    let metrics = before
        .metrics
        .iter()
        .zip(&after.metrics)
        .map(|(b, a)| {
            let significance = test.paired(&b.per_query, &a.per_query)?;
            let per_query_difference: Vec<f64> = b
                .per_query
                .iter()
                .zip(&a.per_query)
                .map(|(x, y)| y - x)
                .collect();
            let improved = per_query_difference
                .iter()
                .filter(|d| **d > ZERO_DIFFERENCE)
                .count();
            let worsened = per_query_difference
                .iter()
                .filter(|d| **d < -ZERO_DIFFERENCE)
                .count();
            Ok(MetricComparison {
                metric: b.metric,
                before: b.mean,
                after: a.mean,
                difference: a.mean - b.mean,
                improved,
                worsened,
                unchanged: per_query_difference.len() - improved - worsened,
                significance,
                per_query_difference,
            })
        })
        .collect::<Result<Vec<_>, MetricsError>>()?;
    Ok(Comparison {
        queries: before.queries.clone(),
        test: *test,
        metrics,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::metrics::{EvalConfig, Judgments, QueryScope, evaluate};

    fn judgments() -> Judgments {
        let mut j = Judgments::new();
        for q in ["q1", "q2", "q3"] {
            j.insert(q, "good", 1);
            j.insert(q, "bad", 0);
        }
        j
    }

    #[test]
    fn compares_before_and_after() {
        let config = EvalConfig::new(vec![Metric::ReciprocalRank(None), Metric::Precision(1)]);
        let before = vec![
            ("q1", vec!["bad", "good"]),
            ("q2", vec!["good"]),
            ("q3", vec!["good"]),
        ];
        let after = vec![("q1", vec!["good"]), ("q2", vec!["good"]), ("q3", vec![])];
        let b = evaluate(before, &judgments(), &config).unwrap();
        let a = evaluate(after, &judgments(), &config).unwrap();
        let c = compare(&b, &a, &RandomizationTest::default()).unwrap();
        assert_eq!(c.queries, ["q1", "q2", "q3"]);
        let rr = c.metric(Metric::ReciprocalRank(None)).unwrap();
        // Before: 0.5, 1, 1; after: 1, 1, 0.
        assert_eq!(rr.per_query_difference, [0.5, 0.0, -1.0]);
        assert_eq!((rr.improved, rr.worsened, rr.unchanged), (1, 1, 1));
        assert!((rr.difference - (-0.5 / 3.0)).abs() < 1e-15);
        // Non-zero differences 0.5 and -1: signed sums ±1.5, ±0.5; |observed| = 0.5: p = 1.
        assert_eq!(rr.significance.p_value, 1.0);
        assert_eq!(rr.significance.num_queries, 3);
        assert_eq!(
            c.changed_queries(Metric::ReciprocalRank(None)),
            [("q3", -1.0), ("q1", 0.5)]
        );
        let json = serde_json::to_value(&c).unwrap();
        assert_eq!(
            json["metrics"][0]["significance"]["method"]["kind"],
            "exact"
        );
    }

    #[test]
    fn refuses_unpaired_sets() {
        let config = EvalConfig {
            scope: QueryScope::JudgedAndRetrieved,
            ..EvalConfig::new(vec![Metric::Precision(1)])
        };
        let b = evaluate(vec![("q1", vec!["good"])], &judgments(), &config).unwrap();
        let a = evaluate(vec![("q2", vec!["good"])], &judgments(), &config).unwrap();
        let e = compare(&b, &a, &RandomizationTest::default()).unwrap_err();
        assert!(
            e.to_string().contains("only before: q1; only after: q2"),
            "{e}"
        );
        let other = evaluate(
            vec![("q1", vec!["good"])],
            &judgments(),
            &EvalConfig::new(vec![Metric::Precision(1)]),
        )
        .unwrap();
        assert!(compare(&b, &other, &RandomizationTest::default()).is_err());
    }
}
