//! Our own keypads, generic over the field: open, key, Done and Cancel. Every key
//! press is checked; a usable value of a live field is applied at once (the plan
//! recomputes), an unusable one shows its reason while the plan shows the value the
//! entry started from. Cancel puts that value back. What each field is lives in
//! `fields.rs`.

use crate::app::keypad::{KeypadBuffer, parse_value};
use crate::app::view_models as vm;
use crate::i18n::tr_with;
use crate::plan::InputError;
use crate::plan::next_step;
use crate::plan::shown;

use super::Session;

mod fields;
mod reading;
mod sizes;
mod temperatures;

pub use fields::EntryTarget;

/// What was typed: the text without surrounding spaces, and the number if it is one.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Typed<'a> {
    pub text: &'a str,
    pub value: Option<f64>,
}

impl<'a> Typed<'a> {
    pub fn new(text: &'a str) -> Self {
        Typed {
            text: text.trim(),
            value: parse_value(text),
        }
    }

    /// The number, or the error to show when there is none.
    pub fn number(&self, field: &str, message: &str) -> Result<f64, InputError> {
        self.value.ok_or_else(|| InputError::new(field, message))
    }
}

/// Why a typed value cannot be used (it changes nothing).
pub type Check = Box<dyn Fn(&Session, Typed<'_>) -> Result<(), InputError>>;
/// Use a value that passed its check; the team may still refuse it.
pub type Apply = Box<dyn Fn(&mut Session, Typed<'_>) -> Result<(), InputError>>;

/// One keypad field.
pub struct Field {
    /// The keypad (digits or letters) with the value it opens with.
    pub buffer: KeypadBuffer,
    pub title: String,
    /// How to read the value, shown in the message line while nothing is wrong (the
    /// line keeps its room, so no key moves when a reason replaces the hint).
    pub hint: Option<String>,
    pub unit: String,
    /// The value drives the plan as it is typed: applied on every usable key, and the
    /// team is saved on Done. Other fields are applied once, on Done.
    pub live: bool,
    /// The step of the ± buttons, if the field has them.
    pub step: Option<f64>,
    /// What a bad key or Cancel puts back, when it is not the text the keypad opens with.
    pub revert: Option<String>,
    pub check: Check,
    pub apply: Apply,
    /// What Done does besides, once the value is in place.
    pub on_done: Option<Apply>,
}

fn check(f: impl Fn(&Session, Typed<'_>) -> Result<(), InputError> + 'static) -> Check {
    Box::new(f)
}

fn apply(f: impl Fn(&mut Session, Typed<'_>) -> Result<(), InputError> + 'static) -> Apply {
    Box::new(f)
}

/// A field whose every value can be used.
fn no_check() -> Check {
    check(|_, _| Ok(()))
}

/// The open keypad: its field, the text it started from and why the typed text
/// cannot be used (empty when it can).
pub struct Entry {
    target: EntryTarget,
    field: Field,
    original: String,
    reason: String,
}

impl Entry {
    pub fn target(&self) -> EntryTarget {
        self.target
    }
    pub fn buffer(&self) -> &KeypadBuffer {
        &self.field.buffer
    }
    pub fn title(&self) -> &str {
        &self.field.title
    }
    /// How to read the value, if the field says.
    pub fn hint(&self) -> Option<&str> {
        self.field.hint.as_deref()
    }
    pub fn unit(&self) -> &str {
        &self.field.unit
    }
    /// Why the typed text cannot be used; empty when it can.
    pub fn reason(&self) -> &str {
        &self.reason
    }
    /// The step of the ± buttons, if the field has them.
    pub fn step(&self) -> Option<f64> {
        self.field.step
    }
}

impl Session {
    /// Open the keypad for `target`; nothing happens when its diver or draft is gone.
    pub fn open_entry(&mut self, target: EntryTarget) {
        let Some(field) = fields::field(self, target) else {
            return;
        };
        let original = field
            .revert
            .clone()
            .unwrap_or_else(|| field.buffer.text().to_string());
        let mut entry = Entry {
            target,
            field,
            original,
            reason: String::new(),
        };
        let opening = entry.field.buffer.text().to_string();
        entry.reason = reason((entry.field.check)(self, Typed::new(&opening)));
        self.entry = Some(entry);
        self.pending_change = matches!(target, EntryTarget::Depth | EntryTarget::WaterTemp)
            .then(|| self.before_change());
    }

    /// One key on the open keypad: a digit or letter, ".", "del", "clear", " ", or
    /// "+step" / "-step" on a field with step buttons.
    pub fn key(&mut self, key: &str) {
        let Some(entry) = self.entry.as_mut() else {
            return;
        };
        let buffer = &mut entry.field.buffer;
        match (key, entry.field.step) {
            ("+step" | "-step", Some(step)) => {
                let dir = if key == "+step" { 1 } else { -1 };
                let v = buffer.value().unwrap_or(0.0);
                buffer.set_text(shown::num(next_step(v, step, dir).max(0.0)));
            }
            ("+step" | "-step", None) => {}
            _ => buffer.press(key),
        }
        self.use_typed(false);
    }

    /// A key of a physical keyboard while a keypad is open (desktop): digits, the
    /// decimal point (or comma), letters and space on the letter pad, Backspace and
    /// Delete, Enter for Done, the up and down arrows for one step. Returns whether the
    /// key was used; Escape is left to Back, which cancels the entry.
    pub fn keyboard(&mut self, text: &str) -> bool {
        const BACKSPACE: &str = "\u{8}";
        const DELETE: &str = "\u{7f}";
        const UP: &str = "\u{f700}";
        const DOWN: &str = "\u{f701}";
        let Some(entry) = self.entry.as_ref() else {
            return false;
        };
        let letters = entry.field.buffer.is_letters();
        match text {
            BACKSPACE | DELETE => self.key("del"),
            "\n" | "\r" => self.entry_done(),
            UP => self.key("+step"),
            DOWN => self.key("-step"),
            "," if !letters => self.key("."),
            t => {
                let mut chars = t.chars();
                let (Some(c), None) = (chars.next(), chars.next()) else {
                    return false;
                };
                let usable = if letters {
                    c.is_alphanumeric() || " -'./".contains(c)
                } else {
                    c.is_ascii_digit() || c == '.'
                };
                if !usable {
                    return false;
                }
                self.key(t);
            }
        }
        true
    }

    /// Done: use the value (only possible when it is usable) and close.
    pub fn entry_done(&mut self) {
        if !self.use_typed(true) {
            return;
        }
        let Some(entry) = self.entry.take() else {
            return;
        };
        if let Some(on_done) = &entry.field.on_done {
            let _ = on_done(self, Typed::new(entry.field.buffer.text()));
        }
        if entry.field.live {
            self.save_team();
        }
        if let Some(before) = self.pending_change.take() {
            let what = match entry.target {
                EntryTarget::Depth => tr_with("Depth now {0}", &[&vm::depth_label(self)]),
                _ => tr_with("Water now {0}", &[&vm::water_temp_text(self)]),
            };
            self.after_change(what, before);
        }
    }

    /// Cancel: put back the value the entry started from, and close.
    pub fn cancel_entry(&mut self) {
        self.pending_change = None;
        if let Some(entry) = self.entry.take()
            && entry.field.live
        {
            let _ = (entry.field.apply)(self, Typed::new(&entry.original));
        }
    }

    /// Check the typed text and apply it where it drives the plan (every field on
    /// Done). While the text of a live field is unusable, the plan shows the value the
    /// entry started from. Returns whether the text is usable.
    fn use_typed(&mut self, done: bool) -> bool {
        let Some(mut entry) = self.entry.take() else {
            return false;
        };
        let field = &entry.field;
        let text = field.buffer.text();
        let typed = Typed::new(text);
        let mut result = (field.check)(self, typed);
        if result.is_ok() && (field.live || done) {
            result = (field.apply)(self, typed);
        }
        if result.is_err() && field.live && text != entry.original {
            let _ = (field.apply)(self, Typed::new(&entry.original));
        }
        let usable = result.is_ok();
        entry.reason = reason(result);
        self.entry = Some(entry);
        usable
    }
}

/// The message of a failed check, or empty.
fn reason(r: Result<(), InputError>) -> String {
    r.err().map(|e| e.message).unwrap_or_default()
}

#[cfg(test)]
mod tests;
