//! When every clause must match: the candidates are the rarest clause's documents, each
//! further clause filters them (for one side, or for both sides at once), and only the
//! documents left are scored.

use std::sync::Arc;

use super::clauses::ClauseLists;
use super::lists::{for_each_common, union_of_docs};
use super::{FieldScore, Hit, Scoring, Stats};
use crate::index::Frequencies;

/// Whether two clauses read the very same lists, field by field.
pub(super) fn same_lists(a: &[Arc<Frequencies>], b: &[Arc<Frequencies>]) -> bool {
    a.iter().zip(b).all(|(x, y)| Arc::ptr_eq(x, y))
}

/// Which side a candidate is still a candidate of.
pub(super) const BASE: u8 = 1;
pub(super) const HEAD: u8 = 2;

/// Leaves in `scratch.candidates` (ascending) the documents that hold every clause of the
/// base, or of the head when given, with `scratch.sides` saying of which. A clause both
/// sides read from the same lists is looked up once for both.
pub(super) fn filter_by_every_clause(
    base: &ClauseLists,
    head: Option<&ClauseLists>,
    scratch: &mut AllScratch,
) {
    let size = |c: &Vec<Arc<Frequencies>>| c.iter().map(|p| p.len()).sum::<usize>();
    // Every distinct clause once, with the sides that hold it.
    let mut clauses: Vec<(&Vec<Arc<Frequencies>>, u8)> = base.iter().map(|c| (c, BASE)).collect();
    for c in head.into_iter().flatten() {
        match clauses
            .iter_mut()
            .find(|(b, s)| *s == BASE && same_lists(b, c))
        {
            Some(shared) => shared.1 |= HEAD,
            None => clauses.push((c, HEAD)),
        }
    }
    let rarest = |bit: u8| {
        (0..clauses.len())
            .filter(|&i| clauses[i].1 & bit != 0)
            .min_by_key(|&i| (size(clauses[i].0), i))
    };
    let start_b = rarest(BASE).expect("a query with clauses");
    let start_h = head.map(|_| rarest(HEAD).expect("a query with clauses"));
    let AllScratch {
        candidates,
        merged,
        sides,
        merged_sides,
        matched,
        docs,
        ..
    } = scratch;
    // The candidates: the base's rarest clause's documents, and the head's.
    union_of_docs(clauses[start_b].0, candidates, merged);
    sides.clear();
    sides.resize(candidates.len(), BASE);
    if let Some(start_h) = start_h {
        if start_h == start_b {
            sides.iter_mut().for_each(|s| *s |= HEAD);
        } else {
            union_of_docs(clauses[start_h].0, docs, merged);
            merge_sides((candidates, sides), docs, (merged, merged_sides));
        }
    }
    let mut order: Vec<usize> = (0..clauses.len()).collect();
    order.sort_by_key(|&i| (size(clauses[i].0), i));
    for i in order {
        let (lists, mut bits) = clauses[i];
        // A side's own starting clause holds all its candidates already.
        if i == start_b {
            bits &= !BASE;
        }
        if Some(i) == start_h {
            bits &= !HEAD;
        }
        if bits == 0 {
            continue;
        }
        matched.clear();
        matched.resize(candidates.len(), false);
        for list in lists {
            if list.len() > candidates.len() && list.is_long() {
                // A long list: its bit set answers each candidate without a search.
                for (c, &doc) in candidates.iter().enumerate() {
                    matched[c] |= list.holds(doc);
                }
            } else {
                for_each_common(candidates, list, |c, _| matched[c] = true);
            }
        }
        let mut kept = 0;
        for c in 0..candidates.len() {
            let s = if matched[c] {
                sides[c]
            } else {
                sides[c] & !bits
            };
            if s != 0 {
                candidates[kept] = candidates[c];
                sides[kept] = s;
                kept += 1;
            }
        }
        candidates.truncate(kept);
        sides.truncate(kept);
        if kept == 0 {
            return;
        }
    }
}

/// Merges `other` (the head's starting documents) into `candidates` (the base's, all
/// marked [`BASE`]), marking each document with the sides it came from; `out` and
/// `out_sides` are buffers to merge into, as in [`merge_sorted`].
fn merge_sides(
    (candidates, sides): (&mut Vec<u32>, &mut Vec<u8>),
    other: &[u32],
    (out, out_sides): (&mut Vec<u32>, &mut Vec<u8>),
) {
    out.clear();
    out_sides.clear();
    let (a, b) = (&candidates[..], other);
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        out.push(x.min(y));
        out_sides.push(if x <= y { BASE } else { 0 } | if y <= x { HEAD } else { 0 });
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
    out.extend_from_slice(&a[i..]);
    out_sides.resize(out.len(), BASE);
    out.extend_from_slice(&b[j..]);
    out_sides.resize(out.len(), HEAD);
    std::mem::swap(candidates, out);
    std::mem::swap(sides, out_sides);
}

/// Scores `docs` (ascending, every clause present) into `hits`: per clause, per field in
/// field order, then the clauses summed in query order, as [`score_clauses`] sums.
pub(super) fn score_documents(
    lists: &ClauseLists,
    docs: &[u32],
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    (contrib, norms): (&mut Vec<f64>, &mut Vec<f64>),
    hits: &mut Vec<Hit>,
) {
    hits.clear();
    let clauses: Vec<&Vec<Arc<Frequencies>>> = lists.iter().collect();
    if docs.is_empty() || clauses.is_empty() {
        return;
    }
    score_clause_matrix(&clauses, docs, stats, scoring, weights, (contrib, norms));
    hits.extend(
        docs.iter()
            .zip(contrib.chunks_exact(clauses.len()))
            .map(|(&doc, parts)| Hit {
                doc,
                score: parts.iter().fold(0.0, |sum, s| sum + s),
            }),
    );
}

/// Fills `contrib` (one row per document of `docs`, ascending; one column per clause)
/// with each clause's score in each document: its fields added in field order.
pub(super) fn score_clause_matrix(
    clauses: &[&Vec<Arc<Frequencies>>],
    docs: &[u32],
    stats: &Stats,
    scoring: &Scoring,
    weights: &[f64],
    (contrib, norms): (&mut Vec<f64>, &mut Vec<f64>),
) {
    let width = clauses.len();
    contrib.clear();
    contrib.resize(docs.len() * width, 0.0);
    // Field by field, the documents' norms are gathered once and read by every clause:
    // a million documents' norms do not stay in cache between clauses. A clause's fields
    // are still added in field order.
    for (field, &weight) in weights.iter().enumerate() {
        let mut gathered_yet = false;
        for (c, clause) in clauses.iter().enumerate() {
            let list = &clause[field];
            if list.is_empty() {
                continue;
            }
            let scorer = FieldScore::new(scoring, stats, field, weight, list.len());
            if !gathered_yet {
                let all = scorer.norms();
                norms.clear();
                norms.extend(docs.iter().map(|&d| all[d as usize]));
                gathered_yet = true;
            }
            for_each_common(docs, list, |i, j| {
                contrib[i * width + c] += scorer.score_with(norms[i], list.tfs[j]);
            });
        }
    }
}

/// Buffers of [`retrieve_all`] and [`matches_both`] kept per thread: a query of frequent
/// terms holds candidates by the hundred thousand, and fresh buffers cost more than the
/// work.
#[derive(Default)]
pub(super) struct AllScratch {
    pub(super) candidates: Vec<u32>,
    /// Per candidate, the sides ([`BASE`], [`HEAD`]) it is still a candidate of.
    pub(super) sides: Vec<u8>,
    /// Where [`merge_sides`] merges the sides before swapping.
    pub(super) merged_sides: Vec<u8>,
    /// Where [`union_of_docs`] merges before swapping.
    pub(super) merged: Vec<u32>,
    pub(super) matched: Vec<bool>,
    /// One side's documents, their per-clause scores, and one field's norms of them.
    pub(super) docs: Vec<u32>,
    pub(super) contrib: Vec<f64>,
    pub(super) norms: Vec<f64>,
}

thread_local! {
    pub(super) static ALL_SCRATCH: std::cell::RefCell<AllScratch> = std::cell::RefCell::default();
}
