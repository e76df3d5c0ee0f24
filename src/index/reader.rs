//! Reading an index back: its term dictionary, postings with positions, document lengths.

use std::path::{Path, PathBuf};
use std::sync::{Arc, Mutex, OnceLock};

use rayon::prelude::*;
use rustc_hash::FxHashMap;
use tantivy::postings::{BlockSegmentPostings, Postings as _};
use tantivy::schema::IndexRecordOption;
use tantivy::{DocSet, Index, Searcher, TERMINATED, Term};

use super::IndexError;
use super::build::{IndexFields, schema};
use super::forms::SurfaceForms;
use super::sidecar;

/// One term's postings: documents (corpus order, ascending), term frequencies, and the
/// positions of each document (`positions[starts[i]..starts[i + 1]]`, ascending).
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct Postings {
    pub docs: Vec<u32>,
    pub tfs: Vec<u32>,
    pub starts: Vec<u32>,
    pub positions: Vec<u32>,
}

impl Postings {
    pub fn len(&self) -> usize {
        self.docs.len()
    }

    pub fn is_empty(&self) -> bool {
        self.docs.is_empty()
    }

    /// The positions in the `i`-th document.
    pub fn positions_at(&self, i: usize) -> &[u32] {
        &self.positions[self.starts[i] as usize..self.starts[i + 1] as usize]
    }

    /// Builds postings from `(doc, position)` pairs in any order (duplicates removed).
    pub fn from_pairs(mut pairs: Vec<(u32, u32)>) -> Postings {
        pairs.sort_unstable();
        pairs.dedup();
        let mut out = Postings::default();
        for (doc, pos) in pairs {
            if out.docs.last() != Some(&doc) {
                out.docs.push(doc);
                out.tfs.push(0);
                out.starts.push(out.positions.len() as u32);
            }
            *out.tfs.last_mut().expect("pushed") += 1;
            out.positions.push(pos);
        }
        out.starts.push(out.positions.len() as u32);
        out
    }

    /// The union of several terms' postings (a conflation group): positions merged,
    /// tf summed.
    pub fn union(parts: &[Arc<Postings>]) -> Postings {
        match parts {
            [] => Postings::from_pairs(Vec::new()),
            [one] => (**one).clone(),
            _ => {
                // Sort (document, part, index) entries, not every position: a group's
                // members rarely share a document, and never a position.
                let mut entries: Vec<(u32, u32, u32)> =
                    Vec::with_capacity(parts.iter().map(|p| p.len()).sum());
                for (k, p) in parts.iter().enumerate() {
                    entries.extend(
                        p.docs
                            .iter()
                            .enumerate()
                            .map(|(i, &d)| (d, k as u32, i as u32)),
                    );
                }
                entries.sort_unstable();
                let mut out = Postings {
                    positions: Vec::with_capacity(parts.iter().map(|p| p.positions.len()).sum()),
                    ..Postings::default()
                };
                let mut group = 0;
                while group < entries.len() {
                    let doc = entries[group].0;
                    let start = out.positions.len();
                    let mut end = group;
                    while end < entries.len() && entries[end].0 == doc {
                        let (_, k, i) = entries[end];
                        out.positions
                            .extend_from_slice(parts[k as usize].positions_at(i as usize));
                        end += 1;
                    }
                    if end - group > 1 {
                        out.positions[start..].sort_unstable();
                    }
                    out.docs.push(doc);
                    out.tfs.push((out.positions.len() - start) as u32);
                    out.starts.push(start as u32);
                    group = end;
                }
                out.starts.push(out.positions.len() as u32);
                out
            }
        }
    }
}

/// One term's documents (ascending) and term frequencies, without positions: what a
/// clause needs unless it holds a phrase. Reading no positions is most of the saving.
#[derive(Clone, Debug, Default)]
pub struct Frequencies {
    pub docs: Vec<u32>,
    pub tfs: Vec<u32>,
    /// The documents as a bit set, built the first time [`Frequencies::holds`] or
    /// [`Frequencies::position`] is asked.
    bits: OnceLock<DocBits>,
}

/// A list's documents as a bit set, with the number of documents before each block of
/// [`RANK_BLOCK`] words, so a document's place in the list is a few population counts.
#[derive(Clone, Debug, Default)]
struct DocBits {
    words: Box<[u64]>,
    ranks: Box<[u32]>,
}

/// Words per counted block: the counts cost a sixteenth of the bit set, and a place costs
/// at most this many population counts.
const RANK_BLOCK: usize = 8;

impl DocBits {
    fn new(docs: &[u32]) -> DocBits {
        let len = docs.last().map_or(0, |&d| d as usize / 64 + 1);
        let mut words = vec![0u64; len];
        for &d in docs {
            words[d as usize / 64] |= 1 << (d % 64);
        }
        let mut before = 0u32;
        let ranks = words
            .chunks(RANK_BLOCK)
            .map(|block| {
                let here = before;
                before += block.iter().map(|w| w.count_ones()).sum::<u32>();
                here
            })
            .collect();
        DocBits {
            words: words.into_boxed_slice(),
            ranks,
        }
    }
}

impl PartialEq for Frequencies {
    fn eq(&self, other: &Self) -> bool {
        self.docs == other.docs && self.tfs == other.tfs
    }
}

impl Eq for Frequencies {}

impl Frequencies {
    /// Documents (ascending, distinct) and their tfs.
    pub fn new(docs: Vec<u32>, tfs: Vec<u32>) -> Self {
        Frequencies {
            docs,
            tfs,
            bits: OnceLock::new(),
        }
    }

    /// Whether `doc` is in the list, in constant time: a frequent term's list is looked up
    /// by candidates many times over, and a bit set answers faster than a search. The set
    /// (one bit per document up to the last) is built once, so ask only of long lists
    /// ([`Frequencies::is_long`]).
    pub fn holds(&self, doc: u32) -> bool {
        let bits = self.bits.get_or_init(|| DocBits::new(&self.docs));
        bits.words
            .get(doc as usize / 64)
            .is_some_and(|w| w & (1 << (doc % 64)) != 0)
    }

    /// Where `doc` is in the list (its index in `docs` and `tfs`), if it is, in constant
    /// time through the same bit set as [`Frequencies::holds`].
    pub fn position(&self, doc: u32) -> Option<usize> {
        let bits = self.bits.get_or_init(|| DocBits::new(&self.docs));
        let at = doc as usize / 64;
        let word = *bits.words.get(at)?;
        let bit = 1u64 << (doc % 64);
        if word & bit == 0 {
            return None;
        }
        let block = at / RANK_BLOCK;
        let before: u32 = bits.words[block * RANK_BLOCK..at]
            .iter()
            .map(|w| w.count_ones())
            .sum();
        Some((bits.ranks[block] + before + (word & (bit - 1)).count_ones()) as usize)
    }

    /// Whether the list holds one document in 64 or more up to its last: then its bit set
    /// ([`Frequencies::holds`], [`Frequencies::position`]) is no bigger than twice the list.
    pub fn is_long(&self) -> bool {
        self.docs
            .last()
            .is_some_and(|&last| self.docs.len() >= (last as usize + 1) / 64)
    }

    pub fn len(&self) -> usize {
        self.docs.len()
    }

    pub fn is_empty(&self) -> bool {
        self.docs.is_empty()
    }

    /// The documents and tfs of terms that never share a position (distinct terms of one
    /// field, each position holding one token): tf summed per document. The lists are
    /// merged smallest first, without copying them beforehand.
    pub fn sum(parts: &[Arc<Frequencies>]) -> Frequencies {
        let mut lists: Vec<&Frequencies> = parts.iter().map(|p| &**p).collect();
        lists.sort_by_key(|l| l.len());
        match lists.as_slice() {
            [] => Frequencies::default(),
            [one] => (*one).clone(),
            [a, b, rest @ ..] => rest.iter().fold(Frequencies::merge(a, b), |sum, l| {
                Frequencies::merge(&sum, l)
            }),
        }
    }

    fn merge(a: &Frequencies, b: &Frequencies) -> Frequencies {
        let mut out = Frequencies::new(
            Vec::with_capacity(a.len() + b.len()),
            Vec::with_capacity(a.len() + b.len()),
        );
        let (mut i, mut j) = (0, 0);
        while i < a.len() && j < b.len() {
            let (da, db) = (a.docs[i], b.docs[j]);
            if da < db {
                out.push(da, a.tfs[i]);
                i += 1;
            } else if db < da {
                out.push(db, b.tfs[j]);
                j += 1;
            } else {
                out.push(da, a.tfs[i] + b.tfs[j]);
                i += 1;
                j += 1;
            }
        }
        for k in i..a.len() {
            out.push(a.docs[k], a.tfs[k]);
        }
        for k in j..b.len() {
            out.push(b.docs[k], b.tfs[k]);
        }
        out
    }

    fn push(&mut self, doc: u32, tf: u32) {
        self.docs.push(doc);
        self.tfs.push(tf);
    }
}

impl From<&Postings> for Frequencies {
    fn from(p: &Postings) -> Self {
        Frequencies::new(p.docs.clone(), p.tfs.clone())
    }
}

/// An opened index: per-field terms and postings in corpus document order, exact lengths.
/// Postings read are kept (up to a budget) so a term is decoded once per run.
pub struct IndexPostings {
    searcher: Searcher,
    fields: IndexFields,
    /// Per segment: segment doc id → corpus ord.
    ords: Vec<Vec<u32>>,
    num_docs: u32,
    /// Per field, per corpus ord: the token count stored at build time.
    lengths: Vec<Vec<u32>>,
    /// Postings with positions (sized by positions), and frequencies (sized by postings).
    cache: ReadCache<Postings>,
    freq_cache: ReadCache<Frequencies>,
    /// The cache directory holding the index, where derived values are kept beside it.
    dir: Option<PathBuf>,
    forms: OnceLock<Arc<SurfaceForms>>,
}

/// Where a cached index's surface forms are kept beside it.
const FORMS_FILE: &str = "lexdelta-forms.bin";

/// Positions, and separately postings, kept in the read caches before they are emptied:
/// with a 4-byte position and an 8-byte posting, at most about 192 MiB and 384 MiB. At a
/// million documents, the lists a typical change's queries read all fit (a smaller budget
/// made the preview read a fifth of them twice), and the preview stays under 1.5 GiB.
const CACHE_BUDGET: usize = 48 << 20;

/// Values already computed, per field and term, up to a budget of `size` units (the caller
/// says what a value costs); emptied when full. Shared by parallel readers.
pub struct ReadCache<T> {
    inner: Mutex<Held<T>>,
    budget: usize,
}

/// Per field, term → value; and the units held.
type Held<T> = (Vec<FxHashMap<String, Arc<T>>>, usize);

impl<T> ReadCache<T> {
    pub fn new(fields: usize, budget: usize) -> Self {
        ReadCache {
            inner: Mutex::new(((0..fields).map(|_| FxHashMap::default()).collect(), 0)),
            budget,
        }
    }

    pub fn get(&self, field: usize, term: &str) -> Option<Arc<T>> {
        let inner = self.inner.lock().unwrap_or_else(|p| p.into_inner());
        inner.0[field].get(term).map(Arc::clone)
    }

    pub fn put(&self, field: usize, term: &str, value: &Arc<T>, size: usize) {
        let mut inner = self.inner.lock().unwrap_or_else(|p| p.into_inner());
        let (maps, used) = &mut *inner;
        if *used + size > self.budget {
            maps.iter_mut().for_each(FxHashMap::clear);
            *used = 0;
        }
        *used += size;
        maps[field].insert(term.to_string(), Arc::clone(value));
    }
}

impl IndexPostings {
    pub fn open(index: &Index, num_fields: usize) -> Result<Self, IndexError> {
        let (_, fields) = schema(num_fields, "unused");
        let reader = index.reader()?;
        let searcher = reader.searcher();
        let num_docs = searcher.num_docs() as u32;
        let mut ords = Vec::new();
        let mut lengths = vec![vec![0u32; num_docs as usize]; num_fields];
        for segment in searcher.segment_readers() {
            let fast = segment.fast_fields();
            let ord_col = fast.u64("ord")?;
            let len_cols = (0..num_fields)
                .map(|i| fast.u64(&format!("len{i}")))
                .collect::<Result<Vec<_>, _>>()?;
            let mut map = Vec::with_capacity(segment.max_doc() as usize);
            for doc in 0..segment.max_doc() {
                let ord = ord_col.first(doc).unwrap_or(0) as u32;
                map.push(ord);
                for (i, col) in len_cols.iter().enumerate() {
                    if let Some(slot) = lengths[i].get_mut(ord as usize) {
                        *slot = col.first(doc).unwrap_or(0) as u32;
                    }
                }
            }
            ords.push(map);
        }
        Ok(IndexPostings {
            searcher,
            fields,
            ords,
            num_docs,
            lengths,
            cache: ReadCache::new(num_fields, CACHE_BUDGET),
            freq_cache: ReadCache::new(num_fields, CACHE_BUDGET),
            dir: None,
            forms: OnceLock::new(),
        })
    }

    /// Keeps values derived from this index in `dir`, the cached index's directory.
    pub(crate) fn set_dir(&mut self, dir: &Path) {
        self.dir = Some(dir.to_path_buf());
    }

    /// The distinct surface forms of every field, read from the term dictionaries once
    /// (and kept beside a cached index).
    pub fn surface_forms(&self) -> Result<Arc<SurfaceForms>, IndexError> {
        if let Some(forms) = self.forms.get() {
            return Ok(Arc::clone(forms));
        }
        let forms = sidecar::load_or_compute(
            self.dir.as_deref(),
            FORMS_FILE,
            SurfaceForms::decode,
            SurfaceForms::encode,
            || {
                let fields = (0..self.num_fields())
                    .into_par_iter()
                    .map(|f| self.terms(f))
                    .collect::<Result<Vec<_>, _>>()?;
                Ok::<_, IndexError>(SurfaceForms::from_fields(&fields))
            },
        )?;
        Ok(Arc::clone(self.forms.get_or_init(|| Arc::new(forms))))
    }

    /// A list of numbers derived from this index, kept beside it under `name` (which must
    /// say everything the value depends on beyond the index).
    pub fn derived_numbers(
        &self,
        name: &str,
        compute: impl FnOnce() -> Result<Vec<u32>, IndexError>,
    ) -> Result<Vec<u32>, IndexError> {
        sidecar::load_or_compute(
            self.dir.as_deref(),
            &format!("lexdelta-{name}.bin"),
            |d| d.u32s(),
            |v, e| e.u32s(v),
            compute,
        )
    }

    /// A list of strings derived from this index, kept beside it under `name`.
    pub fn derived_strings(
        &self,
        name: &str,
        compute: impl FnOnce() -> Result<Vec<String>, IndexError>,
    ) -> Result<Vec<String>, IndexError> {
        sidecar::load_or_compute(
            self.dir.as_deref(),
            &format!("lexdelta-{name}.bin"),
            |d| d.strings(),
            |v, e| e.strings(v),
            compute,
        )
    }

    /// Opens a surface index, counting document lengths (and listing the surface forms)
    /// from its postings.
    pub fn open_surface(index: &Index, num_fields: usize) -> Result<Self, IndexError> {
        let mut postings = IndexPostings::open(index, num_fields)?;
        let (lengths, forms) = postings.surface_lengths_and_forms()?;
        postings.set_lengths(lengths);
        postings.keep_forms(forms)?;
        Ok(postings)
    }

    /// Replaces the stored lengths with these (per field, per corpus ord).
    pub fn set_lengths(&mut self, lengths: Vec<Vec<u32>>) {
        self.lengths = lengths;
    }

    /// Keeps `forms` as this index's surface forms (and beside a cached index, when its
    /// directory is set): what [`IndexPostings::surface_forms`] then answers.
    pub fn keep_forms(&self, forms: SurfaceForms) -> Result<Arc<SurfaceForms>, IndexError> {
        let forms = sidecar::load_or_compute(
            self.dir.as_deref(),
            FORMS_FILE,
            SurfaceForms::decode,
            SurfaceForms::encode,
            || Ok::<_, IndexError>(forms),
        )?;
        Ok(Arc::clone(self.forms.get_or_init(|| Arc::new(forms))))
    }

    /// Counts every document's tokens per field from the postings (term frequencies
    /// summed): the exact lengths of a surface index, which does not store them. The same
    /// walk through the term dictionaries lists every field's terms: the surface forms.
    pub fn surface_lengths_and_forms(&self) -> Result<(Vec<Vec<u32>>, SurfaceForms), IndexError> {
        // Each (field, segment) is counted in parallel into its own segment-local lengths,
        // then placed by corpus ord: one field holds most tokens, and its segments are
        // what two cores can share.
        let segments = self.searcher.segment_readers();
        let parts = (0..self.num_fields())
            .flat_map(|f| (0..segments.len()).map(move |s| (f, s)))
            .collect::<Vec<_>>()
            .into_par_iter()
            .map(|(f, s)| {
                let segment = &segments[s];
                let mut local = vec![0u32; segment.max_doc() as usize];
                let mut terms = Vec::new();
                let inverted = segment.inverted_index(self.fields.texts[f])?;
                let mut stream = inverted.terms().stream()?;
                // Read a block of documents and tfs at a time, through one reader reset
                // for each term: most terms are rare, and a reader per term cost more than
                // the term's postings.
                let mut reader: Option<BlockSegmentPostings> = None;
                while stream.advance() {
                    if let Ok(text) = std::str::from_utf8(stream.key()) {
                        terms.push(text.to_string());
                    }
                    let postings = match &mut reader {
                        Some(reader) => {
                            inverted.reset_block_postings_from_terminfo(stream.value(), reader)?;
                            reader
                        }
                        None => reader.insert(inverted.read_block_postings_from_terminfo(
                            stream.value(),
                            IndexRecordOption::WithFreqs,
                        )?),
                    };
                    while !postings.docs().is_empty() {
                        for (&doc, &tf) in postings.docs().iter().zip(postings.freqs()) {
                            local[doc as usize] += tf;
                        }
                        postings.advance();
                    }
                }
                Ok((f, s, local, terms))
            })
            .collect::<Result<Vec<_>, IndexError>>()?;
        let mut lengths = vec![vec![0u32; self.num_docs as usize]; self.num_fields()];
        let mut terms: Vec<Vec<String>> = vec![Vec::new(); self.num_fields()];
        for (f, s, local, segment_terms) in parts {
            for (doc, len) in local.into_iter().enumerate() {
                lengths[f][self.ords[s][doc] as usize] = len;
            }
            terms[f].extend(segment_terms);
        }
        if segments.len() > 1 {
            terms.par_iter_mut().for_each(|t| {
                // Each segment's terms are a sorted run: a stable sort merges the runs.
                t.sort();
                t.dedup();
            });
        }
        Ok((lengths, SurfaceForms::from_fields(&terms)))
    }

    /// The documents and term frequencies of `term` in `field`, without positions
    /// (cached like [`IndexPostings::postings`]).
    pub fn frequencies(&self, field: usize, term: &str) -> Result<Arc<Frequencies>, IndexError> {
        if let Some(hit) = self.freq_cache.get(field, term) {
            return Ok(hit);
        }
        let read = Arc::new(self.read_frequencies(field, term)?);
        self.freq_cache.put(field, term, &read, read.len());
        Ok(read)
    }

    fn read_frequencies(&self, field: usize, term: &str) -> Result<Frequencies, IndexError> {
        let term = Term::from_field_text(self.fields.texts[field], term);
        let mut found = Vec::new();
        for (s, segment) in self.searcher.segment_readers().iter().enumerate() {
            let inverted = segment.inverted_index(self.fields.texts[field])?;
            if let Some(info) = inverted.get_term_info(&term)? {
                found.push((s, inverted, info));
            }
        }
        // Sized from the term dictionaries: a million-document list is read without the
        // copies (and fresh pages) of a growing vector.
        let total: usize = found.iter().map(|f| f.2.doc_freq as usize).sum();
        // (ord, tf) packed in one number: ords are distinct, so sorting the numbers sorts
        // by ord, and each segment's ascending runs of ords are merged by a stable sort.
        let mut packed: Vec<u64> = Vec::with_capacity(total);
        for (s, inverted, info) in &found {
            // A block of documents and tfs at a time.
            let mut postings =
                inverted.read_block_postings_from_terminfo(info, IndexRecordOption::WithFreqs)?;
            let ords = &self.ords[*s];
            while !postings.docs().is_empty() {
                packed.extend(
                    postings
                        .docs()
                        .iter()
                        .zip(postings.freqs())
                        .map(|(&doc, &tf)| (u64::from(ords[doc as usize]) << 32) | u64::from(tf)),
                );
                postings.advance();
            }
        }
        if found.len() > 1 {
            packed.sort();
        }
        Ok(Frequencies::new(
            packed.iter().map(|p| (p >> 32) as u32).collect(),
            packed.iter().map(|&p| p as u32).collect(),
        ))
    }

    pub fn num_docs(&self) -> u32 {
        self.num_docs
    }

    pub fn num_fields(&self) -> usize {
        self.fields.texts.len()
    }

    /// The token count of each document in `field` (corpus order).
    pub fn lengths(&self, field: usize) -> &[u32] {
        &self.lengths[field]
    }

    /// Every term of `field`, sorted, without repeats.
    pub fn terms(&self, field: usize) -> Result<Vec<String>, IndexError> {
        let mut out = Vec::new();
        for segment in self.searcher.segment_readers() {
            let inverted = segment.inverted_index(self.fields.texts[field])?;
            let mut stream = inverted.terms().stream()?;
            while stream.advance() {
                if let Ok(text) = std::str::from_utf8(stream.key()) {
                    out.push(text.to_string());
                }
            }
        }
        if self.ords.len() > 1 {
            // Each segment's terms are a sorted run: a stable sort merges the runs.
            out.sort();
            out.dedup();
        }
        Ok(out)
    }

    /// The postings of `term` in `field`, with positions.
    pub fn postings(&self, field: usize, term: &str) -> Result<Arc<Postings>, IndexError> {
        if let Some(hit) = self.cache.get(field, term) {
            return Ok(hit);
        }
        let postings = Arc::new(self.read(field, term)?);
        self.cache
            .put(field, term, &postings, postings.positions.len());
        Ok(postings)
    }

    fn read(&self, field: usize, term: &str) -> Result<Postings, IndexError> {
        let term = Term::from_field_text(self.fields.texts[field], term);
        // Per segment, in segment order; segments are then put in corpus order by document.
        let mut out = Postings::default();
        for (s, segment) in self.searcher.segment_readers().iter().enumerate() {
            let inverted = segment.inverted_index(self.fields.texts[field])?;
            let Some(mut postings) =
                inverted.read_postings(&term, IndexRecordOption::WithFreqsAndPositions)?
            else {
                continue;
            };
            let mut doc = postings.doc();
            while doc != TERMINATED {
                out.docs.push(self.ords[s][doc as usize]);
                out.tfs.push(postings.term_freq());
                out.starts.push(out.positions.len() as u32);
                postings.append_positions_with_offset(0, &mut out.positions);
                doc = postings.advance();
            }
        }
        out.starts.push(out.positions.len() as u32);
        if self.ords.len() > 1 && !out.docs.is_sorted() {
            out = out.sorted_by_doc();
        }
        Ok(out)
    }
}

impl Postings {
    /// The same postings with documents in ascending order (a multi-segment read).
    fn sorted_by_doc(&self) -> Postings {
        let mut order: Vec<usize> = (0..self.len()).collect();
        // Each segment's run is ascending: a stable sort merges the runs.
        order.sort_by_key(|&i| self.docs[i]);
        let mut out = Postings::default();
        for i in order {
            out.docs.push(self.docs[i]);
            out.tfs.push(self.tfs[i]);
            out.starts.push(out.positions.len() as u32);
            out.positions.extend_from_slice(self.positions_at(i));
        }
        out.starts.push(out.positions.len() as u32);
        out
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    proptest! {
        /// The bit set's answers are the sorted list's: whether a document is there, and
        /// where (its index, which `tfs` shares).
        #[test]
        fn bit_set_places_are_the_list_places(
            picked in prop::collection::btree_set(0u32..3000, 0..400),
        ) {
            let docs: Vec<u32> = picked.into_iter().collect();
            let list = Frequencies::new(docs.clone(), vec![1; docs.len()]);
            for doc in 0..3100 {
                let expected = docs.binary_search(&doc).ok();
                prop_assert_eq!(list.position(doc), expected);
                prop_assert_eq!(list.holds(doc), expected.is_some());
            }
        }
    }

    #[test]
    fn union_merges_positions_and_sums_tf() {
        let a = Arc::new(Postings::from_pairs(vec![(0, 3), (2, 1)]));
        let b = Arc::new(Postings::from_pairs(vec![(0, 1), (1, 4)]));
        let u = Postings::union(&[a, b]);
        assert_eq!(u.docs, [0, 1, 2]);
        assert_eq!(u.tfs, [2, 1, 1]);
        assert_eq!(u.positions_at(0), [1, 3]);
    }

    #[test]
    fn frequencies_sum_tfs_of_shared_documents() {
        let a = Arc::new(Frequencies::new(vec![0, 2, 5], vec![1, 2, 3]));
        let b = Arc::new(Frequencies::new(vec![2, 3], vec![4, 1]));
        let c = Arc::new(Frequencies::new(vec![5, 9], vec![1, 1]));
        let sum = Frequencies::sum(&[a, b, c]);
        assert_eq!(sum.docs, [0, 2, 3, 5, 9]);
        assert_eq!(sum.tfs, [1, 6, 1, 4, 1]);
        assert_eq!(Frequencies::sum(&[]), Frequencies::default());
        for doc in 0..12 {
            assert_eq!(sum.holds(doc), sum.docs.contains(&doc), "document {doc}");
        }
    }

    #[test]
    fn sorting_by_document_keeps_each_documents_positions() {
        let p = Postings {
            docs: vec![4, 1],
            tfs: vec![2, 1],
            starts: vec![0, 2, 3],
            positions: vec![7, 9, 3],
        };
        let s = p.sorted_by_doc();
        assert_eq!(s.docs, [1, 4]);
        assert_eq!(s.positions_at(0), [3]);
        assert_eq!(s.positions_at(1), [7, 9]);
    }
}
