//! The analyzer: the one implementation of the normalization contract.
//!
//! Indexing, querying, `trace`, lint and every report call the same [`Analyzer`]. The
//! contract, in order: [`tokenize`] (1), [`lowercase`] (2), [`fold`] (3) — together the
//! [`surface`] stage — then [`stopword`] (4), [`exempt`] (5), [`lemma`] (6), [`stem`] (7)
//! and, on the query side, [`expand`] (8). Steps 4–7 are a pure function of the surface
//! form ([`Analyzer::key`]); every stage reports what it did to an [`Observer`], which costs
//! nothing on the hot path (the unit observer) and records a [`trace::Trace`] for people.

mod compile;
pub mod exempt;
pub mod expand;
pub mod fold;
pub mod lemma;
pub mod lowercase;
pub mod stem;
pub mod stopword;
pub mod surface;
pub mod tantivy;
pub mod tokenize;
pub mod trace;

use std::borrow::Cow;
use std::path::Path;
use std::sync::Arc;

use serde::Serialize;

pub use expand::{Alternative, CompiledSynonym, Expansion, Phrase, SynonymTable};
pub use surface::{SurfaceStage, SurfaceToken};

use crate::rules::{self, Origin, RuleMeta, RulesError, Ruleset};

/// A rule that a stage applied: an index into the ruleset's lists, or its stopword list.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(tag = "section", content = "index", rename_all = "snake_case")]
pub enum RuleRef {
    Synonym(usize),
    Exempt(usize),
    Lemma(usize),
    Stopwords,
}

/// The stages of the contract, in order.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Stage {
    Tokenize,
    Lowercase,
    FoldAccents,
    Stopword,
    Exempt,
    Lemma,
    Stem,
    Expand,
}

impl Stage {
    pub fn name(self) -> &'static str {
        match self {
            Stage::Tokenize => "tokenize",
            Stage::Lowercase => "lowercase",
            Stage::FoldAccents => "fold accents",
            Stage::Stopword => "stopword",
            Stage::Exempt => "exempt",
            Stage::Lemma => "lemma",
            Stage::Stem => "stem",
            Stage::Expand => "expand",
        }
    }
}

/// Receives each step of the key stages. `()` ignores them.
pub trait Observer {
    fn step(&mut self, stage: Stage, output: &str, rule: Option<RuleRef>, note: &'static str);
}

impl Observer for () {
    #[inline]
    fn step(&mut self, _: Stage, _: &str, _: Option<RuleRef>, _: &'static str) {}
}

/// Which side of the search a text is analyzed for.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, clap::ValueEnum)]
#[serde(rename_all = "lowercase")]
pub enum Side {
    /// Documents: keys only.
    Index,
    /// Queries: keys, then synonym expansion.
    Query,
}

/// A token after the whole contract: its key, offsets and position.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct KeyToken {
    pub key: String,
    pub from: usize,
    pub to: usize,
    pub position: u32,
}

/// A query after analysis and expansion.
#[derive(Clone, Debug, Serialize)]
pub struct AnalyzedQuery {
    /// The keyed tokens `(position, key)`; stopwords are left out.
    pub keys: Vec<(u32, String)>,
    /// The stretches of `keys`, each with its alternatives.
    pub expansions: Vec<Expansion>,
}

/// The compiled ruleset: stages configured, rule terms normalized into keys.
#[derive(Clone, Debug)]
pub struct Analyzer {
    ruleset: Arc<Ruleset>,
    surface: SurfaceStage,
    stopwords: stopword::Stopwords,
    exemptions: exempt::Exemptions,
    lemmas: lemma::Lemmas,
    stem: Option<stem::Stem>,
    synonyms: SynonymTable,
}

impl Analyzer {
    /// Compiles a ruleset; rule terms that cannot be normalized as written are reported
    /// with their location.
    pub fn new(ruleset: Ruleset) -> Result<Self, RulesError> {
        compile::compile(ruleset)
    }

    /// Loads and compiles the ruleset in a directory.
    pub fn load(dir: &Path) -> Result<Self, RulesError> {
        Analyzer::new(rules::load_dir(dir)?)
    }

    pub fn ruleset(&self) -> &Ruleset {
        &self.ruleset
    }

    pub fn surface(&self) -> &SurfaceStage {
        &self.surface
    }

    pub fn synonyms(&self) -> &SynonymTable {
        &self.synonyms
    }

    pub fn stemmer_name(&self) -> &'static str {
        self.stem.as_ref().map_or("none", |s| s.language().name())
    }

    /// Steps 4–7: the key of a surface form, or `None` for a stopword.
    #[inline]
    pub fn key<'a>(&'a self, form: &'a str) -> Option<Cow<'a, str>> {
        self.key_with(form, &mut ())
    }

    /// Steps 4–7 without the stopword stage: what a form would key to if it were not a
    /// stopword (lint uses this to name the key a stopword member would have had).
    pub fn key_ignoring_stopwords<'a>(&'a self, form: &'a str) -> Cow<'a, str> {
        self.key_after_stopwords(form, &mut ())
    }

    /// Steps 4–7, reporting each step to `observer`.
    pub fn key_with<'a, O: Observer>(
        &'a self,
        form: &'a str,
        observer: &mut O,
    ) -> Option<Cow<'a, str>> {
        if self.stopwords.is_stopword(form) {
            observer.step(Stage::Stopword, "", Some(RuleRef::Stopwords), "dropped");
            return None;
        }
        Some(self.key_after_stopwords(form, observer))
    }

    fn key_after_stopwords<'a, O: Observer>(
        &'a self,
        form: &'a str,
        observer: &mut O,
    ) -> Cow<'a, str> {
        if let Some(rule) = self.exemptions.rule_for(form) {
            observer.step(
                Stage::Exempt,
                form,
                Some(RuleRef::Exempt(rule)),
                "exempt: kept as written",
            );
            return Cow::Borrowed(form);
        }
        let lemma = match self.lemmas.lookup(form) {
            Some((lemma, rule)) => {
                observer.step(
                    Stage::Lemma,
                    lemma,
                    Some(RuleRef::Lemma(rule)),
                    "irregular form replaced by its lemma",
                );
                if let Some(rule) = self.exemptions.rule_for(lemma) {
                    observer.step(
                        Stage::Stem,
                        lemma,
                        Some(RuleRef::Exempt(rule)),
                        "the lemma is exempt: not stemmed",
                    );
                    return Cow::Borrowed(lemma);
                }
                lemma
            }
            None => form,
        };
        match &self.stem {
            Some(stem) => {
                let key = stem.stem(lemma);
                let note = if key == lemma {
                    "unchanged by the stemmer"
                } else {
                    "stemmed"
                };
                observer.step(Stage::Stem, &key, None, note);
                key
            }
            None => {
                observer.step(Stage::Stem, lemma, None, "no stemmer");
                Cow::Borrowed(lemma)
            }
        }
    }

    /// Index side: every token's key, stopwords left out (their positions stay taken).
    pub fn index_tokens(&self, text: &str) -> Vec<KeyToken> {
        let mut out = Vec::new();
        self.surface.for_each(text, |span, form| {
            if let Some(key) = self.key(&form) {
                out.push(KeyToken {
                    key: key.into_owned(),
                    from: span.from,
                    to: span.to,
                    position: span.position,
                });
            }
        });
        out
    }

    /// A text's keys with positions relative to its first token (how rule terms are
    /// compiled, and how a phrase is looked up).
    pub fn phrase(&self, text: &str) -> Phrase {
        let mut keys = Vec::new();
        let mut base = None;
        self.surface.for_each(text, |span, form| {
            if let Some(key) = self.key(&form) {
                let base = *base.get_or_insert(span.position);
                keys.push((span.position - base, key.into_owned()));
            }
        });
        Phrase { keys }
    }

    /// Query side: keys, then synonym expansion.
    pub fn analyze_query(&self, text: &str) -> AnalyzedQuery {
        let keys: Vec<(u32, String)> = self
            .index_tokens(text)
            .into_iter()
            .map(|t| (t.position, t.key))
            .collect();
        let borrowed: Vec<(u32, &str)> = keys.iter().map(|(p, k)| (*p, k.as_str())).collect();
        let expansions = self.synonyms.expand(&borrowed);
        AnalyzedQuery { keys, expansions }
    }

    /// The rule's id and note, and where it is written.
    pub fn rule_meta(&self, rule: RuleRef) -> Option<&RuleMeta> {
        match rule {
            RuleRef::Synonym(i) => self.ruleset.synonyms.get(i).map(|r| &r.meta),
            RuleRef::Exempt(i) => self.ruleset.exemptions.get(i).map(|r| &r.meta),
            RuleRef::Lemma(i) => self.ruleset.lemmas.get(i).map(|r| &r.meta),
            RuleRef::Stopwords => None,
        }
    }

    /// A rule's name in reports (its id, or its file and line).
    pub fn rule_label(&self, rule: RuleRef) -> String {
        match rule {
            RuleRef::Stopwords => "stopwords".to_string(),
            _ => self
                .rule_meta(rule)
                .map_or_else(|| "?".into(), RuleMeta::label),
        }
    }

    /// Where a rule is written.
    pub fn rule_origin(&self, rule: RuleRef) -> Option<&Origin> {
        match rule {
            RuleRef::Stopwords => self.ruleset.pipeline.origin.as_ref(),
            _ => self.rule_meta(rule).map(|m| &m.origin),
        }
    }

    /// The exemption rule that protects a surface form, if any.
    pub fn is_exempt(&self, form: &str) -> Option<usize> {
        self.exemptions.rule_for(form)
    }

    /// The lemma override for a surface form, if any: (lemma, rule index).
    pub fn lemma_of(&self, form: &str) -> Option<(&str, usize)> {
        self.lemmas.lookup(form)
    }

    /// Whether a surface form is on the stopword list.
    pub fn is_stopword(&self, form: &str) -> bool {
        self.stopwords.is_stopword(form)
    }

    /// Whether no rule names `form` (stopword, exemption or lemma override), so its key is
    /// the stemmer's alone: two analyzers with the same stemmer give it the same key.
    pub fn stems_plainly(&self, form: &str) -> bool {
        !self.is_stopword(form) && self.is_exempt(form).is_none() && self.lemma_of(form).is_none()
    }

    /// The stemmer alone applied to `form` (the form itself without a stemmer): the key of
    /// a form no rule names.
    pub fn stem_alone<'a>(&self, form: &'a str) -> Cow<'a, str> {
        match &self.stem {
            Some(stem) => stem.stem(form),
            None => Cow::Borrowed(form),
        }
    }

    /// Names this analyzer's stemmer and its behaviour, for keeping stems on disk: the
    /// language, this build's version, and a hash of the stems of a fixed list of words,
    /// so stems kept by a build whose stemmer behaves otherwise are never reused.
    pub fn stemmer_id(&self) -> String {
        const PROBE: &[&str] = &[
            "running",
            "generously",
            "relational",
            "conditional",
            "hopefulness",
            "universities",
            "caresses",
            "ponies",
            "agreed",
            "feudalism",
            "sensitivity",
            "electrical",
            "adjustment",
            "controlling",
            "rolling",
            "möglichkeiten",
            "continuité",
            "bibliotecas",
            "ёлка",
            "kirjastossa",
        ];
        let mut hasher = blake3::Hasher::new();
        for word in PROBE {
            hasher.update(self.stem_alone(word).as_bytes());
            hasher.update(b"\n");
        }
        format!(
            "{}-{}-{}",
            self.stemmer_name(),
            env!("CARGO_PKG_VERSION"),
            &hasher.finalize().to_hex()[..12]
        )
    }

    /// Whether both analyzers stem with the same algorithm (or neither stems).
    pub fn same_stemmer(&self, other: &Analyzer) -> bool {
        self.ruleset.pipeline.stemmer == other.ruleset.pipeline.stemmer
    }
}

#[cfg(test)]
pub(crate) mod tests {
    use super::*;
    use crate::rules::{SourceFile, load_sources};

    pub(crate) fn analyzer(yaml: &str) -> Analyzer {
        let text = format!("format: 1\nrevision: 1\n{yaml}");
        let ruleset = load_sources(
            "test",
            vec![SourceFile {
                name: "test.yaml".into(),
                text,
            }],
        )
        .unwrap();
        Analyzer::new(ruleset).unwrap()
    }

    #[test]
    fn exempt_shields_from_lemma_and_stem() {
        let a = analyzer(
            "exempt: [left]\nlemmas:\n  - {form: left, lemma: leave}\n  - {form: mice, lemma: mouse}\n",
        );
        assert_eq!(a.key("left").unwrap(), "left");
        assert_eq!(a.key("mice").unwrap(), "mous");
        assert_eq!(a.key("mouse").unwrap(), "mous");
    }

    #[test]
    fn an_exempt_lemma_is_the_key_of_its_forms() {
        let a = analyzer("exempt: [mouse]\nlemmas:\n  - {form: mice, lemma: mouse}\n");
        assert_eq!(a.key("mice").unwrap(), "mouse");
        assert_eq!(a.key("mouse").unwrap(), "mouse");
    }

    #[test]
    fn stopwords_drop_but_keep_their_position() {
        let a = analyzer("pipeline:\n  stemmer: english\n  stopwords: [and]\n");
        let tokens = a.index_tokens("Park and Ride");
        assert_eq!(tokens.len(), 2);
        assert_eq!(tokens[1].position, 2);
        assert_eq!(tokens[1].key, "ride");
    }

    #[test]
    fn rules_speak_in_keys() {
        let a = analyzer("synonyms:\n  - equivalent: [Universe, cosmos]\n");
        let q = a.analyze_query("university");
        let alts: Vec<String> = q.expansions[0]
            .alternatives
            .iter()
            .map(|x| x.phrase.display())
            .collect();
        assert_eq!(alts, ["univers", "cosmos"]);
    }
}
