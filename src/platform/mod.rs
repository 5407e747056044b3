//! Platform glue kept to plain Rust, so the desktop tests cover it: where the data
//! lives, and what each Android lifecycle event does. The two starts sit here, above the
//! app: `desktop.rs` (the `turnsheet` command without a subcommand) and `android.rs` (the
//! Android entry point, which only translates events and calls into here).

use std::path::PathBuf;

use crate::app::session::Session;

#[cfg(target_os = "android")]
mod android;
#[cfg(target_os = "android")]
mod android_share;
#[cfg(not(target_os = "android"))]
pub mod desktop;
#[cfg(not(target_os = "android"))]
pub mod first_frame;

/// The lifecycle events the app reacts to (names as on Android).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Lifecycle {
    SaveState,
    Pause,
    Stop,
    Start,
    Resume,
    Destroy,
    Other,
}

#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum LifecycleAction {
    /// Write every file now: the process may be killed without another word.
    Save,
    /// Re-read files changed by someone else while we were away.
    Reload,
    Nothing,
}

pub fn action_for(event: Lifecycle) -> LifecycleAction {
    match event {
        Lifecycle::SaveState | Lifecycle::Pause | Lifecycle::Stop | Lifecycle::Destroy => {
            LifecycleAction::Save
        }
        Lifecycle::Start | Lifecycle::Resume => LifecycleAction::Reload,
        Lifecycle::Other => LifecycleAction::Nothing,
    }
}

/// Apply a lifecycle event to the session; returns whether the views need a refresh.
pub fn handle_lifecycle(session: &mut Session, event: Lifecycle) -> bool {
    match action_for(event) {
        LifecycleAction::Save => {
            session.save_all();
            false
        }
        LifecycleAction::Reload => session.reload_if_changed(),
        LifecycleAction::Nothing => false,
    }
}

/// The text size asked for by `TURNSHEET_FONT_SCALE` (desktop; e.g. `1.3`), if it is
/// a number.
pub fn font_scale_from(value: Option<&std::ffi::OsStr>) -> Option<f32> {
    value?
        .to_str()?
        .trim()
        .parse::<f32>()
        .ok()
        .filter(|x| x.is_finite())
}

/// The app's data directory on Android: the app-private internal storage
/// (`Context.getFilesDir()`), which needs no permission. Falls back to the
/// desktop rules when the platform gives none.
pub fn android_data_dir(internal: Option<PathBuf>) -> PathBuf {
    match internal {
        Some(p) if !p.as_os_str().is_empty() => p.join("turnsheet"),
        _ => crate::storage::data_dir::desktop_data_dir(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    #[test]
    fn the_font_scale_comes_from_a_number_only() {
        use std::ffi::OsStr;
        assert_eq!(font_scale_from(Some(OsStr::new(" 1.3"))), Some(1.3));
        assert_eq!(font_scale_from(Some(OsStr::new("large"))), None);
        assert_eq!(font_scale_from(Some(OsStr::new("NaN"))), None);
        assert_eq!(font_scale_from(None), None);
    }

    #[test]
    fn pause_and_stop_save_everything() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.confirm_start(0);
        s.nudge_start(0, 1);
        std::fs::remove_file(dir.path().join("last-team.json")).unwrap();
        for ev in [Lifecycle::SaveState, Lifecycle::Pause, Lifecycle::Stop] {
            let _ = std::fs::remove_file(dir.path().join("settings.json"));
            handle_lifecycle(&mut s, ev);
            for f in ["last-team.json", "settings.json", "locker.json"] {
                assert!(dir.path().join(f).exists(), "{ev:?} must write {f}");
            }
        }
        let again = Session::open(Store::new(dir.path()));
        assert_eq!(again.team.input(), s.team.input());
    }

    #[test]
    fn resume_reloads_only_what_changed_elsewhere() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.acknowledge_cautions();
        s.save_all();
        assert!(!handle_lifecycle(&mut s, Lifecycle::Resume));
        // Another writer (e.g. the CLI or a restore) changes the settings.
        let mut other = Session::open(Store::new(dir.path()));
        std::thread::sleep(std::time::Duration::from_millis(20));
        other.set_default_rule(4);
        assert!(handle_lifecycle(&mut s, Lifecycle::Start));
        assert_eq!(s.settings.rule, crate::plan::Rule::Sixths);
        assert_eq!(action_for(Lifecycle::Other), LifecycleAction::Nothing);
    }

    #[test]
    fn data_dir_is_app_private_storage() {
        let p = android_data_dir(Some(PathBuf::from("/data/user/0/org.turnsheet.app/files")));
        assert_eq!(
            p,
            PathBuf::from("/data/user/0/org.turnsheet.app/files/turnsheet")
        );
        assert_ne!(android_data_dir(None), PathBuf::new());
    }
}
