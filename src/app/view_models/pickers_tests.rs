//! Tests of the pickers' rows and titles.

use super::*;
use crate::storage::Store;

#[test]
fn singles_and_pairs_are_listed_apart() {
    let dir = tempfile::tempdir().unwrap();
    let mut s = Session::open(Store::new(dir.path()));
    s.open_cylinder_picker(0);
    let p = picker(&s);
    assert!(!p.singles.is_empty() && !p.pairs.is_empty());
    let all = presets();
    assert!(p.singles.iter().all(|r| all[r.index].set.count == 1));
    assert!(p.pairs.iter().all(|r| all[r.index].set.count == 2));
    assert_eq!(p.singles.len() + p.pairs.len(), all.len());
    // Every twin and sidemount preset is among the pairs.
    for name in [
        "Twin 12 L 232 bar",
        "Sidemount aluminium 77.4 cu ft 3000 psi",
    ] {
        assert!(p.pairs.iter().any(|r| r.title == name), "{name}");
    }
    // Each row shows what to check on the cylinder: the stamp, or the rating.
    // Trade fact, from memory: an aluminium 80 is rated 77.4 cu ft at 3000 psi.
    let row = |t: &str| p.singles.iter().chain(&p.pairs).find(|r| r.title == t);
    let al80 = &row("Single aluminium 77.4 cu ft 3000 psi").unwrap().detail;
    assert!(al80.contains("77.4 cu ft at 3000 psi"), "{al80}");
    let twin = &row("Twin 12 L 232 bar").unwrap().detail;
    assert!(twin.contains("each 12 L at 232 bar"), "{twin}");
}

#[test]
fn the_custom_entry_names_the_missing_field() {
    let dir = tempfile::tempdir().unwrap();
    let mut s = Session::open(Store::new(dir.path()));
    s.open_cylinder_picker(0);
    s.open_custom_cylinders();
    s.edit_custom(|c| c.set_rated(true));
    let c = picker(&s).custom.unwrap();
    assert!(
        c.problem.contains("Rated volume per cylinder"),
        "{}",
        c.problem
    );
    assert_eq!(c.first_value, "—");
    s.edit_custom(|c| {
        c.first = Some(77.4);
        c.second = Some(3000.0);
        c.set_count(1);
    });
    let c = picker(&s).custom.unwrap();
    assert_eq!(c.problem, "");
    // Trade fact, from memory: 77.4 cu ft at 3000 psi is about 11.1 L of water.
    assert!(
        c.summary.starts_with("Single 77.4 cu ft 3000 psi · 11."),
        "{}",
        c.summary
    );
}
