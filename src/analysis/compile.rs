//! Compiling a ruleset into an analyzer: rule terms go through the same surface stage the
//! text will, so "Universe" in a rule and "universe" in a query meet at one key.

use std::collections::HashMap;
use std::sync::Arc;

use rustc_hash::FxHashMap;

use super::expand::{CompiledSynonym, Phrase, SynonymTable};
use super::surface::SurfaceStage;
use super::{Analyzer, exempt, lemma, stem, stopword};
use crate::rules::{Diagnostic, ExemptKind, RulesError, Ruleset, SynonymKind, Term};

pub fn compile(ruleset: Ruleset) -> Result<Analyzer, RulesError> {
    let surface = SurfaceStage::from_pipeline(&ruleset.pipeline);
    let mut diagnostics = Vec::new();
    let one_form = |term: &Term, what: &str, diagnostics: &mut Vec<Diagnostic>| {
        single_form(&surface, term, what, diagnostics)
    };

    let stopwords = stopword::Stopwords::new(
        ruleset
            .pipeline
            .stopwords
            .iter()
            .filter_map(|t| one_form(t, "a stopword", &mut diagnostics)),
    );

    let mut literals = Vec::new();
    let mut patterns = Vec::new();
    for (i, rule) in ruleset.exemptions.iter().enumerate() {
        match &rule.kind {
            ExemptKind::Term(term) => {
                if let Some(form) = one_form(term, "an exempt term", &mut diagnostics) {
                    literals.push((form, i));
                }
            }
            ExemptKind::Pattern { regex, .. } => patterns.push((regex.clone(), i)),
        }
    }

    let mut lemma_map: FxHashMap<String, (String, usize)> = FxHashMap::default();
    let mut lemma_terms: HashMap<String, &Term> = HashMap::new();
    for (i, rule) in ruleset.lemmas.iter().enumerate() {
        let form = one_form(&rule.form, "an irregular form", &mut diagnostics);
        let lemma = one_form(&rule.lemma, "a lemma", &mut diagnostics);
        let (Some(form), Some(lemma)) = (form, lemma) else {
            continue;
        };
        if form == lemma {
            diagnostics.push(self_mapped(&rule.lemma, &form));
            continue;
        }
        match lemma_map.get(&form) {
            Some((previous, _)) if *previous != lemma => {
                let first = lemma_terms[&form];
                diagnostics.push(
                    Diagnostic::new(
                        &rule.form.origin.file,
                        Some(rule.form.origin.position()),
                        format!("{form:?} is given two lemmas: {previous:?} and {lemma:?}",),
                    )
                    .related(&first.origin.file, first.origin.position())
                    .help("a form has one lemma; keep the one you mean and remove the other"),
                );
            }
            Some(_) => {} // the same override twice: lint reports it as a duplicate
            None => {
                lemma_terms.insert(form.clone(), &rule.form);
                lemma_map.insert(form, (lemma, i));
            }
        }
    }

    let exemptions = match exempt::Exemptions::new(literals, patterns) {
        Ok(exemptions) => exemptions,
        Err(too_large) => {
            diagnostics.push(pattern_set_too_large(&ruleset, too_large));
            exempt::Exemptions::default()
        }
    };
    let mut analyzer = Analyzer {
        surface: surface.clone(),
        stopwords,
        exemptions,
        lemmas: lemma::Lemmas::new(lemma_map),
        stem: ruleset.pipeline.stemmer.map(stem::Stem::new),
        synonyms: SynonymTable::default(),
        ruleset: Arc::new(Ruleset::default()),
    };

    let mut compiled = Vec::with_capacity(ruleset.synonyms.len());
    for rule in &ruleset.synonyms {
        let mut phrase = |term: &Term| {
            let p = analyzer.phrase(&term.text);
            if p.keys.is_empty() {
                let at = Some(term.origin.position());
                diagnostics.push(if analyzer.surface.tokens(&term.text).is_empty() {
                    // Punctuation, symbols or emoji only: the tokenizer keeps nothing.
                    Diagnostic::new(
                        &term.origin.file,
                        at,
                        format!("{:?} holds no word the tokenizer keeps", term.text),
                    )
                    .help(
                        "write the member with letters or digits, or remove it \
                         (punctuation, symbols and emoji are not words to the tokenizer)",
                    )
                } else {
                    Diagnostic::new(
                        &term.origin.file,
                        at,
                        format!(
                            "{:?} has no words left after stopwords are dropped",
                            term.text
                        ),
                    )
                    .help("remove it from the rule, or take its words off the stopword list")
                });
            }
            p
        };
        let c = match &rule.kind {
            SynonymKind::Equivalent { members } => {
                CompiledSynonym::Equivalent(members.iter().map(&mut phrase).collect())
            }
            SynonymKind::OneWay { from, to } => CompiledSynonym::OneWay {
                from: phrase(from),
                to: to.iter().map(&mut phrase).collect(),
            },
        };
        compiled.push(c);
    }
    if !diagnostics.is_empty() {
        return Err(RulesError::Invalid(ruleset.attach_sources(diagnostics)));
    }
    analyzer.synonyms = SynonymTable::new(drop_empty(compiled));
    analyzer.ruleset = Arc::new(ruleset);
    Ok(analyzer)
}

/// Only reached without diagnostics, so no phrase is empty; kept total for safety.
fn drop_empty(rules: Vec<CompiledSynonym>) -> Vec<CompiledSynonym> {
    let keep = |p: &Phrase| !p.keys.is_empty();
    rules
        .into_iter()
        .map(|r| match r {
            CompiledSynonym::Equivalent(m) => {
                CompiledSynonym::Equivalent(m.into_iter().filter(keep).collect())
            }
            CompiledSynonym::OneWay { from, to } => CompiledSynonym::OneWay {
                from,
                to: to.into_iter().filter(keep).collect(),
            },
        })
        .collect()
}

/// The surface form of a term that must be one token (a stopword, an exempt term, a form
/// or lemma).
fn single_form(
    surface: &SurfaceStage,
    term: &Term,
    what: &str,
    diagnostics: &mut Vec<Diagnostic>,
) -> Option<String> {
    let tokens = surface.tokens(&term.text);
    match tokens.as_slice() {
        [one] => Some(one.form.clone()),
        [] => {
            diagnostics.push(
                Diagnostic::new(
                    &term.origin.file,
                    Some(term.origin.position()),
                    format!("{what} {:?} holds no word the tokenizer keeps", term.text),
                )
                .help("write a word made of letters or digits"),
            );
            None
        }
        many => {
            let forms: Vec<&str> = many.iter().map(|t| t.form.as_str()).collect();
            diagnostics.push(
                Diagnostic::new(
                    &term.origin.file,
                    Some(term.origin.position()),
                    format!(
                        "{what} is one token, but {:?} splits into {} ({})",
                        term.text,
                        many.len(),
                        forms.join(", ")
                    ),
                )
                .help("list each word on its own, or write a multi-word phrase as a synonym"),
            );
            None
        }
    }
}

fn pattern_set_too_large(ruleset: &Ruleset, err: exempt::PatternSetTooLarge) -> Diagnostic {
    let rule = &ruleset.exemptions[err.rule];
    let at = match &rule.kind {
        ExemptKind::Pattern { source, .. } => &source.origin,
        ExemptKind::Term(term) => &term.origin,
    };
    Diagnostic::new(
        &at.file,
        Some(at.position()),
        format!(
            "the {} exemption patterns are too large to compile together (over {} MiB); \
             they outgrow the limit at this one",
            err.patterns,
            exempt::PATTERN_SET_LIMIT >> 20
        ),
    )
    .help(
        "use fewer or simpler patterns: list fixed words as literal exemptions, \
         merge patterns that share a shape, avoid wide repetitions such as \\w{50}",
    )
}

fn self_mapped(lemma: &Term, form: &str) -> Diagnostic {
    Diagnostic::new(
        &lemma.origin.file,
        Some(lemma.origin.position()),
        format!("the lemma override maps {form:?} to itself once both are normalized"),
    )
    .help("remove it; lowercasing or accent folding already makes the two the same")
}
