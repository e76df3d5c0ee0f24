//! A ruleset's view of an index: postings per key.
//!
//! [`ConflatedKeys`] is the fast path: over the shared surface index, a key's postings are
//! the union of its members' postings (positions merged, tf summed, df = documents holding
//! any member), and a document's length is its surface token count minus its stopwords.
//! [`DirectKeys`] reads an index built with the real analyzer (the reference path).

use std::borrow::Cow;
use std::sync::Arc;

use rayon::prelude::*;
use rustc_hash::FxHashSet;

use crate::analysis::Analyzer;
use crate::index::{Frequencies, IndexError, IndexPostings, Postings, ReadCache, SurfaceForms};

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
    /// The documents and tfs of any of `keys` (distinct) in `field`: their tfs summed, as
    /// distinct keys never share a position. What a clause of one-word alternatives reads.
    /// The default sums [`KeySource::frequencies`]; a source may keep the sum.
    fn frequencies_of_any(
        &self,
        field: usize,
        keys: &[&str],
    ) -> Result<Arc<Frequencies>, IndexError> {
        match keys {
            [only] => self.frequencies(field, only),
            _ => {
                let parts = keys
                    .iter()
                    .map(|k| self.frequencies(field, k))
                    .collect::<Result<Vec<_>, _>>()?;
                Ok(Arc::new(Frequencies::sum(&parts)))
            }
        }
    }

    /// Every key present in `field`, sorted.
    fn keys(&self, field: usize) -> Vec<String>;
}

/// Every distinct surface form's key under one ruleset (`None`: a stopword), and the
/// forms grouped by key. Computed once per side and shared by the change set and that
/// side's conflation groups; a form found in several fields is keyed once.
#[derive(Debug, PartialEq, Eq)]
pub struct FormKeys {
    /// Per distinct form (see [`SurfaceForms::forms`]), its key.
    keys: Vec<Option<String>>,
    /// The forms that have a key, ordered by key (then by form): a key's members are one
    /// run of this list.
    by_key: Vec<u32>,
}

/// The stems of every distinct form of `forms` under `analyzer`'s stemmer alone, kept
/// beside a cached index (`None` without a stemmer: a form is its own stem).
pub fn stems(
    index: &IndexPostings,
    forms: &SurfaceForms,
    analyzer: &Analyzer,
) -> Result<Option<Vec<String>>, IndexError> {
    if analyzer.stemmer_name() == "none" {
        return Ok(None);
    }
    let name = format!("stems-{}", analyzer.stemmer_id());
    let stems = index.derived_strings(&name, || {
        Ok(forms
            .forms
            .par_iter()
            .map(|f| analyzer.stem_alone(f).into_owned())
            .collect())
    })?;
    Ok((stems.len() == forms.len()).then_some(stems))
}

impl FormKeys {
    /// Every form's key; `stems` (from [`stems`]) saves stemming the forms no rule names.
    pub fn compute(
        analyzer: &Analyzer,
        forms: &SurfaceForms,
        stems: Option<&[String]>,
    ) -> FormKeys {
        let keys = forms
            .forms
            .par_iter()
            .enumerate()
            .map(|(i, f)| key_of(analyzer, f, stems.map(|s| s[i].as_str())))
            .collect();
        FormKeys::grouped(keys)
    }

    /// Both sides' keys. With the same stemmer, a form no rule of either side names is
    /// stemmed once for both: most forms, so most of the stemming is shared.
    pub fn compute_pair(
        base: &Analyzer,
        head: &Analyzer,
        forms: &SurfaceForms,
        stems: Option<&[String]>,
    ) -> (FormKeys, FormKeys) {
        if !base.same_stemmer(head) {
            return (
                FormKeys::compute(base, forms, stems),
                FormKeys::compute(head, forms, None),
            );
        }
        let (base_keys, head_keys): (Vec<_>, Vec<_>) = forms
            .forms
            .par_iter()
            .enumerate()
            .map(|(i, f)| {
                let stem = stems.map(|s| s[i].as_str());
                let b = key_of(base, f, stem);
                let h = if base.stems_plainly(f) && head.stems_plainly(f) {
                    b.clone()
                } else {
                    key_of(head, f, stem)
                };
                (b, h)
            })
            .unzip();
        rayon::join(
            || FormKeys::grouped(base_keys),
            || FormKeys::grouped(head_keys),
        )
    }

    fn grouped(keys: Vec<Option<String>>) -> FormKeys {
        let mut by_key: Vec<u32> = (0..keys.len() as u32)
            .filter(|&i| keys[i as usize].is_some())
            .collect();
        by_key
            .par_sort_unstable_by(|&a, &b| keys[a as usize].cmp(&keys[b as usize]).then(a.cmp(&b)));
        FormKeys { keys, by_key }
    }

    /// The key of the `i`-th distinct form.
    pub fn key(&self, i: u32) -> Option<&str> {
        self.keys[i as usize].as_deref()
    }

    /// The distinct forms whose key is `key`, ascending.
    pub fn members(&self, key: &str) -> &[u32] {
        let key_at = |j: &u32| self.keys[*j as usize].as_deref().unwrap_or_default();
        let from = self.by_key.partition_point(|j| key_at(j) < key);
        let to = from + self.by_key[from..].partition_point(|j| key_at(j) == key);
        &self.by_key[from..to]
    }

    /// Every key, sorted, once.
    fn all_keys(&self) -> impl Iterator<Item = (&str, &[u32])> {
        self.by_key
            .chunk_by(|&a, &b| self.keys[a as usize] == self.keys[b as usize])
            .map(|run| (self.key(run[0]).unwrap_or_default(), run))
    }
}

/// A form's key; a form no rule names takes its stem from `stem` when given.
fn key_of(analyzer: &Analyzer, form: &str, stem: Option<&str>) -> Option<String> {
    match stem {
        Some(stem) if analyzer.stems_plainly(form) => Some(stem.to_string()),
        _ => analyzer.key(form).map(Cow::into_owned),
    }
}

/// Every document's length per field under a stopword list: its surface token count minus
/// its stopwords. Kept beside a cached index, named by the list.
pub fn lengths_without_stopwords(
    index: &IndexPostings,
    forms: &SurfaceForms,
    keys: &FormKeys,
) -> Result<Arc<Vec<Vec<u32>>>, IndexError> {
    let stopwords: Vec<u32> = (0..forms.len() as u32)
        .filter(|&i| keys.key(i).is_none())
        .collect();
    if stopwords.is_empty() {
        return Ok(Arc::new(
            (0..forms.fields.len())
                .map(|f| index.lengths(f).to_vec())
                .collect(),
        ));
    }
    let mut hasher = blake3::Hasher::new();
    for &i in &stopwords {
        hasher.update(forms.form(i).as_bytes());
        hasher.update(b"\n");
    }
    let name = format!("lengths-{}", &hasher.finalize().to_hex()[..16]);
    let n = index.num_docs() as usize;
    let flat = index.derived_numbers(&name, || {
        let fields = (0..forms.fields.len())
            .into_par_iter()
            .map(|field| {
                let mut len = index.lengths(field).to_vec();
                for &i in stopwords.iter().filter(|&&i| forms.in_field(field, i)) {
                    let stopword = index.frequencies(field, forms.form(i))?;
                    for (&doc, &tf) in stopword.docs.iter().zip(&stopword.tfs) {
                        let slot = &mut len[doc as usize];
                        *slot = slot.saturating_sub(tf);
                    }
                }
                Ok(len)
            })
            .collect::<Result<Vec<Vec<u32>>, IndexError>>()?;
        Ok(fields.concat())
    })?;
    if flat.len() != n * forms.fields.len() {
        return Err(IndexError::Io {
            path: name,
            source: std::io::Error::other("stored document lengths do not match the index"),
        });
    }
    Ok(Arc::new(
        flat.chunks(n.max(1))
            .take(forms.fields.len())
            .map(<[u32]>::to_vec)
            .collect(),
    ))
}

/// One ruleset's conflation groups over a surface index.
pub struct ConflatedKeys<'a> {
    index: &'a IndexPostings,
    forms: &'a SurfaceForms,
    keys: &'a FormKeys,
    lengths: Arc<Vec<Vec<u32>>>,
    /// Per field: key → its members' union, with and without positions.
    cache: ReadCache<Postings>,
    freq_cache: ReadCache<Frequencies>,
    /// Per field: a clause's keys (joined) → the sum of all their members, so that a
    /// synonym set shared by many queries is merged once.
    clause_cache: ReadCache<Frequencies>,
    /// The other side's groups over the same index, and the keys whose members differ
    /// from it: every other key is read from there, so both sides merge it once.
    other: Option<(&'a ConflatedKeys<'a>, &'a FxHashSet<String>)>,
}

/// Positions, and separately postings, of unions kept before a cache is emptied: about
/// 96 MiB and 192 MiB per side (sized with [`crate::index`]'s read caches).
const UNION_BUDGET: usize = 24 << 20;

impl<'a> ConflatedKeys<'a> {
    /// The groups of forms already keyed, with the documents' lengths under that
    /// ruleset's stopwords ([`lengths_without_stopwords`]).
    pub fn new(
        index: &'a IndexPostings,
        forms: &'a SurfaceForms,
        keys: &'a FormKeys,
        lengths: Arc<Vec<Vec<u32>>>,
    ) -> Self {
        let n = forms.fields.len();
        ConflatedKeys {
            index,
            forms,
            keys,
            lengths,
            cache: ReadCache::new(n, UNION_BUDGET),
            freq_cache: ReadCache::new(n, UNION_BUDGET),
            clause_cache: ReadCache::new(n, UNION_BUDGET),
            other: None,
        }
    }

    /// Reads every key not in `differing` from `other`, the other side's groups over the
    /// same index: a key none of whose forms changed key has the same members there.
    pub fn sharing(
        mut self,
        other: &'a ConflatedKeys<'a>,
        differing: &'a FxHashSet<String>,
    ) -> Self {
        self.other = Some((other, differing));
        self
    }

    /// The other side's groups, when they hold all of `keys` with the same members.
    fn same_in_other(&self, keys: &[&str]) -> Option<&'a ConflatedKeys<'a>> {
        let (other, differing) = self.other?;
        keys.iter()
            .all(|k| !differing.contains(*k))
            .then_some(other)
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
        self.keys
            .members(key)
            .iter()
            .filter(move |&&i| self.forms.in_field(field, i))
            .map(|&i| self.forms.form(i))
    }
}

impl KeySource for ConflatedKeys<'_> {
    fn num_docs(&self) -> u32 {
        self.index.num_docs()
    }

    fn num_fields(&self) -> usize {
        self.forms.fields.len()
    }

    fn doc_lengths(&self, field: usize) -> &[u32] {
        &self.lengths[field]
    }

    fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError> {
        if let Some(other) = self.same_in_other(&[key]) {
            return other.postings(field, key);
        }
        self.group(&self.cache, field, key, IndexPostings::postings, |parts| {
            let union = Postings::union(parts);
            let size = union.positions.len();
            (union, size)
        })
    }

    /// A group's tfs are its members' summed: each position holds one surface form, so
    /// members never share a position.
    fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
        if let Some(other) = self.same_in_other(&[key]) {
            return other.frequencies(field, key);
        }
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

    /// Every member of every key summed in one go, and kept.
    fn frequencies_of_any(
        &self,
        field: usize,
        keys: &[&str],
    ) -> Result<Arc<Frequencies>, IndexError> {
        if let [only] = keys {
            return self.frequencies(field, only);
        }
        if let Some(other) = self.same_in_other(keys) {
            return other.frequencies_of_any(field, keys);
        }
        let name = keys.join("\u{1}");
        if let Some(hit) = self.clause_cache.get(field, &name) {
            return Ok(hit);
        }
        let parts = keys
            .iter()
            .flat_map(|key| self.member_forms(field, key))
            .map(|form| self.index.frequencies(field, form))
            .collect::<Result<Vec<_>, _>>()?;
        let sum = Arc::new(Frequencies::sum(&parts));
        self.clause_cache.put(field, &name, &sum, sum.len());
        Ok(sum)
    }

    fn keys(&self, field: usize) -> Vec<String> {
        self.keys
            .all_keys()
            .filter(|(_, members)| members.iter().any(|&i| self.forms.in_field(field, i)))
            .map(|(key, _)| key.to_string())
            .collect()
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
        let fields: Vec<Vec<String>> = fields
            .iter()
            .map(|f| {
                let mut v: Vec<String> = f.iter().map(|s| s.to_string()).collect();
                v.sort();
                v
            })
            .collect();
        SurfaceForms::from_fields(&fields)
    }

    fn all_keys(keys: &FormKeys, forms: &SurfaceForms) -> Vec<Option<String>> {
        (0..forms.len() as u32)
            .map(|i| keys.key(i).map(str::to_string))
            .collect()
    }

    fn place(forms: &SurfaceForms, form: &str) -> u32 {
        forms.forms.iter().position(|f| f == form).unwrap() as u32
    }

    /// Sharing the stemming between the sides, or taking the stems from a list, changes
    /// no key: each side's keys are what that side alone computes, stopwords, exemptions
    /// and lemma overrides included.
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
        let stems: Vec<String> = forms
            .forms
            .iter()
            .map(|f| base.stem_alone(f).into_owned())
            .collect();
        let alone_b = FormKeys::compute(&base, &forms, None);
        let alone_h = FormKeys::compute(&head, &forms, None);
        for given in [None, Some(stems.as_slice())] {
            let (b, h) = FormKeys::compute_pair(&base, &head, &forms, given);
            assert_eq!(all_keys(&b, &forms), all_keys(&alone_b, &forms));
            assert_eq!(all_keys(&h, &forms), all_keys(&alone_h, &forms));
            assert_eq!(b, alone_b);
            assert_eq!(h, FormKeys::compute(&head, &forms, given));
        }
        assert_eq!(alone_h.key(place(&forms, "universal")), Some("universal"));
        assert_eq!(alone_b.key(place(&forms, "mouse")), Some("mous"));
        assert_eq!(alone_h.key(place(&forms, "running")), None);
    }

    #[test]
    fn a_keys_members_are_its_forms_in_order() {
        let a = analyzer("pipeline:\n  stemmer: english\n  stopwords: [the]\n");
        let forms = forms(&[&["runs", "the", "running", "run", "tram"], &["trams"]]);
        let keys = FormKeys::compute(&a, &forms, None);
        let names = |m: &[u32]| m.iter().map(|&i| forms.form(i)).collect::<Vec<_>>();
        assert_eq!(names(keys.members("run")), ["run", "running", "runs"]);
        assert_eq!(names(keys.members("tram")), ["tram", "trams"]);
        assert!(keys.members("the").is_empty());
        assert!(keys.members("zzz").is_empty());
        let all: Vec<&str> = keys.all_keys().map(|(k, _)| k).collect();
        assert_eq!(all, ["run", "tram"]);
    }
}
