//! The input options every command that reads a corpus or a query log shares, defined
//! once: `--corpus`, `--field`, `--id-field`, `--title-field`, `--queries`,
//! `--queries-format`. Reading is the library's ([`lexdelta::corpus`]); here the options
//! become its settings, and its errors get the option that fixes them.

use std::path::{Path, PathBuf};

use lexdelta::corpus::{
    CorpusError, CorpusWarning, DocOptions, FieldRole, FieldSpec, QueryFormat, QueryLog, Sample,
    read_queries_as,
};

use super::CliError;

/// The documents and which of their fields to read.
#[derive(Debug, Clone, clap::Args)]
pub struct CorpusArgs {
    /// Documents: JSON Lines, CSV with a header, or a directory of .txt/.md files (whose
    /// fields are `id`, the path; `title`, the first line; `body`, the rest). The format is
    /// read from the content.
    #[arg(long, value_name = "PATH")]
    pub corpus: Option<PathBuf>,
    /// A searched field with its weight, `name` or `name^weight`; repeat for several.
    #[arg(long = "field", value_name = "NAME[^W]", default_values = ["title^2", "body"])]
    pub fields: Vec<String>,
    /// The document id field.
    #[arg(long, value_name = "NAME", default_value = "id")]
    pub id_field: String,
    /// The field shown as a document's title [default: `title`, when the documents have
    /// one].
    #[arg(long, value_name = "NAME")]
    pub title_field: Option<String>,
}

impl CorpusArgs {
    /// The reader's settings for these options, with a sample of the documents.
    pub fn doc_options(&self, sample: Option<Sample>, seed: u64) -> Result<DocOptions, CliError> {
        let fields = self
            .fields
            .iter()
            .map(|f| FieldSpec::parse(f).map_err(|e| usage(format!("--field {f:?}: {e}"))))
            .collect::<Result<Vec<_>, _>>()?;
        Ok(DocOptions {
            id_field: self.id_field.clone(),
            title_field: self.title_field.clone(),
            fields,
            sample,
            seed,
        })
    }

    /// The corpus path, which this command needs.
    pub fn required(&self, why: &str) -> Result<&Path, CliError> {
        self.corpus
            .as_deref()
            .ok_or_else(|| usage(format!("--corpus is required {why}")))
    }
}

/// A query log and its format.
#[derive(Debug, Clone, clap::Args)]
pub struct QueryArgs {
    /// A query log: JSON Lines `{"query": ..., "count": ..., "clicks": {...}}`, one query
    /// per line, or `query<TAB>count`; the format is read from the content unless
    /// --queries-format gives it.
    #[arg(long, value_name = "FILE")]
    pub queries: Option<PathBuf>,
    /// The query log's format: jsonl, lines, counts (query<TAB>count) or ids (id<TAB>text,
    /// each searched once), for a file whose content does not tell.
    #[arg(long, value_name = "FORMAT", value_parser = parse_query_format, requires = "queries")]
    pub queries_format: Option<QueryFormat>,
}

impl QueryArgs {
    /// Reads the query log at `path` in the given format (or the one its content shows).
    pub fn read(&self, path: &Path) -> Result<QueryLog, CliError> {
        read_queries_as(path, self.queries_format).map_err(input_error)
    }

    /// Reads the query log, when one is given.
    pub fn read_given(&self) -> Result<Option<QueryLog>, CliError> {
        self.queries.as_deref().map(|p| self.read(p)).transpose()
    }
}

fn parse_query_format(text: &str) -> Result<QueryFormat, String> {
    text.parse()
}

fn usage(message: String) -> CliError {
    CliError(message, false)
}

/// A reader's error with the option that addresses it, where one does.
pub fn input_error(err: CorpusError) -> CliError {
    let hint = match &err {
        CorpusError::UnknownField { role, .. } => Some(match role {
            FieldRole::Id => "choose the id field with --id-field",
            FieldRole::Title => "choose the title field with --title-field",
            FieldRole::Searched => "choose the searched fields with --field (repeatable)",
        }),
        CorpusError::AmbiguousQueries { .. } => {
            Some("pass --queries-format ids or --queries-format lines")
        }
        CorpusError::QrelsWithoutTexts { .. } => {
            Some("pass --judged-queries with a QID<TAB>text line per judged query")
        }
        CorpusError::MissingId { .. } => Some("choose the id field with --id-field"),
        _ => None,
    };
    let mut cli = CliError::from(err);
    if let Some(hint) = hint {
        cli.0.push_str(&format!("\n  help: {hint}"));
    }
    cli
}

/// Shows the reader's warnings on stderr.
pub fn warn(warnings: &[CorpusWarning]) {
    for w in warnings {
        eprintln!("lexdelta: warning: {w}");
    }
}

/// A number option that must be finite (clap's parser, so a bad one is a usage error).
pub fn finite(text: &str) -> Result<f64, String> {
    match text.trim().parse::<f64>() {
        Ok(v) if v.is_finite() => Ok(v),
        Ok(_) => Err("must be a finite number".into()),
        Err(e) => Err(e.to_string()),
    }
}
