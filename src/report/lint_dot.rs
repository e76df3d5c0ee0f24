//! The term graph's components that have findings, as DOT (Graphviz), for `--graph FILE`.
//!
//! Each component is a cluster. Key nodes are ellipses labelled with the term as written
//! (and its keys when they differ), set hubs are small boxes named after their rule,
//! surface forms of lemma overrides are dashed ellipses; exempt nodes get a double border.
//! One-way and lemma edges are arrows, set membership is a plain line. Nodes and edges of
//! the rules a finding names are drawn thicker and in red, so the eye finds the problem.

use std::collections::BTreeSet;
use std::fmt::Write as _;

use petgraph::graph::NodeIndex;
use rustc_hash::FxHashSet;

use crate::analysis::RuleRef;
use crate::lint::LintReport;
use crate::lint::graph::{EdgeKind, Node, NodeKind, TermGraph};

/// Renders the components of `report.graph` that hold a rule some finding names.
pub fn render(report: &LintReport) -> String {
    let graph = &report.graph;
    let flagged = flagged_rules(report);
    let components = graph.components();
    let mut wanted: BTreeSet<usize> = BTreeSet::new();
    for (node, n) in graph.nodes() {
        if n.uses.iter().any(|u| flagged.contains(&u.rule)) {
            wanted.insert(components.of(node));
        }
    }
    let mut out = String::from(
        "digraph lexdelta {\n  graph [rankdir=LR];\n  node [fontsize=11];\n  edge [fontsize=9];\n",
    );
    let groups = components.groups();
    for (k, c) in wanted.iter().enumerate() {
        let nodes = &groups[*c];
        let _ = writeln!(
            out,
            "  subgraph cluster_{k} {{\n    label=\"group {}: {} keys\";",
            k + 1,
            key_count(graph, nodes)
        );
        for node in nodes {
            let _ = writeln!(out, "    {}", node_line(graph, *node, &flagged));
        }
        out.push_str("  }\n");
    }
    let inside: FxHashSet<NodeIndex> = wanted
        .iter()
        .flat_map(|c| groups[*c].iter().copied())
        .collect();
    for (from, to, edge) in graph.edges() {
        if !inside.contains(&from) {
            continue;
        }
        let mut attrs = match edge.kind {
            EdgeKind::Member => vec!["dir=none".to_string()],
            EdgeKind::OneWay => vec!["label=\"one way\"".to_string()],
            EdgeKind::Lemma => vec!["style=dashed".to_string(), "label=\"lemma\"".to_string()],
        };
        if flagged.contains(&edge.rule) {
            attrs.push("color=red".into());
            attrs.push("penwidth=2".into());
        }
        let _ = writeln!(
            out,
            "  n{} -> n{} [{}];",
            from.index(),
            to.index(),
            attrs.join(", ")
        );
    }
    out.push_str("}\n");
    out
}

fn flagged_rules(report: &LintReport) -> FxHashSet<RuleRef> {
    report
        .findings
        .iter()
        .flat_map(|f| {
            f.rule_ref
                .into_iter()
                .chain(f.related.iter().filter_map(|r| r.rule))
        })
        .collect()
}

fn key_count(graph: &TermGraph, nodes: &[NodeIndex]) -> usize {
    nodes
        .iter()
        .filter(|n| matches!(graph.node(**n).kind, NodeKind::Key(_)))
        .count()
}

fn node_line(graph: &TermGraph, index: NodeIndex, flagged: &FxHashSet<RuleRef>) -> String {
    let node = graph.node(index);
    let mut attrs = vec![format!("label=\"{}\"", escape(&label(node)))];
    match node.kind {
        NodeKind::Key(_) => {}
        NodeKind::Set(_) => attrs.push("shape=box, fontsize=9".into()),
        NodeKind::Surface(_) => attrs.push("style=dashed".into()),
    }
    if !node.exempt.is_empty() {
        attrs.push("peripheries=2".into());
    }
    let hot = match node.kind {
        NodeKind::Set(i) => flagged.contains(&RuleRef::Synonym(i)),
        _ => node.uses.iter().any(|u| flagged.contains(&u.rule)),
    };
    if hot {
        attrs.push("color=red, penwidth=2".into());
    }
    format!("n{} [{}];", index.index(), attrs.join(", "))
}

fn label(node: &Node) -> String {
    match &node.kind {
        NodeKind::Key(phrase) => {
            let keys = phrase.display();
            let mut written: Vec<&str> = node.uses.iter().map(|u| u.text.as_str()).collect();
            written.sort_unstable();
            written.dedup();
            let shown = written.join(" / ");
            if shown.is_empty() || shown == keys {
                keys
            } else {
                format!("{shown}\nkey: {keys}")
            }
        }
        NodeKind::Set(_) => node.label(),
        NodeKind::Surface(form) => {
            if node.exempt.is_empty() {
                form.clone()
            } else {
                format!("{form}\n(exempt)")
            }
        }
    }
}

fn escape(text: &str) -> String {
    text.replace('\\', "\\\\")
        .replace('"', "\\\"")
        .replace('\n', "\\n")
}
