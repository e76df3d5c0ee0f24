//! Snowball reference vocabularies: for each language rust-stemmers supports, lexdelta's
//! stem stage (through the whole key chain of a rule-free analyzer) reproduces
//! `output.txt` for `voc.txt`.
//!
//! Source: Debian package `snowball-data` 0+20210120-1 (the snowballstem/snowball-data
//! repository at the Snowball 2.1.0 snapshot), files
//! `/usr/share/snowball/data/<language>/voc.txt` and `output.txt`; licence BSD-3-clause
//! (Arabic: GPL-3+), per `/usr/share/doc/snowball-data/copyright`. `.ci/run` installs it.
//!
//! rust-stemmers 1.2.0 carries older generated code for some algorithms than the 2021
//! vocabularies, so a few languages diverge. Each divergence count is asserted exactly:
//! a change in the stemmer (or in our stage) shows up as a changed number, never silently.

use std::path::Path;

use lexdelta::analysis::Analyzer;
use lexdelta::rules::{Language, SourceFile, load_sources};

const DATA: &str = "/usr/share/snowball/data";

/// Words whose stem differs from the reference, per language (measured 2026-12-02 with
/// rust-stemmers 1.2.0 against snowball-data 0+20210120-1).
const EXPECTED_DIVERGENCES: &[(Language, &str, usize)] =
    &include!("reference/snowball_divergences.in");

fn analyzer_for(language: Language) -> Analyzer {
    let text = format!(
        "format: 1\nrevision: 1\npipeline:\n  stemmer: {}\n  lowercase: false\n",
        language.name()
    );
    let ruleset = load_sources(
        "reference",
        vec![SourceFile {
            name: "pipeline.yaml".into(),
            text,
        }],
    )
    .unwrap();
    Analyzer::new(ruleset).unwrap()
}

/// Reads a reference file, or its gzipped form (Debian compresses the large ones).
fn read_lines(path: &Path) -> Vec<String> {
    let gz = path.with_extension("txt.gz");
    let read = if !path.exists() && gz.exists() {
        std::fs::File::open(&gz).and_then(|f| {
            let mut text = String::new();
            std::io::Read::read_to_string(&mut flate2::read::GzDecoder::new(f), &mut text)?;
            Ok(text)
        })
    } else {
        std::fs::read_to_string(path)
    };
    let text = read.unwrap_or_else(|e| {
        panic!(
            "cannot read {}: {e}\nThe Snowball reference vocabularies are missing: install them with \
             `apt-get install snowball-data` (the README's test command does this).",
            path.display()
        )
    });
    text.lines().map(str::to_string).collect()
}

/// (words compared, divergences, the first few divergent words).
fn compare(language: Language, dir: &str) -> (usize, usize, Vec<String>) {
    let analyzer = analyzer_for(language);
    let base = Path::new(DATA).join(dir);
    let words = read_lines(&base.join("voc.txt"));
    let stems = read_lines(&base.join("output.txt"));
    assert_eq!(
        words.len(),
        stems.len(),
        "{dir}: voc.txt and output.txt differ in length"
    );
    let mut diverging = Vec::new();
    let mut count = 0;
    for (word, want) in words.iter().zip(&stems) {
        let got = analyzer
            .key(word)
            .map(|k| k.into_owned())
            .unwrap_or_default();
        if &got != want {
            count += 1;
            if diverging.len() < 5 {
                diverging.push(format!("{word}: ours {got:?}, reference {want:?}"));
            }
        }
    }
    (words.len(), count, diverging)
}

#[test]
fn every_supported_language_matches_its_reference_vocabulary() {
    let mut report = Vec::new();
    let mut failures = Vec::new();
    for &(language, dir, expected) in EXPECTED_DIVERGENCES {
        let (n, diverging, examples) = compare(language, dir);
        report.push(format!(
            "{:<11} {:>7} words  {:>6} divergent  ({:.3}% agree)",
            language.name(),
            n,
            diverging,
            100.0 * (n - diverging) as f64 / n as f64
        ));
        if diverging != expected {
            failures.push(format!(
                "{}: expected {expected} divergences, found {diverging}; e.g. {examples:?}",
                language.name()
            ));
        }
    }
    eprintln!("{}", report.join("\n"));
    assert_eq!(
        EXPECTED_DIVERGENCES.len(),
        Language::ALL.len(),
        "every language lexdelta offers is checked"
    );
    assert!(failures.is_empty(), "{}", failures.join("\n"));
}
