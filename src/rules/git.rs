//! Reading a ruleset as it was at a git revision, straight from the object store: no
//! checkout, no stash, the working tree untouched.

use std::path::Path;
use std::process::Command;

use super::error::RulesError;
use super::load::{SourceFile, file_too_large, load_sources, not_utf8};
use super::yaml::MAX_FILE_BYTES;
use super::{Diagnostic, Ruleset};

/// Refuses revision arguments that git could take as an option or a path trick.
pub fn validate_revision(rev: &str) -> Result<(), RulesError> {
    let allowed = |c: char| c.is_ascii_alphanumeric() || "._/~^@{}-+".contains(c);
    if rev.is_empty() || rev.starts_with('-') || !rev.chars().all(allowed) || rev.contains("..") {
        return Err(RulesError::Git(format!(
            "{rev:?} is not a revision lexdelta accepts; give a branch, tag, commit or HEAD~N"
        )));
    }
    Ok(())
}

fn git(repo: &Path, args: &[&str]) -> Result<Vec<u8>, RulesError> {
    let output = Command::new("git")
        .arg("-C")
        .arg(repo)
        .args(args)
        .output()
        .map_err(|e| RulesError::Git(format!("cannot run git: {e}")))?;
    if !output.status.success() {
        let stderr = String::from_utf8_lossy(&output.stderr);
        return Err(RulesError::Git(stderr.trim().to_string()));
    }
    Ok(output.stdout)
}

/// Loads the ruleset directory `dir` (relative to the repository root) as of `rev`.
/// `repo` is any directory inside the repository.
pub fn load_at_revision(repo: &Path, rev: &str, dir: &str) -> Result<Ruleset, RulesError> {
    validate_revision(rev)?;
    let commit = git(
        repo,
        &[
            "rev-parse",
            "--verify",
            "--quiet",
            "--end-of-options",
            &format!("{rev}^{{commit}}"),
        ],
    )
    .map_err(|_| RulesError::Git(format!("{rev:?} is not a commit in this repository")))?;
    let commit = String::from_utf8_lossy(&commit).trim().to_string();
    let dir = dir.trim_end_matches('/');
    let listing = git(
        repo,
        &["ls-tree", "-z", "--long", &commit, "--", &format!("{dir}/")],
    )?;
    let mut sources = Vec::new();
    let mut too_large = Vec::new();
    for entry in listing.split(|b| *b == 0).filter(|e| !e.is_empty()) {
        let entry = String::from_utf8_lossy(entry);
        // "<mode> <type> <object> <size>\t<path>"
        let Some((meta, path)) = entry.split_once('\t') else {
            continue;
        };
        let fields: Vec<&str> = meta.split_whitespace().collect();
        let is_yaml = path.ends_with(".yaml") || path.ends_with(".yml");
        if fields.get(1) != Some(&"blob") || !is_yaml {
            continue;
        }
        let name = format!("{rev}:{path}");
        if fields.first() == Some(&"120000") {
            // A symbolic link: git stores its target's name, not a rule file.
            too_large.push(
                Diagnostic::new(
                    &name,
                    None,
                    "a symbolic link; rule files in git must be regular files",
                )
                .help("commit the rule file itself in the ruleset directory"),
            );
            continue;
        }
        let size: u64 = fields.get(3).and_then(|s| s.parse().ok()).unwrap_or(0);
        if size > MAX_FILE_BYTES {
            too_large.push(file_too_large(&name, size));
            continue;
        }
        let bytes = git(repo, &["cat-file", "blob", fields[2]])?;
        match String::from_utf8(bytes) {
            Ok(text) => sources.push(SourceFile { name, text }),
            Err(err) => too_large.push(not_utf8(&name, err.as_bytes(), err.utf8_error())),
        }
    }
    if !too_large.is_empty() {
        return Err(RulesError::Invalid(too_large));
    }
    sources.sort_by(|a, b| a.name.cmp(&b.name));
    load_sources(&format!("{rev}:{dir}"), sources)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn option_like_revisions_are_refused() {
        for bad in ["--output=x", "-n", "", "a b", "HEAD;rm", "a..b", "$(x)"] {
            assert!(validate_revision(bad).is_err(), "{bad}");
        }
        for good in ["HEAD", "HEAD~1", "main", "origin/main", "v1.2", "abc123^"] {
            assert!(validate_revision(good).is_ok(), "{good}");
        }
    }
}
