//! Postings for a few forms: which documents contain them. A second pass over the corpus,
//! restricted to the forms an effect estimate needs, so memory stays small however large
//! the corpus is.

use std::path::Path;

use rustc_hash::{FxHashMap, FxHashSet};

use crate::analysis::SurfaceStage;
use crate::corpus::{CorpusError, DocOptions, Document, for_each_document, for_each_in_memory};

/// Form → sorted, distinct document indexes.
#[derive(Clone, Debug, Default)]
pub struct Postings {
    map: FxHashMap<String, Vec<u32>>,
}

type Part = FxHashMap<String, Vec<u32>>;

impl Postings {
    /// Collects postings for `wanted` on `threads` threads.
    pub fn collect(
        surface: &SurfaceStage,
        documents: &[Document],
        wanted: &FxHashSet<String>,
        threads: usize,
    ) -> Self {
        if wanted.is_empty() {
            return Postings::default();
        }
        let parts = for_each_in_memory(documents, threads, Part::default, |part, i, texts| {
            collect_document(surface, wanted, part, i, texts)
        });
        Self::merge(parts)
    }

    /// Collects postings for `wanted` from the documents of `path`, streaming (see
    /// [`for_each_document`]); document numbers are the reader's.
    pub fn collect_file(
        surface: &SurfaceStage,
        path: &Path,
        options: &DocOptions,
        wanted: &FxHashSet<String>,
        threads: usize,
    ) -> Result<Self, CorpusError> {
        if wanted.is_empty() {
            return Ok(Postings::default());
        }
        let walk = for_each_document(path, options, threads, Part::default, |part, i, texts| {
            collect_document(surface, wanted, part, i, texts)
        })?;
        Ok(Self::merge(walk.states))
    }

    /// Threads saw disjoint documents, so concatenating and sorting keeps lists distinct.
    fn merge(parts: Vec<Part>) -> Self {
        let mut map: Part = FxHashMap::default();
        for part in parts {
            for (form, docs) in part {
                map.entry(form).or_default().extend(docs);
            }
        }
        for docs in map.values_mut() {
            docs.sort_unstable();
        }
        Postings { map }
    }

    pub fn get(&self, form: &str) -> &[u32] {
        self.map.get(form).map_or(&[], Vec::as_slice)
    }

    /// The documents containing any of `forms`.
    pub fn union<'a>(&self, forms: impl IntoIterator<Item = &'a str>) -> Vec<u32> {
        let mut out: Vec<u32> = forms
            .into_iter()
            .flat_map(|f| self.get(f))
            .copied()
            .collect();
        out.sort_unstable();
        out.dedup();
        out
    }
}

fn collect_document(
    surface: &SurfaceStage,
    wanted: &FxHashSet<String>,
    map: &mut Part,
    i: usize,
    texts: &[&str],
) {
    let id = i as u32;
    for text in texts {
        surface.for_each(text, |_, form| {
            if wanted.contains(&*form) {
                match map.get_mut(&*form) {
                    Some(list) if list.last() == Some(&id) => {}
                    Some(list) => list.push(id),
                    None => {
                        map.insert(form.into_owned(), vec![id]);
                    }
                }
            }
        });
    }
}
