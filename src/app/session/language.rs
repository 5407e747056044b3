//! The language the app speaks: the one chosen in Settings, else the system's.

use super::Session;
use crate::i18n::Language;

impl Session {
    /// The language of the words and numbers on screen now.
    pub fn language(&self) -> Language {
        self.settings
            .language
            .as_deref()
            .and_then(Language::from_code)
            .unwrap_or(self.system_language)
    }

    /// The Settings choice: 0 follows the system, then `Language::ALL` in order.
    pub fn language_choice(&self) -> usize {
        self.settings
            .language
            .as_deref()
            .and_then(Language::from_code)
            .and_then(|l| Language::ALL.iter().position(|x| *x == l))
            .map_or(0, |i| i + 1)
    }

    /// Chooses the language (0: the system's); saved with the settings.
    pub fn choose_language(&mut self, choice: usize) {
        let chosen = match choice {
            0 => None,
            k => match Language::ALL.get(k - 1) {
                Some(l) => Some(l.code().to_string()),
                None => return,
            },
        };
        if chosen != self.settings.language {
            self.settings.language = chosen;
            self.save_settings();
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    #[test]
    fn the_choice_overrides_the_system_and_is_kept() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.system_language = Language::Italian;
        assert_eq!((s.language(), s.language_choice()), (Language::Italian, 0));
        s.choose_language(4);
        assert_eq!((s.language(), s.language_choice()), (Language::German, 4));
        s.choose_language(99);
        assert_eq!(s.language(), Language::German, "no such choice: unchanged");
        let again = Session::open(Store::new(dir.path()));
        assert_eq!(
            again.language(),
            Language::German,
            "saved with the settings"
        );
        let mut again = again;
        again.choose_language(0);
        again.system_language = Language::French;
        assert_eq!(again.language(), Language::French);
    }
}
