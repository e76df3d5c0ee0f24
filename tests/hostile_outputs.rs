//! Hostile surroundings through the CLI: output paths that are devices, directories, links
//! or missing directories; a cached index damaged every way; terminal escape sequences in
//! corpus titles and queries; a corpus with nothing for `stemcheck` to measure. Bad input
//! exits 2 with a message naming the path, valid input 0; nothing panics, no output file
//! is left behind by a failed run, and each run takes under two seconds of CPU.

use std::path::{Path, PathBuf};
mod hostile_support;

use hostile_support::{Run, lexdelta};

const ROOT: &str = env!("CARGO_MANIFEST_DIR");

fn files_in(dir: &Path) -> Vec<String> {
    let mut names: Vec<String> = std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
        .collect();
    names.sort();
    names
}

#[cfg(unix)]
#[test]
fn outputs_are_regular_files_or_nothing() {
    let dir = tempfile::tempdir().unwrap();
    let d = dir.path();
    std::fs::create_dir(d.join("taken")).unwrap();
    std::fs::write(d.join("target.dot"), "keep me").unwrap();
    std::os::unix::fs::symlink(d.join("target.dot"), d.join("link.dot")).unwrap();
    let rules = format!("{ROOT}/rules");
    for (out, says) in [
        ("/dev/null", "/dev/null is a device, not a regular file"),
        ("/dev/full", "/dev/full is a device, not a regular file"),
        ("taken", "taken is a directory, not a regular file"),
        (
            "link.dot",
            "link.dot is a symbolic link, not a regular file",
        ),
        (
            "no/such/dir/g.dot",
            "the directory no/such/dir does not exist",
        ),
    ] {
        let run = lexdelta(d, &["lint", "--rules", &rules, "--graph", out]);
        assert_eq!(run.code, 2, "{out}: {}", run.stderr);
        assert!(run.stderr.contains(says), "{out}: {}", run.stderr);
    }
    assert_eq!(
        std::fs::read_to_string(d.join("target.dot")).unwrap(),
        "keep me"
    );
    assert_eq!(files_in(d), ["link.dot", "taken", "target.dot"]);
    // A regular file is replaced and keeps its mode.
    use std::os::unix::fs::PermissionsExt;
    std::fs::set_permissions(d.join("target.dot"), std::fs::Permissions::from_mode(0o640)).unwrap();
    let run = lexdelta(d, &["lint", "--rules", &rules, "--graph", "target.dot"]);
    assert!(run.code == 0 || run.code == 1, "{}", run.stderr);
    assert!(
        std::fs::read_to_string(d.join("target.dot"))
            .unwrap()
            .starts_with("digraph")
    );
    let mode = std::fs::metadata(d.join("target.dot"))
        .unwrap()
        .permissions()
        .mode();
    assert_eq!(mode & 0o777, 0o640);
    assert_eq!(files_in(d), ["link.dot", "taken", "target.dot"]);
}

/// A small sample whose one document's title and whose query carry terminal escape
/// sequences, and a change that gains that document for that query.
struct Sample {
    dir: tempfile::TempDir,
}

impl Sample {
    fn new() -> Sample {
        let dir = tempfile::tempdir().unwrap();
        let d = dir.path();
        for side in ["base", "head"] {
            std::fs::create_dir(d.join(side)).unwrap();
        }
        std::fs::write(
            d.join("base/a.yaml"),
            "format: 1\nrevision: 1\nexempt: [zzz]\n",
        )
        .unwrap();
        std::fs::write(
            d.join("head/a.yaml"),
            "format: 1\nrevision: 2\nexempt: [zzz]\nsynonyms:\n  - [pram, buggy]\n",
        )
        .unwrap();
        let mut docs = String::new();
        for i in 0..40 {
            docs.push_str(&format!(
                "{{\"id\":\"d{i}\",\"title\":\"Buggy {i} \\u001b]0;owned\\u0007\\u001b[2J\",\"body\":\"buggy rides and trams {i}\"}}\n"
            ));
        }
        docs.push_str("{\"id\":\"p\",\"title\":\"Prams\",\"body\":\"pram parking\"}\n");
        std::fs::write(d.join("docs.jsonl"), docs).unwrap();
        std::fs::write(
            d.join("queries.jsonl"),
            "{\"query\":\"pram \\u001b[31mred\",\"count\":3}\n{\"query\":\"pram\",\"count\":5}\n{\"query\":\"trams\",\"count\":2}\n",
        )
        .unwrap();
        Sample { dir }
    }

    fn path(&self) -> &Path {
        self.dir.path()
    }

    fn preview(&self, format: &str, extra: &[&str]) -> Run {
        let mut args = vec![
            "preview",
            "--base",
            "base",
            "--head",
            "head",
            "--corpus",
            "docs.jsonl",
            "--queries",
            "queries.jsonl",
            "--cache",
            "cache",
            "--format",
            format,
        ];
        args.extend_from_slice(extra);
        lexdelta(self.path(), &args)
    }

    fn index_dir(&self) -> PathBuf {
        let cache = self.path().join("cache");
        let found: Vec<PathBuf> = std::fs::read_dir(&cache)
            .unwrap()
            .map(|e| e.unwrap().path())
            .filter(|p| {
                p.file_name()
                    .unwrap()
                    .to_string_lossy()
                    .starts_with("surface-")
            })
            .collect();
        assert_eq!(found.len(), 1, "{found:?}");
        found[0].clone()
    }
}

#[test]
fn escape_sequences_from_the_corpus_never_reach_the_terminal() {
    let sample = Sample::new();
    let run = sample.preview("text", &["--no-cache"]);
    assert_eq!(run.code, 0, "{}", run.stderr);
    assert!(run.stdout.contains("Buggy"), "{}", run.stdout);
    assert!(
        run.stdout.contains("\\u{1b}]0;owned\\u{7}"),
        "{}",
        run.stdout
    );
    assert!(!run.stdout.contains('\u{1b}') && !run.stdout.contains('\u{7}'));
    assert!(!run.stderr.contains('\u{1b}'));
}

/// Every kind of index file damaged every way: the next run rebuilds the index, says so,
/// and prints exactly what a cold run printed.
#[test]
fn a_damaged_cache_is_rebuilt_and_the_report_is_unchanged() {
    let sample = Sample::new();
    let cold = sample.preview("json", &[]);
    assert_eq!(cold.code, 0, "{}", cold.stderr);
    let warm = sample.preview("text", &[]);
    assert!(
        warm.stdout.contains("surface index: reused"),
        "{}",
        warm.stdout
    );
    let kinds = [
        "idx",
        "pos",
        "term",
        "store",
        "fast",
        "fieldnorm",
        "meta.json",
        ".managed.json",
        "lexdelta-lengths.bin",
        "lexdelta-complete",
    ];
    for kind in kinds {
        for how in ["flip", "truncate", "delete"] {
            let dir = sample.index_dir();
            let file = files_in(&dir)
                .into_iter()
                .find(|n| n == kind || n.ends_with(&format!(".{kind}")))
                .unwrap_or_else(|| panic!("a {kind} file"));
            let path = dir.join(&file);
            match how {
                "flip" => {
                    let mut bytes = std::fs::read(&path).unwrap();
                    let mid = bytes.len() / 2;
                    let end = (mid + 16).min(bytes.len());
                    bytes[mid..end].iter_mut().for_each(|b| *b ^= 0xff);
                    std::fs::write(&path, bytes).unwrap();
                }
                "truncate" => {
                    let len = std::fs::metadata(&path).unwrap().len();
                    let f = std::fs::OpenOptions::new().write(true).open(&path).unwrap();
                    f.set_len(len / 3).unwrap();
                }
                _ => std::fs::remove_file(&path).unwrap(),
            }
            let run = sample.preview("json", &[]);
            assert_eq!(run.code, 0, "{how} {file}: {}", run.stderr);
            assert_eq!(run.stdout, cold.stdout, "{how} {file}: the report changed");
            assert!(
                run.stderr.contains("was damaged") && run.stderr.contains("built again"),
                "{how} {file}: no notice in {:?}",
                run.stderr
            );
        }
    }
    // Bytes flipped with the modification time put back: --verify-cache finds them.
    let dir = sample.index_dir();
    let idx = files_in(&dir)
        .into_iter()
        .find(|n| n.ends_with(".idx"))
        .unwrap();
    let path = dir.join(&idx);
    let time = std::fs::metadata(&path).unwrap().modified().unwrap();
    let mut bytes = std::fs::read(&path).unwrap();
    let mid = bytes.len() / 2;
    bytes[mid] ^= 0x01;
    std::fs::write(&path, bytes).unwrap();
    std::fs::OpenOptions::new()
        .write(true)
        .open(&path)
        .unwrap()
        .set_modified(time)
        .unwrap();
    let run = sample.preview("json", &["--verify-cache"]);
    assert_eq!(run.stdout, cold.stdout);
    assert!(run.stderr.contains("fails its checksum"), "{}", run.stderr);
    // A build killed long ago left a directory no lock holds: the next build removes it.
    let killed = sample.path().join("cache/.build-killed");
    std::fs::create_dir(&killed).unwrap();
    std::fs::write(killed.join("lexdelta-build.lock"), "").unwrap();
    std::fs::remove_dir_all(sample.index_dir()).unwrap();
    assert_eq!(sample.preview("json", &[]).stdout, cold.stdout);
    assert!(
        !killed.exists(),
        "the killed build's directory is cleaned up"
    );
}

#[test]
fn stemcheck_over_a_corpus_without_words_is_an_error() {
    let dir = tempfile::tempdir().unwrap();
    let d = dir.path();
    std::fs::write(d.join("empty.jsonl"), "").unwrap();
    std::fs::write(
        d.join("symbols.jsonl"),
        "{\"id\":\"a\",\"title\":\"🚋\",\"body\":\"12 34 ⌘\"}\n",
    )
    .unwrap();
    let rules = format!("{ROOT}/rules");
    for corpus in ["empty.jsonl", "symbols.jsonl"] {
        let run = lexdelta(
            d,
            &[
                "stemcheck",
                "--rules",
                &rules,
                "--wordnet-groups",
                "--corpus",
                corpus,
            ],
        );
        assert_eq!(run.code, 2, "{corpus}: {}{}", run.stdout, run.stderr);
        assert!(run.stderr.contains(corpus), "{corpus}: {}", run.stderr);
        assert!(
            run.stdout.is_empty(),
            "no figures are printed: {}",
            run.stdout
        );
    }
}
