//! Diagnostics for rule files: every problem names its file, line and column.

use std::fmt;
use std::path::PathBuf;

use super::yaml::Position;

/// One problem in a rule file, pointing at the YAML source.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Diagnostic {
    /// The file as the user named it (relative to the ruleset's parent when possible).
    pub file: String,
    /// Where in the file; `None` when the problem concerns the whole file.
    pub at: Option<Position>,
    /// What is wrong, in one sentence.
    pub message: String,
    /// What to do about it.
    pub help: Option<String>,
    /// The source line the position points into, for a caret under it.
    pub source_line: Option<String>,
    /// A second place the problem involves (the first definition of a duplicate id).
    pub related: Option<(String, Position)>,
    /// Where the caret goes in `source_line` when that is a window of a long line.
    pub caret_column: Option<usize>,
}

/// Source lines longer than this are quoted as a window around the column.
const MAX_QUOTED: usize = 100;

impl Diagnostic {
    pub fn new(file: &str, at: Option<Position>, message: impl Into<String>) -> Self {
        Diagnostic {
            file: file.to_string(),
            at,
            message: message.into(),
            help: None,
            source_line: None,
            related: None,
            caret_column: None,
        }
    }

    pub fn help(mut self, help: impl Into<String>) -> Self {
        self.help = Some(help.into());
        self
    }

    pub fn related(mut self, file: &str, at: Position) -> Self {
        self.related = Some((file.to_string(), at));
        self
    }

    /// Attaches the source line the position points into; a very long line is cut to a
    /// window around the column (and the column moved to match).
    pub fn with_source(mut self, text: &str) -> Self {
        let Some(at) = self.at else { return self };
        let Some(line) = text.lines().nth(at.line.saturating_sub(1) as usize) else {
            return self;
        };
        let chars: Vec<char> = line.chars().collect();
        if chars.len() <= MAX_QUOTED {
            self.source_line = Some(line.to_string());
            return self;
        }
        let col = (at.column.saturating_sub(1) as usize).min(chars.len());
        let start = col.saturating_sub(MAX_QUOTED / 2);
        let end = (start + MAX_QUOTED).min(chars.len());
        let window: String = chars[start..end].iter().collect();
        self.source_line = Some(format!("…{window}…"));
        self.caret_column = Some(col - start + 2);
        self
    }

    /// `file:line:column`, or just the file.
    pub fn location(&self) -> String {
        match self.at {
            Some(at) => format!("{}:{}:{}", self.file, at.line, at.column),
            None => self.file.clone(),
        }
    }
}

impl fmt::Display for Diagnostic {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: error: {}", self.location(), self.message)?;
        if let (Some(at), Some(line)) = (self.at, &self.source_line) {
            let number = at.line.to_string();
            let pad = " ".repeat(number.len());
            let column = self.caret_column.unwrap_or(at.column as usize);
            let caret_pad: String = line
                .chars()
                .take(column.saturating_sub(1))
                .map(|c| if c == '\t' { '\t' } else { ' ' })
                .collect();
            write!(f, "\n{pad} |\n{number} | {line}\n{pad} | {caret_pad}^")?;
        }
        if let Some((file, at)) = &self.related {
            write!(
                f,
                "\n  note: first defined at {file}:{}:{}",
                at.line, at.column
            )?;
        }
        if let Some(help) = &self.help {
            write!(f, "\n  help: {help}")?;
        }
        Ok(())
    }
}

/// Why a ruleset could not be loaded or compiled.
#[derive(Debug, thiserror::Error)]
pub enum RulesError {
    #[error("cannot read {path}: {source}")]
    Io {
        path: PathBuf,
        #[source]
        source: std::io::Error,
    },
    #[error("{0} is not a directory; a ruleset is a directory of .yaml files")]
    NotADirectory(PathBuf),
    #[error("{0} holds no .yaml or .yml rule files")]
    Empty(String),
    #[error("{}", render_all(.0))]
    Invalid(Vec<Diagnostic>),
    #[error("git: {0}")]
    Git(String),
}

impl RulesError {
    /// The diagnostics, when the problem is in the rule files themselves.
    pub fn diagnostics(&self) -> &[Diagnostic] {
        match self {
            RulesError::Invalid(d) => d,
            _ => &[],
        }
    }
}

fn render_all(diagnostics: &[Diagnostic]) -> String {
    let mut out = String::new();
    for (i, d) in diagnostics.iter().enumerate() {
        if i > 0 {
            out.push_str("\n\n");
        }
        out.push_str(&d.to_string());
    }
    let n = diagnostics.len();
    out.push_str(&format!(
        "\n\n{n} problem{} in the rule files; nothing was run.",
        if n == 1 { "" } else { "s" }
    ));
    // Source lines and file names come from the files: shown, never sent to the terminal.
    crate::report::style::clean(&out).into_owned()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn display_shows_the_line_and_a_caret() {
        let d = Diagnostic::new("rules/a.yaml", Some(Position { line: 2, column: 5 }), "bad")
            .help("fix it")
            .with_source("format: 1\nfoo: bar\n");
        let text = d.to_string();
        assert!(text.starts_with("rules/a.yaml:2:5: error: bad"), "{text}");
        assert!(text.contains("2 | foo: bar\n  |     ^"), "{text}");
        assert!(text.ends_with("help: fix it"), "{text}");
    }
}
