//! The system clipboard, for "Copy plan as text" on the desktop. Handed to the session
//! as a `TextClipboard`, so tests can give it one that fails.

/// Somewhere to put text.
pub trait TextClipboard {
    /// Put `text` on the clipboard; the reason in words when there is none.
    fn put_text(&mut self, text: &str) -> Result<(), String>;
}

/// Whether this build has a clipboard to copy to (the desktop does; Android, not yet).
pub const HAS_CLIPBOARD: bool = cfg!(not(target_os = "android"));

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
    fn put_text(&mut self, _text: &str) -> Result<(), String> {
        Err("the app has no clipboard on Android yet".to_string())
    }
}
