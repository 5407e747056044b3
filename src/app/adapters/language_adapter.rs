//! The language on screen: the Rust side's words and numbers (`i18n`) and the Slint
//! views' `@tr()` words (the bundled catalogues) switched together.

use std::cell::Cell;

use crate::i18n::{self, Language};

thread_local! {
    /// The language the views were last switched to.
    static SHOWN: Cell<Option<Language>> = const { Cell::new(None) };
}

/// Speak `l` from now on, on both sides. Cheap when nothing changes.
pub fn apply(l: Language) {
    i18n::set_language(l);
    if SHOWN.with(|c| c.get()) == Some(l) {
        return;
    }
    match slint::select_bundled_translation(l.code()) {
        Ok(()) => SHOWN.with(|c| c.set(Some(l))),
        // Only before the first window exists; the next refresh tries again.
        Err(e) => log::warn!("language {}: {e}", l.code()),
    }
}
