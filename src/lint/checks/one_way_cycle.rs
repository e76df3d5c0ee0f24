//! `one-way-cycle`: one-way rules that lead back to where they started.

use std::collections::VecDeque;

use petgraph::graph::NodeIndex;
use rustc_hash::{FxHashMap, FxHashSet};

use super::{CheckInfo, Needs, written};
use crate::lint::graph::{Edge, EdgeKind};
use crate::lint::{Context, Finding, quoted_list};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "one-way-cycle",
    severity: Severity::Error,
    needs: Needs::Nothing,
    summary: "one-way rules that lead back to their own source, undoing the one-way intent",
    finds: "A chain of one-way synonym rules that comes back to its start: `a` finds `b`, \
            `b` finds `a` (or a longer loop). Terms are compared by key, so `refunds` → \
            `compensation` and `compensation` → `refund` close a loop too.",
    why: "A one-way rule exists to keep the reverse direction out. A loop puts it back: \
          every term in the loop finds the next, so the rules behave like an equivalent set \
          that nobody wrote, and searches for the narrower term fill up with the broader \
          term's documents.",
    example: "synonyms:\n  - id: refund-to-compensation\n    one_way: {from: refund, to: [compensation]}\n  - id: compensation-to-refund\n    one_way: {from: compensation, to: [refund]}",
    fix: "If the terms really are interchangeable, replace the loop with one `equivalent` \
          set. Otherwise remove the rule that points back (the finding is on the rule \
          written last).",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    for knot in cx.graph.cycles_of(EdgeKind::OneWay) {
        if let Some(cycle) = shortest_cycle(cx, &knot) {
            out.extend(finding(cx, &knot, &cycle));
        }
    }
}

/// The shortest cycle through the knot's smallest node, as the edges taken (breadth-first
/// over one-way edges inside the knot, so the loop shown is the tightest one).
fn shortest_cycle<'g>(
    cx: &Context<'g>,
    knot: &[NodeIndex],
) -> Option<Vec<(NodeIndex, NodeIndex, &'g Edge)>> {
    let inside: FxHashSet<NodeIndex> = knot.iter().copied().collect();
    let start = *knot.first()?;
    let mut came_from: FxHashMap<NodeIndex, (NodeIndex, &Edge)> = FxHashMap::default();
    let mut queue = VecDeque::from([start]);
    while let Some(node) = queue.pop_front() {
        for (next, edge) in cx.graph.out_edges(node, EdgeKind::OneWay) {
            if !inside.contains(&next) {
                continue;
            }
            if next == start {
                return Some(unwind(&came_from, start, node, edge));
            }
            if let std::collections::hash_map::Entry::Vacant(slot) = came_from.entry(next) {
                slot.insert((node, edge));
                queue.push_back(next);
            }
        }
    }
    None
}

fn unwind<'g>(
    came_from: &FxHashMap<NodeIndex, (NodeIndex, &'g Edge)>,
    start: NodeIndex,
    last: NodeIndex,
    closing: &'g Edge,
) -> Vec<(NodeIndex, NodeIndex, &'g Edge)> {
    let mut edges = vec![(last, start, closing)];
    let mut node = last;
    while node != start {
        let Some(&(prev, edge)) = came_from.get(&node) else {
            break;
        };
        edges.push((prev, node, edge));
        node = prev;
    }
    edges.reverse();
    edges
}

fn finding(
    cx: &Context,
    knot: &[NodeIndex],
    cycle: &[(NodeIndex, NodeIndex, &Edge)],
) -> Option<Finding> {
    // Report on the rule written last: usually the one that closed the loop.
    let (_, _, primary) = cycle.iter().max_by(|a, b| a.2.origin.cmp(&b.2.origin))?;
    let mut path: Vec<String> = cycle
        .iter()
        .map(|(from, _, e)| written(cx.graph, *from, e.rule))
        .collect();
    path.push(path[0].clone());
    let mut message = format!(
        "one-way rules go round in a cycle: {}; every term in it finds the next, as an equivalent set would",
        path.iter()
            .map(|t| format!("{t:?}"))
            .collect::<Vec<_>>()
            .join(" → ")
    );
    let members: Vec<String> = if knot.len() > cycle.len() {
        let all: Vec<String> = knot.iter().map(|n| cx.graph.node(*n).label()).collect();
        message.push_str(&format!(
            " ({} keys are tied in this knot: {})",
            knot.len(),
            quoted_list(&all)
        ));
        all
    } else {
        path.clone()
    };
    let mut f = Finding::new(&INFO, &primary.origin, message)
        .on_rule(cx.analyzer, primary.rule)
        .members(members)
        .help(format!(
            "if these terms are interchangeable, write one equivalent set; otherwise remove the rule that points back ({})",
            cx.analyzer.rule_label(primary.rule)
        ));
    for (from, to, e) in cycle {
        if std::ptr::eq(*e, *primary) {
            continue;
        }
        let note = format!(
            "{:?} → {:?} ({})",
            written(cx.graph, *from, e.rule),
            written(cx.graph, *to, e.rule),
            cx.analyzer.rule_label(e.rule)
        );
        f = f.related(&e.origin, note, Some(e.rule));
    }
    Some(f)
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn a_loop_is_shown_whole_on_the_rule_written_last() {
        let a = analyzer(
            "synonyms:\n  - id: r2c\n    one_way: {from: refund, to: [compensation]}\n  - id: c2r\n    one_way: {from: compensation, to: [refunds]}\n",
        );
        let report = run(&a, None);
        let found = of(&report, "one-way-cycle");
        assert_eq!(found.len(), 1);
        let f = found[0];
        assert_eq!(f.rule.as_deref(), Some("c2r"));
        assert_eq!(
            f.origin.line, 7,
            "the target of the rule that closes the loop"
        );
        assert!(
            f.message
                .contains("\"refund\" → \"compensation\" → \"refund\""),
            "{}",
            f.message
        );
        assert_eq!(f.related.len(), 1);
    }

    #[test]
    fn a_longer_loop_through_three_rules() {
        let a = analyzer(
            "synonyms:\n  - one_way: {from: a, to: [b]}\n  - one_way: {from: b, to: [c]}\n  - one_way: {from: c, to: [a]}\n",
        );
        let report = run(&a, None);
        let f = of(&report, "one-way-cycle");
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].members, ["a", "b", "c", "a"]);
        assert_eq!(f[0].related.len(), 2);
    }

    #[test]
    fn a_chain_without_a_way_back_is_fine() {
        let a = analyzer(
            "synonyms:\n  - one_way: {from: price, to: [fare]}\n  - one_way: {from: cost, to: [fare]}\n  - one_way: {from: fare, to: [ticket price]}\n",
        );
        assert!(of(&run(&a, None), "one-way-cycle").is_empty());
    }
}
