//! Lint at scale: 100,000 synonym sets over a 200,000-form vocabulary, and the naive ways of
//! doing two of its checks, timed on smaller sizes to show what the term graph and the keyed
//! vocabulary buy.
//!
//! ```text
//! cargo bench --bench lint                 # full size
//! cargo bench --bench lint -- --sets 20000 # smaller
//! cargo bench --bench lint -- --no-naive   # the full-size lint only
//! ```
//!
//! The data is synthetic and seeded: random letter roots, each with regular inflections
//! (`-s`, `-es`, `-ed`, `-ing`, which lint treats as the same word) and, for one root in ten,
//! a derived `-ation` form that the stemmer conflates with the root (a stem side effect). A
//! set has one single-word member for three sets in ten and two-word phrases otherwise; one
//! set in a hundred also takes another set's single word, which makes a bridge. The rules are
//! split over 10 files, as YAML, and go through the real loader and compiler.

use std::collections::HashMap;
use std::time::{Duration, Instant};

use lexdelta::Analyzer;
use lexdelta::analysis::{CompiledSynonym, Phrase};
use lexdelta::lint::{FormStats, LintConfig, LintInput, LintReport, Vocabulary, lint};
use lexdelta::rules::{SourceFile, load_sources};
use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;
use rustc_hash::FxHashSet;

const FILES: usize = 10;

struct Data {
    roots: Vec<String>,
    vocabulary: Vocabulary,
}

/// `forms` surface forms: roots with five variants each.
fn vocabulary(forms: usize, rng: &mut ChaCha8Rng) -> Data {
    let mut seen = FxHashSet::default();
    let mut roots = Vec::with_capacity(forms / 5);
    while roots.len() < forms / 5 {
        let len = rng.random_range(6..=9);
        let root: String = (0..len)
            .map(|_| rng.random_range(b'a'..=b'z') as char)
            .collect();
        if seen.insert(root.clone()) {
            roots.push(root);
        }
    }
    let mut counted = Vec::new();
    for (i, root) in roots.iter().enumerate() {
        let last = if i % 10 == 0 {
            format!("{root}ation")
        } else {
            format!("{root}es")
        };
        for form in [
            root.clone(),
            format!("{root}s"),
            format!("{root}ed"),
            format!("{root}ing"),
            last,
        ] {
            let (documents, searches) = (rng.random_range(0..50), rng.random_range(0..20));
            counted.push(FormStats {
                form,
                documents,
                searches,
                queries: u64::from(searches > 0),
            });
        }
    }
    let vocabulary = Vocabulary::from_forms(counted);
    Data { roots, vocabulary }
}

/// `sets` equivalent sets as YAML, split over `FILES` files.
fn ruleset_sources(sets: usize, roots: &[String], rng: &mut ChaCha8Rng) -> Vec<SourceFile> {
    let per_file = sets.div_ceil(FILES);
    let mut files = vec![String::from("format: 1\nrevision: 1\nsynonyms:\n"); FILES];
    files[0] = String::from(
        "format: 1\nrevision: 1\npipeline:\n  stemmer: english\n  stopwords: [and, the]\nsynonyms:\n",
    );
    let mut singles: Vec<usize> = Vec::new();
    for i in 0..sets {
        let mut members: Vec<String> = Vec::with_capacity(4);
        if i % 10 < 3 {
            let r = ((i / 10) * 3 + i % 10) % roots.len();
            singles.push(r);
            members.push(roots[r].clone());
        }
        while members.len() < 3 {
            let (a, b) = (
                rng.random_range(0..roots.len()),
                rng.random_range(0..roots.len()),
            );
            members.push(format!("{} {}", roots[a], roots[b]));
        }
        if i % 100 == 99 && !singles.is_empty() {
            let r = singles[rng.random_range(0..singles.len())];
            members.push(roots[r].clone());
        }
        let file = (i / per_file).min(FILES - 1);
        files[file].push_str(&format!("  - [{}]\n", members.join(", ")));
    }
    files
        .into_iter()
        .enumerate()
        .map(|(i, text)| SourceFile {
            name: format!("bench/synonyms-{i:02}.yaml"),
            text,
        })
        .collect()
}

fn timed<T>(f: impl FnOnce() -> T) -> (T, Duration) {
    let start = Instant::now();
    let value = f();
    (value, start.elapsed())
}

/// CPU time this thread has used (Linux: /proc/thread-self/stat, in clock ticks of 10 ms),
/// to tell the work from waiting when other jobs share the machine.
fn cpu_time() -> Option<Duration> {
    let stat = std::fs::read_to_string("/proc/thread-self/stat").ok()?;
    let after_name = &stat[stat.rfind(')')? + 2..];
    let fields: Vec<&str> = after_name.split_whitespace().collect();
    let ticks: u64 = fields.get(11)?.parse::<u64>().ok()? + fields.get(12)?.parse::<u64>().ok()?;
    Some(Duration::from_millis(ticks * 10))
}

fn ms(d: Duration) -> String {
    format!("{:>9.1} ms", d.as_secs_f64() * 1000.0)
}

struct Setup {
    analyzer: Analyzer,
    vocabulary: Vocabulary,
    load: Duration,
    compile: Duration,
}

fn setup(sets: usize, forms: usize) -> Setup {
    let mut rng = ChaCha8Rng::seed_from_u64(7);
    let data = vocabulary(forms, &mut rng);
    let sources = ruleset_sources(sets, &data.roots, &mut rng);
    let (ruleset, load) =
        timed(|| load_sources("bench", sources).expect("the bench ruleset loads"));
    let (analyzer, compile) = timed(|| Analyzer::new(ruleset).expect("the bench ruleset compiles"));
    Setup {
        analyzer,
        vocabulary: data.vocabulary,
        load,
        compile,
    }
}

fn run_lint(s: &Setup) -> (LintReport, Duration) {
    let config = LintConfig::default();
    timed(|| {
        lint(
            &s.analyzer,
            &LintInput {
                vocabulary: Some(&s.vocabulary),
                base: None,
                config: &config,
            },
        )
    })
}

/// The naive stem side-effect scan: for every word of every rule term, key the whole
/// vocabulary again and collect the other forms with the same key.
fn naive_side_effects(a: &Analyzer, v: &Vocabulary) -> usize {
    let forms = &v.forms;
    let mut hits = 0;
    for rule in &a.ruleset().synonyms {
        for term in rule.terms() {
            for token in a.surface().tokens(&term.text) {
                let Some(key) = a.key(&token.form) else {
                    continue;
                };
                hits += forms
                    .iter()
                    .filter(|f| f.form != token.form && a.key(&f.form).as_deref() == Some(&*key))
                    .count();
            }
        }
    }
    hits
}

/// The naive bridge search: compare every pair of sets for a shared member key.
fn naive_bridges(a: &Analyzer) -> usize {
    let sets: Vec<&[Phrase]> = a
        .synonyms()
        .rules()
        .iter()
        .filter_map(|r| match r {
            CompiledSynonym::Equivalent(m) => Some(m.as_slice()),
            CompiledSynonym::OneWay { .. } => None,
        })
        .collect();
    let mut bridges: FxHashSet<&Phrase> = FxHashSet::default();
    for i in 0..sets.len() {
        for j in i + 1..sets.len() {
            for p in sets[i] {
                if sets[j].contains(p) {
                    bridges.insert(p);
                }
            }
        }
    }
    bridges.len()
}

fn counts(report: &LintReport) -> String {
    let mut by_check: HashMap<&str, usize> = HashMap::new();
    for f in &report.findings {
        *by_check.entry(f.check).or_default() += 1;
    }
    let mut pairs: Vec<(&str, usize)> = by_check.into_iter().collect();
    pairs.sort_unstable();
    pairs
        .iter()
        .map(|(c, n)| format!("{c} {n}"))
        .collect::<Vec<_>>()
        .join(", ")
}

fn arg(name: &str, default: usize) -> usize {
    let args: Vec<String> = std::env::args().collect();
    args.iter()
        .position(|a| a == name)
        .and_then(|i| args.get(i + 1))
        .and_then(|v| v.parse().ok())
        .unwrap_or(default)
}

fn main() {
    // `cargo bench` passes --bench; `cargo test --benches` (or --all-targets) does not, and
    // then a small smoke run checks the harness still works without taking minutes.
    if !std::env::args().any(|a| a == "--bench") {
        let s = setup(200, 1_000);
        let (report, _) = run_lint(&s);
        assert!(
            report
                .findings
                .iter()
                .any(|f| f.check == "stem-side-effect")
        );
        println!(
            "bench smoke run: {} findings (run `cargo bench --bench lint` to time)",
            report.findings.len()
        );
        return;
    }
    let sets = arg("--sets", 100_000);
    let forms = arg("--forms", 200_000);

    let big = setup(sets, forms);
    let cpu_before = cpu_time();
    let (report, lint_time) = run_lint(&big);
    let cpu = cpu_time().zip(cpu_before).map(|(a, b)| a.saturating_sub(b));
    println!("lint at scale: {sets} equivalent sets, {forms} surface forms");
    println!("  load YAML      {}", ms(big.load));
    println!("  compile        {}", ms(big.compile));
    println!(
        "  lint           {}   ({} findings: {})",
        ms(lint_time),
        report.findings.len(),
        counts(&report)
    );
    if let Some(cpu) = cpu {
        println!("  lint CPU time  {}", ms(cpu));
    }
    drop(report);

    if std::env::args().any(|a| a == "--no-naive") {
        return;
    }

    // The naive stem side-effect scan is O(terms × vocabulary): time it where it finishes.
    let small = setup(300, 5_000);
    let (small_report, small_lint) = run_lint(&small);
    let (hits, naive_time) = timed(|| naive_side_effects(&small.analyzer, &small.vocabulary));
    println!("stem side effects, 300 sets over 5000 forms:");
    println!(
        "  lint, all checks      {}   ({} stem-side-effect findings)",
        ms(small_lint),
        small_report
            .findings
            .iter()
            .filter(|f| f.check == "stem-side-effect")
            .count()
    );
    println!(
        "  naive per-term scan   {}   ({hits} form pairs)  → {:.0}× slower",
        ms(naive_time),
        naive_time.as_secs_f64() / small_lint.as_secs_f64()
    );

    // Pairwise set comparison is O(sets²).
    let mid = setup(10_000, 40_000);
    let (mid_report, mid_lint) = run_lint(&mid);
    let (bridges, pairwise) = timed(|| naive_bridges(&mid.analyzer));
    println!("set bridges, 10000 sets:");
    println!(
        "  lint, all checks      {}   ({} set-bridge findings)",
        ms(mid_lint),
        mid_report
            .findings
            .iter()
            .filter(|f| f.check == "set-bridge")
            .count()
    );
    println!(
        "  naive pairwise        {}   ({bridges} bridge keys)  → {:.0}× slower; at {sets} sets ≈ {:.0} s",
        ms(pairwise),
        pairwise.as_secs_f64() / mid_lint.as_secs_f64(),
        pairwise.as_secs_f64() * (sets as f64 / 10_000.0).powi(2)
    );
}
