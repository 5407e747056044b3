//! Swapping cylinder sets between divers: a locker is exported to a file in the locker's
//! own format, and another diver imports it (merged by name, `LockerFile::merge`).
//! Used by the command line (`locker export|import`) and by the app's Locker page.

use std::path::{Path, PathBuf};

use super::atomic::write_json;
use super::locker::{LockerFile, read_locker_file};
use super::locker_merge::MergeReport;
use crate::i18n::{tr_n, tr_with};
use crate::plan::InputError;

/// The name the app gives an exported locker.
pub const EXPORT_NAME: &str = "turnsheet-locker.json";

/// `N set(s)`.
pub fn sets_word(n: usize) -> String {
    tr_n("{n} set", "{n} sets", n as u64, &[])
}

/// `dir/NAME.EXT` if no such file exists, else `dir/NAME-2.EXT`, `dir/NAME-3.EXT`...:
/// the first free name, so that nothing already there is replaced.
pub fn free_path(dir: &Path, file_name: &str) -> PathBuf {
    let (stem, ext) = match file_name.rsplit_once('.') {
        Some((s, e)) if !s.is_empty() => (s, format!(".{e}")),
        _ => (file_name, String::new()),
    };
    let first = dir.join(file_name);
    if !first.exists() {
        return first;
    }
    (2..)
        .map(|n| dir.join(format!("{stem}-{n}{ext}")))
        .find(|p| !p.exists())
        .unwrap_or(first)
}

/// Whether `path` names a JSON file: ends in `.json`, in any case (`.JSON` from a phone or
/// another system too).
pub fn is_json_file_name(path: &Path) -> bool {
    path.extension()
        .is_some_and(|x| x.eq_ignore_ascii_case("json"))
}

/// Write the locker to `file`, in the format `import_locker` reads.
pub fn export_locker(locker: &LockerFile, file: &Path) -> Result<(), String> {
    write_json(file, locker).map_err(|e| format!("could not write {}: {e}", file.display()))
}

/// Read a locker file and merge its sets into `own`: the merged locker (not yet saved)
/// and what happened to each set. Errors name the file and the field.
pub fn import_locker(
    own: &LockerFile,
    file: &Path,
) -> Result<(LockerFile, MergeReport), InputError> {
    let incoming = read_locker_file(file)?;
    own.merge(&incoming)
}

impl MergeReport {
    /// `N added (M of them renamed), K skipped; the locker has S sets.`
    pub fn summary(&self, sets_now: usize) -> String {
        tr_with(
            "{0} added ({1} of them renamed), {2} skipped; the locker has {3}.",
            &[
                &(self.added.len() + self.renamed.len()),
                &self.renamed.len(),
                &self.skipped.len(),
                &sets_word(sets_now),
            ],
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn json_files_are_found_in_any_case() {
        for yes in ["a.json", "B.JSON", "c.Json", "dir/x.jSoN"] {
            assert!(is_json_file_name(Path::new(yes)), "{yes}");
        }
        for no in ["a.txt", "json", "a.json.txt", "a.jsonl", ".json"] {
            assert!(!is_json_file_name(Path::new(no)), "{no}");
        }
    }

    #[test]
    fn free_path_never_replaces_a_file() {
        let dir = tempfile::tempdir().unwrap();
        let first = free_path(dir.path(), EXPORT_NAME);
        assert_eq!(first, dir.path().join("turnsheet-locker.json"));
        std::fs::write(&first, "x").unwrap();
        let second = free_path(dir.path(), EXPORT_NAME);
        assert_eq!(second, dir.path().join("turnsheet-locker-2.json"));
        std::fs::write(&second, "x").unwrap();
        assert_eq!(
            free_path(dir.path(), EXPORT_NAME),
            dir.path().join("turnsheet-locker-3.json")
        );
        assert_eq!(free_path(dir.path(), "noext"), dir.path().join("noext"));
    }

    #[test]
    fn an_export_imports_into_an_empty_locker_unchanged() {
        let dir = tempfile::tempdir().unwrap();
        let mut own = LockerFile::default();
        own.entries.push(crate::storage::locker::LockerEntry {
            id: 4,
            name: "Twin 12s".into(),
            cylinders: crate::formats::team_file::CylindersFile {
                count: 2,
                independent: false,
                water_l: Some(12.0),
                working_bar: Some(232.0),
                rated_cuft: None,
                rated_psi: None,
            },
            material: Default::default(),
            note: "tested 2026".into(),
            mine: true,
        });
        let file = dir.path().join(EXPORT_NAME);
        export_locker(&own, &file).unwrap();
        let (merged, report) = import_locker(&LockerFile::default(), &file).unwrap();
        assert_eq!(report.added, vec!["Twin 12s".to_string()]);
        assert_eq!(merged.entries[0].cylinders, own.entries[0].cylinders);
        assert!(!merged.entries[0].mine, "an imported set is never mine");
        assert_eq!(
            report.summary(merged.entries.len()),
            "1 added (0 of them renamed), 0 skipped; the locker has 1 set."
        );
        let e = import_locker(&own, &dir.path().join("missing.json")).unwrap_err();
        assert!(e.message.contains("missing.json"), "{e}");
    }
}
