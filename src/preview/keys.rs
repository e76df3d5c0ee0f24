//! A ruleset's view of an index: postings per key.
//!
//! [`ConflatedKeys`] is the fast path: over the shared surface index, a key's postings are
//! the union of its members' postings (positions merged, tf summed, df = documents holding
//! any member), and a document's length is its surface token count minus its stopwords.
//! [`DirectKeys`] reads an index built with the real analyzer (the reference path).

use std::borrow::Cow;
use std::sync::Arc;

use rayon::prelude::*;
use rustc_hash::FxHashMap;

use crate::analysis::Analyzer;
use crate::index::{Frequencies, IndexError, IndexPostings, Postings, ReadCache};

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
    /// Reads every field's term dictionary (the fields in parallel).
    pub fn read(index: &IndexPostings) -> Result<Self, IndexError> {
        Ok(SurfaceForms {
            fields: (0..index.num_fields())
                .into_par_iter()
                .map(|f| index.terms(f))
                .collect::<Result<_, _>>()?,
        })
    }
}

/// Every surface form's key under one ruleset (`None`: a stopword). Computed once per side
/// and shared by the change set and that side's conflation groups; a form found in
/// several fields is keyed once.
#[derive(Debug, PartialEq, Eq)]
pub struct FormKeys {
    /// Per distinct form (sorted over all fields), its key.
    keys: Vec<Option<String>>,
    /// Per field, per form: its place among the distinct forms.
    places: Vec<Vec<u32>>,
}

impl FormKeys {
    pub fn compute(analyzer: &Analyzer, forms: &SurfaceForms) -> FormKeys {
        let (distinct, places) = distinct_forms(forms);
        let keys = distinct
            .par_iter()
            .map(|f| analyzer.key(f).map(Cow::into_owned))
            .collect();
        FormKeys { keys, places }
    }

    /// Both sides' keys. With the same stemmer, a form no rule of either side names is
    /// stemmed once for both: most forms, so most of the stemming is shared.
    pub fn compute_pair(
        base: &Analyzer,
        head: &Analyzer,
        forms: &SurfaceForms,
    ) -> (FormKeys, FormKeys) {
        if !base.same_stemmer(head) {
            return (
                FormKeys::compute(base, forms),
                FormKeys::compute(head, forms),
            );
        }
        let (distinct, places) = distinct_forms(forms);
        let (base_keys, head_keys): (Vec<_>, Vec<_>) = distinct
            .par_iter()
            .map(|f| {
                let b = base.key(f).map(Cow::into_owned);
                let h = if base.stems_plainly(f) && head.stems_plainly(f) {
                    b.clone()
                } else {
                    head.key(f).map(Cow::into_owned)
                };
                (b, h)
            })
            .unzip();
        (
            FormKeys {
                keys: base_keys,
                places: places.clone(),
            },
            FormKeys {
                keys: head_keys,
                places,
            },
        )
    }

    /// The key of the `i`-th form of `field`.
    pub fn key(&self, field: usize, i: usize) -> Option<&str> {
        self.keys[self.places[field][i] as usize].as_deref()
    }
}

/// The distinct forms of all fields (sorted), and each field form's place among them.
fn distinct_forms(forms: &SurfaceForms) -> (Vec<&str>, Vec<Vec<u32>>) {
    let mut distinct: Vec<&str> = forms.fields.iter().flatten().map(String::as_str).collect();
    distinct.par_sort_unstable();
    distinct.dedup();
    let places = forms
        .fields
        .iter()
        .map(|list| {
            // Both lists are sorted: one forward walk finds every place.
            let mut at = 0;
            list.iter()
                .map(|form| {
                    at += distinct[at..].partition_point(|d| *d < form.as_str());
                    at as u32
                })
                .collect()
        })
        .collect();
    (distinct, places)
}

/// One ruleset's conflation groups over a surface index.
pub struct ConflatedKeys<'a> {
    index: &'a IndexPostings,
    forms: &'a SurfaceForms,
    /// Per field: key → indices of its member forms.
    members: Vec<FxHashMap<String, Vec<u32>>>,
    lengths: Vec<Vec<u32>>,
    /// Per field: key → its members' union, with and without positions.
    cache: ReadCache<Postings>,
    freq_cache: ReadCache<Frequencies>,
}

/// Positions, and separately postings, of unions kept before a cache is emptied: about
/// 32 MiB and 64 MiB per side.
const UNION_BUDGET: usize = 8 << 20;

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
                match keys.key(field, i) {
                    Some(key) => match groups.get_mut(key) {
                        Some(group) => group.push(i as u32),
                        None => {
                            groups.insert(key.to_string(), vec![i as u32]);
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
            cache: ReadCache::new(lengths.len(), UNION_BUDGET),
            freq_cache: ReadCache::new(lengths.len(), UNION_BUDGET),
            lengths,
        })
    }

    /// The surface forms that make up `key` in `field`.
    pub fn members(&self, field: usize, key: &str) -> Vec<&str> {
        self.member_forms(field, key).collect()
    }

    /// A key's members read with `read` and combined with `combine` (which also says what
    /// the result costs the cache); a single member is the index's own copy.
    fn group<T>(
        &self,
        cache: &ReadCache<T>,
        field: usize,
        key: &str,
        read: impl Fn(&IndexPostings, usize, &str) -> Result<Arc<T>, IndexError>,
        combine: impl Fn(&[Arc<T>]) -> (T, usize),
    ) -> Result<Arc<T>, IndexError> {
        if let Some(hit) = cache.get(field, key) {
            return Ok(hit);
        }
        let parts = self
            .member_forms(field, key)
            .map(|form| read(self.index, field, form))
            .collect::<Result<Vec<_>, _>>()?;
        if let [one] = parts.as_slice() {
            return Ok(Arc::clone(one));
        }
        let (combined, size) = combine(&parts);
        let combined = Arc::new(combined);
        cache.put(field, key, &combined, size);
        Ok(combined)
    }

    fn member_forms(&self, field: usize, key: &str) -> impl Iterator<Item = &str> {
        self.members[field]
            .get(key)
            .into_iter()
            .flatten()
            .map(move |&i| self.forms.fields[field][i as usize].as_str())
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
        self.group(&self.cache, field, key, IndexPostings::postings, |parts| {
            let union = Postings::union(parts);
            let size = union.positions.len();
            (union, size)
        })
    }

    /// A group's tfs are its members' summed: each position holds one surface form, so
    /// members never share a position.
    fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
        self.group(
            &self.freq_cache,
            field,
            key,
            IndexPostings::frequencies,
            |parts| {
                let sum = Frequencies::sum(parts);
                let size = sum.len();
                (sum, size)
            },
        )
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

#[cfg(test)]
mod tests {
    use super::*;
    use crate::analysis::tests::analyzer;

    fn forms(fields: &[&[&str]]) -> SurfaceForms {
        SurfaceForms {
            fields: fields
                .iter()
                .map(|f| {
                    let mut v: Vec<String> = f.iter().map(|s| s.to_string()).collect();
                    v.sort();
                    v
                })
                .collect(),
        }
    }

    fn all_keys(keys: &FormKeys, forms: &SurfaceForms) -> Vec<Vec<Option<String>>> {
        forms
            .fields
            .iter()
            .enumerate()
            .map(|(f, list)| {
                (0..list.len())
                    .map(|i| keys.key(f, i).map(str::to_string))
                    .collect()
            })
            .collect()
    }

    /// Sharing the stemming between the sides changes no key: each side's keys are what
    /// that side alone computes, stopwords, exemptions and lemma overrides included.
    #[test]
    fn paired_keys_equal_each_side_alone() {
        let base = analyzer("pipeline:\n  stemmer: english\n  stopwords: [the]\n");
        let head = analyzer(
            "pipeline:\n  stemmer: english\n  stopwords: [the, running]\n\
             exempt: [universal]\nlemmas:\n  - {form: mice, lemma: mouse}\n",
        );
        let forms = forms(&[
            &["the", "running", "runs", "universal", "university", "mice"],
            &["runs", "mouse", "universe", "the", "ran"],
        ]);
        let (b, h) = FormKeys::compute_pair(&base, &head, &forms);
        assert_eq!(
            all_keys(&b, &forms),
            all_keys(&FormKeys::compute(&base, &forms), &forms)
        );
        assert_eq!(
            all_keys(&h, &forms),
            all_keys(&FormKeys::compute(&head, &forms), &forms)
        );
        assert_eq!(
            h.key(
                0,
                forms.fields[0]
                    .iter()
                    .position(|f| f == "universal")
                    .unwrap()
            ),
            Some("universal")
        );
        assert_eq!(b.key(1, 0), Some("mous"));
    }
}
