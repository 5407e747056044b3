//! The languages the app and the card speak, and the words in each.
//!
//! One gettext catalogue per language (`lang/<code>/LC_MESSAGES/turnsheet.po`) holds
//! every word the app and the card show. The Slint views read them through `@tr()`
//! (bundled into the binary by `slint-build`); the Rust side reads the same files,
//! embedded with `include_str!` and parsed on first use, so nothing is read from disk
//! at run time. English is the source language: a message without a translation is
//! shown in English.
//!
//! The language is a setting of the thread that writes the text, like the decimal
//! separator it brings ([`decimal`]): the app's interface thread, or a command
//! writing a card in a language. Placeholders are `{0}`, `{1}`, … in the order of the
//! arguments, the same in every language.

mod catalogue;
mod detect;

use std::cell::Cell;

pub mod decimal;

use decimal::Decimal;

pub use detect::{from_env, from_tag};

/// A language the app speaks.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Hash)]
pub enum Language {
    /// English, the source language.
    #[default]
    English,
    /// Spanish.
    Spanish,
    /// French.
    French,
    /// German.
    German,
    /// Italian.
    Italian,
    /// Brazilian Portuguese.
    Portuguese,
}

impl Language {
    /// Every language, English first.
    pub const ALL: [Language; 6] = [
        Language::English,
        Language::Spanish,
        Language::French,
        Language::German,
        Language::Italian,
        Language::Portuguese,
    ];

    /// The catalogue's code: "en", "es", "fr", "de", "it", "pt_BR".
    pub fn code(self) -> &'static str {
        match self {
            Language::English => "en",
            Language::Spanish => "es",
            Language::French => "fr",
            Language::German => "de",
            Language::Italian => "it",
            Language::Portuguese => "pt_BR",
        }
    }

    /// The language's name in that language, as the Settings choice shows it.
    pub fn own_name(self) -> &'static str {
        match self {
            Language::English => "English",
            Language::Spanish => "Español",
            Language::French => "Français",
            Language::German => "Deutsch",
            Language::Italian => "Italiano",
            Language::Portuguese => "Português (Brasil)",
        }
    }

    /// The language with this catalogue code.
    pub fn from_code(code: &str) -> Option<Language> {
        Language::ALL.into_iter().find(|l| l.code() == code)
    }

    /// How numbers are written: a decimal comma in every language here but English.
    pub fn decimal(self) -> Decimal {
        match self {
            Language::English => Decimal::Point,
            _ => Decimal::Comma,
        }
    }

    /// The plural form for a count, as the catalogue's Plural-Forms header gives it:
    /// French and Brazilian Portuguese treat 0 as singular (`n > 1`), the others
    /// (`n != 1`) do not.
    pub fn plural_index(self, n: u64) -> usize {
        match self {
            Language::French | Language::Portuguese => usize::from(n > 1),
            _ => usize::from(n != 1),
        }
    }
}

thread_local! {
    static CURRENT: Cell<Language> = const { Cell::new(Language::English) };
}

/// The language this thread writes in.
pub fn language() -> Language {
    CURRENT.with(|c| c.get())
}

/// Writes in `l` from now on, with its decimal separator.
pub fn set_language(l: Language) {
    CURRENT.with(|c| c.set(l));
    decimal::set_decimal(l.decimal());
}

/// A language for as long as the scope lives (a card in a language); the one before
/// comes back after.
#[must_use = "the language holds only while the scope lives"]
pub struct LanguageScope(Language);

impl LanguageScope {
    /// Writes in `l` until the scope is dropped.
    pub fn new(l: Language) -> LanguageScope {
        let before = language();
        set_language(l);
        LanguageScope(before)
    }
}

impl Drop for LanguageScope {
    fn drop(&mut self) {
        set_language(self.0);
    }
}

/// `msgid` in this thread's language.
pub fn tr(msgid: &str) -> String {
    catalogue::lookup(language(), msgid, None, 0).unwrap_or_else(|| msgid.to_string())
}

/// `msgid` in this thread's language with `{0}`, `{1}`, … filled from `args`.
pub fn tr_with(msgid: &str, args: &[&dyn std::fmt::Display]) -> String {
    fill(&tr(msgid), args)
}

/// The singular or plural message for `n`, in this thread's language, with `{n}`
/// replaced by the count and `{0}`, … by `args`.
pub fn tr_n(singular: &str, plural: &str, n: u64, args: &[&dyn std::fmt::Display]) -> String {
    let l = language();
    let form = l.plural_index(n);
    let text = catalogue::lookup(l, singular, Some(plural), form).unwrap_or_else(|| {
        if Language::English.plural_index(n) == 0 {
            singular.to_string()
        } else {
            plural.to_string()
        }
    });
    fill(&text.replace("{n}", &n.to_string()), args)
}

/// `{0}`, `{1}`, … replaced by the arguments; other braces kept as they are.
pub fn fill(text: &str, args: &[&dyn std::fmt::Display]) -> String {
    let mut out = text.to_string();
    for (i, a) in args.iter().enumerate() {
        out = out.replace(&format!("{{{i}}}"), &a.to_string());
    }
    out
}

/// The placeholders of a message, sorted: `{0}`, `{1}`, `{n}`.
pub fn placeholders(text: &str) -> Vec<String> {
    let mut found = Vec::new();
    let mut rest = text;
    while let Some(open) = rest.find('{') {
        let after = &rest[open + 1..];
        match after.find('}') {
            Some(close) if close > 0 && after[..close].chars().all(|c| c.is_alphanumeric()) => {
                found.push(format!("{{{}}}", &after[..close]));
                rest = &after[close + 1..];
            }
            _ => rest = after,
        }
    }
    found.sort();
    found
}

/// Every catalogue as embedded: (language, the .po text).
pub fn catalogues() -> Vec<(Language, &'static str)> {
    catalogue::embedded()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn codes_round_trip_and_commas_follow_the_language() {
        for l in Language::ALL {
            assert_eq!(Language::from_code(l.code()), Some(l));
        }
        let _de = LanguageScope::new(Language::German);
        assert_eq!(decimal::decimal(), Decimal::Comma);
        drop(_de);
        assert_eq!(decimal::decimal(), Decimal::Point);
    }

    #[test]
    fn plural_forms_follow_each_language() {
        // Plural-Forms of the gettext manual's table: French and Portuguese (Brazil)
        // use `n > 1`, English, Spanish, German and Italian `n != 1`.
        assert_eq!(Language::French.plural_index(0), 0);
        assert_eq!(Language::German.plural_index(0), 1);
        assert_eq!(Language::Portuguese.plural_index(2), 1);
        assert_eq!(Language::Italian.plural_index(1), 0);
    }

    #[test]
    fn placeholders_are_found_and_filled() {
        assert_eq!(
            placeholders("Rule now {0}: {1} → {2} {n}"),
            ["{0}", "{1}", "{2}", "{n}"]
        );
        assert_eq!(placeholders("a {b c} {}"), Vec::<String>::new());
        assert_eq!(fill("{1} before {0}", &[&"a", &2]), "2 before a");
    }

    #[test]
    fn english_is_the_fallback() {
        let _en = LanguageScope::new(Language::English);
        assert_eq!(
            tr("A message nobody translated"),
            "A message nobody translated"
        );
        assert_eq!(tr_n("{n} diver", "{n} divers", 1, &[]), "1 diver");
        assert_eq!(tr_n("{n} diver", "{n} divers", 3, &[]), "3 divers");
    }
}
