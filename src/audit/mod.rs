//! Auditing a ruleset against a corpus: conflation groups that merge unrelated words
//! ([`collisions`]), exemptions and lemma overrides that would split them ([`suggest`]),
//! and Paice's stemmer error indices against concept groups ([`stemcheck`]).
//!
//! Word meaning comes from WordNet 3.0 through its published `morphy` algorithm
//! ([`morphy`]): two forms whose base forms differ are taken to mean different things.

pub mod collisions;
pub mod concepts;
pub mod effect;
mod error;
pub mod morphy;
pub mod postings;
pub mod report;
pub mod stemcheck;
pub mod suggest;

pub use error::AuditError;
