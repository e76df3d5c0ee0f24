//! Graded relevance judgments and query texts, and the readers for their files.
//!
//! Three file formats are read:
//!
//! * **TREC qrels**: one judgment per line, `QUERY_ID ITERATION DOC_ID GRADE`, separated by
//!   any whitespace. The iteration field is ignored, as trec_eval ignores it. Blank lines are
//!   skipped.
//! * **CSV judgments**: a header line naming the columns `query_id`, `query`, `doc_id` and
//!   `relevance` (in any order; other columns are ignored), then one judgment per row. The
//!   `query` column carries the query's text, so the reader returns [`Queries`] as well.
//! * **Queries**: one query per line, `QUERY_ID<TAB>TEXT`. Blank lines are skipped; the id
//!   and the text are trimmed of surrounding whitespace.
//!
//! In both judgment formats a (query, document) pair judged twice with the same grade is
//! accepted once; judged twice with different grades it is an error naming both lines.
//! Every error names the file and the 1-based line.

use std::collections::BTreeMap;
use std::fs::File;
use std::io::{BufRead, BufReader, Read};
use std::path::Path;

use rustc_hash::FxHashMap;

use super::error::{MetricsError, ParseErrorKind};

/// The graded judgments of one query: document id → grade.
///
/// A grade at or above the relevance threshold (by default 1) makes a document relevant;
/// grades below it (0 and negative grades) are judged non-relevant. Documents not listed are
/// unjudged and count as non-relevant.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct QueryJudgments {
    grades: FxHashMap<String, i32>,
}

impl QueryJudgments {
    /// The grade of `doc`, or `None` when it is unjudged.
    pub fn grade(&self, doc: &str) -> Option<i32> {
        self.grades.get(doc).copied()
    }

    /// Judges `doc`; returns the grade it had before, if any.
    pub fn insert(&mut self, doc: impl Into<String>, grade: i32) -> Option<i32> {
        self.grades.insert(doc.into(), grade)
    }

    /// How many documents are judged (relevant or not).
    pub fn len(&self) -> usize {
        self.grades.len()
    }

    /// Whether no document is judged.
    pub fn is_empty(&self) -> bool {
        self.grades.is_empty()
    }

    /// How many judged documents have a grade of at least `threshold`.
    pub fn num_relevant(&self, threshold: i32) -> usize {
        self.grades.values().filter(|&&g| g >= threshold).count()
    }

    /// The judged documents and their grades, in no particular order.
    pub fn iter(&self) -> impl Iterator<Item = (&str, i32)> {
        self.grades.iter().map(|(d, &g)| (d.as_str(), g))
    }
}

/// Graded judgments of many queries: query id → document id → grade.
///
/// Queries are kept sorted by id, so iteration (and everything derived from it) is
/// deterministic.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Judgments {
    queries: BTreeMap<String, QueryJudgments>,
}

impl Judgments {
    /// No judgments.
    pub fn new() -> Self {
        Self::default()
    }

    /// Judges `doc` for `query`; returns the grade it had before, if any.
    pub fn insert(
        &mut self,
        query: impl Into<String>,
        doc: impl Into<String>,
        grade: i32,
    ) -> Option<i32> {
        self.queries
            .entry(query.into())
            .or_default()
            .insert(doc, grade)
    }

    /// The judgments of one query.
    pub fn query(&self, query: &str) -> Option<&QueryJudgments> {
        self.queries.get(query)
    }

    /// The grade of `doc` for `query`, or `None` when unjudged.
    pub fn grade(&self, query: &str, doc: &str) -> Option<i32> {
        self.queries.get(query).and_then(|q| q.grade(doc))
    }

    /// Whether `query` has at least one judgment.
    pub fn contains_query(&self, query: &str) -> bool {
        self.queries.contains_key(query)
    }

    /// How many queries have judgments.
    pub fn num_queries(&self) -> usize {
        self.queries.len()
    }

    /// How many (query, document) judgments there are in all.
    pub fn num_judgments(&self) -> usize {
        self.queries.values().map(QueryJudgments::len).sum()
    }

    /// Whether there are no judgments at all.
    pub fn is_empty(&self) -> bool {
        self.queries.is_empty()
    }

    /// The judged query ids, sorted.
    pub fn query_ids(&self) -> impl Iterator<Item = &str> {
        self.queries.keys().map(String::as_str)
    }

    /// The queries and their judgments, sorted by query id.
    pub fn iter(&self) -> impl Iterator<Item = (&str, &QueryJudgments)> {
        self.queries.iter().map(|(q, j)| (q.as_str(), j))
    }
}

/// One query of a queries file.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize, serde::Deserialize)]
pub struct QueryText {
    /// The query id, as used in judgments and runs.
    pub id: String,
    /// The text a user typed.
    pub text: String,
}

/// Query texts by id, in the order they were first read.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Queries {
    entries: Vec<QueryText>,
    index: FxHashMap<String, usize>,
}

impl Queries {
    /// No queries.
    pub fn new() -> Self {
        Self::default()
    }

    /// Sets the text of `id`; returns the previous text, if any. A new id goes last; an
    /// existing one keeps its place.
    pub fn insert(&mut self, id: impl Into<String>, text: impl Into<String>) -> Option<String> {
        let id = id.into();
        let text = text.into();
        if let Some(&i) = self.index.get(&id) {
            return Some(std::mem::replace(&mut self.entries[i].text, text));
        }
        self.index.insert(id.clone(), self.entries.len());
        self.entries.push(QueryText { id, text });
        None
    }

    /// The text of query `id`.
    pub fn get(&self, id: &str) -> Option<&str> {
        self.index.get(id).map(|&i| self.entries[i].text.as_str())
    }

    /// How many queries there are.
    pub fn len(&self) -> usize {
        self.entries.len()
    }

    /// Whether there are none.
    pub fn is_empty(&self) -> bool {
        self.entries.is_empty()
    }

    /// The queries in file order.
    pub fn iter(&self) -> impl Iterator<Item = &QueryText> {
        self.entries.iter()
    }
}

fn open(path: &Path) -> Result<BufReader<File>, MetricsError> {
    File::open(path)
        .map(BufReader::new)
        .map_err(|source| MetricsError::Io {
            path: path.to_path_buf(),
            source,
        })
}

/// Calls `f(line_number, line)` for every line of `reader`, with a trailing `\r` removed.
pub(crate) fn for_each_line(
    mut reader: impl BufRead,
    source: &Path,
    mut f: impl FnMut(u64, &str) -> Result<(), MetricsError>,
) -> Result<(), MetricsError> {
    let mut buf = String::new();
    let mut line_no = 0u64;
    loop {
        buf.clear();
        let n = reader
            .read_line(&mut buf)
            .map_err(|source_err| MetricsError::Io {
                path: source.to_path_buf(),
                source: std::io::Error::new(
                    source_err.kind(),
                    format!("line {}: {source_err}", line_no + 1),
                ),
            })?;
        if n == 0 {
            return Ok(());
        }
        line_no += 1;
        let line = buf.strip_suffix('\n').unwrap_or(&buf);
        let line = line.strip_suffix('\r').unwrap_or(line);
        f(line_no, line)?;
    }
}

pub(crate) fn parse_error(source: &Path, line: u64, kind: ParseErrorKind) -> MetricsError {
    MetricsError::Parse {
        path: source.to_path_buf(),
        line,
        kind,
    }
}

/// Collects judgments while remembering where each was first given, to report conflicts.
#[derive(Default)]
struct JudgmentBuilder {
    judgments: Judgments,
    first_line: FxHashMap<(String, String), u64>,
}

impl JudgmentBuilder {
    fn add(
        &mut self,
        source: &Path,
        line: u64,
        query: &str,
        doc: &str,
        grade: i32,
    ) -> Result<(), MetricsError> {
        match self.judgments.grade(query, doc) {
            Some(first_grade) if first_grade == grade => Ok(()),
            Some(first_grade) => {
                let first_line = self.first_line[&(query.to_owned(), doc.to_owned())];
                Err(parse_error(
                    source,
                    line,
                    ParseErrorKind::ConflictingJudgment {
                        query: query.to_owned(),
                        doc: doc.to_owned(),
                        first_grade,
                        first_line,
                    },
                ))
            }
            None => {
                self.judgments.insert(query, doc, grade);
                self.first_line
                    .insert((query.to_owned(), doc.to_owned()), line);
                Ok(())
            }
        }
    }
}

/// Reads a TREC qrels file (`QUERY_ID ITERATION DOC_ID GRADE` per line).
pub fn read_trec_qrels(path: impl AsRef<Path>) -> Result<Judgments, MetricsError> {
    let path = path.as_ref();
    parse_trec_qrels(open(path)?, path)
}

/// Parses TREC qrels from `reader`; `source` names it in errors.
pub fn parse_trec_qrels(
    reader: impl BufRead,
    source: impl AsRef<Path>,
) -> Result<Judgments, MetricsError> {
    let source = source.as_ref();
    let mut builder = JudgmentBuilder::default();
    for_each_line(reader, source, |line_no, line| {
        let fields: Vec<&str> = line.split_whitespace().collect();
        if fields.is_empty() {
            return Ok(());
        }
        let [query, _iteration, doc, grade] = fields[..] else {
            return Err(parse_error(
                source,
                line_no,
                ParseErrorKind::FieldCount {
                    expected: 4,
                    found: fields.len(),
                },
            ));
        };
        let grade: i32 = grade
            .parse()
            .map_err(|_| parse_error(source, line_no, ParseErrorKind::BadGrade(grade.into())))?;
        builder.add(source, line_no, query, doc, grade)
    })?;
    Ok(builder.judgments)
}

/// Reads a CSV judgments file with the columns `query_id,query,doc_id,relevance`; returns the
/// judgments and the query texts (in order of first appearance).
pub fn read_csv_judgments(path: impl AsRef<Path>) -> Result<(Judgments, Queries), MetricsError> {
    let path = path.as_ref();
    parse_csv_judgments(open(path)?, path)
}

/// Parses CSV judgments from `reader`; `source` names it in errors.
pub fn parse_csv_judgments(
    reader: impl Read,
    source: impl AsRef<Path>,
) -> Result<(Judgments, Queries), MetricsError> {
    let source = source.as_ref();
    let csv_error = |e: csv::Error| MetricsError::Csv {
        path: source.to_path_buf(),
        line: e.position().map(|p| p.line()),
        source: e,
    };
    let mut rdr = csv::ReaderBuilder::new()
        .has_headers(true)
        .trim(csv::Trim::All)
        .from_reader(reader);
    let headers = rdr.headers().map_err(csv_error)?.clone();
    if headers.is_empty() || (headers.len() == 1 && headers[0].is_empty()) {
        return Err(parse_error(source, 1, ParseErrorKind::MissingHeader));
    }
    let column = |name: &'static str| {
        headers
            .iter()
            .position(|h| h.trim_start_matches('\u{feff}').eq_ignore_ascii_case(name))
            .ok_or_else(|| parse_error(source, 1, ParseErrorKind::MissingColumn(name)))
    };
    let (qcol, tcol, dcol, rcol) = (
        column("query_id")?,
        column("query")?,
        column("doc_id")?,
        column("relevance")?,
    );

    let mut builder = JudgmentBuilder::default();
    let mut queries = Queries::new();
    let mut text_line: FxHashMap<String, u64> = FxHashMap::default();
    let mut record = csv::StringRecord::new();
    while rdr.read_record(&mut record).map_err(csv_error)? {
        let line = record.position().map_or(0, |p| p.line());
        let field = |i: usize, name: &'static str| match record.get(i) {
            Some(v) if !v.is_empty() => Ok(v),
            _ => Err(parse_error(source, line, ParseErrorKind::EmptyField(name))),
        };
        let query = field(qcol, "query_id")?;
        let doc = field(dcol, "doc_id")?;
        let grade_text = field(rcol, "relevance")?;
        let text = record.get(tcol).unwrap_or("");
        let grade: i32 = grade_text
            .parse()
            .map_err(|_| parse_error(source, line, ParseErrorKind::BadGrade(grade_text.into())))?;
        match queries.get(query) {
            Some(first) if first != text => {
                return Err(parse_error(
                    source,
                    line,
                    ParseErrorKind::ConflictingQueryText {
                        query: query.into(),
                        first_text: first.into(),
                        first_line: text_line[query],
                        text: text.into(),
                    },
                ));
            }
            Some(_) => {}
            None => {
                queries.insert(query, text);
                text_line.insert(query.into(), line);
            }
        }
        builder.add(source, line, query, doc, grade)?;
    }
    Ok((builder.judgments, queries))
}

/// Reads a queries file (`QUERY_ID<TAB>TEXT` per line).
pub fn read_queries(path: impl AsRef<Path>) -> Result<Queries, MetricsError> {
    let path = path.as_ref();
    parse_queries(open(path)?, path)
}

/// Parses a queries file from `reader`; `source` names it in errors.
pub fn parse_queries(
    reader: impl BufRead,
    source: impl AsRef<Path>,
) -> Result<Queries, MetricsError> {
    let source = source.as_ref();
    let mut queries = Queries::new();
    let mut lines: FxHashMap<String, u64> = FxHashMap::default();
    for_each_line(reader, source, |line_no, line| {
        if line.trim().is_empty() {
            return Ok(());
        }
        let Some((id, text)) = line.split_once('\t') else {
            return Err(parse_error(source, line_no, ParseErrorKind::MissingTab));
        };
        let id = id.trim();
        if id.is_empty() {
            return Err(parse_error(
                source,
                line_no,
                ParseErrorKind::EmptyField("query id"),
            ));
        }
        if let Some(&first_line) = lines.get(id) {
            return Err(parse_error(
                source,
                line_no,
                ParseErrorKind::DuplicateQuery {
                    query: id.into(),
                    first_line,
                },
            ));
        }
        lines.insert(id.into(), line_no);
        queries.insert(id, text.trim());
        Ok(())
    })?;
    Ok(queries)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parse_err(r: Result<impl std::fmt::Debug, MetricsError>) -> (u64, ParseErrorKind) {
        match r {
            Err(MetricsError::Parse { line, kind, .. }) => (line, kind),
            other => panic!("expected a parse error, got {other:?}"),
        }
    }

    #[test]
    fn reads_trec_qrels() {
        let text = "q1 0 d1 2\nq1 0 d2 0\n\n  q2\t0\td9\t-1  \r\nq1 1 d1 2\n";
        let j = parse_trec_qrels(text.as_bytes(), "x.qrels").unwrap();
        assert_eq!(j.num_queries(), 2);
        assert_eq!(j.num_judgments(), 3);
        assert_eq!(j.grade("q1", "d1"), Some(2));
        assert_eq!(j.grade("q1", "d2"), Some(0));
        assert_eq!(j.grade("q2", "d9"), Some(-1));
        assert_eq!(j.grade("q2", "d1"), None);
        assert_eq!(j.query("q1").unwrap().num_relevant(1), 1);
        assert_eq!(j.query_ids().collect::<Vec<_>>(), ["q1", "q2"]);
    }

    #[test]
    fn qrels_errors_name_file_and_line() {
        let e = parse_trec_qrels("q1 0 d1 1\nq1 0 d2\n".as_bytes(), "a.qrels").unwrap_err();
        assert_eq!(e.to_string(), "a.qrels:2: expected 4 fields, found 3");
        let (line, kind) = parse_err(parse_trec_qrels("q1 0 d1 x\n".as_bytes(), "a"));
        assert_eq!((line, kind), (1, ParseErrorKind::BadGrade("x".into())));
        let (line, kind) = parse_err(parse_trec_qrels(
            "q1 0 d1 1\nq2 0 d1 1\nq1 0 d1 2\n".as_bytes(),
            "a",
        ));
        assert_eq!(line, 3);
        assert_eq!(
            kind,
            ParseErrorKind::ConflictingJudgment {
                query: "q1".into(),
                doc: "d1".into(),
                first_grade: 1,
                first_line: 1
            }
        );
    }

    #[test]
    fn reads_csv_judgments() {
        let text = "query_id,query,doc_id,relevance\n\
                    q1,red shoes,d1,2\n\
                    q1,red shoes,d2,0\n\
                    q2,\"pram, folding\",d3,1\n";
        let (j, q) = parse_csv_judgments(text.as_bytes(), "j.csv").unwrap();
        assert_eq!(j.num_judgments(), 3);
        assert_eq!(j.grade("q2", "d3"), Some(1));
        assert_eq!(q.len(), 2);
        assert_eq!(q.get("q2"), Some("pram, folding"));
        assert_eq!(
            q.iter().map(|e| e.id.as_str()).collect::<Vec<_>>(),
            ["q1", "q2"]
        );
    }

    #[test]
    fn csv_columns_in_any_order() {
        let text = "relevance,doc_id,extra,query,query_id\n3,d1,zz,tram,q7\n";
        let (j, q) = parse_csv_judgments(text.as_bytes(), "j.csv").unwrap();
        assert_eq!(j.grade("q7", "d1"), Some(3));
        assert_eq!(q.get("q7"), Some("tram"));
    }

    #[test]
    fn csv_errors_name_file_and_line() {
        let e = parse_csv_judgments("query_id,doc_id,relevance\n".as_bytes(), "j.csv").unwrap_err();
        assert_eq!(
            e.to_string(),
            "j.csv:1: header has no \"query\" column (required: query_id, query, doc_id, relevance)"
        );
        let text = "query_id,query,doc_id,relevance\nq1,a,d1,1\nq1,a,d2,high\n";
        let (line, kind) = parse_err(parse_csv_judgments(text.as_bytes(), "j.csv"));
        assert_eq!((line, kind), (3, ParseErrorKind::BadGrade("high".into())));
        let text = "query_id,query,doc_id,relevance\nq1,a,d1,1\nq1,b,d2,1\n";
        let (line, kind) = parse_err(parse_csv_judgments(text.as_bytes(), "j.csv"));
        assert_eq!(line, 3);
        assert!(matches!(
            kind,
            ParseErrorKind::ConflictingQueryText { first_line: 2, .. }
        ));
        let text = "query_id,query,doc_id,relevance\nq1,a,,1\n";
        let (line, kind) = parse_err(parse_csv_judgments(text.as_bytes(), "j.csv"));
        assert_eq!((line, kind), (2, ParseErrorKind::EmptyField("doc_id")));
        let text = "query_id,query,doc_id,relevance\nq1,a,d1\n";
        let e = parse_csv_judgments(text.as_bytes(), "j.csv").unwrap_err();
        assert!(
            matches!(e, MetricsError::Csv { line: Some(2), .. }),
            "{e:?}"
        );
        assert!(e.to_string().starts_with("j.csv:2: "), "{e}");
    }

    #[test]
    fn reads_queries() {
        let text = "q1\tred shoes\n\nq2\t  pram\tfolding \r\n";
        let q = parse_queries(text.as_bytes(), "q.tsv").unwrap();
        assert_eq!(q.len(), 2);
        assert_eq!(q.get("q1"), Some("red shoes"));
        assert_eq!(q.get("q2"), Some("pram\tfolding"));
        let (line, kind) = parse_err(parse_queries("q1\ta\nq2 b\n".as_bytes(), "q"));
        assert_eq!((line, kind), (2, ParseErrorKind::MissingTab));
        let (line, kind) = parse_err(parse_queries("q1\ta\nq1\tb\n".as_bytes(), "q"));
        assert_eq!(
            (line, kind),
            (
                2,
                ParseErrorKind::DuplicateQuery {
                    query: "q1".into(),
                    first_line: 1
                }
            )
        );
    }

    #[test]
    fn missing_file_is_an_io_error() {
        let e = read_trec_qrels("/nonexistent/x.qrels").unwrap_err();
        assert!(matches!(e, MetricsError::Io { .. }));
        assert!(e.to_string().contains("/nonexistent/x.qrels"));
    }
}
