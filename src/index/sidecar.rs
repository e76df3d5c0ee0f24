//! Values derived from a cached index and kept beside it: its surface forms, each
//! stemmer's stems of them, document lengths without a stopword list, the documents' id
//! order. Each is computed the first time a run needs it and read back by later runs, so a
//! warm preview does not pay again for what only the index determines.
//!
//! A file is written to a temporary name in the index directory and renamed into place,
//! and ends with a BLAKE3 checksum of its contents: a file that is cut short, altered or
//! from another layout fails the check and is computed again, never trusted. Two runs
//! writing the same file at once are safe (both write the same bytes; one rename wins).

use std::fs;
use std::io::Write;
use std::path::Path;

/// First bytes of every sidecar file; bumped when an encoding changes.
const MAGIC: &[u8; 8] = b"lxdside1";
const CHECKSUM: usize = 32;

/// Appends values to a sidecar's bytes.
#[derive(Default)]
pub(crate) struct Encoder(Vec<u8>);

impl Encoder {
    #[cfg(test)]
    pub fn into_bytes(self) -> Vec<u8> {
        self.0
    }

    pub fn u32(&mut self, v: u32) {
        self.0.extend_from_slice(&v.to_le_bytes());
    }

    pub fn u32s(&mut self, values: &[u32]) {
        self.u32(values.len() as u32);
        self.0.reserve(values.len() * 4);
        for v in values {
            self.0.extend_from_slice(&v.to_le_bytes());
        }
    }

    pub fn strings<S: AsRef<str>>(&mut self, values: &[S]) {
        self.u32(values.len() as u32);
        for s in values {
            let s = s.as_ref().as_bytes();
            self.u32(s.len() as u32);
            self.0.extend_from_slice(s);
        }
    }
}

/// Reads values back in the order they were appended; `None` once the bytes run out.
pub(crate) struct Decoder<'a>(&'a [u8]);

impl<'a> Decoder<'a> {
    #[cfg(test)]
    pub fn new(bytes: &'a [u8]) -> Self {
        Decoder(bytes)
    }

    pub fn u32(&mut self) -> Option<u32> {
        let (head, rest) = self.0.split_first_chunk::<4>()?;
        self.0 = rest;
        Some(u32::from_le_bytes(*head))
    }

    pub fn u32s(&mut self) -> Option<Vec<u32>> {
        let n = self.u32()? as usize;
        let bytes = self.take(n.checked_mul(4)?)?;
        Some(
            bytes
                .chunks_exact(4)
                .map(|c| u32::from_le_bytes([c[0], c[1], c[2], c[3]]))
                .collect(),
        )
    }

    pub fn strings(&mut self) -> Option<Vec<String>> {
        let n = self.u32()? as usize;
        let mut out = Vec::with_capacity(n.min(self.0.len() / 4));
        for _ in 0..n {
            let len = self.u32()? as usize;
            out.push(std::str::from_utf8(self.take(len)?).ok()?.to_string());
        }
        Some(out)
    }

    /// Whether every byte was read.
    pub fn is_done(&self) -> bool {
        self.0.is_empty()
    }

    fn take(&mut self, n: usize) -> Option<&'a [u8]> {
        if self.0.len() < n {
            return None;
        }
        let (head, rest) = self.0.split_at(n);
        self.0 = rest;
        Some(head)
    }
}

/// The file `name` in `dir`, decoded by `decode`, or `compute`d and stored there.
/// Without a directory (an index in memory) the value is computed every time.
pub(crate) fn load_or_compute<T, E>(
    dir: Option<&Path>,
    name: &str,
    decode: impl FnOnce(&mut Decoder) -> Option<T>,
    encode: impl FnOnce(&T, &mut Encoder),
    compute: impl FnOnce() -> Result<T, E>,
) -> Result<T, E> {
    let Some(dir) = dir else {
        return compute();
    };
    let path = dir.join(name);
    if let Some(value) = read(&path, decode) {
        return Ok(value);
    }
    let value = compute()?;
    let mut encoder = Encoder::default();
    encode(&value, &mut encoder);
    // A sidecar only saves time: when it cannot be stored (a read-only cache, a full
    // disk) the run goes on with the value it computed.
    let _ = write(dir, &path, &encoder.0);
    Ok(value)
}

fn read<T>(path: &Path, decode: impl FnOnce(&mut Decoder) -> Option<T>) -> Option<T> {
    let bytes = fs::read(path).ok()?;
    let body = bytes.strip_prefix(MAGIC.as_slice())?;
    let (data, sum) = body.split_at_checked(body.len().checked_sub(CHECKSUM)?)?;
    if blake3::hash(data).as_bytes() != sum {
        return None;
    }
    let mut decoder = Decoder(data);
    let value = decode(&mut decoder)?;
    decoder.is_done().then_some(value)
}

fn write(dir: &Path, path: &Path, data: &[u8]) -> std::io::Result<()> {
    let mut tmp = tempfile::Builder::new()
        .prefix(".sidecar-")
        .tempfile_in(dir)?;
    tmp.write_all(MAGIC)?;
    tmp.write_all(data)?;
    tmp.write_all(blake3::hash(data).as_bytes())?;
    tmp.as_file().sync_all()?;
    tmp.persist(path).map_err(|e| e.error)?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    fn store(dir: &Path, calls: &mut u32) -> (Vec<u32>, Vec<String>) {
        load_or_compute(
            Some(dir),
            "test.bin",
            |d| Some((d.u32s()?, d.strings()?)),
            |(n, s), e| {
                e.u32s(n);
                e.strings(s);
            },
            || {
                *calls += 1;
                Ok::<_, ()>((vec![3, 1, 4], vec!["río".to_string(), String::new()]))
            },
        )
        .unwrap()
    }

    #[test]
    fn a_value_is_computed_once_then_read_back() {
        let dir = tempfile::tempdir().unwrap();
        let mut calls = 0;
        let first = store(dir.path(), &mut calls);
        let second = store(dir.path(), &mut calls);
        assert_eq!(first, second);
        assert_eq!(calls, 1);
    }

    #[test]
    fn a_damaged_file_is_computed_again() {
        let dir = tempfile::tempdir().unwrap();
        let mut calls = 0;
        let value = store(dir.path(), &mut calls);
        let path = dir.path().join("test.bin");
        let mut bytes = fs::read(&path).unwrap();
        bytes[MAGIC.len() + 5] ^= 1;
        fs::write(&path, &bytes).unwrap();
        assert_eq!(store(dir.path(), &mut calls), value);
        assert_eq!(calls, 2);
        fs::write(&path, &bytes[..bytes.len() - 3]).unwrap();
        assert_eq!(store(dir.path(), &mut calls), value);
        assert_eq!(calls, 3);
        // The rewritten file is whole again.
        assert_eq!(store(dir.path(), &mut calls), value);
        assert_eq!(calls, 3);
    }
}
