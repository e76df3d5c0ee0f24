//! The `lexdelta` command: parses arguments, calls the library, renders, picks the exit
//! code (0 ok, 1 findings or a gate failed, 2 bad input or usage).

mod cli;

use std::process::ExitCode;

use clap::Parser;

fn main() -> ExitCode {
    let args = cli::Cli::parse();
    match cli::run(args) {
        Ok(code) => code,
        Err(err) => {
            if err.is_broken_pipe() {
                return ExitCode::SUCCESS;
            }
            eprintln!("{err}");
            ExitCode::from(2)
        }
    }
}
