//! Stage 8 (query side): synonym expansion. Rule terms were normalized through steps 1–7,
//! so rules speak in keys: a query phrase matches a rule member when their key sequences
//! (with the gaps that dropped stopwords leave) are equal. An equivalent set makes its
//! members interchangeable; a one-way rule adds its targets to its source. Matching is
//! leftmost-longest and does not overlap; expansion is one step, not transitive, so a term
//! in two sets gets the members of both.

use rustc_hash::FxHashMap;
use serde::Serialize;

/// A key sequence with positions relative to its first token (gaps are dropped stopwords).
#[derive(Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
pub struct Phrase {
    pub keys: Vec<(u32, String)>,
}

impl Phrase {
    pub fn single(key: &str) -> Self {
        Phrase {
            keys: vec![(0, key.to_string())],
        }
    }

    pub fn is_single(&self) -> bool {
        self.keys.len() == 1
    }

    /// The keys joined by spaces, gaps shown as `_`.
    pub fn display(&self) -> String {
        let mut out = String::new();
        let mut next = 0;
        for (pos, key) in &self.keys {
            while next < *pos {
                out.push_str(if out.is_empty() { "_" } else { " _" });
                next += 1;
            }
            if !out.is_empty() {
                out.push(' ');
            }
            out.push_str(key);
            next = pos + 1;
        }
        out
    }
}

/// A compiled synonym rule, in keys.
#[derive(Clone, Debug)]
pub enum CompiledSynonym {
    Equivalent(Vec<Phrase>),
    OneWay { from: Phrase, to: Vec<Phrase> },
}

#[derive(Clone, Debug)]
struct Entry {
    phrase: Phrase,
    rule: usize,
}

/// Every phrase that can trigger an expansion, indexed by its first key.
#[derive(Clone, Debug, Default)]
pub struct SynonymTable {
    rules: Vec<CompiledSynonym>,
    entries: Vec<Entry>,
    by_first_key: FxHashMap<String, Vec<usize>>,
}

/// One alternative for a stretch of the query, and the synonym rules (indices into the
/// ruleset's `synonyms`) that put it there; the query's own words have no rules.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Alternative {
    pub phrase: Phrase,
    pub rules: Vec<usize>,
}

/// What a stretch of keyed tokens expanded to.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Expansion {
    /// Index of the first keyed token covered, and how many keyed tokens.
    pub start: usize,
    pub len: usize,
    /// The stretch's own phrase first, then the synonyms in rule order.
    pub alternatives: Vec<Alternative>,
}

impl SynonymTable {
    pub fn new(rules: Vec<CompiledSynonym>) -> Self {
        let mut table = SynonymTable {
            rules,
            ..SynonymTable::default()
        };
        for (rule, compiled) in table.rules.iter().enumerate() {
            let triggers: Vec<&Phrase> = match compiled {
                CompiledSynonym::Equivalent(members) => members.iter().collect(),
                CompiledSynonym::OneWay { from, .. } => vec![from],
            };
            for phrase in triggers {
                table.entries.push(Entry {
                    phrase: phrase.clone(),
                    rule,
                });
            }
        }
        for (i, entry) in table.entries.iter().enumerate() {
            table
                .by_first_key
                .entry(entry.phrase.keys[0].1.clone())
                .or_default()
                .push(i);
        }
        table
    }

    pub fn rules(&self) -> &[CompiledSynonym] {
        &self.rules
    }

    pub fn is_empty(&self) -> bool {
        self.rules.is_empty()
    }

    /// Whether any rule can be triggered by a phrase starting with this key.
    pub fn triggers_on(&self, key: &str) -> bool {
        self.by_first_key.contains_key(key)
    }

    /// Expands keyed tokens `(position, key)` into stretches with their alternatives.
    pub fn expand(&self, tokens: &[(u32, &str)]) -> Vec<Expansion> {
        let mut out = Vec::with_capacity(tokens.len());
        let mut i = 0;
        while i < tokens.len() {
            let matched = self.longest_match(tokens, i);
            let len = matched.first().map_or(1, |e| e.phrase.keys.len());
            let own = phrase_of(&tokens[i..i + len]);
            let mut alternatives = vec![Alternative {
                phrase: own.clone(),
                rules: Vec::new(),
            }];
            // Where each phrase already is among the alternatives: a set of 100k members
            // makes 100k alternatives, each looked up once.
            let mut placed: FxHashMap<&Phrase, usize> = FxHashMap::default();
            placed.insert(&own, 0);
            for entry in matched {
                let targets: &[Phrase] = match &self.rules[entry.rule] {
                    CompiledSynonym::Equivalent(members) => members,
                    CompiledSynonym::OneWay { to, .. } => to,
                };
                for phrase in targets {
                    add_alternative(&mut alternatives, &mut placed, phrase, entry.rule);
                }
            }
            out.push(Expansion {
                start: i,
                len,
                alternatives,
            });
            i += len;
        }
        out
    }

    /// All entries matching at `i` with the greatest length.
    fn longest_match(&self, tokens: &[(u32, &str)], i: usize) -> Vec<&Entry> {
        let Some(candidates) = self.by_first_key.get(tokens[i].1) else {
            return Vec::new();
        };
        let mut best: Vec<&Entry> = Vec::new();
        for &c in candidates {
            let entry = &self.entries[c];
            if !matches_at(&entry.phrase, tokens, i) {
                continue;
            }
            let len = entry.phrase.keys.len();
            match best.first().map(|b| b.phrase.keys.len()) {
                Some(b) if b > len => {}
                Some(b) if b == len => best.push(entry),
                _ => best = vec![entry],
            }
        }
        best
    }
}

fn matches_at(phrase: &Phrase, tokens: &[(u32, &str)], i: usize) -> bool {
    let Some(window) = tokens.get(i..i + phrase.keys.len()) else {
        return false;
    };
    let base = window[0].0;
    window
        .iter()
        .zip(&phrase.keys)
        .all(|((pos, key), (rel, want))| pos - base == *rel && key == want)
}

fn phrase_of(tokens: &[(u32, &str)]) -> Phrase {
    let base = tokens[0].0;
    Phrase {
        keys: tokens
            .iter()
            .map(|(pos, key)| (pos - base, key.to_string()))
            .collect(),
    }
}

/// Adds `phrase` (offered by `rule`) to the alternatives, or `rule` to the alternative
/// already holding it. `placed` says where each phrase is; the query's own phrase is at 0.
fn add_alternative<'a>(
    alternatives: &mut Vec<Alternative>,
    placed: &mut FxHashMap<&'a Phrase, usize>,
    phrase: &'a Phrase,
    rule: usize,
) {
    if let Some(&at) = placed.get(phrase) {
        // The query's own words stay rule-free; another rule offering the same phrase is
        // recorded so attribution sees every rule involved. Rules arrive in ascending
        // order, so a rule already recorded is the last one.
        let existing = &mut alternatives[at];
        if at != 0 && existing.rules.last() != Some(&rule) {
            existing.rules.push(rule);
        }
        return;
    }
    placed.insert(phrase, alternatives.len());
    alternatives.push(Alternative {
        phrase: phrase.clone(),
        rules: vec![rule],
    });
}

#[cfg(test)]
mod tests {
    use super::*;

    fn p(words: &[&str]) -> Phrase {
        Phrase {
            keys: words
                .iter()
                .enumerate()
                .map(|(i, w)| (i as u32, w.to_string()))
                .collect(),
        }
    }

    #[test]
    fn longest_member_wins_and_one_way_does_not_reverse() {
        let table = SynonymTable::new(vec![
            CompiledSynonym::Equivalent(vec![p(&["light", "rail"]), p(&["tram"])]),
            CompiledSynonym::OneWay {
                from: p(&["lift"]),
                to: vec![p(&["elev"])],
            },
        ]);
        let q = [(0, "light"), (1, "rail"), (2, "lift")];
        let e = table.expand(&q);
        assert_eq!(e.len(), 2);
        assert_eq!(e[0].len, 2);
        assert_eq!(e[0].alternatives[1].phrase, p(&["tram"]));
        assert_eq!(e[1].alternatives.len(), 2);
        let back = table.expand(&[(0, "elev")]);
        assert_eq!(
            back[0].alternatives.len(),
            1,
            "one-way rules do not reverse"
        );
    }

    #[test]
    fn gaps_must_line_up() {
        let gap = Phrase {
            keys: vec![(0, "park".into()), (2, "ride".into())],
        };
        let table = SynonymTable::new(vec![CompiledSynonym::Equivalent(vec![
            gap.clone(),
            p(&["p+r"]),
        ])]);
        assert_eq!(table.expand(&[(0, "park"), (2, "ride")])[0].len, 2);
        assert_eq!(table.expand(&[(0, "park"), (1, "ride")])[0].len, 1);
        assert_eq!(gap.display(), "park _ ride");
    }

    #[test]
    fn a_term_in_two_sets_gets_both() {
        let table = SynonymTable::new(vec![
            CompiledSynonym::Equivalent(vec![p(&["chang"]), p(&["transfer"])]),
            CompiledSynonym::Equivalent(vec![p(&["chang"]), p(&["amend"])]),
        ]);
        let e = table.expand(&[(0, "chang")]);
        let alts: Vec<String> = e[0]
            .alternatives
            .iter()
            .map(|a| a.phrase.display())
            .collect();
        assert_eq!(alts, ["chang", "transfer", "amend"]);
    }
}
