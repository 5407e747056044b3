//! The screen's colours: dark, light or as the system says (Settings page).

use super::Session;
use crate::storage::settings::ThemeChoice;

impl Session {
    /// Choose the screen's colours by their place in `ThemeChoice::ALL`; kept with the
    /// settings at once. An index out of range changes nothing.
    pub fn set_theme(&mut self, idx: usize) {
        if let Some(choice) = ThemeChoice::ALL.get(idx).copied()
            && self.settings.theme != choice
        {
            self.settings.theme = choice;
            self.save_settings();
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::app::session::test_session as session;
    use crate::storage::Store;

    #[test]
    fn the_theme_is_saved_with_the_settings() {
        let (dir, mut s) = session();
        assert_eq!(s.settings.theme, ThemeChoice::System, "the default");
        s.set_theme(1);
        assert_eq!(s.settings.theme, ThemeChoice::Light);
        s.set_theme(7);
        assert_eq!(
            s.settings.theme,
            ThemeChoice::Light,
            "out of range: unchanged"
        );
        let again = Session::open(Store::new(dir.path()));
        assert_eq!(again.settings.theme, ThemeChoice::Light);
        s.set_theme(0);
        let again = Session::open(Store::new(dir.path()));
        assert_eq!(again.settings.theme, ThemeChoice::Dark);
    }
}
