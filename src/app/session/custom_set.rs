//! A cylinder set that is in neither the locker nor the generic sizes: how many
//! cylinders, whether a pair is manifolded, and one cylinder's stamp (litres + bar) or
//! rating (cu ft + psi), typed on our own keypad. The picker holds it while it is open.

use crate::app::locker_draft::Draft;
use crate::plan::InputError;
use crate::plan::{CylinderSet, CylinderSpec};

use super::{Picker, Session};

/// The custom set being entered.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct CustomSet {
    /// 1 to 4 cylinders.
    pub count: u8,
    /// For two cylinders: two independent cylinders (sidemount, independent doubles)
    /// rather than twins on a manifold. Planning sums them the same way; only the
    /// name says which.
    pub independent: bool,
    /// Imperial rating (cu ft at psi) rather than metric stamp (L at bar).
    pub rated: bool,
    /// Water litres, or rated cu ft, of one cylinder.
    pub first: Option<f64>,
    /// Working bar, or rated psi.
    pub second: Option<f64>,
}

impl CustomSet {
    /// Starts from the set the diver has, so that changing one number is one entry; a
    /// pair whose name says sidemount or independent stays independent.
    pub fn from_set(set: &CylinderSet, label: &str) -> Self {
        let label = label.to_lowercase();
        let (rated, first, second) = match set.spec {
            CylinderSpec::Stamped {
                water_l,
                working_bar,
            } => (false, water_l, working_bar),
            CylinderSpec::Rated {
                rated_cuft,
                rated_psi,
            } => (true, rated_cuft, rated_psi),
        };
        CustomSet {
            count: set.count,
            independent: set.is_independent_pair()
                || label.contains("sidemount")
                || label.contains("independent"),
            rated,
            first: Some(first),
            second: Some(second),
        }
    }

    /// The same fields as the locker editor's, checked by the same rules.
    fn draft(&self) -> Draft {
        Draft {
            count: self.count,
            independent: self.independent,
            rated: self.rated,
            first: self.first,
            second: self.second,
            ..Draft::blank()
        }
    }

    /// (caption, unit, allowed range) of the first and second size fields.
    pub fn field_specs(&self) -> [(String, &'static str, f64, f64); 2] {
        self.draft().field_specs()
    }

    /// The set, checked by the planning core's rules; the error names the field.
    pub fn to_set(&self) -> Result<CylinderSet, InputError> {
        self.draft().to_set()
    }

    /// The name the diver's card shows: the core's name of the set
    /// ([`CylinderSet::describe`]), as entered here (twins or independent).
    pub fn label(&self, set: &CylinderSet) -> String {
        let mut set = *set;
        set.independent = self.count == 2 && self.independent;
        set.describe()
    }

    /// 1 to 4 cylinders; other counts are ignored.
    pub fn set_count(&mut self, count: u8) {
        if (1..=4).contains(&count) {
            self.count = count;
        }
    }

    /// Stamp or rating; the size fields mean something else in the other, so they
    /// are emptied.
    pub fn set_rated(&mut self, rated: bool) {
        if self.rated != rated {
            self.rated = rated;
            self.first = None;
            self.second = None;
        }
    }
}

impl Session {
    /// "Custom…" in the cylinder picker.
    pub fn open_custom_cylinders(&mut self) {
        if let Picker::Cylinders { diver, stage } = self.picker {
            let Some(d) = self.team.input().divers.get(diver) else {
                return;
            };
            let labels = if stage {
                self.team.stage_labels()
            } else {
                self.team.labels()
            };
            let label = labels.get(diver).map_or("", |l| l.as_str());
            let current = if stage {
                d.stage.as_ref().map(|st| st.cylinders)
            } else {
                Some(d.cylinders)
            };
            let first = crate::plan::presets()[0].set;
            let set = CustomSet::from_set(&current.unwrap_or(first), label);
            self.picker = Picker::Custom { diver, stage, set };
        }
    }

    /// Change the custom set being entered; nothing happens when none is.
    pub fn edit_custom(&mut self, edit: impl FnOnce(&mut CustomSet)) {
        if let Picker::Custom { set, .. } = &mut self.picker {
            edit(set);
        }
    }

    /// Back from the custom entry to the list.
    pub fn custom_to_list(&mut self) {
        if let Picker::Custom { diver, stage, .. } = self.picker {
            self.picker = Picker::Cylinders { diver, stage };
        }
    }

    /// "Use this set": on the diver, under its own name; an incomplete set says which
    /// field is missing and the entry stays open.
    pub fn custom_done(&mut self) {
        let Picker::Custom { diver, stage, set } = self.picker else {
            return;
        };
        match set.to_set() {
            Ok(c) => self.apply_cylinders(diver, stage, c, &set.label(&c)),
            Err(e) => self.status.push(e.to_string()),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::plan::ModelKind;
    use crate::storage::Store;

    #[test]
    fn a_custom_pair_goes_on_the_diver_with_its_own_name() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.open_cylinder_picker(1);
        s.open_custom_cylinders();
        s.edit_custom(|c| {
            c.set_count(2);
            c.independent = true;
            c.set_rated(false);
        });
        s.custom_done();
        assert!(
            s.status.text().contains("water capacity per cylinder"),
            "an empty field is named: {:?}",
            s.status
        );
        assert!(matches!(s.picker, Picker::Custom { .. }), "still open");
        s.edit_custom(|c| {
            c.first = Some(11.1);
            c.second = Some(232.0);
        });
        s.custom_done();
        assert_eq!(s.picker, Picker::None);
        let d = &s.team.input().divers[1];
        assert_eq!(d.cylinders.count, 2);
        // 2 × 11.1 L of water (the stamp), in both models.
        assert!((d.cylinders.water(ModelKind::Real).litres() - 22.2).abs() < 1e-9);
        assert_eq!(s.team.labels()[1], "2 × 11.1 L 232 bar, independent");
    }

    #[test]
    fn the_sizes_are_typed_on_our_keypad_and_checked_there() {
        use crate::app::session::EntryTarget;
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.open_cylinder_picker(0);
        s.open_custom_cylinders();
        s.open_entry(EntryTarget::CustomFirst);
        for k in ["clear", "4", "0"] {
            s.key(k);
        }
        // The keypad's title names the field; its problem gives the allowed range.
        let e = s.entry.as_ref().unwrap();
        assert!(
            e.title().contains("Water capacity per cylinder"),
            "{}",
            e.title()
        );
        assert!(e.reason().contains("allowed 0.5 to 30 L"), "{}", e.reason());
        s.entry_done();
        assert!(s.entry.is_some(), "an out-of-range size is not taken");
        for k in ["clear", "1", "1", ".", "1"] {
            s.key(k);
        }
        s.entry_done();
        s.open_entry(EntryTarget::CustomSecond);
        for k in ["clear", "2", "3", "2"] {
            s.key(k);
        }
        s.entry_done();
        let Picker::Custom { set, .. } = s.picker else {
            panic!("the custom entry stays open");
        };
        assert_eq!((set.first, set.second), (Some(11.1), Some(232.0)));
    }

    #[test]
    fn labels_tell_twins_from_independent_pairs() {
        let twelves = CylinderSet::twins(CylinderSpec::Stamped {
            water_l: 12.0,
            working_bar: 232.0,
        });
        let side = CustomSet::from_set(&twelves, "Sidemount 2 × 12 L");
        assert_eq!(side.label(&twelves), "2 × 12 L 232 bar, independent");
        assert!(
            side.to_set().unwrap().is_independent_pair(),
            "the set keeps it"
        );
        let saved = CylinderSet::independent_pair(twelves.spec);
        assert!(CustomSet::from_set(&saved, "Mine").independent);
        let mut c = CustomSet::from_set(&twelves, "Twin 12 L 232 bar");
        let set = c.to_set().unwrap();
        assert_eq!(c.label(&set), "Twin 12 L 232 bar");
        c.set_count(1);
        assert_eq!(c.label(&c.to_set().unwrap()), "Single 12 L 232 bar");
        c.set_count(5);
        assert_eq!(c.count, 1, "5 cylinders is refused");
        c.set_rated(true);
        assert_eq!((c.first, c.second), (None, None));
        c.first = Some(80.0);
        c.second = Some(3000.0);
        c.set_count(3);
        assert_eq!(c.label(&c.to_set().unwrap()), "3 × 80 cu ft 3000 psi");
    }
}
