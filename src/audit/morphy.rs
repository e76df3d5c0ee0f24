//! WordNet's morphy: the base forms of a word, as WordNet's own `morph.c` finds them.
//!
//! The published algorithm (WordNet 3.0, `morphy(7WN)`, `wndb(5WN)`, `lib/morph.c`): for
//! each part of speech, look the word up in that part's exception list (`noun.exc`,
//! `verb.exc`, `adj.exc`, `adv.exc`); if it is not there, apply the part's rules of
//! detachment (strip a suffix, add an ending) and keep the candidates that are lemmas in
//! `index.<pos>`. The word itself counts when it is a lemma of that part.
//!
//! Two deliberate differences from `morph.c`, both as in NLTK's `_morphy`: every
//! candidate is returned (`morph.c` stops at the first one that is defined), and the word
//! itself is checked alongside the exception list. Collocations (`ful` words, hyphenated
//! and multi-word phrases) are not handled: lexdelta asks only about single tokens.

use std::collections::BTreeSet;
use std::path::Path;

use rustc_hash::{FxHashMap, FxHashSet};

use super::AuditError;
use crate::import::wordnet::{ExceptionList, PartOfSpeech};

/// The rules of detachment from `morph.c` (`sufx` / `addr`), per part of speech.
const NOUN_RULES: &[(&str, &str)] = &[
    ("s", ""),
    ("ses", "s"),
    ("xes", "x"),
    ("zes", "z"),
    ("ches", "ch"),
    ("shes", "sh"),
    ("men", "man"),
    ("ies", "y"),
];
const VERB_RULES: &[(&str, &str)] = &[
    ("s", ""),
    ("ies", "y"),
    ("es", "e"),
    ("es", ""),
    ("ed", "e"),
    ("ed", ""),
    ("ing", "e"),
    ("ing", ""),
];
const ADJ_RULES: &[(&str, &str)] = &[("er", ""), ("est", ""), ("er", "e"), ("est", "e")];

const PARTS: [PartOfSpeech; 4] = [
    PartOfSpeech::Noun,
    PartOfSpeech::Verb,
    PartOfSpeech::Adj,
    PartOfSpeech::Adv,
];

fn rules(pos: PartOfSpeech) -> &'static [(&'static str, &'static str)] {
    match pos {
        PartOfSpeech::Noun => NOUN_RULES,
        PartOfSpeech::Verb => VERB_RULES,
        PartOfSpeech::Adj => ADJ_RULES,
        PartOfSpeech::Adv => &[],
    }
}

fn index_file(pos: PartOfSpeech) -> &'static str {
    match pos {
        PartOfSpeech::Noun => "index.noun",
        PartOfSpeech::Verb => "index.verb",
        PartOfSpeech::Adj => "index.adj",
        PartOfSpeech::Adv => "index.adv",
    }
}

/// One part of speech: its lemmas and its exception list.
#[derive(Debug, Default)]
struct Part {
    lemmas: FxHashSet<Box<str>>,
    exceptions: FxHashMap<Box<str>, Vec<Box<str>>>,
}

/// WordNet's lemma index and exception lists, loaded once.
#[derive(Debug, Default)]
pub struct Morphy {
    parts: Vec<(PartOfSpeech, Part)>,
}

impl Morphy {
    /// Loads `index.*` and `*.exc` from a WordNet `dict` directory.
    pub fn load(dir: &Path) -> Result<Self, AuditError> {
        let mut parts = Vec::new();
        for pos in PARTS {
            let path = dir.join(index_file(pos));
            let text = std::fs::read_to_string(&path)
                .map_err(|source| AuditError::WordNet { path, source })?;
            let exceptions = ExceptionList::read(dir, &[pos])?;
            parts.push((pos, Part::new(&text, exceptions)));
        }
        Ok(Morphy { parts })
    }

    /// Builds from in-memory text (tests): `(pos, index text, exception text)`.
    pub fn from_texts(texts: &[(PartOfSpeech, &str, &str)]) -> Result<Self, AuditError> {
        let mut parts = Vec::new();
        for &(pos, index, exc) in texts {
            let mut list = ExceptionList::default();
            list.add(Path::new(pos.file_name()), pos, exc)?;
            parts.push((pos, Part::new(index, list)));
        }
        Ok(Morphy { parts })
    }

    /// Whether WordNet knows `word` as a lemma of any part of speech.
    pub fn is_lemma(&self, word: &str) -> bool {
        self.parts.iter().any(|(_, p)| p.lemmas.contains(word))
    }

    /// The base forms of `word` across all parts of speech, sorted; empty when WordNet
    /// does not know the word.
    pub fn base_forms(&self, word: &str) -> BTreeSet<String> {
        let mut out = BTreeSet::new();
        for (pos, part) in &self.parts {
            part.collect(word, *pos, &mut out);
        }
        out
    }

    /// The base forms of `word` for one part of speech.
    pub fn base_forms_for(&self, word: &str, pos: PartOfSpeech) -> BTreeSet<String> {
        let mut out = BTreeSet::new();
        for (p, part) in &self.parts {
            if *p == pos {
                part.collect(word, pos, &mut out);
            }
        }
        out
    }
}

impl Part {
    fn new(index: &str, exceptions: ExceptionList) -> Self {
        // Each index line starts with the lemma; license lines start with a space.
        let lemmas = index
            .lines()
            .filter(|l| !l.starts_with(' '))
            .filter_map(|l| l.split(' ').next())
            .filter(|w| !w.is_empty())
            .map(Box::from)
            .collect();
        let exceptions = exceptions
            .entries
            .into_iter()
            .map(|(form, bases)| (form.into(), bases.into_iter().map(Box::from).collect()))
            .collect();
        Part { lemmas, exceptions }
    }

    fn collect(&self, word: &str, pos: PartOfSpeech, out: &mut BTreeSet<String>) {
        if self.lemmas.contains(word) {
            out.insert(word.to_string());
        }
        if let Some(bases) = self.exceptions.get(word) {
            out.extend(bases.iter().map(|b| b.to_string()));
            return;
        }
        // morph.c: nouns ending in "ss", and words of two letters or fewer, are not detached.
        if pos == PartOfSpeech::Noun && (word.ends_with("ss") || word.len() <= 2) {
            return;
        }
        for (suffix, ending) in rules(pos) {
            if let Some(stem) = word.strip_suffix(suffix) {
                let candidate = format!("{stem}{ending}");
                if !candidate.is_empty() && candidate != word && self.lemmas.contains(&*candidate) {
                    out.insert(candidate);
                }
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The real WordNet 3.0 files (Debian `wordnet-base`); the expected answers are what
    /// WordNet's own `wn` browser gives for these words (its base-form search runs morphy).
    fn wordnet() -> Option<Morphy> {
        Morphy::load(Path::new("/usr/share/wordnet")).ok()
    }

    fn bases(m: &Morphy, w: &str) -> Vec<String> {
        m.base_forms(w).into_iter().collect()
    }

    #[test]
    fn detachment_rules_on_wordnet_3_0() {
        let Some(m) = wordnet() else { return };
        // noun rule ies -> y (morph.c), "university" is in index.noun
        assert_eq!(bases(&m, "universities"), ["university"]);
        // a lemma is its own base (index.adj and index.noun hold "universal")
        assert_eq!(bases(&m, "universal"), ["universal"]);
        // verb rule ing -> e
        assert!(m.base_forms("operating").contains("operate"));
        assert!(!m.base_forms("operator").contains("operate"));
    }

    #[test]
    fn exception_lists_on_wordnet_3_0() {
        let Some(m) = wordnet() else { return };
        // verb.exc: "went go"; noun.exc: "mice mouse"
        assert!(m.base_forms("went").contains("go"));
        assert_eq!(bases(&m, "mice"), ["mouse"]);
    }

    #[test]
    fn rules_from_morph_c_on_a_tiny_dictionary() {
        // Hand-made index and exception text, to pin the rules without WordNet installed.
        let m = Morphy::from_texts(&[
            (
                PartOfSpeech::Noun,
                "box n 1\nglass n 1\nchurch n 1\n",
                "oxen ox\n",
            ),
            (PartOfSpeech::Verb, "hope v 1\nhop v 1\n", ""),
            (PartOfSpeech::Adj, "big a 1\nlarge a 1\n", "bigger big\n"),
        ])
        .unwrap();
        assert_eq!(bases(&m, "boxes"), ["box"]); // xes -> x
        assert_eq!(bases(&m, "churches"), ["church"]); // ches -> ch
        assert!(bases(&m, "glass").contains(&"glass".to_string())); // "ss" kept whole
        // ing -> e and ing -> "": morph.c stops at "hope", we keep every candidate
        assert_eq!(bases(&m, "hoping"), ["hop", "hope"]);
        assert_eq!(bases(&m, "hoped"), ["hop", "hope"]); // ed -> "" and ed -> e
        assert_eq!(bases(&m, "bigger"), ["big"]); // adj.exc before the rules
        assert_eq!(bases(&m, "larger"), ["large"]); // er -> e
        assert_eq!(bases(&m, "oxen"), ["ox"]);
        assert!(bases(&m, "zzyzx").is_empty());
    }
}
