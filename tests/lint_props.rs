//! Random small rulesets: lint never panics, and two runs give the same findings (and the
//! same rendered output) — what CI gates on must not flicker.

use lexdelta::Analyzer;
use lexdelta::lint::{LintConfig, LintInput, Vocabulary, lint};
use lexdelta::report::{Style, lint_dot, lint_json, lint_sarif, lint_text};
use lexdelta::rules::{SourceFile, load_sources};
use proptest::prelude::*;

mod common;
use common::counted::{self, Case};

/// Words chosen to collide: shared stems, irregular forms, stopwords, route numbers.
const WORDS: &[&str] = &[
    "change",
    "changes",
    "changing",
    "transfer",
    "amend",
    "universal",
    "university",
    "universe",
    "left",
    "leave",
    "leaving",
    "lay",
    "laid",
    "lie",
    "park",
    "ride",
    "rode",
    "and",
    "the",
    "tram",
    "light",
    "lit",
    "x40",
    "bus",
    "buses",
];
/// The stopwords of every generated ruleset.
const STOPWORDS: &[&str] = &["and", "the"];
const PATTERNS: &[&str] = &["x\\\\d+", "[a-z]+s", "lay|lie", "tra.*", "zzz"];
const CHECKS: &[&str] = &[
    "set-bridge",
    "stem-side-effect",
    "dead-rule",
    "set-bridges",
    "one-way-cycle",
];
const LEVELS: &[&str] = &["off", "info", "warning", "error"];

fn word() -> impl Strategy<Value = String> {
    prop::sample::select(WORDS).prop_map(str::to_string)
}

/// A one- or two-word term that keeps a word after stopwords (a member made only of
/// stopwords does not load, by design).
fn term() -> impl Strategy<Value = String> {
    let content = prop::sample::select(WORDS)
        .prop_filter("not a stopword", |w| !STOPWORDS.contains(w))
        .prop_map(str::to_string);
    (content, prop::option::of(word())).prop_map(|(first, second)| match second {
        Some(second) => format!("{first} {second}"),
        None => first,
    })
}

fn lint_override() -> impl Strategy<Value = String> {
    (prop::sample::select(CHECKS), prop::sample::select(LEVELS)).prop_map(|(c, l)| {
        format!(
            "\n    lint:\n      - check: {c}\n        severity: {l}\n        reason: property test"
        )
    })
}

fn synonym() -> impl Strategy<Value = String> {
    let set = prop::collection::vec(term(), 2..=4)
        .prop_map(|m| format!("  - equivalent: [{}]", m.join(", ")));
    let one_way = (term(), prop::collection::vec(term(), 1..=2))
        .prop_map(|(f, t)| format!("  - one_way: {{from: {f}, to: [{}]}}", t.join(", ")));
    (
        prop_oneof![set, one_way],
        prop::option::weighted(0.2, lint_override()),
    )
        .prop_map(|(rule, lint)| match lint {
            // An override needs the block form of the rule.
            Some(lint) => format!("{}{lint}", rule.replacen("  - ", "  - id: r\n    ", 1)),
            None => rule,
        })
}

fn exemption() -> impl Strategy<Value = String> {
    prop_oneof![
        word().prop_map(|w| format!("  - term: {w}")),
        prop::sample::select(PATTERNS).prop_map(|p| format!("  - pattern: \"{p}\"")),
    ]
}

/// A ruleset text: pipeline, synonyms, exemptions, lemmas; ids made unique afterwards.
fn ruleset() -> impl Strategy<Value = String> {
    (
        prop::collection::vec(synonym(), 0..6),
        prop::collection::vec(exemption(), 0..3),
        // One lemma per form: a form given two lemmas does not compile, by design.
        prop::collection::btree_map(word(), word(), 0..5).prop_map(|pairs| {
            pairs
                .into_iter()
                .filter(|(f, l)| f != l)
                .map(|(f, l)| format!("  - {{form: {f}, lemma: {l}}}"))
                .collect::<Vec<_>>()
        }),
        prop::option::of(2usize..5),
    )
        .prop_map(|(synonyms, exempt, lemmas, max_group)| {
            let mut text = String::from("format: 1\nrevision: 1\npipeline:\n  stopwords: [and, the]\n");
            if let Some(n) = max_group {
                text.push_str(&format!("lint:\n  max_group_size: {n}\n  checks:\n    dead-rule: {{severity: warning}}\n"));
            }
            let mut id = 0;
            let mut section = |name: &str, items: Vec<String>, text: &mut String| {
                if items.is_empty() {
                    return;
                }
                text.push_str(&format!("{name}:\n"));
                for item in items {
                    id += 1;
                    text.push_str(&item.replace("id: r\n", &format!("id: r{id}\n")));
                    text.push('\n');
                }
            };
            section("synonyms", synonyms, &mut text);
            section("exempt", exempt, &mut text);
            section("lemmas", lemmas, &mut text);
            text
        })
}

fn texts() -> impl Strategy<Value = Vec<String>> {
    prop::collection::vec(
        prop::collection::vec(word(), 0..6).prop_map(|w| w.join(" ")),
        0..6,
    )
}

fn rendered(
    analyzer: &Analyzer,
    vocabulary: &Vocabulary,
    sources: &[SourceFile],
) -> (String, String, String, String) {
    let config = LintConfig::default();
    let report = lint(
        analyzer,
        &LintInput {
            vocabulary: Some(vocabulary),
            base: Some(analyzer.ruleset()),
            config: &config,
        },
    );
    (
        lint_json::render(&report).unwrap(),
        lint_text::render(
            &report,
            sources,
            Style::for_stdout(lexdelta::report::ColorChoice::Never),
        ),
        lint_sarif::render(&report, std::path::Path::new("/")).unwrap(),
        lint_dot::render(&report),
    )
}

#[test]
fn lint_never_panics_and_repeats_itself() {
    let inputs = (ruleset(), texts(), texts());
    counted::check(
        "lint_never_panics_and_repeats_itself",
        256,
        0.9,
        inputs,
        |(text, docs, queries)| {
            let sources = vec![SourceFile {
                name: "p.yaml".into(),
                text,
            }];
            // Rulesets that do not load or compile are the loader's business, not lint's.
            let Ok(ruleset) = load_sources("p", sources.clone()) else {
                return Ok(Case::Rejected);
            };
            let Ok(analyzer) = Analyzer::new(ruleset) else {
                return Ok(Case::Rejected);
            };
            let vocabulary = Vocabulary::from_texts(
                analyzer.surface(),
                docs.iter(),
                queries
                    .iter()
                    .enumerate()
                    .map(|(i, q)| (q.as_str(), i as u64 + 1)),
            );
            let first = rendered(&analyzer, &vocabulary, &sources);
            let second = rendered(&analyzer, &vocabulary, &sources);
            prop_assert_eq!(first, second);
            Ok(Case::Tested)
        },
    );
}
