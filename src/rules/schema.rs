//! The schema of one rule file, walked by hand over the spanned tree so that every
//! diagnostic can name the key, say what was expected and suggest a fix.

use std::sync::Arc;

use regex::Regex;

use super::yaml::{Node, Position, Value};
use super::{
    Diagnostic, ExemptKind, Exemption, FORMAT_VERSION, GateSettings, Language, LemmaOverride,
    Level, Limit, LimitKind, LimitValue, LintOverride, LintSettings, Origin, Pipeline, RuleMeta,
    SynonymKind, SynonymRule, Term, TokenPattern,
};
use crate::severity::Severity;

/// What one file says, before merging with the others.
#[derive(Default)]
pub struct FileRules {
    pub revision: Option<(u64, Origin)>,
    pub pipeline: Option<Pipeline>,
    pub synonyms: Vec<SynonymRule>,
    pub exemptions: Vec<Exemption>,
    pub lemmas: Vec<LemmaOverride>,
    pub lint: Option<LintSettings>,
    pub gate: Option<GateSettings>,
}

const TOP_KEYS: &[&str] = &[
    "format", "revision", "pipeline", "synonyms", "exempt", "lemmas", "lint", "gate",
];
const PIPELINE_KEYS: &[&str] = &[
    "stemmer",
    "lowercase",
    "fold_accents",
    "stopwords",
    "token_pattern",
];
const SYNONYM_KEYS: &[&str] = &["equivalent", "one_way", "id", "note", "lint"];
const ONE_WAY_KEYS: &[&str] = &["from", "to"];
const EXEMPT_KEYS: &[&str] = &["term", "pattern", "id", "note", "lint"];
const LEMMA_KEYS: &[&str] = &["form", "lemma", "id", "note", "lint"];
const LINT_OVERRIDE_KEYS: &[&str] = &["check", "severity", "reason"];
const LINT_KEYS: &[&str] = &["checks", "max_group_size", "max_pattern_share"];
const LINT_CHECK_KEYS: &[&str] = &["severity"];

/// Walks one file's tree, collecting diagnostics instead of stopping at the first.
pub struct Walker<'a> {
    file: Arc<str>,
    text: &'a str,
    pub diagnostics: Vec<Diagnostic>,
}

type Entries = [(Node, Node)];

impl<'a> Walker<'a> {
    pub fn new(file: Arc<str>, text: &'a str) -> Self {
        Walker {
            file,
            text,
            diagnostics: Vec::new(),
        }
    }

    fn origin(&self, at: Position) -> Origin {
        Origin::new(&self.file, at)
    }

    fn error(&mut self, at: Position, message: impl Into<String>, help: Option<String>) {
        let mut d = Diagnostic::new(&self.file, Some(at), message).with_source(self.text);
        d.help = help;
        self.diagnostics.push(d);
    }

    /// Reads the whole file.
    pub fn file(&mut self, root: &Node) -> FileRules {
        let mut out = FileRules::default();
        let entries = match &root.value {
            Value::Map(entries) => entries,
            Value::Null => {
                self.error(
                    root.at,
                    "the file is empty",
                    Some(format!(
                        "a rule file starts with `format: {FORMAT_VERSION}` and `revision: 1`"
                    )),
                );
                return out;
            }
            other => {
                self.error(
                    root.at,
                    format!("expected a mapping of sections, found {}", other.kind()),
                    Some(format!("sections are: {}", TOP_KEYS.join(", "))),
                );
                return out;
            }
        };
        self.check_keys(entries, TOP_KEYS, "a rule file");
        self.format(root, entries);
        out.revision = self.revision(root, entries);
        if let Some(node) = get(entries, "pipeline") {
            out.pipeline = self.pipeline(node);
        }
        if let Some(node) = get(entries, "synonyms") {
            for item in self.list(node, "`synonyms`") {
                if let Some(rule) = self.synonym(item) {
                    out.synonyms.push(rule);
                }
            }
        }
        if let Some(node) = get(entries, "exempt") {
            for item in self.list(node, "`exempt`") {
                if let Some(rule) = self.exemption(item) {
                    out.exemptions.push(rule);
                }
            }
        }
        if let Some(node) = get(entries, "lemmas") {
            for item in self.list(node, "`lemmas`") {
                if let Some(rule) = self.lemma(item) {
                    out.lemmas.push(rule);
                }
            }
        }
        if let Some(node) = get(entries, "lint") {
            out.lint = self.lint_settings(node);
        }
        if let Some(node) = get(entries, "gate") {
            out.gate = self.gate(node);
        }
        out
    }

    fn check_keys(&mut self, entries: &Entries, allowed: &[&str], context: &str) {
        for (key, _) in entries {
            let Value::Str(name) = &key.value else {
                self.error(
                    key.at,
                    format!("keys in {context} are names, found {}", key.value.kind()),
                    None,
                );
                continue;
            };
            if allowed.contains(&name.as_str()) {
                continue;
            }
            let help = match did_you_mean(name, allowed) {
                Some(best) => format!("did you mean `{best}`?"),
                None => format!("the keys allowed here are: {}", allowed.join(", ")),
            };
            self.error(
                key.at,
                format!("unknown key `{name}` in {context}"),
                Some(help),
            );
        }
    }

    fn format(&mut self, root: &Node, entries: &Entries) {
        match get(entries, "format") {
            None => self.error(
                root.at,
                "missing `format`",
                Some(format!(
                    "every rule file declares its format version: add `format: {FORMAT_VERSION}`"
                )),
            ),
            Some(Node {
                value: Value::Int(v),
                ..
            }) if *v == FORMAT_VERSION => {}
            Some(node) => self.error(
                node.at,
                format!(
                    "unsupported format {}; this lexdelta reads format {FORMAT_VERSION}",
                    scalar_text(node)
                ),
                Some(format!("write `format: {FORMAT_VERSION}`")),
            ),
        }
    }

    fn revision(&mut self, root: &Node, entries: &Entries) -> Option<(u64, Origin)> {
        match get(entries, "revision") {
            None => {
                self.error(
                    root.at,
                    "missing `revision`",
                    Some(
                        "every rule file carries a content revision: add `revision: 1` and bump it on every change"
                            .into(),
                    ),
                );
                None
            }
            Some(node) => match node.value {
                Value::Int(v) if v >= 1 => Some((v as u64, self.origin(node.at))),
                _ => {
                    self.error(
                        node.at,
                        format!(
                            "`revision` must be a whole number of at least 1, found {}",
                            scalar_text(node)
                        ),
                        Some("write for example `revision: 3`".into()),
                    );
                    None
                }
            },
        }
    }

    fn list<'n>(&mut self, node: &'n Node, what: &str) -> &'n [Node] {
        match &node.value {
            Value::Seq(items) => items,
            Value::Null => &[],
            other => {
                self.error(
                    node.at,
                    format!("{what} must be a list, found {}", other.kind()),
                    Some("write each entry on its own line starting with `- `".into()),
                );
                &[]
            }
        }
    }

    fn map<'n>(&mut self, node: &'n Node, what: &str, keys: &[&str]) -> Option<&'n Entries> {
        match &node.value {
            Value::Map(entries) => Some(entries),
            other => {
                self.error(
                    node.at,
                    format!("{what} must be a mapping, found {}", other.kind()),
                    Some(format!("the keys of {what} are: {}", keys.join(", "))),
                );
                None
            }
        }
    }

    /// A term: a non-empty string (a number is taken as its digits).
    fn term(&mut self, node: &Node, what: &str) -> Option<Term> {
        let text = match &node.value {
            Value::Str(s) => s.trim().to_string(),
            Value::Int(i) => i.to_string(),
            Value::Bool(_) => {
                self.error(
                    node.at,
                    format!("{what} must be a word or phrase, found true or false"),
                    Some("put the word in quotes, e.g. \"yes\"".into()),
                );
                return None;
            }
            other => {
                self.error(
                    node.at,
                    format!("{what} must be a word or phrase, found {}", other.kind()),
                    None,
                );
                return None;
            }
        };
        if text.is_empty() {
            self.error(
                node.at,
                format!("{what} is empty"),
                Some("remove it".into()),
            );
            return None;
        }
        Some(Term {
            text,
            origin: self.origin(node.at),
        })
    }

    fn terms(&mut self, node: &Node, what: &str) -> Vec<Term> {
        match &node.value {
            Value::Seq(items) => items
                .iter()
                .filter_map(|item| self.term(item, what))
                .collect(),
            _ => self.term(node, what).into_iter().collect(),
        }
    }

    fn string(&mut self, node: &Node, what: &str) -> Option<String> {
        match &node.value {
            Value::Str(s) => Some(s.clone()),
            other => {
                self.error(
                    node.at,
                    format!("{what} must be a string, found {}", other.kind()),
                    Some("put the text in quotes".into()),
                );
                None
            }
        }
    }

    fn boolean(&mut self, node: &Node, what: &str) -> Option<bool> {
        match node.value {
            Value::Bool(b) => Some(b),
            _ => {
                self.error(
                    node.at,
                    format!("{what} must be true or false, found {}", scalar_text(node)),
                    None,
                );
                None
            }
        }
    }

    fn meta(&mut self, node: &Node, entries: &Entries) -> RuleMeta {
        let id = get(entries, "id").and_then(|n| self.rule_id(n));
        let note = get(entries, "note").and_then(|n| self.string(n, "`note`"));
        let lint = get(entries, "lint")
            .map(|n| self.lint_overrides(n))
            .unwrap_or_default();
        RuleMeta {
            id,
            note,
            origin: self.origin(node.at),
            lint,
        }
    }

    fn bare_meta(&self, node: &Node) -> RuleMeta {
        RuleMeta {
            id: None,
            note: None,
            origin: self.origin(node.at),
            lint: Vec::new(),
        }
    }

    fn rule_id(&mut self, node: &Node) -> Option<String> {
        let text = match &node.value {
            Value::Str(s) => s.clone(),
            Value::Int(i) => i.to_string(),
            _ => {
                self.error(
                    node.at,
                    format!("`id` must be a name, found {}", node.value.kind()),
                    None,
                );
                return None;
            }
        };
        let valid = !text.is_empty()
            && text
                .chars()
                .all(|c| c.is_alphanumeric() || matches!(c, '-' | '_' | '.' | '/'));
        if !valid {
            self.error(
                node.at,
                format!("`id` {text:?} may hold only letters, digits, `-`, `_`, `.` and `/`"),
                Some("ids name rules in reports; use for example `pram-family`".into()),
            );
            return None;
        }
        Some(text)
    }

    fn pipeline(&mut self, node: &Node) -> Option<Pipeline> {
        let entries = self.map(node, "`pipeline`", PIPELINE_KEYS)?;
        self.check_keys(entries, PIPELINE_KEYS, "`pipeline`");
        let mut pipeline = Pipeline {
            origin: Some(self.origin(node.at)),
            ..Pipeline::default()
        };
        if let Some(n) = get(entries, "stemmer") {
            pipeline.stemmer = self.stemmer(n);
        }
        if let Some(n) = get(entries, "lowercase") {
            pipeline.lowercase = self.boolean(n, "`lowercase`").unwrap_or(true);
        }
        if let Some(n) = get(entries, "fold_accents") {
            pipeline.fold_accents = self.boolean(n, "`fold_accents`").unwrap_or(false);
        }
        if let Some(n) = get(entries, "stopwords") {
            pipeline.stopwords = match &n.value {
                Value::Seq(_) => self.terms(n, "a stopword"),
                Value::Null => Vec::new(),
                other => {
                    self.error(
                        n.at,
                        format!(
                            "`stopwords` must be a list of words, found {}",
                            other.kind()
                        ),
                        Some("write for example `stopwords: [the, of, and]`".into()),
                    );
                    Vec::new()
                }
            };
        }
        if let Some(n) = get(entries, "token_pattern") {
            pipeline.token_pattern = self.term(n, "`token_pattern`").and_then(|source| {
                let regex = self.regex(n, &source.text, false)?;
                if let Some(problem) = finds_no_token(&source.text) {
                    self.error(
                        n.at,
                        format!(
                            "`token_pattern` {} {problem}, so every text would have no tokens",
                            quoted_pattern(&source.text)
                        ),
                        Some(
                            "write a pattern that matches the words themselves, for example \
                             `[\\w'-]+`; remove `token_pattern` to split on word boundaries"
                                .into(),
                        ),
                    );
                    return None;
                }
                Some(TokenPattern { source, regex })
            });
        }
        Some(pipeline)
    }

    fn stemmer(&mut self, node: &Node) -> Option<Language> {
        let name = match &node.value {
            Value::Str(s) => s.to_lowercase(),
            Value::Null | Value::Bool(false) => return None,
            _ => String::new(),
        };
        if name == "none" {
            return None;
        }
        if let Some(language) = Language::from_name(&name) {
            return Some(language);
        }
        let names: Vec<&str> = Language::ALL.iter().map(|l| l.name()).collect();
        let help = match did_you_mean(&name, &names) {
            Some(best) => format!("did you mean `{best}`?"),
            None => format!("use `none` or one of: {}", names.join(", ")),
        };
        self.error(
            node.at,
            format!("unknown stemmer language {}", scalar_text(node)),
            Some(help),
        );
        Some(Language::English)
    }

    fn regex(&mut self, node: &Node, source: &str, anchored: bool) -> Option<Regex> {
        let full = if anchored {
            format!("^(?:{source})$")
        } else {
            source.to_string()
        };
        match regex::RegexBuilder::new(&full).size_limit(1 << 20).build() {
            Ok(re) => Some(re),
            Err(err) => {
                // The regex crate's message quotes the whole pattern: fine for a line,
                // not for a long one (it would be echoed whole into a CI log).
                let detail = if source.len() <= MAX_QUOTED_PATTERN {
                    err.to_string()
                } else {
                    match regex_syntax::Parser::new().parse(source) {
                        Err(regex_syntax::Error::Parse(e)) => format!(
                            "{} (at character {} of the pattern)",
                            e.kind(),
                            source[..e.span().start.offset].chars().count() + 1
                        ),
                        Err(regex_syntax::Error::Translate(e)) => format!(
                            "{} (at character {} of the pattern)",
                            e.kind(),
                            source[..e.span().start.offset].chars().count() + 1
                        ),
                        _ => shorten(&err.to_string(), MAX_QUOTED_PATTERN),
                    }
                };
                self.error(
                    node.at,
                    format!("invalid regular expression {}", quoted_pattern(source)),
                    Some(format!(
                        "the regex crate says:\n{}",
                        indent(detail.trim_end(), "        ")
                    )),
                );
                None
            }
        }
    }

    fn synonym(&mut self, node: &Node) -> Option<SynonymRule> {
        // Shorthand: a bare list is an equivalent set.
        if let Value::Seq(_) = node.value {
            let members = self.terms(node, "a set member");
            return self.equivalent(node, self.bare_meta(node), members);
        }
        let entries = self.map(node, "a synonym rule", SYNONYM_KEYS)?;
        self.check_keys(entries, SYNONYM_KEYS, "a synonym rule");
        let meta = self.meta(node, entries);
        match (get(entries, "equivalent"), get(entries, "one_way")) {
            (Some(set), None) => {
                if !matches!(set.value, Value::Seq(_)) {
                    self.error(
                        set.at,
                        format!("`equivalent` must be a list, found {}", set.value.kind()),
                        Some("write for example `equivalent: [pram, stroller]`".into()),
                    );
                    return None;
                }
                let members = self.terms(set, "a set member");
                self.equivalent(set, meta, members)
            }
            (None, Some(rule)) => self.one_way(rule, meta),
            (Some(_), Some(second)) => {
                self.error(
                    second.at,
                    "a synonym rule is either `equivalent` or `one_way`, not both",
                    Some("split it into two rules".into()),
                );
                None
            }
            (None, None) => {
                self.error(
                    node.at,
                    "a synonym rule needs `equivalent` or `one_way`",
                    Some(
                        "write `equivalent: [a, b]` (interchangeable) or `one_way: {from: a, to: [b]}`"
                            .into(),
                    ),
                );
                None
            }
        }
    }

    fn equivalent(&mut self, at: &Node, meta: RuleMeta, members: Vec<Term>) -> Option<SynonymRule> {
        if members.len() < 2 {
            self.error(
                at.at,
                format!(
                    "an equivalent set needs at least two members, found {}",
                    members.len()
                ),
                Some("add the words it should be interchangeable with, or remove the rule".into()),
            );
            return None;
        }
        Some(SynonymRule {
            meta,
            kind: SynonymKind::Equivalent { members },
        })
    }

    fn one_way(&mut self, node: &Node, meta: RuleMeta) -> Option<SynonymRule> {
        let entries = self.map(node, "`one_way`", ONE_WAY_KEYS)?;
        self.check_keys(entries, ONE_WAY_KEYS, "`one_way`");
        let from = match get(entries, "from") {
            Some(n) => self.term(n, "`from`"),
            None => {
                self.error(node.at, "`one_way` needs `from`", None);
                None
            }
        };
        let to = match get(entries, "to") {
            Some(n) => {
                let to = self.terms(n, "a `to` term");
                if to.is_empty() {
                    self.error(
                        n.at,
                        "`to` is empty",
                        Some("list the words `from` should also find".into()),
                    );
                }
                to
            }
            None => {
                self.error(node.at, "`one_way` needs `to`", None);
                Vec::new()
            }
        };
        if to.is_empty() {
            return None;
        }
        Some(SynonymRule {
            meta,
            kind: SynonymKind::OneWay { from: from?, to },
        })
    }

    fn exemption(&mut self, node: &Node) -> Option<Exemption> {
        if let Value::Str(_) | Value::Int(_) | Value::Bool(_) = node.value {
            let term = self.term(node, "an exempt term")?;
            return Some(Exemption {
                meta: self.bare_meta(node),
                kind: ExemptKind::Term(term),
            });
        }
        let entries = self.map(node, "an exemption", EXEMPT_KEYS)?;
        self.check_keys(entries, EXEMPT_KEYS, "an exemption");
        let meta = self.meta(node, entries);
        let kind = match (get(entries, "term"), get(entries, "pattern")) {
            (Some(t), None) => ExemptKind::Term(self.term(t, "`term`")?),
            (None, Some(p)) => {
                let source = self.term(p, "`pattern`")?;
                let regex = self.regex(p, &source.text, true)?;
                ExemptKind::Pattern { source, regex }
            }
            (Some(_), Some(p)) => {
                self.error(
                    p.at,
                    "an exemption is either a `term` or a `pattern`, not both",
                    Some("split it into two entries".into()),
                );
                return None;
            }
            (None, None) => {
                self.error(
                    node.at,
                    "an exemption needs `term` or `pattern`",
                    Some("write `term: universal` or `pattern: \"^[a-z]\\\\d+$\"`".into()),
                );
                return None;
            }
        };
        Some(Exemption { meta, kind })
    }

    fn lemma(&mut self, node: &Node) -> Option<LemmaOverride> {
        let entries = self.map(node, "a lemma override", LEMMA_KEYS)?;
        self.check_keys(entries, LEMMA_KEYS, "a lemma override");
        let meta = self.meta(node, entries);
        let form = match get(entries, "form") {
            Some(n) => self.term(n, "`form`"),
            None => {
                self.error(
                    node.at,
                    "a lemma override needs `form`",
                    Some("write `{ form: mice, lemma: mouse }`".into()),
                );
                None
            }
        };
        let lemma = match get(entries, "lemma") {
            Some(n) => self.term(n, "`lemma`"),
            None => {
                self.error(
                    node.at,
                    "a lemma override needs `lemma`",
                    Some("write `{ form: mice, lemma: mouse }`".into()),
                );
                None
            }
        };
        let (form, lemma) = (form?, lemma?);
        if form.text == lemma.text {
            self.error(
                lemma.origin.position(),
                format!("the lemma override maps {:?} to itself", form.text),
                Some("remove it, or exempt the word if the stemmer must leave it alone".into()),
            );
            return None;
        }
        Some(LemmaOverride { meta, form, lemma })
    }

    fn lint_overrides(&mut self, node: &Node) -> Vec<LintOverride> {
        let mut out = Vec::new();
        for item in self.list(node, "`lint`") {
            let Some(entries) = self.map(item, "a lint setting", LINT_OVERRIDE_KEYS) else {
                continue;
            };
            self.check_keys(entries, LINT_OVERRIDE_KEYS, "a lint setting");
            let check = get(entries, "check").and_then(|n| self.term(n, "`check`"));
            let level = get(entries, "severity").and_then(|n| self.level(n));
            let reason = get(entries, "reason")
                .and_then(|n| self.string(n, "`reason`"))
                .filter(|r| !r.trim().is_empty());
            if check.is_none() {
                self.error(item.at, "a lint setting needs `check`", None);
            }
            if level.is_none() && get(entries, "severity").is_none() {
                self.error(
                    item.at,
                    "a lint setting needs `severity`",
                    Some("use error, warning, info or off".into()),
                );
            }
            if reason.is_none() {
                self.error(
                    item.at,
                    "a lint setting needs a `reason`",
                    Some("say why this rule is an exception, for the next reviewer".into()),
                );
            }
            if let (Some(check), Some(level), Some(reason)) = (check, level, reason) {
                out.push(LintOverride {
                    check,
                    level,
                    reason,
                });
            }
        }
        out
    }

    fn level(&mut self, node: &Node) -> Option<Level> {
        let level = match &node.value {
            Value::Str(s) => match s.as_str() {
                "error" => Some(Level::Error),
                "warning" => Some(Level::Warning),
                "info" => Some(Level::Info),
                "off" => Some(Level::Off),
                _ => None,
            },
            // Some YAML readers take a plain `off` as false.
            Value::Bool(false) => Some(Level::Off),
            _ => None,
        };
        if level.is_none() {
            self.error(
                node.at,
                format!("unknown severity {}", scalar_text(node)),
                Some("use error, warning, info or off".into()),
            );
        }
        level
    }

    fn severity(&mut self, node: &Node) -> Option<Severity> {
        let level = self.level(node)?;
        if level == Level::Off {
            self.error(
                node.at,
                "`off` is not a severity here",
                Some("use error, warning or info".into()),
            );
        }
        level.severity()
    }

    fn lint_settings(&mut self, node: &Node) -> Option<LintSettings> {
        let entries = self.map(node, "`lint`", LINT_KEYS)?;
        self.check_keys(entries, LINT_KEYS, "`lint`");
        let mut settings = LintSettings {
            origin: Some(self.origin(node.at)),
            ..LintSettings::default()
        };
        if let Some(checks) = get(entries, "checks")
            && let Some(checks) = self.map(checks, "`checks`", &["<check name>"])
        {
            for (name, value) in checks {
                let Some(name_text) = self.string(name, "a check name") else {
                    continue;
                };
                let level = match &value.value {
                    Value::Map(inner) => {
                        self.check_keys(inner, LINT_CHECK_KEYS, "a check setting");
                        get(inner, "severity").and_then(|n| self.level(n))
                    }
                    _ => self.level(value),
                };
                if let Some(level) = level {
                    settings
                        .checks
                        .insert(name_text, (level, self.origin(name.at)));
                }
            }
        }
        if let Some(n) = get(entries, "max_group_size") {
            settings.max_group_size = self.whole_number(n, "`max_group_size`", 2);
        }
        if let Some(n) = get(entries, "max_pattern_share") {
            settings.max_pattern_share = self.share(n, "`max_pattern_share`");
        }
        Some(settings)
    }

    fn gate(&mut self, node: &Node) -> Option<GateSettings> {
        let keys = Limit::keys();
        let entries = self.map(node, "`gate`", &keys)?;
        self.check_keys(entries, &keys, "`gate`");
        let mut gate = GateSettings {
            origin: Some(self.origin(node.at)),
            ..GateSettings::default()
        };
        for limit in Limit::ALL {
            let Some(n) = get(entries, limit.key()) else {
                continue;
            };
            let what = format!("`{}`", limit.key());
            let value = match limit.spec().kind {
                LimitKind::Searches => self
                    .whole_number(n, &what, 0)
                    .map(|v| LimitValue::Searches(v as u64)),
                LimitKind::Share | LimitKind::Drop => {
                    self.share(n, &what).map(LimitValue::Fraction)
                }
                LimitKind::Severity => self.severity(n).map(LimitValue::Severity),
            };
            if let Some(value) = value {
                gate.limits.set(limit, value);
            }
        }
        Some(gate)
    }

    fn whole_number(&mut self, node: &Node, what: &str, min: i64) -> Option<usize> {
        match node.value {
            Value::Int(v) if v >= min => Some(v as usize),
            _ => {
                self.error(
                    node.at,
                    format!(
                        "{what} must be a whole number of at least {min}, found {}",
                        scalar_text(node)
                    ),
                    None,
                );
                None
            }
        }
    }

    fn share(&mut self, node: &Node, what: &str) -> Option<f64> {
        let v = match node.value {
            Value::Int(v) => v as f64,
            Value::Float(v) => v,
            _ => f64::NAN,
        };
        if (0.0..=1.0).contains(&v) {
            Some(v)
        } else {
            self.error(
                node.at,
                format!(
                    "{what} must be a share between 0 and 1, found {}",
                    scalar_text(node)
                ),
                Some("write for example 0.02 for two percent".into()),
            );
            None
        }
    }
}

fn get<'n>(entries: &'n Entries, key: &str) -> Option<&'n Node> {
    entries
        .iter()
        .find(|(k, _)| matches!(&k.value, Value::Str(s) if s == key))
        .map(|(_, v)| v)
}

/// A value as the user wrote it, for messages.
fn scalar_text(node: &Node) -> String {
    match &node.value {
        Value::Null => "nothing".into(),
        Value::Bool(b) => format!("`{b}`"),
        Value::Int(i) => format!("`{i}`"),
        Value::Float(f) => format!("`{f}`"),
        Value::Str(s) => format!("{s:?}"),
        Value::Seq(_) => "a list".into(),
        Value::Map(_) => "a mapping".into(),
    }
}

/// Patterns longer than this (in bytes) are quoted shortened in diagnostics.
const MAX_QUOTED_PATTERN: usize = 200;

/// A pattern as a diagnostic quotes it: whole when short, else its start and its length.
fn quoted_pattern(source: &str) -> String {
    if source.len() <= MAX_QUOTED_PATTERN {
        format!("{source:?}")
    } else {
        format!("{:?}… ({} bytes in all)", shorten(source, 60), source.len())
    }
}

/// The first `max` bytes of `text` (cut at a character boundary).
fn shorten(text: &str, max: usize) -> String {
    let mut end = max.min(text.len());
    while !text.is_char_boundary(end) {
        end -= 1;
    }
    text[..end].to_string()
}

/// Why a token pattern can find no token, if it cannot: empty matches are no tokens, so a
/// pattern that only ever matches empty text (`\b`, `^`, `x{0}`) or never matches at all
/// (`[^\s\S]`) tokenizes every text to nothing.
fn finds_no_token(source: &str) -> Option<&'static str> {
    let hir = regex_syntax::Parser::new().parse(source).ok()?;
    let props = hir.properties();
    match (props.minimum_len(), props.maximum_len()) {
        (None, _) => Some("can never match"),
        (_, Some(0)) => Some("matches only empty text"),
        _ => None,
    }
}

fn indent(text: &str, prefix: &str) -> String {
    text.lines()
        .map(|l| format!("{prefix}{l}"))
        .collect::<Vec<_>>()
        .join("\n")
}

/// The allowed name closest to a misspelt one, if it is close enough to be a typo.
pub fn did_you_mean<'a>(name: &str, allowed: &[&'a str]) -> Option<&'a str> {
    allowed
        .iter()
        .map(|cand| (strsim::damerau_levenshtein(name, cand), *cand))
        .filter(|(d, cand)| *d <= 2.max(cand.len() / 4))
        .min()
        .map(|(_, cand)| cand)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn suggestions_are_for_near_misses_only() {
        assert_eq!(did_you_mean("equivelant", SYNONYM_KEYS), Some("equivalent"));
        assert_eq!(did_you_mean("lemma", LEMMA_KEYS), Some("lemma"));
        assert_eq!(did_you_mean("zzzzzz", SYNONYM_KEYS), None);
    }

    #[test]
    fn meta_keys_are_allowed_on_every_rule_kind() {
        for kinds in [SYNONYM_KEYS, EXEMPT_KEYS, LEMMA_KEYS] {
            for key in ["id", "note", "lint"] {
                assert!(kinds.contains(&key));
            }
        }
    }
}
