//! Judged retrieval quality: how good a set of rankings is, and whether a change made it
//! better or worse.
//!
//! The pieces, one module each:
//!
//! * [`judgments`]: graded relevance judgments ([`Judgments`], query id → document id →
//!   grade) and query texts ([`Queries`]), read from TREC qrels, CSV
//!   (`query_id,query,doc_id,relevance`) or a `QUERY_ID<TAB>TEXT` queries file.
//! * [`run`]: TREC run files read into [`Rankings`], ordered as trec_eval orders them.
//! * [`ranked`]: per-query metrics of one ranking: P@k, R@k, F1@k, RR (optionally @k),
//!   AP (optionally @k), nDCG (optionally @k, linear or exponential gain) and
//!   JudgedShare@k (the share of the top k that is judged).
//!   The module documentation states every definition and edge case; they follow
//!   trec_eval as exposed by the `ir-measures` Python package, which
//!   `tests/metrics_reference.rs` checks them against.
//! * [`aggregate`]: [`evaluate`] turns rankings of many queries into a [`MetricSet`] of
//!   per-query values and means. By default every judged query counts, a judged query with
//!   no results scoring 0 (`trec_eval -c`).
//! * [`significance`]: the paired randomization test of a mean difference.
//! * [`compare`](mod@compare): [`compare()`] pairs a before and an after [`MetricSet`] into a
//!   [`Comparison`] with a test per metric.
//! * [`rbo`]: rank-biased overlap of two rankings, which says how much a change moved the
//!   results regardless of judgments.
//!
//! Nothing here prints; every failure is a [`MetricsError`].
//!
//! ```
//! # use lexdelta::metrics::*;
//! let mut judgments = Judgments::new();
//! judgments.insert("q1", "doc-a", 2);
//! judgments.insert("q1", "doc-b", 0);
//! let config = EvalConfig::new(vec!["nDCG@10".parse()?, Metric::ReciprocalRank(None)]);
//! let before = evaluate([("q1", vec!["doc-b", "doc-a"])], &judgments, &config)?;
//! let after = evaluate([("q1", vec!["doc-a", "doc-b"])], &judgments, &config)?;
//! let cmp = compare(&before, &after, &RandomizationTest::default())?;
//! assert_eq!(cmp.metrics[1].difference, 0.5); // RR went from 1/2 to 1
//! # Ok::<(), MetricsError>(())
//! ```

pub mod aggregate;
pub mod compare;
pub mod error;
pub mod judgments;
pub mod ranked;
pub mod rbo;
pub mod run;
pub mod significance;

pub use aggregate::{EvalConfig, MetricScores, MetricSet, QueryScope, evaluate};
pub use compare::{Comparison, MetricComparison, compare};
pub use error::{MetricsError, ParseErrorKind};
pub use judgments::{
    Judgments, Queries, QueryJudgments, QueryText, parse_csv_judgments, parse_queries,
    parse_trec_qrels, read_csv_judgments, read_queries, read_trec_qrels,
};
pub use ranked::{EvalParams, Gain, Metric, QueryRanking, evaluate_query};
pub use rbo::{DEFAULT_RBO_P, rbo_ext};
pub use run::{Rankings, parse_trec_run, read_trec_run};
pub use significance::{
    PairedTest, RandomizationTest, TestMethod, ZERO_DIFFERENCE, paired_randomization_test,
};
