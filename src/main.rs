//! The `lexdelta` command: parses arguments, calls the library, renders, picks the exit
//! code (0 ok, 1 findings or a gate failed, 2 bad input or usage).

mod cli;

use std::process::ExitCode;

use clap::Parser;

/// mimalloc: a preview allocates and frees posting lists of a million documents per query
/// on every thread, and after a corpus's texts are freed the system allocator spent most
/// of a second consolidating its heap (measured: README, "Speed"). Its `no_thp` feature
/// keeps it from asking for transparent huge pages: a preview frees and refills large
/// lists all the time, and each 2 MiB page given back and touched again was zeroed whole
/// by the kernel, about a fifth of a warm preview's time at a million documents.
#[global_allocator]
static GLOBAL: mimalloc::MiMalloc = mimalloc::MiMalloc;

fn main() -> ExitCode {
    let args = cli::Cli::parse();
    match cli::run(args) {
        Ok(code) => code,
        Err(err) => {
            if err.is_broken_pipe() {
                return ExitCode::SUCCESS;
            }
            // Messages quote file names, queries and titles: never raw control characters.
            eprintln!("{}", lexdelta::report::style::clean(&err.to_string()));
            ExitCode::from(2)
        }
    }
}
