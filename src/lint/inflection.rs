//! Telling a plain inflection ("bikes" for "bike") from a different word that happens to
//! share a stem ("university" for "universal").
//!
//! A rule written about "bike" is meant to fire for "bikes"; that it also fires for an
//! unrelated word is the hazard `stem-side-effect` reports. The stemmer cannot tell the two
//! apart — it made them share a key — so this module undoes only the regular inflectional
//! endings (plural and possessive `-s`, `-es`, `-ies`; `-ed`, `-ied`; `-ing`, with e-drop
//! and consonant doubling) and calls two forms one word when they reach a common base.
//! Derivational endings (`-al`, `-ity`, `-ion`, `-ible`) are left alone on purpose: words
//! made with them usually mean something else.
//!
//! Only English has endings here. For any other language (or none), two different forms
//! are never called one word, so every other form sharing a key is reported.

use crate::rules::Language;

/// Whether `a` and `b` are inflections of one word in `language`.
pub fn same_word(language: Option<Language>, a: &str, b: &str) -> bool {
    Inflections::of(language, a).includes(b)
}

/// A candidate base: a prefix of the form plus an optional restored letter ("chang" + "e"),
/// kept as two slices so comparing bases allocates nothing — lint compares every rule word
/// with every form that shares its key.
#[derive(Clone, Copy, Debug)]
struct Base<'a> {
    stem: &'a str,
    tail: &'static str,
}

impl PartialEq for Base<'_> {
    fn eq(&self, other: &Self) -> bool {
        self.stem.len() + self.tail.len() == other.stem.len() + other.tail.len()
            && self
                .stem
                .bytes()
                .chain(self.tail.bytes())
                .eq(other.stem.bytes().chain(other.tail.bytes()))
    }
}

/// One word's possible bases, computed once to compare it with many forms.
#[derive(Clone, Debug)]
pub struct Inflections<'a> {
    language: Option<Language>,
    word: &'a str,
    bases: Vec<Base<'a>>,
}

impl<'a> Inflections<'a> {
    pub fn of(language: Option<Language>, word: &'a str) -> Self {
        let mut bases = Vec::new();
        if language == Some(Language::English) {
            english_bases(word, &mut bases);
        }
        Inflections {
            language,
            word,
            bases,
        }
    }

    /// Whether `form` is an inflection of this word.
    pub fn includes(&self, form: &str) -> bool {
        if form == self.word {
            return true;
        }
        if self.language != Some(Language::English) {
            return false;
        }
        let mut theirs = Vec::with_capacity(8);
        english_bases(form, &mut theirs);
        theirs.iter().any(|b| self.bases.contains(b))
    }
}

/// The form itself and every base a regular English ending could have been added to.
fn english_bases<'a>(form: &'a str, out: &mut Vec<Base<'a>>) {
    let mut add = |stem: &'a str, tail: &'static str| {
        let base = Base { stem, tail };
        // Very short bases are too easy to reach by accident ("bus" → "bu").
        if stem.chars().count() + tail.len() >= 2 && !out.contains(&base) {
            out.push(base);
        }
    };
    add(form, "");
    if let Some(stem) = form.strip_suffix("'s") {
        add(stem, "");
    }
    if let Some(stem) = form
        .strip_suffix("ies")
        .or_else(|| form.strip_suffix("ied"))
    {
        add(stem, "y");
    }
    if let Some(stem) = form.strip_suffix("es") {
        add(stem, "");
    }
    if let Some(stem) = form.strip_suffix('s')
        && !stem.ends_with('s')
    {
        add(stem, "");
    }
    for ending in ["ed", "ing"] {
        if let Some(stem) = form.strip_suffix(ending) {
            add(stem, "");
            add(stem, "e");
            if let Some(single) = undouble(stem) {
                add(single, "");
            }
        }
    }
}

/// "stopp" → "stop", "travell" → "travel": the consonant doubled before an ending.
fn undouble(stem: &str) -> Option<&str> {
    let mut chars = stem.chars().rev();
    let (last, before) = (chars.next()?, chars.next()?);
    let doubled = last == before && last.is_alphabetic() && !"aeiouy".contains(last);
    doubled.then(|| &stem[..stem.len() - last.len_utf8()])
}

#[cfg(test)]
mod tests {
    use super::*;

    const EN: Option<Language> = Some(Language::English);

    #[test]
    fn regular_endings_are_one_word() {
        for (a, b) in [
            ("bike", "bikes"),
            ("change", "changing"),
            ("change", "changed"),
            ("travelling", "traveling"),
            ("travel", "travelled"),
            ("bus", "buses"),
            ("city", "cities"),
            ("stop", "stopped"),
            ("rider", "rider's"),
        ] {
            assert!(same_word(EN, a, b), "{a} / {b}");
            assert!(same_word(EN, b, a), "{b} / {a}");
        }
    }

    #[test]
    fn derived_and_irregular_words_are_not() {
        for (a, b) in [
            ("universal", "university"),
            ("accessible", "access"),
            ("connection", "connect"),
            ("left", "leave"),
            ("light", "lit"),
        ] {
            assert!(!same_word(EN, a, b), "{a} / {b}");
        }
        assert!(!same_word(Some(Language::German), "bike", "bikes"));
        assert!(same_word(None, "x", "x"));
    }
}
