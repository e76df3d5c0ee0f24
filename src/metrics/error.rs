//! The error type of the metrics module.

use std::path::PathBuf;

/// Everything that can go wrong while reading judgments, queries or runs, or while
/// evaluating and comparing them.
#[derive(Debug, thiserror::Error)]
#[non_exhaustive]
pub enum MetricsError {
    /// A file could not be opened or read.
    #[error("cannot read {}: {source}", path.display())]
    Io {
        /// The file.
        path: PathBuf,
        /// The underlying error.
        source: std::io::Error,
    },

    /// A line of an input file is malformed. `line` is 1-based.
    #[error("{}:{line}: {kind}", path.display())]
    Parse {
        /// The file (or the source name given to a `parse_*` function).
        path: PathBuf,
        /// The 1-based line number.
        line: u64,
        /// What is wrong with the line.
        kind: ParseErrorKind,
    },

    /// The CSV reader itself failed (bad quoting, invalid UTF-8, unequal field counts...).
    #[error("{}{}: {source}", path.display(), line.map(|l| format!(":{l}")).unwrap_or_default())]
    Csv {
        /// The file.
        path: PathBuf,
        /// The 1-based line number, when the CSV reader knows it.
        line: Option<u64>,
        /// The underlying error.
        source: csv::Error,
    },

    /// A parameter is out of its valid range.
    #[error("invalid {name}: {message}")]
    InvalidParameter {
        /// The parameter's name.
        name: &'static str,
        /// Why the value is rejected.
        message: String,
    },

    /// A metric name could not be parsed.
    #[error(
        "unknown metric {0:?} (expected e.g. P@10, R@10, F1@10, RR, RR@10, AP, AP@100, nDCG, nDCG@10, JudgedShare@10)"
    )]
    UnknownMetric(String),

    /// The same query appeared twice among the rankings given to `evaluate`.
    #[error("query {0:?} has more than one ranking")]
    DuplicateRanking(String),

    /// Two score lists that must be paired have different lengths.
    #[error("paired score lists differ in length: {before} before, {after} after")]
    LengthMismatch {
        /// Length of the first list.
        before: usize,
        /// Length of the second list.
        after: usize,
    },

    /// A score is NaN or infinite.
    #[error("score {index} is not a finite number")]
    NonFiniteScore {
        /// Position of the offending score.
        index: usize,
    },

    /// Two metric sets cannot be compared: they were evaluated over different queries,
    /// different metrics or different parameters.
    #[error("metric sets cannot be compared: {0}")]
    Incomparable(String),
}

/// What is wrong with one line of an input file.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[non_exhaustive]
pub enum ParseErrorKind {
    /// The line has the wrong number of whitespace-separated fields.
    #[error("expected {expected} fields, found {found}")]
    FieldCount {
        /// How many fields the format has.
        expected: usize,
        /// How many the line has.
        found: usize,
    },
    /// A relevance grade is not an integer.
    #[error("relevance grade {0:?} is not an integer")]
    BadGrade(String),
    /// A retrieval score is not a finite number.
    #[error("score {0:?} is not a finite number")]
    BadScore(String),
    /// The same (query, document) pair was judged twice with different grades.
    #[error(
        "document {doc:?} of query {query:?} was already judged {first_grade} on line {first_line}"
    )]
    ConflictingJudgment {
        /// The query id.
        query: String,
        /// The document id.
        doc: String,
        /// The grade given first.
        first_grade: i32,
        /// Where it was given.
        first_line: u64,
    },
    /// The same document appears twice in one query's ranking of a run file.
    #[error("document {doc:?} appears twice for query {query:?} (first on line {first_line})")]
    DuplicateResult {
        /// The query id.
        query: String,
        /// The document id.
        doc: String,
        /// Where it first appeared.
        first_line: u64,
    },
    /// A query id is defined twice in a queries file.
    #[error("query {query:?} is already defined on line {first_line}")]
    DuplicateQuery {
        /// The query id.
        query: String,
        /// Where it was first defined.
        first_line: u64,
    },
    /// The same query id carries two different texts in a CSV judgments file.
    #[error("query {query:?} has text {first_text:?} on line {first_line}, not {text:?}")]
    ConflictingQueryText {
        /// The query id.
        query: String,
        /// The text seen first.
        first_text: String,
        /// Where it was seen.
        first_line: u64,
        /// The text on this line.
        text: String,
    },
    /// A queries-file line has no tab between the id and the text.
    #[error("expected QUERY_ID<TAB>TEXT, found no tab")]
    MissingTab,
    /// A required field is empty.
    #[error("empty {0}")]
    EmptyField(&'static str),
    /// The CSV header lacks a required column.
    #[error("header has no {0:?} column (required: query_id, query, doc_id, relevance)")]
    MissingColumn(&'static str),
    /// The file has no header line.
    #[error("missing header line")]
    MissingHeader,
}
