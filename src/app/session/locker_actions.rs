//! Session actions of the cylinder locker: open the editor, save, delete, undo, mine.
//! Changes to the open draft go straight to `LockerController::edit_draft`.
//!
//! The command line (or another window) may change the locker while the app is open.
//! Every save re-reads the file under its lock and merges this app's changes into it
//! (`merge_changes`): a set is removed only if it was removed here, and a set changed in
//! both places is kept twice, with a line saying so. Regaining focus or resuming
//! re-reads it too (`refresh_locker`).

use crate::i18n::tr_with;
use crate::plan::InputError;
use crate::plan::{Material, presets};
use crate::storage::locker_merge::merge_changes;
use crate::storage::store::LockerError;

use super::super::locker_controller::Added;
use super::super::nav::Screen;
use super::Session;

impl Session {
    pub fn locker_new(&mut self) {
        self.locker.start_new();
        self.nav.go(Screen::LockerEdit);
    }
    pub fn locker_edit(&mut self, id: u64) {
        self.locker.start_edit(id);
        if self.locker.draft().is_some() {
            self.nav.go(Screen::LockerEdit);
        }
    }
    pub fn locker_copy_preset(&mut self, idx: usize) {
        if let Some(p) = presets().get(idx) {
            self.locker.start_from_preset(p);
            self.nav.go(Screen::LockerEdit);
        }
    }
    pub fn locker_delete(&mut self, id: u64) {
        if self.locker.delete(id).is_some() {
            self.save_locker();
        }
    }
    pub fn locker_undo(&mut self) {
        if self.locker.undo_delete() {
            self.save_locker();
        }
    }
    pub fn locker_make_mine(&mut self, id: u64) {
        self.locker.make_mine(id);
        self.save_locker();
    }
    /// "Save to my locker" on a diver's card: the diver's cylinders as a new set named
    /// after their label (never made mine). The material is the generic size's when
    /// the set is one, else steel (the default); it can be changed in the editor.
    pub fn save_diver_cylinders(&mut self, i: usize) {
        let Some(d) = self.team.input().divers.get(i) else {
            return;
        };
        let set = d.cylinders;
        let label = self.team.labels().get(i).cloned().unwrap_or_default();
        let material = presets()
            .iter()
            .find(|p| p.set == set)
            .map_or(Material::default(), |p| p.material);
        match self.locker.add_set(&label, &set, material) {
            Ok(Added::New(name)) => {
                self.save_locker();
                self.status.push(tr_with(
                    "Saved “{0}” ({1}) to your locker. It is not marked mine.",
                    &[&name, &set.describe()],
                ));
            }
            Ok(Added::Already(name)) => self
                .status
                .push(tr_with("“{0}” is already in your locker.", &[&name])),
            Err(e) => self.status.push(e.to_string()),
        }
    }

    /// Write the locker: this app's changes merged into the file as it is now, under the
    /// lock. What the merge kept twice, and a file set aside, is said in the status.
    pub(super) fn write_locker(&mut self) -> Result<(), String> {
        let base = self.locker.base().clone();
        let ours = self.locker.file.clone();
        let mut messages = Vec::new();
        let result = self.store.update_locker(&mut messages, |disk, read| {
            let theirs = if read { disk.clone() } else { base.clone() };
            let (merged, notes) = merge_changes(&base, &ours, &theirs)?;
            *disk = merged;
            Ok(notes)
        });
        for m in messages {
            self.status.push(m);
        }
        match result {
            Ok((notes, file)) => {
                self.locker.synced(file);
                for n in notes {
                    self.status.push(format!("{n}."));
                }
                Ok(())
            }
            Err(LockerError::Input(e)) => Err(format!("could not save locker.json: {e}")),
            Err(LockerError::Write(e)) => Err(e),
        }
    }

    /// Re-read the locker if another program changed it (on focus and resume). Changes
    /// made here and not yet written are merged and saved; a file that cannot be read
    /// leaves every set shown here in place. Returns whether the locker changed.
    pub fn refresh_locker(&mut self) -> bool {
        if !self.store.locker_changed_on_disk() {
            return false;
        }
        if self.locker.changed_here() {
            self.save_locker();
            return true;
        }
        let (found, read, messages) = self.store.reload_locker();
        for m in messages {
            self.status.push(m);
        }
        if read {
            self.locker.synced(found);
        } else {
            self.locker.base_lost();
            self.save_locker();
        }
        true
    }

    /// Save the draft and leave the editor; on error the editor stays open.
    pub fn locker_save(&mut self) -> Result<(), InputError> {
        self.locker.save_draft()?;
        self.save_locker();
        self.nav.back();
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use crate::app::session::{Picker, Session};
    use crate::storage::Store;

    #[test]
    fn a_divers_cylinders_go_to_the_locker_once_and_not_as_mine() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.open_cylinder_picker(0);
        s.open_custom_cylinders();
        s.edit_custom(|c| {
            c.set_count(2);
            c.first = Some(11.1);
            c.second = Some(232.0);
        });
        s.custom_done();
        assert_eq!(s.picker, Picker::None);
        s.save_diver_cylinders(0);
        assert!(
            s.status.text().contains("Twin 11.1 L 232 bar"),
            "{:?}",
            s.status
        );
        s.dismiss_status();
        s.save_diver_cylinders(0);
        assert!(s.status.text().contains("already"), "{:?}", s.status);
        assert_eq!(s.locker.entries().len(), 1);
        let e = &s.locker.entries()[0];
        assert_eq!(e.name, "Twin 11.1 L 232 bar");
        assert!(!e.mine);
        assert!(s.locker.mine().is_none());
        // On disk too.
        let again = Session::open(Store::new(dir.path()));
        assert_eq!(again.locker.entries().len(), 1);
        assert_eq!(
            again.locker.entries()[0]
                .cylinders
                .to_set("locker")
                .unwrap(),
            s.team.input().divers[0].cylinders
        );
    }
}
