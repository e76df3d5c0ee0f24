//! Every file in tests/malformed/ is a broken rule file whose first line states the
//! diagnostic it must produce: `# expect: LINE:COL | message fragment | help: fragment`.
//! Loading (and compiling) it must fail with that diagnostic — never panic, never pass.

use std::fs;
use std::path::Path;

use lexdelta::analysis::Analyzer;
use lexdelta::rules::{Diagnostic, RulesError, SourceFile, load_sources};

struct Expectation {
    line: u32,
    column: u32,
    message: String,
    help: Option<String>,
}

fn expectation(path: &Path, text: &str) -> Expectation {
    let header = text
        .lines()
        .next()
        .and_then(|l| l.strip_prefix("# expect: "))
        .unwrap_or_else(|| panic!("{} lacks its `# expect:` line", path.display()));
    let mut parts = header.split(" | ");
    let at = parts.next().unwrap();
    let (line, column) = at.split_once(':').unwrap();
    Expectation {
        line: line.parse().unwrap(),
        column: column.parse().unwrap(),
        message: parts.next().unwrap_or("").to_string(),
        help: parts
            .next()
            .map(|h| h.strip_prefix("help: ").unwrap_or(h).to_string()),
    }
}

fn diagnostics_for(name: &str, text: &str) -> Vec<Diagnostic> {
    let sources = vec![SourceFile {
        name: name.to_string(),
        text: text.to_string(),
    }];
    let result = load_sources("tests/malformed", sources).and_then(Analyzer::new);
    match result {
        Ok(_) => Vec::new(),
        Err(RulesError::Invalid(d)) => d,
        Err(other) => panic!("{name}: unexpected error kind: {other}"),
    }
}

#[test]
fn every_malformed_file_gets_its_precise_diagnostic() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/malformed");
    let mut files: Vec<_> = fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|e| e == "yaml"))
        .collect();
    files.sort();
    assert!(
        files.len() >= 30,
        "the malformed corpus has {} files",
        files.len()
    );
    let mut failures = Vec::new();
    for path in &files {
        let text = fs::read_to_string(path).unwrap();
        let want = expectation(path, &text);
        let name = format!(
            "tests/malformed/{}",
            path.file_name().unwrap().to_string_lossy()
        );
        let got = diagnostics_for(&name, &text);
        let hit = got.iter().find(|d| {
            d.at.is_some_and(|at| at.line == want.line && at.column == want.column)
                && d.message.contains(&want.message)
                && want
                    .help
                    .as_ref()
                    .is_none_or(|h| d.help.as_deref().unwrap_or("").contains(h.as_str()))
        });
        match hit {
            Some(d) => {
                let shown = d.to_string();
                let location = format!("{name}:{}:{}", want.line, want.column);
                if !shown.starts_with(&location) {
                    failures.push(format!(
                        "{name}: display does not start with {location}: {shown}"
                    ));
                }
            }
            None => failures.push(format!(
                "{name}: wanted {}:{} {:?} (help {:?}), got:\n{}",
                want.line,
                want.column,
                want.message,
                want.help,
                got.iter()
                    .map(|d| format!("    {d}"))
                    .collect::<Vec<_>>()
                    .join("\n")
            )),
        }
    }
    assert!(failures.is_empty(), "\n{}", failures.join("\n\n"));
}
