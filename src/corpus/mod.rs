//! Reading what a preview runs on: documents, query logs (judgments are in
//! [`crate::metrics`]). Every reader reports problems with file and line.

mod documents;
mod error;
mod queries;
mod stream;

pub use documents::{
    Corpus, DocOptions, Document, FieldSpec, Sample, read_documents, read_documents_without_texts,
};
pub use error::CorpusError;
pub use queries::{QueryEntry, QueryLog, read_queries};
pub use stream::{for_each_document, for_each_in_memory};
