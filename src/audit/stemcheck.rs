//! Paice's error-counting evaluation of a stemmer against concept groups (C. D. Paice,
//! "An evaluation method for stemming algorithms", SIGIR '94; and "Method for evaluation
//! of stemming algorithms based on error counting", JASIS 47(8), 1996).
//!
//! Given groups of words that should conflate (one concept each), with `n_g` words in
//! group `g` and `W` words in all:
//!
//! ```text
//! GDMT = Σ_g ½ n_g (n_g − 1)            desired merges
//! GUMT = Σ_g Σ_s ½ u_gs (n_g − u_gs)    unachieved merges; u_gs = words of g with stem s
//! GDNT = Σ_g ½ n_g (W − n_g)            desired non-merges
//! GWMT = Σ_s Σ_g ½ v_sg (n_s − v_sg)    wrongly merged; n_s = words with stem s,
//!                                       v_sg = those of them in group g
//! UI = GUMT / GDMT    OI = GWMT / GDNT    SW = OI / UI
//! ```
//!
//! ERRT compares a stemmer with truncation: `trunc(k)` keeps a word's first `k` letters;
//! its `(UI, OI)` points for k = 2..10, joined in order by straight segments, make the
//! truncation line. With `P` the stemmer's point and `X` where the ray from the origin
//! through `P` meets that line, `ERRT = |OP| / |OX|` (below 1: better than truncation).
//! When the ray passes beyond either end of the line, the end segment is extended.
//!
//! Totals are kept doubled as integers (`2·GDMT` and so on), so the arithmetic is exact.

use rustc_hash::FxHashMap;
use serde::Serialize;

use crate::analysis::Analyzer;
use crate::rules::{RulesError, Ruleset};

/// The counts and indices for one stemmer.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Indices {
    pub gdmt: f64,
    pub gumt: f64,
    pub gdnt: f64,
    pub gwmt: f64,
    /// Under-stemming index.
    pub ui: f64,
    /// Over-stemming index.
    pub oi: f64,
    /// Stemming weight, OI / UI; `None` when UI is 0.
    pub sw: Option<f64>,
    /// Error rate relative to truncation; `None` when not computed or undefined.
    pub errt: Option<f64>,
}

/// Concept groups with every word in one group only (later repeats dropped, empty
/// groups removed), so `W` is the number of distinct words.
#[derive(Clone, Debug, Default, PartialEq, Serialize)]
pub struct ConceptGroups {
    pub groups: Vec<Vec<String>>,
}

impl ConceptGroups {
    pub fn new(groups: impl IntoIterator<Item = Vec<String>>) -> Self {
        let mut seen = rustc_hash::FxHashSet::default();
        let groups = groups
            .into_iter()
            .map(|g| {
                g.into_iter()
                    .filter(|w| seen.insert(w.clone()))
                    .collect::<Vec<_>>()
            })
            .filter(|g| !g.is_empty())
            .collect();
        ConceptGroups { groups }
    }

    pub fn words(&self) -> usize {
        self.groups.iter().map(Vec::len).sum()
    }
}

/// UI, OI and SW of `stem` on `groups` (ERRT left `None`).
pub fn indices(groups: &ConceptGroups, stem: impl Fn(&str) -> String) -> Indices {
    let w = groups.words() as u128;
    let (mut dmt2, mut umt2, mut dnt2) = (0u128, 0u128, 0u128);
    // stem → (concept group → words), for the wrongly-merged total.
    let mut by_stem: FxHashMap<String, FxHashMap<usize, u128>> = FxHashMap::default();
    for (g, words) in groups.groups.iter().enumerate() {
        let n = words.len() as u128;
        dmt2 += n * (n - 1);
        dnt2 += n * (w - n);
        let mut stems: FxHashMap<String, u128> = FxHashMap::default();
        for word in words {
            let s = stem(word);
            *stems.entry(s.clone()).or_default() += 1;
            *by_stem.entry(s).or_default().entry(g).or_default() += 1;
        }
        umt2 += stems.values().map(|u| u * (n - u)).sum::<u128>();
    }
    let wmt2: u128 = by_stem
        .values()
        .map(|concepts| {
            let ns: u128 = concepts.values().sum();
            concepts.values().map(|v| v * (ns - v)).sum::<u128>()
        })
        .sum();
    let ratio = |a: u128, b: u128| if b == 0 { 0.0 } else { a as f64 / b as f64 };
    let ui = ratio(umt2, dmt2);
    let oi = ratio(wmt2, dnt2);
    Indices {
        gdmt: dmt2 as f64 / 2.0,
        gumt: umt2 as f64 / 2.0,
        gdnt: dnt2 as f64 / 2.0,
        gwmt: wmt2 as f64 / 2.0,
        ui,
        oi,
        sw: (ui > 0.0).then(|| oi / ui),
        errt: None,
    }
}

/// The first `k` characters of a word.
pub fn truncate(word: &str, k: usize) -> String {
    word.chars().take(k).collect()
}

/// The truncation stemmers' indices for k = 2..=10, in order of k.
pub fn truncation_line(groups: &ConceptGroups) -> Vec<(usize, Indices)> {
    (2..=10)
        .map(|k| (k, indices(groups, |w| truncate(w, k))))
        .collect()
}

/// ERRT of the point `(ui, oi)` against a truncation line given as `(UI, OI)` points in
/// order; `None` when the line is degenerate or the ray misses it.
pub fn errt(point: (f64, f64), line: &[(f64, f64)]) -> Option<f64> {
    let (px, py) = point;
    if px == 0.0 && py == 0.0 {
        return Some(0.0);
    }
    let last = line.len().checked_sub(2)?;
    for (i, pair) in line.windows(2).enumerate() {
        let (a, b) = (pair[0], pair[1]);
        let (dx, dy) = (b.0 - a.0, b.1 - a.1);
        // Solve λ·P = A + t·(B − A).
        let det = dx * py - px * dy;
        if det.abs() < 1e-15 {
            continue;
        }
        let lambda = (dx * a.1 - dy * a.0) / det;
        let t = (px * a.1 - py * a.0) / det;
        let lo = if i == 0 { f64::NEG_INFINITY } else { -1e-12 };
        let hi = if i == last {
            f64::INFINITY
        } else {
            1.0 + 1e-12
        };
        if lambda > 0.0 && t >= lo && t <= hi {
            return Some(1.0 / lambda);
        }
    }
    None
}

/// One row of the table: a stemmer's name and indices.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Row {
    pub name: String,
    pub indices: Indices,
}

/// The stemcheck result: the rows asked for, and the truncation rows they are measured
/// against.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct StemcheckReport {
    pub source: String,
    pub words: usize,
    pub groups: usize,
    pub rows: Vec<Row>,
    pub truncation: Vec<Row>,
}

/// The ruleset taken apart step by step, each step an analyzer: the bare stemmer, the
/// stemmer with the ruleset's exemptions, and with its lemma overrides too. What each
/// step adds to Paice's indices is what that kind of rule does to the stemmer's errors.
pub struct Ablation {
    steps: Vec<(String, Analyzer)>,
}

impl Ablation {
    pub fn new(ruleset: &Ruleset) -> Result<Ablation, RulesError> {
        let mut bare = ruleset.clone();
        bare.exemptions.clear();
        bare.lemmas.clear();
        let mut exempt_only = ruleset.clone();
        exempt_only.lemmas.clear();
        Ok(Ablation {
            steps: vec![
                ("bare stemmer".into(), Analyzer::new(bare)?),
                ("stemmer + exemptions".into(), Analyzer::new(exempt_only)?),
                (
                    "stemmer + exemptions + lemma overrides".into(),
                    Analyzer::new(ruleset.clone())?,
                ),
            ],
        })
    }

    /// The whole ruleset's analyzer (the last step).
    pub fn full(&self) -> &Analyzer {
        &self.steps[self.steps.len() - 1].1
    }

    /// Every step's indices over `groups`.
    pub fn report(&self, source: &str, groups: &ConceptGroups) -> StemcheckReport {
        // One closure type for every step, so they sit in one Vec without boxing.
        let stems: Vec<_> = self
            .steps
            .iter()
            .map(|(_, a)| move |w: &str| a.key_ignoring_stopwords(w).into_owned())
            .collect();
        stemcheck(
            source,
            groups,
            self.steps
                .iter()
                .zip(&stems)
                .map(|((name, _), f)| (name.clone(), f as &dyn Fn(&str) -> String)),
        )
    }
}

/// Computes each named stemmer's indices and its ERRT against truncation.
pub fn stemcheck<'a>(
    source: &str,
    groups: &ConceptGroups,
    stemmers: impl IntoIterator<Item = (String, &'a dyn Fn(&str) -> String)>,
) -> StemcheckReport {
    let trunc = truncation_line(groups);
    let line: Vec<(f64, f64)> = trunc.iter().map(|(_, i)| (i.ui, i.oi)).collect();
    let rows = stemmers
        .into_iter()
        .map(|(name, stem)| {
            let mut indices = indices(groups, stem);
            indices.errt = errt((indices.ui, indices.oi), &line);
            Row { name, indices }
        })
        .collect();
    StemcheckReport {
        source: source.to_string(),
        words: groups.words(),
        groups: groups.groups.len(),
        rows,
        truncation: trunc
            .into_iter()
            .map(|(k, indices)| Row {
                name: format!("trunc({k})"),
                indices,
            })
            .collect(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn groups(text: &[&[&str]]) -> ConceptGroups {
        ConceptGroups::new(
            text.iter()
                .map(|g| g.iter().map(|w| w.to_string()).collect()),
        )
    }

    /// Hand-computed by the author of this test from Paice's published formulas (SIGIR '94,
    /// JASIS 1996), for these two groups and a made-up stemmer:
    ///
    /// ```text
    /// group 1 = {connect, connected, connection}      n = 3
    /// group 2 = {cone, cones}                         n = 2         W = 5
    /// stemmer: connect, connected, cone → "conn"; connection → "connection";
    ///          cones → "cones"
    /// ```
    ///
    /// ```text
    /// GDMT = ½·3·2 + ½·2·1 = 3 + 1 = 4
    /// GUMT: group 1 stems {conn: 2, connection: 1} → ½(2·1 + 1·2) = 2
    ///       group 2 stems {conn: 1, cones: 1}       → ½(1·1 + 1·1) = 1     GUMT = 3
    /// UI = 3/4 = 0.75
    /// GDNT = ½·3·(5−3) + ½·2·(5−2) = 3 + 3 = 6
    /// GWMT: stem conn holds {g1: 2, g2: 1}, n_s = 3 → ½(2·1 + 1·2) = 2
    ///       stems connection, cones hold one group each → 0              GWMT = 2
    /// OI = 2/6 = 0.3333…     SW = OI/UI = 0.4444…
    /// ```
    #[test]
    fn indices_match_a_hand_computed_example() {
        let g = groups(&[&["connect", "connected", "connection"], &["cone", "cones"]]);
        let stem = |w: &str| match w {
            "connect" | "connected" | "cone" => "conn".to_string(),
            other => other.to_string(),
        };
        let i = indices(&g, stem);
        assert_eq!((i.gdmt, i.gumt, i.gdnt, i.gwmt), (4.0, 3.0, 6.0, 2.0));
        assert!((i.ui - 0.75).abs() < 1e-12);
        assert!((i.oi - 1.0 / 3.0).abs() < 1e-12);
        assert!((i.sw.unwrap() - 4.0 / 9.0).abs() < 1e-12);
    }

    /// Hand-computed: the line from (0, 1) to (1, 0) is x + y = 1; the ray through
    /// P = (0.25, 0.25) meets it at X = (0.5, 0.5), so ERRT = |OP|/|OX| = 0.5. A point on
    /// the line has ERRT 1; beyond the end of the line the end segment is extended.
    #[test]
    fn errt_is_the_distance_ratio_to_the_truncation_line() {
        let line = [(0.0, 1.0), (0.5, 0.5), (1.0, 0.0)];
        assert!((errt((0.25, 0.25), &line).unwrap() - 0.5).abs() < 1e-12);
        assert!((errt((0.8, 0.2), &line).unwrap() - 1.0).abs() < 1e-12);
        let short = [(0.4, 0.6), (0.6, 0.4)];
        assert!((errt((0.1, 0.1), &short).unwrap() - 0.2).abs() < 1e-12);
        assert_eq!(errt((0.0, 0.0), &line), Some(0.0));
    }

    #[test]
    fn truncating_at_the_longest_word_merges_nothing_wrongly() {
        let g = groups(&[&["ab", "abc"], &["abd", "xy"], &["abcdefghij"]]);
        let line = truncation_line(&g);
        assert_eq!(line.last().unwrap().1.oi, 0.0);
    }

    #[test]
    fn a_word_in_two_groups_counts_once() {
        let g = groups(&[&["a", "b"], &["b", "c"]]);
        assert_eq!(g.groups, vec![vec!["a", "b"], vec!["c"]]);
    }
}
