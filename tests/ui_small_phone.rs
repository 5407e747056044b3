//! A small phone: every page and overlay at 360 × 640 with the system text size at
//! 1.3, through the real toolkit with the software renderer. 1.3 is our own choice of a
//! large system text setting (from memory: Android's font size setting reaches 1.3 on
//! many devices).
//!
//! Checked for every state:
//! - every text can be read whole (`layout_check`): none wider than its box, no word
//!   split across lines, no lines cut at the bottom, none out of reach of scrolling,
//!   none drawn over another or touching a button's border, no title withheld;
//! - every button is at least 48 × 48 px (the common minimum touch target);
//! - nothing reaches past the left or right edge;
//! - the open keypad (field, message, keys, Cancel and Done) fits inside the window, so
//!   nothing is hidden behind it or below it;
//! - every text shown reaches 7:1 against its ground (WCAG 2.1, 1.4.6).
//!
//! All of it twice: in the dark theme and in the light one.
//!
//! The walk runs in every language the app speaks (German and French words are the
//! longest). Each state is also drawn to `target/small-phone/LANG-NAME.png` to look at.

mod layout_check;

use i_slint_backend_testing::{
    AccessibleRole, ElementHandle, ElementQuery, TestingBackend, TestingBackendOptions,
};
use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::app::adapters::refresh_all;
use turnsheet::app::nav::Screen;
use turnsheet::app::session::{EntryTarget, Session};
use turnsheet::i18n::Language;

const W: f32 = 360.0;
const H: f32 = 640.0;
const SCALE: f32 = 1.3;

fn save_png(app: &App, name: &str) {
    let dir = std::path::Path::new(env!("CARGO_TARGET_TMPDIR"))
        .parent()
        .unwrap()
        .join("small-phone");
    std::fs::create_dir_all(&dir).unwrap();
    let shot = app.window.window().take_snapshot().unwrap();
    let file = std::fs::File::create(dir.join(format!("{name}.png"))).unwrap();
    let mut enc = png::Encoder::new(std::io::BufWriter::new(file), shot.width(), shot.height());
    enc.set_color(png::ColorType::Rgba);
    enc.set_depth(png::BitDepth::Eight);
    enc.write_header()
        .unwrap()
        .write_image_data(shot.as_bytes())
        .unwrap();
}

/// Every element with a label or a role, with where it is.
fn elements(app: &App) -> Vec<(String, AccessibleRole, f32, f32, f32, f32)> {
    ElementQuery::from_root(&app.window)
        .match_descendants()
        .find_all()
        .into_iter()
        .filter_map(|e: ElementHandle| {
            let role = e.accessible_role()?;
            if role == AccessibleRole::None {
                return None;
            }
            let label = e.accessible_label().unwrap_or_default().to_string();
            let p = e.absolute_position();
            let s = e.size();
            Some((label, role, p.x, p.y, s.width, s.height))
        })
        .collect()
}

/// What the open keypad shows: its field and message, keys, Cancel and Done (their
/// names in the language on screen).
fn on_keypad(label: &str) -> bool {
    let key = label.chars().count() == 1;
    key || [
        "entry",
        "entry problem",
        "cancel entry",
        "done",
        "delete",
        "clear",
        "space",
        "decimal separator",
        "minus one step",
        "plus one step",
    ]
    .iter()
    .any(|name| turnsheet::i18n::tr(name) == label)
}

/// The problems of the state on screen, each naming the element. With `keypad`, the
/// keypad's own elements must also fit the window's height.
fn problems(app: &App, state: &str, keypad: bool) -> Vec<String> {
    let mut out = Vec::new();
    for (label, role, x, y, w, h) in elements(app) {
        let whole_height = keypad && on_keypad(&label);
        if w <= 0.0 || h <= 0.0 {
            continue;
        }
        if role == AccessibleRole::Button && (w < 47.9 || h < 47.9) {
            out.push(format!("{state}: button {label:?} is {w:.0} × {h:.0} px"));
        }
        if x < -0.5 || x + w > W + 0.5 {
            out.push(format!(
                "{state}: {label:?} spans x {x:.0} to {:.0} in a {W} px window",
                x + w
            ));
        }
        if whole_height && (y < -0.5 || y + h > H + 0.5) {
            out.push(format!(
                "{state}: {label:?} spans y {y:.0} to {:.0} in a {H} px window",
                y + h
            ));
        }
    }
    out
}

/// The testing backend with the software renderer, for this test's thread.
fn software_backend() {
    slint::platform::set_platform(Box::new(TestingBackend::new(TestingBackendOptions {
        mock_time: true,
        threading: false,
        renderer_name: Some("software".into()),
    })))
    .unwrap();
}

slint::slint! {
    // One fault of each kind the check must name, and one text that is fine.
    export component Faults inherits Window {
        width: 200px;
        height: 300px;
        Text { x: 0px; y: 0px; width: 30px; height: 30px; text: "210 bar"; }
        Text { x: 0px; y: 40px; width: 30px; height: 100px; text: "aluminium"; wrap: word-wrap; }
        Text { x: 100px; y: 0px; width: 90px; height: 14px; text: "one two three four five six seven"; wrap: word-wrap; }
        Text { x: 0px; y: 285px; width: 100px; height: 30px; text: "footer"; }
        Flickable {
            x: 100px; y: 150px; width: 100px; height: 60px;
            content-height: 60px;
            Text { x: 0px; y: 100px; width: 90px; height: 20px; text: "last row"; }
        }
        Text { x: 0px; y: 220px; width: 60px; height: 30px; text: "•••"; }
        Text { x: 5px; y: 220px; width: 60px; height: 30px; text: "psi"; }
        Rectangle {
            x: 100px; y: 230px; width: 40px; height: 48px;
            accessible-role: button;
            Text { width: parent.width; height: parent.height; text: "Save"; }
        }
        Text { x: 0px; y: 150px; width: 90px; height: 30px; text: "Locker"; color: transparent; }
        Text { x: 100px; y: 40px; width: 90px; height: 30px; text: "fine"; }
        Text { x: 100px; y: 80px; width: 30px; height: 30px; text: "Diver 2"; overflow: elide; }
        Rectangle {
            x: 150px; y: 250px; width: 50px; height: 40px;
            background: #ffffff;
            Text { text: "pale"; color: #dddddd; }
        }
    }
}

#[test]
fn the_check_names_each_kind_of_fault() {
    software_backend();
    let ui = Faults::new().unwrap();
    ui.show().unwrap();
    let found = layout_check::problems(ui.window(), "faults");
    let has = |text: &str, kind: &str| {
        found
            .iter()
            .any(|p| p.contains(&format!("{text:?}")) && p.contains(kind))
    };
    let all = found.join("\n");
    assert!(has("210 bar", "wider than its box"), "{all}");
    assert!(has("aluminium", "splits a word"), "{all}");
    assert!(has("Diver 2", "cut short"), "{all}");
    assert!(
        has("one two three four five six seven", "cut at the bottom"),
        "{all}"
    );
    assert!(has("footer", "cannot be seen or scrolled to"), "{all}");
    assert!(has("last row", "cannot be seen or scrolled to"), "{all}");
    assert!(has("•••", "drawn over each other"), "{all}");
    assert!(has("Save", "button's border"), "{all}");
    assert!(has("Locker", "drawn invisible"), "{all}");
    assert!(!all.contains("\"fine\""), "{all}");
    let low = layout_check::low_contrast(ui.window(), "faults").join("\n");
    assert!(low.contains("\"pale\" is 1.3"), "{low}");
    assert!(!low.contains("\"fine\""), "{low}");
}

#[test]
fn every_page_works_on_a_small_phone_with_large_text() {
    software_backend();
    expect_none(walk(Language::English, false));
}

/// The same in the light theme: the words and the layout do not change with the colours,
/// and no text is drawn in the ground's colour.
#[test]
fn every_page_works_on_a_small_phone_with_large_text_light() {
    software_backend();
    expect_none(walk(Language::English, true));
}

/// German and French words are the longest; every language gets the same walk.
#[test]
fn every_language_works_on_a_small_phone_with_large_text() {
    software_backend();
    let mut found = Vec::new();
    for l in Language::ALL
        .into_iter()
        .filter(|l| *l != Language::English)
    {
        found.extend(walk(l, false));
    }
    expect_none(found);
}

fn expect_none(found: Vec<String>) {
    assert!(
        found.is_empty(),
        "{} problems:\n{}",
        found.len(),
        found.join("\n")
    );
}

/// Every page and overlay in `language`, at 360 × 640 with text at 1.3, in the dark or
/// the light theme.
fn walk(language: Language, light: bool) -> Vec<String> {
    let dir = tempfile::tempdir().unwrap();
    let app = App::new(dir.path()).unwrap();
    app.set_system_language(language);
    let code = language.code();
    // Light is the second choice in Settings (`ThemeChoice::ALL`).
    app.session.borrow_mut().set_theme(usize::from(light));
    let suffix = if light { "-light" } else { "" };
    app.set_font_scale(SCALE);
    app.window.window().set_size(slint::LogicalSize::new(W, H));
    app.window.show().unwrap();

    let mut all = Vec::new();
    let mut seen = 0;
    let mut state = |name: &str, keypad: bool, f: &dyn Fn(&mut Session)| {
        let name = &format!("{code}-{name}");
        f(&mut app.session.borrow_mut());
        refresh_all(&app.window, &app.session.borrow());
        save_png(&app, &format!("{name}{suffix}"));
        seen += elements(&app).len();
        all.extend(problems(&app, name, keypad));
        all.extend(layout_check::problems(app.window.window(), name));
        all.extend(layout_check::low_contrast(app.window.window(), name));
    };

    state("cautions", false, &|_| {});
    state("team", false, &|s| s.acknowledge_cautions());
    state("keypad-start", true, &|s| {
        s.open_entry(EntryTarget::Start(1))
    });
    state("keypad-start-refused", true, &|s| {
        for k in ["9", "9", "9"] {
            s.key(k);
        }
    });
    state("keypad-name", true, &|s| {
        s.cancel_entry();
        s.open_entry(EntryTarget::DiverName(0));
    });
    state("team-read", false, &|s| {
        s.cancel_entry();
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
    });
    state("mix-picker", false, &|s| s.open_mix_picker(0));
    state("cylinder-picker", false, &|s| {
        s.picker.close();
        s.open_cylinder_picker(1);
    });
    state("custom-set", false, &|s| s.open_custom_cylinders());
    state("keypad-custom-size", true, &|s| {
        s.open_entry(EntryTarget::CustomFirst)
    });
    state("turns", false, &|s| {
        s.cancel_entry();
        s.picker.close();
        s.go(Screen::Turns);
    });
    state("turns-qr", false, &|s| s.open_plan_qr());
    state("buddy", false, &|s| s.go(Screen::Buddy));
    state("buddy-qr", false, &|s| s.open_plan_qr());
    state("chart", false, &|s| {
        s.close_plan_qr();
        s.back();
        s.go(Screen::Chart);
    });
    state("fill", false, &|s| {
        s.back();
        s.back();
        s.go(Screen::Fill);
    });
    state("settings", false, &|s| {
        s.back();
        s.go(Screen::Settings);
    });
    state("locker", false, &|s| s.go(Screen::Locker));
    state("locker-edit", false, &|s| s.locker_new());
    state("keypad-locker-name", true, &|s| {
        s.open_entry(EntryTarget::LockerName)
    });
    // The longest name a set may have (40 characters), typed in wide letters: all of
    // it stays on the keypad's line, the end being typed too.
    state("keypad-long-name", true, &|s| {
        for k in 0..40 {
            s.key(if k % 9 == 8 { " " } else { "W" });
        }
    });
    // Leaving the changed set asks first.
    state("prompt-discard", false, &|s| {
        s.key("A");
        s.entry_done();
        s.back();
        assert_ne!(s.prompt, turnsheet::app::session::Prompt::None);
    });

    // Everything below the fold of each scrolling page, in a window as narrow but
    // tall enough to show it all.
    app.window
        .window()
        .set_size(slint::LogicalSize::new(W, 5000.0));
    let mut tall = |name: &str, f: &dyn Fn(&mut Session)| {
        let name = &format!("{code}-{name}");
        f(&mut app.session.borrow_mut());
        refresh_all(&app.window, &app.session.borrow());
        all.extend(problems(&app, name, false));
        all.extend(layout_check::problems(app.window.window(), name));
    };
    tall("locker-edit (whole page)", &|s| {
        s.back();
    });
    tall("locker (whole page)", &|s| {
        s.back();
        s.answer_prompt(1);
        assert_eq!(s.page(), Screen::Locker);
    });
    tall("settings (whole page)", &|s| {
        s.back();
    });
    tall("team (whole page)", &|s| {
        s.back();
    });
    tall("turns (whole page)", &|s| s.go(Screen::Turns));
    // Bram reads psi (his gauge button twice), the team is imperial, then metric again.
    tall("team with a psi diver (whole page)", &|s| {
        s.back();
        s.set_gauge(1, turnsheet::app::session::GAUGES[2]);
        s.open_entry(EntryTarget::Start(1));
        for k in ["2", "9", "5", "0"] {
            s.key(k);
        }
        s.entry_done();
        s.set_units(turnsheet::plan::UnitSystem::Imperial);
        s.set_units(turnsheet::plan::UnitSystem::Metric);
    });
    // His turn in psi has four digits: the Turns page still fits the width.
    tall("turns with a psi diver (whole page)", &|s| {
        s.go(Screen::Turns)
    });
    tall("fill (whole page)", &|s| {
        s.back();
        s.go(Screen::Fill);
    });

    assert!(seen > 200, "only {seen} elements looked at");
    let mut unique = std::collections::BTreeSet::new();
    all.retain(|p| unique.insert(p.clone()));
    all
}

/// On a common large phone (412 × 915, text at 1.0) the Team page opens with the dive's
/// settings unfolded, so it is the longest the page gets: in every language its last
/// control can be scrolled to, and every text of the main pages reads whole.
#[test]
fn every_language_reaches_the_end_of_the_team_page_on_a_large_phone() {
    software_backend();
    let mut found = Vec::new();
    for language in Language::ALL {
        let dir = tempfile::tempdir().unwrap();
        let app = App::new(dir.path()).unwrap();
        app.set_system_language(language);
        app.window
            .window()
            .set_size(slint::LogicalSize::new(412.0, 915.0));
        app.window.show().unwrap();
        let code = language.code();
        let mut state = |name: &str, f: &dyn Fn(&mut Session)| {
            f(&mut app.session.borrow_mut());
            refresh_all(&app.window, &app.session.borrow());
            found.extend(layout_check::problems(
                app.window.window(),
                &format!("{code}-412x915-{name}"),
            ));
        };
        state("team", &|s| s.acknowledge_cautions());
        state("team-read", &|s| {
            for i in 0..s.team.len() {
                s.confirm_start(i);
            }
        });
        state("turns", &|s| s.go(Screen::Turns));
        // Imperial volumes, Bram on his psi gauge (four-digit turn and start).
        state("turns-imperial-psi", &|s| {
            s.back();
            s.set_units(turnsheet::plan::UnitSystem::Imperial);
            s.set_gauge(1, turnsheet::app::session::GAUGES[2]);
            s.open_entry(EntryTarget::Start(1));
            for k in ["clear", "2", "9", "5", "0"] {
                s.key(k);
            }
            s.entry_done();
            s.go(Screen::Turns);
        });
        state("chart", &|s| s.go(Screen::Chart));
        state("fill", &|s| {
            s.back();
            s.back();
            s.go(Screen::Fill);
        });
        state("settings", &|s| {
            s.back();
            s.go(Screen::Settings);
        });
        state("locker", &|s| {
            s.back();
            s.go(Screen::Locker);
        });
    }
    expect_none(found);
}
