//! `stem-side-effect`: a rule term whose key other, unrelated surface forms share.
//!
//! Rules speak in keys, so a rule about "universal" is a rule about the key `univers` — and
//! "university" has that key too. This check looks every rule word's key up in the
//! vocabulary (one hash probe, through [`KeyedVocabulary`](crate::lint::KeyedVocabulary))
//! and lists the other forms that reach it, with how often they occur, leaving out plain
//! inflections of the word itself ([`inflection`](crate::lint::inflection)).

use rustc_hash::{FxHashMap, FxHashSet};

use super::{CheckInfo, Needs};
use crate::analysis::RuleRef;
use crate::lint::inflection::Inflections;
use crate::lint::{Context, Finding, FormCount, KeyedVocabulary, Word, plural};
use crate::rules::{Language, Term};
use crate::severity::Severity;

/// Forms named in the message; the finding's `forms` keeps up to `KEPT`.
const SHOWN: usize = 3;
const KEPT: usize = 25;

pub const INFO: CheckInfo = CheckInfo {
    name: "stem-side-effect",
    severity: Severity::Warning,
    needs: Needs::Vocabulary,
    summary: "a rule term whose key other surface forms in the vocabulary share, so the rule fires for them too",
    finds: "For every word of every synonym rule term, the other surface forms of the \
            vocabulary that normalize to the same key (through the stemmer or a lemma \
            override), with their document frequency and search traffic. Plain inflections of \
            the word itself (`bike`/`bikes`, `change`/`changing`) and forms a lemma override \
            declares to be the word's (`rode` for `ride`) are left out, and a word \
            shared by several terms of one rule is reported once. When none of the other \
            forms was ever searched for, the finding is info rather than a warning.",
    why: "A rule is judged after its words' own normalization: a set written about \
          `universal` is a set about the key `univers`, so it also fires for `university`, \
          and an imported `left → leave` makes `left luggage` match `leaving`. The rule's \
          author rarely sees this; the searches for the other words do.",
    example: "synonyms:\n  - equivalent: [universal, accessible, step-free]\n# \"universal\" and \"university\" both stem to \"univers\"",
    fix: "Exempt the word (`exempt: [universal]`) so it keeps a key of its own, write a more \
          specific phrase, or, when the other forms may match, silence the finding on the \
          rule with a `lint:` override and a reason.",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    let Some(vocabulary) = cx.vocabulary else {
        return;
    };
    let language = cx.ruleset.pipeline.stemmer;
    // The other forms of each distinct word, before the per-rule filter: rule terms repeat
    // words a lot, and the inflection test is the costly part.
    let mut memo: FxHashMap<&str, Vec<FormCount>> = FxHashMap::default();
    for (i, terms) in cx.terms.iter().enumerate() {
        // Forms the rule itself writes are no surprise to its author (built only for the
        // few rules whose words have other forms at all).
        let mut own: Option<FxHashSet<&str>> = None;
        // A word shared by several terms of the rule ("rail replacement", "replacement
        // bus") is reported once, on the first term that has it.
        let mut reported: FxHashSet<&str> = FxHashSet::default();
        for t in terms {
            let mut hits = Vec::new();
            for word in &t.words {
                let Some(key) = word.key.as_deref() else {
                    continue;
                };
                let others = memo
                    .entry(word.surface.as_str())
                    .or_insert_with(|| other_forms(cx, vocabulary, language, word, key));
                if others.is_empty() {
                    continue;
                }
                let own = own.get_or_insert_with(|| {
                    terms
                        .iter()
                        .flat_map(|t| t.words.iter().map(|w| w.surface.as_str()))
                        .collect()
                });
                let forms: Vec<FormCount> = others
                    .iter()
                    .filter(|f| !own.contains(f.form.as_str()))
                    .cloned()
                    .collect();
                if !forms.is_empty() && reported.insert(word.surface.as_str()) {
                    hits.push(Hit { word, key, forms });
                }
            }
            if !hits.is_empty() {
                out.push(finding(cx, i, t.term, hits));
            }
        }
    }
}

/// One word of a term and the other forms that share its key.
struct Hit<'a> {
    word: &'a Word,
    key: &'a str,
    forms: Vec<FormCount>,
}

/// The vocabulary forms with the word's key that are neither the word, nor one of its plain
/// inflections, nor declared its irregular forms; most searched first.
fn other_forms(
    cx: &Context,
    vocabulary: &KeyedVocabulary,
    language: Option<Language>,
    word: &Word,
    key: &str,
) -> Vec<FormCount> {
    let candidates = vocabulary.forms_with_key(key);
    // The common case: the word alone has its key.
    if candidates.iter().all(|f| f.form == word.surface) {
        return Vec::new();
    }
    let inflections = Inflections::of(language, &word.surface);
    let mut forms: Vec<FormCount> = candidates
        .iter()
        .filter(|f| !inflections.includes(&f.form) && !declared_form_of(cx, &f.form, &word.surface))
        .map(|stats| FormCount {
            form: stats.form.clone(),
            documents: stats.documents,
            searches: stats.searches,
            via: cx
                .analyzer
                .lemma_of(&stats.form)
                .map(|(_, r)| cx.analyzer.rule_label(RuleRef::Lemma(r))),
        })
        .collect();
    forms.sort_by(|a, b| {
        (b.searches, b.documents)
            .cmp(&(a.searches, a.documents))
            .then_with(|| a.form.cmp(&b.form))
    });
    forms
}

/// Whether a lemma override declares `form` an irregular form of `word` ("rode" of "ride"):
/// a term written as the base form is meant to cover those. The reverse is not excused: a
/// term written as an irregular form ("left") that an override sends to a lemma ("leave")
/// now fires for the lemma's forms, which its author did not write.
fn declared_form_of(cx: &Context, form: &str, word: &str) -> bool {
    cx.analyzer
        .lemma_of(form)
        .is_some_and(|(lemma, _)| lemma == word)
}

fn describe(form: &FormCount, cx: &Context) -> String {
    let via = match cx.analyzer.lemma_of(&form.form) {
        Some((lemma, _)) => format!("; via the lemma override {:?} → {lemma:?}", form.form),
        None => String::new(),
    };
    format!(
        "{:?} ({}, {}{via})",
        form.form,
        plural(form.documents as usize, "document", "documents"),
        plural(form.searches as usize, "search", "searches")
    )
}

fn part(hit: &Hit, whole: &str, cx: &Context) -> String {
    let shown: Vec<String> = hit
        .forms
        .iter()
        .take(SHOWN)
        .map(|f| describe(f, cx))
        .collect();
    let more = hit.forms.len().saturating_sub(SHOWN);
    let mut list = shown.join(", ");
    if more > 0 {
        list.push_str(&format!(" and {}", plural(more, "more form", "more forms")));
    }
    let through = match cx.analyzer.lemma_of(&hit.word.surface) {
        Some((lemma, r)) => format!(
            " (through the lemma override {:?} → {lemma:?}, {})",
            hit.word.surface,
            cx.analyzer.rule_label(RuleRef::Lemma(r))
        ),
        None => String::new(),
    };
    if hit.word.surface == whole {
        format!(
            "{whole:?} keys to {:?}{through}, and so does {list}",
            hit.key
        )
    } else {
        format!(
            "in {whole:?}, {:?} keys to {:?}{through}, and so does {list}",
            hit.word.surface, hit.key
        )
    }
}

fn finding(cx: &Context, i: usize, term: &Term, hits: Vec<Hit<'_>>) -> Finding {
    let rule = RuleRef::Synonym(i);
    let whole = cx
        .analyzer
        .surface()
        .tokens(&term.text)
        .into_iter()
        .map(|t| t.form)
        .collect::<Vec<_>>()
        .join(" ");
    let parts: Vec<String> = hits.iter().map(|h| part(h, &whole, cx)).collect();
    let mut message = parts.join("; ");
    message.push_str(": the rule fires for them too");
    let first = &hits[0];
    let help = match cx.analyzer.lemma_of(&first.word.surface) {
        Some(_) => format!(
            "the key comes from a lemma override: exempt {:?} (it then keeps its own key) or remove the override; if the other forms may match, silence this on the rule with a reason",
            first.word.surface
        ),
        None => format!(
            "if these must not match, exempt {:?} so it keeps its own key, or write a more specific phrase; if they may, silence this on the rule with a reason",
            first.word.surface
        ),
    };
    let searched = hits.iter().flat_map(|h| &h.forms).any(|f| f.searches > 0);
    let mut f = Finding::new(&INFO, &term.origin, message)
        .on_rule(cx.analyzer, rule)
        .members(hits.iter().map(|h| h.word.surface.clone()).collect())
        .help(help);
    let mut related: Vec<usize> = Vec::new();
    for hit in &hits {
        related.extend(cx.analyzer.lemma_of(&hit.word.surface).map(|(_, r)| r));
        related.extend(
            hit.forms
                .iter()
                .take(SHOWN)
                .filter_map(|form| cx.analyzer.lemma_of(&form.form).map(|(_, r)| r)),
        );
    }
    related.sort_unstable();
    related.dedup();
    for r in related {
        let lemma = &cx.ruleset.lemmas[r];
        f = f.related(
            &lemma.form.origin,
            format!(
                "lemma override {:?} → {:?}",
                lemma.form.text, lemma.lemma.text
            ),
            Some(RuleRef::Lemma(r)),
        );
    }
    if !searched {
        // Nobody searches for the other forms: documents may still match, but no query
        // typed with them changes. Worth a look, not a warning.
        f.severity = Severity::Info;
    }
    let mut forms: Vec<FormCount> = hits.into_iter().flat_map(|h| h.forms).collect();
    forms.truncate(KEPT);
    f.forms(forms)
}

#[cfg(test)]
mod tests {
    use crate::lint::fixture::*;

    #[test]
    fn universal_reveals_university_with_its_traffic() {
        let a = analyzer(
            "synonyms:\n  - id: accessible-travel\n    equivalent: [universal, accessible]\n",
        );
        let v = vocabulary(
            &a,
            &[
                "Universal design at stops",
                "University pass prices",
                "Bikes and bike racks",
            ],
            &[
                ("university pass", 300),
                ("universal", 4),
                ("universals", 1),
            ],
        );
        let report = run(&a, Some(&v));
        let f = of(&report, "stem-side-effect");
        assert_eq!(f.len(), 1, "{f:#?}");
        let f = f[0];
        assert_eq!((f.origin.line, f.origin.column), (5, 18));
        assert_eq!(f.forms[0].form, "university");
        assert_eq!((f.forms[0].documents, f.forms[0].searches), (1, 300));
        assert_eq!(f.forms.len(), 1, "\"universals\" is a plain inflection");
        assert!(f.message.starts_with("\"universal\" keys to \"univers\", and so does \"university\" (1 document, 300 searches)"), "{}", f.message);
    }

    #[test]
    fn a_lemma_override_in_a_phrase_is_named() {
        let a = analyzer(
            "synonyms:\n  - one_way: {from: luggage storage, to: [left luggage]}\nlemmas:\n  - {form: left, lemma: leave}\n",
        );
        let v = vocabulary(
            &a,
            &["Leave your bags", "Left luggage office", "leaving early"],
            &[],
        );
        let report = run(&a, Some(&v));
        let f = of(&report, "stem-side-effect");
        assert_eq!(f.len(), 1, "{f:#?}");
        assert!(
            f[0].message.contains(
                "in \"left luggage\", \"left\" keys to \"leav\" (through the lemma override"
            ),
            "{}",
            f[0].message
        );
        let forms: Vec<&str> = f[0].forms.iter().map(|x| x.form.as_str()).collect();
        assert_eq!(forms, ["leave", "leaving"]);
        assert_eq!(f[0].related[0].origin.line, 6);
    }

    #[test]
    fn plain_inflections_and_exempt_words_are_fine() {
        let a = analyzer("exempt: [universal]\nsynonyms:\n  - equivalent: [universal, bike]\n");
        let v = vocabulary(&a, &["University bikes", "bike biking biked"], &[]);
        assert!(of(&run(&a, Some(&v)), "stem-side-effect").is_empty());
    }
}
