//! A text's journey through every stage, for people: what each stage did and which rule
//! (id, file:line) made it happen. `lexdelta trace` renders this value.

use serde::Serialize;

use super::{Analyzer, Observer, RuleRef, Side, Stage};

#[derive(Clone, Debug, Serialize)]
pub struct Trace {
    pub side: Side,
    pub text: String,
    pub pipeline: PipelineSummary,
    pub tokens: Vec<TokenTrace>,
    /// Query side only: the stretches that synonym rules expanded.
    pub expansions: Vec<ExpansionTrace>,
}

#[derive(Clone, Debug, Serialize)]
pub struct PipelineSummary {
    pub ruleset: String,
    pub tokenizer: String,
    pub lowercase: bool,
    pub fold_accents: bool,
    pub stopwords: usize,
    pub stemmer: String,
}

#[derive(Clone, Debug, Serialize)]
pub struct TokenTrace {
    /// The token as written in the text.
    pub raw: String,
    pub from: usize,
    pub to: usize,
    pub position: u32,
    pub surface: String,
    pub steps: Vec<StepTrace>,
    /// `None`: dropped as a stopword.
    pub key: Option<String>,
}

#[derive(Clone, Debug, Serialize)]
pub struct StepTrace {
    pub stage: Stage,
    pub output: String,
    pub note: String,
    pub rule: Option<RuleInfo>,
}

/// A rule as reports name it.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct RuleInfo {
    pub label: String,
    pub id: Option<String>,
    pub file: String,
    pub line: u32,
    pub column: u32,
}

impl RuleInfo {
    pub fn of(analyzer: &Analyzer, rule: RuleRef) -> RuleInfo {
        let origin = analyzer.rule_origin(rule);
        RuleInfo {
            label: analyzer.rule_label(rule),
            id: analyzer.rule_meta(rule).and_then(|m| m.id.clone()),
            file: origin.map_or_else(String::new, |o| o.file.to_string()),
            line: origin.map_or(0, |o| o.line),
            column: origin.map_or(0, |o| o.column),
        }
    }

    /// `label (file:line)`.
    pub fn describe(&self) -> String {
        if self.file.is_empty() {
            self.label.clone()
        } else if self.id.is_some() {
            format!("{} ({}:{})", self.label, self.file, self.line)
        } else {
            format!("{}:{}", self.file, self.line)
        }
    }
}

#[derive(Clone, Debug, Serialize)]
pub struct ExpansionTrace {
    /// The query words the stretch covers.
    pub text: String,
    pub alternatives: Vec<AlternativeTrace>,
}

#[derive(Clone, Debug, Serialize)]
pub struct AlternativeTrace {
    /// Keys, `_` for a stopword gap.
    pub keys: String,
    /// Matched as a phrase (more than one key).
    pub phrase: bool,
    /// Empty for the query's own words.
    pub rules: Vec<RuleInfo>,
}

struct Recorder<'a> {
    analyzer: &'a Analyzer,
    steps: Vec<StepTrace>,
}

impl Observer for Recorder<'_> {
    fn step(&mut self, stage: Stage, output: &str, rule: Option<RuleRef>, note: &'static str) {
        self.steps.push(StepTrace {
            stage,
            output: output.to_string(),
            note: note.to_string(),
            rule: rule.map(|r| RuleInfo::of(self.analyzer, r)),
        });
    }
}

impl Analyzer {
    /// Traces `text` through every stage on the given side.
    pub fn trace(&self, text: &str, side: Side) -> Trace {
        let surface = self.surface();
        let mut tokens = Vec::new();
        surface.tokenize.for_each(text, |span| {
            let raw = &text[span.from..span.to];
            let mut recorder = Recorder {
                analyzer: self,
                steps: Vec::new(),
            };
            let lowered = if surface.lowercase {
                super::lowercase::lowercase(raw).into_owned()
            } else {
                raw.to_string()
            };
            if lowered != raw {
                recorder.step(Stage::Lowercase, &lowered, None, "lowercased");
            }
            let form = if surface.fold_accents {
                super::fold::fold_accents(&lowered).into_owned()
            } else {
                lowered.clone()
            };
            if form != lowered {
                recorder.step(Stage::FoldAccents, &form, None, "accents folded");
            }
            let key = self.key_with(&form, &mut recorder).map(|k| k.into_owned());
            tokens.push(TokenTrace {
                raw: raw.to_string(),
                from: span.from,
                to: span.to,
                position: span.position,
                surface: form,
                steps: recorder.steps,
                key,
            });
        });
        let expansions = match side {
            Side::Index => Vec::new(),
            Side::Query => self.expansion_traces(text, &tokens),
        };
        let pipeline = &self.ruleset().pipeline;
        Trace {
            side,
            text: text.to_string(),
            pipeline: PipelineSummary {
                ruleset: self.ruleset().source.clone(),
                tokenizer: match &pipeline.token_pattern {
                    Some(p) => format!("regex {:?}", p.source.text),
                    None => "Unicode words (UAX #29)".to_string(),
                },
                lowercase: pipeline.lowercase,
                fold_accents: pipeline.fold_accents,
                stopwords: pipeline.stopwords.len(),
                stemmer: self.stemmer_name().to_string(),
            },
            tokens,
            expansions,
        }
    }

    fn expansion_traces(&self, text: &str, tokens: &[TokenTrace]) -> Vec<ExpansionTrace> {
        let keyed: Vec<&TokenTrace> = tokens.iter().filter(|t| t.key.is_some()).collect();
        let query = self.analyze_query(text);
        query
            .expansions
            .iter()
            .filter(|e| e.alternatives.len() > 1)
            .map(|e| {
                let covered = &keyed[e.start..e.start + e.len];
                let words = &text[covered[0].from..covered[covered.len() - 1].to];
                ExpansionTrace {
                    text: words.to_string(),
                    alternatives: e
                        .alternatives
                        .iter()
                        .map(|a| AlternativeTrace {
                            keys: a.phrase.display(),
                            phrase: !a.phrase.is_single(),
                            rules: a
                                .rules
                                .iter()
                                .map(|r| RuleInfo::of(self, RuleRef::Synonym(*r)))
                                .collect(),
                        })
                        .collect(),
                }
            })
            .collect()
    }
}
