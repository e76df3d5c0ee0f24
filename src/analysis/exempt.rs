//! Stage 5: an exempt surface form is its own key, untouched by lemma and stem.
//! Literals are looked up first (a hash probe); patterns run only when no literal matched,
//! as one `RegexSet` pass.

use regex::{Regex, RegexSet};
use rustc_hash::FxHashMap;

/// Which exemption rule (index into the ruleset's `exemptions`) protects a form.
#[derive(Clone, Debug, Default)]
pub struct Exemptions {
    literals: FxHashMap<String, usize>,
    patterns: Option<RegexSet>,
    pattern_rules: Vec<usize>,
}

impl Exemptions {
    pub fn new(literals: Vec<(String, usize)>, patterns: Vec<(Regex, usize)>) -> Self {
        let mut map = FxHashMap::default();
        for (form, rule) in literals {
            // The first rule that names a form is the one reported.
            map.entry(form).or_insert(rule);
        }
        let set = (!patterns.is_empty()).then(|| {
            RegexSet::new(patterns.iter().map(|(re, _)| re.as_str()))
                .expect("each pattern compiled alone, so the set compiles")
        });
        Exemptions {
            literals: map,
            patterns: set,
            pattern_rules: patterns.into_iter().map(|(_, rule)| rule).collect(),
        }
    }

    /// The rule that exempts `form`, if any.
    pub fn rule_for(&self, form: &str) -> Option<usize> {
        if let Some(rule) = self.literals.get(form) {
            return Some(*rule);
        }
        let set = self.patterns.as_ref()?;
        set.matches(form)
            .iter()
            .next()
            .map(|i| self.pattern_rules[i])
    }

    pub fn literal_forms(&self) -> impl Iterator<Item = (&str, usize)> {
        self.literals.iter().map(|(k, v)| (k.as_str(), *v))
    }
}
