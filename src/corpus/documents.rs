//! Documents: JSON Lines, CSV with a header, or a directory of `.txt` / `.md` files.

use std::collections::HashSet;
use std::fs;
use std::io::{BufRead, BufReader};
use std::path::{Path, PathBuf};

use rand::SeedableRng;
use rand::seq::index::sample;
use rayon::prelude::*;
use serde::Serialize;

use super::CorpusError;

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

/// Which fields make up a document, and how much of the corpus to read.
#[derive(Clone, Debug, Serialize)]
pub struct DocOptions {
    pub id_field: String,
    /// The title field is shown in reports; it is searched only if listed in `fields`.
    pub title_field: String,
    pub fields: Vec<FieldSpec>,
    pub sample: Option<Sample>,
    pub seed: u64,
}

impl Default for DocOptions {
    fn default() -> Self {
        DocOptions {
            id_field: "id".into(),
            title_field: "title".into(),
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

/// Reads documents from `path`: a `.csv` file, a directory of `.txt`/`.md` files, or JSON
/// Lines (any other file).
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

fn read(path: &Path, options: &DocOptions, texts: bool) -> Result<Corpus, CorpusError> {
    let mut hasher = blake3::Hasher::new();
    hasher.update(
        serde_json::to_string(options)
            .unwrap_or_default()
            .as_bytes(),
    );
    let is_csv = path.extension().and_then(|e| e.to_str()) == Some("csv");
    let documents = if path.is_dir() {
        read_directory(path, options, &mut hasher)?
    } else if !is_csv {
        stream_json_lines(path, options, texts, &mut hasher)?
    } else {
        let bytes = fs::read(path).map_err(|source| CorpusError::Io {
            path: path.to_path_buf(),
            source,
        })?;
        hasher.update(&bytes);
        let text = String::from_utf8(bytes).map_err(|e| CorpusError::Invalid {
            path: path.to_path_buf(),
            message: format!(
                "not UTF-8 text (invalid byte at offset {})",
                e.utf8_error().valid_up_to()
            ),
        })?;
        read_csv(path, &text, options)?
    };
    check_unique_ids(path, &documents)?;
    let mut documents = apply_sample(documents, options);
    if !texts {
        documents.iter_mut().for_each(|d| d.texts = Vec::new());
    }
    Ok(Corpus {
        source: path.display().to_string(),
        fields: options.fields.clone(),
        documents,
        fingerprint: hasher.finalize().to_hex().to_string(),
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
                    .map(|&(i, at, line)| document_of_line(path, i, at, line, options, texts))
                    .collect::<Vec<_>>()
            },
        );
        for document in parsed {
            out.extend(document?);
        }
        first_line += lines.len();
        offset += block.len();
    }
    Ok(out)
}

/// The document on line `i` (0-based) starting at byte `offset` of the file; `None` for a
/// blank line.
fn document_of_line(
    path: &Path,
    i: usize,
    offset: usize,
    line: &[u8],
    options: &DocOptions,
    texts: bool,
) -> Result<Option<Document>, CorpusError> {
    let text = std::str::from_utf8(line).map_err(|e| CorpusError::Invalid {
        path: path.to_path_buf(),
        message: format!(
            "not UTF-8 text (invalid byte at offset {}, line {})",
            offset + e.valid_up_to(),
            i + 1
        ),
    })?;
    let text = text.strip_suffix('\n').unwrap_or(text);
    let text = text.strip_suffix('\r').unwrap_or(text);
    if text.trim().is_empty() {
        return Ok(None);
    }
    let mut document = parse_json_line(path, i, text, options)?;
    if !texts {
        document.texts = Vec::new();
    }
    Ok(Some(document))
}

/// One JSON Lines document; `i` is the 0-based line (errors name the 1-based one).
pub(super) fn parse_json_line(
    path: &Path,
    i: usize,
    line: &str,
    options: &DocOptions,
) -> Result<Document, CorpusError> {
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
    let id = field(&options.id_field).ok_or_else(|| {
        parse(format!(
            "no `{}` field (choose the id field with --id-field)",
            options.id_field
        ))
    })?;
    Ok(Document {
        title: field(&options.title_field).unwrap_or_default(),
        texts: options
            .fields
            .iter()
            .map(|f| field(&f.name).unwrap_or_default())
            .collect(),
        id,
    })
}

fn read_csv(path: &Path, text: &str, options: &DocOptions) -> Result<Vec<Document>, CorpusError> {
    let mut reader = csv::Reader::from_reader(text.as_bytes());
    let headers = reader
        .headers()
        .map_err(|e| CorpusError::Parse {
            path: path.to_path_buf(),
            line: 1,
            message: e.to_string(),
        })?
        .clone();
    let column = |name: &str| headers.iter().position(|h| h == name);
    let id_col = column(&options.id_field).ok_or_else(|| CorpusError::Parse {
        path: path.to_path_buf(),
        line: 1,
        message: format!("no `{}` column in the header", options.id_field),
    })?;
    let title_col = column(&options.title_field);
    let cols: Vec<Option<usize>> = options.fields.iter().map(|f| column(&f.name)).collect();
    let mut out = Vec::new();
    for record in reader.records() {
        let record = record.map_err(|e| CorpusError::Parse {
            path: path.to_path_buf(),
            line: e.position().map_or(0, |p| p.line() as usize),
            message: e.to_string(),
        })?;
        let get = |c: Option<usize>| c.and_then(|c| record.get(c)).unwrap_or("").to_string();
        out.push(Document {
            id: get(Some(id_col)),
            title: get(title_col),
            texts: cols.iter().map(|c| get(*c)).collect(),
        });
    }
    Ok(out)
}

/// Each file is a document: its path is the id, its first line the title, the rest the
/// body. The text goes to the first field and the title to a field named like the title.
fn read_directory(
    dir: &Path,
    options: &DocOptions,
    hasher: &mut blake3::Hasher,
) -> Result<Vec<Document>, CorpusError> {
    let mut files = Vec::new();
    collect_files(dir, &mut files)?;
    files.sort();
    let mut out = Vec::new();
    for file in files {
        let text = fs::read_to_string(&file).map_err(|source| CorpusError::Io {
            path: file.clone(),
            source,
        })?;
        let id = file
            .strip_prefix(dir)
            .unwrap_or(&file)
            .to_string_lossy()
            .replace('\\', "/");
        hasher
            .update(id.as_bytes())
            .update(&[0])
            .update(text.as_bytes())
            .update(&[0]);
        let (first, rest) = text.split_once('\n').unwrap_or((&text, ""));
        let title = first.trim_start_matches('#').trim().to_string();
        let texts = options
            .fields
            .iter()
            .map(|f| {
                if f.name == options.title_field {
                    title.clone()
                } else {
                    rest.to_string()
                }
            })
            .collect();
        out.push(Document { id, title, texts });
    }
    Ok(out)
}

fn collect_files(dir: &Path, out: &mut Vec<PathBuf>) -> Result<(), CorpusError> {
    let entries = fs::read_dir(dir).map_err(|source| CorpusError::Io {
        path: dir.to_path_buf(),
        source,
    })?;
    for entry in entries {
        let path = entry
            .map_err(|source| CorpusError::Io {
                path: dir.to_path_buf(),
                source,
            })?
            .path();
        if path.is_dir() {
            collect_files(&path, out)?;
        } else if matches!(
            path.extension().and_then(|e| e.to_str()),
            Some("txt" | "md")
        ) {
            out.push(path);
        }
    }
    Ok(())
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
    fn bad_lines_name_their_line_and_samples_are_seeded() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("d.jsonl");
        fs::write(&p, "{\"id\":\"a\"}\nnot json\n").unwrap();
        let err = read_documents(&p, &DocOptions::default()).unwrap_err();
        assert!(err.to_string().contains("d.jsonl:2:"), "{err}");

        let lines: String = (0..100)
            .map(|i| format!("{{\"id\":\"d{i}\",\"body\":\"x\"}}\n"))
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
