//! Bringing published irregular-form lists in as lemma overrides.
//!
//! The result is a new rule file, written atomically and never over an existing file
//! without `--force`. Entries that name several base forms for one inflected form are
//! not guessed at: they are skipped and listed.

pub mod wordnet;

pub use wordnet::{ExceptionList, ImportOptions, ImportResult, PartOfSpeech};
