//! The catalogues embedded in the binary, parsed on first use.
//!
//! Parsed with `rspolib`, the .po reader Slint's own compiler uses to bundle the
//! `@tr()` translations, so both sides of the app read the files the same way.

use std::collections::HashMap;
use std::sync::OnceLock;

use super::Language;

/// One translated message: its one form, or its plural forms.
struct Entry {
    forms: Vec<String>,
}

type Table = HashMap<String, Entry>;

/// The .po text of each language but English (the source language).
pub fn embedded() -> Vec<(Language, &'static str)> {
    vec![
        (
            Language::Spanish,
            include_str!("../../lang/es/LC_MESSAGES/turnsheet.po"),
        ),
        (
            Language::French,
            include_str!("../../lang/fr/LC_MESSAGES/turnsheet.po"),
        ),
        (
            Language::German,
            include_str!("../../lang/de/LC_MESSAGES/turnsheet.po"),
        ),
        (
            Language::Italian,
            include_str!("../../lang/it/LC_MESSAGES/turnsheet.po"),
        ),
        (
            Language::Portuguese,
            include_str!("../../lang/pt_BR/LC_MESSAGES/turnsheet.po"),
        ),
    ]
}

/// A catalogue's messages by msgid; untranslated and fuzzy entries are left out, so
/// they fall back to English. A catalogue that does not parse gives no messages
/// (English everywhere); the catalogue test fails on it long before a release.
fn parse(text: &str) -> Table {
    let Ok(file) = rspolib::pofile(text) else {
        return Table::new();
    };
    file.entries
        .into_iter()
        .filter(|e| !e.obsolete && !e.flags.iter().any(|f| f == "fuzzy"))
        .filter_map(|e| {
            let forms = if e.msgid_plural.is_some() {
                e.msgstr_plural.clone()
            } else {
                vec![e.msgstr.clone().unwrap_or_default()]
            };
            (!forms.iter().any(|f| f.is_empty())).then_some((e.msgid, Entry { forms }))
        })
        .collect()
}

fn table(l: Language) -> Option<&'static Table> {
    static TABLES: OnceLock<HashMap<Language, Table>> = OnceLock::new();
    TABLES
        .get_or_init(|| {
            embedded()
                .into_iter()
                .map(|(l, text)| (l, parse(text)))
                .collect()
        })
        .get(&l)
}

/// The translation of `msgid` (form `form` of a plural message), if the catalogue
/// has one.
pub fn lookup(l: Language, msgid: &str, plural: Option<&str>, form: usize) -> Option<String> {
    let e = table(l)?.get(msgid)?;
    match plural {
        None => e.forms.first().cloned(),
        Some(_) => e.forms.get(form).or_else(|| e.forms.last()).cloned(),
    }
}
