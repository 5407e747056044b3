//! The locker's reads and changes: a read changes nothing unless the file needs it, and
//! every write (a change, a repair, a file set aside) happens under the lock beside it.

use std::path::{Path, PathBuf};
use std::time::SystemTime;

use super::super::atomic::{
    Inspected, ReadOutcome, inspect_json, kept_aside, read_json, remove_temp_files_before,
    write_target,
};
use super::super::lock::{FileLock, LOCK_WAIT, lock_beside};
use super::super::locker::{LOCKER_SCHEMA, LockerFile};
use super::{LOCKER_FILE, LockerError, Store, unreadable};
use crate::plan::InputError;

/// What state the locker file was found in.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum LockerState {
    /// No locker file yet.
    Missing,
    /// Read (and repaired if it needed it).
    Read,
    /// Its content was not usable: it was moved aside this time (the message says where).
    SetAside,
    /// It could not be read for another reason (permissions, I/O, not a regular file) and
    /// is left where it is; it is never written over.
    Unreadable,
}

/// The locker as a command found it.
#[derive(Debug)]
pub struct LockerRead {
    pub locker: LockerFile,
    pub state: LockerState,
    /// Lines to show (set aside, left in place, repaired), for `load_locker`.
    pub messages: Vec<String>,
}

impl LockerRead {
    fn new(locker: LockerFile, state: LockerState) -> Self {
        LockerRead {
            locker,
            state,
            messages: Vec::new(),
        }
    }

    /// Whether the locker could not be used this time (set aside or left in place).
    pub fn unreadable(&self) -> bool {
        matches!(self.state, LockerState::SetAside | LockerState::Unreadable)
    }
}

impl Store {
    /// Load only the locker (the command line's `locker` commands). An unreadable locker
    /// is set aside as in `load`; the messages say where it went.
    pub fn load_locker(&mut self) -> LockerRead {
        let mut messages = Vec::new();
        let mut found = self.read_locker(&mut messages);
        found.messages = messages;
        self.remember(LOCKER_FILE);
        found
    }

    /// The locker as found. Reading changes nothing on disk unless the file needs it: an
    /// unusable file is set aside, or repeated ids are renumbered (`LockerFile::repair`)
    /// and written back, so that it is said once. Either is done only under the lock,
    /// after reading the file again (another writer may have changed it meanwhile); if
    /// the lock cannot be had, nothing is written and the repaired copy is only used.
    pub(super) fn read_locker(&mut self, messages: &mut Vec<String>) -> LockerRead {
        let path = self.dir.join(LOCKER_FILE);
        match inspect_json::<LockerFile>(&path, LOCKER_SCHEMA) {
            Inspected::Missing => {
                self.blocked.remove(LOCKER_FILE);
                return LockerRead::new(LockerFile::default(), LockerState::Missing);
            }
            Inspected::Unavailable(reason) => {
                return self.left_in_place(messages, &path, &reason);
            }
            Inspected::Loaded(mut locker) => {
                if locker.repair().is_empty() {
                    self.blocked.remove(LOCKER_FILE);
                    return LockerRead::new(locker, LockerState::Read);
                }
            }
            Inspected::BadContent(_) => {}
        }
        let lock = match self.lock_locker() {
            Ok(lock) => lock,
            Err(e) => {
                // Not repaired on disk now: the next command that gets the lock does it.
                messages.push(e);
                return match inspect_json::<LockerFile>(&path, LOCKER_SCHEMA) {
                    Inspected::Loaded(mut locker) => {
                        locker.repair();
                        LockerRead::new(locker, LockerState::Read)
                    }
                    _ => {
                        self.blocked.insert(LOCKER_FILE);
                        LockerRead::new(LockerFile::default(), LockerState::Unreadable)
                    }
                };
            }
        };
        let found = self.read_locker_locked(messages);
        drop(lock);
        found
    }

    /// `read_locker` for a caller that holds the lock: sets aside and repairs at once.
    fn read_locker_locked(&mut self, messages: &mut Vec<String>) -> LockerRead {
        let path = self.dir.join(LOCKER_FILE);
        let mut locker = match read_json::<LockerFile>(&path, LOCKER_SCHEMA) {
            ReadOutcome::Missing => {
                self.blocked.remove(LOCKER_FILE);
                return LockerRead::new(LockerFile::default(), LockerState::Missing);
            }
            ReadOutcome::LeftInPlace { reason } => {
                return self.left_in_place(messages, &path, &reason);
            }
            ReadOutcome::SetAside { kept_as, reason } => {
                self.blocked.remove(LOCKER_FILE);
                messages.push(unreadable(
                    "cylinder locker",
                    &reason,
                    &kept_as.display(),
                    false,
                ));
                return LockerRead::new(LockerFile::default(), LockerState::SetAside);
            }
            ReadOutcome::Loaded(locker) => locker,
        };
        self.blocked.remove(LOCKER_FILE);
        let said = locker.repair();
        if !said.is_empty() {
            messages.extend(said);
            if let Err(e) = self.save(LOCKER_FILE, &locker) {
                messages.push(e);
            }
        }
        LockerRead::new(locker, LockerState::Read)
    }

    /// A locker that cannot be read for a reason other than its content: never written.
    fn left_in_place(
        &mut self,
        messages: &mut Vec<String>,
        path: &Path,
        reason: &str,
    ) -> LockerRead {
        self.blocked.insert(LOCKER_FILE);
        messages.push(unreadable("cylinder locker", reason, &path.display(), true));
        LockerRead::new(LockerFile::default(), LockerState::Unreadable)
    }

    /// Take the locker's lock; stale temp files of killed writers are removed under it.
    fn lock_locker(&self) -> Result<FileLock, String> {
        let path = self.dir.join(LOCKER_FILE);
        let lock = lock_beside(&path, LOCK_WAIT)
            .map_err(|e| format!("could not save {LOCKER_FILE}: {e}"))?;
        let since = SystemTime::now();
        if let Ok(target) = write_target(&path)
            && let (Some(dir), Some(name)) = (target.parent(), target.file_name())
        {
            remove_temp_files_before(dir, &name.to_string_lossy(), since);
        }
        Ok(lock)
    }

    /// The locker again (the app, when another program changed it): the locker, whether
    /// the file was read (not missing, not set aside), and lines to show.
    pub fn reload_locker(&mut self) -> (LockerFile, bool, Vec<String>) {
        let mut messages = Vec::new();
        let found = self.read_locker(&mut messages);
        self.remember(LOCKER_FILE);
        (found.locker, found.state == LockerState::Read, messages)
    }

    /// Lockers set aside as unreadable, in this store's folder (oldest name first).
    pub fn kept_aside_lockers(&self) -> Vec<PathBuf> {
        kept_aside(&self.dir, LOCKER_FILE)
    }

    /// Whether another program changed the locker since this store last read or wrote it.
    pub fn locker_changed_on_disk(&self) -> bool {
        self.seen.get(LOCKER_FILE).copied().flatten() != self.modified(LOCKER_FILE)
    }

    /// Change the locker safely against other writers: take the lock beside it, read it
    /// again, apply `change` to what was read, and write it atomically if it changed.
    /// Lines to show (a file set aside, ids repaired) go to `messages`, even on error.
    /// `change` is also told whether the file was read (not missing, not set aside).
    /// A locker that cannot be read for a reason other than its content (permissions,
    /// an I/O error, not a regular file) is not changed at all.
    /// Returns the locker as written (or as found, if `change` left it alone).
    pub fn update_locker<R>(
        &mut self,
        messages: &mut Vec<String>,
        change: impl FnOnce(&mut LockerFile, bool) -> Result<R, InputError>,
    ) -> Result<(R, LockerFile), LockerError> {
        let path = self.dir.join(LOCKER_FILE);
        let _lock = self.lock_locker().map_err(LockerError::Write)?;
        let found = self.read_locker_locked(messages);
        if found.state == LockerState::Unreadable {
            return Err(LockerError::Write(format!(
                "{LOCKER_FILE} was not changed: it could not be read, and is never written over"
            )));
        }
        let read = found.state == LockerState::Read;
        let found = found.locker;
        let mut locker = found.clone();
        let r = change(&mut locker, read).map_err(LockerError::Input)?;
        if locker != found || !path.exists() {
            self.save(LOCKER_FILE, &locker)
                .map_err(LockerError::Write)?;
        } else {
            self.remember(LOCKER_FILE);
        }
        Ok((r, locker))
    }
}
