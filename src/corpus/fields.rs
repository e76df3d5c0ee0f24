//! Whether the fields the options name are there: counted over every document read, a
//! field no document has is an error listing the fields the documents do have (with the
//! closest one when a name looks misspelt), and a field under 1% of the documents have is a
//! warning. A document has a field when its value is not empty.

use std::collections::BTreeSet;
use std::fmt;
use std::fs;
use std::io::{BufRead, BufReader};
use std::path::{Path, PathBuf};

use serde::Serialize;

use super::{CorpusError, DocOptions, Document, DocumentFormat, FieldRole};

/// A field worth a look, though the corpus can be read.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum CorpusWarning {
    /// Under 1% of the documents have this field.
    RareField {
        path: PathBuf,
        role: FieldRole,
        name: String,
        documents: usize,
        total: usize,
    },
}

impl fmt::Display for CorpusWarning {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            CorpusWarning::RareField {
                path,
                role,
                name,
                documents,
                total,
            } => write!(
                f,
                "{}: only {documents} of {total} documents ({:.2}%) have the {role} `{name}`; \
                 the others count as empty in it",
                path.display(),
                *documents as f64 * 100.0 / *total as f64
            ),
        }
    }
}

/// A share below this (1%) is worth a warning.
const RARE: f64 = 0.01;

/// How many documents have each named field, counted as they are read.
#[derive(Clone, Debug)]
pub(super) struct Presence {
    documents: usize,
    id: usize,
    /// The first document without an id: its line (or number, for directories).
    first_without_id: Option<usize>,
    title: usize,
    fields: Vec<usize>,
}

impl Presence {
    pub(super) fn new(options: &DocOptions) -> Self {
        Presence {
            documents: 0,
            id: 0,
            first_without_id: None,
            title: 0,
            fields: vec![0; options.fields.len()],
        }
    }

    /// Counts one document; `line` locates it (1-based) should it lack an id.
    pub(super) fn add(&mut self, document: &Document, has_id: bool, line: usize) {
        self.add_texts(
            has_id,
            line,
            !document.title.is_empty(),
            document.texts.iter().map(String::as_str),
        );
    }

    pub(super) fn add_texts<'a>(
        &mut self,
        has_id: bool,
        line: usize,
        has_title: bool,
        texts: impl Iterator<Item = &'a str>,
    ) {
        self.documents += 1;
        if has_id {
            self.id += 1;
        } else if self.first_without_id.is_none_or(|l| line < l) {
            self.first_without_id = Some(line);
        }
        self.title += usize::from(has_title);
        for (n, text) in self.fields.iter_mut().zip(texts) {
            *n += usize::from(!text.is_empty());
        }
    }

    pub(super) fn documents(&self) -> usize {
        self.documents
    }

    /// Adds another reader's counts (documents seen by one reader only).
    pub(super) fn merge(&mut self, other: &Presence) {
        self.documents += other.documents;
        self.id += other.id;
        if let Some(line) = other.first_without_id
            && self.first_without_id.is_none_or(|l| line < l)
        {
            self.first_without_id = Some(line);
        }
        self.title += other.title;
        for (a, b) in self.fields.iter_mut().zip(&other.fields) {
            *a += b;
        }
    }

    /// Whether [`Presence::check`] would find an error (without reading anything).
    pub(super) fn has_error(&self, options: &DocOptions) -> bool {
        self.documents > 0
            && (self.id == 0
                || self.first_without_id.is_some()
                || self.fields.contains(&0)
                || (options.title_field.is_some() && self.title == 0))
    }

    /// The error for a field no document has (or a document without an id), else the
    /// warnings for fields few documents have.
    pub(super) fn check(
        &self,
        path: &Path,
        format: DocumentFormat,
        options: &DocOptions,
    ) -> Result<Vec<CorpusWarning>, CorpusError> {
        let total = self.documents;
        if total == 0 {
            return Ok(Vec::new());
        }
        let unknown = |role: FieldRole, name: &str| -> CorpusError {
            let available = field_names(path, format);
            let names: Vec<&str> = available.iter().map(String::as_str).collect();
            CorpusError::UnknownField {
                path: path.to_path_buf(),
                role,
                name: name.to_string(),
                suggestion: did_you_mean(name, &names),
                available,
            }
        };
        if self.id == 0 {
            return Err(unknown(FieldRole::Id, &options.id_field));
        }
        if let Some(line) = self.first_without_id {
            return Err(CorpusError::MissingId {
                path: path.to_path_buf(),
                line,
                field: options.id_field.clone(),
            });
        }
        let mut warnings = Vec::new();
        let mut rare = |role: FieldRole, name: &str, n: usize| {
            if (n as f64) < RARE * total as f64 {
                warnings.push(CorpusWarning::RareField {
                    path: path.to_path_buf(),
                    role,
                    name: name.to_string(),
                    documents: n,
                    total,
                });
            }
        };
        for (field, &n) in options.fields.iter().zip(&self.fields) {
            if n == 0 {
                return Err(unknown(FieldRole::Searched, &field.name));
            }
            rare(FieldRole::Searched, &field.name, n);
        }
        if let Some(title) = &options.title_field {
            if self.title == 0 {
                return Err(unknown(FieldRole::Title, title));
            }
            rare(FieldRole::Title, title, self.title);
        }
        Ok(warnings)
    }
}

/// The allowed name closest to a misspelt one, if it is close enough to be a typo.
pub(super) fn did_you_mean(name: &str, allowed: &[&str]) -> Option<String> {
    allowed
        .iter()
        .filter(|cand| **cand != name)
        .map(|cand| (strsim::damerau_levenshtein(name, cand), *cand))
        .filter(|(d, cand)| *d <= 2.max(cand.len() / 4))
        .min()
        .map(|(_, cand)| cand.to_string())
}

/// Every field some document has (with a value), sorted: read again from the file, as it
/// is only needed for an error.
fn field_names(path: &Path, format: DocumentFormat) -> Vec<String> {
    let mut names = BTreeSet::new();
    match format {
        DocumentFormat::Directory => {
            names.extend(["body", "id", "title"].map(String::from));
        }
        DocumentFormat::Csv => {
            if let Ok(mut reader) = csv::Reader::from_path(path)
                && let Ok(headers) = reader.headers()
            {
                names.extend(
                    headers
                        .iter()
                        .map(|h| h.trim_start_matches('\u{feff}').to_string())
                        .filter(|h| !h.is_empty()),
                );
            }
        }
        DocumentFormat::JsonLines => {
            if let Ok(file) = fs::File::open(path) {
                for line in BufReader::new(file).lines().map_while(Result::ok) {
                    if let Ok(serde_json::Value::Object(object)) = serde_json::from_str(&line) {
                        for (key, value) in object {
                            let empty = value.is_null() || value.as_str() == Some("");
                            if !empty && !names.contains(&key) {
                                names.insert(key);
                            }
                        }
                    }
                }
            }
        }
    }
    names.into_iter().collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::corpus::{FieldSpec, read_documents};

    fn options(fields: &[&str]) -> DocOptions {
        DocOptions {
            fields: fields
                .iter()
                .map(|f| FieldSpec::parse(f).unwrap())
                .collect(),
            ..DocOptions::default()
        }
    }

    #[test]
    fn a_field_no_document_has_is_an_error_naming_the_fields_there_are() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("d.jsonl");
        fs::write(
            &p,
            "{\"id\":\"a\",\"title\":\"Fares\",\"text\":\"Buy a pass.\"}\n\
             {\"id\":\"b\",\"text\":\"Ask.\",\"extra\":null}\n",
        )
        .unwrap();
        let err = read_documents(&p, &options(&["titel"])).unwrap_err();
        let CorpusError::UnknownField {
            role,
            available,
            suggestion,
            ..
        } = &err
        else {
            panic!("{err}")
        };
        assert_eq!(*role, FieldRole::Searched);
        assert_eq!(available, &["id", "text", "title"]);
        assert_eq!(suggestion.as_deref(), Some("title"));
        assert!(
            err.to_string()
                .contains("no document has the searched field `titel`"),
            "{err}"
        );
        let mut o = options(&["text"]);
        o.id_field = "doc_id".into();
        let err = read_documents(&p, &o).unwrap_err().to_string();
        assert!(err.contains("id field `doc_id`"), "{err}");
        o.id_field = "id".into();
        o.title_field = Some("heading".into());
        let err = read_documents(&p, &o).unwrap_err().to_string();
        assert!(err.contains("title field `heading`"), "{err}");
        // The default title needs no title in the documents.
        o.title_field = None;
        assert!(read_documents(&p, &o).is_ok());

        let csv = dir.path().join("d.csv");
        fs::write(&csv, "id,heading,text\na,Fares,Buy\n").unwrap();
        let err = read_documents(&csv, &options(&["body"]))
            .unwrap_err()
            .to_string();
        assert!(
            err.contains("the documents have `heading`, `id`, `text`"),
            "{err}"
        );
    }

    #[test]
    fn a_field_under_one_percent_of_the_documents_have_is_a_warning() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("d.jsonl");
        let mut text = String::from("{\"id\":\"d0\",\"body\":\"x\",\"note\":\"rare\"}\n");
        for i in 1..200 {
            text.push_str(&format!("{{\"id\":\"d{i}\",\"body\":\"x\"}}\n"));
        }
        fs::write(&p, &text).unwrap();
        let corpus = read_documents(&p, &options(&["body", "note"])).unwrap();
        assert_eq!(
            corpus.warnings,
            [CorpusWarning::RareField {
                path: p.clone(),
                role: FieldRole::Searched,
                name: "note".into(),
                documents: 1,
                total: 200,
            }]
        );
        assert!(
            corpus.warnings[0]
                .to_string()
                .contains("only 1 of 200 documents (0.50%)")
        );
        // 2 of 200 is 1%: no warning.
        fs::write(
            &p,
            text.replace("\"id\":\"d1\",", "\"id\":\"d1\",\"note\":\"y\","),
        )
        .unwrap();
        assert!(
            read_documents(&p, &options(&["body", "note"]))
                .unwrap()
                .warnings
                .is_empty()
        );
    }
}
