//! Render every page headless to PNG at phone size (412×915 logical px, scale 1)
//! with Slint's software renderer, into docs/screenshots/.
//!
//! Run: `cargo run --example screenshots`

use std::path::Path;

use i_slint_backend_testing::{TestingBackend, TestingBackendOptions};
use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::app::adapters::refresh_all;
use turnsheet::app::nav::Screen;
use turnsheet::app::session::EntryTarget;
use turnsheet::formats::team_file::CylindersFile;
use turnsheet::plan::{Material, presets};
use turnsheet::storage::locker::LockerEntry;

fn save_png(app: &App, path: &Path) {
    let buffer = app.window.window().take_snapshot().expect("snapshot");
    let file = std::fs::File::create(path).expect("create png");
    let mut enc = png::Encoder::new(
        std::io::BufWriter::new(file),
        buffer.width(),
        buffer.height(),
    );
    enc.set_color(png::ColorType::Rgba);
    enc.set_depth(png::BitDepth::Eight);
    let mut w = enc.write_header().expect("png header");
    w.write_image_data(buffer.as_bytes()).expect("png data");
    println!("wrote {}", path.display());
}

fn main() {
    slint::platform::set_platform(Box::new(TestingBackend::new(TestingBackendOptions {
        mock_time: true,
        threading: false,
        renderer_name: Some("software".into()),
    })))
    .expect("platform");
    let out = Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/screenshots");
    std::fs::create_dir_all(&out).unwrap();
    let data = tempfile::tempdir().unwrap();
    // A fixed clock (5 December 2026, 09:42 UTC), so the read times on the pictures do
    // not change from one run to the next.
    let clock = turnsheet::app::clock::ManualClock::at(1_796_463_720);
    let app = App::with_clock(data.path(), std::rc::Rc::new(clock)).expect("app");
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 915.0));
    app.window.show().unwrap();

    let shot = |name: &str, f: &dyn Fn(&mut turnsheet::app::session::Session)| {
        f(&mut app.session.borrow_mut());
        refresh_all(&app.window, &app.session.borrow());
        save_png(&app, &out.join(format!("{name}.png")));
    };

    shot("01-cautions", &|_| {});
    shot("02-team", &|s| s.acknowledge_cautions());
    // The demo's starts are unread: the Turns page says whose and shows no numbers.
    shot("16-turns-waiting", &|s| s.go(Screen::Turns));
    // Read every start in the water (here: confirm the demo's numbers).
    shot("17-team-read", &|s| {
        s.back();
        for i in 0..s.team.len() {
            s.confirm_start(i);
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, s.now());
            }
        }
    });
    shot("03-keypad", &|s| {
        s.open_entry(EntryTarget::Start(1));
        for k in ["clear", "2", "1", "0"] {
            s.key(k);
        }
    });
    shot("04-keypad-invalid", &|s| s.key("0"));
    shot("05-turns", &|s| {
        s.cancel_entry();
        s.go(Screen::Turns);
    });
    shot("06-buddy", &|s| s.go(Screen::Buddy));
    shot("07-mix", &|s| {
        s.back();
        s.back();
        s.open_mix_picker(0);
    });
    shot("08-cylinders", &|s| {
        s.picker.close();
        s.open_cylinder_picker(2);
    });
    shot("09-locker", &|s| {
        s.picker.close();
        let p = &presets()[0];
        for (name, set, note) in [
            ("Steel twins", presets()[0].set, "Test due March"),
            ("Side AL", presets()[9].set, ""),
        ] {
            let id = s.locker.file.next_id();
            s.locker.file.entries.push(LockerEntry {
                id,
                name: name.into(),
                cylinders: CylindersFile::from_set(&set),
                material: if name.contains("AL") {
                    Material::Aluminium
                } else {
                    p.material
                },
                note: note.into(),
                mine: id == 1,
            });
        }
        s.go(Screen::Locker);
    });
    shot("10-locker-edit", &|s| s.locker_edit(1));
    shot("11-settings", &|s| {
        s.back();
        s.back();
        s.go(Screen::Settings);
    });
    shot("12-fill", &|s| {
        s.back();
        s.fill.pressure = turnsheet::plan::Pressure::from_bar(232.0);
        s.fill.temperature = turnsheet::plan::Temperature::from_celsius(32.0);
        s.go(Screen::Fill);
    });
    shot("13-chart", &|s| {
        s.back();
        s.go(Screen::Turns);
        s.go(Screen::Chart);
    });
    // Imperial volumes; Bram reads a psi gauge (two taps on his gauge button) and his
    // start is read again on it. Every other diver keeps the bar gauge they read.
    shot("14-turns-imperial", &|s| {
        s.back();
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
    shot("15-buddy-imperial", &|s| s.go(Screen::Buddy));
    // A set in neither list: Bram's two independent 11.1 L cylinders at 232 bar.
    shot("18-custom-set", &|s| {
        s.set_units(turnsheet::plan::UnitSystem::Metric);
        s.back();
        s.open_cylinder_picker(1);
        s.open_custom_cylinders();
        s.edit_custom(|c| {
            c.set_rated(false);
            c.set_count(2);
            c.independent = true;
            c.first = Some(11.1);
            c.second = Some(232.0);
        });
    });

    // A small phone (360 × 640) with the system text size at 1.3: a window opened at that
    // size (a window resized from 412 px would be drawn before its layout settled), with
    // every start read and Bram on his psi gauge, as above.
    let data = tempfile::tempdir().unwrap();
    let clock = turnsheet::app::clock::ManualClock::at(1_796_463_720);
    let app = App::with_clock(data.path(), std::rc::Rc::new(clock)).expect("app");
    app.set_font_scale(1.3);
    app.window
        .window()
        .set_size(slint::LogicalSize::new(360.0, 640.0));
    app.window.show().unwrap();
    let shot = |name: &str, f: &dyn Fn(&mut turnsheet::app::session::Session)| {
        f(&mut app.session.borrow_mut());
        refresh_all(&app.window, &app.session.borrow());
        save_png(&app, &out.join(format!("{name}.png")));
    };
    shot("20-small-team", &|s| {
        s.acknowledge_cautions();
        s.set_gauge(1, turnsheet::app::session::GAUGES[2]);
        s.open_entry(EntryTarget::Start(1));
        for k in ["clear", "2", "9", "5", "0"] {
            s.key(k);
        }
        s.entry_done();
        for i in 0..s.team.len() {
            s.confirm_start(i);
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, s.now());
            }
        }
    });
    shot("21-small-keypad", &|s| {
        s.open_entry(EntryTarget::Start(0));
        for k in ["clear", "2", "1", "0"] {
            s.key(k);
        }
    });
    shot("22-small-turns", &|s| {
        s.entry_done();
        s.go(Screen::Turns);
    });
    shot("23-small-chart", &|s| s.go(Screen::Chart));
    shot("24-small-buddy", &|s| s.go(Screen::Buddy));
    // A stray tap on the rule once turns are shown: what it did, and Undo.
    shot("25-small-rule-changed", &|s| {
        s.back();
        s.back();
        s.back();
        s.set_rule(3);
    });
    // The gauge of a diver is chosen, the current one marked.
    shot("26-small-gauge-chooser", &|s| s.open_gauge_chooser(1));

    // The light theme (Settings, Screen: Light, for bright sun) on the key pages, with
    // every start read, at 412 × 915 and the normal text size.
    let data = tempfile::tempdir().unwrap();
    let clock = turnsheet::app::clock::ManualClock::at(1_796_463_720);
    let app = App::with_clock(data.path(), std::rc::Rc::new(clock)).expect("app");
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 915.0));
    app.window.show().unwrap();
    let shot = |name: &str, f: &dyn Fn(&mut turnsheet::app::session::Session)| {
        f(&mut app.session.borrow_mut());
        refresh_all(&app.window, &app.session.borrow());
        save_png(&app, &out.join(format!("{name}.png")));
    };
    shot("30-light-team", &|s| {
        s.acknowledge_cautions();
        s.set_theme(1);
        for i in 0..s.team.len() {
            s.confirm_start(i);
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, s.now());
            }
        }
    });
    shot("31-light-turns", &|s| s.go(Screen::Turns));
    shot("32-light-buddy", &|s| s.go(Screen::Buddy));
    shot("33-light-settings", &|s| {
        s.back();
        s.back();
        s.go(Screen::Settings);
    });
}
