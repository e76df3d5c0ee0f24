//! Writing files atomically: a temporary file in the same directory, then a rename, so a
//! reader sees the old file or the new one, never half of one.

use std::io::Write;
use std::path::Path;

/// Why a file was not written.
#[derive(Debug, thiserror::Error)]
pub enum WriteError {
    #[error("{0} exists; pass --force to replace it")]
    Exists(String),
    #[error("cannot write {path}: {source}")]
    Io {
        path: String,
        #[source]
        source: std::io::Error,
    },
}

/// Writes `bytes` to `path` atomically. Without `overwrite`, an existing file is left alone
/// and reported.
pub fn write_file(path: &Path, bytes: &[u8], overwrite: bool) -> Result<(), WriteError> {
    let shown = path.display().to_string();
    let io = |source| WriteError::Io {
        path: shown.clone(),
        source,
    };
    let dir = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p,
        _ => Path::new("."),
    };
    let mut tmp = tempfile::Builder::new()
        .prefix(".lexdelta-")
        .tempfile_in(dir)
        .map_err(io)?;
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
}
