//! The documents of a few surface forms, as the index's own lists ([`Frequencies`]: the
//! documents, ascending, and the form's occurrences in each): a second pass over the
//! corpus, restricted to the forms an effect estimate needs, so memory stays small however
//! large the corpus is. Document numbers are the corpus reader's.

use std::path::Path;
use std::sync::Arc;

use rustc_hash::{FxHashMap, FxHashSet};

use crate::analysis::SurfaceStage;
use crate::corpus::{CorpusError, DocOptions, Document, for_each_document, for_each_in_memory};
use crate::index::Frequencies;

/// Surface form → its documents and occurrences in each (all searched fields together).
#[derive(Clone, Debug, Default)]
pub struct FormLists {
    map: FxHashMap<String, Arc<Frequencies>>,
}

/// Per thread: form → (documents, occurrences), in the order the thread saw them.
type Part = FxHashMap<String, (Vec<u32>, Vec<u32>)>;

impl FormLists {
    /// Collects the lists of `wanted` on `threads` threads.
    pub fn collect(
        surface: &SurfaceStage,
        documents: &[Document],
        wanted: &FxHashSet<String>,
        threads: usize,
    ) -> Self {
        if wanted.is_empty() {
            return FormLists::default();
        }
        let parts = for_each_in_memory(documents, threads, Part::default, |part, i, texts| {
            collect_document(surface, wanted, part, i, texts)
        });
        Self::merge(parts)
    }

    /// Collects the lists of `wanted` from the documents of `path`, streaming (see
    /// [`for_each_document`]).
    pub fn collect_file(
        surface: &SurfaceStage,
        path: &Path,
        options: &DocOptions,
        wanted: &FxHashSet<String>,
        threads: usize,
    ) -> Result<Self, CorpusError> {
        if wanted.is_empty() {
            return Ok(FormLists::default());
        }
        let walk = for_each_document(path, options, threads, Part::default, |part, i, texts| {
            collect_document(surface, wanted, part, i, texts)
        })?;
        Ok(Self::merge(walk.states))
    }

    /// Threads saw disjoint documents: their lists are merged by document.
    fn merge(parts: Vec<Part>) -> Self {
        let mut pairs: FxHashMap<String, Vec<(u32, u32)>> = FxHashMap::default();
        for part in parts {
            for (form, (docs, tfs)) in part {
                pairs
                    .entry(form)
                    .or_default()
                    .extend(docs.into_iter().zip(tfs));
            }
        }
        let map = pairs
            .into_iter()
            .map(|(form, mut list)| {
                list.sort_unstable();
                let (docs, tfs) = list.into_iter().unzip();
                (form, Arc::new(Frequencies::new(docs, tfs)))
            })
            .collect();
        FormLists { map }
    }

    /// The documents containing `form`, ascending.
    pub fn get(&self, form: &str) -> &[u32] {
        self.map.get(form).map_or(&[], |f| f.docs.as_slice())
    }

    /// The documents containing any of `forms`, ascending: the list of their conflation
    /// group, merged as the index merges a group's members.
    pub fn union<'a>(&self, forms: impl IntoIterator<Item = &'a str>) -> Vec<u32> {
        let parts: Vec<Arc<Frequencies>> = forms
            .into_iter()
            .filter_map(|f| self.map.get(f).cloned())
            .collect();
        Frequencies::sum(&parts).docs
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
                    Some((docs, tfs)) if docs.last() == Some(&id) => {
                        *tfs.last_mut().expect("a document has its count") += 1;
                    }
                    Some((docs, tfs)) => {
                        docs.push(id);
                        tfs.push(1);
                    }
                    None => {
                        map.insert(form.into_owned(), (vec![id], vec![1]));
                    }
                }
            }
        });
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rules::Pipeline;

    #[test]
    fn a_forms_documents_are_the_same_whatever_the_thread_count() {
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let docs: Vec<Document> = ["trams and trams", "tram", "buses", "a tram, trams"]
            .iter()
            .enumerate()
            .map(|(i, t)| Document {
                id: i.to_string(),
                title: String::new(),
                texts: vec![t.to_string()],
            })
            .collect();
        let wanted: FxHashSet<String> = ["tram", "trams"].map(String::from).into_iter().collect();
        for threads in [1, 2, 3] {
            let lists = FormLists::collect(&surface, &docs, &wanted, threads);
            assert_eq!(lists.get("trams"), [0, 3]);
            assert_eq!(lists.get("tram"), [1, 3]);
            assert_eq!(lists.union(["tram", "trams"]), [0, 1, 3]);
            assert_eq!(lists.map["trams"].tfs, [2, 1]);
            assert!(lists.get("buses").is_empty());
        }
    }
}
