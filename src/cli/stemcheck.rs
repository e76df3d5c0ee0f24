//! `lexdelta stemcheck`: Paice's under- and over-stemming indices for the ruleset.

use std::path::PathBuf;
use std::process::ExitCode;

use lexdelta::analysis::Analyzer;
use lexdelta::audit::concepts::{read_groups, wordnet_groups};
use lexdelta::audit::morphy::Morphy;
use lexdelta::audit::stemcheck::{Ablation, ConceptGroups};
use lexdelta::corpus::{DocumentCounts, Vocabulary};
use lexdelta::report::stemcheck_text;
use lexdelta::rules::load_dir;

use super::input::{CorpusArgs, input_error, warn};
use super::shared::{Format, formats, not_offered};
use super::{CliError, print};

/// Measure under-stemming (UI), over-stemming (OI), their ratio (SW) and the error rate
/// relative to truncation (ERRT) for the bare stemmer, the stemmer with the ruleset's
/// exemptions, and with its lemma overrides too.
#[derive(Debug, clap::Args)]
#[command(
    after_help = "Examples:\n  lexdelta stemcheck --groups concepts.txt\n  lexdelta stemcheck --wordnet-groups --corpus demo-corpus/documents.jsonl --rules rules\n  lexdelta stemcheck --groups concepts.txt --format json\n\nA groups file holds one concept group per line, words separated by spaces or commas;\n`#` starts a comment. --wordnet-groups groups the corpus's words by their WordNet base\nform (morphy). Method: Paice, SIGIR '94 and JASIS 47(8), 1996.",
    group(clap::ArgGroup::new("source").required(true).args(["groups", "wordnet_groups"]))
)]
pub struct Args {
    /// The ruleset directory.
    #[arg(long, default_value = "rules")]
    rules: PathBuf,
    /// A concept-group file.
    #[arg(long)]
    groups: Option<PathBuf>,
    /// Derive concept groups from WordNet over the --corpus vocabulary.
    #[arg(long, requires = "corpus")]
    wordnet_groups: bool,
    #[command(flatten)]
    input: CorpusArgs,
    /// The WordNet 3.0 `dict` directory.
    #[arg(long, default_value = "/usr/share/wordnet")]
    wordnet: PathBuf,
    /// Output format.
    #[arg(long, default_value = "text", value_parser = formats(&[Format::Text, Format::Json]))]
    format: Format,
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    let ablation = Ablation::new(&load_dir(&args.rules)?)?;
    let surface = ablation.full().surface();
    let (groups, source) = match (&args.groups, &args.input.corpus) {
        (Some(path), _) => (read_groups(path, surface)?, path.display().to_string()),
        (None, Some(corpus)) => (
            corpus_groups(&args, corpus, ablation.full())?,
            format!("WordNet over {}", corpus.display()),
        ),
        (None, None) => {
            return Err(CliError(
                "give --groups FILE, or --wordnet-groups with --corpus FILE".into(),
                false,
            ));
        }
    };
    let report = ablation.report(&source, &groups);
    let rendered = match args.format {
        Format::Text => stemcheck_text::render(&report),
        Format::Json => serde_json::to_string_pretty(&report)? + "\n",
        other => return Err(not_offered(other)),
    };
    print(&rendered)?;
    Ok(ExitCode::SUCCESS)
}

fn corpus_groups(
    args: &Args,
    corpus: &std::path::Path,
    analyzer: &Analyzer,
) -> Result<ConceptGroups, CliError> {
    // The corpus is streamed and only its forms counted, as `collisions` reads it.
    let shown = corpus.display();
    let threads = std::thread::available_parallelism().map_or(1, |n| n.get());
    let options = args.input.doc_options(None, 0)?;
    let counts = DocumentCounts::from_file(analyzer.surface(), corpus, &options, threads)
        .map_err(input_error)?;
    warn(&counts.warnings);
    let morphy = Morphy::load(&args.wordnet)?;
    let vocabulary = Vocabulary::from_counts(analyzer.surface(), counts, None);
    let (groups, _skipped) =
        wordnet_groups(vocabulary.forms.iter().map(|f| f.form.as_str()), &morphy);
    if groups.groups.is_empty() {
        // Indices over no group are all zero: a figure that measured nothing.
        return Err(CliError(
            format!(
                "{shown}: none of its {} words has a base form in WordNet, so there is no \
                 concept group to measure; use a corpus in English, or concept groups with \
                 --groups FILE",
                vocabulary.forms.len()
            ),
            false,
        ));
    }
    Ok(groups)
}
