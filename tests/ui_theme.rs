//! The screen's colours through the real toolkit, drawn by the software renderer: the
//! Settings choice turns every page light or dark, is saved, and comes back after a
//! restart; "as the system" follows the colour scheme the platform reports.

use i_slint_backend_testing::{ElementHandle, TestingBackend, TestingBackendOptions};
use i_slint_core::items::ColorScheme;
use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::app::ui::{Nav, Page, Theme};

fn software_backend() {
    slint::platform::set_platform(Box::new(TestingBackend::new(TestingBackendOptions {
        mock_time: true,
        threading: false,
        renderer_name: Some("software".into()),
    })))
    .unwrap();
}

/// What the platform says the system's scheme is, as the desktop backend does when the
/// desktop's setting changes.
fn system_says(scheme: ColorScheme) {
    i_slint_core::context::with_global_context(
        || panic!("the platform is set first"),
        |ctx| ctx.set_color_scheme(scheme),
    )
    .unwrap();
}

fn open(dir: &std::path::Path) -> App {
    let app = App::new(dir).unwrap();
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 915.0));
    app.window.show().unwrap();
    app
}

fn press(app: &App, label: &str) {
    let all: Vec<_> = ElementHandle::find_by_accessible_label(&app.window, label).collect();
    assert_eq!(all.len(), 1, "one element labelled {label:?}");
    all[0].invoke_accessible_default_action();
}

/// The colour drawn at the window's top-left corner, inside the page's padding: the
/// page background, as rendered.
fn page_background(app: &App) -> [u8; 3] {
    let shot = app.window.window().take_snapshot().unwrap();
    let p = shot.as_slice()[2 * shot.width() as usize + 2];
    [p.r, p.g, p.b]
}

const BLACK: [u8; 3] = [0, 0, 0];
const WHITE: [u8; 3] = [255, 255, 255];

#[test]
fn choosing_light_turns_the_pages_white_and_survives_a_restart() {
    software_backend();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    press(&app, "acknowledge cautions");
    assert_eq!(
        page_background(&app),
        BLACK,
        "dark when the system says nothing"
    );
    press(&app, "Settings");
    assert_eq!(app.window.global::<Nav>().get_page(), Page::Settings);
    press(&app, "screen light");
    assert!(!app.window.global::<Theme>().get_dark());
    assert_eq!(
        page_background(&app),
        WHITE,
        "the Settings page turned light"
    );
    press(&app, "back");
    assert_eq!(app.window.global::<Nav>().get_page(), Page::Team);
    assert_eq!(page_background(&app), WHITE, "and so did the Team page");

    // Saved with the settings at once: a new window over the same files opens light.
    let saved = std::fs::read_to_string(dir.path().join("settings.json")).unwrap();
    assert!(saved.contains("\"theme\": \"light\""), "{saved}");
    drop(app);
    let app = open(dir.path());
    assert_eq!(app.window.global::<Nav>().get_page(), Page::Team);
    assert_eq!(
        page_background(&app),
        WHITE,
        "light again after the restart"
    );

    press(&app, "Settings");
    press(&app, "screen dark");
    assert_eq!(page_background(&app), BLACK);
    drop(app);
    let app = open(dir.path());
    assert_eq!(page_background(&app), BLACK, "dark again after the restart");
}

#[test]
fn as_the_system_follows_the_reported_scheme() {
    software_backend();
    let dir = tempfile::tempdir().unwrap();
    let app = open(dir.path());
    press(&app, "acknowledge cautions");
    press(&app, "Settings");
    // The default follows the system.
    let value = |label: &str| {
        ElementHandle::find_by_accessible_label(&app.window, label)
            .next()
            .unwrap()
            .accessible_value()
            .unwrap_or_default()
            .to_string()
    };
    assert_eq!(value("screen as the system"), "As the system (dark now)");
    system_says(ColorScheme::Light);
    assert_eq!(page_background(&app), WHITE, "the system turned light");
    assert_eq!(value("screen as the system"), "As the system (light now)");
    system_says(ColorScheme::Dark);
    assert_eq!(page_background(&app), BLACK, "and dark again");
    // A fixed choice does not follow.
    press(&app, "screen light");
    system_says(ColorScheme::Dark);
    assert_eq!(page_background(&app), WHITE);
    press(&app, "screen as the system");
    assert_eq!(page_background(&app), BLACK);
    system_says(ColorScheme::Unknown);
}
