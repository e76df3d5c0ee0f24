//! `lexdelta lint` end to end: the planted hazards of the demo's proposed change, exit codes,
//! levels, the revision check, and SARIF validated against the published schema.

use std::path::{Path, PathBuf};
use std::process::Command;

use assert_cmd::cargo::CommandCargoExt;
use serde_json::Value;

const PROPOSED: &str = "demo-corpus/proposed";
const CORPUS: &str = "demo-corpus/documents.jsonl";
const QUERIES: &str = "demo-corpus/queries.jsonl";
const SCHEMA: &str = "tests/data/sarif-schema-2.1.0.json";
const SCHEMA_SHA256: &str = "c3b4bb2d6093897483348925aaa73af03b3e3f4bd4ca38cef26dcb4212a2682e";

struct Run {
    code: i32,
    stdout: String,
    stderr: String,
}

fn lexdelta(args: &[&str]) -> Run {
    let output = Command::cargo_bin("lexdelta")
        .expect("the binary is built")
        .args(args)
        .env_remove("NO_COLOR")
        .output()
        .expect("lexdelta runs");
    Run {
        code: output.status.code().unwrap_or(-1),
        stdout: String::from_utf8_lossy(&output.stdout).into_owned(),
        stderr: String::from_utf8_lossy(&output.stderr).into_owned(),
    }
}

/// Lints the proposed change with the demo corpus and query log.
fn proposed(format: &str) -> Run {
    lexdelta(&[
        "lint",
        "--rules",
        PROPOSED,
        "--corpus",
        CORPUS,
        "--queries",
        QUERIES,
        "--format",
        format,
        "--color",
        "never",
    ])
}

fn json(run: &Run) -> Value {
    serde_json::from_str(&run.stdout)
        .unwrap_or_else(|e| panic!("not JSON ({e}):\n{}\n{}", run.stdout, run.stderr))
}

/// The 1-based line of `file` that contains `needle`, so the assertions follow the demo
/// files rather than hard-coded numbers.
fn line_of(file: &str, needle: &str) -> u64 {
    let text = std::fs::read_to_string(file).unwrap_or_else(|e| panic!("{file}: {e}"));
    let index = text
        .lines()
        .position(|l| l.contains(needle))
        .unwrap_or_else(|| panic!("{file} has no line with {needle:?}"));
    index as u64 + 1
}

/// The findings of `check` in `file` at `line`.
fn findings_at<'a>(report: &'a Value, check: &str, file: &str, line: u64) -> Vec<&'a Value> {
    report["findings"]
        .as_array()
        .expect("findings")
        .iter()
        .filter(|f| {
            f["check"] == check && f["origin"]["file"] == file && f["origin"]["line"] == line
        })
        .collect()
}

fn forms(finding: &Value) -> Vec<&str> {
    finding["forms"]
        .as_array()
        .map(|a| a.iter().filter_map(|f| f["form"].as_str()).collect())
        .unwrap_or_default()
}

macro_rules! assert_found {
    ($found:expr, $report:expr, $what:expr) => {
        assert!(
            !$found.is_empty(),
            "expected {}; the report was:\n{}",
            $what,
            serde_json::to_string_pretty(&$report["findings"]).unwrap()
        );
    };
}

const SYNONYMS: &str = "demo-corpus/proposed/synonyms.yaml";
const VERBS: &str = "demo-corpus/proposed/irregular-verbs.yaml";

#[test]
fn universal_in_the_accessibility_set_also_fires_for_university() {
    let run = proposed("json");
    assert_eq!(run.code, 1, "an error-level finding exists: {}", run.stderr);
    let report = json(&run);
    let line = line_of(SYNONYMS, "equivalent: [universal, accessible, step-free]");
    let found = findings_at(&report, "stem-side-effect", SYNONYMS, line);
    assert_found!(
        found,
        report,
        format!("stem-side-effect at {SYNONYMS}:{line}")
    );
    let universal = found
        .iter()
        .find(|f| f["message"].as_str().unwrap().starts_with("\"universal\""))
        .expect("a finding on the member \"universal\"");
    assert_eq!(universal["rule"], "accessible-travel");
    assert_eq!(
        forms(universal)[0],
        "university",
        "the most searched form comes first"
    );
    assert_eq!(universal["severity"], "warning");
    assert!(universal["forms"][0]["searches"].as_u64().unwrap() > 0);
}

#[test]
fn the_irregular_verb_import_merges_left_with_leave() {
    let report = json(&proposed("json"));
    let line = line_of(SYNONYMS, "to: [left luggage]");
    let found = findings_at(&report, "stem-side-effect", SYNONYMS, line);
    assert_found!(found, report, "stem-side-effect on \"left luggage\"");
    let f = found[0];
    let forms = forms(f);
    assert!(
        forms.contains(&"leave") && forms.contains(&"leaving"),
        "{forms:?}"
    );
    let override_line = line_of(VERBS, "{form: left, lemma: leave}");
    assert!(
        f["related"]
            .as_array()
            .unwrap()
            .iter()
            .any(|r| r["origin"]["file"] == VERBS && r["origin"]["line"] == override_line),
        "the lemma override is named: {f:#}"
    );
    // The import also brings a chain: laid → lay, and lay → lie.
    let laid = line_of(VERBS, "{form: laid, lemma: lay}");
    let chain = findings_at(&report, "lemma-chain", VERBS, laid);
    assert_found!(chain, report, "lemma-chain on laid → lay → lie");
    assert_eq!(
        chain[0]["members"],
        serde_json::json!(["laid", "lay", "lie"])
    );
}

#[test]
fn the_new_booking_set_bridges_change_and_step_free_bridges_too() {
    let report = json(&proposed("json"));
    let line = line_of(SYNONYMS, "equivalent: [change, amend, alter]");
    let found = findings_at(&report, "set-bridge", SYNONYMS, line);
    assert_found!(found, report, "set-bridge on change");
    assert_eq!(found[0]["rule"], "booking-changes");
    assert_eq!(found[0]["members"][0], "change");
    for member in ["transfer", "connection", "amend", "alter"] {
        assert!(
            found[0]["members"]
                .as_array()
                .unwrap()
                .iter()
                .any(|m| m == member),
            "{member}"
        );
    }
    let vehicle = line_of(SYNONYMS, "equivalent: [change, transfer, connection]");
    assert_eq!(found[0]["related"][0]["origin"]["line"], vehicle);

    let line = line_of(SYNONYMS, "equivalent: [universal, accessible, step-free]");
    let step_free = findings_at(&report, "set-bridge", SYNONYMS, line);
    assert_found!(step_free, report, "set-bridge on step-free");
    assert_eq!(step_free[0]["members"][0], "step-free");
}

#[test]
fn compensation_back_to_refund_closes_a_one_way_cycle() {
    let report = json(&proposed("json"));
    let line = line_of(SYNONYMS, "to: [refund]");
    let found = findings_at(&report, "one-way-cycle", SYNONYMS, line);
    assert_found!(found, report, "one-way-cycle");
    assert_eq!(found[0]["severity"], "error");
    assert_eq!(found[0]["rule"], "compensation-to-refund");
}

#[test]
fn text_output_points_at_the_yaml() {
    let run = proposed("text");
    let line = line_of(SYNONYMS, "equivalent: [universal, accessible, step-free]");
    let head = format!(
        "{SYNONYMS}:{line}:18: warning[stem-side-effect]: \"universal\" keys to \"univers\""
    );
    assert!(run.stdout.contains(&head), "{}", run.stdout);
    assert!(
        run.stdout
            .contains("    equivalent: [universal, accessible, step-free]\n")
    );
    assert!(
        run.stdout.contains("|                  ^^^^^^^^^\n"),
        "a caret under the term"
    );
    assert!(run.stdout.contains("  help: "));
    assert!(!run.stdout.contains('\x1b'), "no colour with --color never");
}

#[test]
fn the_live_ruleset_passes_the_default_gate() {
    let run = lexdelta(&[
        "lint",
        "--rules",
        "rules",
        "--corpus",
        CORPUS,
        "--queries",
        QUERIES,
    ]);
    assert_eq!(run.code, 0, "{}{}", run.stdout, run.stderr);
    let strict = lexdelta(&["lint", "--rules", "rules", "--fail-on-lint", "info"]);
    assert_eq!(strict.code, 1, "info findings exist (stopwords in members)");
}

#[test]
fn levels_from_the_command_line() {
    let run = lexdelta(&[
        "lint",
        "--rules",
        PROPOSED,
        "--level",
        "one-way-cycle=warning",
        "--format",
        "json",
    ]);
    assert_eq!(run.code, 0, "the only error was lowered: {}", run.stdout);
    let report = json(&run);
    assert_eq!(report["counts"]["error"], 0);

    let off = json(&lexdelta(&[
        "lint",
        "--rules",
        PROPOSED,
        "--level",
        "set-bridge=off",
        "--format",
        "json",
    ]));
    assert_eq!(off["silenced"], 2);
    assert!(
        off["findings"]
            .as_array()
            .unwrap()
            .iter()
            .all(|f| f["check"] != "set-bridge")
    );

    let bad = lexdelta(&["lint", "--rules", PROPOSED, "--level", "set-bridges=off"]);
    assert_eq!(bad.code, 2);
    assert!(
        bad.stderr.contains("did you mean \"set-bridge\""),
        "{}",
        bad.stderr
    );
}

/// A scratch copy of the proposed ruleset, with one file rewritten.
fn scratch_ruleset(edit: impl Fn(&str, String) -> String) -> (tempfile::TempDir, PathBuf) {
    let dir = tempfile::tempdir().unwrap();
    let rules = dir.path().join("rules");
    std::fs::create_dir(&rules).unwrap();
    for entry in std::fs::read_dir(PROPOSED).unwrap() {
        let path = entry.unwrap().path();
        let name = path.file_name().unwrap().to_string_lossy().into_owned();
        let text = std::fs::read_to_string(&path).unwrap();
        std::fs::write(rules.join(&name), edit(&name, text)).unwrap();
    }
    (dir, rules)
}

#[test]
fn a_rule_can_silence_a_check_for_itself_with_a_reason() {
    let (_dir, rules) = scratch_ruleset(|name, text| {
        if name != "synonyms.yaml" {
            return text;
        }
        text.replace(
            "    equivalent: [universal, accessible, step-free]\n",
            "    equivalent: [universal, accessible, step-free]\n    lint:\n      - check: stem-side-effect\n        severity: off\n        reason: reviewed with the accessibility team\n",
        )
    });
    let rules = rules.to_str().unwrap();
    let report = json(&lexdelta(&[
        "lint", "--rules", rules, "--corpus", CORPUS, "--format", "json",
    ]));
    let on_rule = report["findings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|f| f["check"] == "stem-side-effect" && f["rule"] == "accessible-travel")
        .count();
    assert_eq!(on_rule, 0);
    assert!(
        report["silenced"].as_u64().unwrap() >= 2,
        "universal and accessible"
    );
    // Other rules keep the check.
    assert!(
        report["findings"]
            .as_array()
            .unwrap()
            .iter()
            .any(|f| f["check"] == "stem-side-effect")
    );
}

#[test]
fn an_unknown_check_name_in_a_rule_is_an_error() {
    let (_dir, rules) = scratch_ruleset(|name, text| {
        if name != "exempt.yaml" {
            return text;
        }
        text.replace(
            "    term: wayfare\n",
            "    term: wayfare\n    lint:\n      - check: dead-rules\n        severity: off\n        reason: brand name\n",
        )
    });
    let run = lexdelta(&[
        "lint",
        "--rules",
        rules.to_str().unwrap(),
        "--level",
        "one-way-cycle=off",
        "--color",
        "never",
    ]);
    assert_eq!(run.code, 1, "{}", run.stdout);
    assert!(
        run.stdout
            .contains("error[unknown-check]: there is no lint check named \"dead-rules\""),
        "{}",
        run.stdout
    );
    assert!(run.stdout.contains("did you mean \"dead-rule\"?"));
}

#[test]
fn revisions_are_compared_with_the_base() {
    let ok = lexdelta(&[
        "lint", "--rules", PROPOSED, "--base", "rules", "--format", "json",
    ]);
    let report = json(&ok);
    assert!(
        report["findings"]
            .as_array()
            .unwrap()
            .iter()
            .all(|f| f["check"] != "revision-not-bumped")
    );
    assert!(
        report["skipped"]
            .as_array()
            .unwrap()
            .iter()
            .all(|s| s["check"] != "revision-not-bumped")
    );

    let (_dir, rules) = scratch_ruleset(|name, text| {
        if name == "synonyms.yaml" {
            text.replace("revision: 13", "revision: 12")
        } else {
            text
        }
    });
    let run = lexdelta(&[
        "lint",
        "--rules",
        rules.to_str().unwrap(),
        "--base",
        "rules",
        "--format",
        "json",
    ]);
    let report = json(&run);
    let found: Vec<&Value> = report["findings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|f| f["check"] == "revision-not-bumped")
        .collect();
    assert_eq!(found.len(), 1, "{found:#?}");
    assert!(
        found[0]["origin"]["file"]
            .as_str()
            .unwrap()
            .ends_with("synonyms.yaml")
    );
    assert_eq!(found[0]["help"], "set `revision: 13`");
}

#[test]
fn bad_input_exits_2_with_the_place() {
    let (_dir, rules) = scratch_ruleset(|name, text| {
        if name == "lemmas.yaml" {
            text.replace("    lemma: bus\n", "    lemma: [bus]\n")
        } else {
            text
        }
    });
    let run = lexdelta(&["lint", "--rules", rules.to_str().unwrap()]);
    assert_eq!(run.code, 2, "{}", run.stdout);
    assert!(run.stderr.contains("lemmas.yaml:"), "{}", run.stderr);

    let dir = tempfile::tempdir().unwrap();
    let corpus = dir.path().join("docs.jsonl");
    std::fs::write(&corpus, "{\"title\": \"a\", \"body\": \"b\"}\nnot json\n").unwrap();
    let run = lexdelta(&[
        "lint",
        "--rules",
        PROPOSED,
        "--corpus",
        corpus.to_str().unwrap(),
    ]);
    assert_eq!(run.code, 2);
    assert!(run.stderr.contains("docs.jsonl:2:"), "{}", run.stderr);

    let run = lexdelta(&["lint", "--rules", "no/such/dir"]);
    assert_eq!(run.code, 2);
}

#[test]
fn checks_are_listed_and_explained_from_their_metadata() {
    let list = lexdelta(&["lint", "--list-checks", "--color", "never"]);
    assert_eq!(list.code, 0);
    for name in [
        "one-way-cycle",
        "lemma-chain",
        "set-bridge",
        "one-way-vs-set",
        "exempt-vs-lemma",
        "redundant-member",
        "stem-side-effect",
        "stopword-in-member",
        "exempt-pattern-coverage",
        "duplicate-rule",
        "dead-rule",
        "oversized-group",
        "revision-not-bumped",
        "unknown-check",
    ] {
        assert!(
            list.stdout.lines().any(|l| l.starts_with(name)),
            "{name} listed:\n{}",
            list.stdout
        );
    }
    let explain = lexdelta(&["lint", "--explain", "set-bridge", "--color", "never"]);
    assert_eq!(explain.code, 0);
    assert!(
        explain
            .stdout
            .starts_with("set-bridge (warning by default)")
    );
    assert!(explain.stdout.contains("Example:") && explain.stdout.contains("Usual fix:"));
    let unknown = lexdelta(&["lint", "--explain", "set-bridgez"]);
    assert_eq!(unknown.code, 2);
    assert!(
        unknown.stderr.contains("did you mean \"set-bridge\""),
        "{}",
        unknown.stderr
    );
}

#[test]
fn the_graph_export_is_dot_of_the_flagged_groups() {
    let dir = tempfile::tempdir().unwrap();
    let dot = dir.path().join("groups.dot");
    let run = lexdelta(&[
        "lint",
        "--rules",
        PROPOSED,
        "--graph",
        dot.to_str().unwrap(),
        "--format",
        "json",
    ]);
    assert_eq!(run.code, 1);
    let text = std::fs::read_to_string(&dot).unwrap();
    assert!(text.starts_with("digraph lexdelta {"));
    assert!(
        text.contains("label=\"booking-changes\""),
        "the bridged sets are drawn"
    );
    assert!(
        text.contains("label=\"one way\""),
        "the one-way cycle is drawn"
    );
    assert!(text.trim_end().ends_with('}'));
}

/// Runs the schema check script; any failure to run it fails the test.
fn validate_with_schema(instance: &Path) -> std::process::Output {
    // tests/run.sh points LEXDELTA_PYTHON at the venv holding the pinned validator.
    let python = std::env::var("LEXDELTA_PYTHON").unwrap_or_else(|_| "python3".into());
    Command::new(python)
        .arg("tests/data/check_json_schema.py")
        .arg(SCHEMA)
        .arg(SCHEMA_SHA256)
        .arg(instance)
        .output()
        .expect("python3 is needed to validate SARIF against the published schema (with `pip install jsonschema==4.26.0`)")
}

#[test]
fn sarif_output_is_valid_sarif_2_1_0_and_repeatable() {
    let first = proposed("sarif");
    let second = proposed("sarif");
    assert_eq!(first.stdout, second.stdout, "byte-identical across runs");
    let log: Value = serde_json::from_str(&first.stdout).unwrap();
    let run = &log["runs"][0];
    assert_eq!(run["tool"]["driver"]["name"], "lexdelta");
    let rules = run["tool"]["driver"]["rules"].as_array().unwrap();
    assert_eq!(rules.len(), 14);
    for result in run["results"].as_array().unwrap() {
        let index = result["ruleIndex"].as_u64().unwrap() as usize;
        assert_eq!(rules[index]["id"], result["ruleId"]);
        let uri = result["locations"][0]["physicalLocation"]["artifactLocation"]["uri"]
            .as_str()
            .unwrap();
        assert!(
            uri.starts_with("demo-corpus/proposed/") && !uri.contains('\\'),
            "{uri}"
        );
    }
    assert!(
        run["results"]
            .as_array()
            .unwrap()
            .iter()
            .any(|r| r["ruleId"] == "set-bridge" && r["level"] == "warning")
    );

    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("lint.sarif");
    std::fs::write(&path, &first.stdout).unwrap();
    let checked = validate_with_schema(&path);
    assert!(
        checked.status.success(),
        "SARIF validation failed (exit {:?}):\n{}{}",
        checked.status.code(),
        String::from_utf8_lossy(&checked.stdout),
        String::from_utf8_lossy(&checked.stderr)
    );

    // The validator really validates: a wrong level is refused.
    let broken = first
        .stdout
        .replacen("\"level\": \"warning\"", "\"level\": \"severe\"", 1);
    let bad = dir.path().join("bad.sarif");
    std::fs::write(&bad, broken).unwrap();
    let refused = validate_with_schema(&bad);
    assert_eq!(
        refused.status.code(),
        Some(1),
        "{}",
        String::from_utf8_lossy(&refused.stderr)
    );
}
