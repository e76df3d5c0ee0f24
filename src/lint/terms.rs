//! Synonym rule terms normalized once per lint run.
//!
//! Several checks need each term's key sequence and its words with their keys. Computing
//! them once, from the phrases the analyzer already compiled, keeps a 100,000-rule lint from
//! stemming the same words once per check.

use std::borrow::Cow;

use crate::analysis::{Analyzer, CompiledSynonym, Phrase};
use crate::rules::{SynonymKind, Term};

/// One word of a rule term after the surface stage, with its key (`None`: a stopword).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Word {
    pub surface: String,
    pub key: Option<String>,
}

/// A synonym rule term as written, its key sequence and its words.
#[derive(Clone, Debug)]
pub struct RuleTerm<'a> {
    pub term: &'a Term,
    pub phrase: Cow<'a, Phrase>,
    pub words: Vec<Word>,
}

/// Every synonym rule's terms (equivalent: the members; one-way: the source, then the
/// targets), indexed like the ruleset's `synonyms`.
pub fn rule_terms(analyzer: &Analyzer) -> Vec<Vec<RuleTerm<'_>>> {
    (0..analyzer.ruleset().synonyms.len())
        .map(|i| terms_of(analyzer, i))
        .collect()
}

/// The terms of synonym rule `rule`, normalized as the analyzer compiled them. The compiled
/// rule is used when it lines up with the written one (it always does once the ruleset
/// compiled); otherwise each term is normalized again.
pub fn terms_of(analyzer: &Analyzer, rule: usize) -> Vec<RuleTerm<'_>> {
    let Some(written) = analyzer.ruleset().synonyms.get(rule) else {
        return Vec::new();
    };
    let terms: Vec<&Term> = match &written.kind {
        SynonymKind::Equivalent { members } => members.iter().collect(),
        SynonymKind::OneWay { from, to } => std::iter::once(from).chain(to).collect(),
    };
    let compiled: Option<Vec<&Phrase>> = match analyzer.synonyms().rules().get(rule) {
        Some(CompiledSynonym::Equivalent(members)) => Some(members.iter().collect()),
        Some(CompiledSynonym::OneWay { from, to }) => {
            Some(std::iter::once(from).chain(to).collect())
        }
        None => None,
    };
    let phrases: Vec<Cow<Phrase>> = match compiled {
        Some(p) if p.len() == terms.len() => p.into_iter().map(Cow::Borrowed).collect(),
        _ => terms
            .iter()
            .map(|t| Cow::Owned(analyzer.phrase(&t.text)))
            .collect(),
    };
    terms
        .into_iter()
        .zip(phrases)
        .filter(|(_, p)| !p.keys.is_empty())
        .map(|(term, phrase)| RuleTerm {
            words: words_of(analyzer, &term.text, &phrase),
            term,
            phrase,
        })
        .collect()
}

/// A term's words: the surface stage's tokens, each with the key the phrase gives it (the
/// phrase holds the keys of the non-stopword tokens, in order), so nothing is stemmed twice.
fn words_of(analyzer: &Analyzer, text: &str, phrase: &Phrase) -> Vec<Word> {
    let tokens = analyzer.surface().tokens(text);
    let kept = tokens
        .iter()
        .filter(|t| !analyzer.is_stopword(&t.form))
        .count();
    let from_phrase = kept == phrase.keys.len();
    let mut keys = phrase.keys.iter();
    tokens
        .into_iter()
        .map(|t| {
            let key = if analyzer.is_stopword(&t.form) {
                None
            } else if from_phrase {
                keys.next().map(|(_, k)| k.clone())
            } else {
                analyzer.key(&t.form).map(Cow::into_owned)
            };
            Word {
                surface: t.form,
                key,
            }
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::lint::fixture::analyzer;

    #[test]
    fn words_carry_the_keys_of_the_compiled_phrase() {
        let a = analyzer(
            "pipeline:\n  stopwords: [and]\nsynonyms:\n  - equivalent: [Park and Rides, p+r]\n",
        );
        let terms = rule_terms(&a);
        let park = &terms[0][0];
        assert_eq!(park.phrase.display(), "park _ ride");
        let words: Vec<(&str, Option<&str>)> = park
            .words
            .iter()
            .map(|w| (w.surface.as_str(), w.key.as_deref()))
            .collect();
        assert_eq!(
            words,
            [
                ("park", Some("park")),
                ("and", None),
                ("rides", Some("ride"))
            ]
        );
        assert!(matches!(park.phrase, Cow::Borrowed(_)));
    }
}
