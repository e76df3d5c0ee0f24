//! Concept groups for `stemcheck`: read from a file, or derived from WordNet over a
//! corpus vocabulary.

use std::collections::BTreeMap;
use std::path::Path;

use super::AuditError;
use super::morphy::Morphy;
use super::stemcheck::ConceptGroups;
use crate::analysis::SurfaceStage;

/// Reads one group per line, words separated by whitespace or commas; `#` starts a
/// comment. Each word is put through the surface stage and must stay one token.
pub fn read_groups(path: &Path, surface: &SurfaceStage) -> Result<ConceptGroups, AuditError> {
    let text = std::fs::read_to_string(path).map_err(|source| AuditError::Io {
        path: path.to_path_buf(),
        source,
    })?;
    parse_groups(&text, surface).map_err(|(line, message)| AuditError::Groups {
        path: path.to_path_buf(),
        message: format!("line {line}: {message}"),
    })
}

/// The parser behind [`read_groups`]; errors carry the 1-based line.
pub fn parse_groups(text: &str, surface: &SurfaceStage) -> Result<ConceptGroups, (usize, String)> {
    let mut groups = Vec::new();
    for (i, line) in text.lines().enumerate() {
        let content = line.split('#').next().unwrap_or("");
        let mut group = Vec::new();
        for word in content.split(|c: char| c == ',' || c.is_whitespace()) {
            if word.is_empty() {
                continue;
            }
            let tokens = surface.tokens(word);
            match tokens.as_slice() {
                [one] => group.push(one.form.clone()),
                _ => {
                    return Err((i + 1, format!("{word:?} is not one word for the tokenizer")));
                }
            }
        }
        if !group.is_empty() {
            groups.push(group);
        }
    }
    if groups.is_empty() {
        return Err((0, "no concept groups found".into()));
    }
    Ok(ConceptGroups::new(groups))
}

/// Groups the vocabulary's alphabetic forms by their WordNet base form: a base form and
/// every form whose only base it is (its exception forms and regular inflections, as
/// morphy finds them). Forms with several bases (`saw`: saw, see) or none are left out,
/// since their group cannot be told. Groups come sorted by base form.
pub fn wordnet_groups<'a>(
    forms: impl IntoIterator<Item = &'a str>,
    morphy: &Morphy,
) -> (ConceptGroups, usize) {
    let mut by_base: BTreeMap<String, Vec<String>> = BTreeMap::new();
    let mut skipped = 0;
    for form in forms {
        if !form.chars().all(char::is_alphabetic) {
            continue;
        }
        let bases = morphy.base_forms(form);
        match bases.len() {
            1 => by_base
                .entry(bases.into_iter().next().unwrap_or_default())
                .or_default()
                .push(form.to_string()),
            0 => {}
            _ => skipped += 1,
        }
    }
    (ConceptGroups::new(by_base.into_values()), skipped)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rules::Pipeline;

    #[test]
    fn groups_split_on_commas_and_spaces_and_skip_comments() {
        let s = SurfaceStage::from_pipeline(&Pipeline::default());
        let g = parse_groups("# words\nRun, runs running\n\nmouse mice # plural\n", &s).unwrap();
        assert_eq!(
            g.groups,
            vec![vec!["run", "runs", "running"], vec!["mouse", "mice"]]
        );
        assert_eq!(parse_groups("ice-cream\n", &s).unwrap_err().0, 1);
    }
}
