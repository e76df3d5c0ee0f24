//! lexdelta: change a search engine's text-normalization rules safely.
//!
//! Whoever owns a search box keeps the rules that decide which words match — synonym sets,
//! terms the stemmer must leave alone, lemma overrides for irregular forms. This crate
//! loads those rules from versioned YAML files, compiles them into one [`Analyzer`], and
//! lets every other part (trace, lint, preview, review, audit) share that analyzer.
//!
//! # The model
//!
//! A **ruleset** ([`rules::Ruleset`]) is a directory of YAML rule files; every loaded rule
//! keeps its file, line and column. Compiling it yields one [`Analyzer`], the single
//! implementation of normalization. The analyzer maps text to **keys**: for fixed surface
//! settings (tokenizer, case, accents), everything after tokenization is a pure function
//! from a **surface form** to a key, or to "dropped" for a stopword
//! ([`Analyzer::key`]). Surface forms that share a key are a **conflation group**.
//!
//! The normalization contract, in order:
//!
//! 1. tokenize — Unicode word boundaries (UAX #29), or the ruleset's regex;
//! 2. lowercase — unless the ruleset keeps case;
//! 3. fold accents — NFKD, combining marks removed, if asked;
//! 4. stopword — dropped, its position kept;
//! 5. exemption — an exempt form is its own key;
//! 6. lemma override — an irregular form becomes its lemma;
//! 7. stem — Snowball (rust-stemmers), unless the lemma is exempt;
//! 8. expand (query side) — synonym rules, themselves normalized through 1–7, so rules
//!    speak in keys.
//!
//! # Example
//!
//! ```
//! use lexdelta::analysis::{Analyzer, Side};
//! use lexdelta::rules::{load_sources, SourceFile};
//!
//! let text = "format: 1\nrevision: 1\nexempt: [universal]\nlemmas:\n  - {form: rode, lemma: ride}\n";
//! let ruleset = load_sources("rules", vec![SourceFile { name: "r.yaml".into(), text: text.into() }])?;
//! let analyzer = Analyzer::new(ruleset)?;
//!
//! assert_eq!(analyzer.key("rode").as_deref(), Some("ride"));        // lemma override
//! assert_eq!(analyzer.key("universal").as_deref(), Some("universal")); // exempt
//! assert_eq!(analyzer.key("university").as_deref(), Some("univers"));  // Snowball English
//!
//! let trace = analyzer.trace("She rode", Side::Index);
//! assert_eq!(trace.tokens[1].key.as_deref(), Some("ride"));
//! # Ok::<(), lexdelta::rules::RulesError>(())
//! ```
//!
//! # Modules
//!
//! - [`rules`]: the rule-file format, loading with spans, diagnostics, git revisions.
//! - [`analysis`]: the analyzer, one file per stage, the trace, the tantivy adapter.
//! - [`corpus`]: the one input layer: documents (JSON Lines, CSV, a directory of text
//!   files), query logs, judgments, each format read from the content; named fields
//!   checked against the documents; the corpus vocabulary every command shares.
//! - [`lint`]: the term graph and one check per file: contradictions and hazards in rules.
//! - [`import`]: published irregular-form lists (WordNet) as lemma overrides.
//! - [`metrics`]: precision, recall, reciprocal rank, AP, nDCG, RBO, significance.

pub mod analysis;
pub mod atomic;
pub mod audit;
pub mod corpus;
pub mod import;
pub mod index;
pub mod lint;
pub mod metrics;
pub mod preview;
pub mod report;
pub mod review;
pub mod rules;
pub mod severity;

pub use analysis::Analyzer;
