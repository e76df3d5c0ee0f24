//! Both sides' rankings in the TREC run format, for any outside evaluator.

use serde::Serialize;

use super::report::RankedDoc;

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

/// A run in TREC format: `qid Q0 docid rank score tag`.
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
