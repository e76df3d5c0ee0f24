//! The corpus vocabulary every command shares (lint, collisions, stemcheck, review): every
//! distinct surface form with its document frequency and the query traffic that mentions
//! it, built in one pass. Only the surface stage (steps 1–3) runs while counting, so one
//! vocabulary serves every ruleset with the same surface settings.
//!
//! Speed matters (a million documents hold about 140,000 distinct forms): documents are
//! split across threads, each thread interns forms in its own `FxHashMap` and counts a
//! form once per document through a "last document seen" slot, and the per-thread tables
//! are merged at the end. Keys are not computed here: each distinct form is keyed once,
//! later, instead of once per occurrence.

use std::path::Path;

use rustc_hash::FxHashMap;

use serde::Serialize;

use super::{
    Corpus, CorpusError, CorpusWarning, DocOptions, Document, QueryLog, for_each_document,
    for_each_in_memory,
};
use crate::analysis::SurfaceStage;

/// One distinct surface form.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct FormStats {
    pub form: String,
    /// Documents containing the form (in any field).
    pub documents: u64,
    /// Searches (query counts) whose query contains the form.
    pub searches: u64,
    /// Distinct queries containing the form.
    pub queries: u64,
}

/// The vocabulary, sorted by form.
#[derive(Clone, Debug, Default)]
pub struct Vocabulary {
    pub forms: Vec<FormStats>,
    pub documents: usize,
    pub queries: usize,
    pub searches: u64,
}

/// Totals, for reports.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
pub struct VocabularySummary {
    pub forms: usize,
    pub documents: u64,
    pub searches: u64,
}

/// Per-thread counts: form → (document frequency, last document counted).
type Counts = FxHashMap<Box<str>, (u64, usize)>;

/// Document frequencies of every form, before the query log is added.
#[derive(Clone, Debug, Default)]
pub struct DocumentCounts {
    merged: Merged,
    documents: usize,
    /// The reader's warnings (fields few documents have).
    pub warnings: Vec<CorpusWarning>,
}

impl DocumentCounts {
    /// Counts `documents` on `threads` threads.
    pub fn from_documents(surface: &SurfaceStage, documents: &[Document], threads: usize) -> Self {
        let tables = for_each_in_memory(documents, threads, Counts::default, |counts, i, texts| {
            count_document(surface, counts, i, texts)
        });
        DocumentCounts {
            merged: merge(tables),
            documents: documents.len(),
            warnings: Vec::new(),
        }
    }

    /// Counts the documents of `path` as [`crate::corpus::read_documents`] would read
    /// them, streaming (see [`for_each_document`]).
    pub fn from_file(
        surface: &SurfaceStage,
        path: &Path,
        options: &DocOptions,
        threads: usize,
    ) -> Result<Self, CorpusError> {
        let walk = for_each_document(
            path,
            options,
            threads,
            Counts::default,
            |counts, i, texts| count_document(surface, counts, i, texts),
        )?;
        Ok(DocumentCounts {
            merged: merge(walk.states),
            documents: walk.documents,
            warnings: walk.warnings,
        })
    }
}

impl Vocabulary {
    /// The vocabulary of a corpus (every searched field of each document) and a query log;
    /// either may be missing.
    pub fn from_corpus(
        surface: &SurfaceStage,
        corpus: Option<&Corpus>,
        log: Option<&QueryLog>,
    ) -> Self {
        let documents = corpus.map_or(&[][..], |c| &c.documents[..]);
        Self::build(surface, documents, log, default_threads())
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
        let documents: Vec<Document> = documents
            .into_iter()
            .enumerate()
            .map(|(i, text)| Document {
                id: i.to_string(),
                title: String::new(),
                texts: vec![text.as_ref().to_string()],
            })
            .collect();
        let log = QueryLog::from_entries(
            "",
            queries.into_iter().map(|(text, count)| super::QueryEntry {
                query: text.as_ref().to_string(),
                count,
                clicks: Default::default(),
            }),
        );
        Self::build(surface, &documents, Some(&log), 1)
    }

    /// A vocabulary from forms counted elsewhere (a repeated form's counts are added), with
    /// no document or query totals.
    pub fn from_forms(forms: impl IntoIterator<Item = FormStats>) -> Self {
        let mut forms: Vec<FormStats> = forms.into_iter().collect();
        forms.sort_by(|a, b| a.form.cmp(&b.form));
        forms.dedup_by(|next, kept| {
            let same = next.form == kept.form;
            if same {
                kept.documents = kept.documents.saturating_add(next.documents);
                kept.searches = kept.searches.saturating_add(next.searches);
                kept.queries = kept.queries.saturating_add(next.queries);
            }
            same
        });
        Vocabulary {
            forms,
            ..Vocabulary::default()
        }
    }

    /// The form's counts, if the vocabulary has it.
    pub fn get(&self, form: &str) -> Option<&FormStats> {
        self.forms
            .binary_search_by(|f| f.form.as_str().cmp(form))
            .ok()
            .map(|i| &self.forms[i])
    }

    pub fn contains(&self, form: &str) -> bool {
        self.get(form).is_some()
    }

    /// Number of distinct surface forms.
    pub fn len(&self) -> usize {
        self.forms.len()
    }

    pub fn is_empty(&self) -> bool {
        self.forms.is_empty()
    }

    pub fn summary(&self) -> VocabularySummary {
        VocabularySummary {
            forms: self.forms.len(),
            documents: self.documents as u64,
            searches: self.searches,
        }
    }

    /// Builds the vocabulary of `documents` (and of `queries`, when given) on `threads`
    /// threads.
    pub fn build(
        surface: &SurfaceStage,
        documents: &[Document],
        queries: Option<&QueryLog>,
        threads: usize,
    ) -> Self {
        Self::from_counts(
            surface,
            DocumentCounts::from_documents(surface, documents, threads),
            queries,
        )
    }

    /// The vocabulary of counted documents, with the query log's traffic added.
    pub fn from_counts(
        surface: &SurfaceStage,
        counts: DocumentCounts,
        queries: Option<&QueryLog>,
    ) -> Self {
        let DocumentCounts {
            mut merged,
            documents,
            ..
        } = counts;
        let (queries_n, searches) = match queries {
            Some(log) => {
                add_queries(surface, log, &mut merged);
                (log.queries.len(), log.total_searches())
            }
            None => (0, 0),
        };
        let mut forms: Vec<FormStats> = merged
            .into_iter()
            .map(|(form, (documents, searches, queries))| FormStats {
                form: form.into_string(),
                documents,
                searches,
                queries,
            })
            .collect();
        forms.sort_unstable_by(|a, b| a.form.cmp(&b.form));
        Vocabulary {
            forms,
            documents,
            queries: queries_n,
            searches,
        }
    }
}

fn default_threads() -> usize {
    std::thread::available_parallelism().map_or(1, |n| n.get())
}

/// Counts each form of one document once, through the "last document seen" slot.
fn count_document(surface: &SurfaceStage, counts: &mut Counts, i: usize, texts: &[&str]) {
    for text in texts {
        surface.for_each(text, |_, form| {
            // A probe with the borrowed form first: allocation only for a new form.
            if let Some(slot) = counts.get_mut(&*form) {
                if slot.1 != i {
                    *slot = (slot.0 + 1, i);
                }
            } else {
                counts.insert(form.into_owned().into_boxed_str(), (1, i));
            }
        });
    }
}

/// form → (documents, searches, queries)
type Merged = FxHashMap<Box<str>, (u64, u64, u64)>;

fn merge(tables: Vec<Counts>) -> Merged {
    let mut tables = tables.into_iter();
    let mut merged: Merged = tables
        .next()
        .unwrap_or_default()
        .into_iter()
        .map(|(form, (df, _))| (form, (df, 0, 0)))
        .collect();
    for table in tables {
        for (form, (df, _)) in table {
            merged.entry(form).or_default().0 += df;
        }
    }
    merged
}

fn add_queries(surface: &SurfaceStage, log: &QueryLog, merged: &mut Merged) {
    for entry in &log.queries {
        let mut seen: Vec<String> = Vec::new();
        surface.for_each(&entry.query, |_, form| {
            if !seen.iter().any(|s| *s == *form) {
                seen.push(form.into_owned());
            }
        });
        for form in seen {
            let slot = merged.entry(form.into_boxed_str()).or_default();
            slot.1 = slot.1.saturating_add(entry.count);
            slot.2 += 1;
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::corpus::QueryEntry;
    use crate::rules::Pipeline;

    fn doc(id: &str, text: &str) -> Document {
        Document {
            id: id.into(),
            title: String::new(),
            texts: vec![text.into()],
        }
    }

    #[test]
    fn documents_count_once_and_queries_carry_their_traffic() {
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let v = Vocabulary::from_texts(
            &surface,
            ["University pass, university card", "The universe"],
            [("university pass", 40), ("pass", 2)],
        );
        let university = v.get("university").unwrap();
        assert_eq!((university.documents, university.searches), (1, 40));
        assert_eq!(v.get("pass").unwrap().searches, 42);
        assert_eq!(v.get("universe").unwrap().documents, 1);
        assert!(!v.contains("universes"));
        assert_eq!(v.summary().documents, 2);
        assert_eq!(v.summary().searches, 42);
        assert!(v.forms.windows(2).all(|w| w[0].form < w[1].form));
    }

    #[test]
    fn a_form_counts_once_per_document_whatever_the_thread_count() {
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let docs = vec![
            doc("a", "Trams and trams"),
            doc("b", "tram"),
            doc("c", "trams"),
        ];
        let log = QueryLog::from_entries(
            "q",
            vec![QueryEntry {
                query: "trams trams".into(),
                count: 5,
                clicks: Default::default(),
            }],
        );
        for threads in [1, 2, 3, 8] {
            let v = Vocabulary::build(&surface, &docs, Some(&log), threads);
            let trams = v.forms.iter().find(|f| f.form == "trams").unwrap();
            assert_eq!((trams.documents, trams.searches, trams.queries), (2, 5, 1));
            assert_eq!(v.forms.len(), 3, "and, tram, trams");
        }
    }
}
