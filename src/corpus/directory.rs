//! The files of a directory corpus: every `.txt` and `.md` file below it, each read once.
//!
//! Symbolic links are followed while they stay inside the directory, and each file and
//! directory is visited once whatever the number of names leading to it, so a link loop
//! ends the walk instead of repeating it. A link that leaves the directory, or leads
//! nowhere, is an error naming it.

use std::collections::HashSet;
use std::fs;
use std::path::{Path, PathBuf};

use super::CorpusError;

/// `(id, path)` of every text file below `root`, sorted by path; the id is the path below
/// `root` with `/` separators.
pub(super) fn text_files(root: &Path) -> Result<Vec<(String, PathBuf)>, CorpusError> {
    let canonical_root = canonical(root)?;
    let mut walk = Walk {
        root: &canonical_root,
        shown_root: root,
        dirs: HashSet::from([canonical_root.clone()]),
        files: HashSet::new(),
        out: Vec::new(),
    };
    walk.dir(root)?;
    let mut files = walk.out;
    files.sort();
    Ok(files
        .into_iter()
        .map(|file| {
            let id = file
                .strip_prefix(root)
                .unwrap_or(&file)
                .to_string_lossy()
                .replace('\\', "/");
            (id, file)
        })
        .collect())
}

struct Walk<'a> {
    /// The directory, resolved: every link must lead inside it.
    root: &'a Path,
    shown_root: &'a Path,
    /// Resolved directories and files already taken.
    dirs: HashSet<PathBuf>,
    files: HashSet<PathBuf>,
    out: Vec<PathBuf>,
}

impl Walk<'_> {
    fn dir(&mut self, dir: &Path) -> Result<(), CorpusError> {
        let io = |path: &Path| {
            let path = path.to_path_buf();
            move |source| CorpusError::Io { path, source }
        };
        let mut entries = fs::read_dir(dir)
            .map_err(io(dir))?
            .map(|e| e.map(|e| e.path()))
            .collect::<Result<Vec<_>, _>>()
            .map_err(io(dir))?;
        // Sorted, so that which of two names of one file is taken does not depend on the
        // order the file system lists them in.
        entries.sort();
        for path in entries {
            let kind = fs::symlink_metadata(&path).map_err(io(&path))?.file_type();
            let is_text = is_text_file(&path);
            if kind.is_symlink() {
                // A link is looked at only if it would be read: a text file or a directory.
                let leads_to_dir = fs::metadata(&path).is_ok_and(|m| m.is_dir());
                if !is_text && !leads_to_dir {
                    continue;
                }
                let Ok(target) = fs::canonicalize(&path) else {
                    return Err(self.refuse(&path, "leads nowhere (a broken link or a loop)"));
                };
                if !target.starts_with(self.root) {
                    return Err(
                        self.refuse(&path, &format!("leads outside it, to {}", target.display()))
                    );
                }
                let meta = fs::metadata(&path).map_err(io(&path))?;
                if meta.is_dir() {
                    if self.dirs.insert(target) {
                        self.dir(&path)?;
                    }
                } else if meta.is_file() && is_text && self.files.insert(target) {
                    self.out.push(path);
                }
            } else if kind.is_dir() {
                if self.dirs.insert(canonical(&path)?) {
                    self.dir(&path)?;
                }
            } else if kind.is_file() && is_text && self.files.insert(canonical(&path)?) {
                self.out.push(path);
            }
        }
        Ok(())
    }

    fn refuse(&self, link: &Path, what: &str) -> CorpusError {
        CorpusError::Invalid {
            path: link.to_path_buf(),
            message: format!(
                "a symbolic link in the corpus directory {} that {what}; remove the link, or \
                 copy what it points at into the directory",
                self.shown_root.display()
            ),
        }
    }
}

fn is_text_file(path: &Path) -> bool {
    matches!(
        path.extension().and_then(|e| e.to_str()),
        Some("txt" | "md")
    )
}

fn canonical(path: &Path) -> Result<PathBuf, CorpusError> {
    fs::canonicalize(path).map_err(|source| CorpusError::Io {
        path: path.to_path_buf(),
        source,
    })
}

#[cfg(all(test, unix))]
mod tests {
    use super::*;
    use std::os::unix::fs::symlink;

    #[test]
    fn links_are_followed_inside_once_and_refused_outside() {
        let outside = tempfile::tempdir().unwrap();
        fs::write(outside.path().join("secret.txt"), "x").unwrap();
        let dir = tempfile::tempdir().unwrap();
        let root = dir.path().join("docs");
        fs::create_dir_all(root.join("a")).unwrap();
        fs::write(root.join("a/one.txt"), "one").unwrap();
        fs::write(root.join("b.md"), "b").unwrap();
        // A loop back to the root, a second name for a file, a link to a directory.
        symlink(&root, root.join("a/loop")).unwrap();
        symlink(root.join("b.md"), root.join("c.md")).unwrap();
        symlink(root.join("a"), root.join("z")).unwrap();
        let ids: Vec<String> = text_files(&root)
            .unwrap()
            .into_iter()
            .map(|f| f.0)
            .collect();
        assert_eq!(ids, ["a/one.txt", "b.md"]);

        symlink(outside.path().join("secret.txt"), root.join("s.txt")).unwrap();
        let err = text_files(&root).unwrap_err().to_string();
        assert!(err.contains("s.txt: a symbolic link"), "{err}");
        assert!(err.contains("leads outside it"), "{err}");
        fs::remove_file(root.join("s.txt")).unwrap();

        symlink(root.join("gone.txt"), root.join("broken.txt")).unwrap();
        let err = text_files(&root).unwrap_err().to_string();
        assert!(err.contains("leads nowhere"), "{err}");
    }
}
