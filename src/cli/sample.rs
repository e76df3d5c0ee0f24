//! The sample a preview runs on — documents, queries, judgments — and how it is scored:
//! the arguments `preview` and `review` share.

use std::io::IsTerminal;
use std::path::PathBuf;

use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
use lexdelta::corpus::{Corpus, DocOptions, QueryLog, Sample, read_documents, read_judgments};
use lexdelta::index::Progress;
use lexdelta::metrics::{self, RandomizationTest};
use lexdelta::preview::{self, JudgedSet, MatchMode, PreviewOptions, Ranking, Scoring};

use super::CliError;
use super::input::{CorpusArgs, QueryArgs, finite, input_error, warn};

#[derive(Debug, Clone, clap::Args)]
pub struct SampleArgs {
    /// Use the bundled demo: its documents, query log and judgments (and, where the
    /// command takes rulesets, `rules` as base and `demo-corpus/proposed` as head).
    #[arg(long)]
    pub demo: bool,
    #[command(flatten)]
    pub input: CorpusArgs,
    #[command(flatten)]
    pub log: QueryArgs,
    /// Relevance judgments: TREC qrels (with --judged-queries) or CSV
    /// (`query_id,query,doc_id,relevance`), told apart by content.
    #[arg(long, value_name = "FILE")]
    pub judgments: Option<PathBuf>,
    /// The text of each judged query, `QID<TAB>text` (for qrels judgments).
    #[arg(long, value_name = "FILE")]
    pub judged_queries: Option<PathBuf>,
    /// Keep a random sample of the documents: a count (1000) or a fraction (0.1).
    #[arg(long, value_name = "N", value_parser = parse_sample)]
    pub sample: Option<Sample>,
    /// Seed of the sample's random draw.
    #[arg(long, default_value_t = 42)]
    pub sample_seed: u64,
    /// Which documents match: all clauses, any clause, or at least N (`min:N`).
    #[arg(long = "match", value_name = "MODE", default_value = "all")]
    pub mode: String,
    /// Ranking function.
    #[arg(long, value_enum, default_value_t = Ranking::Bm25)]
    pub ranking: Ranking,
    /// BM25 k1.
    #[arg(long, default_value_t = 1.2, value_parser = finite)]
    pub k1: f64,
    /// BM25 b.
    #[arg(long, default_value_t = 0.75, value_parser = finite)]
    pub b: f64,
    /// Documents shown per ranking, and compared by RBO and the outcome labels.
    #[arg(long, default_value_t = 10)]
    pub top_k: usize,
    /// How deep rankings are evaluated for judged metrics and written to run files.
    #[arg(long, default_value_t = preview::DEFAULT_DEPTH)]
    pub depth: usize,
    /// Random sign assignments drawn by the paired randomization test.
    #[arg(long, default_value_t = RandomizationTest::default().trials)]
    pub trials: usize,
    /// Seed of the paired randomization test.
    #[arg(long, default_value_t = RandomizationTest::default().seed)]
    pub seed: u64,
    /// RBO persistence p, between 0 and 1.
    #[arg(long, default_value_t = metrics::DEFAULT_RBO_P, value_parser = finite)]
    pub rbo_p: f64,
    /// Where surface indexes are cached.
    #[arg(long, value_name = "DIR", default_value = ".lexdelta-cache")]
    pub cache: PathBuf,
    /// Build the index in memory and store nothing.
    #[arg(long)]
    pub no_cache: bool,
}

pub const DEMO_BASE: &str = "rules";
pub const DEMO_HEAD: &str = "demo-corpus/proposed";
const DEMO_CORPUS: &str = "demo-corpus/documents.jsonl";
const DEMO_QUERIES: &str = "demo-corpus/queries.jsonl";
const DEMO_JUDGMENTS: &str = "demo-corpus/judgments.qrels";
const DEMO_JUDGED_QUERIES: &str = "demo-corpus/judged-queries.tsv";

/// Everything a preview needs besides the two rulesets.
pub struct Loaded {
    /// Where the documents are and how to read them (see [`Loaded::read_corpus`]).
    pub corpus_path: PathBuf,
    pub doc_options: DocOptions,
    pub log: QueryLog,
    pub judged: Option<JudgedSet>,
    pub options: PreviewOptions,
}

impl SampleArgs {
    /// Validates the settings and reads the queries and judgments; the documents are read
    /// by [`Loaded::read_corpus`] or by the preview itself (`preview::open_sample`).
    pub fn load(&self, docs_shown: usize, want_runs: bool) -> Result<Loaded, CliError> {
        if self.demo && self.judgments.is_none() {
            let mut with_demo = self.clone();
            with_demo.judgments = Some(DEMO_JUDGMENTS.into());
            with_demo.judged_queries = Some(DEMO_JUDGED_QUERIES.into());
            return with_demo.load(docs_shown, want_runs);
        }
        let mode: MatchMode = self
            .mode
            .parse()
            .map_err(|e| CliError(format!("--match: {e}"), false))?;
        let doc_options = self.input.doc_options(self.sample, self.sample_seed)?;
        let options = PreviewOptions {
            scoring: Scoring {
                ranking: self.ranking,
                k1: self.k1,
                b: self.b,
                mode,
            },
            top_k: self.top_k,
            depth: self.depth,
            rbo_p: self.rbo_p,
            docs_shown: docs_shown.max(1),
            cache_dir: (!self.no_cache).then(|| self.cache.clone()),
            want_runs,
            test: RandomizationTest {
                trials: self.trials,
                seed: self.seed,
                ..RandomizationTest::default()
            },
        };
        options.validate()?;
        // Given inputs win; --demo fills in the ones not given.
        let given_or_demo = |given: &Option<PathBuf>, demo: &str, option: &str| {
            given
                .clone()
                .or_else(|| self.demo.then(|| PathBuf::from(demo)))
                .ok_or_else(|| CliError(format!("{option} is required (or --demo)"), false))
        };
        let corpus_path = given_or_demo(&self.input.corpus, DEMO_CORPUS, "--corpus")?;
        let queries_path = given_or_demo(&self.log.queries, DEMO_QUERIES, "--queries")?;
        let log = self.log.read(&queries_path)?;
        let judged = match &self.judgments {
            None => None,
            Some(path) => {
                let (judgments, texts) =
                    read_judgments(path, self.judged_queries.as_deref()).map_err(input_error)?;
                Some(JudgedSet { judgments, texts })
            }
        };
        Ok(Loaded {
            corpus_path,
            doc_options,
            log,
            judged,
            options,
        })
    }
}

impl Loaded {
    /// Reads the documents with their texts, and says on stderr what they lack.
    pub fn read_corpus(&self) -> Result<Corpus, CliError> {
        let corpus = read_documents(&self.corpus_path, &self.doc_options).map_err(input_error)?;
        warn(&corpus.warnings);
        Ok(corpus)
    }
}

/// A progress bar on stderr, drawn only on a terminal.
pub struct Bar(ProgressBar);

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
    fn notice(&self, message: &str) {
        self.0.suspend(|| eprintln!("lexdelta: {message}"));
    }
}

pub fn bar() -> Bar {
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

fn parse_sample(text: &str) -> Result<Sample, String> {
    text.parse()
}
