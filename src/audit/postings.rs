//! Postings for a few forms: which documents contain them. A second pass over the corpus,
//! restricted to the forms an effect estimate needs, so memory stays small however large
//! the corpus is.

use rustc_hash::{FxHashMap, FxHashSet};

use crate::analysis::SurfaceStage;
use crate::corpus::Document;

/// Form → sorted, distinct document indexes.
#[derive(Clone, Debug, Default)]
pub struct Postings {
    map: FxHashMap<String, Vec<u32>>,
}

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
        let chunk = documents.len().div_ceil(threads.max(1)).max(1);
        let parts: Vec<FxHashMap<String, Vec<u32>>> = std::thread::scope(|scope| {
            let handles: Vec<_> = documents
                .chunks(chunk)
                .enumerate()
                .map(|(n, part)| {
                    scope.spawn(move || collect_part(surface, part, n * chunk, wanted))
                })
                .collect();
            handles
                .into_iter()
                .map(|h| h.join().expect("a postings thread panicked"))
                .collect()
        });
        let mut map: FxHashMap<String, Vec<u32>> = FxHashMap::default();
        // Parts cover consecutive document ranges, so appending keeps each list sorted.
        for part in parts {
            for (form, docs) in part {
                map.entry(form).or_default().extend(docs);
            }
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

fn collect_part(
    surface: &SurfaceStage,
    documents: &[Document],
    first: usize,
    wanted: &FxHashSet<String>,
) -> FxHashMap<String, Vec<u32>> {
    let mut map: FxHashMap<String, Vec<u32>> = FxHashMap::default();
    for (i, doc) in documents.iter().enumerate() {
        let id = (first + i) as u32;
        for text in &doc.texts {
            surface.for_each(text, |_, form| {
                if wanted.contains(&*form) {
                    let list = map.entry(form.into_owned()).or_default();
                    if list.last() != Some(&id) {
                        list.push(id);
                    }
                }
            });
        }
    }
    map
}
