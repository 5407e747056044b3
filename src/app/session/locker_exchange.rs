//! Locker page: "Export locker" and "Import sets", so that two divers can swap sets.
//! There is no file dialog: export writes a new file into a stated folder, import reads
//! every locker file in another stated folder. The message says what happened.

use std::path::{Path, PathBuf};

use crate::i18n::{tr, tr_n, tr_with};
use crate::storage::data_dir;
use crate::storage::exchange::{EXPORT_NAME, export_locker, free_path, import_locker};

use super::{SavedFile, Session};

/// The two folders, and the last message about them.
#[derive(Clone, Debug, Default)]
pub struct Exchange {
    pub export_dir: PathBuf,
    pub import_dir: PathBuf,
    /// Where the Turns page saves team cards: `<data dir>/cards` unless the platform
    /// start sets the user's folder (`storage::data_dir::user_card_dir`).
    pub card_dir: PathBuf,
    /// Where a saved card also goes where its owner can open it, when the platform has
    /// such a place of its own (Android: Downloads through the media store). It gets the
    /// file name, the MIME type and the bytes, and gives back the place in words.
    pub publish_card: Option<PublishFile>,
    /// What the last export or import did; empty once dismissed.
    pub message: String,
}

/// A platform's way to put a file where its owner can open it (see
/// `Exchange::publish_card`).
pub type PublishFile = fn(&str, &str, &[u8]) -> Result<String, String>;

impl Exchange {
    pub fn for_data_dir(dir: &Path) -> Self {
        Exchange {
            export_dir: data_dir::export_dir(dir),
            import_dir: data_dir::import_dir(dir),
            card_dir: data_dir::data_card_dir(dir),
            publish_card: None,
            message: String::new(),
        }
    }

    /// The line under the buttons: where files go and come from.
    pub fn hint(&self) -> String {
        tr_with(
            "Export writes a new file into {0}. To import, put the other diver's exported file (any name ending in .json) into {1} and press Import sets; imported files move to its \"imported\" folder.",
            &[&self.export_dir.display(), &self.import_dir.display()],
        )
    }
}

impl Session {
    /// Write the whole locker to a new file; never replaces one.
    pub fn locker_export(&mut self) {
        let n = self.locker.entries().len();
        if n == 0 {
            self.exchange.message = tr("The locker is empty: nothing to export.");
            return;
        }
        let file = free_path(&self.exchange.export_dir, EXPORT_NAME);
        self.exchange.message = match export_locker(&self.locker.file, &file) {
            Ok(()) => tr_n(
                "Exported {n} set to {0}. Give that file to the other diver.",
                "Exported {n} sets to {0}. Give that file to the other diver.",
                n as u64,
                &[&file.display()],
            ),
            Err(e) => tr_with("Not exported: {0}.", &[&e]),
        };
    }

    /// Merge every `.json` file in the import folder into the locker, save, and only
    /// then move each file read into `imported/`, so that the next import does not read
    /// it again. A file that fails, or a save that fails, leaves the files where they
    /// were. Symbolic links are never followed: a link in the folder is not read, and an
    /// import folder (or `imported/`) that is a link is not used.
    pub fn locker_import(&mut self) {
        let dir = self.exchange.import_dir.clone();
        let _ = std::fs::create_dir_all(&dir);
        if let Some(why) = linked_folder(&dir) {
            self.exchange.message = tr_with("Nothing imported: {0}.", &[&why]);
            return;
        }
        let mut lines = Vec::new();
        let mut files = Vec::new();
        for (path, is_link) in json_files(&dir) {
            let shown = path
                .file_name()
                .unwrap_or_default()
                .to_string_lossy()
                .to_string();
            if is_link {
                lines.push(tr_with(
                    "Not imported: {0} is a symbolic link; put the file itself into the folder.",
                    &[&shown],
                ));
            } else {
                files.push(path);
            }
        }
        if files.is_empty() && lines.is_empty() {
            self.exchange.message = tr_with(
                "No locker file to import. Put the other diver's exported file into {0}, then press Import sets again.",
                &[&dir.display()],
            );
            return;
        }
        let mut changed = false;
        let mut read = Vec::new();
        for file in &files {
            let shown = file.file_name().unwrap_or_default().to_string_lossy();
            match import_locker(&self.locker.file, file) {
                Ok((merged, report)) => {
                    lines.push(tr_with("From {0}:", &[&shown]));
                    for n in &report.added {
                        lines.push(tr_with("added {0}", &[n]));
                    }
                    for (from, to) in &report.renamed {
                        lines.push(tr_with(
                            "renamed {0} → {1} (a different set has that name)",
                            &[from, to],
                        ));
                    }
                    for (n, why) in &report.skipped {
                        lines.push(tr_with("skipped {0}: {1}", &[n, why]));
                    }
                    lines.push(report.summary(merged.entries.len()));
                    changed |= report.changed();
                    self.locker.file = merged;
                    read.push(file.clone());
                }
                Err(e) => lines.push(tr_with("Not imported: {0}", &[&e])),
            }
        }
        // Saved before any file moves (writing only if something changed; an earlier
        // import that could not be saved is saved now).
        if changed || self.unsaved.files().contains(&SavedFile::Locker) {
            self.save_locker();
        }
        if self.unsaved.files().contains(&SavedFile::Locker) {
            lines.push(tr_with(
                "The locker could not be saved, so the files stay in {0} (importing them again adds nothing twice).",
                &[&dir.display()],
            ));
        } else {
            for file in &read {
                lines.extend(move_aside(&dir, file));
            }
        }
        self.exchange.message = lines.join("\n");
    }

    pub fn dismiss_exchange_message(&mut self) {
        self.exchange.message.clear();
    }
}

/// The `.json` entries of `dir` (any case: `.JSON` too), sorted, each with whether it is a symbolic link (never
/// followed). Folders and other non-files are left out.
fn json_files(dir: &Path) -> Vec<(PathBuf, bool)> {
    let mut found: Vec<(PathBuf, bool)> = std::fs::read_dir(dir)
        .map(|rd| {
            rd.filter_map(|e| e.ok())
                .filter(|e| crate::storage::exchange::is_json_file_name(&e.path()))
                .filter_map(|e| {
                    let t = e.file_type().ok()?;
                    (t.is_file() || t.is_symlink()).then(|| (e.path(), t.is_symlink()))
                })
                .collect()
        })
        .unwrap_or_default();
    found.sort();
    found
}

/// Why `dir` may not be used, if it is a symbolic link.
fn linked_folder(dir: &Path) -> Option<String> {
    let link = std::fs::symlink_metadata(dir)
        .ok()?
        .file_type()
        .is_symlink();
    link.then(|| {
        tr_with(
            "{0} is a symbolic link; Turnsheet only uses folders inside its data folder",
            &[&dir.display()],
        )
    })
}

/// Move an imported file into `dir/imported/`; a line if that failed.
fn move_aside(dir: &Path, file: &Path) -> Option<String> {
    let done = dir.join("imported");
    let name = file.file_name()?.to_string_lossy().to_string();
    if let Some(why) = linked_folder(&done) {
        return Some(tr_with("{0} was left where it is: {1}.", &[&name, &why]));
    }
    let moved = std::fs::create_dir_all(&done)
        .and_then(|()| std::fs::rename(file, free_path(&done, &name)));
    moved.err().map(|e| {
        tr_with(
            "{0} could not be moved to {1}: {2}",
            &[&name, &done.display(), &e],
        )
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    fn session_with(dir: &Path, sets: &[(&str, f64)]) -> Session {
        let mut s = Session::open(Store::new(dir));
        s.acknowledge_cautions();
        for (name, litres) in sets {
            s.locker_new();
            s.locker.edit_draft(|d| {
                d.name = name.to_string();
                d.first = Some(*litres);
                d.second = Some(232.0);
            });
            s.locker_save().unwrap();
        }
        // The first set is theirs: marked mine on purpose (saving never does it).
        if let Some(id) = s.locker.entries().first().map(|e| e.id) {
            s.locker_make_mine(id);
        }
        s
    }

    #[test]
    fn two_divers_swap_sets_through_the_two_folders() {
        let tmp = tempfile::tempdir().unwrap();
        let shared = tmp.path().join("downloads");
        std::fs::create_dir(&shared).unwrap();
        let mut anna = session_with(
            &tmp.path().join("anna"),
            &[("Twelves", 12.0), ("Sevens", 7.0)],
        );
        anna.exchange.export_dir = shared.clone();
        anna.locker_export();
        let file = shared.join("turnsheet-locker.json");
        assert!(anna.exchange.message.contains(&*file.to_string_lossy()));
        anna.locker_export();
        assert!(
            shared.join("turnsheet-locker-2.json").exists(),
            "never replaced"
        );

        let mut ben = session_with(&tmp.path().join("ben"), &[("Sevens", 8.5)]);
        ben.locker_import();
        assert!(ben.exchange.message.starts_with("No locker file to import"));
        assert!(
            ben.exchange.import_dir.is_dir(),
            "the folder is made for the person"
        );
        std::fs::copy(&file, ben.exchange.import_dir.join("from-anna.json")).unwrap();
        std::fs::write(ben.exchange.import_dir.join("broken.json"), "{oops").unwrap();
        ben.locker_import();
        let m = ben.exchange.message.clone();
        assert!(m.contains("added Twelves"), "{m}");
        assert!(m.contains("renamed Sevens → Sevens (2)"), "{m}");
        assert!(m.contains("Not imported: FILE:"), "{m}");
        assert!(m.contains("broken.json"), "{m}");
        assert!(m.contains("the locker has 3 sets"), "{m}");
        let names: Vec<&str> = ben
            .locker
            .entries()
            .iter()
            .map(|e| e.name.as_str())
            .collect();
        assert_eq!(names, ["Sevens", "Twelves", "Sevens (2)"]);
        assert!(ben.locker.entries()[0].mine, "Ben's own set stays his");
        // Saved, and the imported file moved out of the way; the broken one stays.
        let reread = Session::open(Store::new(tmp.path().join("ben")));
        assert_eq!(reread.locker.entries().len(), 3);
        assert!(
            ben.exchange
                .import_dir
                .join("imported/from-anna.json")
                .exists()
        );
        assert!(ben.exchange.import_dir.join("broken.json").exists());
        // The same file again adds nothing.
        std::fs::copy(&file, ben.exchange.import_dir.join("again.json")).unwrap();
        ben.locker_import();
        assert!(
            ben.exchange.message.contains("0 added"),
            "{}",
            ben.exchange.message
        );
        assert_eq!(ben.locker.entries().len(), 3);
        ben.dismiss_exchange_message();
        assert_eq!(ben.exchange.message, "");
    }
}
