//! The app: controllers hold state and call the planning core; adapters connect them
//! to the Slint globals (`ui`); `App` wires a window to a session. The platform layer
//! (`crate::platform`) starts it.

pub mod adapters;
pub mod cautions;
pub mod keypad;
pub mod locker_controller;
pub mod locker_draft;
pub mod nav;
pub mod readings;
pub mod session;
pub mod team_controller;
pub mod ui;
pub mod view_models;

use std::cell::RefCell;
use std::rc::Rc;

use crate::storage::Store;
use session::Session;
use ui::{AppWindow, Theme};

/// A window with its session, wired together.
pub struct App {
    pub window: AppWindow,
    pub session: Rc<RefCell<Session>>,
}

impl App {
    /// Build the window over the files in `data_dir`.
    pub fn new(data_dir: impl Into<std::path::PathBuf>) -> Result<App, slint::PlatformError> {
        let window = AppWindow::new()?;
        let session = Rc::new(RefCell::new(Session::open(Store::new(data_dir))));
        adapters::connect_all(&window, &session);
        adapters::refresh_all(&window, &session.borrow());
        Ok(App { window, session })
    }

    /// Follow the system's text size: 1 is normal; larger settings give more (from
    /// memory: Android's reach about 1.3 on many devices).
    /// Kept within 0.8 to 2 so a stray value cannot make the app unusable.
    pub fn set_font_scale(&self, scale: f32) {
        use slint::ComponentHandle;
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
