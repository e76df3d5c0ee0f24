//! The term graph: what the rules say, as nodes and edges, each remembering its rule.
//!
//! Three kinds of node, because rules act at two levels of the normalization contract:
//!
//! - a **key node** is a key sequence that synonym rule terms normalize to ("light rail" is
//!   the node `light rail` of two keys; most nodes hold one key). Synonym rules speak in
//!   keys, so two rules that mention "universal" and "universe" meet at one node when both
//!   stem to the same key — which is the point of building the graph over keys;
//! - a **set node** is the hub of one equivalent set, with a member edge to each member's key
//!   node: an n-member set costs n edges, not the n² of a clique, and a key in two sets is
//!   simply a key node with two hubs;
//! - a **surface node** is a surface form named by a lemma override. An override works on
//!   surface forms before stemming ("left" → "leave"), so its edge joins two surface forms,
//!   form → lemma, and never a key: chains and cycles of overrides are read off these edges.
//!
//! One-way rules are directed edges from the source's key node to each target's. Exemptions
//! are marks on the nodes whose surface form they protect. Connected components (edge
//! direction ignored) are the groups of terms that rules tie together.

use petgraph::graph::{DiGraph, EdgeIndex, NodeIndex};
use petgraph::unionfind::UnionFind;
use petgraph::visit::EdgeRef;
use petgraph::{Direction, algo};
use std::collections::hash_map::Entry;
use std::hash::{Hash, Hasher};

use rustc_hash::{FxHashMap, FxHasher};

use crate::analysis::{Analyzer, Phrase, RuleRef};
use crate::lint::terms::{RuleTerm, rule_terms};
use crate::rules::{Origin, RuleMeta, SynonymKind, Term};

/// What a node stands for.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum NodeKind {
    /// A key sequence that synonym rule terms normalize to.
    Key(Phrase),
    /// The hub of an equivalent set: the index of the rule in the ruleset's `synonyms`.
    Set(usize),
    /// A surface form named by a lemma override (as a form or as a lemma).
    Surface(String),
}

/// A rule term that landed on a node, as written.
#[derive(Clone, Debug)]
pub struct TermUse {
    pub text: String,
    pub origin: Origin,
    pub rule: RuleRef,
}

#[derive(Clone, Debug)]
pub struct Node {
    pub kind: NodeKind,
    /// Every rule term written as this node, in ruleset order.
    pub uses: Vec<TermUse>,
    /// Exemption rules (indices into the ruleset's `exemptions`) that protect the node's
    /// surface form; only surface nodes and single-word key nodes can carry one.
    pub exempt: Vec<usize>,
    /// For a set hub: the rule's id, if it has one.
    pub name: Option<String>,
    /// For a set hub: where the rule is written (it is named by file and line without an id).
    pub origin: Option<Origin>,
}

impl Node {
    /// How the node is shown: its keys, its surface form, or the set's place.
    pub fn label(&self) -> String {
        match &self.kind {
            NodeKind::Key(p) => p.display(),
            NodeKind::Surface(form) => form.clone(),
            NodeKind::Set(i) => match (&self.name, &self.origin) {
                (Some(id), _) => id.clone(),
                (None, Some(origin)) => origin.to_string(),
                (None, None) => format!("set #{i}"),
            },
        }
    }
}

#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum EdgeKind {
    /// Set hub → member key node.
    Member,
    /// One-way rule: source key node → target key node.
    OneWay,
    /// Lemma override: form surface node → lemma surface node.
    Lemma,
}

#[derive(Clone, Debug)]
pub struct Edge {
    pub kind: EdgeKind,
    pub rule: RuleRef,
    /// Where the edge is written: the member, the target, or the overridden form.
    pub origin: Origin,
}

/// The rules of a ruleset as a graph; see the module docs.
#[derive(Clone, Debug, Default)]
pub struct TermGraph {
    graph: DiGraph<Node, Edge>,
    /// Key nodes by the hash of their phrase: the phrase itself is stored once, in the node.
    keys: FxHashMap<u64, NodeIndex>,
    /// Key nodes whose phrase hash another phrase already took (practically never).
    collided: Vec<NodeIndex>,
    surfaces: FxHashMap<String, NodeIndex>,
    /// Per synonym rule: its hub, for equivalent sets.
    hubs: Vec<Option<NodeIndex>>,
    /// Per synonym rule: the key node of each term, in the order of its terms.
    term_nodes: Vec<Vec<NodeIndex>>,
}

/// Connected components: a dense label per node, numbered in node order.
#[derive(Clone, Debug)]
pub struct Components {
    of: Vec<usize>,
    count: usize,
}

impl Components {
    pub fn of(&self, node: NodeIndex) -> usize {
        self.of[node.index()]
    }

    pub fn count(&self) -> usize {
        self.count
    }

    /// The nodes of every component, each list in node order.
    pub fn groups(&self) -> Vec<Vec<NodeIndex>> {
        let mut groups = vec![Vec::new(); self.count];
        for (i, c) in self.of.iter().enumerate() {
            groups[*c].push(NodeIndex::new(i));
        }
        groups
    }
}

impl TermGraph {
    /// Builds the graph of an analyzer's ruleset; rule terms are normalized exactly as the
    /// analyzer compiled them.
    pub fn build(analyzer: &Analyzer) -> TermGraph {
        TermGraph::from_terms(analyzer, &rule_terms(analyzer))
    }

    /// Builds the graph from synonym terms already normalized (see [`rule_terms`]).
    pub fn from_terms(analyzer: &Analyzer, terms: &[Vec<RuleTerm>]) -> TermGraph {
        let mut g = TermGraph::default();
        // Roughly a hub per set and a node and an edge per term: reserving once saves the
        // repeated growth of a large ruleset.
        let term_count: usize = terms.iter().map(Vec::len).sum();
        g.graph.reserve_nodes(terms.len() + term_count);
        g.graph.reserve_edges(term_count);
        g.keys.reserve(term_count);
        let ruleset = analyzer.ruleset();
        for (i, rule) in ruleset.synonyms.iter().enumerate() {
            let rule_terms = terms.get(i).map_or(&[][..], Vec::as_slice);
            match &rule.kind {
                SynonymKind::Equivalent { .. } => {
                    g.add_set(i, &rule.meta, rule_terms, analyzer);
                }
                SynonymKind::OneWay { .. } => {
                    g.hubs.push(None);
                    g.add_one_way(i, rule_terms, analyzer);
                }
            }
        }
        for (i, rule) in ruleset.lemmas.iter().enumerate() {
            let (Some(form), Some(lemma)) = (
                one_form(analyzer, &rule.form),
                one_form(analyzer, &rule.lemma),
            ) else {
                continue;
            };
            let r = RuleRef::Lemma(i);
            let from = g.surface_node(form, &rule.form, r);
            let to = g.surface_node(lemma, &rule.lemma, r);
            g.graph.add_edge(
                from,
                to,
                Edge {
                    kind: EdgeKind::Lemma,
                    rule: r,
                    origin: rule.form.origin.clone(),
                },
            );
        }
        g.mark_exemptions(analyzer);
        g
    }

    fn add_set(&mut self, i: usize, meta: &RuleMeta, terms: &[RuleTerm], analyzer: &Analyzer) {
        let rule = RuleRef::Synonym(i);
        let hub = self.graph.add_node(Node {
            kind: NodeKind::Set(i),
            uses: Vec::new(),
            exempt: Vec::new(),
            name: meta.id.clone(),
            origin: Some(meta.origin.clone()),
        });
        self.hubs.push(Some(hub));
        let mut nodes = Vec::with_capacity(terms.len());
        for t in terms {
            let member = self.key_node(&t.phrase, t.term, rule);
            self.mark_term(member, t, analyzer);
            self.add_edge(hub, member, EdgeKind::Member, rule, t.term);
            nodes.push(member);
        }
        self.term_nodes.push(nodes);
    }

    fn add_one_way(&mut self, i: usize, terms: &[RuleTerm], analyzer: &Analyzer) {
        let rule = RuleRef::Synonym(i);
        let Some((source, targets)) = terms.split_first() else {
            self.term_nodes.push(Vec::new());
            return;
        };
        let from = self.key_node(&source.phrase, source.term, rule);
        self.mark_term(from, source, analyzer);
        let mut nodes = vec![from];
        for t in targets {
            let to = self.key_node(&t.phrase, t.term, rule);
            self.mark_term(to, t, analyzer);
            self.add_edge(from, to, EdgeKind::OneWay, rule, t.term);
            nodes.push(to);
        }
        self.term_nodes.push(nodes);
    }

    fn add_edge(&mut self, a: NodeIndex, b: NodeIndex, kind: EdgeKind, rule: RuleRef, at: &Term) {
        self.graph.add_edge(
            a,
            b,
            Edge {
                kind,
                rule,
                origin: at.origin.clone(),
            },
        );
    }

    fn key_node(&mut self, phrase: &Phrase, term: &Term, rule: RuleRef) -> NodeIndex {
        let hash = phrase_hash(phrase);
        let index = match self.find_key(hash, phrase) {
            Some(index) => index,
            None => {
                let index = self.graph.add_node(Node {
                    kind: NodeKind::Key(phrase.clone()),
                    uses: Vec::new(),
                    exempt: Vec::new(),
                    name: None,
                    origin: None,
                });
                match self.keys.entry(hash) {
                    Entry::Occupied(_) => self.collided.push(index),
                    Entry::Vacant(slot) => {
                        slot.insert(index);
                    }
                }
                index
            }
        };
        self.graph[index].uses.push(use_of(term, rule));
        index
    }

    fn find_key(&self, hash: u64, phrase: &Phrase) -> Option<NodeIndex> {
        let is = |n: &NodeIndex| matches!(&self.graph[*n].kind, NodeKind::Key(p) if p == phrase);
        self.keys
            .get(&hash)
            .copied()
            .filter(is)
            .or_else(|| self.collided.iter().copied().find(is))
    }

    fn surface_node(&mut self, form: String, term: &Term, rule: RuleRef) -> NodeIndex {
        let graph = &mut self.graph;
        let index = *self.surfaces.entry(form).or_insert_with_key(|form| {
            graph.add_node(Node {
                kind: NodeKind::Surface(form.clone()),
                uses: Vec::new(),
                exempt: Vec::new(),
                name: None,
                origin: None,
            })
        });
        self.graph[index].uses.push(use_of(term, rule));
        index
    }

    /// Marks surface nodes, and key nodes written as a single exempt word.
    /// Marks surface nodes with the exemption that protects their form (key nodes are
    /// marked as their terms are added, from the words already at hand).
    fn mark_exemptions(&mut self, analyzer: &Analyzer) {
        for node in self.graph.node_weights_mut() {
            if let NodeKind::Surface(form) = &node.kind {
                node.exempt = analyzer.is_exempt(form).into_iter().collect();
            }
        }
    }

    /// Marks a key node written as one exempt word.
    fn mark_term(&mut self, node: NodeIndex, term: &RuleTerm, analyzer: &Analyzer) {
        let [word] = term.words.as_slice() else {
            return;
        };
        if let Some(rule) = analyzer.is_exempt(&word.surface) {
            let exempt = &mut self.graph[node].exempt;
            if !exempt.contains(&rule) {
                exempt.push(rule);
                exempt.sort_unstable();
            }
        }
    }

    pub fn node(&self, index: NodeIndex) -> &Node {
        &self.graph[index]
    }

    pub fn edge(&self, index: EdgeIndex) -> &Edge {
        &self.graph[index]
    }

    pub fn node_count(&self) -> usize {
        self.graph.node_count()
    }

    /// Every node with its index, in index order.
    pub fn nodes(&self) -> impl Iterator<Item = (NodeIndex, &Node)> {
        self.graph.node_indices().map(move |i| (i, &self.graph[i]))
    }

    /// Every edge as (source, target, edge), in insertion order.
    pub fn edges(&self) -> impl Iterator<Item = (NodeIndex, NodeIndex, &Edge)> {
        self.graph
            .edge_references()
            .map(|e| (e.source(), e.target(), e.weight()))
    }

    pub fn key_node_of(&self, phrase: &Phrase) -> Option<NodeIndex> {
        self.find_key(phrase_hash(phrase), phrase)
    }

    pub fn surface_node_of(&self, form: &str) -> Option<NodeIndex> {
        self.surfaces.get(form).copied()
    }

    /// The key node of each term of synonym rule `rule` (equivalent: the members; one-way:
    /// the source, then the targets).
    pub fn term_nodes(&self, rule: usize) -> &[NodeIndex] {
        self.term_nodes.get(rule).map_or(&[], Vec::as_slice)
    }

    /// The hub of an equivalent set (by synonym rule index).
    pub fn hub(&self, rule: usize) -> Option<NodeIndex> {
        self.hubs.get(rule).copied().flatten()
    }

    /// A set's member key nodes with the edge that makes each a member, in written order.
    pub fn members(&self, hub: NodeIndex) -> Vec<(NodeIndex, &Edge)> {
        let mut out: Vec<(EdgeIndex, NodeIndex, &Edge)> = self
            .graph
            .edges_directed(hub, Direction::Outgoing)
            .filter(|e| e.weight().kind == EdgeKind::Member)
            .map(|e| (e.id(), e.target(), e.weight()))
            .collect();
        out.sort_unstable_by_key(|(id, _, _)| *id);
        out.into_iter().map(|(_, n, e)| (n, e)).collect()
    }

    /// How many member edges point at a node (a set listing a key twice counts twice).
    pub fn set_count(&self, node: NodeIndex) -> usize {
        self.graph
            .edges_directed(node, Direction::Incoming)
            .filter(|e| e.weight().kind == EdgeKind::Member)
            .count()
    }

    /// The set hubs a key node is a member of, with the member edge, in rule order.
    pub fn sets_of(&self, node: NodeIndex) -> Vec<(NodeIndex, &Edge)> {
        let mut out: Vec<(EdgeIndex, NodeIndex, &Edge)> = self
            .graph
            .edges_directed(node, Direction::Incoming)
            .filter(|e| e.weight().kind == EdgeKind::Member)
            .map(|e| (e.id(), e.source(), e.weight()))
            .collect();
        out.sort_unstable_by_key(|(id, _, _)| *id);
        out.into_iter().map(|(_, n, e)| (n, e)).collect()
    }

    /// Outgoing edges of one kind, in insertion order.
    pub fn out_edges(&self, node: NodeIndex, kind: EdgeKind) -> Vec<(NodeIndex, &Edge)> {
        let mut out: Vec<(EdgeIndex, NodeIndex, &Edge)> = self
            .graph
            .edges_directed(node, Direction::Outgoing)
            .filter(|e| e.weight().kind == kind)
            .map(|e| (e.id(), e.target(), e.weight()))
            .collect();
        out.sort_unstable_by_key(|(id, _, _)| *id);
        out.into_iter().map(|(_, n, e)| (n, e)).collect()
    }

    /// Connected components over every edge, direction ignored.
    pub fn components(&self) -> Components {
        let n = self.graph.node_count();
        let mut sets = UnionFind::<usize>::new(n);
        for e in self.graph.edge_references() {
            sets.union(e.source().index(), e.target().index());
        }
        // Relabel densely, in node order, so labels do not depend on union order.
        let mut label: FxHashMap<usize, usize> = FxHashMap::default();
        let mut of = Vec::with_capacity(n);
        for i in 0..n {
            let root = sets.find_mut(i);
            let next = label.len();
            of.push(*label.entry(root).or_insert(next));
        }
        Components {
            count: label.len(),
            of,
        }
    }

    /// Strongly connected components of the edges of one kind with more than one node, each
    /// sorted, in order of their smallest node.
    pub fn cycles_of(&self, kind: EdgeKind) -> Vec<Vec<NodeIndex>> {
        // Only the nodes these edges touch: one-way and lemma edges are few next to the
        // member edges, so the search stays small on a large ruleset.
        let mut sub: DiGraph<NodeIndex, ()> = DiGraph::new();
        let mut local: FxHashMap<NodeIndex, NodeIndex> = FxHashMap::default();
        for e in self
            .graph
            .edge_references()
            .filter(|e| e.weight().kind == kind)
        {
            let mut at = |n: NodeIndex| *local.entry(n).or_insert_with(|| sub.add_node(n));
            let (a, b) = (at(e.source()), at(e.target()));
            sub.add_edge(a, b, ());
        }
        let mut sccs: Vec<Vec<NodeIndex>> = algo::tarjan_scc(&sub)
            .into_iter()
            .filter(|c| c.len() > 1)
            .map(|c| {
                let mut c: Vec<NodeIndex> = c.into_iter().map(|n| sub[n]).collect();
                c.sort_unstable();
                c
            })
            .collect();
        sccs.sort_unstable();
        sccs
    }
}

fn phrase_hash(phrase: &Phrase) -> u64 {
    let mut hasher = FxHasher::default();
    phrase.hash(&mut hasher);
    hasher.finish()
}

fn use_of(term: &Term, rule: RuleRef) -> TermUse {
    TermUse {
        text: term.text.clone(),
        origin: term.origin.clone(),
        rule,
    }
}

/// The surface form of a term that is one token.
fn one_form(analyzer: &Analyzer, term: &Term) -> Option<String> {
    single_surface(analyzer, &term.text)
}

/// The surface form of a text that is exactly one token.
pub fn single_surface(analyzer: &Analyzer, text: &str) -> Option<String> {
    let mut tokens = analyzer.surface().tokens(text).into_iter();
    match (tokens.next(), tokens.next()) {
        (Some(one), None) => Some(one.form),
        _ => None,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::lint::fixture::analyzer;

    #[test]
    fn sets_share_key_nodes_and_one_way_rules_are_directed() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [change, transfer]\n  - equivalent: [changes, amend]\n  - one_way: {from: lift, to: [elevator, light rail]}\n",
        );
        let g = TermGraph::build(&a);
        let chang = g.key_node_of(&Phrase::single("chang")).unwrap();
        assert_eq!(
            g.sets_of(chang).len(),
            2,
            "change and changes meet at one key"
        );
        assert_eq!(g.node(chang).uses.len(), 2);
        let lift = g.key_node_of(&Phrase::single("lift")).unwrap();
        let targets = g.out_edges(lift, EdgeKind::OneWay);
        assert_eq!(targets.len(), 2);
        assert_eq!(g.node(targets[1].0).label(), "light rail");
        let components = g.components();
        assert_eq!(
            components.of(chang),
            components.of(g.key_node_of(&Phrase::single("amend")).unwrap())
        );
        assert_ne!(components.of(chang), components.of(lift));
    }

    #[test]
    fn key_nodes_written_as_an_exempt_word_are_marked() {
        let a =
            analyzer("exempt: [universal]\nsynonyms:\n  - equivalent: [universal, accessible]\n");
        let g = TermGraph::build(&a);
        let universal = g.key_node_of(&Phrase::single("universal")).unwrap();
        assert_eq!(g.node(universal).exempt, vec![0]);
        assert_eq!(g.term_nodes(0).len(), 2);
        assert_eq!(g.node(g.hub(0).unwrap()).label(), "test.yaml:5");
    }

    #[test]
    fn lemma_edges_join_surface_forms_and_exemptions_mark_them() {
        let a = analyzer(
            "exempt: [lay]\nlemmas:\n  - {form: laid, lemma: lay}\n  - {form: lay, lemma: lie}\n  - {form: lie, lemma: laid}\n",
        );
        let g = TermGraph::build(&a);
        let lay = g.surface_node_of("lay").unwrap();
        assert_eq!(g.node(lay).exempt, vec![0]);
        assert!(g.node(g.surface_node_of("laid").unwrap()).exempt.is_empty());
        let cycles = g.cycles_of(EdgeKind::Lemma);
        assert_eq!(cycles.len(), 1);
        assert_eq!(cycles[0].len(), 3);
        assert!(g.cycles_of(EdgeKind::OneWay).is_empty());
    }
}
