//! Suggestions that split a risky conflation group along its meaning classes, each
//! verified by recompiling the analyzer with it.
//!
//! To move a class out of the shared key, exempt its base form and map the class's other
//! forms to that base with lemma overrides (an exempt lemma is the key of its forms, step 7
//! of the contract). Exempting a single form is not enough in general: exempting
//! `transit` leaves it on the key `transit`, which `transition` still stems to. So every
//! candidate is checked on a recompiled analyzer: each moved class must land on one key of
//! its own, different from every other class's keys and from every key the vocabulary
//! already uses. The class kept on the shared key is tried heaviest first; the first
//! choice that verifies is suggested.

use std::collections::BTreeMap;
use std::sync::Arc;

use serde::Serialize;

use super::collisions::{Collision, KeyIndex, MeaningClass};
use crate::analysis::Analyzer;
use crate::rules::{
    ExemptKind, Exemption, LemmaOverride, Origin, Position, RuleMeta, Ruleset, Term,
};

/// One rule of a suggestion, as it will be written.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum SuggestedRule {
    Exempt {
        id: String,
        term: String,
        note: String,
    },
    Lemma {
        id: String,
        form: String,
        lemma: String,
        note: String,
    },
}

/// A verified way to split one group.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Suggestion {
    /// The group's key.
    pub key: String,
    /// The class left on the shared key.
    pub kept: String,
    /// Surface form → key after the change, for every form whose key changes.
    pub changed: BTreeMap<String, String>,
    pub rules: Vec<SuggestedRule>,
    /// The rules as a YAML fragment in the rule-file format.
    pub yaml: String,
}

/// Finds a verified suggestion for `collision`, or `None` when no choice of kept class
/// verifies. `index` tells which keys and forms the vocabulary already has.
pub fn suggest(live: &Analyzer, collision: &Collision, index: &KeyIndex) -> Option<Suggestion> {
    let used_ids: std::collections::HashSet<String> = live
        .ruleset()
        .all_meta()
        .filter_map(|m| m.id.clone())
        .collect();
    for kept in 0..collision.classes.len() {
        let moved: Vec<&MeaningClass> = collision
            .classes
            .iter()
            .enumerate()
            .filter(|(i, _)| *i != kept)
            .map(|(_, c)| c)
            .collect();
        let Some(rules) = rules_for(live, collision, &moved, &used_ids) else {
            continue;
        };
        if let Some(changed) = verify(live, collision, kept, &moved, &rules, index) {
            return Some(Suggestion {
                key: collision.key.clone(),
                kept: collision.classes[kept].base.clone(),
                changed,
                yaml: fragment(&rules),
                rules,
            });
        }
    }
    None
}

/// The key a moved class lands on: its base form when that is one surface token the
/// tokenizer keeps whole, else its most frequent form.
fn target(live: &Analyzer, class: &MeaningClass) -> String {
    let tokens = live.surface().tokens(&class.base);
    if matches!(tokens.as_slice(), [t] if t.form == class.base) {
        return class.base.clone();
    }
    class
        .forms
        .iter()
        .max_by(|a, b| {
            a.documents
                .cmp(&b.documents)
                .then_with(|| b.form.cmp(&a.form))
        })
        .map(|f| f.form.clone())
        .unwrap_or_default()
}

fn rules_for(
    live: &Analyzer,
    collision: &Collision,
    moved: &[&MeaningClass],
    used_ids: &std::collections::HashSet<String>,
) -> Option<Vec<SuggestedRule>> {
    let mut rules = Vec::new();
    let mut ids = used_ids.clone();
    let mut fresh = |wanted: String| {
        let mut id = wanted.clone();
        let mut n = 2;
        while ids.contains(&id) {
            id = format!("{wanted}-{n}");
            n += 1;
        }
        ids.insert(id.clone());
        id
    };
    for class in moved {
        let base = target(live, class);
        if base.is_empty() {
            return None;
        }
        rules.push(SuggestedRule::Exempt {
            id: fresh(format!("keep-{base}")),
            term: base.clone(),
            note: format!(
                "keeps \"{base}\" apart from the other words stemmed to \"{}\"",
                collision.key
            ),
        });
        for f in class.forms.iter().filter(|f| f.form != base) {
            rules.push(SuggestedRule::Lemma {
                id: fresh(format!("{}-to-{base}", f.form)),
                form: f.form.clone(),
                lemma: base.clone(),
                note: format!("a form of \"{base}\", kept on its key"),
            });
        }
    }
    Some(rules)
}

/// Recompiles with the rules and checks the split: each moved class on one new key of its
/// own, no key shared between classes, no key already used elsewhere in the vocabulary.
/// Returns the forms whose key changed.
fn verify(
    live: &Analyzer,
    collision: &Collision,
    kept: usize,
    moved: &[&MeaningClass],
    rules: &[SuggestedRule],
    index: &KeyIndex,
) -> Option<BTreeMap<String, String>> {
    let changed_analyzer = with_rules(live.ruleset(), rules).ok()?;
    let key = |f: &str| changed_analyzer.key(f).map(|k| k.into_owned());
    let kept_keys: std::collections::BTreeSet<Option<String>> = collision.classes[kept]
        .forms
        .iter()
        .map(|f| key(&f.form))
        .collect();
    let mut taken = kept_keys;
    let mut changed = BTreeMap::new();
    for class in moved {
        let keys: std::collections::BTreeSet<Option<String>> =
            class.forms.iter().map(|f| key(&f.form)).collect();
        let new_key = match keys.into_iter().collect::<Vec<_>>().as_slice() {
            [Some(k)] => k.clone(),
            _ => return None,
        };
        if taken.contains(&Some(new_key.clone())) || index.key_in_use(&new_key) {
            return None;
        }
        // An exempt base that occurs elsewhere in the corpus would move too: not a split.
        let is_member = class.forms.iter().any(|f| f.form == new_key);
        if !is_member && index.has_form(&new_key) {
            return None;
        }
        taken.insert(Some(new_key.clone()));
        for f in &class.forms {
            changed.insert(f.form.clone(), new_key.clone());
        }
    }
    // Unclassified forms must not move: the rules name only classified forms.
    let still = collision
        .unclassified
        .iter()
        .all(|f| key(&f.form).as_deref() == Some(collision.key.as_str()));
    still.then_some(changed)
}

/// The live ruleset with the suggested rules added, compiled.
pub fn with_rules(
    live: &Ruleset,
    rules: &[SuggestedRule],
) -> Result<Analyzer, crate::rules::RulesError> {
    let mut ruleset = live.clone();
    let file: Arc<str> = Arc::from("(suggestion)");
    let origin = Origin::new(&file, Position { line: 1, column: 1 });
    let meta = |id: &str, note: &str| RuleMeta {
        id: Some(id.to_string()),
        note: Some(note.to_string()),
        origin: origin.clone(),
        lint: Vec::new(),
    };
    let term = |text: &str| Term {
        text: text.to_string(),
        origin: origin.clone(),
    };
    for rule in rules {
        match rule {
            SuggestedRule::Exempt { id, term: t, note } => ruleset.exemptions.push(Exemption {
                meta: meta(id, note),
                kind: ExemptKind::Term(term(t)),
            }),
            SuggestedRule::Lemma {
                id,
                form,
                lemma,
                note,
            } => ruleset.lemmas.push(LemmaOverride {
                meta: meta(id, note),
                form: term(form),
                lemma: term(lemma),
            }),
        }
    }
    Analyzer::new(ruleset)
}

/// A YAML string scalar: JSON's double-quoted strings are valid YAML.
fn quoted(text: &str) -> String {
    serde_json::to_string(text).unwrap_or_else(|_| format!("{text:?}"))
}

/// The `exempt:` and `lemmas:` sections for some rules (no header).
pub fn fragment(rules: &[SuggestedRule]) -> String {
    let mut exempt = String::new();
    let mut lemmas = String::new();
    for rule in rules {
        match rule {
            SuggestedRule::Exempt { id, term, note } => exempt.push_str(&format!(
                "  - id: {id}\n    term: {}\n    note: {}\n",
                quoted(term),
                quoted(note)
            )),
            SuggestedRule::Lemma {
                id,
                form,
                lemma,
                note,
            } => lemmas.push_str(&format!(
                "  - id: {id}\n    form: {}\n    lemma: {}\n    note: {}\n",
                quoted(form),
                quoted(lemma),
                quoted(note)
            )),
        }
    }
    let mut out = String::new();
    if !exempt.is_empty() {
        out.push_str("exempt:\n");
        out.push_str(&exempt);
    }
    if !lemmas.is_empty() {
        out.push_str("lemmas:\n");
        out.push_str(&lemmas);
    }
    out
}

/// A complete new rule file holding the accepted suggestions.
pub fn rule_file(accepted: &[&Suggestion]) -> String {
    let groups: Vec<&str> = accepted.iter().map(|s| s.key.as_str()).collect();
    let rules: Vec<SuggestedRule> = accepted.iter().flat_map(|s| s.rules.clone()).collect();
    format!(
        "# Written by `lexdelta collisions --write`: splits the conflation groups {}.\n# Review each rule before merging.\nformat: 1\nrevision: 1\n\n{}",
        groups.join(", "),
        fragment(&rules)
    )
}
