//! A locker entry being added or edited: the fields as typed, checked on save.

use crate::formats::team_file::CylindersFile;
use crate::plan::error::InputError;
use crate::plan::validate_cylinders;
use crate::plan::{CylinderSet, CylinderSpec, UnitSystem};
use crate::plan::{Material, Preset};
use crate::storage::locker::LockerEntry;

/// An entry being added or edited.
#[derive(Clone, Debug, PartialEq)]
pub struct Draft {
    /// The entry being edited, or None for a new one.
    pub id: Option<u64>,
    pub name: String,
    pub count: u8,
    /// For a pair: independent cylinders (sidemount) rather than twins. Kept as it was
    /// through an edit.
    pub independent: bool,
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
            independent: false,
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
            independent: e.cylinders.independent,
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

    /// One cylinder more or fewer, kept within 1 to 4.
    pub fn change_count(&mut self, delta: i32) {
        self.count = (i32::from(self.count) + delta).clamp(1, 4) as u8;
    }

    /// Switch between a metric stamp and an imperial rating; the size fields, which
    /// mean something else in the other system, are emptied.
    pub fn set_rated(&mut self, rated: bool) {
        if self.rated != rated {
            self.rated = rated;
            self.first = None;
            self.second = None;
        }
    }

    /// The material at `idx` in `Material::ALL`; other indices are ignored.
    pub fn set_material(&mut self, idx: usize) {
        if let Some(m) = Material::ALL.get(idx) {
            self.material = *m;
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
            independent: self.independent && self.count == 2,
            spec,
        };
        validate_cylinders(UnitSystem::Metric, "cylinders", &set)?;
        Ok(set)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn draft_edits_stay_in_range() {
        let mut d = Draft::blank();
        d.change_count(5);
        assert_eq!(d.count, 4);
        d.change_count(-9);
        assert_eq!(d.count, 1);
        d.first = Some(12.0);
        d.set_rated(false);
        assert_eq!(d.first, Some(12.0), "the same system keeps the sizes");
        d.set_rated(true);
        assert_eq!((d.first, d.second), (None, None));
        d.set_material(1);
        assert_eq!(d.material, Material::ALL[1]);
        d.set_material(99);
        assert_eq!(d.material, Material::ALL[1]);
    }
}
