//! `lemma-chain`: a lemma override whose lemma is itself overridden (and loops of them).
//!
//! Lemma overrides are applied once, to the surface form: "laid" → "lay" gives "laid" the
//! key of "lay" as the stemmer sees it, and never follows "lay" → "lie". So in a chain the
//! first form and its lemma part ways, and in a loop the forms swap keys.

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::lint::graph::single_surface;
use crate::lint::{Context, Finding};
use crate::rules::LemmaOverride;
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "lemma-chain",
    severity: Severity::Warning,
    needs: Needs::Nothing,
    summary: "a lemma override whose lemma is itself overridden, or overrides that loop",
    finds: "A lemma override `a → b` where `b` is the form of another override `b → c`, and \
            overrides that go round in a loop (`a → b`, `b → a`). The whole chain or loop \
            is shown. With a vocabulary, a chain whose first form occurs nowhere is info.",
    why: "An override is applied once, to the surface form, and its lemma is then stemmed, \
          not looked up again. In a chain `a` gets the key of `b` while `b` gets the key of \
          `c`, so `a` and `b` no longer meet, and `a` never reaches `c`. In a loop the forms \
          swap keys. Imported irregular-form lists produce chains where one word is both \
          an irregular form and a base form of its own (`lay` is the past of `lie` and a \
          verb in its own right).",
    example: "lemmas:\n  - {form: laid, lemma: lay}\n  - {form: lay, lemma: lie}",
    fix: "Point the form straight at the lemma you mean (`laid → lie`, or keep `laid → lay` \
          and remove `lay → lie` when the lemma is a word of its own).",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    for (i, rule) in cx.ruleset.lemmas.iter().enumerate() {
        let Some(steps) = chain_from(cx, i, rule) else {
            continue;
        };
        if steps.looped {
            // Every override of a loop sees the same loop: report it once, from the
            // override written last.
            if is_last_of_loop(cx, &steps.rules) {
                out.push(loop_finding(cx, &steps));
            }
        } else {
            let mut f = chain_finding(cx, i, rule, &steps);
            // With a vocabulary, a chain whose first form never occurs changes no search
            // today: still worth fixing, not worth a warning.
            if cx
                .vocabulary
                .is_some_and(|v| !v.vocabulary.contains(&steps.forms[0]))
            {
                f.message.push_str(&format!(
                    "; {:?} occurs nowhere in the vocabulary",
                    steps.forms[0]
                ));
                f.severity = Severity::Info;
            }
            out.push(f);
        }
    }
}

/// The overrides followed from one override, and whether they come back to its form.
struct Steps {
    /// Surface forms in order: the override's form, its lemma, the lemma's lemma, …
    forms: Vec<String>,
    /// The override at each step (index into `lemmas`), starting with the given one.
    rules: Vec<usize>,
    looped: bool,
}

/// Follows the overrides the analyzer applies, from override `i`; `None` when the lemma is
/// not itself overridden (or the override never applies, which other checks report).
fn chain_from(cx: &Context, i: usize, rule: &LemmaOverride) -> Option<Steps> {
    let a = cx.analyzer;
    let form = single_surface(a, &rule.form.text)?;
    // Only the override the analyzer uses for this form, and only when it can apply.
    if a.lemma_of(&form).map(|(_, r)| r) != Some(i) || a.is_exempt(&form).is_some() {
        return None;
    }
    let mut steps = Steps {
        forms: vec![form],
        rules: vec![i],
        looped: false,
    };
    let mut current = single_surface(a, &rule.lemma.text)?;
    loop {
        if steps.forms.contains(&current) {
            steps.looped = steps.forms[0] == current;
            steps.forms.push(current);
            break;
        }
        let next = match a.lemma_of(&current) {
            Some(next) if a.is_exempt(&current).is_none() => next,
            _ => {
                steps.forms.push(current);
                break;
            }
        };
        steps.forms.push(current);
        steps.rules.push(next.1);
        current = next.0.to_string();
    }
    (steps.rules.len() > 1).then_some(steps)
}

fn is_last_of_loop(cx: &Context, rules: &[usize]) -> bool {
    let origin = |r: &usize| &cx.ruleset.lemmas[*r].meta.origin;
    let last = rules.iter().max_by(|x, y| origin(x).cmp(origin(y)));
    last == rules.first()
}

fn arrows(forms: &[String]) -> String {
    forms
        .iter()
        .map(|f| format!("{f:?}"))
        .collect::<Vec<_>>()
        .join(" → ")
}

fn key_of(cx: &Context, form: &str) -> String {
    cx.analyzer
        .key(form)
        .map_or_else(|| "(dropped)".to_string(), |k| k.into_owned())
}

fn chain_finding(cx: &Context, i: usize, rule: &LemmaOverride, steps: &Steps) -> Finding {
    let (form, lemma) = (&steps.forms[0], &steps.forms[1]);
    let next = &steps.forms[2];
    let mut f = Finding::new(
        &INFO,
        &rule.form.origin,
        format!(
            "{form:?} → {lemma:?}, but {lemma:?} is itself overridden to {next:?}: overrides are applied once, so {form:?} keys to {:?} and {lemma:?} to {:?}; they no longer meet (chain: {})",
            key_of(cx, form),
            key_of(cx, lemma),
            arrows(&steps.forms)
        ),
    )
    .on_rule(cx.analyzer, RuleRef::Lemma(i))
    .members(steps.forms.clone())
    .help(format!(
        "point {form:?} straight at the lemma you mean, or remove the override of {lemma:?} if it is a word of its own"
    ));
    for (step, r) in steps.rules.iter().enumerate().skip(1) {
        let other = &cx.ruleset.lemmas[*r];
        let note = format!(
            "{:?} → {:?} is overridden here",
            steps.forms[step],
            steps.forms[step + 1]
        );
        f = f.related(&other.form.origin, note, Some(RuleRef::Lemma(*r)));
    }
    f
}

fn loop_finding(cx: &Context, steps: &Steps) -> Finding {
    let first = &cx.ruleset.lemmas[steps.rules[0]];
    let keys: Vec<String> = steps.forms[..steps.forms.len() - 1]
        .iter()
        .map(|form| format!("{form:?} keys to {:?}", key_of(cx, form)))
        .collect();
    let mut f = Finding::new(
        &INFO,
        &first.form.origin,
        format!(
            "lemma overrides go round in a loop: {}; each is applied once, so the forms swap keys ({})",
            arrows(&steps.forms),
            keys.join(", ")
        ),
    )
    .on_rule(cx.analyzer, RuleRef::Lemma(steps.rules[0]))
    .members(steps.forms.clone())
    .help("keep one direction: decide which form is the lemma and remove the other overrides");
    for r in steps.rules.iter().skip(1) {
        let other = &cx.ruleset.lemmas[*r];
        f = f.related(
            &other.form.origin,
            format!("{:?} → {:?}", other.form.text, other.lemma.text),
            Some(RuleRef::Lemma(*r)),
        );
    }
    f
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn a_chain_is_reported_on_the_override_whose_lemma_is_overridden() {
        let a = analyzer("lemmas:\n  - {form: laid, lemma: lay}\n  - {form: lay, lemma: lie}\n");
        let report = run(&a, None);
        let f = of(&report, "lemma-chain");
        assert_eq!(f.len(), 1);
        assert_eq!(f[0].origin.line, 4);
        assert_eq!(f[0].members, ["laid", "lay", "lie"]);
        assert!(
            f[0].message
                .contains("\"laid\" keys to \"lay\" and \"lay\" to \"lie\""),
            "{}",
            f[0].message
        );
        assert_eq!(f[0].related[0].origin.line, 5);
    }

    #[test]
    fn a_loop_is_reported_once_with_the_whole_loop() {
        let a = analyzer(
            "lemmas:\n  - {form: a1, lemma: b1}\n  - {form: b1, lemma: c1}\n  - {form: c1, lemma: a1}\n",
        );
        let report = run(&a, None);
        let f = of(&report, "lemma-chain");
        assert_eq!(f.len(), 1, "{f:#?}");
        assert!(f[0].message.contains("loop"));
        assert_eq!(f[0].members.len(), 4);
        assert_eq!(f[0].origin.line, 6, "on the override written last");
    }

    #[test]
    fn a_chain_that_never_meets_the_text_is_info() {
        let a = analyzer("lemmas:\n  - {form: laid, lemma: lay}\n  - {form: lay, lemma: lie}\n");
        let v = vocabulary(&a, &["lay the table"], &[]);
        let report = run(&a, Some(&v));
        let f = of(&report, "lemma-chain");
        assert_eq!(f[0].severity, crate::severity::Severity::Info);
        assert!(
            f[0].message
                .ends_with("\"laid\" occurs nowhere in the vocabulary")
        );
    }

    #[test]
    fn independent_overrides_and_exempt_lemmas_are_fine() {
        let a = analyzer(
            "exempt: [lay]\nlemmas:\n  - {form: rode, lemma: ride}\n  - {form: ridden, lemma: ride}\n  - {form: laid, lemma: lay}\n  - {form: lay, lemma: lie}\n",
        );
        // "lay" is exempt, so "lay → lie" never applies: exempt-vs-lemma's business.
        assert!(of(&run(&a, None), "lemma-chain").is_empty());
    }
}
