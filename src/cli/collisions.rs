//! `lexdelta collisions`: conflation groups that merge words of different meanings.

use std::path::PathBuf;
use std::process::ExitCode;

use lexdelta::analysis::Analyzer;
use lexdelta::atomic::write_file;
use lexdelta::audit::AuditError;
use lexdelta::audit::morphy::Morphy;
use lexdelta::audit::report::{CollisionOptions, collision_report_from_file};
use lexdelta::corpus::DocumentCounts;
use lexdelta::report::{Style, collisions_csv, collisions_json, collisions_text};

use super::input::{CorpusArgs, QueryArgs, input_error, warn};
use super::shared::{ColorArg, Format, LimitArg, formats, not_offered};
use super::{CliError, print};

/// Rank the corpus's conflation groups that merge words WordNet gives different base
/// forms, with a verified exemption or lemma override that splits each one.
#[derive(Debug, clap::Args)]
#[command(
    after_help = "Examples:\n  lexdelta collisions --corpus demo-corpus/documents.jsonl --queries demo-corpus/queries.jsonl\n  lexdelta collisions --corpus docs.jsonl --limit 50 --format csv > groups.csv\n  lexdelta collisions --corpus docs.jsonl --queries q.jsonl --accept univers,transit --write rules/split-groups.yaml\n\nRisk = (W - heaviest meaning's weight) * m/(m-1), where a meaning's weight is its forms'\ndocument frequencies plus the searches that mention them, W the group's total and m its\nnumber of meanings. Every suggestion is checked by recompiling the analyzer with it.\n--write never replaces an existing file without --force."
)]
pub struct Args {
    /// The ruleset directory.
    #[arg(long, default_value = "rules")]
    rules: PathBuf,
    #[command(flatten)]
    input: CorpusArgs,
    #[command(flatten)]
    log: QueryArgs,
    /// The WordNet 3.0 `dict` directory.
    #[arg(long, default_value = "/usr/share/wordnet")]
    wordnet: PathBuf,
    #[command(flatten)]
    limit: LimitArg,
    /// Output format.
    #[arg(long, default_value = "text", value_parser = formats(&[Format::Text, Format::Json, Format::Csv]))]
    format: Format,
    #[command(flatten)]
    color: ColorArg,
    /// Write the shown groups' suggestions (or only --accept's) as a new rule file.
    #[arg(long)]
    write: Option<PathBuf>,
    /// Keys of the groups whose suggestions --write takes, comma-separated.
    #[arg(long, value_delimiter = ',', requires = "write")]
    accept: Vec<String>,
    /// Replace the --write file if it exists.
    #[arg(long)]
    force: bool,
    /// Worker threads (default: all cores).
    #[arg(long)]
    threads: Option<usize>,
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    let analyzer = Analyzer::load(&args.rules)?;
    let mut options = CollisionOptions {
        top: Some(args.limit.value),
        ..CollisionOptions::default()
    };
    if let Some(n) = args.threads {
        options.threads = n.max(1);
    }
    // The corpus is streamed, never held in memory: counted now (so its errors come
    // first), read again later only for the postings of the shown groups.
    let corpus = args.input.required("by collisions")?;
    let doc_options = args.input.doc_options(None, 0)?;
    let counts =
        DocumentCounts::from_file(analyzer.surface(), corpus, &doc_options, options.threads)
            .map_err(input_error)?;
    warn(&counts.warnings);
    let log = args.log.read_given()?;
    let morphy = Morphy::load(&args.wordnet)?;
    let report = collision_report_from_file(
        &analyzer,
        counts,
        corpus,
        &doc_options,
        log.as_ref(),
        &morphy,
        &options,
    )?;
    if let Some(path) = &args.write {
        write_rules(&report, path, &args.accept, args.force)?;
    }
    let rendered = match args.format {
        Format::Text => collisions_text::render(&report, Style::for_stdout(args.color.choice)),
        Format::Json => collisions_json::render(&report),
        Format::Csv => collisions_csv::render(&report),
        other => return Err(not_offered(other)),
    };
    print(&rendered)?;
    Ok(ExitCode::SUCCESS)
}

fn write_rules(
    report: &lexdelta::audit::report::CollisionReport,
    path: &std::path::Path,
    accept: &[String],
    force: bool,
) -> Result<(), CliError> {
    let text = report.accepted_rule_file(accept).map_err(|e| match e {
        AuditError::UnknownGroup(key) => CliError(
            format!("--accept {key:?}: no shown group has that key (raise --limit?)"),
            false,
        ),
        e => e.into(),
    })?;
    write_file(path, text.as_bytes(), force)?;
    Ok(())
}
