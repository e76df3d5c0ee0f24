//! `lexdelta collisions` and `lexdelta stemcheck` on the demo data set.
//!
//! The planted over-truncations come from the demo's own description
//! (demo-corpus/README.md) and from what Snowball English (rust-stemmers) does to them:
//! university/universal → "univers", transit/transition → "transit",
//! express/expression → "express", general/generally → "general", and others.

use std::path::Path;

use assert_cmd::Command;

/// These tests read WordNet 3.0 (Debian `wordnet-base`, which `tests/run.sh` installs):
/// without it they fail, naming what is missing, instead of passing unchecked.
fn require_wordnet() {
    assert!(
        Path::new("/usr/share/wordnet/index.noun").exists(),
        "WordNet 3.0 is missing: install the Debian package wordnet-base \
         (tests/run.sh does) so /usr/share/wordnet/index.noun exists"
    );
}

fn lexdelta() -> Command {
    let mut cmd = Command::cargo_bin("lexdelta").unwrap();
    cmd.current_dir(env!("CARGO_MANIFEST_DIR"));
    cmd
}

fn collisions_json(extra: &[&str]) -> serde_json::Value {
    let out = lexdelta()
        .args([
            "collisions",
            "--corpus",
            "demo-corpus/documents.jsonl",
            "--queries",
            "demo-corpus/queries.jsonl",
            "--format",
            "json",
        ])
        .args(extra)
        .assert()
        .success()
        .get_output()
        .stdout
        .clone();
    serde_json::from_slice(&out).unwrap()
}

#[test]
fn planted_over_truncations_rank_in_the_top_ten() {
    require_wordnet();
    let report = collisions_json(&["--limit", "10"]);
    let keys: Vec<&str> = report["collisions"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["key"].as_str().unwrap())
        .collect();
    assert!(keys.contains(&"univers"), "top ten: {keys:?}");
    let others = [
        "transit", "express", "general", "oper", "organ", "experi", "depart",
    ];
    let found = others.iter().filter(|k| keys.contains(k)).count();
    assert!(
        found >= 3,
        "only {found} planted groups in the top ten: {keys:?}"
    );
}

#[test]
fn transit_is_split_by_exempting_the_other_side() {
    require_wordnet();
    let report = collisions_json(&["--limit", "30"]);
    let transit = report["collisions"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["key"] == "transit")
        .expect("the transit group is shown");
    let s = &transit["suggestion"];
    assert_eq!(s["kept"], "transit");
    assert_eq!(s["changed"]["transition"], "transition");
    assert_eq!(s["changed"]["transitions"], "transition");
    assert!(s["changed"].get("transit").is_none());
    // "transit card" loses the transition documents it matched before.
    let q = transit["effect"]["queries"]
        .as_array()
        .unwrap()
        .iter()
        .find(|q| q["query"] == "transit card")
        .unwrap();
    assert!(q["lost"].as_u64().unwrap() > 0);
}

#[test]
fn output_is_byte_identical_across_runs() {
    require_wordnet();
    for format in ["text", "json", "csv"] {
        let run = || {
            lexdelta()
                .args([
                    "collisions",
                    "--corpus",
                    "demo-corpus/documents.jsonl",
                    "--queries",
                    "demo-corpus/queries.jsonl",
                    "--color",
                    "never",
                    "--format",
                    format,
                ])
                .assert()
                .success()
                .get_output()
                .stdout
                .clone()
        };
        assert_eq!(run(), run(), "{format} output differs between runs");
    }
}

#[test]
fn written_suggestions_load_as_a_rule_file_and_split_the_groups() {
    require_wordnet();
    let dir = tempfile::tempdir().unwrap();
    let rules = dir.path().join("rules");
    std::fs::create_dir(&rules).unwrap();
    for entry in std::fs::read_dir(Path::new(env!("CARGO_MANIFEST_DIR")).join("rules")).unwrap() {
        let entry = entry.unwrap();
        std::fs::copy(entry.path(), rules.join(entry.file_name())).unwrap();
    }
    let out = rules.join("split-groups.yaml");
    let write = |force: bool| {
        let mut cmd = lexdelta();
        cmd.args([
            "collisions",
            "--corpus",
            "demo-corpus/documents.jsonl",
            // "transitions" occurs only in the query log: without it, no lemma for it.
            "--queries",
            "demo-corpus/queries.jsonl",
            "--accept",
            "univers,transit",
            "--write",
        ])
        .arg(&out);
        if force {
            cmd.arg("--force");
        }
        cmd.assert()
    };
    write(false).success();
    let text = std::fs::read_to_string(&out).unwrap();
    assert!(text.contains("format: 1\nrevision: 1\n"), "{text}");
    // Alone, and merged into the live ruleset.
    let alone = tempfile::tempdir().unwrap();
    std::fs::copy(&out, alone.path().join("split.yaml")).unwrap();
    lexdelta::rules::load_dir(alone.path()).unwrap();
    let analyzer = lexdelta::Analyzer::load(&rules).unwrap();
    assert_ne!(analyzer.key("universal"), analyzer.key("university"));
    assert_ne!(analyzer.key("transition"), analyzer.key("transit"));
    assert_eq!(analyzer.key("transitions"), analyzer.key("transition"));
    // Never replaced without --force.
    write(false).code(2);
    write(true).success();
}

#[test]
fn bad_input_exits_with_2() {
    lexdelta()
        .args(["collisions", "--corpus", "no/such/file.jsonl"])
        .assert()
        .code(2);
    lexdelta()
        .args([
            "collisions",
            "--corpus",
            "demo-corpus/documents.jsonl",
            "--accept",
            "x",
        ])
        .assert()
        .code(2);
    lexdelta()
        .args(["stemcheck", "--groups", "no/such/groups.txt"])
        .assert()
        .code(2);
}

#[test]
fn stemcheck_prints_the_three_rows_and_truncation() {
    let dir = tempfile::tempdir().unwrap();
    let groups = dir.path().join("groups.txt");
    std::fs::write(
        &groups,
        "university universities\nuniversal\nuniverse universes\ntransit transits\ntransition transitions\n",
    )
    .unwrap();
    let out = lexdelta()
        .args(["stemcheck", "--groups"])
        .arg(&groups)
        .args(["--format", "json"])
        .assert()
        .success()
        .get_output()
        .stdout
        .clone();
    let report: serde_json::Value = serde_json::from_slice(&out).unwrap();
    let rows = report["rows"].as_array().unwrap();
    assert_eq!(rows.len(), 3);
    assert_eq!(report["truncation"].as_array().unwrap().len(), 9);
    let oi = |i: usize| rows[i]["indices"]["oi"].as_f64().unwrap();
    // The live ruleset exempts "universe": fewer wrong merges than the bare stemmer.
    assert!(oi(1) < oi(0), "{rows:?}");
}
