//! Sorted-list algebra over ascending document numbers: intersection (walking, galloping
//! or through a long list's bit set), union and merge.

use std::sync::Arc;

use crate::index::Frequencies;

/// Calls `found(i, j)` for every candidate `i` (ascending documents) that `list` holds, at
/// its index `j` in the list, in ascending `i`. A long list gives each candidate's place
/// through its bit set; lists of like lengths are walked side by side; otherwise the
/// shorter is walked and the longer galloped through, so a short list costs its own
/// length, not the candidates'.
pub(super) fn for_each_common(
    candidates: &[u32],
    list: &Frequencies,
    mut found: impl FnMut(usize, usize),
) {
    if list.len() > candidates.len() && list.is_long() {
        // A long list: its bit set gives each candidate's place without a search.
        for (i, &doc) in candidates.iter().enumerate() {
            if let Some(j) = list.position(doc) {
                found(i, j);
            }
        }
        return;
    }
    let (short, long) = if list.len() < candidates.len() {
        (list.len(), candidates.len())
    } else {
        (candidates.len(), list.len())
    };
    if long <= short * WALK_RATIO {
        walk_common(candidates, &list.docs, found);
        return;
    }
    if list.len() < candidates.len() {
        let mut from = 0;
        for (j, &doc) in list.docs.iter().enumerate() {
            from = gallop(candidates, from, doc);
            if from == candidates.len() {
                break;
            }
            if candidates[from] == doc {
                found(from, j);
            }
        }
        return;
    }
    let mut from = 0;
    for (i, &doc) in candidates.iter().enumerate() {
        from = gallop(&list.docs, from, doc);
        if from == list.docs.len() {
            break;
        }
        if list.docs[from] == doc {
            found(i, from);
        }
    }
}

/// Up to this ratio of lengths, walking two lists side by side (a few predictable steps
/// per document) beats galloping through the longer (a search, its branches mispredicted,
/// per document of the shorter).
const WALK_RATIO: usize = 8;

/// Calls `found(i, j)` for every value in both `a[i]` and `b[j]` (both ascending), walking
/// both side by side.
fn walk_common(a: &[u32], b: &[u32], mut found: impl FnMut(usize, usize)) {
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        if x == y {
            found(i, j);
        }
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
}

/// The documents of any of these lists (each ascending), ascending, without repeats,
/// into `out`; `spare` is a buffer to merge into.
pub(super) fn union_of_docs(lists: &[Arc<Frequencies>], out: &mut Vec<u32>, spare: &mut Vec<u32>) {
    out.clear();
    for list in lists.iter().filter(|l| !l.is_empty()) {
        if out.is_empty() {
            out.extend_from_slice(&list.docs);
        } else {
            merge_sorted(out, &list.docs, spare);
            std::mem::swap(out, spare);
        }
    }
}

/// Two ascending lists merged into `out` (cleared first), a value in both kept once.
pub(super) fn merge_sorted(a: &[u32], b: &[u32], out: &mut Vec<u32>) {
    out.clear();
    out.reserve(a.len() + b.len());
    let (mut i, mut j) = (0, 0);
    while i < a.len() && j < b.len() {
        let (x, y) = (a[i], b[j]);
        out.push(x.min(y));
        i += usize::from(x <= y);
        j += usize::from(y <= x);
    }
    out.extend_from_slice(&a[i..]);
    out.extend_from_slice(&b[j..]);
}

/// The first index at or after `from` whose document is not below `doc` (exponential then
/// binary search, so a run of nearby lookups costs little).
pub(super) fn gallop(docs: &[u32], from: usize, doc: u32) -> usize {
    let mut step = 1;
    let mut hi = from;
    while hi < docs.len() && docs[hi] < doc {
        hi = from + step;
        step *= 2;
    }
    let lo = from + step / 4;
    let hi = hi.min(docs.len());
    let lo = lo.min(hi);
    lo + docs[lo..hi].partition_point(|&d| d < doc)
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;
    use std::collections::BTreeSet;

    /// Ascending, distinct documents below `max`: dense (long lists, with bit sets) or
    /// sparse, depending on `max`.
    fn docs(max: u32) -> impl Strategy<Value = Vec<u32>> {
        prop::collection::btree_set(0..max, 0..200).prop_map(|s| s.into_iter().collect())
    }

    fn list(docs: &[u32]) -> Frequencies {
        Frequencies::new(docs.to_vec(), docs.iter().map(|d| d % 5 + 1).collect())
    }

    proptest! {
        /// Whichever way it walks (side by side, galloping either list, or through a long
        /// list's bit set), the intersection is every common document, at its index in
        /// both lists, in ascending order.
        #[test]
        fn common_documents_are_the_intersection(
            candidates in docs(300),
            other in prop_oneof![docs(250), docs(5000)],
        ) {
            let list = list(&other);
            let mut found = Vec::new();
            for_each_common(&candidates, &list, |i, j| found.push((i, j)));
            let want: Vec<(usize, usize)> = candidates
                .iter()
                .enumerate()
                .filter_map(|(i, d)| other.binary_search(d).ok().map(|j| (i, j)))
                .collect();
            prop_assert_eq!(found, want);
        }

        /// A union of lists and a merge of two are the sorted set of their documents.
        #[test]
        fn unions_are_sorted_sets(lists in prop::collection::vec(docs(400), 0..5)) {
            let want: Vec<u32> =
                lists.iter().flatten().copied().collect::<BTreeSet<u32>>().into_iter().collect();
            let shared: Vec<Arc<Frequencies>> = lists.iter().map(|d| Arc::new(list(d))).collect();
            let (mut out, mut spare) = (vec![7], Vec::new());
            union_of_docs(&shared, &mut out, &mut spare);
            prop_assert_eq!(&out, &want);
            if let [a, b, ..] = &lists[..] {
                let mut merged = Vec::new();
                merge_sorted(a, b, &mut merged);
                let pair: BTreeSet<u32> = a.iter().chain(b).copied().collect();
                prop_assert_eq!(merged, pair.into_iter().collect::<Vec<_>>());
            }
        }

        /// Galloping from any start finds what a binary search of the rest finds.
        #[test]
        fn gallop_is_a_search_of_the_rest(docs in docs(1000), from in 0usize..200, doc in 0u32..1000) {
            let from = from.min(docs.len());
            let want = from + docs[from..].partition_point(|&d| d < doc);
            prop_assert_eq!(gallop(&docs, from, doc), want);
        }
    }

    #[test]
    fn merged_lists_keep_shared_documents_once() {
        let mut out = vec![99];
        merge_sorted(&[1, 4, 6], &[2, 4, 9, 11], &mut out);
        assert_eq!(out, [1, 2, 4, 6, 9, 11]);
        merge_sorted(&[], &[3], &mut out);
        assert_eq!(out, [3]);
    }

    #[test]
    fn gallop_finds_the_first_document_not_below() {
        let docs = [1, 3, 5, 7, 9, 11, 13, 15, 17];
        for from in 0..docs.len() {
            for doc in 0..20 {
                let want = from + docs[from..].partition_point(|&d| d < doc);
                assert_eq!(gallop(&docs, from, doc), want, "from {from} doc {doc}");
            }
        }
    }
}
