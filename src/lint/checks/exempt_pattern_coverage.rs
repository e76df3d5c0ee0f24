//! `exempt-pattern-coverage`: exemption patterns that match nothing, or far too much.

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::lint::{Context, Finding, FormCount, KeyedVocabulary, plural};
use crate::rules::{ExemptKind, Exemption};
use crate::severity::Severity;

/// Forms kept as evidence on a finding.
const KEPT: usize = 10;

pub const INFO: CheckInfo = CheckInfo {
    name: "exempt-pattern-coverage",
    severity: Severity::Warning,
    needs: Needs::Vocabulary,
    summary: "an exemption pattern that matches no surface form, or more than max_pattern_share of them",
    finds: "An exemption `pattern` that matches no surface form of the vocabulary, or that \
            matches more than `lint.max_pattern_share` of its distinct forms (5% unless the \
            ruleset sets it). The forms it matches are listed, most searched first.",
    why: "A pattern that matches nothing protects nothing: often it is anchored wrongly or \
          written for a spelling the text does not use. A pattern that matches a large part \
          of the vocabulary switches stemming off for all of it (a pattern is matched \
          against the whole surface form, so `.*s` takes every plural), and plurals, past \
          tenses and the like stop finding each other.",
    example: "exempt:\n  - pattern: \"[a-z]*\\\\d+[a-z]*\"   # meant for route numbers, also takes \"2nd\", \"10am\"…\n  - pattern: \"trasition\"          # misspelt: matches nothing",
    fix: "Narrow the pattern and check it with `lexdelta trace`; remove a pattern \
          that matches nothing; raise `lint.max_pattern_share` only if so many forms really \
          must stay unstemmed.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let Some(vocabulary) = cx.vocabulary else {
        return;
    };
    for (i, rule) in cx.ruleset.exemptions.iter().enumerate() {
        let ExemptKind::Pattern { source, regex } = &rule.kind else {
            continue;
        };
        let matched: Vec<FormCount> = vocabulary
            .sorted()
            .iter()
            .filter(|stats| regex.is_match(&stats.form))
            .map(|stats| FormCount {
                form: stats.form.clone(),
                documents: stats.documents,
                searches: stats.searches,
                via: None,
            })
            .collect();
        if let Some(f) = judge(cx, vocabulary, i, rule, &source.text, matched) {
            out.push(f);
        }
    }
}

fn judge(
    cx: &Context,
    vocabulary: &KeyedVocabulary,
    i: usize,
    rule: &Exemption,
    pattern: &str,
    mut matched: Vec<FormCount>,
) -> Option<Finding> {
    let total = vocabulary.vocabulary.len();
    let origin = match &rule.kind {
        ExemptKind::Pattern { source, .. } => &source.origin,
        ExemptKind::Term(term) => &term.origin,
    };
    if matched.is_empty() {
        let f = Finding::new(
            &INFO,
            origin,
            format!(
                "the pattern {pattern:?} matches none of the {} in the vocabulary",
                plural(total, "surface form", "surface forms")
            ),
        )
        .help("check the pattern against real forms with `lexdelta trace`, or remove it");
        return Some(f.on_rule(cx.analyzer, RuleRef::Exempt(i)));
    }
    let share = matched.len() as f64 / total.max(1) as f64;
    if share <= cx.max_pattern_share {
        return None;
    }
    matched.sort_by(|a, b| {
        (b.searches, b.documents)
            .cmp(&(a.searches, a.documents))
            .then_with(|| a.form.cmp(&b.form))
    });
    let examples: Vec<String> = matched
        .iter()
        .take(5)
        .map(|f| format!("{:?}", f.form))
        .collect();
    let n = matched.len();
    matched.truncate(KEPT);
    Some(
        Finding::new(
            &INFO,
            origin,
            format!(
                "the pattern {pattern:?} matches {n} of the {total} surface forms ({:.1}%), more than max_pattern_share ({:.1}%): stemming is off for all of them, e.g. {}",
                share * 100.0,
                cx.max_pattern_share * 100.0,
                examples.join(", ")
            ),
        )
        .on_rule(cx.analyzer, RuleRef::Exempt(i))
        .forms(matched)
        .help("narrow the pattern; raise lint.max_pattern_share only if so many forms really must stay unstemmed"),
    )
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn a_pattern_matching_nothing() {
        let a = analyzer("exempt:\n  - pattern: \"trasition\"\n");
        let v = vocabulary(&a, &["zone transition notices"], &[]);
        let report = run(&a, Some(&v));
        let f = of(&report, "exempt-pattern-coverage");
        assert_eq!(f.len(), 1);
        assert!(
            f[0].message.contains("matches none of the 3 surface forms"),
            "{}",
            f[0].message
        );
    }

    #[test]
    fn a_pattern_matching_too_much() {
        let a = analyzer("exempt:\n  - pattern: \".*s.*\"\nlint:\n  max_pattern_share: 0.4\n");
        let v = vocabulary(&a, &["buses stops times route"], &[("stops", 10)]);
        let report = run(&a, Some(&v));
        let f = of(&report, "exempt-pattern-coverage");
        assert_eq!(f.len(), 1);
        assert!(
            f[0].message
                .contains("matches 3 of the 4 surface forms (75.0%)"),
            "{}",
            f[0].message
        );
        assert_eq!(f[0].forms[0].form, "stops");
    }

    #[test]
    fn a_narrow_pattern_that_matches_is_fine() {
        let a = analyzer(
            "exempt:\n  - pattern: \"^transition(s|al)?$\"\nlint:\n  max_pattern_share: 0.5\n",
        );
        let v = vocabulary(&a, &["zone transition notices"], &[]);
        assert!(of(&run(&a, Some(&v)), "exempt-pattern-coverage").is_empty());
    }
}
