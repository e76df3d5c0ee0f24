//! Stage 4: a surface form on the stopword list is dropped (its position stays taken).

use rustc_hash::FxHashSet;

#[derive(Clone, Debug, Default)]
pub struct Stopwords {
    forms: FxHashSet<String>,
}

impl Stopwords {
    pub fn new(forms: impl IntoIterator<Item = String>) -> Self {
        Stopwords {
            forms: forms.into_iter().collect(),
        }
    }

    pub fn is_stopword(&self, form: &str) -> bool {
        self.forms.contains(form)
    }

    pub fn len(&self) -> usize {
        self.forms.len()
    }

    pub fn is_empty(&self) -> bool {
        self.forms.is_empty()
    }
}
