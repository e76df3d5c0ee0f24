//! What checking a cached surface index costs before it is trusted: the quick check
//! (manifest sizes, modification times, small files' checksums) against the full one
//! (every index file against its CRC32 footer), on an index already in the cache.
//!
//! ```text
//! cargo run --release --example bench_cache_verify -- DOCUMENTS.jsonl CACHE_DIR [RUNS]
//! ```
//!
//! Builds the index into CACHE_DIR first if it is not there; then opens it RUNS times (5 by
//! default) each way, alternating, and prints the median wall time of each, with the index
//! size. Compare with a warm preview's time on the same corpus (README, "Speed").

use std::path::PathBuf;
use std::time::Instant;

use lexdelta::corpus::{DocOptions, read_documents, read_documents_without_texts};
use lexdelta::index::{NoProgress, Verify, open_or_build_checked};
use lexdelta::rules::{SourceFile, load_sources};

#[global_allocator]
static GLOBAL: mimalloc::MiMalloc = mimalloc::MiMalloc;

fn median(mut v: Vec<f64>) -> f64 {
    v.sort_by(f64::total_cmp);
    v[v.len() / 2]
}

fn main() {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let [documents, cache, rest @ ..] = args.as_slice() else {
        eprintln!("usage: bench_cache_verify DOCUMENTS.jsonl CACHE_DIR [RUNS]");
        std::process::exit(2);
    };
    let runs: usize = rest.first().and_then(|r| r.parse().ok()).unwrap_or(5);
    let (documents, cache) = (PathBuf::from(documents), PathBuf::from(cache));
    let rules = load_sources(
        "bench",
        vec![SourceFile {
            name: "bench.yaml".into(),
            text: "format: 1\nrevision: 1\npipeline:\n  stemmer: english\n".into(),
        }],
    )
    .expect("the bench ruleset loads");
    let analyzer = lexdelta::analysis::Analyzer::new(rules).expect("it compiles");
    let surface = analyzer.surface();
    let light = read_documents_without_texts(&documents, &DocOptions::default()).unwrap();
    let opened = match open_or_build_checked(&light, surface, &cache, Verify::Quick, &NoProgress) {
        Ok(opened) => opened,
        Err(_) => {
            let full = read_documents(&documents, &DocOptions::default()).unwrap();
            open_or_build_checked(&full, surface, &cache, Verify::Quick, &NoProgress).unwrap()
        }
    };
    let size: u64 = std::fs::read_dir(&opened.path)
        .unwrap()
        .flatten()
        .filter_map(|e| e.metadata().ok())
        .map(|m| m.len())
        .sum();
    drop(opened);
    let (mut quick, mut full) = (Vec::new(), Vec::new());
    for _ in 0..runs {
        for (verify, times) in [(Verify::Quick, &mut quick), (Verify::Full, &mut full)] {
            let start = Instant::now();
            let opened = open_or_build_checked(&light, surface, &cache, verify, &NoProgress)
                .expect("the cached index opens");
            times.push(start.elapsed().as_secs_f64());
            assert!(opened.damage.is_none(), "{:?}", opened.damage);
        }
    }
    println!(
        "index {:.1} MiB, {} documents: open with quick check {:.4} s, with full check {:.4} s (medians of {runs})",
        size as f64 / (1 << 20) as f64,
        light.len(),
        median(quick),
        median(full),
    );
}
