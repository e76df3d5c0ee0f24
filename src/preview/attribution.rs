//! Which rules caused a query's change. Rules are matched across the two rulesets by id, or
//! by their content when they have none.
//!
//! - Synonym rules: those whose alternatives for this query differ between the sides.
//! - Exemptions and lemma overrides: those applied on one side and not the other to a
//!   surface form whose key changed, where the form is in the query or in a conflation
//!   group the query touches.
//! - The stopword list, when it differs; the stemmer, for a key change no rule explains.

use std::collections::{BTreeMap, BTreeSet};

use rustc_hash::FxHashMap;

use super::change::{ChangeSet, touched_keys};
use super::report::{Cause, CauseKind, RuleChange};
use crate::analysis::{AnalyzedQuery, Analyzer, Observer, RuleRef, Stage};
use crate::rules::{ExemptKind, SynonymKind};

const FORMS_SHOWN: usize = 5;

/// A rule's identity across rulesets, and its content.
fn identity(analyzer: &Analyzer, rule: RuleRef) -> (String, String) {
    let rs = analyzer.ruleset();
    let (section, id, content) = match rule {
        RuleRef::Synonym(i) => {
            let r = &rs.synonyms[i];
            let content = match &r.kind {
                SynonymKind::Equivalent { members } => format!(
                    "equivalent:{}",
                    members
                        .iter()
                        .map(|t| t.text.as_str())
                        .collect::<Vec<_>>()
                        .join("|")
                ),
                SynonymKind::OneWay { from, to } => format!(
                    "one_way:{}>{}",
                    from.text,
                    to.iter()
                        .map(|t| t.text.as_str())
                        .collect::<Vec<_>>()
                        .join("|")
                ),
            };
            ("synonym", r.meta.id.clone(), content)
        }
        RuleRef::Exempt(i) => {
            let r = &rs.exemptions[i];
            let content = match &r.kind {
                ExemptKind::Term(t) => format!("term:{}", t.text),
                ExemptKind::Pattern { source, .. } => format!("pattern:{}", source.text),
            };
            ("exempt", r.meta.id.clone(), content)
        }
        RuleRef::Lemma(i) => {
            let r = &rs.lemmas[i];
            (
                "lemma",
                r.meta.id.clone(),
                format!("{}>{}", r.form.text, r.lemma.text),
            )
        }
        RuleRef::Stopwords => ("stopwords", None, String::new()),
    };
    let identity = match id {
        Some(id) => format!("{section}#{id}"),
        None => format!("{section}:{content}"),
    };
    (identity, content)
}

/// Rule identities of one ruleset → content, for telling added from changed.
pub struct RuleIndex {
    contents: FxHashMap<String, String>,
}

impl RuleIndex {
    pub fn new(analyzer: &Analyzer) -> Self {
        let rs = analyzer.ruleset();
        let refs = (0..rs.synonyms.len())
            .map(RuleRef::Synonym)
            .chain((0..rs.exemptions.len()).map(RuleRef::Exempt))
            .chain((0..rs.lemmas.len()).map(RuleRef::Lemma));
        RuleIndex {
            contents: refs.map(|r| identity(analyzer, r)).collect(),
        }
    }

    /// How a rule seen on one side relates to the other side's ruleset.
    fn status(&self, identity: &str, content: &str, present: RuleChange) -> RuleChange {
        match self.contents.get(identity) {
            None => present,
            Some(c) if c == content => RuleChange::SameRuleNewEffect,
            Some(_) => RuleChange::Changed,
        }
    }
}

struct Applied(Vec<RuleRef>);

impl Observer for Applied {
    fn step(&mut self, _: Stage, _: &str, rule: Option<RuleRef>, _: &'static str) {
        if let Some(r @ (RuleRef::Exempt(_) | RuleRef::Lemma(_))) = rule {
            self.0.push(r);
        }
    }
}

pub struct Sides<'a> {
    pub base: &'a Analyzer,
    pub head: &'a Analyzer,
    pub base_rules: &'a RuleIndex,
    pub head_rules: &'a RuleIndex,
    pub change: &'a ChangeSet,
}

fn cause(analyzer: &Analyzer, rule: RuleRef, change: RuleChange) -> Cause {
    let kind = match rule {
        RuleRef::Synonym(_) => CauseKind::Synonym,
        RuleRef::Exempt(_) => CauseKind::Exempt,
        RuleRef::Lemma(_) => CauseKind::Lemma,
        RuleRef::Stopwords => CauseKind::Stopwords,
    };
    Cause {
        kind,
        rule: analyzer.rule_label(rule),
        origin: analyzer.rule_origin(rule).map(|o| o.to_string()),
        change,
        forms: Vec::new(),
    }
}

impl Sides<'_> {
    pub fn attribute(&self, text: &str, qb: &AnalyzedQuery, qh: &AnalyzedQuery) -> Vec<Cause> {
        let mut causes: BTreeMap<(CauseKind, String), Cause> = BTreeMap::new();
        let add =
            |causes: &mut BTreeMap<(CauseKind, String), Cause>, c: Cause, form: Option<&str>| {
                let slot = causes.entry((c.kind, c.rule.clone())).or_insert(c);
                if let Some(form) = form
                    && slot.forms.len() < FORMS_SHOWN
                    && !slot.forms.iter().any(|f| f == form)
                {
                    slot.forms.push(form.to_string());
                }
            };

        // Synonym rules: what each contributed to this query, on each side.
        let contributions = |a: &Analyzer, q: &AnalyzedQuery| {
            let mut out: BTreeMap<String, (RuleRef, String, BTreeSet<String>)> = BTreeMap::new();
            for e in &q.expansions {
                for alt in &e.alternatives {
                    for &r in &alt.rules {
                        let (id, content) = identity(a, RuleRef::Synonym(r));
                        out.entry(id)
                            .or_insert_with(|| (RuleRef::Synonym(r), content, BTreeSet::new()))
                            .2
                            .insert(alt.phrase.display());
                    }
                }
            }
            out
        };
        let (cb, ch) = (contributions(self.base, qb), contributions(self.head, qh));
        for (id, (rule, content, phrases)) in &ch {
            if cb.get(id).map(|b| &b.2) != Some(phrases) {
                let status = self.base_rules.status(id, content, RuleChange::Added);
                add(&mut causes, cause(self.head, *rule, status), None);
            }
        }
        for (id, (rule, content, _)) in &cb {
            if !ch.contains_key(id) {
                let status = self.head_rules.status(id, content, RuleChange::Removed);
                let status = if status == RuleChange::Removed {
                    status
                } else {
                    // Present on the head side, but no longer fires for this query.
                    RuleChange::SameRuleNewEffect.max(status)
                };
                add(&mut causes, cause(self.base, *rule, status), None);
            }
        }

        // Exemptions and lemma overrides, through the surface forms whose key changed.
        let mut forms: BTreeSet<String> = BTreeSet::new();
        self.base.surface().for_each(text, |_, form| {
            forms.insert(form.into_owned());
        });
        for key in touched_keys(qb).chain(touched_keys(qh)) {
            if let Some(moved) = self.change.moved_forms.get(key) {
                forms.extend(moved.iter().cloned());
            }
        }
        for form in &forms {
            let (mut ab, mut ah) = (Applied(Vec::new()), Applied(Vec::new()));
            let kb = self.base.key_with(form, &mut ab);
            let kh = self.head.key_with(form, &mut ah);
            if kb == kh {
                continue;
            }
            let rb: Vec<_> = ab.0.iter().map(|&r| (r, identity(self.base, r))).collect();
            let rh: Vec<_> = ah.0.iter().map(|&r| (r, identity(self.head, r))).collect();
            let mut explained = false;
            for (r, idc) in &rh {
                if !rb.iter().any(|(_, x)| x == idc) {
                    let status = self.base_rules.status(&idc.0, &idc.1, RuleChange::Added);
                    add(&mut causes, cause(self.head, *r, status), Some(form));
                    explained = true;
                }
            }
            for (r, idc) in &rb {
                if !rh.iter().any(|(_, x)| x == idc) {
                    let status = self.head_rules.status(&idc.0, &idc.1, RuleChange::Removed);
                    add(&mut causes, cause(self.base, *r, status), Some(form));
                    explained = true;
                }
            }
            if !explained {
                let kind = if kb.is_none() || kh.is_none() {
                    CauseKind::Stopwords
                } else {
                    CauseKind::Pipeline
                };
                let origin = self
                    .head
                    .rule_origin(RuleRef::Stopwords)
                    .map(|o| o.to_string());
                add(
                    &mut causes,
                    Cause {
                        kind,
                        rule: match kind {
                            CauseKind::Stopwords => "stopwords".into(),
                            _ => format!("stemmer ({})", self.head.stemmer_name()),
                        },
                        origin,
                        change: RuleChange::Changed,
                        forms: Vec::new(),
                    },
                    Some(form),
                );
            }
        }
        if self.change.evaluate_all.is_some() && causes.is_empty() {
            let origin = self
                .head
                .rule_origin(RuleRef::Stopwords)
                .map(|o| o.to_string());
            add(
                &mut causes,
                Cause {
                    kind: CauseKind::Pipeline,
                    rule: "pipeline settings".into(),
                    origin,
                    change: RuleChange::Changed,
                    forms: Vec::new(),
                },
                None,
            );
        }
        causes.into_values().collect()
    }
}
