//! `lexdelta trace`: one text through every stage.

use std::path::PathBuf;
use std::process::ExitCode;

use lexdelta::analysis::{Analyzer, Side};
use lexdelta::report::{Style, trace_text};

use super::shared::{ColorArg, Format, formats, not_offered};
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
    #[arg(long, default_value = "text", value_parser = formats(&[Format::Text, Format::Json]))]
    format: Format,
    #[command(flatten)]
    color: ColorArg,
    /// The text to analyze (several words are joined by spaces).
    #[arg(required = true)]
    text: Vec<String>,
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    let analyzer = Analyzer::load(&args.rules)?;
    let trace = analyzer.trace(&args.text.join(" "), args.side);
    let rendered = match args.format {
        Format::Text => trace_text::render(&trace, Style::for_stdout(args.color.choice)),
        Format::Json => serde_json::to_string_pretty(&trace)? + "\n",
        other => return Err(not_offered(other)),
    };
    print(&rendered)?;
    Ok(ExitCode::SUCCESS)
}
