//! The one input layer through the CLI: every command reads the same corpora and query
//! logs the same way, names a missing field with the fields there are, refuses inputs
//! with nothing in them, and says so when a preview found nothing. Fixtures are in
//! `tests/inputs/` (see its README).

use std::path::Path;
use std::time::Duration;

use assert_cmd::Command;
use serde_json::Value;

const FIX: &str = "tests/inputs";

fn lexdelta() -> Command {
    let mut cmd = Command::cargo_bin("lexdelta").unwrap();
    cmd.current_dir(env!("CARGO_MANIFEST_DIR"))
        .timeout(Duration::from_secs(60));
    cmd
}

struct Run {
    code: i32,
    stdout: String,
    stderr: String,
}

fn run(args: &[&str]) -> Run {
    let out = lexdelta().args(args).output().unwrap();
    Run {
        code: out.status.code().unwrap_or(-1),
        stdout: String::from_utf8_lossy(&out.stdout).into_owned(),
        stderr: String::from_utf8_lossy(&out.stderr).into_owned(),
    }
}

fn fix(name: &str) -> String {
    format!("{FIX}/{name}")
}

/// `preview` or `review` of `rules` → `head` over the given inputs.
fn compare(command: &str, head: &str, corpus: &str, queries: &str, extra: &[&str]) -> Run {
    // `review --base` takes a git revision; directories are `--base-dir` and `--head-dir`.
    let (base_option, head_option) = if command == "review" {
        ("--base-dir", "--head-dir")
    } else {
        ("--base", "--head")
    };
    let mut args = vec![
        command,
        base_option,
        "rules",
        head_option,
        head,
        "--corpus",
        corpus,
        "--queries",
        queries,
        "--no-cache",
    ];
    args.extend_from_slice(extra);
    run(&args)
}

/// A preview of the demo change over the given inputs.
fn preview(corpus: &str, queries: &str, extra: &[&str]) -> Run {
    compare("preview", "demo-corpus/proposed", corpus, queries, extra)
}

/// A review of the demo change over the given inputs.
fn review(corpus: &str, queries: &str, extra: &[&str]) -> Run {
    compare("review", "demo-corpus/proposed", corpus, queries, extra)
}

fn json(run: &Run) -> Value {
    serde_json::from_str(&run.stdout)
        .unwrap_or_else(|e| panic!("{e}: {}\nstderr: {}", run.stdout, run.stderr))
}

/// Exit 2 with a message, never a panic.
fn refused(run: &Run, fragments: &[&str]) {
    assert_eq!(
        run.code, 2,
        "stdout: {}\nstderr: {}",
        run.stdout, run.stderr
    );
    assert!(!run.stderr.contains("panicked"), "{}", run.stderr);
    for f in fragments {
        assert!(run.stderr.contains(f), "{f:?} not in: {}", run.stderr);
    }
}

#[test]
fn lint_reads_every_corpus_format_and_query_layout_alike() {
    let mut seen: Option<Value> = None;
    for corpus in ["library.jsonl", "library.csv", "library"] {
        for queries in ["queries.txt", "queries.tsv", "queries.jsonl"] {
            let r = run(&[
                "lint",
                "--corpus",
                &fix(corpus),
                "--queries",
                &fix(queries),
                "--format",
                "json",
            ]);
            assert!(
                r.code == 0 || r.code == 1,
                "{corpus} {queries}: {}",
                r.stderr
            );
            let mut vocabulary = json(&r)["vocabulary"].clone();
            assert!(vocabulary["forms"].as_u64().unwrap() > 50, "{vocabulary}");
            assert_eq!(vocabulary["documents"], 10, "{corpus}");
            // Plain lines count one search per line; the other two carry the counts.
            let searches = if queries == "queries.txt" { 5 } else { 62 };
            assert_eq!(vocabulary["searches"], searches, "{corpus} {queries}");
            vocabulary["searches"] = Value::Null;
            match &seen {
                None => seen = Some(vocabulary),
                Some(first) => assert_eq!(&vocabulary, first, "{corpus} {queries}"),
            }
        }
    }
}

#[test]
fn preview_reads_csv_and_directory_corpora_as_it_reads_json_lines() {
    let dir = tempfile::tempdir().unwrap();
    let source = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("demo-corpus/documents.jsonl"),
    )
    .unwrap();
    let csv_path = dir.path().join("documents");
    let mut writer = csv::Writer::from_path(&csv_path).unwrap();
    writer.write_record(["id", "title", "body"]).unwrap();
    let docs = dir.path().join("docs");
    std::fs::create_dir(&docs).unwrap();
    for line in source.lines().filter(|l| !l.trim().is_empty()) {
        let d: Value = serde_json::from_str(line).unwrap();
        let (id, title, body) = (
            d["id"].as_str().unwrap(),
            d["title"].as_str().unwrap(),
            d["body"].as_str().unwrap(),
        );
        writer.write_record([id, title, body]).unwrap();
        std::fs::write(docs.join(format!("{id}.txt")), format!("{title}\n{body}")).unwrap();
    }
    writer.flush().unwrap();
    let summary = |corpus: &str| {
        let r = preview(
            corpus,
            "demo-corpus/queries.jsonl",
            &["--format", "json", "--field", "title^2", "--field", "body"],
        );
        assert_eq!(r.code, 0, "{corpus}: {}", r.stderr);
        let report = json(&r);
        (report["summary"].clone(), report["evaluation"].clone())
    };
    let jsonl = summary("demo-corpus/documents.jsonl");
    // The CSV file has no extension: its content says what it is.
    assert_eq!(summary(csv_path.to_str().unwrap()), jsonl);
    assert_eq!(summary(docs.to_str().unwrap()), jsonl);
}

/// The options that name `catalogue.csv`'s fields, with this title field.
fn catalogue_fields(title: &str) -> [&str; 6] {
    [
        "--id-field",
        "ref",
        "--field",
        "description",
        "--title-field",
        title,
    ]
}

#[test]
fn a_field_no_document_has_is_an_error_in_every_command() {
    let corpus = fix("catalogue.csv");
    let fields = "the documents have `description`, `name`, `ref`";
    refused(
        &preview(
            &corpus,
            &fix("queries.txt"),
            &["--id-field", "ref", "--field", "descripton"],
        ),
        &[
            "catalogue.csv: no document has the searched field `descripton`",
            fields,
            "did you mean `description`?",
            "--field",
        ],
    );
    refused(
        &run(&["lint", "--corpus", &corpus, "--id-field", "ref"]),
        &["searched field `title`", fields, "--field"],
    );
    refused(
        &run(&["lint", "--corpus", &corpus, "--field", "description"]),
        &["no document has the id field `id`", fields, "--id-field"],
    );
    refused(
        &review(&corpus, &fix("queries.txt"), &catalogue_fields("titel")),
        &["no document has the title field `titel`", "--title-field"],
    );
    refused(
        &run(&[
            "collisions",
            "--corpus",
            &corpus,
            "--id-field",
            "ref",
            "--field",
            "body",
        ]),
        &["searched field `body`", fields],
    );
    refused(
        &run(&[
            "stemcheck",
            "--wordnet-groups",
            "--corpus",
            &fix("library"),
            "--field",
            "text",
        ]),
        &[
            "searched field `text`",
            "the documents have `body`, `id`, `title`",
        ],
    );
    // Named right, the same corpus reads.
    let r = preview(&corpus, &fix("queries.txt"), &catalogue_fields("name"));
    assert_eq!(r.code, 0, "{}", r.stderr);
}

#[test]
fn a_field_few_documents_have_is_a_warning() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("docs.jsonl");
    let mut text = String::new();
    for i in 0..300 {
        let note = if i == 7 { ",\"note\":\"renew\"" } else { "" };
        text.push_str(&format!(
            "{{\"id\":\"d{i}\",\"body\":\"renew a book {i}\"{note}}}\n"
        ));
    }
    std::fs::write(&path, text).unwrap();
    let r = run(&[
        "lint",
        "--corpus",
        path.to_str().unwrap(),
        "--field",
        "body",
        "--field",
        "note",
    ]);
    assert!(r.code == 0 || r.code == 1, "{}", r.stderr);
    assert!(
        r.stderr.contains("warning: ",)
            && r.stderr
                .contains("only 1 of 300 documents (0.33%) have the searched field `note`"),
        "{}",
        r.stderr
    );
}

#[test]
fn the_query_format_comes_from_the_content_or_the_option() {
    // An id<TAB>text file is not silently read as counts, whatever its name.
    refused(
        &preview(&fix("library.jsonl"), &fix("judged.tsv"), &[]),
        &[
            "judged.tsv:1: the line has a tab but its last field \"renew a book\" is not a count",
            "--queries-format ids",
        ],
    );
    let r = preview(
        &fix("library.jsonl"),
        &fix("judged.tsv"),
        &["--queries-format", "ids", "--format", "json"],
    );
    assert_eq!(r.code, 0, "{}", r.stderr);
    assert_eq!(json(&r)["summary"]["queries"], 3);
    let r = run(&[
        "lint",
        "--corpus",
        &fix("library.jsonl"),
        "--queries",
        &fix("judged.tsv"),
        "--queries-format",
        "ids",
        "--format",
        "json",
    ]);
    assert!(r.code == 0 || r.code == 1, "{}", r.stderr);
    assert_eq!(json(&r)["vocabulary"]["searches"], 3);
}

#[test]
fn inputs_without_documents_are_errors_not_panics() {
    for (corpus, why) in [
        ("empty.jsonl", "no documents: the file is empty"),
        (
            "blank.jsonl",
            "no documents: the file holds only blank lines",
        ),
        ("header-only.csv", "no documents: a CSV header and no rows"),
        (
            "empty-dir",
            "no documents: no .txt or .md files in the directory",
        ),
    ] {
        refused(
            &preview(&fix(corpus), &fix("queries.txt"), &[]),
            &[corpus, why],
        );
        refused(
            &review(&fix(corpus), &fix("queries.txt"), &[]),
            &[corpus, why],
        );
        refused(&run(&["lint", "--corpus", &fix(corpus)]), &[why]);
    }
    refused(
        &preview(
            &fix("library.jsonl"),
            &fix("queries.txt"),
            &["--sample", "0"],
        ),
        &["--sample", "a sample of 0 documents holds nothing"],
    );
    // A fraction that keeps nothing of a small corpus.
    refused(
        &preview(
            &fix("library.jsonl"),
            &fix("queries.txt"),
            &["--sample", "0.01"],
        ),
        &["the sample keeps none of the 10 documents"],
    );
    refused(
        &preview(&fix("library.jsonl"), &fix("blank.jsonl"), &[]),
        &["blank.jsonl: no queries"],
    );
}

#[test]
fn a_preview_that_finds_nothing_says_so_and_fails_the_gate() {
    let r = preview(&fix("library.jsonl"), &fix("unmatched-queries.txt"), &[]);
    assert_eq!(r.code, 0, "{}", r.stderr);
    assert!(
        r.stderr.contains("warning: no query matched any document"),
        "{}",
        r.stderr
    );
    let r = preview(
        &fix("library.jsonl"),
        &fix("unmatched-queries.txt"),
        &["--format", "json"],
    );
    assert_eq!(json(&r)["warnings"], serde_json::json!(["nothing_found"]));
    // One query that matches is enough: no warning, and none in the JSON.
    let r = preview(
        &fix("library.jsonl"),
        &fix("queries.txt"),
        &["--format", "json"],
    );
    assert!(!r.stderr.contains("warning"), "{}", r.stderr);
    assert!(json(&r).get("warnings").is_none());

    // The ruleset against itself: the only thing the gate can object to is the input.
    let review = |queries: &str| {
        compare(
            "review",
            "rules",
            &fix("library.jsonl"),
            &fix(queries),
            &["--format", "json"],
        )
    };
    let r = review("unmatched-queries.txt");
    assert_eq!(r.code, 1, "{}", r.stderr);
    assert!(r.stderr.contains("gate: nothing_found:"), "{}", r.stderr);
    assert_eq!(json(&r)["gate"]["breaches"][0]["limit"], "nothing_found");
    let r = review("queries.txt");
    assert_eq!(r.code, 0, "{}", r.stderr);
}

#[test]
fn counts_past_the_largest_number_are_errors_with_their_line() {
    refused(
        &preview(&fix("library.jsonl"), &fix("overflow.tsv"), &[]),
        &["overflow.tsv:2: the count 18446744073709551616 is larger than the largest count"],
    );
    refused(
        &run(&["lint", "--queries", &fix("overflow-sum.tsv")]),
        &["overflow-sum.tsv:2: the searches of the log add up to more than 18446744073709551615"],
    );
}

#[test]
fn numbers_that_are_not_finite_are_usage_errors() {
    for (option, value) in [
        ("--k1", "inf"),
        ("--k1", "NaN"),
        ("--b", "nan"),
        ("--rbo-p", "NaN"),
    ] {
        refused(
            &preview(&fix("library.jsonl"), &fix("queries.txt"), &[option, value]),
            &[option, "must be a finite number"],
        );
    }
    refused(
        &preview(&fix("library.jsonl"), &fix("queries.txt"), &["--k1=-1"]),
        &["invalid BM25 k1: -1 is not a finite number of at least 0"],
    );
    for (option, value) in [
        ("--max-ndcg-drop", "NaN"),
        ("--max-query-ndcg-drop", "inf"),
        ("--max-lost-traffic-share", "1.5"),
    ] {
        refused(
            &review(&fix("library.jsonl"), &fix("queries.txt"), &[option, value]),
            &[option],
        );
    }
}

#[cfg(unix)]
#[test]
fn a_directory_corpus_with_link_loops_is_read_once_and_links_out_are_refused() {
    use std::os::unix::fs::symlink;
    let dir = tempfile::tempdir().unwrap();
    let root = dir.path().join("docs");
    std::fs::create_dir_all(root.join("a/b")).unwrap();
    for (i, entry) in std::fs::read_dir(
        Path::new(env!("CARGO_MANIFEST_DIR"))
            .join(FIX)
            .join("library"),
    )
    .unwrap()
    .enumerate()
    {
        let entry = entry.unwrap();
        let into = if i % 2 == 0 {
            root.join("a/b")
        } else {
            root.clone()
        };
        std::fs::copy(entry.path(), into.join(entry.file_name())).unwrap();
    }
    // Loops back up the tree, and a second name for a directory.
    symlink(&root, root.join("a/b/up")).unwrap();
    symlink(root.join("a"), root.join("a/b/again")).unwrap();
    symlink(root.join("a"), root.join("same")).unwrap();
    let r = run(&[
        "lint",
        "--corpus",
        root.to_str().unwrap(),
        "--format",
        "json",
    ]);
    assert!(r.code == 0 || r.code == 1, "{}", r.stderr);
    assert_eq!(json(&r)["vocabulary"]["documents"], 10);

    let outside = tempfile::tempdir().unwrap();
    std::fs::write(outside.path().join("secret.txt"), "not for the corpus").unwrap();
    symlink(outside.path().join("secret.txt"), root.join("s.txt")).unwrap();
    refused(
        &run(&["lint", "--corpus", root.to_str().unwrap()]),
        &[
            "s.txt: a symbolic link in the corpus directory",
            "leads outside it",
        ],
    );
}

#[test]
fn judgments_are_read_by_their_content() {
    let dir = tempfile::tempdir().unwrap();
    let csv = dir.path().join("judgments.txt");
    std::fs::write(
        &csv,
        "query_id,query,doc_id,relevance\nL1,renew a book,lib-01,2\nL2,reading rooms,lib-04,1\n",
    )
    .unwrap();
    let r = preview(
        &fix("library.jsonl"),
        &fix("queries.txt"),
        &["--judgments", csv.to_str().unwrap(), "--format", "json"],
    );
    assert_eq!(r.code, 0, "{}", r.stderr);
    assert!(json(&r)["quality"].is_object());
    let qrels = dir.path().join("judgments.csv");
    std::fs::write(&qrels, "L1 0 lib-01 2\n").unwrap();
    refused(
        &preview(
            &fix("library.jsonl"),
            &fix("queries.txt"),
            &["--judgments", qrels.to_str().unwrap()],
        ),
        &["TREC qrels name queries by id", "--judged-queries"],
    );
}

#[test]
fn given_inputs_win_over_the_demo_and_a_missing_one_is_named() {
    let r = run(&[
        "preview",
        "--demo",
        "--queries",
        &fix("queries.tsv"),
        "--no-cache",
        "--format",
        "json",
    ]);
    assert_eq!(r.code, 0, "{}", r.stderr);
    let report = json(&r);
    assert_eq!(report["queries_source"], fix("queries.tsv"));
    assert_eq!(report["corpus"]["source"], "demo-corpus/documents.jsonl");
    refused(
        &run(&[
            "preview",
            "--base",
            "rules",
            "--head",
            "rules",
            "--queries",
            &fix("queries.txt"),
        ]),
        &["--corpus is required (or --demo)"],
    );
}
