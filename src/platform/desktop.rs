//! The desktop start: the window over the desktop data directory, the text size from
//! `TURNSHEET_FONT_SCALE`, and a save when the window closes.

use slint::ComponentHandle;

use crate::app::App;
use crate::storage::data_dir::desktop_data_dir;

use super::font_scale_from;

/// Open the app window (desktop). Returns the process exit code.
pub fn run() -> i32 {
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
    if let Some(scale) = font_scale_from(std::env::var_os("TURNSHEET_FONT_SCALE").as_deref()) {
        app.set_font_scale(scale);
    }
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
