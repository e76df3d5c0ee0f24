//! Reviewing a rule change like code: the rule-level diff, lint on the head, the preview of
//! base → head on the sample, and the gate — one [`ReviewReport`] that the text, Markdown,
//! JSON and HTML renderers share.

pub mod diff;
pub mod gate;

use std::sync::Arc;

use serde::Serialize;

pub use diff::{RuleDiff, diff};
pub use gate::{GateLimits, GateOutcome};

use crate::analysis::Analyzer;
use crate::corpus::{Corpus, QueryLog};
use crate::index::Progress;
use crate::lint::{self, LintConfig, LintInput, LintReport, Vocabulary};
use crate::metrics::Metric;
use crate::preview::{
    self, JudgedSet, Label, PreviewError, PreviewInput, PreviewOptions, PreviewReport, Runs,
};
use crate::severity::Severity;

/// What a review compares, and on what.
pub struct ReviewInput<'a> {
    pub base: Arc<Analyzer>,
    pub head: Arc<Analyzer>,
    pub corpus: &'a Corpus,
    pub queries: &'a QueryLog,
    pub judged: Option<JudgedSet>,
    pub lint: &'a LintConfig,
    /// Limits given on the command line; they override the base ruleset's `gate:`.
    pub limits: GateLimits,
}

/// Everything a reviewer needs, in one value.
#[derive(Clone, Debug, Serialize)]
pub struct ReviewReport {
    pub notice: String,
    pub base: String,
    pub head: String,
    pub diff: RuleDiff,
    pub lint: LintReport,
    pub preview: PreviewReport,
    pub gate: GateOutcome,
    /// Whether the head changes the gate limits (reviewers should look at that too).
    pub gate_changed: bool,
}

pub struct ReviewOutcome {
    pub report: ReviewReport,
    pub runs: Option<Runs>,
}

/// Runs lint on the head, the preview of base → head, and the gate.
pub fn review(
    input: ReviewInput<'_>,
    options: &PreviewOptions,
    progress: &dyn Progress,
) -> Result<ReviewOutcome, PreviewError> {
    let (base_rules, head_rules) = (input.base.ruleset(), input.head.ruleset());
    let rule_diff = diff(base_rules, head_rules);
    let vocabulary = vocabulary_of(&input.head, input.corpus, input.queries);
    let lint_report = lint::lint(
        &input.head,
        &LintInput {
            vocabulary: Some(&vocabulary),
            base: Some(base_rules),
            config: input.lint,
        },
    );
    let limits = base_rules.gate.limits.clone().overridden_by(&input.limits);
    let gate_changed = head_rules.gate.limits != base_rules.gate.limits;
    let outcome = preview::run(
        PreviewInput {
            base: Arc::clone(&input.base),
            head: Arc::clone(&input.head),
            corpus: input.corpus,
            queries: input.queries,
            judged: input.judged,
        },
        options,
        progress,
    )?;
    let gate = gate::check(&limits, &gate_input(&outcome.report, &lint_report));
    Ok(ReviewOutcome {
        report: ReviewReport {
            notice: outcome.report.notice.clone(),
            base: base_rules.source.clone(),
            head: head_rules.source.clone(),
            diff: rule_diff,
            lint: lint_report,
            preview: outcome.report,
            gate,
            gate_changed,
        },
        runs: outcome.runs,
    })
}

/// The head's view of the sample's vocabulary, for lint's corpus-aware checks.
fn vocabulary_of(analyzer: &Analyzer, corpus: &Corpus, queries: &QueryLog) -> Vocabulary {
    Vocabulary::from_corpus(analyzer.surface(), Some(corpus), Some(queries))
}

fn gate_input(preview: &PreviewReport, lint: &LintReport) -> gate::GateInput {
    let emptied = preview
        .queries
        .iter()
        .filter(|q| q.label == Label::Emptied)
        .map(|q| (q.query.clone(), q.searches))
        .collect();
    let lost_searches = preview
        .queries
        .iter()
        .filter(|q| q.lost_count > 0)
        .map(|q| q.searches)
        .sum();
    let (ndcg, query_ndcg) = match &preview.quality {
        Some(quality) => {
            let position = quality
                .metrics
                .iter()
                .position(|m| matches!(m.metric, Metric::Ndcg(_)));
            let mean = position.map(|i| {
                let row = &quality.metrics[i];
                (row.metric.to_string(), row.before, row.after)
            });
            let searches = |query: &str| {
                preview
                    .queries
                    .iter()
                    .find(|q| q.query == query)
                    .map_or(0, |q| q.searches)
            };
            let per_query = position
                .map(|i| {
                    quality
                        .per_query
                        .iter()
                        .map(|q| (q.query.clone(), searches(&q.query), q.before[i], q.after[i]))
                        .collect()
                })
                .unwrap_or_default();
            (mean, per_query)
        }
        None => (None, Vec::new()),
    };
    gate::GateInput {
        emptied,
        lost_searches,
        total_searches: preview.summary.searches,
        ndcg,
        query_ndcg,
        lint: vec![
            (Severity::Error, lint.counts.error),
            (Severity::Warning, lint.counts.warning),
            (Severity::Info, lint.counts.info),
        ],
        nothing_found: preview
            .warnings
            .contains(&preview::PreviewWarning::NothingFound),
    }
}
