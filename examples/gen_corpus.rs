//! Synthetic benchmark corpus generator.
//!
//! Writes `N` documents and `Q` distinct queries in the same JSON Lines layout as the demo
//! corpus, so `lexdelta` reads either one:
//!
//! - `DIR/documents.jsonl`, one document per line:
//!   `{"id": "d0000001", "title": "...", "body": "...", "section": "guides", "updated": "2025-06-01"}`
//! - `DIR/queries.jsonl`, one distinct query per line, sorted by count descending then query
//!   ascending: `{"query": "...", "count": 12, "clicks": {"d0000042": 3}}` (`clicks` maps
//!   a document id to its click count, most clicked first; often empty)
//!
//! Text is lowercase words separated by spaces; body sentences end with `.` and paragraphs
//! are separated by a blank line (`\n\n`). A one-line summary (counts, distinct forms
//! available and used, seconds) goes to stderr.
//!
//! ```text
//! cargo run --release --example gen_corpus -- --docs 100000 --queries 10000 --out /tmp/corpus
//! ```
//!
//! # Why real word forms
//!
//! Random letter strings would make every normalization rule look harmless: nothing would
//! stem together, nothing would collide. The vocabulary is therefore built from the English
//! lemmas of WordNet 3.0 (Debian package `wordnet-base`, read from `/usr/share/wordnet`):
//! each single-word lemma, its regular inflections (noun plurals; verb `-s`, `-ed`, `-ing`
//! with e-drop and consonant doubling; `-er`/`-est` for short adjectives) and the irregular
//! forms listed in WordNet's exception files (`mice`, `went`, `better`). Nouns that
//! `data.noun` only spells capitalized (place and person names, taxa such as `Zamiaceae`)
//! get no plural. A stemmer, an exemption or a lemma override then meets the same mix of
//! regular families, irregular forms and accidental collisions that it meets on real text.
//! The full vocabulary has about 138,000 distinct surface forms in 77,500 families
//! (`--vocab` keeps the most frequent N); one million documents use all of them.
//!
//! # Frequencies
//!
//! Words come in families (a lemma and all its forms). Families get Zipf weights
//! `1 / rank^s` (`--zipf`, default 1.07). A few dozen function words (`the`, `of`, `and`,
//! ...) hold the head ranks; the order of all other families is shuffled with the seed, so
//! frequent words are not alphabetical. Inside a family the lemma itself takes 55% of the
//! weight and its other forms share the rest, so `run`, `runs`, `ran` and `running` have
//! related frequencies, as in real text. Sampling uses Vose's alias method, split into
//! levels by rank so that most draws stay in the CPU cache (see `WordSampler`).
//!
//! Documents: titles of 4 to 10 content words; bodies whose length follows a log-normal
//! distribution (mean about 120 words) in sentences and paragraphs; a section from a small
//! fixed list; an `updated` date between 2012 and 2025, skewed to recent years.
//!
//! Queries: 1 to 4 words drawn from a steeper, query-specific Zipf (popular words get even
//! more of the traffic, function words are left out), all distinct. Counts follow a
//! long tail: the most likely queries get the highest counts. Queries seen at least twice
//! may get clicks on one to three documents; those documents are made to contain the query
//! words (a sentence of the body starts with them, and half the time the title too), so a
//! click always points at a matching document.
//!
//! # Reproducibility and speed
//!
//! Everything derives from `--seed` (default 42) through ChaCha8 streams: one for the
//! vocabulary order, one for queries, one for clicks and one per block of documents. Blocks
//! are generated on `--threads` threads and written in order, so the same arguments give
//! byte-identical files whatever the thread count or timing (on one platform: the weights
//! use floating-point `powf` and `ln`). One million documents (about 1 GB) take well under
//! a minute on two cores, in about 100 MB of memory.

use std::collections::BTreeMap;
use std::fmt::Write as _;
use std::fs::File;
use std::io::{self, BufWriter, Write};
use std::path::{Path, PathBuf};
use std::process::ExitCode;
use std::sync::atomic::{AtomicU64, Ordering};
use std::sync::mpsc;
use std::time::Instant;

use clap::Parser;
use rand::{Rng, RngCore, SeedableRng};
use rand_chacha::ChaCha8Rng;
use rustc_hash::{FxHashMap, FxHashSet};

/// Command-line arguments.
#[derive(Debug, Parser)]
#[command(
    about = "Generate a deterministic synthetic corpus (documents and queries) from WordNet word forms"
)]
struct Args {
    /// Number of documents to write.
    #[arg(long, default_value_t = 100_000)]
    docs: u64,
    /// Number of distinct queries to write.
    #[arg(long, default_value_t = 10_000)]
    queries: u64,
    /// Output directory (created if missing); receives documents.jsonl and queries.jsonl.
    #[arg(long)]
    out: PathBuf,
    /// Seed: the same arguments always give byte-identical files.
    #[arg(long, default_value_t = 42)]
    seed: u64,
    /// Directory holding the WordNet 3.0 files (index.noun, noun.exc, ...).
    #[arg(long, default_value = "/usr/share/wordnet")]
    wordnet: PathBuf,
    /// Keep only the N most frequent surface forms (default: all, about 138,000).
    #[arg(long)]
    vocab: Option<usize>,
    /// Zipf exponent of the document vocabulary.
    #[arg(long, default_value_t = 1.07)]
    zipf: f64,
    /// Write every query with empty clicks.
    #[arg(long)]
    no_clicks: bool,
    /// Worker threads for documents (the output does not depend on it).
    #[arg(long, default_value_t = 2)]
    threads: usize,
}

fn main() -> ExitCode {
    let args = Args::parse();
    match run(&args) {
        Ok(()) => ExitCode::SUCCESS,
        Err(message) => {
            eprintln!("gen_corpus: error: {message}");
            ExitCode::from(2)
        }
    }
}

fn run(args: &Args) -> Result<(), String> {
    let started = Instant::now();
    if !(args.zipf > 0.0 && args.zipf <= 4.0) {
        return Err(format!("--zipf must be in (0, 4], got {}", args.zipf));
    }
    if args.threads == 0 {
        return Err("--threads must be at least 1".into());
    }
    let text = WordNetText::load(&args.wordnet)?;
    let vocab = Vocabulary::build(&text, args.seed, args.zipf, args.vocab);
    drop(text);
    if vocab.content_forms() == 0 {
        return Err(match args.vocab {
            Some(n) if vocab.available > n => format!(
                "--vocab {n} keeps only function words; use more than {}",
                FUNCTION_WORDS.len()
            ),
            _ => format!("no usable lemmas found in {}", args.wordnet.display()),
        });
    }
    std::fs::create_dir_all(&args.out)
        .map_err(|e| format!("cannot create {}: {e}", args.out.display()))?;
    let docs_path = args.out.join("documents.jsonl");
    let queries_path = args.out.join("queries.jsonl");
    let create = |p: &Path| {
        File::create(p)
            .map(|f| BufWriter::with_capacity(1 << 20, f))
            .map_err(|e| format!("cannot create {}: {e}", p.display()))
    };
    let mut docs_out = create(&docs_path)?;
    let mut queries_out = create(&queries_path)?;
    let config = Config {
        docs: args.docs,
        queries: args.queries,
        seed: args.seed,
        clicks: !args.no_clicks,
        threads: args.threads,
    };
    let stats = generate(&vocab, &config, &mut docs_out, &mut queries_out)
        .and_then(|s| {
            docs_out.flush()?;
            queries_out.flush()?;
            Ok(s)
        })
        .map_err(|e| format!("writing {}: {e}", args.out.display()))?;
    eprintln!(
        "gen_corpus: {} documents ({} words, {} distinct forms used), {} queries ({} with clicks); \
         vocabulary {} of {} forms ({} families); seed {}; {:.2} s -> {}",
        stats.docs,
        stats.words,
        stats.forms_used,
        stats.queries,
        stats.queries_with_clicks,
        vocab.len(),
        vocab.available,
        vocab.families,
        args.seed,
        started.elapsed().as_secs_f64(),
        args.out.display()
    );
    Ok(())
}

// ---------------------------------------------------------------------------------------
// WordNet input
// ---------------------------------------------------------------------------------------

/// The raw text of the WordNet files the vocabulary is built from.
#[derive(Debug, Default)]
struct WordNetText {
    noun_index: String,
    /// `data.noun`, read only for the capitalization of its words (proper nouns).
    noun_data: String,
    verb_index: String,
    adj_index: String,
    adv_index: String,
    noun_exc: String,
    verb_exc: String,
    adj_exc: String,
    adv_exc: String,
}

impl WordNetText {
    fn load(dir: &Path) -> Result<Self, String> {
        let read = |name: &str, required: bool| -> Result<String, String> {
            let path = dir.join(name);
            match std::fs::read_to_string(&path) {
                Ok(s) => Ok(s),
                Err(e) if e.kind() == io::ErrorKind::NotFound && !required => Ok(String::new()),
                Err(e) if e.kind() == io::ErrorKind::NotFound => Err(format!(
                    "WordNet file {} not found; install the WordNet 3.0 data with \
                     `apt-get install wordnet-base`, or point --wordnet at a directory holding \
                     index.noun, index.verb, index.adj, index.adv, data.noun and noun.exc, \
                     verb.exc, adj.exc",
                    path.display()
                )),
                Err(e) => Err(format!("cannot read {}: {e}", path.display())),
            }
        };
        Ok(Self {
            noun_index: read("index.noun", true)?,
            noun_data: read("data.noun", true)?,
            verb_index: read("index.verb", true)?,
            adj_index: read("index.adj", true)?,
            adv_index: read("index.adv", true)?,
            noun_exc: read("noun.exc", true)?,
            verb_exc: read("verb.exc", true)?,
            adj_exc: read("adj.exc", true)?,
            adv_exc: read("adv.exc", false)?,
        })
    }
}

/// A usable word: plain lowercase ASCII letters, at least two of them.
fn is_plain_word(w: &str) -> bool {
    w.len() >= 2 && w.bytes().all(|b| b.is_ascii_lowercase())
}

/// Lemmas of an index file: the first field of every line except the licence header
/// (lines starting with two spaces); multi-word lemmas (with `_`) and anything that is
/// not plain letters are skipped.
fn index_lemmas(text: &str) -> Vec<&str> {
    text.lines()
        .filter(|l| !l.starts_with("  ") && !l.is_empty())
        .filter_map(|l| l.split(' ').next())
        .filter(|w| is_plain_word(w))
        .collect()
}

/// Nouns that `data.noun` only ever spells capitalized (`Aachen`, `Zamiaceae`): proper
/// names and taxa, which get no plural. Lines are `offset lex_filenum ss_type w_cnt word
/// lex_id [word lex_id ...] ...` with `w_cnt` in hexadecimal.
fn proper_nouns(data: &str) -> FxHashSet<String> {
    let mut capitalized: FxHashSet<String> = FxHashSet::default();
    let mut lowercase: FxHashSet<&str> = FxHashSet::default();
    for line in data.lines().filter(|l| !l.starts_with("  ")) {
        let mut fields = line.split(' ').skip(3);
        let Some(count) = fields
            .next()
            .and_then(|c| usize::from_str_radix(c, 16).ok())
        else {
            continue;
        };
        for word in fields.step_by(2).take(count) {
            if is_plain_word(word) {
                lowercase.insert(word);
            } else if word.bytes().all(|b| b.is_ascii_alphabetic()) {
                capitalized.insert(word.to_ascii_lowercase());
            }
        }
    }
    capitalized.retain(|w| !lowercase.contains(w.as_str()));
    capitalized
}

/// Exception list: base lemma -> irregular forms, from lines `inflected base [base ...]`.
fn exceptions(text: &str) -> FxHashMap<&str, Vec<&str>> {
    let mut map: FxHashMap<&str, Vec<&str>> = FxHashMap::default();
    for line in text.lines() {
        let mut fields = line.split_whitespace();
        let Some(form) = fields.next() else { continue };
        if !is_plain_word(form) {
            continue;
        }
        for base in fields {
            if base != form && is_plain_word(base) {
                let forms = map.entry(base).or_default();
                if !forms.contains(&form) {
                    forms.push(form);
                }
            }
        }
    }
    map
}

// ---------------------------------------------------------------------------------------
// Regular inflection
// ---------------------------------------------------------------------------------------

fn is_vowel(b: u8) -> bool {
    matches!(b, b'a' | b'e' | b'i' | b'o' | b'u')
}

/// Rough syllable count: groups of vowels, `y` counting as a vowel after a consonant.
fn syllables(w: &str) -> usize {
    let b = w.as_bytes();
    let mut count = 0;
    let mut prev_vowel = false;
    for (i, &c) in b.iter().enumerate() {
        let v = is_vowel(c) || (c == b'y' && i > 0 && !is_vowel(b[i - 1]));
        if v && !prev_vowel {
            count += 1;
        }
        prev_vowel = v;
    }
    count
}

fn ends_consonant_y(w: &str) -> bool {
    let b = w.as_bytes();
    b.len() >= 2 && b[b.len() - 1] == b'y' && !is_vowel(b[b.len() - 2])
}

/// One-syllable consonant-vowel-consonant words double their final consonant before a
/// vowel suffix (`stop` -> `stopped`, `big` -> `bigger`); `w`, `x` and `y` never double.
fn doubles_final(w: &str) -> bool {
    let b = w.as_bytes();
    let n = b.len();
    if n < 3 || syllables(w) != 1 {
        return false;
    }
    let (c1, v, c2) = (b[n - 3], b[n - 2], b[n - 1]);
    !is_vowel(c1) && is_vowel(v) && !is_vowel(c2) && !matches!(c2, b'w' | b'x' | b'y')
}

fn sibilant_end(w: &str) -> bool {
    w.ends_with('s')
        || w.ends_with('x')
        || w.ends_with('z')
        || w.ends_with("ch")
        || w.ends_with("sh")
}

/// Regular noun plural: `-es` after a sibilant, `-ies` after consonant + y, else `-s`.
fn noun_plural(w: &str) -> String {
    if sibilant_end(w) {
        format!("{w}es")
    } else if ends_consonant_y(w) {
        format!("{}ies", &w[..w.len() - 1])
    } else {
        format!("{w}s")
    }
}

/// Third person singular: like the plural, plus `-es` after consonant + o (`goes`).
fn verb_s(w: &str) -> String {
    let b = w.as_bytes();
    let consonant_o = b.len() >= 2 && b[b.len() - 1] == b'o' && !is_vowel(b[b.len() - 2]);
    if consonant_o {
        format!("{w}es")
    } else {
        noun_plural(w)
    }
}

/// Appends a suffix starting with a vowel (`ed`, `er`, `est`) with the e-drop, y-to-i and
/// doubling rules.
fn vowel_suffix(w: &str, suffix: &str) -> String {
    if w.ends_with('e') {
        format!("{w}{}", &suffix[1..])
    } else if ends_consonant_y(w) {
        format!("{}i{suffix}", &w[..w.len() - 1])
    } else if doubles_final(w) {
        let last = &w[w.len() - 1..];
        format!("{w}{last}{suffix}")
    } else {
        format!("{w}{suffix}")
    }
}

fn verb_ed(w: &str) -> String {
    vowel_suffix(w, "ed")
}

fn verb_ing(w: &str) -> String {
    if let Some(stem) = w.strip_suffix("ie") {
        format!("{stem}ying")
    } else if w.len() > 2
        && w.ends_with('e')
        && !w.ends_with("ee")
        && !w.ends_with("ye")
        && !w.ends_with("oe")
    {
        format!("{}ing", &w[..w.len() - 1])
    } else if doubles_final(w) {
        let last = &w[w.len() - 1..];
        format!("{w}{last}ing")
    } else {
        format!("{w}ing")
    }
}

/// Adjectives that take `-er`/`-est`: one syllable, or two ending in consonant + y.
fn is_short_adjective(w: &str) -> bool {
    let s = syllables(w);
    w.len() >= 3 && (s == 1 || (s == 2 && ends_consonant_y(w) && w.len() <= 7))
}

// ---------------------------------------------------------------------------------------
// Vocabulary
// ---------------------------------------------------------------------------------------

/// Function words at the head of the frequency ranking, in rank order.
const FUNCTION_WORDS: &[&str] = &[
    "the", "of", "and", "to", "a", "in", "is", "for", "on", "that", "with", "as", "it", "by",
    "this", "be", "are", "from", "or", "at", "an", "was", "not", "which", "can", "you", "if",
    "have", "but", "will", "all", "their", "has", "its", "more", "when", "they", "we", "were",
    "been", "how", "than", "into", "also", "would", "there", "other", "these", "some", "any",
];

/// Share of a family's weight taken by the lemma itself (when it has other forms).
const LEMMA_SHARE: f64 = 0.55;

/// The sampled surface forms, most frequent first.
#[derive(Debug)]
struct Vocabulary {
    /// All forms' bytes, concatenated.
    arena: Vec<u8>,
    /// `(start, end)` of each form in `arena`.
    spans: Vec<(u32, u32)>,
    /// Relative frequency in documents (sums to 1).
    weights: Vec<f64>,
    /// Whether the form is one of [`FUNCTION_WORDS`].
    function: Vec<bool>,
    /// Number of word families the forms came from.
    families: usize,
    /// Number of distinct forms before `--vocab` cut the list.
    available: usize,
}

/// A family under construction: a lemma and its forms (lemma first).
struct Family {
    forms: Vec<String>,
}

impl Family {
    fn add(&mut self, form: String) {
        if !self.forms.contains(&form) {
            self.forms.push(form);
        }
    }
}

impl Vocabulary {
    /// Builds the vocabulary: families from the index and exception files, ranks shuffled
    /// with `seed` behind the function words, Zipf weights with exponent `zipf`, keeping at
    /// most `cap` forms (the most frequent).
    fn build(text: &WordNetText, seed: u64, zipf: f64, cap: Option<usize>) -> Self {
        let function: FxHashSet<&str> = FUNCTION_WORDS.iter().copied().collect();
        let mut families: Vec<Family> = Vec::new();
        let mut by_lemma: FxHashMap<String, usize> = FxHashMap::default();
        let mut family_of = |lemma: &str, families: &mut Vec<Family>| -> usize {
            *by_lemma.entry(lemma.to_string()).or_insert_with(|| {
                families.push(Family {
                    forms: vec![lemma.to_string()],
                });
                families.len() - 1
            })
        };
        for word in FUNCTION_WORDS {
            family_of(word, &mut families);
        }
        let first_content = families.len();

        // Nouns: plural unless the exception file gives an irregular one; proper names and
        // taxa keep only their lemma.
        let exc = exceptions(&text.noun_exc);
        let proper = proper_nouns(&text.noun_data);
        for lemma in index_lemmas(&text.noun_index) {
            if function.contains(lemma) {
                continue;
            }
            let f = family_of(lemma, &mut families);
            match exc.get(lemma) {
                Some(irregular) => irregular
                    .iter()
                    .for_each(|x| families[f].add(x.to_string())),
                None if proper.contains(lemma) => {}
                None => families[f].add(noun_plural(lemma)),
            }
        }
        // Verbs: -s, -ed, -ing, each replaced by the irregular forms that fill its slot.
        let exc = exceptions(&text.verb_exc);
        for lemma in index_lemmas(&text.verb_index) {
            if function.contains(lemma) {
                continue;
            }
            let f = family_of(lemma, &mut families);
            let irregular = exc.get(lemma).map(Vec::as_slice).unwrap_or(&[]);
            let (mut has_s, mut has_ing, mut has_past) = (false, false, false);
            for form in irregular {
                if form.ends_with("ing") {
                    has_ing = true;
                } else if form.ends_with('s')
                    && !form.ends_with("ss")
                    && form.len() <= lemma.len() + 2
                {
                    has_s = true;
                } else {
                    has_past = true;
                }
                families[f].add(form.to_string());
            }
            if !has_s {
                families[f].add(verb_s(lemma));
            }
            if !has_past {
                families[f].add(verb_ed(lemma));
            }
            if !has_ing {
                families[f].add(verb_ing(lemma));
            }
        }
        // Adjectives: -er/-est for short ones, unless irregular forms fill the slot.
        let exc = exceptions(&text.adj_exc);
        for lemma in index_lemmas(&text.adj_index) {
            if function.contains(lemma) {
                continue;
            }
            let f = family_of(lemma, &mut families);
            let irregular = exc.get(lemma).map(Vec::as_slice).unwrap_or(&[]);
            let (mut has_er, mut has_est) = (false, false);
            for form in irregular {
                if form.ends_with("est") {
                    has_est = true;
                } else {
                    has_er = true;
                }
                families[f].add(form.to_string());
            }
            if is_short_adjective(lemma) {
                if !has_er {
                    families[f].add(vowel_suffix(lemma, "er"));
                }
                if !has_est {
                    families[f].add(vowel_suffix(lemma, "est"));
                }
            }
        }
        // Adverbs: the lemma and its few irregular forms.
        let exc = exceptions(&text.adv_exc);
        for lemma in index_lemmas(&text.adv_index) {
            if function.contains(lemma) {
                continue;
            }
            let f = family_of(lemma, &mut families);
            for form in exc.get(lemma).map(Vec::as_slice).unwrap_or(&[]) {
                families[f].add(form.to_string());
            }
        }

        // Rank order: function words first, then the content families shuffled.
        let mut order: Vec<usize> = (0..families.len()).collect();
        let mut rng = stream_rng(seed, STREAM_VOCAB);
        let content = &mut order[first_content..];
        for i in (1..content.len()).rev() {
            let j = rng.random_range(0..=i);
            content.swap(i, j);
        }

        // Form weights: family Zipf weight split between the lemma and its other forms.
        // A form reached from two families (`axes`: ax, axis) adds up both shares.
        let mut form_id: FxHashMap<&str, usize> = FxHashMap::default();
        let mut names: Vec<&str> = Vec::new();
        let mut weights: Vec<f64> = Vec::new();
        for (rank, &fam) in order.iter().enumerate() {
            let w = 1.0 / ((rank + 1) as f64).powf(zipf);
            let forms = &families[fam].forms;
            for (k, form) in forms.iter().enumerate() {
                if k > 0 && function.contains(form.as_str()) {
                    continue;
                }
                let share = if forms.len() == 1 {
                    1.0
                } else if k == 0 {
                    LEMMA_SHARE
                } else {
                    (1.0 - LEMMA_SHARE) / (forms.len() - 1) as f64
                };
                let id = *form_id.entry(form.as_str()).or_insert_with(|| {
                    names.push(form.as_str());
                    weights.push(0.0);
                    names.len() - 1
                });
                weights[id] += w * share;
            }
        }

        let available = names.len();
        let mut ids: Vec<usize> = (0..names.len()).collect();
        ids.sort_by(|&a, &b| {
            weights[b]
                .total_cmp(&weights[a])
                .then_with(|| names[a].cmp(names[b]))
        });
        if let Some(cap) = cap {
            ids.truncate(cap.max(1));
        }
        let total: f64 = ids.iter().map(|&i| weights[i]).sum();
        let mut vocab = Vocabulary {
            arena: Vec::new(),
            spans: Vec::with_capacity(ids.len()),
            weights: Vec::with_capacity(ids.len()),
            function: Vec::with_capacity(ids.len()),
            families: families.len(),
            available,
        };
        for &i in &ids {
            let start = vocab.arena.len() as u32;
            vocab.arena.extend_from_slice(names[i].as_bytes());
            vocab.spans.push((start, vocab.arena.len() as u32));
            vocab.weights.push(weights[i] / total);
            vocab.function.push(function.contains(names[i]));
        }
        vocab
    }

    fn len(&self) -> usize {
        self.spans.len()
    }

    fn content_forms(&self) -> usize {
        self.function.iter().filter(|f| !**f).count()
    }

    fn word(&self, id: u32) -> &[u8] {
        let (s, e) = self.spans[id as usize];
        &self.arena[s as usize..e as usize]
    }

    fn word_str(&self, id: u32) -> &str {
        std::str::from_utf8(self.word(id)).expect("forms are ASCII")
    }
}

// ---------------------------------------------------------------------------------------
// Sampling
// ---------------------------------------------------------------------------------------

/// Vose's alias table: O(1) sampling from a discrete distribution with one `u64` draw.
#[derive(Debug)]
struct AliasTable {
    /// `(threshold, alias)`: keep index `i` when the low 32 random bits are below
    /// `threshold`, else take `alias`.
    slots: Vec<(u32, u32)>,
}

impl AliasTable {
    /// Builds the table; weights need not be normalized, zero weights are never drawn.
    /// Panics if no weight is positive.
    fn new(weights: &[f64]) -> Self {
        let n = weights.len();
        let total: f64 = weights.iter().sum();
        assert!(n > 0 && total > 0.0, "alias table needs a positive weight");
        let mut scaled: Vec<f64> = weights.iter().map(|w| w * n as f64 / total).collect();
        let mut slots = vec![(u32::MAX, 0u32); n];
        let (mut small, mut large): (Vec<u32>, Vec<u32>) = (Vec::new(), Vec::new());
        for (i, &p) in scaled.iter().enumerate() {
            if p < 1.0 {
                small.push(i as u32);
            } else {
                large.push(i as u32);
            }
        }
        while let (Some(&s), Some(&l)) = (small.last(), large.last()) {
            small.pop();
            let p = scaled[s as usize];
            slots[s as usize] = ((p * 4_294_967_296.0) as u32, l);
            scaled[l as usize] -= 1.0 - p;
            if scaled[l as usize] < 1.0 {
                large.pop();
                small.push(l);
            }
        }
        // Whatever is left has probability 1 up to rounding.
        for i in small.into_iter().chain(large) {
            slots[i as usize] = (u32::MAX, i);
        }
        Self { slots }
    }

    #[inline]
    fn sample<R: RngCore>(&self, rng: &mut R) -> u32 {
        let r = rng.next_u64();
        let i = (((r >> 32) * self.slots.len() as u64) >> 32) as usize;
        let (threshold, alias) = self.slots[i];
        if (r as u32) < threshold {
            i as u32
        } else {
            alias
        }
    }
}

/// Bytes of a word stored inline in a [`WordSlot`]; longer words (a handful) are read
/// from the vocabulary.
const INLINE: usize = 27;
/// [`WordSlot::len`] marker: the word is longer than [`INLINE`].
const LONG: u8 = u8::MAX;
/// [`WordSlot::len`] marker: draw again from the next level.
const DESCEND: u8 = u8::MAX - 1;
/// Level boundaries (vocabulary ranks) of the document word samplers: the first level
/// (128 KiB of slots) serves most draws from the CPU cache, see [`WordSampler`].
const LEVELS: &[usize] = &[2048, 24_576];

/// One alias-table slot carrying the bytes of both of its candidate words: drawing a word
/// and copying it touches a single cache line.
#[derive(Debug, Clone, Copy)]
#[repr(C, align(64))]
struct WordSlot {
    threshold: u32,
    /// Index of the alias inside its level.
    alias: u32,
    len: [u8; 2],
    bytes: [[u8; INLINE]; 2],
}

/// The forms `offset..offset + n` of a sampler, plus (unless last) one slot standing for
/// all later levels.
#[derive(Debug)]
struct Level {
    offset: u32,
    slots: Vec<WordSlot>,
}

/// Draws words by frequency and appends their bytes.
///
/// An alias table reads a uniformly random slot per draw, so one table over all forms
/// misses the CPU cache on nearly every word. The vocabulary is sorted by frequency, so
/// the sampler is split into levels by rank: the first level holds the most frequent forms
/// and one pseudo-form standing for "all the rest", which draws again from the next level.
/// With a Zipf vocabulary most draws end in the small first level.
#[derive(Debug)]
struct WordSampler<'a> {
    levels: Vec<Level>,
    vocab: &'a Vocabulary,
}

impl<'a> WordSampler<'a> {
    /// `weights` are indexed like `vocab`; `bounds` are the ranks where levels start.
    /// Panics if no weight is positive.
    fn new(vocab: &'a Vocabulary, weights: &[f64], bounds: &[usize]) -> Self {
        let inline = |id: usize| {
            let word = vocab.word(id as u32);
            let mut bytes = [0u8; INLINE];
            let len = if word.len() <= INLINE {
                bytes[..word.len()].copy_from_slice(word);
                word.len() as u8
            } else {
                LONG
            };
            (len, bytes)
        };
        let n = weights.len();
        let mut cuts: Vec<usize> = bounds.iter().copied().filter(|&b| b > 0 && b < n).collect();
        cuts.push(n);
        cuts.dedup();
        let mut levels = Vec::new();
        let mut start = 0;
        for &end in &cuts {
            let rest: f64 = weights[end..].iter().sum();
            let mut local = weights[start..end].to_vec();
            if rest > 0.0 {
                local.push(rest);
            }
            let slot_word = |j: usize| {
                if start + j < end {
                    inline(start + j)
                } else {
                    (DESCEND, [0u8; INLINE])
                }
            };
            let slots = AliasTable::new(&local)
                .slots
                .iter()
                .enumerate()
                .map(|(j, &(threshold, alias))| {
                    let (l0, b0) = slot_word(j);
                    let (l1, b1) = slot_word(alias as usize);
                    WordSlot {
                        threshold,
                        alias,
                        len: [l0, l1],
                        bytes: [b0, b1],
                    }
                })
                .collect();
            levels.push(Level {
                offset: start as u32,
                slots,
            });
            if rest == 0.0 {
                break;
            }
            start = end;
        }
        Self { levels, vocab }
    }

    /// Draws a word, appends it to `out`, marks it in `used` and returns its id.
    #[inline]
    fn put<R: RngCore>(&self, rng: &mut R, out: &mut Vec<u8>, used: &mut [u64]) -> u32 {
        let mut level = 0;
        loop {
            let Level { offset, slots } = &self.levels[level];
            let r = rng.next_u64();
            let i = (((r >> 32) * slots.len() as u64) >> 32) as usize;
            let slot = &slots[i];
            let (local, k) = if (r as u32) < slot.threshold {
                (i as u32, 0)
            } else {
                (slot.alias, 1)
            };
            let len = slot.len[k];
            if len == DESCEND {
                level += 1;
                continue;
            }
            let id = offset + local;
            used[id as usize / 64] |= 1 << (id % 64);
            if len == LONG {
                out.extend_from_slice(self.vocab.word(id));
            } else {
                // A fixed-size copy compiles to a few moves; the truncate drops the padding.
                let at = out.len();
                out.extend_from_slice(&slot.bytes[k]);
                out.truncate(at + usize::from(len));
            }
            return id;
        }
    }
}

const STREAM_VOCAB: u64 = 1;
const STREAM_QUERIES: u64 = 2;
const STREAM_CLICKS: u64 = 3;
const STREAM_DOCS: u64 = 1 << 32;

/// The ChaCha8 generator of one named stream of the seed.
fn stream_rng(seed: u64, stream: u64) -> ChaCha8Rng {
    let mut rng = ChaCha8Rng::seed_from_u64(seed);
    rng.set_stream(stream);
    rng
}

/// A standard normal variate (Box-Muller).
fn normal<R: Rng>(rng: &mut R) -> f64 {
    let u1: f64 = 1.0 - rng.random::<f64>();
    let u2: f64 = rng.random::<f64>();
    (-2.0 * u1.ln()).sqrt() * (std::f64::consts::TAU * u2).cos()
}

// ---------------------------------------------------------------------------------------
// Generation
// ---------------------------------------------------------------------------------------

#[derive(Debug, Clone)]
struct Config {
    docs: u64,
    queries: u64,
    seed: u64,
    clicks: bool,
    threads: usize,
}

#[derive(Debug, Default, PartialEq)]
struct Stats {
    docs: u64,
    words: u64,
    forms_used: usize,
    queries: u64,
    queries_with_clicks: u64,
}

/// One distinct query with its traffic.
#[derive(Debug)]
struct Query {
    words: Box<[u32]>,
    text: String,
    count: u64,
    /// `(document index, clicks)`, most clicked first.
    clicks: Vec<(u64, u64)>,
}

/// Documents per block; each block has its own random stream.
const DOC_BLOCK: u64 = 2048;
/// Body length: log-normal with this sigma and a mean of `BODY_MEAN` words.
const BODY_SIGMA: f64 = 0.7;
const BODY_MEAN: f64 = 120.0;
/// Sections and their relative weights.
const SECTIONS: &[(&str, u32)] = &[
    ("guides", 24),
    ("reference", 20),
    ("support", 16),
    ("news", 14),
    ("blog", 10),
    ("releases", 7),
    ("community", 6),
    ("policies", 3),
];
/// `updated` dates: days since 1970-01-01 of 2012-01-01 and 2025-12-31.
const FIRST_DAY: i64 = 15_340;
const LAST_DAY: i64 = 20_453;
/// Query length distribution (1 to 4 words), in percent.
const QUERY_LENGTHS: [u32; 4] = [28, 38, 22, 12];
/// Query-term Zipf is the document one raised to this power: heads get more traffic.
const QUERY_STEEPNESS: f64 = 1.2;
/// Total query traffic per distinct query; counts are `max(1, round(traffic / (H * rank)))`.
const TRAFFIC_PER_QUERY: f64 = 10.0;

/// Generates the queries and documents, writing both.
fn generate<D: Write, Q: Write>(
    vocab: &Vocabulary,
    config: &Config,
    docs_out: &mut D,
    queries_out: &mut Q,
) -> io::Result<Stats> {
    let queries = make_queries(vocab, config);
    let mut stats = Stats {
        queries: queries.len() as u64,
        queries_with_clicks: queries.iter().filter(|q| !q.clicks.is_empty()).count() as u64,
        ..Stats::default()
    };
    write_queries(&queries, queries_out)?;

    // Planted query words: (document index, query index), sorted by document.
    let mut plants: Vec<(u64, u32)> = queries
        .iter()
        .enumerate()
        .flat_map(|(qi, q)| q.clicks.iter().map(move |&(d, _)| (d, qi as u32)))
        .collect();
    plants.sort_unstable();

    let content_weights: Vec<f64> = (0..vocab.len())
        .map(|i| {
            if vocab.function[i] {
                0.0
            } else {
                vocab.weights[i]
            }
        })
        .collect();
    let ctx = DocContext {
        vocab,
        body: WordSampler::new(vocab, &vocab.weights, LEVELS),
        title: WordSampler::new(vocab, &content_weights, LEVELS),
        queries: &queries,
        plants: &plants,
        seed: config.seed,
        docs: config.docs,
    };
    let blocks = config.docs.div_ceil(DOC_BLOCK);
    let next = AtomicU64::new(0);
    let (tx, rx) = mpsc::sync_channel::<(u64, Vec<u8>, u64)>(config.threads * 2);
    let mut used = vec![0u64; vocab.len().div_ceil(64)];
    let mut write_result = Ok(());
    std::thread::scope(|scope| {
        let workers: Vec<_> = (0..config.threads)
            .map(|_| {
                let tx = tx.clone();
                let (ctx, next) = (&ctx, &next);
                scope.spawn(move || {
                    let mut used = vec![0u64; ctx.vocab.len().div_ceil(64)];
                    loop {
                        let block = next.fetch_add(1, Ordering::Relaxed);
                        if block >= blocks {
                            break;
                        }
                        let mut buf = Vec::with_capacity(DOC_BLOCK as usize * 1024);
                        let words = ctx.write_block(block, &mut buf, &mut used);
                        if tx.send((block, buf, words)).is_err() {
                            break;
                        }
                    }
                    used
                })
            })
            .collect();
        drop(tx);
        // Write blocks in order as they arrive.
        let mut pending: BTreeMap<u64, Vec<u8>> = BTreeMap::new();
        let mut expected = 0u64;
        for (block, buf, words) in rx.iter() {
            stats.words += words;
            pending.insert(block, buf);
            while let Some(buf) = pending.remove(&expected) {
                if write_result.is_ok() {
                    write_result = docs_out.write_all(&buf);
                }
                expected += 1;
            }
            if write_result.is_err() {
                break;
            }
        }
        drop(rx);
        for worker in workers {
            let part = worker.join().expect("document worker panicked");
            used.iter_mut().zip(part).for_each(|(a, b)| *a |= b);
        }
    });
    write_result?;
    stats.docs = config.docs;
    stats.forms_used = used.iter().map(|w| w.count_ones() as usize).sum();
    Ok(stats)
}

/// Draws the distinct queries, ranks them by likelihood (plus noise), assigns long-tail
/// counts and clicks, and returns them in output order.
fn make_queries(vocab: &Vocabulary, config: &Config) -> Vec<Query> {
    let weights: Vec<f64> = (0..vocab.len())
        .map(|i| {
            if vocab.function[i] {
                0.0
            } else {
                vocab.weights[i].powf(QUERY_STEEPNESS)
            }
        })
        .collect();
    if config.queries == 0 || weights.iter().all(|w| *w == 0.0) {
        return Vec::new();
    }
    let table = AliasTable::new(&weights);
    let total: f64 = weights.iter().sum();
    let mut rng = stream_rng(config.seed, STREAM_QUERIES);
    let mut seen: FxHashSet<Box<[u32]>> = FxHashSet::default();
    let mut drawn: Vec<(f64, Box<[u32]>)> = Vec::new();
    let max_attempts = config.queries.saturating_mul(50).saturating_add(1000);
    let mut words: Vec<u32> = Vec::with_capacity(4);
    for _ in 0..max_attempts {
        if drawn.len() as u64 >= config.queries {
            break;
        }
        let pick = rng.random_range(0..100u32);
        let mut acc = 0;
        let len = QUERY_LENGTHS
            .iter()
            .position(|&p| {
                acc += p;
                pick < acc
            })
            .unwrap_or(0)
            + 1;
        words.clear();
        let mut score = 0.0;
        while words.len() < len {
            let w = table.sample(&mut rng);
            if !words.contains(&w) {
                words.push(w);
                score += (weights[w as usize] / total).ln();
            }
        }
        // Gumbel noise so that ranking is not a pure function of the word frequencies.
        let noise = -(-(1.0 - rng.random::<f64>()).ln()).ln();
        if seen.insert(words.clone().into_boxed_slice()) {
            drawn.push((score + 2.0 * noise, words.clone().into_boxed_slice()));
        }
    }
    // Most likely queries first; ties keep draw order.
    let mut order: Vec<usize> = (0..drawn.len()).collect();
    order.sort_by(|&a, &b| drawn[b].0.total_cmp(&drawn[a].0).then(a.cmp(&b)));
    let n = drawn.len();
    let harmonic: f64 = (1..=n).map(|r| 1.0 / r as f64).sum();
    let traffic = TRAFFIC_PER_QUERY * n as f64;
    let mut queries: Vec<Query> = Vec::with_capacity(n);
    for (rank, &i) in order.iter().enumerate() {
        let words = std::mem::take(&mut drawn[i].1);
        let mut text = String::new();
        for (k, &w) in words.iter().enumerate() {
            if k > 0 {
                text.push(' ');
            }
            text.push_str(vocab.word_str(w));
        }
        let count = ((traffic / (harmonic * (rank + 1) as f64)).round() as u64).max(1);
        queries.push(Query {
            words,
            text,
            count,
            clicks: Vec::new(),
        });
    }
    queries.sort_by(|a, b| b.count.cmp(&a.count).then_with(|| a.text.cmp(&b.text)));

    if config.clicks && config.docs > 0 {
        let mut rng = stream_rng(config.seed, STREAM_CLICKS);
        for q in &mut queries {
            if q.count < 2 || rng.random::<f64>() >= 0.7 {
                continue;
            }
            let k = (1 + usize::from(q.count >= 20) + usize::from(q.count >= 200))
                .min(config.docs as usize);
            let ctr = rng.random_range(0.15..0.6);
            let total = ((q.count as f64 * ctr).round() as u64).max(1);
            let harmonic: f64 = (1..=k).map(|j| 1.0 / j as f64).sum();
            let mut docs: Vec<u64> = Vec::with_capacity(k);
            while docs.len() < k {
                let d = rng.random_range(0..config.docs);
                if !docs.contains(&d) {
                    docs.push(d);
                }
            }
            for (j, d) in docs.into_iter().enumerate() {
                let share = (total as f64 / (harmonic * (j + 1) as f64)).round() as u64;
                let clicks = if j == 0 { share.max(1) } else { share };
                if clicks > 0 {
                    q.clicks.push((d, clicks));
                }
            }
            q.clicks.sort_by(|a, b| b.1.cmp(&a.1).then(a.0.cmp(&b.0)));
        }
    }
    queries
}

fn write_queries<W: Write>(queries: &[Query], out: &mut W) -> io::Result<()> {
    let mut line = String::with_capacity(256);
    for q in queries {
        line.clear();
        // Query text is lowercase ASCII letters and spaces: nothing to escape.
        let _ = write!(
            line,
            "{{\"query\": \"{}\", \"count\": {}, \"clicks\": {{",
            q.text, q.count
        );
        for (k, &(doc, clicks)) in q.clicks.iter().enumerate() {
            let sep = if k > 0 { ", " } else { "" };
            let _ = write!(line, "{sep}\"{}\": {clicks}", doc_id(doc));
        }
        line.push_str("}}\n");
        out.write_all(line.as_bytes())?;
    }
    Ok(())
}

/// The id of document `index` (0-based): `d0000001` for the first.
fn doc_id(index: u64) -> String {
    format!("d{:07}", index + 1)
}

/// `YYYY-MM-DD` of a day count since 1970-01-01 (proleptic Gregorian calendar).
fn civil_date(days: i64) -> (i64, u32, u32) {
    let z = days + 719_468;
    let era = z.div_euclid(146_097);
    let doe = z.rem_euclid(146_097);
    let yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
    let doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    let mp = (5 * doy + 2) / 153;
    let day = (doy - (153 * mp + 2) / 5 + 1) as u32;
    let month = if mp < 10 { mp + 3 } else { mp - 9 } as u32;
    let year = yoe + era * 400 + i64::from(month <= 2);
    (year, month, day)
}

struct DocContext<'a> {
    vocab: &'a Vocabulary,
    body: WordSampler<'a>,
    title: WordSampler<'a>,
    queries: &'a [Query],
    plants: &'a [(u64, u32)],
    seed: u64,
    docs: u64,
}

impl DocContext<'_> {
    /// Writes the documents of one block as JSON Lines; returns the number of words.
    fn write_block(&self, block: u64, out: &mut Vec<u8>, used: &mut [u64]) -> u64 {
        let mut rng = stream_rng(self.seed, STREAM_DOCS + block);
        let start = block * DOC_BLOCK;
        let end = (start + DOC_BLOCK).min(self.docs);
        let mut plant_at = self.plants.partition_point(|p| p.0 < start);
        let mut words = 0;
        let mu = BODY_MEAN.ln() - BODY_SIGMA * BODY_SIGMA / 2.0;
        for doc in start..end {
            let first_plant = plant_at;
            while plant_at < self.plants.len() && self.plants[plant_at].0 == doc {
                plant_at += 1;
            }
            let planted = &self.plants[first_plant..plant_at];
            let put = |out: &mut Vec<u8>, used: &mut [u64], id: u32| {
                used[id as usize / 64] |= 1 << (id % 64);
                out.extend_from_slice(self.vocab.word(id));
            };

            out.extend_from_slice(b"{\"id\": \"d");
            push_padded(out, doc + 1, 7);

            // Title: 4 to 10 content words; a planted query may open it.
            out.extend_from_slice(b"\", \"title\": \"");
            let mut title_len = rng.random_range(4..=10usize);
            let mut n = 0;
            if let Some(&(_, qi)) = planted.first()
                && rng.random::<bool>()
            {
                let q = &self.queries[qi as usize].words;
                for &w in q.iter() {
                    if n > 0 {
                        out.push(b' ');
                    }
                    put(out, used, w);
                    words += 1;
                    n += 1;
                }
                title_len = title_len.max(n + 1);
            }
            while n < title_len {
                if n > 0 {
                    out.push(b' ');
                }
                self.title.put(&mut rng, out, used);
                words += 1;
                n += 1;
            }

            // Body: sentences of 5 to 22 words, 3 to 7 sentences a paragraph. Planted
            // queries come first, each in a sentence of its own.
            out.extend_from_slice(b"\", \"body\": \"");
            let body_len = ((mu + BODY_SIGMA * normal(&mut rng)).exp() as usize).clamp(8, 4000);
            let mut written = 0;
            let mut sentences_left = rng.random_range(3..=7u32);
            let mut first_sentence = true;
            let mut plants = planted.iter();
            // Every planted query gets its sentence, even past the drawn length.
            while written < body_len || !plants.as_slice().is_empty() {
                if !first_sentence {
                    if sentences_left == 0 {
                        out.extend_from_slice(b"\\n\\n");
                        sentences_left = rng.random_range(3..=7u32);
                    } else {
                        out.push(b' ');
                    }
                }
                first_sentence = false;
                sentences_left = sentences_left.saturating_sub(1);
                let mut len = rng
                    .random_range(5..=22usize)
                    .min(body_len.saturating_sub(written));
                let mut k = 0;
                if let Some(&(_, qi)) = plants.next() {
                    for &w in self.queries[qi as usize].words.iter() {
                        if k > 0 {
                            out.push(b' ');
                        }
                        put(out, used, w);
                        words += 1;
                        k += 1;
                    }
                    len = len.max(k + 2);
                }
                while k < len {
                    if k > 0 {
                        out.push(b' ');
                    }
                    self.body.put(&mut rng, out, used);
                    words += 1;
                    k += 1;
                }
                out.push(b'.');
                written += k;
            }

            out.extend_from_slice(b"\", \"section\": \"");
            let mut pick = rng.random_range(0..SECTIONS.iter().map(|s| s.1).sum::<u32>());
            let section = SECTIONS
                .iter()
                .find(|s| {
                    if pick < s.1 {
                        true
                    } else {
                        pick -= s.1;
                        false
                    }
                })
                .map_or(SECTIONS[0].0, |s| s.0);
            out.extend_from_slice(section.as_bytes());

            // Recent dates are more common: the square root of a uniform leans to 1.
            out.extend_from_slice(b"\", \"updated\": \"");
            let span = (LAST_DAY - FIRST_DAY) as f64;
            let day = FIRST_DAY + (span * rng.random::<f64>().sqrt()).round() as i64;
            let (y, m, d) = civil_date(day);
            push_padded(out, y as u64, 4);
            out.push(b'-');
            push_padded(out, u64::from(m), 2);
            out.push(b'-');
            push_padded(out, u64::from(d), 2);
            out.extend_from_slice(b"\"}\n");
        }
        words
    }
}

/// Appends `value` in decimal, zero-padded to at least `width` digits.
fn push_padded(out: &mut Vec<u8>, mut value: u64, width: usize) {
    let mut digits = [0u8; 20];
    let mut n = 0;
    while value > 0 || n < width {
        digits[n] = b'0' + (value % 10) as u8;
        value /= 10;
        n += 1;
    }
    out.extend(digits[..n].iter().rev());
}

// ---------------------------------------------------------------------------------------
// Tests
// ---------------------------------------------------------------------------------------

#[cfg(test)]
mod tests {
    use super::*;

    const LICENCE: &str = "  1 This software and database is provided under a licence.  \n  2   \n";

    /// A tiny WordNet-shaped lexicon.
    fn tiny_text() -> WordNetText {
        WordNetText {
            noun_index: format!(
                "{LICENCE}bus n 1 0 1 0 00000001  \ncity n 1 0 1 0 00000002  \n\
                 mouse n 1 0 1 0 00000003  \nrun n 1 0 1 0 00000004  \n\
                 ice_cream n 1 0 1 0 00000005  \nbox n 1 0 1 0 00000006  \n\
                 x n 1 0 1 0 00000007  \nthe n 1 0 1 0 00000008  \nlake n 1 0 1 0 00000009  \n\
                 zamiaceae n 1 0 1 0 00000021  \naachen n 1 0 1 0 00000022  \n\
                 pneumonoultramicroscopicsilicovolcanoconiosis n 1 0 1 0 00000023  \n"
            ),
            verb_index: format!(
                "{LICENCE}run v 1 0 1 0 00000010  \ngo v 1 0 1 0 00000011  \n\
                 stop v 1 0 1 0 00000012  \ndie v 1 0 1 0 00000013  \n\
                 make v 1 0 1 0 00000014  \nvisit v 1 0 1 0 00000015  \n"
            ),
            noun_data: "00000001 15 n 02 Aachen 0 aachen 0 000 | a city  \n\
                        00000002 15 n 01 Zamiaceae 0 000 | a family  \n\
                        00000003 15 n 02 bus 0 Bus 0 000 | a vehicle  \n"
                .into(),
            adj_index: format!(
                "{LICENCE}big a 1 0 1 0 00000016  \nhappy a 1 0 1 0 00000017  \n\
                 good a 1 0 1 0 00000018  \nbeautiful a 1 0 1 0 00000019  \n"
            ),
            adv_index: format!("{LICENCE}well r 1 0 1 0 00000020  \n"),
            noun_exc: "mice mouse\n".into(),
            verb_exc: "ran run\nrunning run\nwent go\ngone go\nstopped stop\ndying die\n".into(),
            adj_exc: "better good well\nbest good\nbigger big\nbiggest big\n".into(),
            adv_exc: "better well\nbest well\n".into(),
        }
    }

    fn tiny_vocab(seed: u64) -> Vocabulary {
        Vocabulary::build(&tiny_text(), seed, 1.07, None)
    }

    fn forms(v: &Vocabulary) -> FxHashSet<String> {
        (0..v.len() as u32)
            .map(|i| v.word_str(i).to_string())
            .collect()
    }

    fn run_tiny(seed: u64, threads: usize, docs: u64) -> (Vec<u8>, Vec<u8>, Stats) {
        run_tiny_with(seed, threads, docs, 60)
    }

    fn run_tiny_with(
        seed: u64,
        threads: usize,
        docs: u64,
        queries: u64,
    ) -> (Vec<u8>, Vec<u8>, Stats) {
        let vocab = tiny_vocab(seed);
        let config = Config {
            docs,
            queries,
            seed,
            clicks: true,
            threads,
        };
        let (mut d, mut q) = (Vec::new(), Vec::new());
        let stats = generate(&vocab, &config, &mut d, &mut q).unwrap();
        (d, q, stats)
    }

    #[test]
    fn regular_inflections() {
        assert_eq!(noun_plural("bus"), "buses");
        assert_eq!(noun_plural("church"), "churches");
        assert_eq!(noun_plural("city"), "cities");
        assert_eq!(noun_plural("day"), "days");
        assert_eq!(noun_plural("lake"), "lakes");
        assert_eq!(verb_s("go"), "goes");
        assert_eq!(verb_s("try"), "tries");
        assert_eq!(verb_s("play"), "plays");
        assert_eq!(verb_ed("stop"), "stopped");
        assert_eq!(verb_ed("make"), "maked");
        assert_eq!(verb_ed("try"), "tried");
        assert_eq!(verb_ed("visit"), "visited");
        assert_eq!(verb_ed("fix"), "fixed");
        assert_eq!(verb_ed("cool"), "cooled");
        assert_eq!(verb_ing("make"), "making");
        assert_eq!(verb_ing("die"), "dying");
        assert_eq!(verb_ing("see"), "seeing");
        assert_eq!(verb_ing("stop"), "stopping");
        assert_eq!(verb_ing("visit"), "visiting");
        assert_eq!(verb_ing("show"), "showing");
        assert_eq!(vowel_suffix("big", "er"), "bigger");
        assert_eq!(vowel_suffix("happy", "est"), "happiest");
        assert_eq!(vowel_suffix("late", "est"), "latest");
        assert_eq!(vowel_suffix("fast", "er"), "faster");
        assert!(is_short_adjective("big") && is_short_adjective("happy"));
        assert!(!is_short_adjective("beautiful") && !is_short_adjective("polite"));
        assert_eq!(syllables("beautiful"), 3);
        assert_eq!(syllables("rhythm"), 1);
    }

    #[test]
    fn wordnet_parsing() {
        let text = tiny_text();
        let nouns = index_lemmas(&text.noun_index);
        assert!(nouns.contains(&"bus") && nouns.contains(&"lake"));
        assert!(
            !nouns.contains(&"ice_cream"),
            "multi-word lemmas are skipped"
        );
        assert!(!nouns.contains(&"x"), "single letters are skipped");
        assert!(!nouns.iter().any(|w| w.contains("licence") || w.is_empty()));
        let exc = exceptions(&text.adj_exc);
        assert_eq!(exc["good"], vec!["better", "best"]);
        assert_eq!(exc["well"], vec!["better"]);
        let proper = proper_nouns(&text.noun_data);
        assert!(proper.contains("zamiaceae"));
        assert!(
            !proper.contains("aachen") && !proper.contains("bus"),
            "also seen lowercase"
        );
    }

    #[test]
    fn vocabulary_has_regular_and_irregular_forms() {
        let v = tiny_vocab(42);
        let f = forms(&v);
        for w in [
            "buses",
            "cities",
            "aachens",
            "zamiaceae",
            "mice",
            "runs",
            "ran",
            "running",
            "went",
            "gone",
            "goes",
            "going",
            "stopped",
            "stopping",
            "stops",
            "dying",
            "died",
            "making",
            "visited",
            "bigger",
            "biggest",
            "happier",
            "happiest",
            "better",
            "best",
            "well",
        ] {
            assert!(f.contains(w), "missing {w}");
        }
        for w in [
            "mouses",
            "zamiaceaes",
            "goed",
            "runned",
            "goodest",
            "gooder",
            "beautifuler",
            "ice",
        ] {
            assert!(!f.contains(w), "unexpected {w}");
        }
        // Function words hold the head, in list order.
        assert_eq!(v.word_str(0), "the");
        assert_eq!(v.word_str(1), "of");
        assert!(v.function[..FUNCTION_WORDS.len()].iter().all(|b| *b));
        let sum: f64 = v.weights.iter().sum();
        assert!((sum - 1.0).abs() < 1e-9);
        assert!(v.weights.windows(2).all(|w| w[0] >= w[1]));
        // The cap keeps the most frequent forms.
        let capped = Vocabulary::build(&tiny_text(), 42, 1.07, Some(10));
        assert_eq!(capped.len(), 10);
        assert_eq!(capped.word(0), v.word(0));
    }

    #[test]
    fn seed_shuffles_content_ranks() {
        let a = tiny_vocab(1);
        let b = tiny_vocab(2);
        let order = |v: &Vocabulary| -> Vec<String> {
            (0..v.len() as u32)
                .map(|i| v.word_str(i).to_string())
                .collect()
        };
        assert_eq!(forms(&a), forms(&b));
        assert_ne!(order(&a), order(&b));
        assert_eq!(order(&a), order(&tiny_vocab(1)));
    }

    #[test]
    fn alias_sampler_matches_weights() {
        let weights = [1.0, 0.0, 2.0, 3.0, 4.0, 0.5];
        let total: f64 = weights.iter().sum();
        let table = AliasTable::new(&weights);
        let mut rng = stream_rng(7, 0);
        let n = 1_000_000;
        let mut counts = [0u64; 6];
        for _ in 0..n {
            counts[table.sample(&mut rng) as usize] += 1;
        }
        assert_eq!(counts[1], 0, "zero weight never drawn");
        for (c, w) in counts.iter().zip(weights) {
            let expected = w / total;
            let got = *c as f64 / n as f64;
            assert!((got - expected).abs() < 0.003, "{got} vs {expected}");
        }
        // A single weight always wins.
        let one = AliasTable::new(&[5.0]);
        assert!((0..100).all(|_| one.sample(&mut rng) == 0));
    }

    #[test]
    fn word_sampler_levels_match_weights() {
        let vocab = tiny_vocab(3);
        let long = (0..vocab.len() as u32)
            .find(|&i| vocab.word(i).len() > INLINE)
            .expect("a long word");
        // Flat weights so that every level, and the long word, is drawn often.
        let weights: Vec<f64> = (0..vocab.len()).map(|i| 1.0 + (i % 3) as f64).collect();
        let total: f64 = weights.iter().sum();
        let sampler = WordSampler::new(&vocab, &weights, &[3, 7, 7, 1000]);
        assert_eq!(sampler.levels.len(), 3);
        let mut rng = stream_rng(11, 0);
        let mut used = vec![0u64; vocab.len().div_ceil(64)];
        let mut counts = vec![0u64; vocab.len()];
        let mut out = Vec::new();
        let n = 400_000;
        for _ in 0..n {
            out.clear();
            let id = sampler.put(&mut rng, &mut out, &mut used);
            assert_eq!(out, vocab.word(id));
            counts[id as usize] += 1;
        }
        assert!(counts[long as usize] > 0);
        for (c, w) in counts.iter().zip(&weights) {
            let (got, expected) = (*c as f64 / n as f64, w / total);
            assert!((got - expected).abs() < 0.003, "{got} vs {expected}");
        }
        let used_count: u32 = used.iter().map(|w| w.count_ones()).sum();
        assert_eq!(used_count as usize, vocab.len());
        // Zero weights past a level boundary: no level is built for them.
        let mut head_only = vec![0.0; vocab.len()];
        head_only[..3].fill(1.0);
        let sampler = WordSampler::new(&vocab, &head_only, &[3, 7]);
        assert_eq!(sampler.levels.len(), 1);
        assert!((0..1000).all(|_| sampler.put(&mut rng, &mut out, &mut used) < 3));
    }

    #[test]
    fn dates_and_ids() {
        assert_eq!(civil_date(0), (1970, 1, 1));
        assert_eq!(civil_date(FIRST_DAY), (2012, 1, 1));
        assert_eq!(civil_date(LAST_DAY), (2025, 12, 31));
        assert_eq!(civil_date(19_782), (2024, 2, 29));
        assert_eq!(doc_id(0), "d0000001");
        let mut buf = Vec::new();
        push_padded(&mut buf, 12_345_678, 7);
        push_padded(&mut buf, 0, 2);
        assert_eq!(buf, b"1234567800");
    }

    #[test]
    fn output_is_deterministic_and_thread_independent() {
        let (d1, q1, s1) = run_tiny(42, 1, 5000);
        let (d2, q2, s2) = run_tiny(42, 3, 5000);
        assert_eq!(d1, d2);
        assert_eq!(q1, q2);
        assert_eq!(s1, s2);
        let (d3, q3, _) = run_tiny(43, 2, 5000);
        assert_ne!(d1, d3);
        assert_ne!(q1, q3);
        assert_eq!(s1.docs, 5000);
        assert!(d1.iter().filter(|b| **b == b'\n').count() == 5000);
    }

    #[test]
    fn output_is_valid_json_lines_and_clicks_match() {
        let (d, q, stats) = run_tiny(9, 2, 3000);
        let docs = parse_lines(&d);
        assert_eq!(docs.len(), 3000);
        assert_eq!(docs[0]["id"], "d0000001");
        assert_eq!(docs[2999]["id"], "d0003000");
        let mut total_words = 0;
        let mut multi_paragraph = 0;
        for doc in &docs {
            let title = doc["title"].as_str().unwrap();
            let body = doc["body"].as_str().unwrap();
            let n = title.split(' ').count();
            assert!((4..=10).contains(&n), "title {title:?}");
            assert!(body.ends_with('.'));
            multi_paragraph += usize::from(body.contains("\n\n"));
            total_words += n + body.split_whitespace().count();
            let section = doc["section"].as_str().unwrap();
            assert!(SECTIONS.iter().any(|s| s.0 == section));
            let updated = doc["updated"].as_str().unwrap();
            assert_eq!(updated.len(), 10);
            assert!(("2012-01-01"..="2025-12-31").contains(&updated));
        }
        assert_eq!(total_words as u64, stats.words);
        assert!(
            multi_paragraph > 300,
            "{multi_paragraph} multi-paragraph bodies"
        );
        let mean_body = stats.words as f64 / 3000.0;
        assert!((90.0..160.0).contains(&mean_body), "mean {mean_body}");

        let queries = parse_lines(&q);
        assert_eq!(queries.len() as u64, stats.queries);
        assert!(stats.queries_with_clicks > 0);
        let mut seen = FxHashSet::default();
        for pair in queries.windows(2) {
            let (a, b) = (&pair[0], &pair[1]);
            let (ca, cb) = (a["count"].as_u64().unwrap(), b["count"].as_u64().unwrap());
            assert!(ca > cb || (ca == cb && a["query"].as_str() < b["query"].as_str()));
        }
        for query in &queries {
            let text = query["query"].as_str().unwrap();
            assert!(seen.insert(text.to_string()), "duplicate query {text}");
            assert!((1..=4).contains(&text.split(' ').count()));
        }
        assert_clicks_match(&docs, &queries);
    }

    /// Regression: a short body with several clicked queries dropped the later ones.
    #[test]
    fn crowded_click_targets_contain_every_query() {
        let (d, q, stats) = run_tiny_with(5, 2, 4, 300);
        let queries = parse_lines(&q);
        let clicks: usize = queries
            .iter()
            .map(|q| q["clicks"].as_object().unwrap().len())
            .sum();
        assert!(clicks > 40, "{clicks} clicks on 4 documents");
        let docs = parse_lines(&d);
        assert_clicks_match(&docs, &queries);
        let words: usize = docs
            .iter()
            .map(|d| {
                let (t, b) = (d["title"].as_str().unwrap(), d["body"].as_str().unwrap());
                t.split(' ').count() + b.split_whitespace().count()
            })
            .sum();
        assert_eq!(words as u64, stats.words);
    }

    fn parse_lines(bytes: &[u8]) -> Vec<serde_json::Value> {
        std::str::from_utf8(bytes)
            .unwrap()
            .lines()
            .map(|l| serde_json::from_str(l).expect("valid JSON"))
            .collect()
    }

    /// Every clicked document holds every word of its query.
    fn assert_clicks_match(docs: &[serde_json::Value], queries: &[serde_json::Value]) {
        for query in queries {
            let text = query["query"].as_str().unwrap();
            for (id, clicks) in query["clicks"].as_object().unwrap() {
                assert!(clicks.as_u64().unwrap() >= 1);
                let index: usize = id[1..].parse::<usize>().unwrap() - 1;
                let doc = &docs[index];
                let words: FxHashSet<&str> = doc["title"]
                    .as_str()
                    .unwrap()
                    .split(' ')
                    .chain(doc["body"].as_str().unwrap().split([' ', '.', '\n']))
                    .collect();
                for w in text.split(' ') {
                    assert!(words.contains(w), "{id} lacks {w} of {text:?}");
                }
            }
        }
    }

    #[test]
    fn empty_runs() {
        let (d, q, stats) = run_tiny(1, 2, 0);
        assert!(d.is_empty());
        assert!(!q.is_empty());
        assert_eq!(stats.queries_with_clicks, 0);
        assert_eq!(stats.forms_used, 0);
    }
}
