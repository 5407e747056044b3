//! The locker controller without Slint.

use super::*;
use crate::storage::atomic::WithinLimits;
use crate::storage::locker::{MAX_SET_NAME_CHARS, MAX_SET_NOTE_CHARS};

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
    assert!(
        !l.file.entries[0].mine,
        "not even the first set is made mine"
    );
    assert!(l.mine().is_none());
    l.make_mine(id);
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

#[test]
fn a_set_added_from_a_diver_gets_a_free_name_and_is_not_mine() {
    let mut l = LockerController::default();
    let set = CylinderSet::twins(crate::plan::CylinderSpec::Stamped {
        water_l: 11.1,
        working_bar: 232.0,
    });
    let other = CylinderSet::single(crate::plan::CylinderSpec::Stamped {
        water_l: 15.0,
        working_bar: 232.0,
    });
    let add = |l: &mut LockerController, set| l.add_set("Twin 11.1 L", set, Material::Steel);
    assert_eq!(add(&mut l, &set), Ok(Added::New("Twin 11.1 L".into())));
    assert_eq!(add(&mut l, &set), Ok(Added::Already("Twin 11.1 L".into())));
    assert_eq!(
        add(&mut l, &other),
        Ok(Added::New("Twin 11.1 L (2)".into()))
    );
    assert_eq!(l.entries().len(), 2);
    assert!(l.entries().iter().all(|e| !e.mine));
    let long = "x".repeat(60);
    let Ok(Added::New(n)) = l.add_set(&long, &set, Material::Steel) else {
        panic!("a long label is shortened, not refused");
    };
    assert_eq!(n.chars().count(), MAX_SET_NAME_CHARS);
}

fn stamped(count: u8, water_l: f64, working_bar: f64) -> CylinderSet {
    CylinderSet {
        count,
        spec: crate::plan::CylinderSpec::Stamped {
            water_l,
            working_bar,
        },
        independent: false,
    }
}

#[test]
fn a_name_made_from_the_sizes_follows_them() {
    let mut l = LockerController::default();
    let twin12 = crate::plan::presets()
        .into_iter()
        .find(|p| p.name == "Twin 12 L 232 bar")
        .unwrap();
    l.start_from_preset(&twin12);
    l.edit_draft(|d| d.first = Some(11.0));
    assert_eq!(l.draft().unwrap().name, "Twin 11 L 232 bar");
    l.edit_draft(|d| d.change_count(-1));
    assert_eq!(l.draft().unwrap().name, "Single 11 L 232 bar");
    l.edit_draft(|d| d.second = Some(300.0));
    assert_eq!(l.draft().unwrap().name, "Single 11 L 300 bar");
    assert_eq!(l.draft().unwrap().name_warning(), None);
    // Switching to a rating empties the sizes; the name waits for whole ones.
    l.edit_draft(|d| d.set_rated(true));
    assert_eq!(l.draft().unwrap().name, "Single 11 L 300 bar");
    l.edit_draft(|d| d.first = Some(80.0));
    l.edit_draft(|d| d.second = Some(3000.0));
    assert_eq!(l.draft().unwrap().name, "Single 80 cu ft 3000 psi");
    let id = l.save_draft().unwrap();
    assert_eq!(l.entry(id).unwrap().name, "Single 80 cu ft 3000 psi");

    // A new set gets its name from its sizes once they are whole.
    l.start_new();
    l.edit_draft(|d| d.first = Some(12.0));
    assert_eq!(l.draft().unwrap().name, "");
    l.edit_draft(|d| d.second = Some(232.0));
    assert_eq!(l.draft().unwrap().name, "Twin 12 L 232 bar");

    // The count inside a sidemount name, and its material.
    let mut d = Draft::blank();
    d.name = "Sidemount 2 × aluminium 11.1 L 207 bar".into();
    d.first = Some(11.1);
    d.second = Some(207.0);
    d.material = Material::Aluminium;
    d.named_for = d.sizes();
    let before = d.clone();
    d.change_count(1);
    d.set_material(2);
    d.follow_sizes(&before);
    assert_eq!(d.name, "Sidemount 3 × composite 11.1 L 207 bar");
}

#[test]
fn a_typed_name_gets_a_warning_when_the_sizes_change() {
    let mut l = LockerController::default();
    l.start_new();
    l.edit_draft(|d| {
        d.first = Some(12.0);
        d.second = Some(232.0);
    });
    l.edit_draft(|d| d.name = "Cave set".into());
    assert_eq!(l.draft().unwrap().name_warning(), None);
    l.edit_draft(|d| d.first = Some(11.0));
    let d = l.draft().unwrap();
    assert_eq!(d.name, "Cave set", "a typed name is the diver's");
    let w = d.name_warning().expect("a warning");
    assert!(
        w.contains("Twin 12 L 232 bar") && w.contains("Twin 11 L 232 bar"),
        "{w}"
    );
    // Back to the sizes it was typed for: no warning; typed again: none either.
    l.edit_draft(|d| d.first = Some(12.0));
    assert_eq!(l.draft().unwrap().name_warning(), None);
    l.edit_draft(|d| d.first = Some(11.0));
    l.edit_draft(|d| d.name = "Cave set 11".into());
    assert_eq!(l.draft().unwrap().name_warning(), None);
    assert_eq!(l.draft().unwrap().sizes(), Some(stamped(2, 11.0, 232.0)));
}

#[test]
fn an_independent_pair_is_named_as_the_core_names_it() {
    let mut d = Draft::blank();
    d.independent = true;
    let before = d.clone();
    d.first = Some(11.1);
    d.second = Some(207.0);
    d.follow_sizes(&before);
    assert_eq!(d.name, "2 × 11.1 L 207 bar, independent");
    let before = d.clone();
    d.first = Some(12.0);
    d.follow_sizes(&before);
    assert_eq!(d.name, "2 × 12 L 207 bar, independent");
    // A name the core made, so each language writes it its own way.
    let set = d.sizes().unwrap();
    let _de = crate::i18n::LanguageScope::new(crate::i18n::Language::German);
    let shown = crate::plan::shown_label(&d.name, &set);
    assert!(
        shown != d.name && shown.starts_with("2 × 12 L 207 bar"),
        "{shown}"
    );
}
