//! Times building conflation groups two ways on a corpus: lexdelta's (the file streamed
//! in blocks by two threads, lines parsed in place, each distinct form keyed once,
//! `FxHashMap`) against a naive one (the whole corpus read into memory first, then every
//! token occurrence analyzed and keyed again, `std` `HashMap` of `String`s, one thread).
//!
//! ```text
//! cargo run --release --example gen_corpus -- --docs 100000 --out /tmp/corpus
//! cargo run --release --example bench_collisions -- /tmp/corpus/documents.jsonl [rules]
//! ```

use std::collections::{HashMap, HashSet};
use std::path::Path;
use std::time::Instant;

use lexdelta::Analyzer;
use lexdelta::audit::collisions::key_forms;
use lexdelta::corpus::{DocOptions, Document, read_documents};
use lexdelta::corpus::{DocumentCounts, Vocabulary};

fn main() {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let corpus = args
        .first()
        .expect("usage: bench_collisions DOCUMENTS [RULES]");
    let rules = args.get(1).map_or("rules", String::as_str);
    let analyzer = Analyzer::load(Path::new(rules)).expect("ruleset loads");
    let path = Path::new(corpus);

    let t = Instant::now();
    let fast = fast_groups(&analyzer, path);
    let fast_s = t.elapsed().as_secs_f64();
    let t = Instant::now();
    let corpus = read_documents(path, &DocOptions::default()).expect("corpus");
    let read_s = t.elapsed().as_secs_f64();
    let naive = naive_groups(&analyzer, &corpus.documents);
    let naive_s = t.elapsed().as_secs_f64();
    assert_eq!(fast, naive, "both ways find the same groups");
    println!(
        "{} documents, groups of >= 2 forms: {fast}; lexdelta {fast_s:.2} s, naive {naive_s:.2} s \
         ({read_s:.2} s of it reading) ({:.1}x)",
        corpus.len(),
        naive_s / fast_s
    );
}

fn fast_groups(analyzer: &Analyzer, path: &Path) -> usize {
    let counts = DocumentCounts::from_file(analyzer.surface(), path, &DocOptions::default(), 2)
        .expect("corpus");
    let vocabulary = Vocabulary::from_counts(analyzer.surface(), counts, None);
    let keyed = key_forms(analyzer, &vocabulary.forms, 2);
    keyed
        .chunk_by(|a, b| a.0 == b.0)
        .filter(|r| r.len() >= 2)
        .count()
}

/// Every occurrence tokenized and keyed, no cache: key → form → documents.
fn naive_groups(analyzer: &Analyzer, documents: &[Document]) -> usize {
    let mut groups: HashMap<String, HashMap<String, HashSet<usize>>> = HashMap::new();
    for (i, doc) in documents.iter().enumerate() {
        for text in &doc.texts {
            for token in analyzer.surface().tokens(text) {
                if let Some(key) = analyzer.key(&token.form) {
                    groups
                        .entry(key.into_owned())
                        .or_default()
                        .entry(token.form)
                        .or_default()
                        .insert(i);
                }
            }
        }
    }
    groups.values().filter(|g| g.len() >= 2).count()
}
