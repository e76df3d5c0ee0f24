//! Query logs: JSON Lines (`{"query", "count", "clicks": {doc id: clicks}}`), one query
//! per line, `query<TAB>count`, or `id<TAB>text` — the format read from the content or
//! given ([`QueryFormat`]). Repeated queries are merged; counts and their sums are checked,
//! never wrapped.

use std::collections::{BTreeMap, HashMap};
use std::fs;
use std::path::Path;

use serde::{Deserialize, Serialize};

use super::{CorpusError, QueryFormat};

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
    /// All searches of the log. A log read from a file is checked to fit in a `u64`; one
    /// built by hand saturates rather than wraps.
    pub fn total_searches(&self) -> u64 {
        self.queries
            .iter()
            .fold(0u64, |sum, q| sum.saturating_add(q.count))
    }

    /// Builds a log from entries, merging repeats and sorting; counts that overflow
    /// saturate (readers use [`QueryLog::try_from_entries`], which refuses them).
    pub fn from_entries(source: &str, entries: impl IntoIterator<Item = QueryEntry>) -> Self {
        let mut merged = Merged::default();
        for e in entries {
            merged.add(e, |a, b| Some(a.saturating_add(b)));
        }
        merged.into_log(source)
    }

    /// Builds a log from entries with the (1-based) line each comes from, merging repeats
    /// and sorting. A query's searches or clicks, or all searches together, that add up to
    /// more than `u64::MAX` are an error at the line where they overflow.
    pub fn try_from_entries(
        path: &Path,
        entries: impl IntoIterator<Item = (usize, QueryEntry)>,
    ) -> Result<Self, CorpusError> {
        let mut merged = Merged::default();
        let mut total = 0u64;
        for (line, e) in entries {
            let parse = |message: String| CorpusError::Parse {
                path: path.to_path_buf(),
                line,
                message,
            };
            total = total.checked_add(e.count).ok_or_else(|| {
                parse(format!(
                    "the searches of the log add up to more than {} here",
                    u64::MAX
                ))
            })?;
            let query = e.query.trim().to_string();
            if !merged.add(e, u64::checked_add) {
                return Err(parse(format!(
                    "the searches or clicks of {query:?} add up to more than {} here",
                    u64::MAX
                )));
            }
        }
        Ok(merged.into_log(&path.display().to_string()))
    }
}

#[derive(Default)]
struct Merged(HashMap<String, QueryEntry>);

impl Merged {
    /// Adds one entry; false when `add` refused a sum.
    fn add(&mut self, e: QueryEntry, add: impl Fn(u64, u64) -> Option<u64>) -> bool {
        let text = e.query.trim().to_string();
        if text.is_empty() {
            return true;
        }
        let slot = self.0.entry(text.clone()).or_insert_with(|| QueryEntry {
            query: text,
            count: 0,
            clicks: BTreeMap::new(),
        });
        let Some(count) = add(slot.count, e.count) else {
            return false;
        };
        slot.count = count;
        for (doc, n) in e.clicks {
            let clicks = slot.clicks.entry(doc).or_default();
            let Some(sum) = add(*clicks, n) else {
                return false;
            };
            *clicks = sum;
        }
        true
    }

    fn into_log(self, source: &str) -> QueryLog {
        let mut queries: Vec<QueryEntry> = self.0.into_values().collect();
        queries.sort_by(|a, b| b.count.cmp(&a.count).then_with(|| a.query.cmp(&b.query)));
        QueryLog {
            source: source.to_string(),
            queries,
        }
    }
}

/// Reads a query log, its format read from the content ([`QueryFormat::detect`]).
pub fn read_queries(path: &Path) -> Result<QueryLog, CorpusError> {
    read_queries_as(path, None)
}

/// Reads a query log in `format`, or in the format its content shows when `None`. A log
/// without queries is an error.
pub fn read_queries_as(path: &Path, format: Option<QueryFormat>) -> Result<QueryLog, CorpusError> {
    let bytes = fs::read(path).map_err(|source| CorpusError::Io {
        path: path.to_path_buf(),
        source,
    })?;
    let text = String::from_utf8(bytes).map_err(|e| {
        let valid = &e.as_bytes()[..e.utf8_error().valid_up_to()];
        let line_start = valid.iter().rposition(|&b| b == b'\n').map_or(0, |p| p + 1);
        CorpusError::Parse {
            path: path.to_path_buf(),
            line: valid.iter().filter(|&&b| b == b'\n').count() + 1,
            message: format!(
                "not UTF-8 text (invalid byte at column {})",
                valid.len() - line_start + 1
            ),
        }
    })?;
    let text = text.strip_prefix('\u{feff}').unwrap_or(&text);
    let format = match format {
        Some(f) => f,
        None => QueryFormat::detect(path, text)?,
    };
    let entries = match format {
        QueryFormat::Ids => ids(path, text)?,
        _ => {
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
                let entry = match format {
                    QueryFormat::JsonLines => json_entry(line).map_err(parse)?,
                    QueryFormat::Counts => {
                        let (query, count) = line.rsplit_once('\t').unwrap_or((line, "1"));
                        QueryEntry {
                            query: query.to_string(),
                            count: parse_count(count.trim()).map_err(parse)?,
                            clicks: BTreeMap::new(),
                        }
                    }
                    _ => QueryEntry {
                        query: line.to_string(),
                        count: 1,
                        clicks: BTreeMap::new(),
                    },
                };
                entries.push((i + 1, entry));
            }
            entries
        }
    };
    let log = QueryLog::try_from_entries(path, entries)?;
    if log.queries.is_empty() {
        return Err(CorpusError::Empty {
            path: path.to_path_buf(),
            what: "queries",
            why: if text.is_empty() {
                "the file is empty".into()
            } else {
                "the file holds only blank lines or empty queries".into()
            },
        });
    }
    Ok(log)
}

/// A search count: a whole number from 0 to `u64::MAX`.
fn parse_count(text: &str) -> Result<u64, String> {
    if !text.is_empty() && text.bytes().all(|b| b.is_ascii_digit()) {
        text.parse().map_err(|_| {
            format!(
                "the count {text} is larger than the largest count, {}",
                u64::MAX
            )
        })
    } else {
        Err(format!("the count {text:?} is not a whole number"))
    }
}

/// One JSON Lines entry, every number checked: a count is a whole number that fits.
fn json_entry(line: &str) -> Result<QueryEntry, String> {
    let expected = "expected {\"query\": ..., \"count\": ...}";
    let value: serde_json::Value =
        serde_json::from_str(line).map_err(|e| format!("{expected}: {e}"))?;
    let object = value
        .as_object()
        .ok_or_else(|| format!("{expected}: not a JSON object"))?;
    let count_of = |v: &serde_json::Value, what: &str| -> Result<u64, String> {
        match v {
            serde_json::Value::Number(n) => n.as_u64().ok_or_else(|| match n.as_f64() {
                Some(f) if f >= u64::MAX as f64 && f.fract() == 0.0 => format!(
                    "{what}: the count {n} is larger than the largest count, {}",
                    u64::MAX
                ),
                _ => format!("{what}: the count {n} is not a whole number"),
            }),
            other => Err(format!("{what}: the count {other} is not a whole number")),
        }
    };
    let query = match object.get("query") {
        Some(serde_json::Value::String(q)) => q.clone(),
        Some(other) => return Err(format!("{expected}: the query {other} is not a string")),
        None => return Err(format!("{expected}: no \"query\"")),
    };
    let count = match object.get("count") {
        None | Some(serde_json::Value::Null) => 1,
        Some(v) => count_of(v, "\"count\"")?,
    };
    let mut clicks = BTreeMap::new();
    match object.get("clicks") {
        None | Some(serde_json::Value::Null) => {}
        Some(serde_json::Value::Object(map)) => {
            for (doc, n) in map {
                clicks.insert(doc.clone(), count_of(n, &format!("clicks on {doc:?}"))?);
            }
        }
        Some(other) => {
            return Err(format!(
                "\"clicks\" must map document ids to click counts, not {other}"
            ));
        }
    }
    Ok(QueryEntry {
        query,
        count,
        clicks,
    })
}

/// `id<TAB>text` lines (the judged-query layout): each text searched once.
fn ids(path: &Path, text: &str) -> Result<Vec<(usize, QueryEntry)>, CorpusError> {
    let queries = crate::metrics::parse_queries(text.as_bytes(), path)?;
    // Lines of the texts, for errors while merging: the parser checked the layout.
    let lines: Vec<usize> = text
        .lines()
        .enumerate()
        .filter(|(_, l)| !l.trim().is_empty())
        .map(|(i, _)| i + 1)
        .collect();
    Ok(queries
        .iter()
        .zip(lines)
        .map(|(q, line)| {
            (
                line,
                QueryEntry {
                    query: q.text.clone(),
                    count: 1,
                    clicks: BTreeMap::new(),
                },
            )
        })
        .collect())
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
        let err = read_queries_as(&t, Some(QueryFormat::Counts))
            .unwrap_err()
            .to_string();
        assert!(err.contains("q.tsv:2:"), "{err}");
    }

    /// The extension does not choose the format: an id<TAB>text file named .tsv is
    /// ambiguous until the format is given.
    #[test]
    fn the_content_chooses_the_format_and_ids_are_read_when_asked() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("judged.tsv");
        fs::write(&p, "q1\tlost property\nq2\tpram\n").unwrap();
        let err = read_queries(&p).unwrap_err();
        assert!(
            matches!(err, CorpusError::AmbiguousQueries { line: 1, .. }),
            "{err}"
        );
        let log = read_queries_as(&p, Some(QueryFormat::Ids)).unwrap();
        let texts: Vec<&str> = log.queries.iter().map(|q| q.query.as_str()).collect();
        assert_eq!(texts, ["lost property", "pram"]);
        let j = dir.path().join("log.txt");
        fs::write(&j, "{\"query\":\"pram\",\"count\":3}\n").unwrap();
        assert_eq!(read_queries(&j).unwrap().queries[0].count, 3);
    }

    #[test]
    fn counts_that_overflow_are_errors_with_their_line() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("q.tsv");
        fs::write(&p, "a\t1\nb\t18446744073709551616\n").unwrap();
        let err = read_queries(&p).unwrap_err().to_string();
        assert!(
            err.contains("q.tsv:2: the count 18446744073709551616 is larger"),
            "{err}"
        );
        fs::write(&p, "a\t18446744073709551615\nb\t1\n").unwrap();
        let err = read_queries(&p).unwrap_err().to_string();
        assert!(
            err.contains("q.tsv:2: the searches of the log add up"),
            "{err}"
        );
        let j = dir.path().join("q.jsonl");
        fs::write(&j, "{\"query\":\"a\",\"count\":99999999999999999999}\n").unwrap();
        let err = read_queries(&j).unwrap_err().to_string();
        assert!(
            err.contains("q.jsonl:1: \"count\": the count 1e+20 is larger than the largest count"),
            "{err}"
        );
        fs::write(&j, "{\"query\":\"a\",\"count\":-1}\n").unwrap();
        assert!(read_queries(&j).is_err());
        fs::write(
            &j,
            "{\"query\":\"a\",\"clicks\":{\"d\":18446744073709551615}}\n{\"query\":\"a\",\"clicks\":{\"d\":1}}\n",
        )
        .unwrap();
        let err = read_queries(&j).unwrap_err().to_string();
        assert!(
            err.contains("q.jsonl:2: the searches or clicks of \"a\""),
            "{err}"
        );
    }

    #[test]
    fn a_byte_order_mark_is_not_part_of_the_first_query() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("q.tsv");
        fs::write(&p, "\u{feff}timetable\t90\r\npram\t3\r\n").unwrap();
        let log = read_queries(&p).unwrap();
        assert_eq!(log.queries[0].query, "timetable");
        assert_eq!(log.total_searches(), 93);
        let j = dir.path().join("q.jsonl");
        fs::write(&j, "\u{feff}{\"query\":\"pram\"}\n").unwrap();
        assert_eq!(read_queries(&j).unwrap().queries[0].query, "pram");
    }

    #[test]
    fn a_log_without_queries_is_an_error() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("q.txt");
        for text in ["", "\n  \n"] {
            fs::write(&p, text).unwrap();
            let err = read_queries(&p).unwrap_err();
            assert!(matches!(err, CorpusError::Empty { .. }), "{err}");
        }
    }
}
