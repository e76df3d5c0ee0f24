//! `unknown-check`: a `lint:` setting that names a check lint does not have.

use super::{CheckInfo, Needs, closest, find};
use crate::analysis::RuleRef;
use crate::lint::{Context, Finding};
use crate::rules::{Origin, RuleMeta};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "unknown-check",
    severity: Severity::Error,
    needs: Needs::Nothing,
    summary: "a lint setting (on a rule or in the ruleset's lint section) that names no existing check",
    finds: "A per-rule `lint:` override or an entry of the ruleset's `lint.checks` whose \
            check name is not one of lint's checks, with the closest real name when one is \
            close.",
    why: "A misspelt name silences nothing and raises nothing, so the setting its author \
          relies on is not in force: the finding it meant to quiet still fails the build, \
          or the check it meant to make stricter stays lenient.",
    example: "synonyms:\n  - equivalent: [universe, cosmos]\n    lint:\n      - check: stem-side-efect\n        severity: off\n        reason: reviewed",
    fix: "Correct the name (`lexdelta lint --list-checks` lists them) or remove the setting.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let ruleset = cx.ruleset;
    let metas = ruleset
        .synonyms
        .iter()
        .enumerate()
        .map(|(i, r)| (RuleRef::Synonym(i), &r.meta))
        .chain(
            ruleset
                .exemptions
                .iter()
                .enumerate()
                .map(|(i, r)| (RuleRef::Exempt(i), &r.meta)),
        )
        .chain(
            ruleset
                .lemmas
                .iter()
                .enumerate()
                .map(|(i, r)| (RuleRef::Lemma(i), &r.meta)),
        );
    for (rule, meta) in metas {
        per_rule(cx, rule, meta, out);
    }
    for (name, (_, origin)) in &ruleset.lint.checks {
        if find(name).is_none() {
            out.push(unknown(name, origin, "in the ruleset's lint section"));
        }
    }
}

fn per_rule(cx: &Context, rule: RuleRef, meta: &RuleMeta, out: &mut Vec<Finding>) {
    for o in &meta.lint {
        if find(&o.check.text).is_none() {
            out.push(
                unknown(&o.check.text, &o.check.origin, "on this rule").on_rule(cx.analyzer, rule),
            );
        }
    }
}

fn unknown(name: &str, origin: &Origin, place: &str) -> Finding {
    let help = match closest(name) {
        Some(s) => format!("did you mean {s:?}? `lexdelta lint --list-checks` lists every check"),
        None => "`lexdelta lint --list-checks` lists every check".to_string(),
    };
    Finding::new(
        &INFO,
        origin,
        format!("there is no lint check named {name:?}: the setting {place} has no effect"),
    )
    .members(vec![name.to_string()])
    .help(help)
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn misspelt_names_on_a_rule_and_in_the_lint_section() {
        let a = analyzer(
            "lint:\n  checks:\n    set-bridges: {severity: off}\nsynonyms:\n  - equivalent: [universe, cosmos]\n    lint:\n      - check: stem-side-efect\n        severity: off\n        reason: reviewed\n",
        );
        let report = run(&a, None);
        let f = of(&report, "unknown-check");
        assert_eq!(f.len(), 2);
        assert_eq!(f[0].origin.line, 5);
        assert!(
            f[0].help
                .as_deref()
                .unwrap()
                .starts_with("did you mean \"set-bridge\"?")
        );
        assert_eq!(f[1].origin.line, 9);
        assert!(
            f[1].help
                .as_deref()
                .unwrap()
                .contains("\"stem-side-effect\"")
        );
    }

    #[test]
    fn real_names_are_fine() {
        let a = analyzer(
            "lint:\n  checks:\n    set-bridge: {severity: off}\nsynonyms:\n  - equivalent: [universe, cosmos]\n    lint:\n      - check: stem-side-effect\n        severity: off\n        reason: reviewed\n",
        );
        assert!(of(&run(&a, None), "unknown-check").is_empty());
    }
}
