//! Which format an input file is in, read from its content — never from its name alone.
//!
//! Documents: a directory of `.txt`/`.md` files, JSON Lines (the first non-blank character
//! is `{`), or CSV with a header (anything else). Query logs: JSON Lines (first non-blank
//! character `{`), plain lines (no tab anywhere), or `query<TAB>count` (every tab-separated
//! line ends in a whole number); `id<TAB>text` only when asked for, since its lines look
//! like queries with tabs in them. A tab-separated file whose lines do not end in counts is
//! ambiguous, and the error says which formats would read it.

use std::fmt;
use std::fs;
use std::io::Read;
use std::path::Path;

use serde::Serialize;

use super::CorpusError;

/// How a corpus is stored.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum DocumentFormat {
    /// One JSON object per line.
    JsonLines,
    /// CSV with a header naming the columns.
    Csv,
    /// A directory of `.txt` / `.md` files, one document each.
    Directory,
}

impl DocumentFormat {
    /// The format of the documents at `path`, from its content: a directory, JSON Lines
    /// when the first non-blank character is `{`, CSV otherwise. A JSON array is refused
    /// (documents are one object per line).
    pub fn detect(path: &Path) -> Result<DocumentFormat, CorpusError> {
        let meta = fs::metadata(path).map_err(|source| CorpusError::Io {
            path: path.to_path_buf(),
            source,
        })?;
        if meta.is_dir() {
            return Ok(DocumentFormat::Directory);
        }
        regular(path, &meta)?;
        Ok(match first_char(path)? {
            Some(('{', _)) | None => DocumentFormat::JsonLines,
            Some(('[', line)) => {
                return Err(CorpusError::Parse {
                    path: path.to_path_buf(),
                    line,
                    message: "a JSON array: documents are read as JSON Lines, one object per \
                              line (jq -c '.[]' turns an array into lines)"
                        .into(),
                });
            }
            Some(_) => DocumentFormat::Csv,
        })
    }
}

impl fmt::Display for DocumentFormat {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            DocumentFormat::JsonLines => "JSON Lines",
            DocumentFormat::Csv => "CSV",
            DocumentFormat::Directory => "a directory of text files",
        })
    }
}

/// How a query log is stored.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum QueryFormat {
    /// `{"query": ..., "count": ..., "clicks": {doc id: clicks}}` per line.
    JsonLines,
    /// One query per line, each searched once.
    Lines,
    /// `query<TAB>count` per line (a line without a tab is searched once).
    Counts,
    /// `id<TAB>text` per line (judged-query files), each searched once.
    Ids,
}

impl QueryFormat {
    pub const ALL: [QueryFormat; 4] = [
        QueryFormat::JsonLines,
        QueryFormat::Lines,
        QueryFormat::Counts,
        QueryFormat::Ids,
    ];

    /// The short name: `jsonl`, `lines`, `counts`, `ids`.
    pub fn name(self) -> &'static str {
        match self {
            QueryFormat::JsonLines => "jsonl",
            QueryFormat::Lines => "lines",
            QueryFormat::Counts => "counts",
            QueryFormat::Ids => "ids",
        }
    }

    /// The layout a line of this format has, for messages.
    pub fn layout(self) -> &'static str {
        match self {
            QueryFormat::JsonLines => "{\"query\": ..., \"count\": ...}",
            QueryFormat::Lines => "one query per line",
            QueryFormat::Counts => "query<TAB>count",
            QueryFormat::Ids => "id<TAB>text",
        }
    }

    /// The format of a query log's `text`, from its content (see the module docs).
    pub(super) fn detect(path: &Path, text: &str) -> Result<QueryFormat, CorpusError> {
        let mut lines = text
            .lines()
            .enumerate()
            .filter(|(_, l)| !l.trim().is_empty());
        let Some((_, first)) = lines.clone().next() else {
            return Ok(QueryFormat::Lines);
        };
        if first
            .trim_start_matches('\u{feff}')
            .trim_start()
            .starts_with('{')
        {
            return Ok(QueryFormat::JsonLines);
        }
        let mut tabbed = false;
        for (i, line) in &mut lines {
            let Some((_, last)) = line.rsplit_once('\t') else {
                continue;
            };
            tabbed = true;
            let last = last.trim();
            if last.is_empty() || !last.bytes().all(|b| b.is_ascii_digit()) {
                return Err(CorpusError::AmbiguousQueries {
                    path: path.to_path_buf(),
                    line: i + 1,
                    last_field: last.to_string(),
                });
            }
        }
        Ok(if tabbed {
            QueryFormat::Counts
        } else {
            QueryFormat::Lines
        })
    }
}

impl std::str::FromStr for QueryFormat {
    type Err = String;
    fn from_str(s: &str) -> Result<Self, String> {
        QueryFormat::ALL
            .into_iter()
            .find(|f| f.name() == s)
            .ok_or_else(|| format!("unknown query format {s:?}; use jsonl, lines, counts or ids"))
    }
}

impl fmt::Display for QueryFormat {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.name())
    }
}

/// Refuses what is not a regular file (a pipe, a device): its format is read from its
/// first bytes and it may be read again, which a pipe cannot give.
pub(super) fn regular(path: &Path, meta: &fs::Metadata) -> Result<(), CorpusError> {
    if meta.is_file() {
        Ok(())
    } else {
        Err(CorpusError::Invalid {
            path: path.to_path_buf(),
            message: "not a regular file (a pipe or a device): it is read more than once, \
                      so write it to a file first"
                .into(),
        })
    }
}

/// The first non-blank character of a file (past a byte-order mark) and its 1-based line;
/// `None` for an empty or blank file. Reads only as far as that character.
fn first_char(path: &Path) -> Result<Option<(char, usize)>, CorpusError> {
    let io = |source| CorpusError::Io {
        path: path.to_path_buf(),
        source,
    };
    let mut file = fs::File::open(path).map_err(io)?;
    let mut buf = [0u8; 8192];
    let mut line = 1;
    let mut start = true;
    loop {
        let n = file.read(&mut buf).map_err(io)?;
        if n == 0 {
            return Ok(None);
        }
        let mut bytes = &buf[..n];
        if start && bytes.starts_with(b"\xef\xbb\xbf") {
            bytes = &bytes[3..];
        }
        start = false;
        for &b in bytes {
            match b {
                b'\n' => line += 1,
                b' ' | b'\t' | b'\r' => {}
                other => return Ok(Some((other as char, line))),
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn detect(text: &str) -> Result<QueryFormat, String> {
        QueryFormat::detect(Path::new("q"), text).map_err(|e| e.to_string())
    }

    #[test]
    fn query_formats_are_read_from_the_content() {
        assert_eq!(detect("\n{\"query\":\"a\"}\n"), Ok(QueryFormat::JsonLines));
        assert_eq!(detect("lost property\npram\n"), Ok(QueryFormat::Lines));
        assert_eq!(detect("lost property\t90\npram\n"), Ok(QueryFormat::Counts));
        let err = detect("a\t3\nq7\tlost property\n").unwrap_err();
        assert!(err.starts_with("q:2:"), "{err}");
        assert!(err.contains("\"lost property\""), "{err}");
        // Negative or fractional counts are not counts either.
        assert!(detect("a\t-3\n").is_err());
        assert!(detect("a\t1.5\n").is_err());
    }

    #[cfg(unix)]
    #[test]
    fn a_pipe_or_a_device_is_refused_before_anything_is_read_from_it() {
        let err = DocumentFormat::detect(Path::new("/dev/null")).unwrap_err();
        assert!(err.to_string().contains("not a regular file"), "{err}");
    }

    #[test]
    fn document_formats_are_read_from_the_content() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("docs.csv");
        fs::write(&p, "\u{feff}\n  {\"id\":\"a\"}\n").unwrap();
        assert_eq!(
            DocumentFormat::detect(&p).unwrap(),
            DocumentFormat::JsonLines
        );
        let p = dir.path().join("docs.jsonl");
        fs::write(&p, "id,title\na,b\n").unwrap();
        assert_eq!(DocumentFormat::detect(&p).unwrap(), DocumentFormat::Csv);
        fs::write(&p, "\n[{\"id\":\"a\"}]").unwrap();
        let err = DocumentFormat::detect(&p).unwrap_err().to_string();
        assert!(err.contains("docs.jsonl:2: a JSON array"), "{err}");
        assert_eq!(
            DocumentFormat::detect(dir.path()).unwrap(),
            DocumentFormat::Directory
        );
    }
}
