//! Saving, and what the person is told while changes are not saved.
//!
//! Every edit is kept in memory. A save that fails (a read-only folder, a full disk)
//! marks that file unsaved with the reason; every later save writes it again, and the
//! banner above the pages stays until it is written. Closing the window while a file is
//! unsaved asks first (`Prompt::Close`).

use std::collections::BTreeMap;

use super::super::nav::Screen;
use super::Session;

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
    /// The reasons, one per file, joined.
    pub fn reasons(&self) -> String {
        self.failed.values().cloned().collect::<Vec<_>>().join("; ")
    }
}

/// A question shown over the page until it is answered.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub enum Prompt {
    #[default]
    None,
    /// The window is closing with unsaved changes: close anyway, try again, stay.
    Close,
    /// Leaving the locker editor with changes: keep editing, discard.
    Discard,
}

/// An answer to a prompt: its text, accessible label, and whether it is the one to stress.
pub type Answer = (&'static str, &'static str, bool);

/// What the window must do after an answer.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum AfterPrompt {
    Stay,
    CloseWindow,
}

impl Session {
    /// Write everything (used on Android lifecycle events and when the window closes).
    pub fn save_all(&mut self) {
        for f in ALL_FILES {
            self.write(f);
        }
    }
    pub fn save_team(&mut self) {
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
            SavedFile::Locker => self.store.save_locker(&self.locker.file),
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
        format!(
            "Not saved to {}: {}. Your changes are kept while Turnsheet is open and saved with your next change.",
            self.store.dir().display(),
            self.unsaved.reasons()
        )
    }

    /// The window is asked to close: save, and say whether it may close now. With
    /// changes that could not be saved, the close prompt opens instead.
    pub fn close_requested(&mut self) -> bool {
        self.save_all();
        if self.all_saved() {
            true
        } else {
            self.prompt = Prompt::Close;
            false
        }
    }

    /// Back from the locker editor: asks once when the draft was changed.
    pub(super) fn leave_locker_edit(&mut self) -> bool {
        if self.locker.draft_changed() {
            self.prompt = Prompt::Discard;
            return true;
        }
        self.locker.drop_draft();
        self.nav.back()
    }

    /// The question on screen and its answers (text, accessible label, the one to
    /// stress).
    pub fn prompt_text(&self) -> Option<(String, Vec<Answer>)> {
        match self.prompt {
            Prompt::None => None,
            Prompt::Close => Some((
                format!(
                    "Your last changes could not be saved to {}: {}. Closing now loses them.",
                    self.store.dir().display(),
                    self.unsaved.reasons()
                ),
                vec![
                    ("Close anyway", "close anyway", false),
                    ("Try again", "try again", true),
                    ("Stay", "stay", false),
                ],
            )),
            Prompt::Discard => {
                let name = self
                    .locker
                    .draft()
                    .map(|d| d.name.trim().to_string())
                    .filter(|n| !n.is_empty())
                    .unwrap_or_else(|| "the new set".to_string());
                Some((
                    format!("Discard changes to {name}?"),
                    vec![
                        ("Keep editing", "keep editing", true),
                        ("Discard", "discard changes", false),
                    ],
                ))
            }
        }
    }

    /// The answer at `idx` of `prompt_text`'s list.
    pub fn answer_prompt(&mut self, idx: usize) -> AfterPrompt {
        let prompt = std::mem::take(&mut self.prompt);
        match (prompt, idx) {
            (Prompt::Close, 0) => AfterPrompt::CloseWindow,
            (Prompt::Close, 1) => {
                if self.close_requested() {
                    AfterPrompt::CloseWindow
                } else {
                    AfterPrompt::Stay
                }
            }
            (Prompt::Discard, 1) => {
                self.locker.drop_draft();
                if self.nav.current() == Screen::LockerEdit {
                    self.nav.back();
                }
                AfterPrompt::Stay
            }
            _ => AfterPrompt::Stay,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    /// A data directory that cannot be written, even by root: its parent is a file.
    fn unwritable(tmp: &tempfile::TempDir) -> std::path::PathBuf {
        let blocker = tmp.path().join("blocker");
        std::fs::write(&blocker, "a file, not a folder").unwrap();
        blocker.join("data")
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

    #[test]
    fn closing_with_unsaved_changes_asks_first() {
        let tmp = tempfile::tempdir().unwrap();
        let dir = tmp.path().join("data");
        let mut s = Session::open(Store::new(&dir));
        assert!(s.close_requested(), "all saved: close at once");
        let mut s = Session::open(Store::new(unwritable(&tmp)));
        s.acknowledge_cautions();
        assert!(!s.close_requested());
        assert_eq!(s.prompt, Prompt::Close);
        let (text, answers) = s.prompt_text().unwrap();
        assert!(text.starts_with("Your last changes could not be saved to"));
        assert!(text.contains("blocker"), "names the folder: {text}");
        assert_eq!(answers.len(), 3);
        assert_eq!(s.answer_prompt(2), AfterPrompt::Stay, "Stay");
        assert_eq!(s.prompt, Prompt::None);
        assert!(!s.close_requested());
        assert_eq!(s.answer_prompt(1), AfterPrompt::Stay, "Try again: fails");
        assert_eq!(s.prompt, Prompt::Close, "and asks again");
        assert_eq!(s.answer_prompt(0), AfterPrompt::CloseWindow, "Close anyway");
    }

    #[test]
    fn leaving_a_changed_locker_edit_asks_once() {
        let tmp = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(tmp.path()));
        s.acknowledge_cautions();
        s.go(Screen::Locker);
        s.locker_copy_preset(0);
        assert!(s.back(), "unchanged: leaves without asking");
        assert_eq!(s.page(), Screen::Locker);
        assert_eq!(s.prompt, Prompt::None);

        s.locker_copy_preset(0);
        s.locker.edit_draft(|d| d.name = "Cave twins".into());
        assert!(s.back());
        assert_eq!(s.prompt, Prompt::Discard);
        assert_eq!(s.page(), Screen::LockerEdit);
        assert_eq!(s.prompt_text().unwrap().0, "Discard changes to Cave twins?");
        // Back again answers "keep editing": one question, not a second one.
        assert!(s.back());
        assert_eq!(s.prompt, Prompt::None);
        assert_eq!(s.page(), Screen::LockerEdit);
        assert!(s.locker.draft().is_some());
        assert!(s.back());
        assert_eq!(s.answer_prompt(0), AfterPrompt::Stay, "Keep editing");
        assert_eq!(s.locker.draft().unwrap().name, "Cave twins");
        assert!(s.back());
        assert_eq!(s.answer_prompt(1), AfterPrompt::Stay, "Discard");
        assert!(s.locker.draft().is_none());
        assert_eq!(s.page(), Screen::Locker);
        assert!(s.locker.entries().is_empty(), "nothing was saved");
    }
}
