//! The fuzzing harness (`tests/fuzz_harness/`) in CI for a few seconds, and as long as
//! asked outside it:
//!
//! ```text
//! LEXDELTA_FUZZ_INPUTS=10000000 LEXDELTA_FUZZ_SEED=1 \
//!     cargo test --release --test fuzz_smoke -- --ignored --nocapture fuzz_long
//! ```
//!
//! Every input runs under `catch_unwind`; a panic or an input slower than a second fails
//! the test with the seed that reproduces it.

mod fuzz_harness;

use std::time::{Duration, Instant};

use fuzz_harness::{Tally, fuzz_cache, fuzz_for, fuzz_readers, fuzz_rules};

fn report(tally: &Tally, took: Duration) -> String {
    let mut out = format!(
        "{} inputs ({} loaded and compiled) in {:.1} s; slowest {:?}; {} findings",
        tally.inputs,
        tally.loaded,
        took.as_secs_f64(),
        tally.slowest,
        tally.findings.len()
    );
    for f in tally.findings.iter().take(20) {
        out.push_str(&format!(
            "\n  {} seed {}: {}\n    input: {:?}",
            f.target, f.seed, f.what, f.input
        ));
    }
    out
}

#[test]
fn fuzz_smoke() {
    let start = Instant::now();
    let tally = fuzz_for(Duration::from_secs(3), 20_261_205);
    let text = report(&tally, start.elapsed());
    eprintln!("{text}");
    assert!(tally.findings.is_empty(), "{text}");
    assert!(tally.loaded > 0, "some generated files load: {text}");
}

#[test]
#[ignore = "long: run by hand with LEXDELTA_FUZZ_INPUTS (see the file's docs)"]
fn fuzz_long() {
    let inputs: u64 = std::env::var("LEXDELTA_FUZZ_INPUTS")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(100_000);
    let seed: u64 = std::env::var("LEXDELTA_FUZZ_SEED")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(1);
    let cache_inputs: u64 = std::env::var("LEXDELTA_FUZZ_CACHE_INPUTS")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(inputs / 1000);
    let start = Instant::now();
    let mut tally = Tally::default();
    fuzz_rules(seed, inputs, &mut tally);
    let rules_took = start.elapsed();
    eprintln!("rules+analyzer: {}", report(&tally, rules_took));
    let readers_inputs: u64 = std::env::var("LEXDELTA_FUZZ_READER_INPUTS")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(inputs / 10);
    let mut readers = Tally::default();
    let start = Instant::now();
    fuzz_readers(seed, readers_inputs, &mut readers);
    eprintln!("readers: {}", report(&readers, start.elapsed()));
    let mut cache = Tally::default();
    let start = Instant::now();
    fuzz_cache(seed, cache_inputs, &mut cache);
    eprintln!("cache: {}", report(&cache, start.elapsed()));
    assert!(tally.findings.is_empty() && readers.findings.is_empty() && cache.findings.is_empty());
}
