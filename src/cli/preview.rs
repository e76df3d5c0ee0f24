//! `lexdelta preview`: before/after over a query set on a sample index.

use std::io::IsTerminal;
use std::path::PathBuf;
use std::process::ExitCode;
use std::sync::Arc;

use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
use lexdelta::analysis::Analyzer;
use lexdelta::atomic::write_file;
use lexdelta::corpus::{DocOptions, FieldSpec, Sample, read_documents, read_queries};
use lexdelta::index::Progress;
use lexdelta::metrics::{self, RandomizationTest};
use lexdelta::preview::{
    self, JudgedSet, MatchMode, PreviewInput, PreviewOptions, Ranking, Scoring,
};
use lexdelta::report::preview_text::Limits;
use lexdelta::report::{ColorChoice, Style, preview_json, preview_text};

use super::{CliError, print};

const AFTER_HELP: &str = "\
Examples:
  lexdelta preview --base rules --head demo-corpus/proposed \\
      --corpus demo-corpus/documents.jsonl --queries demo-corpus/queries.jsonl
  lexdelta preview --base rules --head demo-corpus/proposed \\
      --corpus demo-corpus/documents.jsonl --queries demo-corpus/queries.jsonl \\
      --judgments demo-corpus/judgments.qrels --judged-queries demo-corpus/judged-queries.tsv \\
      --format json --runs runs/
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
    #[arg(long, value_name = "DIR")]
    base: PathBuf,
    /// The changed ruleset.
    #[arg(long, value_name = "DIR")]
    head: PathBuf,
    /// Documents: JSON Lines, CSV with a header, or a directory of .txt/.md files.
    #[arg(long, value_name = "FILE")]
    corpus: PathBuf,
    /// Queries: one per line, TSV `query<TAB>count`, or a JSON Lines query log (.jsonl).
    #[arg(long, value_name = "FILE")]
    queries: PathBuf,
    /// Relevance judgments: TREC qrels (with --judged-queries) or CSV
    /// (`query_id,query,doc_id,relevance`).
    #[arg(long, value_name = "FILE")]
    judgments: Option<PathBuf>,
    /// The text of each judged query, `QID<TAB>text` (for qrels judgments).
    #[arg(long, value_name = "FILE")]
    judged_queries: Option<PathBuf>,
    /// A searched field with its weight, `name` or `name^weight`; repeat for several.
    #[arg(long = "field", value_name = "NAME[^W]", default_values = ["title^2", "body"])]
    fields: Vec<String>,
    /// The document id field.
    #[arg(long, default_value = "id")]
    id_field: String,
    /// The field shown as a document's title.
    #[arg(long, default_value = "title")]
    title_field: String,
    /// Keep a random sample of the documents: a count (1000) or a fraction (0.1).
    #[arg(long, value_name = "N")]
    sample: Option<String>,
    /// Seed of the sample.
    #[arg(long, default_value_t = 42)]
    seed: u64,
    /// Which documents match: all clauses, any clause, or at least N (`min:N`).
    #[arg(long = "match", value_name = "MODE", default_value = "all")]
    mode: String,
    /// Ranking function.
    #[arg(long, value_enum, default_value_t = Ranking::Bm25)]
    ranking: Ranking,
    /// BM25 k1.
    #[arg(long, default_value_t = 1.2)]
    k1: f64,
    /// BM25 b.
    #[arg(long, default_value_t = 0.75)]
    b: f64,
    /// Rankings are cut at this depth; metrics and RBO use it.
    #[arg(long, default_value_t = 10)]
    top_k: usize,
    /// RBO persistence p, between 0 and 1.
    #[arg(long, default_value_t = metrics::DEFAULT_RBO_P)]
    rbo_p: f64,
    /// Changed queries shown in text output (JSON lists all).
    #[arg(long, default_value_t = 20)]
    limit: usize,
    /// Gained and lost documents listed per query.
    #[arg(long, default_value_t = 5)]
    docs: usize,
    /// Write base.run and head.run (TREC run format) into this directory.
    #[arg(long, value_name = "DIR")]
    runs: Option<PathBuf>,
    /// Where surface indexes are cached.
    #[arg(long, value_name = "DIR", default_value = ".lexdelta-cache")]
    cache: PathBuf,
    /// Build the index in memory and store nothing.
    #[arg(long)]
    no_cache: bool,
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Text)]
    format: Format,
    /// Colour: auto (on a terminal, unless NO_COLOR is set), always or never.
    #[arg(long, value_enum, default_value_t = ColorChoice::Auto)]
    color: ColorChoice,
}

#[derive(Clone, Copy, Debug, clap::ValueEnum)]
enum Format {
    Text,
    Json,
}

/// A progress bar on stderr, drawn only on a terminal.
struct Bar(ProgressBar);

impl Progress for Bar {
    fn begin(&self, total: u64, what: &str) {
        self.0.set_length(total);
        self.0.set_message(what.to_string());
    }
    fn advance(&self, n: u64) {
        self.0.inc(n);
    }
    fn finish(&self) {
        self.0.finish_and_clear();
    }
}

fn bar() -> Bar {
    let target = if std::io::stderr().is_terminal() {
        ProgressDrawTarget::stderr()
    } else {
        ProgressDrawTarget::hidden()
    };
    let bar = ProgressBar::with_draw_target(Some(0), target);
    if let Ok(style) =
        ProgressStyle::with_template("{msg} {wide_bar} {pos}/{len} documents ({eta})")
    {
        bar.set_style(style);
    }
    Bar(bar)
}

fn parse_sample(text: &str) -> Result<Sample, CliError> {
    let bad = || {
        CliError(
            format!("--sample {text:?}: give a count (1000) or a fraction (0.1)"),
            false,
        )
    };
    if let Ok(n) = text.parse::<usize>() {
        return Ok(Sample::Count(n));
    }
    match text.parse::<f64>() {
        Ok(f) if f > 0.0 && f <= 1.0 => Ok(Sample::Fraction(f)),
        _ => Err(bad()),
    }
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    let mode: MatchMode = args
        .mode
        .parse()
        .map_err(|e| CliError(format!("--match: {e}"), false))?;
    if !(args.rbo_p > 0.0 && args.rbo_p < 1.0) {
        return Err(CliError(
            format!("--rbo-p {}: must be between 0 and 1", args.rbo_p),
            false,
        ));
    }
    if args.top_k == 0 {
        return Err(CliError("--top-k must be at least 1".into(), false));
    }
    if !(args.k1 >= 0.0 && (0.0..=1.0).contains(&args.b)) {
        return Err(CliError(
            "--k1 must be ≥ 0 and --b between 0 and 1".into(),
            false,
        ));
    }
    let fields = args
        .fields
        .iter()
        .map(|f| FieldSpec::parse(f).map_err(|e| CliError(format!("--field {f:?}: {e}"), false)))
        .collect::<Result<Vec<_>, _>>()?;
    let doc_options = DocOptions {
        id_field: args.id_field.clone(),
        title_field: args.title_field.clone(),
        fields,
        sample: args.sample.as_deref().map(parse_sample).transpose()?,
        seed: args.seed,
    };
    let base = Arc::new(Analyzer::load(&args.base)?);
    let head = Arc::new(Analyzer::load(&args.head)?);
    let corpus = read_documents(&args.corpus, &doc_options)?;
    let log = read_queries(&args.queries)?;
    let judged = match &args.judgments {
        None => None,
        Some(path) if path.extension().is_some_and(|e| e == "csv") => {
            let (judgments, texts) = metrics::read_csv_judgments(path)?;
            Some(JudgedSet { judgments, texts })
        }
        Some(path) => {
            let Some(texts_path) = &args.judged_queries else {
                return Err(CliError(
                    format!(
                        "{}: TREC qrels name queries by id; pass --judged-queries with each id's text",
                        path.display()
                    ),
                    false,
                ));
            };
            Some(JudgedSet {
                judgments: metrics::read_trec_qrels(path)?,
                texts: metrics::read_queries(texts_path)?,
            })
        }
    };
    let options = PreviewOptions {
        scoring: Scoring {
            ranking: args.ranking,
            k1: args.k1,
            b: args.b,
            mode,
        },
        top_k: args.top_k,
        rbo_p: args.rbo_p,
        docs_shown: args.docs.max(1),
        cache_dir: (!args.no_cache).then(|| args.cache.clone()),
        want_runs: args.runs.is_some(),
        test: RandomizationTest::default(),
    };
    let input = PreviewInput {
        base,
        head,
        corpus: &corpus,
        queries: &log,
        judged,
    };
    let outcome = preview::run(input, &options, &bar())?;
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
            Style::for_stdout(args.color),
            Limits {
                queries: args.limit,
                docs: args.docs,
            },
        ),
        Format::Json => preview_json::render(&outcome.report)?,
    };
    print(&rendered)?;
    Ok(ExitCode::SUCCESS)
}
