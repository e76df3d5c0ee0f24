//! Preview benchmark, harness-free (run in release):
//!
//! ```text
//! cargo run --release --example gen_corpus -- --docs 100000 --queries 10000 --out /tmp/c
//! cargo run --release --example bench_preview -- --data /tmp/c --change synonym --mode warm
//! ```
//!
//! `--change synonym` adds one synonym set; `--change exempt` exempts the most frequent 1%
//! of the surface forms from the stemmer (the worst case: most queries hold one);
//! `--change exempt-random` exempts 1% of the forms drawn at random, seed 42 (a typical
//! edit: mostly rare forms). `--mode`:
//!
//! - `plain`: one plain tantivy build of the corpus (surface tokenizer, positions), nothing else;
//! - `naive`: index the corpus once per ruleset with the real analyzer and run every query on both
//!   (queries in parallel, as the preview runs its own);
//! - `cold`: `preview` with an empty cache (builds the surface index);
//! - `warm`: `preview` with the cache filled (run `cold` first with the same `--cache`);
//!   as in the CLI, the documents are read without their texts.
//!
//! Prints `mode change seconds` (wall; the CPU time of all threads beside it) and a few
//! counts on stdout. Measure peak memory with
//! `/usr/bin/time -v` (maximum resident set size), one mode per process.

use std::collections::HashMap;
use std::path::PathBuf;
use std::sync::Arc;
use std::time::Instant;

use lexdelta::analysis::Analyzer;
use lexdelta::analysis::tantivy::SurfaceTokenizer;
use lexdelta::corpus::{
    Corpus, DocOptions, read_documents, read_documents_without_texts, read_queries,
};
use lexdelta::index::{IndexPostings, NoProgress, build_key_index};
use lexdelta::preview::{
    self, DirectKeys, DocOrder, PreviewInput, PreviewOptions, Scoring, Stats, retrieve,
};
use lexdelta::rules::{SourceFile, load_sources};
use rand::SeedableRng;
use rand_chacha::ChaCha8Rng;
use rayon::prelude::*;
use tantivy::schema::{IndexRecordOption, Schema, TextFieldIndexing, TextOptions};
use tantivy::{Index, TantivyDocument};

// The allocator the CLI uses (src/main.rs), so the figures are the CLI's.
#[global_allocator]
static GLOBAL: mimalloc::MiMalloc = mimalloc::MiMalloc;

const PIPELINE: &str =
    "pipeline:\n  stemmer: english\n  stopwords: [a, an, and, the, of, to, in, is, for, on]\n";

fn analyzer(extra: &str) -> Analyzer {
    let text = format!("format: 1\nrevision: 1\n{PIPELINE}{extra}");
    let rs = load_sources(
        "bench",
        vec![SourceFile {
            name: "bench.yaml".into(),
            text,
        }],
    )
    .unwrap();
    Analyzer::new(rs).unwrap()
}

/// The first `n` documents with their texts (read from a copy of the first `n` lines).
fn first_documents(path: &std::path::Path, n: usize) -> Corpus {
    use std::io::{BufRead, Write};
    let file = std::io::BufReader::new(std::fs::File::open(path).unwrap());
    let mut head = tempfile::NamedTempFile::with_suffix(".jsonl").unwrap();
    for line in file.lines().take(n) {
        writeln!(head, "{}", line.unwrap()).unwrap();
    }
    head.flush().unwrap();
    read_documents(head.path(), &DocOptions::default()).unwrap()
}

/// CPU seconds this process has used, all threads, user and system (Linux: /proc, in
/// USER_HZ ticks, which the kernel ABI fixes at 100 per second). On a noisy machine CPU
/// time compares two builds more steadily than wall time.
fn cpu_seconds() -> f64 {
    let stat = std::fs::read_to_string("/proc/self/stat").unwrap_or_default();
    // Fields after the command name (which may hold spaces) closed by ')'.
    let rest = stat.rsplit_once(')').map_or("", |r| r.1);
    let ticks: Vec<f64> = rest
        .split_whitespace()
        .skip(11)
        .take(2)
        .filter_map(|t| t.parse().ok())
        .collect();
    ticks.iter().sum::<f64>() / 100.0
}

fn arg(args: &[String], name: &str) -> Option<String> {
    args.iter()
        .position(|a| a == name)
        .and_then(|i| args.get(i + 1).cloned())
}

fn main() {
    let args: Vec<String> = std::env::args().collect();
    let data = PathBuf::from(arg(&args, "--data").expect("--data DIR"));
    let change = arg(&args, "--change").unwrap_or_else(|| "synonym".into());
    let mode = arg(&args, "--mode").unwrap_or_else(|| "warm".into());
    let cache =
        PathBuf::from(arg(&args, "--cache").unwrap_or_else(|| "/tmp/lexdelta-bench-cache".into()));

    let started = Instant::now();
    let documents = data.join("documents.jsonl");
    // As the CLI does: with the index cached, the documents are read without their texts.
    let mut corpus = if mode == "warm" {
        read_documents_without_texts(&documents, &DocOptions::default()).unwrap()
    } else {
        read_documents(&documents, &DocOptions::default()).unwrap()
    };
    let log = read_queries(&data.join("queries.jsonl")).unwrap();
    let read_secs = started.elapsed().as_secs_f64();

    let base = analyzer("");
    let head = match change.as_str() {
        "synonym" => {
            // One set over three frequent query words.
            let mut counts: HashMap<&str, u64> = HashMap::new();
            for q in &log.queries {
                for w in q.query.split_whitespace() {
                    *counts.entry(w).or_default() += q.count;
                }
            }
            let mut words: Vec<(&str, u64)> = counts.into_iter().collect();
            words.sort_by(|a, b| b.1.cmp(&a.1).then(a.0.cmp(b.0)));
            let members: Vec<&str> = words.iter().skip(5).take(3).map(|w| w.0).collect();
            analyzer(&format!(
                "synonyms:\n  - id: bench-set\n    equivalent: [{}]\n",
                members.join(", ")
            ))
        }
        _ => {
            // Exempt the most frequent 1% of the surface forms (counted on a slice).
            let mut counts: HashMap<String, u64> = HashMap::new();
            for d in first_documents(&documents, 20_000).documents.iter() {
                for t in &d.texts {
                    for tok in base.surface().tokens(t) {
                        *counts.entry(tok.form).or_default() += 1;
                    }
                }
            }
            let distinct = counts.len();
            let mut forms: Vec<(String, u64)> = counts
                .into_iter()
                .filter(|(f, _)| !base.is_stopword(f))
                .collect();
            forms.sort_by(|a, b| b.1.cmp(&a.1).then(a.0.cmp(&b.0)));
            let n = (distinct / 100).max(1);
            let list: Vec<String> = if change == "exempt-random" {
                // A typical edit: 1% of the forms drawn at random (seeded), mostly rare.
                let mut rng = ChaCha8Rng::seed_from_u64(42);
                forms.sort_by(|a, b| a.0.cmp(&b.0));
                rand::seq::index::sample(&mut rng, forms.len(), n.min(forms.len()))
                    .into_iter()
                    .map(|i| forms[i].0.clone())
                    .collect()
            } else {
                // The worst case: the most frequent 1%, which most queries hold.
                forms.into_iter().take(n).map(|f| f.0).collect()
            };
            eprintln!("exempting {n} of {distinct} forms ({change})");
            analyzer(&format!("exempt: [{}]\n", list.join(", ")))
        }
    };

    let t = Instant::now();
    let cpu = cpu_seconds();
    match mode.as_str() {
        "plain" => {
            let mut schema = Schema::builder();
            let indexing = TextFieldIndexing::default()
                .set_tokenizer("surface")
                .set_index_option(IndexRecordOption::WithFreqsAndPositions);
            let opts = TextOptions::default().set_indexing_options(indexing);
            let fields: Vec<_> = (0..corpus.fields.len())
                .map(|i| schema.add_text_field(&format!("f{i}"), opts.clone()))
                .collect();
            let dir = tempfile::tempdir().unwrap();
            let index = Index::create_in_dir(dir.path(), schema.build()).unwrap();
            index
                .tokenizers()
                .register("surface", SurfaceTokenizer::new(base.surface().clone()));
            let mut writer = index.writer::<TantivyDocument>(200_000_000).unwrap();
            for d in &corpus.documents {
                let mut doc = TantivyDocument::default();
                for (f, text) in fields.iter().zip(&d.texts) {
                    doc.add_text(*f, text);
                }
                writer.add_document(doc).unwrap();
            }
            writer.commit().unwrap();
            writer.wait_merging_threads().unwrap();
        }
        "naive" => {
            let scoring = Scoring::default();
            let ids: Vec<String> = corpus.documents.iter().map(|d| d.id.clone()).collect();
            let order = DocOrder::by_id(&ids);
            let weights: Vec<f64> = corpus.fields.iter().map(|f| f.weight as f64).collect();
            let mut changed = 0;
            let mut results = Vec::new();
            for a in [Arc::new(base.clone()), Arc::new(head.clone())] {
                let dir = tempfile::tempdir().unwrap();
                let index = build_key_index(&corpus, &a, Some(dir.path())).unwrap();
                let postings = IndexPostings::open(&index, corpus.fields.len()).unwrap();
                let keys = DirectKeys::new(&postings);
                let stats = Stats::compute(&keys, &scoring).unwrap();
                // Each query's ranking is kept as a hash: a million documents' full hit
                // lists for every query would not fit in memory.
                // Queries run on both cores, as the preview's own queries do.
                let side: Vec<blake3::Hash> = log
                    .queries
                    .par_iter()
                    .map(|q| {
                        let hits = retrieve(
                            &a.analyze_query(&q.query),
                            &keys,
                            &stats,
                            &scoring,
                            &weights,
                            &order,
                        )
                        .unwrap();
                        let mut hasher = blake3::Hasher::new();
                        for h in &hits {
                            hasher.update(&h.doc.to_le_bytes());
                            hasher.update(&h.score.to_bits().to_le_bytes());
                        }
                        hasher.finalize()
                    })
                    .collect();
                results.push(side);
            }
            for (b, h) in results[0].iter().zip(&results[1]) {
                if b != h {
                    changed += 1;
                }
            }
            println!("naive changed queries: {changed}");
        }
        "cold" | "warm" => {
            if mode == "cold" {
                let _ = std::fs::remove_dir_all(&cache);
            }
            let options = PreviewOptions {
                cache_dir: Some(cache.clone()),
                ..PreviewOptions::default()
            };
            // As the CLI does: the texts are dropped once the index is open.
            let indexes =
                preview::open_indexes(&corpus, &base, &head, &options, &NoProgress).unwrap();
            if corpus.has_texts() {
                corpus.drop_texts();
            }
            let input = PreviewInput {
                base: Arc::new(base),
                head: Arc::new(head),
                corpus: &corpus,
                queries: &log,
                judged: None,
            };
            let report = preview::run_opened(input, indexes, &options)
                .unwrap()
                .report;
            let e = &report.evaluation;
            println!(
                "evaluated {} of {} queries, {} changed, {} forms change key, index {}",
                e.evaluated,
                e.queries,
                report.queries.len(),
                e.changed_forms,
                report.corpus.index
            );
        }
        other => panic!("unknown --mode {other}"),
    }
    println!(
        "{mode} {change} {:.3} (cpu {:.2}s; reading inputs {:.3}s, not counted)",
        t.elapsed().as_secs_f64(),
        cpu_seconds() - cpu,
        read_secs
    );
}
