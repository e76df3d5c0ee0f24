//! Stage 3: fold accents — NFKD decomposition with combining marks removed.

use std::borrow::Cow;

use unicode_normalization::UnicodeNormalization;
use unicode_normalization::char::is_combining_mark;

/// Folds accents, borrowing when the text is plain ASCII (nothing to fold).
pub fn fold_accents(text: &str) -> Cow<'_, str> {
    if text.is_ascii() {
        Cow::Borrowed(text)
    } else {
        Cow::Owned(text.nfkd().filter(|c| !is_combining_mark(*c)).collect())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn accents_go_and_compatibility_forms_decompose() {
        assert_eq!(fold_accents("café"), "cafe");
        assert_eq!(fold_accents("naïve"), "naive");
        assert_eq!(fold_accents("ﬁ"), "fi");
        assert_eq!(fold_accents("plain"), "plain");
    }
}
