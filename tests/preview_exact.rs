//! The fast path (one surface index, conflated postings, change reduction) gives the same
//! matches and scores as the reference path (an index per ruleset built with
//! `KeyTokenizer::keys`), on the demo and on random rule edits.

use std::sync::Arc;

use lexdelta::analysis::Analyzer;
use lexdelta::corpus::{Corpus, DocOptions, Document, FieldSpec, QueryEntry, QueryLog};
use lexdelta::index::{IndexPostings, NoProgress, build_key_index, build_surface_index};
use lexdelta::preview::{
    self, ConflatedKeys, DirectKeys, DocOrder, FormKeys, Hit, KeySource, MatchMode, PreviewInput,
    PreviewOptions, Ranking, Scoring, Stats, lengths_without_stopwords, retrieve, stems,
};
use lexdelta::rules::{SourceFile, load_sources};
use proptest::prelude::*;

mod common;
use common::counted::{self, Case};

fn ids(corpus: &Corpus) -> Vec<String> {
    corpus.documents.iter().map(|d| d.id.clone()).collect()
}

fn weights(corpus: &Corpus) -> Vec<f64> {
    corpus.fields.iter().map(|f| f.weight as f64).collect()
}

fn run_all(
    source: &dyn KeySource,
    analyzer: &Analyzer,
    corpus: &Corpus,
    queries: &[String],
    scoring: &Scoring,
) -> Vec<Vec<Hit>> {
    let stats = Stats::compute(source, scoring).unwrap();
    let (order, weights) = (DocOrder::by_id(&ids(corpus)), weights(corpus));
    queries
        .iter()
        .map(|q| {
            let analyzed = analyzer.analyze_query(q);
            retrieve(&analyzed, source, &stats, scoring, &weights, &order).unwrap()
        })
        .collect()
}

/// Reference: a key index for this analyzer.
fn slow(
    analyzer: &Arc<Analyzer>,
    corpus: &Corpus,
    queries: &[String],
    s: &Scoring,
) -> Vec<Vec<Hit>> {
    let index = build_key_index(corpus, analyzer, None).unwrap();
    let postings = IndexPostings::open(&index, corpus.fields.len()).unwrap();
    run_all(&DirectKeys::new(&postings), analyzer, corpus, queries, s)
}

/// Fast: the surface index seen through this analyzer's conflation groups.
fn fast(analyzer: &Analyzer, corpus: &Corpus, queries: &[String], s: &Scoring) -> Vec<Vec<Hit>> {
    let index = build_surface_index(corpus, analyzer.surface(), None, &NoProgress).unwrap();
    let postings = IndexPostings::open_surface(&index, corpus.fields.len()).unwrap();
    let forms = postings.surface_forms().unwrap();
    let stems = stems(&postings, &forms, analyzer).unwrap();
    let form_keys = FormKeys::compute(analyzer, &forms, stems.as_deref());
    let lengths = lengths_without_stopwords(&postings, &forms, &form_keys).unwrap();
    let keys = ConflatedKeys::new(&postings, &forms, &form_keys, lengths);
    run_all(&keys, analyzer, corpus, queries, s)
}

fn assert_same(a: &[Vec<Hit>], b: &[Vec<Hit>], queries: &[String]) {
    for ((x, y), q) in a.iter().zip(b).zip(queries) {
        assert_eq!(x.len(), y.len(), "match count of {q:?}");
        for (h, k) in x.iter().zip(y) {
            assert_eq!(h.doc, k.doc, "ranking of {q:?}");
            assert!(
                (h.score - k.score).abs() <= 1e-9,
                "score of {q:?}: {} vs {}",
                h.score,
                k.score
            );
        }
    }
}

fn demo() -> (Corpus, Vec<String>) {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let corpus = lexdelta::corpus::read_documents(
        &root.join("demo-corpus/documents.jsonl"),
        &DocOptions::default(),
    )
    .unwrap();
    let log = lexdelta::corpus::read_queries(&root.join("demo-corpus/queries.jsonl")).unwrap();
    (corpus, log.queries.into_iter().map(|q| q.query).collect())
}

#[test]
fn fast_equals_slow_on_the_demo() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let (corpus, queries) = demo();
    for dir in ["rules", "demo-corpus/proposed"] {
        let analyzer = Arc::new(Analyzer::load(&root.join(dir)).unwrap());
        let s = Scoring::default();
        assert_same(
            &fast(&analyzer, &corpus, &queries, &s),
            &slow(&analyzer, &corpus, &queries, &s),
            &queries,
        );
        let few: Vec<String> = queries.iter().take(300).cloned().collect();
        let cosine = Scoring {
            ranking: Ranking::Cosine,
            mode: MatchMode::Any,
            ..Scoring::default()
        };
        assert_same(
            &fast(&analyzer, &corpus, &few, &cosine),
            &slow(&analyzer, &corpus, &few, &cosine),
            &few,
        );
    }
}

/// Our match sets agree with tantivy's own boolean query over the key index.
#[test]
fn match_sets_agree_with_tantivy_queries() {
    use tantivy::collector::Count;
    use tantivy::query::Occur;
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let (mut corpus, queries) = demo();
    corpus.fields.truncate(1); // title only: one field, as query_for targets one
    for d in &mut corpus.documents {
        d.texts.truncate(1);
    }
    let analyzer = Arc::new(Analyzer::load(&root.join("demo-corpus/proposed")).unwrap());
    let index = build_key_index(&corpus, &analyzer, None).unwrap();
    let searcher = index.reader().unwrap().searcher();
    let field = index.schema().get_field("f0").unwrap();
    let few: Vec<String> = queries.iter().take(400).cloned().collect();
    let ours = fast(&analyzer, &corpus, &few, &Scoring::default());
    for (q, hits) in few.iter().zip(&ours) {
        if analyzer.analyze_query(q).expansions.is_empty() {
            continue;
        }
        let query = lexdelta::analysis::tantivy::query_for(&analyzer, field, q, Occur::Must);
        let count = searcher.search(&*query, &Count).unwrap();
        assert_eq!(hits.len(), count, "{q:?}");
    }
}

// ---- random rule edits -------------------------------------------------------------

const WORDS: &[&str] = &[
    "run",
    "runs",
    "ran",
    "running",
    "ride",
    "rode",
    "rides",
    "bus",
    "buses",
    "left",
    "leave",
    "leaves",
    "the",
    "and",
    "of",
    "pram",
    "stroller",
    "buggy",
    "tram",
    "light",
    "rail",
    "park",
    "universe",
    "university",
    "universal",
    "card",
    "cards",
    "transit",
    "transition",
    "lost",
    "found",
    "mice",
    "mouse",
];
const SYNONYMS: &[&str] = &[
    "  - equivalent: [pram, stroller]\n",
    "  - equivalent: [pram, buggy, stroller]\n",
    "  - equivalent: [tram, light rail]\n",
    "  - equivalent: [universal, accessible]\n",
    "  - equivalent: [park and ride, bus]\n",
    "  - one_way:\n      from: lost\n      to: [found]\n",
    "  - one_way:\n      from: card\n      to: [transit card]\n",
];
const EXEMPT: &[&str] = &[
    "transition",
    "university",
    "left",
    "rides",
    "cards",
    "mouse",
];
const LEMMAS: &[(&str, &str)] = &[
    ("ran", "run"),
    ("rode", "ride"),
    ("left", "leave"),
    ("mice", "mouse"),
    ("found", "find"),
    ("buses", "bus"),
];
const STOPWORDS: &[&str] = &["the", "and", "of"];

fn pick<T: Clone>(pool: &[T], mask: u32) -> Vec<T> {
    pool.iter()
        .enumerate()
        .filter(|(i, _)| mask & (1 << i) != 0)
        .map(|(_, x)| x.clone())
        .collect()
}

fn ruleset(mask: [u32; 4]) -> Option<Analyzer> {
    let mut yaml = String::from("format: 1\nrevision: 1\n");
    let stop = pick(STOPWORDS, mask[3]);
    yaml.push_str(&format!(
        "pipeline:\n  stemmer: english\n  stopwords: [{}]\n",
        stop.join(", ")
    ));
    let syn = pick(SYNONYMS, mask[0]);
    if !syn.is_empty() {
        yaml.push_str("synonyms:\n");
        syn.iter().for_each(|s| yaml.push_str(s));
    }
    let ex = pick(EXEMPT, mask[1]);
    if !ex.is_empty() {
        yaml.push_str(&format!("exempt: [{}]\n", ex.join(", ")));
    }
    let lem = pick(LEMMAS, mask[2]);
    if !lem.is_empty() {
        yaml.push_str("lemmas:\n");
        for (f, l) in lem {
            yaml.push_str(&format!("  - {{form: {f}, lemma: {l}}}\n"));
        }
    }
    let rs = load_sources(
        "r",
        vec![SourceFile {
            name: "r.yaml".into(),
            text: yaml,
        }],
    )
    .ok()?;
    Analyzer::new(rs).ok()
}

fn text() -> impl Strategy<Value = String> {
    prop::collection::vec(prop::sample::select(WORDS), 0..12).prop_map(|w| w.join(" "))
}

fn corpus_strategy() -> impl Strategy<Value = Corpus> {
    prop::collection::vec((text(), text()), 1..14).prop_map(|docs| Corpus {
        source: "random".into(),
        fields: vec![
            FieldSpec {
                name: "title".into(),
                weight: 2.0,
            },
            FieldSpec {
                name: "body".into(),
                weight: 1.0,
            },
        ],
        fingerprint: format!("{docs:?}"),
        warnings: Vec::new(),
        documents: docs
            .into_iter()
            .enumerate()
            .map(|(i, (t, b))| Document {
                id: format!("d{i:02}"),
                title: t.clone(),
                texts: vec![t, b],
            })
            .collect(),
    })
}

#[test]
fn fast_equals_slow_on_random_edits() {
    let inputs = (
        corpus_strategy(),
        prop::array::uniform4(0u32..128),
        prop::array::uniform4(0u32..128),
        prop::collection::vec(
            prop::collection::vec(prop::sample::select(WORDS), 1..4).prop_map(|w| w.join(" ")),
            1..12,
        ),
        any::<bool>(),
    );
    counted::check(
        "fast_equals_slow_on_random_edits",
        48,
        0.9,
        inputs,
        |(corpus, base_mask, head_mask, queries, any)| {
            let (Some(base), Some(head)) = (ruleset(base_mask), ruleset(head_mask)) else {
                return Ok(Case::Rejected);
            };
            let (base, head) = (Arc::new(base), Arc::new(head));
            let scoring = Scoring {
                mode: if any { MatchMode::Any } else { MatchMode::All },
                ..Scoring::default()
            };
            let slow_base = slow(&base, &corpus, &queries, &scoring);
            let slow_head = slow(&head, &corpus, &queries, &scoring);
            assert_same(
                &fast(&base, &corpus, &queries, &scoring),
                &slow_base,
                &queries,
            );
            assert_same(
                &fast(&head, &corpus, &queries, &scoring),
                &slow_head,
                &queries,
            );

            // Change reduction: every query whose reference results differ is reported.
            let log = QueryLog::from_entries(
                "q",
                queries.iter().map(|q| QueryEntry {
                    query: q.clone(),
                    count: 1,
                    clicks: Default::default(),
                }),
            );
            let options = PreviewOptions {
                scoring,
                ..PreviewOptions::default()
            };
            let input = PreviewInput {
                base,
                head,
                corpus: &corpus,
                queries: &log,
                judged: None,
            };
            let report = preview::run(input, &options, &NoProgress).unwrap().report;
            // A query is reported when its matches or its top 10 (documents, order) differ;
            // one whose scores alone moved is counted apart, as rescored.
            let mut rescored = std::collections::BTreeSet::new();
            for ((q, b), h) in queries.iter().zip(&slow_base).zip(&slow_head) {
                let docs = |v: &[Hit]| {
                    v.iter()
                        .map(|x| x.doc)
                        .collect::<std::collections::BTreeSet<_>>()
                };
                let top = |v: &[Hit]| v.iter().take(10).map(|x| x.doc).collect::<Vec<_>>();
                let differs = docs(b) != docs(h) || top(b) != top(h);
                let scores_moved = b
                    .iter()
                    .zip(h)
                    .take(10)
                    .any(|(x, y)| (x.score - y.score).abs() > 1e-9 * x.score.abs().max(1.0));
                if !differs && scores_moved {
                    rescored.insert(q.trim().to_string());
                }
                let reported = report.queries.iter().any(|c| c.query == q.trim());
                prop_assert_eq!(differs, reported, "query {:?}", q);
            }
            prop_assert_eq!(report.summary.rescored.queries, rescored.len());
            Ok(Case::Tested)
        },
    );
}
