//! What the UI tests share: finding an element by its accessible label, pressing it,
//! reading its value, the page on screen, and letting the tap guard pass.
// Each test file uses some of these.
#![allow(dead_code)]

use i_slint_backend_testing::ElementHandle;
use slint::ComponentHandle;
use turnsheet::app::App;
use turnsheet::app::ui::{Nav, Page};

/// Every element labelled `label`. A no-break space in a label (kept between a number and
/// its unit, "pick Twin 12 L 232 bar") matches an ordinary space in `label`.
pub fn all(app: &App, label: &str) -> Vec<ElementHandle> {
    let want = label.replace('\u{a0}', " ");
    use i_slint_backend_testing::ElementRoot;
    app.window
        .root_element()
        .query_descendants()
        .match_predicate(move |e| {
            e.accessible_label()
                .is_some_and(|l| l.replace('\u{a0}', " ") == want)
        })
        .find_all()
}

/// The one element labelled `label` (the test fails when there are none or several).
pub fn find(app: &App, label: &str) -> ElementHandle {
    let v = all(app, label);
    assert_eq!(
        v.len(),
        1,
        "expected exactly one element labelled {label:?}, found {}",
        v.len()
    );
    v.into_iter().next().unwrap()
}

/// Press the element labelled `label` (its accessibility action, as a screen reader or
/// a finger on it).
pub fn press(app: &App, label: &str) {
    find(app, label).invoke_accessible_default_action();
}

/// The accessible value, with no-break spaces (kept between numbers and units) read as
/// spaces.
pub fn value(app: &App, label: &str) -> String {
    find(app, label)
        .accessible_value()
        .unwrap_or_default()
        .replace('\u{a0}', " ")
}

/// The page on screen.
pub fn page(app: &App) -> Page {
    app.window.global::<Nav>().get_page()
}

/// Long enough for every button to count taps again (the 0.4 s tap guard).
pub fn settle() {
    slint::platform::update_timers_and_animations();
    i_slint_backend_testing::mock_elapsed_time(std::time::Duration::from_millis(500));
    slint::platform::update_timers_and_animations();
}
