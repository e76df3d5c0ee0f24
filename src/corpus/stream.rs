//! Documents without a [`Corpus`](super::Corpus): a JSON Lines file read in blocks by
//! several threads, each line parsed in place (fields borrowed from the line unless they
//! hold escapes) and handed to a callback, so memory stays flat however large the file is.
//!
//! The result is the one [`read_documents`] would give: a line this fast parser does not
//! take (a non-string field, say) goes through the same per-line code `read_documents`
//! uses, and any problem at all (bad UTF-8, a bad line, a repeated id) makes the reader
//! defer to `read_documents` itself, so the error and its precedence are exactly its own.
//! CSV, directories and samples are read with `read_documents` and then walked.

use std::borrow::Cow;
use std::fmt;
use std::fs::File;
use std::hash::BuildHasher;
use std::io::{BufRead, BufReader, Read};
use std::path::Path;
use std::sync::Mutex;

use serde::de::{self, DeserializeSeed, Deserializer, IgnoredAny, MapAccess, Visitor};

use super::documents::{DocOptions, Document, parse_json_line, read_documents};
use super::fields::Presence;
use super::{CorpusError, CorpusWarning, DocumentFormat};

/// How many bytes a thread takes from the file at a time (then on to the line's end).
const BLOCK: usize = 1 << 20;

/// What [`for_each_document`] gives back.
#[derive(Debug)]
pub struct Walk<S> {
    /// The threads' states, in no particular order.
    pub states: Vec<S>,
    /// How many documents were walked.
    pub documents: usize,
    /// What [`read_documents`] would warn about for the same file and options.
    pub warnings: Vec<CorpusWarning>,
}

/// Calls `each(state, number, texts)` for every document of `path`, on `threads` threads,
/// each with its own state from `init`. `texts` are the document's fields in
/// `options.fields` order (`""` when missing). `number` is unique per document and
/// increases in file order (the 0-based line for JSON Lines, the index otherwise); a
/// document is seen by one thread only. The checks and errors are [`read_documents`]'s.
pub fn for_each_document<S, I, F>(
    path: &Path,
    options: &DocOptions,
    threads: usize,
    init: I,
    each: F,
) -> Result<Walk<S>, CorpusError>
where
    S: Send,
    I: Fn() -> S + Sync,
    F: Fn(&mut S, usize, &[&str]) + Sync,
{
    let format = DocumentFormat::detect(path)?;
    if options.sample.is_none() && format == DocumentFormat::JsonLines {
        let file = File::open(path).map_err(|source| CorpusError::Io {
            path: path.to_path_buf(),
            source,
        })?;
        if let Some((states, presence)) = stream(file, path, options, threads, &init, &each)
            && !presence.has_error(options)
            && let Ok(warnings) = presence.check(path, format, options)
        {
            return Ok(Walk {
                states,
                documents: presence.documents(),
                warnings,
            });
        }
    }
    let corpus = read_documents(path, options)?;
    let states = for_each_in_memory(&corpus.documents, threads, init, each);
    Ok(Walk {
        states,
        documents: corpus.documents.len(),
        warnings: corpus.warnings,
    })
}

/// The same walk over documents already in memory (`number` is the index).
pub fn for_each_in_memory<S, I, F>(
    documents: &[Document],
    threads: usize,
    init: I,
    each: F,
) -> Vec<S>
where
    S: Send,
    I: Fn() -> S + Sync,
    F: Fn(&mut S, usize, &[&str]) + Sync,
{
    let chunk = documents.len().div_ceil(threads.max(1)).max(1);
    let (init, each) = (&init, &each);
    std::thread::scope(|scope| {
        let handles: Vec<_> = documents
            .chunks(chunk)
            .enumerate()
            .map(|(n, part)| {
                scope.spawn(move || {
                    let mut state = init();
                    let mut texts: Vec<&str> = Vec::new();
                    for (i, doc) in part.iter().enumerate() {
                        texts.clear();
                        texts.extend(doc.texts.iter().map(String::as_str));
                        each(&mut state, n * chunk + i, &texts);
                    }
                    state
                })
            })
            .collect();
        let mut states: Vec<S> = handles
            .into_iter()
            .map(|h| h.join().expect("a document thread panicked"))
            .collect();
        if states.is_empty() {
            states.push(init());
        }
        states
    })
}

/// The shared reader: the file, and the line the next block starts at.
struct Blocks<R> {
    reader: BufReader<R>,
    line: usize,
    done: bool,
}

impl<R: Read> Blocks<R> {
    /// The next block of whole lines into `buf`, and its first line; `None` at the end.
    fn next(&mut self, buf: &mut Vec<u8>) -> std::io::Result<Option<usize>> {
        buf.clear();
        if self.done {
            return Ok(None);
        }
        while buf.len() < BLOCK {
            let chunk = self.reader.fill_buf()?;
            if chunk.is_empty() {
                self.done = true;
                break;
            }
            let take = chunk.len().min(BLOCK - buf.len());
            buf.extend_from_slice(&chunk[..take]);
            self.reader.consume(take);
        }
        if !self.done && buf.last() != Some(&b'\n') {
            let n = self.reader.read_until(b'\n', buf)?;
            if n == 0 || buf.last() != Some(&b'\n') {
                self.done = true;
            }
        }
        if buf.is_empty() {
            return Ok(None);
        }
        let first = self.line;
        self.line += memchr_count(buf);
        Ok(Some(first))
    }
}

fn memchr_count(bytes: &[u8]) -> usize {
    bytes.iter().filter(|&&b| b == b'\n').count()
}

/// What one thread keeps besides the caller's state.
struct Worker<S> {
    state: S,
    presence: Presence,
    /// Hashes of the document ids, to find a repeated id.
    ids: Vec<u64>,
    failed: bool,
}

/// `None` when anything was wrong: the caller then defers to `read_documents`.
fn stream<S, I, F, R>(
    file: R,
    path: &Path,
    options: &DocOptions,
    threads: usize,
    init: &I,
    each: &F,
) -> Option<(Vec<S>, Presence)>
where
    S: Send,
    I: Fn() -> S + Sync,
    F: Fn(&mut S, usize, &[&str]) + Sync,
    R: Read + Send,
{
    let blocks = Mutex::new(Blocks {
        reader: BufReader::with_capacity(BLOCK, file),
        line: 0,
        done: false,
    });
    let names: Vec<&str> = options.fields.iter().map(|f| f.name.as_str()).collect();
    let wanted = Wanted {
        id: &options.id_field,
        title: options.title_name(),
        fields: &names,
    };
    let workers: Vec<Worker<S>> = std::thread::scope(|scope| {
        let handles: Vec<_> = (0..threads.max(1))
            .map(|_| {
                let (blocks, wanted) = (&blocks, &wanted);
                scope.spawn(move || work(blocks, wanted, path, options, init, each))
            })
            .collect();
        handles
            .into_iter()
            .map(|h| h.join().expect("a document thread panicked"))
            .collect()
    });
    if workers.iter().any(|w| w.failed) {
        return None;
    }
    let mut presence = Presence::new(options);
    for w in &workers {
        presence.merge(&w.presence);
    }
    if presence.documents() == 0 {
        return None;
    }
    let mut ids: Vec<u64> = Vec::with_capacity(presence.documents());
    let mut states = Vec::with_capacity(workers.len());
    for w in workers {
        ids.extend(w.ids);
        states.push(w.state);
    }
    ids.sort_unstable();
    if ids.windows(2).any(|w| w[0] == w[1]) {
        // A repeated id (or, very rarely, two ids with one hash): `read_documents` decides.
        return None;
    }
    Some((states, presence))
}

fn work<S, I, F, R>(
    blocks: &Mutex<Blocks<R>>,
    wanted: &Wanted,
    path: &Path,
    options: &DocOptions,
    init: &I,
    each: &F,
) -> Worker<S>
where
    I: Fn() -> S,
    F: Fn(&mut S, usize, &[&str]),
    R: Read,
{
    let mut worker = Worker {
        state: init(),
        presence: Presence::new(options),
        ids: Vec::new(),
        failed: false,
    };
    let hasher = rustc_hash::FxBuildHasher;
    let mut buf = Vec::with_capacity(BLOCK + 4096);
    loop {
        let first = match blocks.lock().map(|mut b| b.next(&mut buf)) {
            Ok(Ok(Some(first))) => first,
            Ok(Ok(None)) => break,
            _ => {
                worker.failed = true;
                break;
            }
        };
        let Ok(text) = std::str::from_utf8(&buf) else {
            worker.failed = true;
            break;
        };
        let mut fields: Vec<Option<Cow<str>>> = Vec::new();
        for (k, line) in lines(text).enumerate() {
            if line.trim().is_empty() {
                continue;
            }
            let number = first + k;
            let line = if number == 0 {
                line.strip_prefix('\u{feff}').unwrap_or(line)
            } else {
                line
            };
            let slow;
            let id: &str;
            let has_title;
            let mut texts: Vec<&str> = Vec::with_capacity(wanted.fields.len());
            let n = wanted.fields.len();
            match parse_fast(line, wanted, &mut fields) {
                Some(()) if fields[0].is_some() => {
                    id = fields[0].as_deref().unwrap_or_default();
                    texts.extend(fields[1..=n].iter().map(|f| f.as_deref().unwrap_or("")));
                    has_title = fields[n + 1].as_deref().is_some_and(|t| !t.is_empty());
                }
                _ => match parse_json_line(path, number, line, options) {
                    Ok((doc, true)) => {
                        slow = doc;
                        id = &slow.id;
                        has_title = !slow.title.is_empty();
                        texts.extend(slow.texts.iter().map(String::as_str));
                    }
                    _ => {
                        worker.failed = true;
                        return worker;
                    }
                },
            }
            worker.ids.push(hasher.hash_one(id));
            worker
                .presence
                .add_texts(true, number + 1, has_title, texts.iter().copied());
            each(&mut worker.state, number, &texts);
        }
    }
    worker
}

/// Lines as `str::lines` splits them.
fn lines(text: &str) -> impl Iterator<Item = &str> {
    text.split_inclusive('\n')
        .map(|l| match l.strip_suffix('\n') {
            Some(l) => l.strip_suffix('\r').unwrap_or(l),
            None => l,
        })
}

/// The names the fast parser keeps: the id, the searched fields, the title.
struct Wanted<'a> {
    id: &'a str,
    title: &'a str,
    fields: &'a [&'a str],
}

/// Parses one line into `out` (`out[0]` the id, then the fields, then the title; `None`
/// when missing or null). `None` when the line needs the general parser: not an object of strings where
/// it matters, or not JSON at all.
fn parse_fast<'l>(
    line: &'l str,
    wanted: &Wanted,
    out: &mut Vec<Option<Cow<'l, str>>>,
) -> Option<()> {
    out.clear();
    out.resize(wanted.fields.len() + 2, None);
    let mut de = serde_json::Deserializer::from_str(line);
    Line { wanted, out }.deserialize(&mut de).ok()?;
    de.end().ok()
}

struct Line<'a, 'o, 'l> {
    wanted: &'a Wanted<'a>,
    out: &'o mut Vec<Option<Cow<'l, str>>>,
}

impl<'de> DeserializeSeed<'de> for Line<'_, '_, 'de> {
    type Value = ();
    fn deserialize<D: Deserializer<'de>>(self, d: D) -> Result<(), D::Error> {
        d.deserialize_map(self)
    }
}

impl<'de> Visitor<'de> for Line<'_, '_, 'de> {
    type Value = ();
    fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
        f.write_str("a JSON object")
    }
    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<(), A::Error> {
        while let Some(key) = map.next_key::<Text<'de>>()? {
            let key = key.0.as_deref();
            // A name may be both the id and a field; every slot it names gets the value.
            let names = || {
                std::iter::once(self.wanted.id)
                    .chain(self.wanted.fields.iter().copied())
                    .chain(std::iter::once(self.wanted.title))
            };
            if !names().any(|n| Some(n) == key) {
                map.next_value::<Ignore>()?;
                continue;
            }
            let value = map.next_value::<Text<'de>>()?.0;
            for (i, n) in names().enumerate() {
                if Some(n) == key {
                    self.out[i] = value.clone();
                }
            }
        }
        Ok(())
    }
}

/// A string (`Some`) or null (`None`); anything else is refused, for the general parser.
struct Text<'de>(Option<Cow<'de, str>>);

impl<'de> de::Deserialize<'de> for Text<'de> {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_any(TextVisitor)
    }
}

struct TextVisitor;

impl<'de> Visitor<'de> for TextVisitor {
    type Value = Text<'de>;
    fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
        f.write_str("a string or null")
    }
    fn visit_borrowed_str<E: de::Error>(self, v: &'de str) -> Result<Text<'de>, E> {
        Ok(Text(Some(Cow::Borrowed(v))))
    }
    fn visit_str<E: de::Error>(self, v: &str) -> Result<Text<'de>, E> {
        Ok(Text(Some(Cow::Owned(v.to_string()))))
    }
    fn visit_string<E: de::Error>(self, v: String) -> Result<Text<'de>, E> {
        Ok(Text(Some(Cow::Owned(v))))
    }
    fn visit_unit<E: de::Error>(self) -> Result<Text<'de>, E> {
        Ok(Text(None))
    }
}

/// Skips a value while checking it as strictly as `serde_json::Value` would (numbers are
/// parsed, so one out of range fails here too).
struct Ignore;

impl<'de> de::Deserialize<'de> for Ignore {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_any(IgnoreVisitor)
    }
}

struct IgnoreVisitor;

impl<'de> Visitor<'de> for IgnoreVisitor {
    type Value = Ignore;
    fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
        f.write_str("any JSON value")
    }
    fn visit_bool<E>(self, _: bool) -> Result<Ignore, E> {
        Ok(Ignore)
    }
    fn visit_i64<E>(self, _: i64) -> Result<Ignore, E> {
        Ok(Ignore)
    }
    fn visit_u64<E>(self, _: u64) -> Result<Ignore, E> {
        Ok(Ignore)
    }
    fn visit_f64<E>(self, _: f64) -> Result<Ignore, E> {
        Ok(Ignore)
    }
    fn visit_str<E>(self, _: &str) -> Result<Ignore, E> {
        Ok(Ignore)
    }
    fn visit_unit<E>(self) -> Result<Ignore, E> {
        Ok(Ignore)
    }
    fn visit_seq<A: de::SeqAccess<'de>>(self, mut seq: A) -> Result<Ignore, A::Error> {
        while seq.next_element::<Ignore>()?.is_some() {}
        Ok(Ignore)
    }
    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Ignore, A::Error> {
        while map.next_entry::<IgnoredKey, Ignore>()?.is_some() {}
        Ok(Ignore)
    }
}

/// A map key, checked as a string.
struct IgnoredKey;

impl<'de> de::Deserialize<'de> for IgnoredKey {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_any(IgnoredAny).map(|_| IgnoredKey)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn streamed(path: &Path, threads: usize) -> Result<Vec<(usize, Vec<String>)>, String> {
        let walk = for_each_document(
            path,
            &DocOptions::default(),
            threads,
            Vec::new,
            |out: &mut Vec<(usize, Vec<String>)>, i, texts| {
                out.push((i, texts.iter().map(|t| t.to_string()).collect()))
            },
        )
        .map_err(|e| e.to_string())?;
        let mut all: Vec<_> = walk.states.into_iter().flatten().collect();
        all.sort();
        assert_eq!(all.len(), walk.documents);
        Ok(all)
    }

    #[test]
    fn streaming_reads_what_read_documents_reads_and_fails_the_same_way() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("d.jsonl");
        std::fs::write(
            &p,
            "\u{feff}{\"id\":\"a\",\"title\":\"Caf\\u00e9 \\\"x\\\"\",\"body\":null,\"n\":[1,{\"k\":2.5}]}\r\n\
             \n   \n{\"body\":\"b1\",\"id\":7,\"title\":3}\n{\"id\":\"c\",\"body\":\"x\",\"body\":\"y\"}",
        )
        .unwrap();
        let expected: Vec<Vec<String>> = read_documents(&p, &DocOptions::default())
            .unwrap()
            .documents
            .into_iter()
            .map(|d| d.texts)
            .collect();
        for threads in [1, 2, 3] {
            let got = streamed(&p, threads).unwrap();
            let numbers: Vec<usize> = got.iter().map(|g| g.0).collect();
            assert_eq!(numbers, [0, 3, 4]);
            let texts: Vec<Vec<String>> = got.into_iter().map(|g| g.1).collect();
            assert_eq!(texts, expected);
        }
        for bad in [
            "{\"id\":\"a\"}\nnot json\n",
            "{\"id\":\"a\"}\n{\"id\":\"a\"}\n",
            "{\"id\":\"a\"}\n[1]\n",
            "{\"title\":\"t\"}\n",
            "{\"id\":\"a\",\"x\":1e999}\n",
        ] {
            std::fs::write(&p, bad).unwrap();
            let want = read_documents(&p, &DocOptions::default()).unwrap_err();
            assert_eq!(streamed(&p, 2).unwrap_err(), want.to_string(), "{bad:?}");
        }
        std::fs::write(&p, b"{\"id\":\"a\"}\n{\"id\":\"b\",\"body\":\"\xff\"}\n").unwrap();
        let want = read_documents(&p, &DocOptions::default()).unwrap_err();
        assert_eq!(streamed(&p, 2).unwrap_err(), want.to_string());
    }
}
