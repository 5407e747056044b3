//! Writing files whole or not at all, and the readers' re-exports (`reading.rs`).
//!
//! Every file the program writes (the app's three files, a card, a chart, an exported
//! locker) goes through `write_steps`: a temp file in the same folder, written, flushed
//! and synced, then renamed over the old one, and the folder synced. If anything fails
//! (a full disk, a size limit, a killed process) the old file is untouched.

use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

use serde::Serialize;

pub use super::reading::{
    Inspected, MAX_FILE_BYTES, ReadOutcome, TextReadError, WithinLimits, check_envelope,
    human_bytes, inspect_json, kept_aside, not_regular, one_line, open_regular, read_json,
    read_text, set_aside,
};

/// Bytes written in one step.
const CHUNK: usize = 16 * 1024;

/// The steps of a write, in order. A save interrupted before `Rename` leaves the old file.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum WriteStep {
    /// Create the temp file beside the target.
    CreateTemp,
    /// Write one chunk of the bytes (numbered from 0).
    Write(usize),
    /// Flush and sync the temp file.
    Sync,
    /// Rename the temp file over the target.
    Rename,
    /// Sync the folder, so that the rename itself is on the disk.
    SyncFolder,
}

/// How a write step ends early (tests simulate failures and kills with it).
#[derive(Debug)]
pub enum Interrupt {
    /// The step fails with this error; the temp file is removed.
    Fail(std::io::Error),
    /// The process dies here: nothing more happens, not even the clean-up.
    Kill,
}

/// Write `value` as pretty JSON, whole or not at all (`write_text`).
pub fn write_json<T: Serialize>(path: &Path, value: &T) -> std::io::Result<()> {
    let mut text = serde_json::to_string_pretty(value).map_err(std::io::Error::other)?;
    text.push('\n');
    write_text(path, &text)
}

/// Write `text` to `path` whole or not at all, even if the process is killed or two
/// processes write at once. On error `path` is untouched and the message says so.
pub fn write_text(path: &Path, text: &str) -> std::io::Result<()> {
    write_steps(path, text.as_bytes(), &mut |_| Ok(()))
}

/// Where a write to `path` goes: `path` itself, or the file a symbolic link at `path`
/// points to (the link stays a link; a link to nothing is refused).
pub fn write_target(path: &Path) -> std::io::Result<PathBuf> {
    let is_link = fs::symlink_metadata(path).is_ok_and(|m| m.file_type().is_symlink());
    if !is_link {
        return Ok(path.to_path_buf());
    }
    fs::canonicalize(path).map_err(|e| {
        let to = fs::read_link(path).map_or_else(|_| "?".to_string(), |t| t.display().to_string());
        std::io::Error::new(
            e.kind(),
            format!(
                "{} is a symbolic link to {to}, which cannot be reached ({e}); nothing was written",
                path.display()
            ),
        )
    })
}

/// The one writer. `before` is called before each step and may end the write there.
/// A target that exists but is not a regular file (a folder, a FIFO, a device) is
/// never replaced; a symbolic link is written through (its target is replaced, the link
/// kept); the folder must exist (none is created). The new file keeps the old one's
/// permissions. The temp file's name is unique to the writer; one left behind by a
/// killed writer is removed by a later write once it is ten minutes old.
pub fn write_steps(
    path: &Path,
    bytes: &[u8],
    before: &mut dyn FnMut(WriteStep) -> Result<(), Interrupt>,
) -> std::io::Result<()> {
    let target = write_target(path)?;
    let path = target.as_path();
    if let Some(kind) = not_regular(path) {
        return Err(std::io::Error::other(format!(
            "{} is {kind}, not a regular file; it was not replaced",
            path.display()
        )));
    }
    let dir = match path.parent() {
        Some(d) if !d.as_os_str().is_empty() => d,
        _ => Path::new("."),
    };
    let name = path.file_name().and_then(|n| n.to_str()).unwrap_or("data");
    let nanos = std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .map(|d| d.subsec_nanos())
        .unwrap_or(0);
    static WRITES: std::sync::atomic::AtomicU64 = std::sync::atomic::AtomicU64::new(0);
    let n = WRITES.fetch_add(1, std::sync::atomic::Ordering::Relaxed);
    if !dir.is_dir() {
        return Err(std::io::Error::new(
            std::io::ErrorKind::NotFound,
            format!(
                "the folder {} does not exist (no folder is created); nothing was written",
                dir.display()
            ),
        ));
    }
    let tmp = dir.join(format!(".{name}.{}-{nanos}-{n}.tmp", std::process::id()));
    let old = fs::metadata(path).ok();
    let existed = old.is_some();
    let written = (|| -> Result<(), Interrupt> {
        before(WriteStep::CreateTemp)?;
        let mut f = fs::OpenOptions::new()
            .write(true)
            .create_new(true)
            .open(&tmp)
            .map_err(Interrupt::Fail)?;
        // The replaced file's permissions (a private 600 locker stays private).
        if let Some(m) = &old {
            f.set_permissions(m.permissions())
                .map_err(Interrupt::Fail)?;
        }
        for (i, chunk) in bytes.chunks(CHUNK).enumerate() {
            before(WriteStep::Write(i))?;
            f.write_all(chunk).map_err(Interrupt::Fail)?;
        }
        before(WriteStep::Sync)?;
        f.flush().map_err(Interrupt::Fail)?;
        f.sync_all().map_err(Interrupt::Fail)?;
        drop(f);
        before(WriteStep::Rename)?;
        fs::rename(&tmp, path).map_err(Interrupt::Fail)
    })();
    match written {
        Ok(()) => {}
        Err(Interrupt::Kill) => {
            return Err(std::io::Error::other(
                "the write was stopped (simulated kill)",
            ));
        }
        Err(Interrupt::Fail(e)) => {
            let _ = fs::remove_file(&tmp);
            let kept = if existed {
                format!("{} is unchanged", path.display())
            } else {
                format!("no {name} was written")
            };
            return Err(std::io::Error::new(e.kind(), format!("{e}; {kept}")));
        }
    }
    // The new file is in place; syncing the folder makes the rename durable.
    match before(WriteStep::SyncFolder) {
        Ok(()) => {}
        Err(Interrupt::Kill) => {
            return Err(std::io::Error::other(
                "the write was stopped (simulated kill)",
            ));
        }
        Err(Interrupt::Fail(e)) => {
            return Err(std::io::Error::new(
                e.kind(),
                format!("{e} (syncing the folder; the new {name} is in place)"),
            ));
        }
    }
    if let Ok(d) = fs::File::open(dir) {
        let _ = d.sync_all();
    }
    remove_stale_temp_files(dir, name);
    Ok(())
}

/// Temp files of `name` older than ten minutes: left by a writer that was killed.
fn remove_stale_temp_files(dir: &Path, name: &str) {
    if let Some(ten_minutes_ago) =
        std::time::SystemTime::now().checked_sub(std::time::Duration::from_secs(600))
    {
        remove_temp_files_before(dir, name, ten_minutes_ago);
    }
}

/// Temp files of `name` in `dir` last changed before `before`. A writer that holds the
/// lock calls it with the time it took the lock: every such file was left by a writer
/// that was killed (a live one would still hold the lock).
pub fn remove_temp_files_before(dir: &Path, name: &str, before: std::time::SystemTime) {
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
            .is_ok_and(|t| t < before);
        if old {
            let _ = fs::remove_file(e.path());
        }
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
            (
                vec![b' '; MAX_FILE_BYTES as usize + 1],
                "the file is 1048577 bytes and the limit is 1 MB (1048576 bytes)",
            ),
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
