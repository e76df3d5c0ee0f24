//! Relevance judgments and the texts of the judged queries, whichever layout they come in:
//! TREC qrels (`QUERY_ID ITERATION DOC_ID GRADE`, with the texts in an `id<TAB>text` file)
//! or CSV with the columns `query_id,query,doc_id,relevance` (texts included). The layout
//! is read from the content; the parsers themselves are [`crate::metrics`]'s.

use std::fs;
use std::io::Read;
use std::path::Path;

use crate::metrics::{self, Judgments, Queries};

use super::CorpusError;

/// How a judgments file is laid out.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum JudgmentFormat {
    /// TREC qrels: four fields separated by white space.
    TrecQrels,
    /// CSV with a header.
    Csv,
}

impl JudgmentFormat {
    /// The layout of `path`: CSV when its first non-blank line holds a comma (a qrels line
    /// never does), qrels otherwise.
    pub fn detect(path: &Path) -> Result<JudgmentFormat, CorpusError> {
        let io = |source| CorpusError::Io {
            path: path.to_path_buf(),
            source,
        };
        let meta = fs::metadata(path).map_err(io)?;
        super::format::regular(path, &meta)?;
        let mut head = Vec::new();
        fs::File::open(path)
            .map_err(io)?
            .take(64 * 1024)
            .read_to_end(&mut head)
            .map_err(io)?;
        let head = String::from_utf8_lossy(&head);
        let first = head.lines().find(|l| !l.trim().is_empty()).unwrap_or("");
        Ok(if first.contains(',') {
            JudgmentFormat::Csv
        } else {
            JudgmentFormat::TrecQrels
        })
    }
}

/// Reads judgments and the judged queries' texts: from the CSV itself, or for qrels from
/// `texts` (an `id<TAB>text` file), which qrels need.
pub fn read_judgments(
    path: &Path,
    texts: Option<&Path>,
) -> Result<(Judgments, Queries), CorpusError> {
    Ok(match JudgmentFormat::detect(path)? {
        JudgmentFormat::Csv => metrics::read_csv_judgments(path)?,
        JudgmentFormat::TrecQrels => {
            let Some(texts) = texts else {
                return Err(CorpusError::QrelsWithoutTexts {
                    path: path.to_path_buf(),
                });
            };
            (
                metrics::read_trec_qrels(path)?,
                metrics::read_queries(texts)?,
            )
        }
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_layout_is_read_from_the_content_not_the_name() {
        let dir = tempfile::tempdir().unwrap();
        let csv = dir.path().join("judgments.txt");
        fs::write(&csv, "query_id,query,doc_id,relevance\nq1,pram,d1,2\n").unwrap();
        let (j, q) = read_judgments(&csv, None).unwrap();
        assert_eq!(j.num_judgments(), 1);
        assert_eq!(q.get("q1"), Some("pram"));
        let qrels = dir.path().join("judgments.csv");
        fs::write(&qrels, "q1 0 d1 2\n").unwrap();
        let err = read_judgments(&qrels, None).unwrap_err();
        assert!(
            matches!(err, CorpusError::QrelsWithoutTexts { .. }),
            "{err}"
        );
        let texts = dir.path().join("texts.tsv");
        fs::write(&texts, "q1\tpram\n").unwrap();
        let (j, q) = read_judgments(&qrels, Some(&texts)).unwrap();
        assert_eq!((j.num_judgments(), q.get("q1")), (1, Some("pram")));
    }
}
