//! `lexdelta preview` on the demo: live rules against the proposed change.

use assert_cmd::Command;
use serde_json::Value;

fn preview(cache: &std::path::Path, extra: &[&str]) -> std::process::Output {
    let mut cmd = Command::cargo_bin("lexdelta").unwrap();
    cmd.current_dir(env!("CARGO_MANIFEST_DIR")).args([
        "preview",
        "--base",
        "rules",
        "--head",
        "demo-corpus/proposed",
        "--corpus",
        "demo-corpus/documents.jsonl",
        "--queries",
        "demo-corpus/queries.jsonl",
        "--judgments",
        "demo-corpus/judgments.qrels",
        "--judged-queries",
        "demo-corpus/judged-queries.tsv",
        "--cache",
    ]);
    cmd.arg(cache).args(extra);
    cmd.output().unwrap()
}

fn json(cache: &std::path::Path) -> (Vec<u8>, Value) {
    let out = preview(cache, &["--format", "json"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let value = serde_json::from_slice(&out.stdout).unwrap();
    (out.stdout, value)
}

fn query<'a>(report: &'a Value, text: &str) -> &'a Value {
    report["queries"]
        .as_array()
        .unwrap()
        .iter()
        .find(|q| q["query"] == text)
        .unwrap_or_else(|| panic!("{text:?} is not among the changed queries"))
}

fn causes(q: &Value) -> Vec<(String, String)> {
    q["causes"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| {
            (
                c["rule"].as_str().unwrap().to_string(),
                c["origin"].as_str().unwrap_or("").to_string(),
            )
        })
        .collect()
}

#[test]
fn demo_preview_labels_and_attributes_the_change() {
    let cache = tempfile::tempdir().unwrap();
    let (first, report) = json(cache.path());

    let stroller = query(&report, "stroller");
    assert_eq!(stroller["label"], "rescued");
    assert_eq!(stroller["matches_before"], 0);
    assert!(
        causes(stroller)
            .iter()
            .any(|(r, _)| r == "prams-and-pushchairs")
    );

    let left = query(&report, "left luggage");
    assert!(left["gained_count"].as_u64().unwrap() + left["lost_count"].as_u64().unwrap() > 0);
    assert!(
        causes(left)
            .iter()
            .any(|(_, o)| o.starts_with("demo-corpus/proposed/irregular-verbs.yaml:")),
        "{:?}",
        causes(left)
    );

    let uni = query(&report, "university pass");
    assert_ne!(uni["label"], "unchanged");
    assert!(causes(uni).iter().any(|(r, _)| r == "accessible-travel"));

    assert!(
        report["notice"]
            .as_str()
            .unwrap()
            .contains("evidence, not proof")
    );
    let quality = &report["quality"];
    assert_eq!(quality["judged_queries"], 122);
    assert!(
        quality["test"]
            .as_str()
            .unwrap()
            .contains("Fisher's randomization test")
    );
    let skipped = report["evaluation"]["skipped"].as_u64().unwrap();
    assert!(skipped > 0, "unaffected queries are not run");

    // The second run reuses the cache and prints the same bytes.
    let (second, _) = json(cache.path());
    assert_eq!(first, second);
}

#[test]
fn text_output_and_run_files() {
    let cache = tempfile::tempdir().unwrap();
    let runs = cache.path().join("runs");
    let out = preview(
        cache.path(),
        &[
            "--color",
            "never",
            "--runs",
            runs.to_str().unwrap(),
            "--limit",
            "3",
        ],
    );
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8(out.stdout).unwrap();
    // Every emptied, lost or judged-worse query is listed whatever the limit, first; then
    // the limit's worth of the rest.
    assert!(
        text.contains("changed queries (16 of 135: every emptied, lost or judged-worse query (13 queries), then the most searched)"),
        "{text}"
    );
    let listed: Vec<&str> = text
        .lines()
        .filter(|l| l.starts_with("  ") && l.contains("] "))
        .collect();
    assert!(listed[0].starts_with("  transitions  [emptied"), "{text}");
    assert!(listed[1].starts_with("  transit  [lost]"), "{text}");
    assert!(
        listed[2].starts_with("  access pass  [gained, nDCG@10 0.7110 -> 0.1143]"),
        "{text}"
    );
    assert!(text.contains("nDCG@10"));
    assert!(text.contains("evidence, not proof"));
    let base = std::fs::read_to_string(runs.join("base.run")).unwrap();
    let first = base.lines().next().unwrap();
    let cols: Vec<&str> = first.split(' ').collect();
    assert_eq!(cols.len(), 6, "{first}");
    assert_eq!(cols[1], "Q0");
    assert_eq!(cols[5], "base");
    assert!(base.lines().any(|l| l.starts_with("q001 Q0 ")));
    // Judged queries under their ids, others under ids from their text, sorted by id.
    let qids: Vec<&str> = base.lines().map(|l| l.split(' ').next().unwrap()).collect();
    assert!(qids.is_sorted());
    assert!(qids.iter().any(|q| q.starts_with("log-")));
    assert!(
        std::fs::read_to_string(runs.join("head.run"))
            .unwrap()
            .contains(" head\n")
    );
}

#[test]
fn bad_input_exits_2_with_the_line() {
    let dir = tempfile::tempdir().unwrap();
    let queries = dir.path().join("q.tsv");
    std::fs::write(&queries, "pram\t3\nbus\tmany\n").unwrap();
    let out = preview_of_rules()
        .args(["--corpus", "demo-corpus/documents.jsonl", "--queries"])
        .arg(&queries)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("q.tsv:2:"));
}

/// `preview` of the demo's live rules against its proposed change, with no cache.
fn preview_of_rules() -> Command {
    let mut cmd = Command::cargo_bin("lexdelta").unwrap();
    cmd.current_dir(env!("CARGO_MANIFEST_DIR")).args([
        "preview",
        "--base",
        "rules",
        "--head",
        "demo-corpus/proposed",
        "--no-cache",
    ]);
    cmd
}

/// A preview over a small corpus and log written into `dir`, with run files.
fn preview_with_runs(dir: &std::path::Path, corpus: &str, queries: &str) -> std::process::Output {
    std::fs::write(dir.join("docs.jsonl"), corpus).unwrap();
    std::fs::write(dir.join("q.tsv"), queries).unwrap();
    preview_of_rules()
        .arg("--corpus")
        .arg(dir.join("docs.jsonl"))
        .arg("--queries")
        .arg(dir.join("q.tsv"))
        .arg("--runs")
        .arg(dir.join("runs"))
        .output()
        .unwrap()
}

#[test]
fn run_files_name_unjudged_queries_by_their_text_and_sort_them() {
    let docs = "{\"id\": \"a\", \"title\": \"night bus\", \"body\": \"night bus times\"}\n\
                {\"id\": \"b\", \"title\": \"tram\", \"body\": \"tram and bus stops\"}\n";
    let (one, two) = (tempfile::tempdir().unwrap(), tempfile::tempdir().unwrap());
    // The same queries in two orders, with other traffic: the same run files.
    let first = preview_with_runs(one.path(), docs, "bus\t5\ntram\t2\nnight bus\t1\n");
    let second = preview_with_runs(two.path(), docs, "night bus\t9\nbus\t1\ntram\t1\n");
    for out in [&first, &second] {
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
    }
    let read = |dir: &tempfile::TempDir| {
        std::fs::read_to_string(dir.path().join("runs/base.run")).unwrap()
    };
    let (a, b) = (read(&one), read(&two));
    assert_eq!(a, b);
    let qids: Vec<&str> = a.lines().map(|l| l.split(' ').next().unwrap()).collect();
    assert!(
        qids.iter().all(|q| q.starts_with("log-") && q.len() == 16),
        "{a}"
    );
    assert!(qids.is_sorted(), "{a}");
}

#[test]
fn an_id_the_run_format_cannot_carry_is_refused_before_anything_is_written() {
    let dir = tempfile::tempdir().unwrap();
    let docs = "{\"id\": \"kb 1\", \"title\": \"night bus\", \"body\": \"night bus times\"}\n";
    let out = preview_with_runs(dir.path(), docs, "bus\t5\n");
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains("document id \"kb 1\" cannot be written to a TREC run file")
            && err.contains("whitespace"),
        "{err}"
    );
    assert!(!dir.path().join("runs").exists());
}

#[test]
fn the_randomization_test_takes_its_trials_and_seed() {
    let cache = tempfile::tempdir().unwrap();
    let out = preview(
        cache.path(),
        &["--format", "json", "--trials", "500", "--seed", "7"],
    );
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let report: Value = serde_json::from_slice(&out.stdout).unwrap();
    let quality = &report["quality"];
    assert!(
        quality["test"]
            .as_str()
            .unwrap()
            .contains("500 random assignments from seed 7")
    );
    let sampled: Vec<&Value> = quality["metrics"]
        .as_array()
        .unwrap()
        .iter()
        .map(|m| &m["method"])
        .filter(|m| m["kind"] == "sampled")
        .collect();
    assert!(!sampled.is_empty());
    assert!(sampled.iter().all(|m| m["trials"] == 500 && m["seed"] == 7));
    let out = preview(cache.path(), &["--trials", "0"]);
    assert_eq!(out.status.code(), Some(2));
}
