//! The cylinder locker: entries, the entry being edited, and undo of the last delete.

use crate::formats::team_file::CylindersFile;
use crate::i18n::{tr, tr_with};
use crate::plan::CylinderSet;
use crate::plan::InputError;
use crate::plan::text;
use crate::plan::{Material, Preset};
use crate::storage::locker::{
    LockerEntry, LockerFile, MAX_LOCKER_SETS, MAX_SET_NAME_CHARS, check_set_name, check_set_note,
};

pub use super::locker_draft::Draft;

/// What `add_set` did, with the name the set has in the locker.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Added {
    New(String),
    Already(String),
}

#[derive(Clone, Debug, Default)]
pub struct LockerController {
    pub file: LockerFile,
    /// The locker as this app last read or wrote it: what a save merges `file` against
    /// (`storage::locker_merge::merge_changes`), so that sets changed elsewhere are kept.
    base: LockerFile,
    draft: Option<Draft>,
    /// The draft as it was opened, to tell whether it was changed.
    opened: Option<Draft>,
    /// The last deleted entry and where it was.
    undo: Option<(usize, LockerEntry)>,
}

impl LockerController {
    pub fn new(file: LockerFile) -> Self {
        LockerController {
            base: file.clone(),
            file,
            draft: None,
            opened: None,
            undo: None,
        }
    }

    /// The locker as last read or written.
    pub fn base(&self) -> &LockerFile {
        &self.base
    }
    /// Whether this app changed the locker since it was last read or written.
    pub fn changed_here(&self) -> bool {
        self.file != self.base
    }
    /// The locker as now read or written: both the copy shown and the base of the next
    /// merge. The draft and the Undo on offer stay.
    pub fn synced(&mut self, file: LockerFile) {
        self.base = file.clone();
        self.file = file;
    }
    /// The file could not be read (missing, or set aside): every set shown here is kept,
    /// and the next save writes them all.
    pub fn base_lost(&mut self) {
        self.base = LockerFile::default();
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
    /// Change the open draft; nothing happens when none is open. A name made from the
    /// sizes follows them (`Draft::follow_sizes`).
    pub fn edit_draft(&mut self, edit: impl FnOnce(&mut Draft)) {
        if let Some(d) = self.draft.as_mut() {
            let before = d.clone();
            edit(d);
            d.follow_sizes(&before);
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
            return Err(InputError::new("locker", tr("nothing is being edited")));
        };
        check_set_name("name", &d.name)?;
        check_set_note("note", &d.note)?;
        let name = text::nfc(d.name.trim());
        let note = text::nfc(d.note.trim());
        let set = d.to_set()?;
        let is_new = d.id.is_none_or(|id| self.entry(id).is_none());
        if is_new && self.file.entries.len() >= MAX_LOCKER_SETS {
            return Err(InputError::new(
                "locker",
                tr_with(
                    "the locker is full: it holds at most {0} sets; delete one first",
                    &[&MAX_LOCKER_SETS],
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
                // Never mine by itself, not even the first: the diver marks it.
                self.file.entries.push(LockerEntry {
                    id,
                    name,
                    cylinders,
                    material: d.material,
                    note,
                    mine: false,
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

    /// Add `set` under `name` (shortened to the name limit, `NAME (2)`... when taken),
    /// never as mine. The same set under the same name is not added twice.
    pub fn add_set(
        &mut self,
        name: &str,
        set: &CylinderSet,
        material: Material,
    ) -> Result<Added, InputError> {
        let cylinders = CylindersFile::from_set(set);
        let name: String = text::nfc(name.trim())
            .chars()
            .take(MAX_SET_NAME_CHARS)
            .collect();
        // A label that is no usable name (empty, or with a refused character) gives way
        // to the set's own description.
        let name = if check_set_name("name", &name).is_ok() {
            name.trim().to_string()
        } else {
            set.describe()
        };
        if let Some(e) = self
            .file
            .entries
            .iter()
            .find(|e| e.cylinders == cylinders && e.name == name)
        {
            return Ok(Added::Already(e.name.clone()));
        }
        if self.file.entries.len() >= MAX_LOCKER_SETS {
            return Err(InputError::new(
                "locker",
                tr_with(
                    "the locker is full ({0} sets); delete one first",
                    &[&MAX_LOCKER_SETS],
                ),
            ));
        }
        let name = if self.file.find_by_name(&name).is_empty() {
            name
        } else {
            self.file.free_name(&name).ok_or_else(|| {
                InputError::new("name", tr("no free variant of the name was found"))
            })?
        };
        self.file.entries.push(LockerEntry {
            id: self.file.next_id(),
            name: name.clone(),
            cylinders,
            material,
            note: String::new(),
            mine: false,
        });
        Ok(Added::New(name))
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
mod tests;
