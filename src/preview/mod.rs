//! `preview`: what a rule change does to real queries, on a sample index.
//!
//! # How it is fast and exact
//!
//! The corpus is indexed once on its **surface forms** ([`crate::index`], cached on disk).
//! Each ruleset's view of that index maps every surface form to its key ([`ConflatedKeys`]);
//! a key's postings are the union of its members' postings (positions merged), so its tf is
//! the sum over members and its df the number of documents holding any member. Document
//! length is the number of tokens the analyzer keeps (stopwords excluded).
//!
//! The change is first reduced ([`ChangeSet`]) to the surface forms whose key differs and
//! the keys whose conflation group gained or lost members. Only queries whose analysis or
//! expansion differs, or that touch an affected key, are run on both sides; every other
//! query is reported unchanged without being run, which is exact: all the postings and
//! statistics it reads are identical on both sides. When the stopword lists or the surface
//! settings differ, every query is run (and the report says so).
//!
//! The reference path (an index per ruleset built with the real analyzer, read through
//! [`DirectKeys`]) gives the same matches and scores; `tests/preview_exact.rs` checks it.
//!
//! # Retrieval
//!
//! A query is analyzed with the query-side analyzer and expanded by synonyms. Each
//! [`Expansion`](crate::analysis::Expansion) is one **clause**; its alternatives are OR-ed,
//! multi-word alternatives being phrases (relative positions include stopword gaps). A
//! clause counts as one term: its tf in a field is the number of positions where any
//! alternative matches, its df the number of documents where any alternative matches in
//! that field. A document matches a clause when any field does; it matches the query under
//! [`MatchMode`]: `all` clauses (the default), `any`, or `min:N` (at least N, capped at the
//! number of clauses). A query with no clause (only stopwords) matches nothing.
//!
//! **BM25** (Robertson & Zaragoza 2009, "The Probabilistic Relevance Framework: BM25 and
//! Beyond"), per field f with N documents, per-field average length avgdl_f:
//! `idf = ln(1 + (N − df + 0.5)/(df + 0.5))`,
//! `tf part = tf·(k1 + 1)/(tf + k1·(1 − b + b·dl/avgdl_f))`, k1 = 1.2 and b = 0.75 by
//! default; the score is Σ_clauses Σ_f weight_f · idf · tf part.
//!
//! **Cosine** (`--ranking cosine`): per field, `w = (1 + ln tf)·ln(N/df)` for a clause and
//! for every key of the document; the field score is Σ_clauses w / ‖d‖_f, where ‖d‖_f is the
//! Euclidean norm of the document's vector of key weights under that ruleset (the query
//! vector is binary over clauses, its norm left out as it is the same for every document);
//! the score is Σ_f weight_f · field score. A zero norm gives 0.
//!
//! Rankings are sorted by score, ties broken as trec_eval breaks them (the later document
//! id first), so the rankings shown, the run files and the metrics agree with trec_eval
//! reading those run files. The top k is shown, compared by RBO and read by the outcome
//! labels; rankings are evaluated for judged metrics, and written to run files, to the
//! depth ([`PreviewOptions::depth`], 1000 by default).
//!
//! # Steps
//!
//! [`run_opened`] keys every surface form on both sides and reduces the change
//! (`views`), plans the queries (`plan`), evaluates them in parallel (`evaluate`), folds
//! the outcomes in plan order into the report, the run files and the judged rankings
//! (`fold`), and scores the judged rankings (`judge`).
//!
//! # Evaluation cost
//!
//! Under `all`, the documents of the rarest clause are the candidates and every further
//! clause only looks them up in its sorted postings (galloping search), so a query with one
//! rare and one common term costs about the rare term's postings. Under `any` and `min:N`
//! every posting is scored into dense per-document accumulators reused across queries.
//! Both sum a document's score in the same order (clauses in query order, fields in field
//! order), so the two strategies cannot be told apart in the scores.
//!
//! A query the change touches is matched on both sides at once ([`matches_both`]): a
//! change usually touches one of its clauses, and the clauses it leaves alone are the very
//! same lists on both sides, so they filter the candidates of both sides in one pass. Each
//! side's documents are then scored alone, so the hits are exactly those of [`matches()`].
//!
//! A clause without a phrase reads documents and tfs only (a group's tfs are its members'
//! summed, as members never share a position); positions are read for phrases alone.
//! Only the top k of each side is ranked; gained and lost documents come from merging the
//! two document-ordered match lists. A clause of several keys (a synonym set) is merged
//! once per view and kept; over one index, the head reads every key whose members did not
//! change from the base's view, so both sides merge it once.
//!
//! What depends only on the index is kept beside it on disk (see [`crate::index`]): its
//! surface forms, their stems under each stemmer, the document lengths under each stopword
//! list, and the documents' id order. A warm preview reads these instead of computing
//! them, and spends its time on the queries the change touches. Queries are evaluated in parallel and folded into the
//! report in log order, so the output does not depend on the number of threads.

mod attribution;
mod change;
mod evaluate;
mod fold;
mod judge;
mod keys;
mod plan;
mod report;
mod retrieve;
mod runs;
mod views;

use std::path::{Path, PathBuf};
use std::sync::Arc;

pub use crate::index::SurfaceForms;
pub use attribution::{RuleIndex, Sides};
pub use change::{ChangeSet, same_expansions, touched_keys};
pub use keys::{ConflatedKeys, DirectKeys, FormKeys, KeySource, lengths_without_stopwords, stems};
pub use report::*;
pub use retrieve::{
    DocOrder, Hit, MatchMode, Ranking, Scoring, SideQuery, Stats, matches, matches_both,
    matches_into, rank, retrieve, top_hits,
};
pub use runs::{RunQuery, Runs, trec_run};

use crate::analysis::Analyzer;
use crate::corpus::{
    Corpus, CorpusError, DocOptions, QueryLog, read_documents, read_documents_without_texts,
};
use crate::index::{self, IndexError, IndexPostings, Progress};
use crate::metrics::{self, Judgments, Metric, MetricsError, Queries, RandomizationTest};
use evaluate::Engine;
use plan::QueryPlan;
use views::{KeyedSides, Side, View};

/// Judgments and the texts of the judged queries.
pub struct JudgedSet {
    pub judgments: Judgments,
    pub texts: Queries,
}

/// What a preview compares.
pub struct PreviewInput<'a> {
    pub base: Arc<Analyzer>,
    pub head: Arc<Analyzer>,
    pub corpus: &'a Corpus,
    pub queries: &'a QueryLog,
    pub judged: Option<JudgedSet>,
}

/// How deep rankings are evaluated by default: trec_eval's own default depth.
pub const DEFAULT_DEPTH: usize = 1000;

#[derive(Clone, Debug)]
pub struct PreviewOptions {
    pub scoring: Scoring,
    /// Documents shown per ranking, and compared by RBO and the outcome labels.
    pub top_k: usize,
    /// How deep rankings are evaluated for judged metrics and written to run files.
    pub depth: usize,
    pub rbo_p: f64,
    /// Gained and lost documents listed per query.
    pub docs_shown: usize,
    /// Where surface indexes are cached; `None` builds in memory.
    pub cache_dir: Option<PathBuf>,
    /// Rank every query on both sides, for TREC run files.
    pub want_runs: bool,
    pub test: RandomizationTest,
}

impl Default for PreviewOptions {
    fn default() -> Self {
        PreviewOptions {
            scoring: Scoring::default(),
            top_k: 10,
            depth: DEFAULT_DEPTH,
            rbo_p: metrics::DEFAULT_RBO_P,
            docs_shown: 10,
            cache_dir: None,
            want_runs: false,
            test: RandomizationTest::default(),
        }
    }
}

impl PreviewOptions {
    /// Checks every setting: cut-offs of at least 1, finite BM25 parameters in range, an
    /// RBO persistence strictly between 0 and 1, a valid randomization test.
    pub fn validate(&self) -> Result<(), PreviewError> {
        let bad = |name: &'static str, message: String| {
            Err(PreviewError::Metrics(MetricsError::InvalidParameter {
                name,
                message,
            }))
        };
        if self.top_k == 0 {
            return bad("top k", "must be at least 1".into());
        }
        if self.depth == 0 {
            return bad("evaluation depth", "must be at least 1".into());
        }
        let (k1, b) = (self.scoring.k1, self.scoring.b);
        if !(k1.is_finite() && k1 >= 0.0) {
            return bad(
                "BM25 k1",
                format!("{k1} is not a finite number of at least 0"),
            );
        }
        if !(0.0..=1.0).contains(&b) {
            return bad("BM25 b", format!("{b} is not between 0 and 1"));
        }
        if !(self.rbo_p > 0.0 && self.rbo_p < 1.0) {
            return bad(
                "RBO p",
                format!("{} is not strictly between 0 and 1", self.rbo_p),
            );
        }
        self.test.validate()?;
        Ok(())
    }
}

pub struct PreviewOutcome {
    pub report: PreviewReport,
    pub runs: Option<Runs>,
}

#[derive(Debug, thiserror::Error)]
pub enum PreviewError {
    #[error(transparent)]
    Index(#[from] IndexError),
    #[error(transparent)]
    Metrics(#[from] MetricsError),
    #[error(transparent)]
    Corpus(#[from] CorpusError),
    /// An id that the TREC run format cannot carry.
    #[error(
        "{what} id {id:?} cannot be written to a TREC run file: {why}; give it an id without \
         spaces, tabs or line breaks, or write no run files"
    )]
    RunId {
        what: &'static str,
        id: String,
        why: &'static str,
    },
    /// Two queries that would share one id in the run files.
    #[error(
        "queries {first:?} and {second:?} would both be written to the run files as {id:?}; \
         give one of them a judged query id"
    )]
    RunIdClash {
        id: String,
        first: String,
        second: String,
    },
}

/// The judged metrics of a preview whose rankings are evaluated to `depth`: the standard
/// early-precision cut-off of 10 (P@10, nDCG@10) and the whole evaluated ranking (R, RR
/// and AP at the depth), each named with its cut-off.
pub fn metric_list(depth: usize) -> Vec<Metric> {
    vec![
        Metric::Precision(10),
        Metric::Recall(depth),
        Metric::ReciprocalRank(Some(depth)),
        Metric::AveragePrecision(Some(depth)),
        Metric::Ndcg(Some(10)),
    ]
}

struct Opened {
    postings: IndexPostings,
    status: String,
}

fn open(
    corpus: &Corpus,
    analyzer: &Analyzer,
    options: &PreviewOptions,
    progress: &dyn Progress,
) -> Result<Opened, IndexError> {
    let (postings, status) = match &options.cache_dir {
        Some(dir) => {
            let (postings, status, _) =
                index::open_or_build(corpus, analyzer.surface(), dir, progress)?;
            let s = match status {
                index::CacheStatus::Built => "built",
                index::CacheStatus::Reused => "reused",
            };
            (postings, s)
        }
        None => {
            let idx = index::build_surface_index(corpus, analyzer.surface(), None, progress)?;
            (
                IndexPostings::open_surface(&idx, corpus.fields.len())?,
                "memory",
            )
        }
    };
    Ok(Opened {
        postings,
        status: status.to_string(),
    })
}

fn ruleset_info(a: &Analyzer) -> RulesetInfo {
    let rs = a.ruleset();
    RulesetInfo {
        source: rs.source.clone(),
        synonyms: rs.synonyms.len(),
        exemptions: rs.exemptions.len(),
        lemmas: rs.lemmas.len(),
        stopwords: rs.pipeline.stopwords.len(),
    }
}

/// The surface indexes a preview reads: one, or one per side when the surface settings
/// differ. Once they are open, the documents' texts are no longer needed
/// ([`Corpus::drop_texts`](crate::corpus::Corpus::drop_texts) frees them).
pub struct OpenedIndexes {
    base: Opened,
    head: Option<Opened>,
}

/// Opens (building when the cache has none) the surface indexes of both sides.
pub fn open_indexes(
    corpus: &Corpus,
    base: &Analyzer,
    head: &Analyzer,
    options: &PreviewOptions,
    progress: &dyn Progress,
) -> Result<OpenedIndexes, PreviewError> {
    let same_surface = base.surface().fingerprint() == head.surface().fingerprint();
    Ok(OpenedIndexes {
        base: open(corpus, base, options, progress)?,
        head: if same_surface {
            None
        } else {
            Some(open(corpus, head, options, progress)?)
        },
    })
}

/// Reads the sample's documents and opens both sides' surface indexes, holding as little
/// text as it can: with a cache, the documents are first read without their texts (a
/// cached index holds everything retrieval reads) and read again in full only when an
/// index must be built; the texts are dropped once the indexes are open, before any query
/// runs.
pub fn open_sample(
    path: &Path,
    doc_options: &DocOptions,
    base: &Analyzer,
    head: &Analyzer,
    options: &PreviewOptions,
    progress: &dyn Progress,
) -> Result<(Corpus, OpenedIndexes), PreviewError> {
    let mut corpus = if options.cache_dir.is_some() {
        read_documents_without_texts(path, doc_options)?
    } else {
        read_documents(path, doc_options)?
    };
    let indexes = match open_indexes(&corpus, base, head, options, progress) {
        Err(PreviewError::Index(IndexError::NoTexts)) => {
            // The text-free copy goes first: the two need not be held at once.
            corpus.documents = Vec::new();
            corpus = read_documents(path, doc_options)?;
            open_indexes(&corpus, base, head, options, progress)?
        }
        opened => opened?,
    };
    corpus.drop_texts();
    Ok((corpus, indexes))
}

/// Runs a preview.
pub fn run(
    input: PreviewInput<'_>,
    options: &PreviewOptions,
    progress: &dyn Progress,
) -> Result<PreviewOutcome, PreviewError> {
    let indexes = open_indexes(input.corpus, &input.base, &input.head, options, progress)?;
    run_opened(input, indexes, options)
}

/// Runs a preview on indexes already open (the corpus's texts may have been dropped), in
/// named steps: key both sides and reduce the change, plan the queries, evaluate them,
/// fold the outcomes, judge the rankings.
pub fn run_opened(
    input: PreviewInput<'_>,
    indexes: OpenedIndexes,
    options: &PreviewOptions,
) -> Result<PreviewOutcome, PreviewError> {
    options.validate()?;
    let corpus = input.corpus;
    let (base_a, head_a) = (&*input.base, &*input.head);
    let base_postings = &indexes.base.postings;
    let head_postings = indexes.head.as_ref().map(|o| &o.postings);

    let keyed = KeyedSides::compute(base_a, head_a, base_postings, head_postings)?;
    let base_view = View::base(&keyed, base_postings, &options.scoring)?;
    let head_view = View::head(
        &keyed,
        &base_view,
        base_postings,
        head_postings,
        &options.scoring,
    )?;
    let (base, head) = Side::pair(
        (base_a, head_a),
        &base_view,
        head_view.as_ref().unwrap_or(&base_view),
    );

    let ids: Vec<String> = corpus.documents.iter().map(|d| d.id.clone()).collect();
    let order = id_order(base_postings, &ids)?;
    let weights: Vec<f64> = corpus.fields.iter().map(|f| f.weight as f64).collect();
    let plan = QueryPlan::new(input.queries, input.judged.as_ref());
    if options.want_runs {
        runs::check_ids(&ids, &plan)?;
    }
    let engine = Engine {
        base,
        head,
        change: &keyed.change,
        attribution: Sides {
            base: base_a,
            head: head_a,
            base_rules: &RuleIndex::new(base_a),
            head_rules: &RuleIndex::new(head_a),
            change: &keyed.change,
        },
        corpus,
        ids: &ids,
        order: &order,
        weights: &weights,
        options,
    };
    let outcomes = engine.evaluate_all(&plan)?;
    let folded = fold::fold(
        &plan,
        outcomes,
        &ids,
        input.queries.total_searches(),
        options.want_runs,
    );
    let quality = input
        .judged
        .as_ref()
        .map(|j| judge::quality(j, &folded.judged, options))
        .transpose()?;
    let mut changes = folded.changes;
    if let Some(quality) = &quality {
        judge::mark_judged(&mut changes, quality);
        fold::worst_first(&mut changes);
    }

    // Silence is a failure: a preview in which no query finds anything says so.
    let warnings = if engine.finds_anything(&plan, &changes)? {
        Vec::new()
    } else {
        vec![PreviewWarning::NothingFound]
    };
    let report = PreviewReport {
        notice: EVIDENCE_NOTICE.to_string(),
        base: ruleset_info(base_a),
        head: ruleset_info(head_a),
        corpus: CorpusInfo {
            source: corpus.source.clone(),
            documents: corpus.len(),
            fields: corpus.fields.clone(),
            fingerprint: corpus.fingerprint.clone(),
            index: indexes.base.status.clone(),
        },
        queries_source: input.queries.source.clone(),
        settings: settings(options),
        evaluation: evaluation_info(&keyed.change, plan.queries.len(), folded.evaluated),
        summary: folded.summary,
        queries: changes,
        quality,
        warnings,
    };
    Ok(PreviewOutcome {
        report,
        runs: folded.runs,
    })
}

fn settings(options: &PreviewOptions) -> Settings {
    Settings {
        scoring: options.scoring,
        ranking_definition: options.scoring.definition(),
        top_k: options.top_k,
        depth: options.depth,
        rbo_p: options.rbo_p,
    }
}

/// How the change was reduced, and how many of the `queries` planned were run.
fn evaluation_info(change: &ChangeSet, queries: usize, evaluated: usize) -> EvaluationInfo {
    EvaluationInfo {
        strategy: if change.evaluate_all.is_some() {
            "all".into()
        } else {
            "affected".into()
        },
        reason: change.evaluate_all.clone(),
        changed_forms: change.changed_forms,
        affected_keys: change.affected_keys.len(),
        queries,
        evaluated,
        skipped: queries - evaluated,
    }
}

/// The documents' id order, kept beside the index: it depends on the corpus alone, which
/// the index is keyed by.
fn id_order(postings: &IndexPostings, ids: &[String]) -> Result<DocOrder, IndexError> {
    let places = postings.derived_numbers("id-order", || Ok(DocOrder::by_id(ids).into_places()))?;
    Ok(if places.len() == ids.len() {
        DocOrder::from_places(places)
    } else {
        DocOrder::by_id(ids)
    })
}
