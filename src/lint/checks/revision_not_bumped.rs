//! `revision-not-bumped`: a file whose rules changed while its `revision` did not go up.

use super::{CheckInfo, Needs};
use crate::lint::{Context, Finding};
use crate::rules::{FileInfo, Ruleset};
use crate::severity::Severity;

pub const INFO: CheckInfo = CheckInfo {
    name: "revision-not-bumped",
    severity: Severity::Error,
    needs: Needs::Base,
    summary: "a rule file whose rules changed against the base ruleset but whose revision did not go up",
    finds: "A file present in both the base ruleset and this one whose rule content differs \
            (comments, layout and the `revision` line itself are ignored) while its \
            `revision` is not greater than the base's; and a file whose revision went down.",
    why: "The revision is how a deployed analyzer, a cached preview and a review report say \
          which rules they used. A change under an old revision number makes two different \
          rule contents look like one, so a report or cache can silently describe the wrong \
          rules.",
    example: "# base: synonyms.yaml, revision: 12\n# this change edits a set and keeps\nrevision: 12",
    fix: "Bump `revision` in every file the change touches (one more than the base).",
};

pub fn run(cx: &Context, out: &mut Vec<Finding>) {
    if let Some(base) = cx.base {
        out.extend(revision_findings(cx.ruleset, base));
    }
}

/// Compares each file of `current` with the file of the same name in `base` (names are
/// taken relative to each ruleset's own directory, so `rules/a.yaml` meets `HEAD:rules/a.yaml`
/// or `old/a.yaml`). New and removed files are not findings.
pub fn revision_findings(current: &Ruleset, base: &Ruleset) -> Vec<Finding> {
    let mut out = Vec::new();
    for file in &current.files {
        let name = relative_name(current, file);
        let Some(old) = base.files.iter().find(|f| relative_name(base, f) == name) else {
            continue;
        };
        let changed = file.rules_hash != old.rules_hash;
        let message = if file.revision < old.revision {
            format!(
                "the revision went down, from {} in the base to {}",
                old.revision, file.revision
            )
        } else if changed && file.revision == old.revision {
            format!(
                "the rules in this file changed, but its revision is still {}",
                file.revision
            )
        } else {
            continue;
        };
        out.push(
            Finding::new(&INFO, &file.revision_origin, message)
                .related(
                    &old.revision_origin,
                    format!("the base's revision: {}", old.revision),
                    None,
                )
                .help(format!("set `revision: {}`", old.revision + 1)),
        );
    }
    out
}

/// A file's name inside its ruleset: the path with the ruleset's directory taken off.
fn relative_name<'a>(ruleset: &Ruleset, file: &'a FileInfo) -> &'a str {
    let name: &str = &file.name;
    let dir = ruleset.source.trim_end_matches(['/', '\\']);
    let stripped = name
        .strip_prefix(dir)
        .and_then(|rest| rest.strip_prefix(['/', '\\']));
    match stripped {
        Some(rest) => rest,
        None => name.rsplit(['/', '\\', ':']).next().unwrap_or(name),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rules::{SourceFile, load_sources};

    fn ruleset(dir: &str, files: &[(&str, &str)]) -> Ruleset {
        load_sources(
            dir,
            files
                .iter()
                .map(|(name, text)| SourceFile {
                    name: format!("{dir}/{name}"),
                    text: text.to_string(),
                })
                .collect(),
        )
        .unwrap()
    }

    #[test]
    fn a_changed_file_needs_a_new_revision() {
        let base = ruleset(
            "old",
            &[
                ("s.yaml", "format: 1\nrevision: 12\nexempt: [news]\n"),
                ("t.yaml", "format: 1\nrevision: 3\nexempt: [tram]\n"),
                ("u.yaml", "format: 1\nrevision: 5\nexempt: [bus]\n"),
            ],
        );
        let current = ruleset(
            "new",
            &[
                (
                    "s.yaml",
                    "format: 1\nrevision: 12\nexempt: [news, wayfare]\n",
                ),
                (
                    "t.yaml",
                    "# comment only\nformat: 1\nrevision: 3\nexempt:\n  - tram\n",
                ),
                ("u.yaml", "format: 1\nrevision: 4\nexempt: [bus]\n"),
                ("v.yaml", "format: 1\nrevision: 1\nexempt: [ferry]\n"),
            ],
        );
        let found = revision_findings(&current, &base);
        assert_eq!(found.len(), 2, "{found:#?}");
        assert_eq!(&*found[0].origin.file, "new/s.yaml");
        assert_eq!(found[0].origin.line, 2);
        assert!(found[0].message.contains("still 12"));
        assert_eq!(found[0].help.as_deref(), Some("set `revision: 13`"));
        assert!(found[1].message.contains("went down"));
    }

    #[test]
    fn a_bumped_file_is_fine() {
        let base = ruleset(
            "old",
            &[("s.yaml", "format: 1\nrevision: 12\nexempt: [news]\n")],
        );
        let current = ruleset(
            "HEAD:rules",
            &[("s.yaml", "format: 1\nrevision: 13\nexempt: [wayfare]\n")],
        );
        assert!(revision_findings(&current, &base).is_empty());
    }
}
