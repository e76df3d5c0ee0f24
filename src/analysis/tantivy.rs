//! The analyzer as a tantivy text analyzer, so a tantivy application indexes and queries
//! with exactly the normalization a preview used.
//!
//! The stem stage inside is lexdelta's own (rust-stemmers), never tantivy's `Stemmer`
//! filter, which runs a different stemming library whose stems differ for several
//! languages.
//!
//! ```
//! use std::sync::Arc;
//! use lexdelta::analysis::Analyzer;
//! use lexdelta::analysis::tantivy::{KeyTokenizer, query_for};
//! use lexdelta::rules::{load_sources, SourceFile};
//! use tantivy::collector::TopDocs;
//! use tantivy::query::Occur;
//! use tantivy::schema::{IndexRecordOption, Schema, TextFieldIndexing, TextOptions, STORED};
//! use tantivy::{doc, Index, TantivyDocument};
//!
//! let rules = "format: 1\nrevision: 1\nsynonyms:\n  - equivalent: [pram, stroller]\nlemmas:\n  - {form: children, lemma: child}\n";
//! let ruleset = load_sources("rules", vec![SourceFile { name: "rules.yaml".into(), text: rules.into() }])?;
//! let analyzer = Arc::new(Analyzer::new(ruleset)?);
//!
//! let mut schema = Schema::builder();
//! let indexing = TextFieldIndexing::default()
//!     .set_tokenizer("lexdelta")
//!     .set_index_option(IndexRecordOption::WithFreqsAndPositions);
//! let body = schema.add_text_field("body", TextOptions::default().set_indexing_options(indexing) | STORED);
//! let index = Index::create_in_ram(schema.build());
//! index.tokenizers().register("lexdelta", KeyTokenizer::keys(Arc::clone(&analyzer)));
//!
//! let mut writer = index.writer(15_000_000)?;
//! writer.add_document(doc!(body => "Prams and strollers are welcome on every tram."))?;
//! writer.add_document(doc!(body => "A child travels free with a paying adult."))?;
//! writer.add_document(doc!(body => "Timetables for the night buses."))?;
//! writer.commit()?;
//!
//! let searcher = index.reader()?.searcher();
//! let hits = |text: &str| -> tantivy::Result<usize> {
//!     let query = query_for(&analyzer, body, text, Occur::Must);
//!     Ok(searcher.search(&*query, &TopDocs::with_limit(10).order_by_score())?.len())
//! };
//! assert_eq!(hits("stroller")?, 1);   // synonym expansion
//! assert_eq!(hits("children")?, 1);   // lemma override, then the stemmer
//! assert_eq!(hits("ferry")?, 0);
//! # Ok::<(), Box<dyn std::error::Error>>(())
//! ```

use std::sync::Arc;

use tantivy::Term;
use tantivy::query::{BooleanQuery, Occur, PhraseQuery, Query, TermQuery};
use tantivy::schema::{Field, IndexRecordOption};
use tantivy::tokenizer::{Token, TokenStream, Tokenizer};

use super::{Analyzer, Phrase, SurfaceStage};

/// A tantivy tokenizer emitting keys (steps 1–7): what an index built with the real
/// analyzer holds.
#[derive(Clone)]
pub struct KeyTokenizer {
    analyzer: Arc<Analyzer>,
    tokens: Vec<Token>,
}

impl KeyTokenizer {
    pub fn keys(analyzer: Arc<Analyzer>) -> Self {
        KeyTokenizer {
            analyzer,
            tokens: Vec::new(),
        }
    }
}

/// A tantivy tokenizer emitting surface forms (steps 1–3): what the shared sample index
/// holds. It needs only the surface settings, not a compiled ruleset.
#[derive(Clone)]
pub struct SurfaceTokenizer {
    surface: SurfaceStage,
    tokens: Vec<Token>,
}

impl SurfaceTokenizer {
    pub fn new(surface: SurfaceStage) -> Self {
        SurfaceTokenizer {
            surface,
            tokens: Vec::new(),
        }
    }
}

/// The token stream of both tokenizers: tokens collected into a reused buffer.
pub struct KeyTokenStream<'a> {
    tokens: &'a mut Vec<Token>,
    next: usize,
}

/// Runs the surface stage over `text`, keeping the tokens `text_of` returns a text for.
fn collect<'a>(
    surface: &SurfaceStage,
    text: &str,
    tokens: &'a mut Vec<Token>,
    mut text_of: impl FnMut(std::borrow::Cow<'_, str>) -> Option<String>,
) -> KeyTokenStream<'a> {
    tokens.clear();
    surface.for_each(text, |span, form| {
        if let Some(text) = text_of(form) {
            tokens.push(Token {
                offset_from: span.from,
                offset_to: span.to,
                position: span.position as usize,
                text,
                position_length: 1,
            });
        }
    });
    KeyTokenStream { tokens, next: 0 }
}

impl Tokenizer for KeyTokenizer {
    type TokenStream<'a> = KeyTokenStream<'a>;

    fn token_stream<'a>(&'a mut self, text: &'a str) -> KeyTokenStream<'a> {
        let analyzer = &self.analyzer;
        collect(analyzer.surface(), text, &mut self.tokens, |form| {
            analyzer.key(&form).map(|k| k.into_owned())
        })
    }
}

impl Tokenizer for SurfaceTokenizer {
    type TokenStream<'a> = KeyTokenStream<'a>;

    fn token_stream<'a>(&'a mut self, text: &'a str) -> KeyTokenStream<'a> {
        collect(&self.surface, text, &mut self.tokens, |form| {
            Some(form.into_owned())
        })
    }
}

impl TokenStream for KeyTokenStream<'_> {
    fn advance(&mut self) -> bool {
        if self.next < self.tokens.len() {
            self.next += 1;
            true
        } else {
            false
        }
    }

    fn token(&self) -> &Token {
        &self.tokens[self.next - 1]
    }

    fn token_mut(&mut self) -> &mut Token {
        &mut self.tokens[self.next - 1]
    }
}

/// A tantivy query for `text` on a field indexed with [`KeyTokenizer::keys`]: each stretch
/// of the query becomes the union of its alternatives (multi-word ones as phrases), and the
/// stretches are combined with `occur` (`Must`: all terms; `Should`: any term).
pub fn query_for(analyzer: &Analyzer, field: Field, text: &str, occur: Occur) -> Box<dyn Query> {
    let query = analyzer.analyze_query(text);
    let clauses: Vec<(Occur, Box<dyn Query>)> = query
        .expansions
        .iter()
        .map(|e| {
            let alternatives: Vec<(Occur, Box<dyn Query>)> = e
                .alternatives
                .iter()
                .map(|a| (Occur::Should, phrase_query(field, &a.phrase)))
                .collect();
            let q: Box<dyn Query> = Box::new(BooleanQuery::new(alternatives));
            (occur, q)
        })
        .collect();
    Box::new(BooleanQuery::new(clauses))
}

fn phrase_query(field: Field, phrase: &Phrase) -> Box<dyn Query> {
    if let [(_, key)] = phrase.keys.as_slice() {
        return Box::new(TermQuery::new(
            Term::from_field_text(field, key),
            IndexRecordOption::WithFreqs,
        ));
    }
    let terms = phrase
        .keys
        .iter()
        .map(|(pos, key)| (*pos as usize, Term::from_field_text(field, key)))
        .collect();
    Box::new(PhraseQuery::new_with_offset(terms))
}
