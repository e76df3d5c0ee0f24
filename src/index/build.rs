//! Building an index of a corpus: surface forms (the cached sample index) or keys (the
//! reference path).

use std::path::Path;
use std::sync::Arc;

use tantivy::schema::{FAST, Field, IndexRecordOption, Schema, TextFieldIndexing, TextOptions};
use tantivy::{Index, TantivyDocument};

use super::{IndexError, Progress};
use crate::analysis::tantivy::{KeyTokenizer, SurfaceTokenizer};
use crate::analysis::{Analyzer, SurfaceStage};
use crate::corpus::Corpus;

/// The tokenizer name key indexes register.
pub(crate) const KEY_TOKENIZER: &str = "lexdelta-keys";
const WRITER_MEMORY: usize = 200_000_000;

pub(crate) struct IndexFields {
    pub texts: Vec<Field>,
    pub ord: Field,
    pub lens: Vec<Field>,
}

/// The schema; `tokenizer` names the text fields' tokenizer (surface indexes receive
/// pre-tokenized text and keep tantivy's `default` name, which is always registered).
pub(crate) fn schema(num_fields: usize, tokenizer: &str) -> (Schema, IndexFields) {
    let mut builder = Schema::builder();
    let indexing = TextFieldIndexing::default()
        .set_tokenizer(tokenizer)
        .set_index_option(IndexRecordOption::WithFreqsAndPositions);
    let options = TextOptions::default().set_indexing_options(indexing);
    let texts = (0..num_fields)
        .map(|i| builder.add_text_field(&format!("f{i}"), options.clone()))
        .collect();
    let ord = builder.add_u64_field("ord", FAST);
    let lens = (0..num_fields)
        .map(|i| builder.add_u64_field(&format!("len{i}"), FAST))
        .collect();
    (builder.build(), IndexFields { texts, ord, lens })
}

fn create(dir: Option<&Path>, schema: Schema) -> Result<Index, IndexError> {
    Ok(match dir {
        Some(dir) => Index::create_in_dir(dir, schema)?,
        None => Index::create_in_ram(schema),
    })
}

/// The tokenizer name surface indexes register.
pub(crate) const SURFACE_TOKENIZER: &str = "lexdelta-surface";

/// Indexes the surface forms of every document, tokenized by tantivy's indexing threads
/// with the surface stage. Document lengths are not stored in the index: they are counted
/// from the postings afterwards ([`IndexPostings::surface_lengths_and_forms`]).
/// `dir: None` builds in memory.
///
/// [`IndexPostings::surface_lengths_and_forms`]: super::IndexPostings::surface_lengths_and_forms
pub fn build_surface_index(
    corpus: &Corpus,
    surface: &SurfaceStage,
    dir: Option<&Path>,
    progress: &dyn Progress,
) -> Result<Index, IndexError> {
    if !corpus.has_texts() {
        return Err(IndexError::NoTexts);
    }
    let (schema, fields) = schema(corpus.fields.len(), SURFACE_TOKENIZER);
    let index = create(dir, schema)?;
    register_surface(&index, surface);
    let mut writer = index.writer::<TantivyDocument>(WRITER_MEMORY)?;
    progress.begin(corpus.len() as u64, "indexing surface forms");
    for (ord, document) in corpus.documents.iter().enumerate() {
        let mut doc = TantivyDocument::default();
        doc.add_u64(fields.ord, ord as u64);
        for (i, text) in document.texts.iter().enumerate() {
            doc.add_text(fields.texts[i], text);
        }
        writer.add_document(doc)?;
        if ord % 1024 == 1023 {
            progress.advance(1024);
        }
    }
    writer.commit()?;
    writer.wait_merging_threads()?;
    progress.finish();
    Ok(index)
}

/// Registers the surface tokenizer on an opened surface index.
pub fn register_surface(index: &Index, surface: &SurfaceStage) {
    index
        .tokenizers()
        .register(SURFACE_TOKENIZER, SurfaceTokenizer::new(surface.clone()));
}

/// Indexes the keys of every document with [`KeyTokenizer::keys`]: what an index built
/// with the real analyzer holds. The reference path and the naive baseline use it.
pub fn build_key_index(
    corpus: &Corpus,
    analyzer: &Arc<Analyzer>,
    dir: Option<&Path>,
) -> Result<Index, IndexError> {
    let (schema, fields) = schema(corpus.fields.len(), KEY_TOKENIZER);
    let index = create(dir, schema)?;
    index
        .tokenizers()
        .register(KEY_TOKENIZER, KeyTokenizer::keys(Arc::clone(analyzer)));
    let mut writer = index.writer::<TantivyDocument>(WRITER_MEMORY)?;
    for (ord, document) in corpus.documents.iter().enumerate() {
        let mut doc = TantivyDocument::default();
        doc.add_u64(fields.ord, ord as u64);
        for (i, text) in document.texts.iter().enumerate() {
            let len = analyzer.index_tokens(text).len();
            doc.add_u64(fields.lens[i], len as u64);
            doc.add_text(fields.texts[i], text);
        }
        writer.add_document(doc)?;
    }
    writer.commit()?;
    writer.wait_merging_threads()?;
    Ok(index)
}
