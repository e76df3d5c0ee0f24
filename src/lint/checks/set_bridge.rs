//! `set-bridge`: a key that is a member of two or more equivalent sets.

use petgraph::graph::NodeIndex;
use rustc_hash::{FxHashMap, FxHashSet};

use super::{CheckInfo, Needs, written};
use crate::analysis::{Phrase, RuleRef};
use crate::lint::graph::{Edge, NodeKind};
use crate::lint::{Context, Finding, quoted_list};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "set-bridge",
    severity: Severity::Warning,
    needs: Needs::Nothing,
    summary: "a term in two equivalent sets, which bridges them into one lopsided group",
    finds: "A key that is a member of two or more equivalent sets (compared after \
            normalization, so `change` in one set and `changes` in another count). The \
            finding names the bridge term and the merged group it creates.",
    why: "Expansion takes one step: a search for the bridge term finds the members of every \
          set it is in, while the other members only find their own set. Usually the bridge \
          term has two meanings (changing buses, changing a booking), and searches for one \
          meaning now reach documents about the other.",
    example: "synonyms:\n  - id: vehicle-change\n    equivalent: [change, transfer, connection]\n  - id: booking-changes\n    equivalent: [change, amend, alter]",
    fix: "If all the words are interchangeable, merge the sets into one. If the bridge term \
          has two senses, keep it in one set and reach the other sense with a one-way rule \
          or a more specific phrase (`change booking`).",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    // Each set's content is worked out once, however many of its keys are looked at: a
    // set of 100k members sorted once per member was quadratic.
    let mut contents = Contents::default();
    for (node, n) in cx.graph.nodes() {
        if !matches!(n.kind, NodeKind::Key(_)) || cx.graph.set_count(node) < 2 {
            continue;
        }
        let sets = distinct_sets(cx, node, &mut contents);
        if sets.len() >= 2 {
            out.push(finding(cx, node, &sets));
        }
    }
}

/// Each set's content (its member keys, sorted, without repeats) as a number: two sets
/// with the same number say the same thing.
#[derive(Default)]
struct Contents {
    of_hub: FxHashMap<NodeIndex, usize>,
    ids: FxHashMap<Vec<Phrase>, usize>,
}

impl Contents {
    fn id(&mut self, cx: &Context, hub: NodeIndex) -> usize {
        if let Some(&id) = self.of_hub.get(&hub) {
            return id;
        }
        let mut content: Vec<Phrase> = cx
            .graph
            .members(hub)
            .into_iter()
            .filter_map(|(m, _)| match &cx.graph.node(m).kind {
                NodeKind::Key(p) => Some(p.clone()),
                _ => None,
            })
            .collect();
        content.sort_unstable();
        content.dedup();
        let next = self.ids.len();
        let id = *self.ids.entry(content).or_insert(next);
        self.of_hub.insert(hub, id);
        id
    }
}

/// The sets a key is in, leaving out any set that says exactly what an earlier one says
/// (`duplicate-rule` reports those): `(hub, member edge)` in rule order.
fn distinct_sets<'g>(
    cx: &Context<'g>,
    node: NodeIndex,
    contents: &mut Contents,
) -> Vec<(NodeIndex, &'g Edge)> {
    let mut hubs: Vec<(NodeIndex, &'g Edge)> = Vec::new();
    for (hub, edge) in cx.graph.sets_of(node) {
        // The same key twice in one set is redundant-member's business, not a bridge.
        if !hubs.iter().any(|(h, _)| *h == hub) {
            hubs.push((hub, edge));
        }
    }
    if hubs.len() < 2 {
        return hubs;
    }
    let mut seen: FxHashSet<usize> = FxHashSet::default();
    hubs.into_iter()
        .filter(|(hub, _)| seen.insert(contents.id(cx, *hub)))
        .collect()
}

fn finding(cx: &Context, node: NodeIndex, sets: &[(NodeIndex, &Edge)]) -> Finding {
    let (_, primary) = sets[sets.len() - 1];
    let bridge = written(cx.graph, node, primary.rule);
    let labels: Vec<String> = sets
        .iter()
        .map(|(_, e)| cx.analyzer.rule_label(e.rule))
        .collect();
    let group = merged_group(cx, node, sets);
    let others: Vec<&String> = group.iter().filter(|t| **t != bridge).collect();
    let first_of = |i: usize| -> Option<String> {
        let hub = sets.get(i)?.0;
        cx.graph
            .members(hub)
            .into_iter()
            .find(|(m, _)| *m != node)
            .map(|(m, e)| written(cx.graph, m, e.rule))
    };
    let contrast = match (first_of(0), first_of(sets.len() - 1)) {
        (Some(a), Some(b)) => format!(", but {a:?} still does not find {b:?}"),
        _ => String::new(),
    };
    let mut f = Finding::new(
        &INFO,
        &primary.origin,
        format!(
            "{bridge:?} is in {} equivalent sets ({}): a search for it finds all of {}{contrast}; the sets meet only through {bridge:?}",
            sets.len(),
            labels.join(", "),
            quoted_list(&others)
        ),
    )
    .on_rule(cx.analyzer, primary.rule)
    .members(group)
    .help(format!(
        "if all these words are interchangeable, merge the sets; if {bridge:?} has two senses, keep it in one set and reach the other with a one-way rule or a more specific phrase"
    ));
    for (_, edge) in &sets[..sets.len() - 1] {
        let as_written = written(cx.graph, node, edge.rule);
        let note = if as_written == bridge {
            format!(
                "{bridge:?} is also in {}",
                cx.analyzer.rule_label(edge.rule)
            )
        } else {
            format!(
                "{as_written:?}, the same keys as {bridge:?}, is in {}",
                cx.analyzer.rule_label(edge.rule)
            )
        };
        f = f.related(&edge.origin, note, Some(edge.rule));
    }
    f
}

/// Every member of the bridged sets, as written, the bridge first, each once.
fn merged_group(cx: &Context, node: NodeIndex, sets: &[(NodeIndex, &Edge)]) -> Vec<String> {
    let rule_of = |e: &Edge| e.rule;
    let mut seen: FxHashSet<NodeIndex> = FxHashSet::from_iter([node]);
    let last: RuleRef = rule_of(sets[sets.len() - 1].1);
    let mut group = vec![written(cx.graph, node, last)];
    for (hub, _) in sets {
        for (member, edge) in cx.graph.members(*hub) {
            if seen.insert(member) {
                group.push(written(cx.graph, member, edge.rule));
            }
        }
    }
    group
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn the_bridge_term_and_the_merged_group_are_named() {
        let a = analyzer(
            "synonyms:\n  - id: vehicle-change\n    equivalent: [change, transfer, connection]\n  - id: booking-changes\n    equivalent: [changes, amend, alter]\n",
        );
        let report = run(&a, None);
        let f = of(&report, "set-bridge");
        assert_eq!(f.len(), 1);
        let f = f[0];
        assert_eq!((f.origin.line, f.origin.column), (7, 18));
        assert_eq!(f.rule.as_deref(), Some("booking-changes"));
        assert_eq!(
            f.members,
            ["changes", "transfer", "connection", "amend", "alter"]
        );
        assert!(
            f.message
                .contains("\"transfer\" still does not find \"amend\""),
            "{}",
            f.message
        );
        assert!(
            f.related[0].note.contains("\"change\", the same keys"),
            "{:?}",
            f.related
        );
    }

    #[test]
    fn separate_sets_and_duplicate_sets_are_not_bridges() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [pram, pushchair]\n  - equivalent: [lift, elevator]\n  - equivalent: [pushchair, pram]\n  - one_way: {from: pram, to: [buggy]}\n",
        );
        assert!(of(&run(&a, None), "set-bridge").is_empty());
    }
}
