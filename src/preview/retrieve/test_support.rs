//! In-memory postings and analyzers for the retrieval tests.

use std::sync::Arc;

use rustc_hash::FxHashMap;

use super::super::keys::KeySource;
use crate::analysis::Analyzer;
use crate::index::{Frequencies, IndexError, Postings};
use crate::rules::{SourceFile, load_sources};

/// Postings held in memory: key → (doc, position) pairs, two fields. Frequencies are
/// kept too, so two reads of a key give the very same list (as a view's caches do).
pub(super) struct MapKeys {
    postings: Vec<FxHashMap<String, Arc<Postings>>>,
    frequencies: Vec<FxHashMap<String, Arc<Frequencies>>>,
    lengths: Vec<Vec<u32>>,
}

impl KeySource for MapKeys {
    fn num_docs(&self) -> u32 {
        self.lengths[0].len() as u32
    }
    fn num_fields(&self) -> usize {
        self.lengths.len()
    }
    fn doc_lengths(&self, field: usize) -> &[u32] {
        &self.lengths[field]
    }
    fn postings(&self, field: usize, key: &str) -> Result<Arc<Postings>, IndexError> {
        Ok(self.postings[field].get(key).cloned().unwrap_or_default())
    }
    fn frequencies(&self, field: usize, key: &str) -> Result<Arc<Frequencies>, IndexError> {
        Ok(self.frequencies[field]
            .get(key)
            .cloned()
            .unwrap_or_default())
    }
    fn keys(&self, field: usize) -> Vec<String> {
        let mut k: Vec<String> = self.postings[field].keys().cloned().collect();
        k.sort();
        k
    }
}

pub(super) const WORDS: [&str; 6] = ["red", "blue", "green", "bus", "tram", "stop"];

pub(super) fn source(docs: &[Vec<Vec<u8>>]) -> MapKeys {
    let mut pairs: Vec<FxHashMap<String, Vec<(u32, u32)>>> = vec![Default::default(); 2];
    let mut lengths = vec![vec![0u32; docs.len()]; 2];
    for (d, fields) in docs.iter().enumerate() {
        for (f, words) in fields.iter().enumerate() {
            lengths[f][d] = words.len() as u32;
            for (pos, &w) in words.iter().enumerate() {
                pairs[f]
                    .entry(WORDS[w as usize].to_string())
                    .or_default()
                    .push((d as u32, pos as u32));
            }
        }
    }
    let postings: Vec<FxHashMap<String, Arc<Postings>>> = pairs
        .into_iter()
        .map(|m| {
            m.into_iter()
                .map(|(k, v)| (k, Arc::new(Postings::from_pairs(v))))
                .collect()
        })
        .collect();
    let frequencies = postings
        .iter()
        .map(|m| {
            m.iter()
                .map(|(k, p)| (k.clone(), Arc::new(Frequencies::from(&**p))))
                .collect()
        })
        .collect();
    MapKeys {
        postings,
        frequencies,
        lengths,
    }
}

pub(super) fn analyzer() -> Analyzer {
    analyzer_with("synonyms:\n  - id: colours\n    equivalent: [red, green tram]\n")
}

pub(super) fn analyzer_with(rules: &str) -> Analyzer {
    let text = format!("format: 1\nrevision: 1\n{rules}");
    let rs = load_sources(
        "t",
        vec![SourceFile {
            name: "t.yaml".into(),
            text,
        }],
    )
    .unwrap();
    Analyzer::new(rs).unwrap()
}
