//! The words a search actually meets, read through one analyzer.
//!
//! Lint judges rules against real text with the corpus vocabulary
//! ([`crate::corpus::Vocabulary`], the one every command shares): a rule term whose key
//! other surface forms share fires for those forms too, and a rule none of whose words
//! occur is dead.

use rustc_hash::FxHashMap;

use crate::analysis::Analyzer;
use crate::corpus::{FormStats, Vocabulary};

/// A vocabulary read through one analyzer: which surface forms share each key.
///
/// Built once per lint run (one key computation per distinct form), so a check asks "who
/// else keys to this?" with a hash probe instead of scanning the vocabulary per rule term.
#[derive(Clone, Debug)]
pub struct KeyedVocabulary<'v> {
    pub vocabulary: &'v Vocabulary,
    by_key: FxHashMap<String, Vec<&'v FormStats>>,
}

impl<'v> KeyedVocabulary<'v> {
    pub fn new(vocabulary: &'v Vocabulary, analyzer: &Analyzer) -> Self {
        let mut by_key: FxHashMap<String, Vec<&'v FormStats>> = FxHashMap::default();
        // Forms come sorted, so every key's list is in form order.
        for stats in &vocabulary.forms {
            let Some(key) = analyzer.key(&stats.form) else {
                continue;
            };
            match by_key.get_mut(key.as_ref()) {
                Some(list) => list.push(stats),
                None => {
                    by_key.insert(key.into_owned(), vec![stats]);
                }
            }
        }
        KeyedVocabulary { vocabulary, by_key }
    }

    /// Every form with its counts, in form order.
    pub fn sorted(&self) -> &'v [FormStats] {
        &self.vocabulary.forms
    }

    /// The surface forms whose key is `key`, in form order.
    pub fn forms_with_key(&self, key: &str) -> &[&'v FormStats] {
        self.by_key.get(key).map_or(&[], Vec::as_slice)
    }

    /// Whether any surface form of the vocabulary has this key.
    pub fn has_key(&self, key: &str) -> bool {
        self.by_key.contains_key(key)
    }
}
