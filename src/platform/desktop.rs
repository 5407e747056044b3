//! The desktop start: the window over the desktop data directory, the language from
//! the environment (`TURNSHEET_LANG`, then gettext's order), the text size from
//! `TURNSHEET_FONT_SCALE`, and a save when the window closes.

use slint::ComponentHandle;

use crate::app::App;
use crate::storage::data_dir::desktop_data_dir;

use super::font_scale_from;

/// Open the app window (desktop). Returns the process exit code.
pub fn run() -> i32 {
    let dir = desktop_data_dir();
    // Before the files are read, so what the start-up says about them is in the system's
    // language (a language chosen in Settings takes over once the settings are read).
    let system_language = crate::i18n::from_env(|k| std::env::var(k).ok());
    crate::i18n::set_language(system_language);
    let app = match App::new(&dir) {
        Ok(a) => a,
        Err(e) => {
            eprintln!(
                "turnsheet: cannot open a window ({e}). For servers use `turnsheet plan TEAM.json`."
            );
            return 1;
        }
    };
    app.set_system_language(system_language);
    // Cards go where their owner can open them (Documents, else Downloads).
    app.session.borrow_mut().exchange.card_dir = crate::storage::data_dir::user_card_dir(&dir);
    if let Some(scale) = font_scale_from(std::env::var_os("TURNSHEET_FONT_SCALE").as_deref()) {
        app.set_font_scale(scale);
    }
    reread_on_focus(&app);
    super::first_frame::exit_after_first_frame_if_asked(app.window.window());
    let result = app.window.run();
    app.save();
    match result {
        Ok(()) => 0,
        Err(e) => {
            eprintln!("turnsheet: {e}");
            1
        }
    }
}

/// When the window regains focus, re-read files another program changed meanwhile (the
/// locker from the command line), as on an Android resume.
fn reread_on_focus(app: &App) {
    use slint::winit_030::{EventResult, WinitWindowAccessor, winit};
    let session = app.session.clone();
    let window = app.window.as_weak();
    app.window.window().on_winit_window_event(move |_, event| {
        if matches!(event, winit::event::WindowEvent::Focused(true)) {
            let (session, window) = (session.clone(), window.clone());
            slint::Timer::single_shot(std::time::Duration::ZERO, move || {
                let Ok(mut s) = session.try_borrow_mut() else {
                    return;
                };
                let changed = super::handle_lifecycle(&mut s, super::Lifecycle::Resume);
                if let (true, Some(w)) = (changed, window.upgrade()) {
                    crate::app::adapters::refresh_all(&w, &s);
                }
            });
        }
        EventResult::Propagate
    });
}
