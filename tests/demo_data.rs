//! The demo scenario's files exist with the promised sizes, parse with lexdelta's own
//! readers, and cross-reference: every judged, clicked or session document exists, every
//! judged or session query is in the query log, and both rulesets compile.

use std::collections::{BTreeMap, HashSet};
use std::path::{Path, PathBuf};

use lexdelta::analysis::Analyzer;
use lexdelta::corpus::{DocOptions, read_documents, read_queries};
use lexdelta::metrics::{
    Judgments, read_csv_judgments, read_queries as read_judged_queries, read_trec_qrels,
};

fn demo(name: &str) -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("demo-corpus")
        .join(name)
}

#[derive(serde::Deserialize)]
struct Session {
    session: String,
    searches: Vec<Search>,
}

#[derive(serde::Deserialize)]
struct Search {
    query: String,
    clicks: Vec<String>,
}

#[test]
fn documents_queries_and_sessions_cross_reference() {
    let corpus = read_documents(&demo("documents.jsonl"), &DocOptions::default()).unwrap();
    assert!(corpus.len() >= 400, "{} documents", corpus.len());
    let ids: HashSet<&str> = corpus.documents.iter().map(|d| d.id.as_str()).collect();
    let lengths: Vec<usize> = corpus
        .documents
        .iter()
        .map(|d| d.texts[1].split_whitespace().count())
        .collect();
    assert!(
        lengths.iter().any(|&n| n < 30),
        "some articles are a sentence or two"
    );
    assert!(
        lengths.iter().any(|&n| n > 250),
        "some articles run to several paragraphs"
    );

    let log = read_queries(&demo("queries.jsonl")).unwrap();
    assert!(
        log.queries.len() >= 3000,
        "{} distinct queries",
        log.queries.len()
    );
    assert!(
        log.queries[0].count >= 1000,
        "a head query has thousands of searches"
    );
    let tail = log.queries.iter().filter(|q| q.count <= 2).count();
    assert!(tail >= 1000, "a long tail of rare queries: {tail}");
    for q in &log.queries {
        for doc in q.clicks.keys() {
            assert!(
                ids.contains(doc.as_str()),
                "{:?} clicks unknown document {doc}",
                q.query
            );
        }
        assert!(
            q.clicks.values().sum::<u64>() <= q.count,
            "{:?}: more clicks than searches",
            q.query
        );
    }
    let logged: HashSet<&str> = log.queries.iter().map(|q| q.query.as_str()).collect();

    let text = std::fs::read_to_string(demo("sessions.jsonl")).unwrap();
    let mut sessions = 0;
    let mut reformulated = 0;
    for line in text.lines() {
        let s: Session = serde_json::from_str(line).unwrap();
        assert!(s.session.starts_with("s-"));
        sessions += 1;
        reformulated += usize::from(s.searches.len() > 1);
        for search in &s.searches {
            assert!(
                logged.contains(search.query.as_str()),
                "{}: {:?} not in the log",
                s.session,
                search.query
            );
            for doc in &search.clicks {
                assert!(
                    ids.contains(doc.as_str()),
                    "{}: unknown document {doc}",
                    s.session
                );
            }
        }
    }
    assert!(
        sessions >= 1000 && reformulated >= 300,
        "{sessions} sessions, {reformulated} reformulated"
    );
}

fn as_map(j: &Judgments) -> BTreeMap<(String, String), i32> {
    j.iter()
        .flat_map(|(q, qj)| {
            qj.iter()
                .map(move |(d, g)| ((q.to_string(), d.to_string()), g))
        })
        .collect()
}

#[test]
fn judgments_agree_across_formats_and_reference_real_documents_and_queries() {
    let qrels = read_trec_qrels(demo("judgments.qrels")).unwrap();
    let (csv, csv_queries) = read_csv_judgments(demo("judgments.csv")).unwrap();
    let judged = read_judged_queries(demo("judged-queries.tsv")).unwrap();
    assert_eq!(
        as_map(&qrels),
        as_map(&csv),
        "qrels and CSV hold the same judgments"
    );
    assert!(
        qrels.num_queries() >= 80,
        "{} judged queries",
        qrels.num_queries()
    );

    let corpus = read_documents(&demo("documents.jsonl"), &DocOptions::default()).unwrap();
    let ids: HashSet<&str> = corpus.documents.iter().map(|d| d.id.as_str()).collect();
    let log = read_queries(&demo("queries.jsonl")).unwrap();
    let logged: HashSet<&str> = log.queries.iter().map(|q| q.query.as_str()).collect();
    for (qid, qj) in qrels.iter() {
        assert!(qj.len() >= 8, "{qid} has {} judged documents", qj.len());
        let text = judged
            .get(qid)
            .unwrap_or_else(|| panic!("{qid} has no text in judged-queries.tsv"));
        assert_eq!(
            csv_queries.get(qid),
            Some(text),
            "{qid}: CSV and TSV name the query alike"
        );
        assert!(
            logged.contains(text),
            "{qid} {text:?} is not in the query log"
        );
        let grades: HashSet<i32> = qj.iter().map(|(_, g)| g).collect();
        assert!(
            grades.iter().all(|g| (0..=3).contains(g)),
            "{qid}: grades 0–3"
        );
        for (doc, _) in qj.iter() {
            assert!(ids.contains(doc), "{qid} judges unknown document {doc}");
        }
    }
}

#[test]
fn live_and_proposed_rulesets_compile_and_differ() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let live = Analyzer::load(&root.join("rules")).unwrap();
    let proposed = Analyzer::load(&root.join("demo-corpus/proposed")).unwrap();
    assert!(live.ruleset().synonyms.len() >= 20);
    assert!(!live.ruleset().exemptions.is_empty() && !live.ruleset().lemmas.is_empty());
    assert!(
        proposed.ruleset().lemmas.len() > live.ruleset().lemmas.len() + 1000,
        "the bulk import"
    );
    assert_ne!(live.key("left"), proposed.key("left"));
}
