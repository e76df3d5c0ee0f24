//! Stage 6: an exact surface form listed as an irregular form becomes its lemma.

use rustc_hash::FxHashMap;

/// Irregular form → (lemma, index of the rule in the ruleset's `lemmas`).
#[derive(Clone, Debug, Default)]
pub struct Lemmas {
    map: FxHashMap<String, (String, usize)>,
}

impl Lemmas {
    pub fn new(map: FxHashMap<String, (String, usize)>) -> Self {
        Lemmas { map }
    }

    pub fn lookup(&self, form: &str) -> Option<(&str, usize)> {
        self.map
            .get(form)
            .map(|(lemma, rule)| (lemma.as_str(), *rule))
    }

    pub fn len(&self) -> usize {
        self.map.len()
    }

    pub fn is_empty(&self) -> bool {
        self.map.is_empty()
    }
}
