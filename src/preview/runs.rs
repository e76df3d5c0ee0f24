//! Both sides' rankings in the TREC run format, for any outside evaluator.

use rustc_hash::FxHashMap;
use serde::Serialize;

use super::PreviewError;
use super::plan::QueryPlan;
use super::report::RankedDoc;

/// The id a query without a judged id is written under: `log-` and the first 12 hex digits
/// of the BLAKE3 hash of its text. It depends on the text alone, so it is the same in every
/// run, whatever the log's order or the other queries in it.
pub fn log_query_id(text: &str) -> String {
    let hash = blake3::hash(text.as_bytes()).to_hex();
    format!("log-{}", &hash[..12])
}

/// Why an id cannot be a field of a TREC run line, if it cannot.
fn unwritable(id: &str) -> Option<&'static str> {
    if id.is_empty() {
        Some("it is empty")
    } else if id.chars().any(char::is_whitespace) {
        Some("it contains whitespace, which separates the fields of a run line")
    } else {
        None
    }
}

/// Checks, before anything is run, that every document id and every query's run id can be
/// written to a run file, and that no two queries would share a run id.
pub(super) fn check_ids(doc_ids: &[String], plan: &QueryPlan) -> Result<(), PreviewError> {
    let refuse = |what, id: &str| {
        unwritable(id).map_or(Ok(()), |why| {
            Err(PreviewError::RunId {
                what,
                id: id.to_string(),
                why,
            })
        })
    };
    for id in doc_ids {
        refuse("document", id)?;
    }
    let mut text_of: FxHashMap<String, &str> = FxHashMap::default();
    for (i, q) in plan.queries.iter().enumerate() {
        for id in plan.run_ids(i) {
            refuse("query", &id)?;
            if let Some(first) = text_of.insert(id.clone(), &q.text)
                && first != q.text
            {
                return Err(PreviewError::RunIdClash {
                    id,
                    first: first.to_string(),
                    second: q.text.clone(),
                });
            }
        }
    }
    Ok(())
}

/// One query's ranking on one side, for a TREC run file.
#[derive(Clone, Debug, Serialize)]
pub struct RunQuery {
    pub qid: String,
    pub docs: Vec<RankedDoc>,
}

/// Both sides' rankings of every query.
#[derive(Clone, Debug, Default)]
pub struct Runs {
    pub base: Vec<RunQuery>,
    pub head: Vec<RunQuery>,
}

/// A run in TREC format: `qid Q0 docid rank score tag`, queries in the order given (the
/// preview sorts them by id). A score is written as the shortest decimal that reads back as
/// the same number, so tied documents stay tied for any evaluator that reads the file.
pub fn trec_run(run: &[RunQuery], tag: &str) -> String {
    let mut out = String::new();
    for q in run {
        for (i, d) in q.docs.iter().enumerate() {
            out.push_str(&format!(
                "{} Q0 {} {} {} {tag}\n",
                q.qid,
                d.id,
                i + 1,
                d.score
            ));
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn log_ids_depend_on_the_text_alone() {
        let id = log_query_id("night bus");
        assert_eq!(id, log_query_id("night bus"));
        assert_ne!(id, log_query_id("night buses"));
        assert!(id.starts_with("log-") && id.len() == 16, "{id}");
        assert!(unwritable(&id).is_none());
    }

    #[test]
    fn ids_with_whitespace_are_refused() {
        assert!(unwritable("doc 1").is_some());
        assert!(unwritable("doc\t1").is_some());
        assert!(unwritable("").is_some());
        assert!(unwritable("doc-1").is_none());
    }
}
