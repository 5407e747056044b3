//! Unit tests of the team controller: edits are refused whole, nudges land on the step.

use super::*;

fn demo() -> TeamController {
    let f = TeamFile::parse(include_str!("../../../examples/hollowmere-team.json")).unwrap();
    TeamController::new(f.to_input().unwrap(), vec![]).unwrap()
}

#[test]
fn invalid_edit_keeps_the_plan() {
    let mut t = demo();
    let before = t.plan().clone();
    let e = t.set_start(0, Pressure::from_bar(400.0)).unwrap_err();
    assert_eq!(e.field, "divers[0].start");
    assert_eq!(t.plan(), &before);
}

#[test]
fn nudges_land_on_the_step() {
    let mut t = demo();
    t.nudge_start(0, 1).unwrap();
    assert!((t.input().divers[0].start.bar() - 220.0).abs() < 1e-9);
    t.nudge_start(0, -1).unwrap();
    t.nudge_start(0, -1).unwrap();
    assert!((t.input().divers[0].start.bar() - 200.0).abs() < 1e-9);
}

#[test]
fn units_switch_keeps_physical_pressures() {
    let mut t = demo();
    // Bram's start was read on his bar gauge; Sol's was never read.
    t.mark_read(
        1,
        crate::app::clock::Clock::now(&crate::app::clock::SystemClock),
    );
    let bar = t.input().divers[1].start.bar();
    t.set_units(UnitSystem::Imperial).unwrap();
    assert_eq!(t.input().gauge_step, 100.0);
    assert!((t.input().divers[1].start.bar() - bar).abs() < 1e-9);
    assert_eq!(t.input().gauge_of(1).unit, crate::plan::PressureUnit::Bar);
    assert_eq!(t.plan().units, UnitSystem::Imperial);
    // An unread placeholder follows the team onto the psi graduation.
    assert_eq!(t.input().gauge_of(2).unit, crate::plan::PressureUnit::Psi);
    assert_eq!(
        t.input().gauge_of(2).value(t.input().divers[2].start) % 100.0,
        0.0
    );
}

#[test]
fn a_new_gauge_unit_makes_the_start_unread() {
    let mut t = demo();
    let now = crate::app::clock::Clock::now(&crate::app::clock::SystemClock);
    t.mark_read(0, now);
    t.set_gauge(0, crate::app::session::GAUGES[1]).unwrap(); // 5 bar: same unit, still read
    assert_eq!(
        t.start_status(0, now),
        crate::app::readings::StartStatus::Fresh
    );
    t.set_gauge(0, crate::app::session::GAUGES[2]).unwrap(); // 100 psi: read again
    assert_eq!(
        t.start_status(0, now),
        crate::app::readings::StartStatus::Missing
    );
    assert_eq!(t.input().gauge_of(0).unit, crate::plan::PressureUnit::Psi);
}

#[test]
fn add_and_remove_respect_team_size() {
    let mut t = demo();
    let set = t.input().divers[0].cylinders;
    for _ in 0..3 {
        t.add_diver(set, "x").unwrap();
    }
    assert!(t.add_diver(set, "x").is_err());
    assert_eq!(t.len(), 6);
    assert_eq!(t.labels().len(), 6);
    for _ in 0..4 {
        t.remove_diver(0).unwrap();
    }
    assert!(t.remove_diver(0).is_err());
}

#[test]
fn an_unread_diver_picking_a_rated_set_reads_psi() {
    use crate::plan::{CylinderSet, CylinderSpec, PressureUnit};
    let mut t = demo();
    let rated = CylinderSet::twins(CylinderSpec::Rated {
        rated_cuft: 104.0,
        rated_psi: 2640.0,
    });
    t.set_cylinders(0, rated, "Twin steel 104").unwrap();
    assert_eq!(t.input().gauge_of(0).unit, PressureUnit::Psi);
    // A diver whose start was read keeps the gauge it was read on.
    // (Bram's 205 bar still fits the new set, so his reading stands.)
    t.mark_read(
        1,
        crate::app::clock::Clock::now(&crate::app::clock::SystemClock),
    );
    t.set_cylinders(1, rated, "Twin steel 104").unwrap();
    assert_eq!(t.input().gauge_of(1).unit, PressureUnit::Bar);
}

#[test]
fn a_typed_name_is_stored_in_one_form() {
    // "José" typed with a combining acute accent (U+0301) is the same name as with the
    // precomposed "é" (U+00E9): Unicode normalization form C (UAX #15).
    let mut t = demo();
    t.set_name(0, "Jose\u{301}").unwrap();
    assert_eq!(t.input().divers[0].name, "Jos\u{e9}");
}

#[test]
fn a_saved_team_with_old_preset_names_loads_with_the_names_of_now() {
    let mut state = demo().to_state();
    // "Aluminium 80" is a preset's old name on purpose: files saved with it still load.
    state.cylinder_labels = vec!["Aluminium 80".into(), "My own".into(), String::new()];
    let t = TeamController::from_state(&state).unwrap();
    assert_eq!(t.labels()[0], "Single aluminium 77.4 cu ft 3000 psi");
    assert_eq!(t.labels()[1], "My own");
}

#[test]
fn a_fill_warning_waits_for_its_start_to_be_read() {
    let mut t = demo();
    let now = 1_796_342_280;
    // Ines's twins are 232 bar sets: 250 bar is above their working pressure.
    t.set_start(0, Pressure::from_bar(250.0)).unwrap();
    let about_ines = |t: &TeamController| {
        t.shown_warnings(now)
            .iter()
            .any(|w| matches!(w, crate::plan::Warning::AboveWorking { diver: 0, .. }))
    };
    assert!(
        t.plan()
            .warnings
            .iter()
            .any(|w| matches!(w, crate::plan::Warning::AboveWorking { diver: 0, .. })),
        "the plan has the warning"
    );
    assert!(!about_ines(&t), "not shown while the start is unread");
    t.mark_read(0, now);
    assert!(about_ines(&t), "shown once read");
}
