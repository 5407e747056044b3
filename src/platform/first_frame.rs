//! Start-up measurement: with `TURNSHEET_EXIT_AFTER_FIRST_FRAME=1` the desktop app quits
//! as soon as its window has rendered and presented its first frame, so that the time from
//! start to first frame can be measured from outside with any renderer (BENCHMARKS.md).
//! Nothing is saved differently: the app closes as if the window were closed.

use slint::winit_030::{EventResult, WinitWindowAccessor, winit};

/// The environment variable; only the value `1` turns the hook on.
pub const EXIT_AFTER_FIRST_FRAME_ENV: &str = "TURNSHEET_EXIT_AFTER_FIRST_FRAME";

/// Whether `value` (of the environment variable) asks for the hook.
pub fn asked(value: Option<&std::ffi::OsStr>) -> bool {
    value.is_some_and(|v| v == "1")
}

/// Quit the event loop after the first frame if the environment asks for it. The winit
/// filter sees the first redraw request before Slint renders it; the quit is queued behind
/// it, so it runs once that frame is drawn and presented. A window that is not backed by
/// winit is left alone.
pub fn exit_after_first_frame_if_asked(window: &slint::Window) {
    if !asked(std::env::var_os(EXIT_AFTER_FIRST_FRAME_ENV).as_deref()) {
        return;
    }
    let mut queued = false;
    window.on_winit_window_event(move |_, event| {
        if !queued && matches!(event, winit::event::WindowEvent::RedrawRequested) {
            queued = true;
            let _ = slint::invoke_from_event_loop(|| {
                let _ = slint::quit_event_loop();
            });
        }
        EventResult::Propagate
    });
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn only_one_turns_it_on() {
        assert!(asked(Some(std::ffi::OsStr::new("1"))));
        assert!(!asked(Some(std::ffi::OsStr::new("0"))));
        assert!(!asked(Some(std::ffi::OsStr::new(""))));
        assert!(!asked(None));
    }
}
