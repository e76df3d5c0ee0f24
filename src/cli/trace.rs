//! `lexdelta trace`: one text through every stage.

use std::path::PathBuf;
use std::process::ExitCode;

use lexdelta::analysis::{Analyzer, Side};
use lexdelta::report::{ColorChoice, Style, trace_text};

use super::{CliError, print};

/// Show each token of TEXT going through every stage, with the rule that fired.
#[derive(Debug, clap::Args)]
#[command(
    after_help = "Examples:\n  lexdelta trace 'Children rode the light rail'\n  lexdelta trace --side index --rules demo-corpus/proposed 'left luggage'\n  lexdelta trace --format json 'stroller'"
)]
pub struct Args {
    /// The ruleset directory.
    #[arg(long, default_value = "rules")]
    rules: PathBuf,
    /// Analyze as a document (index) or as a query (with synonym expansion).
    #[arg(long, value_enum, default_value_t = Side::Query)]
    side: Side,
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Text)]
    format: Format,
    /// Colour: auto (on a terminal, unless NO_COLOR is set), always or never.
    #[arg(long, value_enum, default_value_t = ColorChoice::Auto)]
    color: ColorChoice,
    /// The text to analyze (several words are joined by spaces).
    #[arg(required = true)]
    text: Vec<String>,
}

#[derive(Clone, Copy, Debug, clap::ValueEnum)]
enum Format {
    Text,
    Json,
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    let analyzer = Analyzer::load(&args.rules)?;
    let trace = analyzer.trace(&args.text.join(" "), args.side);
    let rendered = match args.format {
        Format::Text => trace_text::render(&trace, Style::for_stdout(args.color)),
        Format::Json => serde_json::to_string_pretty(&trace)? + "\n",
    };
    print(&rendered)?;
    Ok(ExitCode::SUCCESS)
}
