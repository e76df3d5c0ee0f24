//! A ruleset's view of an index: postings per key.
//!
//! [`ConflatedKeys`] is the fast path: over the shared surface index, a key's postings are
//! the union of its members' postings (positions merged, tf summed, df = documents holding
//! any member), and a document's length is its surface token count minus its stopwords.
//! [`DirectKeys`] reads an index built with the real analyzer (the reference path).

use std::cell::RefCell;
use std::sync::Arc;

use rustc_hash::FxHashMap;

use crate::analysis::Analyzer;
use crate::index::{IndexError, IndexPostings, Postings};

/// Where retrieval gets its postings and statistics.
pub trait KeySource {
    fn num_docs(&self) -> u32;
    fn num_fields(&self) -> usize;
    /// The length of every document in `field`: the tokens the analyzer keeps (stopwords
    /// excluded).
    fn doc_lengths(&self, field: usize) -> &[u32];
    /// The postings of `key` in `field` (empty if no document holds it).
    fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError>;
    /// Every key present in `field`, sorted.
    fn keys(&self, field: usize) -> Vec<String>;
}

/// The surface forms of each field of a surface index, read once and shared by both sides.
pub struct SurfaceForms {
    pub fields: Vec<Vec<String>>,
}

impl SurfaceForms {
    pub fn read(index: &IndexPostings) -> Result<Self, IndexError> {
        Ok(SurfaceForms {
            fields: (0..index.num_fields())
                .map(|f| index.terms(f))
                .collect::<Result<_, _>>()?,
        })
    }
}

/// One ruleset's conflation groups over a surface index.
pub struct ConflatedKeys<'a> {
    index: &'a IndexPostings,
    forms: &'a SurfaceForms,
    /// Per field: key → indices of its member forms.
    members: Vec<FxHashMap<String, Vec<u32>>>,
    lengths: Vec<Vec<u32>>,
    cache: RefCell<FxHashMap<(usize, String), Arc<Postings>>>,
}

impl<'a> ConflatedKeys<'a> {
    pub fn new(
        index: &'a IndexPostings,
        forms: &'a SurfaceForms,
        analyzer: &Analyzer,
    ) -> Result<Self, IndexError> {
        let mut members = Vec::with_capacity(forms.fields.len());
        let mut lengths = Vec::with_capacity(forms.fields.len());
        for (field, list) in forms.fields.iter().enumerate() {
            let mut groups: FxHashMap<String, Vec<u32>> = FxHashMap::default();
            let mut len = index.lengths(field).to_vec();
            for (i, form) in list.iter().enumerate() {
                match analyzer.key(form) {
                    Some(key) => groups.entry(key.into_owned()).or_default().push(i as u32),
                    None => {
                        for (doc, tf) in index.frequencies(field, form)? {
                            let slot = &mut len[doc as usize];
                            *slot = slot.saturating_sub(tf);
                        }
                    }
                }
            }
            members.push(groups);
            lengths.push(len);
        }
        Ok(ConflatedKeys {
            index,
            forms,
            members,
            lengths,
            cache: RefCell::default(),
        })
    }

    /// The surface forms that make up `key` in `field`.
    pub fn members(&self, field: usize, key: &str) -> Vec<&str> {
        self.members[field]
            .get(key)
            .map(|m| {
                m.iter()
                    .map(|&i| self.forms.fields[field][i as usize].as_str())
                    .collect()
            })
            .unwrap_or_default()
    }
}

impl KeySource for ConflatedKeys<'_> {
    fn num_docs(&self) -> u32 {
        self.index.num_docs()
    }

    fn num_fields(&self) -> usize {
        self.members.len()
    }

    fn doc_lengths(&self, field: usize) -> &[u32] {
        &self.lengths[field]
    }

    fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError> {
        let cache_key = (field, key.to_string());
        if let Some(hit) = self.cache.borrow().get(&cache_key) {
            return Ok(Arc::clone(hit));
        }
        let parts = match self.members[field].get(key) {
            Some(m) => m
                .iter()
                .map(|&i| {
                    self.index
                        .postings(field, &self.forms.fields[field][i as usize])
                })
                .collect::<Result<Vec<_>, _>>()?,
            None => Vec::new(),
        };
        let union = match parts.as_slice() {
            [one] => Arc::clone(one),
            _ => Arc::new(Postings::union(&parts)),
        };
        let mut cache = self.cache.borrow_mut();
        if cache.len() > 100_000 {
            cache.clear();
        }
        cache.insert(cache_key, Arc::clone(&union));
        Ok(union)
    }

    fn keys(&self, field: usize) -> Vec<String> {
        let mut keys: Vec<String> = self.members[field].keys().cloned().collect();
        keys.sort_unstable();
        keys
    }
}

/// An index built with the real analyzer: its terms are keys.
pub struct DirectKeys<'a> {
    index: &'a IndexPostings,
}

impl<'a> DirectKeys<'a> {
    pub fn new(index: &'a IndexPostings) -> Self {
        DirectKeys { index }
    }
}

impl KeySource for DirectKeys<'_> {
    fn num_docs(&self) -> u32 {
        self.index.num_docs()
    }

    fn num_fields(&self) -> usize {
        self.index.num_fields()
    }

    fn doc_lengths(&self, field: usize) -> &[u32] {
        self.index.lengths(field)
    }

    fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError> {
        self.index.postings(field, key)
    }

    fn keys(&self, field: usize) -> Vec<String> {
        self.index.terms(field).unwrap_or_default()
    }
}
