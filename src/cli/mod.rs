//! Command-line interface: one file per command, each with its arguments and `run`.

mod collisions;
mod import;
mod input;
mod lint;
mod preview;
mod review;
mod sample;
mod shared;
mod stemcheck;
mod trace;

use std::io::Write;
use std::process::ExitCode;

use clap::{Parser, Subcommand};

const EXIT_CODES: &str = "\
Exit codes:
  0  success
  1  findings at or above the chosen severity, or a gate limit breached
  2  bad input or usage (the message names the file, line and column)";

/// Change search normalization rules safely: trace, lint, preview and review them.
#[derive(Debug, Parser)]
#[command(name = "lexdelta", version, about, after_help = EXIT_CODES)]
pub struct Cli {
    #[command(subcommand)]
    command: Command,
    /// Before using a cached sample index (preview, review), check every file of it against
    /// its checksum, reading the whole index; without it, sizes, modification times and the
    /// small files' checksums are checked. A damaged index is rebuilt either way.
    #[arg(long, global = true)]
    verify_cache: bool,
}

#[derive(Debug, Subcommand)]
enum Command {
    Trace(trace::Args),
    Import(import::Args),
    Preview(Box<preview::Args>),
    Review(Box<review::Args>),
    Collisions(collisions::Args),
    Stemcheck(stemcheck::Args),
    Lint(lint::Args),
}

/// An error the CLI reports on stderr with exit code 2.
#[derive(Debug)]
pub struct CliError(pub String, bool);

impl CliError {
    pub fn is_broken_pipe(&self) -> bool {
        self.1
    }
}

impl std::fmt::Display for CliError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "lexdelta: {}", self.0)
    }
}

impl<E: std::error::Error> From<E> for CliError {
    fn from(err: E) -> Self {
        let mut text = err.to_string();
        let mut source = err.source();
        while let Some(s) = source {
            let s_text = s.to_string();
            if !text.contains(&s_text) {
                text.push_str(": ");
                text.push_str(&s_text);
            }
            source = s.source();
        }
        CliError(text, false)
    }
}

pub fn run(cli: Cli) -> Result<ExitCode, CliError> {
    if cli.verify_cache {
        lexdelta::index::set_default_verify(lexdelta::index::Verify::Full);
    }
    match cli.command {
        Command::Trace(args) => trace::run(args),
        Command::Import(args) => import::run(args),
        Command::Preview(args) => preview::run(*args),
        Command::Review(args) => review::run(*args),
        Command::Collisions(args) => collisions::run(args),
        Command::Stemcheck(args) => stemcheck::run(args),
        Command::Lint(args) => lint::run(args),
    }
}

/// Writes a rendered report to stdout; a closed pipe (`| head`) is not an error.
pub fn print(text: &str) -> Result<(), CliError> {
    let mut out = std::io::stdout().lock();
    match out.write_all(text.as_bytes()).and_then(|_| out.flush()) {
        Ok(()) => Ok(()),
        Err(e) if e.kind() == std::io::ErrorKind::BrokenPipe => Err(CliError(String::new(), true)),
        Err(e) => Err(e.into()),
    }
}
