//! `stopword-in-member`: stopwords inside synonym rule terms.

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::lint::{Context, Finding, quoted_list};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "stopword-in-member",
    severity: Severity::Info,
    needs: Needs::Nothing,
    summary: "a synonym term containing stopwords, which are dropped from the term as from text",
    finds: "A synonym rule term with a word on the stopword list. Inside a phrase the \
            stopword leaves a gap that any stopword fills; at either end it is simply dropped.",
    why: "Rule terms go through the same stages as text, so `park and ride` is the key `park`, \
          any one stopword, then `ride`: it also matches `park the ride`, and `the ferry` \
          is matched as `ferry` alone. That is usually harmless, but a member that only \
          differs from another by a stopword is not the distinct phrase it looks like.",
    example: "pipeline:\n  stopwords: [and, the]\nsynonyms:\n  - equivalent: [park and ride, the p+r]",
    fix: "Usually nothing: the finding is informational. If the stopword matters, take it off \
          the stopword list; if it does not, write the term without it.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    if cx.ruleset.pipeline.stopwords.is_empty() {
        return;
    }
    for (i, terms) in cx.terms.iter().enumerate() {
        for t in terms {
            let (term, words) = (t.term, &t.words);
            let stop: Vec<usize> = (0..words.len())
                .filter(|k| words[*k].key.is_none())
                .collect();
            if stop.is_empty() {
                continue;
            }
            let first_kept = words.iter().position(|w| w.key.is_some());
            let last_kept = words.iter().rposition(|w| w.key.is_some());
            let (Some(first_kept), Some(last_kept)) = (first_kept, last_kept) else {
                continue; // nothing but stopwords: the ruleset does not compile
            };
            let inner: Vec<&str> = stop
                .iter()
                .filter(|k| **k > first_kept && **k < last_kept)
                .map(|k| words[*k].surface.as_str())
                .collect();
            let edge: Vec<&str> = stop
                .iter()
                .filter(|k| **k < first_kept || **k > last_kept)
                .map(|k| words[*k].surface.as_str())
                .collect();
            let kept: Vec<&str> = words
                .iter()
                .filter(|w| w.key.is_some())
                .map(|w| w.surface.as_str())
                .collect();
            let mut parts = Vec::new();
            if !inner.is_empty() {
                parts.push(format!(
                    "the stopword {} inside it is dropped and leaves a gap any stopword fills",
                    quoted_list(&inner)
                ));
            }
            if !edge.is_empty() {
                parts.push(format!(
                    "{} at its edge is dropped, so it is matched as {:?}",
                    quoted_list(&edge),
                    kept.join(" ")
                ));
            }
            let stopwords: Vec<String> = stop.iter().map(|k| words[*k].surface.clone()).collect();
            out.push(
                Finding::new(&INFO, &term.origin, format!("{:?}: {}", term.text, parts.join("; ")))
                    .on_rule(cx.analyzer, RuleRef::Synonym(i))
                    .members(stopwords)
                    .help("usually fine; if the stopword matters, take it off the stopword list, otherwise write the term without it"),
            );
        }
    }
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn gaps_and_edges_are_told_apart() {
        let a = analyzer(
            "pipeline:\n  stopwords: [and, the]\nsynonyms:\n  - equivalent: [park and ride, the ferry, p+r]\n",
        );
        let report = run(&a, None);
        let f = of(&report, "stopword-in-member");
        assert_eq!(f.len(), 2);
        assert!(
            f[0].message.contains("\"and\" inside it"),
            "{}",
            f[0].message
        );
        assert!(
            f[1].message.contains("matched as \"ferry\""),
            "{}",
            f[1].message
        );
    }

    #[test]
    fn no_stopwords_no_finding() {
        let a = analyzer(
            "pipeline:\n  stopwords: [and]\nsynonyms:\n  - equivalent: [tram, light rail]\n",
        );
        assert!(of(&run(&a, None), "stopword-in-member").is_empty());
    }
}
