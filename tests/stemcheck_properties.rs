//! Properties of Paice's indices (Paice 1994/1996) that follow from their definitions:
//! a finer partition of the words into stems (longer truncation, or an exemption that
//! gives a word a key of its own) can only remove wrong merges and add missed ones.

use lexdelta::audit::stemcheck::{ConceptGroups, indices, truncate};
use lexdelta::rules::{SourceFile, load_sources};
use proptest::prelude::*;

mod common;
use common::counted::{self, Case};

/// Real English words in rough concept groups, so stems collide the way they do on text.
const WORDS: &[&[&str]] = &[
    &["university", "universities"],
    &["universal", "universally"],
    &["universe", "universes"],
    &["transit", "transits"],
    &["transition", "transitions", "transitional"],
    &["express", "expressed", "expressing"],
    &["expression", "expressions"],
    &["general", "generals"],
    &["generally"],
    &["operate", "operated", "operating", "operates"],
    &["operator", "operators"],
    &["operation", "operations"],
    &["organ", "organs"],
    &["organization", "organizations"],
    &["experiment", "experiments"],
    &["experience", "experienced"],
    &["depart", "departed", "departure"],
    &["department", "departments"],
];

fn sample(mask: u32) -> ConceptGroups {
    ConceptGroups::new(
        WORDS
            .iter()
            .enumerate()
            .filter(|(i, _)| mask & (1 << i) != 0)
            .map(|(_, g)| g.iter().map(|w| w.to_string()).collect()),
    )
}

proptest! {
    #[test]
    fn longer_truncation_never_raises_oi_nor_lowers_ui(mask in 1u32..(1 << 18), k in 1usize..12) {
        let g = sample(mask);
        let a = indices(&g, |w| truncate(w, k));
        let b = indices(&g, |w| truncate(w, k + 1));
        prop_assert!(b.oi <= a.oi + 1e-12);
        prop_assert!(b.ui + 1e-12 >= a.ui);
    }
}

/// Exempting a word moves it to the key it is written as. OI cannot rise unless that key
/// is already some other word's stem (then the word would join that stem group); the
/// property is stated for exemptions where it is not, and other draws are rejects.
#[test]
fn an_exemption_never_raises_oi() {
    let inputs = (1u32..(1 << 18), 0usize..64);
    counted::check(
        "an_exemption_never_raises_oi",
        256,
        0.5,
        inputs,
        |(mask, pick)| {
            let g = sample(mask);
            let words: Vec<&String> = g.groups.iter().flatten().collect();
            let exempt = words[pick % words.len()].clone();
            let live = lexdelta::Analyzer::new(
                load_sources(
                    "t",
                    vec![SourceFile {
                        name: "a.yaml".into(),
                        text: "format: 1\nrevision: 1\n".into(),
                    }],
                )
                .unwrap(),
            )
            .unwrap();
            let with = lexdelta::Analyzer::new(
                load_sources(
                    "t",
                    vec![SourceFile {
                        name: "a.yaml".into(),
                        text: format!("format: 1\nrevision: 1\nexempt: [{exempt}]\n"),
                    }],
                )
                .unwrap(),
            )
            .unwrap();
            if !words
                .iter()
                .all(|w| **w == exempt || live.key_ignoring_stopwords(w) != exempt.as_str())
            {
                return Ok(Case::Rejected);
            }
            let before = indices(&g, |w| live.key_ignoring_stopwords(w).into_owned());
            let after = indices(&g, |w| with.key_ignoring_stopwords(w).into_owned());
            prop_assert!(after.oi <= before.oi + 1e-12, "{} raised OI", exempt);
            Ok(Case::Tested)
        },
    );
}

#[test]
fn truncating_beyond_the_longest_word_gives_oi_zero() {
    let g = sample((1 << 18) - 1);
    let longest = g
        .groups
        .iter()
        .flatten()
        .map(|w| w.chars().count())
        .max()
        .unwrap();
    assert_eq!(indices(&g, |w| truncate(w, longest)).oi, 0.0);
}
