//! The surface stage: tokenize, lowercase, fold accents (steps 1–3 of the contract).
//! Its output, the surface form, is what the sample index stores; changing these settings
//! means a new surface index, which is why they are fingerprinted.

use std::borrow::Cow;

use super::fold::fold_accents;
use super::lowercase::lowercase;
use super::tokenize::{Span, Tokenize};
use crate::rules::Pipeline;

/// A token after the surface stage.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct SurfaceToken {
    /// The surface form: the token lowercased and folded as the pipeline says.
    pub form: String,
    /// Byte offsets of the token in the original text.
    pub from: usize,
    pub to: usize,
    pub position: u32,
}

/// Steps 1–3, configured.
#[derive(Clone, Debug)]
pub struct SurfaceStage {
    pub tokenize: Tokenize,
    pub lowercase: bool,
    pub fold_accents: bool,
}

impl SurfaceStage {
    pub fn from_pipeline(pipeline: &Pipeline) -> Self {
        SurfaceStage {
            tokenize: match &pipeline.token_pattern {
                Some(p) => Tokenize::Pattern(p.regex.clone()),
                None => Tokenize::Words,
            },
            lowercase: pipeline.lowercase,
            fold_accents: pipeline.fold_accents,
        }
    }

    /// The surface form of one raw token.
    pub fn form<'a>(&self, raw: &'a str) -> Cow<'a, str> {
        let lowered = if self.lowercase {
            lowercase(raw)
        } else {
            Cow::Borrowed(raw)
        };
        if !self.fold_accents {
            return lowered;
        }
        match lowered {
            Cow::Borrowed(s) => fold_accents(s),
            Cow::Owned(s) => Cow::Owned(fold_accents(&s).into_owned()),
        }
    }

    /// Calls `f` with each token's span and surface form, without collecting.
    pub fn for_each<'t>(&self, text: &'t str, mut f: impl FnMut(Span, Cow<'t, str>)) {
        self.tokenize
            .for_each(text, |span| f(span, self.form(&text[span.from..span.to])));
    }

    pub fn tokens(&self, text: &str) -> Vec<SurfaceToken> {
        let mut out = Vec::new();
        self.for_each(text, |span, form| {
            out.push(SurfaceToken {
                form: form.into_owned(),
                from: span.from,
                to: span.to,
                position: span.position,
            })
        });
        out
    }

    /// A stable description of these settings: surface indexes are cached under it.
    pub fn fingerprint(&self) -> String {
        let tokenize = match &self.tokenize {
            Tokenize::Words => "uax29".to_string(),
            Tokenize::Pattern(re) => format!("regex:{}", re.as_str()),
        };
        format!(
            "tokenize={tokenize};lowercase={};fold_accents={}",
            self.lowercase, self.fold_accents
        )
    }
}
