//! Documents: JSON Lines, CSV with a header, or a directory of `.txt` / `.md` files.

use std::collections::HashSet;
use std::fs;
use std::io::{BufRead, BufReader};
use std::path::Path;

use rand::SeedableRng;
use rand::seq::index::sample;
use rayon::prelude::*;
use serde::Serialize;

use super::fields::Presence;
use super::{CorpusError, CorpusWarning, DocumentFormat, directory};

/// A text field to search, with its weight in ranking.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct FieldSpec {
    pub name: String,
    pub weight: f32,
}

impl FieldSpec {
    /// Parses `name` or `name^weight` (e.g. `title^2`).
    pub fn parse(text: &str) -> Result<FieldSpec, String> {
        let (name, weight) = match text.split_once('^') {
            Some((n, w)) => (
                n,
                w.parse::<f32>()
                    .ok()
                    .filter(|w| w.is_finite() && *w > 0.0)
                    .ok_or_else(|| format!("field weight {w:?} must be a positive number"))?,
            ),
            None => (text, 1.0),
        };
        if name.is_empty() {
            return Err("a field needs a name".into());
        }
        Ok(FieldSpec {
            name: name.to_string(),
            weight,
        })
    }
}

/// How much of a large corpus to keep.
#[derive(Clone, Copy, Debug, PartialEq, Serialize)]
pub enum Sample {
    Count(usize),
    Fraction(f64),
}

impl std::str::FromStr for Sample {
    type Err = String;

    /// A count of documents (`1000`, at least 1) or a fraction of them (`0.1`, above 0 and
    /// at most 1).
    fn from_str(text: &str) -> Result<Sample, String> {
        let text = text.trim();
        if let Ok(n) = text.parse::<usize>() {
            return if n == 0 {
                Err("a sample of 0 documents holds nothing; give a count of 1 or more".into())
            } else {
                Ok(Sample::Count(n))
            };
        }
        match text.parse::<f64>() {
            Ok(f) if f.is_finite() && f > 0.0 && f <= 1.0 => Ok(Sample::Fraction(f)),
            _ => Err(format!(
                "{text:?} is neither a count (1000) nor a fraction above 0 and at most 1 (0.1)"
            )),
        }
    }
}

/// Which fields make up a document, and how much of the corpus to read.
#[derive(Clone, Debug, Serialize)]
pub struct DocOptions {
    pub id_field: String,
    /// The title field is shown in reports; it is searched only if listed in `fields`.
    /// `None` takes `title` when the documents have it (and no title otherwise); a field
    /// named here must exist.
    pub title_field: Option<String>,
    pub fields: Vec<FieldSpec>,
    pub sample: Option<Sample>,
    pub seed: u64,
}

impl Default for DocOptions {
    fn default() -> Self {
        DocOptions {
            id_field: "id".into(),
            title_field: None,
            fields: vec![
                FieldSpec {
                    name: "title".into(),
                    weight: 2.0,
                },
                FieldSpec {
                    name: "body".into(),
                    weight: 1.0,
                },
            ],
            sample: None,
            seed: 42,
        }
    }
}

/// One document: its id, title for display, and searchable texts in `DocOptions::fields`
/// order.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Document {
    pub id: String,
    pub title: String,
    pub texts: Vec<String>,
}

/// The documents read, and a fingerprint of exactly what was read (for caches).
#[derive(Clone, Debug, Serialize)]
pub struct Corpus {
    pub source: String,
    pub fields: Vec<FieldSpec>,
    pub documents: Vec<Document>,
    /// A hash of the input bytes and the options that shaped the documents.
    pub fingerprint: String,
    /// Fields few documents have: worth a look, not an error.
    pub warnings: Vec<CorpusWarning>,
}

impl Corpus {
    /// Frees every document's texts, keeping ids, titles and the fingerprint: what a
    /// preview needs once its index is open. A million documents' texts are most of the
    /// memory a preview would otherwise hold.
    pub fn drop_texts(&mut self) {
        for document in &mut self.documents {
            document.texts = Vec::new();
        }
    }

    /// Whether every document holds the texts of every field (false once they are dropped
    /// or were never read): an index can be built only from a corpus that has them.
    pub fn has_texts(&self) -> bool {
        self.documents
            .iter()
            .all(|d| d.texts.len() == self.fields.len())
    }

    pub fn len(&self) -> usize {
        self.documents.len()
    }

    pub fn is_empty(&self) -> bool {
        self.documents.is_empty()
    }
}

/// Reads documents from `path`: JSON Lines, CSV with a header, or a directory of
/// `.txt`/`.md` files, told apart by content ([`DocumentFormat::detect`]).
///
/// Every field the options name is checked against the whole corpus (before sampling): a
/// field no document has is an error that lists the fields the documents do have; a field
/// under 1% of the documents have is a warning in [`Corpus::warnings`]. A corpus (or a
/// sample) without documents is an error.
pub fn read_documents(path: &Path, options: &DocOptions) -> Result<Corpus, CorpusError> {
    read(path, options, true)
}

/// The same documents, ids, titles and fingerprint without their texts, which are
/// dropped as each document is read: enough for a preview whose index is cached.
pub fn read_documents_without_texts(
    path: &Path,
    options: &DocOptions,
) -> Result<Corpus, CorpusError> {
    read(path, options, false)
}

/// What the options looked like when caches were first keyed by them: the fingerprint
/// hashes this shape, so a cache stays valid across versions that add options.
#[derive(Serialize)]
struct HashedOptions<'a> {
    id_field: &'a str,
    title_field: &'a str,
    fields: &'a [FieldSpec],
    sample: Option<Sample>,
    seed: u64,
}

impl DocOptions {
    /// The title field's name: the one given, or `title`.
    pub fn title_name(&self) -> &str {
        self.title_field.as_deref().unwrap_or("title")
    }

    fn hashed(&self) -> String {
        serde_json::to_string(&HashedOptions {
            id_field: &self.id_field,
            title_field: self.title_name(),
            fields: &self.fields,
            sample: self.sample,
            seed: self.seed,
        })
        .unwrap_or_default()
    }
}

fn read(path: &Path, options: &DocOptions, texts: bool) -> Result<Corpus, CorpusError> {
    let mut hasher = blake3::Hasher::new();
    hasher.update(options.hashed().as_bytes());
    let format = DocumentFormat::detect(path)?;
    let mut presence = Presence::new(options);
    let documents = match format {
        DocumentFormat::Directory => read_directory(path, options, &mut hasher, &mut presence)?,
        DocumentFormat::JsonLines => {
            stream_json_lines(path, options, texts, &mut hasher, &mut presence)?
        }
        DocumentFormat::Csv => {
            let bytes = fs::read(path).map_err(|source| CorpusError::Io {
                path: path.to_path_buf(),
                source,
            })?;
            hasher.update(&bytes);
            let text = String::from_utf8(bytes).map_err(|e| {
                let valid = &e.as_bytes()[..e.utf8_error().valid_up_to()];
                CorpusError::Parse {
                    path: path.to_path_buf(),
                    line: valid.iter().filter(|&&b| b == b'\n').count() + 1,
                    message: "not UTF-8 text".into(),
                }
            })?;
            read_csv(path, &text, options, &mut presence)?
        }
    };
    let warnings = presence.check(path, format, options)?;
    check_unique_ids(path, &documents)?;
    let total = documents.len();
    let mut documents = apply_sample(documents, options);
    if documents.is_empty() {
        return Err(CorpusError::Empty {
            path: path.to_path_buf(),
            what: "documents",
            why: format!("the sample keeps none of the {total} documents"),
        });
    }
    if !texts {
        documents.iter_mut().for_each(|d| d.texts = Vec::new());
    }
    Ok(Corpus {
        source: path.display().to_string(),
        fields: options.fields.clone(),
        documents,
        fingerprint: hasher.finalize().to_hex().to_string(),
        warnings,
    })
}

/// How many bytes of whole lines [`stream_json_lines`] takes at a time.
const BLOCK: usize = 8 << 20;

/// JSON Lines read in blocks of whole lines, every byte hashed as read: the file is never
/// held whole beside its documents (a million documents would otherwise need twice their
/// size). A block's lines are parsed in parallel while the block is hashed; the documents
/// keep file order, and the first bad line in file order is the error, as when reading
/// line by line.
fn stream_json_lines(
    path: &Path,
    options: &DocOptions,
    texts: bool,
    hasher: &mut blake3::Hasher,
    presence: &mut Presence,
) -> Result<Vec<Document>, CorpusError> {
    let io = |source| CorpusError::Io {
        path: path.to_path_buf(),
        source,
    };
    let mut reader = BufReader::with_capacity(1 << 20, fs::File::open(path).map_err(io)?);
    let mut out = Vec::new();
    let mut block = Vec::new();
    let (mut first_line, mut offset) = (0usize, 0usize);
    loop {
        block.clear();
        while block.len() < BLOCK {
            if reader.read_until(b'\n', &mut block).map_err(io)? == 0 {
                break;
            }
        }
        if block.is_empty() {
            break;
        }
        // (line number, offset in the file, bytes with the line's end) per line.
        let mut lines = Vec::new();
        let mut start = 0;
        for piece in block.split_inclusive(|&b| b == b'\n') {
            lines.push((first_line + lines.len(), offset + start, piece));
            start += piece.len();
        }
        let (_, parsed) = rayon::join(
            || hasher.update(&block),
            || {
                lines
                    .par_iter()
                    .map(|&(i, at, line)| document_of_line(path, i, at, line, options))
                    .collect::<Vec<_>>()
            },
        );
        for document in parsed {
            if let Some((i, mut document, has_id)) = document? {
                presence.add(&document, has_id, i + 1);
                if !texts {
                    document.texts = Vec::new();
                }
                out.push(document);
            }
        }
        first_line += lines.len();
        offset += block.len();
    }
    if out.is_empty() {
        let empty = fs::metadata(path).map(|m| m.len() == 0).unwrap_or(false);
        return Err(CorpusError::Empty {
            path: path.to_path_buf(),
            what: "documents",
            why: if empty {
                "the file is empty".into()
            } else {
                "the file holds only blank lines".into()
            },
        });
    }
    Ok(out)
}

/// The document on line `i` (0-based) starting at byte `offset` of the file, and whether
/// it has an id; `None` for a blank line.
fn document_of_line(
    path: &Path,
    i: usize,
    offset: usize,
    line: &[u8],
    options: &DocOptions,
) -> Result<Option<(usize, Document, bool)>, CorpusError> {
    let text = std::str::from_utf8(line).map_err(|e| CorpusError::Parse {
        path: path.to_path_buf(),
        line: i + 1,
        message: format!(
            "not UTF-8 text (invalid byte at column {}, byte offset {} of the file)",
            e.valid_up_to() + 1,
            offset + e.valid_up_to()
        ),
    })?;
    let text = text.strip_suffix('\n').unwrap_or(text);
    let text = text.strip_suffix('\r').unwrap_or(text);
    // A byte-order mark some editors write before the first line is not part of the JSON.
    let text = if i == 0 {
        text.strip_prefix('\u{feff}').unwrap_or(text)
    } else {
        text
    };
    if text.trim().is_empty() {
        return Ok(None);
    }
    let (document, has_id) = parse_json_line(path, i, text, options)?;
    Ok(Some((i, document, has_id)))
}

/// One JSON Lines document, and whether it has an id (without one, the id is empty); `i`
/// is the 0-based line (errors name the 1-based one).
pub(super) fn parse_json_line(
    path: &Path,
    i: usize,
    line: &str,
    options: &DocOptions,
) -> Result<(Document, bool), CorpusError> {
    let parse = |message: String| CorpusError::Parse {
        path: path.to_path_buf(),
        line: i + 1,
        message,
    };
    let value: serde_json::Value =
        serde_json::from_str(line).map_err(|e| parse(format!("not a JSON object: {e}")))?;
    let object = value
        .as_object()
        .ok_or_else(|| parse("expected a JSON object per line".into()))?;
    let field = |name: &str| -> Option<String> {
        match object.get(name)? {
            serde_json::Value::String(s) => Some(s.clone()),
            serde_json::Value::Null => None,
            other => Some(other.to_string()),
        }
    };
    let id = field(&options.id_field);
    let has_id = id.is_some();
    Ok((
        Document {
            title: field(options.title_name()).unwrap_or_default(),
            texts: options
                .fields
                .iter()
                .map(|f| field(&f.name).unwrap_or_default())
                .collect(),
            id: id.unwrap_or_default(),
        },
        has_id,
    ))
}

fn read_csv(
    path: &Path,
    text: &str,
    options: &DocOptions,
    presence: &mut Presence,
) -> Result<Vec<Document>, CorpusError> {
    let mut reader = csv::Reader::from_reader(text.as_bytes());
    let headers = reader
        .headers()
        .map_err(|e| CorpusError::Parse {
            path: path.to_path_buf(),
            line: 1,
            message: e.to_string(),
        })?
        .clone();
    let column = |name: &str| {
        headers
            .iter()
            .position(|h| h.trim_start_matches('\u{feff}') == name)
    };
    let id_col = column(&options.id_field);
    let title_col = column(options.title_name());
    let cols: Vec<Option<usize>> = options.fields.iter().map(|f| column(&f.name)).collect();
    let mut out = Vec::new();
    for record in reader.records() {
        let record = record.map_err(|e| CorpusError::Parse {
            path: path.to_path_buf(),
            line: e.position().map_or(0, |p| p.line() as usize),
            message: e.to_string(),
        })?;
        let line = record.position().map_or(0, |p| p.line() as usize);
        let get = |c: Option<usize>| c.and_then(|c| record.get(c)).unwrap_or("").to_string();
        let document = Document {
            id: get(id_col),
            title: get(title_col),
            texts: cols.iter().map(|c| get(*c)).collect(),
        };
        presence.add(&document, id_col.is_some(), line);
        out.push(document);
    }
    if out.is_empty() {
        return Err(CorpusError::Empty {
            path: path.to_path_buf(),
            what: "documents",
            why: if headers.iter().all(str::is_empty) {
                "the file is empty".into()
            } else {
                "a CSV header and no rows".into()
            },
        });
    }
    Ok(out)
}

/// Each file is a document: its path below the directory is its `id`, its first line
/// (`#` marks dropped) its `title`, the rest its `body`.
fn read_directory(
    dir: &Path,
    options: &DocOptions,
    hasher: &mut blake3::Hasher,
    presence: &mut Presence,
) -> Result<Vec<Document>, CorpusError> {
    let files = directory::text_files(dir)?;
    let mut out = Vec::new();
    for (id, file) in files {
        let text = fs::read_to_string(&file).map_err(|source| CorpusError::Io {
            path: file.clone(),
            source,
        })?;
        hasher
            .update(id.as_bytes())
            .update(&[0])
            .update(text.as_bytes())
            .update(&[0]);
        let (first, rest) = text.split_once('\n').unwrap_or((&text, ""));
        let title = first.trim_start_matches('#').trim().to_string();
        let value = |name: &str| match name {
            "id" => id.clone(),
            "title" => title.clone(),
            "body" => rest.to_string(),
            _ => String::new(),
        };
        let document = Document {
            id: value(&options.id_field),
            title: value(options.title_name()),
            texts: options.fields.iter().map(|f| value(&f.name)).collect(),
        };
        presence.add(&document, options.id_field == "id", out.len() + 1);
        out.push(document);
    }
    if out.is_empty() {
        return Err(CorpusError::Empty {
            path: dir.to_path_buf(),
            what: "documents",
            why: "no .txt or .md files in the directory".into(),
        });
    }
    Ok(out)
}

fn check_unique_ids(path: &Path, documents: &[Document]) -> Result<(), CorpusError> {
    let mut seen = HashSet::with_capacity(documents.len());
    for (i, d) in documents.iter().enumerate() {
        if !seen.insert(d.id.as_str()) {
            return Err(CorpusError::Invalid {
                path: path.to_path_buf(),
                message: format!(
                    "document id {:?} appears twice (second time in document {})",
                    d.id,
                    i + 1
                ),
            });
        }
    }
    Ok(())
}

/// A seeded sample, kept in corpus order so results stay comparable.
fn apply_sample(documents: Vec<Document>, options: &DocOptions) -> Vec<Document> {
    let n = documents.len();
    let keep = match options.sample {
        None => return documents,
        Some(Sample::Count(k)) => k.min(n),
        Some(Sample::Fraction(f)) => ((n as f64) * f.clamp(0.0, 1.0)).round() as usize,
    };
    if keep == n {
        return documents;
    }
    let mut rng = rand_chacha::ChaCha8Rng::seed_from_u64(options.seed);
    let mut chosen: Vec<usize> = sample(&mut rng, n, keep).into_vec();
    chosen.sort_unstable();
    let mut slots: Vec<Option<Document>> = documents.into_iter().map(Some).collect();
    chosen.into_iter().filter_map(|i| slots[i].take()).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn json_lines_csv_and_directories_read_the_same_documents() {
        let dir = tempfile::tempdir().unwrap();
        let jsonl = dir.path().join("d.jsonl");
        fs::write(
            &jsonl,
            "{\"id\":\"a\",\"title\":\"Lost property\",\"body\":\"Ask at the desk.\"}\n",
        )
        .unwrap();
        let csv = dir.path().join("d.csv");
        fs::write(&csv, "id,title,body\na,Lost property,Ask at the desk.\n").unwrap();
        let docs = dir.path().join("docs");
        fs::create_dir(&docs).unwrap();
        fs::write(docs.join("a.md"), "# Lost property\nAsk at the desk.").unwrap();
        let o = DocOptions::default();
        let a = read_documents(&jsonl, &o).unwrap().documents;
        let b = read_documents(&csv, &o).unwrap().documents;
        let c = read_documents(&docs, &o).unwrap().documents;
        assert_eq!(a, b);
        assert_eq!(a[0].texts, c[0].texts);
        assert_eq!(c[0].id, "a.md");
    }

    /// Read without texts, a corpus keeps its ids, titles and fingerprint (so it finds the
    /// same cached index) in every format, and says it has no texts.
    #[test]
    fn reading_without_texts_keeps_ids_titles_and_fingerprint() {
        let dir = tempfile::tempdir().unwrap();
        let jsonl = dir.path().join("d.jsonl");
        fs::write(
            &jsonl,
            "{\"id\":\"a\",\"title\":\"Lost property\",\"body\":\"Ask at the desk.\"}\r\n\n\
             {\"id\":\"b\",\"title\":\"Fares\",\"body\":\"Buy a pass.\"}",
        )
        .unwrap();
        let csv = dir.path().join("d.csv");
        fs::write(&csv, "id,title,body\na,Lost property,Ask at the desk.\n").unwrap();
        let o = DocOptions::default();
        for path in [&jsonl, &csv] {
            let full = read_documents(path, &o).unwrap();
            let light = read_documents_without_texts(path, &o).unwrap();
            assert!(full.has_texts() && !light.has_texts());
            assert_eq!(full.fingerprint, light.fingerprint);
            let names = |c: &Corpus| -> Vec<(String, String)> {
                c.documents
                    .iter()
                    .map(|d| (d.id.clone(), d.title.clone()))
                    .collect()
            };
            assert_eq!(names(&full), names(&light));
        }
        let full = read_documents(&jsonl, &o).unwrap();
        assert_eq!(full.documents.len(), 2);
        assert_eq!(full.documents[0].texts[1], "Ask at the desk.");
    }

    #[test]
    fn a_byte_order_mark_before_the_first_document_is_skipped() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("d.jsonl");
        fs::write(
            &p,
            "\u{feff}{\"id\":\"a\",\"title\":\"T\",\"body\":\"B\"}\n",
        )
        .unwrap();
        let corpus = read_documents(&p, &DocOptions::default()).unwrap();
        assert_eq!(corpus.documents[0].id, "a");
    }

    #[test]
    fn bad_lines_name_their_line_and_samples_are_seeded() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("d.jsonl");
        fs::write(&p, "{\"id\":\"a\"}\nnot json\n").unwrap();
        let err = read_documents(&p, &DocOptions::default()).unwrap_err();
        assert!(err.to_string().contains("d.jsonl:2:"), "{err}");

        let lines: String = (0..100)
            .map(|i| format!("{{\"id\":\"d{i}\",\"title\":\"t\",\"body\":\"x\"}}\n"))
            .collect();
        fs::write(&p, lines).unwrap();
        let o = DocOptions {
            sample: Some(Sample::Count(10)),
            ..DocOptions::default()
        };
        let s1 = read_documents(&p, &o).unwrap().documents;
        let s2 = read_documents(&p, &o).unwrap().documents;
        assert_eq!(s1.len(), 10);
        assert_eq!(s1, s2);
    }
}
