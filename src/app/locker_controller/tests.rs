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
