//! The plan's warnings reach the diver wherever a value is entered or read: the keypad
//! while typing, the diver's card, the Turns page, the team card and `turnsheet plan`,
//! all from the core's one list (`TeamPlan::warnings`). Also the locker editor's name
//! warning and the picker's preset ratings. Through the real toolkit
//! (i-slint-backend-testing), as in tests/ui_app.rs.

mod ui_common;

use i_slint_backend_testing::{ElementHandle, ElementQuery};
use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::plan_team;

fn init() {
    i_slint_backend_testing::init_no_event_loop();
}

/// The window tall enough that nothing is scrolled out of the queries' reach.
fn open(dir: &std::path::Path) -> App {
    let app = App::new(dir).unwrap();
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 4000.0));
    press(&app, "acknowledge cautions");
    app
}

/// The accessible values of the elements labelled `label` (each element once).
fn values(app: &App, label: &str) -> Vec<String> {
    let mut out: Vec<String> = ElementQuery::from_root(&app.window)
        .match_descendants()
        .match_predicate({
            let label = label.to_string();
            move |e| {
                e.accessible_label()
                    .is_some_and(|l| l.replace('\u{a0}', " ") == label)
            }
        })
        .find_all()
        .into_iter()
        .map(|e| {
            e.accessible_value()
                .unwrap_or_default()
                .replace('\u{a0}', " ")
        })
        .collect();
    out.dedup();
    out
}

fn value(app: &App, label: &str) -> String {
    let v = values(app, label);
    assert_eq!(v.len(), 1, "{label:?}: {v:?}");
    v[0].clone()
}

/// The keypad's warning about a usable value: the description of its message line.
fn entry_warning(app: &App) -> String {
    let all: Vec<_> = ElementHandle::find_by_accessible_label(&app.window, "entry problem")
        .filter_map(|e| e.accessible_description())
        .map(|d| d.replace('\u{a0}', " "))
        .collect();
    assert!(!all.is_empty(), "no keypad message line");
    all[0].clone()
}

/// Press the first element labelled `label` (a label a list may hold twice).
fn press(app: &App, label: &str) {
    ui_common::all(app, label)
        .into_iter()
        .next()
        .unwrap_or_else(|| panic!("no element labelled {label:?}"))
        .invoke_accessible_default_action();
}

fn type_keys(app: &App, keys: &str) {
    for c in keys.chars() {
        press(app, &c.to_string());
    }
}

/// The words of every `<text>` of an SVG, joined by spaces, entities undone.
fn svg_words(svg: &str) -> String {
    let mut words = Vec::new();
    for part in svg.split("<text").skip(1) {
        let body = part.split_once('>').map_or("", |(_, b)| b);
        let body = body.split("</text>").next().unwrap_or("");
        words.push(
            body.replace("&lt;", "<")
                .replace("&gt;", ">")
                .replace("&apos;", "'")
                .replace("&quot;", "\"")
                .replace("&amp;", "&"),
        );
    }
    words.join(" ")
}

#[test]
fn an_overfill_is_named_on_the_keypad_the_pages_the_card_and_by_the_cli() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    // Ines dives a twin 12 L 232 bar set (the demo). 300 bar is 29 % over its working
    // pressure: an overfill by the core's rule (more than 10 % over, common practice).
    press(&app, "start pressure of Ines");
    type_keys(&app, "300");
    // Ines's warnings from the core, in full or in brief.
    let ines_warnings_as = |words: fn(&turnsheet::plan::Warning) -> String| {
        let s = app.session.borrow();
        let plan = plan_team(s.team.input()).unwrap();
        plan.warnings
            .iter()
            .filter(|w| w.diver() == Some(0))
            .map(words)
            .collect::<Vec<_>>()
    };
    let ines_warnings = || ines_warnings_as(|w| w.detail());
    let expected = ines_warnings();
    assert_eq!(expected.len(), 1, "{expected:?}");
    assert!(expected[0].starts_with("Overfill"), "{expected:?}");
    // While typing: the keypad says it in brief (its message line keeps three lines'
    // room, so no key moves), and still lets the diver enter what the gauge reads.
    let brief = ines_warnings_as(|w| w.brief());
    assert_eq!(entry_warning(&app), brief[0]);
    assert!(brief[0].starts_with("Overfill") && brief[0].contains("232"));
    assert_eq!(value(&app, "entry problem"), "", "a warning, not a refusal");
    press(&app, "done");
    assert!(values(&app, "entry").is_empty(), "Done closed the keypad");
    // The diver's card says it.
    assert_eq!(value(&app, "problem for Ines"), expected.join(" "));
    // Every other start read, so there are turns and a card.
    let readings: Vec<(String, String)> = {
        let s = app.session.borrow();
        let input = s.team.input();
        let read = |i: usize, p| format!("{}", (input.gauge_of(i).value(p) + 1e-6).floor());
        let mut out = Vec::new();
        for (i, d) in input.divers.iter().enumerate() {
            if i > 0 {
                out.push((format!("start pressure of {}", d.name), read(i, d.start)));
            }
            if let Some(st) = &d.stage {
                out.push((format!("stage pressure of {}", d.name), read(i, st.start)));
            }
        }
        out
    };
    for (field, digits) in readings {
        press(&app, &field);
        press(&app, "clear");
        type_keys(&app, &digits);
        press(&app, "done");
    }
    // The Turns page lists the core's warnings, each led by the diver's name.
    press(&app, "show turns");
    let (team, plan) = {
        let s = app.session.borrow();
        (s.team.input().clone(), plan_team(s.team.input()).unwrap())
    };
    let texts = plan.warning_texts();
    assert!(texts.iter().any(|t| t.starts_with("Ines: Overfill")));
    assert_eq!(values(&app, "warning"), texts);
    // The card the app writes carries the same sentences.
    press(&app, "save card");
    let cards: Vec<_> = std::fs::read_dir(dir.path().join("cards"))
        .unwrap()
        .map(|e| e.unwrap().path())
        .collect();
    assert_eq!(cards.len(), 1, "{}", value(&app, "message"));
    let card = svg_words(&std::fs::read_to_string(&cards[0]).unwrap());
    for t in &texts {
        assert!(card.contains(&format!("WARNING: {t}")), "{t} not in {card}");
    }
    // `turnsheet plan` and `turnsheet card` of the same team say the same.
    let file = dir.path().join("team.json");
    std::fs::write(
        &file,
        serde_json::to_string(&TeamFile::from_input(&team)).unwrap(),
    )
    .unwrap();
    let run = |cmd: &str| {
        let out = std::process::Command::new(env!("CARGO_BIN_EXE_turnsheet"))
            .arg(cmd)
            .arg(&file)
            .output()
            .unwrap();
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
        String::from_utf8(out.stdout).unwrap()
    };
    let cli: Vec<String> = run("plan")
        .lines()
        .filter_map(|l| l.strip_prefix("warning: "))
        .map(str::to_string)
        .collect();
    assert_eq!(cli, texts);
    let cli_card = svg_words(&run("card"));
    for t in &texts {
        assert!(cli_card.contains(&format!("WARNING: {t}")), "{t}");
    }
}

#[test]
fn a_start_within_the_working_pressure_has_no_warning_on_the_keypad() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    press(&app, "start pressure of Ines");
    type_keys(&app, "220");
    assert_eq!(entry_warning(&app), "");
    assert_eq!(value(&app, "entry problem"), "");
    // 240 bar is above 232 bar by more than half a 10 bar graduation: said, not refused.
    press(&app, "clear");
    type_keys(&app, "240");
    let w = entry_warning(&app);
    assert!(
        w.to_lowercase()
            .contains("above the working pressure 232 bar"),
        "{w}"
    );
}

#[test]
fn a_locker_name_never_contradicts_its_sizes_without_a_word() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    // The picker's generic sizes show what to check on the cylinder: the stamp, or the
    // rating (trade facts, from memory: an aluminium 80 is 77.4 cu ft at 3000 psi).
    press(&app, "cylinders of Ines");
    let al80 = value(&app, "pick Single aluminium 77.4 cu ft 3000 psi");
    assert!(al80.contains("77.4 cu ft at 3000 psi"), "{al80}");
    let twin = value(&app, "pick Twin 12 L 232 bar");
    assert!(twin.contains("12 L at 232 bar"), "{twin}");
    press(&app, "cancel pick");

    // A copied generic size: its name was made from the sizes, so it follows them.
    press(&app, "Locker");
    press(&app, "copy Twin 12 L 232 bar");
    assert_eq!(value(&app, "edit NAME"), "Twin 12 L 232 bar");
    press(&app, "edit WATER CAPACITY PER CYLINDER");
    press(&app, "clear");
    type_keys(&app, "11");
    press(&app, "done");
    assert_eq!(value(&app, "edit NAME"), "Twin 11 L 232 bar");
    assert!(values(&app, "name warning").is_empty());
    press(&app, "Save");
    assert_eq!(value(&app, "locker entry"), "Twin 11 L 232 bar");
    let saved = app.session.borrow().locker.file.entries[0]
        .cylinders
        .clone();
    assert_eq!(saved.water_l, Some(11.0));

    // A name the diver typed stays, with a warning once the sizes change.
    press(&app, "edit Twin 11 L 232 bar");
    press(&app, "edit NAME");
    press(&app, "clear");
    type_keys(&app, "CAVE");
    press(&app, "done");
    assert!(values(&app, "name warning").is_empty());
    press(&app, "fewer cylinders");
    assert_eq!(value(&app, "edit NAME"), "Cave");
    let w = value(&app, "name warning");
    assert!(
        w.contains("Twin 11 L 232 bar") && w.contains("now holds Single 11 L 232 bar"),
        "{w}"
    );
}

#[test]
fn a_fill_far_over_the_working_pressure_is_named_before_it_is_planned_with() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    press(&app, "fill check");
    // Ines's set is a twin 12 L 232 bar (the demo). A 300 bar fill cooling to the water.
    assert!(
        values(&app, "fill warning").is_empty(),
        "232 bar by default"
    );
    press(&app, "fill pressure");
    press(&app, "clear");
    type_keys(&app, "300");
    press(&app, "done");
    let predicted = {
        let s = app.session.borrow();
        s.fill.usable_start(s.team.input())
    };
    let w = value(&app, "fill warning");
    assert!(w.starts_with("Overfill"), "{w}");
    // Planned with, the same words come from the plan on the Team page.
    press(&app, "plan with the prediction");
    let s = app.session.borrow();
    assert_eq!(s.team.input().divers[0].start, predicted);
    drop(s);
    press(&app, "back");
    assert_eq!(value(&app, "problem for Ines"), w);
}
