//! Tests of opening a session and moving between pages.

use super::*;

#[test]
fn a_saved_team_that_no_longer_plans_is_kept_aside() {
    let dir = tempfile::tempdir().unwrap();
    let text = crate::app::session::DEMO_TEAM.replace("\"Sol\"", "\"Ines\"");
    let saved = format!("{{\"schema\": 1, \"team\": {text}}}");
    std::fs::write(dir.path().join("last-team.json"), &saved).unwrap();
    let mut s = Session::open(Store::new(dir.path()));
    assert!(
        s.status.iter().any(|m| m.contains("could not be planned")),
        "{:?}",
        s.status
    );
    s.save_all();
    let kept = crate::storage::atomic::kept_aside(dir.path(), "last-team.json");
    assert_eq!(kept.len(), 1);
    assert_eq!(std::fs::read_to_string(&kept[0]).unwrap(), saved);
}

#[test]
fn back_closes_the_keypad_then_the_picker_then_the_page() {
    let dir = tempfile::tempdir().unwrap();
    let mut s = Session::open(Store::new(dir.path()));
    s.acknowledge_cautions();
    s.locker_new();
    s.open_entry(EntryTarget::LockerName);
    assert!(s.back());
    assert!(s.entry.is_none());
    assert_eq!(s.page(), Screen::LockerEdit);
    assert!(s.back());
    assert!(
        s.locker.draft().is_none(),
        "leaving the editor drops the draft"
    );
    assert_eq!(s.page(), Screen::Team);
    s.open_mix_picker(0);
    assert!(s.back());
    assert_eq!(s.picker, Picker::None);
    assert!(!s.back(), "the Team page is left to the system");
}

#[test]
fn start_up_messages_are_in_the_language_set_before_the_files_are_read() {
    use crate::i18n::{Language, LanguageScope};
    let dir = tempfile::tempdir().unwrap();
    std::fs::write(dir.path().join("locker.json"), "{ not json").unwrap();
    let _de = LanguageScope::new(Language::German);
    let s = Session::open(Store::new(dir.path()));
    let said = s.status.text();
    let english = "The cylinder locker file could not be read";
    assert!(!said.is_empty() && !said.contains(english), "{said}");
    assert!(
        said.contains("Flaschenregal"),
        "German names the locker: {said}"
    );
}
