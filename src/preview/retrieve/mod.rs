//! Retrieval and scoring over a [`KeySource`]: the same code serves the fast path and the
//! reference path, so the two can differ only in the postings they are given.
//!
//! One job per module: the scoring model (`scoring`), the ranking and its tie order
//! (`order`), sorted-list algebra (`lists`), a query's clauses as postings (`clauses`), the
//! every-clause candidate filter (`candidates`), and retrieval for one side (`one_side`) or
//! for both sides of a change at once (`two_sides`).

mod candidates;
mod clauses;
mod lists;
mod one_side;
mod order;
mod scoring;
#[cfg(test)]
mod test_support;
mod two_sides;

use scoring::FieldScore;

pub use one_side::{matches, matches_into, retrieve};
pub use order::{DocOrder, rank, top_hits};
pub use scoring::{Hit, MatchMode, Ranking, Scoring, Stats};
pub use two_sides::{SideQuery, matches_both};

#[cfg(doc)]
use super::keys::KeySource;
