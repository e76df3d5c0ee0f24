//! The collision report: vocabulary, ranked risky groups, a verified suggestion for each
//! shown group and, with a query log, its effect. One function computes it; renderers in
//! `report::collisions_*` turn it into text, JSON or CSV.

use std::convert::Infallible;
use std::path::Path;

use rustc_hash::FxHashSet;
use serde::Serialize;

use super::collisions::{self, Collision, KeyIndex};
use super::effect::{self, Effect};
use super::error::AuditError;
use super::morphy::Morphy;
use super::postings::FormLists;
use super::suggest::{self, Suggestion, rule_file};
use crate::analysis::Analyzer;
use crate::corpus::{Corpus, CorpusError, DocOptions, QueryLog};
use crate::corpus::{DocumentCounts, Vocabulary};

/// How much to compute.
#[derive(Clone, Debug)]
pub struct CollisionOptions {
    /// Show this many groups (all when `None`).
    pub top: Option<usize>,
    pub threads: usize,
}

impl Default for CollisionOptions {
    fn default() -> Self {
        CollisionOptions {
            top: Some(20),
            threads: std::thread::available_parallelism().map_or(1, |n| n.get()),
        }
    }
}

/// A shown group with its rank, suggestion and effect.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct RankedCollision {
    pub rank: usize,
    #[serde(flatten)]
    pub collision: Collision,
    pub suggestion: Option<Suggestion>,
    pub effect: Option<Effect>,
}

#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct CollisionReport {
    pub ruleset: String,
    pub corpus: String,
    pub query_log: Option<String>,
    pub documents: usize,
    pub queries: usize,
    pub searches: u64,
    /// Distinct surface forms.
    pub forms: usize,
    /// Conflation groups with two forms or more.
    pub groups: usize,
    /// Groups with more than one meaning class (risk > 0).
    pub risky: usize,
    pub collisions: Vec<RankedCollision>,
}

impl CollisionReport {
    /// The verified suggestions of the shown groups whose keys are in `accept` (of every
    /// shown group when `accept` is empty), as a new rule file.
    pub fn accepted_rule_file(&self, accept: &[String]) -> Result<String, AuditError> {
        if let Some(key) = accept
            .iter()
            .find(|key| !self.collisions.iter().any(|c| &c.collision.key == *key))
        {
            return Err(AuditError::UnknownGroup(key.clone()));
        }
        let accepted: Vec<_> = self
            .collisions
            .iter()
            .filter(|c| accept.is_empty() || accept.contains(&c.collision.key))
            .filter_map(|c| c.suggestion.as_ref())
            .collect();
        if accepted.is_empty() {
            return Err(AuditError::NoSuggestion);
        }
        Ok(rule_file(&accepted))
    }
}

/// Builds the report from documents in memory.
pub fn collision_report(
    analyzer: &Analyzer,
    corpus: &Corpus,
    log: Option<&QueryLog>,
    morphy: &Morphy,
    options: &CollisionOptions,
) -> CollisionReport {
    let threads = options.threads.max(1);
    let vocabulary = Vocabulary::build(analyzer.surface(), &corpus.documents, log, threads);
    let postings = |wanted: &FxHashSet<String>| -> Result<FormLists, Infallible> {
        Ok(FormLists::collect(
            analyzer.surface(),
            &corpus.documents,
            wanted,
            threads,
        ))
    };
    match assemble(
        analyzer,
        vocabulary,
        &corpus.source,
        log,
        morphy,
        options,
        postings,
    ) {
        Ok(report) => report,
        Err(never) => match never {},
    }
}

/// Builds the report from a corpus file without holding it in memory: `counts` come from
/// [`DocumentCounts::from_file`] on the same file, which is read once more, streaming, for
/// the postings of the shown groups. The report is the one [`collision_report`] gives for
/// `read_documents(path, doc_options)`.
pub fn collision_report_from_file(
    analyzer: &Analyzer,
    counts: DocumentCounts,
    path: &Path,
    doc_options: &DocOptions,
    log: Option<&QueryLog>,
    morphy: &Morphy,
    options: &CollisionOptions,
) -> Result<CollisionReport, CorpusError> {
    let threads = options.threads.max(1);
    let vocabulary = Vocabulary::from_counts(analyzer.surface(), counts, log);
    let postings = |wanted: &FxHashSet<String>| {
        FormLists::collect_file(analyzer.surface(), path, doc_options, wanted, threads)
    };
    let source = path.display().to_string();
    assemble(
        analyzer, vocabulary, &source, log, morphy, options, postings,
    )
}

fn assemble<E>(
    analyzer: &Analyzer,
    vocabulary: Vocabulary,
    source: &str,
    log: Option<&QueryLog>,
    morphy: &Morphy,
    options: &CollisionOptions,
    postings: impl FnOnce(&FxHashSet<String>) -> Result<FormLists, E>,
) -> Result<CollisionReport, E> {
    let threads = options.threads.max(1);
    let found = collisions::find(analyzer, &vocabulary, morphy, threads);
    let index = KeyIndex {
        keyed: &found.keyed,
        vocabulary: &vocabulary,
    };
    let shown: Vec<&Collision> = found
        .collisions
        .iter()
        .take(options.top.unwrap_or(usize::MAX))
        .collect();
    let suggestions: Vec<Option<Suggestion>> = shown
        .iter()
        .map(|c| suggest::suggest(analyzer, c, &index))
        .collect();
    let effects = log.map(|log| {
        let mut wanted = FxHashSet::default();
        for s in suggestions.iter().flatten() {
            effect::forms_needed(s, &index, &mut wanted);
        }
        let postings = postings(&wanted)?;
        Ok(suggestions
            .iter()
            .map(|s| {
                s.as_ref()
                    .map(|s| effect::estimate_effect(s, &index, &postings, analyzer.surface(), log))
            })
            .collect::<Vec<_>>())
    });
    let effects = effects.transpose()?;
    let collisions = shown
        .into_iter()
        .zip(suggestions)
        .enumerate()
        .map(|(i, (c, suggestion))| RankedCollision {
            rank: i + 1,
            collision: c.clone(),
            suggestion,
            effect: effects.as_ref().and_then(|e| e[i].clone()),
        })
        .collect();
    Ok(CollisionReport {
        ruleset: analyzer.ruleset().source.clone(),
        corpus: source.to_string(),
        query_log: log.map(|l| l.source.clone()),
        documents: vocabulary.documents,
        queries: vocabulary.queries,
        searches: vocabulary.searches,
        forms: vocabulary.forms.len(),
        groups: found.groups,
        risky: found.collisions.len(),
        collisions,
    })
}
