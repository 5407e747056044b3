//! The keypad without Slint: apply as you type, revert on a bad key, cancel, Done.

use super::*;
use crate::app::nav::Screen;
use crate::plan::{Pressure, UnitSystem};

use crate::app::session::test_session as session;

fn keys(s: &mut Session, keys: &[&str]) {
    for k in keys {
        s.key(k);
    }
}

fn reason(s: &Session) -> String {
    s.entry.as_ref().unwrap().reason().to_string()
}

fn start_bar(s: &Session, i: usize) -> f64 {
    s.team.input().divers[i].start.bar()
}

#[test]
fn a_live_field_applies_as_you_type_and_done_keeps_it() {
    let (_dir, mut s) = session();
    s.open_entry(EntryTarget::Start(0));
    keys(&mut s, &["clear", "2", "0", "0"]);
    assert_eq!(reason(&s), "");
    assert_eq!(start_bar(&s, 0), 200.0, "applied before Done");
    s.entry_done();
    assert!(s.entry.is_none());
    assert_eq!(start_bar(&s, 0), 200.0);
}

#[test]
fn a_bad_key_shows_its_reason_and_the_plan_goes_back_to_the_start_value() {
    let (_dir, mut s) = session();
    let original = start_bar(&s, 0);
    let plan = s.team.plan().clone();
    s.open_entry(EntryTarget::Start(0));
    keys(&mut s, &["clear", "2", "0"]);
    assert_eq!(start_bar(&s, 0), 20.0, "20 bar is a usable start");
    s.key("0");
    s.key("0");
    assert!(reason(&s).contains("1.5 ×"), "{}", reason(&s));
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "2000");
    assert_eq!(start_bar(&s, 0), original);
    assert_eq!(s.team.plan(), &plan);
    s.entry_done();
    assert!(s.entry.is_some(), "Done does not take an unusable value");
}

#[test]
fn cancel_puts_back_the_start_value() {
    let (_dir, mut s) = session();
    let plan = s.team.plan().clone();
    s.open_entry(EntryTarget::Sac(1));
    keys(&mut s, &["clear", "3", "0"]);
    assert_eq!(s.team.input().divers[1].sac_l_per_min, Some(30.0));
    s.cancel_entry();
    assert!(s.entry.is_none());
    assert_eq!(s.team.plan(), &plan);
}

#[test]
fn an_empty_name_or_a_taken_one_is_refused() {
    let (_dir, mut s) = session();
    let name = s.team.input().divers[1].name.clone();
    let other = s.team.input().divers[0].name.to_uppercase();
    s.open_entry(EntryTarget::DiverName(1));
    s.key("clear");
    assert!(reason(&s).contains("1 to 24"));
    for c in other.chars() {
        s.key(&c.to_string());
    }
    assert_eq!(reason(&s), "another diver already has this name");
    assert_eq!(s.team.input().divers[1].name, name);
    s.key("X");
    assert_eq!(reason(&s), "");
    s.entry_done();
    assert_eq!(
        s.team.input().divers[1].name,
        format!("{}x", s.team.input().divers[0].name)
    );
}

#[test]
fn step_keys_follow_the_fields_step_flag() {
    let (_dir, mut s) = session();
    s.open_entry(EntryTarget::Start(0));
    assert_eq!(s.entry.as_ref().unwrap().step(), Some(10.0));
    keys(&mut s, &["clear", "2", "1", "7", "+step"]);
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "220");
    keys(&mut s, &["-step", "-step"]);
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "200");
    keys(&mut s, &["clear", "-step"]);
    assert_eq!(
        s.entry.as_ref().unwrap().buffer().text(),
        "0",
        "never below zero"
    );
    s.cancel_entry();
    s.open_entry(EntryTarget::StageStart(0));
    let before = s.entry.as_ref().unwrap().buffer().text().to_string();
    assert_eq!(s.entry.as_ref().unwrap().step(), None);
    s.key("+step");
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), before);
}

#[test]
fn fields_that_do_not_drive_the_plan_apply_on_done_only() {
    let (_dir, mut s) = session();
    let before = s.fill.pressure;
    s.open_entry(EntryTarget::FillPressure);
    keys(&mut s, &["clear", "2", "0", "0"]);
    assert_eq!(s.fill.pressure, before);
    s.entry_done();
    assert_eq!(s.fill.pressure, Pressure::from_bar(200.0));

    s.locker_new();
    assert_eq!(s.page(), Screen::LockerEdit);
    s.open_entry(EntryTarget::LockerFirst);
    keys(&mut s, &["4", "5"]);
    assert!(reason(&s).contains("allowed 0.5 to 30 L"), "{}", reason(&s));
    keys(&mut s, &["del", "del", "1", "2", ".", "5"]);
    assert_eq!(s.locker.draft().unwrap().first, None);
    s.entry_done();
    assert_eq!(s.locker.draft().unwrap().first, Some(12.5));
}

#[test]
fn the_dive_water_is_live_and_the_default_is_set_on_done_only() {
    let (_dir, mut s) = session();
    let default = s.settings.water_temp_c;
    s.open_entry(EntryTarget::WaterTemp);
    keys(&mut s, &["clear", "8"]);
    assert!((s.team.input().water_temp.celsius() - 8.0).abs() < 1e-9);
    s.entry_done();
    assert_eq!(
        s.settings.water_temp_c, default,
        "a dive's water is not the default"
    );
    s.open_entry(EntryTarget::DefaultWaterTemp);
    keys(&mut s, &["4", "1"]);
    assert!(reason(&s).contains("-2 to 40"), "{}", reason(&s));
    keys(&mut s, &["del"]);
    assert_eq!(s.settings.water_temp_c, default, "applied on Done only");
    s.entry_done();
    assert_eq!(s.settings.water_temp_c, 4.0);
    assert!((s.team.input().water_temp.celsius() - 8.0).abs() < 1e-9);
}

#[test]
fn a_physical_keyboard_types_into_the_open_keypad() {
    let (_dir, mut s) = session();
    assert!(!s.keyboard("5"), "no keypad open");
    s.open_entry(EntryTarget::Start(0));
    for k in ["2", "x", "1", "0", "\u{8}", "5"] {
        s.keyboard(k);
    }
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "215");
    assert!(s.keyboard("\u{f701}"), "down arrow: one step down");
    let g = s.team.input().gauge_of(0);
    assert_eq!(
        s.entry.as_ref().unwrap().buffer().text(),
        shown::num(crate::plan::next_step(215.0, g.step, -1))
    );
    assert!(s.keyboard("\n"));
    assert!(s.entry.is_none(), "Enter is Done");
    assert_eq!(
        s.team.input().divers[0].start.bar(),
        crate::plan::next_step(215.0, g.step, -1)
    );
    s.open_entry(EntryTarget::DiverName(0));
    for k in ["b", "o", "\u{7f}", "e", " ", "l", "3"] {
        s.keyboard(k);
    }
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "Be L3");
}

#[test]
fn opening_and_cancelling_an_imperial_start_changes_nothing() {
    let (_dir, mut s) = session();
    s.set_units(UnitSystem::Imperial);
    s.team.set_start(0, Pressure::from_psi(3000.0)).unwrap();
    s.team.mark_read(0, s.now());
    let plan = s.team.plan().clone();
    s.open_entry(EntryTarget::Start(0));
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "3000");
    s.key("9");
    s.cancel_entry();
    assert_eq!(s.team.plan(), &plan);
}

#[test]
fn an_unread_start_opens_empty_and_a_bad_key_restores_the_placeholder() {
    let (_dir, mut s) = session();
    let before = start_bar(&s, 1);
    s.open_entry(EntryTarget::Start(1));
    assert_eq!(s.entry.as_ref().unwrap().buffer().text(), "");
    assert!(!reason(&s).is_empty(), "Done needs a number from the gauge");
    keys(&mut s, &["2", "0", "0", "0"]);
    assert_eq!(start_bar(&s, 1), before);
    s.cancel_entry();
    assert_eq!(start_bar(&s, 1), before);
    assert_eq!(
        s.team.start_status(1, s.now()),
        crate::app::readings::StartStatus::Missing
    );
}
