//! Rank-biased overlap (RBO) between two rankings.
//!
//! RBO is defined in W. Webber, A. Moffat and J. Zobel, "A similarity measure for indefinite
//! rankings", ACM Transactions on Information Systems 28(4), 2010. This module computes the
//! paper's extrapolated point estimate **RBO_ext** of two top-k prefixes, which assumes the
//! agreement seen at the deepest observed rank continues below it.
//!
//! With `X_d` the size of the overlap of the two lists' top-d prefixes and `p` the
//! persistence:
//!
//! * lists of equal length k (eq. 30 of the paper):
//!   `RBO_ext = (1−p)/p · Σ_{d=1..k} (X_d/d)·p^d + (X_k/k)·p^k`;
//! * lists of unequal length, the shorter S of length s and the longer L of length l
//!   (eq. 32), where for d > s, `X_d` is the overlap of all of S with the top d of L:
//!   `RBO_ext = (1−p)/p · ( Σ_{d=1..l} (X_d/d)·p^d + Σ_{d=s+1..l} (X_s·(d−s)/(s·d))·p^d )
//!             + ((X_l − X_s)/l + X_s/s)·p^l`.
//!
//! For equal lengths the second formula reduces to the first. Conventions beyond the paper:
//! two empty lists have RBO 1, one empty and one non-empty list 0; an item repeated within a
//! list counts only at its first rank (the repeat is dropped, as RBO assumes lists without
//! repeats); the result is clamped to [0, 1] against rounding.

use std::hash::Hash;

use rustc_hash::FxHashSet;

use super::error::MetricsError;

/// The default persistence: with p = 0.9 the top 10 ranks carry about 86% of the weight
/// (by the paper's eq. 21).
pub const DEFAULT_RBO_P: f64 = 0.9;

/// The list without repeated items, first occurrences kept.
fn dedup<T: Eq + Hash>(list: &[T]) -> Vec<&T> {
    let mut seen = FxHashSet::default();
    list.iter().filter(|x| seen.insert(*x)).collect()
}

/// RBO_ext of rankings `a` and `b` (best first) with persistence `p`, 0 < p < 1.
///
/// Symmetric in its arguments; 1 for identical lists, 0 for disjoint ones.
pub fn rbo_ext<T: Eq + Hash>(a: &[T], b: &[T], p: f64) -> Result<f64, MetricsError> {
    if !(p > 0.0 && p < 1.0) {
        return Err(MetricsError::InvalidParameter {
            name: "RBO persistence p",
            message: format!("{p} is not strictly between 0 and 1"),
        });
    }
    let (a, b) = (dedup(a), dedup(b));
    let (short, long) = if a.len() <= b.len() { (a, b) } else { (b, a) };
    let (s, l) = (short.len(), long.len());
    if l == 0 {
        return Ok(1.0);
    }
    if s == 0 {
        return Ok(0.0);
    }

    let mut seen_short: FxHashSet<&T> = FxHashSet::default();
    let mut seen_long: FxHashSet<&T> = FxHashSet::default();
    let mut overlap = 0usize; // X_d
    let mut overlap_at_s = 0usize; // X_s
    let mut p_d = 1.0; // p^d
    let mut sum = 0.0;
    for d in 1..=l {
        p_d *= p;
        let from_long = long[d - 1];
        if d <= s {
            let from_short = short[d - 1];
            if from_short == from_long {
                overlap += 1;
            } else {
                overlap += usize::from(seen_long.contains(from_short));
                overlap += usize::from(seen_short.contains(from_long));
            }
            seen_short.insert(from_short);
            seen_long.insert(from_long);
            if d == s {
                overlap_at_s = overlap;
            }
        } else {
            overlap += usize::from(seen_short.contains(from_long));
            let (xs, s_f, d_f) = (overlap_at_s as f64, s as f64, d as f64);
            sum += xs * (d_f - s_f) / (s_f * d_f) * p_d;
        }
        sum += overlap as f64 / d as f64 * p_d;
    }
    let (xs, xl) = (overlap_at_s as f64, overlap as f64);
    let tail = ((xl - xs) / l as f64 + xs / s as f64) * p_d;
    Ok(((1.0 - p) / p * sum + tail).clamp(0.0, 1.0))
}

#[cfg(test)]
mod tests {
    use super::*;
    use proptest::prelude::*;

    fn close(a: f64, b: f64) {
        assert!((a - b).abs() < 1e-12, "{a} != {b}");
    }

    /// Hand computation (the module author's own) of eq. 30, equal lengths:
    /// A = [a, b, c], B = [b, a, d], p = 0.9.
    /// X_1 = |{a} ∩ {b}| = 0, X_2 = |{a,b} ∩ {b,a}| = 2, X_3 = |{a,b,c} ∩ {b,a,d}| = 2.
    /// Σ (X_d/d) p^d = 0·0.9 + (2/2)·0.81 + (2/3)·0.729 = 0.81 + 0.486 = 1.296.
    /// (1−p)/p = 0.1/0.9 = 1/9, so the first part is 1.296/9 = 0.144.
    /// Tail (X_3/3)·p^3 = (2/3)·0.729 = 0.486.  RBO_ext = 0.144 + 0.486 = 0.63.
    #[test]
    fn hand_computed_even() {
        let v = rbo_ext(&["a", "b", "c"], &["b", "a", "d"], 0.9).unwrap();
        close(v, 0.63);
    }

    /// Hand computation (the module author's own) of eq. 32, unequal lengths:
    /// S = [a, b] (s = 2), L = [b, c, a, d] (l = 4), p = 0.5, so (1−p)/p = 1.
    /// X_1 = |{a} ∩ {b}| = 0, X_2 = |{a,b} ∩ {b,c}| = 1 = X_s,
    /// X_3 = |{a,b} ∩ {b,c,a}| = 2, X_4 = |{a,b} ∩ {b,c,a,d}| = 2 = X_l.
    /// Σ_{d=1..4} (X_d/d) p^d = 0 + (1/2)(1/4) + (2/3)(1/8) + (2/4)(1/16)
    ///                        = 1/8 + 1/12 + 1/32 = 23/96 = 46/192.
    /// Σ_{d=3..4} X_s (d−s)/(s d) p^d = 1·1/(2·3)·(1/8) + 1·2/(2·4)·(1/16)
    ///                                = 1/48 + 1/64 = 7/192.
    /// Tail ((X_l − X_s)/l + X_s/s) p^l = (1/4 + 1/2)·(1/16) = 3/64 = 9/192.
    /// RBO_ext = 1·(46 + 7)/192 + 9/192 = 62/192 = 31/96 = 0.3229166...
    #[test]
    fn hand_computed_uneven() {
        let v = rbo_ext(&["a", "b"], &["b", "c", "a", "d"], 0.5).unwrap();
        close(v, 31.0 / 96.0);
        let w = rbo_ext(&["b", "c", "a", "d"], &["a", "b"], 0.5).unwrap();
        close(w, 31.0 / 96.0);
    }

    /// A shorter list that is a prefix of the longer one is extrapolated as agreeing fully:
    /// S = [a], L = [a, b], p = 0.9. X_1 = 1, X_2 = 1, X_s = 1, X_l = 1.
    /// (1−p)/p · (1·p + (1/2)p² + 1·(1/2)p²) + (0/2 + 1/1)·p² = (1−p)(1+p) + p² = 1.
    #[test]
    fn prefix_extrapolates_to_one() {
        close(rbo_ext(&["a"], &["a", "b"], 0.9).unwrap(), 1.0);
    }

    #[test]
    fn edge_cases() {
        let empty: [&str; 0] = [];
        assert_eq!(rbo_ext(&empty, &empty, 0.9).unwrap(), 1.0);
        assert_eq!(rbo_ext(&empty, &["a"], 0.9).unwrap(), 0.0);
        assert_eq!(rbo_ext(&["a"], &empty, 0.9).unwrap(), 0.0);
        for p in [0.0, 1.0, -0.5, 2.0, f64::NAN] {
            assert!(rbo_ext(&["a"], &["a"], p).is_err(), "{p}");
        }
        // Repeats are dropped: [a, a, b] is treated as [a, b].
        close(
            rbo_ext(&["a", "a", "b"], &["a", "b"], 0.9).unwrap(),
            rbo_ext(&["a", "b"], &["a", "b"], 0.9).unwrap(),
        );
    }

    #[test]
    fn swapping_the_top_costs_more_than_swapping_the_bottom() {
        let base = ["a", "b", "c", "d", "e"];
        let top = rbo_ext(&base, &["b", "a", "c", "d", "e"], 0.9).unwrap();
        let bottom = rbo_ext(&base, &["a", "b", "c", "e", "d"], 0.9).unwrap();
        assert!(top < bottom && bottom < 1.0, "{top} {bottom}");
    }

    fn list() -> impl Strategy<Value = Vec<u8>> {
        proptest::collection::vec(0u8..30, 0..25)
    }

    proptest! {
        #[test]
        fn in_unit_interval_and_symmetric(a in list(), b in list(), p in 0.05f64..0.99) {
            let x = rbo_ext(&a, &b, p).unwrap();
            let y = rbo_ext(&b, &a, p).unwrap();
            prop_assert!((0.0..=1.0).contains(&x));
            prop_assert!((x - y).abs() < 1e-12);
        }

        #[test]
        fn identical_lists_score_one(a in list(), p in 0.05f64..0.99) {
            let x = rbo_ext(&a, &a, p).unwrap();
            prop_assert!((x - 1.0).abs() < 1e-12, "{}", x);
        }

        #[test]
        fn disjoint_lists_score_zero(a in list(), b in list(), p in 0.05f64..0.99) {
            let b: Vec<u16> = b.iter().map(|&x| u16::from(x) + 1000).collect();
            let a: Vec<u16> = a.iter().map(|&x| u16::from(x)).collect();
            prop_assume!(!a.is_empty() || !b.is_empty());
            prop_assert_eq!(rbo_ext(&a, &b, p).unwrap(), 0.0);
        }
    }
}
