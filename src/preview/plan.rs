//! Which queries a preview runs: the query log's, in log order, then judged queries the
//! log lacks; each with its judged id when it has one.

use rustc_hash::{FxHashMap, FxHashSet};

use super::JudgedSet;
use super::runs::log_query_id;
use crate::corpus::QueryLog;

/// One query to run.
pub(super) struct PlannedQuery {
    pub text: String,
    /// Searches in the log (0 for a judged query the log lacks).
    pub count: u64,
    /// The judged query ids of this text (usually none or one), sorted.
    pub qids: Vec<String>,
}

/// The queries of a preview.
pub(super) struct QueryPlan {
    pub queries: Vec<PlannedQuery>,
    /// The first `log_len` queries are the log's; the rest are judged queries it lacks.
    pub log_len: usize,
}

impl QueryPlan {
    pub fn new(log: &QueryLog, judged: Option<&JudgedSet>) -> QueryPlan {
        // Judged query texts → ids; judged texts missing from the log are run too.
        let mut qid_of: FxHashMap<String, Vec<String>> = FxHashMap::default();
        if let Some(j) = judged {
            for q in j.texts.iter() {
                if j.judgments.contains_query(&q.id) {
                    qid_of
                        .entry(q.text.trim().to_string())
                        .or_default()
                        .push(q.id.clone());
                }
            }
        }
        for ids in qid_of.values_mut() {
            ids.sort();
            ids.dedup();
        }
        let in_log: FxHashSet<&str> = log.queries.iter().map(|q| q.query.as_str()).collect();
        let mut extra: Vec<&String> = qid_of
            .keys()
            .filter(|t| !in_log.contains(t.as_str()))
            .collect();
        extra.sort();
        let mut queries: Vec<PlannedQuery> = log
            .queries
            .iter()
            .map(|q| PlannedQuery {
                text: q.query.clone(),
                count: q.count,
                qids: qid_of.get(&q.query).cloned().unwrap_or_default(),
            })
            .collect();
        let log_len = queries.len();
        queries.extend(extra.into_iter().map(|t| PlannedQuery {
            text: t.clone(),
            count: 0,
            qids: qid_of.get(t).cloned().unwrap_or_default(),
        }));
        QueryPlan { queries, log_len }
    }

    /// The ids query `i` is written under in run files: its judged ids, or else an id
    /// derived from its text ([`log_query_id`]).
    pub fn run_ids(&self, i: usize) -> Vec<String> {
        let q = &self.queries[i];
        if q.qids.is_empty() {
            vec![log_query_id(&q.text)]
        } else {
            q.qids.clone()
        }
    }

    /// Whether query `i` is from the log.
    pub fn in_log(&self, i: usize) -> bool {
        i < self.log_len
    }
}
