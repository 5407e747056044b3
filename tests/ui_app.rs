//! UI behaviour through the real toolkit (i-slint-backend-testing, pinned to the Slint
//! version): keys are pressed through their accessibility actions, values read back from
//! the accessibility tree, as a screen reader or a finger would.

mod ui_common;
use ui_common::{find, page, press, value};

use i_slint_backend_testing::ElementHandle;
use slint::ComponentHandle;
use slint::platform::{Key, WindowEvent};
use turnsheet::app::App;
use turnsheet::app::ui::{Nav, Page};
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::{
    CylinderSet, CylinderSpec, Gauge, Mix, Pressure, PressureUnit, UnitSystem, plan_team,
};

fn init() {
    i_slint_backend_testing::init_no_event_loop();
}

fn type_keys(app: &App, keys: &str) {
    for c in keys.chars() {
        press(app, &c.to_string());
    }
}

/// A phone-wide window, tall enough that no scrolling hides an element (the
/// accessibility queries only see elements inside their clip).
fn open(dir: &std::path::Path) -> App {
    let app = App::new(dir).unwrap();
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 4000.0));
    app
}

/// Past the cautions, on the Team page, with every start unread (as on the dock).
fn open_unread(dir: &std::path::Path) -> App {
    let app = open(dir);
    if page(&app) == Page::Cautions {
        press(&app, "acknowledge cautions");
    }
    assert_eq!(page(&app), Page::Team);
    app
}

/// Type each diver's start on the keypad, as read in the water: only then are there turns.
fn read_every_start(app: &App) {
    let starts: Vec<(String, String)> = {
        let s = app.session.borrow();
        let input = s.team.input();
        (0..input.divers.len())
            .map(|i| {
                let g = input.gauge_of(i);
                (
                    input.divers[i].name.clone(),
                    format!("{}", (g.value(input.divers[i].start) + 1e-6).floor() as i64),
                )
            })
            .collect()
    };
    for (name, digits) in starts {
        press(app, &format!("start pressure of {name}"));
        press(app, "clear");
        type_keys(app, &digits);
        press(app, "done");
    }
    // Each stage's gauge too: its drop pressure needs a stage start read today.
    let stages: Vec<(String, String)> = {
        let s = app.session.borrow();
        let input = s.team.input();
        (0..input.divers.len())
            .filter_map(|i| {
                let st = input.divers[i].stage.as_ref()?;
                let g = input.gauge_of(i);
                Some((
                    input.divers[i].name.clone(),
                    format!("{}", (g.value(st.start) + 1e-6).floor() as i64),
                ))
            })
            .collect()
    };
    for (name, digits) in stages {
        press(app, &format!("stage pressure of {name}"));
        press(app, "clear");
        type_keys(app, &digits);
        press(app, "done");
    }
}

fn open_acknowledged(dir: &std::path::Path) -> App {
    let app = open_unread(dir);
    read_every_start(&app);
    app
}

fn back_key(app: &App) {
    app.window.window().dispatch_event(WindowEvent::KeyPressed {
        text: Key::Escape.into(),
    });
    app.window
        .window()
        .dispatch_event(WindowEvent::KeyReleased {
            text: Key::Escape.into(),
        });
}

fn turn_number(app: &App, name: &str) -> f64 {
    let v = value(app, &format!("turn of {name}"));
    v.split_whitespace().next().unwrap().parse().unwrap()
}

#[test]
fn first_launch_asks_for_the_cautions_then_shows_the_demo_team() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    assert_eq!(page(&app), Page::Cautions);
    press(&app, "acknowledge cautions");
    assert_eq!(page(&app), Page::Team);
    drop(app);
    let app = open(dir.path());
    assert_eq!(page(&app), Page::Team, "acknowledgement is remembered");
}

#[test]
fn three_diver_team_entered_with_keypad_matches_the_core() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "new team");
    press(&app, "add diver");
    // Cylinders from the generic catalogue.
    press(&app, "cylinders of Me");
    press(&app, "pick Twin 10 L 300 bar");
    press(&app, "cylinders of Diver 3");
    press(&app, "pick Single 18 L 232 bar");
    // Rename diver 3 with the letter pad.
    press(&app, "name of diver 3");
    press(&app, "clear");
    type_keys(&app, "SOL");
    press(&app, "done");
    // Start pressures with the number pad.
    for (who, digits) in [("Me", "285"), ("Buddy", "215"), ("Sol", "225")] {
        press(&app, &format!("start pressure of {who}"));
        press(&app, "clear");
        type_keys(&app, digits);
        assert_eq!(value(&app, "entry"), digits);
        assert_eq!(value(&app, "entry problem"), "");
        press(&app, "done");
        assert_eq!(
            value(&app, &format!("start pressure of {who}")),
            format!("{digits} bar")
        );
    }
    press(&app, "show turns");
    assert_eq!(page(&app), Page::Turns);

    // The same team, built directly on the planning core.
    let stamped = |count, water_l, working_bar| CylinderSet {
        count,
        independent: false,
        spec: CylinderSpec::Stamped {
            water_l,
            working_bar,
        },
    };
    let mut input = TeamFile::parse(turnsheet::app::session::DEMO_TEAM)
        .unwrap()
        .to_input()
        .unwrap();
    input.divers.truncate(2);
    let mut third = input.divers[1].clone();
    input.depth = None;
    input.water_temp = turnsheet::plan::Temperature::from_celsius(20.0);
    for (d, (name, set, start)) in input
        .divers
        .iter_mut()
        .chain(std::iter::once(&mut third))
        .zip([
            ("Me", stamped(2, 10.0, 300.0), 285.0),
            ("Buddy", stamped(2, 12.0, 232.0), 215.0),
            ("Sol", stamped(1, 18.0, 232.0), 225.0),
        ])
    {
        d.name = name.into();
        d.cylinders = set;
        d.start = Pressure::from_bar(start);
        d.mix = Mix::AIR;
        d.sac_l_per_min = None;
        d.stage = None;
    }
    input.divers.push(third);
    let plan = plan_team(&input).unwrap();
    for d in &plan.divers {
        assert_eq!(turn_number(&app, &d.name), d.turn_shown_value, "{}", d.name);
    }
    // Sol's single 18 L holds the least gas: Sol controls.
    let sol = find(&app, "turn of Sol");
    assert_eq!(
        sol.accessible_description().unwrap_or_default(),
        "controlling diver"
    );
    assert_eq!(plan.controlling_diver().name, "Sol");
}

#[test]
fn invalid_entry_shows_its_reason_and_leaves_the_plan_alone() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    let before = value(&app, "team summary");
    press(&app, "start pressure of Ines");
    press(&app, "clear");
    type_keys(&app, "360");
    let reason = value(&app, "entry problem");
    assert!(reason.contains("more than 1.5 × the"), "{reason}");
    assert_eq!(value(&app, "team summary"), before);
    press(&app, "done"); // disabled while invalid
    assert!(
        app.session.borrow().entry.is_some(),
        "done must not accept an invalid entry"
    );
    // A valid value updates the plan live, on every key press.
    press(&app, "delete");
    press(&app, "delete");
    type_keys(&app, "00");
    assert_eq!(value(&app, "entry problem"), "");
    assert_ne!(value(&app, "team summary"), before);
    // Cancel restores the start pressure and the plan.
    press(&app, "cancel entry");
    assert_eq!(value(&app, "team summary"), before);
    assert_eq!(value(&app, "start pressure of Ines"), "218 bar");
}

#[test]
fn locker_add_edit_delete_survive_a_restart() {
    init();
    let dir = tempfile::tempdir().unwrap();
    {
        let app = open_acknowledged(dir.path());
        press(&app, "Locker");
        press(&app, "+ New");
        assert_eq!(page(&app), Page::LockerEdit);
        press(&app, "edit NAME");
        type_keys(&app, "DEEP");
        press(&app, "done");
        press(&app, "edit WATER CAPACITY PER CYLINDER");
        type_keys(&app, "45");
        assert!(value(&app, "entry problem").contains("allowed 0.5 to 30 L"));
        press(&app, "delete");
        press(&app, "delete");
        type_keys(&app, "15");
        press(&app, "done");
        press(&app, "edit WORKING PRESSURE");
        type_keys(&app, "232");
        press(&app, "done");
        press(&app, "Save");
        assert_eq!(page(&app), Page::Locker);
        assert_eq!(value(&app, "locker entry"), "Deep");
    }
    {
        let app = open_acknowledged(dir.path());
        press(&app, "Locker");
        assert_eq!(value(&app, "locker entry"), "Deep");
        press(&app, "edit Deep");
        assert_eq!(value(&app, "cylinder count"), "2");
        press(&app, "fewer cylinders");
        assert_eq!(value(&app, "cylinder count"), "1");
        // One cylinder is the fewest: the step down does nothing more.
        press(&app, "fewer cylinders");
        assert_eq!(value(&app, "cylinder count"), "1");
        press(&app, "Save");
        // A second set, then delete it with undo.
        press(&app, "copy Single aluminium 40 cu ft 3000 psi");
        press(&app, "Save");
        press(&app, "delete Single aluminium 40 cu ft 3000 psi");
        press(&app, "undo delete");
        press(&app, "delete Single aluminium 40 cu ft 3000 psi");
    }
    let app = open_acknowledged(dir.path());
    let locker = &app.session.borrow().locker.file;
    assert_eq!(locker.entries.len(), 1);
    assert_eq!(locker.entries[0].name, "Deep");
    assert_eq!(locker.entries[0].cylinders.count, 1);
    assert_eq!(locker.entries[0].cylinders.water_l, Some(15.0));
    assert!(
        !locker.entries[0].mine,
        "the first set is not made mine until the diver marks it"
    );
}

#[test]
fn corrupt_locker_is_kept_aside_and_the_app_starts() {
    init();
    let dir = tempfile::tempdir().unwrap();
    std::fs::write(
        dir.path().join("locker.json"),
        "{\"schema\": 1, \"entries\": [oops",
    )
    .unwrap();
    let app = open_acknowledged(dir.path());
    let msg = value(&app, "message");
    assert!(
        msg.contains("cylinder locker") && msg.contains("unreadable"),
        "{msg}"
    );
    let kept = turnsheet::storage::atomic::kept_aside(dir.path(), "locker.json");
    assert_eq!(kept.len(), 1);
    assert!(std::fs::read_to_string(&kept[0]).unwrap().contains("oops"));
    press(&app, "dismiss message");
    assert_eq!(count(&app, "message"), 0);
}

#[test]
fn back_goes_one_page_back_and_is_rejected_on_the_team_page() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "show turns");
    press(&app, "Buddy view");
    assert_eq!(page(&app), Page::Buddy);
    back_key(&app);
    assert_eq!(page(&app), Page::Turns);
    back_key(&app);
    assert_eq!(page(&app), Page::Team);
    back_key(&app);
    assert_eq!(page(&app), Page::Team);
    assert!(
        !app.window.global::<Nav>().invoke_back(),
        "Back on the Team page is left to the system"
    );

    press(&app, "Settings");
    press(&app, "open locker");
    press(&app, "+ New");
    assert_eq!(page(&app), Page::LockerEdit);
    press(&app, "edit NAME");
    back_key(&app); // closes the keypad first
    assert_eq!(page(&app), Page::LockerEdit);
    assert!(app.session.borrow().entry.is_none());
    back_key(&app);
    assert_eq!(page(&app), Page::Locker);
    back_key(&app);
    assert_eq!(page(&app), Page::Settings);
    back_key(&app);
    assert_eq!(page(&app), Page::Team);

    // The buddy view closes on any tap, too.
    press(&app, "show turns");
    press(&app, "Buddy view");
    press(&app, "close buddy view");
    assert_eq!(page(&app), Page::Turns);
    // On-screen back button.
    press(&app, "back");
    assert_eq!(page(&app), Page::Team);
}

#[test]
fn units_switch_shows_numbers_consistent_with_the_core() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "Settings");
    press(&app, "units imperial");
    back_key(&app);
    // Starts read on bar gauges stay in bar: switching the team's units converts no
    // reading into a number those gauges do not show.
    assert_eq!(value(&app, "start pressure of Ines"), "218 bar");
    // Bram reads a psi gauge: chosen in his gauge chooser, and his start is read again.
    press(&app, "gauge of Bram");
    press(&app, "gauge psi 100");
    assert_eq!(value(&app, "start pressure of Bram"), "— psi");
    assert!(value(&app, "start note of Bram").contains("Not read"));
    press(&app, "start pressure of Bram");
    type_keys(&app, "2950");
    press(&app, "done");
    assert_eq!(value(&app, "start pressure of Bram"), "2950 psi");
    press(&app, "show turns");
    let mut input = TeamFile::parse(turnsheet::app::session::DEMO_TEAM)
        .unwrap()
        .to_input()
        .unwrap();
    input.units = UnitSystem::Imperial;
    input.gauge_step = 100.0;
    for d in &mut input.divers {
        d.gauge = Some(Gauge::usual(PressureUnit::Bar));
    }
    input.divers[1].gauge = Some(Gauge::usual(PressureUnit::Psi));
    input.divers[1].start = Pressure::from_psi(2950.0);
    let plan = plan_team(&input).unwrap();
    for d in &plan.divers {
        let shown = value(&app, &format!("turn of {}", d.name));
        assert_eq!(
            shown,
            format!("{} {}", d.turn_shown_value, d.gauge.label()),
            "{}",
            d.name
        );
    }
    assert_eq!(plan.divers[1].gauge.label(), "psi");
    assert_eq!(plan.divers[0].gauge.label(), "bar");
    // The buddy view shows each diver's turn on their own gauge.
    press(&app, "Buddy view");
    for d in &plan.divers {
        let row = find(&app, &format!("buddy turn of {}", d.name));
        assert_eq!(
            row.accessible_value().unwrap(),
            format!("{} {}", d.turn_shown_value, d.gauge.label())
        );
    }
}

#[test]
fn turns_wait_until_every_start_is_read_today() {
    init();
    let dir = tempfile::tempdir().unwrap();
    // The demo's starts count as unread: no turn numbers, and the page says whose.
    let app = open_unread(dir.path());
    press(&app, "show turns");
    assert_eq!(value(&app, "turn of Ines"), "— bar");
    assert!(value(&app, "plan problem").contains("Ines (start not read)"));
    press(&app, "Buddy view");
    assert!(value(&app, "buddy view note").contains("Bram"));
    assert_eq!(value(&app, "buddy turn of Sol"), "— bar");
    back_key(&app);
    back_key(&app);
    read_every_start(&app);
    press(&app, "show turns");
    assert_ne!(value(&app, "turn of Ines"), "— bar");
    assert!(
        ElementHandle::find_by_accessible_label(&app.window, "plan problem")
            .next()
            .is_none()
    );
    // A new diver has no start until it is read, and the turns wait for it.
    back_key(&app);
    press(&app, "add diver");
    assert_eq!(value(&app, "start pressure of Diver 4"), "— bar");
    press(&app, "show turns");
    assert_eq!(value(&app, "turn of Ines"), "— bar");
    assert!(value(&app, "plan problem").contains("Diver 4 (start not read)"));
}

#[test]
fn a_start_entered_on_an_earlier_day_must_be_confirmed() {
    init();
    let dir = tempfile::tempdir().unwrap();
    {
        let app = open_acknowledged(dir.path());
        drop(app);
    }
    // Move every saved entry time back a day, as if the team was planned yesterday.
    let path = dir.path().join("last-team.json");
    let mut v: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(&path).unwrap()).unwrap();
    for r in v["start_readings"].as_array_mut().unwrap() {
        let at = r["at"].as_i64().unwrap();
        r["at"] = (at - 86_400).into();
    }
    std::fs::write(&path, v.to_string()).unwrap();
    let app = open_unread(dir.path());
    assert!(value(&app, "start note of Ines").contains("Entered yesterday"));
    assert_eq!(value(&app, "start pressure of Ines"), "218 bar");
    press(&app, "show turns");
    assert!(value(&app, "plan problem").contains("Ines (start entered yesterday"));
    back_key(&app);
    for name in ["Ines", "Bram", "Sol"] {
        press(&app, &format!("confirm start of {name}"));
    }
    // The note stays in its place and now says when the start was read.
    assert!(
        value(&app, "start note of Ines").starts_with("Start read "),
        "{}",
        value(&app, "start note of Ines")
    );
    press(&app, "show turns");
    let plan = plan_team(
        &TeamFile::parse(turnsheet::app::session::DEMO_TEAM)
            .unwrap()
            .to_input()
            .unwrap(),
    )
    .unwrap();
    assert_eq!(turn_number(&app, "Ines"), plan.divers[0].turn_shown_value);
}

#[test]
fn every_button_is_a_big_touch_target() {
    use i_slint_backend_testing::{AccessibleRole, ElementQuery};
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    let check = |what: &str| {
        let buttons = ElementQuery::from_root(&app.window)
            .match_descendants()
            .match_accessible_role(AccessibleRole::Button)
            .find_all();
        assert!(buttons.len() >= 3, "{what}: only {} buttons", buttons.len());
        for b in buttons {
            let size = b.size();
            let label = b.accessible_label().unwrap_or_default();
            // 64 px = 64 dp on Android: the minimum touch target for wet hands.
            assert!(
                size.width >= 63.9 && size.height >= 63.9,
                "{what}: button {label:?} is {}×{} px",
                size.width,
                size.height
            );
        }
    };
    check("team page");
    press(&app, "start pressure of Ines");
    check("number pad");
    press(&app, "cancel entry");
    press(&app, "name of diver 1");
    check("letter pad");
    press(&app, "cancel entry");
    press(&app, "mix of Ines");
    check("mix picker");
    press(&app, "cancel mix");
    press(&app, "cylinders of Ines");
    check("cylinder picker");
    press(&app, "custom set");
    check("custom cylinder set");
    press(&app, "custom water capacity per cylinder");
    check("custom set keypad");
    press(&app, "cancel entry");
    press(&app, "cancel pick");
    press(&app, "show turns");
    check("turns page");
    press(&app, "back");
    press(&app, "Settings");
    check("settings page");
    press(&app, "open locker");
    check("locker page");
    press(&app, "+ New");
    check("locker editor");
    back_key(&app);
    back_key(&app);
    back_key(&app);
    press(&app, "fill check");
    check("fill page");
    back_key(&app);
    press(&app, "show turns");
    press(&app, "Chart");
    check("chart page");
}

#[test]
fn fill_check_predicts_the_in_water_pressure() {
    // Reference (CoolProp 8.0.0, tests/reference/temperature_change.csv): air filled to
    // 232 bar at 35 °C reads 207.16 bar at 12 °C. Shown rounded down: 207 bar.
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "fill check");
    assert_eq!(page(&app), Page::Fill);
    // The demo team breathes EAN32: switch Ines to air first.
    back_key(&app);
    press(&app, "mix of Ines");
    press(&app, "Air");
    press(&app, "mix done");
    press(&app, "fill check");
    press(&app, "fill pressure");
    press(&app, "clear");
    type_keys(&app, "232");
    press(&app, "done");
    press(&app, "cylinder temperature at the fill");
    press(&app, "clear");
    type_keys(&app, "35");
    press(&app, "done");
    press(&app, "water temperature for the fill check");
    press(&app, "clear");
    type_keys(&app, "12");
    press(&app, "done");
    assert_eq!(value(&app, "expected pressure in the water"), "207 bar");
    press(&app, "plan with the prediction");
    back_key(&app);
    assert_eq!(value(&app, "start pressure of Ines"), "207 bar");
    // The prediction is marked until the gauge is read in the water.
    assert!(value(&app, "start note of Ines").contains("Predicted"));
    press(&app, "show turns");
    assert!(value(&app, "turn of Ines").ends_with("bar"));
    assert_ne!(value(&app, "turn of Ines"), "— bar");
}

#[test]
fn stages_get_drop_pressures_matching_the_core() {
    use turnsheet::plan::StageInput;
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    // The demo team carries stages already; replace them.
    press(&app, "stage of Ines");
    press(&app, "pick Single aluminium 40 cu ft 3000 psi");
    press(&app, "stage mix of Ines");
    press(&app, "custom mix O2 percent");
    press(&app, "clear");
    type_keys(&app, "50");
    press(&app, "done");
    press(&app, "done");
    press(&app, "mix done");
    press(&app, "stage pressure of Ines");
    press(&app, "clear");
    type_keys(&app, "200");
    press(&app, "done");
    press(&app, "stage of Sol");
    press(&app, "pick Single 10 L 200 bar");
    press(&app, "stage pressure of Sol");
    press(&app, "clear");
    type_keys(&app, "190");
    press(&app, "done");
    press(&app, "show turns");

    let mut input = TeamFile::parse(turnsheet::app::session::DEMO_TEAM)
        .unwrap()
        .to_input()
        .unwrap();
    input.divers[0].stage = Some(StageInput {
        cylinders: CylinderSet {
            count: 1,
            independent: false,
            spec: CylinderSpec::Rated {
                rated_cuft: 40.0,
                rated_psi: 3000.0,
            },
        },
        mix: Mix::nitrox(0.5),
        start: Pressure::from_bar(200.0),
    });
    input.divers[2].stage = Some(StageInput {
        cylinders: CylinderSet {
            count: 1,
            independent: false,
            spec: CylinderSpec::Stamped {
                water_l: 10.0,
                working_bar: 200.0,
            },
        },
        mix: Mix::nitrox(0.5),
        start: Pressure::from_bar(190.0),
    });
    let plan = plan_team(&input).unwrap();
    for i in [0, 2] {
        let d = &plan.divers[i];
        let st = d.stage.as_ref().unwrap();
        let text = value(&app, &format!("stage drop of {}", d.name));
        assert!(
            text.starts_with(&format!("Drop stage at {} bar (", st.drop_shown_value)),
            "{text}"
        );
    }
    // The main turns do not change with stages.
    for d in &plan.divers {
        assert_eq!(turn_number(&app, &d.name), d.turn_shown_value);
    }
    press(&app, "back");
    press(&app, "stage of Sol");
    press(&app, "no stage");
    assert!(app.session.borrow().team.input().divers[2].stage.is_none());
    press(&app, "show turns");
    let warnings: Vec<String> = ElementHandle::find_by_accessible_label(&app.window, "warning")
        .map(|w| w.accessible_value().unwrap_or_default().to_string())
        .collect();
    assert!(
        warnings
            .iter()
            .any(|w| w.contains("Only one diver carries a stage")),
        "{warnings:?}"
    );
    // Warnings come before the turn cards, where nobody can miss them.
    let first_warning = ElementHandle::find_by_accessible_label(&app.window, "warning")
        .map(|w| w.absolute_position().y)
        .fold(f32::INFINITY, f32::min);
    let first_card = find(&app, "turn of Ines").absolute_position().y;
    assert!(
        first_warning < first_card,
        "{first_warning} vs {first_card}"
    );
}

#[test]
fn pairing_chart_page_shows_the_core_chart() {
    use turnsheet::plan::{pair_chart, starts_around};
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "show turns");
    press(&app, "Chart");
    assert_eq!(page(&app), Page::Chart);
    assert_eq!(value(&app, "chart diver"), "Ines");
    assert_eq!(value(&app, "chart teammate"), "Bram");
    press(&app, "next teammate");
    assert_eq!(value(&app, "chart teammate"), "Sol");
    press(&app, "next diver"); // Bram against Sol
    press(&app, "next diver"); // Sol: the teammate moves on so they differ
    assert_eq!(value(&app, "chart diver"), "Sol");
    assert_eq!(value(&app, "chart teammate"), "Ines");

    let input = TeamFile::parse(turnsheet::app::session::DEMO_TEAM)
        .unwrap()
        .to_input()
        .unwrap();
    use turnsheet::app::session::{CHART_ROWS, chart_columns};
    let (start_sol, start_ines) = (input.divers[2].start.bar(), input.divers[0].start.bar());
    let rows = starts_around(start_sol, 10.0, CHART_ROWS.0, CHART_ROWS.1);
    let (above, below) = chart_columns(start_ines);
    let columns = starts_around(start_ines, 10.0, above, below);
    assert!(
        columns.len() >= 6,
        "one above, four below and the planned start"
    );
    let chart = pair_chart(&input, 2, 0, &rows, &columns).unwrap();
    for (r, row) in chart.turns.iter().enumerate() {
        for (c, cell) in row.iter().enumerate() {
            let shown = value(&app, &format!("chart cell {r} {c}"));
            assert_eq!(shown, format!("{}", cell.unwrap()), "cell {r} {c}");
        }
    }
}

#[test]
fn the_set_marked_mine_starts_a_new_team() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "Locker");
    press(&app, "copy Twin steel 85 cu ft 2640 psi");
    press(&app, "Save");
    press(&app, "copy Twin 10 L 300 bar");
    press(&app, "Save");
    press(&app, "mark Twin 10 L 300 bar as mine");
    back_key(&app);
    press(&app, "new team");
    // A new team's starts are empty until read in the water.
    assert_eq!(value(&app, "start pressure of Me"), "— bar");
    assert_eq!(value(&app, "start pressure of Buddy"), "— bar");
    press(&app, "add diver");
    assert_eq!(value(&app, "start pressure of Diver 3"), "— bar");
    let s = app.session.borrow();
    for d in &s.team.input().divers {
        assert_eq!(
            d.cylinders,
            CylinderSet {
                count: 2,
                independent: false,
                spec: CylinderSpec::Stamped {
                    water_l: 10.0,
                    working_bar: 300.0
                }
            }
        );
    }
    assert!(s.team.labels().iter().all(|l| l == "Twin 10 L 300 bar"));
}

#[test]
fn the_keypad_replaces_the_old_value_on_the_first_digit() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "start pressure of Ines");
    assert_eq!(value(&app, "entry"), "218");
    type_keys(&app, "2");
    assert_eq!(value(&app, "entry"), "2");
    type_keys(&app, "05");
    press(&app, "done");
    assert_eq!(value(&app, "start pressure of Ines"), "205 bar");
    // A name that is too long is refused with a message, not cut short.
    press(&app, "name of diver 1");
    type_keys(&app, "ABCDEFGHIJKLMNOPQRSTUVWXYZ");
    assert!(
        value(&app, "entry problem").contains("24"),
        "{}",
        value(&app, "entry problem")
    );
    press(&app, "cancel entry");
    assert_eq!(app.session.borrow().team.input().divers[0].name, "Ines");
}

fn keyboard(app: &App, text: impl Into<slint::SharedString>) {
    let text: slint::SharedString = text.into();
    let w = app.window.window();
    w.dispatch_event(WindowEvent::KeyPressed { text: text.clone() });
    w.dispatch_event(WindowEvent::KeyReleased { text });
}

#[test]
fn removing_a_diver_offers_undo_that_puts_the_diver_back() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    let before = app.session.borrow().team.to_state();
    press(&app, "show turns");
    let bram_turn = turn_number(&app, "Bram");
    back_key(&app);
    press(&app, "remove Bram");
    assert_eq!(app.session.borrow().team.len(), 2);
    // The note says what the removal did to each remaining turn (the allowance may
    // grow without Bram, so turns may go down).
    let note = value(&app, "undo note");
    assert!(note.starts_with("Bram removed. Turns: Ines "), "{note}");
    press(&app, "undo");
    assert_eq!(app.session.borrow().team.to_state().team, before.team);
    assert!(count(&app, "undo") == 0, "the offer is gone once used");
    // Bram's start still counts as read today: his turn is back at once.
    press(&app, "show turns");
    assert_eq!(turn_number(&app, "Bram"), bram_turn);
    back_key(&app);
    // New team: the same offer; undone, the whole team is back.
    press(&app, "new team");
    assert!(value(&app, "undo note").contains("Ines, Bram, Sol"));
    press(&app, "undo");
    assert_eq!(app.session.borrow().team.to_state().team, before.team);
}

#[test]
fn a_physical_keyboard_types_into_the_keypads() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "start pressure of Ines");
    for k in ["2", "1", "x", "0"] {
        keyboard(&app, k);
    }
    keyboard(&app, Key::Backspace);
    keyboard(&app, "5");
    assert_eq!(value(&app, "entry"), "215");
    keyboard(&app, Key::Return);
    assert_eq!(value(&app, "start pressure of Ines"), "215 bar");
    press(&app, "name of diver 1");
    for k in ["n", "e", "l", "l", "a", "2"] {
        keyboard(&app, k);
    }
    keyboard(&app, Key::Return);
    assert_eq!(app.session.borrow().team.input().divers[0].name, "Nella2");
    // Escape cancels an entry and leaves the value as it was.
    press(&app, "start pressure of Nella2");
    keyboard(&app, "9");
    back_key(&app);
    assert_eq!(value(&app, "start pressure of Nella2"), "215 bar");
    assert_eq!(page(&app), Page::Team);
}

#[test]
fn the_water_temperature_belongs_to_the_dive() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    let (dive, default) = {
        let s = app.session.borrow();
        (s.team.input().water_temp.celsius(), s.settings.water_temp_c)
    };
    press(&app, "colder water");
    press(&app, "colder water");
    let s = app.session.borrow();
    assert!((s.team.input().water_temp.celsius() - (dive - 2.0)).abs() < 1e-9);
    assert_eq!(
        s.settings.water_temp_c, default,
        "not the default for new teams"
    );
    drop(s);
    let shown = value(&app, "water temperature");
    assert_eq!(shown, format!("{} °C", dive - 2.0));
    press(&app, "fill check");
    assert_eq!(value(&app, "water temperature for the fill check"), shown);
}

#[test]
fn the_demo_says_so_on_every_page_until_a_team_of_ones_own() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_unread(dir.path());
    assert!(value(&app, "demo note").contains("invented"));
    for (go, label) in [("show turns", "Chart"), ("fill check", "")] {
        press(&app, go);
        assert!(value(&app, "demo note").contains("invented"), "{go}");
        if !label.is_empty() {
            press(&app, label);
            assert!(value(&app, "demo note").contains("invented"), "{label}");
            back_key(&app);
        }
        back_key(&app);
    }
    press(&app, "new team");
    assert_eq!(count(&app, "demo note"), 0);
}

#[test]
fn the_team_card_is_written_from_starts_read_today_only() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_unread(dir.path());
    press(&app, "show turns");
    press(&app, "save card");
    assert!(
        value(&app, "message").contains("No card yet"),
        "{}",
        value(&app, "message")
    );
    press(&app, "dismiss message");
    back_key(&app);
    read_every_start(&app);
    press(&app, "show turns");
    press(&app, "save card");
    let msg = value(&app, "message");
    assert!(msg.contains("Team card written to"), "{msg}");
    let cards: Vec<_> = std::fs::read_dir(dir.path().join("cards"))
        .unwrap()
        .map(|e| e.unwrap().path())
        .collect();
    assert_eq!(cards.len(), 1);
    let svg = std::fs::read_to_string(&cards[0]).unwrap();
    // The card carries the turn the Turns page shows for each diver.
    for name in ["Ines", "Bram", "Sol"] {
        let turn = value(&app, &format!("turn of {name}"));
        let digits = turn.split_whitespace().next().unwrap();
        assert!(svg.contains(digits), "{name} {turn}");
    }
}

fn count(app: &App, label: &str) -> usize {
    ui_common::all(app, label).len()
}

/// Make saving fail, even for root: the data directory is replaced by a file.
fn block_saving(dir: &std::path::Path) {
    std::fs::remove_dir_all(dir).unwrap();
    std::fs::write(dir, "a file where the data folder was").unwrap();
}

fn unblock_saving(dir: &std::path::Path) {
    std::fs::remove_file(dir).unwrap();
    std::fs::create_dir(dir).unwrap();
}

#[test]
fn a_failed_save_stays_on_screen_until_a_save_succeeds() {
    init();
    let tmp = tempfile::tempdir().unwrap();
    let dir = tmp.path().join("data");
    let app = open_unread(&dir);
    assert_eq!(count(&app, "not saved"), 0);
    block_saving(&dir);
    read_every_start(&app);
    let said = value(&app, "not saved");
    assert!(said.contains("last-team.json"), "{said}");
    assert!(
        said.contains(&*dir.to_string_lossy()),
        "names the folder: {said}"
    );
    // It stays: on another page, and after a retry that fails again.
    press(&app, "Locker");
    assert_eq!(count(&app, "not saved"), 1);
    press(&app, "try saving again");
    assert_eq!(count(&app, "not saved"), 1);
    back_key(&app);
    // The folder is back; the next edit saves everything and the banner goes.
    unblock_saving(&dir);
    press(&app, "start pressure of Ines");
    press(&app, "done");
    assert_eq!(count(&app, "not saved"), 0);
    drop(app);
    let again = open_unread(&dir);
    assert_eq!(value(&again, "start pressure of Bram"), "205 bar");
}

#[test]
fn closing_the_window_with_unsaved_changes_asks_first() {
    init();
    let tmp = tempfile::tempdir().unwrap();
    let dir = tmp.path().join("data");
    let app = open_unread(&dir);
    app.window.show().unwrap();
    block_saving(&dir);
    read_every_start(&app);
    app.window
        .window()
        .dispatch_event(WindowEvent::CloseRequested);
    assert!(app.window.window().is_visible(), "kept open");
    let q = value(&app, "question");
    assert!(
        q.starts_with(&format!(
            "Your last changes could not be saved to {}: ",
            dir.display()
        )),
        "{q}"
    );
    for label in ["close anyway", "try again", "stay"] {
        let b = find(&app, label);
        assert!(b.size().height >= 48.0, "{label}: a big button");
    }
    press(&app, "stay");
    assert_eq!(count(&app, "question"), 0);
    app.window
        .window()
        .dispatch_event(WindowEvent::CloseRequested);
    press(&app, "try again");
    assert_eq!(count(&app, "question"), 1, "still failing: asks again");
    press(&app, "close anyway");
    assert!(!app.window.window().is_visible());
}

#[test]
fn leaving_a_changed_locker_edit_asks_before_discarding() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_unread(dir.path());
    press(&app, "Locker");
    press(&app, "+ New");
    back_key(&app);
    assert_eq!(page(&app), Page::Locker, "nothing typed: no question");
    press(&app, "+ New");
    press(&app, "edit NAME");
    type_keys(&app, "REEF");
    press(&app, "done");
    // The page's own back button asks.
    press(&app, "back");
    assert_eq!(value(&app, "question"), "Discard changes to Reef?");
    press(&app, "keep editing");
    assert_eq!(page(&app), Page::LockerEdit);
    assert_eq!(count(&app, "question"), 0);
    // So does the app's Back, once.
    back_key(&app);
    assert_eq!(count(&app, "question"), 1);
    press(&app, "discard changes");
    assert_eq!(page(&app), Page::Locker);
    assert_eq!(count(&app, "locker entry"), 0);
}

#[test]
fn two_divers_swap_locker_sets_from_the_locker_page() {
    init();
    let tmp = tempfile::tempdir().unwrap();
    let shared = tmp.path().join("shared");
    std::fs::create_dir(&shared).unwrap();
    {
        let app = open_unread(&tmp.path().join("ana"));
        app.session.borrow_mut().exchange.export_dir = shared.clone();
        press(&app, "Locker");
        press(&app, "copy Single aluminium 40 cu ft 3000 psi");
        press(&app, "Save");
        press(&app, "export locker");
        let said = value(&app, "message");
        assert!(said.starts_with("Exported 1 set to"), "{said}");
        assert!(shared.join("turnsheet-locker.json").exists());
    }
    let app = open_unread(&tmp.path().join("ben"));
    press(&app, "Locker");
    let import_dir = app.session.borrow().exchange.import_dir.clone();
    assert!(
        value(&app, "where locker files go").contains(&*import_dir.to_string_lossy()),
        "the page says where to put the file"
    );
    press(&app, "import sets");
    assert!(value(&app, "message").starts_with("No locker file to import"));
    std::fs::copy(
        shared.join("turnsheet-locker.json"),
        import_dir.join("from-ana.json"),
    )
    .unwrap();
    press(&app, "import sets");
    let said = value(&app, "message");
    assert!(
        said.contains("added Single aluminium 40 cu ft 3000 psi"),
        "{said}"
    );
    assert!(said.contains("the locker has 1 set"), "{said}");
    assert_eq!(
        value(&app, "locker entry"),
        "Single aluminium 40 cu ft 3000 psi"
    );
    press(&app, "dismiss locker message");
    assert_eq!(count(&app, "message"), 0);
}

/// The quick mixes offered, row by row, as the mix picker shows them.
fn quick_mixes(app: &App) -> Vec<String> {
    use slint::Model;
    let rows = app
        .window
        .global::<turnsheet::app::ui::PickerAdapter>()
        .get_mix_rows();
    rows.iter()
        .flat_map(|r| {
            r.items
                .iter()
                .map(|i| i.text.to_string())
                .collect::<Vec<_>>()
        })
        .collect()
}

#[test]
fn a_custom_pair_entered_in_the_picker_plans_like_the_core() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "cylinders of Bram");
    press(&app, "custom set");
    press(&app, "cylinder count 2");
    press(&app, "pair independent");
    press(&app, "given as metric stamp");
    // A field out of range is refused on the keypad with the field's name.
    press(&app, "custom water capacity per cylinder");
    press(&app, "clear");
    type_keys(&app, "40");
    // The keypad's title names the field; the problem gives the range.
    assert_eq!(
        app.session.borrow().entry.as_ref().unwrap().title(),
        "Custom set: Water capacity per cylinder (L)"
    );
    assert!(
        value(&app, "entry problem").contains("allowed 0.5 to 30 L"),
        "{}",
        value(&app, "entry problem")
    );
    press(&app, "clear");
    type_keys(&app, "11");
    press(&app, "decimal separator");
    type_keys(&app, "1");
    press(&app, "done");
    press(&app, "custom working pressure");
    press(&app, "clear");
    type_keys(&app, "232");
    press(&app, "done");
    assert!(
        value(&app, "custom set summary").starts_with("2 × 11.1 L 232 bar, independent"),
        "{}",
        value(&app, "custom set summary")
    );
    press(&app, "use custom set");
    assert_eq!(
        app.session.borrow().team.labels()[1],
        "2 × 11.1 L 232 bar, independent"
    );
    press(&app, "start pressure of Bram");
    press(&app, "clear");
    type_keys(&app, "220");
    press(&app, "done");
    press(&app, "show turns");

    // The demo team with Bram's custom pair, built directly on the planning core.
    let mut input = TeamFile::parse(turnsheet::app::session::DEMO_TEAM)
        .unwrap()
        .to_input()
        .unwrap();
    input.divers[1].cylinders = CylinderSet {
        count: 2,
        independent: false,
        spec: CylinderSpec::Stamped {
            water_l: 11.1,
            working_bar: 232.0,
        },
    };
    input.divers[1].start = Pressure::from_bar(220.0);
    let plan = plan_team(&input).unwrap();
    for d in &plan.divers {
        assert_eq!(turn_number(&app, &d.name), d.turn_shown_value, "{}", d.name);
    }
}

#[test]
fn save_to_my_locker_adds_the_set_and_does_not_make_it_mine() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "save cylinders of Bram to my locker");
    assert!(
        value(&app, "message").contains("Sidemount aluminium 77.4 cu ft 3000 psi"),
        "{}",
        value(&app, "message")
    );
    // A second tap does not add it twice.
    press(&app, "save cylinders of Bram to my locker");
    press(&app, "Locker");
    assert_eq!(
        value(&app, "locker entry"),
        "Sidemount aluminium 77.4 cu ft 3000 psi"
    );
    find(&app, "mark Sidemount aluminium 77.4 cu ft 3000 psi as mine");
    assert!(app.session.borrow().locker.mine().is_none());
    back_key(&app);
    // Not mine: a new team starts with the first generic size, not Bram's set.
    press(&app, "new team");
    let s = app.session.borrow();
    assert_eq!(s.locker.entries().len(), 1);
    assert_eq!(s.team.labels()[0], "Twin 12 L 232 bar");
    drop(s);
    // It is offered in the picker, under my locker.
    press(&app, "cylinders of Me");
    press(
        &app,
        "pick from my locker Sidemount aluminium 77.4 cu ft 3000 psi",
    );
    assert_eq!(
        app.session.borrow().team.input().divers[0].cylinders.count,
        2
    );
}

#[test]
fn a_recent_mix_is_offered_first() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    // The demo team breathes EAN32; common practice adds air and EAN36.
    press(&app, "mix of Bram");
    assert_eq!(quick_mixes(&app), ["EAN32", "Air", "EAN36"]);
    // A custom mix on the keypad: O2, then He.
    press(&app, "custom mix O2 percent");
    press(&app, "clear");
    type_keys(&app, "28");
    press(&app, "done");
    press(&app, "clear");
    type_keys(&app, "0");
    press(&app, "done");
    assert_eq!(value(&app, "mix"), "EAN28");
    press(&app, "mix done");
    press(&app, "mix of Bram");
    press(&app, "EAN32");
    press(&app, "mix done");
    // Bram's two recent mixes come first, newest first.
    press(&app, "mix of Bram");
    assert_eq!(quick_mixes(&app), ["EAN32", "EAN28", "Air", "EAN36"]);
    press(&app, "EAN28");
    assert_eq!(value(&app, "mix"), "EAN28");
    press(&app, "cancel mix");
    // Ines has no history: her own mix, then the team's.
    press(&app, "mix of Ines");
    assert_eq!(quick_mixes(&app), ["EAN32", "Air", "EAN36"]);
    press(&app, "cancel mix");
}

#[test]
fn the_pickers_cancel_is_one_touch_high() {
    init();
    let dir = tempfile::tempdir().unwrap();
    let app = open_acknowledged(dir.path());
    press(&app, "cylinders of Ines");
    // 64 px = 64 dp: the touch size of every big button. The window is 4000 px tall,
    // so a Cancel that took the space left over would be far taller.
    let one_touch = |h: f32| (63.9..=64.5).contains(&h);
    let other = find(&app, "custom set").size().height;
    let cancel = find(&app, "cancel pick").size().height;
    assert!(one_touch(cancel) && one_touch(other), "{cancel} vs {other}");
    press(&app, "custom set");
    let cancel = find(&app, "cancel pick").size().height;
    let other = find(&app, "cylinder count 1").size().height;
    assert!(one_touch(cancel) && one_touch(other), "{cancel} vs {other}");
}
