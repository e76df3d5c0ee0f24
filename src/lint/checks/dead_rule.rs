//! `dead-rule`: rules none of whose terms occur in the vocabulary.

use std::collections::BTreeMap;
use std::sync::Arc;

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::lint::graph::single_surface;
use crate::lint::{Context, Finding, KeyedVocabulary, RuleTerm, plural, quoted_list};
use crate::rules::ExemptKind;
use crate::severity::Severity;

/// A file with more dead lemma overrides than this gets one summary finding instead of one
/// per override: imported irregular-form lists name thousands of forms a corpus never uses.
const SUMMARY_OVER: usize = 20;
/// Forms listed on a summary finding.
const LISTED: usize = 50;

pub const INFO: CheckInfo = CheckInfo {
    name: "dead-rule",
    severity: Severity::Info,
    needs: Needs::Vocabulary,
    summary: "a rule none of whose terms occur in the vocabulary, so it never changes a search",
    finds: "A synonym rule none of whose terms occur in the vocabulary (a term occurs when \
            each of its keys is the key of some surface form), an exempt term or a lemma \
            override whose surface form occurs nowhere. When one file holds more than 20 dead \
            lemma overrides they are summed up in one finding on the first of them (a `lint:` \
            override on that one governs the summary).",
    why: "A rule that never fires costs nothing at search time but a lot at review time: \
          readers assume it does something, and a later edit to it is never tested by real \
          text. In an imported list, the dead share says how much of the list the corpus \
          needs at all.",
    example: "synonyms:\n  - equivalent: [hovercraft, air-cushion vehicle]   # no such service",
    fix: "Remove the rule, or keep it with a note saying why it is there (a term riders are \
          expected to use soon) and silence the finding on it with a reason.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let Some(vocabulary) = cx.vocabulary else {
        return;
    };
    synonyms(cx, vocabulary, out);
    exemptions(cx, vocabulary, out);
    lemmas(cx, vocabulary, out);
}

/// Whether every key of the term is some vocabulary form's key.
fn occurs(vocabulary: &KeyedVocabulary, term: &RuleTerm) -> bool {
    let mut keys = term
        .words
        .iter()
        .filter_map(|w| w.key.as_deref())
        .peekable();
    keys.peek().is_some() && keys.all(|k| vocabulary.has_key(k))
}

fn synonyms(cx: &Context, vocabulary: &KeyedVocabulary, out: &mut Vec<Finding>) {
    for (i, rule) in cx.ruleset.synonyms.iter().enumerate() {
        let terms = cx.terms.get(i).map_or(&[][..], Vec::as_slice);
        if terms.is_empty() || terms.iter().any(|t| occurs(vocabulary, t)) {
            continue;
        }
        let texts: Vec<&str> = terms.iter().map(|t| t.term.text.as_str()).collect();
        out.push(
            Finding::new(
                &INFO,
                &rule.meta.origin,
                format!(
                    "no term of this rule occurs in the vocabulary: {}",
                    quoted_list(&texts)
                ),
            )
            .on_rule(cx.analyzer, RuleRef::Synonym(i))
            .members(texts.iter().map(|t| t.to_string()).collect())
            .help("remove the rule, or keep it with a note and silence this on it with a reason"),
        );
    }
}

fn exemptions(cx: &Context, vocabulary: &KeyedVocabulary, out: &mut Vec<Finding>) {
    for (i, rule) in cx.ruleset.exemptions.iter().enumerate() {
        // Patterns are exempt-pattern-coverage's business.
        let ExemptKind::Term(term) = &rule.kind else {
            continue;
        };
        let Some(form) = single_surface(cx.analyzer, &term.text) else {
            continue;
        };
        if vocabulary.vocabulary.contains(&form) {
            continue;
        }
        out.push(
            Finding::new(
                &INFO,
                &term.origin,
                format!("the exempt term {form:?} occurs nowhere in the vocabulary"),
            )
            .on_rule(cx.analyzer, RuleRef::Exempt(i))
            .members(vec![form])
            .help(
                "remove the exemption, or keep it with a note and silence this on it with a reason",
            ),
        );
    }
}

/// A file's lemma override count, and its dead overrides (rule index, form).
type FileLemmas = (usize, Vec<(usize, String)>);

fn lemmas(cx: &Context, vocabulary: &KeyedVocabulary, out: &mut Vec<Finding>) {
    let mut per_file: BTreeMap<Arc<str>, FileLemmas> = BTreeMap::new();
    for (i, rule) in cx.ruleset.lemmas.iter().enumerate() {
        let entry = per_file.entry(rule.form.origin.file.clone()).or_default();
        entry.0 += 1;
        let Some(form) = single_surface(cx.analyzer, &rule.form.text) else {
            continue;
        };
        if !vocabulary.vocabulary.contains(&form) {
            entry.1.push((i, form));
        }
    }
    for (file, (total, dead)) in per_file {
        if dead.len() > SUMMARY_OVER {
            out.push(summary(cx, &file, total, &dead));
            continue;
        }
        for (i, form) in dead {
            let rule = &cx.ruleset.lemmas[i];
            out.push(
                Finding::new(
                    &INFO,
                    &rule.form.origin,
                    format!("the irregular form {form:?} occurs nowhere in the vocabulary: this override never applies"),
                )
                .on_rule(cx.analyzer, RuleRef::Lemma(i))
                .members(vec![form])
                .help("remove the override, or keep it with a note and silence this on it with a reason"),
            );
        }
    }
}

fn summary(cx: &Context, file: &str, total: usize, dead: &[(usize, String)]) -> Finding {
    let (first, _) = dead[0];
    let listed: Vec<&str> = dead.iter().take(5).map(|(_, f)| f.as_str()).collect();
    Finding::new(
        &INFO,
        &cx.ruleset.lemmas[first].form.origin,
        format!(
            "{} of the {} in {file} name a form that occurs nowhere in the vocabulary ({:.0}%), e.g. {}",
            dead.len(),
            plural(total, "lemma override", "lemma overrides"),
            100.0 * dead.len() as f64 / total.max(1) as f64,
            quoted_list(&listed)
        ),
    )
    .on_rule(cx.analyzer, RuleRef::Lemma(first))
    .members(dead.iter().take(LISTED).map(|(_, f)| f.clone()).collect())
    .help("an imported list may keep its unused entries; import only the forms the corpus uses to keep review small")
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn rules_that_never_meet_the_text() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [hovercraft, air cushion vehicle]\n  - equivalent: [tram, light rail]\nexempt: [wayfare]\nlemmas:\n  - {form: rode, lemma: ride}\n",
        );
        let v = vocabulary(&a, &["Trams to the cushion depot"], &[("ride", 3)]);
        let report = run(&a, Some(&v));
        let f = of(&report, "dead-rule");
        let lines: Vec<u32> = f.iter().map(|f| f.origin.line).collect();
        assert_eq!(lines, [4, 6, 8], "{f:#?}");
    }

    #[test]
    fn a_large_dead_import_is_summed_up() {
        let mut yaml = String::from("lemmas:\n");
        for i in 0..30 {
            yaml.push_str(&format!("  - {{form: went{i}, lemma: go{i}}}\n"));
        }
        let a = analyzer(&yaml);
        let v = vocabulary(&a, &["went0 and went1"], &[]);
        let report = run(&a, Some(&v));
        let f = of(&report, "dead-rule");
        assert_eq!(f.len(), 1);
        assert!(
            f[0].message
                .starts_with("28 of the 30 lemma overrides in test.yaml"),
            "{}",
            f[0].message
        );
    }

    #[test]
    fn a_rule_that_occurs_is_alive() {
        let a = analyzer("synonyms:\n  - equivalent: [pram, stroller]\n");
        let v = vocabulary(&a, &["Prams on buses"], &[]);
        assert!(of(&run(&a, Some(&v)), "dead-rule").is_empty());
    }
}
