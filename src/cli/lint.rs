//! `lexdelta lint`: contradictions and hazards in a ruleset, before anyone runs it.

use std::path::PathBuf;
use std::process::ExitCode;

use lexdelta::analysis::Analyzer;
use lexdelta::atomic::{check_output, write_file};
use lexdelta::corpus::read_documents;
use lexdelta::lint::{LintConfig, LintInput, Vocabulary, checks, lint};
use lexdelta::report::{Style, lint_dot, lint_json, lint_sarif, lint_text};
use lexdelta::rules::{self, Level};
use lexdelta::severity::Severity;

use super::input::{CorpusArgs, QueryArgs, input_error, warn};
use super::shared::{ColorArg, Format, formats, not_offered, severity};
use super::{CliError, print};

const AFTER_HELP: &str = "\
Examples:
  Lint the live ruleset (./rules):
    lexdelta lint
  Judge a proposed change against real text (needed by stem-side-effect, dead-rule and
  exempt-pattern-coverage):
    lexdelta lint --rules demo-corpus/proposed \\
      --corpus demo-corpus/documents.jsonl --queries demo-corpus/queries.jsonl
  Check that every changed file bumped its revision:
    lexdelta lint --rules demo-corpus/proposed --base rules
  Output for code review tools, or scripts:
    lexdelta lint --format sarif > lint.sarif
    lexdelta lint --format json | jq '.counts'
  Draw the groups that have findings:
    lexdelta lint --graph groups.dot && dot -Tsvg groups.dot > groups.svg
  Be stricter or quieter for one run:
    lexdelta lint --fail-on-lint warning --level dead-rule=off --level set-bridge=error
  Learn about the checks:
    lexdelta lint --list-checks
    lexdelta lint --explain stem-side-effect

Levels: a check starts at its default severity; the ruleset's `lint.checks` changes it,
then --level, then a rule's own `lint:` override (which carries a reason) for findings
on that rule. `off` silences; silenced findings are counted, not shown.

Exit codes: 0 no finding at or above --fail-on-lint, 1 some, 2 bad input.";

/// Check a ruleset for contradictions and hazards: one-way cycles, bridged sets, lemma
/// chains, and rule terms that also fire for unrelated words.
#[derive(Debug, clap::Args)]
#[command(after_help = AFTER_HELP)]
pub struct Args {
    /// The ruleset directory.
    #[arg(long, value_name = "DIR", default_value = "rules")]
    rules: PathBuf,
    #[command(flatten)]
    input: CorpusArgs,
    #[command(flatten)]
    log: QueryArgs,
    /// The ruleset before the change, for the revision check.
    #[arg(long, value_name = "DIR")]
    base: Option<PathBuf>,
    /// Output format.
    #[arg(long, default_value = "text", value_parser = formats(&[Format::Text, Format::Json, Format::Sarif]))]
    format: Format,
    /// Also write the term-graph groups that have findings as DOT (replaced if it exists).
    #[arg(long, value_name = "FILE")]
    graph: Option<PathBuf>,
    /// Exit 1 when a finding is at this severity or above: error, warning or info.
    #[arg(long, alias = "fail-on", value_name = "SEVERITY", default_value = "error", value_parser = severity())]
    fail_on_lint: Severity,
    /// Set a check's level for this run: off, info, warning or error (repeatable).
    #[arg(long = "level", value_name = "NAME=LEVEL", value_parser = parse_level)]
    levels: Vec<(String, Level)>,
    /// Explain one check: what it finds, why it matters, an example, the usual fix.
    #[arg(long, value_name = "NAME")]
    explain: Option<String>,
    /// List every check with its default severity.
    #[arg(long)]
    list_checks: bool,
    #[command(flatten)]
    color: ColorArg,
}

/// `NAME=LEVEL`, with the name checked against the checks lint has.
fn parse_level(raw: &str) -> Result<(String, Level), String> {
    let (name, level) = raw
        .split_once('=')
        .ok_or_else(|| format!("expected NAME=LEVEL, e.g. set-bridge=error, found {raw:?}"))?;
    let name = name.trim();
    if checks::find(name).is_none() {
        return Err(match checks::closest(name) {
            Some(s) => format!("there is no check named {name:?}; did you mean {s:?}?"),
            None => format!("there is no check named {name:?}; --list-checks lists them"),
        });
    }
    let level = match level.trim() {
        "off" => Level::Off,
        "info" => Level::Info,
        "warning" => Level::Warning,
        "error" => Level::Error,
        other => {
            return Err(format!(
                "unknown level {other:?}; use off, info, warning or error"
            ));
        }
    };
    Ok((name.to_string(), level))
}

pub fn run(args: Args) -> Result<ExitCode, CliError> {
    if let Some(path) = &args.graph {
        check_output(path, true)?;
    }
    let style = Style::for_stdout(args.color.choice);
    if args.list_checks {
        print(&lint_text::render_check_list(style))?;
        return Ok(ExitCode::SUCCESS);
    }
    if let Some(name) = &args.explain {
        let info = checks::find(name).ok_or_else(|| {
            CliError::from(lexdelta::lint::UnknownCheck {
                name: name.clone(),
                suggestion: checks::closest(name),
            })
        })?;
        print(&lint_text::render_explanation(info, style))?;
        return Ok(ExitCode::SUCCESS);
    }

    let sources = rules::read_sources(&args.rules)?;
    let ruleset = rules::load_sources(&args.rules.display().to_string(), sources.clone())?;
    let analyzer = Analyzer::new(ruleset)?;
    let base = args.base.as_deref().map(rules::load_dir).transpose()?;
    // With a corpus or a query log, their surface forms and frequencies form the
    // vocabulary the corpus-aware checks judge rules against.
    let corpus = match &args.input.corpus {
        Some(path) => {
            let corpus =
                read_documents(path, &args.input.doc_options(None, 0)?).map_err(input_error)?;
            warn(&corpus.warnings);
            Some(corpus)
        }
        None => None,
    };
    let log = args.log.read_given()?;
    let vocabulary = (corpus.is_some() || log.is_some())
        .then(|| Vocabulary::from_corpus(analyzer.surface(), corpus.as_ref(), log.as_ref()));
    let config = LintConfig::with_levels(args.levels.iter().map(|(n, l)| (n.as_str(), *l)))?;
    let report = lint(
        &analyzer,
        &LintInput {
            vocabulary: vocabulary.as_ref(),
            base: base.as_ref(),
            config: &config,
        },
    );

    if let Some(path) = &args.graph {
        write_file(path, lint_dot::render(&report).as_bytes(), true)?;
    }
    let rendered = match args.format {
        Format::Text => lint_text::render(&report, &sources, style),
        Format::Json => lint_json::render(&report)?,
        Format::Sarif => lint_sarif::render(&report, &std::env::current_dir()?)?,
        other => return Err(not_offered(other)),
    };
    print(&rendered)?;
    Ok(if report.has_at_least(args.fail_on_lint) {
        ExitCode::from(1)
    } else {
        ExitCode::SUCCESS
    })
}
