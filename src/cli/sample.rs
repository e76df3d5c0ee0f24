//! The sample a preview runs on — documents, queries, judgments — and how it is scored:
//! the arguments `preview` and `review` share.

use std::io::IsTerminal;
use std::path::PathBuf;

use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
use lexdelta::corpus::{
    Corpus, DocOptions, FieldSpec, QueryLog, Sample, read_documents, read_documents_without_texts,
    read_queries,
};
use lexdelta::index::Progress;
use lexdelta::metrics::{self, RandomizationTest};
use lexdelta::preview::{self, JudgedSet, MatchMode, PreviewOptions, Ranking, Scoring};

use super::CliError;

#[derive(Debug, Clone, clap::Args)]
pub struct SampleArgs {
    /// Use the bundled demo: its documents, query log and judgments (and, where the
    /// command takes rulesets, `rules` as base and `demo-corpus/proposed` as head).
    #[arg(long)]
    pub demo: bool,
    /// Documents: JSON Lines, CSV with a header, or a directory of .txt/.md files.
    #[arg(long, value_name = "FILE", required_unless_present = "demo")]
    pub corpus: Option<PathBuf>,
    /// Queries: one per line, TSV `query<TAB>count`, or a JSON Lines query log (.jsonl).
    #[arg(long, value_name = "FILE", required_unless_present = "demo")]
    pub queries: Option<PathBuf>,
    /// Relevance judgments: TREC qrels (with --judged-queries) or CSV
    /// (`query_id,query,doc_id,relevance`).
    #[arg(long, value_name = "FILE")]
    pub judgments: Option<PathBuf>,
    /// The text of each judged query, `QID<TAB>text` (for qrels judgments).
    #[arg(long, value_name = "FILE")]
    pub judged_queries: Option<PathBuf>,
    /// A searched field with its weight, `name` or `name^weight`; repeat for several.
    #[arg(long = "field", value_name = "NAME[^W]", default_values = ["title^2", "body"])]
    pub fields: Vec<String>,
    /// The document id field.
    #[arg(long, default_value = "id")]
    pub id_field: String,
    /// The field shown as a document's title.
    #[arg(long, default_value = "title")]
    pub title_field: String,
    /// Keep a random sample of the documents: a count (1000) or a fraction (0.1).
    #[arg(long, value_name = "N")]
    pub sample: Option<String>,
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
    #[arg(long, default_value_t = 1.2)]
    pub k1: f64,
    /// BM25 b.
    #[arg(long, default_value_t = 0.75)]
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
    #[arg(long, default_value_t = metrics::DEFAULT_RBO_P)]
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
    pub corpus: Corpus,
    /// Where the corpus was read from and how: to read it again with its texts.
    corpus_path: PathBuf,
    doc_options: DocOptions,
    pub log: QueryLog,
    pub judged: Option<JudgedSet>,
    pub options: PreviewOptions,
}

impl SampleArgs {
    /// Validates the settings and reads the corpus, queries and judgments; the documents'
    /// texts only with `texts` (see [`Loaded::read_texts`]).
    pub fn load(
        &self,
        docs_shown: usize,
        want_runs: bool,
        texts: bool,
    ) -> Result<Loaded, CliError> {
        if self.demo && self.judgments.is_none() {
            let mut with_demo = self.clone();
            with_demo.judgments = Some(DEMO_JUDGMENTS.into());
            with_demo.judged_queries = Some(DEMO_JUDGED_QUERIES.into());
            return with_demo.load(docs_shown, want_runs, texts);
        }
        let mode: MatchMode = self
            .mode
            .parse()
            .map_err(|e| CliError(format!("--match: {e}"), false))?;
        let fields = self
            .fields
            .iter()
            .map(|f| {
                FieldSpec::parse(f).map_err(|e| CliError(format!("--field {f:?}: {e}"), false))
            })
            .collect::<Result<Vec<_>, _>>()?;
        let doc_options = DocOptions {
            id_field: self.id_field.clone(),
            title_field: self.title_field.clone(),
            fields,
            sample: self.sample.as_deref().map(parse_sample).transpose()?,
            seed: self.sample_seed,
        };
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
        let (corpus_path, queries_path) = match (&self.corpus, &self.queries) {
            (Some(c), Some(q)) => (c.clone(), q.clone()),
            _ => (PathBuf::from(DEMO_CORPUS), PathBuf::from(DEMO_QUERIES)),
        };
        let corpus = if texts {
            read_documents(&corpus_path, &doc_options)?
        } else {
            read_documents_without_texts(&corpus_path, &doc_options)?
        };
        let log = read_queries(&queries_path)?;
        let judged = match &self.judgments {
            None => None,
            Some(path) if path.extension().is_some_and(|e| e == "csv") => {
                let (judgments, texts) = metrics::read_csv_judgments(path)?;
                Some(JudgedSet { judgments, texts })
            }
            Some(path) => {
                let Some(texts_path) = &self.judged_queries else {
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
        Ok(Loaded {
            corpus,
            corpus_path,
            doc_options,
            log,
            judged,
            options,
        })
    }
}

impl Loaded {
    /// Reads the corpus again, with its texts (the same file, so the same fingerprint).
    pub fn read_texts(&mut self) -> Result<(), CliError> {
        // The text-free copy goes first: the two need not be held at once.
        self.corpus.documents = Vec::new();
        self.corpus = read_documents(&self.corpus_path, &self.doc_options)?;
        Ok(())
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
