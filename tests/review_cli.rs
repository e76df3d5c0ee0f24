//! `lexdelta review` end to end: two directories, a temporary git repository with two
//! commits of rules, the gate both ways, a stable Markdown report, and an HTML page that
//! shows hostile document text as text.

use std::path::Path;
use std::process::Command as Process;

use assert_cmd::Command;
use predicates::prelude::*;

const ROOT: &str = env!("CARGO_MANIFEST_DIR");

fn lexdelta(dir: &Path) -> Command {
    let mut cmd = Command::cargo_bin("lexdelta").unwrap();
    cmd.current_dir(dir).env("NO_COLOR", "1");
    cmd
}

#[test]
fn the_demo_change_is_blocked_with_the_planted_harms_named() {
    let dir = tempfile::tempdir().unwrap();
    let html = dir.path().join("review.html");
    let out = lexdelta(Path::new(ROOT))
        .args([
            "review",
            "--demo",
            "--format",
            "markdown",
            "--no-cache",
            "--html",
        ])
        .arg(&html)
        .assert()
        .code(1)
        .stderr(predicate::str::contains(
            "gate: max_emptied_searches: \"transitions\"",
        ))
        .get_output()
        .stdout
        .clone();
    let md = String::from_utf8(out).unwrap();
    for expected in [
        "**Gate: blocked**",
        "`accessible-travel`", // the synonym whose stem also matches "university"
        "irregular-verbs.yaml", // the bulk import turning "left" into "leave"
        "`fail_on_lint`",      // the one-way cycle
        "| stroller | rescued, nDCG@10 0.0000 → 0.9355 |", // and what the change does well
        "| access pass | gained, nDCG@10 0.7110 → 0.1143 ⚠ |", // a gain that hurts
        "validate the change against your own full collection",
    ] {
        assert!(md.contains(expected), "missing {expected:?} in:\n{md}");
    }
    let page = std::fs::read_to_string(&html).unwrap();
    assert!(page.starts_with("<!DOCTYPE html>"));
    assert!(
        !page.contains("<script") && !page.contains("src=\"http") && !page.contains("href=\"http")
    );
    assert!(page.contains("<svg"));
}

#[test]
fn markdown_matches_its_snapshot() {
    let out = lexdelta(Path::new(ROOT))
        .args(["review", "--demo", "--format", "markdown", "--no-cache"])
        .assert()
        .code(1)
        .get_output()
        .stdout
        .clone();
    let got = String::from_utf8(out).unwrap();
    let path = Path::new(ROOT).join("tests/snapshots/review-demo.md");
    if std::env::var_os("LEXDELTA_UPDATE_SNAPSHOTS").is_some() {
        std::fs::write(&path, &got).unwrap();
    }
    let want = std::fs::read_to_string(&path)
        .expect("run with LEXDELTA_UPDATE_SNAPSHOTS=1 to create the snapshot");
    if got != want {
        let diff = similar::TextDiff::from_lines(&want, &got)
            .unified_diff()
            .header("snapshot", "now")
            .to_string();
        panic!("the Markdown report changed (LEXDELTA_UPDATE_SNAPSHOTS=1 accepts it):\n{diff}");
    }
}

#[test]
fn gate_limits_from_the_command_line_can_pass_a_change() {
    lexdelta(Path::new(ROOT))
        .args([
            "review",
            "--demo",
            "--no-cache",
            "--max-emptied-searches",
            "100",
            "--max-query-ndcg-drop",
            "1",
            "--fail-on-lint",
            "error",
        ])
        .assert()
        .code(1)
        .stderr(predicate::str::contains("fail_on_lint"))
        .stderr(predicate::str::contains("max_emptied_searches").not());
}

fn git(dir: &Path, args: &[&str]) {
    let status = Process::new("git")
        .current_dir(dir)
        .args(["-c", "user.name=t", "-c", "user.email=t@example.invalid"])
        .args(args)
        .status()
        .unwrap();
    assert!(status.success(), "git {args:?}");
}

fn write(dir: &Path, name: &str, text: &str) {
    std::fs::write(dir.join(name), text).unwrap();
}

#[test]
fn a_git_repository_is_reviewed_without_touching_the_working_tree() {
    let repo = tempfile::tempdir().unwrap();
    let r = repo.path();
    std::fs::create_dir(r.join("rules")).unwrap();
    write(
        r,
        "rules/synonyms.yaml",
        "format: 1\nrevision: 1\nsynonyms:\n  - id: pram\n    equivalent: [pram, pushchair]\n",
    );
    write(
        r,
        "rules/gate.yaml",
        "format: 1\nrevision: 1\ngate:\n  max_emptied_searches: 0\n",
    );
    write(
        r,
        "docs.jsonl",
        "{\"id\":\"a\",\"title\":\"Prams\",\"body\":\"Prams and pushchairs ride free.\"}\n\
         {\"id\":\"b\",\"title\":\"Strollers <b>bold</b>\",\"body\":\"<script>alert(1)</script> stroller rules\"}\n",
    );
    write(r, "queries.txt", "pram\nstroller\npushchair\nbuggy\n");
    git(r, &["init", "-q", "-b", "main"]);
    git(r, &["add", "."]);
    git(r, &["commit", "-q", "-m", "rules"]);
    write(
        r,
        "rules/synonyms.yaml",
        "format: 1\nrevision: 2\nsynonyms:\n  - id: pram\n    equivalent: [pram, pushchair, stroller, buggy]\n",
    );
    git(r, &["commit", "-q", "-am", "add stroller and buggy"]);
    let before = std::fs::read_to_string(r.join("rules/synonyms.yaml")).unwrap();

    let html = r.join("out.html");
    lexdelta(r)
        .args([
            "review",
            "--base",
            "HEAD~1",
            "--head",
            "HEAD",
            "--corpus",
            "docs.jsonl",
            "--queries",
            "queries.txt",
            "--no-cache",
            "--html",
        ])
        .arg(&html)
        .assert()
        .success()
        .stdout(predicate::str::contains(
            "review HEAD~1:rules -> HEAD:rules",
        ))
        .stdout(predicate::str::contains("gate     passed"));
    let page = std::fs::read_to_string(&html).unwrap();
    assert!(
        page.contains("&lt;b&gt;bold&lt;/b&gt;"),
        "titles are escaped"
    );
    assert!(!page.contains("<b>bold</b>") && !page.contains("<script>alert"));
    assert_eq!(
        std::fs::read_to_string(r.join("rules/synonyms.yaml")).unwrap(),
        before
    );

    // The working tree against the base, and an option-like revision refused.
    write(
        r,
        "rules/synonyms.yaml",
        "format: 1\nrevision: 3\nsynonyms: []\n",
    );
    lexdelta(r)
        .args([
            "review",
            "--base",
            "HEAD",
            "--corpus",
            "docs.jsonl",
            "--queries",
            "queries.txt",
            "--no-cache",
        ])
        .assert()
        .code(1)
        .stderr(predicate::str::contains(
            "gate: max_emptied_searches: \"buggy\"",
        ));
    lexdelta(r)
        .args([
            "review",
            "--base=--output=x",
            "--corpus",
            "docs.jsonl",
            "--queries",
            "queries.txt",
        ])
        .assert()
        .code(2)
        .stderr(predicate::str::contains(
            "is not a revision lexdelta accepts",
        ));
}

/// The CI recipe (`--base origin/main`) cannot be switched off by a change that commits a
/// directory named like the base revision holding a ruleset without gate limits: `--base`
/// always reads the revision from git. A directory is read only through `--base-dir`.
#[test]
fn a_directory_named_like_the_base_revision_cannot_bypass_the_gate() {
    let repo = tempfile::tempdir().unwrap();
    let r = repo.path();
    std::fs::create_dir(r.join("rules")).unwrap();
    let rules =
        "format: 1\nrevision: 1\nsynonyms:\n  - id: pram\n    equivalent: [pram, pushchair]\n";
    write(r, "rules/synonyms.yaml", rules);
    write(
        r,
        "rules/gate.yaml",
        "format: 1\nrevision: 1\ngate:\n  max_emptied_searches: 0\n",
    );
    write(
        r,
        "docs.jsonl",
        "{\"id\":\"a\",\"title\":\"Buggies\",\"body\":\"Pushchairs ride free.\"}\n",
    );
    write(r, "queries.txt", "pram\n");
    git(r, &["init", "-q", "-b", "main"]);
    git(r, &["add", "."]);
    git(r, &["commit", "-q", "-m", "rules"]);
    git(r, &["update-ref", "refs/remotes/origin/main", "HEAD"]);
    // The change empties "pram", and plants origin/main/ with a gate that allows it.
    write(
        r,
        "rules/synonyms.yaml",
        "format: 1\nrevision: 2\nsynonyms: []\n",
    );
    std::fs::create_dir_all(r.join("origin/main")).unwrap();
    write(r, "origin/main/synonyms.yaml", rules);
    write(
        r,
        "origin/main/gate.yaml",
        "format: 1\nrevision: 1\ngate:\n  max_emptied_searches: 1000000\n",
    );
    let recipe = |base: &[&str]| {
        let mut cmd = lexdelta(r);
        cmd.arg("review")
            .args(base)
            .args(["--corpus", "docs.jsonl", "--queries", "queries.txt"])
            .args(["--no-cache", "--markdown", "review.md"]);
        cmd
    };
    recipe(&["--base", "origin/main"])
        .assert()
        .code(1)
        .stdout(predicate::str::contains(
            "review origin/main:rules -> rules",
        ))
        .stderr(predicate::str::contains(
            "gate: max_emptied_searches: \"pram\"",
        ))
        .stderr(predicate::str::contains(
            "the directory \"origin/main\" in the working tree is not read",
        ));
    // The planted directory is read only when asked for by --base-dir (and then it is the
    // user's own choice).
    recipe(&["--base-dir", "origin/main"]).assert().code(0);
    // A name that is no revision but is a directory is refused with the option to use.
    std::fs::create_dir_all(r.join("old-rules")).unwrap();
    write(r, "old-rules/synonyms.yaml", rules);
    recipe(&["--base", "old-rules"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("pass --base-dir \"old-rules\""));
    recipe(&["--base", "origin/main", "--base-dir", "old-rules"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains("cannot be used with"));
}

/// Every output path is checked before anything is written: a bad last path leaves no
/// first file behind, and two outputs may not name one file.
#[test]
fn outputs_are_checked_before_any_is_written() {
    let dir = tempfile::tempdir().unwrap();
    let d = dir.path();
    let demo = |extra: &[&str]| {
        let mut cmd = lexdelta(Path::new(ROOT));
        cmd.args(["review", "--demo", "--no-cache"]).args(extra);
        cmd
    };
    let md = d.join("a.md");
    demo(&["--markdown"])
        .arg(&md)
        .arg("--html")
        .arg(d.join("missing/b.html"))
        .assert()
        .code(2)
        .stderr(predicate::str::contains("does not exist; create it first"));
    assert!(!md.exists(), "nothing is written when one output is bad");
    demo(&["--markdown"])
        .arg(&md)
        .arg("--sarif")
        .arg(d.join(".").join("a.md"))
        .assert()
        .code(2)
        .stderr(predicate::str::contains("name the same file"));
    demo(&["--html", "/dev/null"])
        .assert()
        .code(2)
        .stderr(predicate::str::contains(
            "/dev/null is a device, not a regular file",
        ));
    assert_eq!(std::fs::read_dir(d).unwrap().count(), 0);
}
