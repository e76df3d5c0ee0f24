//! WordNet 3.0 exception lists (`verb.exc`, `noun.exc`, `adj.exc`, `adv.exc`): one
//! "inflected base [base…]" entry per line. Debian ships them in `wordnet-base`
//! under `/usr/share/wordnet/`.

use std::collections::{BTreeMap, BTreeSet};
use std::fmt::Write as _;
use std::path::{Path, PathBuf};

use serde::Serialize;

use crate::analysis::SurfaceStage;
use crate::analysis::tokenize::Tokenize;

/// The parts of speech WordNet keeps exception lists for.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Hash, Serialize, clap::ValueEnum)]
#[serde(rename_all = "lowercase")]
pub enum PartOfSpeech {
    Noun,
    Verb,
    Adj,
    Adv,
}

impl PartOfSpeech {
    pub fn file_name(self) -> &'static str {
        match self {
            PartOfSpeech::Noun => "noun.exc",
            PartOfSpeech::Verb => "verb.exc",
            PartOfSpeech::Adj => "adj.exc",
            PartOfSpeech::Adv => "adv.exc",
        }
    }
}

#[derive(Debug, thiserror::Error)]
pub enum ImportError {
    #[error(
        "cannot read {path}: {source}\n  help: install the WordNet 3.0 data (Debian: apt-get install wordnet-base), or give the directory that holds its dict files"
    )]
    Read {
        path: PathBuf,
        #[source]
        source: std::io::Error,
    },
    #[error("{path}:{line}: expected \"inflected base [base...]\", found {text:?}")]
    Malformed {
        path: PathBuf,
        line: usize,
        text: String,
    },
}

/// Inflected form → the base forms WordNet gives it, across the chosen parts of speech.
#[derive(Clone, Debug, Default)]
pub struct ExceptionList {
    pub entries: BTreeMap<String, BTreeSet<String>>,
    /// Lines read per part of speech.
    pub lines: BTreeMap<PartOfSpeech, usize>,
}

impl ExceptionList {
    /// Reads the exception lists for `parts` from a WordNet `dict` directory.
    pub fn read(dir: &Path, parts: &[PartOfSpeech]) -> Result<Self, ImportError> {
        let mut list = ExceptionList::default();
        for &pos in parts {
            let path = dir.join(pos.file_name());
            let text = std::fs::read_to_string(&path).map_err(|source| ImportError::Read {
                path: path.clone(),
                source,
            })?;
            list.add(&path, pos, &text)?;
        }
        Ok(list)
    }

    /// Adds one file's entries.
    pub fn add(&mut self, path: &Path, pos: PartOfSpeech, text: &str) -> Result<(), ImportError> {
        let mut count = 0;
        for (i, line) in text.lines().enumerate() {
            let mut fields = line.split_whitespace();
            let Some(form) = fields.next() else { continue };
            let bases: Vec<&str> = fields.collect();
            if bases.is_empty() {
                return Err(ImportError::Malformed {
                    path: path.to_path_buf(),
                    line: i + 1,
                    text: line.to_string(),
                });
            }
            count += 1;
            let entry = self.entries.entry(form.to_string()).or_default();
            entry.extend(bases.into_iter().map(str::to_string));
        }
        *self.lines.entry(pos).or_default() += count;
        Ok(())
    }
}

/// How to turn the list into rules.
#[derive(Clone, Debug)]
pub struct ImportOptions {
    /// Shown in the file's header comment.
    pub source_description: String,
    /// Surface stage of the ruleset the file joins: entries that are not one token there
    /// are skipped (they could never match a single token).
    pub surface: SurfaceStage,
}

impl Default for ImportOptions {
    fn default() -> Self {
        ImportOptions {
            source_description: "WordNet 3.0 exception lists".into(),
            surface: SurfaceStage {
                tokenize: Tokenize::Words,
                lowercase: true,
                fold_accents: false,
            },
        }
    }
}

/// The rule file's text and what went into it.
#[derive(Clone, Debug, Serialize)]
pub struct ImportResult {
    #[serde(skip)]
    pub yaml: String,
    /// (form, lemma) written, sorted by form.
    pub written: Vec<(String, String)>,
    /// Forms with several bases, skipped: (form, bases).
    pub ambiguous: Vec<(String, Vec<String>)>,
    /// Entries that are not a single word (multi-word, punctuation), skipped.
    pub not_one_word: Vec<String>,
    /// Entries whose form and base are the same once normalized.
    pub self_mapped: Vec<String>,
}

impl ImportResult {
    pub fn skipped(&self) -> usize {
        self.ambiguous.len() + self.not_one_word.len() + self.self_mapped.len()
    }
}

/// Decides every entry and renders the lemma-override file.
pub fn build_lemma_file(list: &ExceptionList, options: &ImportOptions) -> ImportResult {
    let mut result = ImportResult {
        yaml: String::new(),
        written: Vec::new(),
        ambiguous: Vec::new(),
        not_one_word: Vec::new(),
        self_mapped: Vec::new(),
    };
    let one_word = |text: &str| -> Option<String> {
        // WordNet joins the words of a collocation with `_`, which UAX #29 keeps inside a
        // word; such entries are multi-word and can never match one token.
        if text.contains('_') {
            return None;
        }
        let tokens = options.surface.tokens(text);
        match tokens.as_slice() {
            [t] if t.from == 0 && t.to == text.len() => Some(t.form.clone()),
            _ => None,
        }
    };
    for (form, bases) in &list.entries {
        let Some(form_key) = one_word(form) else {
            result.not_one_word.push(form.clone());
            continue;
        };
        let normalized: BTreeSet<Option<String>> = bases.iter().map(|b| one_word(b)).collect();
        if normalized.len() > 1 {
            result
                .ambiguous
                .push((form.clone(), bases.iter().cloned().collect()));
            continue;
        }
        match normalized.into_iter().next().flatten() {
            None => result.not_one_word.push(form.clone()),
            Some(base) if base == form_key => result.self_mapped.push(form.clone()),
            Some(base) => result.written.push((form_key, base)),
        }
    }
    result.written.sort();
    result.written.dedup();
    result.yaml = render(list, options, &result);
    result
}

fn render(list: &ExceptionList, options: &ImportOptions, result: &ImportResult) -> String {
    let mut out = String::new();
    let files: Vec<&str> = list.lines.keys().map(|p| p.file_name()).collect();
    let _ = writeln!(
        out,
        "# Lemma overrides imported from {} ({}) by `lexdelta import`.",
        options.source_description,
        files.join(", ")
    );
    let _ = writeln!(
        out,
        "# {} written; {} skipped: {} with several bases, {} not a single word, {} the same as their base.",
        result.written.len(),
        result.skipped(),
        result.ambiguous.len(),
        result.not_one_word.len(),
        result.self_mapped.len()
    );
    out.push_str(
        "# Review before use: every override here replaces the stemmer's view of a word.\n",
    );
    out.push_str("format: 1\nrevision: 1\n");
    if result.written.is_empty() {
        out.push_str("lemmas: []\n");
    } else {
        out.push_str("lemmas:\n");
        for (form, lemma) in &result.written {
            let _ = writeln!(
                out,
                "  - {{ form: {}, lemma: {} }}",
                quote(form),
                quote(lemma)
            );
        }
    }
    if !result.ambiguous.is_empty() {
        out.push_str("\n# Skipped, several bases (add the one you mean by hand):\n");
        for (form, bases) in &result.ambiguous {
            let _ = writeln!(out, "#   {form}: {}", bases.join(", "));
        }
    }
    out
}

/// Quotes a YAML scalar when a plain one could be read as something else.
fn quote(text: &str) -> String {
    let plain = text
        .chars()
        .all(|c| c.is_alphanumeric() || c == '\'' || c == '-')
        && !matches!(
            text,
            "yes" | "no" | "on" | "off" | "true" | "false" | "null" | "y" | "n" | "~"
        )
        && text.parse::<f64>().is_err();
    if plain {
        text.to_string()
    } else {
        format!("{text:?}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn list(verb: &str, noun: &str) -> ExceptionList {
        let mut l = ExceptionList::default();
        l.add(Path::new("verb.exc"), PartOfSpeech::Verb, verb)
            .unwrap();
        l.add(Path::new("noun.exc"), PartOfSpeech::Noun, noun)
            .unwrap();
        l
    }

    #[test]
    fn ambiguous_and_multiword_entries_are_skipped_and_listed() {
        let l = list(
            "left leave\nrode ride\nbore bear\n",
            "bore bore\naxes axe axis\nbad_hats bad_hat\n",
        );
        let r = build_lemma_file(&l, &ImportOptions::default());
        assert_eq!(
            r.written,
            [
                ("left".into(), "leave".into()),
                ("rode".into(), "ride".into())
            ]
        );
        assert_eq!(r.ambiguous.len(), 2, "{:?}", r.ambiguous); // axes, bore
        assert_eq!(r.not_one_word, ["bad_hats"]);
        assert!(r.yaml.contains("#   axes: axe, axis"));
    }

    #[test]
    fn the_output_is_a_loadable_rule_file() {
        let l = list("left leave\nno no\nyes yes\n", "");
        let r = build_lemma_file(&l, &ImportOptions::default());
        let ruleset = crate::rules::load_sources(
            "x",
            vec![crate::rules::SourceFile {
                name: "x.yaml".into(),
                text: r.yaml,
            }],
        )
        .unwrap();
        assert_eq!(ruleset.lemmas.len(), 1);
    }

    #[test]
    fn malformed_lines_are_reported_with_their_number() {
        let mut l = ExceptionList::default();
        let err = l
            .add(Path::new("verb.exc"), PartOfSpeech::Verb, "a b\nlonely\n")
            .unwrap_err();
        assert!(err.to_string().contains("verb.exc:2"), "{err}");
    }
}
