//! Text contrast of the theme's colour pairs, in the dark and the light theme: at least
//! 7:1 (WCAG 2.1 contrast ratio, success criterion 1.4.6 "Contrast (Enhanced)", using its
//! relative-luminance formula). Pairs are declared in ui/theme.slint with
//! `// contrast-pair: FG on BG` comments; each colour is written `dark ? DARK : LIGHT`.

/// A colour of the theme: the dark one (`light` false) or the light one.
fn colour(theme: &str, name: &str, light: bool) -> [f64; 3] {
    let needle = format!("property <color> {name}:");
    let line = theme
        .lines()
        .find(|l| l.contains(&needle))
        .unwrap_or_else(|| panic!("colour {name} not in theme"));
    let hexes: Vec<&str> = line.split('#').skip(1).collect();
    assert!(
        line.contains("dark ?") && hexes.len() == 2,
        "colour {name} is not written `dark ? #DARK : #LIGHT`: {line}"
    );
    let hex = hexes[usize::from(light)];
    let v = |i: usize| u8::from_str_radix(&hex[i..i + 2], 16).unwrap() as f64 / 255.0;
    [v(0), v(2), v(4)]
}

fn luminance(c: [f64; 3]) -> f64 {
    let lin = |x: f64| {
        if x <= 0.03928 {
            x / 12.92
        } else {
            ((x + 0.055) / 1.055).powf(2.4)
        }
    };
    0.2126 * lin(c[0]) + 0.7152 * lin(c[1]) + 0.0722 * lin(c[2])
}

fn contrast(a: [f64; 3], b: [f64; 3]) -> f64 {
    let (la, lb) = (luminance(a), luminance(b));
    (la.max(lb) + 0.05) / (la.min(lb) + 0.05)
}

#[test]
fn wcag_formula_matches_known_values() {
    // WCAG 2.1: black on white is 21:1; #777777 on white is about 4.48:1.
    assert!((contrast([0.0; 3], [1.0; 3]) - 21.0).abs() < 1e-9);
    let grey = 0x77 as f64 / 255.0;
    assert!((contrast([grey; 3], [1.0; 3]) - 4.48).abs() < 0.01);
}

#[test]
fn every_declared_pair_reaches_seven_to_one_in_both_themes() {
    let theme = include_str!("../ui/theme.slint");
    for (light, name) in [(false, "dark"), (true, "light")] {
        let mut pairs = 0;
        let mut lowest = f64::INFINITY;
        for line in theme.lines() {
            if let Some(rest) = line.trim().strip_prefix("// contrast-pair:") {
                let parts: Vec<&str> = rest.split(" on ").map(str::trim).collect();
                let fg = colour(theme, parts[0], light);
                let bg = colour(theme, parts[1], light);
                let c = contrast(fg, bg);
                assert!(c >= 7.0, "{name}: {} on {}: {c:.2}:1", parts[0], parts[1]);
                lowest = lowest.min(c);
                pairs += 1;
            }
        }
        println!("{name} theme: {pairs} declared pairs, lowest {lowest:.2}:1");
        assert!(pairs >= 8, "only {pairs} pairs declared");
    }
}

#[test]
fn a_light_colour_on_a_light_ground_is_caught() {
    // The check must be able to fail: the dark theme's text on the light background.
    let theme = include_str!("../ui/theme.slint");
    let c = contrast(
        colour(theme, "text", false),
        colour(theme, "background", true),
    );
    assert!(c < 1.5, "{c}");
}

#[path = "layout_check/mod.rs"]
mod layout_check;

/// Every text the real UI shows, in every state a diver meets (selected values and
/// choices, disabled buttons, warnings, the mine mark, boxed chart cells, prompts),
/// against what is painted behind it: at least 7:1 (WCAG 2.1, 1.4.6). The colours are
/// read from the laid-out item tree, so a state's pair cannot be missed by the list of
/// declared pairs above.
#[test]
fn every_text_in_every_state_reaches_seven_to_one_dark() {
    every_text_in_every_state(turnsheet::storage::settings::ThemeChoice::Dark);
}

#[test]
fn every_text_in_every_state_reaches_seven_to_one_light() {
    every_text_in_every_state(turnsheet::storage::settings::ThemeChoice::Light);
}

fn every_text_in_every_state(theme: turnsheet::storage::settings::ThemeChoice) {
    use slint::ComponentHandle;
    use turnsheet::app::App;
    use turnsheet::app::adapters::refresh_all;
    use turnsheet::app::nav::Screen;
    use turnsheet::app::session::{EntryTarget, Session};

    i_slint_backend_testing::init_no_event_loop();
    let dir = tempfile::tempdir().unwrap();
    let app = App::new(dir.path()).unwrap();
    // Tall, so that every text is laid out on screen at once.
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 3000.0));
    let mut failures = Vec::new();
    let mut checked = 0;
    let mut lowest = (f64::INFINITY, String::new());
    let mut state = |name: &str, f: &dyn Fn(&mut Session)| {
        f(&mut app.session.borrow_mut());
        refresh_all(&app.window, &app.session.borrow());
        for t in layout_check::texts(app.window.window()) {
            if t.covered || t.colour.alpha() == 0 {
                continue;
            }
            let fg = layout_check::blend(t.colour, t.background);
            let c = layout_check::contrast(fg, t.background);
            checked += 1;
            if c < lowest.0 {
                lowest = (
                    c,
                    format!("{name}: {:?}", t.text.chars().take(30).collect::<String>()),
                );
            }
            if c < 7.0 {
                failures.push(format!(
                    "{name}: {:?} {:?} on {:?}: {c:.2}:1",
                    t.text.chars().take(30).collect::<String>(),
                    fg,
                    t.background
                ));
            }
        }
    };
    // The theme is chosen as in Settings (and saved), before the first page is drawn.
    let index = turnsheet::storage::settings::ThemeChoice::ALL
        .iter()
        .position(|t| *t == theme)
        .unwrap();
    app.session.borrow_mut().set_theme(index);
    refresh_all(&app.window, &app.session.borrow());
    let dark = app.window.global::<turnsheet::app::ui::Theme>().get_dark();
    assert_eq!(
        dark,
        theme == turnsheet::storage::settings::ThemeChoice::Dark
    );
    state("cautions", &|_| {});
    state("team", &|s| s.acknowledge_cautions());
    // A value already read: the keypad opens with it selected (lit).
    state("keypad selected", &|s| {
        s.confirm_start(0);
        s.open_entry(EntryTarget::Start(0))
    });
    // A refused value: the message, the field's border and Done disabled.
    state("keypad refused", &|s| {
        for k in ["9", "9", "9"] {
            s.key(k);
        }
    });
    // An overfill: said on the keypad, not refused.
    state("keypad warning", &|s| {
        s.key("clear");
        for k in ["3", "0", "0"] {
            s.key(k);
        }
    });
    state("team with warnings and halves", &|s| {
        s.entry_done();
        s.set_rule(0); // halves: the rule warning
    });
    state("letters", &|s| s.open_entry(EntryTarget::DiverName(0)));
    state("mix picker", &|s| {
        s.cancel_entry();
        s.open_mix_picker(0);
    });
    state("cylinder picker", &|s| {
        s.picker.close();
        s.open_cylinder_picker(1);
    });
    state("custom set", &|s| s.open_custom_cylinders());
    state("turns", &|s| {
        s.picker.close();
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
        s.go(Screen::Turns);
    });
    state("buddy", &|s| s.go(Screen::Buddy));
    state("chart", &|s| {
        s.back();
        s.go(Screen::Chart);
    });
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
        s.go(Screen::Locker);
        s.locker_copy_preset(0);
        s.locker_save().unwrap();
        let id = s.locker.entries()[0].id;
        s.locker.make_mine(id);
    });
    state("locker edit, name warning", &|s| {
        let id = s.locker.entries()[0].id;
        s.locker_edit(id);
        s.open_entry(EntryTarget::LockerName);
        s.key("clear");
        s.key("A");
        s.entry_done();
        s.locker.edit_draft(|d| d.change_count(1));
    });
    state("discard prompt", &|s| {
        s.back();
    });
    println!(
        "{theme:?} theme: {checked} texts in 18 states; lowest {:.2}:1 ({})",
        lowest.0, lowest.1
    );
    assert!(checked > 300, "only {checked} texts looked at");
    assert!(
        failures.is_empty(),
        "{theme:?} theme: {} texts under 7:1:\n{}",
        failures.len(),
        failures.join("\n")
    );
}
