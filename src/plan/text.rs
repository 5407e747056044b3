//! The one check of names and notes people type or files carry (divers, cylinder sets).
//!
//! Refused: control characters (they can drive a terminal), Unicode non-characters (not
//! allowed in XML, so not on the card), line and paragraph separators, and the
//! bidirectional controls (in a line of text they can reorder the digits printed beside
//! the name). Accepted text is kept in Unicode normalisation form C, so two names that
//! look the same compare the same.

use unicode_normalization::UnicodeNormalization;

use super::error::InputError;
use crate::i18n::tr_with;

/// Why `c` may not stand in a name or note, if it may not.
pub fn refused_char(c: char) -> Option<&'static str> {
    let u = c as u32;
    if c.is_control() {
        Some("a control character")
    } else if (0xFDD0..=0xFDEF).contains(&u) || (u & 0xFFFE) == 0xFFFE {
        Some("a Unicode non-character")
    } else if matches!(u, 0x202A..=0x202E | 0x2066..=0x2069 | 0x200E | 0x200F | 0x061C) {
        Some("a bidirectional control")
    } else if matches!(u, 0x2028 | 0x2029) {
        Some("a line or paragraph separator")
    } else {
        None
    }
}

/// `Ok` if every character of `text` may stand in a name or note; else an error naming
/// `field`, the character (as U+XXXX, never the character itself) and where it is.
pub fn check_text(field: &str, text: &str) -> Result<(), InputError> {
    match text
        .chars()
        .enumerate()
        .find_map(|(i, c)| refused_char(c).map(|why| (i, c, why)))
    {
        None => Ok(()),
        Some((i, c, why)) => {
            let (at, code) = (i + 1, format!("U+{:04X}", c as u32));
            let args: [&dyn std::fmt::Display; 2] = [&at, &code];
            // One whole sentence per reason, so each language words it its own way.
            let message = match why {
                "a control character" => tr_with(
                    "character {0} is {1}, a control character; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                "a Unicode non-character" => tr_with(
                    "character {0} is {1}, a Unicode non-character; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                "a bidirectional control" => tr_with(
                    "character {0} is {1}, a bidirectional control; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                _ => tr_with(
                    "character {0} is {1}, a line or paragraph separator; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
            };
            Err(InputError::new(field, message))
        }
    }
}

/// `text` in normalisation form C (composed): how names and notes are stored.
pub fn nfc(text: &str) -> String {
    text.nfc().collect()
}

/// The same name as people read it: trimmed and normalised (case kept).
pub fn same_text(a: &str, b: &str) -> bool {
    a.trim().nfc().eq(b.trim().nfc())
}

/// `text` safe to quote in a message on one line: every refused character is replaced by
/// U+FFFD, so a message can never carry an escape sequence or reorder a line.
pub fn shown(text: &str) -> String {
    text.chars()
        .map(|c| {
            if refused_char(c).is_some() {
                '\u{FFFD}'
            } else {
                c
            }
        })
        .collect()
}

/// The first letter upper case, the rest as it is.
pub fn first_upper(s: &str) -> String {
    let mut c = s.chars();
    match c.next() {
        Some(f) => f.to_uppercase().collect::<String>() + c.as_str(),
        None => String::new(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn refused_characters_are_named_with_their_field_and_position() {
        assert!(check_text("name", "Åsa Öberg-Ng 2").is_ok());
        let cases = [
            ("A\u{1b}[31m", 2, "U+001B, a control character"),
            ("Tab\there", 4, "U+0009, a control character"),
            ("x\u{ffff}", 2, "U+FFFF, a Unicode non-character"),
            ("\u{1fffe}", 1, "U+1FFFE, a Unicode non-character"),
            ("\u{fdd0}", 1, "U+FDD0, a Unicode non-character"),
            ("ab\u{202e}12", 3, "U+202E, a bidirectional control"),
            ("\u{2066}", 1, "U+2066, a bidirectional control"),
            ("a\u{2028}", 2, "U+2028, a line or paragraph separator"),
            ("\u{85}", 1, "U+0085, a control character"),
        ];
        for (text, at, why) in cases {
            let e = check_text("divers[1].name", text).unwrap_err();
            assert_eq!(e.field, "divers[1].name");
            assert!(
                e.message.starts_with(&format!("character {at} is {why}")),
                "{text:?}: {e}"
            );
            assert!(!e.message.contains(text), "the character is never echoed");
        }
        // The limits of each range are refused, their neighbours accepted.
        for ok in [0x2027, 0x202F, 0x2065, 0x206A, 0xFDCF, 0xFDF0, 0xFFFD] {
            let c = char::from_u32(ok).unwrap();
            assert!(refused_char(c).is_none(), "U+{ok:04X}");
        }
        for bad in [0x202A, 0x2069, 0xFDEF, 0xFFFE, 0x10FFFF] {
            assert!(
                refused_char(char::from_u32(bad).unwrap()).is_some(),
                "U+{bad:04X}"
            );
        }
    }

    #[test]
    fn names_are_compared_and_stored_composed() {
        let composed = "Jos\u{e9}";
        let decomposed = "Jose\u{301}";
        assert_ne!(composed, decomposed);
        assert_eq!(nfc(decomposed), composed);
        assert!(same_text(composed, &format!(" {decomposed} ")));
        assert!(!same_text("Jose", composed));
        assert_eq!(shown("a\u{1b}b\u{202e}"), "a\u{fffd}b\u{fffd}");
    }
}
