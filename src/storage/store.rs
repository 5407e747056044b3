//! The app's three files in one directory.

use std::collections::{HashMap, HashSet};
use std::path::{Path, PathBuf};
use std::time::SystemTime;

use super::atomic::{ReadOutcome, WithinLimits, read_json, set_aside, write_json};
use super::locker::LockerFile;
use super::settings::{FoundSettings, SETTINGS_SCHEMA, Settings};
use super::team_state::{TEAM_SCHEMA, TeamState};
use crate::i18n::tr_with;
use crate::plan::InputError;

mod locker_io;
pub use locker_io::{LockerRead, LockerState};

pub const LOCKER_FILE: &str = "locker.json";
pub const SETTINGS_FILE: &str = "settings.json";
pub const TEAM_FILE: &str = "last-team.json";

/// What loading found, for the app to show.
#[derive(Debug, Default, Clone, PartialEq)]
pub struct LoadReport {
    /// One line per file that was set aside, naming where it was kept.
    pub messages: Vec<String>,
    /// No settings file was found: this is a first launch.
    pub first_launch: bool,
    /// Some settings were reset to their defaults (the file as found was kept aside):
    /// the settings should be saved again.
    pub settings_repaired: bool,
}

/// Why a locker change was not made.
#[derive(Debug)]
pub enum LockerError {
    /// The change itself was refused (the message names the field).
    Input(InputError),
    /// The locker could not be locked, read or written (the message says why).
    Write(String),
}

impl std::fmt::Display for LockerError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            LockerError::Input(e) => write!(f, "{e}"),
            LockerError::Write(e) => write!(f, "{e}"),
        }
    }
}

/// Reads and writes the app's files. A file that could not be moved aside is never written.
#[derive(Debug)]
pub struct Store {
    dir: PathBuf,
    blocked: HashSet<&'static str>,
    /// Modification time of each file as last loaded or written by this store.
    seen: HashMap<&'static str, Option<SystemTime>>,
}

const FILES: [&str; 3] = [LOCKER_FILE, SETTINGS_FILE, TEAM_FILE];

pub struct Loaded {
    pub locker: LockerFile,
    pub settings: Settings,
    pub team: Option<TeamState>,
    pub report: LoadReport,
}

impl Store {
    pub fn new(dir: impl Into<PathBuf>) -> Self {
        Store {
            dir: dir.into(),
            blocked: HashSet::new(),
            seen: HashMap::new(),
        }
    }

    pub fn dir(&self) -> &Path {
        &self.dir
    }

    pub fn load(&mut self) -> Loaded {
        let mut report = LoadReport::default();
        let locker = self.read_locker(&mut report.messages).locker;
        let settings_path = self.dir.join(SETTINGS_FILE);
        report.first_launch = !settings_path.exists();
        let settings = self
            .take::<FoundSettings>(SETTINGS_FILE, SETTINGS_SCHEMA, "settings", &mut report)
            .map(|found| self.repair_settings(found, &mut report))
            .unwrap_or_default();
        let team = self.take(TEAM_FILE, TEAM_SCHEMA, "last team", &mut report);
        for name in FILES {
            self.remember(name);
        }
        Loaded {
            locker,
            settings,
            team,
            report,
        }
    }

    /// Path of one of the store's files.
    pub fn path_of(&self, name: &str) -> PathBuf {
        self.dir.join(name)
    }

    fn take<T: serde::de::DeserializeOwned + WithinLimits>(
        &mut self,
        name: &'static str,
        schema: u32,
        what: &str,
        report: &mut LoadReport,
    ) -> Option<T> {
        let path = self.dir.join(name);
        match read_json::<T>(&path, schema) {
            ReadOutcome::Missing => {
                self.blocked.remove(name);
                None
            }
            ReadOutcome::Loaded(v) => {
                self.blocked.remove(name);
                Some(v)
            }
            ReadOutcome::SetAside { kept_as, reason } => {
                self.blocked.remove(name);
                report
                    .messages
                    .push(unreadable(what, &reason, &kept_as.display(), false));
                None
            }
            ReadOutcome::LeftInPlace { reason } => {
                self.blocked.insert(name);
                report
                    .messages
                    .push(unreadable(what, &reason, &path.display(), true));
                None
            }
        }
    }

    /// Settings from the file's fields; a field that is not usable goes back to its
    /// default, and the file as it was is kept aside so nothing is lost.
    fn repair_settings(&mut self, found: FoundSettings, report: &mut LoadReport) -> Settings {
        let (settings, notes) = Settings::from_found(found);
        if notes.is_empty() {
            return settings;
        }
        let path = self.dir.join(SETTINGS_FILE);
        let kept = match set_aside::<()>(&path, String::new()) {
            ReadOutcome::SetAside { kept_as, .. } => {
                report.settings_repaired = true;
                tr_with(
                    "Some settings could not be used and went back to their defaults ({0}). The other settings were kept; the file as it was is kept as {1}.",
                    &[&notes.join("; "), &kept_as.display()],
                )
            }
            _ => {
                self.blocked.insert(SETTINGS_FILE);
                tr_with(
                    "Some settings could not be used and went back to their defaults ({0}). The other settings were kept; the file was left untouched and will not be overwritten.",
                    &[&notes.join("; ")],
                )
            }
        };
        report.messages.push(kept);
        settings
    }

    fn modified(&self, name: &str) -> Option<SystemTime> {
        std::fs::metadata(self.dir.join(name))
            .and_then(|m| m.modified())
            .ok()
    }

    fn remember(&mut self, name: &'static str) {
        let t = self.modified(name);
        self.seen.insert(name, t);
    }

    /// Keep the last-team file aside (it read, but no longer plans), so that the next
    /// save cannot overwrite it. Returns where it was kept.
    pub fn set_aside_team(&mut self, reason: &str) -> Option<PathBuf> {
        let path = self.dir.join(TEAM_FILE);
        match set_aside::<()>(&path, reason.to_string()) {
            ReadOutcome::SetAside { kept_as, .. } => Some(kept_as),
            _ => {
                self.blocked.insert(TEAM_FILE);
                None
            }
        }
    }

    /// Whether another program changed a file since this store last read or wrote it.
    pub fn changed_on_disk(&self) -> bool {
        FILES
            .iter()
            .any(|name| self.seen.get(name).copied().flatten() != self.modified(name))
    }

    fn save<T: serde::Serialize>(&mut self, name: &'static str, value: &T) -> Result<(), String> {
        if self.blocked.contains(name) {
            return Err(format!(
                "{name} is not saved: the unreadable file is kept in its place"
            ));
        }
        // The data folder is made on the first save (a file in its place is an error).
        std::fs::create_dir_all(&self.dir)
            .and_then(|()| write_json(&self.dir.join(name), value))
            .map_err(|e| format!("could not save {name}: {e}"))?;
        self.remember(name);
        Ok(())
    }

    pub fn save_locker(&mut self, locker: &LockerFile) -> Result<(), String> {
        self.save(LOCKER_FILE, locker)
    }
    pub fn save_settings(&mut self, settings: &Settings) -> Result<(), String> {
        self.save(SETTINGS_FILE, settings)
    }
    pub fn save_team(&mut self, team: &TeamState) -> Result<(), String> {
        self.save(TEAM_FILE, team)
    }
}

/// The message for a file that could not be read: kept aside under another name, or
/// left where it is (`untouched`, at `at`). One whole sentence per file kind.
fn unreadable(what: &str, reason: &str, at: &dyn std::fmt::Display, untouched: bool) -> String {
    let args: [&dyn std::fmt::Display; 2] = [&reason, at];
    match (what, untouched) {
        ("settings", true) => tr_with(
            "The settings file could not be read ({0}). {1} was left untouched and will not be overwritten.",
            &args,
        ),
        ("settings", false) => tr_with(
            "The settings file could not be read ({0}). It was kept as {1} and Turnsheet carries on without it.",
            &args,
        ),
        ("last team", true) => tr_with(
            "The last team file could not be read ({0}). {1} was left untouched and will not be overwritten.",
            &args,
        ),
        ("last team", false) => tr_with(
            "The last team file could not be read ({0}). It was kept as {1} and Turnsheet carries on without it.",
            &args,
        ),
        (_, true) => tr_with(
            "The cylinder locker file could not be read ({0}). {1} was left untouched and will not be overwritten.",
            &args,
        ),
        (_, false) => tr_with(
            "The cylinder locker file could not be read ({0}). It was kept as {1} and Turnsheet carries on without it.",
            &args,
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn corrupt_locker_is_kept_and_defaults_load() {
        let dir = tempfile::tempdir().unwrap();
        std::fs::write(dir.path().join(LOCKER_FILE), "[[[").unwrap();
        let mut store = Store::new(dir.path());
        let loaded = store.load();
        assert!(loaded.locker.entries.is_empty());
        assert!(loaded.report.first_launch);
        assert_eq!(loaded.report.messages.len(), 1);
        assert!(loaded.report.messages[0].contains("cylinder locker"));
        let kept = super::super::atomic::kept_aside(dir.path(), LOCKER_FILE);
        assert_eq!(kept.len(), 1);
        assert_eq!(std::fs::read_to_string(&kept[0]).unwrap(), "[[[");
        // Saving afterwards writes a fresh file and leaves the kept copy alone.
        store.save_locker(&LockerFile::default()).unwrap();
        assert_eq!(std::fs::read_to_string(&kept[0]).unwrap(), "[[[");
    }
}
