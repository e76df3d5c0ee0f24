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
    if a == b {
        return true;
    }
    match language {
        Some(Language::English) => {
            let left = english_bases(a);
            english_bases(b).iter().any(|x| left.contains(x))
        }
        _ => false,
    }
}

/// The form itself and every base a regular English ending could have been added to.
fn english_bases(form: &str) -> Vec<String> {
    let mut out = vec![form.to_string()];
    let mut add = |base: &str| {
        // Very short bases are too easy to reach by accident ("bus" → "bu").
        if base.chars().count() >= 2 && !out.iter().any(|b| b == base) {
            out.push(base.to_string());
        }
    };
    if let Some(stem) = form.strip_suffix("'s") {
        add(stem);
    }
    if let Some(stem) = form
        .strip_suffix("ies")
        .or_else(|| form.strip_suffix("ied"))
    {
        add(&format!("{stem}y"));
    }
    if let Some(stem) = form.strip_suffix("es") {
        add(stem);
    }
    if let Some(stem) = form.strip_suffix('s')
        && !stem.ends_with('s')
    {
        add(stem);
    }
    for ending in ["ed", "ing"] {
        if let Some(stem) = form.strip_suffix(ending) {
            add(stem);
            add(&format!("{stem}e"));
            if let Some(single) = undouble(stem) {
                add(single);
            }
        }
    }
    out
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
