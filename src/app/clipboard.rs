//! The system clipboard, for "Copy plan as text". Handed to the session as a
//! `TextClipboard`, so tests can give it one that fails. The desktop's is `arboard`;
//! Android's is the framework's, which the platform start hands in (`set_platform_copy`).

/// Somewhere to put text.
pub trait TextClipboard {
    /// Put `text` on the clipboard; the reason in words when there is none.
    fn put_text(&mut self, text: &str) -> Result<(), String>;
}

/// A platform's own way to put text on its clipboard.
pub type PlatformCopy = fn(&str) -> Result<(), String>;

static PLATFORM_COPY: std::sync::OnceLock<PlatformCopy> = std::sync::OnceLock::new();

/// The platform start hands in its clipboard (Android); the desktop needs none.
pub fn set_platform_copy(copy: PlatformCopy) {
    let _ = PLATFORM_COPY.set(copy);
}

/// Whether there is a clipboard to copy to: always on the desktop, on Android once the
/// platform start has handed its clipboard in.
pub fn has_clipboard() -> bool {
    cfg!(not(target_os = "android")) || PLATFORM_COPY.get().is_some()
}

/// The desktop's clipboard. It is opened on the first copy and kept: on Linux the text
/// stays on the clipboard only while the program that put it there holds it (or a
/// clipboard manager has taken it), so it lives as long as the window.
#[derive(Default)]
pub struct SystemClipboard {
    #[cfg(not(target_os = "android"))]
    open: Option<arboard::Clipboard>,
}

impl TextClipboard for SystemClipboard {
    #[cfg(not(target_os = "android"))]
    fn put_text(&mut self, text: &str) -> Result<(), String> {
        if self.open.is_none() {
            self.open = Some(arboard::Clipboard::new().map_err(|e| e.to_string())?);
        }
        let Some(c) = self.open.as_mut() else {
            return Err("no clipboard".to_string());
        };
        let done = c.set_text(text);
        if done.is_err() {
            // A clipboard that failed once is opened afresh next time.
            self.open = None;
        }
        done.map_err(|e| e.to_string())
    }

    #[cfg(target_os = "android")]
    fn put_text(&mut self, text: &str) -> Result<(), String> {
        match PLATFORM_COPY.get() {
            Some(copy) => copy(text),
            None => Err("no clipboard was handed to the app".to_string()),
        }
    }
}
