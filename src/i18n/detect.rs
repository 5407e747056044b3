//! The system's language: on the desktop from the environment, in the order gettext
//! reads it (its manual, "The LANGUAGE variable" and "Locale Environment Variables"):
//! `TURNSHEET_LANG` first (ours, for trying a language), then `LANGUAGE` (a list:
//! the first we speak wins), `LC_ALL`, `LC_MESSAGES`, `LANG`. A "C" or "POSIX" locale
//! means English, and gettext ignores `LANGUAGE` then. Android passes the device
//! locale's tag to [`from_tag`].

use super::Language;

/// The language a locale tag names: "de_DE.UTF-8", "pt-BR", "fr", "es_MX@euro".
/// Portuguese of any country is written as in Brazil (the one Portuguese catalogue).
pub fn from_tag(tag: &str) -> Option<Language> {
    let base = tag.split(['.', '@']).next().unwrap_or("").trim();
    let lang = base
        .split(['_', '-'])
        .next()
        .unwrap_or("")
        .to_ascii_lowercase();
    Some(match lang.as_str() {
        "en" => Language::English,
        "es" => Language::Spanish,
        "fr" => Language::French,
        "de" => Language::German,
        "it" => Language::Italian,
        "pt" => Language::Portuguese,
        _ => return None,
    })
}

/// The language the environment asks for (`get` reads a variable), English when it
/// names none we speak.
pub fn from_env(get: impl Fn(&str) -> Option<String>) -> Language {
    let set = |k: &str| get(k).filter(|v| !v.trim().is_empty());
    if let Some(l) = set("TURNSHEET_LANG").and_then(|v| from_tag(&v)) {
        return l;
    }
    // The locale in force for messages: the first of LC_ALL, LC_MESSAGES, LANG set.
    let locale = set("LC_ALL")
        .or_else(|| set("LC_MESSAGES"))
        .or_else(|| set("LANG"));
    let c_locale = matches!(locale.as_deref(), Some("C" | "POSIX") | None)
        || locale.as_deref().is_some_and(|l| l.starts_with("C."));
    if !c_locale
        && let Some(l) = set("LANGUAGE").and_then(|list| list.split(':').find_map(from_tag))
    {
        return l;
    }
    locale
        .and_then(|l| from_tag(&l))
        .unwrap_or(Language::English)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn env(pairs: &[(&str, &str)]) -> impl Fn(&str) -> Option<String> {
        let v: Vec<(String, String)> = pairs
            .iter()
            .map(|(k, v)| (k.to_string(), v.to_string()))
            .collect();
        move |k: &str| v.iter().find(|(n, _)| n == k).map(|(_, x)| x.clone())
    }

    #[test]
    fn tags_name_languages() {
        assert_eq!(from_tag("de_DE.UTF-8"), Some(Language::German));
        assert_eq!(from_tag("pt-BR"), Some(Language::Portuguese));
        assert_eq!(from_tag("pt_PT"), Some(Language::Portuguese));
        assert_eq!(from_tag("es_MX@euro"), Some(Language::Spanish));
        assert_eq!(from_tag("FR"), Some(Language::French));
        assert_eq!(from_tag("nl_NL.UTF-8"), None);
        assert_eq!(from_tag("C"), None);
    }

    #[test]
    fn the_environment_is_read_in_gettext_order() {
        assert_eq!(from_env(env(&[])), Language::English);
        assert_eq!(from_env(env(&[("LANG", "it_IT.UTF-8")])), Language::Italian);
        assert_eq!(
            from_env(env(&[
                ("LANG", "it_IT.UTF-8"),
                ("LC_MESSAGES", "fr_FR.UTF-8")
            ])),
            Language::French
        );
        assert_eq!(
            from_env(env(&[("LC_MESSAGES", "fr_FR"), ("LC_ALL", "de_DE.UTF-8")])),
            Language::German
        );
        assert_eq!(
            from_env(env(&[("LANG", "de_DE.UTF-8"), ("LANGUAGE", "nl:es:de")])),
            Language::Spanish,
            "the first language of the list that we speak"
        );
        assert_eq!(
            from_env(env(&[("LANG", "C"), ("LANGUAGE", "es")])),
            Language::English,
            "LANGUAGE is ignored under the C locale"
        );
        assert_eq!(
            from_env(env(&[("LANG", "es_ES.UTF-8"), ("TURNSHEET_LANG", "pt_BR")])),
            Language::Portuguese
        );
        assert_eq!(
            from_env(env(&[("LANG", "nl_NL.UTF-8")])),
            Language::English,
            "a language we do not speak"
        );
    }
}
