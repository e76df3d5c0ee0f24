//! Stage 2: lowercase (Unicode), unless the ruleset keeps case.

use std::borrow::Cow;

/// Lowercases, borrowing when the text is already lowercase (the common case).
pub fn lowercase(text: &str) -> Cow<'_, str> {
    if text.chars().any(char::is_uppercase) {
        Cow::Owned(text.to_lowercase())
    } else {
        Cow::Borrowed(text)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn unicode_lowercase() {
        assert_eq!(lowercase("ÉCOLE"), "école");
        assert!(matches!(lowercase("already"), Cow::Borrowed(_)));
    }
}
