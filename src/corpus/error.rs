//! Errors of the corpus readers: always with the file, and the line when there is one.

use std::fmt;
use std::path::PathBuf;

use serde::Serialize;

/// What a named field is for.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum FieldRole {
    /// The document id.
    Id,
    /// The title shown in reports.
    Title,
    /// A field that is searched (and counted into vocabularies).
    Searched,
}

impl fmt::Display for FieldRole {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            FieldRole::Id => "id field",
            FieldRole::Title => "title field",
            FieldRole::Searched => "searched field",
        })
    }
}

#[derive(Debug, thiserror::Error)]
pub enum CorpusError {
    #[error("cannot read {path}: {source}")]
    Io {
        path: PathBuf,
        #[source]
        source: std::io::Error,
    },
    #[error("{path}:{line}: {message}")]
    Parse {
        path: PathBuf,
        line: usize,
        message: String,
    },
    #[error("{path}: {message}")]
    Invalid { path: PathBuf, message: String },
    /// Nothing to read: a preview, a vocabulary or a log over nothing would say nothing.
    #[error("{path}: no {what}: {why}")]
    Empty {
        path: PathBuf,
        /// `documents` or `queries`.
        what: &'static str,
        why: String,
    },
    /// A field named in the options that no document has.
    #[error("{path}: no document has the {role} `{name}`; {}", available_fields(.available, .suggestion))]
    UnknownField {
        path: PathBuf,
        role: FieldRole,
        name: String,
        /// Every field some document has, sorted.
        available: Vec<String>,
        /// The closest of `available`, when one is close.
        suggestion: Option<String>,
    },
    /// A document without the id field, when others have it.
    #[error("{path}:{line}: no `{field}` field, which every document needs as its id")]
    MissingId {
        path: PathBuf,
        line: usize,
        field: String,
    },
    /// A tab-separated query log whose lines do not end in counts.
    #[error(
        "{path}:{line}: the line has a tab but its last field {last_field:?} is not a count, so \
         the query format is unclear: `ids` reads id<TAB>text lines, `lines` reads each line as \
         one query (or make every line query<TAB>count)"
    )]
    AmbiguousQueries {
        path: PathBuf,
        line: usize,
        last_field: String,
    },
    /// Judgments in TREC qrels name their queries by id only.
    #[error("{path}: TREC qrels name queries by id; the text of each judged query is needed too")]
    QrelsWithoutTexts { path: PathBuf },
    #[error(transparent)]
    Judgments(#[from] crate::metrics::MetricsError),
}

fn available_fields(available: &[String], suggestion: &Option<String>) -> String {
    let list = if available.is_empty() {
        "the documents have no fields at all".to_string()
    } else {
        format!(
            "the documents have {}",
            available
                .iter()
                .map(|f| format!("`{f}`"))
                .collect::<Vec<_>>()
                .join(", ")
        )
    };
    match suggestion {
        Some(s) => format!("{list}; did you mean `{s}`?"),
        None => list,
    }
}
