//! The on-disk cache of surface indexes.
//!
//! An index lives in `CACHE/surface-HASH/`, where `HASH` covers [`FORMAT_VERSION`], the
//! corpus fingerprint (input bytes and reading options), the field list and the surface
//! stage's fingerprint. It is built in a temporary directory inside the cache directory,
//! completed with a marker file, and only then renamed into place, so:
//!
//! - a run killed mid-build leaves only a temporary directory, which no run trusts (only a
//!   renamed directory holding the marker is used);
//! - two runs building the same index at once are safe: the second rename finds the target
//!   taken, and that run uses the existing index and discards its own.

use std::fs;
use std::path::{Path, PathBuf};

use serde::Serialize;
use tantivy::Index;

use super::build::build_surface_index;
use super::{IndexError, IndexPostings, Progress};
use crate::analysis::SurfaceStage;
use crate::corpus::Corpus;

/// Bumped whenever the layout of a cached index changes.
pub const FORMAT_VERSION: u32 = 2;
const MARKER: &str = "lexdelta-complete";
const LENGTHS: &str = "lexdelta-lengths.bin";

/// Whether the index came from the cache.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum CacheStatus {
    /// Built by this run and stored.
    Built,
    /// A complete index stored earlier was used.
    Reused,
}

fn cache_key(corpus: &Corpus, surface: &SurfaceStage) -> String {
    let mut hasher = blake3::Hasher::new();
    hasher.update(format!("lexdelta surface index v{FORMAT_VERSION}\n").as_bytes());
    hasher.update(corpus.fingerprint.as_bytes());
    hasher.update(b"\n");
    hasher.update(
        serde_json::to_string(&corpus.fields)
            .unwrap_or_default()
            .as_bytes(),
    );
    hasher.update(b"\n");
    hasher.update(surface.fingerprint().as_bytes());
    hasher.finalize().to_hex()[..24].to_string()
}

fn io(path: &Path) -> impl FnOnce(std::io::Error) -> IndexError + '_ {
    move |source| IndexError::Io {
        path: path.display().to_string(),
        source,
    }
}

/// Opens the cached surface index for this corpus and surface stage, building it first if
/// the cache has no complete copy. Returns the index, whether it was reused, and its path.
pub fn open_or_build(
    corpus: &Corpus,
    surface: &SurfaceStage,
    cache_dir: &Path,
    progress: &dyn Progress,
) -> Result<(IndexPostings, CacheStatus, PathBuf), IndexError> {
    let n = corpus.fields.len();
    let target = cache_dir.join(format!("surface-{}", cache_key(corpus, surface)));
    if target.join(MARKER).is_file()
        && let Ok(found) = open_cached(&target, n)
    {
        return Ok((found, CacheStatus::Reused, target));
    }
    if !corpus.has_texts() {
        return Err(IndexError::NoTexts);
    }
    fs::create_dir_all(cache_dir).map_err(io(cache_dir))?;
    if target.exists() {
        // Not a complete build: never trusted.
        fs::remove_dir_all(&target).map_err(io(&target))?;
    }
    let tmp = tempfile::Builder::new()
        .prefix(".build-")
        .tempdir_in(cache_dir)
        .map_err(io(cache_dir))?;
    let index = build_surface_index(corpus, surface, Some(tmp.path()), progress)?;
    let mut postings = IndexPostings::open(&index, n)?;
    let (lengths, forms) = postings.surface_lengths_and_forms()?;
    let bytes: Vec<u8> = lengths
        .iter()
        .flatten()
        .flat_map(|l| l.to_le_bytes())
        .collect();
    fs::write(tmp.path().join(LENGTHS), bytes).map_err(io(tmp.path()))?;
    postings.set_lengths(lengths);
    // The surface forms are kept beside the index from the start.
    postings.set_dir(tmp.path());
    postings.keep_forms(forms)?;
    drop(postings);
    drop(index);
    fs::write(tmp.path().join(MARKER), format!("{FORMAT_VERSION}\n")).map_err(io(tmp.path()))?;
    match fs::rename(tmp.path(), &target) {
        Ok(()) => {
            // The directory moved; nothing is left for the guard to remove.
            let _ = tmp.keep();
            Ok((open_cached(&target, n)?, CacheStatus::Built, target))
        }
        Err(_) if target.join(MARKER).is_file() => {
            // Another run finished first: use its index, ours is removed with `tmp`.
            Ok((open_cached(&target, n)?, CacheStatus::Reused, target))
        }
        Err(e) => Err(io(&target)(e)),
    }
}

fn open_cached(dir: &Path, num_fields: usize) -> Result<IndexPostings, IndexError> {
    let index = Index::open_in_dir(dir)?;
    let mut postings = IndexPostings::open(&index, num_fields)?;
    postings.set_dir(dir);
    let bytes = fs::read(dir.join(LENGTHS)).map_err(io(dir))?;
    let docs = postings.num_docs() as usize;
    if bytes.len() != docs * num_fields * 4 {
        return Err(io(dir)(std::io::Error::other(
            "document lengths do not match the index",
        )));
    }
    let values: Vec<u32> = bytes
        .chunks_exact(4)
        .map(|c| u32::from_le_bytes([c[0], c[1], c[2], c[3]]))
        .collect();
    postings.set_lengths(
        values
            .chunks(docs.max(1))
            .map(<[u32]>::to_vec)
            .take(num_fields)
            .collect(),
    );
    Ok(postings)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::corpus::{Document, FieldSpec};
    use crate::index::NoProgress;
    use crate::rules::Pipeline;

    fn corpus() -> Corpus {
        Corpus {
            source: "t".into(),
            fields: vec![FieldSpec {
                name: "body".into(),
                weight: 1.0,
            }],
            documents: vec![Document {
                id: "a".into(),
                title: "A".into(),
                texts: vec!["Prams on trams".into()],
            }],
            fingerprint: "fp".into(),
            warnings: Vec::new(),
        }
    }

    #[test]
    fn a_build_is_reused_and_an_unfinished_one_is_not_trusted() {
        let dir = tempfile::tempdir().unwrap();
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let (_, first, path) = open_or_build(&corpus(), &surface, dir.path(), &NoProgress).unwrap();
        assert_eq!(first, CacheStatus::Built);
        let (_, second, _) = open_or_build(&corpus(), &surface, dir.path(), &NoProgress).unwrap();
        assert_eq!(second, CacheStatus::Reused);
        // A directory without the marker (a killed build renamed by hand, say) is rebuilt.
        fs::remove_file(path.join(MARKER)).unwrap();
        let (_, third, _) = open_or_build(&corpus(), &surface, dir.path(), &NoProgress).unwrap();
        assert_eq!(third, CacheStatus::Built);
        let leftovers = fs::read_dir(dir.path()).unwrap().count();
        assert_eq!(leftovers, 1, "temporary build directories are cleaned up");
    }

    /// A corpus without its texts opens a cached index but never builds (or caches) one.
    #[test]
    fn a_corpus_without_texts_reuses_but_never_builds() {
        let dir = tempfile::tempdir().unwrap();
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let mut light = corpus();
        light.drop_texts();
        let missing = open_or_build(&light, &surface, dir.path(), &NoProgress);
        assert!(matches!(missing, Err(IndexError::NoTexts)));
        assert_eq!(fs::read_dir(dir.path()).map(|d| d.count()).unwrap_or(0), 0);
        open_or_build(&corpus(), &surface, dir.path(), &NoProgress).unwrap();
        let (_, status, _) = open_or_build(&light, &surface, dir.path(), &NoProgress).unwrap();
        assert_eq!(status, CacheStatus::Reused);
    }
}
