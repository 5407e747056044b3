//! Ordinary use on the dock must never put a wrong, stale or ambiguous turn in front of a
//! diver: a stray tap on the rule, a second dive, a tap that lands on a control that just
//! moved, a reading taken before midnight. Through the real toolkit, with the clock
//! handed in.

mod ui_common;
use ui_common::{all, find, page, press, settle, value};

use std::rc::Rc;

use i_slint_backend_testing::ElementHandle;
use slint::ComponentHandle;
use slint::platform::PointerEventButton;
use turnsheet::app::App;
use turnsheet::app::clock::ManualClock;
use turnsheet::app::ui::Page;
use turnsheet::plan::plan_team;

/// 3 December 2026, 23:58 UTC.
const LATE: i64 = 1_796_342_280;

fn open_at(dir: &std::path::Path, clock: &ManualClock, w: f32, h: f32) -> App {
    i_slint_backend_testing::init_no_event_loop();
    let app = App::with_clock(dir, Rc::new(clock.clone())).unwrap();
    app.window.window().set_size(slint::LogicalSize::new(w, h));
    if page(&app) == Page::Cautions {
        press(&app, "acknowledge cautions");
    }
    app
}

fn read_all(app: &App) {
    let names: Vec<String> = app.session.borrow().team.plan().names();
    for n in names {
        press(app, &format!("start pressure of {n}"));
        let start = {
            let s = app.session.borrow();
            let i = s.team.plan().names().iter().position(|x| *x == n).unwrap();
            let g = s.team.input().gauge_of(i);
            g.value(s.team.input().divers[i].start).floor()
        };
        for c in format!("{start}").chars() {
            press(app, &c.to_string());
        }
        press(app, "done");
    }
}

fn turn(app: &App, name: &str) -> String {
    value(app, &format!("turn of {name}"))
}

#[test]
fn a_rule_change_says_what_it_did_and_the_buddy_view_names_the_rule() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    read_all(&app);
    press(&app, "show turns");
    let before: Vec<String> = ["Ines", "Bram", "Sol"]
        .iter()
        .map(|n| turn(&app, n))
        .collect();
    assert!(value(&app, "rule line").starts_with("Rule of thirds"));
    press(&app, "Buddy view");
    assert!(value(&app, "buddy view heading").contains("Rule of thirds"));
    assert!(value(&app, "buddy view heading").contains("°C"));
    press(&app, "close buddy view");
    press(&app, "back");
    // A tap on halves asks first; keeping the rule changes nothing.
    press(&app, "rule halves");
    assert!(value(&app, "question").contains("open-water rule"));
    press(&app, "keep the rule");
    assert_eq!(
        app.session.borrow().team.input().rule,
        turnsheet::plan::Rule::Thirds
    );
    press(&app, "rule quarters");
    let note = value(&app, "undo note");
    assert!(note.starts_with("Rule now quarters. Turns: "), "{note}");
    let plan = plan_team(app.session.borrow().team.input()).unwrap();
    for (d, was) in plan.divers.iter().zip(&before) {
        let now = format!("{} {}", d.turn_shown_value, d.gauge.label());
        if now == *was {
            assert!(note.contains(&format!("{} {now} (same)", d.name)), "{note}");
        } else {
            let was_n = was.split(' ').next().unwrap();
            assert!(
                note.contains(&format!("{} {was_n} → {now}", d.name)),
                "{note}"
            );
        }
    }
    press(&app, "undo");
    press(&app, "show turns");
    let after: Vec<String> = ["Ines", "Bram", "Sol"]
        .iter()
        .map(|n| turn(&app, n))
        .collect();
    assert_eq!(after, before, "Undo puts every turn back");
}

#[test]
fn next_dive_unreads_every_start_and_undoes() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    read_all(&app);
    // Read at 23:58, the dive at 00:05: the same dive, turns shown, read times said.
    clock.advance(7 * 60);
    press(&app, "show turns");
    assert!(turn(&app, "Ines").ends_with("bar") && !turn(&app, "Ines").starts_with('—'));
    assert!(
        value(&app, "start reading of Ines").contains("read "),
        "{}",
        value(&app, "start reading of Ines")
    );
    let shown = turn(&app, "Ines");
    press(&app, "back");
    press(&app, "next dive");
    assert!(value(&app, "undo note").starts_with("Next dive"));
    press(&app, "show turns");
    assert_eq!(turn(&app, "Ines"), "— bar");
    press(&app, "back");
    press(&app, "undo");
    press(&app, "show turns");
    assert_eq!(turn(&app, "Ines"), shown);
    // Three hours after the reading the turns go, with nobody touching the phone: the
    // window's clock watch looks.
    clock.advance(3 * 3600);
    i_slint_backend_testing::mock_elapsed_time(turnsheet::app::CLOCK_WATCH);
    slint::platform::update_timers_and_animations();
    assert_eq!(turn(&app, "Ines"), "— bar");
}

#[test]
fn the_gauge_is_chosen_not_cycled_and_nothing_slides_under_a_finger() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    // Shorter than the page (as on a phone, the page scrolls), tall enough to hold
    // Bram's card without scrolling.
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    read_all(&app);
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 1800.0));
    // Entered yesterday: "Still reads" beside the gauge button.
    clock.advance(24 * 3600);
    press(&app, "Settings");
    press(&app, "back");
    let gauge = find(&app, "gauge of Bram");
    let (p, s) = (gauge.absolute_position(), gauge.size());
    settle();
    find(&app, "confirm start of Bram").mock_single_click(PointerEventButton::Left);
    slint::platform::update_timers_and_animations();
    assert!(all(&app, "confirm start of Bram").is_empty(), "confirmed");
    let gauge = find(&app, "gauge of Bram");
    assert_eq!(
        (gauge.absolute_position(), gauge.size()),
        (p, s),
        "the gauge button stays put"
    );
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 4000.0));
    press(&app, "confirm start of Ines");
    press(&app, "confirm start of Sol");
    let gauge = find(&app, "gauge of Bram");
    // The gauge button only opens the chooser, with the current gauge marked.
    settle();
    gauge.mock_single_click(PointerEventButton::Left);
    assert!(value(&app, "gauge bar 10").contains("(now)"));
    press(&app, "gauge psi 50");
    let g = app.session.borrow().team.input().gauge_of(1);
    assert_eq!((g.label(), g.step), ("psi", 50.0));
    assert!(value(&app, "undo note").starts_with("Gauge of Bram now psi"));
    // A control that just appeared ignores a pointer tap for a moment.
    press(&app, "undo");
    press(&app, "remove Sol");
    let undo = find(&app, "undo");
    undo.mock_single_click(PointerEventButton::Left);
    assert_eq!(
        app.session.borrow().team.len(),
        2,
        "a tap on a button that just appeared is ignored"
    );
    settle();
    find(&app, "undo").mock_single_click(PointerEventButton::Left);
    assert_eq!(
        app.session.borrow().team.len(),
        3,
        "once settled, the tap counts"
    );
}

#[test]
fn the_chart_boxes_only_starts_read_for_this_dive() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    let boxed = |app: &App| {
        i_slint_backend_testing::ElementQuery::from_root(&app.window)
            .match_descendants()
            .match_predicate(|e: &ElementHandle| {
                e.accessible_description().is_some_and(|d| d == "planned")
            })
            .find_all()
            .into_iter()
            .filter_map(|e| e.accessible_label())
            .collect::<std::collections::BTreeSet<_>>()
            .len()
    };
    press(&app, "show turns");
    press(&app, "Chart");
    assert_eq!(page(&app), Page::Chart);
    assert_eq!(boxed(&app), 0, "unread starts: nothing boxed");
    press(&app, "back");
    press(&app, "back");
    read_all(&app);
    press(&app, "show turns");
    press(&app, "Chart");
    assert_eq!(boxed(&app), 1);
    clock.advance(3 * 3600 + 60);
    i_slint_backend_testing::mock_elapsed_time(turnsheet::app::CLOCK_WATCH);
    slint::platform::update_timers_and_animations();
    assert_eq!(boxed(&app), 0, "three hours on: nothing boxed");
}

#[test]
fn the_named_controller_is_the_one_whose_sums_are_shown() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    read_all(&app);
    press(&app, "show turns");
    let rule = value(&app, "rule line");
    let s = app.session.borrow();
    let sources = turnsheet::plan::allowance_sources(s.team.input(), s.team.plan());
    for a in &sources {
        let name = &s.team.plan().divers[a.diver].name;
        // "4237 L (Buddy) ÷ 3 = 1412 L": the content, whose, the rule, the allowance.
        let sum = format!(
            "{} L ({name}) ÷ 3 = {} L",
            a.content.floor(),
            a.allowance.floor()
        );
        assert!(rule.contains(&sum), "{sum} in {rule}");
        assert!(rule.contains(&format!("{name} control")), "{rule}");
    }
}

#[test]
fn a_second_dive_is_next_dive_and_one_keypad_entry_per_diver() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    read_all(&app);
    clock.advance(2 * 3600);
    let taps = std::cell::Cell::new(0);
    let tap = |label: &str| {
        taps.set(taps.get() + 1);
        press(&app, label);
    };
    tap("next dive");
    for (name, start) in [("Ines", "190"), ("Bram", "180"), ("Sol", "200")] {
        tap(&format!("start pressure of {name}"));
        for c in start.chars() {
            tap(&c.to_string());
        }
        tap("done");
    }
    tap("show turns");
    for name in ["Ines", "Bram", "Sol"] {
        assert!(
            !turn(&app, name).starts_with('—'),
            "{name}: {}",
            turn(&app, name)
        );
    }
    println!("second dive of three divers: {} taps", taps.get());
    assert_eq!(taps.get(), 1 + 3 * 5 + 1);
}

/// The taps a new user needs from the very first launch (cautions shown) to three divers'
/// turns: once with generic presets, once with one diver's pair entered by hand.
#[test]
fn first_launch_to_three_turns_counts_its_taps() {
    i_slint_backend_testing::init_no_event_loop();
    for custom in [false, true] {
        let dir = tempfile::tempdir().unwrap();
        let clock = ManualClock::at(LATE);
        let app = App::with_clock(dir.path(), Rc::new(clock.clone())).unwrap();
        app.window
            .window()
            .set_size(slint::LogicalSize::new(412.0, 4000.0));
        assert_eq!(page(&app), Page::Cautions);
        let taps = std::cell::Cell::new(0);
        let tap = |label: &str| {
            taps.set(taps.get() + 1);
            press(&app, label);
        };
        let keys = |s: &str| s.chars().for_each(|c| tap(&c.to_string()));
        tap("acknowledge cautions");
        tap("new team");
        tap("add diver");
        tap("cylinders of Me");
        tap("pick Single 12 L 232 bar");
        tap("cylinders of Buddy");
        if custom {
            tap("custom set");
            tap("cylinder count 2");
            tap("custom water capacity per cylinder");
            keys("11");
            tap("decimal separator");
            keys("1");
            tap("done");
            tap("custom working pressure");
            keys("232");
            tap("done");
            tap("use custom set");
        } else {
            tap("pick Twin 10 L 300 bar");
        }
        tap("cylinders of Diver 3");
        tap("pick Single 18 L 232 bar");
        for (name, start) in [("Me", "210"), ("Buddy", "220"), ("Diver 3", "200")] {
            tap(&format!("start pressure of {name}"));
            keys(start);
            tap("done");
        }
        tap("show turns");
        assert_eq!(page(&app), Page::Turns);
        for name in ["Me", "Buddy", "Diver 3"] {
            let t = turn(&app, name);
            assert!(t.ends_with("bar") && !t.starts_with('—'), "{name}: {t}");
        }
        let what = if custom {
            "one pair by hand"
        } else {
            "presets"
        };
        println!("first launch to three turns, {what}: {} taps", taps.get());
        // Presets: 3 to open a team of three, 2 per diver's set, 5 per start, 1 to show.
        let sets = if custom { 2 + 15 + 2 } else { 2 + 2 + 2 };
        assert_eq!(taps.get(), 3 + sets + 3 * 5 + 1);
    }
}

/// On a small phone with large text, in every language, no key of the start keypad
/// moves while a start is typed: the message line keeps its room whether it holds a
/// hint, a reason, a warning or nothing (a digit typed fast must land on the key aimed
/// at).
#[test]
fn no_keypad_key_moves_while_a_start_is_typed() {
    use i_slint_backend_testing::{AccessibleRole, ElementQuery};
    use turnsheet::app::adapters::refresh_all;
    use turnsheet::app::session::EntryTarget;
    use turnsheet::i18n::Language;
    i_slint_backend_testing::init_no_event_loop();
    for language in Language::ALL {
        let dir = tempfile::tempdir().unwrap();
        let clock = ManualClock::at(LATE);
        let app = App::with_clock(dir.path(), Rc::new(clock.clone())).unwrap();
        app.window
            .window()
            .set_size(slint::LogicalSize::new(360.0, 640.0));
        app.session.borrow_mut().acknowledge_cautions();
        app.set_system_language(language);
        app.set_font_scale(1.3);
        app.window.show().unwrap();
        // Every button on screen (the keypad covers the page), where it is.
        let buttons = || -> Vec<(String, slint::LogicalPosition, slint::LogicalSize)> {
            ElementQuery::from_root(&app.window)
                .match_descendants()
                .find_all()
                .into_iter()
                .filter(|e: &ElementHandle| e.accessible_role() == Some(AccessibleRole::Button))
                .map(|e| {
                    let label = e.accessible_label().unwrap_or_default().to_string();
                    (label, e.absolute_position(), e.size())
                })
                .collect()
        };
        // Ines has twins (one gauge); Bram has a sidemount pair (the keypad's hint).
        for diver in [0, 1] {
            app.session
                .borrow_mut()
                .open_entry(EntryTarget::Start(diver));
            refresh_all(&app.window, &app.session.borrow());
            let opened = buttons();
            assert!(opened.iter().any(|(l, ..)| l == "7"), "the keypad is open");
            // A reason comes (too low), goes (a usable start), a warning comes (above
            // the working pressure, then an overfill).
            for k in [
                "2", "1", "0", "clear", "2", "4", "0", "clear", "3", "0", "0",
            ] {
                app.session.borrow_mut().key(k);
                refresh_all(&app.window, &app.session.borrow());
                let s = app.session.borrow();
                let e = s.entry.as_ref().unwrap();
                assert_eq!(
                    buttons(),
                    opened,
                    "{} diver {diver}: a key moved after {k:?} (entry {:?}, reason {:?})",
                    language.code(),
                    e.buffer().text(),
                    e.reason(),
                );
            }
            app.session.borrow_mut().cancel_entry();
        }
    }
}

/// Once turns are shown, each plan-changing control says what it did, through the real
/// toolkit, and Undo puts the team back as it was.
#[test]
fn every_plan_change_says_what_it_did_and_undoes() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    let app = open_at(dir.path(), &clock, 412.0, 4000.0);
    read_all(&app);
    press(&app, "show turns");
    press(&app, "back");
    let cases: [(&str, &[&str]); 6] = [
        ("Water now", &["colder water"]),
        (
            "Cylinders of Bram now",
            &["cylinders of Bram", "pick Twin 12 L 232 bar"],
        ),
        ("Mix of Ines now", &["mix of Ines", "Air", "mix done"]),
        (
            "Stage of Sol now",
            &["stage of Sol", "pick Single 10 L 200 bar"],
        ),
        ("Sol carries no stage now", &["stage of Sol", "no stage"]),
        ("Gauge of Bram now", &["gauge of Bram", "gauge psi 100"]),
    ];
    for (headline, taps) in cases {
        let before = app.session.borrow().team.to_state();
        for t in taps {
            press(&app, t);
        }
        let note = value(&app, "undo note");
        assert!(note.starts_with(headline), "{headline}: {note}");
        assert!(
            note.contains("Turns: ") || note.contains("No turns until"),
            "{note}"
        );
        press(&app, "undo");
        assert_eq!(
            app.session.borrow().team.to_state(),
            before,
            "{headline}: Undo puts the team back"
        );
    }
}

/// The start box of a diver's card is as wide as the widest start on that gauge from
/// the first, so the "−" and "+" beside it stay where the finger is when a start is
/// typed, cleared or stepped (a small phone, text at 1.3, bar and psi).
#[test]
fn the_start_steps_never_move_as_a_start_is_typed() {
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(LATE);
    // As narrow as a small phone, tall enough that both cards are on screen.
    let app = open_at(dir.path(), &clock, 360.0, 2400.0);
    app.set_font_scale(1.3);
    // A new team: every start empty. Me reads bar, Buddy psi.
    {
        let mut s = app.session.borrow_mut();
        s.new_team();
        s.set_gauge(1, turnsheet::app::session::GAUGES[2]);
    }
    turnsheet::app::adapters::refresh_all(&app.window, &app.session.borrow());
    let at = |name: &str| -> Vec<(f32, f32)> {
        [
            format!("start minus one step for {name}"),
            format!("start plus one step for {name}"),
        ]
        .iter()
        .map(|l| {
            let e = find(&app, l);
            (e.absolute_position().x, e.size().width)
        })
        .collect()
    };
    let names = app.session.borrow().team.plan().names();
    assert_eq!(names.len(), 2);
    let values = [["232", "9", "50"], ["2950", "500", "3000"]];
    for (name, values) in names.iter().zip(values) {
        let shown = || value(&app, &format!("start pressure of {name}"));
        // Measured with the start still empty.
        assert!(
            !shown().starts_with(|c: char| c.is_ascii_digit()),
            "{}",
            shown()
        );
        let before = at(name);
        for v in values {
            let mut s = app.session.borrow_mut();
            let i = s
                .team
                .plan()
                .names()
                .iter()
                .position(|x| x == name)
                .unwrap();
            s.open_entry(turnsheet::app::session::EntryTarget::Start(i));
            s.key("clear");
            for c in v.chars() {
                s.key(&c.to_string());
            }
            s.entry_done();
            drop(s);
            turnsheet::app::adapters::refresh_all(&app.window, &app.session.borrow());
            assert_eq!(at(name), before, "{name} with start {v:?}");
            // The first value is a start the gauge can read: it is shown.
            if v == values[0] {
                assert!(shown().starts_with(v), "{}", shown());
            }
        }
    }
}
