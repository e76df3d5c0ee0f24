//! A query's clauses as postings: per clause and field, the documents and tfs where any
//! of its alternatives (words or phrases) matches.

use std::sync::Arc;

use super::super::keys::KeySource;
use super::{MatchMode, Scoring};
use crate::analysis::{AnalyzedQuery, Expansion, Phrase};
use crate::index::{Frequencies, IndexError, Postings};

/// A query's clause lists: per clause, per field, its documents and tfs.
pub(super) type ClauseLists = Vec<Vec<Arc<Frequencies>>>;

pub(super) fn clause_lists(
    query: &AnalyzedQuery,
    source: &dyn KeySource,
    fields: usize,
) -> Result<ClauseLists, IndexError> {
    query
        .expansions
        .iter()
        .map(|e| {
            (0..fields)
                .map(|field| clause_tf(e, field, source))
                .collect::<Result<Vec<_>, _>>()
        })
        .collect()
}

/// Whether `query` needs every clause under `scoring` (`min:N` asks for at most the number
/// of clauses, so a short query can still match).
pub(super) fn needs_every_clause(query: &AnalyzedQuery, scoring: &Scoring) -> bool {
    let clauses = query.expansions.len();
    match scoring.mode {
        MatchMode::All => true,
        MatchMode::Any => clauses <= 1,
        MatchMode::Min(k) => k >= clauses,
    }
}

/// A clause's tf per document in one field: the number of positions where any of its
/// alternatives matches (sorted by document). Without a phrase among the alternatives this
/// is the sum of the distinct keys' tfs (a position holds one key), read without positions.
pub(super) fn clause_tf(
    expansion: &Expansion,
    field: usize,
    source: &dyn KeySource,
) -> Result<Arc<Frequencies>, IndexError> {
    if expansion
        .alternatives
        .iter()
        .all(|a| a.phrase.keys.len() <= 1)
    {
        let mut keys: Vec<&str> = expansion
            .alternatives
            .iter()
            .flat_map(|a| a.phrase.keys.iter().map(|(_, k)| k.as_str()))
            .collect();
        keys.sort_unstable();
        keys.dedup();
        return source.frequencies_of_any(field, &keys);
    }
    let mut pairs = Vec::new();
    for alternative in &expansion.alternatives {
        phrase_matches(&alternative.phrase, field, source, &mut pairs)?;
    }
    Ok(Arc::new(Frequencies::from(&Postings::from_pairs(pairs))))
}

/// Appends `(doc, start position)` for every match of `phrase`.
fn phrase_matches(
    phrase: &Phrase,
    field: usize,
    source: &dyn KeySource,
    out: &mut Vec<(u32, u32)>,
) -> Result<(), IndexError> {
    let lists = phrase
        .keys
        .iter()
        .map(|(rel, key)| Ok((*rel, source.postings(field, key)?)))
        .collect::<Result<Vec<_>, IndexError>>()?;
    let Some(((_, first), rest)) = lists.split_first() else {
        return Ok(());
    };
    'docs: for (i, &doc) in first.docs.iter().enumerate() {
        let mut found = Vec::with_capacity(rest.len());
        for (rel, list) in rest {
            match list.docs.binary_search(&doc) {
                Ok(j) => found.push((*rel, list.positions_at(j))),
                Err(_) => continue 'docs,
            }
        }
        for &pos in first.positions_at(i) {
            if found
                .iter()
                .all(|(rel, positions)| positions.binary_search(&(pos + rel)).is_ok())
            {
                out.push((doc, pos));
            }
        }
    }
    Ok(())
}
