//! Each ruleset's view of the surface index: every surface form keyed once, the change
//! reduced to what it touches, and the conflation groups with their statistics.

use std::sync::Arc;

use super::change::ChangeSet;
use super::keys::{self, ConflatedKeys, FormKeys};
use super::retrieve::{Scoring, Stats};
use crate::analysis::Analyzer;
use crate::index::{IndexError, IndexPostings, SurfaceForms};

/// Both sides' keys of every surface form, and the change they make.
pub(super) struct KeyedSides {
    pub forms_base: Arc<SurfaceForms>,
    /// The head's own surface forms, when it has its own index.
    pub forms_head: Option<Arc<SurfaceForms>>,
    pub keys_base: FormKeys,
    pub keys_head: FormKeys,
    pub change: ChangeSet,
}

impl KeyedSides {
    /// Keys every surface form once per side (shared stemming where the rules allow, the
    /// stems themselves kept beside the index); the change set and the conflation groups
    /// share those keys.
    pub fn compute(
        base: &Analyzer,
        head: &Analyzer,
        base_postings: &IndexPostings,
        head_postings: Option<&IndexPostings>,
    ) -> Result<KeyedSides, IndexError> {
        let forms_base = base_postings.surface_forms()?;
        let forms_head = head_postings.map(|p| p.surface_forms()).transpose()?;
        let stems_base = keys::stems(base_postings, &forms_base, base)?;
        let (keys_base, keys_head) = match (head_postings, &forms_head) {
            (Some(postings), Some(forms)) => {
                let stems_head = keys::stems(postings, forms, head)?;
                rayon::join(
                    || FormKeys::compute(base, &forms_base, stems_base.as_deref()),
                    || FormKeys::compute(head, forms, stems_head.as_deref()),
                )
            }
            _ => FormKeys::compute_pair(base, head, &forms_base, stems_base.as_deref()),
        };
        let same_surface = forms_head.is_none();
        let change = ChangeSet::from_keys(
            base,
            head,
            same_surface.then_some((&*forms_base, (&keys_base, &keys_head))),
        );
        Ok(KeyedSides {
            forms_base,
            forms_head,
            keys_base,
            keys_head,
            change,
        })
    }
}

/// A ruleset's view of the index: its conflation groups and their statistics.
pub(super) struct View<'a> {
    pub keys: ConflatedKeys<'a>,
    pub stats: Stats,
}

impl<'a> View<'a> {
    fn new(
        postings: &'a IndexPostings,
        forms: &'a SurfaceForms,
        form_keys: &'a FormKeys,
        scoring: &Scoring,
    ) -> Result<View<'a>, IndexError> {
        let lengths = keys::lengths_without_stopwords(postings, forms, form_keys)?;
        let keys = ConflatedKeys::new(postings, forms, form_keys, lengths);
        let stats = Stats::compute(&keys, scoring)?;
        Ok(View { keys, stats })
    }

    /// The base's view.
    pub fn base(
        keyed: &'a KeyedSides,
        postings: &'a IndexPostings,
        scoring: &Scoring,
    ) -> Result<View<'a>, IndexError> {
        View::new(postings, &keyed.forms_base, &keyed.keys_base, scoring)
    }

    /// The head's view, or `None` when every form keeps its key over one index (a synonym
    /// edit, say): the head then sees the index exactly as the base does, and one view
    /// serves both, its unions merged once.
    pub fn head(
        keyed: &'a KeyedSides,
        base_view: &'a View<'a>,
        base_postings: &'a IndexPostings,
        head_postings: Option<&'a IndexPostings>,
        scoring: &Scoring,
    ) -> Result<Option<View<'a>>, IndexError> {
        let Some(forms_head) = &keyed.forms_head else {
            if keyed.keys_base == keyed.keys_head {
                return Ok(None);
            }
            let view = View::new(base_postings, &keyed.forms_base, &keyed.keys_head, scoring)?;
            // Over one index, a key whose members did not change is merged once, by the base.
            return Ok(Some(View {
                keys: view
                    .keys
                    .sharing(&base_view.keys, &keyed.change.affected_keys),
                stats: view.stats,
            }));
        };
        let postings = head_postings.unwrap_or(base_postings);
        View::new(postings, forms_head, &keyed.keys_head, scoring).map(Some)
    }
}

/// One side as the evaluation reads it.
pub(super) struct Side<'a> {
    pub analyzer: &'a Analyzer,
    pub keys: &'a ConflatedKeys<'a>,
    pub stats: &'a Stats,
}

impl<'a> Side<'a> {
    /// Both sides; equal statistics (the same lengths, hence the same norms) are shared,
    /// which lets `matches_both` score a clause both sides share once for both.
    pub fn pair(
        (base, head): (&'a Analyzer, &'a Analyzer),
        base_view: &'a View<'a>,
        head_view: &'a View<'a>,
    ) -> (Side<'a>, Side<'a>) {
        let head_stats = if head_view.stats == base_view.stats {
            &base_view.stats
        } else {
            &head_view.stats
        };
        (
            Side {
                analyzer: base,
                keys: &base_view.keys,
                stats: &base_view.stats,
            },
            Side {
                analyzer: head,
                keys: &head_view.keys,
                stats: head_stats,
            },
        )
    }
}
