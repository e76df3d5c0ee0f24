//! Judged quality: both sides' rankings of the judged queries scored against the
//! judgments, and the paired randomization test of each metric's mean difference.

use rustc_hash::{FxHashMap, FxHashSet};

use super::fold::JudgedRanking;
use super::report::{JudgedMove, JudgedQuery, MetricRow, Quality, QueryChange};
use super::{JudgedSet, PreviewOptions, metric_list};
use crate::metrics::{self, EvalConfig, Judgments, Metric, MetricsError};

pub(super) fn quality(
    judged: &JudgedSet,
    rankings: &[JudgedRanking],
    options: &PreviewOptions,
) -> Result<Quality, MetricsError> {
    let with_text: FxHashSet<&str> = rankings.iter().map(|r| r.0.as_str()).collect();
    let mut judgments = Judgments::new();
    let mut without_text = Vec::new();
    for (qid, qj) in judged.judgments.iter() {
        if !with_text.contains(qid) {
            without_text.push(qid.to_string());
            continue;
        }
        for (doc, grade) in qj.iter() {
            judgments.insert(qid, doc, grade);
        }
    }
    let config = EvalConfig::new(metric_list(options.depth));
    let before = metrics::evaluate(
        rankings.iter().map(|r| (r.0.as_str(), r.1.as_slice())),
        &judgments,
        &config,
    )?;
    let after = metrics::evaluate(
        rankings.iter().map(|r| (r.0.as_str(), r.2.as_slice())),
        &judgments,
        &config,
    )?;
    let cmp = metrics::compare(&before, &after, &options.test)?;
    let text_of: FxHashMap<&str, &str> = judged
        .texts
        .iter()
        .map(|q| (q.id.as_str(), q.text.as_str()))
        .collect();
    let per_query = before
        .queries
        .iter()
        .map(|qid| JudgedQuery {
            qid: qid.clone(),
            query: text_of.get(qid.as_str()).unwrap_or(&"").to_string(),
            before: config
                .metrics
                .iter()
                .map(|&m| before.value(qid, m).unwrap_or(0.0))
                .collect(),
            after: config
                .metrics
                .iter()
                .map(|&m| after.value(qid, m).unwrap_or(0.0))
                .collect(),
        })
        .collect();
    let test = &options.test;
    Ok(Quality {
        judged_queries: before.queries.len(),
        averaging: format!(
            "each mean is over the {} judged queries with a text; a judged query that finds \
             nothing, or that has no relevant judgment, counts with 0 (as trec_eval -c \
             counts it); rankings are evaluated to depth {}",
            before.queries.len(),
            options.depth
        ),
        without_text,
        test: format!(
            "Fisher's randomization test, paired, two-sided (Smucker, Allan & Carterette 2007, \
             \"A Comparison of Statistical Significance Tests for Information Retrieval \
             Evaluation\"): every sign assignment when at most {} queries differ, otherwise \
             {} random assignments from seed {}",
            test.exact_limit, test.trials, test.seed
        ),
        metrics: cmp
            .metrics
            .iter()
            .map(|m| MetricRow {
                metric: m.metric,
                before: m.before,
                after: m.after,
                difference: m.difference,
                improved: m.improved,
                worsened: m.worsened,
                p_value: m.significance.p_value,
                method: m.significance.method,
            })
            .collect(),
        per_query,
    })
}

/// Gives every changed judged query its nDCG@10 on both sides.
pub(super) fn mark_judged(changes: &mut [QueryChange], quality: &Quality) {
    let Some(at) = quality
        .metrics
        .iter()
        .position(|m| matches!(m.metric, Metric::Ndcg(_)))
    else {
        return;
    };
    let metric = quality.metrics[at].metric;
    let by_qid: FxHashMap<&str, &JudgedQuery> = quality
        .per_query
        .iter()
        .map(|q| (q.qid.as_str(), q))
        .collect();
    for change in changes {
        if let Some(q) = change.qid.as_deref().and_then(|id| by_qid.get(id)) {
            change.judged = Some(JudgedMove {
                metric,
                before: q.before[at],
                after: q.after[at],
            });
        }
    }
}
