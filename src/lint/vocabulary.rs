//! The words a search actually meets: surface forms with how many documents hold them and
//! how many searches typed them.
//!
//! Lint uses it to judge rules against real text: a rule term whose key other surface forms
//! share fires for those forms too, and a rule none of whose words occur is dead. Only the
//! surface stage (steps 1–3) runs while counting, so one vocabulary serves every ruleset
//! with the same surface settings.

use std::cell::OnceCell;

use rustc_hash::{FxHashMap, FxHashSet};
use serde::Serialize;

use crate::analysis::{Analyzer, SurfaceStage};
use crate::corpus::{Corpus, QueryLog};

/// How often one surface form occurs.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Serialize)]
pub struct FormStats {
    /// Documents that contain the form at least once.
    pub documents: u64,
    /// Searches (query count summed over distinct queries) that contain it.
    pub searches: u64,
}

/// Surface form → how often it occurs in documents and in the query log.
#[derive(Clone, Debug, Default)]
pub struct Vocabulary {
    forms: FxHashMap<String, FormStats>,
    documents: u64,
    searches: u64,
}

/// Totals, for reports.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
pub struct VocabularySummary {
    pub forms: usize,
    pub documents: u64,
    pub searches: u64,
}

impl Vocabulary {
    pub fn new() -> Self {
        Vocabulary::default()
    }

    /// Counts documents (each one text) and queries (each a text and how many times it was
    /// searched), through the surface stage.
    pub fn from_texts<D, Q, S, T>(surface: &SurfaceStage, documents: D, queries: Q) -> Self
    where
        D: IntoIterator<Item = S>,
        S: AsRef<str>,
        Q: IntoIterator<Item = (T, u64)>,
        T: AsRef<str>,
    {
        let mut vocabulary = Vocabulary::new();
        for text in documents {
            vocabulary.add_document(surface, text.as_ref());
        }
        for (text, count) in queries {
            vocabulary.add_query(surface, text.as_ref(), count);
        }
        vocabulary
    }

    /// The vocabulary of a corpus (every searched field of each document) and a query log.
    pub fn from_corpus(
        surface: &SurfaceStage,
        corpus: Option<&Corpus>,
        log: Option<&QueryLog>,
    ) -> Self {
        let mut vocabulary = Vocabulary::new();
        for doc in corpus.iter().flat_map(|c| &c.documents) {
            vocabulary.add_document(surface, &doc.texts.join("\n\n"));
        }
        for q in log.iter().flat_map(|l| &l.queries) {
            vocabulary.add_query(surface, &q.query, q.count);
        }
        vocabulary
    }

    /// Counts one document: each distinct form once.
    pub fn add_document(&mut self, surface: &SurfaceStage, text: &str) {
        self.documents += 1;
        for form in distinct_forms(surface, text) {
            self.entry(form).documents += 1;
        }
    }

    /// Counts one distinct query searched `count` times: each distinct form gets `count`.
    pub fn add_query(&mut self, surface: &SurfaceStage, text: &str, count: u64) {
        self.searches = self.searches.saturating_add(count);
        for form in distinct_forms(surface, text) {
            let stats = self.entry(form);
            stats.searches = stats.searches.saturating_add(count);
        }
    }

    /// Adds counts for a form directly (for callers that counted forms themselves).
    pub fn add_form(&mut self, form: &str, stats: FormStats) {
        let entry = self.entry(form.to_string());
        entry.documents = entry.documents.saturating_add(stats.documents);
        entry.searches = entry.searches.saturating_add(stats.searches);
    }

    fn entry(&mut self, form: String) -> &mut FormStats {
        self.forms.entry(form).or_default()
    }

    pub fn get(&self, form: &str) -> Option<FormStats> {
        self.forms.get(form).copied()
    }

    pub fn contains(&self, form: &str) -> bool {
        self.forms.contains_key(form)
    }

    /// Number of distinct surface forms.
    pub fn len(&self) -> usize {
        self.forms.len()
    }

    pub fn is_empty(&self) -> bool {
        self.forms.is_empty()
    }

    /// Every form with its counts, sorted by form so that whatever is built from it is
    /// deterministic.
    pub fn sorted(&self) -> Vec<(&str, FormStats)> {
        let mut out: Vec<(&str, FormStats)> =
            self.forms.iter().map(|(f, s)| (f.as_str(), *s)).collect();
        out.sort_unstable_by(|a, b| a.0.cmp(b.0));
        out
    }

    pub fn summary(&self) -> VocabularySummary {
        VocabularySummary {
            forms: self.forms.len(),
            documents: self.documents,
            searches: self.searches,
        }
    }
}

/// A vocabulary read through one analyzer: which surface forms share each key.
///
/// Built once per lint run (one key computation per distinct form), so a check asks "who
/// else keys to this?" with a hash probe instead of scanning the vocabulary per rule term.
#[derive(Clone, Debug)]
pub struct KeyedVocabulary<'v> {
    pub vocabulary: &'v Vocabulary,
    /// Every form, in form order, sorted on first use (only pattern checks need it).
    sorted: OnceCell<Vec<(&'v str, FormStats)>>,
    by_key: FxHashMap<String, Vec<(&'v str, FormStats)>>,
}

impl<'v> KeyedVocabulary<'v> {
    pub fn new(vocabulary: &'v Vocabulary, analyzer: &Analyzer) -> Self {
        let mut by_key: FxHashMap<String, Vec<(&'v str, FormStats)>> = FxHashMap::default();
        for (form, stats) in &vocabulary.forms {
            let Some(key) = analyzer.key(form) else {
                continue;
            };
            let entry = (form.as_str(), *stats);
            match by_key.get_mut(key.as_ref()) {
                Some(list) => list.push(entry),
                None => {
                    by_key.insert(key.into_owned(), vec![entry]);
                }
            }
        }
        // Hash order is arbitrary: sort each (short) list so results are deterministic.
        for list in by_key.values_mut() {
            list.sort_unstable_by(|a, b| a.0.cmp(b.0));
        }
        KeyedVocabulary {
            vocabulary,
            sorted: OnceCell::new(),
            by_key,
        }
    }

    /// Every form with its counts, in form order.
    pub fn sorted(&self) -> &[(&'v str, FormStats)] {
        self.sorted.get_or_init(|| self.vocabulary.sorted())
    }

    /// The surface forms whose key is `key`, in form order.
    pub fn forms_with_key(&self, key: &str) -> &[(&'v str, FormStats)] {
        self.by_key.get(key).map_or(&[], Vec::as_slice)
    }

    /// Whether any surface form of the vocabulary has this key.
    pub fn has_key(&self, key: &str) -> bool {
        self.by_key.contains_key(key)
    }
}

fn distinct_forms(surface: &SurfaceStage, text: &str) -> FxHashSet<String> {
    let mut seen = FxHashSet::default();
    surface.for_each(text, |_, form| {
        if !seen.contains(form.as_ref()) {
            seen.insert(form.into_owned());
        }
    });
    seen
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rules::Pipeline;

    #[test]
    fn documents_count_once_and_queries_carry_their_traffic() {
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let v = Vocabulary::from_texts(
            &surface,
            ["University pass, university card", "The universe"],
            [("university pass", 40), ("pass", 2)],
        );
        assert_eq!(
            v.get("university"),
            Some(FormStats {
                documents: 1,
                searches: 40
            })
        );
        assert_eq!(v.get("pass").unwrap().searches, 42);
        assert_eq!(v.get("universe").unwrap().documents, 1);
        assert_eq!(v.summary().documents, 2);
        assert_eq!(v.summary().searches, 42);
        let sorted: Vec<&str> = v.sorted().into_iter().map(|(f, _)| f).collect();
        assert!(sorted.windows(2).all(|w| w[0] < w[1]));
    }
}
