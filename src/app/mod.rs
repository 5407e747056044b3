//! The app: controllers hold state and call the planning core; adapters connect them
//! to the Slint globals; `run_desktop` opens the window.

pub mod adapters;
pub mod cautions;
pub mod clock;
pub mod keypad;
pub mod locker_controller;
pub mod locker_draft;
pub mod nav;
pub mod readings;
pub mod session;
pub mod team_controller;
pub mod view_models;

slint::include_modules!();

use std::cell::RefCell;

use slint::ComponentHandle;
use std::rc::Rc;

use crate::storage::Store;
use crate::storage::data_dir::desktop_data_dir;
use session::Session;

/// A window with its session, wired together.
pub struct App {
    pub window: AppWindow,
    pub session: Rc<RefCell<Session>>,
    /// Looks at the clock now and then, so a start that ages past three hours stops
    /// making turns on screen even when nobody touches the phone.
    _clock_watch: slint::Timer,
}

/// How often the window looks at the clock between actions.
pub const CLOCK_WATCH: std::time::Duration = std::time::Duration::from_secs(20);

impl App {
    /// Build the window over the files in `data_dir`.
    pub fn new(data_dir: impl Into<std::path::PathBuf>) -> Result<App, slint::PlatformError> {
        App::with_clock(data_dir, Rc::new(clock::SystemClock))
    }

    /// The same, reading the time from `clock` (tests put the app at any time).
    pub fn with_clock(
        data_dir: impl Into<std::path::PathBuf>,
        clock: Rc<dyn clock::Clock>,
    ) -> Result<App, slint::PlatformError> {
        let window = AppWindow::new()?;
        let session = Rc::new(RefCell::new(Session::open_with_clock(
            Store::new(data_dir),
            clock,
        )));
        adapters::connect_all(&window, &session);
        adapters::refresh_all(&window, &session.borrow());
        let watch = slint::Timer::default();
        let (w, s) = (window.as_weak(), session.clone());
        watch.start(slint::TimerMode::Repeated, CLOCK_WATCH, move || {
            let changed = s.borrow_mut().tick();
            if let (true, Some(ui)) = (changed, w.upgrade()) {
                adapters::refresh_all(&ui, &s.borrow());
            }
        });
        Ok(App {
            window,
            session,
            _clock_watch: watch,
        })
    }

    /// Follow the system's text size: 1 is normal, about 1.3 is Android's "large".
    /// Kept within 0.8 to 2 so a stray value cannot make the app unusable.
    pub fn set_font_scale(&self, scale: f32) {
        let scale = if scale.is_finite() {
            scale.clamp(0.8, 2.0)
        } else {
            1.0
        };
        self.window.global::<Theme>().set_font_scale(scale);
    }

    /// Save everything now (lifecycle events).
    pub fn save(&self) {
        self.session.borrow_mut().save_all();
    }
}

/// Open the app window (desktop). Returns the process exit code.
pub fn run_desktop() -> i32 {
    let dir = desktop_data_dir();
    let app = match App::new(&dir) {
        Ok(a) => a,
        Err(e) => {
            eprintln!(
                "turnsheet: cannot open a window ({e}). For servers use `turnsheet plan TEAM.json`."
            );
            return 1;
        }
    };
    if let Some(scale) =
        crate::platform::font_scale_from(std::env::var_os("TURNSHEET_FONT_SCALE").as_deref())
    {
        app.set_font_scale(scale);
    }
    #[cfg(not(target_os = "android"))]
    reread_on_focus(&app);
    crate::platform::first_frame::exit_after_first_frame_if_asked(app.window.window());
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
#[cfg(not(target_os = "android"))]
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
                let changed =
                    crate::platform::handle_lifecycle(&mut s, crate::platform::Lifecycle::Resume);
                if let (true, Some(w)) = (changed, window.upgrade()) {
                    adapters::refresh_all(&w, &s);
                }
            });
        }
        EventResult::Propagate
    });
}
