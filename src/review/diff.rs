//! The rule-level difference between two rulesets: which synonym rules, exemptions and
//! lemma overrides were added, removed or changed (by id and file:line), which pipeline
//! settings moved, and a text diff of every changed file.
//!
//! Rules are matched across the two sides by id; rules without an id by their content
//! (so a moved rule without an id reads as removed + added). Lemma overrides are matched
//! by their irregular form, which is what makes one override "the same" as another.

use std::collections::{BTreeMap, BTreeSet};
use std::path::Path;

use serde::Serialize;

use crate::rules::{
    ExemptKind, FileInfo, LemmaOverride, Origin, Ruleset, SynonymKind, SynonymRule, Term,
};

#[derive(Clone, Debug, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Change {
    Added,
    Removed,
    Changed,
}

/// One rule that differs, with where it is written on each side.
#[derive(Clone, Debug, Serialize)]
pub struct RuleChange {
    pub change: Change,
    /// `synonym`, `exempt` or `lemma`.
    pub section: &'static str,
    /// The rule's id, or a description of its content.
    pub label: String,
    pub base: Option<Origin>,
    pub head: Option<Origin>,
    /// The rule as written on each side, in one line.
    pub before: Option<String>,
    pub after: Option<String>,
    /// For synonym rules: every term on the head side, in the order written.
    pub members: Vec<String>,
    /// For sets: members added and removed.
    pub members_added: Vec<String>,
    pub members_removed: Vec<String>,
}

#[derive(Clone, Debug, Serialize)]
pub struct PipelineChange {
    pub setting: &'static str,
    pub before: String,
    pub after: String,
}

#[derive(Clone, Debug, Serialize)]
pub struct FileChange {
    /// The file name inside the ruleset.
    pub name: String,
    pub change: Change,
    pub base_revision: Option<u64>,
    pub head_revision: Option<u64>,
    /// A unified diff of the text (`similar`), for changed files.
    pub unified: Option<String>,
}

#[derive(Clone, Debug, Default, Serialize)]
pub struct RuleDiff {
    pub files: Vec<FileChange>,
    pub pipeline: Vec<PipelineChange>,
    pub rules: Vec<RuleChange>,
}

impl RuleDiff {
    pub fn is_empty(&self) -> bool {
        self.files.is_empty() && self.pipeline.is_empty() && self.rules.is_empty()
    }

    /// How many rules changed in each way, per section.
    pub fn counts(&self) -> BTreeMap<(&'static str, Change), usize> {
        let mut out = BTreeMap::new();
        for r in &self.rules {
            *out.entry((r.section, r.change.clone())).or_default() += 1;
        }
        out
    }
}

/// Compares two rulesets.
pub fn diff(base: &Ruleset, head: &Ruleset) -> RuleDiff {
    let mut rules = Vec::new();
    diff_synonyms(base, head, &mut rules);
    diff_exemptions(base, head, &mut rules);
    diff_lemmas(&base.lemmas, &head.lemmas, &mut rules);
    rules.sort_by(|a, b| {
        let at = |r: &RuleChange| r.head.clone().or_else(|| r.base.clone());
        (a.section, at(a), &a.label).cmp(&(b.section, at(b), &b.label))
    });
    RuleDiff {
        files: diff_files(&base.files, &head.files),
        pipeline: diff_pipeline(base, head),
        rules,
    }
}

fn file_key(info: &FileInfo) -> String {
    let name = info.name.rsplit(':').next().unwrap_or(&info.name);
    Path::new(name)
        .file_name()
        .map_or_else(|| name.to_string(), |n| n.to_string_lossy().into_owned())
}

fn diff_files(base: &[FileInfo], head: &[FileInfo]) -> Vec<FileChange> {
    let base: BTreeMap<String, &FileInfo> = base.iter().map(|f| (file_key(f), f)).collect();
    let head: BTreeMap<String, &FileInfo> = head.iter().map(|f| (file_key(f), f)).collect();
    let names: BTreeSet<&String> = base.keys().chain(head.keys()).collect();
    let mut out = Vec::new();
    for name in names {
        let (b, h) = (base.get(name), head.get(name));
        let change = match (b, h) {
            (None, Some(_)) => Change::Added,
            (Some(_), None) => Change::Removed,
            (Some(b), Some(h)) if b.content_hash != h.content_hash => Change::Changed,
            _ => continue,
        };
        let text = |f: Option<&&FileInfo>| f.map_or("", |f| &f.text).to_string();
        let (old, new) = (text(b), text(h));
        let unified = similar::TextDiff::from_lines(&old, &new)
            .unified_diff()
            .context_radius(2)
            .header(&format!("base/{name}"), &format!("head/{name}"))
            .to_string();
        out.push(FileChange {
            name: name.clone(),
            change,
            base_revision: b.map(|f| f.revision),
            head_revision: h.map(|f| f.revision),
            unified: Some(unified),
        });
    }
    out
}

fn diff_pipeline(base: &Ruleset, head: &Ruleset) -> Vec<PipelineChange> {
    let (b, h) = (&base.pipeline, &head.pipeline);
    let mut out = Vec::new();
    let mut setting = |name: &'static str, before: String, after: String| {
        if before != after {
            out.push(PipelineChange {
                setting: name,
                before,
                after,
            });
        }
    };
    let stemmer = |p: &crate::rules::Pipeline| p.stemmer.map_or("none", |l| l.name()).to_string();
    setting("stemmer", stemmer(b), stemmer(h));
    setting(
        "lowercase",
        b.lowercase.to_string(),
        h.lowercase.to_string(),
    );
    setting(
        "fold_accents",
        b.fold_accents.to_string(),
        h.fold_accents.to_string(),
    );
    let words = |p: &crate::rules::Pipeline| {
        let set: BTreeSet<&str> = p.stopwords.iter().map(|t| t.text.as_str()).collect();
        set.into_iter().collect::<Vec<_>>().join(", ")
    };
    setting("stopwords", words(b), words(h));
    let pattern = |p: &crate::rules::Pipeline| {
        p.token_pattern
            .as_ref()
            .map_or_else(|| "Unicode words".to_string(), |t| t.source.text.clone())
    };
    setting("token_pattern", pattern(b), pattern(h));
    out
}

fn terms_text(terms: &[Term]) -> Vec<String> {
    terms.iter().map(|t| t.text.clone()).collect()
}

fn describe_synonym(rule: &SynonymRule) -> String {
    match &rule.kind {
        SynonymKind::Equivalent { members } => {
            format!("equivalent [{}]", terms_text(members).join(", "))
        }
        SynonymKind::OneWay { from, to } => {
            format!("one_way {} → [{}]", from.text, terms_text(to).join(", "))
        }
    }
}

/// A rule's identity across the two sides: its id, or its content.
fn identity(id: &Option<String>, content: &str) -> String {
    match id {
        Some(id) => format!("id:{id}"),
        None => format!("content:{content}"),
    }
}

fn diff_synonyms(base: &Ruleset, head: &Ruleset, out: &mut Vec<RuleChange>) {
    let (b, h) = (synonym_index(base), synonym_index(head));
    for (key, rule) in &b {
        if !h.contains_key(key) {
            out.push(synonym_change(Change::Removed, Some(rule), None));
        }
    }
    for (key, rule) in &h {
        match b.get(key) {
            None => out.push(synonym_change(Change::Added, None, Some(rule))),
            Some(old) if describe_synonym(old) != describe_synonym(rule) => {
                out.push(synonym_change(Change::Changed, Some(old), Some(rule)))
            }
            Some(_) => {}
        }
    }
}

fn synonym_index(rs: &Ruleset) -> BTreeMap<String, &SynonymRule> {
    rs.synonyms
        .iter()
        .map(|r| (identity(&r.meta.id, &describe_synonym(r)), r))
        .collect()
}

fn synonym_change(
    change: Change,
    base: Option<&SynonymRule>,
    head: Option<&SynonymRule>,
) -> RuleChange {
    let members = |r: Option<&SynonymRule>| -> BTreeSet<String> {
        r.map(|r| r.terms().iter().map(|t| t.text.clone()).collect())
            .unwrap_or_default()
    };
    let (old, new) = (members(base), members(head));
    let either = head.or(base).expect("one side exists");
    RuleChange {
        change,
        section: "synonym",
        label: either
            .meta
            .id
            .clone()
            .unwrap_or_else(|| describe_synonym(either)),
        base: base.map(|r| r.meta.origin.clone()),
        head: head.map(|r| r.meta.origin.clone()),
        before: base.map(describe_synonym),
        after: head.map(describe_synonym),
        members: head
            .map(|r| r.terms().iter().map(|t| t.text.clone()).collect())
            .unwrap_or_default(),
        members_added: new.difference(&old).cloned().collect(),
        members_removed: old.difference(&new).cloned().collect(),
    }
}

fn describe_exempt(kind: &ExemptKind) -> String {
    match kind {
        ExemptKind::Term(t) => format!("term {}", t.text),
        ExemptKind::Pattern { source, .. } => format!("pattern {}", source.text),
    }
}

fn diff_exemptions(base: &Ruleset, head: &Ruleset, out: &mut Vec<RuleChange>) {
    let index = |rs: &Ruleset| -> BTreeMap<String, (String, Origin, Option<String>)> {
        rs.exemptions
            .iter()
            .map(|r| {
                let text = describe_exempt(&r.kind);
                (
                    identity(&r.meta.id, &text),
                    (text, r.meta.origin.clone(), r.meta.id.clone()),
                )
            })
            .collect()
    };
    let (b, h) = (index(base), index(head));
    let entry = |change,
                 old: Option<&(String, Origin, Option<String>)>,
                 new: Option<&(String, Origin, Option<String>)>| {
        let either = new.or(old).expect("one side exists");
        RuleChange {
            change,
            section: "exempt",
            label: either.2.clone().unwrap_or_else(|| either.0.clone()),
            base: old.map(|e| e.1.clone()),
            head: new.map(|e| e.1.clone()),
            before: old.map(|e| e.0.clone()),
            after: new.map(|e| e.0.clone()),
            members: Vec::new(),
            members_added: Vec::new(),
            members_removed: Vec::new(),
        }
    };
    for (key, old) in &b {
        if !h.contains_key(key) {
            out.push(entry(Change::Removed, Some(old), None));
        }
    }
    for (key, new) in &h {
        match b.get(key) {
            None => out.push(entry(Change::Added, None, Some(new))),
            Some(old) if old.0 != new.0 => out.push(entry(Change::Changed, Some(old), Some(new))),
            Some(_) => {}
        }
    }
}

fn diff_lemmas(base: &[LemmaOverride], head: &[LemmaOverride], out: &mut Vec<RuleChange>) {
    let index = |list: &[LemmaOverride]| -> BTreeMap<String, (String, Origin)> {
        let mut map = BTreeMap::new();
        for r in list {
            map.entry(r.form.text.to_lowercase())
                .or_insert_with(|| (r.lemma.text.clone(), r.meta.origin.clone()));
        }
        map
    };
    let (b, h) = (index(base), index(head));
    let entry = |change,
                 form: &str,
                 old: Option<&(String, Origin)>,
                 new: Option<&(String, Origin)>| RuleChange {
        change,
        section: "lemma",
        label: form.to_string(),
        base: old.map(|e| e.1.clone()),
        head: new.map(|e| e.1.clone()),
        before: old.map(|e| format!("{form} → {}", e.0)),
        after: new.map(|e| format!("{form} → {}", e.0)),
        members: Vec::new(),
        members_added: Vec::new(),
        members_removed: Vec::new(),
    };
    for (form, old) in &b {
        if !h.contains_key(form) {
            out.push(entry(Change::Removed, form, Some(old), None));
        }
    }
    for (form, new) in &h {
        match b.get(form) {
            None => out.push(entry(Change::Added, form, None, Some(new))),
            Some(old) if old.0 != new.0 => {
                out.push(entry(Change::Changed, form, Some(old), Some(new)))
            }
            Some(_) => {}
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rules::{SourceFile, load_sources};

    fn ruleset(name: &str, text: &str) -> Ruleset {
        load_sources(
            name,
            vec![SourceFile {
                name: format!("{name}/r.yaml"),
                text: text.into(),
            }],
        )
        .unwrap()
    }

    #[test]
    fn added_removed_and_changed_rules_are_named() {
        let base = ruleset(
            "base",
            "format: 1\nrevision: 1\nsynonyms:\n  - id: pram\n    equivalent: [pram, pushchair]\n  - equivalent: [lift, elevator]\nlemmas:\n  - {form: rode, lemma: ride}\n",
        );
        let head = ruleset(
            "head",
            "format: 1\nrevision: 2\nsynonyms:\n  - id: pram\n    equivalent: [pram, pushchair, stroller]\nexempt: [universal]\nlemmas:\n  - {form: rode, lemma: rid}\n  - {form: left, lemma: leave}\n",
        );
        let d = diff(&base, &head);
        let summary: Vec<(String, &str, String)> = d
            .rules
            .iter()
            .map(|r| (format!("{:?}", r.change), r.section, r.label.clone()))
            .collect();
        assert!(
            summary.contains(&("Changed".into(), "synonym", "pram".into())),
            "{summary:?}"
        );
        assert!(summary.contains(&(
            "Removed".into(),
            "synonym",
            "equivalent [lift, elevator]".into()
        )));
        assert!(summary.contains(&("Added".into(), "exempt", "term universal".into())));
        assert!(summary.contains(&("Changed".into(), "lemma", "rode".into())));
        assert!(summary.contains(&("Added".into(), "lemma", "left".into())));
        let pram = d.rules.iter().find(|r| r.label == "pram").unwrap();
        assert_eq!(pram.members_added, ["stroller"]);
        assert_eq!(d.files.len(), 1);
        assert!(
            d.files[0]
                .unified
                .as_ref()
                .unwrap()
                .contains("+revision: 2")
        );
    }

    #[test]
    fn identical_rulesets_have_no_diff() {
        let text = "format: 1\nrevision: 1\nexempt: [x]\n";
        assert!(diff(&ruleset("a", text), &ruleset("b", text)).is_empty());
    }
}
