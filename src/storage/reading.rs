//! Reading the files the program is given or keeps: nothing read is trusted. A file must
//! be a regular file (a FIFO, device, socket or folder is refused at once, before any
//! read could block), at most `MAX_FILE_BYTES` (checked before reading, and the read stops
//! one byte past it), UTF-8, and then pass its format's own checks.

use std::fs;
use std::io::Read;
use std::path::{Path, PathBuf};

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
    /// Not a regular file: what it is (`a FIFO`, `a folder`...).
    NotRegular(&'static str),
    Io(std::io::Error),
}

impl std::fmt::Display for TextReadError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            TextReadError::Missing => write!(f, "no such file"),
            TextReadError::TooLarge { bytes, limit } if *limit < 1024 => {
                write!(
                    f,
                    "the file is {bytes} bytes and the limit is {limit} bytes"
                )
            }
            // Both in bytes: a file one byte over would otherwise read "1 MB, limit 1 MB".
            TextReadError::TooLarge { bytes, limit } => write!(
                f,
                "the file is {bytes} bytes and the limit is {} ({limit} bytes)",
                human_bytes(*limit)
            ),
            TextReadError::NotUtf8 { byte, line, column } => write!(
                f,
                "not UTF-8 text: byte {byte} (line {line}, column {column}) is not valid UTF-8"
            ),
            TextReadError::NotRegular(kind) => write!(
                f,
                "it is {kind}, not a regular file; only regular files are read"
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

/// At most `max` characters of `text` on one line: control characters become spaces, other
/// characters refused in names (bidirectional controls, non-characters) become U+FFFD, and
/// a longer text ends in `…`. Error messages can quote a file's content; this keeps them short.
pub fn one_line(text: &str, max: usize) -> String {
    let mut out: String = text
        .chars()
        .take(max)
        .map(|c| {
            if c.is_control() {
                ' '
            } else if crate::plan::text::refused_char(c).is_some() {
                '\u{fffd}'
            } else {
                c
            }
        })
        .collect();
    if text.chars().nth(max).is_some() {
        out.push('…');
    }
    out
}

/// What a file is when it is not a regular file.
#[cfg(unix)]
fn kind_of(t: fs::FileType) -> Option<&'static str> {
    use std::os::unix::fs::FileTypeExt;
    if t.is_file() {
        None
    } else if t.is_dir() {
        Some("a folder")
    } else if t.is_fifo() {
        Some("a FIFO (named pipe)")
    } else if t.is_socket() {
        Some("a socket")
    } else if t.is_char_device() || t.is_block_device() {
        Some("a device")
    } else {
        Some("not a file")
    }
}

#[cfg(not(unix))]
fn kind_of(t: fs::FileType) -> Option<&'static str> {
    if t.is_file() {
        None
    } else if t.is_dir() {
        Some("a folder")
    } else {
        Some("not a file")
    }
}

/// What `path` is if it exists and is not a regular file (symbolic links followed).
pub fn not_regular(path: &Path) -> Option<&'static str> {
    fs::metadata(path).ok().and_then(|m| kind_of(m.file_type()))
}

/// Open `path` for reading only if it is a regular file. It is opened without blocking
/// (a FIFO put in its place between a check and the open cannot hang the read), then
/// checked on the open file itself.
pub fn open_regular(path: &Path) -> Result<fs::File, TextReadError> {
    let mut options = fs::OpenOptions::new();
    options.read(true);
    #[cfg(unix)]
    {
        use std::os::unix::fs::OpenOptionsExt;
        options.custom_flags(libc::O_NONBLOCK);
    }
    let file = match options.open(path) {
        Ok(f) => f,
        Err(e) if e.kind() == std::io::ErrorKind::NotFound => {
            return Err(TextReadError::Missing);
        }
        // A folder on the way is a file (a data directory that is a file): an error,
        // never "no file yet", or an empty file would be written over it.
        Err(e) if e.kind() == std::io::ErrorKind::NotADirectory => {
            let folder = path.parent().map(|p| p.display().to_string());
            return Err(TextReadError::Io(std::io::Error::new(
                e.kind(),
                format!(
                    "{} is a file, not a folder",
                    folder.unwrap_or_else(|| "the folder".to_string())
                ),
            )));
        }
        Err(e) => return Err(TextReadError::Io(e)),
    };
    let meta = file.metadata().map_err(TextReadError::Io)?;
    if let Some(kind) = kind_of(meta.file_type()) {
        return Err(TextReadError::NotRegular(kind));
    }
    Ok(file)
}

/// Read a UTF-8 text file of at most `limit` bytes. The size is checked before reading,
/// and the read stops one byte past the limit whatever the file system reported.
/// A leading byte-order mark is dropped.
pub fn read_text(path: &Path, limit: u64) -> Result<String, TextReadError> {
    let file = open_regular(path)?;
    let meta = file.metadata().map_err(TextReadError::Io)?;
    if meta.len() > limit {
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
    /// The content could not be used; the file was moved to `kept_as` and must not be
    /// recreated from nothing without telling the user.
    SetAside {
        kept_as: PathBuf,
        reason: String,
    },
    /// The file could not be read for a reason that is not its content (not a regular
    /// file, permission denied, an I/O error), or could not be moved aside: it is left
    /// where it is and must not be written over.
    LeftInPlace {
        reason: String,
    },
}

/// What looking at a file found, changing nothing.
#[derive(Debug)]
pub enum Inspected<T> {
    Missing,
    Loaded(T),
    /// The content is not usable (size, encoding, JSON, shape, schema, limits): why.
    BadContent(String),
    /// Not readable for another reason (not a regular file, permissions, I/O): why.
    Unavailable(String),
}

/// Read a versioned envelope `{"schema": N, ...payload}` and change nothing: what was found.
pub fn inspect_json<T: DeserializeOwned + WithinLimits>(
    path: &Path,
    max_schema: u32,
) -> Inspected<T> {
    let text = match read_text(path, MAX_FILE_BYTES) {
        Ok(t) => t,
        Err(TextReadError::Missing) => return Inspected::Missing,
        Err(e @ (TextReadError::NotRegular(_) | TextReadError::Io(_))) => {
            return Inspected::Unavailable(e.to_string());
        }
        Err(e) => return Inspected::BadContent(e.to_string()),
    };
    if let Err(why) = check_envelope(&text, max_schema) {
        return Inspected::BadContent(why);
    }
    let de = &mut serde_json::Deserializer::from_str(&text);
    match serde_path_to_error::deserialize::<_, T>(de) {
        Ok(v) => match v.within_limits() {
            Ok(()) => Inspected::Loaded(v),
            Err(why) => Inspected::BadContent(one_line(&why, 300)),
        },
        Err(e) => {
            let at = e.path().to_string();
            let at = at.trim_end_matches('?').trim_end_matches('.');
            let why = one_line(&e.inner().to_string(), 200);
            if at.is_empty() {
                Inspected::BadContent(why)
            } else {
                Inspected::BadContent(format!("{}: {why}", one_line(at, 100)))
            }
        }
    }
}

/// Read a versioned file (`inspect_json`); one whose content is not usable (over the size
/// limit, not UTF-8, bad JSON, wrong shape, newer schema, outside the type's limits) is
/// renamed aside. One that cannot be read for another reason is left where it is.
pub fn read_json<T: DeserializeOwned + WithinLimits>(
    path: &Path,
    max_schema: u32,
) -> ReadOutcome<T> {
    match inspect_json(path, max_schema) {
        Inspected::Missing => ReadOutcome::Missing,
        Inspected::Loaded(v) => ReadOutcome::Loaded(v),
        Inspected::BadContent(why) => set_aside(path, why),
        Inspected::Unavailable(why) => ReadOutcome::LeftInPlace { reason: why },
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

pub fn set_aside<T>(path: &Path, reason: String) -> ReadOutcome<T> {
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
        // Gone between the read and the move: another program moved or removed it.
        Err(e) if e.kind() == std::io::ErrorKind::NotFound => ReadOutcome::LeftInPlace {
            reason: format!("{reason}; another program moved or removed it meanwhile"),
        },
        // Could not move it: left in place; the store then refuses to write it.
        Err(e) => ReadOutcome::LeftInPlace {
            reason: format!("{reason}; could not move it aside: {e}"),
        },
    }
}
