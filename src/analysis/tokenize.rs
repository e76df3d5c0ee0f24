//! Stage 1: tokenize. Unicode word boundaries (UAX #29) by default, or the ruleset's regex.
//! Every token keeps its byte offsets in the original text and its position.

use regex::Regex;
use unicode_segmentation::UnicodeSegmentation;

/// How text is split into tokens.
#[derive(Clone, Debug)]
pub enum Tokenize {
    /// Unicode word boundaries (UAX #29): runs holding a letter or digit.
    Words,
    /// Every match of the regex is a token.
    Pattern(Regex),
}

/// A raw token: where it is in the text, and its position among the tokens.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct Span {
    pub from: usize,
    pub to: usize,
    pub position: u32,
}

impl Tokenize {
    /// Calls `f` with each token's span, in order.
    pub fn for_each(&self, text: &str, mut f: impl FnMut(Span)) {
        let mut position = 0u32;
        let mut emit = |from: usize, to: usize| {
            if from < to {
                f(Span { from, to, position });
                position += 1;
            }
        };
        match self {
            Tokenize::Words => {
                for (from, word) in text.unicode_word_indices() {
                    emit(from, from + word.len());
                }
            }
            Tokenize::Pattern(re) => {
                for m in re.find_iter(text) {
                    emit(m.start(), m.end());
                }
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn words(t: &Tokenize, text: &str) -> Vec<(String, u32)> {
        let mut out = Vec::new();
        t.for_each(text, |s| {
            out.push((text[s.from..s.to].to_string(), s.position))
        });
        out
    }

    #[test]
    fn word_boundaries_split_on_punctuation_and_keep_offsets() {
        let got = words(&Tokenize::Words, "Park-and-ride, Zone 2!");
        let texts: Vec<&str> = got.iter().map(|(w, _)| w.as_str()).collect();
        assert_eq!(texts, ["Park", "and", "ride", "Zone", "2"]);
        assert_eq!(got[4].1, 4);
    }

    #[test]
    fn a_pattern_decides_what_a_token_is() {
        let t = Tokenize::Pattern(Regex::new("[a-z]+-[a-z]+|[a-z]+").unwrap());
        let texts: Vec<String> = words(&t, "step-free access")
            .into_iter()
            .map(|w| w.0)
            .collect();
        assert_eq!(texts, ["step-free", "access"]);
    }
}
