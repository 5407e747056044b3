//! The app: controllers hold state and call the planning core; adapters connect them
//! to the Slint globals (`ui`); `App` wires a window to a session. The platform layer
//! (`crate::platform`) starts it.

pub mod adapters;
pub mod cautions;
pub mod clipboard;
pub mod clock;
pub mod keypad;
pub mod locker_controller;
pub mod locker_draft;
pub mod nav;
pub mod qr_image;
pub mod readings;
pub mod session;
pub mod team_controller;
pub mod ui;
pub mod view_models;

use std::cell::RefCell;

use slint::ComponentHandle;
use std::rc::Rc;

use crate::storage::Store;
use session::Session;
use ui::{AppWindow, Theme};

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

    /// Follow the system's text size: 1 is normal; larger settings give more (from
    /// memory: Android's reach about 1.3 on many devices).
    /// Kept within 0.8 to 2 so a stray value cannot make the app unusable.
    pub fn set_font_scale(&self, scale: f32) {
        let scale = if scale.is_finite() {
            scale.clamp(0.8, 2.0)
        } else {
            1.0
        };
        self.window.global::<Theme>().set_font_scale(scale);
    }

    /// The system's language, as the platform reads it; the words and numbers on
    /// screen follow it unless Settings chose another.
    pub fn set_system_language(&self, l: crate::i18n::Language) {
        self.session.borrow_mut().system_language = l;
        adapters::refresh_all(&self.window, &self.session.borrow());
    }

    /// Save everything now (lifecycle events).
    pub fn save(&self) {
        self.session.borrow_mut().save_all();
    }
}
