//! `oversized-group`: synonym rules that tie too many keys together.

use std::collections::BTreeSet;

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::lint::graph::{EdgeKind, NodeKind};
use crate::lint::{Context, Finding};
use crate::severity::Severity;

/// Keys listed on a finding, and other rules named as related locations.
const LISTED: usize = 50;
const RELATED: usize = 5;

pub const INFO: CheckInfo = CheckInfo {
    name: "oversized-group",
    severity: Severity::Warning,
    needs: Needs::Nothing,
    summary: "a connected group of synonym keys larger than max_group_size",
    finds: "A connected component of the synonym graph — equivalent sets and one-way rules \
            joined wherever they share a key — with more than `lint.max_group_size` keys (10 \
            unless the ruleset sets it).",
    why: "Synonym rules grow one reasonable edit at a time, and sets that share a term \
          quietly join. A group that large rarely means one thing: it is where a search for \
          one word starts returning documents about a loosely related one. The group is \
          usually held together by one or two bridge terms.",
    example: "synonyms:\n  - equivalent: [ticket, pass, card]\n  - equivalent: [card, wayfare, smart card]\n  - equivalent: [pass, permit, season ticket]\n  # … and a few more sets sharing one term each",
    fix: "Find the bridge terms (see `set-bridge`) and split the group; raise \
          `lint.max_group_size` only if the group really is one topic.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let components = cx.graph.components();
    let mut sizes = vec![0usize; components.count()];
    for (node, n) in cx.graph.nodes() {
        if matches!(n.kind, NodeKind::Key(_)) {
            sizes[components.of(node)] += 1;
        }
    }
    if sizes.iter().all(|s| *s <= cx.max_group_size) {
        return;
    }
    // Labels only for the groups that are reported.
    let mut keys: Vec<Vec<String>> = vec![Vec::new(); components.count()];
    for (node, n) in cx.graph.nodes() {
        let c = components.of(node);
        if sizes[c] > cx.max_group_size && matches!(n.kind, NodeKind::Key(_)) {
            keys[c].push(n.label());
        }
    }
    let mut rules: Vec<BTreeSet<usize>> = vec![BTreeSet::new(); components.count()];
    for (from, _, edge) in cx.graph.edges() {
        if let (EdgeKind::Member | EdgeKind::OneWay, RuleRef::Synonym(i)) = (edge.kind, edge.rule) {
            rules[components.of(from)].insert(i);
        }
    }
    for (c, mut group) in keys.into_iter().enumerate() {
        if group.len() <= cx.max_group_size {
            continue;
        }
        group.sort_unstable();
        let in_group: Vec<usize> = rules[c].iter().copied().collect();
        let Some(&first) = in_group.first() else {
            continue;
        };
        out.push(finding(cx, first, &in_group, group));
    }
}

fn finding(cx: &Context, first: usize, in_group: &[usize], mut group: Vec<String>) -> Finding {
    let shown: Vec<String> = group.iter().take(8).map(|k| format!("{k:?}")).collect();
    let mut f = Finding::new(
        &INFO,
        &cx.ruleset.synonyms[first].meta.origin,
        format!(
            "{} synonym rules tie {} keys into one connected group, more than max_group_size ({}): {}{}",
            in_group.len(),
            group.len(),
            cx.max_group_size,
            shown.join(", "),
            if group.len() > shown.len() { ", …" } else { "" }
        ),
    )
    .on_rule(cx.analyzer, RuleRef::Synonym(first))
    .help("look for the bridge terms (set-bridge) and split the group, or raise lint.max_group_size if it is one topic");
    for &i in in_group.iter().skip(1).take(RELATED) {
        let rule = RuleRef::Synonym(i);
        f = f.related(
            &cx.ruleset.synonyms[i].meta.origin,
            format!("{} is part of the group", cx.analyzer.rule_label(rule)),
            Some(rule),
        );
    }
    group.truncate(LISTED);
    f.members(group)
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn sets_joined_through_shared_terms_grow_past_the_limit() {
        let a = analyzer(
            "lint:\n  max_group_size: 4\nsynonyms:\n  - equivalent: [ticket, pass, card]\n  - equivalent: [card, wayfare]\n  - one_way: {from: wayfare, to: [smart card]}\n  - equivalent: [tram, light rail]\n",
        );
        let report = run(&a, None);
        let f = of(&report, "oversized-group");
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].origin.line, 6);
        assert_eq!(
            f[0].members,
            ["card", "pass", "smart card", "ticket", "wayfar"]
        );
        assert_eq!(f[0].related.len(), 2);
    }

    #[test]
    fn small_groups_are_fine() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [ticket, pass, card]\n  - equivalent: [card, wayfare]\n",
        );
        assert!(of(&run(&a, None), "oversized-group").is_empty());
    }
}
