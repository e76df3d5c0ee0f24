//! Paired significance of a difference in mean per-query scores.
//!
//! The test is the two-sided paired randomization (permutation) test, also called Fisher's
//! randomization test, which M. D. Smucker, J. Allan and B. Carterette recommend for IR
//! evaluation in "A comparison of statistical significance tests for information retrieval
//! evaluation" (CIKM 2007).
//!
//! Under the null hypothesis the two systems are exchangeable on every query, so each
//! per-query difference `d_i = after_i − before_i` is as likely to have had the opposite
//! sign. The p-value is the share of sign assignments whose mean difference is at least as
//! far from zero as the observed one:
//!
//! * **Exact**: when at most [`RandomizationTest::exact_limit`] differences are non-zero
//!   (default 20), all 2^m sign assignments of the m non-zero differences are counted (zero
//!   differences do not change the statistic under any sign). The count is done by meeting
//!   in the middle: the sums of each half's assignments are enumerated and one half sorted,
//!   so 2^20 assignments cost two lists of 1,024 sums.
//! * **Sampled**: otherwise [`RandomizationTest::trials`] random assignments (default
//!   10,000) are drawn from a ChaCha8 generator seeded with [`RandomizationTest::seed`], so
//!   the result is deterministic for a seed. The p-value is (hits + 1) / (trials + 1), which
//!   counts the observed assignment among the trials and is never 0 (B. Phipson and G. K.
//!   Smyth, "Permutation p-values should never be zero", Statistical Applications in
//!   Genetics and Molecular Biology 9(1), 2010).
//!
//! Differences within 1e-12 of zero count as zero. Assignments whose absolute sum is within
//! a relative 1e-10 of the observed one count as ties, i.e. as "at least as extreme", so
//! rounding cannot move an assignment that is mathematically a tie out of the count.

use rand::{RngCore, SeedableRng};
use rand_chacha::ChaCha8Rng;
use serde::{Deserialize, Serialize};

use super::error::MetricsError;

/// Differences at most this far from zero are treated as zero.
pub const ZERO_DIFFERENCE: f64 = 1e-12;

/// The largest allowed [`RandomizationTest::exact_limit`] (2^40 assignments).
pub const MAX_EXACT_LIMIT: usize = 40;

/// Settings of the paired randomization test.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(default)]
pub struct RandomizationTest {
    /// Random sign assignments drawn when the test is not exact. Default 10,000.
    pub trials: usize,
    /// Seed of the ChaCha8 generator.
    pub seed: u64,
    /// Enumerate all assignments when at most this many differences are non-zero.
    /// Default 20, at most [`MAX_EXACT_LIMIT`]; 0 always samples.
    pub exact_limit: usize,
}

impl Default for RandomizationTest {
    fn default() -> Self {
        Self {
            trials: 10_000,
            seed: 0x6c65_7864_656c_7461,
            exact_limit: 20,
        }
    }
}

/// How a p-value was obtained.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum TestMethod {
    /// Every sign assignment of the non-zero differences was counted.
    Exact {
        /// 2^(non-zero differences).
        assignments: u64,
    },
    /// Random sign assignments were drawn.
    Sampled {
        /// How many.
        trials: usize,
        /// From which seed.
        seed: u64,
    },
}

/// The outcome of a paired randomization test.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct PairedTest {
    /// Number of paired queries (zero differences included).
    pub num_queries: usize,
    /// Number of queries whose difference is non-zero.
    pub nonzero_differences: usize,
    /// Mean of after − before over all paired queries (0 for no queries).
    pub mean_difference: f64,
    /// Two-sided p-value, in (0, 1]. 1 when no difference is non-zero.
    pub p_value: f64,
    /// How the p-value was obtained.
    pub method: TestMethod,
}

impl RandomizationTest {
    /// Checks the settings.
    pub fn validate(&self) -> Result<(), MetricsError> {
        if self.exact_limit > MAX_EXACT_LIMIT {
            return Err(MetricsError::InvalidParameter {
                name: "exact_limit",
                message: format!("{} is above {MAX_EXACT_LIMIT}", self.exact_limit),
            });
        }
        if self.trials == 0 {
            return Err(MetricsError::InvalidParameter {
                name: "trials",
                message: "at least one trial is needed".into(),
            });
        }
        Ok(())
    }

    /// Tests paired per-query scores: `before[i]` and `after[i]` belong to the same query.
    pub fn paired(&self, before: &[f64], after: &[f64]) -> Result<PairedTest, MetricsError> {
        if before.len() != after.len() {
            return Err(MetricsError::LengthMismatch {
                before: before.len(),
                after: after.len(),
            });
        }
        let diffs: Vec<f64> = before.iter().zip(after).map(|(b, a)| a - b).collect();
        // Report the first non-finite input, not the difference.
        if let Some(index) = before
            .iter()
            .zip(after)
            .position(|(b, a)| !b.is_finite() || !a.is_finite())
        {
            return Err(MetricsError::NonFiniteScore { index });
        }
        self.differences(&diffs)
    }

    /// Tests per-query differences (after − before) directly.
    pub fn differences(&self, diffs: &[f64]) -> Result<PairedTest, MetricsError> {
        self.validate()?;
        if let Some(index) = diffs.iter().position(|d| !d.is_finite()) {
            return Err(MetricsError::NonFiniteScore { index });
        }
        let n = diffs.len();
        let mean_difference = if n == 0 {
            0.0
        } else {
            diffs.iter().sum::<f64>() / n as f64
        };
        let nonzero: Vec<f64> = diffs
            .iter()
            .copied()
            .filter(|d| d.abs() > ZERO_DIFFERENCE)
            .collect();
        let m = nonzero.len();
        let observed: f64 = nonzero.iter().sum::<f64>().abs();
        let scale: f64 = nonzero.iter().map(|d| d.abs()).sum();
        let threshold = observed - 1e-10 * scale;

        let (p_value, method) = if m <= self.exact_limit {
            let assignments = 1u64 << m;
            let p = if threshold <= 0.0 {
                1.0
            } else {
                exact_count(&nonzero, threshold) as f64 / assignments as f64
            };
            (p, TestMethod::Exact { assignments })
        } else {
            let hits = sampled_count(&nonzero, threshold, self.trials, self.seed);
            (
                (hits + 1) as f64 / (self.trials + 1) as f64,
                TestMethod::Sampled {
                    trials: self.trials,
                    seed: self.seed,
                },
            )
        };
        Ok(PairedTest {
            num_queries: n,
            nonzero_differences: m,
            mean_difference,
            p_value,
            method,
        })
    }
}

/// [`RandomizationTest::paired`] as a free function.
pub fn paired_randomization_test(
    before: &[f64],
    after: &[f64],
    test: &RandomizationTest,
) -> Result<PairedTest, MetricsError> {
    test.paired(before, after)
}

/// All 2^len signed sums of `values`.
fn all_sums(values: &[f64]) -> Vec<f64> {
    (0u64..1 << values.len())
        .map(|mask| {
            values
                .iter()
                .enumerate()
                .map(|(i, v)| if mask >> i & 1 == 1 { -v } else { *v })
                .sum()
        })
        .collect()
}

/// Number of sign assignments of `values` with |signed sum| ≥ `threshold` (> 0).
fn exact_count(values: &[f64], threshold: f64) -> u64 {
    let (left, right) = values.split_at(values.len() / 2);
    let left = all_sums(left);
    let mut right = all_sums(right);
    right.sort_by(f64::total_cmp);
    left.iter()
        .map(|a| {
            // Sums a + b ≥ threshold, and sums a + b ≤ −threshold: disjoint as threshold > 0.
            let high = right.len() - right.partition_point(|b| a + b < threshold);
            let low = right.partition_point(|b| a + b <= -threshold);
            (high + low) as u64
        })
        .sum()
}

/// Number of random sign assignments of `values` with |signed sum| ≥ `threshold`.
fn sampled_count(values: &[f64], threshold: f64, trials: usize, seed: u64) -> u64 {
    let mut rng = ChaCha8Rng::seed_from_u64(seed);
    let mut hits = 0u64;
    for _ in 0..trials {
        let mut sum = 0.0;
        for chunk in values.chunks(64) {
            let bits = rng.next_u64();
            for (i, v) in chunk.iter().enumerate() {
                sum += if bits >> i & 1 == 1 { -v } else { *v };
            }
        }
        hits += u64::from(sum.abs() >= threshold);
    }
    hits
}

#[cfg(test)]
mod tests {
    use super::*;

    fn test() -> RandomizationTest {
        RandomizationTest::default()
    }

    #[test]
    fn all_zero_differences_give_p_one() {
        let t = test().paired(&[0.5, 0.2, 0.0], &[0.5, 0.2, 0.0]).unwrap();
        assert_eq!(t.p_value, 1.0);
        assert_eq!(t.mean_difference, 0.0);
        assert_eq!(t.num_queries, 3);
        assert_eq!(t.nonzero_differences, 0);
        assert_eq!(t.method, TestMethod::Exact { assignments: 1 });
        let sampled = RandomizationTest {
            exact_limit: 0,
            ..test()
        };
        assert_eq!(sampled.differences(&[0.0; 30]).unwrap().p_value, 1.0);
        assert_eq!(test().differences(&[]).unwrap().p_value, 1.0);
    }

    /// Hand computation (the module author's own), exact enumeration:
    /// differences 0.1, 0.2, 0.3, 0 (the zero does not count). Observed sum 0.6.
    /// The 8 signed sums of (±0.1, ±0.2, ±0.3): 0.6, 0.4, 0.2, 0.0, 0.0, −0.2, −0.4, −0.6.
    /// |sum| ≥ 0.6 for 2 of 8, so p = 0.25. The mean difference is 0.6 / 4 = 0.15.
    #[test]
    fn hand_computed_exact() {
        let t = test()
            .paired(&[0.5, 0.5, 0.5, 0.7], &[0.6, 0.7, 0.8, 0.7])
            .unwrap();
        assert_eq!(t.method, TestMethod::Exact { assignments: 8 });
        assert_eq!(t.nonzero_differences, 3);
        assert!((t.p_value - 0.25).abs() < 1e-15, "{}", t.p_value);
        assert!((t.mean_difference - 0.15).abs() < 1e-15);
    }

    /// Differences 0.5, −0.5, 0.25: observed |sum| = 0.25. Signed sums of (±0.5, ±0.5,
    /// ±0.25): ±1.25 (2 ways), ±0.75 (2), ±0.25 (4: the two 0.5s cancel). All 8 reach 0.25,
    /// so p = 1. With 1, 1, 1, −1: observed 2; sums ±4 (2 ways), ±2 (8), 0 (6): p = 10/16.
    #[test]
    fn hand_computed_exact_with_ties() {
        let t = test().differences(&[0.5, -0.5, 0.25]).unwrap();
        assert_eq!(t.p_value, 1.0);
        let t = test().differences(&[1.0, 1.0, 1.0, -1.0]).unwrap();
        assert_eq!(t.p_value, 10.0 / 16.0);
    }

    /// A single non-zero difference: signed sums ±d, both as extreme: p = 1. Two equal
    /// differences: sums ±2d (2 of 4 reach 2d): p = 0.5.
    #[test]
    fn tiny_cases() {
        assert_eq!(test().differences(&[0.3]).unwrap().p_value, 1.0);
        assert_eq!(test().differences(&[0.3, 0.3]).unwrap().p_value, 0.5);
        // Ten equal improvements: only all-plus and all-minus reach the observed sum.
        let t = test().differences(&[0.1; 10]).unwrap();
        assert_eq!(t.p_value, 2.0 / 1024.0);
    }

    #[test]
    fn exact_matches_brute_force() {
        // Awkward values, odd length, mixed signs.
        let d = [
            0.31, -0.07, 0.12, 0.5, -0.44, 0.09, 0.2, 0.013, -0.3, 0.27, 0.06,
        ];
        let observed: f64 = d.iter().sum::<f64>().abs();
        let scale: f64 = d.iter().map(|x| x.abs()).sum();
        let brute = all_sums(&d)
            .iter()
            .filter(|s| s.abs() >= observed - 1e-10 * scale)
            .count();
        let t = test().differences(&d).unwrap();
        assert_eq!(t.p_value, brute as f64 / 2048.0);
    }

    #[test]
    fn sampled_is_deterministic_and_close_to_exact() {
        let d: Vec<f64> = (0..16)
            .map(|i| ((i * 37 % 11) as f64 - 4.0) / 10.0)
            .collect();
        let exact = test().differences(&d).unwrap();
        let sampled_cfg = RandomizationTest {
            exact_limit: 0,
            ..test()
        };
        let a = sampled_cfg.differences(&d).unwrap();
        let b = sampled_cfg.differences(&d).unwrap();
        assert_eq!(a, b);
        assert!(matches!(
            a.method,
            TestMethod::Sampled { trials: 10_000, .. }
        ));
        let p = exact.p_value;
        let se = (p * (1.0 - p) / 10_000.0).sqrt();
        assert!(
            (a.p_value - p).abs() < 5.0 * se + 1e-3,
            "sampled {} vs exact {p}",
            a.p_value
        );
        let other_seed = RandomizationTest {
            seed: 7,
            ..sampled_cfg
        };
        assert_ne!(other_seed.differences(&d).unwrap().p_value, a.p_value);
    }

    #[test]
    fn large_consistent_improvement_is_significant() {
        let before: Vec<f64> = (0..200).map(|i| (i % 10) as f64 / 10.0).collect();
        let after: Vec<f64> = before.iter().map(|b| b + 0.05).collect();
        let t = test().paired(&before, &after).unwrap();
        assert!(matches!(t.method, TestMethod::Sampled { .. }));
        // No random assignment reaches the observed sum: p = 1 / 10001.
        assert_eq!(t.p_value, 1.0 / 10_001.0);
        assert!((t.mean_difference - 0.05).abs() < 1e-12);
    }

    #[test]
    fn rejects_bad_input() {
        assert!(matches!(
            test().paired(&[0.1], &[0.1, 0.2]),
            Err(MetricsError::LengthMismatch { .. })
        ));
        assert!(matches!(
            test().paired(&[0.1, f64::NAN], &[0.1, 0.2]),
            Err(MetricsError::NonFiniteScore { index: 1 })
        ));
        let bad = RandomizationTest {
            exact_limit: 41,
            ..test()
        };
        assert!(bad.differences(&[0.1]).is_err());
        let bad = RandomizationTest {
            trials: 0,
            ..test()
        };
        assert!(bad.differences(&[0.1]).is_err());
    }
}
