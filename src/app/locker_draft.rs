//! A locker entry being added or edited: the fields as typed, checked on save.

use crate::formats::team_file::CylindersFile;
use crate::i18n::{tr, tr_with};
use crate::plan::InputError;
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
    /// The sizes the name was made from or typed for (None until the sizes are whole).
    pub named_for: Option<CylinderSet>,
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
            named_for: None,
        }
    }

    pub fn from_entry(e: &LockerEntry) -> Self {
        let rated = e.cylinders.rated_cuft.is_some();
        let mut d = Draft {
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
            named_for: None,
        };
        d.named_for = d.sizes();
        d
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
    pub fn field_specs(&self) -> [(String, &'static str, f64, f64); 2] {
        if self.rated {
            [
                (tr("RATED VOLUME PER CYLINDER"), "cu ft", 5.0, 400.0),
                (tr("RATED PRESSURE"), "psi", 700.0, 5800.0),
            ]
        } else {
            [
                (tr("WATER CAPACITY PER CYLINDER"), "L", 0.5, 30.0),
                (tr("WORKING PRESSURE"), "bar", 50.0, 400.0),
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

    /// The count and both sizes, when all are entered (not yet checked).
    pub fn sizes(&self) -> Option<CylinderSet> {
        let (first, second) = (self.first?, self.second?);
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
        Some(CylinderSet {
            count: self.count,
            independent: self.independent && self.count == 2,
            spec,
        })
    }

    /// After an edit from `before`: a name typed now is the diver's for the sizes of now;
    /// a name that states the sizes (made from them, as every generic size's is) follows
    /// them; an empty name is made from the sizes once they are whole. A typed name that
    /// does not state them stays, and `name_warning` says so.
    pub fn follow_sizes(&mut self, before: &Draft) {
        let now = self.sizes();
        if self.name != before.name {
            self.named_for = now;
            return;
        }
        if self.material != before.material {
            self.name = replace_material(&self.name, before.material, self.material);
        }
        let Some(now) = now else { return };
        match self.named_for {
            Some(old) if old == now => {}
            Some(old) => {
                if let Some(name) = rename(&self.name, &old, &now) {
                    self.name = name;
                    self.named_for = Some(now);
                }
            }
            None => {
                if self.name.trim().is_empty() {
                    self.name = made_name(&now);
                }
                self.named_for = Some(now);
            }
        }
    }

    /// A warning while the name was typed for other sizes than the set holds now.
    pub fn name_warning(&self) -> Option<String> {
        let (old, now) = (self.named_for?, self.sizes()?);
        (old != now).then(|| {
            tr_with(
                "The name was given to {0}; the set now holds {1}. Check the name still fits.",
                &[&old.describe(), &now.describe()],
            )
        })
    }

    /// The cylinder set, checked by the planning core's rules.
    pub fn to_set(&self) -> Result<CylinderSet, InputError> {
        let [a, b] = self.field_specs();
        if self.first.is_none() {
            return Err(InputError::new(a.0.to_lowercase(), tr("enter a value")));
        }
        let set = self
            .sizes()
            .ok_or_else(|| InputError::new(b.0.to_lowercase(), tr("enter a value")))?;
        validate_cylinders(UnitSystem::Metric, "cylinders", &set)?;
        Ok(set)
    }
}

/// The name made from the sizes: the core's ([`CylinderSet::describe`]), "Single 15 L
/// 232 bar", "Twin 12 L 232 bar", "2 × 12 L 232 bar, independent", "3 × 40 cu ft 3000 psi".
pub fn made_name(set: &CylinderSet) -> String {
    set.describe()
}

/// The words of the core's name around the sizes, in this thread's language: ("Twin ",
/// "") for twins, ("2 × ", ", independent") for an independent pair.
fn count_words(set: &CylinderSet) -> (String, String) {
    let (name, sizes) = (set.describe(), set.spec.describe());
    match name.split_once(&sizes) {
        Some((before, after)) => (before.to_string(), after.to_string()),
        None => (String::new(), String::new()),
    }
}

/// `name` with the sizes of `old` replaced by those of `now`; None when the name does not
/// state the old cylinder's sizes (a name of the diver's own).
fn rename(name: &str, old: &CylinderSet, now: &CylinderSet) -> Option<String> {
    use crate::plan::shown::{Decimal, DecimalScope};
    // A name made in another language may hold the other decimal separator.
    let was = [Decimal::Point, Decimal::Comma]
        .map(|d| {
            let _scope = DecimalScope::new(d);
            old.spec.describe()
        })
        .into_iter()
        .find(|w| name.contains(w.as_str()))?;
    // The core's own name for the old sizes (in any language): the core's for the new.
    if crate::plan::is_made_name(name, old) {
        return Some(made_name(now));
    }
    let is = now.spec.describe();
    let mut name = name.replacen(&was, &is, 1);
    if old.count != now.count {
        let (w, n) = (count_words(old).0, count_words(now).0);
        let (wx, nx) = (format!("{} × ", old.count), format!("{} × ", now.count));
        if let Some(rest) = name.strip_prefix(&w).filter(|_| !w.is_empty()) {
            name = format!("{n}{rest}");
        } else if name.contains(&wx) {
            // "Sidemount 2 × …": the count inside the name.
            let by = if now.count == 1 { String::new() } else { nx };
            name = name.replacen(&wx, &by, 1);
        }
    }
    Some(name)
}

/// The material's word in `name` (as written, or with a capital) replaced by the new one's.
fn replace_material(name: &str, old: Material, now: Material) -> String {
    let cap = |m: Material| crate::plan::text::first_upper(m.name());
    if name.contains(old.name()) {
        name.replacen(old.name(), now.name(), 1)
    } else if name.contains(&cap(old)) {
        name.replacen(&cap(old), &cap(now), 1)
    } else {
        name.to_string()
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
