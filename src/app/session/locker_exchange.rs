//! Locker page: "Export locker" and "Import sets", so that two divers can swap sets.
//! There is no file dialog: export writes a new file into a stated folder, import reads
//! every locker file in another stated folder. The message says what happened.

use std::path::{Path, PathBuf};

use crate::storage::data_dir;
use crate::storage::exchange::{EXPORT_NAME, export_locker, free_path, import_locker, sets_word};

use super::Session;

/// The two folders, and the last message about them.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct Exchange {
    pub export_dir: PathBuf,
    pub import_dir: PathBuf,
    /// What the last export or import did; empty once dismissed.
    pub message: String,
}

impl Exchange {
    pub fn for_data_dir(dir: &Path) -> Self {
        Exchange {
            export_dir: data_dir::export_dir(dir),
            import_dir: data_dir::import_dir(dir),
            message: String::new(),
        }
    }

    /// The line under the buttons: where files go and come from.
    pub fn hint(&self) -> String {
        format!(
            "Export writes a new file into {}. To import, put the other diver's exported file (any name ending in .json) into {} and press Import sets; imported files move to its \"imported\" folder.",
            self.export_dir.display(),
            self.import_dir.display()
        )
    }
}

impl Session {
    /// Write the whole locker to a new file; never replaces one.
    pub fn locker_export(&mut self) {
        let n = self.locker.entries().len();
        if n == 0 {
            self.exchange.message = "The locker is empty: nothing to export.".to_string();
            return;
        }
        let file = free_path(&self.exchange.export_dir, EXPORT_NAME);
        self.exchange.message = match export_locker(&self.locker.file, &file) {
            Ok(()) => format!(
                "Exported {} to {}. Give that file to the other diver.",
                sets_word(n),
                file.display()
            ),
            Err(e) => format!("Not exported: {e}."),
        };
    }

    /// Merge every `.json` file in the import folder into the locker, then move each file
    /// read into `imported/`, so that the next import does not read it again.
    pub fn locker_import(&mut self) {
        let dir = self.exchange.import_dir.clone();
        let _ = std::fs::create_dir_all(&dir);
        let mut files: Vec<PathBuf> = std::fs::read_dir(&dir)
            .map(|rd| {
                rd.filter_map(|e| e.ok().map(|e| e.path()))
                    .filter(|p| p.is_file() && p.extension().is_some_and(|x| x == "json"))
                    .collect()
            })
            .unwrap_or_default();
        files.sort();
        if files.is_empty() {
            self.exchange.message = format!(
                "No locker file to import. Put the other diver's exported file into {}, then press Import sets again.",
                dir.display()
            );
            return;
        }
        let mut lines = Vec::new();
        let mut changed = false;
        for file in &files {
            let shown = file.file_name().unwrap_or_default().to_string_lossy();
            match import_locker(&self.locker.file, file) {
                Ok((merged, report)) => {
                    lines.push(format!("From {shown}:"));
                    for n in &report.added {
                        lines.push(format!("added {n}"));
                    }
                    for (from, to) in &report.renamed {
                        lines.push(format!(
                            "renamed {from} → {to} (a different set has that name)"
                        ));
                    }
                    for (n, why) in &report.skipped {
                        lines.push(format!("skipped {n}: {why}"));
                    }
                    lines.push(report.summary(merged.entries.len()));
                    changed |= report.changed();
                    self.locker.file = merged;
                    lines.extend(move_aside(&dir, file));
                }
                Err(e) => lines.push(format!("Not imported: {e}")),
            }
        }
        if changed {
            self.save_locker();
        }
        self.exchange.message = lines.join("\n");
    }

    pub fn dismiss_exchange_message(&mut self) {
        self.exchange.message.clear();
    }
}

/// Move an imported file into `dir/imported/`; a line if that failed.
fn move_aside(dir: &Path, file: &Path) -> Option<String> {
    let done = dir.join("imported");
    let name = file.file_name()?.to_string_lossy().to_string();
    let moved = std::fs::create_dir_all(&done)
        .and_then(|()| std::fs::rename(file, free_path(&done, &name)));
    moved
        .err()
        .map(|e| format!("{name} could not be moved to {}: {e}", done.display()))
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
