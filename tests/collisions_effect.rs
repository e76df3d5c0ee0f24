//! The collisions report's effect estimate against the preview engine.
//!
//! The estimate (`audit::effect`) models single-term matching: a query term matches the
//! documents holding any form with the term's key. For a query of one word that no synonym
//! expands, that is exactly the preview's model, so there the two must give the same
//! documents gained and lost for every suggestion — this test runs both on the demo and
//! compares them query by query. (For longer queries the estimate is per term and the
//! preview per query, so they are not compared.)

use std::collections::BTreeMap;
use std::path::Path;
use std::sync::Arc;

use lexdelta::analysis::Analyzer;
use lexdelta::audit::morphy::Morphy;
use lexdelta::audit::report::{CollisionOptions, collision_report};
use lexdelta::audit::suggest::with_rules;
use lexdelta::corpus::{DocOptions, QueryEntry, QueryLog, read_documents, read_queries};
use lexdelta::index::NoProgress;
use lexdelta::preview::{self, PreviewInput, PreviewOptions};

fn root(path: &str) -> std::path::PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join(path)
}

/// A query of one word that every side keys without synonyms: where the models coincide.
fn single_term(analyzers: &[&Analyzer], query: &str) -> bool {
    analyzers.iter().all(|a| {
        let q = a.analyze_query(query);
        q.keys.len() == 1 && q.expansions.iter().all(|e| e.alternatives.len() == 1)
    })
}

#[test]
fn the_effect_estimate_equals_the_preview_on_single_term_queries() {
    assert!(
        Path::new("/usr/share/wordnet/index.noun").exists(),
        "WordNet 3.0 is missing: install the Debian package wordnet-base \
         (tests/run.sh does) so /usr/share/wordnet/index.noun exists"
    );
    let live = Analyzer::load(&root("rules")).unwrap();
    let corpus =
        read_documents(&root("demo-corpus/documents.jsonl"), &DocOptions::default()).unwrap();
    let demo_log = read_queries(&root("demo-corpus/queries.jsonl")).unwrap();
    let morphy = Morphy::load(Path::new("/usr/share/wordnet")).unwrap();
    let options = CollisionOptions {
        top: Some(12),
        threads: 2,
    };
    // First pass: which groups are shown. Then every form of those groups becomes a
    // one-word query too, so each suggestion is compared on all of its forms.
    let first = collision_report(&live, &corpus, Some(&demo_log), &morphy, &options);
    let mut entries: Vec<QueryEntry> = demo_log.queries.clone();
    for c in &first.collisions {
        let classes = c.collision.classes.iter().flat_map(|class| &class.forms);
        for form in classes.chain(&c.collision.unclassified) {
            entries.push(QueryEntry {
                query: form.form.clone(),
                count: 1,
                clicks: Default::default(),
            });
        }
    }
    let log = QueryLog::from_entries("demo and group forms", entries);
    let report = collision_report(&live, &corpus, Some(&log), &morphy, &options);

    let base = Arc::new(live.clone());
    let mut compared = 0;
    let mut changed = 0;
    for rc in &report.collisions {
        let (Some(suggestion), Some(effect)) = (&rc.suggestion, &rc.effect) else {
            continue;
        };
        let head = Arc::new(with_rules(live.ruleset(), &suggestion.rules).unwrap());
        let outcome = preview::run(
            PreviewInput {
                base: Arc::clone(&base),
                head: Arc::clone(&head),
                corpus: &corpus,
                queries: &log,
                judged: None,
            },
            &PreviewOptions::default(),
            &NoProgress,
        )
        .unwrap();
        let by_preview: BTreeMap<&str, (usize, usize)> = outcome
            .report
            .queries
            .iter()
            .map(|q| (q.query.as_str(), (q.gained_count, q.lost_count)))
            .collect();
        let by_estimate: BTreeMap<&str, (usize, usize)> = effect
            .queries
            .iter()
            .map(|q| (q.query.as_str(), (q.gained, q.lost)))
            .collect();
        for entry in &log.queries {
            let q = entry.query.as_str();
            if !single_term(&[&base, &head], q) {
                continue;
            }
            let preview = by_preview.get(q).copied().unwrap_or_default();
            let estimate = by_estimate.get(q).copied().unwrap_or_default();
            assert_eq!(
                estimate, preview,
                "{q:?} under the suggestion for {:?}: estimate (gained, lost) vs preview",
                suggestion.key
            );
            compared += 1;
            changed += usize::from(preview != (0, 0));
        }
    }
    // Not a vacuous pass: many queries compared, and many of them changed.
    eprintln!("{compared} single-term queries compared, {changed} of them changed");
    assert!(compared > 100, "only {compared} queries compared");
    assert!(changed > 20, "only {changed} compared queries changed");
}
