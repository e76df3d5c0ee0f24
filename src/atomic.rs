//! Writing files atomically: a temporary file in the same directory, then a rename, so a
//! reader sees the old file or the new one, never half of one.
//!
//! Only regular files are written or replaced: a rename would put a regular file in the
//! place of a device, FIFO, socket or symbolic link (`--html /dev/null` run as root would
//! replace the device). A replaced file keeps its permissions; a new one gets the usual
//! permissions for new files (read and write for all, less the process's umask).
//!
//! A command that writes several files checks them all with [`check_outputs`] before it
//! computes anything, so a bad second path never leaves the first written.

use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

/// Why a file was not written.
#[derive(Debug, thiserror::Error)]
pub enum WriteError {
    #[error("{0} exists; pass --force to replace it")]
    Exists(String),
    #[error(
        "{path} is {what}, not a regular file; lexdelta writes only regular files (name a file path instead)"
    )]
    NotRegular { path: String, what: &'static str },
    #[error("cannot write {path}: the directory {dir} does not exist; create it first")]
    NoDirectory { path: String, dir: String },
    #[error("{first} and {second} name the same file; give each output its own path")]
    SamePath { first: String, second: String },
    #[error("cannot write {path}: {source}")]
    Io {
        path: String,
        #[source]
        source: std::io::Error,
    },
}

/// What a path names, in the words of an error, when it is not a regular file.
fn not_regular(meta: &fs::Metadata) -> Option<&'static str> {
    let kind = meta.file_type();
    if kind.is_file() {
        return None;
    }
    if kind.is_symlink() {
        return Some("a symbolic link");
    }
    if kind.is_dir() {
        return Some("a directory");
    }
    #[cfg(unix)]
    {
        use std::os::unix::fs::FileTypeExt;
        if kind.is_char_device() || kind.is_block_device() {
            return Some("a device");
        }
        if kind.is_fifo() {
            return Some("a FIFO");
        }
        if kind.is_socket() {
            return Some("a socket");
        }
    }
    Some("a special file")
}

fn parent_of(path: &Path) -> &Path {
    match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p,
        _ => Path::new("."),
    }
}

/// The target's metadata (not following a link), or `None` if nothing is there.
fn existing(path: &Path) -> Result<Option<fs::Metadata>, WriteError> {
    match fs::symlink_metadata(path) {
        Ok(meta) => Ok(Some(meta)),
        Err(e) if e.kind() == std::io::ErrorKind::NotFound => Ok(None),
        Err(source) => Err(WriteError::Io {
            path: path.display().to_string(),
            source,
        }),
    }
}

/// Checks one output path without writing it: its directory exists and takes new files,
/// and the path names a regular file or nothing (and nothing, without `overwrite`).
pub fn check_output(path: &Path, overwrite: bool) -> Result<(), WriteError> {
    let shown = path.display().to_string();
    if let Some(meta) = existing(path)? {
        if let Some(what) = not_regular(&meta) {
            return Err(WriteError::NotRegular { path: shown, what });
        }
        if !overwrite {
            return Err(WriteError::Exists(shown));
        }
    }
    let dir = parent_of(path);
    if !dir.is_dir() {
        return Err(WriteError::NoDirectory {
            path: shown,
            dir: dir.display().to_string(),
        });
    }
    // The directory must take a new file: create the temporary file the write would, and
    // remove it again.
    tempfile::Builder::new()
        .prefix(".lexdelta-")
        .tempfile_in(dir)
        .map(drop)
        .map_err(|source| WriteError::Io {
            path: shown,
            source,
        })
}

/// The file a path names, for comparing two paths: its directory resolved, then its name.
fn identity(path: &Path) -> PathBuf {
    let dir = fs::canonicalize(parent_of(path)).unwrap_or_else(|_| parent_of(path).into());
    match path.file_name() {
        Some(name) => dir.join(name),
        None => dir,
    }
}

/// Checks every output path of a command before any is written: each as
/// [`check_output`], and no two naming the same file.
pub fn check_outputs(paths: &[&Path], overwrite: bool) -> Result<(), WriteError> {
    for (i, path) in paths.iter().enumerate() {
        check_output(path, overwrite)?;
        if let Some(earlier) = paths[..i].iter().find(|p| identity(p) == identity(path)) {
            return Err(WriteError::SamePath {
                first: earlier.display().to_string(),
                second: path.display().to_string(),
            });
        }
    }
    Ok(())
}

/// Writes `bytes` to `path` atomically. Without `overwrite`, an existing file is left alone
/// and reported. Anything but a regular file at `path` is refused.
pub fn write_file(path: &Path, bytes: &[u8], overwrite: bool) -> Result<(), WriteError> {
    let shown = path.display().to_string();
    let io = |source| WriteError::Io {
        path: shown.clone(),
        source,
    };
    let replaced = existing(path)?;
    if let Some(meta) = &replaced
        && let Some(what) = not_regular(meta)
    {
        return Err(WriteError::NotRegular { path: shown, what });
    }
    let dir = parent_of(path);
    if !dir.is_dir() {
        return Err(WriteError::NoDirectory {
            path: shown,
            dir: dir.display().to_string(),
        });
    }
    let mut builder = tempfile::Builder::new();
    builder.prefix(".lexdelta-");
    #[cfg(unix)]
    {
        use std::os::unix::fs::PermissionsExt;
        // Created as any new file is (the umask applies); a replaced file's mode is set
        // below, as it was.
        builder.permissions(fs::Permissions::from_mode(0o666));
    }
    let mut tmp = builder.tempfile_in(dir).map_err(io)?;
    if let Some(meta) = &replaced {
        tmp.as_file()
            .set_permissions(meta.permissions())
            .map_err(io)?;
    }
    tmp.write_all(bytes).map_err(io)?;
    tmp.as_file().sync_all().map_err(io)?;
    if overwrite {
        tmp.persist(path).map_err(|e| io(e.error))?;
    } else {
        // persist_noclobber refuses atomically if the file appeared meanwhile.
        tmp.persist_noclobber(path).map_err(|e| {
            if e.error.kind() == std::io::ErrorKind::AlreadyExists {
                WriteError::Exists(shown.clone())
            } else {
                io(e.error)
            }
        })?;
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn refuses_to_overwrite_without_permission() {
        let dir = tempfile::tempdir().unwrap();
        let path = dir.path().join("a.yaml");
        write_file(&path, b"one", false).unwrap();
        assert!(matches!(
            write_file(&path, b"two", false),
            Err(WriteError::Exists(_))
        ));
        assert_eq!(std::fs::read(&path).unwrap(), b"one");
        write_file(&path, b"two", true).unwrap();
        assert_eq!(std::fs::read(&path).unwrap(), b"two");
        assert_eq!(
            std::fs::read_dir(dir.path()).unwrap().count(),
            1,
            "no temp file left"
        );
    }

    #[cfg(unix)]
    #[test]
    fn special_files_are_refused_and_modes_kept() {
        use std::os::unix::fs::PermissionsExt;
        let dir = tempfile::tempdir().unwrap();
        for special in ["/dev/null", "/dev/full"] {
            let err = write_file(Path::new(special), b"x", true).unwrap_err();
            assert!(
                matches!(
                    err,
                    WriteError::NotRegular {
                        what: "a device",
                        ..
                    }
                ),
                "{err}"
            );
        }
        assert!(matches!(
            write_file(dir.path(), b"x", true),
            Err(WriteError::NotRegular {
                what: "a directory",
                ..
            })
        ));
        let target = dir.path().join("target");
        fs::write(&target, b"keep").unwrap();
        let link = dir.path().join("link");
        std::os::unix::fs::symlink(&target, &link).unwrap();
        assert!(matches!(
            write_file(&link, b"x", true),
            Err(WriteError::NotRegular {
                what: "a symbolic link",
                ..
            })
        ));
        assert_eq!(fs::read(&target).unwrap(), b"keep");

        let kept = dir.path().join("kept");
        fs::write(&kept, b"old").unwrap();
        fs::set_permissions(&kept, fs::Permissions::from_mode(0o640)).unwrap();
        write_file(&kept, b"new", true).unwrap();
        assert_eq!(kept.metadata().unwrap().permissions().mode() & 0o777, 0o640);

        // A new file gets 0666 less the umask (temporary files alone would be 0600).
        let fresh = dir.path().join("fresh");
        write_file(&fresh, b"new", false).unwrap();
        let mode = fresh.metadata().unwrap().permissions().mode() & 0o777;
        let status = fs::read_to_string("/proc/self/status").unwrap_or_default();
        let umask = status
            .lines()
            .find_map(|l| l.strip_prefix("Umask:"))
            .and_then(|m| u32::from_str_radix(m.trim(), 8).ok())
            .expect("Linux reports the umask in /proc/self/status");
        assert_eq!(mode, 0o666 & !umask);
    }

    #[test]
    fn outputs_are_checked_together_before_any_is_written() {
        let dir = tempfile::tempdir().unwrap();
        let a = dir.path().join("a.md");
        let missing = dir.path().join("missing/b.html");
        let err = check_outputs(&[&a, &missing], true).unwrap_err();
        assert!(matches!(err, WriteError::NoDirectory { .. }), "{err}");
        let same = dir.path().join(".").join("a.md");
        let err = check_outputs(&[&a, &same], true).unwrap_err();
        assert!(matches!(err, WriteError::SamePath { .. }), "{err}");
        check_outputs(&[&a, &dir.path().join("b.md")], true).unwrap();
        assert_eq!(
            fs::read_dir(dir.path()).unwrap().count(),
            0,
            "checking writes nothing"
        );
    }
}
