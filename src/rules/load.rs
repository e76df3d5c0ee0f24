//! Reading a ruleset: files from a directory (or from git), parsed, checked and merged.

use std::collections::HashMap;
use std::fs;
use std::path::Path;
use std::sync::Arc;

use super::error::{Diagnostic, RulesError};
use super::schema::{FileRules, Walker};
use super::yaml::{self, MAX_FILE_BYTES, Node, Value};
use super::{FileInfo, Origin, Ruleset};

/// One rule file's name (as shown in diagnostics) and text.
#[derive(Clone, Debug)]
pub struct SourceFile {
    pub name: String,
    pub text: String,
}

/// Loads the ruleset in a directory.
pub fn load_dir(dir: &Path) -> Result<Ruleset, RulesError> {
    let sources = read_sources(dir)?;
    load_sources(&dir.display().to_string(), sources)
}

/// Reads the `.yaml` / `.yml` files of a directory, in file-name order, refusing files too
/// large to be rule files before reading them.
pub fn read_sources(dir: &Path) -> Result<Vec<SourceFile>, RulesError> {
    let io = |source| RulesError::Io {
        path: dir.to_path_buf(),
        source,
    };
    if !dir.is_dir() {
        return if dir.exists() {
            Err(RulesError::NotADirectory(dir.to_path_buf()))
        } else {
            Err(io(std::io::Error::new(
                std::io::ErrorKind::NotFound,
                "no such directory",
            )))
        };
    }
    // Symbolic links are followed only to files inside the ruleset directory: a link to a
    // file elsewhere would be read, and its lines quoted in diagnostics, in CI logs.
    let root = fs::canonicalize(dir).map_err(io)?;
    let mut paths = Vec::new();
    let mut refused = Vec::new();
    for entry in fs::read_dir(dir).map_err(io)? {
        let entry = entry.map_err(io)?;
        let path = entry.path();
        let is_yaml = matches!(
            path.extension().and_then(|e| e.to_str()),
            Some("yaml" | "yml")
        );
        if !is_yaml {
            continue;
        }
        let name = path.display().to_string();
        let kind = entry.file_type().map_err(|source| RulesError::Io {
            path: path.clone(),
            source,
        })?;
        if kind.is_dir() {
            continue;
        }
        if kind.is_symlink() {
            match fs::canonicalize(&path) {
                Err(_) => refused.push(
                    Diagnostic::new(
                        &name,
                        None,
                        "a symbolic link that leads nowhere (its target is missing, or the \
                         links form a loop)",
                    )
                    .help("point the link at a rule file in this directory, or remove it"),
                ),
                Ok(target) if !target.starts_with(&root) => refused.push(
                    Diagnostic::new(
                        &name,
                        None,
                        "a symbolic link to a file outside the ruleset directory; \
                         lexdelta does not follow it",
                    )
                    .help("copy the rule file into the ruleset directory, or remove the link"),
                ),
                Ok(target) if target.is_dir() => {}
                Ok(target) if target.is_file() => paths.push(path),
                Ok(_) => refused.push(not_regular(&name)),
            }
            continue;
        }
        if kind.is_file() {
            paths.push(path);
        } else {
            // A FIFO, socket or device: reading it could block or never end.
            refused.push(not_regular(&name));
        }
    }
    if !refused.is_empty() {
        refused.sort_by(|a, b| a.file.cmp(&b.file));
        return Err(RulesError::Invalid(refused));
    }
    paths.sort();
    let mut sources = Vec::with_capacity(paths.len());
    let mut too_large = Vec::new();
    for path in paths {
        let name = path.display().to_string();
        let size = fs::metadata(&path)
            .map_err(|source| RulesError::Io {
                path: path.clone(),
                source,
            })?
            .len();
        if size > MAX_FILE_BYTES {
            too_large.push(file_too_large(&name, size));
            continue;
        }
        let bytes = fs::read(&path).map_err(|source| RulesError::Io {
            path: path.clone(),
            source,
        })?;
        match String::from_utf8(bytes) {
            Ok(text) => sources.push(SourceFile { name, text }),
            Err(err) => too_large.push(not_utf8(&name, err.as_bytes(), err.utf8_error())),
        }
    }
    if !too_large.is_empty() {
        return Err(RulesError::Invalid(too_large));
    }
    Ok(sources)
}

fn not_regular(name: &str) -> Diagnostic {
    Diagnostic::new(
        name,
        None,
        "not a regular file (a FIFO, socket or device named like a rule file)",
    )
    .help("rule files are regular files; remove this one from the ruleset directory")
}

/// A file that is not UTF-8, located by line and column (of the valid text before the
/// first invalid byte).
pub(super) fn not_utf8(name: &str, bytes: &[u8], err: std::str::Utf8Error) -> Diagnostic {
    let valid = std::str::from_utf8(&bytes[..err.valid_up_to()]).unwrap_or_default();
    let line = valid.matches('\n').count() + 1;
    let last = valid.rsplit('\n').next().unwrap_or_default();
    let at = super::Position {
        line: u32::try_from(line).unwrap_or(u32::MAX),
        column: u32::try_from(last.chars().count() + 1).unwrap_or(u32::MAX),
    };
    Diagnostic::new(
        name,
        Some(at),
        format!(
            "the file is not UTF-8 text: byte 0x{:02x} here is not valid UTF-8",
            bytes[err.valid_up_to()]
        ),
    )
    .help("save the rule file as UTF-8 (a file in another encoding, or not a text file at all)")
}

pub(super) fn file_too_large(name: &str, size: u64) -> Diagnostic {
    Diagnostic::new(
        name,
        None,
        format!(
            "the file is {:.1} MiB; rule files are limited to {} MiB",
            size as f64 / (1024.0 * 1024.0),
            MAX_FILE_BYTES / (1024 * 1024)
        ),
    )
    .help("split it into several files, or check that it is a rule file at all")
}

/// Parses, checks and merges rule files. All problems in all files are reported together.
pub fn load_sources(source: &str, files: Vec<SourceFile>) -> Result<Ruleset, RulesError> {
    if files.is_empty() {
        return Err(RulesError::Empty(source.to_string()));
    }
    let mut diagnostics = Vec::new();
    let mut ruleset = Ruleset {
        source: source.to_string(),
        ..Ruleset::default()
    };
    let mut single = SingleSections::default();
    for file in &files {
        let name: Arc<str> = Arc::from(file.name.as_str());
        if file.text.len() as u64 > MAX_FILE_BYTES {
            diagnostics.push(file_too_large(&file.name, file.text.len() as u64));
            continue;
        }
        // A file that does not even declare a format may be anything (a file named like a
        // rule file by mistake): its problems are located, never quoted.
        let quotable = looks_like_rule_file(&file.text);
        let quoted = |d: Diagnostic| {
            if quotable {
                d.with_source(&file.text)
            } else {
                d
            }
        };
        let root = match yaml::parse(&file.text) {
            Ok(root) => root,
            Err(err) => {
                diagnostics.push(quoted(
                    Diagnostic::new(&file.name, err.at, err.message).help(err.help),
                ));
                continue;
            }
        };
        let mut walker = Walker::new(Arc::clone(&name), if quotable { &file.text } else { "" });
        let rules = walker.file(&root);
        diagnostics.append(&mut walker.diagnostics);
        if let Some((revision, revision_origin)) = rules.revision.clone() {
            ruleset.files.push(FileInfo {
                name: Arc::clone(&name),
                revision,
                revision_origin,
                content_hash: blake3::hash(file.text.as_bytes()).to_hex().to_string(),
                rules_hash: rules_digest(&root),
                text: Arc::from(file.text.as_str()),
            });
        }
        single.merge(&mut ruleset, rules, &mut diagnostics, &files);
    }
    check_unique_ids(&ruleset, &files, &mut diagnostics);
    if diagnostics.is_empty() {
        Ok(ruleset)
    } else {
        Err(RulesError::Invalid(diagnostics))
    }
}

/// Whether a text declares itself a rule file: some line starts with `format:`.
fn looks_like_rule_file(text: &str) -> bool {
    text.lines().any(|line| line.starts_with("format:"))
}

/// Sections that only one file of a ruleset may hold.
#[derive(Default)]
struct SingleSections {
    pipeline: Option<Origin>,
    lint: Option<Origin>,
    gate: Option<Origin>,
}

impl SingleSections {
    fn merge(
        &mut self,
        ruleset: &mut Ruleset,
        rules: FileRules,
        diagnostics: &mut Vec<Diagnostic>,
        files: &[SourceFile],
    ) {
        if let Some(pipeline) = rules.pipeline {
            let at = pipeline.origin.clone();
            if once("pipeline", &mut self.pipeline, at, diagnostics, files) {
                ruleset.pipeline = pipeline;
            }
        }
        if let Some(lint) = rules.lint {
            let at = lint.origin.clone();
            if once("lint", &mut self.lint, at, diagnostics, files) {
                ruleset.lint = lint;
            }
        }
        if let Some(gate) = rules.gate {
            let at = gate.origin.clone();
            if once("gate", &mut self.gate, at, diagnostics, files) {
                ruleset.gate = gate;
            }
        }
        ruleset.synonyms.extend(rules.synonyms);
        ruleset.exemptions.extend(rules.exemptions);
        ruleset.lemmas.extend(rules.lemmas);
    }
}

/// Records the first place a single section appears; reports any later one.
fn once(
    section: &str,
    first: &mut Option<Origin>,
    at: Option<Origin>,
    diagnostics: &mut Vec<Diagnostic>,
    files: &[SourceFile],
) -> bool {
    let Some(at) = at else { return false };
    match first {
        None => {
            *first = Some(at);
            true
        }
        Some(previous) => {
            diagnostics.push(
                Diagnostic::new(
                    &at.file,
                    Some(at.position()),
                    format!("a second `{section}` section; a ruleset has only one"),
                )
                .related(&previous.file, previous.position())
                .help(format!("merge the two `{section}` sections into one file"))
                .with_source(source_text(files, &at.file)),
            );
            false
        }
    }
}

fn source_text<'a>(files: &'a [SourceFile], name: &str) -> &'a str {
    files
        .iter()
        .find(|f| f.name == name && looks_like_rule_file(&f.text))
        .map_or("", |f| f.text.as_str())
}

fn check_unique_ids(ruleset: &Ruleset, files: &[SourceFile], diagnostics: &mut Vec<Diagnostic>) {
    let mut seen: HashMap<&str, &Origin> = HashMap::new();
    for meta in ruleset.all_meta() {
        let Some(id) = meta.id.as_deref() else {
            continue;
        };
        if let Some(first) = seen.get(id) {
            diagnostics.push(
                Diagnostic::new(
                    &meta.origin.file,
                    Some(meta.origin.position()),
                    format!("duplicate rule id `{id}`"),
                )
                .related(&first.file, first.position())
                .help("rule ids are unique across the ruleset; rename one of them")
                .with_source(source_text(files, &meta.origin.file)),
            );
        } else {
            seen.insert(id, &meta.origin);
        }
    }
}

/// A digest of what the file says, leaving out its `revision`, comments and layout: two
/// files with the same digest hold the same rules.
fn rules_digest(root: &Node) -> String {
    let mut hasher = blake3::Hasher::new();
    match &root.value {
        Value::Map(entries) => {
            for (key, value) in entries {
                if matches!(&key.value, Value::Str(k) if k == "revision") {
                    continue;
                }
                feed(&mut hasher, key);
                feed(&mut hasher, value);
            }
        }
        _ => feed(&mut hasher, root),
    }
    hasher.finalize().to_hex().to_string()
}

fn feed(hasher: &mut blake3::Hasher, node: &Node) {
    match &node.value {
        Value::Null => hasher.update(b"n"),
        Value::Bool(b) => hasher.update(if *b { b"t" } else { b"f" }),
        Value::Int(i) => hasher.update(b"i").update(&i.to_le_bytes()),
        Value::Float(f) => hasher.update(b"d").update(&f.to_le_bytes()),
        Value::Str(s) => hasher
            .update(b"s")
            .update(&(s.len() as u64).to_le_bytes())
            .update(s.as_bytes()),
        Value::Seq(items) => {
            hasher.update(b"[");
            for item in items {
                feed(hasher, item);
            }
            hasher.update(b"]")
        }
        Value::Map(entries) => {
            hasher.update(b"{");
            for (k, v) in entries {
                feed(hasher, k);
                feed(hasher, v);
            }
            hasher.update(b"}")
        }
    };
}

#[cfg(test)]
mod tests {
    use super::*;

    fn source(name: &str, text: &str) -> SourceFile {
        SourceFile {
            name: name.into(),
            text: text.into(),
        }
    }

    #[test]
    fn files_merge_and_rules_keep_their_origin() {
        let ruleset = load_sources(
            "rules",
            vec![
                source(
                    "a.yaml",
                    "format: 1\nrevision: 1\nsynonyms:\n  - equivalent: [pram, stroller]\n",
                ),
                source(
                    "b.yaml",
                    "format: 1\nrevision: 2\nsynonyms:\n  - id: x\n    one_way: {from: lift, to: elevator}\n",
                ),
            ],
        )
        .unwrap();
        assert_eq!(ruleset.synonyms.len(), 2);
        assert_eq!(ruleset.synonyms[1].meta.origin.to_string(), "b.yaml:4");
        assert_eq!(ruleset.files[1].revision, 2);
    }

    #[test]
    fn the_digest_ignores_revision_and_comments() {
        let a = yaml::parse("format: 1\nrevision: 1\nexempt: [x]\n").unwrap();
        let b = yaml::parse("# hello\nformat: 1\nrevision: 9\nexempt:\n  - x\n").unwrap();
        let c = yaml::parse("format: 1\nrevision: 1\nexempt: [y]\n").unwrap();
        assert_eq!(rules_digest(&a), rules_digest(&b));
        assert_ne!(rules_digest(&a), rules_digest(&c));
    }
}
