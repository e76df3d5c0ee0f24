//! lexdelta's metrics against outside reference implementations.
//!
//! `tests/reference/metrics_reference.py` generates seeded random graded judgments and runs
//! and computes reference values with:
//!
//! * ir-measures 0.4.3 with the pytrec-eval-terrier 0.5.11 provider (trec_eval's own code)
//!   for P@k, R@k, RR, AP, AP@k, nDCG and nDCG@k (linear gain and, through ir-measures'
//!   gain mapping, 2^g − 1), and ir-measures' msmarco and judged providers for RR@k and
//!   JudgedShare@k (its `Judged@k`); F1@k is derived from its P@k and R@k;
//! * rbo 0.1.3 (PyPI) for RBO_ext, even and uneven lengths;
//! * scipy 1.17.1 `scipy.stats.permutation_test` (exact, paired) for the randomization
//!   test's p-values.
//!
//! This test runs the script with `python3` (or `$LEXDELTA_PYTHON`) and requires agreement
//! to 1e-9. It fails, never skips, when Python or a library is missing; install them with
//! the command in `INSTALL`.

use std::collections::{BTreeMap, BTreeSet};
use std::path::{Path, PathBuf};
use std::process::Command;
use std::sync::OnceLock;

use lexdelta::metrics::{
    EvalConfig, EvalParams, Gain, Metric, QueryScope, RandomizationTest, Rankings, TestMethod,
    evaluate, rbo_ext, read_csv_judgments, read_queries, read_trec_qrels, read_trec_run,
};
use serde::Deserialize;

const INSTALL: &str =
    "pip install ir-measures==0.4.3 pytrec-eval-terrier==0.5.11 rbo==0.1.3 scipy==1.17.1";
const TOLERANCE: f64 = 1e-9;

#[derive(Deserialize)]
struct Expected {
    libraries: BTreeMap<String, String>,
    judged_queries: Vec<String>,
    metrics: Vec<MetricCase>,
    rbo: Vec<RboCase>,
    significance: Vec<SignificanceCase>,
}

#[derive(Deserialize)]
struct MetricCase {
    run: String,
    metric: String,
    relevance_threshold: i32,
    gain: Gain,
    reference: String,
    per_query: BTreeMap<String, f64>,
    mean: f64,
}

#[derive(Deserialize)]
struct RboCase {
    a: Vec<String>,
    b: Vec<String>,
    p: f64,
    value: f64,
}

#[derive(Deserialize)]
struct SignificanceCase {
    before: Vec<f64>,
    after: Vec<f64>,
    p_value: f64,
}

struct Reference {
    dir: tempfile::TempDir,
    expected: Expected,
}

impl Reference {
    fn path(&self, name: &str) -> PathBuf {
        self.dir.path().join(name)
    }
}

fn script() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/reference/metrics_reference.py")
}

fn reference() -> &'static Reference {
    static REFERENCE: OnceLock<Reference> = OnceLock::new();
    REFERENCE.get_or_init(|| {
        let dir = tempfile::tempdir().expect("temporary directory");
        let python = std::env::var("LEXDELTA_PYTHON").unwrap_or_else(|_| "python3".into());
        let script = script();
        let output = Command::new(&python)
            .arg(&script)
            .arg(dir.path())
            .output()
            .unwrap_or_else(|e| {
                panic!(
                    "cannot run {python:?} for the metrics reference test ({e}).\n\
                     Install Python 3 and the reference libraries:\n    {INSTALL}"
                )
            });
        if !output.status.success() {
            panic!(
                "{} {} failed ({}):\n{}\n\
                 The metrics reference test needs the Python reference libraries:\n    {INSTALL}",
                python,
                script.display(),
                output.status,
                String::from_utf8_lossy(&output.stderr)
            );
        }
        let json = std::fs::read_to_string(dir.path().join("expected.json"))
            .expect("the reference script wrote expected.json");
        let expected: Expected = serde_json::from_str(&json).expect("expected.json parses");
        Reference { dir, expected }
    })
}

fn report(failures: &[String], total: usize, what: &str) {
    assert!(
        failures.is_empty(),
        "{} of {total} {what} disagree with the reference (libraries: {:?}):\n{}",
        failures.len(),
        reference().expected.libraries,
        failures
            .iter()
            .take(25)
            .cloned()
            .collect::<Vec<_>>()
            .join("\n")
    );
}

#[test]
fn readers_agree_with_each_other() {
    let r = reference();
    let qrels = read_trec_qrels(r.path("judgments.qrels")).unwrap();
    let (csv, csv_queries) = read_csv_judgments(r.path("judgments.csv")).unwrap();
    assert_eq!(qrels, csv);
    assert_eq!(
        qrels.query_ids().collect::<Vec<_>>(),
        r.expected.judged_queries
    );
    let queries = read_queries(r.path("queries.tsv")).unwrap();
    assert!(queries.len() > csv_queries.len());
    for q in csv_queries.iter() {
        assert_eq!(queries.get(&q.id), Some(q.text.as_str()), "{}", q.id);
    }
}

#[test]
fn ranked_metrics_match_ir_measures() {
    let r = reference();
    let judgments = read_trec_qrels(r.path("judgments.qrels")).unwrap();
    let mut runs: BTreeMap<&str, Rankings> = BTreeMap::new();
    let mut failures = Vec::new();
    let mut compared = 0;
    for case in &r.expected.metrics {
        let run = runs
            .entry(&case.run)
            .or_insert_with(|| read_trec_run(r.path(&case.run)).unwrap());
        let metric: Metric = case.metric.parse().unwrap();
        let config = EvalConfig {
            metrics: vec![metric],
            params: EvalParams {
                relevance_threshold: case.relevance_threshold,
                gain: case.gain,
            },
            scope: QueryScope::Judged,
        };
        let set = evaluate(&*run, &judgments, &config).unwrap();
        let label = format!(
            "{} (rel {}, {:?} gain) on {} vs {}",
            case.metric, case.relevance_threshold, case.gain, case.run, case.reference
        );
        let ours: BTreeSet<&str> = set.queries.iter().map(String::as_str).collect();
        let theirs: BTreeSet<&str> = case.per_query.keys().map(String::as_str).collect();
        if ours != theirs {
            failures.push(format!("{label}: query sets differ"));
            continue;
        }
        for (q, &want) in &case.per_query {
            compared += 1;
            let got = set.value(q, metric).unwrap();
            if (got - want).abs() > TOLERANCE {
                failures.push(format!(
                    "{label}: query {q}: lexdelta {got}, reference {want}"
                ));
            }
        }
        let got = set.metrics[0].mean;
        if (got - case.mean).abs() > TOLERANCE {
            failures.push(format!(
                "{label}: mean: lexdelta {got}, reference {}",
                case.mean
            ));
        }
    }
    assert!(compared > 5_000, "only {compared} values compared");
    report(&failures, compared, "per-query metric values");
}

#[test]
fn rbo_matches_the_rbo_package() {
    let r = reference();
    let mut failures = Vec::new();
    let mut uneven = 0;
    for (i, case) in r.expected.rbo.iter().enumerate() {
        uneven += usize::from(case.a.len() != case.b.len());
        let got = rbo_ext(&case.a, &case.b, case.p).unwrap();
        if (got - case.value).abs() > TOLERANCE {
            failures.push(format!(
                "case {i} (lengths {} and {}, p {}): lexdelta {got}, rbo {}",
                case.a.len(),
                case.b.len(),
                case.p,
                case.value
            ));
        }
    }
    assert!(uneven > 20, "too few uneven cases: {uneven}");
    report(&failures, r.expected.rbo.len(), "RBO values");
}

#[test]
fn randomization_test_matches_scipy_exact() {
    let r = reference();
    let test = RandomizationTest::default();
    let mut failures = Vec::new();
    for (i, case) in r.expected.significance.iter().enumerate() {
        let got = test.paired(&case.before, &case.after).unwrap();
        assert!(matches!(got.method, TestMethod::Exact { .. }));
        if (got.p_value - case.p_value).abs() > TOLERANCE {
            failures.push(format!(
                "case {i} ({} queries): lexdelta p {}, scipy p {}",
                case.before.len(),
                got.p_value,
                case.p_value
            ));
        }
    }
    report(
        &failures,
        r.expected.significance.len(),
        "randomization-test p-values",
    );
}
