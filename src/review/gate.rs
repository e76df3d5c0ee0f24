//! The gate: agreed limits a change must stay within, each breach with a one-line reason.
//!
//! Limits come from the `gate:` section of the **base** ruleset — a change under review
//! cannot loosen the limits it is judged by — and can be set or overridden on the command
//! line.

use serde::Serialize;

use crate::severity::Severity;

pub use crate::rules::{GateLimits, Limit, LimitValue};

/// What the gate looks at, taken from the review's result.
#[derive(Clone, Debug, Default)]
pub struct GateInput {
    /// Emptied queries and their searches.
    pub emptied: Vec<(String, u64)>,
    /// Searches whose results lost documents, and all searches.
    pub lost_searches: u64,
    pub total_searches: u64,
    /// Mean nDCG before and after, when judgments were given.
    pub ndcg: Option<(String, f64, f64)>,
    /// Per judged query: (query, searches, nDCG before, after).
    pub query_ndcg: Vec<(String, u64, f64, f64)>,
    /// Lint findings per severity.
    pub lint: Vec<(Severity, usize)>,
    /// No query matched any document on either side: nothing was searched.
    pub nothing_found: bool,
}

#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Breach {
    pub limit: &'static str,
    pub reason: String,
}

#[derive(Clone, Debug, Serialize)]
pub struct GateOutcome {
    pub limits: GateLimits,
    pub breaches: Vec<Breach>,
}

impl GateOutcome {
    pub fn passed(&self) -> bool {
        self.breaches.is_empty()
    }
}

/// Checks every limit; all breaches are reported, not only the first. A preview in which
/// nothing was found fails whatever the limits: no limit can be judged on it.
pub fn check(limits: &GateLimits, input: &GateInput) -> GateOutcome {
    let mut breaches = Vec::new();
    if input.nothing_found {
        breaches.push(Breach {
            limit: "nothing_found",
            reason: "no query matched any document, before or after the change: nothing was \
                     searched, so no limit can pass (check the searched fields and the query log)"
                .into(),
        });
    }
    if let Some(max) = limits.searches(Limit::MaxEmptiedSearches) {
        let mut over: Vec<&(String, u64)> =
            input.emptied.iter().filter(|(_, n)| *n > max).collect();
        over.sort_by(|a, b| b.1.cmp(&a.1).then_with(|| a.0.cmp(&b.0)));
        for (query, searches) in over {
            breaches.push(Breach {
                limit: Limit::MaxEmptiedSearches.key(),
                reason: format!("{query:?} ({searches} searches) finds nothing after the change; the limit is {max}"),
            });
        }
    }
    if let Some(max) = limits.fraction(Limit::MaxLostTrafficShare)
        && input.total_searches > 0
    {
        let share = input.lost_searches as f64 / input.total_searches as f64;
        if share > max {
            breaches.push(Breach {
                limit: Limit::MaxLostTrafficShare.key(),
                reason: format!(
                    "{:.1}% of searches ({} of {}) lose documents; the limit is {:.1}%",
                    share * 100.0,
                    input.lost_searches,
                    input.total_searches,
                    max * 100.0
                ),
            });
        }
    }
    if let (Some(max), Some((metric, before, after))) =
        (limits.fraction(Limit::MaxNdcgDrop), &input.ndcg)
    {
        let drop = before - after;
        if drop > max {
            breaches.push(Breach {
                limit: Limit::MaxNdcgDrop.key(),
                reason: format!("mean {metric} drops by {drop:.4} ({before:.4} → {after:.4}); the limit is {max:.4}"),
            });
        }
    }
    if let Some(max) = limits.fraction(Limit::MaxQueryNdcgDrop) {
        let mut over: Vec<&(String, u64, f64, f64)> = input
            .query_ndcg
            .iter()
            .filter(|(_, _, b, a)| b - a > max)
            .collect();
        over.sort_by(|x, y| {
            (y.2 - y.3)
                .total_cmp(&(x.2 - x.3))
                .then_with(|| x.0.cmp(&y.0))
        });
        for (query, searches, before, after) in over {
            breaches.push(Breach {
                limit: Limit::MaxQueryNdcgDrop.key(),
                reason: format!(
                    "{query:?} ({searches} searches): nDCG drops by {:.4} ({before:.4} → {after:.4}); the limit is {max:.4}",
                    before - after
                ),
            });
        }
    }
    if let Some(floor) = limits.severity(Limit::FailOnLint) {
        let n: usize = input
            .lint
            .iter()
            .filter(|(s, _)| *s >= floor)
            .map(|(_, n)| n)
            .sum();
        if n > 0 {
            breaches.push(Breach {
                limit: Limit::FailOnLint.key(),
                reason: format!(
                    "{n} lint finding{} at {floor} or above",
                    if n == 1 { "" } else { "s" }
                ),
            });
        }
    }
    GateOutcome {
        limits: limits.clone(),
        breaches,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn input() -> GateInput {
        GateInput {
            emptied: vec![("transitions".into(), 14), ("rare".into(), 1)],
            lost_searches: 3000,
            total_searches: 90_000,
            ndcg: Some(("nDCG@10".into(), 0.66, 0.64)),
            query_ndcg: vec![("access pass".into(), 120, 0.71, 0.11)],
            lint: vec![(Severity::Warning, 3)],
            nothing_found: false,
        }
    }

    /// Nothing searched is a breach even with no limits set, and beside any other.
    #[test]
    fn nothing_found_fails_the_gate_without_any_limit() {
        let nothing = GateInput {
            nothing_found: true,
            ..GateInput::default()
        };
        let out = check(&GateLimits::default(), &nothing);
        assert!(!out.passed());
        assert_eq!(out.breaches[0].limit, "nothing_found");
        assert!(check(&GateLimits::default(), &input()).passed());
    }

    #[test]
    fn each_breached_limit_gives_one_reason() {
        let mut limits = GateLimits::default();
        limits.set(Limit::MaxEmptiedSearches, LimitValue::Searches(5));
        limits.set(Limit::MaxLostTrafficShare, LimitValue::Fraction(0.02));
        limits.set(Limit::MaxNdcgDrop, LimitValue::Fraction(0.01));
        limits.set(Limit::MaxQueryNdcgDrop, LimitValue::Fraction(0.25));
        limits.set(Limit::FailOnLint, LimitValue::Severity(Severity::Error));
        let out = check(&limits, &input());
        let names: Vec<&str> = out.breaches.iter().map(|b| b.limit).collect();
        assert_eq!(
            names,
            [
                "max_emptied_searches",
                "max_lost_traffic_share",
                "max_ndcg_drop",
                "max_query_ndcg_drop"
            ]
        );
        assert!(
            out.breaches[0]
                .reason
                .contains("\"transitions\" (14 searches)")
        );
        assert!(!out.passed());
    }

    #[test]
    fn within_limits_passes_and_cli_overrides_the_ruleset() {
        let mut ruleset = GateLimits::default();
        ruleset.set(Limit::MaxEmptiedSearches, LimitValue::Searches(0));
        let mut cli = GateLimits::default();
        cli.set(Limit::MaxEmptiedSearches, LimitValue::Searches(100));
        let limits = ruleset.overridden_by(&cli);
        assert!(check(&limits, &input()).passed());
    }
}
