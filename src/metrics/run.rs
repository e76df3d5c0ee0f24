//! Reading TREC run files into rankings.
//!
//! A run file has one retrieved document per line, `QUERY_ID Q0 DOC_ID RANK SCORE TAG`,
//! separated by any whitespace. As in trec_eval, the `Q0`, `RANK` and `TAG` fields are
//! ignored: each query's documents are ordered by `SCORE`, highest first, and documents with
//! equal scores are ordered by document id in *descending* byte order (trec_eval's tie
//! rule). A document listed twice for the same query is an error.

use std::collections::BTreeMap;
use std::fs::File;
use std::io::{BufRead, BufReader};
use std::path::Path;

use rustc_hash::FxHashMap;

use super::error::{MetricsError, ParseErrorKind};
use super::judgments::{for_each_line, parse_error};

/// Query id → ranked document ids, best first.
pub type Rankings = BTreeMap<String, Vec<String>>;

/// Reads a TREC run file.
pub fn read_trec_run(path: impl AsRef<Path>) -> Result<Rankings, MetricsError> {
    let path = path.as_ref();
    let file = File::open(path).map_err(|source| MetricsError::Io {
        path: path.to_path_buf(),
        source,
    })?;
    parse_trec_run(BufReader::new(file), path)
}

/// Parses a TREC run from `reader`; `source` names it in errors.
pub fn parse_trec_run(
    reader: impl BufRead,
    source: impl AsRef<Path>,
) -> Result<Rankings, MetricsError> {
    let source = source.as_ref();
    let mut scored: BTreeMap<String, Vec<(f64, String)>> = BTreeMap::new();
    let mut first_line: FxHashMap<(String, String), u64> = FxHashMap::default();
    for_each_line(reader, source, |line_no, line| {
        let fields: Vec<&str> = line.split_whitespace().collect();
        if fields.is_empty() {
            return Ok(());
        }
        let [query, _q0, doc, _rank, score, _tag] = fields[..] else {
            return Err(parse_error(
                source,
                line_no,
                ParseErrorKind::FieldCount {
                    expected: 6,
                    found: fields.len(),
                },
            ));
        };
        let value: f64 = score
            .parse()
            .ok()
            .filter(|s: &f64| s.is_finite())
            .ok_or_else(|| parse_error(source, line_no, ParseErrorKind::BadScore(score.into())))?;
        if let Some(&first) = first_line.get(&(query.to_owned(), doc.to_owned())) {
            return Err(parse_error(
                source,
                line_no,
                ParseErrorKind::DuplicateResult {
                    query: query.into(),
                    doc: doc.into(),
                    first_line: first,
                },
            ));
        }
        first_line.insert((query.to_owned(), doc.to_owned()), line_no);
        scored
            .entry(query.to_owned())
            .or_default()
            .push((value, doc.to_owned()));
        Ok(())
    })?;
    Ok(scored
        .into_iter()
        .map(|(query, mut docs)| {
            docs.sort_by(|(sa, da), (sb, db)| sb.total_cmp(sa).then_with(|| db.cmp(da)));
            (query, docs.into_iter().map(|(_, d)| d).collect())
        })
        .collect())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn orders_by_score_then_doc_id_descending() {
        let text = "q1 Q0 a 1 1.0 t\nq1 Q0 b 2 1.0 t\nq1 Q0 c 3 2.5 t\nq2 Q0 z 1 -3 t\n\
                    q1 Q0 d 4 -1e3 t\n";
        let r = parse_trec_run(text.as_bytes(), "r.run").unwrap();
        assert_eq!(r["q1"], ["c", "b", "a", "d"]);
        assert_eq!(r["q2"], ["z"]);
    }

    #[test]
    fn errors_name_file_and_line() {
        let e = parse_trec_run("q1 Q0 a 1 1.0\n".as_bytes(), "r.run").unwrap_err();
        assert_eq!(e.to_string(), "r.run:1: expected 6 fields, found 5");
        let e =
            parse_trec_run("q1 Q0 a 1 1.0 t\nq1 Q0 b 1 NaN t\n".as_bytes(), "r.run").unwrap_err();
        assert_eq!(
            e.to_string(),
            "r.run:2: score \"NaN\" is not a finite number"
        );
        let e =
            parse_trec_run("q1 Q0 a 1 1.0 t\nq1 Q0 a 2 0.5 t\n".as_bytes(), "r.run").unwrap_err();
        assert_eq!(
            e.to_string(),
            "r.run:2: document \"a\" appears twice for query \"q1\" (first on line 1)"
        );
    }
}
