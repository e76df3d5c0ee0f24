//! Ranking: best score first, ties broken by a fixed document order.

use std::cmp::Ordering;

use rayon::prelude::*;

use super::Hit;

/// Each document's place when sorted by id (then by corpus position, so equal ids still
/// order deterministically): what breaks score ties, and the order documents are listed
/// in. Comparing two `u32`s
/// instead of two id strings matters: equal scores are common (same tf, same length).
#[derive(Clone, Debug)]
pub struct DocOrder(Vec<u32>);

impl DocOrder {
    pub fn by_id(ids: &[String]) -> DocOrder {
        let mut order: Vec<u32> = (0..ids.len() as u32).collect();
        order.par_sort_unstable_by(|&a, &b| ids[a as usize].cmp(&ids[b as usize]).then(a.cmp(&b)));
        let mut place = vec![0u32; ids.len()];
        for (i, doc) in order.into_iter().enumerate() {
            place[doc as usize] = i as u32;
        }
        DocOrder(place)
    }

    /// Each document's place, as [`DocOrder::by_id`] computed it (kept on disk).
    pub fn into_places(self) -> Vec<u32> {
        self.0
    }

    /// The order of places computed earlier by [`DocOrder::by_id`].
    pub fn from_places(places: Vec<u32>) -> DocOrder {
        DocOrder(places)
    }

    /// The document's place in id order.
    pub fn place(&self, doc: u32) -> u32 {
        self.0[doc as usize]
    }
}

/// Best first: a higher score, then on equal scores the document whose id comes **later**
/// in byte order. That is trec_eval's own tie rule (it ignores the rank column of a run
/// and sorts by score, then by document id descending), so a ranking shown here, the run
/// file written from it, and trec_eval reading that file all put tied documents in the
/// same order, and every metric agrees.
fn better(order: &DocOrder) -> impl Fn(&Hit, &Hit) -> Ordering + '_ {
    |a, b| {
        b.score
            .total_cmp(&a.score)
            .then_with(|| order.place(b.doc).cmp(&order.place(a.doc)))
    }
}

/// Up to this k, a sorted buffer of k that most hits skip at one comparison beats
/// selecting over a copy of every hit.
const SMALL_K: usize = 64;

/// The best `k` of `hits`, in the order [`rank`] gives, without sorting every hit: one
/// pass with a sorted buffer for a small k, a selection over a copy otherwise (a deep
/// evaluation asks for the best thousand of a million).
pub fn top_hits(hits: &[Hit], k: usize, order: &DocOrder) -> Vec<Hit> {
    let better = better(order);
    if k == 0 {
        return Vec::new();
    }
    if k > SMALL_K || hits.len() <= k {
        let mut all = hits.to_vec();
        if all.len() > k {
            all.select_nth_unstable_by(k - 1, &better);
            all.truncate(k);
        }
        all.sort_unstable_by(&better);
        return all;
    }
    let mut best: Vec<Hit> = Vec::with_capacity(k + 1);
    for hit in hits {
        if best.len() == k && better(hit, &best[k - 1]).is_ge() {
            continue;
        }
        let at = best.partition_point(|b| better(b, hit).is_lt());
        best.insert(at, *hit);
        best.truncate(k);
    }
    best
}

/// Sorts hits best first (see [`top_hits`] for the tie rule).
pub fn rank(hits: &mut [Hit], order: &DocOrder) {
    hits.sort_unstable_by(better(order));
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    proptest! {
        /// The one-pass top k is the first k of the full ranking.
        #[test]
        fn top_hits_is_the_ranking_prefix(
            scores in prop::collection::vec(0u8..5, 0..160),
            k in prop_oneof![0usize..12, 60usize..80],
        ) {
            let hits: Vec<Hit> = scores
                .iter()
                .enumerate()
                .map(|(d, &s)| Hit { doc: d as u32, score: s as f64 / 2.0 })
                .collect();
            let ids: Vec<String> = (0..hits.len()).map(|d| format!("x{}", (d * 7) % 13)).collect();
            let order = DocOrder::by_id(&ids);
            let mut ranked = hits.clone();
            rank(&mut ranked, &order);
            ranked.truncate(k);
            prop_assert_eq!(top_hits(&hits, k, &order), ranked);
        }
    }

    #[test]
    fn ties_go_to_the_later_id_as_trec_eval_orders_them() {
        let ids = ["doc-b", "doc-a", "doc-c", "doc-d"].map(String::from);
        let order = DocOrder::by_id(&ids);
        let hit = |doc, score| Hit { doc, score };
        let mut hits = vec![hit(0, 1.0), hit(1, 1.0), hit(2, 0.5), hit(3, 1.0)];
        rank(&mut hits, &order);
        let ranked: Vec<&str> = hits.iter().map(|h| ids[h.doc as usize].as_str()).collect();
        assert_eq!(ranked, ["doc-d", "doc-b", "doc-a", "doc-c"]);
    }
}
