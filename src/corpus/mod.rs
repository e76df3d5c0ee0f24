//! The one input layer: documents, query logs, judgments and the judged queries' texts,
//! read the same way by every command. Formats are read from the content (or given),
//! never guessed from a file name; every problem names its file and line; a named field
//! that no document has, an input with nothing in it and a count that does not fit are
//! errors, and a field few documents have is a warning the caller shows.

mod directory;
mod documents;
mod error;
mod fields;
mod format;
mod judged;
mod queries;
mod stream;
pub mod vocabulary;

pub use documents::{
    Corpus, DocOptions, Document, FieldSpec, Sample, read_documents, read_documents_without_texts,
};
pub use error::{CorpusError, FieldRole};
pub use fields::CorpusWarning;
pub use format::{DocumentFormat, QueryFormat};
pub use judged::{JudgmentFormat, read_judgments};
pub use queries::{QueryEntry, QueryLog, read_queries, read_queries_as};
pub use stream::{Walk, for_each_document, for_each_in_memory};
pub use vocabulary::{DocumentCounts, FormStats, Vocabulary, VocabularySummary};
