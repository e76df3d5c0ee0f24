//! A structure-aware fuzzing harness on stable Rust (cargo-fuzz needs a nightly compiler's
//! sanitizer flags): seeded generators of hostile rule files, texts and damaged cached
//! indexes, each input run under `catch_unwind` with its time measured.
//!
//! - rule loader: rule files built from the format's own pieces (sections, kinds, ids,
//!   patterns, token patterns, tags, anchors and aliases, documents, deep nesting, odd
//!   Unicode and control characters), then mutated byte-wise; loaded, compiled and, when
//!   they compile, run through the analyzer and (one input in 50) lint;
//! - analyzer: every compiled ruleset keys, traces and expands hostile texts;
//! - readers: documents (JSON Lines, CSV), query logs (every layout) and judgments (qrels,
//!   CSV) built from their formats' pieces and mutated, written to files and read;
//! - cache opener: a cached index copied and damaged (bytes flipped with or without the
//!   modification time put back, files cut short, deleted or added, the manifest edited),
//!   then opened with the check that damage calls for and read whole.
//!
//! `tests/fuzz_smoke.rs` runs it for a few seconds in CI; its ignored `fuzz_long` test
//! runs as many inputs as `LEXDELTA_FUZZ_INPUTS` says (see DEVELOPERS.md).

#![allow(dead_code)]

use std::panic::{AssertUnwindSafe, catch_unwind};
use std::path::{Path, PathBuf};
use std::time::{Duration, Instant};

use lexdelta::analysis::{Analyzer, Side, SurfaceStage};
use lexdelta::corpus::{Corpus, DocOptions, Document, FieldSpec, QueryFormat};
use lexdelta::index::{NoProgress, Verify, open_or_build_checked};
use lexdelta::lint::{LintConfig, LintInput, lint};
use lexdelta::rules::{Pipeline, SourceFile, load_sources};
use rand::seq::IndexedRandom;
use rand::{Rng, SeedableRng};
use rand_chacha::ChaCha8Rng;

/// An input that panicked or ran over the time limit.
#[derive(Debug)]
pub struct Finding {
    pub target: &'static str,
    pub seed: u64,
    pub what: String,
    pub input: String,
}

/// What a run did.
#[derive(Debug, Default)]
pub struct Tally {
    pub inputs: u64,
    pub loaded: u64,
    pub slowest: Duration,
    pub findings: Vec<Finding>,
}

/// Inputs slower than this count as hangs.
pub const HANG: Duration = Duration::from_secs(1);

const WORDS: &[&str] = &[
    "pram",
    "stroller",
    "buggy",
    "tram",
    "lift",
    "elevator",
    "ride",
    "route",
    "mice",
    "pram",
    "stroller",
    "tram",
    "trams",
    "light rail",
    "ferry",
    "ferries",
    "left",
    "leave",
    "mice",
    "mouse",
    "university",
    "universe",
    "the",
    "of",
    "on",
    "no",
    "yes",
    "null",
    "~",
    "Ünïcödé",
    "straße",
    "İstanbul",
    "ǅemal",
    "ﬁne",
    "e\u{301}",
    "東京",
    "🚋",
    "🚋🚋",
    "?!",
    "-",
    "'",
    "\"",
    "a\tb",
    "a\u{1b}[31mb",
    "\u{202e}rtl",
    "\u{feff}bom",
    "\u{0}",
    "x y z",
    "park and ride",
    "p+r",
    "***",
    "#hash",
    "&anchor",
    "*alias",
    "!tag",
    "%",
    "@",
    "`",
    "{a: b}",
    "[x]",
    ":",
    "- item",
    "0x1F",
    "1e999",
    "-0",
    ".inf",
    "NaN",
    "true",
    "",
];

const PATTERNS: &[&str] = &[
    "[a-z]+",
    "\\w+",
    "\\b",
    "^",
    "$",
    "(",
    ")",
    "[",
    "a{1000}",
    "\\w{50}",
    "(?i)tram",
    "[^\\s\\S]",
    ".*",
    "a|",
    "(a|b)*c",
    "\\p{Greek}+",
    "\\d{2,}",
    "x{0}",
    "(?:)",
    "[\\w'-]+",
    "\\",
    "(?P<n>a)",
    "a{2,1}",
    "[z-a]",
];

fn word(rng: &mut ChaCha8Rng) -> String {
    // Mostly plain words, so that most files load and the analyzer gets to run.
    let w = if rng.random_ratio(4, 5) {
        WORDS[..9].choose(rng).unwrap()
    } else {
        WORDS.choose(rng).unwrap()
    };
    if rng.random_ratio(1, 10) {
        // A random character from anywhere in Unicode (surrogates excluded by char).
        let c = char::from_u32(rng.random_range(0..0x11_0000)).unwrap_or('x');
        format!("{w}{c}")
    } else {
        w.to_string()
    }
}

fn scalar(rng: &mut ChaCha8Rng) -> String {
    let w = word(rng);
    match rng.random_range(0..40) {
        0..=19 => w,
        20..=29 => format!("{w:?}"),
        30..=38 => format!("'{}'", w.replace('\'', "''")),
        _ => {
            let tags = ["!!binary", "!!str", "!!int", "!keep", "!<tag:x>", "!!null"];
            format!("{} {w:?}", tags.choose(rng).unwrap())
        }
    }
}

fn list(rng: &mut ChaCha8Rng, n: usize) -> String {
    let items: Vec<String> = (0..n).map(|_| scalar(rng)).collect();
    format!("[{}]", items.join(", "))
}

/// A rule file made of the format's own pieces, valid or nearly so.
pub fn rule_file(rng: &mut ChaCha8Rng) -> String {
    let mut out = String::new();
    if rng.random_ratio(49, 50) {
        out.push_str(match rng.random_range(0..40) {
            0 => "format: 2\n",
            1 => "format: one\n",
            _ => "format: 1\n",
        });
    }
    let valid_revision = rng.random_ratio(19, 20);
    if valid_revision {
        out.push_str("revision: 3\n");
    } else if rng.random_bool(0.5) {
        let r = ["1", "0", "-3", "7", "99999999999999999999", "x", "1.5"];
        out.push_str(&format!("revision: {}\n", r.choose(rng).unwrap()));
    }
    let sections = rng.random_range(0..5);
    let mut used = Vec::new();
    for _ in 0..sections {
        let kind = rng.random_range(0..8);
        // A section twice is a duplicate key: now and then, not half the time.
        if used.contains(&kind) && !rng.random_ratio(1, 20) {
            continue;
        }
        used.push(kind);
        match kind {
            0 | 1 => {
                out.push_str("synonyms:\n");
                for _ in 0..rng.random_range(0..6) {
                    match rng.random_range(0..5) {
                        0 => {
                            let n = rng.random_range(0..5);
                            out.push_str(&format!("  - {}\n", list(rng, n)));
                        }
                        1 => {
                            let (from, to) = (scalar(rng), list(rng, 2));
                            out.push_str(&format!(
                                "  - id: {}\n    one_way: {{from: {from}, to: {to}}}\n",
                                word(rng).replace(' ', "-")
                            ));
                        }
                        2 => {
                            let n = rng.random_range(0..4);
                            out.push_str(&format!(
                                "  - equivalent: {}\n    note: {}\n",
                                list(rng, n),
                                scalar(rng)
                            ));
                        }
                        3 => {
                            let n = rng.random_range(0..3);
                            out.push_str(&format!("  - &a {}\n  - *a\n", list(rng, n)));
                        }
                        _ => out.push_str(&format!("  - {}\n", scalar(rng))),
                    }
                }
            }
            2 => {
                out.push_str("exempt:\n");
                for _ in 0..rng.random_range(0..5) {
                    if rng.random_bool(0.5) {
                        out.push_str(&format!("  - {}\n", scalar(rng)));
                    } else {
                        let p = PATTERNS.choose(rng).unwrap();
                        let q = PATTERNS.choose(rng).unwrap();
                        out.push_str(&format!("  - pattern: {:?}\n", format!("{p}{q}")));
                    }
                }
            }
            3 => {
                out.push_str("lemmas:\n");
                for _ in 0..rng.random_range(0..4) {
                    out.push_str(&format!(
                        "  - {{form: {}, lemma: {}}}\n",
                        scalar(rng),
                        scalar(rng)
                    ));
                }
            }
            4 => {
                out.push_str("pipeline:\n");
                let stemmers = ["english", "none", "klingon", "french", "german", "~"];
                out.push_str(&format!("  stemmer: {}\n", stemmers.choose(rng).unwrap()));
                if rng.random_bool(0.5) {
                    out.push_str(&format!("  stopwords: {}\n", list(rng, 3)));
                }
                if rng.random_bool(0.3) {
                    let p = PATTERNS.choose(rng).unwrap();
                    out.push_str(&format!("  token_pattern: {p:?}\n"));
                }
                for key in ["lowercase", "fold_accents"] {
                    if rng.random_bool(0.3) {
                        let v = ["true", "false", "yes", "1"];
                        out.push_str(&format!("  {key}: {}\n", v.choose(rng).unwrap()));
                    }
                }
            }
            5 => {
                let v = ["0", "0.5", "-1", "2", "x", "1e400"];
                out.push_str(&format!(
                    "gate:\n  max_lost_traffic_share: {}\n  fail_on_lint: {}\n",
                    v.choose(rng).unwrap(),
                    ["error", "warning", "fatal"].choose(rng).unwrap()
                ));
            }
            6 if rng.random_ratio(1, 4) => {
                let depth = rng.random_range(1..60);
                out.push_str(&format!(
                    "synonyms: {}{}\n",
                    "[".repeat(depth),
                    "]".repeat(depth)
                ));
            }
            _ if rng.random_ratio(1, 3) => out.push_str(match rng.random_range(0..4) {
                0 => "---\nformat: 1\n",
                1 => "format: 1\n",
                2 => "? [a, b]\n: c\n",
                _ => "lint:\n  checks:\n    set-bridge: {severity: error}\n  max_group_size: 0\n",
            }),
            _ => {}
        }
    }
    if rng.random_ratio(1, 3) {
        mutate(rng, out)
    } else {
        out
    }
}

/// Byte-level mutations that keep the text valid UTF-8.
pub fn mutate(rng: &mut ChaCha8Rng, text: String) -> String {
    let mut chars: Vec<char> = text.chars().collect();
    for _ in 0..rng.random_range(0..4) {
        if chars.is_empty() {
            break;
        }
        let at = rng.random_range(0..chars.len());
        match rng.random_range(0..4) {
            0 => {
                chars.remove(at);
            }
            1 => chars.insert(
                at,
                *[
                    ':', '-', '[', ']', '{', '}', '\n', ' ', '"', '\'', '&', '*', '!', '#', '|',
                    '>', '\t', '\u{0}', '\u{85}',
                ]
                .choose(rng)
                .unwrap(),
            ),
            2 => {
                let end = (at + rng.random_range(1..20)).min(chars.len());
                let copy: Vec<char> = chars[at..end].to_vec();
                let to = rng.random_range(0..chars.len());
                chars.splice(to..to, copy);
            }
            _ => chars[at] = char::from_u32(rng.random_range(0..0x3000)).unwrap_or('x'),
        }
    }
    chars.into_iter().collect()
}

/// A hostile text for the analyzer.
pub fn text(rng: &mut ChaCha8Rng) -> String {
    let n = rng.random_range(0..12);
    let words: Vec<String> = (0..n).map(|_| word(rng)).collect();
    let seps = [" ", "  ", "-", "\n", "\u{a0}", "", ".", "\u{200b}"];
    let mut out = String::new();
    for w in words {
        out.push_str(&w);
        out.push_str(seps.choose(rng).unwrap());
    }
    mutate(rng, out)
}

fn run_one(
    tally: &mut Tally,
    target: &'static str,
    seed: u64,
    input: &str,
    f: impl FnOnce() -> bool,
) {
    let start = Instant::now();
    let outcome = catch_unwind(AssertUnwindSafe(f));
    let took = start.elapsed();
    tally.inputs += 1;
    tally.slowest = tally.slowest.max(took);
    match outcome {
        Ok(loaded) => tally.loaded += u64::from(loaded),
        Err(panic) => {
            let what = panic
                .downcast_ref::<String>()
                .cloned()
                .or_else(|| panic.downcast_ref::<&str>().map(|s| s.to_string()))
                .unwrap_or_default();
            tally.findings.push(Finding {
                target,
                seed,
                what: format!("panic: {what}"),
                input: input.to_string(),
            });
        }
    }
    if took > HANG {
        tally.findings.push(Finding {
            target,
            seed,
            what: format!("took {took:?}"),
            input: input.to_string(),
        });
    }
}

/// Rule files and texts from `seed` on: `inputs` rule files, each compiled ruleset keying
/// and expanding a few texts.
pub fn fuzz_rules(seed: u64, inputs: u64, tally: &mut Tally) {
    for i in 0..inputs {
        let seed = seed.wrapping_add(i);
        let mut rng = ChaCha8Rng::seed_from_u64(seed);
        let file = rule_file(&mut rng);
        let texts: Vec<String> = (0..3).map(|_| text(&mut rng)).collect();
        let with_lint = rng.random_ratio(1, 50);
        let input = file.clone();
        run_one(tally, "rules+analyzer", seed, &input, move || {
            let sources = vec![SourceFile {
                name: "fuzz.yaml".into(),
                text: file,
            }];
            let loaded = load_sources("fuzz", sources);
            let Ok(ruleset) = loaded else {
                // Every refusal must render (the CLI prints it).
                let _ = loaded.map_err(|e| e.to_string());
                return false;
            };
            let Ok(analyzer) = Analyzer::new(ruleset) else {
                return false;
            };
            for t in &texts {
                let _ = analyzer.index_tokens(t);
                let _ = analyzer.analyze_query(t);
                let _ = analyzer.trace(t, Side::Query);
                for token in t.split_whitespace() {
                    let _ = analyzer.key(token);
                }
            }
            if with_lint {
                let config = LintConfig::default();
                let input = LintInput {
                    vocabulary: None,
                    base: None,
                    config: &config,
                };
                let _ = lint(&analyzer, &input);
            }
            true
        });
    }
}

fn small_corpus() -> Corpus {
    let words = [
        "tram", "trams", "ferry", "ferries", "bus", "pram", "ride", "straße",
    ];
    Corpus {
        source: "fuzz".into(),
        fields: vec![
            FieldSpec {
                name: "body".into(),
                weight: 1.0,
            },
            FieldSpec {
                name: "title".into(),
                weight: 2.0,
            },
        ],
        documents: (0..200)
            .map(|i| Document {
                id: format!("d{i}"),
                title: format!("T{i}"),
                texts: vec![
                    (0..30)
                        .map(|j| words[(i * 5 + j * 3) % words.len()])
                        .collect::<Vec<_>>()
                        .join(" "),
                    words[i % words.len()].to_string(),
                ],
            })
            .collect(),
        fingerprint: "fuzz-corpus".into(),
        warnings: Vec::new(),
    }
}

fn copy_dir(from: &Path, to: &Path) {
    std::fs::create_dir_all(to).unwrap();
    for entry in std::fs::read_dir(from).unwrap() {
        let entry = entry.unwrap();
        let target = to.join(entry.file_name());
        if entry.file_type().unwrap().is_dir() {
            copy_dir(&entry.path(), &target);
        } else {
            std::fs::copy(entry.path(), &target).unwrap();
            // Copies keep their times, as the cache did.
            let time = entry.metadata().unwrap().modified().unwrap();
            let f = std::fs::OpenOptions::new()
                .write(true)
                .open(&target)
                .unwrap();
            f.set_modified(time).unwrap();
        }
    }
}

/// Damages a copy of a cached index and opens it; what it reads must be what the index held.
pub fn fuzz_cache(seed: u64, inputs: u64, tally: &mut Tally) {
    let work = tempfile::tempdir().unwrap();
    let pristine = work.path().join("pristine");
    let corpus = small_corpus();
    let surface = SurfaceStage::from_pipeline(&Pipeline::default());
    let first = open_or_build_checked(&corpus, &surface, &pristine, Verify::Quick, &NoProgress)
        .expect("the pristine index builds");
    let index_name = first.path.file_name().unwrap().to_owned();
    let want = first.postings.surface_forms().unwrap().forms.clone();
    drop(first);
    for i in 0..inputs {
        let seed = seed.wrapping_add(i);
        let mut rng = ChaCha8Rng::seed_from_u64(seed);
        let cache: PathBuf = work.path().join("cache");
        let _ = std::fs::remove_dir_all(&cache);
        copy_dir(&pristine, &cache);
        let dir = cache.join(&index_name);
        let mut names: Vec<PathBuf> = std::fs::read_dir(&dir)
            .unwrap()
            .map(|e| e.unwrap().path())
            .collect();
        names.sort();
        let mut done = Vec::new();
        let mut verify = Verify::Quick;
        for _ in 0..rng.random_range(1..4) {
            let file = names.choose(&mut rng).unwrap().clone();
            if !file.exists() {
                continue;
            }
            let name = file.file_name().unwrap().to_string_lossy().into_owned();
            let time = std::fs::metadata(&file).unwrap().modified().unwrap();
            let mut bytes = std::fs::read(&file).unwrap();
            let how = rng.random_range(0..6);
            match how {
                0 | 1 if !bytes.is_empty() => {
                    for _ in 0..rng.random_range(1..17) {
                        let at = rng.random_range(0..bytes.len());
                        bytes[at] ^= rng.random_range(1..=255u8);
                    }
                }
                2 => bytes.truncate(rng.random_range(0..=bytes.len())),
                3 => bytes.extend((0..rng.random_range(1..64)).map(|_| rng.random::<u8>())),
                4 => {
                    std::fs::remove_file(&file).unwrap();
                    done.push(format!("delete {name}"));
                    continue;
                }
                _ => {
                    let extra = dir.join(format!("extra-{i}.idx"));
                    std::fs::write(extra, b"junk").unwrap();
                }
            }
            std::fs::write(&file, &bytes).unwrap();
            if how == 1 {
                // Bit rot: the time stays. Only the full check can see it.
                let f = std::fs::OpenOptions::new().write(true).open(&file).unwrap();
                f.set_modified(time).unwrap();
                verify = Verify::Full;
            }
            done.push(format!("{how} {name}"));
        }
        let input = done.join(", ");
        let (corpus, surface, want) = (&corpus, &surface, &want);
        run_one(tally, "cache", seed, &input, || {
            let opened = open_or_build_checked(corpus, surface, &cache, verify, &NoProgress)
                .expect("a damaged cache is rebuilt, not an error");
            let forms = opened.postings.surface_forms().unwrap();
            assert_eq!(&forms.forms, want, "the forms read back");
            for form in &forms.forms {
                for field in 0..2 {
                    let _ = opened.postings.postings(field, form).unwrap();
                }
            }
            true
        });
    }
}

/// Seconds-long: as many inputs of each target as fit in `budget`.
pub fn fuzz_for(budget: Duration, seed: u64) -> Tally {
    let mut tally = Tally::default();
    let start = Instant::now();
    let mut next = seed;
    while start.elapsed() < budget {
        fuzz_rules(next, 200, &mut tally);
        fuzz_readers(next, 50, &mut tally);
        fuzz_cache(next, 2, &mut tally);
        next += 200;
    }
    tally
}

/// A value of a JSON Lines field: usually a string of words, sometimes not a string.
fn json_value(rng: &mut ChaCha8Rng) -> String {
    match rng.random_range(0..12) {
        0 => rng.random_range(-5i64..100_000).to_string(),
        1 => "null".into(),
        2 => "[\"a\", 1]".into(),
        3 => "{\"x\": \"y\"}".into(),
        4 => "18446744073709551616".into(),
        5 => "1e400".into(),
        _ => serde_json::to_string(&text(rng)).unwrap(),
    }
}

/// A documents file: JSON Lines or CSV, from the formats' own pieces, then mutated.
pub fn documents_file(rng: &mut ChaCha8Rng) -> String {
    let fields = ["id", "title", "body", "section", "ID", ""];
    let mut out = String::new();
    if rng.random_ratio(1, 20) {
        out.push('\u{feff}');
    }
    let rows = rng.random_range(0..8);
    if rng.random_bool(0.5) {
        for i in 0..rows {
            let mut parts = Vec::new();
            if rng.random_ratio(9, 10) {
                parts.push(format!("\"id\": \"d{}\"", i % 5));
            }
            for key in ["title", "body"] {
                if rng.random_ratio(4, 5) {
                    parts.push(format!(
                        "\"{key}\": {}",
                        serde_json::to_string(&text(rng)).unwrap()
                    ));
                }
            }
            for _ in 0..rng.random_range(0..3) {
                let key = fields.choose(rng).unwrap();
                parts.push(format!("\"{key}\": {}", json_value(rng)));
            }
            out.push_str(&format!("{{{}}}\n", parts.join(", ")));
            if rng.random_ratio(1, 6) {
                out.push_str("\n  \n");
            }
        }
    } else {
        let header: Vec<&str> = (0..rng.random_range(0..5))
            .map(|_| *fields.choose(rng).unwrap())
            .collect();
        out.push_str(&header.join(","));
        out.push('\n');
        for _ in 0..rows {
            let cells: Vec<String> = (0..rng.random_range(0..6))
                .map(|_| match rng.random_range(0..4) {
                    0 => format!("\"{}\"", text(rng).replace('"', "\"\"")),
                    1 => "\"unclosed".into(),
                    _ => word(rng),
                })
                .collect();
            out.push_str(&cells.join(","));
            out.push('\n');
        }
    }
    sometimes_mutated(rng, out)
}

/// The text as built, or (one time in three) mutated: most inputs keep their format, so
/// the readers' paths past the first error are reached too.
fn sometimes_mutated(rng: &mut ChaCha8Rng, text: String) -> String {
    if rng.random_ratio(1, 3) {
        mutate(rng, text)
    } else {
        text
    }
}

/// A query log in any of its layouts, then mutated.
pub fn query_file(rng: &mut ChaCha8Rng) -> String {
    let mut out = String::new();
    for _ in 0..rng.random_range(0..8) {
        let query = text(rng).replace(['\n', '\t'], " ");
        let line = match rng.random_range(0..5) {
            0 => format!(
                "{{\"query\": {}, \"count\": {}, \"clicks\": {{\"d1\": {}}}}}",
                serde_json::to_string(&query).unwrap(),
                json_value(rng),
                json_value(rng)
            ),
            1 => format!(
                "{query}\t{}",
                ["3", "-1", "0", "18446744073709551615", "1.5", "x", ""]
                    .choose(rng)
                    .unwrap()
            ),
            2 => format!("q{}\t{query}", rng.random_range(0..5)),
            _ => query,
        };
        out.push_str(&line);
        out.push('\n');
    }
    sometimes_mutated(rng, out)
}

/// A judgments file, TREC qrels or CSV, then mutated.
pub fn judgments_file(rng: &mut ChaCha8Rng) -> String {
    let mut out = String::new();
    let csv = rng.random_bool(0.4);
    if csv {
        out.push_str("query_id,query,doc_id,relevance\n");
    }
    for _ in 0..rng.random_range(0..8) {
        let grade = ["0", "1", "3", "-1", "2.5", "x", "99999999999"]
            .choose(rng)
            .unwrap();
        let (q, d) = (rng.random_range(0..4), rng.random_range(0..6));
        if csv {
            out.push_str(&format!("q{q},{},d{d},{grade}\n", word(rng)));
        } else {
            out.push_str(&format!("q{q} 0 d{d} {grade}\n"));
        }
    }
    sometimes_mutated(rng, out)
}

/// Documents, query logs and judgments from `seed` on: `inputs` of each, written to files
/// and read by the library's readers (queries in the layout the content shows and in
/// every layout asked for by name).
pub fn fuzz_readers(seed: u64, inputs: u64, tally: &mut Tally) {
    let dir = tempfile::tempdir().expect("a temporary directory");
    let (docs, queries, judgments, texts) = (
        dir.path().join("docs"),
        dir.path().join("queries"),
        dir.path().join("judgments"),
        dir.path().join("texts"),
    );
    for i in 0..inputs {
        let seed = seed.wrapping_add(i);
        let mut rng = ChaCha8Rng::seed_from_u64(seed);
        let files = [
            documents_file(&mut rng),
            query_file(&mut rng),
            judgments_file(&mut rng),
            query_file(&mut rng),
        ];
        for (path, text) in [&docs, &queries, &judgments, &texts].iter().zip(&files) {
            std::fs::write(path, text).expect("write a fuzz input");
        }
        let input = files.join("\n----\n");
        run_one(tally, "readers", seed, &input, || {
            let read = lexdelta::corpus::read_documents(&docs, &DocOptions::default());
            let loaded = read.is_ok();
            let _ = read.map_err(|e| e.to_string());
            let _ = lexdelta::corpus::read_queries_as(&queries, None).map_err(|e| e.to_string());
            for format in QueryFormat::ALL {
                let _ = lexdelta::corpus::read_queries_as(&queries, Some(format))
                    .map_err(|e| e.to_string());
            }
            let _ = lexdelta::corpus::read_judgments(&judgments, Some(&texts))
                .map_err(|e| e.to_string());
            loaded
        });
    }
}
