//! Stage 5: an exempt surface form is its own key, untouched by lemma and stem.
//! Literals are looked up first (a hash probe); patterns run only when no literal matched,
//! as one `RegexSet` pass.

use regex::{Regex, RegexSet, RegexSetBuilder};
use rustc_hash::FxHashMap;

/// Which exemption rule (index into the ruleset's `exemptions`) protects a form.
#[derive(Clone, Debug, Default)]
pub struct Exemptions {
    literals: FxHashMap<String, usize>,
    patterns: Option<RegexSet>,
    pattern_rules: Vec<usize>,
}

/// The size limit of the compiled set of all exemption patterns: each pattern alone is
/// limited to 1 MiB when its file is read, and all together to this.
pub const PATTERN_SET_LIMIT: usize = 16 << 20;

/// The exemption patterns compile alone but not together: the set outgrew
/// [`PATTERN_SET_LIMIT`]. `rule` is the pattern whose addition made it too large.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct PatternSetTooLarge {
    /// The exemption rule (index into the ruleset's `exemptions`).
    pub rule: usize,
    /// How many patterns there are in all.
    pub patterns: usize,
}

fn pattern_set(patterns: &[(Regex, usize)]) -> Result<RegexSet, regex::Error> {
    RegexSetBuilder::new(patterns.iter().map(|(re, _)| re.as_str()))
        .size_limit(PATTERN_SET_LIMIT)
        .build()
}

impl Exemptions {
    /// Literals and patterns with their rules. Fails when the patterns, each valid alone,
    /// are too large as one set.
    pub fn new(
        literals: Vec<(String, usize)>,
        patterns: Vec<(Regex, usize)>,
    ) -> Result<Self, PatternSetTooLarge> {
        let mut map = FxHashMap::default();
        for (form, rule) in literals {
            // The first rule that names a form is the one reported.
            map.entry(form).or_insert(rule);
        }
        let set = if patterns.is_empty() {
            None
        } else {
            match pattern_set(&patterns) {
                Ok(set) => Some(set),
                Err(_) => {
                    // Name the pattern that tips the set over: the shortest failing prefix,
                    // found by halving (a failure is rare, so a few compiles are cheap).
                    let (mut ok, mut bad) = (0, patterns.len());
                    while bad - ok > 1 {
                        let mid = ok + (bad - ok) / 2;
                        if pattern_set(&patterns[..mid]).is_ok() {
                            ok = mid;
                        } else {
                            bad = mid;
                        }
                    }
                    return Err(PatternSetTooLarge {
                        rule: patterns[bad - 1].1,
                        patterns: patterns.len(),
                    });
                }
            }
        };
        Ok(Exemptions {
            literals: map,
            patterns: set,
            pattern_rules: patterns.into_iter().map(|(_, rule)| rule).collect(),
        })
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

#[cfg(test)]
mod tests {
    use super::*;

    fn pattern(source: &str) -> Regex {
        regex::RegexBuilder::new(&format!("^(?:{source})$"))
            .size_limit(1 << 20)
            .build()
            .unwrap()
    }

    #[test]
    fn patterns_too_large_together_name_the_one_that_tips_the_set() {
        // Each alone is under the per-pattern limit; together they outgrow the set's.
        let many: Vec<(Regex, usize)> = (0..40)
            .map(|i| (pattern(&format!(r"x{i}\w{{20}}")), i + 3))
            .collect();
        let err = Exemptions::new(Vec::new(), many.clone()).unwrap_err();
        assert_eq!(err.patterns, 40);
        let tipping = err.rule - 3;
        assert!(pattern_set(&many[..tipping]).is_ok());
        assert!(pattern_set(&many[..=tipping]).is_err());
        let few = Exemptions::new(Vec::new(), many[..2].to_vec()).unwrap();
        assert!(few.rule_for("x").is_none());
    }
}
