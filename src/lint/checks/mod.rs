//! The checks, one file each. Every check carries its metadata ([`CheckInfo`]): the
//! `lexdelta lint --list-checks` table, `--explain NAME` and the SARIF rule descriptions are
//! all generated from it, never written twice.

mod dead_rule;
mod duplicate_rule;
mod exempt_pattern_coverage;
mod exempt_vs_lemma;
mod lemma_chain;
mod one_way_cycle;
mod one_way_vs_set;
mod oversized_group;
mod redundant_member;
mod revision_not_bumped;
mod set_bridge;
mod stem_side_effect;
mod stopword_in_member;
mod unknown_check;

pub use revision_not_bumped::revision_findings;

use petgraph::graph::NodeIndex;

use super::graph::TermGraph;
use super::{Context, Finding};
use crate::analysis::RuleRef;
use crate::severity::Severity;

/// What a check needs besides the ruleset.
#[derive(Clone, Copy, Debug, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Needs {
    Nothing,
    /// A vocabulary of surface forms (a corpus or a query log).
    Vocabulary,
    /// The ruleset before the change.
    Base,
}

/// A check's name, default severity and documentation.
#[derive(Clone, Copy, Debug, serde::Serialize)]
pub struct CheckInfo {
    /// Kebab-case, stable: used in `lint:` settings, `--level` and SARIF `ruleId`.
    pub name: &'static str,
    pub severity: Severity,
    pub needs: Needs,
    /// One line.
    pub summary: &'static str,
    /// What the check looks for.
    pub finds: &'static str,
    /// Why that hurts search.
    pub why: &'static str,
    /// A YAML example that fires.
    pub example: &'static str,
    /// What to write instead, usually.
    pub fix: &'static str,
}

impl CheckInfo {
    /// The explanation `--explain` prints and SARIF carries as the rule's help.
    pub fn explanation(&self) -> String {
        format!(
            "{}\n\n{}\n\nExample:\n\n{}\n\nUsual fix: {}",
            self.finds,
            self.why,
            indent(self.example.trim_end()),
            self.fix
        )
    }
}

fn indent(text: &str) -> String {
    text.lines()
        .map(|l| format!("    {l}"))
        .collect::<Vec<_>>()
        .join("\n")
}

/// A check: its metadata and the function that runs it.
pub struct Check {
    pub info: &'static CheckInfo,
    pub run: fn(&Context, &mut Vec<Finding>),
}

/// Every check, in the order `--list-checks` shows them.
pub const ALL: &[Check] = &[
    Check {
        info: &one_way_cycle::INFO,
        run: one_way_cycle::run,
    },
    Check {
        info: &lemma_chain::INFO,
        run: lemma_chain::run,
    },
    Check {
        info: &set_bridge::INFO,
        run: set_bridge::run,
    },
    Check {
        info: &one_way_vs_set::INFO,
        run: one_way_vs_set::run,
    },
    Check {
        info: &exempt_vs_lemma::INFO,
        run: exempt_vs_lemma::run,
    },
    Check {
        info: &redundant_member::INFO,
        run: redundant_member::run,
    },
    Check {
        info: &stem_side_effect::INFO,
        run: stem_side_effect::run,
    },
    Check {
        info: &stopword_in_member::INFO,
        run: stopword_in_member::run,
    },
    Check {
        info: &exempt_pattern_coverage::INFO,
        run: exempt_pattern_coverage::run,
    },
    Check {
        info: &duplicate_rule::INFO,
        run: duplicate_rule::run,
    },
    Check {
        info: &dead_rule::INFO,
        run: dead_rule::run,
    },
    Check {
        info: &oversized_group::INFO,
        run: oversized_group::run,
    },
    Check {
        info: &revision_not_bumped::INFO,
        run: revision_not_bumped::run,
    },
    Check {
        info: &unknown_check::INFO,
        run: unknown_check::run,
    },
];

/// The metadata of every check, in `ALL` order.
pub fn infos() -> impl Iterator<Item = &'static CheckInfo> {
    ALL.iter().map(|c| c.info)
}

/// The check with this exact name.
pub fn find(name: &str) -> Option<&'static CheckInfo> {
    infos().find(|c| c.name == name)
}

/// The check name closest to a misspelt one, if any is close enough to suggest.
pub fn closest(name: &str) -> Option<&'static str> {
    let mut best: Option<(f64, &'static str)> = None;
    for info in infos() {
        let score = strsim::jaro_winkler(name, info.name);
        if score >= 0.8 && best.is_none_or(|(b, _)| score > b) {
            best = Some((score, info.name));
        }
    }
    best.map(|(_, n)| n)
}

/// How a node was written in `rule` (or in its first rule): terms are shown as the author
/// wrote them, keys only where the author's words would not explain the point.
pub(crate) fn written(graph: &TermGraph, node: NodeIndex, rule: RuleRef) -> String {
    let n = graph.node(node);
    n.uses
        .iter()
        .find(|u| u.rule == rule)
        .or_else(|| n.uses.first())
        .map_or_else(|| n.label(), |u| u.text.clone())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_are_unique_kebab_case_and_documented() {
        let mut names: Vec<&str> = infos().map(|c| c.name).collect();
        for info in infos() {
            assert!(
                info.name
                    .chars()
                    .all(|c| c.is_ascii_lowercase() || c == '-'),
                "{}",
                info.name
            );
            for text in [info.summary, info.finds, info.why, info.example, info.fix] {
                assert!(!text.trim().is_empty(), "{} has an empty field", info.name);
            }
            assert!(
                !info.summary.contains('\n'),
                "{}: one-line summary",
                info.name
            );
        }
        names.sort_unstable();
        let n = names.len();
        names.dedup();
        assert_eq!(names.len(), n);
    }

    #[test]
    fn misspelt_names_get_a_suggestion() {
        assert_eq!(closest("stem-side-efect"), Some("stem-side-effect"));
        assert_eq!(closest("one-way-cycles"), Some("one-way-cycle"));
        assert_eq!(closest("zzz"), None);
    }
}
