//! Atomic JSON files with a schema version, and quarantine of unreadable files.

use std::fs;
use std::io::{Read, Write};
use std::path::{Path, PathBuf};

use serde::Serialize;
use serde::de::DeserializeOwned;

/// Largest file the app or the command line reads (team, locker, settings files), bytes.
/// Anything larger is refused before it is read.
pub const MAX_FILE_BYTES: u64 = 1024 * 1024;

/// Limits a file's content must keep beyond its JSON shape (counts, name lengths).
/// A loaded file that breaks one is treated like an unreadable one: kept aside.
pub trait WithinLimits {
    /// `Err` names the field and the limit.
    fn within_limits(&self) -> Result<(), String> {
        Ok(())
    }
}

/// Why a text file could not be read.
#[derive(Debug)]
pub enum TextReadError {
    Missing,
    /// Over the size limit (the size as found, in bytes).
    TooLarge {
        bytes: u64,
        limit: u64,
    },
    /// Not UTF-8: the first bad byte, counted from 0, and where it sits.
    NotUtf8 {
        byte: usize,
        line: usize,
        column: usize,
    },
    Io(std::io::Error),
}

impl std::fmt::Display for TextReadError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            TextReadError::Missing => write!(f, "no such file"),
            TextReadError::TooLarge { bytes, limit } if *bytes < 1024 => {
                write!(
                    f,
                    "the file is {bytes} bytes and the limit is {}",
                    human_bytes(*limit)
                )
            }
            TextReadError::TooLarge { bytes, limit } => write!(
                f,
                "the file is {} ({bytes} bytes) and the limit is {}",
                human_bytes(*bytes),
                human_bytes(*limit)
            ),
            TextReadError::NotUtf8 { byte, line, column } => write!(
                f,
                "not UTF-8 text: byte {byte} (line {line}, column {column}) is not valid UTF-8"
            ),
            TextReadError::Io(e) => write!(f, "cannot read: {e}"),
        }
    }
}

/// A byte count for people: `512 bytes`, `12.3 KB`, `1 MB` (1 KB = 1024 bytes).
pub fn human_bytes(n: u64) -> String {
    const KB: f64 = 1024.0;
    let x = n as f64;
    let (v, unit) = if x < KB {
        return format!("{n} bytes");
    } else if x < KB * KB {
        (x / KB, "KB")
    } else {
        (x / (KB * KB), "MB")
    };
    let s = format!("{v:.1}");
    format!("{} {unit}", s.trim_end_matches(".0"))
}

/// At most `max` characters of `text` on one line: control characters become spaces and
/// a longer text ends in `…`. Error messages can quote a file's content; this keeps them short.
pub fn one_line(text: &str, max: usize) -> String {
    let mut out: String = text
        .chars()
        .take(max)
        .map(|c| if c.is_control() { ' ' } else { c })
        .collect();
    if text.chars().nth(max).is_some() {
        out.push('…');
    }
    out
}

/// Read a UTF-8 text file of at most `limit` bytes. The size is checked before reading,
/// and the read stops one byte past the limit whatever the file system reported.
/// A leading byte-order mark is dropped.
pub fn read_text(path: &Path, limit: u64) -> Result<String, TextReadError> {
    let file = match fs::File::open(path) {
        Ok(f) => f,
        // A missing file, or a data directory that is a file: nothing to read.
        Err(e)
            if matches!(
                e.kind(),
                std::io::ErrorKind::NotFound | std::io::ErrorKind::NotADirectory
            ) =>
        {
            return Err(TextReadError::Missing);
        }
        Err(e) => return Err(TextReadError::Io(e)),
    };
    if let Ok(meta) = file.metadata()
        && meta.is_file()
        && meta.len() > limit
    {
        return Err(TextReadError::TooLarge {
            bytes: meta.len(),
            limit,
        });
    }
    let mut bytes = Vec::new();
    file.take(limit + 1)
        .read_to_end(&mut bytes)
        .map_err(TextReadError::Io)?;
    if bytes.len() as u64 > limit {
        return Err(TextReadError::TooLarge {
            bytes: bytes.len() as u64,
            limit,
        });
    }
    // A byte-order mark (some editors write one) is not part of the text.
    let bom = if bytes.starts_with("\u{feff}".as_bytes()) {
        bytes.drain(..3);
        3
    } else {
        0
    };
    String::from_utf8(bytes).map_err(|e| {
        let byte = e.utf8_error().valid_up_to();
        let before = &e.as_bytes()[..byte];
        let line = before.iter().filter(|&&b| b == b'\n').count() + 1;
        let line_start = before
            .iter()
            .rposition(|&b| b == b'\n')
            .map_or(0, |i| i + 1);
        // Columns count characters; the bytes before `byte` are valid UTF-8.
        let column = std::str::from_utf8(&before[line_start..])
            .map_or(byte - line_start, |s| s.chars().count())
            + 1;
        TextReadError::NotUtf8 {
            byte: byte + bom,
            line,
            column,
        }
    })
}

/// What reading a file found.
#[derive(Debug)]
pub enum ReadOutcome<T> {
    /// No file yet.
    Missing,
    Loaded(T),
    /// The file could not be read; it was moved to `kept_as` and must not be recreated
    /// from nothing without telling the user.
    SetAside {
        kept_as: PathBuf,
        reason: String,
    },
}

/// Write `value` as pretty JSON: to a temp file in the same directory, synced, then renamed
/// over `path`, so that `path` always holds either the old or the new content, even if the
/// process is killed or two processes save at once. The temp file's name is unique to the
/// writer; one left behind by a killed writer is removed by a later save once it is old.
pub fn write_json<T: Serialize>(path: &Path, value: &T) -> std::io::Result<()> {
    let mut text = serde_json::to_string_pretty(value).map_err(std::io::Error::other)?;
    text.push('\n');
    write_text(path, &text)
}

/// Write `text` the same way: whole or not at all, even if the process is killed.
pub fn write_text(path: &Path, text: &str) -> std::io::Result<()> {
    let dir = path.parent().unwrap_or_else(|| Path::new("."));
    fs::create_dir_all(dir)?;
    let name = path.file_name().and_then(|n| n.to_str()).unwrap_or("data");
    let nanos = std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .map(|d| d.subsec_nanos())
        .unwrap_or(0);
    static WRITES: std::sync::atomic::AtomicU64 = std::sync::atomic::AtomicU64::new(0);
    let n = WRITES.fetch_add(1, std::sync::atomic::Ordering::Relaxed);
    let tmp = dir.join(format!(".{name}.{}-{nanos}-{n}.tmp", std::process::id()));
    let written = (|| {
        let mut f = fs::OpenOptions::new()
            .write(true)
            .create_new(true)
            .open(&tmp)?;
        f.write_all(text.as_bytes())?;
        f.sync_all()?;
        fs::rename(&tmp, path)
    })();
    if let Err(e) = written {
        let _ = fs::remove_file(&tmp);
        return Err(e);
    }
    if let Ok(d) = fs::File::open(dir) {
        let _ = d.sync_all();
    }
    remove_stale_temp_files(dir, name);
    Ok(())
}

/// Temp files of `name` older than ten minutes: left by a writer that was killed.
fn remove_stale_temp_files(dir: &Path, name: &str) {
    let prefix = format!(".{name}.");
    let Ok(entries) = fs::read_dir(dir) else {
        return;
    };
    for e in entries.filter_map(|e| e.ok()) {
        let file_name = e.file_name();
        let f = file_name.to_string_lossy();
        if !(f.starts_with(&prefix) && f.ends_with(".tmp")) {
            continue;
        }
        let old = e
            .metadata()
            .and_then(|m| m.modified())
            .ok()
            .and_then(|t| t.elapsed().ok())
            .is_some_and(|age| age > std::time::Duration::from_secs(600));
        if old {
            let _ = fs::remove_file(e.path());
        }
    }
}

/// A versioned envelope: `{"schema": N, ...payload}` is read through `parse`.
/// Unreadable files (over the size limit, not UTF-8, bad JSON, wrong shape, newer schema,
/// outside the type's limits) are renamed aside.
pub fn read_json<T: DeserializeOwned + WithinLimits>(
    path: &Path,
    max_schema: u32,
) -> ReadOutcome<T> {
    let text = match read_text(path, MAX_FILE_BYTES) {
        Ok(t) => t,
        Err(TextReadError::Missing) => return ReadOutcome::Missing,
        Err(e) => return set_aside(path, e.to_string()),
    };
    if let Err(why) = check_envelope(&text, max_schema) {
        return set_aside(path, why);
    }
    let de = &mut serde_json::Deserializer::from_str(&text);
    match serde_path_to_error::deserialize::<_, T>(de) {
        Ok(v) => match v.within_limits() {
            Ok(()) => ReadOutcome::Loaded(v),
            Err(why) => set_aside(path, one_line(&why, 300)),
        },
        Err(e) => {
            let at = e.path().to_string();
            let at = at.trim_end_matches('?').trim_end_matches('.');
            let why = one_line(&e.inner().to_string(), 200);
            if at.is_empty() {
                set_aside(path, why)
            } else {
                set_aside(path, format!("{}: {why}", one_line(at, 100)))
            }
        }
    }
}

/// The outside of a versioned file: JSON (syntax, nesting at most 128 deep), an object,
/// and a `schema` this version reads. `Err` says what is wrong.
pub fn check_envelope(text: &str, max_schema: u32) -> Result<(), String> {
    let v = serde_json::from_str::<serde_json::Value>(text)
        .map_err(|e| one_line(&e.to_string(), 200))?;
    let Some(obj) = v.as_object() else {
        return Err("not a JSON object: the file must start with {".to_string());
    };
    if let Some(s) = obj.get("schema").and_then(|s| s.as_u64())
        && s > u64::from(max_schema)
    {
        return Err(format!(
            "written by a newer version (schema {s}; this version reads up to {max_schema})"
        ));
    }
    Ok(())
}

/// Files set aside for `name` in `dir` (`<name>.unreadable-…`), oldest name first.
pub fn kept_aside(dir: &Path, name: &str) -> Vec<PathBuf> {
    let prefix = format!("{name}.unreadable");
    let mut found: Vec<PathBuf> = fs::read_dir(dir)
        .map(|entries| {
            entries
                .filter_map(|e| e.ok())
                .filter(|e| e.file_name().to_string_lossy().starts_with(&prefix))
                .map(|e| e.path())
                .collect()
        })
        .unwrap_or_default();
    found.sort();
    found
}

pub(crate) fn set_aside<T>(path: &Path, reason: String) -> ReadOutcome<T> {
    let stamp = std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .map(|d| d.as_secs())
        .unwrap_or(0);
    let name = path.file_name().and_then(|n| n.to_str()).unwrap_or("data");
    let mut kept = path.with_file_name(format!("{name}.unreadable-{stamp}"));
    let mut n = 1;
    while kept.exists() {
        kept = path.with_file_name(format!("{name}.unreadable-{stamp}-{n}"));
        n += 1;
    }
    match fs::rename(path, &kept) {
        Ok(()) => ReadOutcome::SetAside {
            kept_as: kept,
            reason,
        },
        // Could not move it: report it as kept in place; the store then refuses to write it.
        Err(e) => ReadOutcome::SetAside {
            kept_as: path.to_path_buf(),
            reason: format!("{reason}; could not move it aside: {e}"),
        },
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[derive(serde::Serialize, serde::Deserialize, Debug, PartialEq)]
    struct Doc {
        schema: u32,
        value: i32,
    }

    impl WithinLimits for Doc {
        fn within_limits(&self) -> Result<(), String> {
            if self.value > 100 {
                return Err(format!("value: {} is over 100", self.value));
            }
            Ok(())
        }
    }

    #[test]
    fn write_then_read() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("a.json");
        assert!(matches!(read_json::<Doc>(&p, 1), ReadOutcome::Missing));
        write_json(
            &p,
            &Doc {
                schema: 1,
                value: 7,
            },
        )
        .unwrap();
        match read_json::<Doc>(&p, 1) {
            ReadOutcome::Loaded(d) => assert_eq!(d.value, 7),
            other => panic!("{other:?}"),
        }
        let left: Vec<_> = fs::read_dir(dir.path())
            .unwrap()
            .map(|e| e.unwrap().file_name())
            .collect();
        assert_eq!(
            left,
            vec![std::ffi::OsString::from("a.json")],
            "no temp file is left"
        );
    }

    #[test]
    fn corrupt_and_newer_files_are_set_aside_with_their_bytes() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("a.json");
        fs::write(&p, "{not json").unwrap();
        match read_json::<Doc>(&p, 1) {
            ReadOutcome::SetAside { kept_as, .. } => {
                assert!(!p.exists());
                assert_eq!(fs::read_to_string(kept_as).unwrap(), "{not json");
            }
            other => panic!("{other:?}"),
        }
        fs::write(&p, r#"{"schema": 9, "value": 1}"#).unwrap();
        match read_json::<Doc>(&p, 1) {
            ReadOutcome::SetAside { reason, .. } => assert!(reason.contains("newer"), "{reason}"),
            other => panic!("{other:?}"),
        }
    }

    #[test]
    fn oversized_non_utf8_and_out_of_limit_files_are_set_aside_byte_identical() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("a.json");
        let cases: Vec<(Vec<u8>, &str)> = vec![
            (vec![b' '; MAX_FILE_BYTES as usize + 1], "limit is 1 MB"),
            (
                b"{\"schema\": 1,\n \"value\": \xff}".to_vec(),
                "byte 24 (line 2, column 11)",
            ),
            (
                br#"{"schema": 1, "value": 101}"#.to_vec(),
                "value: 101 is over 100",
            ),
            (
                br#"{"schema": 1, "value": "x"}"#.to_vec(),
                "value: invalid type",
            ),
            (b"".to_vec(), "EOF"),
        ];
        for (bytes, why) in cases {
            fs::write(&p, &bytes).unwrap();
            match read_json::<Doc>(&p, 1) {
                ReadOutcome::SetAside { kept_as, reason } => {
                    assert!(reason.contains(why), "{reason}");
                    assert!(!p.exists());
                    assert_eq!(fs::read(&kept_as).unwrap(), bytes);
                    fs::remove_file(kept_as).unwrap();
                }
                other => panic!("{why}: {other:?}"),
            }
        }
    }

    #[test]
    fn read_text_reports_size_and_position() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("t.txt");
        fs::write(&p, b"ab\nc\xc3\xa9\xfe").unwrap();
        match read_text(&p, 100) {
            Err(TextReadError::NotUtf8 { byte, line, column }) => {
                assert_eq!((byte, line, column), (6, 2, 3));
            }
            other => panic!("{other:?}"),
        }
        fs::write(&p, "x".repeat(101)).unwrap();
        let e = read_text(&p, 100).unwrap_err();
        assert!(
            matches!(e, TextReadError::TooLarge { bytes: 101, .. }),
            "{e}"
        );
        assert_eq!(
            e.to_string(),
            "the file is 101 bytes and the limit is 100 bytes"
        );
        assert!(matches!(
            read_text(&dir.path().join("none"), 100),
            Err(TextReadError::Missing)
        ));
        assert_eq!(human_bytes(12 * 1024 * 1024 + 300 * 1024), "12.3 MB");
        assert_eq!(human_bytes(1024 * 1024), "1 MB");
    }

    #[test]
    fn concurrent_writers_never_mix_their_bytes() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("a.json");
        std::thread::scope(|scope| {
            for value in 0..4 {
                let p = &p;
                scope.spawn(move || {
                    for _ in 0..50 {
                        write_json(p, &Doc { schema: 1, value }).unwrap();
                    }
                });
            }
        });
        match read_json::<Doc>(&p, 1) {
            ReadOutcome::Loaded(d) => assert!((0..4).contains(&d.value)),
            other => panic!("{other:?}"),
        }
        assert_eq!(
            fs::read_dir(dir.path()).unwrap().count(),
            1,
            "no temp file is left"
        );
    }
}
