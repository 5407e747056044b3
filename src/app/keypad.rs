//! The entry buffer behind our own keypads: digits or letters, no system keyboard.

/// Text being typed on a keypad.
#[derive(Clone, Debug, PartialEq)]
pub struct KeypadBuffer {
    text: String,
    letters: bool,
    decimal: bool,
    max_len: usize,
    /// The text it opened with is selected: the first character typed replaces it, and
    /// "del" removes it all.
    selected: bool,
}

impl KeypadBuffer {
    /// A number pad opening with `initial` selected.
    pub fn digits(initial: &str, decimal: bool) -> Self {
        KeypadBuffer {
            text: initial.to_string(),
            letters: false,
            decimal,
            max_len: 7,
            selected: !initial.is_empty(),
        }
    }

    /// A letter pad opening with `initial` selected. `max_len` leaves room past the
    /// field's own limit, so a name that is too long gets a message instead of being
    /// cut short silently.
    pub fn letters(initial: &str, max_len: usize) -> Self {
        KeypadBuffer {
            text: initial.to_string(),
            letters: true,
            decimal: false,
            max_len,
            selected: !initial.is_empty(),
        }
    }

    /// Whether the opening text is still selected (the next character replaces it).
    pub fn is_selected(&self) -> bool {
        self.selected
    }

    pub fn text(&self) -> &str {
        &self.text
    }
    pub fn is_letters(&self) -> bool {
        self.letters
    }
    pub fn allows_decimal(&self) -> bool {
        self.decimal
    }
    pub fn set_text(&mut self, text: String) {
        self.text = text;
        self.selected = false;
    }

    /// The number typed, if any.
    pub fn value(&self) -> Option<f64> {
        parse_value(&self.text)
    }

    /// Apply one key: a digit or letter, "." or ",", "del", "clear" or " ". Unknown keys are ignored.
    pub fn press(&mut self, key: &str) {
        if self.selected {
            self.selected = false;
            match key {
                "del" | "clear" => {
                    self.text.clear();
                    return;
                }
                // A character replaces the selected text.
                k if k.chars().count() == 1 => self.text.clear(),
                _ => {}
            }
        }
        match key {
            "del" => {
                self.text.pop();
            }
            "clear" => self.text.clear(),
            _ if self.text.chars().count() >= self.max_len => {}
            // Either separator types the one of the language shown (157,5 or 157.5).
            "." | "," if !self.letters && self.decimal && !self.text.contains(['.', ',']) => {
                if self.text.is_empty() {
                    self.text.push('0');
                }
                self.text.push(crate::plan::shown::decimal().mark());
            }
            k if !self.letters && k.len() == 1 && k.as_bytes()[0].is_ascii_digit() => {
                if self.text == "0" {
                    self.text.clear();
                }
                self.text.push_str(k);
            }
            k if self.letters && k.chars().count() == 1 => {
                let c = k.chars().next().unwrap_or(' ');
                if c == ' ' && (self.text.is_empty() || self.text.ends_with(' ')) {
                    return;
                }
                // Capitalise the first letter of each word; lower-case the rest.
                let word_start = self.text.is_empty() || self.text.ends_with([' ', '-', '/']);
                if c.is_alphabetic() {
                    if word_start {
                        self.text.extend(c.to_uppercase());
                    } else {
                        self.text.extend(c.to_lowercase());
                    }
                } else {
                    self.text.push(c);
                }
            }
            _ => {}
        }
    }
}

/// The number in a keypad text, if it is one (either decimal separator).
pub fn parse_value(text: &str) -> Option<f64> {
    crate::plan::shown::parse(text)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn digits_build_a_number() {
        let mut b = KeypadBuffer::digits("", false);
        for k in ["0", "2", "1", "8", "."] {
            b.press(k);
        }
        assert_eq!(b.text(), "218");
        assert_eq!(b.value(), Some(218.0));
        b.press("del");
        assert_eq!(b.value(), Some(21.0));
        b.press("clear");
        assert_eq!(b.value(), None);
        b.press("A");
        assert_eq!(b.text(), "");
    }

    #[test]
    fn the_opening_value_is_replaced_by_the_first_key() {
        let mut b = KeypadBuffer::digits("210", false);
        assert!(b.is_selected());
        b.press("2");
        assert_eq!(b.text(), "2");
        b.press("0");
        assert_eq!(b.text(), "20");
        let mut b = KeypadBuffer::digits("210", false);
        b.press("del");
        assert_eq!(b.text(), "");
        let mut b = KeypadBuffer::letters("Ines", 32);
        b.press("S");
        assert_eq!(b.text(), "S");
        // Digits are allowed in names.
        b.press("2");
        assert_eq!(b.text(), "S2");
    }

    #[test]
    fn one_decimal_point_when_allowed() {
        let mut b = KeypadBuffer::digits("", true);
        for k in [".", "5", ".", "1"] {
            b.press(k);
        }
        assert_eq!(b.text(), "0.51");
    }

    #[test]
    fn letters_capitalise_words() {
        let mut b = KeypadBuffer::letters("", 24);
        for k in [" ", "M", "A", "R", "I", " ", "L", "U", "-", "K", "A"] {
            b.press(k);
        }
        assert_eq!(b.text(), "Mari Lu-Ka");
    }

    #[test]
    fn the_decimal_key_types_the_language_separator() {
        use crate::plan::shown::{Decimal, DecimalScope};
        let _comma = DecimalScope::new(Decimal::Comma);
        let mut b = KeypadBuffer::digits("", true);
        for k in ["1", "5", "7", ".", ",", "5"] {
            b.press(k);
        }
        assert_eq!(b.text(), "157,5", "one separator, the language's");
        assert_eq!(b.value(), Some(157.5));
        let mut b = KeypadBuffer::digits("", true);
        b.press(",");
        assert_eq!(b.text(), "0,");
        assert_eq!(b.value(), Some(0.0));
    }
}
