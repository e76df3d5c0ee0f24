//! Options several commands share, defined once so they mean the same everywhere: the
//! output format (each command offers the formats it has), colour, how many items a
//! listing shows, and the lint severity that fails a run.

use clap::builder::{PossibleValuesParser, TypedValueParser, ValueParser};
use lexdelta::report::ColorChoice;
use lexdelta::rules::{GateLimits, Limit, LimitKind, LimitValue};

use super::CliError;
use lexdelta::severity::Severity;

/// An output format. A value means the same in every command; each command accepts only
/// the formats it renders ([`formats`]).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Format {
    Text,
    Json,
    Markdown,
    Sarif,
    Csv,
}

impl Format {
    fn name(self) -> &'static str {
        match self {
            Format::Text => "text",
            Format::Json => "json",
            Format::Markdown => "markdown",
            Format::Sarif => "sarif",
            Format::Csv => "csv",
        }
    }
}

/// The parser of `--format` for a command that renders `offered`.
pub fn formats(offered: &'static [Format]) -> ValueParser {
    let names: Vec<&'static str> = offered.iter().map(|f| f.name()).collect();
    ValueParser::new(PossibleValuesParser::new(names).map(move |name| {
        *offered
            .iter()
            .find(|f| f.name() == name)
            .expect("clap accepts only the offered names")
    }))
}

/// `--color`.
#[derive(Clone, Copy, Debug, clap::Args)]
pub struct ColorArg {
    /// Colour: auto (on a terminal, unless NO_COLOR is set), always or never.
    #[arg(long = "color", value_enum, default_value_t = ColorChoice::Auto)]
    pub choice: ColorChoice,
}

/// `--limit`: how many items a text or Markdown listing shows.
#[derive(Clone, Copy, Debug, clap::Args)]
pub struct LimitArg {
    /// Items listed in text and Markdown output (JSON lists all).
    #[arg(long = "limit", value_name = "N", default_value_t = 20)]
    pub value: usize,
}

/// The parser of a lint severity (`error`, `warning`, `info`), for every option that
/// takes one.
pub fn severity() -> ValueParser {
    ValueParser::new(
        PossibleValuesParser::new(["error", "warning", "info"])
            .map(|name| Severity::from_name(&name).expect("clap accepts only severity names")),
    )
}

/// The error for a format a command does not render (its `--format` parser already
/// refuses it, so this is never seen; it keeps the match total without a panic).
pub fn not_offered(format: Format) -> CliError {
    CliError(
        format!("this command does not write {}", format.name()),
        false,
    )
}

/// The gate's limits as `review` options, one per declared limit ([`Limit::ALL`]): the
/// option, its help and its range check all come from the declaration.
#[derive(Clone, Debug, Default)]
pub struct GateArgs(pub GateLimits);

impl clap::FromArgMatches for GateArgs {
    fn from_arg_matches(matches: &clap::ArgMatches) -> Result<Self, clap::Error> {
        let mut limits = GateLimits::default();
        for limit in Limit::ALL {
            if let Some(value) = matches.get_one::<LimitValue>(limit.key()) {
                limits.set(limit, *value);
            }
        }
        Ok(GateArgs(limits))
    }

    fn update_from_arg_matches(&mut self, matches: &clap::ArgMatches) -> Result<(), clap::Error> {
        *self = Self::from_arg_matches(matches)?;
        Ok(())
    }
}

impl clap::Args for GateArgs {
    fn augment_args(cmd: clap::Command) -> clap::Command {
        Limit::ALL.iter().fold(cmd, |cmd, &limit| {
            let spec = limit.spec();
            let value_name = match spec.kind {
                LimitKind::Searches => "N",
                LimitKind::Share => "SHARE",
                LimitKind::Drop => "DROP",
                LimitKind::Severity => "SEVERITY",
            };
            cmd.arg(
                clap::Arg::new(spec.key)
                    .long(spec.option)
                    .value_name(value_name)
                    .help(format!("Gate: {}.", spec.help))
                    .value_parser(move |text: &str| limit.parse(text)),
            )
        })
    }

    fn augment_args_for_update(cmd: clap::Command) -> clap::Command {
        Self::augment_args(cmd)
    }
}
