//! `lexdelta review`: a rule change reviewed like code, with a gate for CI.

use std::path::{Path, PathBuf};
use std::process::ExitCode;
use std::sync::Arc;

use lexdelta::analysis::Analyzer;
use lexdelta::atomic::{check_outputs, write_file};
use lexdelta::lint::LintConfig;
use lexdelta::report::preview_text::Limits;
use lexdelta::report::{Style, lint_sarif, review_json, review_markdown, review_text};
use lexdelta::review::{self, ReviewInput};
use lexdelta::rules::{self, Ruleset};

use super::sample::{DEMO_BASE, DEMO_HEAD, SampleArgs, bar};
use super::shared::{ColorArg, Format, GateArgs, LimitArg, formats, not_offered};
use super::{CliError, print};

const AFTER_HELP: &str = "\
Examples:
  lexdelta review --demo --html review.html
      the bundled demo: live rules vs the proposed change, with judgments
  lexdelta review --base origin/main --corpus sample.jsonl --queries log.jsonl \\
      --markdown review.md --sarif lint.sarif
      in a git repository: the `rules` directory at origin/main vs the working tree
  lexdelta review --base v12 --head HEAD --rules search/rules ...
  lexdelta review --base-dir old-rules/ --head-dir new-rules/ ...   two directories, no git

--base and --head name git revisions, always: their ruleset (the --rules directory) is read
straight from git, with no checkout and the working tree untouched, whatever directories
the working tree holds. --base-dir and --head-dir name directories. Without --head or
--head-dir the head is the --rules directory in the working tree. Gate limits come from the
base ruleset's `gate:` section; the --max-* options override them. In CI, take the base from
a revision (--base): a directory in the change cannot stand in for it.

A preview on a sample is evidence, not proof: if you depend on recall (legal discovery,
clinical or safety documents), validate against your own full collection.

Exit codes:
  0  the gate passed (or no limits are set)
  1  a gate limit was breached (one line per breach on stderr)
  2  bad input or usage";

/// Compare the rules on a branch with the base: rule diff, lint, preview and a CI gate.
#[derive(Debug, clap::Args)]
#[command(after_help = AFTER_HELP)]
pub struct Args {
    /// The base: a git revision (branch, tag, commit) whose --rules directory is read from
    /// git.
    #[arg(
        long,
        value_name = "REV",
        required_unless_present_any = ["demo", "base_dir"],
        conflicts_with = "base_dir"
    )]
    base: Option<String>,
    /// The base: a ruleset directory (instead of --base).
    #[arg(long, value_name = "DIR")]
    base_dir: Option<PathBuf>,
    /// The head: a git revision (default: the --rules directory in the working tree).
    #[arg(long, value_name = "REV", conflicts_with = "head_dir")]
    head: Option<String>,
    /// The head: a ruleset directory (instead of --head).
    #[arg(long, value_name = "DIR")]
    head_dir: Option<PathBuf>,
    /// The ruleset directory inside the repository, for git revisions.
    #[arg(long, value_name = "DIR", default_value = "rules")]
    rules: String,
    /// Output on stdout.
    #[arg(long, default_value = "text", value_parser = formats(&[Format::Text, Format::Markdown, Format::Json]))]
    format: Format,
    /// Also write the Markdown report (for a review comment) to FILE.
    #[arg(long, value_name = "FILE")]
    markdown: Option<PathBuf>,
    /// Also write the self-contained HTML report to FILE.
    #[arg(long, value_name = "FILE")]
    html: Option<PathBuf>,
    /// Also write lint's SARIF 2.1.0 log of the head to FILE.
    #[arg(long, value_name = "FILE")]
    sarif: Option<PathBuf>,
    #[command(flatten)]
    gate: GateArgs,
    #[command(flatten)]
    limit: LimitArg,
    /// Gained and lost documents listed per query.
    #[arg(long, default_value_t = 5)]
    docs: usize,
    #[command(flatten)]
    color: ColorArg,
    #[command(flatten)]
    sample: SampleArgs,
}

/// Where one side's ruleset comes from: never guessed from the name.
enum Side {
    /// A git revision of the --rules directory.
    Revision(String),
    /// A ruleset directory.
    Dir(PathBuf),
}

impl Side {
    fn pick(rev: Option<&String>, dir: Option<&PathBuf>) -> Option<Side> {
        match (rev, dir) {
            (Some(rev), _) => Some(Side::Revision(rev.clone())),
            (None, Some(dir)) => Some(Side::Dir(dir.clone())),
            (None, None) => None,
        }
    }

    fn load(&self, option: &str, rules_dir: &str) -> Result<Ruleset, CliError> {
        match self {
            Side::Dir(dir) => Ok(rules::load_dir(dir)?),
            Side::Revision(rev) => {
                let repo = std::env::current_dir()?;
                match rules::load_at_revision(&repo, rev, rules_dir) {
                    Ok(ruleset) => {
                        if Path::new(rev).is_dir() {
                            // Said aloud: in CI this is a change trying to stand in for
                            // the base.
                            eprintln!(
                                "lexdelta: note: {option} {rev:?} reads the git revision; the \
                                 directory {rev:?} in the working tree is not read (pass \
                                 {option}-dir to compare a directory)"
                            );
                        }
                        Ok(ruleset)
                    }
                    // Not a revision, but a directory of that name: say which option reads
                    // directories, never read it in the revision's place.
                    Err(err @ rules::RulesError::Git(_)) if Path::new(rev).is_dir() => {
                        Err(CliError(
                            format!(
                                "{option} {rev:?}: {err}; {option} takes a git revision only. \
                                 To compare the directory {rev:?}, pass {option}-dir {rev:?}"
                            ),
                            false,
                        ))
                    }
                    Err(err) => Err(err.into()),
                }
            }
        }
    }
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    // Every output path is checked before anything is computed or written: a bad last
    // path never leaves the first written.
    let outputs: Vec<&Path> = [&args.markdown, &args.html, &args.sarif]
        .into_iter()
        .flatten()
        .map(PathBuf::as_path)
        .collect();
    check_outputs(&outputs, true)?;
    let demo = args.sample.demo;
    let base_side = Side::pick(args.base.as_ref(), args.base_dir.as_ref())
        .unwrap_or_else(|| Side::Dir(DEMO_BASE.into()));
    let head_side = Side::pick(args.head.as_ref(), args.head_dir.as_ref()).unwrap_or_else(|| {
        let no_base = args.base.is_none() && args.base_dir.is_none();
        Side::Dir(if demo && no_base {
            DEMO_HEAD.into()
        } else {
            args.rules.clone().into()
        })
    });
    let base = Arc::new(Analyzer::new(base_side.load("--base", &args.rules)?)?);
    let head = Arc::new(Analyzer::new(head_side.load("--head", &args.rules)?)?);
    let loaded = args.sample.load(args.docs, false)?;
    let corpus = loaded.read_corpus()?;
    let limits = args.gate.0.clone();
    let lint_config = LintConfig::default();
    let outcome = review::review(
        ReviewInput {
            base,
            head,
            corpus: &corpus,
            queries: &loaded.log,
            judged: loaded.judged,
            lint: &lint_config,
            limits,
        },
        &loaded.options,
        &bar(),
    )?;
    let report = outcome.report;
    for w in &report.preview.warnings {
        eprintln!("lexdelta: warning: {w}");
    }
    let limits = Limits {
        queries: args.limit.value,
        docs: args.docs,
    };
    let markdown_limits = review_markdown::Limits {
        queries: args.limit.value,
        docs: args.docs,
    };
    if let Some(path) = &args.markdown {
        write_file(
            path,
            review_markdown::render(&report, markdown_limits).as_bytes(),
            true,
        )?;
    }
    if let Some(path) = &args.html {
        write_file(
            path,
            lexdelta::report::review_html::render(&report).as_bytes(),
            true,
        )?;
    }
    if let Some(path) = &args.sarif {
        let sarif = lint_sarif::render(&report.lint, &std::env::current_dir()?)?;
        write_file(path, sarif.as_bytes(), true)?;
    }
    let rendered = match args.format {
        Format::Text => review_text::render(&report, Style::for_stdout(args.color.choice), limits),
        Format::Markdown => review_markdown::render(&report, markdown_limits),
        Format::Json => review_json::render(&report)?,
        other => return Err(not_offered(other)),
    };
    print(&rendered)?;
    if let Some(path) = &args.html {
        eprintln!("lexdelta: wrote {}", path.display());
    }
    if report.gate.passed() {
        Ok(ExitCode::SUCCESS)
    } else {
        for b in &report.gate.breaches {
            eprintln!(
                "gate: {}: {}",
                b.limit,
                lexdelta::report::style::clean_line(&b.reason)
            );
        }
        Ok(ExitCode::from(1))
    }
}
