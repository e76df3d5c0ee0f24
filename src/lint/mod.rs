//! Lint: find contradictions and hazards in a ruleset before anyone runs it.
//!
//! [`lint`] builds the [`TermGraph`] of a compiled ruleset, runs every check in
//! [`checks::ALL`] (one file per check, each with its name, default severity and
//! explanation), applies the configured levels, and returns a [`LintReport`] with the
//! findings sorted by file, line, column, check and message. A [`Vocabulary`] (surface forms
//! with document and search counts) lets the checks that judge rules against real text run;
//! a base ruleset lets the revision check compare files.
//!
//! # Levels
//!
//! A finding starts at its check's default severity. Then, each later step winning:
//! the ruleset's `lint.checks`, the caller's [`LintConfig`] (the command line's `--level`),
//! and last the `lint:` overrides written on the finding's own rule, since those are
//! reviewed exceptions with a reason. `off` silences: silenced findings are counted, not
//! kept.
//!
//! ```
//! use lexdelta::Analyzer;
//! use lexdelta::lint::{LintConfig, LintInput, Vocabulary, lint};
//! use lexdelta::rules::{SourceFile, load_sources};
//!
//! let text = "format: 1\nrevision: 1\nsynonyms:\n  - equivalent: [universal, accessible]\n";
//! let ruleset = load_sources("rules", vec![SourceFile { name: "s.yaml".into(), text: text.into() }])?;
//! let analyzer = Analyzer::new(ruleset)?;
//! let vocabulary = Vocabulary::from_texts(
//!     analyzer.surface(),
//!     ["Universal design", "University passes"],
//!     [("university pass", 120)],
//! );
//! let config = LintConfig::default();
//! let report = lint(&analyzer, &LintInput { vocabulary: Some(&vocabulary), base: None, config: &config });
//! let side_effect = report.findings.iter().find(|f| f.check == "stem-side-effect").unwrap();
//! assert_eq!(side_effect.forms[0].form, "university");
//! # Ok::<(), lexdelta::rules::RulesError>(())
//! ```

pub mod checks;
pub mod graph;
pub mod inflection;
pub mod terms;
pub mod vocabulary;

use serde::Serialize;

pub use crate::corpus::{FormStats, Vocabulary, VocabularySummary};
pub use checks::{CheckInfo, Needs};
pub use graph::TermGraph;
pub use terms::{RuleTerm, Word};
pub use vocabulary::KeyedVocabulary;

use crate::analysis::{Analyzer, RuleRef};
use crate::rules::{Level, Origin, Ruleset};
use crate::severity::Severity;

/// Used by `oversized-group` when the ruleset does not set `lint.max_group_size`.
pub const DEFAULT_MAX_GROUP_SIZE: usize = 10;
/// Used by `exempt-pattern-coverage` when the ruleset does not set `lint.max_pattern_share`.
pub const DEFAULT_MAX_PATTERN_SHARE: f64 = 0.05;

/// A second place a finding involves.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Related {
    pub origin: Origin,
    pub note: String,
    /// The rule written there, if any (the graph export highlights it).
    #[serde(skip)]
    pub rule: Option<RuleRef>,
}

/// A surface form from the vocabulary, with its counts.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct FormCount {
    pub form: String,
    pub documents: u64,
    pub searches: u64,
    /// The lemma override that gives the form its key, when one does.
    pub via: Option<String>,
}

/// One problem, pointing at the YAML that causes it.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Finding {
    pub check: &'static str,
    pub severity: Severity,
    pub message: String,
    /// The primary location: per-rule `lint:` overrides of the rule written here apply.
    pub origin: Origin,
    /// The label of the rule at `origin` (its id, or file:line), if the finding is about one.
    pub rule: Option<String>,
    #[serde(skip)]
    pub rule_ref: Option<RuleRef>,
    pub related: Vec<Related>,
    pub help: Option<String>,
    /// The terms or keys the finding is about: a cycle in order, a merged group, a chain.
    pub members: Vec<String>,
    /// Vocabulary evidence, most searched first.
    pub forms: Vec<FormCount>,
}

impl Finding {
    /// A finding of `check` at `origin`, at the check's default severity.
    pub fn new(check: &CheckInfo, origin: &Origin, message: impl Into<String>) -> Self {
        Finding {
            check: check.name,
            severity: check.severity,
            message: message.into(),
            origin: origin.clone(),
            rule: None,
            rule_ref: None,
            related: Vec::new(),
            help: None,
            members: Vec::new(),
            forms: Vec::new(),
        }
    }

    /// The rule the finding is about (its per-rule overrides apply).
    pub fn on_rule(mut self, analyzer: &Analyzer, rule: RuleRef) -> Self {
        self.rule = Some(analyzer.rule_label(rule));
        self.rule_ref = Some(rule);
        self
    }

    pub fn related(
        mut self,
        origin: &Origin,
        note: impl Into<String>,
        rule: Option<RuleRef>,
    ) -> Self {
        self.related.push(Related {
            origin: origin.clone(),
            note: note.into(),
            rule,
        });
        self
    }

    pub fn help(mut self, help: impl Into<String>) -> Self {
        self.help = Some(help.into());
        self
    }

    pub fn members(mut self, members: Vec<String>) -> Self {
        self.members = members;
        self
    }

    pub fn forms(mut self, forms: Vec<FormCount>) -> Self {
        self.forms = forms;
        self
    }

    /// `file:line:column`.
    pub fn location(&self) -> String {
        format!(
            "{}:{}:{}",
            self.origin.file, self.origin.line, self.origin.column
        )
    }

    fn sort_key(&self) -> (&str, u32, u32, &str, &str) {
        (
            &self.origin.file,
            self.origin.line,
            self.origin.column,
            self.check,
            &self.message,
        )
    }
}

/// A check name the caller asked for that lint does not know.
#[derive(Clone, Debug, PartialEq, Eq, thiserror::Error)]
#[error("there is no lint check named {name:?}{}", suggestion_text(.suggestion))]
pub struct UnknownCheck {
    pub name: String,
    pub suggestion: Option<&'static str>,
}

fn suggestion_text(suggestion: &Option<&'static str>) -> String {
    match suggestion {
        Some(s) => format!("; did you mean {s:?}?"),
        None => "; `lexdelta lint --list-checks` lists them".to_string(),
    }
}

/// Levels set by the caller for this run (the command line's `--level NAME=LEVEL`).
#[derive(Clone, Debug, Default)]
pub struct LintConfig {
    levels: Vec<(&'static str, Level)>,
}

impl LintConfig {
    /// Checks each name; the last level given for a check wins.
    pub fn with_levels<I, S>(levels: I) -> Result<Self, UnknownCheck>
    where
        I: IntoIterator<Item = (S, Level)>,
        S: AsRef<str>,
    {
        let mut out = Vec::new();
        for (name, level) in levels {
            let name = name.as_ref();
            match checks::find(name) {
                Some(info) => out.push((info.name, level)),
                None => {
                    return Err(UnknownCheck {
                        name: name.to_string(),
                        suggestion: checks::closest(name),
                    });
                }
            }
        }
        Ok(LintConfig { levels: out })
    }

    fn level_of(&self, check: &str) -> Option<Level> {
        self.levels
            .iter()
            .rev()
            .find(|(n, _)| *n == check)
            .map(|(_, l)| *l)
    }
}

/// What lint is given besides the analyzer.
#[derive(Clone, Copy, Debug)]
pub struct LintInput<'a> {
    /// Surface forms of a corpus and a query log, for the checks that need real text.
    pub vocabulary: Option<&'a Vocabulary>,
    /// The ruleset before the change, for the revision check.
    pub base: Option<&'a Ruleset>,
    pub config: &'a LintConfig,
}

/// A check that did not run, and why.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Skipped {
    pub check: &'static str,
    pub reason: &'static str,
}

/// Findings per severity.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Serialize)]
pub struct Counts {
    pub error: usize,
    pub warning: usize,
    pub info: usize,
}

/// Everything one lint run found.
#[derive(Clone, Debug, Serialize)]
pub struct LintReport {
    /// The ruleset's directory, as given.
    pub ruleset: String,
    pub findings: Vec<Finding>,
    pub counts: Counts,
    /// Findings a level of `off` silenced: counted, not shown.
    pub silenced: usize,
    pub skipped: Vec<Skipped>,
    pub vocabulary: Option<VocabularySummary>,
    /// The graph the checks looked at (exported as DOT on request).
    #[serde(skip)]
    pub graph: TermGraph,
}

impl LintReport {
    /// Whether any finding is at `severity` or above.
    pub fn has_at_least(&self, severity: Severity) -> bool {
        self.findings.iter().any(|f| f.severity >= severity)
    }
}

/// Everything a check may look at.
pub struct Context<'a> {
    pub analyzer: &'a Analyzer,
    pub ruleset: &'a Ruleset,
    pub graph: &'a TermGraph,
    /// Every synonym rule's terms, normalized once, indexed like the ruleset's `synonyms`.
    pub terms: &'a [Vec<RuleTerm<'a>>],
    pub vocabulary: Option<&'a KeyedVocabulary<'a>>,
    pub base: Option<&'a Ruleset>,
    pub max_group_size: usize,
    pub max_pattern_share: f64,
}

/// Runs every check on a compiled ruleset.
pub fn lint(analyzer: &Analyzer, input: &LintInput) -> LintReport {
    let ruleset = analyzer.ruleset();
    let terms = terms::rule_terms(analyzer);
    let graph = TermGraph::from_terms(analyzer, &terms);
    let keyed = input.vocabulary.map(|v| KeyedVocabulary::new(v, analyzer));
    let cx = Context {
        analyzer,
        ruleset,
        graph: &graph,
        terms: &terms,
        vocabulary: keyed.as_ref(),
        base: input.base,
        max_group_size: ruleset
            .lint
            .max_group_size
            .unwrap_or(DEFAULT_MAX_GROUP_SIZE),
        max_pattern_share: ruleset
            .lint
            .max_pattern_share
            .unwrap_or(DEFAULT_MAX_PATTERN_SHARE),
    };
    let mut raw = Vec::new();
    let mut skipped = Vec::new();
    for check in checks::ALL {
        match check.info.needs {
            Needs::Vocabulary if cx.vocabulary.is_none() => skipped.push(Skipped {
                check: check.info.name,
                reason: "needs a vocabulary (a corpus or a query log)",
            }),
            Needs::Base if cx.base.is_none() => skipped.push(Skipped {
                check: check.info.name,
                reason: "needs the ruleset before the change",
            }),
            _ => (check.run)(&cx, &mut raw),
        }
    }
    let (mut findings, silenced) = apply_levels(raw, analyzer, input.config);
    findings.sort_by(|a, b| a.sort_key().cmp(&b.sort_key()));
    findings.dedup();
    let mut counts = Counts::default();
    for f in &findings {
        match f.severity {
            Severity::Error => counts.error += 1,
            Severity::Warning => counts.warning += 1,
            Severity::Info => counts.info += 1,
        }
    }
    LintReport {
        ruleset: ruleset.source.clone(),
        findings,
        counts,
        silenced,
        skipped,
        vocabulary: input.vocabulary.map(Vocabulary::summary),
        graph,
    }
}

/// Resolves each finding's level; returns the findings kept and how many were silenced.
fn apply_levels(
    raw: Vec<Finding>,
    analyzer: &Analyzer,
    config: &LintConfig,
) -> (Vec<Finding>, usize) {
    let mut kept = Vec::with_capacity(raw.len());
    let mut silenced = 0;
    for mut finding in raw {
        match level_for(&finding, analyzer, config).severity() {
            Some(severity) => {
                finding.severity = severity;
                kept.push(finding);
            }
            None => silenced += 1,
        }
    }
    (kept, silenced)
}

/// Default, then the ruleset's `lint.checks`, then the caller's levels, then the rule's own
/// `lint:` overrides.
fn level_for(finding: &Finding, analyzer: &Analyzer, config: &LintConfig) -> Level {
    let mut level = level_of_severity(finding.severity);
    if let Some((l, _)) = analyzer.ruleset().lint.checks.get(finding.check) {
        level = *l;
    }
    if let Some(l) = config.level_of(finding.check) {
        level = l;
    }
    let own = finding.rule_ref.and_then(|r| analyzer.rule_meta(r));
    if let Some(o) = own.and_then(|m| m.lint.iter().rev().find(|o| o.check.text == finding.check)) {
        level = o.level;
    }
    level
}

fn level_of_severity(severity: Severity) -> Level {
    match severity {
        Severity::Error => Level::Error,
        Severity::Warning => Level::Warning,
        Severity::Info => Level::Info,
    }
}

/// `"a", "b" and "c"`: terms quoted, for messages.
pub(crate) fn quoted_list<S: AsRef<str>>(items: &[S]) -> String {
    let quoted: Vec<String> = items.iter().map(|s| format!("{:?}", s.as_ref())).collect();
    match quoted.as_slice() {
        [] => String::new(),
        [one] => one.clone(),
        [init @ .., last] => format!("{} and {last}", init.join(", ")),
    }
}

/// `1 thing` / `2 things`.
pub(crate) fn plural(n: usize, one: &str, many: &str) -> String {
    format!("{n} {}", if n == 1 { one } else { many })
}

#[cfg(test)]
pub(crate) mod fixture {
    //! Small rulesets and vocabularies for the checks' tests.

    use super::*;
    use crate::rules::{SourceFile, load_sources};

    /// Compiles one rule file `test.yaml`; its first two lines are `format` and `revision`,
    /// so the YAML given starts on line 3.
    pub fn analyzer(yaml: &str) -> Analyzer {
        let text = format!("format: 1\nrevision: 1\n{yaml}");
        let ruleset = load_sources(
            "test",
            vec![SourceFile {
                name: "test.yaml".into(),
                text,
            }],
        )
        .expect("the fixture loads");
        Analyzer::new(ruleset).expect("the fixture compiles")
    }

    /// One document per text; queries each searched `count` times.
    pub fn vocabulary(a: &Analyzer, documents: &[&str], queries: &[(&str, u64)]) -> Vocabulary {
        Vocabulary::from_texts(a.surface(), documents, queries.iter().copied())
    }

    pub fn run(a: &Analyzer, vocabulary: Option<&Vocabulary>) -> LintReport {
        let config = LintConfig::default();
        lint(
            a,
            &LintInput {
                vocabulary,
                base: None,
                config: &config,
            },
        )
    }

    /// The findings of one check.
    pub fn of<'r>(report: &'r LintReport, check: &str) -> Vec<&'r Finding> {
        report
            .findings
            .iter()
            .filter(|f| f.check == check)
            .collect()
    }
}

#[cfg(test)]
mod tests {
    use super::fixture::*;
    use super::*;

    const BRIDGE: &str = "synonyms:\n  - equivalent: [change, transfer]\n  - id: booking\n    equivalent: [change, amend]\n";

    #[test]
    fn findings_are_sorted_and_repeatable() {
        let a = analyzer(
            "synonyms:\n  - equivalent: [b, c]\n  - equivalent: [a, b]\n  - one_way: {from: x, to: y}\n  - one_way: {from: y, to: x}\n",
        );
        let one = run(&a, None);
        let two = run(&a, None);
        assert_eq!(one.findings, two.findings);
        assert!(!one.findings.is_empty());
        assert!(
            one.findings
                .windows(2)
                .all(|w| w[0].sort_key() <= w[1].sort_key())
        );
        assert!(one.skipped.iter().any(|s| s.check == "stem-side-effect"));
    }

    #[test]
    fn the_rules_own_override_wins_and_off_is_counted() {
        let with_override = format!(
            "{BRIDGE}    lint:\n      - check: set-bridge\n        severity: off\n        reason: both meanings are wanted\n"
        );
        let a = analyzer(&with_override);
        let report = run(&a, None);
        assert!(of(&report, "set-bridge").is_empty());
        assert_eq!(report.silenced, 1);

        let config = LintConfig::with_levels([("set-bridge", Level::Error)]).unwrap();
        let a = analyzer(BRIDGE);
        let report = lint(
            &a,
            &LintInput {
                vocabulary: None,
                base: None,
                config: &config,
            },
        );
        assert_eq!(of(&report, "set-bridge")[0].severity, Severity::Error);
        assert!(report.has_at_least(Severity::Error));
    }

    #[test]
    fn ruleset_levels_apply_everywhere() {
        let a = analyzer(&format!(
            "{BRIDGE}lint:\n  checks:\n    set-bridge: {{severity: info}}\n"
        ));
        let report = run(&a, None);
        assert_eq!(of(&report, "set-bridge")[0].severity, Severity::Info);
    }

    #[test]
    fn unknown_levels_are_refused_with_a_suggestion() {
        let err = LintConfig::with_levels([("set-bridges", Level::Off)]).unwrap_err();
        assert_eq!(err.suggestion, Some("set-bridge"));
        assert!(
            err.to_string().contains("did you mean \"set-bridge\""),
            "{err}"
        );
    }
}
