//! Conflation groups that merge words of different meanings, ranked by risk.
//!
//! Every distinct surface form of the corpus (and of the query log) is keyed once under
//! the ruleset's analyzer; forms sharing a key make a conflation group. A group's forms are
//! split into **meaning classes** by WordNet's morphy: two forms whose base-form sets
//! intersect are in the same class (transitively), so `operates` and `operating` (base
//! `operate`) are one class and `operator` another. Forms WordNet does not know (brand
//! names, typos, route numbers) are **unclassified**: they are listed, but neither raise
//! nor lower the risk, since nothing says what they mean.
//!
//! # The risk score
//!
//! For a group whose classified forms fall into `m` classes, class `c` has a weight
//! `w_c = d_c + t_c`: its document weight `d_c` (the sum of its forms' document
//! frequencies, so a document holding two forms counts twice — an upper bound on distinct
//! documents that costs nothing to compute) plus its traffic `t_c` (searches whose query
//! contains one of its forms; zero without a query log). With `W = Σ w_c`:
//!
//! ```text
//! evenness = (1 − max_c w_c / W) · m / (m − 1)      (0 when one meaning holds everything,
//!                                                    1 for an even split)
//! risk     = W · evenness = (W − max_c w_c) · m / (m − 1)
//! ```
//!
//! A group with one class (or none) has risk 0. The score reads as "the documents and
//! searches at stake that do not belong to the group's dominant meaning", scaled so an
//! even split of any number of meanings scores its whole weight. Groups are ranked by risk,
//! highest first, ties broken by key, so the order is deterministic.

use serde::Serialize;

use super::morphy::Morphy;
use crate::analysis::Analyzer;
use crate::corpus::{FormStats, Vocabulary};

/// A form of a group, with what WordNet says its base forms are.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct GroupForm {
    pub form: String,
    pub documents: u64,
    pub searches: u64,
    pub queries: u64,
    pub bases: Vec<String>,
}

/// Forms of one group sharing a meaning (intersecting morphy base forms).
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct MeaningClass {
    /// The base form most of the class's forms share (ties: the first in order).
    pub base: String,
    pub forms: Vec<GroupForm>,
    /// The sum of the forms' document frequencies.
    pub documents: u64,
    pub searches: u64,
}

impl MeaningClass {
    pub fn weight(&self) -> u64 {
        self.documents + self.searches
    }
}

/// One conflation group with more than one meaning class.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Collision {
    pub key: String,
    pub risk: f64,
    pub evenness: f64,
    /// Classes, heaviest first (ties by base form).
    pub classes: Vec<MeaningClass>,
    /// Forms WordNet does not know.
    pub unclassified: Vec<GroupForm>,
}

impl Collision {
    pub fn form_count(&self) -> usize {
        self.classes.iter().map(|c| c.forms.len()).sum::<usize>() + self.unclassified.len()
    }
}

/// Every group of ≥ 2 forms, scored; and how many there were.
#[derive(Clone, Debug, Default)]
pub struct Groups {
    /// Groups with ≥ 2 forms.
    pub groups: usize,
    /// Groups with risk > 0, ranked.
    pub collisions: Vec<Collision>,
    /// (key, index into the vocabulary's forms) for every non-stopword form, by key.
    pub keyed: Vec<(String, usize)>,
}

/// Looks keys and forms up in the keyed vocabulary (both sorted, so binary searches).
#[derive(Clone, Copy, Debug)]
pub struct KeyIndex<'a> {
    pub keyed: &'a [(String, usize)],
    pub vocabulary: &'a Vocabulary,
}

impl KeyIndex<'_> {
    /// The forms keyed to `key` (indexes into the vocabulary's forms).
    pub fn group<'k>(&'k self, key: &'k str) -> impl Iterator<Item = usize> + 'k {
        let start = self.keyed.partition_point(|(k, _)| k.as_str() < key);
        self.keyed[start..]
            .iter()
            .take_while(move |(k, _)| k == key)
            .map(|(_, i)| *i)
    }

    pub fn key_in_use(&self, key: &str) -> bool {
        self.group(key).next().is_some()
    }

    pub fn has_form(&self, form: &str) -> bool {
        self.vocabulary
            .forms
            .binary_search_by(|f| f.form.as_str().cmp(form))
            .is_ok()
    }
}

/// Keys every form once (on `threads` threads), groups forms by key and scores each group.
pub fn find(
    analyzer: &Analyzer,
    vocabulary: &Vocabulary,
    morphy: &Morphy,
    threads: usize,
) -> Groups {
    let keyed = key_forms(analyzer, &vocabulary.forms, threads);
    let mut groups = 0;
    let mut collisions = Vec::new();
    for run in keyed.chunk_by(|a, b| a.0 == b.0) {
        if run.len() < 2 {
            continue;
        }
        groups += 1;
        let forms: Vec<&FormStats> = run.iter().map(|(_, i)| &vocabulary.forms[*i]).collect();
        if let Some(c) = score(&run[0].0, &forms, morphy) {
            collisions.push(c);
        }
    }
    rank(&mut collisions);
    Groups {
        groups,
        collisions,
        keyed,
    }
}

/// Ranks by risk, highest first, ties by key.
pub fn rank(collisions: &mut [Collision]) {
    collisions.sort_by(|a, b| b.risk.total_cmp(&a.risk).then_with(|| a.key.cmp(&b.key)));
}

/// (key, index into `forms`), sorted by key then form; stopwords left out.
pub fn key_forms(analyzer: &Analyzer, forms: &[FormStats], threads: usize) -> Vec<(String, usize)> {
    let chunk = forms.len().div_ceil(threads.max(1)).max(1);
    let keys: Vec<Option<String>> = std::thread::scope(|scope| {
        let handles: Vec<_> = forms
            .chunks(chunk)
            .map(|part| {
                scope.spawn(move || {
                    part.iter()
                        .map(|f| analyzer.key(&f.form).map(|k| k.into_owned()))
                        .collect::<Vec<_>>()
                })
            })
            .collect();
        handles
            .into_iter()
            .flat_map(|h| h.join().expect("a keying thread panicked"))
            .collect()
    });
    let mut keyed: Vec<(String, usize)> = keys
        .into_iter()
        .enumerate()
        .filter_map(|(i, k)| k.map(|k| (k, i)))
        .collect();
    // Forms are already sorted, so a stable sort by key keeps forms in order.
    keyed.sort_by(|a, b| a.0.cmp(&b.0));
    keyed
}

/// Splits a group into meaning classes and scores it; `None` when it has one meaning.
pub fn score(key: &str, forms: &[&FormStats], morphy: &Morphy) -> Option<Collision> {
    let mut known = Vec::new();
    let mut unclassified = Vec::new();
    for f in forms {
        let bases: Vec<String> = morphy.base_forms(&f.form).into_iter().collect();
        let g = GroupForm {
            form: f.form.clone(),
            documents: f.documents,
            searches: f.searches,
            queries: f.queries,
            bases,
        };
        if g.bases.is_empty() {
            unclassified.push(g);
        } else {
            known.push(g);
        }
    }
    let mut classes = split_classes(known);
    if classes.len() < 2 {
        return None;
    }
    classes.sort_by(|a, b| {
        b.weight()
            .cmp(&a.weight())
            .then_with(|| a.base.cmp(&b.base))
    });
    let (risk, evenness) = risk(&classes.iter().map(MeaningClass::weight).collect::<Vec<_>>());
    Some(Collision {
        key: key.to_string(),
        risk,
        evenness,
        classes,
        unclassified,
    })
}

/// `(risk, evenness)` from the class weights, as defined in the module docs.
pub fn risk(weights: &[u64]) -> (f64, f64) {
    let m = weights.len();
    let total: u64 = weights.iter().sum();
    if m < 2 || total == 0 {
        return (0.0, 0.0);
    }
    let max = *weights.iter().max().unwrap_or(&0);
    let scale = m as f64 / (m as f64 - 1.0);
    let evenness = (1.0 - max as f64 / total as f64) * scale;
    ((total - max) as f64 * scale, evenness)
}

/// Union of forms whose base sets intersect (a small union-find over the group).
fn split_classes(forms: Vec<GroupForm>) -> Vec<MeaningClass> {
    let mut parent: Vec<usize> = (0..forms.len()).collect();
    fn find(parent: &mut [usize], i: usize) -> usize {
        let mut r = i;
        while parent[r] != r {
            r = parent[r];
        }
        parent[i] = r;
        r
    }
    let mut owner: std::collections::BTreeMap<&str, usize> = Default::default();
    for (i, f) in forms.iter().enumerate() {
        for b in &f.bases {
            match owner.get(b.as_str()) {
                Some(&j) => {
                    let (ri, rj) = (find(&mut parent, i), find(&mut parent, j));
                    parent[ri.max(rj)] = ri.min(rj);
                }
                None => {
                    owner.insert(b, i);
                }
            }
        }
    }
    let roots: Vec<usize> = (0..forms.len()).map(|i| find(&mut parent, i)).collect();
    let mut buckets: std::collections::BTreeMap<usize, Vec<GroupForm>> = Default::default();
    for (f, r) in forms.into_iter().zip(roots) {
        buckets.entry(r).or_default().push(f);
    }
    buckets.into_values().map(class_of).collect()
}

fn class_of(forms: Vec<GroupForm>) -> MeaningClass {
    let mut tally: std::collections::BTreeMap<&str, usize> = Default::default();
    for f in &forms {
        for b in &f.bases {
            *tally.entry(b).or_default() += 1;
        }
    }
    // Most shared base; among equals prefer one that is itself a form of the class, then
    // the alphabetically first (BTreeMap order), so the choice is deterministic.
    let is_form = |b: &str| forms.iter().any(|f| f.form == b);
    let base = tally
        .iter()
        .max_by(|a, b| {
            a.1.cmp(b.1)
                .then_with(|| is_form(a.0).cmp(&is_form(b.0)))
                .then_with(|| b.0.cmp(a.0))
        })
        .map(|(b, _)| b.to_string())
        .unwrap_or_default();
    MeaningClass {
        documents: forms.iter().map(|f| f.documents).sum(),
        searches: forms.iter().map(|f| f.searches).sum(),
        base,
        forms,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn one_meaning_is_no_risk_and_an_even_split_is_the_whole_weight() {
        assert_eq!(risk(&[10]), (0.0, 0.0));
        assert_eq!(risk(&[5, 5]), (10.0, 1.0));
        // 99 against 1: (100 − 99) · 2 = 2, far below the even split's 100.
        let (r, e) = risk(&[99, 1]);
        assert!((r - 2.0).abs() < 1e-9 && (e - 0.02).abs() < 1e-9);
        let (r, e) = risk(&[4, 4, 4]);
        assert!((r - 12.0).abs() < 1e-9 && (e - 1.0).abs() < 1e-9);
    }

    #[test]
    fn forms_sharing_a_base_are_one_class() {
        let f = |form: &str, bases: &[&str]| GroupForm {
            form: form.into(),
            documents: 1,
            searches: 0,
            queries: 0,
            bases: bases.iter().map(|s| s.to_string()).collect(),
        };
        let classes = split_classes(vec![
            f("operate", &["operate"]),
            f("operating", &["operate"]),
            f("operator", &["operator"]),
            f("operators", &["operator"]),
        ]);
        assert_eq!(classes.len(), 2);
        assert_eq!(classes[0].base, "operate");
        assert_eq!(classes[1].forms.len(), 2);
    }
}
