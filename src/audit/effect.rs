//! What a suggestion would do to the query log: the queries whose matching documents
//! change, with the documents they gain and lose.

use std::collections::BTreeMap;

use rustc_hash::FxHashSet;
use serde::Serialize;

use super::collisions::KeyIndex;
use super::postings::FormLists;
use super::suggest::Suggestion;
use crate::analysis::SurfaceStage;
use crate::corpus::QueryLog;

/// One query whose matches change.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct QueryEffect {
    pub query: String,
    pub searches: u64,
    /// The query's surface forms whose matching documents change.
    pub terms: Vec<String>,
    /// Documents the query's changed terms match after, and not before.
    pub gained: usize,
    /// Documents they matched before, and not after.
    pub lost: usize,
}

/// The effect of one suggestion on a query log.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize)]
pub struct Effect {
    /// Queries whose matches change, most searched first (ties by text).
    pub queries: Vec<QueryEffect>,
    /// Their searches, summed.
    pub searches: u64,
}

/// The forms whose postings [`estimate_effect`] needs for `suggestion`: its whole group.
pub fn forms_needed(suggestion: &Suggestion, index: &KeyIndex, into: &mut FxHashSet<String>) {
    for i in index.group(&suggestion.key) {
        into.insert(index.vocabulary.forms[i].form.clone());
    }
}

/// A small, exact, self-contained estimate of a suggestion's effect under single-term
/// matching: a query term matches the documents holding any form with the term's key.
/// For every form of the group, the documents its key matches before and after the
/// change are compared; a query is listed when one of its terms gains or loses documents.
/// Synonym expansion, phrases and ranking are not modelled.
///
/// On a query of one word that no synonym expands, this model is the preview's, and
/// `tests/collisions_effect.rs` checks that the two give the same documents gained and lost
/// for every suggestion; on longer queries this is per term where the preview is per query.
pub fn estimate_effect(
    suggestion: &Suggestion,
    index: &KeyIndex,
    postings: &FormLists,
    surface: &SurfaceStage,
    log: &QueryLog,
) -> Effect {
    let group: Vec<&str> = index
        .group(&suggestion.key)
        .map(|i| index.vocabulary.forms[i].form.as_str())
        .collect();
    let before = postings.union(group.iter().copied());
    let kept_after = postings.union(
        group
            .iter()
            .copied()
            .filter(|f| !suggestion.changed.contains_key(*f)),
    );
    // New key → documents of the forms that move to it (verification made these keys new).
    let mut moved: BTreeMap<&str, Vec<&str>> = BTreeMap::new();
    for (form, key) in &suggestion.changed {
        moved.entry(key.as_str()).or_default().push(form.as_str());
    }
    let moved_docs: BTreeMap<&str, Vec<u32>> = moved
        .into_iter()
        .map(|(k, forms)| (k, postings.union(forms)))
        .collect();
    // A term's documents after the change depend only on where its form goes (kept under
    // the key, or moved to a new key), so gains and losses are computed once per target.
    let target_of = |form: &str| suggestion.changed.get(form).map(String::as_str);
    let mut changes: BTreeMap<Option<&str>, (Vec<u32>, Vec<u32>)> = BTreeMap::new();
    for form in &group {
        changes.entry(target_of(form)).or_insert_with_key(|target| {
            let after: &[u32] = match target {
                Some(key) => &moved_docs[key],
                None => &kept_after,
            };
            (difference(after, &before), difference(&before, after))
        });
    }
    let members: FxHashSet<&str> = group.iter().copied().collect();
    let mut queries = Vec::new();
    for entry in &log.queries {
        let mut terms: Vec<String> = Vec::new();
        surface.for_each(&entry.query, |_, form| {
            if members.contains(&*form) && !terms.iter().any(|t| *t == *form) {
                terms.push(form.into_owned());
            }
        });
        let mut targets: Vec<Option<&str>> = Vec::new();
        let mut changed_terms = Vec::new();
        for t in terms {
            let target = target_of(&t);
            let (g, l) = &changes[&target];
            if !g.is_empty() || !l.is_empty() {
                if !targets.contains(&target) {
                    targets.push(target);
                }
                changed_terms.push(t);
            }
        }
        if changed_terms.is_empty() {
            continue;
        }
        let (gained, lost) = match targets.as_slice() {
            [one] => (changes[one].0.len(), changes[one].1.len()),
            many => {
                let mut gained: FxHashSet<u32> = FxHashSet::default();
                let mut lost: FxHashSet<u32> = FxHashSet::default();
                for t in many {
                    gained.extend(&changes[t].0);
                    lost.extend(&changes[t].1);
                }
                (gained.len(), lost.len())
            }
        };
        queries.push(QueryEffect {
            query: entry.query.clone(),
            searches: entry.count,
            terms: changed_terms,
            gained,
            lost,
        });
    }
    queries.sort_by(|a, b| {
        b.searches
            .cmp(&a.searches)
            .then_with(|| a.query.cmp(&b.query))
    });
    Effect {
        searches: queries.iter().map(|q| q.searches).sum(),
        queries,
    }
}

/// Sorted-list difference `a \ b`, in one merge.
fn difference(a: &[u32], b: &[u32]) -> Vec<u32> {
    let mut out = Vec::new();
    let mut j = 0;
    for &x in a {
        while j < b.len() && b[j] < x {
            j += 1;
        }
        if j == b.len() || b[j] != x {
            out.push(x);
        }
    }
    out
}
