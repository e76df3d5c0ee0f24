//! Stage 7: the language's Snowball stemmer (rust-stemmers), or none.
//!
//! This is the only stemmer lexdelta runs, in every path — the tantivy adapter included —
//! so a preview and production can never disagree about a stem.

use std::borrow::Cow;

use rust_stemmers::{Algorithm, Stemmer};

use crate::rules::Language;

pub struct Stem {
    language: Language,
    stemmer: Stemmer,
}

impl std::fmt::Debug for Stem {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "Stem({})", self.language.name())
    }
}

impl Clone for Stem {
    fn clone(&self) -> Self {
        Stem::new(self.language)
    }
}

impl Stem {
    pub fn new(language: Language) -> Self {
        Stem {
            language,
            stemmer: Stemmer::create(algorithm(language)),
        }
    }

    pub fn language(&self) -> Language {
        self.language
    }

    pub fn stem<'a>(&self, form: &'a str) -> Cow<'a, str> {
        self.stemmer.stem(form)
    }
}

fn algorithm(language: Language) -> Algorithm {
    match language {
        Language::Arabic => Algorithm::Arabic,
        Language::Danish => Algorithm::Danish,
        Language::Dutch => Algorithm::Dutch,
        Language::English => Algorithm::English,
        Language::Finnish => Algorithm::Finnish,
        Language::French => Algorithm::French,
        Language::German => Algorithm::German,
        Language::Greek => Algorithm::Greek,
        Language::Hungarian => Algorithm::Hungarian,
        Language::Italian => Algorithm::Italian,
        Language::Norwegian => Algorithm::Norwegian,
        Language::Portuguese => Algorithm::Portuguese,
        Language::Romanian => Algorithm::Romanian,
        Language::Russian => Algorithm::Russian,
        Language::Spanish => Algorithm::Spanish,
        Language::Swedish => Algorithm::Swedish,
        Language::Tamil => Algorithm::Tamil,
        Language::Turkish => Algorithm::Turkish,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn english_snowball_keeps_university_and_universe_together() {
        // The reason lexdelta owns this stage: Snowball English gives "univers" for both.
        let s = Stem::new(Language::English);
        assert_eq!(s.stem("university"), "univers");
        assert_eq!(s.stem("universe"), "univers");
    }
}
