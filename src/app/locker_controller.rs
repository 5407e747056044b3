//! The cylinder locker: entries, the entry being edited, and undo of the last delete.

use crate::formats::team_file::CylindersFile;
use crate::plan::CylinderSet;
use crate::plan::catalogue::Preset;
use crate::plan::error::InputError;
use crate::storage::locker::{
    LockerEntry, LockerFile, MAX_LOCKER_SETS, MAX_SET_NOTE_CHARS, check_set_name,
};

pub use super::locker_draft::Draft;

#[derive(Clone, Debug, Default)]
pub struct LockerController {
    pub file: LockerFile,
    draft: Option<Draft>,
    /// The draft as it was opened, to tell whether it was changed.
    opened: Option<Draft>,
    /// The last deleted entry and where it was.
    undo: Option<(usize, LockerEntry)>,
}

impl LockerController {
    pub fn new(file: LockerFile) -> Self {
        LockerController {
            file,
            draft: None,
            opened: None,
            undo: None,
        }
    }

    pub fn entry(&self, id: u64) -> Option<&LockerEntry> {
        self.file.entries.iter().find(|e| e.id == id)
    }
    pub fn entries(&self) -> &[LockerEntry] {
        &self.file.entries
    }

    /// The set being added or edited, if any.
    pub fn draft(&self) -> Option<&Draft> {
        self.draft.as_ref()
    }
    /// Change the open draft; nothing happens when none is open.
    pub fn edit_draft(&mut self, edit: impl FnOnce(&mut Draft)) {
        if let Some(d) = self.draft.as_mut() {
            edit(d);
        }
    }
    /// Close the draft without saving.
    pub fn drop_draft(&mut self) {
        self.draft = None;
        self.opened = None;
    }
    /// Whether the open draft differs from what it was when opened.
    pub fn draft_changed(&self) -> bool {
        self.draft.is_some() && self.draft != self.opened
    }
    fn open_draft(&mut self, d: Option<Draft>) {
        self.opened = d.clone();
        self.draft = d;
    }

    /// The name of the entry that Undo would bring back.
    pub fn undo_name(&self) -> Option<&str> {
        self.undo.as_ref().map(|(_, e)| e.name.as_str())
    }

    pub fn start_new(&mut self) {
        self.open_draft(Some(Draft::blank()));
    }
    pub fn start_edit(&mut self, id: u64) {
        self.open_draft(self.entry(id).map(Draft::from_entry));
    }
    pub fn start_from_preset(&mut self, p: &Preset) {
        self.open_draft(Some(Draft::from_preset(p)));
    }

    /// Save the draft into the locker. The draft stays open on error.
    pub fn save_draft(&mut self) -> Result<u64, InputError> {
        let Some(d) = self.draft.clone() else {
            return Err(InputError::new("locker", "nothing is being edited"));
        };
        check_set_name("name", &d.name)?;
        let name = d.name.trim().to_string();
        let note = d.note.trim().to_string();
        let n = note.chars().count();
        if n > MAX_SET_NOTE_CHARS {
            return Err(InputError::new(
                "note",
                format!("{n} characters is too long; at most {MAX_SET_NOTE_CHARS}"),
            ));
        }
        let set = d.to_set()?;
        let is_new = d.id.is_none_or(|id| self.entry(id).is_none());
        if is_new && self.file.entries.len() >= MAX_LOCKER_SETS {
            return Err(InputError::new(
                "locker",
                format!(
                    "the locker is full: it holds at most {MAX_LOCKER_SETS} sets; delete one first"
                ),
            ));
        }
        let cylinders = CylindersFile::from_set(&set);
        let id = match d
            .id
            .and_then(|id| self.file.entries.iter_mut().find(|e| e.id == id))
        {
            Some(e) => {
                e.name = name;
                e.cylinders = cylinders;
                e.material = d.material;
                e.note = note;
                e.id
            }
            None => {
                let id = self.file.next_id();
                let first = self.file.entries.is_empty();
                self.file.entries.push(LockerEntry {
                    id,
                    name,
                    cylinders,
                    material: d.material,
                    note,
                    mine: first,
                });
                id
            }
        };
        self.drop_draft();
        Ok(id)
    }

    pub fn delete(&mut self, id: u64) -> Option<String> {
        let pos = self.file.entries.iter().position(|e| e.id == id)?;
        let e = self.file.entries.remove(pos);
        let name = e.name.clone();
        self.undo = Some((pos, e));
        Some(name)
    }

    pub fn undo_delete(&mut self) -> bool {
        match self.undo.take() {
            Some((pos, e)) => {
                let pos = pos.min(self.file.entries.len());
                if e.mine {
                    for x in &mut self.file.entries {
                        x.mine = false;
                    }
                }
                self.file.entries.insert(pos, e);
                true
            }
            None => false,
        }
    }

    pub fn make_mine(&mut self, id: u64) {
        self.file.set_mine(id);
    }

    /// The set marked mine, as (set, label).
    pub fn mine(&self) -> Option<(CylinderSet, String)> {
        let e = self.file.mine()?;
        let set = e.cylinders.to_set("locker").ok()?;
        Some((set, e.name.clone()))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::atomic::WithinLimits;
    use crate::storage::locker::MAX_SET_NAME_CHARS;

    #[test]
    fn draft_save_edit_delete_undo() {
        let mut l = LockerController::default();
        l.start_new();
        l.edit_draft(|d| {
            d.name = "My twins".into();
            d.first = Some(12.0);
            d.second = Some(232.0);
        });
        let id = l.save_draft().unwrap();
        assert!(l.file.entries[0].mine, "the first set becomes mine");
        l.start_edit(id);
        l.edit_draft(|d| d.first = Some(40.0));
        let e = l.save_draft().unwrap_err();
        assert!(e.field.contains("water_l"), "{e}");
        l.edit_draft(|d| d.first = Some(15.0));
        l.save_draft().unwrap();
        assert_eq!(l.file.entries[0].cylinders.water_l, Some(15.0));
        assert_eq!(l.delete(id).as_deref(), Some("My twins"));
        assert!(l.file.entries.is_empty());
        assert!(l.undo_delete());
        assert_eq!(l.file.entries.len(), 1);
        assert!(l.mine().is_some());
    }

    #[test]
    fn names_notes_and_the_number_of_sets_keep_the_locker_file_limits() {
        let mut l = LockerController::default();
        let fill = |l: &mut LockerController, name: String, note: String| {
            l.start_new();
            l.edit_draft(|d| {
                d.name = name;
                d.note = note;
                d.first = Some(12.0);
                d.second = Some(232.0);
            });
            l.save_draft()
        };
        let e = fill(&mut l, "n".repeat(MAX_SET_NAME_CHARS + 1), String::new()).unwrap_err();
        assert_eq!(e.field, "name");
        let e = fill(&mut l, "Ok".into(), "x".repeat(MAX_SET_NOTE_CHARS + 1)).unwrap_err();
        assert_eq!(e.field, "note");
        for i in 0..MAX_LOCKER_SETS {
            fill(&mut l, format!("Set {i}"), String::new()).unwrap();
        }
        let e = fill(&mut l, "One more".into(), String::new()).unwrap_err();
        assert!(e.message.contains("full"), "{e}");
        assert!(l.draft().is_some(), "the draft stays open");
        assert!(
            l.file.within_limits().is_ok(),
            "the saved file would load again"
        );
    }
}
