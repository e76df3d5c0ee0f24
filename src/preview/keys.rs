//! A ruleset's view of an index: postings per key.
//!
//! [`ConflatedKeys`] is the fast path: over the shared surface index, a key's postings are
//! the union of its members' postings (positions merged, tf summed, df = documents holding
//! any member), and a document's length is its surface token count minus its stopwords.
//! [`DirectKeys`] reads an index built with the real analyzer (the reference path).

use std::borrow::Cow;
use std::sync::{Arc, Mutex};

use rustc_hash::FxHashMap;

use crate::analysis::Analyzer;
use crate::index::{Frequencies, IndexError, IndexPostings, Postings};

/// Where retrieval gets its postings and statistics.
pub trait KeySource {
    fn num_docs(&self) -> u32;
    fn num_fields(&self) -> usize;
    /// The length of every document in `field`: the tokens the analyzer keeps (stopwords
    /// excluded).
    fn doc_lengths(&self, field: usize) -> &[u32];
    /// The postings of `key` in `field`, with positions (empty if no document holds it).
    fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError>;
    /// The documents and tfs of `key` in `field`, without positions. The default drops
    /// the positions of [`KeySource::postings`]; an index reads less.
    fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
        Ok(Arc::new(Frequencies::from(&*self.postings(field, key)?)))
    }
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

/// Every surface form's key under one ruleset (`None`: a stopword), per field. Computed
/// once per side and shared by the change set and that side's conflation groups; a form
/// found in several fields is keyed once.
pub struct FormKeys {
    pub fields: Vec<Vec<Option<String>>>,
}

impl FormKeys {
    pub fn compute(analyzer: &Analyzer, forms: &SurfaceForms) -> FormKeys {
        // Where each form was first keyed: (field, index).
        let mut first: FxHashMap<&str, (usize, usize)> = FxHashMap::default();
        let mut fields: Vec<Vec<Option<String>>> = Vec::with_capacity(forms.fields.len());
        for (f, list) in forms.fields.iter().enumerate() {
            let mut keys = Vec::with_capacity(list.len());
            for (i, form) in list.iter().enumerate() {
                let key = match first.get(form.as_str()) {
                    Some(&(g, j)) if g < f => fields[g][j].clone(),
                    _ => {
                        first.insert(form, (f, i));
                        analyzer.key(form).map(Cow::into_owned)
                    }
                };
                keys.push(key);
            }
            fields.push(keys);
        }
        FormKeys { fields }
    }
}

/// One ruleset's conflation groups over a surface index.
pub struct ConflatedKeys<'a> {
    index: &'a IndexPostings,
    forms: &'a SurfaceForms,
    /// Per field: key → indices of its member forms.
    members: Vec<FxHashMap<String, Vec<u32>>>,
    lengths: Vec<Vec<u32>>,
    /// Per field: key → its members' union, with and without positions.
    /// (Behind locks: queries are evaluated in parallel.)
    cache: Mutex<Vec<FxHashMap<String, Arc<Postings>>>>,
    freq_cache: Mutex<Vec<FxHashMap<String, Arc<Frequencies>>>>,
}

/// Unions kept per cache before it is emptied.
const CACHE_ENTRIES: usize = 100_000;

impl<'a> ConflatedKeys<'a> {
    pub fn new(
        index: &'a IndexPostings,
        forms: &'a SurfaceForms,
        analyzer: &Analyzer,
    ) -> Result<Self, IndexError> {
        ConflatedKeys::with_keys(index, forms, &FormKeys::compute(analyzer, forms))
    }

    /// The groups of forms already keyed.
    pub fn with_keys(
        index: &'a IndexPostings,
        forms: &'a SurfaceForms,
        keys: &FormKeys,
    ) -> Result<Self, IndexError> {
        let mut members = Vec::with_capacity(forms.fields.len());
        let mut lengths = Vec::with_capacity(forms.fields.len());
        for (field, list) in forms.fields.iter().enumerate() {
            let mut groups: FxHashMap<String, Vec<u32>> = FxHashMap::default();
            let mut len = index.lengths(field).to_vec();
            for (i, form) in list.iter().enumerate() {
                match &keys.fields[field][i] {
                    Some(key) => match groups.get_mut(key.as_str()) {
                        Some(group) => group.push(i as u32),
                        None => {
                            groups.insert(key.clone(), vec![i as u32]);
                        }
                    },
                    None => {
                        let stopword = index.frequencies(field, form)?;
                        for (&doc, &tf) in stopword.docs.iter().zip(&stopword.tfs) {
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
            cache: Mutex::new(vec![FxHashMap::default(); lengths.len()]),
            freq_cache: Mutex::new(vec![FxHashMap::default(); lengths.len()]),
            lengths,
        })
    }

    /// The surface forms that make up `key` in `field`.
    pub fn members(&self, field: usize, key: &str) -> Vec<&str> {
        self.member_forms(field, key).collect()
    }

    fn member_forms(&self, field: usize, key: &str) -> impl Iterator<Item = &str> {
        self.members[field]
            .get(key)
            .into_iter()
            .flatten()
            .map(move |&i| self.forms.fields[field][i as usize].as_str())
    }
}

type Cache<T> = Mutex<Vec<FxHashMap<String, Arc<T>>>>;

fn cached<T>(cache: &Cache<T>, field: usize, key: &str) -> Option<Arc<T>> {
    let cache = cache
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner());
    cache[field].get(key).map(Arc::clone)
}

fn remember<T>(cache: &Cache<T>, field: usize, key: &str, value: &Arc<T>) {
    let mut cache = cache
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner());
    if cache[field].len() >= CACHE_ENTRIES {
        cache[field].clear();
    }
    cache[field].insert(key.to_string(), Arc::clone(value));
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
        if let Some(hit) = cached(&self.cache, field, key) {
            return Ok(hit);
        }
        let parts = self
            .member_forms(field, key)
            .map(|form| self.index.postings(field, form))
            .collect::<Result<Vec<_>, _>>()?;
        let union = match parts.as_slice() {
            [one] => Arc::clone(one),
            _ => Arc::new(Postings::union(&parts)),
        };
        remember(&self.cache, field, key, &union);
        Ok(union)
    }

    /// A group's tfs are its members' summed: each position holds one surface form, so
    /// members never share a position.
    fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
        if let Some(hit) = cached(&self.freq_cache, field, key) {
            return Ok(hit);
        }
        let parts = self
            .member_forms(field, key)
            .map(|form| self.index.frequencies(field, form))
            .collect::<Result<Vec<_>, _>>()?;
        let sum = match parts.as_slice() {
            [one] => Arc::clone(one),
            _ => Arc::new(Frequencies::sum(&parts)),
        };
        remember(&self.freq_cache, field, key, &sum);
        Ok(sum)
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

    fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
        self.index.frequencies(field, key)
    }

    fn keys(&self, field: usize) -> Vec<String> {
        self.index.terms(field).unwrap_or_default()
    }
}
