//! Queries: one per line, TSV `query<TAB>count`, or the JSON Lines query log
//! (`{"query", "count", "clicks": {doc id: clicks}}`). Repeated queries are merged.

use std::collections::{BTreeMap, HashMap};
use std::fs;
use std::path::Path;

use serde::{Deserialize, Serialize};

use super::CorpusError;

/// One distinct query with its traffic and clicks.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct QueryEntry {
    pub query: String,
    #[serde(default = "one")]
    pub count: u64,
    #[serde(default)]
    pub clicks: BTreeMap<String, u64>,
}

fn one() -> u64 {
    1
}

/// Distinct queries, most searched first (ties by text), with their total traffic.
#[derive(Clone, Debug, Default, Serialize)]
pub struct QueryLog {
    pub source: String,
    pub queries: Vec<QueryEntry>,
}

impl QueryLog {
    pub fn total_searches(&self) -> u64 {
        self.queries.iter().map(|q| q.count).sum()
    }

    /// Builds a log from entries, merging repeats and sorting.
    pub fn from_entries(source: &str, entries: impl IntoIterator<Item = QueryEntry>) -> Self {
        let mut merged: HashMap<String, QueryEntry> = HashMap::new();
        for e in entries {
            let text = e.query.trim().to_string();
            if text.is_empty() {
                continue;
            }
            let slot = merged.entry(text.clone()).or_insert_with(|| QueryEntry {
                query: text,
                count: 0,
                clicks: BTreeMap::new(),
            });
            slot.count += e.count;
            for (doc, n) in e.clicks {
                *slot.clicks.entry(doc).or_default() += n;
            }
        }
        let mut queries: Vec<QueryEntry> = merged.into_values().collect();
        queries.sort_by(|a, b| b.count.cmp(&a.count).then_with(|| a.query.cmp(&b.query)));
        QueryLog {
            source: source.to_string(),
            queries,
        }
    }
}

pub fn read_queries(path: &Path) -> Result<QueryLog, CorpusError> {
    let text = fs::read_to_string(path).map_err(|source| CorpusError::Io {
        path: path.to_path_buf(),
        source,
    })?;
    let ext = path.extension().and_then(|e| e.to_str());
    let mut entries = Vec::new();
    for (i, line) in text.lines().enumerate() {
        if line.trim().is_empty() {
            continue;
        }
        let parse = |message: String| CorpusError::Parse {
            path: path.to_path_buf(),
            line: i + 1,
            message,
        };
        let entry = match ext {
            Some("jsonl" | "json") => serde_json::from_str::<QueryEntry>(line)
                .map_err(|e| parse(format!("expected {{\"query\": ..., \"count\": ...}}: {e}")))?,
            Some("tsv") => {
                let (query, count) = line.rsplit_once('\t').unwrap_or((line, "1"));
                let count = count
                    .trim()
                    .parse()
                    .map_err(|_| parse(format!("the count {count:?} is not a whole number")))?;
                QueryEntry {
                    query: query.to_string(),
                    count,
                    clicks: BTreeMap::new(),
                }
            }
            _ => QueryEntry {
                query: line.to_string(),
                count: 1,
                clicks: BTreeMap::new(),
            },
        };
        entries.push(entry);
    }
    Ok(QueryLog::from_entries(&path.display().to_string(), entries))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn repeats_merge_and_the_log_is_sorted_by_traffic() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("q.txt");
        fs::write(&p, "pram\nlost property\npram\n").unwrap();
        let log = read_queries(&p).unwrap();
        assert_eq!(log.queries[0].query, "pram");
        assert_eq!(log.queries[0].count, 2);
        let t = dir.path().join("q.tsv");
        fs::write(&t, "timetable\t90\nbad\tx\n").unwrap();
        let err = read_queries(&t).unwrap_err().to_string();
        assert!(err.contains("q.tsv:2:"), "{err}");
    }
}
