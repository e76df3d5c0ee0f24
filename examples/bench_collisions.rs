//! Times building conflation groups two ways on a corpus: lexdelta's (one pass, each
//! distinct form keyed once, `FxHashMap`, two threads) against a naive one (every token
//! occurrence analyzed and keyed again, `std` `HashMap` of `String`s, one thread).
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
use lexdelta::audit::vocabulary::Vocabulary;
use lexdelta::corpus::{DocOptions, Document, read_documents};

fn main() {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let corpus = args
        .first()
        .expect("usage: bench_collisions DOCUMENTS [RULES]");
    let rules = args.get(1).map_or("rules", String::as_str);
    let analyzer = Analyzer::load(Path::new(rules)).expect("ruleset loads");
    let t = Instant::now();
    let corpus = read_documents(Path::new(corpus), &DocOptions::default()).expect("corpus");
    eprintln!(
        "read {} documents in {:.2} s",
        corpus.len(),
        t.elapsed().as_secs_f64()
    );

    let t = Instant::now();
    let fast = fast_groups(&analyzer, &corpus.documents);
    let fast_s = t.elapsed().as_secs_f64();
    let t = Instant::now();
    let naive = naive_groups(&analyzer, &corpus.documents);
    let naive_s = t.elapsed().as_secs_f64();
    assert_eq!(fast, naive, "both ways find the same groups");
    println!(
        "groups of >= 2 forms: {fast}; lexdelta {fast_s:.2} s, naive {naive_s:.2} s ({:.1}x)",
        naive_s / fast_s
    );
}

fn fast_groups(analyzer: &Analyzer, documents: &[Document]) -> usize {
    let vocabulary = Vocabulary::build(analyzer.surface(), documents, None, 2);
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
