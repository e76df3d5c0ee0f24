//! `lexdelta preview`: before/after over a query set on a sample index.

use std::path::PathBuf;
use std::process::ExitCode;
use std::sync::Arc;

use lexdelta::analysis::Analyzer;
use lexdelta::atomic::write_file;
use lexdelta::preview::{self, PreviewError, PreviewInput};
use lexdelta::report::preview_text::Limits;
use lexdelta::report::{Style, preview_json, preview_text};

use super::input::{input_error, warn};
use super::sample::{DEMO_BASE, DEMO_HEAD, SampleArgs, bar};
use super::shared::{ColorArg, Format, LimitArg, formats, not_offered};
use super::{CliError, print};

const AFTER_HELP: &str = "\
Examples:
  lexdelta preview --base rules --head demo-corpus/proposed \\
      --corpus demo-corpus/documents.jsonl --queries demo-corpus/queries.jsonl
  lexdelta preview --base rules --head demo-corpus/proposed \\
      --corpus demo-corpus/documents.jsonl --queries demo-corpus/queries.jsonl \\
      --judgments demo-corpus/judgments.qrels --judged-queries demo-corpus/judged-queries.tsv \\
      --format json --runs runs/ --depth 100
  lexdelta preview ... --field title^3 --field body --sample 0.2 --match min:2 --ranking cosine

The surface index is cached in .lexdelta-cache/ (see --cache); it is rebuilt only when the
corpus, the fields or the surface settings (tokenizer, case, accents) change.

A preview on a sample is evidence, not proof: if you depend on recall (legal discovery,
clinical or safety documents), validate against your own full collection.

Exit codes:
  0  the preview ran (gates come with `lexdelta review`)
  2  bad input or usage (the message names the file and line)";

/// Show which queries gain or lose which documents when the rules change from BASE to HEAD.
#[derive(Debug, clap::Args)]
#[command(after_help = AFTER_HELP)]
pub struct Args {
    /// The ruleset in use (a directory of rule files).
    #[arg(long, value_name = "DIR", required_unless_present = "demo")]
    base: Option<PathBuf>,
    /// The changed ruleset.
    #[arg(long, value_name = "DIR", required_unless_present = "demo")]
    head: Option<PathBuf>,
    #[command(flatten)]
    limit: LimitArg,
    /// Gained and lost documents listed per query.
    #[arg(long, default_value_t = 5)]
    docs: usize,
    /// Write base.run and head.run (TREC run format, every query ranked to --depth) into
    /// this directory.
    #[arg(long, value_name = "DIR")]
    runs: Option<PathBuf>,
    /// Output format.
    #[arg(long, default_value = "text", value_parser = formats(&[Format::Text, Format::Json]))]
    format: Format,
    /// JSON: leave out each changed query's top-k lists (the report says so in `omitted`).
    #[arg(long)]
    omit_top_lists: bool,
    #[command(flatten)]
    color: ColorArg,
    #[command(flatten)]
    pub sample: SampleArgs,
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    let dir = |given: &Option<PathBuf>, demo: &str| given.clone().unwrap_or_else(|| demo.into());
    let base = Arc::new(Analyzer::load(&dir(&args.base, DEMO_BASE))?);
    let head = Arc::new(Analyzer::load(&dir(&args.head, DEMO_HEAD))?);
    let loaded = args.sample.load(args.docs, args.runs.is_some())?;
    let options = loaded.options.clone();
    let (corpus, indexes) = preview::open_sample(
        &loaded.corpus_path,
        &loaded.doc_options,
        &base,
        &head,
        &options,
        &bar(),
    )
    .map_err(|e| match e {
        PreviewError::Corpus(e) => input_error(e),
        e => e.into(),
    })?;
    warn(&corpus.warnings);
    let input = PreviewInput {
        base,
        head,
        corpus: &corpus,
        queries: &loaded.log,
        judged: loaded.judged,
    };
    let outcome = preview::run_opened(input, indexes, &options)?;
    for w in &outcome.report.warnings {
        eprintln!("lexdelta: warning: {w}");
    }
    if let (Some(dir), Some(runs)) = (&args.runs, &outcome.runs) {
        std::fs::create_dir_all(dir)
            .map_err(|e| CliError(format!("{}: {e}", dir.display()), false))?;
        write_file(
            &dir.join("base.run"),
            preview::trec_run(&runs.base, "base").as_bytes(),
            true,
        )?;
        write_file(
            &dir.join("head.run"),
            preview::trec_run(&runs.head, "head").as_bytes(),
            true,
        )?;
    }
    let rendered = match args.format {
        Format::Text => preview_text::render(
            &outcome.report,
            Style::for_stdout(args.color.choice),
            Limits {
                queries: args.limit.value,
                docs: args.docs,
            },
        ),
        Format::Json => preview_json::render(
            &outcome.report,
            preview_json::Omit {
                top_lists: args.omit_top_lists,
            },
        )?,
        other => return Err(not_offered(other)),
    };
    print(&rendered)?;
    Ok(ExitCode::SUCCESS)
}
