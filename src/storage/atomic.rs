//! Atomic JSON files with a schema version, and quarantine of unreadable files.

use std::fs;
use std::io::Write;
use std::path::{Path, PathBuf};

use serde::Serialize;
use serde::de::DeserializeOwned;

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

/// Write `value` as pretty JSON: to a temp file in the same directory, synced, then renamed.
pub fn write_json<T: Serialize>(path: &Path, value: &T) -> std::io::Result<()> {
    let dir = path.parent().unwrap_or_else(|| Path::new("."));
    fs::create_dir_all(dir)?;
    let text = serde_json::to_string_pretty(value).map_err(std::io::Error::other)?;
    let tmp = dir.join(format!(
        ".{}.tmp",
        path.file_name().and_then(|n| n.to_str()).unwrap_or("data")
    ));
    {
        let mut f = fs::File::create(&tmp)?;
        f.write_all(text.as_bytes())?;
        f.write_all(b"\n")?;
        f.sync_all()?;
    }
    fs::rename(&tmp, path)?;
    if let Ok(d) = fs::File::open(dir) {
        let _ = d.sync_all();
    }
    Ok(())
}

/// A versioned envelope: `{"schema": N, ...payload}` is read through `parse`.
/// Unreadable files (bad JSON, wrong shape, newer schema) are renamed aside.
pub fn read_json<T: DeserializeOwned>(path: &Path, max_schema: u32) -> ReadOutcome<T> {
    let text = match fs::read_to_string(path) {
        Ok(t) => t,
        Err(e) if e.kind() == std::io::ErrorKind::NotFound => return ReadOutcome::Missing,
        Err(e) => return set_aside(path, format!("cannot read: {e}")),
    };
    let schema = serde_json::from_str::<serde_json::Value>(&text)
        .ok()
        .and_then(|v| v.get("schema").and_then(|s| s.as_u64()));
    match schema {
        Some(s) if s > u64::from(max_schema) => {
            return set_aside(
                path,
                format!(
                    "written by a newer version (schema {s}; this version reads up to {max_schema})"
                ),
            );
        }
        None => {}
        _ => {}
    }
    match serde_json::from_str::<T>(&text) {
        Ok(v) => ReadOutcome::Loaded(v),
        Err(e) => set_aside(path, e.to_string()),
    }
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
        assert!(!dir.path().join(".a.json.tmp").exists());
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
}
