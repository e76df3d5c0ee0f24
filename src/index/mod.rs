//! The sample index: a tantivy index of the corpus's **surface forms** (steps 1–3 of the
//! normalization contract, positions kept), built once and cached on disk.
//!
//! One surface index serves every ruleset that shares its surface settings: a ruleset's
//! view of it is a map from surface form to key ([`crate::preview`] builds it). The same
//! schema also holds **key indexes** (built with [`KeyTokenizer::keys`]), which the slow
//! reference path and the naive benchmark use.
//!
//! Schema: one text field per searched field (`f0`, `f1`, … in [`Corpus::fields`] order,
//! with frequencies and positions), a fast field `ord` (the document's index in
//! [`Corpus::documents`]) and a fast field `len{i}` per text field (the number of tokens
//! the field holds in that index).
//!
//! Beside a cached index lie values derived from it, computed on first use and checked
//! when read back: the surface forms, stems, stopword-free lengths and id order (see
//! `sidecar.rs` for how they are written and trusted).
//!
//! [`KeyTokenizer::keys`]: crate::analysis::tantivy::KeyTokenizer::keys
//! [`Corpus::fields`]: crate::corpus::Corpus::fields
//! [`Corpus::documents`]: crate::corpus::Corpus::documents

mod build;
mod cache;
mod forms;
mod reader;
mod sidecar;

pub use build::{build_key_index, build_surface_index};
pub use cache::{
    CacheStatus, FORMAT_VERSION, Opened, Verify, default_verify, open_or_build,
    open_or_build_checked, set_default_verify,
};
pub use forms::SurfaceForms;
pub use reader::{Frequencies, IndexPostings, Postings, ReadCache};

/// Why an index could not be built, opened or read.
#[derive(Debug, thiserror::Error)]
pub enum IndexError {
    #[error("index error: {0}")]
    Tantivy(#[from] tantivy::TantivyError),
    /// The corpus was read without its texts (the cache was expected to hold the index).
    #[error("the documents were read without their texts, so no index can be built from them")]
    NoTexts,
    #[error("cannot use the cache at {path}: {source}")]
    Io {
        path: String,
        #[source]
        source: std::io::Error,
    },
}

impl From<std::io::Error> for IndexError {
    fn from(source: std::io::Error) -> Self {
        IndexError::Io {
            path: "index".into(),
            source,
        }
    }
}

/// Reports the progress of a long build. The CLI passes a progress bar; the library never
/// prints.
pub trait Progress {
    fn begin(&self, total: u64, what: &str);
    fn advance(&self, n: u64);
    fn finish(&self);
    /// Something the user should hear about that does not stop the run (a damaged cache
    /// rebuilt). Ignored unless the implementation shows it.
    fn notice(&self, _message: &str) {}
}

/// Reports nothing.
pub struct NoProgress;

impl Progress for NoProgress {
    fn begin(&self, _: u64, _: &str) {}
    fn advance(&self, _: u64) {}
    fn finish(&self) {}
}
