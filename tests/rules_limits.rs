//! Hostile and random input: refused quickly with a clear message, never a panic.

use std::time::{Duration, Instant};

use lexdelta::analysis::Analyzer;
use lexdelta::rules::{RulesError, SourceFile, load_dir, load_sources};
use proptest::prelude::*;

fn load_text(text: String) -> Result<Analyzer, RulesError> {
    load_sources(
        "fuzz",
        vec![SourceFile {
            name: "fuzz.yaml".into(),
            text,
        }],
    )
    .and_then(Analyzer::new)
}

/// A 50 KB-class document of one anchor aliased 10,000 times, each alias replaying a
/// 1,000-item list: ten million nodes if expanded.
fn alias_bomb() -> String {
    let mut text = String::from("format: 1\nrevision: 1\nbig: &a [");
    text.push_str(&vec!["w"; 1000].join(","));
    text.push_str("]\nexempt: [");
    text.push_str(&vec!["*a"; 10_000].join(","));
    text.push_str("]\n");
    text
}

#[test]
fn an_alias_bomb_is_refused_quickly() {
    let text = alias_bomb();
    assert!(text.len() < 60_000, "{}", text.len());
    let started = Instant::now();
    let err = load_text(text).unwrap_err().to_string();
    let took = started.elapsed();
    assert!(took < Duration::from_secs(2), "took {took:?}");
    assert!(err.contains("fuzz.yaml:"), "{err}");
    assert!(
        err.contains("alias") || err.contains("nodes") || err.contains("budget"),
        "the message says why: {err}"
    );
}

#[test]
fn a_100_mb_file_is_refused_before_it_is_read() {
    let dir = tempfile::tempdir().unwrap();
    let file = std::fs::File::create(dir.path().join("huge.yaml")).unwrap();
    file.set_len(100 * 1024 * 1024).unwrap(); // sparse: costs no disk
    let started = Instant::now();
    let err = load_dir(dir.path()).unwrap_err().to_string();
    assert!(started.elapsed() < Duration::from_secs(1));
    assert!(err.contains("huge.yaml"), "{err}");
    assert!(
        err.contains("100.0 MiB; rule files are limited to 16 MiB"),
        "{err}"
    );
}

#[test]
fn a_missing_directory_is_named() {
    let err = load_dir(std::path::Path::new("no/such/rules"))
        .unwrap_err()
        .to_string();
    assert!(err.contains("no/such/rules"), "{err}");
}

const FRAGMENTS: &[&str] = &[
    "format: 1\n",
    "revision: 1\n",
    "synonyms:\n",
    "  - equivalent: [a, b]\n",
    "exempt:\n",
    "  - pattern: \"[\"\n",
    "lemmas:\n",
    "  - {form: x, lemma: y}\n",
    "pipeline:\n",
    "  stopwords: [the]\n",
    "  stemmer: dutch\n",
    "&a [x]\n",
    "*a\n",
    "  - one_way: {from: a}\n",
    "- ]\n",
    "{",
    "\t",
    ": :\n",
    "\"\\u00e9\"\n",
    "lint:\n  checks: {x: off}\n",
    "gate: 3\n",
    "  - id: a\n",
    "  - id: a\n    term: q\n",
    "\u{feff}",
    "---\n",
    "...\n",
];

proptest! {
    #![proptest_config(ProptestConfig::with_cases(400))]

    #[test]
    fn random_fragments_never_panic(picks in prop::collection::vec(0..FRAGMENTS.len(), 0..14)) {
        let text: String = picks.iter().map(|&i| FRAGMENTS[i]).collect();
        if let Err(RulesError::Invalid(d)) = load_text(text) {
            prop_assert!(!d.is_empty());
        }
    }

    #[test]
    fn random_bytes_never_panic(text in "\\PC{0,200}") {
        let _ = load_text(text);
    }
}
