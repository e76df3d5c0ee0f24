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
//! Rankings are sorted by score, ties broken by document id, and cut at top-k.
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
mod keys;
mod report;
mod retrieve;

use std::path::PathBuf;
use std::sync::Arc;

use rayon::prelude::*;
use rustc_hash::{FxHashMap, FxHashSet};
use serde::Serialize;

pub use crate::index::SurfaceForms;
pub use attribution::{RuleIndex, Sides};
pub use change::{ChangeSet, same_expansions, touched_keys};
pub use keys::{ConflatedKeys, DirectKeys, FormKeys, KeySource, lengths_without_stopwords, stems};
pub use report::*;
pub use retrieve::{
    DocOrder, Hit, MatchMode, Ranking, Scoring, SideQuery, Stats, matches, matches_both,
    matches_into, rank, retrieve, top_hits,
};

use crate::analysis::Analyzer;
use crate::corpus::{Corpus, QueryLog};
use crate::index::{self, IndexError, IndexPostings, Progress};
use crate::metrics::{
    self, EvalConfig, Judgments, Metric, MetricsError, Queries, RandomizationTest,
};

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

#[derive(Clone, Debug)]
pub struct PreviewOptions {
    pub scoring: Scoring,
    pub top_k: usize,
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
            rbo_p: metrics::DEFAULT_RBO_P,
            docs_shown: 10,
            cache_dir: None,
            want_runs: false,
            test: RandomizationTest::default(),
        }
    }
}

/// One query's top-k on one side, for a TREC run file.
#[derive(Clone, Debug, Serialize)]
pub struct RunQuery {
    pub qid: String,
    pub docs: Vec<RankedDoc>,
}

#[derive(Clone, Debug, Default)]
pub struct Runs {
    pub base: Vec<RunQuery>,
    pub head: Vec<RunQuery>,
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
}

/// A run in TREC format: `qid Q0 docid rank score tag`.
pub fn trec_run(run: &[RunQuery], tag: &str) -> String {
    let mut out = String::new();
    for q in run {
        for (i, d) in q.docs.iter().enumerate() {
            out.push_str(&format!(
                "{} Q0 {} {} {} {tag}\n",
                q.qid,
                d.id,
                i + 1,
                d.score
            ));
        }
    }
    out
}

/// The evaluation metrics at cut-off k.
pub fn metric_list(k: usize) -> Vec<Metric> {
    vec![
        Metric::Precision(k),
        Metric::Recall(k),
        Metric::F1(k),
        Metric::ReciprocalRank(None),
        Metric::AveragePrecision(None),
        Metric::Ndcg(Some(k)),
    ]
}

/// One query's result on both sides, before it is folded into the report.
struct QueryOutcome {
    evaluated: bool,
    label: Label,
    top_b: Vec<RankedDoc>,
    top_h: Vec<RankedDoc>,
    /// Listed in the report: a changed query of the log.
    change: Option<QueryChange>,
}

/// A ruleset's view of the index: its conflation groups and their statistics.
struct View<'a> {
    keys: ConflatedKeys<'a>,
    stats: Stats,
}

impl<'a> View<'a> {
    fn new(
        postings: &'a IndexPostings,
        forms: &'a SurfaceForms,
        form_keys: &'a FormKeys,
        scoring: &Scoring,
    ) -> Result<View<'a>, IndexError> {
        let lengths = keys::lengths_without_stopwords(postings, forms, form_keys)?;
        let keys = ConflatedKeys::new(postings, forms, form_keys, lengths);
        let stats = Stats::compute(&keys, scoring)?;
        Ok(View { keys, stats })
    }
}

struct Side<'a> {
    analyzer: &'a Analyzer,
    keys: &'a ConflatedKeys<'a>,
    stats: &'a Stats,
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

/// Runs a preview.
pub fn run(
    input: PreviewInput<'_>,
    options: &PreviewOptions,
    progress: &dyn Progress,
) -> Result<PreviewOutcome, PreviewError> {
    let indexes = open_indexes(input.corpus, &input.base, &input.head, options, progress)?;
    run_opened(input, indexes, options)
}

/// Runs a preview on indexes already open (the corpus's texts may have been dropped).
pub fn run_opened(
    input: PreviewInput<'_>,
    indexes: OpenedIndexes,
    options: &PreviewOptions,
) -> Result<PreviewOutcome, PreviewError> {
    let corpus = input.corpus;
    let (base_a, head_a) = (&*input.base, &*input.head);
    let same_surface = indexes.head.is_none();
    let OpenedIndexes {
        base: opened_base,
        head: opened_head,
    } = indexes;
    let forms_base = opened_base.postings.surface_forms()?;
    let forms_head = match &opened_head {
        Some(o) => Some(o.postings.surface_forms()?),
        None => None,
    };
    // Each side keys every surface form once (shared stemming where the rules allow, the
    // stems themselves kept beside the index); the change set and the conflation groups
    // share those keys.
    let (head_postings, head_forms) = match (&opened_head, &forms_head) {
        (Some(o), Some(f)) => (&o.postings, f),
        _ => (&opened_base.postings, &forms_base),
    };
    let stems_base = keys::stems(&opened_base.postings, &forms_base, base_a)?;
    let (keys_base, keys_head) = if same_surface {
        FormKeys::compute_pair(base_a, head_a, &forms_base, stems_base.as_deref())
    } else {
        let stems_head = keys::stems(head_postings, head_forms, head_a)?;
        rayon::join(
            || FormKeys::compute(base_a, &forms_base, stems_base.as_deref()),
            || FormKeys::compute(head_a, head_forms, stems_head.as_deref()),
        )
    };
    let change = ChangeSet::from_keys(
        base_a,
        head_a,
        same_surface.then_some((&*forms_base, (&keys_base, &keys_head))),
    );
    let base_view = View::new(
        &opened_base.postings,
        &forms_base,
        &keys_base,
        &options.scoring,
    )?;
    // When every form keeps its key (a synonym edit, say), the head sees the index exactly
    // as the base does: one view serves both, its unions merged once.
    let head_view = if same_surface && keys_base == keys_head {
        None
    } else {
        let view = View::new(head_postings, head_forms, &keys_head, &options.scoring)?;
        Some(if same_surface {
            // Over one index, a key whose members did not change is merged once, by the base.
            View {
                keys: view.keys.sharing(&base_view.keys, &change.affected_keys),
                stats: view.stats,
            }
        } else {
            view
        })
    };
    let head_view = head_view.as_ref().unwrap_or(&base_view);
    let base = Side {
        analyzer: base_a,
        keys: &base_view.keys,
        stats: &base_view.stats,
    };
    let head = Side {
        analyzer: head_a,
        keys: &head_view.keys,
        // Equal statistics (the same lengths, hence the same norms) are shared, which lets
        // `matches_both` score a clause both sides share once for both.
        stats: if head_view.stats == base_view.stats {
            &base_view.stats
        } else {
            &head_view.stats
        },
    };

    let ids: Vec<String> = corpus.documents.iter().map(|d| d.id.clone()).collect();
    // The id order depends on the corpus alone, which the index is keyed by.
    let places = opened_base
        .postings
        .derived_numbers("id-order", || Ok(DocOrder::by_id(&ids).into_places()))?;
    let order = if places.len() == ids.len() {
        DocOrder::from_places(places)
    } else {
        DocOrder::by_id(&ids)
    };
    let weights: Vec<f64> = corpus.fields.iter().map(|f| f.weight as f64).collect();
    // Hits in document order; only the top k is ever ranked.
    let run_side = |s: &Side, q: &crate::analysis::AnalyzedQuery, hits: &mut Vec<Hit>| {
        matches_into(q, s.keys, s.stats, &options.scoring, &weights, hits)
    };

    // Judged query texts → ids; judged texts missing from the log are run too.
    let mut qid_of: FxHashMap<String, String> = FxHashMap::default();
    if let Some(j) = &input.judged {
        for q in j.texts.iter() {
            if j.judgments.contains_query(&q.id) {
                qid_of
                    .entry(q.text.trim().to_string())
                    .or_insert(q.id.clone());
            }
        }
    }
    let mut queries: Vec<(String, u64)> = input
        .queries
        .queries
        .iter()
        .map(|q| (q.query.clone(), q.count))
        .collect();
    let in_log: FxHashSet<String> = queries.iter().map(|q| q.0.clone()).collect();
    let mut extra: Vec<&String> = qid_of.keys().filter(|t| !in_log.contains(*t)).collect();
    extra.sort();
    let log_len = queries.len();
    queries.extend(extra.into_iter().map(|t| (t.clone(), 0)));

    let sides = Sides {
        base: base_a,
        head: head_a,
        base_rules: &RuleIndex::new(base_a),
        head_rules: &RuleIndex::new(head_a),
        change: &change,
    };
    let top = |hits: &[Hit]| -> Vec<RankedDoc> {
        top_hits(hits, options.top_k, &order)
            .iter()
            .map(|h| RankedDoc {
                id: ids[h.doc as usize].clone(),
                score: h.score,
            })
            .collect()
    };
    let doc_ref = |d: u32| DocRef {
        id: ids[d as usize].clone(),
        title: corpus.documents[d as usize].title.clone(),
    };

    // Queries are evaluated independently, in parallel, then folded in log order.
    let evaluate = |i: usize, hb: &mut Vec<Hit>, hh: &mut Vec<Hit>| {
        let (text, count) = &queries[i];
        let qid = qid_of.get(text);
        let qb = base.analyzer.analyze_query(text);
        let qh = head.analyzer.analyze_query(text);
        let differs = !same_expansions(&qb, &qh);
        let must = change.evaluate_all.is_some()
            || differs
            || touched_keys(&qb)
                .chain(touched_keys(&qh))
                .any(|k| change.affected_keys.contains(k));
        let needs_ranking = qid.is_some() || options.want_runs;
        if !must {
            let top_b = if needs_ranking {
                run_side(&base, &qb, hb)?;
                top(hb)
            } else {
                Vec::new()
            };
            return Ok(QueryOutcome {
                evaluated: false,
                label: Label::Unchanged,
                top_h: top_b.clone(),
                top_b,
                change: None,
            });
        }
        matches_both(
            &SideQuery {
                query: &qb,
                source: base.keys,
                stats: base.stats,
            },
            &SideQuery {
                query: &qh,
                source: head.keys,
                stats: head.stats,
            },
            &options.scoring,
            &weights,
            hb,
            hh,
        )?;
        let (top_b, top_h) = (top(hb), top(hh));
        let (gained, lost) = gained_and_lost(hb, hh);
        let mut change = diff(
            text,
            *count,
            qid,
            (hb.len(), hh.len()),
            (gained.len(), lost.len()),
            top_b.clone(),
            top_h.clone(),
            options,
        )?;
        let label = change.label;
        let listed = label != Label::Unchanged && i < log_len;
        if listed {
            let shown = |docs: Vec<u32>| {
                first_by_place(docs, options.docs_shown, &order)
                    .into_iter()
                    .map(doc_ref)
                    .collect()
            };
            change.gained = shown(gained);
            change.lost = shown(lost);
            change.causes = sides.attribute(text, &qb, &qh);
        }
        Ok::<_, PreviewError>(QueryOutcome {
            evaluated: true,
            label,
            top_b,
            top_h,
            change: listed.then_some(change),
        })
    };
    let outcomes = (0..queries.len())
        .into_par_iter()
        .map(|i| {
            // Each thread reuses its two hit buffers: taken out for the query, put back after.
            let (mut hb, mut hh) = HIT_BUFFERS.take();
            let outcome = evaluate(i, &mut hb, &mut hh);
            HIT_BUFFERS.set((hb, hh));
            outcome
        })
        .collect::<Result<Vec<_>, _>>()?;

    let mut changes = Vec::new();
    let mut labels: FxHashMap<Label, (usize, u64)> = FxHashMap::default();
    let mut evaluated = 0;
    let mut runs = Runs::default();
    let mut judged_rankings: Vec<(String, Vec<String>, Vec<String>)> = Vec::new();
    for (i, outcome) in outcomes.into_iter().enumerate() {
        let (text, count) = &queries[i];
        let qid = qid_of.get(text);
        evaluated += usize::from(outcome.evaluated);
        changes.extend(outcome.change);
        if i < log_len {
            let slot = labels.entry(outcome.label).or_default();
            slot.0 += 1;
            slot.1 += count;
        }
        if let Some(qid) = qid {
            let names = |v: &[RankedDoc]| v.iter().map(|d| d.id.clone()).collect();
            judged_rankings.push((qid.clone(), names(&outcome.top_b), names(&outcome.top_h)));
        }
        if options.want_runs {
            let qid = qid.cloned().unwrap_or_else(|| format!("q{}", i + 1));
            runs.base.push(RunQuery {
                qid: qid.clone(),
                docs: outcome.top_b,
            });
            runs.head.push(RunQuery {
                qid,
                docs: outcome.top_h,
            });
        }
    }
    changes.sort_by(|a, b| {
        b.searches
            .cmp(&a.searches)
            .then_with(|| a.query.cmp(&b.query))
    });

    let searches = input.queries.total_searches();
    let affected: u64 = labels
        .iter()
        .filter(|(l, _)| **l != Label::Unchanged)
        .map(|(_, v)| v.1)
        .sum();
    let summary = Summary {
        queries: log_len,
        searches,
        affected_searches: affected,
        affected_share: if searches == 0 {
            0.0
        } else {
            affected as f64 / searches as f64
        },
        labels: Label::ALL
            .iter()
            .map(|&label| {
                let (queries, searches) = labels.get(&label).copied().unwrap_or_default();
                LabelCount {
                    label,
                    queries,
                    searches,
                }
            })
            .collect(),
    };
    let quality = match &input.judged {
        Some(j) => Some(quality(j, &judged_rankings, options)?),
        None => None,
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
            index: opened_base.status.clone(),
        },
        queries_source: input.queries.source.clone(),
        settings: Settings {
            scoring: options.scoring,
            ranking_definition: options.scoring.definition(),
            top_k: options.top_k,
            rbo_p: options.rbo_p,
        },
        evaluation: EvaluationInfo {
            strategy: if change.evaluate_all.is_some() {
                "all".into()
            } else {
                "affected".into()
            },
            reason: change.evaluate_all.clone(),
            changed_forms: change.changed_forms,
            affected_keys: change.affected_keys.len(),
            queries: queries.len(),
            evaluated,
            skipped: queries.len() - evaluated,
        },
        summary,
        queries: changes,
        quality,
    };
    Ok(PreviewOutcome {
        report,
        runs: options.want_runs.then_some(runs),
    })
}

thread_local! {
    /// Per thread, the base and head hits of the query being evaluated.
    static HIT_BUFFERS: std::cell::Cell<(Vec<Hit>, Vec<Hit>)> = const { std::cell::Cell::new((Vec::new(), Vec::new())) };
}

/// The documents only `after` holds (gained) and only `before` holds (lost), both hit
/// lists being in document order.
fn gained_and_lost(before: &[Hit], after: &[Hit]) -> (Vec<u32>, Vec<u32>) {
    let (mut gained, mut lost) = (Vec::new(), Vec::new());
    let (mut i, mut j) = (0, 0);
    while i < before.len() || j < after.len() {
        match (before.get(i), after.get(j)) {
            (Some(b), Some(a)) if b.doc == a.doc => {
                i += 1;
                j += 1;
            }
            (Some(b), Some(a)) if b.doc < a.doc => {
                lost.push(b.doc);
                i += 1;
            }
            (Some(b), None) => {
                lost.push(b.doc);
                i += 1;
            }
            (_, Some(a)) => {
                gained.push(a.doc);
                j += 1;
            }
            (None, None) => unreachable!("the loop runs while either list has hits"),
        }
    }
    (gained, lost)
}

/// The first `n` documents in id order.
fn first_by_place(mut docs: Vec<u32>, n: usize, order: &DocOrder) -> Vec<u32> {
    if docs.len() > n && n > 0 {
        docs.select_nth_unstable_by_key(n - 1, |&d| order.place(d));
    }
    docs.truncate(n);
    docs.sort_unstable_by_key(|&d| order.place(d));
    docs
}

#[allow(clippy::too_many_arguments)]
fn diff(
    text: &str,
    searches: u64,
    qid: Option<&String>,
    (matches_before, matches_after): (usize, usize),
    (gained, lost): (usize, usize),
    top_before: Vec<RankedDoc>,
    top_after: Vec<RankedDoc>,
    options: &PreviewOptions,
) -> Result<QueryChange, MetricsError> {
    let same_top = top_before.len() == top_after.len()
        && top_before.iter().zip(&top_after).all(|(x, y)| {
            x.id == y.id && (x.score - y.score).abs() <= 1e-9 * x.score.abs().max(1.0)
        });
    let label = match (matches_before, matches_after) {
        (0, n) if n > 0 => Label::Rescued,
        (n, 0) if n > 0 => Label::Emptied,
        _ if gained > lost => Label::Gained,
        _ if lost > 0 => Label::Lost,
        _ if !same_top => Label::Reordered,
        _ => Label::Unchanged,
    };
    let names = |v: &[RankedDoc]| v.iter().map(|d| d.id.clone()).collect::<Vec<_>>();
    let rbo = metrics::rbo_ext(&names(&top_before), &names(&top_after), options.rbo_p)?;
    Ok(QueryChange {
        query: text.to_string(),
        qid: qid.cloned(),
        searches,
        label,
        mixed: gained > 0 && lost > 0,
        matches_before,
        matches_after,
        gained_count: gained,
        lost_count: lost,
        gained: Vec::new(),
        lost: Vec::new(),
        rbo,
        top_before,
        top_after,
        causes: Vec::new(),
    })
}

fn quality(
    judged: &JudgedSet,
    rankings: &[(String, Vec<String>, Vec<String>)],
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
    let config = EvalConfig::new(metric_list(options.top_k));
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
    Ok(Quality {
        judged_queries: before.queries.len(),
        without_text,
        test: "Fisher's randomization test, paired, two-sided (Smucker, Allan & Carterette 2007, \
               \"A Comparison of Statistical Significance Tests for Information Retrieval \
               Evaluation\")"
            .into(),
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
