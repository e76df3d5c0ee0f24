//! Terminal colour, only where it helps: on a terminal, and never when NO_COLOR is set.

use std::io::IsTerminal;

#[derive(Clone, Copy, Debug, PartialEq, Eq, clap::ValueEnum)]
pub enum ColorChoice {
    Auto,
    Always,
    Never,
}

#[derive(Clone, Copy, Debug)]
pub struct Style {
    enabled: bool,
}

impl Style {
    pub fn for_stdout(choice: ColorChoice) -> Self {
        let no_color = std::env::var_os("NO_COLOR").is_some_and(|v| !v.is_empty());
        let enabled = match choice {
            ColorChoice::Always => true,
            ColorChoice::Never => false,
            ColorChoice::Auto => !no_color && std::io::stdout().is_terminal(),
        };
        Style { enabled }
    }

    fn paint(&self, code: &str, text: &str) -> String {
        if self.enabled {
            format!("\x1b[{code}m{text}\x1b[0m")
        } else {
            text.to_string()
        }
    }

    pub fn bold(&self, text: &str) -> String {
        self.paint("1", text)
    }
    pub fn dim(&self, text: &str) -> String {
        self.paint("2", text)
    }
    pub fn red(&self, text: &str) -> String {
        self.paint("31", text)
    }
    pub fn green(&self, text: &str) -> String {
        self.paint("32", text)
    }
    pub fn yellow(&self, text: &str) -> String {
        self.paint("33", text)
    }
    pub fn cyan(&self, text: &str) -> String {
        self.paint("36", text)
    }
}

/// Pads `text` to `width` columns by its visible length (colour codes take none).
pub fn pad(text: &str, visible: &str, width: usize) -> String {
    let len = visible.chars().count();
    format!("{text}{}", " ".repeat(width.saturating_sub(len)))
}

/// `text` safe to print on a terminal: control characters (C0 but tab, DEL, C1 — among
/// them ESC, which starts escape sequences that could move the cursor, rewrite earlier
/// lines or set the window title) are shown as `\u{..}` escapes. Corpus titles, queries
/// and rule text go through this in every text renderer.
pub fn clean(text: &str) -> std::borrow::Cow<'_, str> {
    let unsafe_char = |c: char| c.is_control() && c != '\t' && c != '\n';
    if !text.chars().any(unsafe_char) {
        return std::borrow::Cow::Borrowed(text);
    }
    let mut out = String::with_capacity(text.len() + 8);
    for c in text.chars() {
        if unsafe_char(c) {
            out.push_str(&c.escape_unicode().to_string());
        } else {
            out.push(c);
        }
    }
    std::borrow::Cow::Owned(out)
}

/// `text` on one terminal line: as [`clean`], and line breaks shown as `\n` too (a title or
/// query must not start a line that looks like the report's own).
pub fn clean_line(text: &str) -> std::borrow::Cow<'_, str> {
    if !text.chars().any(|c| c.is_control() && c != '\t') {
        return std::borrow::Cow::Borrowed(text);
    }
    let mut out = String::with_capacity(text.len() + 8);
    for c in text.chars() {
        match c {
            '\n' => out.push_str("\\n"),
            '\t' => out.push('\t'),
            c if c.is_control() => out.push_str(&c.escape_unicode().to_string()),
            c => out.push(c),
        }
    }
    std::borrow::Cow::Owned(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn control_characters_are_shown_not_sent() {
        let hostile = "Timetable\x1b]0;owned\x07 \x1b[2J\u{9b}31m\r\nnext\tcol";
        let line = clean_line(hostile);
        assert!(!line.chars().any(|c| c.is_control() && c != '\t'), "{line}");
        assert!(line.contains("\\u{1b}]0;owned\\u{7}"));
        assert!(line.contains("\\u{9b}31m\\u{d}\\nnext\tcol"));
        assert_eq!(clean("plain ünïcode\ttab\n"), "plain ünïcode\ttab\n");
        assert!(matches!(clean("plain"), std::borrow::Cow::Borrowed(_)));
        assert!(clean("a\x1bb\nc").contains("a\\u{1b}b\nc"));
    }
}
