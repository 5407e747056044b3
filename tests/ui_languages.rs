//! Every language on screen, through the real toolkit: a diver whose phone speaks
//! Spanish, French, German, Italian or Portuguese reads the starts in with the keypad
//! in their own words, and the turn card shows the same turns as the plan, its lines in
//! their language and its decimals with a comma.

mod ui_common;
use ui_common::{press, settle, value};

use std::rc::Rc;

use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::app::clock::ManualClock;
use turnsheet::app::view_models::turn_rows;
use turnsheet::i18n::{Language, LanguageScope, tr, tr_with};
use turnsheet::plan::shown;

/// 3 December 2026, 09:42 UTC.
const MORNING: i64 = 1_796_463_720;

/// A decimal number written with `mark` ("54.4", "54,4").
fn has_decimal(text: &str, mark: char) -> bool {
    let c: Vec<char> = text.chars().collect();
    c.windows(3)
        .any(|w| w[0].is_ascii_digit() && w[1] == mark && w[2].is_ascii_digit())
}

/// Tall enough that every card is laid out (lists build only what is on screen).
fn open(dir: &std::path::Path, l: Language) -> App {
    let app = App::with_clock(dir, Rc::new(ManualClock::at(MORNING))).unwrap();
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 4000.0));
    app.set_system_language(l);
    press(&app, &tr("acknowledge cautions"));
    settle();
    app
}

/// Each diver's start, typed on the keypad as read on the gauge.
fn read_starts(app: &App) {
    let names = app.session.borrow().team.plan().names();
    for (i, n) in names.iter().enumerate() {
        let start = {
            let s = app.session.borrow();
            let g = s.team.input().gauge_of(i);
            g.value(s.team.input().divers[i].start).floor()
        };
        press(app, &tr_with("start pressure of {0}", &[n]));
        for c in format!("{start}").chars() {
            press(app, &c.to_string());
        }
        press(app, &tr("done"));
        settle();
    }
}

#[test]
fn a_turn_card_reads_in_every_language() {
    i_slint_backend_testing::init_no_event_loop();
    for l in Language::ALL {
        let dir = tempfile::tempdir().unwrap();
        let app = open(dir.path(), l);
        read_starts(&app);
        press(&app, &tr("show turns"));
        settle();
        let names = app.session.borrow().team.plan().names();
        let english = {
            let _en = LanguageScope::new(Language::English);
            turn_rows(&app.session.borrow())
        };
        for (i, n) in names.iter().enumerate() {
            // The turn is the plan's, whatever the language.
            let want = {
                let s = app.session.borrow();
                let d = &s.team.plan().divers[i];
                format!("{} {}", shown::turn(d.turn_shown_value), d.gauge.label())
            };
            assert_eq!(value(&app, &tr_with("turn of {0}", &[n])), want, "{l:?}");

            let how = value(&app, &tr_with("how the turn of {0} was found", &[n]));
            assert!(!how.is_empty(), "{l:?}: no line on how the turn was found");
            if l != Language::English {
                assert_ne!(
                    how,
                    english[i].how.replace('\u{a0}', " "),
                    "{l:?}: English words"
                );
            }

            // The pencil sums, one tap away, write decimals as the language does.
            press(&app, &tr_with("sums of {0}", &[n]));
            settle();
            let sums = value(&app, &tr_with("hand check of {0}", &[n]));
            let en_sums = english[i].sums.replace('\u{a0}', " ");
            assert!(
                has_decimal(&en_sums, '.'),
                "the demo team's sums show a decimal: {en_sums}"
            );
            let (mark, other) = match l {
                Language::English => ('.', ','),
                _ => (',', '.'),
            };
            assert!(has_decimal(&sums, mark), "{l:?}: {sums}");
            assert!(!has_decimal(&sums, other), "{l:?}: {sums}");
            if l != Language::English {
                assert_ne!(sums, en_sums, "{l:?}: the sums' words are English");
            }
        }
    }
}

#[test]
fn the_settings_choice_overrides_the_system_language() {
    i_slint_backend_testing::init_no_event_loop();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path(), Language::French);
    // The French screen names the choice in French; German is chosen by its own name.
    let rows = app.session.borrow().language_choice();
    assert_eq!(rows, 0, "follows the system at first");
    app.window
        .global::<turnsheet::app::ui::Nav>()
        .invoke_go(turnsheet::app::ui::Page::Settings);
    settle();
    press(&app, &format!("{} Deutsch", tr("language")));
    settle();
    assert_eq!(turnsheet::i18n::language(), Language::German);
    assert_eq!(shown::num(157.5), "157,5");
    // Kept for the next start, over the system's language.
    drop(app);
    let again = App::with_clock(dir.path(), Rc::new(ManualClock::at(MORNING))).unwrap();
    again.set_system_language(Language::Italian);
    assert_eq!(again.session.borrow().language(), Language::German);
}

/// Units that must stay on the line of their number.
const UNITS: [&str; 11] = [
    "L/min", "cu ft", "bar", "psi", "min", "°C", "°F", "L", "m", "ft", "%",
];

/// The first place where a number and its unit are parted by an ordinary space (where
/// a narrow screen may end the line), if any.
fn unit_split(text: &str) -> Option<String> {
    let c: Vec<char> = text.chars().collect();
    for k in 1..c.len() {
        if c[k] != ' ' || !c[k - 1].is_ascii_digit() {
            continue;
        }
        let rest: String = c[k + 1..].iter().collect();
        let unit = UNITS.iter().any(|u| {
            rest.starts_with(u)
                && rest[u.len()..]
                    .chars()
                    .next()
                    .is_none_or(|n| !n.is_alphanumeric())
        });
        if unit {
            let from = k.saturating_sub(12);
            return Some(c[from..(k + 8).min(c.len())].iter().collect());
        }
    }
    None
}

#[test]
fn numbers_keep_their_units_in_every_language() {
    use slint::Model;
    use turnsheet::app::adapters::refresh_all;
    use turnsheet::app::ui::{LockerAdapter, PickerAdapter, TurnsAdapter};
    i_slint_backend_testing::init_no_event_loop();
    assert!(
        unit_split("tras unos 18 min.").is_some(),
        "the check can fail"
    );
    assert!(unit_split("18\u{a0}min, 12 Liters").is_none());
    for l in Language::ALL {
        let dir = tempfile::tempdir().unwrap();
        let app = open(dir.path(), l);
        {
            let mut s = app.session.borrow_mut();
            for i in 0..s.team.len() {
                s.confirm_start(i);
            }
            s.open_cylinder_picker(0);
        }
        refresh_all(&app.window, &app.session.borrow());
        let mut shown = Vec::new();
        let p = app.window.global::<PickerAdapter>();
        shown.push(p.get_title().to_string());
        for rows in [p.get_locker(), p.get_singles(), p.get_pairs()] {
            for r in rows.iter() {
                shown.push(r.title.to_string());
                shown.push(r.detail.to_string());
            }
        }
        let k = app.window.global::<LockerAdapter>();
        for r in k.get_presets().iter() {
            shown.push(r.name.to_string());
            shown.push(r.detail.to_string());
        }
        for r in k.get_entries().iter() {
            shown.push(r.name.to_string());
            shown.push(r.detail.to_string());
        }
        let t = app.window.global::<TurnsAdapter>();
        let first = t.get_first_text().to_string();
        assert!(!first.is_empty(), "{l:?}: no first-to-turn line");
        shown.push(first);
        shown.extend(t.get_warnings().iter().map(|w| w.to_string()));
        assert!(shown.len() > 20, "{l:?}: {} texts", shown.len());
        for text in &shown {
            assert_eq!(unit_split(text), None, "{l:?}: {text:?}");
        }
    }
}
