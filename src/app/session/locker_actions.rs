//! Session actions of the cylinder locker: open the editor, save, delete, undo, mine.
//! Changes to the open draft go straight to `LockerController::edit_draft`.

use crate::plan::catalogue::presets;
use crate::plan::error::InputError;

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
    /// Save the draft and leave the editor; on error the editor stays open.
    pub fn locker_save(&mut self) -> Result<(), InputError> {
        self.locker.save_draft()?;
        self.save_locker();
        self.nav.back();
        Ok(())
    }
}
