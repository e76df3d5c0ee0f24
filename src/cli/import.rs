//! `lexdelta import`: WordNet exception lists as a new lemma-override file.

use std::path::PathBuf;
use std::process::ExitCode;

use lexdelta::analysis::SurfaceStage;
use lexdelta::atomic::{check_output, write_file};
use lexdelta::import::wordnet::{ExceptionList, ImportOptions, PartOfSpeech, build_lemma_file};

use super::{CliError, print};

/// Bring WordNet's irregular forms ("inflected base" per line) in as lemma overrides.
#[derive(Debug, clap::Args)]
#[command(
    after_help = "Examples:\n  lexdelta import --pos verb --out rules/irregular-verbs.yaml\n  lexdelta import --pos noun,verb,adj --list-skipped --out /tmp/all.yaml\n\nThe file is new and written atomically; an existing file is replaced only with --force.\nForms WordNet gives several bases are skipped and listed, never guessed."
)]
pub struct Args {
    /// The directory holding WordNet's *.exc files.
    #[arg(long, default_value = "/usr/share/wordnet")]
    wordnet: PathBuf,
    /// Parts of speech to import, comma-separated.
    #[arg(long, value_enum, value_delimiter = ',', default_values_t = [PartOfSpeech::Verb, PartOfSpeech::Noun, PartOfSpeech::Adj])]
    pos: Vec<PartOfSpeech>,
    /// The rule file to write.
    #[arg(long)]
    out: PathBuf,
    /// The ruleset the file will join: its surface settings decide what is one word.
    #[arg(long)]
    rules: Option<PathBuf>,
    /// Replace the output file if it exists.
    #[arg(long)]
    force: bool,
    /// Print every skipped entry and why.
    #[arg(long)]
    list_skipped: bool,
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    check_output(&args.out, args.force)?;
    let list = ExceptionList::read(&args.wordnet, &args.pos)?;
    let mut options = ImportOptions::default();
    if let Some(dir) = &args.rules {
        let ruleset = lexdelta::rules::load_dir(dir)?;
        options.surface = SurfaceStage::from_pipeline(&ruleset.pipeline);
    }
    let result = build_lemma_file(&list, &options);
    write_file(&args.out, result.yaml.as_bytes(), args.force)?;
    let mut text = format!(
        "wrote {}: {} lemma overrides; skipped {} ({} with several bases, {} not a single word, {} same as base)\n",
        args.out.display(),
        result.written.len(),
        result.skipped(),
        result.ambiguous.len(),
        result.not_one_word.len(),
        result.self_mapped.len()
    );
    if args.list_skipped {
        for (form, bases) in &result.ambiguous {
            text.push_str(&format!("several bases\t{form}\t{}\n", bases.join(" ")));
        }
        for form in &result.not_one_word {
            text.push_str(&format!("not one word\t{form}\n"));
        }
        for form in &result.self_mapped {
            text.push_str(&format!("same as base\t{form}\n"));
        }
    }
    print(&text)?;
    Ok(ExitCode::SUCCESS)
}
