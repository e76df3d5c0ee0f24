//! `exempt-vs-lemma`: an exempt surface form that a lemma override names.

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::analysis::stem::Stem;
use crate::lint::graph::single_surface;
use crate::lint::{Context, Finding};
use crate::rules::LemmaOverride;
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "exempt-vs-lemma",
    severity: Severity::Warning,
    needs: Needs::Nothing,
    summary: "an exempt term that is also the form or the lemma of a lemma override",
    finds: "A lemma override whose form is exempt (by a literal or a pattern), so the \
            override never applies; and, reported as info, an override whose lemma is exempt, \
            so its form lands on the lemma as written rather than on the lemma's stem.",
    why: "Exemption comes before lemma overrides in the normalization contract: an exempt \
          form is its own key and is never looked up. An override of an exempt form is dead \
          text that a reader takes for a working rule; usually one of the two rules was added \
          without knowing about the other (an import brings in `left → leave` while `left` is \
          exempt to keep `left luggage` apart). When only the lemma is exempt, the form joins \
          the exempt spelling and not the other inflections of the word — sometimes intended, \
          worth a look.",
    example: "exempt:\n  - term: left\nlemmas:\n  - {form: left, lemma: leave}",
    fix: "Remove one of the two: keep the exemption if the form must match only itself, or \
          remove it if the form should join its lemma.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let stem = cx.ruleset.pipeline.stemmer.map(Stem::new);
    for (i, rule) in cx.ruleset.lemmas.iter().enumerate() {
        let (Some(form), Some(lemma)) = (
            single_surface(cx.analyzer, &rule.form.text),
            single_surface(cx.analyzer, &rule.lemma.text),
        ) else {
            continue;
        };
        if let Some(e) = cx.analyzer.is_exempt(&form) {
            out.push(exempt_form(cx, i, rule, &form, &lemma, e));
        } else if let Some(e) = cx.analyzer.is_exempt(&lemma) {
            let stemmed = stem.as_ref().map(|s| s.stem(&lemma).into_owned());
            // Without a stemmer, or when the stemmer leaves the lemma alone, the exemption
            // changes nothing for this override.
            if let Some(stemmed) = stemmed.filter(|s| *s != lemma) {
                out.push(exempt_lemma(cx, i, rule, &form, &lemma, &stemmed, e));
            }
        }
    }
}

fn exempt_form(
    cx: &Context,
    i: usize,
    rule: &LemmaOverride,
    form: &str,
    lemma: &str,
    exemption: usize,
) -> Finding {
    let e = RuleRef::Exempt(exemption);
    let label = cx.analyzer.rule_label(e);
    let mut f = Finding::new(
        &INFO,
        &rule.form.origin,
        format!("{form:?} is exempt ({label}), so the lemma override {form:?} → {lemma:?} never applies"),
    )
    .on_rule(cx.analyzer, RuleRef::Lemma(i))
    .members(vec![form.to_string(), lemma.to_string()])
    .help(format!(
        "keep the exemption if {form:?} must match only itself and remove the override, or remove the exemption if {form:?} should join {lemma:?}"
    ));
    if let Some(origin) = cx.analyzer.rule_origin(e) {
        f = f.related(origin, format!("{form:?} is exempted here"), Some(e));
    }
    f
}

fn exempt_lemma(
    cx: &Context,
    i: usize,
    rule: &LemmaOverride,
    form: &str,
    lemma: &str,
    stemmed: &str,
    exemption: usize,
) -> Finding {
    let e = RuleRef::Exempt(exemption);
    let label = cx.analyzer.rule_label(e);
    let mut f = Finding::new(
        &INFO,
        &rule.lemma.origin,
        format!(
            "the lemma {lemma:?} is exempt ({label}): {form:?} keys to {lemma:?} as written, not to {stemmed:?}, the key the stemmer gives the word's other forms"
        ),
    )
    .on_rule(cx.analyzer, RuleRef::Lemma(i))
    .members(vec![form.to_string(), lemma.to_string()])
    .help("fine if the exemption is meant to keep this spelling apart; otherwise remove the exemption");
    // Reported below the check's level: the contract makes this case work on purpose.
    f.severity = Severity::Info;
    if let Some(origin) = cx.analyzer.rule_origin(e) {
        f = f.related(origin, format!("{lemma:?} is exempted here"), Some(e));
    }
    f
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;
    use crate::severity::Severity;

    #[test]
    fn an_exempt_form_makes_its_override_dead() {
        let a = analyzer(
            "exempt:\n  - id: keep-left\n    term: left\nlemmas:\n  - {form: left, lemma: leave}\n",
        );
        let report = run(&a, None);
        let f = of(&report, "exempt-vs-lemma");
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].severity, Severity::Warning);
        assert_eq!(f[0].origin.line, 7);
        assert!(f[0].message.contains("never applies"));
        assert_eq!(f[0].related[0].origin.line, 4);
    }

    #[test]
    fn patterns_count_and_an_exempt_lemma_is_info() {
        let a = analyzer(
            "exempt:\n  - pattern: \"^mouse$\"\nlemmas:\n  - {form: mice, lemma: mouse}\n",
        );
        let f = of(&run(&a, None), "exempt-vs-lemma")
            .into_iter()
            .cloned()
            .collect::<Vec<_>>();
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].severity, Severity::Info);
        assert!(f[0].message.contains("not to \"mous\""), "{}", f[0].message);
    }

    #[test]
    fn unrelated_exemptions_are_fine() {
        let a = analyzer(
            "exempt: [news, wayfare]\nlemmas:\n  - {form: rode, lemma: ride}\n  - {form: children, lemma: child}\n",
        );
        assert!(of(&run(&a, None), "exempt-vs-lemma").is_empty());
    }
}
