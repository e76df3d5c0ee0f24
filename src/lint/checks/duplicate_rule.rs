//! `duplicate-rule`: the same rule written twice, in one file or across files.

use rustc_hash::FxHashMap;

use super::{CheckInfo, Needs};
use petgraph::graph::NodeIndex;

use crate::analysis::RuleRef;
use crate::lint::graph::single_surface;
use crate::lint::{Context, Finding};
use crate::rules::{ExemptKind, Origin, SynonymKind};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "duplicate-rule",
    severity: Severity::Warning,
    needs: Needs::Nothing,
    summary: "the same rule in two places: same kind, same content once normalized",
    finds: "Two rules of the same kind that say the same thing once their terms are \
            normalized: equivalent sets with the same members in any order, one-way rules \
            with the same source and targets, the same exempt term or pattern, the same \
            lemma override. Across files too.",
    why: "A duplicate looks harmless until someone edits one copy and not the other; then \
          the ruleset says two things and the old one still wins for the searches it \
          covers. Duplicates across files usually mean an import or a copy overlapped with \
          hand-written rules.",
    example: "# synonyms.yaml\nsynonyms:\n  - equivalent: [pram, pushchair]\n# more-synonyms.yaml\nsynonyms:\n  - equivalent: [Pushchairs, prams]",
    fix: "Keep one copy (the one with the id and the note) and delete the other.",
};

/// What a rule says, normalized: two rules with equal signatures are duplicates.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
enum Signature {
    Set(Vec<NodeIndex>),
    OneWay(NodeIndex, Vec<NodeIndex>),
    ExemptTerm(String),
    ExemptPattern(String),
    Lemma(String, String),
}

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let mut first: FxHashMap<Signature, (RuleRef, Origin)> = FxHashMap::default();
    for (rule, origin, signature) in signatures(cx) {
        match first.get(&signature) {
            Some((earlier, at)) => out.push(
                Finding::new(
                    &INFO,
                    &origin,
                    format!(
                        "this rule says the same as {} ({}:{}), once normalized",
                        cx.analyzer.rule_label(*earlier),
                        at.file,
                        at.line
                    ),
                )
                .on_rule(cx.analyzer, rule)
                .related(at, "the first copy", Some(*earlier))
                .help("keep one copy and delete the other"),
            ),
            None => {
                first.insert(signature, (rule, origin));
            }
        }
    }
}

/// Every rule's signature, in ruleset order.
fn signatures(cx: &Context) -> Vec<(RuleRef, Origin, Signature)> {
    let mut out = Vec::new();
    for (i, rule) in cx.ruleset.synonyms.iter().enumerate() {
        // Terms are compared through their key nodes: equal phrases are one node, so a
        // rule's content is a short list of node numbers, cheap to sort and hash.
        let mut phrases: Vec<NodeIndex> = cx.graph.term_nodes(i).to_vec();
        let signature = match &rule.kind {
            SynonymKind::Equivalent { .. } => {
                phrases.sort_unstable();
                phrases.dedup();
                Signature::Set(phrases)
            }
            SynonymKind::OneWay { .. } => {
                if phrases.is_empty() {
                    continue;
                }
                let from = phrases.remove(0);
                phrases.sort_unstable();
                phrases.dedup();
                Signature::OneWay(from, phrases)
            }
        };
        out.push((RuleRef::Synonym(i), rule.meta.origin.clone(), signature));
    }
    for (i, rule) in cx.ruleset.exemptions.iter().enumerate() {
        let signature = match &rule.kind {
            ExemptKind::Term(t) => match single_surface(cx.analyzer, &t.text) {
                Some(form) => Signature::ExemptTerm(form),
                None => continue,
            },
            ExemptKind::Pattern { source, .. } => Signature::ExemptPattern(source.text.clone()),
        };
        out.push((RuleRef::Exempt(i), rule.meta.origin.clone(), signature));
    }
    for (i, rule) in cx.ruleset.lemmas.iter().enumerate() {
        let (Some(form), Some(lemma)) = (
            single_surface(cx.analyzer, &rule.form.text),
            single_surface(cx.analyzer, &rule.lemma.text),
        ) else {
            continue;
        };
        out.push((
            RuleRef::Lemma(i),
            rule.meta.origin.clone(),
            Signature::Lemma(form, lemma),
        ));
    }
    out
}

#[cfg(test)]
mod tests {
    use crate::analysis::Analyzer;
    use crate::lint::fixture::*;
    use crate::rules::{SourceFile, load_sources};

    #[test]
    fn duplicates_across_files_once_normalized() {
        let file = |name: &str, body: &str| SourceFile {
            name: name.into(),
            text: format!("format: 1\nrevision: 1\n{body}"),
        };
        let ruleset = load_sources(
            "r",
            vec![
                file("a.yaml", "synonyms:\n  - id: prams\n    equivalent: [pram, pushchair]\nlemmas:\n  - {form: rode, lemma: ride}\n"),
                file("b.yaml", "synonyms:\n  - equivalent: [Pushchairs, prams, pram]\nlemmas:\n  - {form: Rode, lemma: ride}\nexempt: [news, News]\n"),
            ],
        )
        .unwrap();
        let a = Analyzer::new(ruleset).unwrap();
        let report = run(&a, None);
        let f = of(&report, "duplicate-rule");
        assert_eq!(f.len(), 3, "{f:#?}");
        assert!(f.iter().all(|f| &*f.origin.file == "b.yaml"));
        assert!(
            f[0].message.contains("the same as prams (a.yaml:4)"),
            "{}",
            f[0].message
        );
    }

    #[test]
    fn different_rules_are_fine() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [pram, pushchair]\n  - one_way: {from: pram, to: [pushchair]}\n  - one_way: {from: pushchair, to: [pram]}\n",
        );
        assert!(of(&run(&a, None), "duplicate-rule").is_empty());
    }
}
