//! Headless rendering with Slint's software renderer: the buddy view at phone size
//! (412×915) with a full team of six keeps every turn row at least 96 px tall and
//! renders white digits on black.

use i_slint_backend_testing::{ElementHandle, TestingBackend, TestingBackendOptions};
use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::app::adapters::refresh_all;
use turnsheet::app::nav::Screen;

#[test]
fn buddy_view_rows_are_big_and_high_contrast() {
    slint::platform::set_platform(Box::new(TestingBackend::new(TestingBackendOptions {
        mock_time: true,
        threading: false,
        renderer_name: Some("software".into()),
    })))
    .unwrap();
    let dir = tempfile::tempdir().unwrap();
    let app = App::new(dir.path()).unwrap();
    app.window
        .window()
        .set_size(slint::LogicalSize::new(412.0, 915.0));
    app.window.show().unwrap();
    {
        let mut s = app.session.borrow_mut();
        s.acknowledge_cautions();
        while s.team.can_add() {
            s.add_diver();
        }
        s.go(Screen::Turns);
        s.go(Screen::Buddy);
    }
    refresh_all(&app.window, &app.session.borrow());
    let names: Vec<String> = app
        .session
        .borrow()
        .team
        .input()
        .divers
        .iter()
        .map(|d| d.name.clone())
        .collect();
    assert_eq!(names.len(), 6);
    for n in &names {
        let row =
            ElementHandle::find_by_accessible_label(&app.window, &format!("buddy turn of {n}"))
                .next()
                .unwrap_or_else(|| panic!("row for {n}"));
        assert!(
            row.size().height >= 96.0,
            "{n}: row {} px",
            row.size().height
        );
    }
    let shot = app.window.window().take_snapshot().unwrap();
    assert_eq!((shot.width(), shot.height()), (412, 915));
    let px = shot.as_slice();
    let white = px
        .iter()
        .filter(|p| p.r > 240 && p.g > 240 && p.b > 240)
        .count();
    let black = px
        .iter()
        .filter(|p| p.r < 10 && p.g < 10 && p.b < 10)
        .count();
    assert!(black > px.len() / 2, "background must be black");
    assert!(
        white > px.len() / 50,
        "digits must be white and large: {white} white px"
    );
    assert_eq!(
        white
            + black
            + px.iter()
                .filter(|p| {
                    let grey = p.r.abs_diff(p.g) < 8 && p.g.abs_diff(p.b) < 8;
                    grey && !(p.r > 240 || p.r < 10)
                })
                .count(),
        px.len(),
        "only white, black and anti-aliased grey: no colour"
    );
}
