//! The plan on every diver's phone: the QR code on the Turns page and the buddy view,
//! drawn by the real UI (software renderer, 360 × 640, text at 1.3), must read back as
//! the plan's text with an independent decoder (`rqrr`, crates.io), and must only be
//! there while the turns are. "Copy plan as text" never panics without a clipboard.

use std::rc::Rc;

use i_slint_backend_testing::{ElementHandle, TestingBackend, TestingBackendOptions};
use slint::ComponentHandle;
use slint::platform::{Key, WindowEvent};
use turnsheet::app::adapters::refresh_all;
use turnsheet::app::clock::{Clock, ManualClock};
use turnsheet::app::nav::Screen;
use turnsheet::app::qr_image::{QUIET_ZONE, qr_matrix};
use turnsheet::app::ui::PlanQrAdapter;
use turnsheet::app::{App, CLOCK_WATCH};
use turnsheet::i18n::{Language, tr};

/// 3 December 2026, 09:00 UTC.
const MORNING: i64 = 1_796_288_400;

fn software_backend() {
    slint::platform::set_platform(Box::new(TestingBackend::new(TestingBackendOptions {
        mock_time: true,
        threading: false,
        renderer_name: Some("software".into()),
    })))
    .unwrap();
}

/// A window as narrow as a small phone and tall enough that the Turns page's buttons
/// below the turns are inside it (queries only see elements inside their clip).
fn tall(app: &App) {
    app.window
        .window()
        .set_size(slint::LogicalSize::new(360.0, 4000.0));
}

/// The small phone itself: 360 × 640.
fn phone(app: &App) {
    app.window
        .window()
        .set_size(slint::LogicalSize::new(360.0, 640.0));
}

/// A small phone with large text, past the cautions, with `divers` divers.
fn small_phone(dir: &std::path::Path, clock: &ManualClock, divers: usize) -> App {
    let app = App::with_clock(dir, Rc::new(clock.clone())).unwrap();
    app.set_font_scale(1.3);
    tall(&app);
    app.window.show().unwrap();
    {
        let mut s = app.session.borrow_mut();
        s.acknowledge_cautions();
        while s.team.len() < divers {
            s.add_diver();
        }
        s.go(Screen::Turns);
    }
    refresh_all(&app.window, &app.session.borrow());
    app
}

/// Every start and stage start read on the gauge now.
fn read_every_gauge(app: &App) {
    {
        let mut s = app.session.borrow_mut();
        s.begin_action();
        let now = s.now();
        for i in 0..s.team.len() {
            s.confirm_start(i);
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, now);
            }
        }
    }
    refresh_all(&app.window, &app.session.borrow());
}

fn count(app: &App, label: &str) -> usize {
    ElementHandle::find_by_accessible_label(&app.window, label).count()
}

fn press(app: &App, label: &str) {
    ElementHandle::find_by_accessible_label(&app.window, label)
        .next()
        .unwrap_or_else(|| panic!("no {label:?}"))
        .invoke_accessible_default_action();
}

/// Every QR code `rqrr` finds in a grey picture, decoded.
fn decode(w: usize, h: usize, luma: impl Fn(usize, usize) -> u8) -> Vec<String> {
    let mut img = rqrr::PreparedImage::prepare_from_greyscale(w, h, luma);
    img.detect_grids()
        .into_iter()
        .filter_map(|g| g.decode().ok().map(|(_, text)| text))
        .collect()
}

/// The QR codes on the window as drawn.
fn decode_screen(app: &App) -> Vec<String> {
    let shot = app.window.window().take_snapshot().unwrap();
    let (w, h) = (shot.width() as usize, shot.height() as usize);
    let px = shot.as_slice();
    decode(w, h, |x, y| {
        let p = px[y * w + x];
        ((p.r as u32 * 30 + p.g as u32 * 59 + p.b as u32 * 11) / 100) as u8
    })
}

/// The QR code the adapter hands to the view.
fn decode_adapter(app: &App) -> Vec<String> {
    let image = app.window.global::<PlanQrAdapter>().get_code();
    let buf = image.to_rgb8().expect("an RGB picture");
    let (w, h) = (buf.width() as usize, buf.height() as usize);
    let px = buf.as_slice();
    decode(w, h, |x, y| px[y * w + x].r)
}

fn plan_text(app: &App) -> String {
    app.session.borrow().plan_text().expect("turns are shown")
}

#[test]
fn the_qr_code_reads_back_as_the_plan_and_only_while_turns_are_shown() {
    software_backend();
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(MORNING);
    let app = small_phone(dir.path(), &clock, 3);

    // Starts not read: no code, no copy, on the Turns page or the buddy view.
    assert_eq!(count(&app, "show plan QR code"), 0);
    assert_eq!(count(&app, "copy plan as text"), 0);
    app.session.borrow_mut().open_plan_qr();
    refresh_all(&app.window, &app.session.borrow());
    assert!(!app.window.global::<PlanQrAdapter>().get_open());

    read_every_gauge(&app);
    assert_eq!(count(&app, "show plan QR code"), 1);
    press(&app, "show plan QR code");
    phone(&app);
    assert!(app.window.global::<PlanQrAdapter>().get_open());
    let text = plan_text(&app);
    assert_eq!(decode_adapter(&app), vec![text.clone()]);
    assert_eq!(decode_screen(&app), vec![text.clone()], "the code as drawn");
    // The text names each diver with the turn the Turns page shows.
    for d in &app.session.borrow().team.plan().divers {
        assert!(
            text.contains(&format!("{}: start", d.name)),
            "{}: {text}",
            d.name
        );
    }
    // Drawn large enough for a camera: most of the width of a 360 px phone.
    let code = ElementHandle::find_by_accessible_label(&app.window, "plan QR code")
        .next()
        .unwrap();
    assert!(code.size().width >= 250.0, "{:?}", code.size());
    assert_eq!(code.accessible_value().unwrap_or_default(), text.as_str());

    // Back closes the code first; the Turns page stays.
    let w = app.window.window();
    w.dispatch_event(WindowEvent::KeyPressed {
        text: Key::Escape.into(),
    });
    w.dispatch_event(WindowEvent::KeyReleased {
        text: Key::Escape.into(),
    });
    assert!(!app.window.global::<PlanQrAdapter>().get_open());
    assert_eq!(app.session.borrow().page(), Screen::Turns);

    // The buddy view has it too (at the foot of the screen, inside a small phone).
    press(&app, "Buddy view");
    assert_eq!(app.session.borrow().page(), Screen::Buddy);
    press(&app, "show plan QR code");
    assert_eq!(
        decode_screen(&app),
        vec![plan_text(&app)],
        "on the buddy view"
    );
    // Three hours later the starts are no reading of this dive: the code goes with
    // the turns, even with nobody touching the phone.
    clock.advance(3 * 3600 + 60);
    i_slint_backend_testing::mock_elapsed_time(CLOCK_WATCH);
    slint::platform::update_timers_and_animations();
    assert!(clock.now() > MORNING);
    assert!(!app.window.global::<PlanQrAdapter>().get_open());
    assert_eq!(count(&app, "show plan QR code"), 0);
    assert!(decode_screen(&app).is_empty());
}

#[test]
fn six_divers_fit_one_code_that_reads_back_on_a_small_phone() {
    software_backend();
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(MORNING);
    let app = small_phone(dir.path(), &clock, 6);
    read_every_gauge(&app);
    let text = plan_text(&app);
    let m = qr_matrix(&text).expect("one code");
    let drawn = ElementHandle::find_by_accessible_label(&app.window, "show plan QR code").count();
    assert_eq!(drawn, 1);
    press(&app, "show plan QR code");
    phone(&app);
    let code = ElementHandle::find_by_accessible_label(&app.window, "plan QR code")
        .next()
        .unwrap();
    let per_module = code.size().width / (m.modules + 2 * QUIET_ZONE) as f32;
    println!(
        "six divers: {} bytes of text, QR version {}, {} × {} modules ({} with the quiet zone), {:.1} px per module at 360 px wide\n{text}",
        text.len(),
        m.version,
        m.modules,
        m.modules,
        m.modules + 2 * QUIET_ZONE,
        per_module
    );
    // Our own limits: a version a phone camera reads from a screen at arm's length, and
    // at least 3 logical pixels (about 8 device pixels on a phone) per module.
    assert!(m.version <= 20, "version {}", m.version);
    assert!(per_module >= 3.0, "{per_module} px per module");
    assert_eq!(decode_screen(&app), vec![text]);
    // In every language the same team still fits one code of at most version 20.
    for l in Language::ALL {
        app.set_system_language(l);
        let text = plan_text(&app);
        let m = qr_matrix(&text).expect("one code");
        println!("{l:?}: {} bytes, QR version {}", text.len(), m.version);
        assert!(m.version <= 20, "{l:?}: version {}\n{text}", m.version);
    }
}

/// The caption over a code.
const CAPTION: &str = "Point a phone camera at the code: it reads the plan as plain text, with no app and no network.";

#[test]
fn the_code_and_its_caption_speak_the_screen_language() {
    software_backend();
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(MORNING);
    let app = small_phone(dir.path(), &clock, 3);
    read_every_gauge(&app);
    let english = plan_text(&app);
    for l in [Language::German, Language::French, Language::Spanish] {
        app.set_system_language(l);
        app.session.borrow_mut().open_plan_qr();
        refresh_all(&app.window, &app.session.borrow());
        let a = app.window.global::<PlanQrAdapter>();
        assert!(a.get_open(), "{l:?}");
        let caption = a.get_caption().to_string();
        assert_eq!(caption, tr(CAPTION), "{l:?}");
        assert_ne!(caption, CAPTION, "{l:?}: the caption is English");
        // The code reads back as the plan in the diver's words, letters like "ü" and
        // "é" included.
        let text = plan_text(&app);
        assert_eq!(decode_adapter(&app), vec![text.clone()], "{l:?}");
        for (ours, en) in text.lines().zip(english.lines()) {
            assert_ne!(ours, en, "{l:?}: an English line");
        }
        app.session.borrow_mut().close_plan_qr();
    }
}

#[test]
fn copying_without_a_clipboard_says_so() {
    software_backend();
    let dir = tempfile::tempdir().unwrap();
    let clock = ManualClock::at(MORNING);
    let app = small_phone(dir.path(), &clock, 3);
    read_every_gauge(&app);
    assert_eq!(count(&app, "copy plan as text"), 1);
    press(&app, "copy plan as text");
    let msg = app.session.borrow().status.text();
    let headless =
        std::env::var_os("DISPLAY").is_none() && std::env::var_os("WAYLAND_DISPLAY").is_none();
    if headless {
        assert!(
            msg.contains("The plan could not be copied: no clipboard is available here"),
            "{msg}"
        );
    } else {
        assert!(
            msg.contains("Plan copied") || msg.contains("could not be copied"),
            "{msg}"
        );
    }
}
