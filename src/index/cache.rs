//! The on-disk cache of surface indexes.
//!
//! An index lives in `CACHE/surface-HASH/`, where `HASH` covers [`FORMAT_VERSION`], the
//! corpus fingerprint (input bytes and reading options), the field list and the surface
//! stage's fingerprint. It is built in a temporary directory inside the cache directory,
//! completed with a manifest, and only then renamed into place, so:
//!
//! - a run killed mid-build leaves only a temporary directory, which no run trusts (only a
//!   renamed directory holding the manifest is used), and which a later run removes once
//!   no build holds its lock;
//! - two runs building the same index at once are safe: the second rename finds the target
//!   taken, and that run uses the existing index and discards its own.
//!
//! A cached index lives for months beside a repository, so it is checked before it is
//! trusted ([`Verify`]): the manifest lists every file the build wrote with its size and
//! modification time, and a BLAKE3 checksum of the small files (index metadata, document
//! lengths); a full check also reads every index file against its own CRC32 footer. A
//! damaged, truncated or missing file makes the run rebuild the index (as a cold run would,
//! [`Opened::damage`] saying why), never read it.

use std::fs;
use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicBool, Ordering};
use std::time::{Duration, UNIX_EPOCH};

use rayon::prelude::*;
use serde::Serialize;
use tantivy::Index;

use super::build::build_surface_index;
use super::{IndexError, IndexPostings, Progress};
use crate::analysis::SurfaceStage;
use crate::corpus::Corpus;

/// Bumped whenever the layout of a cached index changes.
pub const FORMAT_VERSION: u32 = 3;
/// The manifest: written last, so its presence means the build completed.
const MARKER: &str = "lexdelta-complete";
const LENGTHS: &str = "lexdelta-lengths.bin";
/// Held (locked) by the run building in a `.build-*` directory.
const BUILD_LOCK: &str = "lexdelta-build.lock";
const BUILD_PREFIX: &str = ".build-";
/// A damaged or unfinished index moved aside to be removed.
const STALE_PREFIX: &str = ".stale-";
/// A `.build-*` directory without a lock file this old is a killed build's.
const UNLOCKED_BUILD_AGE: Duration = Duration::from_secs(600);
/// Files this small are checked by checksum on every run.
const HASHED_BELOW: u64 = 1 << 20;

/// Whether the index came from the cache.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum CacheStatus {
    /// Built by this run and stored.
    Built,
    /// A complete index stored earlier was used.
    Reused,
}

/// How thoroughly a cached index is checked before it is trusted.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq)]
pub enum Verify {
    /// Every file the build wrote is there with its size and modification time, and the
    /// small files (index metadata, document lengths) match their checksums. Costs
    /// microseconds; catches files written to, cut short, replaced or deleted.
    #[default]
    Quick,
    /// Also reads every index file against its own CRC32 footer: catches damage that left
    /// the size and modification time alone (a failing disk), at the cost of reading the
    /// whole index.
    Full,
}

static FULL_BY_DEFAULT: AtomicBool = AtomicBool::new(false);

/// Sets the check [`open_or_build`] makes for this process (the CLI's `--verify-cache`).
pub fn set_default_verify(verify: Verify) {
    FULL_BY_DEFAULT.store(verify == Verify::Full, Ordering::Relaxed);
}

/// The check [`open_or_build`] makes: [`Verify::Quick`] unless
/// [`set_default_verify`] said otherwise.
pub fn default_verify() -> Verify {
    if FULL_BY_DEFAULT.load(Ordering::Relaxed) {
        Verify::Full
    } else {
        Verify::Quick
    }
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
/// The cached copy is checked as [`default_verify`] says; see [`open_or_build_checked`].
pub fn open_or_build(
    corpus: &Corpus,
    surface: &SurfaceStage,
    cache_dir: &Path,
    progress: &dyn Progress,
) -> Result<(IndexPostings, CacheStatus, PathBuf), IndexError> {
    let opened = open_or_build_checked(corpus, surface, cache_dir, default_verify(), progress)?;
    if let Some(damage) = &opened.damage {
        progress.notice(&format!(
            "the cached index {} was damaged ({damage}); it was built again",
            opened.path.display()
        ));
    }
    Ok((opened.postings, opened.status, opened.path))
}

/// An index opened from the cache (or built into it).
pub struct Opened {
    pub postings: IndexPostings,
    pub status: CacheStatus,
    pub path: PathBuf,
    /// Why the stored copy was not trusted, when it was rebuilt.
    pub damage: Option<String>,
}

/// [`open_or_build`] with an explicit check.
pub fn open_or_build_checked(
    corpus: &Corpus,
    surface: &SurfaceStage,
    cache_dir: &Path,
    verify: Verify,
    progress: &dyn Progress,
) -> Result<Opened, IndexError> {
    let n = corpus.fields.len();
    let target = cache_dir.join(format!("surface-{}", cache_key(corpus, surface)));
    let mut damage = None;
    if target.join(MARKER).is_file() {
        match open_checked(&target, n, verify) {
            Ok(postings) => {
                return Ok(Opened {
                    postings,
                    status: CacheStatus::Reused,
                    path: target,
                    damage: None,
                });
            }
            Err(why) => damage = Some(why),
        }
    } else if target.exists() {
        // Only a complete build is renamed into place: its manifest went missing since.
        damage = Some("its manifest is missing".into());
    }
    if !corpus.has_texts() {
        return Err(IndexError::NoTexts);
    }
    fs::create_dir_all(cache_dir).map_err(io(cache_dir))?;
    remove_killed_builds(cache_dir);
    if target.exists() {
        // Not a complete build, or a damaged one: never trusted. It is moved aside in one
        // rename, then removed: a removal that fails (a file that appears in it meanwhile,
        // from a reader of the damaged copy still shutting down) never stops the run, and
        // a later run finishes it.
        let aside = tempfile::Builder::new()
            .prefix(STALE_PREFIX)
            .tempdir_in(cache_dir)
            .map_err(io(cache_dir))?
            .keep();
        fs::rename(&target, &aside).map_err(io(&target))?;
        let _ = fs::remove_dir_all(&aside);
    }
    let tmp = tempfile::Builder::new()
        .prefix(BUILD_PREFIX)
        .tempdir_in(cache_dir)
        .map_err(io(cache_dir))?;
    // Held until this function returns: a run that finds the directory unlocked knows
    // its build was killed.
    let lock = fs::File::create(tmp.path().join(BUILD_LOCK)).map_err(io(tmp.path()))?;
    let _ = fs4::fs_std::FileExt::try_lock_exclusive(&lock);
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
    let manifest = Manifest::of(tmp.path())?;
    fs::write(tmp.path().join(MARKER), manifest.render()).map_err(io(tmp.path()))?;
    let status = CacheStatus::Built;
    match fs::rename(tmp.path(), &target) {
        Ok(()) => {
            // The directory moved; nothing is left for the guard to remove.
            let _ = tmp.keep();
            drop(lock);
            let _ = fs::remove_file(target.join(BUILD_LOCK));
            Ok(Opened {
                postings: open_checked(&target, n, Verify::Quick).map_err(|why| {
                    io(&target)(std::io::Error::other(format!(
                        "the index just built fails its check: {why}"
                    )))
                })?,
                status,
                path: target,
                damage,
            })
        }
        Err(_) if target.join(MARKER).is_file() => {
            // Another run finished first: use its index, ours is removed with `tmp`.
            let postings = open_checked(&target, n, verify).map_err(|why| {
                io(&target)(std::io::Error::other(format!(
                    "the index another run built fails its check: {why}"
                )))
            })?;
            Ok(Opened {
                postings,
                status: CacheStatus::Reused,
                path: target,
                damage,
            })
        }
        Err(e) => Err(io(&target)(e)),
    }
}

/// Removes `.build-*` directories left by killed builds: those whose lock no run holds
/// (or, from a build killed before it made its lock, older than ten minutes), and
/// `.stale-*` directories a run moved aside but could not remove. Best effort: a
/// directory that cannot be removed is left for a later run.
fn remove_killed_builds(cache_dir: &Path) {
    let Ok(entries) = fs::read_dir(cache_dir) else {
        return;
    };
    for entry in entries.flatten() {
        let name = entry.file_name().to_string_lossy().into_owned();
        if !entry.file_type().is_ok_and(|t| t.is_dir()) {
            continue;
        }
        let dir = entry.path();
        if name.starts_with(STALE_PREFIX) {
            let _ = fs::remove_dir_all(&dir);
            continue;
        }
        if !name.starts_with(BUILD_PREFIX) {
            continue;
        }
        let killed = match fs::OpenOptions::new()
            .write(true)
            .open(dir.join(BUILD_LOCK))
        {
            Ok(lock) => fs4::fs_std::FileExt::try_lock_exclusive(&lock).unwrap_or(false),
            Err(_) => entry
                .metadata()
                .and_then(|m| m.modified())
                .ok()
                .and_then(|t| t.elapsed().ok())
                .is_some_and(|age| age > UNLOCKED_BUILD_AGE),
        };
        if killed {
            let _ = fs::remove_dir_all(&dir);
        }
    }
}

/// One file of a complete index as the build left it.
#[derive(Clone, Debug, PartialEq, Eq)]
struct Entry {
    name: String,
    size: u64,
    /// Modification time, nanoseconds since the epoch.
    modified: u128,
    /// BLAKE3 of the contents, for files under [`HASHED_BELOW`].
    hash: Option<String>,
}

/// What a complete build wrote: the manifest stored in [`MARKER`].
#[derive(Debug, PartialEq, Eq)]
struct Manifest {
    entries: Vec<Entry>,
}

fn modified_nanos(meta: &fs::Metadata) -> u128 {
    meta.modified()
        .ok()
        .and_then(|t| t.duration_since(UNIX_EPOCH).ok())
        .map_or(0, |d| d.as_nanos())
}

/// Files that belong in the manifest: the index's own and the document lengths. Derived
/// files written later (`lexdelta-*.bin`) carry their own checksums; lock files change.
fn listed(name: &str) -> bool {
    name == LENGTHS
        || !(name.starts_with("lexdelta-")
            || name.ends_with(".lock")
            || name.starts_with(".sidecar-")
            || name == MARKER)
}

impl Manifest {
    fn of(dir: &Path) -> Result<Manifest, IndexError> {
        let mut entries = Vec::new();
        for entry in fs::read_dir(dir).map_err(io(dir))? {
            let entry = entry.map_err(io(dir))?;
            let name = entry.file_name().to_string_lossy().into_owned();
            if !listed(&name) {
                continue;
            }
            let meta = entry.metadata().map_err(io(dir))?;
            if !meta.is_file() {
                continue;
            }
            let hash = if meta.len() < HASHED_BELOW || name == LENGTHS {
                let bytes = fs::read(entry.path()).map_err(io(dir))?;
                Some(blake3::hash(&bytes).to_hex().to_string())
            } else {
                None
            };
            entries.push(Entry {
                name,
                size: meta.len(),
                modified: modified_nanos(&meta),
                hash,
            });
        }
        entries.sort_by(|a, b| a.name.cmp(&b.name));
        Ok(Manifest { entries })
    }

    fn render(&self) -> String {
        let mut out = format!("lexdelta surface index v{FORMAT_VERSION}\n");
        for e in &self.entries {
            out.push_str(&format!(
                "{}\t{}\t{}\t{}\n",
                e.size,
                e.modified,
                e.hash.as_deref().unwrap_or("-"),
                e.name
            ));
        }
        out
    }

    fn parse(text: &str) -> Option<Manifest> {
        let mut lines = text.lines();
        if lines.next()? != format!("lexdelta surface index v{FORMAT_VERSION}") {
            return None;
        }
        let entries = lines
            .map(|line| {
                let mut parts = line.splitn(4, '\t');
                let size = parts.next()?.parse().ok()?;
                let modified = parts.next()?.parse().ok()?;
                let hash = match parts.next()? {
                    "-" => None,
                    h if h.len() == 64 => Some(h.to_string()),
                    _ => return None,
                };
                let name = parts.next()?.to_string();
                let plain = !name.is_empty() && !name.contains(['/', '\\']) && name != "..";
                plain.then_some(Entry {
                    name,
                    size,
                    modified,
                    hash,
                })
            })
            .collect::<Option<Vec<_>>>()?;
        (!entries.is_empty()).then_some(Manifest { entries })
    }

    /// The first difference between the files in `dir` and the manifest, if any.
    fn check(&self, dir: &Path) -> Result<(), String> {
        for e in &self.entries {
            let path = dir.join(&e.name);
            let meta = match fs::symlink_metadata(&path) {
                Ok(meta) if meta.is_file() => meta,
                Ok(_) => return Err(format!("{} is not a regular file", e.name)),
                Err(_) => return Err(format!("{} is missing", e.name)),
            };
            if meta.len() != e.size {
                return Err(format!(
                    "{} has {} bytes, the build wrote {}",
                    e.name,
                    meta.len(),
                    e.size
                ));
            }
            if modified_nanos(&meta) != e.modified {
                return Err(format!("{} was modified after the build", e.name));
            }
            if let Some(want) = &e.hash {
                let bytes = fs::read(&path).map_err(|err| format!("{}: {err}", e.name))?;
                if blake3::hash(&bytes).to_hex().as_str() != want {
                    return Err(format!("{} fails its checksum", e.name));
                }
            }
        }
        Ok(())
    }
}

/// Opens a complete cached index after checking it; `Err` says why it is not trusted.
fn open_checked(dir: &Path, num_fields: usize, verify: Verify) -> Result<IndexPostings, String> {
    let text = fs::read_to_string(dir.join(MARKER)).map_err(|_| "its manifest is unreadable")?;
    let manifest = Manifest::parse(&text).ok_or("its manifest is damaged")?;
    manifest.check(dir)?;
    let index = Index::open_in_dir(dir).map_err(|e| format!("the index does not open: {e}"))?;
    if verify == Verify::Full {
        let managed = index.directory();
        manifest
            .entries
            .par_iter()
            .filter(|e| e.hash.is_none())
            .try_for_each(|e| match managed.validate_checksum(Path::new(&e.name)) {
                Ok(true) => Ok(()),
                Ok(false) => Err(format!("{} fails its checksum", e.name)),
                Err(err) => Err(format!("{}: {err}", e.name)),
            })?;
    }
    open_cached(dir, &index, num_fields).map_err(|e| e.to_string())
}

fn open_cached(dir: &Path, index: &Index, num_fields: usize) -> Result<IndexPostings, IndexError> {
    let mut postings = IndexPostings::open(index, num_fields)?;
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

    fn big_corpus() -> Corpus {
        let words = [
            "tram", "trams", "ferry", "ferries", "bus", "pram", "ride", "route",
        ];
        let mut c = corpus();
        c.fields.push(FieldSpec {
            name: "title".into(),
            weight: 2.0,
        });
        c.documents = (0..300)
            .map(|i| Document {
                id: format!("d{i}"),
                title: format!("T{i}"),
                texts: vec![
                    (0..40)
                        .map(|j| words[(i * 7 + j * 3) % words.len()])
                        .collect::<Vec<_>>()
                        .join(" "),
                    format!("{} {}", words[i % 8], words[(i / 8) % 8]),
                ],
            })
            .collect();
        c.fingerprint = "big".into();
        c
    }

    /// What a reader of the index sees: every field's forms, lengths and postings.
    fn contents(p: &IndexPostings) -> (Vec<String>, Vec<Vec<u32>>, Vec<Vec<u32>>) {
        let forms = p.surface_forms().unwrap().forms.clone();
        let lengths = (0..2).map(|f| p.lengths(f).to_vec()).collect();
        let docs = forms
            .iter()
            .map(|form| p.postings(0, form).unwrap().docs.clone())
            .collect();
        (forms, lengths, docs)
    }

    enum Damage {
        /// Bytes flipped in the middle; `keep_time` puts the modification time back.
        Flip {
            keep_time: bool,
        },
        Truncate,
        Delete,
    }

    fn damage(path: &Path, how: &Damage) {
        match how {
            Damage::Flip { keep_time } => {
                let time = fs::metadata(path).unwrap().modified().unwrap();
                let mut bytes = fs::read(path).unwrap();
                let (mid, end) = (bytes.len() / 2, (bytes.len() / 2 + 16).min(bytes.len()));
                for b in &mut bytes[mid..end] {
                    *b ^= 0x5a;
                }
                fs::write(path, &bytes).unwrap();
                if *keep_time {
                    let file = fs::OpenOptions::new().write(true).open(path).unwrap();
                    file.set_modified(time).unwrap();
                }
            }
            Damage::Truncate => {
                let len = fs::metadata(path).unwrap().len();
                let file = fs::OpenOptions::new().write(true).open(path).unwrap();
                file.set_len(len / 2).unwrap();
            }
            Damage::Delete => fs::remove_file(path).unwrap(),
        }
    }

    /// Every kind of file of a cached index, damaged every way: the next open rebuilds
    /// (saying why) and reads exactly what the undamaged index held. Bytes flipped with the
    /// modification time put back are caught by the full check (and by the quick one in the
    /// small files it checksums).
    #[test]
    fn a_damaged_index_is_rebuilt_never_read() {
        let dir = tempfile::tempdir().unwrap();
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        let corpus = big_corpus();
        let first =
            open_or_build_checked(&corpus, &surface, dir.path(), Verify::Quick, &NoProgress)
                .unwrap();
        let want = contents(&first.postings);
        let path = first.path.clone();
        drop(first);
        // The file of each kind in the index as it is now (a rebuild names segments anew).
        let current = |kind: &str| -> Option<String> {
            let mut names: Vec<String> = fs::read_dir(&path)
                .unwrap()
                .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
                .filter(|n| n == kind || n.ends_with(&format!(".{kind}")))
                .collect();
            names.sort();
            names.into_iter().next()
        };
        let kinds = [
            "idx",
            "pos",
            "term",
            "store",
            "fast",
            "fieldnorm",
            "meta.json",
            ".managed.json",
            LENGTHS,
            MARKER,
            "lexdelta-forms.bin",
        ];
        let ways = [
            (Damage::Flip { keep_time: false }, Verify::Quick),
            (Damage::Flip { keep_time: true }, Verify::Full),
            (Damage::Truncate, Verify::Quick),
            (Damage::Delete, Verify::Quick),
        ];
        for kind in kinds {
            for (how, verify) in &ways {
                let name = current(kind).unwrap_or_else(|| panic!("a {kind} file"));
                damage(&path.join(&name), how);
                let opened =
                    open_or_build_checked(&corpus, &surface, dir.path(), *verify, &NoProgress)
                        .unwrap();
                if kind == "lexdelta-forms.bin" {
                    // Derived files carry their own checksums and are computed again.
                    assert_eq!(opened.status, CacheStatus::Reused, "{name}");
                } else {
                    assert_eq!(opened.status, CacheStatus::Built, "{name}");
                    assert!(opened.damage.is_some(), "{name}");
                }
                assert_eq!(contents(&opened.postings), want, "{name}");
            }
        }
        // A flip that keeps the time, in a large file, passes the quick check but never
        // the full one.
        let large = current("idx").unwrap();
        damage(&path.join(large), &Damage::Flip { keep_time: true });
        let full = open_or_build_checked(&corpus, &surface, dir.path(), Verify::Full, &NoProgress)
            .unwrap();
        assert!(full.damage.unwrap().contains("checksum"));
        assert_eq!(contents(&full.postings), want);
    }

    #[test]
    fn killed_builds_are_cleaned_up_but_live_ones_are_not() {
        let dir = tempfile::tempdir().unwrap();
        let killed = dir.path().join(".build-killed");
        fs::create_dir(&killed).unwrap();
        fs::write(killed.join(BUILD_LOCK), b"").unwrap();
        fs::write(killed.join("x.idx"), b"partial").unwrap();
        let live = dir.path().join(".build-live");
        fs::create_dir(&live).unwrap();
        let lock = fs::File::create(live.join(BUILD_LOCK)).unwrap();
        assert!(fs4::fs_std::FileExt::try_lock_exclusive(&lock).unwrap());
        // A damaged index a run moved aside but could not remove.
        let stale = dir.path().join(".stale-left");
        fs::create_dir(&stale).unwrap();
        fs::write(stale.join("x.idx"), b"damaged").unwrap();
        // Just made, without a lock file: a build that has not made its lock yet.
        let young = dir.path().join(".build-young");
        fs::create_dir(&young).unwrap();
        let surface = SurfaceStage::from_pipeline(&Pipeline::default());
        open_or_build(&corpus(), &surface, dir.path(), &NoProgress).unwrap();
        assert!(!killed.exists(), "a killed build is removed");
        assert!(!stale.exists(), "a damaged index moved aside is removed");
        assert!(live.exists(), "a build in progress is left alone");
        assert!(young.exists(), "a build that may be starting is left alone");
    }

    #[test]
    fn the_manifest_reads_back_and_refuses_damage() {
        let m = Manifest {
            entries: vec![Entry {
                name: "a.idx".into(),
                size: 3,
                modified: 17,
                hash: None,
            }],
        };
        assert_eq!(Manifest::parse(&m.render()), Some(m));
        for bad in [
            "",
            "lexdelta surface index v1\n3\t17\t-\ta.idx\n",
            "lexdelta surface index v3\n",
            "lexdelta surface index v3\nx\t17\t-\ta.idx\n",
            "lexdelta surface index v3\n3\t17\t-\t../a.idx\n",
            "lexdelta surface index v3\n3\t17\tabc\ta.idx\n",
        ] {
            let bad = bad.replace("v3", &format!("v{FORMAT_VERSION}"));
            assert_eq!(Manifest::parse(&bad), None, "{bad:?}");
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
