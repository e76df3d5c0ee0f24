//! WordNet 3.0 exception lists: imported as lemma overrides, every unambiguous irregular
//! form must reach the same key as its base form — the gap the overrides close over the
//! plain English stemmer, which is measured alongside.
//!
//! Source: Debian package `wordnet-base` 1:3.0-37, `/usr/share/wordnet/{verb,noun,adj}.exc`
//! (WordNet 3.0, Princeton University; WordNet licence, a BSD-style permission notice in
//! `/usr/share/doc/wordnet-base/copyright`). `.ci/run` installs it.
//!
//! The one principled exception: when a base form is itself listed as an irregular form of
//! another word ("laid → lay", "lay → lie"), the contract applies one override, not a
//! chain, so the pair cannot meet. Every miss must be such a chain; lint's `lemma-chain`
//! check reports them.

use std::collections::HashSet;
use std::path::Path;

use lexdelta::analysis::Analyzer;
use lexdelta::import::wordnet::{ExceptionList, ImportOptions, PartOfSpeech, build_lemma_file};
use lexdelta::rules::{SourceFile, load_sources};

const WORDNET: &str = "/usr/share/wordnet";
const PIPELINE: &str = "format: 1\nrevision: 1\npipeline:\n  stemmer: english\n";

fn analyzer(files: Vec<(&str, String)>) -> Analyzer {
    let sources = files
        .into_iter()
        .map(|(name, text)| SourceFile {
            name: name.into(),
            text,
        })
        .collect();
    Analyzer::new(load_sources("wordnet", sources).unwrap()).unwrap()
}

struct Measured {
    pairs: usize,
    ambiguous: usize,
    stemmer_alone: usize,
    with_overrides: usize,
    chains: usize,
}

fn measure(pos: PartOfSpeech) -> Measured {
    let dir = Path::new(WORDNET);
    let list = ExceptionList::read(dir, &[pos]).unwrap_or_else(|e| {
        panic!("{e}\nThe WordNet 3.0 exception lists are missing: `apt-get install wordnet-base`.")
    });
    let import = build_lemma_file(&list, &ImportOptions::default());
    let plain = analyzer(vec![("pipeline.yaml", PIPELINE.into())]);
    let with = analyzer(vec![
        ("pipeline.yaml", PIPELINE.into()),
        ("wordnet.yaml", import.yaml.clone()),
    ]);
    let overridden: HashSet<&str> = import.written.iter().map(|(f, _)| f.as_str()).collect();
    let same = |a: &Analyzer, form: &str, base: &str| a.key(form) == a.key(base);
    let mut m = Measured {
        pairs: import.written.len(),
        ambiguous: import.ambiguous.len(),
        stemmer_alone: 0,
        with_overrides: 0,
        chains: 0,
    };
    for (form, base) in &import.written {
        m.stemmer_alone += usize::from(same(&plain, form, base));
        if same(&with, form, base) {
            m.with_overrides += 1;
        } else {
            assert!(
                overridden.contains(base.as_str()),
                "{form} → {base}: keys differ ({:?} vs {:?}) although {base} is not itself overridden",
                with.key(form),
                with.key(base)
            );
            m.chains += 1;
        }
    }
    m
}

#[test]
fn imported_overrides_conflate_irregular_forms_with_their_base() {
    // (pos, pairs written, ambiguous skipped, conflated by the stemmer alone,
    //  conflated with the overrides, chains) — measured 2026-12-02.
    let expected = [
        (PartOfSpeech::Verb, 2182, 26, 1576, 2165, 17),
        (PartOfSpeech::Noun, 1860, 72, 484, 1854, 6),
        (PartOfSpeech::Adj, 1323, 4, 10, 1323, 0),
    ];
    let mut report = Vec::new();
    let mut mismatches = Vec::new();
    for (pos, pairs, ambiguous, alone, with, chains) in expected {
        let m = measure(pos);
        report.push(format!(
            "{pos:?}: {} pairs ({} ambiguous skipped); stemmer alone conflates {} ({:.1}%), with overrides {} ({:.1}%); {} chains",
            m.pairs,
            m.ambiguous,
            m.stemmer_alone,
            100.0 * m.stemmer_alone as f64 / m.pairs as f64,
            m.with_overrides,
            100.0 * m.with_overrides as f64 / m.pairs as f64,
            m.chains
        ));
        if (
            m.pairs,
            m.ambiguous,
            m.stemmer_alone,
            m.with_overrides,
            m.chains,
        ) != (pairs, ambiguous, alone, with, chains)
        {
            mismatches.push(format!(
                "{pos:?}: measured ({}, {}, {}, {}, {})",
                m.pairs, m.ambiguous, m.stemmer_alone, m.with_overrides, m.chains
            ));
        }
    }
    eprintln!("{}", report.join("\n"));
    assert!(
        mismatches.is_empty(),
        "{}\n{}",
        mismatches.join("\n"),
        report.join("\n")
    );
}
