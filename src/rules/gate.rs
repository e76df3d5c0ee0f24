//! The gate's limits, declared once: each limit's key (in the `gate:` section and, with
//! dashes, as a `review` option), the kind of value it takes with its range check, and its
//! help. The rule-file reader, the command line, the gate and the reports all derive from
//! [`Limit::ALL`] and [`Limit::spec`].

use std::collections::BTreeMap;
use std::fmt;

use serde::Serialize;

use crate::severity::Severity;

/// A limit a change must stay within.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Limit {
    MaxEmptiedSearches,
    MaxLostTrafficShare,
    MaxNdcgDrop,
    MaxQueryNdcgDrop,
    FailOnLint,
}

/// The kind of value a limit takes.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum LimitKind {
    /// A whole number of searches, at least 0.
    Searches,
    /// A share of all searches, from 0 to 1.
    Share,
    /// A drop of a metric that lies between 0 and 1, itself from 0 to 1.
    Drop,
    /// A lint severity: error, warning or info.
    Severity,
}

/// One limit's declaration.
pub struct LimitSpec {
    pub limit: Limit,
    /// The key in the `gate:` section.
    pub key: &'static str,
    /// The `review` option: the key with dashes.
    pub option: &'static str,
    pub kind: LimitKind,
    /// What the limit says, for `--help` and the documentation.
    pub help: &'static str,
}

const SPECS: [LimitSpec; 5] = [
    LimitSpec {
        limit: Limit::MaxEmptiedSearches,
        key: "max_emptied_searches",
        option: "max-emptied-searches",
        kind: LimitKind::Searches,
        help: "no query the change empties may have more searches than this",
    },
    LimitSpec {
        limit: Limit::MaxLostTrafficShare,
        key: "max_lost_traffic_share",
        option: "max-lost-traffic-share",
        kind: LimitKind::Share,
        help: "at most this share (0 to 1) of all searches may lose documents they found before",
    },
    LimitSpec {
        limit: Limit::MaxNdcgDrop,
        key: "max_ndcg_drop",
        option: "max-ndcg-drop",
        kind: LimitKind::Drop,
        help: "mean nDCG@10 over the judged queries may drop by at most this much (0 to 1)",
    },
    LimitSpec {
        limit: Limit::MaxQueryNdcgDrop,
        key: "max_query_ndcg_drop",
        option: "max-query-ndcg-drop",
        kind: LimitKind::Drop,
        help: "no judged query's nDCG@10 may drop by more than this (0 to 1)",
    },
    LimitSpec {
        limit: Limit::FailOnLint,
        key: "fail_on_lint",
        option: "fail-on-lint",
        kind: LimitKind::Severity,
        help: "no lint finding on the head at this severity or above (error, warning or info)",
    },
];

impl Limit {
    /// Every limit, in report order.
    pub const ALL: [Limit; 5] = [
        Limit::MaxEmptiedSearches,
        Limit::MaxLostTrafficShare,
        Limit::MaxNdcgDrop,
        Limit::MaxQueryNdcgDrop,
        Limit::FailOnLint,
    ];

    pub fn spec(self) -> &'static LimitSpec {
        SPECS
            .iter()
            .find(|s| s.limit == self)
            .expect("every limit is declared in SPECS")
    }

    pub fn key(self) -> &'static str {
        self.spec().key
    }

    /// Every limit's key, for the `gate:` section's key check.
    pub fn keys() -> Vec<&'static str> {
        SPECS.iter().map(|s| s.key).collect()
    }

    /// Reads a value written as text (on the command line), with the kind's range check.
    pub fn parse(self, text: &str) -> Result<LimitValue, String> {
        let text = text.trim();
        match self.spec().kind {
            LimitKind::Searches => text
                .parse::<u64>()
                .map(LimitValue::Searches)
                .map_err(|_| "must be a whole number of searches, 0 or more".into()),
            LimitKind::Share | LimitKind::Drop => {
                let v: f64 = text
                    .parse()
                    .map_err(|_| format!("{text:?} is not a number"))?;
                self.check_fraction(v).map(LimitValue::Fraction)
            }
            LimitKind::Severity => Severity::from_name(text)
                .map(LimitValue::Severity)
                .ok_or_else(|| "must be error, warning or info".into()),
        }
    }

    /// The range check of a share or a drop: a finite number from 0 to 1.
    fn check_fraction(self, v: f64) -> Result<f64, String> {
        if v.is_finite() && (0.0..=1.0).contains(&v) {
            Ok(v)
        } else {
            Err(match self.spec().kind {
                LimitKind::Share => "must be a share from 0 to 1".into(),
                _ => "must be a drop from 0 to 1".into(),
            })
        }
    }
}

impl fmt::Display for Limit {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.key())
    }
}

/// A limit's value.
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
#[serde(untagged)]
pub enum LimitValue {
    Searches(u64),
    /// A share or a drop.
    Fraction(f64),
    Severity(Severity),
}

/// The limits in force: each set limit with its value.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct GateLimits(BTreeMap<Limit, LimitValue>);

impl GateLimits {
    pub fn set(&mut self, limit: Limit, value: LimitValue) {
        self.0.insert(limit, value);
    }

    pub fn get(&self, limit: Limit) -> Option<LimitValue> {
        self.0.get(&limit).copied()
    }

    pub fn searches(&self, limit: Limit) -> Option<u64> {
        match self.get(limit)? {
            LimitValue::Searches(n) => Some(n),
            _ => None,
        }
    }

    pub fn fraction(&self, limit: Limit) -> Option<f64> {
        match self.get(limit)? {
            LimitValue::Fraction(v) => Some(v),
            _ => None,
        }
    }

    pub fn severity(&self, limit: Limit) -> Option<Severity> {
        match self.get(limit)? {
            LimitValue::Severity(s) => Some(s),
            _ => None,
        }
    }

    /// These limits, with every limit `other` sets taking precedence.
    pub fn overridden_by(mut self, other: &GateLimits) -> Self {
        self.0.extend(other.0.iter().map(|(l, v)| (*l, *v)));
        self
    }

    pub fn is_empty(&self) -> bool {
        self.0.is_empty()
    }

    /// The set limits, in report order.
    pub fn iter(&self) -> impl Iterator<Item = (Limit, LimitValue)> + '_ {
        self.0.iter().map(|(l, v)| (*l, *v))
    }
}

impl Serialize for GateLimits {
    /// As an object keyed by the limits' keys.
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.collect_map(self.0.iter().map(|(l, v)| (l.key(), v)))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_limit_is_declared_once_with_a_distinct_key() {
        let keys: std::collections::BTreeSet<&str> = Limit::ALL.iter().map(|l| l.key()).collect();
        assert_eq!(keys.len(), Limit::ALL.len());
        for limit in Limit::ALL {
            assert_eq!(limit.spec().limit, limit);
            assert_eq!(limit.spec().option, limit.key().replace('_', "-"));
        }
    }

    #[test]
    fn values_are_range_checked_by_kind() {
        assert_eq!(
            Limit::MaxEmptiedSearches.parse("10"),
            Ok(LimitValue::Searches(10))
        );
        assert!(Limit::MaxEmptiedSearches.parse("-1").is_err());
        assert_eq!(
            Limit::MaxLostTrafficShare.parse("0.02"),
            Ok(LimitValue::Fraction(0.02))
        );
        for bad in ["1.5", "-0.1", "NaN", "inf", "lots"] {
            assert!(Limit::MaxLostTrafficShare.parse(bad).is_err(), "{bad}");
            assert!(Limit::MaxNdcgDrop.parse(bad).is_err(), "{bad}");
        }
        assert_eq!(
            Limit::FailOnLint.parse("warning"),
            Ok(LimitValue::Severity(Severity::Warning))
        );
        assert!(Limit::FailOnLint.parse("off").is_err());
    }

    #[test]
    fn command_line_limits_take_precedence() {
        let mut base = GateLimits::default();
        base.set(Limit::MaxNdcgDrop, LimitValue::Fraction(0.01));
        base.set(Limit::MaxEmptiedSearches, LimitValue::Searches(10));
        let mut cli = GateLimits::default();
        cli.set(Limit::MaxEmptiedSearches, LimitValue::Searches(100));
        let both = base.overridden_by(&cli);
        assert_eq!(both.searches(Limit::MaxEmptiedSearches), Some(100));
        assert_eq!(both.fraction(Limit::MaxNdcgDrop), Some(0.01));
        assert_eq!(
            serde_json::to_string(&both).unwrap(),
            r#"{"max_emptied_searches":100,"max_ndcg_drop":0.01}"#
        );
    }
}
