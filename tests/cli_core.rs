//! The core commands run from the project's checkout, on the demo ruleset.

use assert_cmd::Command;
use predicates::prelude::*;

fn lexdelta() -> Command {
    let mut cmd = Command::cargo_bin("lexdelta").unwrap();
    cmd.current_dir(env!("CARGO_MANIFEST_DIR"))
        .env_remove("NO_COLOR");
    cmd
}

#[test]
fn trace_shows_every_kind_of_rule_firing_with_its_location() {
    let out = lexdelta()
        .args([
            "trace",
            "Children ride the light rail with a wayfare card on route x40",
        ])
        .assert()
        .success()
        .get_output()
        .stdout
        .clone();
    let text = String::from_utf8(out).unwrap();
    for expected in [
        "lemma → child [children (rules/lemmas.yaml:",
        "exempt kept as written [brand-wayfare (rules/exempt.yaml:",
        "exempt kept as written [route-numbers (rules/exempt.yaml:",
        "stopword dropped [rules/pipeline.yaml:",
        "light rail (phrase)  ← the query's own words",
        "tram  ← tram-light-rail (rules/synonyms.yaml:",
        "smart card (phrase)  ← smart-card (rules/synonyms.yaml:",
    ] {
        assert!(text.contains(expected), "missing {expected:?} in:\n{text}");
    }
    assert!(
        !text.contains('\x1b'),
        "no colour when stdout is not a terminal"
    );
}

#[test]
fn trace_stems_on_the_index_side_without_expanding() {
    lexdelta()
        .args(["trace", "--side", "index", "universities"])
        .assert()
        .success()
        .stdout(predicate::str::contains("stem → univers"))
        .stdout(predicate::str::contains("synonym expansion").not());
}

#[test]
fn trace_json_is_stable() {
    let run = || {
        lexdelta()
            .args([
                "trace",
                "--format",
                "json",
                "--rules",
                "demo-corpus/proposed",
                "left luggage",
            ])
            .assert()
            .success()
            .get_output()
            .stdout
            .clone()
    };
    let first = run();
    assert_eq!(first, run());
    let v: serde_json::Value = serde_json::from_slice(&first).unwrap();
    assert_eq!(v["tokens"][0]["key"], "leav");
    assert_eq!(v["tokens"][0]["steps"][0]["stage"], "lemma");
    assert!(
        v["tokens"][0]["steps"][0]["rule"]["file"]
            .as_str()
            .unwrap()
            .ends_with("irregular-verbs.yaml")
    );
}

#[test]
fn colour_is_used_only_when_asked_and_never_under_no_color() {
    lexdelta()
        .args(["trace", "--color", "always", "rode"])
        .assert()
        .stdout(predicate::str::contains("\x1b["));
    lexdelta()
        .env("NO_COLOR", "1")
        .args(["trace", "rode"])
        .assert()
        .stdout(predicate::str::contains("\x1b[").not());
}

#[test]
fn a_broken_rule_file_exits_2_with_its_location() {
    let dir = tempfile::tempdir().unwrap();
    std::fs::write(
        dir.path().join("bad.yaml"),
        "format: 1\nrevision: 1\nsynonyms:\n  - equivelant: [a, b]\n",
    )
    .unwrap();
    lexdelta()
        .args(["trace", "--rules"])
        .arg(dir.path())
        .arg("x")
        .assert()
        .code(2)
        .stderr(predicate::str::contains(
            "bad.yaml:4:5: error: unknown key `equivelant`",
        ))
        .stderr(predicate::str::contains("did you mean `equivalent`?"));
}

#[test]
fn import_writes_a_loadable_file_and_never_overwrites_without_force() {
    let dir = tempfile::tempdir().unwrap();
    let out = dir.path().join("irregular.yaml");
    lexdelta()
        .args(["import", "--pos", "verb", "--out"])
        .arg(&out)
        .assert()
        .success()
        .stdout(predicate::str::contains("2182 lemma overrides; skipped"));
    let written = std::fs::read_to_string(&out).unwrap();
    assert!(written.contains("- { form: left, lemma: leave }"));
    lexdelta()
        .args(["import", "--pos", "verb", "--out"])
        .arg(&out)
        .assert()
        .code(2)
        .stderr(predicate::str::contains("exists; pass --force"));
    assert_eq!(std::fs::read_to_string(&out).unwrap(), written);
    lexdelta()
        .args([
            "import",
            "--pos",
            "noun",
            "--force",
            "--list-skipped",
            "--out",
        ])
        .arg(&out)
        .assert()
        .success()
        .stdout(predicate::str::contains("several bases\taxes\tax axis"));
    // The result joins a ruleset and loads.
    std::fs::copy("rules/pipeline.yaml", dir.path().join("pipeline.yaml")).unwrap();
    lexdelta()
        .args(["trace", "--rules"])
        .arg(dir.path())
        .arg("mice")
        .assert()
        .success()
        .stdout(predicate::str::contains("lemma → mouse"));
}

#[test]
fn help_lists_exit_codes_and_examples() {
    lexdelta()
        .arg("--help")
        .assert()
        .success()
        .stdout(predicate::str::contains("Exit codes:"));
    lexdelta()
        .args(["trace", "--help"])
        .assert()
        .success()
        .stdout(predicate::str::contains("Examples:"));
}
