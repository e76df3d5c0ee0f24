//! `redundant-member`: terms of one synonym rule that normalize to the same keys.

use std::collections::hash_map::Entry;

use rustc_hash::FxHashMap;

use super::{CheckInfo, Needs};
use crate::analysis::{Phrase, RuleRef};
use crate::lint::{Context, Finding, quoted_list};
use crate::rules::{SynonymKind, Term};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "redundant-member",
    severity: Severity::Info,
    needs: Needs::Nothing,
    summary: "members of one rule that normalize to the same keys, so one of them adds nothing",
    finds: "Two members of one equivalent set with the same key sequence, a one-way target \
            with the same keys as its source, or the same target twice. When every member of \
            a set has the same keys, the whole set does nothing.",
    why: "Rules speak in keys: after lowercasing, stopwords and stemming, `travelling` and \
          `traveling` are both `travel`, and `park-and-ride` is `park and ride`. A member \
          that repeats another's keys changes nothing, and it suggests the author expected \
          the rule to do something the stemmer already does — worth knowing before relying \
          on it.",
    example: "synonyms:\n  - equivalent: [travelling, traveling]\n  - equivalent: [park and ride, park-and-ride, p+r]",
    fix: "Remove the repeated member (or the whole rule, when the analyzer already makes all \
          its members the same). `lexdelta trace WORD` shows the key of each.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    for (i, rule) in cx.ruleset.synonyms.iter().enumerate() {
        let terms = cx.terms.get(i).map_or(&[][..], Vec::as_slice);
        let phrases: Vec<(&Phrase, &Term)> = terms.iter().map(|t| (&*t.phrase, t.term)).collect();
        match &rule.kind {
            SynonymKind::Equivalent { .. } => set_findings(cx, i, &phrases, out),
            SynonymKind::OneWay { .. } => one_way_findings(cx, i, &phrases, out),
        }
    }
}

fn set_findings(cx: &Context, i: usize, phrases: &[(&Phrase, &Term)], out: &mut Vec<Finding>) {
    let rule = RuleRef::Synonym(i);
    let Some((first, first_term)) = phrases.first() else {
        return;
    };
    if phrases.len() > 1 && phrases.iter().all(|(p, _)| p == first) {
        let terms: Vec<&str> = phrases.iter().map(|(_, t)| t.text.as_str()).collect();
        out.push(
            Finding::new(
                &INFO,
                &first_term.origin,
                format!(
                    "the set does nothing: {} all normalize to {:?}",
                    quoted_list(&terms),
                    first.display()
                ),
            )
            .on_rule(cx.analyzer, rule)
            .members(terms.iter().map(|t| t.to_string()).collect())
            .help("remove the rule: the analyzer already makes these the same"),
        );
        return;
    }
    // The first member with each phrase: one look-up per member, not a scan of the
    // members before it (quadratic in a set of 100k members).
    let mut first_with: FxHashMap<&Phrase, &Term> = FxHashMap::default();
    for (phrase, term) in phrases {
        match first_with.entry(phrase) {
            Entry::Occupied(earlier) => {
                out.push(repeated(cx, rule, term, earlier.get(), phrase, "member"));
            }
            Entry::Vacant(slot) => {
                slot.insert(term);
            }
        }
    }
}

fn one_way_findings(cx: &Context, i: usize, phrases: &[(&Phrase, &Term)], out: &mut Vec<Finding>) {
    let rule = RuleRef::Synonym(i);
    let Some(((from, from_term), targets)) = phrases.split_first() else {
        return;
    };
    let mut first_with: FxHashMap<&Phrase, &Term> = FxHashMap::default();
    for (phrase, term) in targets {
        let earlier = match first_with.entry(phrase) {
            Entry::Occupied(earlier) => Some(*earlier.get()),
            Entry::Vacant(slot) => {
                slot.insert(term);
                None
            }
        };
        if phrase == from {
            out.push(
                Finding::new(
                    &INFO,
                    &term.origin,
                    format!(
                        "the target {:?} normalizes to the same keys as the source {:?} ({:?}): it adds nothing",
                        term.text,
                        from_term.text,
                        from.display()
                    ),
                )
                .on_rule(cx.analyzer, rule)
                .members(vec![from_term.text.clone(), term.text.clone()])
                .related(&from_term.origin, "the source", Some(rule))
                .help("remove the target; a search for the source already finds it"),
            );
        } else if let Some(earlier) = earlier {
            out.push(repeated(cx, rule, term, earlier, phrase, "target"));
        }
    }
}

fn repeated(
    cx: &Context,
    rule: RuleRef,
    term: &Term,
    earlier: &Term,
    phrase: &Phrase,
    what: &str,
) -> Finding {
    Finding::new(
        &INFO,
        &term.origin,
        format!(
            "{what} {:?} normalizes to the same keys as {:?} ({:?}): it adds nothing",
            term.text,
            earlier.text,
            phrase.display()
        ),
    )
    .on_rule(cx.analyzer, rule)
    .members(vec![earlier.text.clone(), term.text.clone()])
    .related(
        &earlier.origin,
        format!("{:?} is here", earlier.text),
        Some(rule),
    )
    .help(format!(
        "remove {:?}; {:?} already matches the same text",
        term.text, earlier.text
    ))
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn spellings_the_analyzer_already_joins() {
        let a = analyzer(
            "pipeline:\n  stopwords: [and]\nsynonyms:\n  - equivalent: [park and ride, park-and-ride, p+r]\n  - equivalent: [travelling, traveling]\n  - one_way: {from: lift, to: [lifts, elevator, elevators]}\n",
        );
        let report = run(&a, None);
        let f = of(&report, "redundant-member");
        assert_eq!(f.len(), 4, "{f:#?}");
        assert!(f[0].message.contains("\"park-and-ride\" normalizes to the same keys as \"park and ride\" (\"park _ ride\")"), "{}", f[0].message);
        assert!(f[1].message.starts_with("the set does nothing"));
        assert!(f[2].message.contains("the target \"lifts\""));
        assert!(
            f[3].message
                .contains("target \"elevators\" normalizes to the same keys as \"elevator\"")
        );
    }

    #[test]
    fn distinct_members_are_fine() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [tyre, tire]\n  - one_way: {from: boat, to: [ferry]}\n",
        );
        assert!(of(&run(&a, None), "redundant-member").is_empty());
    }
}
