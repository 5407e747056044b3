//! Android entry point: the same window as desktop, storage in app-private files,
//! the device locale's language, saves on lifecycle events, and the framework's
//! clipboard and shared Downloads (`android_share.rs`) handed to the app. Everything it calls is covered by the desktop tests.

use std::cell::RefCell;
use std::rc::Rc;

use slint::android::android_activity::{MainEvent, PollEvent};

use super::{Lifecycle, android_data_dir, handle_lifecycle};
use crate::app::App;
use crate::app::session::Session;

fn lifecycle(event: &PollEvent<'_>) -> Lifecycle {
    match event {
        PollEvent::Main(MainEvent::SaveState { .. }) => Lifecycle::SaveState,
        PollEvent::Main(MainEvent::Pause) => Lifecycle::Pause,
        PollEvent::Main(MainEvent::Stop) => Lifecycle::Stop,
        PollEvent::Main(MainEvent::Destroy) => Lifecycle::Destroy,
        PollEvent::Main(MainEvent::Start) => Lifecycle::Start,
        PollEvent::Main(MainEvent::Resume { .. }) => Lifecycle::Resume,
        _ => Lifecycle::Other,
    }
}

#[unsafe(no_mangle)]
fn android_main(app: slint::android::AndroidApp) {
    let dir = android_data_dir(app.internal_data_path());
    // The device locale's language ("de", "pt"), from the activity's configuration.
    let system_language = app
        .config()
        .language()
        .and_then(|code| crate::i18n::from_tag(&code))
        .unwrap_or_default();
    let session: Rc<
        RefCell<Option<(Rc<RefCell<Session>>, slint::Weak<crate::app::ui::AppWindow>)>>,
    > = Rc::new(RefCell::new(None));
    let listener_session = session.clone();
    slint::android::init_with_event_listener(app, move |event| {
        let Ok(slot) = listener_session.try_borrow() else {
            return;
        };
        let Some((s, w)) = slot.as_ref() else { return };
        // A lifecycle event never arrives inside a UI callback; if it ever did, skip it
        // rather than panic (every edit is already saved as it happens).
        let Ok(mut session) = s.try_borrow_mut() else {
            return;
        };
        let refresh = handle_lifecycle(&mut session, lifecycle(event));
        drop(session);
        if let (true, Some(ui)) = (refresh, w.upgrade()) {
            crate::app::adapters::refresh_all(&ui, &s.borrow());
        }
    })
    .expect("Slint Android backend");
    // Before the files are read, so the start-up messages are in the device's language.
    crate::i18n::set_language(system_language);
    let app = App::new(dir).expect("app window");
    app.set_system_language(system_language);
    // The plan as text onto the clipboard, and cards into Downloads/Turnsheet.
    crate::app::clipboard::set_platform_copy(super::android_share::copy_text);
    app.session.borrow_mut().exchange.publish_card = Some(super::android_share::save_download);
    use slint::ComponentHandle;
    *session.borrow_mut() = Some((app.session.clone(), app.window.as_weak()));
    let _ = app.window.run();
    app.save();
}
