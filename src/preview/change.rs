//! Reducing a rule change to what it can affect: surface forms whose key differs, the keys
//! of both sides' groups that gained or lost members, and queries whose expansion differs.

use rustc_hash::{FxHashMap, FxHashSet};

use super::keys::FormKeys;
use crate::analysis::{AnalyzedQuery, Analyzer};
use crate::index::SurfaceForms;

/// What a change touches.
#[derive(Debug, Default)]
pub struct ChangeSet {
    /// Keys (of either side) whose conflation group gained or lost a member.
    pub affected_keys: FxHashSet<String>,
    /// Affected key → the surface forms that moved into or out of it.
    pub moved_forms: FxHashMap<String, Vec<String>>,
    pub changed_forms: usize,
    /// Why every query must be evaluated, if so.
    pub evaluate_all: Option<String>,
}

fn stopword_set(analyzer: &Analyzer) -> Vec<String> {
    let mut v: Vec<String> = analyzer
        .ruleset()
        .pipeline
        .stopwords
        .iter()
        .map(|t| analyzer.surface().form(&t.text).into_owned())
        .collect();
    v.sort();
    v.dedup();
    v
}

impl ChangeSet {
    /// Compares both sides' keys of every surface form of the shared index (`None` when
    /// the surface settings differ and each side has its own index).
    pub fn from_keys(
        base: &Analyzer,
        head: &Analyzer,
        shared: Option<(&SurfaceForms, (&FormKeys, &FormKeys))>,
    ) -> ChangeSet {
        let mut change = ChangeSet::default();
        let Some((forms, (base_keys, head_keys))) = shared else {
            change.evaluate_all = Some(
                "the surface settings (tokenizer, case, accents) differ: every query was run, \
                 each side on its own surface index"
                    .into(),
            );
            return change;
        };
        if stopword_set(base) != stopword_set(head) {
            change.evaluate_all = Some(
                "the stopword lists differ, which changes every document's length: every query \
                 was run"
                    .into(),
            );
        }
        for i in 0..forms.len() as u32 {
            let (b, h) = (base_keys.key(i), head_keys.key(i));
            if b == h {
                continue;
            }
            change.changed_forms += 1;
            for key in [b, h].into_iter().flatten() {
                change.affected_keys.insert(key.to_string());
                change
                    .moved_forms
                    .entry(key.to_string())
                    .or_default()
                    .push(forms.form(i).to_string());
            }
        }
        change
    }
}

/// Every key a query's expansion mentions.
pub fn touched_keys(query: &AnalyzedQuery) -> impl Iterator<Item = &str> {
    query
        .expansions
        .iter()
        .flat_map(|e| &e.alternatives)
        .flat_map(|a| &a.phrase.keys)
        .map(|(_, k)| k.as_str())
}

/// Whether two analyses retrieve the same way (rule indices aside).
pub fn same_expansions(a: &AnalyzedQuery, b: &AnalyzedQuery) -> bool {
    a.expansions.len() == b.expansions.len()
        && a.expansions.iter().zip(&b.expansions).all(|(x, y)| {
            x.alternatives.len() == y.alternatives.len()
                && x.alternatives
                    .iter()
                    .zip(&y.alternatives)
                    .all(|(p, q)| p.phrase == q.phrase)
        })
}
