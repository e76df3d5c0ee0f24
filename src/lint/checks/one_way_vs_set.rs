//! `one-way-vs-set`: a one-way rule whose two ends are already in one equivalent set.

use super::{CheckInfo, Needs, written};
use crate::lint::graph::{EdgeKind, NodeKind};
use crate::lint::{Context, Finding};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "one-way-vs-set",
    severity: Severity::Warning,
    needs: Needs::Nothing,
    summary: "a one-way rule that an equivalent set duplicates and contradicts",
    finds: "A one-way rule `from → to` where `from` and `to` (compared by key) are both \
            members of the same equivalent set.",
    why: "The set already makes `from` find `to`, so the one-way rule adds nothing; and the \
          set also makes `to` find `from`, which is exactly what a one-way rule is written \
          to prevent. One of the two rules does not say what its author meant.",
    example: "synonyms:\n  - equivalent: [lift, elevator]\n  - one_way: {from: lift, to: [elevator]}",
    fix: "Decide which you mean: if the words are interchangeable, remove the one-way rule; \
          if searches for `to` must not find `from`, take one of them out of the set.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    for (from, n) in cx.graph.nodes() {
        if !matches!(n.kind, NodeKind::Key(_)) || cx.graph.set_count(from) == 0 {
            continue;
        }
        let from_sets = cx.graph.sets_of(from);
        if from_sets.is_empty() {
            continue;
        }
        for (to, edge) in cx.graph.out_edges(from, EdgeKind::OneWay) {
            if to == from {
                continue; // a target equal to its source: redundant-member
            }
            let to_sets = cx.graph.sets_of(to);
            let Some((_, set_edge)) = from_sets
                .iter()
                .find(|(hub, _)| to_sets.iter().any(|(h, _)| h == hub))
            else {
                continue;
            };
            let (f_text, t_text) = (
                written(cx.graph, from, edge.rule),
                written(cx.graph, to, edge.rule),
            );
            let set = cx.analyzer.rule_label(set_edge.rule);
            out.push(
                Finding::new(
                    &INFO,
                    &edge.origin,
                    format!(
                        "the one-way rule {f_text:?} → {t_text:?} is duplicated by the equivalent set {set}, which holds both: the set already makes {f_text:?} find {t_text:?}, and also makes {t_text:?} find {f_text:?}, which a one-way rule is meant to prevent"
                    ),
                )
                .on_rule(cx.analyzer, edge.rule)
                .members(vec![f_text.clone(), t_text.clone()])
                .related(&set_edge.origin, format!("{f_text:?} and {t_text:?} are members of {set}"), Some(set_edge.rule))
                .help(format!(
                    "if the words are interchangeable, remove the one-way rule; if searches for {t_text:?} must not find {f_text:?}, take one of them out of {set}"
                )),
            );
        }
    }
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn both_ends_in_one_set() {
        let a = analyzer(
            "synonyms:\n  - id: lift-elevator\n    equivalent: [lift, elevator, hoist]\n  - id: lifts-to-elevators\n    one_way: {from: lifts, to: [elevators]}\n",
        );
        let report = run(&a, None);
        let f = of(&report, "one-way-vs-set");
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].rule.as_deref(), Some("lifts-to-elevators"));
        assert!(f[0].message.contains("lift-elevator"));
        assert_eq!(f[0].related[0].origin.line, 5);
    }

    #[test]
    fn ends_in_different_sets_or_none_are_fine() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [lift, elevator]\n  - equivalent: [stairs, steps]\n  - one_way: {from: lift, to: [stairs]}\n  - one_way: {from: boat, to: [ferry]}\n",
        );
        assert!(of(&run(&a, None), "one-way-vs-set").is_empty());
    }
}
