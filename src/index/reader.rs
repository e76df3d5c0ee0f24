//! Reading an index back: its term dictionary, postings with positions, document lengths.

use std::cell::RefCell;
use std::sync::Arc;

use rustc_hash::FxHashMap;
use tantivy::postings::Postings as _;
use tantivy::schema::IndexRecordOption;
use tantivy::{DocSet, Index, Searcher, TERMINATED, Term};

use super::IndexError;
use super::build::{IndexFields, schema};

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
    cache: RefCell<FxHashMap<(usize, String), Arc<Postings>>>,
    cached_positions: RefCell<usize>,
}

const CACHE_BUDGET: usize = 64 << 20;

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
            cache: RefCell::default(),
            cached_positions: RefCell::new(0),
        })
    }

    /// Opens a surface index, counting document lengths from its postings.
    pub fn open_surface(index: &Index, num_fields: usize) -> Result<Self, IndexError> {
        let mut postings = IndexPostings::open(index, num_fields)?;
        let lengths = postings.surface_lengths()?;
        postings.set_lengths(lengths);
        Ok(postings)
    }

    /// Replaces the stored lengths with these (per field, per corpus ord).
    pub fn set_lengths(&mut self, lengths: Vec<Vec<u32>>) {
        self.lengths = lengths;
    }

    /// Counts every document's tokens per field from the postings (term frequencies
    /// summed): the exact lengths of a surface index, which does not store them.
    pub fn surface_lengths(&self) -> Result<Vec<Vec<u32>>, IndexError> {
        let mut out = vec![vec![0u32; self.num_docs as usize]; self.num_fields()];
        for (s, segment) in self.searcher.segment_readers().iter().enumerate() {
            for (f, lengths) in out.iter_mut().enumerate() {
                let inverted = segment.inverted_index(self.fields.texts[f])?;
                let mut stream = inverted.terms().stream()?;
                while stream.advance() {
                    let mut postings = inverted.read_postings_from_terminfo(
                        stream.value(),
                        IndexRecordOption::WithFreqs,
                    )?;
                    let mut doc = postings.doc();
                    while doc != TERMINATED {
                        lengths[self.ords[s][doc as usize] as usize] += postings.term_freq();
                        doc = postings.advance();
                    }
                }
            }
        }
        Ok(out)
    }

    /// The term frequencies of `term` in `field`: `(corpus ord, tf)`, without positions.
    pub fn frequencies(&self, field: usize, term: &str) -> Result<Vec<(u32, u32)>, IndexError> {
        let term = Term::from_field_text(self.fields.texts[field], term);
        let mut out = Vec::new();
        for (s, segment) in self.searcher.segment_readers().iter().enumerate() {
            let inverted = segment.inverted_index(self.fields.texts[field])?;
            if let Some(mut postings) =
                inverted.read_postings(&term, IndexRecordOption::WithFreqs)?
            {
                let mut doc = postings.doc();
                while doc != TERMINATED {
                    out.push((self.ords[s][doc as usize], postings.term_freq()));
                    doc = postings.advance();
                }
            }
        }
        Ok(out)
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
            out.sort_unstable();
            out.dedup();
        }
        Ok(out)
    }

    /// The postings of `term` in `field`, with positions.
    pub fn postings(&self, field: usize, term: &str) -> Result<Arc<Postings>, IndexError> {
        let cache_key = (field, term.to_string());
        if let Some(hit) = self.cache.borrow().get(&cache_key) {
            return Ok(Arc::clone(hit));
        }
        let postings = Arc::new(self.read(field, term)?);
        let mut used = self.cached_positions.borrow_mut();
        let mut cache = self.cache.borrow_mut();
        if *used + postings.positions.len() > CACHE_BUDGET {
            cache.clear();
            *used = 0;
        }
        *used += postings.positions.len();
        cache.insert(cache_key, Arc::clone(&postings));
        Ok(postings)
    }

    fn read(&self, field: usize, term: &str) -> Result<Postings, IndexError> {
        let term = Term::from_field_text(self.fields.texts[field], term);
        let mut parts: Vec<(u32, u32, Vec<u32>)> = Vec::new();
        let mut buffer = Vec::new();
        for (s, segment) in self.searcher.segment_readers().iter().enumerate() {
            let inverted = segment.inverted_index(self.fields.texts[field])?;
            let Some(mut postings) =
                inverted.read_postings(&term, IndexRecordOption::WithFreqsAndPositions)?
            else {
                continue;
            };
            let mut doc = postings.doc();
            while doc != TERMINATED {
                buffer.clear();
                postings.positions(&mut buffer);
                parts.push((
                    self.ords[s][doc as usize],
                    postings.term_freq(),
                    buffer.clone(),
                ));
                doc = postings.advance();
            }
        }
        if self.ords.len() > 1 {
            parts.sort_unstable_by_key(|p| p.0);
        }
        let mut out = Postings::default();
        for (doc, tf, positions) in parts {
            out.docs.push(doc);
            out.tfs.push(tf);
            out.starts.push(out.positions.len() as u32);
            out.positions.extend(positions);
        }
        out.starts.push(out.positions.len() as u32);
        Ok(out)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn union_merges_positions_and_sums_tf() {
        let a = Arc::new(Postings::from_pairs(vec![(0, 3), (2, 1)]));
        let b = Arc::new(Postings::from_pairs(vec![(0, 1), (1, 4)]));
        let u = Postings::union(&[a, b]);
        assert_eq!(u.docs, [0, 1, 2]);
        assert_eq!(u.tfs, [2, 1, 1]);
        assert_eq!(u.positions_at(0), [1, 3]);
    }
}
