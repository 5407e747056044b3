//! The cylinder locker: entries, the entry being edited, and undo of the last delete.

use crate::formats::team_file::CylindersFile;
use crate::plan::catalogue::{Material, Preset};
use crate::plan::error::InputError;
use crate::plan::team::validate_cylinders;
use crate::plan::{CylinderSet, CylinderSpec, UnitSystem};
use crate::storage::locker::{LockerEntry, LockerFile};

/// An entry being added or edited.
#[derive(Clone, Debug, PartialEq)]
pub struct Draft {
    /// The entry being edited, or None for a new one.
    pub id: Option<u64>,
    pub name: String,
    pub count: u8,
    /// Imperial rating (cu ft @ psi) rather than metric stamp (L @ bar).
    pub rated: bool,
    /// Water litres, or rated cu ft.
    pub first: Option<f64>,
    /// Working bar, or rated psi.
    pub second: Option<f64>,
    pub material: Material,
    pub note: String,
}

impl Draft {
    pub fn blank() -> Self {
        Draft {
            id: None,
            name: String::new(),
            count: 2,
            rated: false,
            first: None,
            second: None,
            material: Material::Steel,
            note: String::new(),
        }
    }

    pub fn from_entry(e: &LockerEntry) -> Self {
        let rated = e.cylinders.rated_cuft.is_some();
        Draft {
            id: Some(e.id),
            name: e.name.clone(),
            count: e.cylinders.count,
            rated,
            first: if rated {
                e.cylinders.rated_cuft
            } else {
                e.cylinders.water_l
            },
            second: if rated {
                e.cylinders.rated_psi
            } else {
                e.cylinders.working_bar
            },
            material: e.material,
            note: e.note.clone(),
        }
    }

    pub fn from_preset(p: &Preset) -> Self {
        let mut d = Draft::from_entry(&LockerEntry {
            id: 0,
            name: p.name.to_string(),
            cylinders: CylindersFile::from_set(&p.set),
            material: p.material,
            note: String::new(),
            mine: false,
        });
        d.id = None;
        d
    }

    /// (caption, unit, allowed range) of the first and second size fields.
    pub fn field_specs(&self) -> [(&'static str, &'static str, f64, f64); 2] {
        if self.rated {
            [
                ("RATED VOLUME PER CYLINDER", "cu ft", 5.0, 400.0),
                ("RATED PRESSURE", "psi", 700.0, 5800.0),
            ]
        } else {
            [
                ("WATER CAPACITY PER CYLINDER", "L", 0.5, 30.0),
                ("WORKING PRESSURE", "bar", 50.0, 400.0),
            ]
        }
    }

    /// The cylinder set, checked by the planning core's rules.
    pub fn to_set(&self) -> Result<CylinderSet, InputError> {
        let [a, b] = self.field_specs();
        let first = self
            .first
            .ok_or_else(|| InputError::new(a.0.to_lowercase(), "enter a value"))?;
        let second = self
            .second
            .ok_or_else(|| InputError::new(b.0.to_lowercase(), "enter a value"))?;
        let spec = if self.rated {
            CylinderSpec::Rated {
                rated_cuft: first,
                rated_psi: second,
            }
        } else {
            CylinderSpec::Stamped {
                water_l: first,
                working_bar: second,
            }
        };
        let set = CylinderSet {
            count: self.count,
            spec,
        };
        validate_cylinders(UnitSystem::Metric, "cylinders", &set)?;
        Ok(set)
    }
}

#[derive(Clone, Debug, Default)]
pub struct LockerController {
    pub file: LockerFile,
    pub draft: Option<Draft>,
    /// The last deleted entry and where it was.
    pub undo: Option<(usize, LockerEntry)>,
}

impl LockerController {
    pub fn new(file: LockerFile) -> Self {
        LockerController {
            file,
            draft: None,
            undo: None,
        }
    }

    pub fn entry(&self, id: u64) -> Option<&LockerEntry> {
        self.file.entries.iter().find(|e| e.id == id)
    }

    pub fn start_new(&mut self) {
        self.draft = Some(Draft::blank());
    }
    pub fn start_edit(&mut self, id: u64) {
        self.draft = self.entry(id).map(Draft::from_entry);
    }
    pub fn start_from_preset(&mut self, p: &Preset) {
        self.draft = Some(Draft::from_preset(p));
    }

    /// Save the draft into the locker. The draft stays open on error.
    pub fn save_draft(&mut self) -> Result<u64, InputError> {
        let Some(d) = self.draft.clone() else {
            return Err(InputError::new("locker", "nothing is being edited"));
        };
        let name = d.name.trim().to_string();
        if name.is_empty() || name.chars().count() > 40 {
            return Err(InputError::new(
                "name",
                "a name of 1 to 40 characters is needed",
            ));
        }
        let set = d.to_set()?;
        let cylinders = CylindersFile::from_set(&set);
        let id = match d
            .id
            .and_then(|id| self.file.entries.iter_mut().find(|e| e.id == id))
        {
            Some(e) => {
                e.name = name;
                e.cylinders = cylinders;
                e.material = d.material;
                e.note = d.note.trim().to_string();
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
                    note: d.note.trim().to_string(),
                    mine: first,
                });
                id
            }
        };
        self.draft = None;
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

    #[test]
    fn draft_save_edit_delete_undo() {
        let mut l = LockerController::default();
        l.start_new();
        let d = l.draft.as_mut().unwrap();
        d.name = "My twins".into();
        d.first = Some(12.0);
        d.second = Some(232.0);
        let id = l.save_draft().unwrap();
        assert!(l.file.entries[0].mine, "the first set becomes mine");
        l.start_edit(id);
        l.draft.as_mut().unwrap().first = Some(40.0);
        let e = l.save_draft().unwrap_err();
        assert!(e.field.contains("water_l"), "{e}");
        l.draft.as_mut().unwrap().first = Some(15.0);
        l.save_draft().unwrap();
        assert_eq!(l.file.entries[0].cylinders.water_l, Some(15.0));
        assert_eq!(l.delete(id).as_deref(), Some("My twins"));
        assert!(l.file.entries.is_empty());
        assert!(l.undo_delete());
        assert_eq!(l.file.entries.len(), 1);
        assert!(l.mine().is_some());
    }
}
