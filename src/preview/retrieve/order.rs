//! Ranking: best score first, ties broken by a fixed document order.

use rayon::prelude::*;

use super::Hit;

/// The order that breaks score ties: each document's place when sorted by id (then by
/// corpus position, so equal ids still order deterministically). Comparing two `u32`s
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

/// The best `k` of `hits`, best first, ties by document id: the order [`rank`] gives,
/// found in one pass over the hits with a buffer of k.
pub fn top_hits(hits: &[Hit], k: usize, order: &DocOrder) -> Vec<Hit> {
    let better = |a: &Hit, b: &Hit| {
        b.score
            .total_cmp(&a.score)
            .then_with(|| order.place(a.doc).cmp(&order.place(b.doc)))
    };
    let mut best: Vec<Hit> = Vec::with_capacity(k + 1);
    if k == 0 {
        return best;
    }
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

/// Sorts hits best first, ties broken by document id.
pub fn rank(hits: &mut [Hit], order: &DocOrder) {
    hits.sort_unstable_by(|a, b| {
        b.score
            .total_cmp(&a.score)
            .then_with(|| order.place(a.doc).cmp(&order.place(b.doc)))
    });
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    proptest! {
        /// The one-pass top k is the first k of the full ranking.
        #[test]
        fn top_hits_is_the_ranking_prefix(
            scores in prop::collection::vec(0u8..5, 0..60),
            k in 0usize..12,
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
}
