//! The app: controllers, adapters and the desktop entry point.

/// Open the app window (desktop). Returns the process exit code.
pub fn run_desktop() -> i32 {
    eprintln!("the app window is not built yet");
    1
}
