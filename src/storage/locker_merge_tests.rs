//! Tests of `locker_merge.rs`.

use super::*;
use crate::formats::team_file::CylindersFile;
use crate::plan::Material;
use crate::storage::locker::LOCKER_SCHEMA;

fn entry(id: u64, name: &str, water_l: f64) -> LockerEntry {
    LockerEntry {
        id,
        name: name.to_string(),
        cylinders: CylindersFile {
            count: 2,
            water_l: Some(water_l),
            working_bar: Some(232.0),
            rated_cuft: None,
            rated_psi: None,
            independent: false,
        },
        material: Material::Steel,
        note: String::new(),
        mine: false,
    }
}

fn locker(entries: Vec<LockerEntry>) -> LockerFile {
    LockerFile {
        schema: LOCKER_SCHEMA,
        entries,
    }
}

#[test]
fn merge_adds_skips_and_renames_by_name() {
    let mut mine = entry(1, "Twelves", 12.0);
    mine.mine = true;
    let own = locker(vec![mine, entry(2, "Sevens", 7.0)]);
    let mut theirs_mine = entry(9, "Fifteens", 15.0);
    theirs_mine.mine = true;
    let incoming = locker(vec![
        entry(1, " twelves ", 12.0), // the same set: skipped
        entry(2, "Sevens", 8.5),     // a different set with a taken name: renamed
        theirs_mine,                 // new: added, never mine
        entry(4, "Sevens", 9.0),     // taken twice now: renamed again
        entry(5, "", 12.0),          // bad name: skipped
        entry(6, "Huge", 90.0),      // out of range: skipped
        entry(7, "Fifteens", 15.0),  // duplicate inside the file: skipped
    ]);
    let (merged, report) = own.merge(&incoming).unwrap();
    assert_eq!(report.added, vec!["Fifteens".to_string()]);
    assert_eq!(
        report.renamed,
        vec![
            ("Sevens".to_string(), "Sevens (2)".to_string()),
            ("Sevens".to_string(), "Sevens (3)".to_string())
        ]
    );
    let skipped: Vec<&str> = report.skipped.iter().map(|(n, _)| n.as_str()).collect();
    assert_eq!(skipped, vec!["twelves", "", "Huge", "Fifteens"]);
    assert!(
        report.skipped[1].1.contains("entries[4].name"),
        "{:?}",
        report.skipped
    );
    assert!(report.skipped[2].1.contains("entries[5].cylinders.water_l"));
    assert_eq!(merged.entries.len(), 5);
    assert_eq!(merged.entries.iter().filter(|e| e.mine).count(), 1);
    assert!(merged.entries[0].mine, "which set is mine does not change");
    let mut ids: Vec<u64> = merged.entries.iter().map(|e| e.id).collect();
    ids.sort();
    ids.dedup();
    assert_eq!(ids.len(), 5, "ids stay unique");
    // Importing the result, or the same file, again changes nothing.
    let (again, report) = merged.merge(&merged).unwrap();
    assert_eq!(again, merged);
    assert!(!report.changed());
    assert_eq!(report.skipped.len(), 5);
    let (again, report) = merged.merge(&incoming).unwrap();
    assert_eq!(again, merged);
    assert!(!report.changed(), "{report:?}");
}

#[test]
fn renamed_names_fit_the_limit_and_a_full_locker_refuses() {
    let long = "L".repeat(MAX_SET_NAME_CHARS);
    let own = locker(vec![entry(1, &long, 12.0)]);
    let (merged, report) = own.merge(&locker(vec![entry(1, &long, 10.0)])).unwrap();
    let given = &report.renamed[0].1;
    assert_eq!(given.chars().count(), MAX_SET_NAME_CHARS);
    assert!(given.ends_with(" (2)"));
    assert!(merged.within_limits().is_ok());

    let full = locker(
        (0..MAX_LOCKER_SETS as u64)
            .map(|i| entry(i + 1, &format!("Set {i}"), 12.0))
            .collect(),
    );
    assert!(full.within_limits().is_ok());
    let e = full
        .merge(&locker(vec![entry(1, "One more", 12.0)]))
        .unwrap_err();
    assert!(
        e.message.contains(&format!("at most {MAX_LOCKER_SETS}")),
        "{e}"
    );
}

fn names(l: &LockerFile) -> Vec<&str> {
    l.entries.iter().map(|e| e.name.as_str()).collect()
}

#[test]
fn changes_on_both_sides_are_all_kept() {
    let base = locker(vec![
        entry(1, "A", 12.0),
        entry(2, "B", 7.0),
        entry(3, "C", 10.0),
    ]);
    // Here: B deleted, C changed, D added, A marked mine.
    let mut ours = base.clone();
    ours.entries.remove(1);
    ours.entries[1].cylinders.water_l = Some(11.0);
    ours.entries.push(entry(4, "D", 15.0));
    ours.set_mine(1);
    // Elsewhere: C changed too (differently), E added with the id D got here.
    let mut theirs = base.clone();
    theirs.entries[2].cylinders.water_l = Some(8.0);
    theirs.entries.push(entry(4, "E", 5.0));
    let (out, notes) = merge_changes(&base, &ours, &theirs).unwrap();
    assert_eq!(names(&out), ["A", "C", "E", "C (2)", "D"]);
    assert_eq!(notes.len(), 1, "{notes:?}");
    assert!(
        notes[0].contains("both versions are kept (this one as “C (2)”)"),
        "{notes:?}"
    );
    let mut ids: Vec<u64> = out.entries.iter().map(|e| e.id).collect();
    ids.sort();
    ids.dedup();
    assert_eq!(ids.len(), 5, "ids stay unique");
    assert_eq!(out.mine().map(|e| e.name.as_str()), Some("A"));
    // Nothing changed here: the file as it is wins, whatever it is.
    let (same, notes) = merge_changes(&theirs, &theirs, &ours).unwrap();
    assert_eq!((same, notes.len()), (ours.clone(), 0));
}

#[test]
fn a_deleted_set_changed_elsewhere_is_kept_and_the_same_addition_counts_once() {
    let base = locker(vec![entry(1, "A", 12.0)]);
    let mut ours = locker(vec![entry(2, "Z", 12.0)]);
    let mut theirs = base.clone();
    theirs.entries[0].note = "new valve".into();
    theirs.entries.push(entry(2, "z", 12.0));
    let (out, notes) = merge_changes(&base, &ours, &theirs).unwrap();
    assert_eq!(names(&out), ["A", "z"]);
    assert!(notes[0].contains("deleted here but changed"), "{notes:?}");
    // Changed here, deleted there: kept.
    ours = base.clone();
    ours.entries[0].note = "mine now".into();
    let (out, notes) = merge_changes(&base, &ours, &locker(vec![])).unwrap();
    assert_eq!(out.entries[0].note, "mine now");
    assert!(notes[0].contains("deleted in another program"), "{notes:?}");
    // Deleted there and untouched here: gone.
    let (out, _) = merge_changes(&base, &base, &locker(vec![])).unwrap();
    assert!(out.entries.is_empty());
}

#[test]
fn a_merge_past_the_limit_changes_nothing() {
    let base = locker(vec![]);
    let full = locker(
        (1..=MAX_LOCKER_SETS as u64)
            .map(|i| entry(i, &format!("S{i}"), 12.0))
            .collect(),
    );
    let ours = locker(vec![entry(1, "Extra", 12.0)]);
    let e = merge_changes(&base, &ours, &full).unwrap_err();
    assert!(
        e.message.contains(&format!("at most {MAX_LOCKER_SETS}")),
        "{e}"
    );
}
