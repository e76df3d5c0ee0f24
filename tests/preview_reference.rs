//! What `lexdelta preview` prints, checked against outside references:
//!
//! * its judged metrics against trec_eval's own code (ir-measures 0.4.3 with the
//!   pytrec-eval-terrier 0.5.11 provider) reading lexdelta's own `--runs` files, per query
//!   and in the means, to 1e-9: on a generated collection built to tie (a third of its
//!   documents are copies of another under another id), at the default depth (1000), at a
//!   shallow depth, and on the demo;
//! * its BM25 scores against bm25s 0.3.16 and its cosine scores against scikit-learn 1.9.1,
//!   on a single field, to 1e-6.
//!
//! `tests/reference/preview_reference.py` generates the collection and computes the
//! reference values. It runs with `$LEXDELTA_PYTHON` (set by `tests/run.sh`) or `python3`;
//! a missing library fails the test with the command that installs it, never skips it.

use std::collections::{BTreeMap, BTreeSet};
use std::path::{Path, PathBuf};
use std::process::Command;

use serde_json::Value;

const INSTALL: &str = "tests/run.sh (or: pip install -r tests/reference/requirements.txt)";

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

/// Runs the reference script and returns its stdout.
fn reference(args: &[&str]) -> String {
    let python = std::env::var("LEXDELTA_PYTHON").unwrap_or_else(|_| "python3".into());
    let script = root().join("tests/reference/preview_reference.py");
    let out = Command::new(&python)
        .arg(&script)
        .args(args)
        .output()
        .unwrap_or_else(|e| panic!("cannot run {python:?} ({e}); install with {INSTALL}"));
    assert!(
        out.status.success(),
        "{} {args:?} failed ({}):\n{}\ninstall the reference libraries with {INSTALL}",
        script.display(),
        out.status,
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).expect("UTF-8 from the reference script")
}

/// Runs `lexdelta` in the project root and returns its stdout; it must succeed.
fn lexdelta(args: &[&str]) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_lexdelta"))
        .args(args)
        .current_dir(root())
        .output()
        .expect("run lexdelta");
    assert!(
        out.status.success(),
        "lexdelta {args:?} failed ({}):\n{}",
        out.status,
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).expect("UTF-8 from lexdelta")
}

fn path(p: &Path) -> &str {
    p.to_str().expect("a UTF-8 temporary path")
}

/// A generated collection, written once per test.
fn generated(dir: &Path) -> PathBuf {
    let gen_dir = dir.join("collection");
    std::fs::create_dir_all(&gen_dir).unwrap();
    reference(&["generate", path(&gen_dir), "20261205"]);
    gen_dir
}

/// The arguments of a preview of the generated collection.
fn collection_args(gen_dir: &Path) -> Vec<String> {
    let at = |name: &str| gen_dir.join(name).to_string_lossy().into_owned();
    [
        "--corpus",
        &at("corpus.jsonl"),
        "--queries",
        &at("queries.tsv"),
        "--judgments",
        &at("judgments.qrels"),
        "--judged-queries",
        &at("judged-queries.tsv"),
        "--no-cache",
    ]
    .iter()
    .map(|s| s.to_string())
    .collect()
}

/// lexdelta's per-query values: metric name → query id → (before, after).
type Values = BTreeMap<String, BTreeMap<String, (f64, f64)>>;

fn lexdelta_values(report: &Value) -> (Values, BTreeMap<String, (f64, f64)>) {
    let quality = &report["quality"];
    let names: Vec<String> = quality["metrics"]
        .as_array()
        .expect("metrics")
        .iter()
        .map(|m| m["metric"].as_str().unwrap().to_string())
        .collect();
    let means = quality["metrics"]
        .as_array()
        .unwrap()
        .iter()
        .map(|m| {
            let name = m["metric"].as_str().unwrap().to_string();
            (
                name,
                (m["before"].as_f64().unwrap(), m["after"].as_f64().unwrap()),
            )
        })
        .collect();
    let mut values = Values::new();
    for q in quality["per_query"].as_array().expect("per_query") {
        let qid = q["qid"].as_str().unwrap();
        for (i, name) in names.iter().enumerate() {
            let (b, a) = (
                q["before"][i].as_f64().unwrap(),
                q["after"][i].as_f64().unwrap(),
            );
            values
                .entry(name.clone())
                .or_default()
                .insert(qid.to_string(), (b, a));
        }
    }
    (values, means)
}

/// Runs a preview with run files and checks every judged figure against trec_eval's code
/// reading those run files. Returns how many judged queries found nothing on the base side
/// (they enter the means as 0, as `trec_eval -c` counts them).
fn check_against_trec_eval(
    label: &str,
    args: &[String],
    qrels: &Path,
    judged_queries: &Path,
    depth: usize,
) -> usize {
    let dir = tempfile::tempdir().unwrap();
    let runs = dir.path().join("runs");
    let mut all: Vec<&str> = vec!["preview", "--format", "json", "--runs", path(&runs)];
    all.extend(args.iter().map(String::as_str));
    let depth_arg = depth.to_string();
    all.extend(["--depth", &depth_arg]);
    let report: Value = serde_json::from_str(&lexdelta(&all)).expect("JSON report");
    let (values, means) = lexdelta_values(&report);
    let mut failures = Vec::new();
    let mut not_found = 0;
    let (mut compared, mut largest) = (0usize, 0f64);
    for (side, pick) in [("base", 0), ("head", 1)] {
        let run = runs.join(format!("{side}.run"));
        let expected: Value = serde_json::from_str(&reference(&[
            "metrics",
            path(qrels),
            path(judged_queries),
            path(&run),
            &depth_arg,
        ]))
        .unwrap();
        let ref_queries: BTreeSet<&str> = expected["queries"]
            .as_array()
            .unwrap()
            .iter()
            .map(|q| q.as_str().unwrap())
            .collect();
        let ours: BTreeSet<&str> = values
            .values()
            .next()
            .unwrap()
            .keys()
            .map(String::as_str)
            .collect();
        assert_eq!(ours, ref_queries, "{label}: the judged queries evaluated");
        let in_run: BTreeSet<String> = std::fs::read_to_string(&run)
            .unwrap()
            .lines()
            .map(|l| l.split_whitespace().next().unwrap().to_string())
            .collect();
        if side == "base" {
            not_found = ref_queries.iter().filter(|q| !in_run.contains(**q)).count();
        }
        for (name, per_query) in expected["per_query"].as_object().unwrap() {
            let ours = values
                .get(name)
                .unwrap_or_else(|| panic!("{label}: lexdelta reports no {name}"));
            for (qid, want) in per_query.as_object().unwrap() {
                let got = if pick == 0 { ours[qid].0 } else { ours[qid].1 };
                let want = want.as_f64().unwrap();
                compared += 1;
                largest = largest.max((got - want).abs());
                if (got - want).abs() > 1e-9 {
                    failures.push(format!("{label} {side} {name} {qid}: {got} vs {want}"));
                }
            }
            let want = expected["means"][name].as_f64().unwrap();
            let got = if pick == 0 {
                means[name].0
            } else {
                means[name].1
            };
            if (got - want).abs() > 1e-9 {
                failures.push(format!("{label} {side} mean {name}: {got} vs {want}"));
            }
        }
    }
    // For the record (visible with --nocapture).
    println!(
        "{label}: {compared} per-query figures compared with trec_eval, largest difference {largest:e}"
    );
    assert!(
        failures.is_empty(),
        "{} figures disagree with trec_eval:\n{}",
        failures.len(),
        failures.join("\n")
    );
    not_found
}

/// Queries of a run file whose documents tie: (queries with a tie, all queries).
fn ties(run: &Path) -> (usize, usize) {
    let mut scores: BTreeMap<String, Vec<String>> = BTreeMap::new();
    for line in std::fs::read_to_string(run).unwrap().lines() {
        let f: Vec<&str> = line.split_whitespace().collect();
        scores.entry(f[0].into()).or_default().push(f[4].into());
    }
    let tied = scores
        .values()
        .filter(|s| s.iter().collect::<BTreeSet<_>>().len() < s.len())
        .count();
    (tied, scores.len())
}

#[test]
fn judged_metrics_equal_trec_eval_on_lexdelta_runs_with_ties() {
    let dir = tempfile::tempdir().unwrap();
    let gen_dir = generated(dir.path());
    let (qrels, judged) = (
        gen_dir.join("judgments.qrels"),
        gen_dir.join("judged-queries.tsv"),
    );
    let rules = |side: &str| gen_dir.join(side).to_string_lossy().into_owned();
    let mut args = vec![
        "--base".to_string(),
        rules("base"),
        "--head".into(),
        rules("head"),
    ];
    args.extend(collection_args(&gen_dir));

    // The collection must really tie, or this test would check nothing about ties.
    let runs = dir.path().join("tie-check");
    let mut all: Vec<&str> = vec!["preview", "--runs", path(&runs)];
    all.extend(args.iter().map(String::as_str));
    lexdelta(&all);
    let (tied, queries) = ties(&runs.join("base.run"));
    assert!(
        tied * 2 > queries,
        "only {tied} of {queries} queries have tied scores"
    );

    let not_found = check_against_trec_eval("default depth", &args, &qrels, &judged, 1000);
    assert!(
        not_found > 0,
        "no judged query finds nothing: -c is untested"
    );
    check_against_trec_eval("depth 5", &args, &qrels, &judged, 5);
    let mut any = args.clone();
    any.extend(["--match".into(), "any".into(), "--top-k".into(), "3".into()]);
    check_against_trec_eval("match any, depth 20", &any, &qrels, &judged, 20);
}

#[test]
fn judged_metrics_equal_trec_eval_on_the_demo() {
    let demo = root().join("demo-corpus");
    let args: Vec<String> = ["--demo", "--no-cache"]
        .iter()
        .map(|s| s.to_string())
        .collect();
    check_against_trec_eval(
        "demo",
        &args,
        &demo.join("judgments.qrels"),
        &demo.join("judged-queries.tsv"),
        1000,
    );
}

/// (query id, document id) → score, from a run file.
fn run_scores(run: &Path) -> BTreeMap<(String, String), f64> {
    std::fs::read_to_string(run)
        .unwrap()
        .lines()
        .map(|l| {
            let f: Vec<&str> = l.split_whitespace().collect();
            ((f[0].into(), f[2].into()), f[4].parse().unwrap())
        })
        .collect()
}

#[test]
fn single_field_scores_equal_outside_scorers() {
    let dir = tempfile::tempdir().unwrap();
    let gen_dir = generated(dir.path());
    let expected: Value = serde_json::from_str(&reference(&[
        "scores",
        path(&gen_dir.join("corpus.jsonl")),
        "body",
        path(&gen_dir.join("queries.tsv")),
        path(&gen_dir.join("judged-queries.tsv")),
    ]))
    .unwrap();
    let base = gen_dir.join("base").to_string_lossy().into_owned();
    let mut worst = BTreeMap::new();
    for (ranking, scorer) in [("bm25", "bm25"), ("cosine", "cosine")] {
        let runs = dir.path().join(ranking);
        let mut args: Vec<String> = [
            "preview",
            "--base",
            &base,
            "--head",
            &base,
            "--field",
            "body",
            "--match",
            "any",
            "--depth",
            "100000",
            "--ranking",
            ranking,
            "--runs",
        ]
        .iter()
        .map(|s| s.to_string())
        .collect();
        args.push(path(&runs).to_string());
        args.extend(collection_args(&gen_dir));
        lexdelta(&args.iter().map(String::as_str).collect::<Vec<_>>());
        let ours = run_scores(&runs.join("base.run"));
        let mut theirs = BTreeMap::new();
        for (qid, docs) in expected[scorer].as_object().unwrap() {
            for (doc, score) in docs.as_object().unwrap() {
                theirs.insert((qid.clone(), doc.clone()), score.as_f64().unwrap());
            }
        }
        let ours_keys: BTreeSet<_> = ours.keys().collect();
        let theirs_keys: BTreeSet<_> = theirs.keys().collect();
        assert_eq!(
            ours_keys, theirs_keys,
            "{ranking}: the matching documents differ"
        );
        assert!(
            theirs.len() > 500,
            "{ranking}: only {} scores",
            theirs.len()
        );
        let mut max: f64 = 0.0;
        for (key, want) in &theirs {
            let got = ours[key];
            max = max.max((got - want).abs());
            assert!(
                (got - want).abs() <= 1e-6,
                "{ranking} score of {key:?}: lexdelta {got}, {} {want}",
                expected["libraries"]
            );
        }
        worst.insert(ranking, max);
    }
    // The largest differences, for the record (visible with --nocapture).
    println!("largest score differences: {worst:?}");
}
