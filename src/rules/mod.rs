//! The rule-file format: types, loading with spans, and diagnostics.
//!
//! A [`Ruleset`] is what a directory of YAML rule files says, merged: one [`Pipeline`],
//! and lists of [`SynonymRule`]s, [`Exemption`]s and [`LemmaOverride`]s. Every rule keeps
//! its [`Origin`] (file, line, column) so lint findings and preview attributions point back
//! at the YAML. The format is described in `docs/rule-files.md`.

mod error;
pub mod gate;
mod git;
mod load;
mod schema;
pub mod yaml;

use std::collections::BTreeMap;
use std::fmt;
use std::sync::Arc;

use regex::Regex;
use serde::Serialize;

pub use error::{Diagnostic, RulesError};
pub use gate::{GateLimits, Limit, LimitKind, LimitValue};
pub use git::{load_at_revision, validate_revision};
pub use load::{SourceFile, load_dir, load_sources, read_sources};
pub use yaml::Position;

use crate::severity::Severity;

/// The one file-format version this build reads.
pub const FORMAT_VERSION: i64 = 1;

/// Where a rule (or a term of it) is written.
#[derive(Clone, Debug, PartialEq, Eq, PartialOrd, Ord, Hash, Serialize)]
pub struct Origin {
    pub file: Arc<str>,
    pub line: u32,
    pub column: u32,
}

impl Origin {
    pub fn new(file: &Arc<str>, at: Position) -> Self {
        Origin {
            file: Arc::clone(file),
            line: at.line,
            column: at.column,
        }
    }

    pub fn position(&self) -> Position {
        Position {
            line: self.line,
            column: self.column,
        }
    }
}

impl fmt::Display for Origin {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}:{}", self.file, self.line)
    }
}

/// A word or phrase as the user wrote it in a rule.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Term {
    pub text: String,
    pub origin: Origin,
}

/// What a rule may say about itself, whatever its kind.
#[derive(Clone, Debug, Serialize)]
pub struct RuleMeta {
    pub id: Option<String>,
    pub note: Option<String>,
    /// Where the rule starts (its first key).
    pub origin: Origin,
    /// Inline lint settings for this rule only.
    pub lint: Vec<LintOverride>,
}

impl RuleMeta {
    /// The rule's name in reports: its id, or its file and line.
    pub fn label(&self) -> String {
        match &self.id {
            Some(id) => id.clone(),
            None => self.origin.to_string(),
        }
    }
}

/// A check's level for one rule or for the whole ruleset: a severity, or silenced.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Level {
    Error,
    Warning,
    Info,
    Off,
}

impl Level {
    pub fn severity(self) -> Option<Severity> {
        match self {
            Level::Error => Some(Severity::Error),
            Level::Warning => Some(Severity::Warning),
            Level::Info => Some(Severity::Info),
            Level::Off => None,
        }
    }
}

/// `lint: [{check, severity, reason}]` on one rule.
#[derive(Clone, Debug, Serialize)]
pub struct LintOverride {
    pub check: Term,
    pub level: Level,
    pub reason: String,
}

/// A synonym rule: an equivalent set or a one-way rule.
#[derive(Clone, Debug, Serialize)]
pub struct SynonymRule {
    pub meta: RuleMeta,
    pub kind: SynonymKind,
}

#[derive(Clone, Debug, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum SynonymKind {
    /// All members are interchangeable.
    Equivalent { members: Vec<Term> },
    /// `from` also finds each of `to`; not the other way round.
    OneWay { from: Term, to: Vec<Term> },
}

impl SynonymRule {
    /// Every term the rule mentions, in the order written.
    pub fn terms(&self) -> Vec<&Term> {
        match &self.kind {
            SynonymKind::Equivalent { members } => members.iter().collect(),
            SynonymKind::OneWay { from, to } => std::iter::once(from).chain(to).collect(),
        }
    }
}

/// A surface form (or a pattern of them) that the lemma and stem stages leave alone.
#[derive(Clone, Debug, Serialize)]
pub struct Exemption {
    pub meta: RuleMeta,
    pub kind: ExemptKind,
}

#[derive(Clone, Debug, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum ExemptKind {
    Term(Term),
    /// A regex over the whole surface form.
    Pattern {
        source: Term,
        #[serde(skip)]
        regex: Regex,
    },
}

/// An irregular form and the lemma it stands for.
#[derive(Clone, Debug, Serialize)]
pub struct LemmaOverride {
    pub meta: RuleMeta,
    pub form: Term,
    pub lemma: Term,
}

/// A Snowball stemmer language, as rust-stemmers provides them.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Language {
    Arabic,
    Danish,
    Dutch,
    English,
    Finnish,
    French,
    German,
    Greek,
    Hungarian,
    Italian,
    Norwegian,
    Portuguese,
    Romanian,
    Russian,
    Spanish,
    Swedish,
    Tamil,
    Turkish,
}

impl Language {
    pub const ALL: [Language; 18] = [
        Language::Arabic,
        Language::Danish,
        Language::Dutch,
        Language::English,
        Language::Finnish,
        Language::French,
        Language::German,
        Language::Greek,
        Language::Hungarian,
        Language::Italian,
        Language::Norwegian,
        Language::Portuguese,
        Language::Romanian,
        Language::Russian,
        Language::Spanish,
        Language::Swedish,
        Language::Tamil,
        Language::Turkish,
    ];

    pub fn name(self) -> &'static str {
        match self {
            Language::Arabic => "arabic",
            Language::Danish => "danish",
            Language::Dutch => "dutch",
            Language::English => "english",
            Language::Finnish => "finnish",
            Language::French => "french",
            Language::German => "german",
            Language::Greek => "greek",
            Language::Hungarian => "hungarian",
            Language::Italian => "italian",
            Language::Norwegian => "norwegian",
            Language::Portuguese => "portuguese",
            Language::Romanian => "romanian",
            Language::Russian => "russian",
            Language::Spanish => "spanish",
            Language::Swedish => "swedish",
            Language::Tamil => "tamil",
            Language::Turkish => "turkish",
        }
    }

    pub fn from_name(name: &str) -> Option<Language> {
        Language::ALL.into_iter().find(|l| l.name() == name)
    }
}

/// How text becomes keys: the settings of the normalization contract.
#[derive(Clone, Debug, Serialize)]
pub struct Pipeline {
    /// `None` means no stemming.
    pub stemmer: Option<Language>,
    pub lowercase: bool,
    pub fold_accents: bool,
    pub stopwords: Vec<Term>,
    /// A regex that finds tokens, instead of Unicode word boundaries.
    pub token_pattern: Option<TokenPattern>,
    /// Where the `pipeline` section is written; `None` when defaults apply.
    pub origin: Option<Origin>,
}

#[derive(Clone, Debug, Serialize)]
pub struct TokenPattern {
    pub source: Term,
    #[serde(skip)]
    pub regex: Regex,
}

impl Default for Pipeline {
    fn default() -> Self {
        Pipeline {
            stemmer: Some(Language::English),
            lowercase: true,
            fold_accents: false,
            stopwords: Vec::new(),
            token_pattern: None,
            origin: None,
        }
    }
}

/// Ruleset-wide lint configuration (`lint:` section).
#[derive(Clone, Debug, Default, Serialize)]
pub struct LintSettings {
    /// Check name → level, with where it is set.
    pub checks: BTreeMap<String, (Level, Origin)>,
    pub max_group_size: Option<usize>,
    pub max_pattern_share: Option<f64>,
    pub origin: Option<Origin>,
}

/// Limits that `review` enforces (`gate:` section).
#[derive(Clone, Debug, Default, Serialize)]
pub struct GateSettings {
    pub limits: GateLimits,
    pub origin: Option<Origin>,
}

/// One file of a ruleset, as read.
#[derive(Clone, Debug, Serialize)]
pub struct FileInfo {
    /// The path as shown in diagnostics.
    pub name: Arc<str>,
    pub revision: u64,
    pub revision_origin: Origin,
    /// A hash of the file's bytes, to tell whether content changed.
    pub content_hash: String,
    /// The rule content with comments and the revision line set aside, hashed; what the
    /// revision check compares.
    pub rules_hash: String,
    /// The file's text, so later diagnostics can quote the source line.
    #[serde(skip)]
    pub text: Arc<str>,
}

/// A loaded ruleset: every file's rules, merged, each rule with its origin.
#[derive(Clone, Debug, Default, Serialize)]
pub struct Ruleset {
    /// The directory (or `rev:dir`) it was loaded from, for reports.
    pub source: String,
    pub files: Vec<FileInfo>,
    pub pipeline: Pipeline,
    pub synonyms: Vec<SynonymRule>,
    pub exemptions: Vec<Exemption>,
    pub lemmas: Vec<LemmaOverride>,
    pub lint: LintSettings,
    pub gate: GateSettings,
}

impl Ruleset {
    /// Quotes the source line under each diagnostic that points into this ruleset.
    pub fn attach_sources(&self, diagnostics: Vec<Diagnostic>) -> Vec<Diagnostic> {
        diagnostics
            .into_iter()
            .map(|d| match self.files.iter().find(|f| *f.name == *d.file) {
                Some(file) if d.source_line.is_none() => d.with_source(&file.text),
                _ => d,
            })
            .collect()
    }

    /// Every rule's meta, in a stable order: synonyms, exemptions, lemmas.
    pub fn all_meta(&self) -> impl Iterator<Item = &RuleMeta> {
        self.synonyms
            .iter()
            .map(|r| &r.meta)
            .chain(self.exemptions.iter().map(|r| &r.meta))
            .chain(self.lemmas.iter().map(|r| &r.meta))
    }
}
