//! The result of a preview: one value that every renderer (text, JSON, and later the
//! review's Markdown and HTML) turns into its format.

use serde::Serialize;

use super::retrieve::Scoring;
use crate::corpus::FieldSpec;
use crate::metrics::{Metric, TestMethod};

/// What a sample preview can and cannot show.
pub const EVIDENCE_NOTICE: &str = "A preview on a sample is evidence, not proof: if you depend \
on recall (legal discovery, clinical or safety documents), validate the change against your own \
full collection and your own rules of practice.";

/// What happened to one query.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Hash, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Label {
    /// Found nothing before, finds something now.
    Rescued,
    /// Found something before, finds nothing now.
    Emptied,
    /// Finds more documents (or more gained than lost).
    Gained,
    /// Finds fewer documents (or at least as many lost as gained).
    Lost,
    /// The same documents, but the top k holds other documents or the same in another
    /// order.
    Reordered,
    /// The same documents and the same top k in the same order (scores may have moved:
    /// [`Summary::rescored`] counts those).
    Unchanged,
}

impl Label {
    pub const ALL: [Label; 6] = [
        Label::Rescued,
        Label::Emptied,
        Label::Gained,
        Label::Lost,
        Label::Reordered,
        Label::Unchanged,
    ];

    pub fn name(self) -> &'static str {
        match self {
            Label::Rescued => "rescued",
            Label::Emptied => "emptied",
            Label::Gained => "gained",
            Label::Lost => "lost",
            Label::Reordered => "reordered",
            Label::Unchanged => "unchanged",
        }
    }
}

#[derive(Clone, Debug, Serialize)]
pub struct PreviewReport {
    /// [`EVIDENCE_NOTICE`].
    pub notice: String,
    pub base: RulesetInfo,
    pub head: RulesetInfo,
    pub corpus: CorpusInfo,
    pub queries_source: String,
    pub settings: Settings,
    pub evaluation: EvaluationInfo,
    pub summary: Summary,
    /// Every query whose label is not `unchanged`: emptied, lost and judged-worse queries
    /// first whatever their traffic ([`QueryChange::urgency`]), then by searches.
    pub queries: Vec<QueryChange>,
    pub quality: Option<Quality>,
    /// What makes the preview say less than it seems to (left out of JSON when empty).
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub warnings: Vec<PreviewWarning>,
}

/// A preview that ran but may not mean what its figures suggest.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum PreviewWarning {
    /// No query matched any document, before or after the change: nothing was searched.
    NothingFound,
}

impl std::fmt::Display for PreviewWarning {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            PreviewWarning::NothingFound => {
                "no query matched any document, before or after the change: nothing was \
                 searched, so every figure is empty (are the searched fields the ones that \
                 hold the text, and is the query log for this corpus?)"
            }
        })
    }
}

#[derive(Clone, Debug, Serialize)]
pub struct RulesetInfo {
    pub source: String,
    pub synonyms: usize,
    pub exemptions: usize,
    pub lemmas: usize,
    pub stopwords: usize,
}

#[derive(Clone, Debug, Serialize)]
pub struct CorpusInfo {
    pub source: String,
    pub documents: usize,
    pub fields: Vec<FieldSpec>,
    pub fingerprint: String,
    /// `built`, `reused` or `memory` (no cache). Left out of JSON so that two runs of the
    /// same preview give the same bytes.
    #[serde(skip)]
    pub index: String,
}

#[derive(Clone, Debug, Serialize)]
pub struct Settings {
    #[serde(flatten)]
    pub scoring: Scoring,
    pub ranking_definition: String,
    /// Documents shown per ranking, compared by RBO and the outcome labels.
    pub top_k: usize,
    /// How deep rankings are evaluated for judged metrics and written to run files.
    pub depth: usize,
    pub rbo_p: f64,
}

#[derive(Clone, Debug, Serialize)]
pub struct EvaluationInfo {
    /// `affected` (only queries touching the change were run) or `all`.
    pub strategy: String,
    /// Why every query was run, when it was.
    pub reason: Option<String>,
    /// Surface forms whose key differs between the two rulesets.
    pub changed_forms: usize,
    /// Keys whose conflation group gained or lost members.
    pub affected_keys: usize,
    pub queries: usize,
    /// Queries run on both sides.
    pub evaluated: usize,
    /// Queries reported unchanged without being run.
    pub skipped: usize,
}

#[derive(Clone, Debug, Serialize)]
pub struct LabelCount {
    pub label: Label,
    pub queries: usize,
    pub searches: u64,
}

/// A number of queries and their searches.
#[derive(Clone, Copy, Debug, Default, Serialize)]
pub struct QueryCount {
    pub queries: usize,
    pub searches: u64,
}

#[derive(Clone, Debug, Serialize)]
pub struct Summary {
    pub queries: usize,
    pub searches: u64,
    /// Searches whose query's matches or top k changed (any label but `unchanged`).
    pub affected_searches: u64,
    pub affected_share: f64,
    pub labels: Vec<LabelCount>,
    /// Unchanged queries whose scores moved: the same matches and the same top k in the
    /// same order. Not affected.
    pub rescored: QueryCount,
}

#[derive(Clone, Debug, Serialize)]
pub struct DocRef {
    pub id: String,
    pub title: String,
}

#[derive(Clone, Debug, Serialize)]
pub struct RankedDoc {
    pub id: String,
    pub score: f64,
}

#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum CauseKind {
    Synonym,
    Exempt,
    Lemma,
    Stopwords,
    /// A pipeline setting (the stemmer) changed the key.
    Pipeline,
}

#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum RuleChange {
    Added,
    Removed,
    Changed,
    /// The rule is the same on both sides; what it does to this query changed.
    SameRuleNewEffect,
}

/// A rule that caused a query's change.
#[derive(Clone, Debug, Serialize)]
pub struct Cause {
    pub kind: CauseKind,
    /// The rule's id, or its file and line.
    pub rule: String,
    /// `file:line` of the rule (on the head side, or the base side for removed rules).
    pub origin: Option<String>,
    pub change: RuleChange,
    /// For exemptions and lemmas: surface forms whose key changed (a few).
    pub forms: Vec<String>,
}

#[derive(Clone, Debug, Serialize)]
pub struct QueryChange {
    pub query: String,
    /// The judged query id, when the query is judged.
    pub qid: Option<String>,
    pub searches: u64,
    pub label: Label,
    /// Both documents gained and documents lost.
    pub mixed: bool,
    pub matches_before: usize,
    pub matches_after: usize,
    pub gained_count: usize,
    pub lost_count: usize,
    /// The first gained and lost documents (by document id), up to the report's limit.
    pub gained: Vec<DocRef>,
    pub lost: Vec<DocRef>,
    /// RBO of the two top-k lists.
    pub rbo: f64,
    pub top_before: Vec<RankedDoc>,
    pub top_after: Vec<RankedDoc>,
    pub causes: Vec<Cause>,
    /// For a judged query: its nDCG@10 on both sides, so a label that counts documents
    /// never hides a judged loss.
    pub judged: Option<JudgedMove>,
}

/// A judged query's headline metric on both sides.
#[derive(Clone, Debug, Serialize)]
pub struct JudgedMove {
    pub metric: Metric,
    pub before: f64,
    pub after: f64,
}

/// The changed queries a limited listing shows: every urgent one (emptied, lost, judged
/// worse), whatever the limit, then up to `limit` of the rest, in report order.
pub fn listed(queries: &[QueryChange], limit: usize) -> impl Iterator<Item = &QueryChange> {
    let urgent = queries.iter().take_while(|q| q.urgency() < 3);
    let rest = queries.iter().skip_while(|q| q.urgency() < 3).take(limit);
    urgent.chain(rest)
}

impl QueryChange {
    /// Whether judged quality fell.
    pub fn judged_worse(&self) -> bool {
        self.judged.as_ref().is_some_and(|j| j.after < j.before)
    }

    /// How bad the news is, most urgent first: emptied, lost, judged worse, the rest.
    pub fn urgency(&self) -> u8 {
        match self.label {
            Label::Emptied => 0,
            Label::Lost => 1,
            _ if self.judged_worse() => 2,
            _ => 3,
        }
    }
}

#[derive(Clone, Debug, Serialize)]
pub struct MetricRow {
    pub metric: Metric,
    pub before: f64,
    pub after: f64,
    pub difference: f64,
    pub improved: usize,
    pub worsened: usize,
    pub p_value: f64,
    pub method: TestMethod,
}

#[derive(Clone, Debug, Serialize)]
pub struct JudgedQuery {
    pub qid: String,
    pub query: String,
    /// In [`Quality::metrics`] order.
    pub before: Vec<f64>,
    pub after: Vec<f64>,
}

#[derive(Clone, Debug, Serialize)]
pub struct Quality {
    /// Judged queries with a text, evaluated.
    pub judged_queries: usize,
    /// Which queries the means are over, and how those that find nothing count.
    pub averaging: String,
    /// Judged query ids without a text (not evaluated).
    pub without_text: Vec<String>,
    /// The test named, with its source.
    pub test: String,
    pub metrics: Vec<MetricRow>,
    pub per_query: Vec<JudgedQuery>,
}
