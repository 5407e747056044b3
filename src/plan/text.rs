//! The one check of names and notes people type or files carry (divers, cylinder sets).
//!
//! Refused: control characters (they can drive a terminal), Unicode non-characters (not
//! allowed in XML, so not on the card), line and paragraph separators, the
//! bidirectional controls (in a line of text they can reorder the digits printed beside
//! the name), and every character that draws nothing or something private: format
//! characters (general category Cf, e.g. a zero-width space or a soft hyphen, which make
//! "Bram" and "Bra\u{200B}m" two names that read alike), tag characters, variation selectors,
//! private-use characters and the blank fillers. A name needs one visible character.
//! Accepted text is kept in Unicode normalisation form C, and names compare case-blind,
//! so two names that look the same are the same.

use unicode_normalization::UnicodeNormalization;

use super::error::InputError;
use crate::i18n::{tr, tr_with};

/// Unicode format characters (general category Cf) other than the bidirectional controls
/// refused above. Source: the Unicode Character Database, DerivedGeneralCategory.txt
/// (Unicode 15.1), every `; Cf` line. The list is short and changes rarely.
const FORMAT_CHARS: &[(u32, u32)] = &[
    (0x00AD, 0x00AD),
    (0x0600, 0x0605),
    (0x06DD, 0x06DD),
    (0x070F, 0x070F),
    (0x0890, 0x0891),
    (0x08E2, 0x08E2),
    (0x180E, 0x180E),
    (0x200B, 0x200D),
    (0x2060, 0x2064),
    (0x206A, 0x206F),
    (0xFEFF, 0xFEFF),
    (0xFFF9, 0xFFFB),
    (0x110BD, 0x110BD),
    (0x110CD, 0x110CD),
    (0x13430, 0x1343F),
    (0x1BCA0, 0x1BCA3),
    (0x1D173, 0x1D17A),
    (0xE0001, 0xE0001),
    (0xE0020, 0xE007F),
];

/// Other characters that draw nothing (the Unicode Character Database's
/// Default_Ignorable_Code_Point property, DerivedCoreProperties.txt, beyond Cf and the
/// variation selectors): the combining grapheme joiner, the Khmer inherent vowels, the
/// reserved U+FFF0..FFF8, and the unassigned rest of the tag plane E0000..E0FFF.
const IGNORABLE: &[(u32, u32)] = &[
    (0x034F, 0x034F),
    (0x17B4, 0x17B5),
    (0xFFF0, 0xFFF8),
    (0xE0000, 0xE0FFF),
];

/// Variation selectors: U+FE00..FE0F, the supplement U+E0100..E01EF, and the Mongolian
/// free variation selectors U+180B..180D and U+180F (Unicode Character Database,
/// StandardizedVariants.txt and PropList.txt, Variation_Selector).
const VARIATION_SELECTORS: &[(u32, u32)] = &[
    (0x180B, 0x180D),
    (0x180F, 0x180F),
    (0xFE00, 0xFE0F),
    (0xE0100, 0xE01EF),
];

/// Private-use areas (general category Co): the BMP area and planes 15 and 16.
const PRIVATE_USE: &[(u32, u32)] = &[(0xE000, 0xF8FF), (0xF0000, 0xFFFFD), (0x100000, 0x10FFFD)];

/// Letters that draw as blank space but are not White_Space: the Hangul fillers
/// (U+115F, U+1160, U+3164, U+FFA0) and the blank Braille pattern U+2800.
const BLANK_FILLERS: &[u32] = &[0x115F, 0x1160, 0x3164, 0xFFA0, 0x2800];

fn in_ranges(ranges: &[(u32, u32)], u: u32) -> bool {
    ranges.iter().any(|&(lo, hi)| (lo..=hi).contains(&u))
}

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
    } else if in_ranges(VARIATION_SELECTORS, u) {
        Some("a variation selector")
    } else if in_ranges(FORMAT_CHARS, u) || in_ranges(IGNORABLE, u) {
        Some("an invisible formatting character")
    } else if in_ranges(PRIVATE_USE, u) {
        Some("a private-use character")
    } else if BLANK_FILLERS.contains(&u) {
        Some("a blank filler character")
    } else {
        None
    }
}

/// Whether `c` shows something by itself: not white space and not a combining mark
/// (the common combining blocks U+0300..036F, 1AB0..1AFF, 1DC0..1DFF, 20D0..20FF,
/// FE20..FE2F). Refused characters are never visible.
fn visible(c: char) -> bool {
    let u = c as u32;
    !c.is_whitespace()
        && refused_char(c).is_none()
        && !matches!(
            u,
            0x0300..=0x036F | 0x1AB0..=0x1AFF | 0x1DC0..=0x1DFF | 0x20D0..=0x20FF | 0xFE20..=0xFE2F
        )
}

/// A name (of a diver or a set): every character accepted by `check_text`, and at least
/// one that shows something, so that no name reads as blank.
pub fn check_name(field: &str, text: &str) -> Result<(), InputError> {
    check_text(field, text)?;
    if text.chars().any(visible) {
        Ok(())
    } else {
        Err(InputError::new(
            field,
            tr("a name needs at least one visible character (a letter, digit or sign)"),
        ))
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
                "a line or paragraph separator" => tr_with(
                    "character {0} is {1}, a line or paragraph separator; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                "a variation selector" => tr_with(
                    "character {0} is {1}, a variation selector; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                "a private-use character" => tr_with(
                    "character {0} is {1}, a private-use character; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                "a blank filler character" => tr_with(
                    "character {0} is {1}, a blank filler character; names and notes take letters, digits, spaces and punctuation only",
                    &args,
                ),
                _ => tr_with(
                    "character {0} is {1}, an invisible formatting character; names and notes take letters, digits, spaces and punctuation only",
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

/// The same name as people read it: trimmed, normalised (NFC), case ignored.
pub fn same_text(a: &str, b: &str) -> bool {
    nfc(a.trim()).to_lowercase() == nfc(b.trim()).to_lowercase()
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
        for ok in [0x2027, 0x202F, 0x2065, 0x2070, 0xFDCF, 0xFDF0, 0xFFFD] {
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
        assert!(same_text("Bram", " bram"), "case is ignored");
        assert!(same_text("\u{C5}SA", "a\u{30A}sa"), "after NFC, then case");
        assert_eq!(shown("a\u{1b}b\u{202e}"), "a\u{fffd}b\u{fffd}");
    }

    /// Characters that draw nothing or something private, from the audit that found them
    /// accepted, and the neighbours of each range (accepted). Categories as listed in the
    /// Unicode Character Database (DerivedGeneralCategory.txt, Unicode 15.1; Python's
    /// `unicodedata` 14.0 gives the same Cf list below U+13439).
    #[test]
    fn invisible_private_and_blank_characters_are_refused() {
        let cases = [
            (0x200B, "an invisible formatting character"),
            (0x00AD, "an invisible formatting character"),
            (0xFEFF, "an invisible formatting character"),
            (0x2061, "an invisible formatting character"),
            (0x034F, "an invisible formatting character"),
            (0x180E, "an invisible formatting character"),
            (0x200D, "an invisible formatting character"),
            (0xE0001, "an invisible formatting character"),
            (0xE0041, "an invisible formatting character"),
            (0x1343F, "an invisible formatting character"),
            (0xFE0F, "a variation selector"),
            (0xE0100, "a variation selector"),
            (0xF0000, "a private-use character"),
            (0xE000, "a private-use character"),
            (0x10FFFD, "a private-use character"),
            (0x3164, "a blank filler character"),
            (0x2800, "a blank filler character"),
            (0x115F, "a blank filler character"),
            (0x1160, "a blank filler character"),
            (0xFFA0, "a blank filler character"),
        ];
        for (u, why) in cases {
            let c = char::from_u32(u).unwrap();
            assert_eq!(refused_char(c), Some(why), "U+{u:04X}");
            let e = check_name("divers[0].name", &format!("Bra{c}m")).unwrap_err();
            assert_eq!(e.field, "divers[0].name");
            assert!(
                e.message
                    .starts_with(&format!("character 4 is U+{u:04X}, {why}")),
                "{e}"
            );
        }
        for ok in [
            0x00AC, 0x00AE, 0x0606, 0x200A, 0x2010, 0x2065, 0x2070, 0xFEFE, 0xFF00, 0xD7A3, 0xF900,
            0x2801, 0x3165, 0x1161, 0xFFA1, 0x0300,
        ] {
            let c = char::from_u32(ok).unwrap();
            assert!(refused_char(c).is_none(), "U+{ok:04X} is accepted");
        }
        // Python's unicodedata (the Unicode Character Database, 14.0) lists these as Cf;
        // every one is refused.
        for u in [
            0x0600, 0x0605, 0x06DD, 0x070F, 0x0890, 0x08E2, 0xFFF9, 0x110BD, 0x1BCA3, 0x1D17A,
        ] {
            assert!(
                refused_char(char::from_u32(u).unwrap()).is_some(),
                "U+{u:04X}"
            );
        }
        assert!(check_name("name", "Bram").is_ok());
        assert!(check_name("name", "\u{e9}").is_ok());
        for blank in ["\u{301}", "\u{301}\u{302}", ""] {
            let e = check_name("name", blank).unwrap_err();
            assert!(e.message.contains("visible character"), "{blank:?}: {e}");
        }
        let e = check_name("name", "\u{3164}").unwrap_err();
        assert!(e.message.contains("U+3164, a blank filler"), "{e}");
    }
}
