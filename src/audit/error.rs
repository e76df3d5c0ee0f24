//! Errors of the audit: a missing WordNet, a malformed concept-group file.

use std::path::PathBuf;

#[derive(Debug, thiserror::Error)]
pub enum AuditError {
    #[error(
        "cannot read {path}: {source}\n  help: install the WordNet 3.0 data (Debian: apt-get install wordnet-base), or give the directory that holds its dict files"
    )]
    WordNet {
        path: PathBuf,
        #[source]
        source: std::io::Error,
    },
    #[error(transparent)]
    Exceptions(#[from] crate::import::wordnet::ImportError),
    #[error("cannot read {path}: {source}")]
    Io {
        path: PathBuf,
        #[source]
        source: std::io::Error,
    },
    #[error("{path}: {message}")]
    Groups { path: PathBuf, message: String },
    #[error(transparent)]
    Rules(#[from] crate::rules::RulesError),
    #[error("no shown group has the key {0:?}")]
    UnknownGroup(String),
    #[error("no verified suggestion to write")]
    NoSuggestion,
}
