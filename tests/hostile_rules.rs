//! Hostile rule files through the CLI, as a change's author could commit them: each is
//! refused with exit code 2 and a message naming the file and line (where there is one),
//! never a panic, never a silent skip, never a file's contents that are not rule text, and
//! each within two seconds of CPU. Valid but extreme inputs exit 0 within the same time.

use std::path::Path;
use std::process::Command;

mod hostile_support;

use hostile_support::lexdelta;

/// A ruleset of one file `a.yaml` holding `text`, linted: exit 2, and the message holds
/// `at` (file:line[:col]) and `says`.
fn refused(text: &[u8], at: &str, says: &str) {
    let dir = tempfile::tempdir().unwrap();
    std::fs::create_dir(dir.path().join("rules")).unwrap();
    std::fs::write(dir.path().join("rules/a.yaml"), text).unwrap();
    let run = lexdelta(dir.path(), &["lint", "--rules", "rules"]);
    assert_eq!(run.code, 2, "{at}: {}", run.stderr);
    assert!(run.stderr.contains(at), "want {at:?} in:\n{}", run.stderr);
    assert!(
        run.stderr.contains(says),
        "want {says:?} in:\n{}",
        run.stderr
    );
    assert!(
        !run.stderr.contains('\u{1b}'),
        "no raw escape reaches the terminal"
    );
}

const HEAD: &str = "format: 1\nrevision: 1\n";

#[test]
fn yaml_tags_documents_keys_and_nesting() {
    refused(
        format!("{HEAD}synonyms:\n  - [pram, !!binary c3Ryb2xsZXI=]\n").as_bytes(),
        "rules/a.yaml:4:12",
        "a YAML tag `!!binary`",
    );
    refused(
        format!("{HEAD}exempt: [!!str left]\n").as_bytes(),
        "rules/a.yaml:3:10",
        "a YAML tag `!!str`",
    );
    refused(
        format!("{HEAD}---\n{HEAD}").as_bytes(),
        "rules/a.yaml:3:1",
        "a second YAML document",
    );
    refused(
        format!("{HEAD}revision: 2\n").as_bytes(),
        "rules/a.yaml:3:1",
        "the key \"revision\" is written twice",
    );
    refused(
        format!("{HEAD}synonyms: {}{}\n", "[".repeat(100), "]".repeat(100)).as_bytes(),
        "rules/a.yaml:3:",
        "nested more than 32 levels",
    );
    let mut bomb = format!("{HEAD}a: &a [x, x, x, x, x, x, x, x, x, x]\n");
    for i in 1..10 {
        let prev = if i == 1 {
            "a".to_string()
        } else {
            format!("a{}", i - 1)
        };
        bomb.push_str(&format!("a{i}: &a{i} [*{prev}, *{prev}, *{prev}, *{prev}, *{prev}, *{prev}, *{prev}, *{prev}, *{prev}, *{prev}]\n"));
    }
    refused(bomb.as_bytes(), "rules/a.yaml:", "aliases");
    refused(
        format!("{HEAD}gate:\n  max_ndcg_drop: .nan\n").as_bytes(),
        "rules/a.yaml:4:18",
        "not finite",
    );
}

#[test]
fn encodings_and_sizes() {
    let mut latin1 = format!("{HEAD}exempt: [caf").into_bytes();
    latin1.extend_from_slice(b"\xe9]\n");
    refused(&latin1, "rules/a.yaml:3:13", "not UTF-8");
    refused(
        format!("{HEAD}exempt: [\"a\u{1b}]0;owned\u{7}b\"]\n").as_bytes(),
        "rules/a.yaml:3",
        "\\u{1b}",
    );
    let big = vec![b'#'; 17 << 20];
    refused(&big, "rules/a.yaml", "rule files are limited to 16 MiB");
}

#[test]
fn patterns() {
    refused(
        format!("{HEAD}pipeline:\n  token_pattern: \"\\\\b\"\n").as_bytes(),
        "rules/a.yaml:4:18",
        "matches only empty text",
    );
    // Each pattern is fine alone; together they outgrow the set's limit.
    let mut many = format!("{HEAD}exempt:\n");
    for i in 0..40 {
        many.push_str(&format!("  - pattern: \"x{i}\\\\w{{20}}\"\n"));
    }
    refused(
        many.as_bytes(),
        "rules/a.yaml:",
        "too large to compile together",
    );
    // A 1 MB pattern is quoted by its start and length, not echoed.
    let huge = format!(
        "{HEAD}exempt:\n  - pattern: \"({})\"\n",
        "ab|".repeat(350_000)
    );
    let dir = tempfile::tempdir().unwrap();
    std::fs::create_dir(dir.path().join("rules")).unwrap();
    std::fs::write(dir.path().join("rules/a.yaml"), &huge).unwrap();
    let run = lexdelta(dir.path(), &["lint", "--rules", "rules"]);
    assert_eq!(run.code, 2);
    assert!(run.stderr.contains("rules/a.yaml:4:14"), "{}", run.stderr);
    assert!(run.stderr.contains("bytes in all)"), "{}", run.stderr);
    assert!(
        run.stderr.len() < 2_000,
        "{} bytes of stderr",
        run.stderr.len()
    );
}

#[test]
fn members_without_words() {
    refused(
        format!("{HEAD}synonyms:\n  - [tram, \"🚋\"]\n").as_bytes(),
        "rules/a.yaml:4:12",
        "holds no word the tokenizer keeps",
    );
}

#[cfg(unix)]
#[test]
fn symbolic_links_and_special_files() {
    use std::os::unix::fs::symlink;
    let secret_dir = tempfile::tempdir().unwrap();
    let secret = secret_dir.path().join("secrets.yaml");
    std::fs::write(&secret, "password: hunter2-do-not-print\n").unwrap();
    type Make<'a> = Box<dyn Fn(&Path) + 'a>;
    let cases: Vec<(&str, Make, &str)> = vec![
        (
            "outside",
            Box::new(|rules: &Path| symlink(&secret, rules.join("b.yaml")).unwrap()),
            "a symbolic link to a file outside the ruleset directory",
        ),
        (
            "broken",
            Box::new(|rules: &Path| symlink(rules.join("nowhere"), rules.join("b.yaml")).unwrap()),
            "a symbolic link that leads nowhere",
        ),
        (
            "loop",
            Box::new(|rules: &Path| {
                symlink(rules.join("c.yaml"), rules.join("b.yaml")).unwrap();
                symlink(rules.join("b.yaml"), rules.join("c.yaml")).unwrap();
            }),
            "a symbolic link that leads nowhere",
        ),
        (
            "fifo",
            Box::new(|rules: &Path| {
                let ok = Command::new("mkfifo")
                    .arg(rules.join("b.yaml"))
                    .status()
                    .unwrap()
                    .success();
                assert!(ok, "mkfifo");
            }),
            "not a regular file",
        ),
    ];
    for (name, make, says) in cases {
        let dir = tempfile::tempdir().unwrap();
        let rules = dir.path().join("rules");
        std::fs::create_dir(&rules).unwrap();
        std::fs::write(rules.join("a.yaml"), format!("{HEAD}exempt: [x]\n")).unwrap();
        make(&rules);
        let run = lexdelta(dir.path(), &["lint", "--rules", "rules"]);
        assert_eq!(run.code, 2, "{name}: {}", run.stderr);
        assert!(
            run.stderr.contains("rules/b.yaml"),
            "{name}: {}",
            run.stderr
        );
        assert!(run.stderr.contains(says), "{name}: {}", run.stderr);
        assert!(
            !run.stderr.contains("hunter2"),
            "{name}: a secret was quoted"
        );
    }
    // A link to a rule file inside the ruleset is read.
    let dir = tempfile::tempdir().unwrap();
    let rules = dir.path().join("rules");
    std::fs::create_dir_all(rules.join("shared")).unwrap();
    std::fs::write(
        rules.join("shared/a.yml.txt"),
        format!("{HEAD}exempt: [x]\n"),
    )
    .unwrap();
    symlink(rules.join("shared/a.yml.txt"), rules.join("a.yaml")).unwrap();
    assert_eq!(lexdelta(dir.path(), &["lint", "--rules", "rules"]).code, 0);
    // A file named like a rule file that is no rule file is located, not quoted.
    std::fs::write(rules.join("b.yaml"), "hunter2-do-not-print\n").unwrap();
    let run = lexdelta(dir.path(), &["lint", "--rules", "rules"]);
    assert_eq!(run.code, 2);
    assert!(run.stderr.contains("rules/b.yaml"), "{}", run.stderr);
    assert!(!run.stderr.contains("hunter2"), "{}", run.stderr);
}

/// Valid and large: one set of 100k members traces (it was quadratic: 20 s), and 100k
/// three-word sets load, within the limit, in a debug build too.
#[test]
fn huge_valid_rulesets_are_quick() {
    let word = |i: usize| {
        let mut s = String::from("z");
        let mut n = i + 26 * 26;
        let mut rev = Vec::new();
        while n > 0 {
            rev.push((b'a' + (n % 26) as u8) as char);
            n /= 26;
        }
        s.extend(rev.into_iter().rev());
        s
    };
    let dir = tempfile::tempdir().unwrap();
    let rules = dir.path().join("rules");
    std::fs::create_dir(&rules).unwrap();
    let members: Vec<String> = (0..100_000).map(word).collect();
    std::fs::write(
        rules.join("a.yaml"),
        format!("{HEAD}synonyms:\n  - [{}]\n", members.join(", ")),
    )
    .unwrap();
    let run = lexdelta(dir.path(), &["trace", "--rules", "rules", "zbaaa"]);
    assert_eq!(run.code, 0, "{}", run.stderr);
    assert!(
        run.stdout.contains("zfsyd"),
        "every member is an alternative"
    );
    let big = dir.path().join("big");
    std::fs::create_dir(&big).unwrap();
    let mut text = format!("{HEAD}synonyms:\n");
    for i in 0..100_000 {
        text.push_str(&format!(
            "  - [{} {} {}, {}]\n",
            word(3 * i),
            word(3 * i + 1),
            word(3 * i + 2),
            word(900_000 + i)
        ));
    }
    std::fs::write(big.join("a.yaml"), text).unwrap();
    let run = lexdelta(dir.path(), &["trace", "--rules", "big", "zbaaa"]);
    assert_eq!(run.code, 0, "{}", run.stderr);
}
