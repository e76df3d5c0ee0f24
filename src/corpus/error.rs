//! Errors of the corpus readers: always with the file, and the line when there is one.

use std::path::PathBuf;

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
}
