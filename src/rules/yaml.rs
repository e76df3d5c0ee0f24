//! A spanned YAML tree: the one place that talks to the YAML parser.
//!
//! Rule files are read into a small generic tree whose every node knows its line and column,
//! and the schema in `schema.rs` walks that tree. Doing the schema by hand (instead of
//! deriving it) is what lets every diagnostic name the exact key or value, suggest a key for
//! a misspelt one, and say what was expected.
//!
//! Untrusted input is bounded three ways: the file size is checked before reading, the
//! parser's budget caps events, aliases and depth, and the tree builder counts the nodes it
//! materializes (an alias replays its anchor, so a small file can ask for a huge tree).

use std::cell::Cell;
use std::fmt;

use serde::de::{self, Deserialize, Deserializer, MapAccess, SeqAccess, Visitor};
use serde_saphyr::Spanned;

/// Files larger than this are refused before they are read.
pub const MAX_FILE_BYTES: u64 = 16 * 1024 * 1024;

/// At most this many nodes are replayed through aliases in one file (and at least this
/// many nodes are allowed in all; a file without aliases may hold as many as its size
/// allows, see [`node_budget`]).
pub const MAX_TREE_NODES: usize = 400_000;

/// Values may nest at most this deep (a rule file needs five levels).
pub const MAX_DEPTH: usize = 32;

/// The nodes built for a file of `len` bytes: every node written needs at least two bytes
/// (`a,`), so a file without aliases never reaches this; aliases may add
/// [`MAX_TREE_NODES`] more.
fn node_budget(len: usize) -> usize {
    MAX_TREE_NODES + len / 2 + 1
}

/// A line and column, both counted from 1.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct Position {
    pub line: u32,
    pub column: u32,
}

/// One YAML node with the position where it is written.
#[derive(Clone, Debug)]
pub struct Node {
    pub at: Position,
    pub value: Value,
}

/// The shapes a node can have. Scalars keep their YAML type so the schema can tell a number
/// from a string.
#[derive(Clone, Debug)]
pub enum Value {
    Null,
    Bool(bool),
    Int(i64),
    Float(f64),
    Str(String),
    Seq(Vec<Node>),
    Map(Vec<(Node, Node)>),
}

impl Value {
    /// What the value is, in the words of a diagnostic ("a list", "a number").
    pub fn kind(&self) -> &'static str {
        match self {
            Value::Null => "an empty value",
            Value::Bool(_) => "true or false",
            Value::Int(_) | Value::Float(_) => "a number",
            Value::Str(_) => "a string",
            Value::Seq(_) => "a list",
            Value::Map(_) => "a mapping",
        }
    }
}

/// Why a file could not be parsed as YAML at all.
#[derive(Debug)]
pub struct SyntaxError {
    pub at: Option<Position>,
    pub message: String,
    pub help: &'static str,
}

thread_local! {
    static NODES_LEFT: Cell<usize> = const { Cell::new(usize::MAX) };
}

/// Parses one YAML document into a spanned tree, within the budgets above.
pub fn parse(text: &str) -> Result<Node, SyntaxError> {
    let shape = prescan(text)?;
    let budget = node_budget(text.len());
    // YAML 1.2 core booleans only: a stopword list holding `on` or `no` means the words.
    let options = serde_saphyr::options! {
        strict_booleans: true,
        alias_limits: serde_saphyr::alias_limits! {
            max_total_replayed_events: MAX_TREE_NODES,
        },
        budget: serde_saphyr::budget! {
            max_nodes: budget,
            max_aliases: 10_000,
            max_depth: MAX_DEPTH,
            max_documents: 1,
            max_recorded_anchor_events: MAX_TREE_NODES,
        },
    };
    NODES_LEFT.with(|left| left.set(budget));
    let parsed: Result<Option<Spanned<Value>>, _> =
        serde_saphyr::from_str_with_options(text, options);
    NODES_LEFT.with(|left| left.set(usize::MAX));
    match parsed {
        Ok(Some(spanned)) => Ok(node_from(spanned)),
        Ok(None) => Ok(Node {
            at: Position { line: 1, column: 1 },
            value: Value::Null,
        }),
        Err(err) => Err(syntax_error(&err, &shape)),
    }
}

/// What the pre-scan learnt of a file that the parser's own errors do not say.
#[derive(Debug, Default)]
struct Shape {
    /// The first alias (`*name`), if any.
    first_alias: Option<Position>,
}

fn marker_position(m: &granit_parser::Marker) -> Position {
    Position {
        line: u32::try_from(m.line()).unwrap_or(u32::MAX).max(1),
        column: u32::try_from(m.col() + 1).unwrap_or(u32::MAX),
    }
}

/// One open collection in the pre-scan: for a mapping, its keys so far and whether the
/// next node is a key.
struct Frame {
    keys: Option<std::collections::HashMap<String, Position>>,
    next_is_key: bool,
}

/// Walks the file's parse events once, before the tree is built, for what must be refused
/// with a precise place: YAML tags (`!!binary` would decode into text the file does not
/// show), a second document, nesting deeper than [`MAX_DEPTH`], and a key written twice in
/// one mapping. Syntax errors are left to the parser proper, which reports them.
fn prescan(text: &str) -> Result<Shape, SyntaxError> {
    use granit_parser::{Event, Parser};
    let mut shape = Shape::default();
    let mut frames: Vec<Frame> = Vec::new();
    let mut documents = 0;
    for event in Parser::new_from_str(text) {
        let Ok((event, span)) = event else {
            break;
        };
        let at = marker_position(&span.start);
        // A node event (scalar, collection start or alias) in a mapping's key place.
        let node = |frames: &mut Vec<Frame>, key: Option<&str>| -> Result<(), SyntaxError> {
            let Some(frame) = frames.last_mut() else {
                return Ok(());
            };
            let Some(keys) = &mut frame.keys else {
                return Ok(());
            };
            let is_key = frame.next_is_key;
            frame.next_is_key = !is_key;
            if let (true, Some(key)) = (is_key, key) {
                if let Some(first) = keys.get(key) {
                    return Err(SyntaxError {
                        at: Some(at),
                        message: format!(
                            "the key {key:?} is written twice in one mapping (first at line {}, column {})",
                            first.line, first.column
                        ),
                        help: "keep one of the two entries; a mapping holds each key once",
                    });
                }
                keys.insert(key.to_string(), at);
            }
            Ok(())
        };
        let tag = match &event {
            Event::Scalar(_, _, _, tag)
            | Event::SequenceStart(_, _, tag)
            | Event::MappingStart(_, _, tag) => tag.as_ref(),
            _ => None,
        };
        if let Some(tag) = tag {
            let written = format!("{}{}", tag.original_handle(), tag.suffix());
            let tag_at = span.tag_start.as_ref().map_or(at, marker_position);
            return Err(SyntaxError {
                at: Some(tag_at),
                message: format!(
                    "a YAML tag `{written}`; rule files take plain values, without tags"
                ),
                help: "remove the tag and write the value as plain text (a tag such as `!!binary` \
                       would turn the value into something the file does not show)",
            });
        }
        match event {
            Event::DocumentStart(..) => {
                documents += 1;
                if documents > 1 {
                    return Err(SyntaxError {
                        at: Some(at),
                        message: "a second YAML document in one file (after a `---` line); \
                                  a rule file holds one document"
                            .into(),
                        help: "move the second document into a file of its own, or remove the `---` line",
                    });
                }
            }
            Event::Scalar(value, ..) => node(&mut frames, Some(value.as_ref()))?,
            Event::Alias(_) => {
                shape.first_alias.get_or_insert(at);
                node(&mut frames, None)?;
            }
            Event::SequenceStart(..) | Event::MappingStart(..) => {
                node(&mut frames, None)?;
                if frames.len() >= MAX_DEPTH {
                    return Err(SyntaxError {
                        at: Some(at),
                        message: format!("values nested more than {MAX_DEPTH} levels deep"),
                        help: "a rule file needs a few levels at most; check the indentation or the brackets here",
                    });
                }
                let is_map = matches!(event, Event::MappingStart(..));
                frames.push(Frame {
                    keys: is_map.then(Default::default),
                    next_is_key: true,
                });
            }
            Event::SequenceEnd | Event::MappingEnd => {
                frames.pop();
            }
            _ => {}
        }
    }
    Ok(shape)
}

fn syntax_error(err: &serde_saphyr::Error, shape: &Shape) -> SyntaxError {
    let at = err.location().and_then(|loc| position_of(&loc));
    let rendered = err.without_snippet().to_string();
    // The parser's message may carry its own "line N column M" prefix; keep the first line,
    // which states the problem, since our diagnostic prints the position itself.
    let message = rendered
        .lines()
        .find(|line| !line.trim().is_empty())
        .unwrap_or("the file is not valid YAML")
        .trim();
    // Our diagnostic prints the position itself; drop the parser's copy of it.
    let message = match message.rfind(" at line ") {
        Some(i) if message[i..].contains("column") => &message[..i],
        _ => message,
    }
    .to_string();
    // The parser's own words name its settings ("configured policy", "DuplicateKeyPolicy"),
    // which a rule file's author cannot reach: say what the file holds instead.
    let plain = |message: &str, help: &'static str| SyntaxError {
        at,
        message: message.to_string(),
        help,
    };
    if message.contains("non-finite float") {
        return plain(
            "a number that is not finite (infinite, not a number, or too large)",
            "write an ordinary number",
        );
    }
    if message.contains("merge keys") {
        return plain(
            "a YAML merge key (`<<`); rule files take plain mappings",
            "write the entries out instead of merging them in",
        );
    }
    if message.contains("duplicate mapping key") {
        return plain(
            "a key written twice in one mapping",
            "keep one of the two entries; a mapping holds each key once",
        );
    }
    let over_budget = message.contains("budget breached")
        || message.contains("alias replay")
        || message.contains("expands to more than");
    if over_budget {
        return match shape.first_alias {
            Some(alias) => SyntaxError {
                at: Some(alias),
                message: format!(
                    "the aliases in this file (the first is here) repeat more than \
                     {MAX_TREE_NODES} values, or more than 10000 aliases are used"
                ),
                help: "rule files need no YAML anchors or aliases (`&name`, `*name`); write the values out",
            },
            None => SyntaxError {
                at,
                message: "the file holds more values than a rule file may".into(),
                help: "split it into several files",
            },
        };
    }
    SyntaxError {
        at,
        message,
        help: "fix the YAML syntax at this point",
    }
}

fn position_of(loc: &serde_saphyr::Location) -> Option<Position> {
    let line = u32::try_from(loc.line()).ok()?;
    let column = u32::try_from(loc.column()).ok()?;
    (line > 0).then_some(Position {
        line,
        column: column.max(1),
    })
}

fn node_from(spanned: Spanned<Value>) -> Node {
    let at = position_of(&spanned.referenced).unwrap_or_default();
    Node {
        at,
        value: spanned.value,
    }
}

fn take_node_budget<E: de::Error>() -> Result<(), E> {
    NODES_LEFT.with(|left| {
        let n = left.get();
        if n == 0 {
            Err(E::custom(
                "the document expands to more than its node budget",
            ))
        } else {
            left.set(n - 1);
            Ok(())
        }
    })
}

impl<'de> Deserialize<'de> for Value {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        deserializer.deserialize_any(ValueVisitor)
    }
}

struct ValueVisitor;

impl<'de> Visitor<'de> for ValueVisitor {
    type Value = Value;

    fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
        f.write_str("any YAML value")
    }

    fn visit_bool<E: de::Error>(self, v: bool) -> Result<Value, E> {
        take_node_budget()?;
        Ok(Value::Bool(v))
    }

    fn visit_i64<E: de::Error>(self, v: i64) -> Result<Value, E> {
        take_node_budget()?;
        Ok(Value::Int(v))
    }

    fn visit_u64<E: de::Error>(self, v: u64) -> Result<Value, E> {
        take_node_budget()?;
        Ok(i64::try_from(v).map_or(Value::Float(v as f64), Value::Int))
    }

    fn visit_f64<E: de::Error>(self, v: f64) -> Result<Value, E> {
        take_node_budget()?;
        Ok(Value::Float(v))
    }

    fn visit_str<E: de::Error>(self, v: &str) -> Result<Value, E> {
        take_node_budget()?;
        Ok(Value::Str(v.to_string()))
    }

    fn visit_string<E: de::Error>(self, v: String) -> Result<Value, E> {
        take_node_budget()?;
        Ok(Value::Str(v))
    }

    fn visit_unit<E: de::Error>(self) -> Result<Value, E> {
        take_node_budget()?;
        Ok(Value::Null)
    }

    fn visit_none<E: de::Error>(self) -> Result<Value, E> {
        self.visit_unit()
    }

    fn visit_some<D: Deserializer<'de>>(self, d: D) -> Result<Value, D::Error> {
        Value::deserialize(d)
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<Value, A::Error> {
        take_node_budget()?;
        let mut items = Vec::new();
        while let Some(item) = seq.next_element::<Spanned<Value>>()? {
            items.push(node_from(item));
        }
        Ok(Value::Seq(items))
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Value, A::Error> {
        take_node_budget()?;
        let mut entries = Vec::new();
        while let Some((key, value)) = map.next_entry::<Spanned<Value>, Spanned<Value>>()? {
            entries.push((node_from(key), node_from(value)));
        }
        Ok(Value::Map(entries))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn keys_and_values_keep_their_positions() {
        let node = parse("format: 1\nsynonyms:\n  - equivalent: [a, b]\n").unwrap();
        let Value::Map(entries) = node.value else {
            panic!("expected a map")
        };
        assert_eq!(entries[0].0.at, Position { line: 1, column: 1 });
        assert_eq!(entries[0].1.at, Position { line: 1, column: 9 });
        let Value::Seq(items) = &entries[1].1.value else {
            panic!("expected a list")
        };
        assert_eq!(items[0].at.line, 3);
    }

    #[test]
    fn an_empty_file_is_null() {
        assert!(matches!(parse("").unwrap().value, Value::Null));
        assert!(matches!(
            parse("# only a comment\n").unwrap().value,
            Value::Null
        ));
    }

    #[test]
    fn syntax_errors_carry_a_position() {
        let err = parse("a: [1, 2\nb: 3\n").unwrap_err();
        assert!(err.at.is_some(), "{err:?}");
    }
}
