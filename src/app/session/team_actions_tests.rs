//! Tests of the Team page's actions on the session.

use super::*;
use crate::storage::Store;

use crate::app::session::test_session as session;

#[test]
fn a_refused_edit_is_reported_and_the_plan_stays() {
    let (_dir, mut s) = session();
    s.confirm_start(0);
    // Step Ines's start up until it passes 1.5 × the working pressure.
    let mut last = s.team.plan().clone();
    for _ in 0..40 {
        s.nudge_start(0, 1);
        if s.status.iter().next().is_some() {
            break;
        }
        last = s.team.plan().clone();
    }
    assert!(s.status.text().contains("1.5 ×"), "{:?}", s.status);
    assert_eq!(s.team.plan(), &last, "the refused step left the plan alone");
}

#[test]
fn the_demo_says_so_until_a_team_of_ones_own() {
    let (dir, mut s) = session();
    assert!(s.team.is_demo());
    assert!(crate::app::view_models::demo_note(&s).contains("invented"));
    s.save_all();
    let again = Session::open(Store::new(dir.path()));
    assert!(again.team.is_demo(), "kept across a restart");
    s.team.set_name(0, "Ana").unwrap();
    assert!(!s.team.is_demo(), "a diver of one's own");
    let (_dir, mut s) = session();
    s.new_team();
    assert!(!s.team.is_demo());
    assert_eq!(crate::app::view_models::demo_note(&s), "");
}

#[test]
fn the_steppers_of_a_start_not_read_today_open_the_keypad() {
    let (_dir, mut s) = session();
    let before = s.team.input().divers[1].start;
    s.nudge_start(1, 1);
    assert_eq!(
        s.team.input().divers[1].start,
        before,
        "no number stepped from"
    );
    assert_eq!(
        s.entry.as_ref().map(|e| e.target()),
        Some(crate::app::session::EntryTarget::Start(1))
    );
    assert_eq!(
        s.entry.as_ref().unwrap().buffer().text(),
        "",
        "the keypad opens empty: read the gauge"
    );
    s.cancel_entry();
    s.confirm_start(1);
    s.nudge_start(1, 1);
    assert!(s.entry.is_none());
    assert!(s.team.input().divers[1].start.bar() > before.bar());
}

#[test]
fn a_stage_drop_needs_the_stage_gauge_read_today() {
    use crate::app::readings::StartStatus;
    use crate::app::session::EntryTarget;
    let (dir, mut s) = session();
    for i in 0..s.team.len() {
        s.confirm_start(i);
    }
    // Ines carries a stage in the demo; nobody has read its gauge.
    let now = s.now();
    assert_eq!(s.team.stage_status(0, now), Some(StartStatus::Missing));
    assert_eq!(s.team.stage_status(1, now), None, "Bram has no stage");
    let text = crate::app::view_models::stage_text(&s, 0);
    assert!(text.contains("read the stage gauge of Ines"), "{text}");
    s.open_entry(EntryTarget::StageStart(0));
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "", "opens empty");
    for k in ["1", "9", "0"] {
        s.key(k);
    }
    s.entry_done();
    assert_eq!(s.team.stage_status(0, now), Some(StartStatus::Fresh));
    let text = crate::app::view_models::stage_text(&s, 0);
    assert!(text.starts_with("Drop stage at"), "{text}");
    // Kept with the team; a new stage set is unread again.
    let again = Session::open(Store::new(dir.path()));
    assert_eq!(again.team.stage_status(0, now), Some(StartStatus::Fresh));
    let set = s.team.input().divers[0].stage.as_ref().unwrap().cylinders;
    s.team.set_stage_cylinders(0, Some(set), "Another").unwrap();
    assert_eq!(s.team.stage_status(0, now), Some(StartStatus::Missing));
}

#[test]
fn a_new_team_has_two_full_divers_on_air() {
    let (_dir, mut s) = session();
    s.new_team();
    let input = s.team.input();
    assert_eq!(input.divers.len(), 2);
    assert_eq!(input.divers[0].name, "Me");
    assert!(input.divers.iter().all(|d| d.stage.is_none()));
    assert!(input.divers.iter().all(|d| d.start.bar() % 10.0 == 0.0));
}

#[test]
fn the_dive_and_the_default_water_temperatures_are_apart() {
    let (_dir, mut s) = session();
    let default = s.settings.water_temp_c;
    let dive = s.team.input().water_temp.celsius();
    s.nudge_water_temp(-1);
    assert!((s.team.input().water_temp.celsius() - (dive - 1.0)).abs() < 1e-9);
    assert_eq!(
        s.settings.water_temp_c, default,
        "the dive's water is not the default"
    );
    s.nudge_default_water_temp(1);
    assert_eq!(s.settings.water_temp_c, default + 1.0);
    assert!((s.team.input().water_temp.celsius() - (dive - 1.0)).abs() < 1e-9);
    s.new_team();
    assert!((s.team.input().water_temp.celsius() - (default + 1.0)).abs() < 1e-9);
    // The default stays within what a team accepts (-2 to 40 °C, the core's range).
    for _ in 0..60 {
        s.nudge_default_water_temp(1);
    }
    assert_eq!(s.settings.water_temp_c, 40.0);
}
