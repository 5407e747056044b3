//! Saving, and what the person is told while changes are not saved.
//!
//! Every edit is kept in memory. A save that fails (a read-only folder, a full disk)
//! marks that file unsaved with the reason; every later save writes it again, and the
//! banner above the pages stays until it is written. Closing the window while a file is
//! unsaved asks first (`prompts.rs`).

use std::collections::BTreeMap;

use super::Session;
use crate::i18n::tr_with;

/// The app's three files.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord)]
pub enum SavedFile {
    Team,
    Locker,
    Settings,
}

const ALL_FILES: [SavedFile; 3] = [SavedFile::Team, SavedFile::Locker, SavedFile::Settings];

/// The files whose last save failed, with the reason.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct Unsaved {
    failed: BTreeMap<SavedFile, String>,
}

impl Unsaved {
    pub fn record(&mut self, file: SavedFile, result: Result<(), String>) {
        match result {
            Ok(()) => {
                self.failed.remove(&file);
            }
            Err(why) => {
                self.failed.insert(file, why);
            }
        }
    }
    pub fn is_empty(&self) -> bool {
        self.failed.is_empty()
    }
    pub fn files(&self) -> Vec<SavedFile> {
        self.failed.keys().copied().collect()
    }
    /// The reasons, files with the same reason together: `last-team.json and
    /// settings.json: Permission denied (os error 13)`.
    pub fn reasons(&self) -> String {
        let mut groups: Vec<(Vec<&str>, &str)> = Vec::new();
        for why in self.failed.values() {
            let (file, rest) = why
                .strip_prefix("could not save ")
                .and_then(|x| x.split_once(": "))
                .unwrap_or(("", why.as_str()));
            match groups.iter_mut().find(|(_, r)| *r == rest) {
                Some((files, _)) => files.push(file),
                None => groups.push((vec![file], rest)),
            }
        }
        groups
            .into_iter()
            .map(|(files, rest)| {
                let files: Vec<&str> = files.into_iter().filter(|f| !f.is_empty()).collect();
                match files.as_slice() {
                    [] => rest.to_string(),
                    [one] => tr_with("{0}: {1}", &[one, &rest]),
                    [many @ .., last] => {
                        tr_with("{0} and {1}: {2}", &[&many.join(", "), last, &rest])
                    }
                }
            })
            .collect::<Vec<_>>()
            .join("; ")
    }
}

impl Session {
    /// Write everything (used on Android lifecycle events and when the window closes).
    pub fn save_all(&mut self) {
        for f in ALL_FILES {
            self.write(f);
        }
    }
    /// Save the team after a change: the change ends any Undo on offer (`save_all`,
    /// on lifecycle events, does not).
    pub fn save_team(&mut self) {
        self.undo = None;
        self.save(SavedFile::Team);
    }
    pub fn save_locker(&mut self) {
        self.save(SavedFile::Locker);
    }
    pub fn save_settings(&mut self) {
        self.save(SavedFile::Settings);
    }

    /// Write one file, and again every file whose last save failed: the edits are
    /// still in memory.
    fn save(&mut self, file: SavedFile) {
        self.write(file);
        for f in self.unsaved.files() {
            if f != file {
                self.write(f);
            }
        }
    }

    fn write(&mut self, file: SavedFile) {
        let r = match file {
            SavedFile::Team => self.store.save_team(&self.team.to_state()),
            SavedFile::Locker => self.write_locker(),
            SavedFile::Settings => self.store.save_settings(&self.settings),
        };
        self.unsaved.record(file, r);
    }

    /// Try every unsaved file again ("Try again").
    pub fn retry_saves(&mut self) {
        for f in self.unsaved.files() {
            self.write(f);
        }
    }

    /// Whether every change is on disk.
    pub fn all_saved(&self) -> bool {
        self.unsaved.is_empty()
    }

    /// Why changes are not saved, for the banner; empty when all is saved.
    pub fn unsaved_text(&self) -> String {
        if self.unsaved.is_empty() {
            return String::new();
        }
        tr_with(
            "Not saved to {0}: {1}. Your changes are kept while Turnsheet is open; your next change or Try again saves them.",
            &[&self.store.dir().display(), &self.unsaved.reasons()],
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    #[test]
    fn files_with_the_same_reason_are_named_together() {
        let mut u = Unsaved::default();
        let denied = "Permission denied (os error 13)";
        u.record(
            SavedFile::Team,
            Err(format!("could not save last-team.json: {denied}")),
        );
        u.record(
            SavedFile::Settings,
            Err(format!("could not save settings.json: {denied}")),
        );
        u.record(
            SavedFile::Locker,
            Err("locker.json is not saved: the unreadable file is kept in its place".into()),
        );
        assert_eq!(
            u.reasons(),
            format!(
                "last-team.json and settings.json: {denied}; locker.json is not saved: the unreadable file is kept in its place"
            )
        );
        u.record(SavedFile::Team, Ok(()));
        assert_eq!(u.files(), [SavedFile::Locker, SavedFile::Settings]);
    }

    #[test]
    fn a_failed_save_is_kept_and_retried_until_it_succeeds() {
        let tmp = tempfile::tempdir().unwrap();
        let good = tmp.path().join("good");
        let mut s = Session::open(Store::new(&good));
        s.acknowledge_cautions();
        assert!(s.all_saved());
        // The folder becomes unusable: a file takes its place.
        std::fs::remove_dir_all(&good).unwrap();
        std::fs::write(&good, "not a folder").unwrap();
        s.set_default_rule(2);
        s.nudge_water_temp(1);
        assert!(!s.all_saved());
        let text = s.unsaved_text();
        assert!(text.contains("settings.json"), "{text}");
        assert!(text.contains("last-team.json"), "{text}");
        // Another edit does not clear it while the folder is still unusable.
        s.locker_new();
        s.locker.edit_draft(|d| {
            d.name = "Spare".into();
            d.first = Some(7.0);
            d.second = Some(232.0);
        });
        s.locker_save().unwrap();
        assert!(s.unsaved_text().contains("locker.json"));
        assert_eq!(s.status.iter().count(), 0, "no pile of one-off messages");
        // The folder is back: the next save writes every file, the banner goes.
        std::fs::remove_file(&good).unwrap();
        std::fs::create_dir(&good).unwrap();
        s.locker_make_mine(1);
        assert!(s.all_saved(), "{}", s.unsaved_text());
        assert_eq!(s.unsaved_text(), "");
        let again = Session::open(Store::new(&good));
        assert_eq!(again.settings.rule, s.settings.rule);
        assert_eq!(again.settings.water_temp_c, s.settings.water_temp_c);
        assert_eq!(again.locker.entries()[0].name, "Spare");
    }
}
