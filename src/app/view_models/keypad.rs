//! The open keypad: what it is for, what was typed and why it cannot be used yet.

use super::super::session::Session;
use crate::plan::error::fmt_num;

pub struct KeypadVm {
    pub letters: bool,
    pub title: String,
    pub display: String,
    pub unit: String,
    pub reason: String,
    /// The opening value is selected: the first key replaces it.
    pub selected: bool,
    pub can_decimal: bool,
    /// The field has ± gauge-step buttons.
    pub can_step: bool,
    /// The gauge step on the ± buttons; empty when the field has none.
    pub step_text: String,
}

/// The open keypad, if any.
pub fn keypad(s: &Session) -> Option<KeypadVm> {
    let e = s.entry.as_ref()?;
    Some(KeypadVm {
        letters: e.buffer().is_letters(),
        title: e.title().to_string(),
        display: e.buffer().text().to_string(),
        unit: e.unit().to_string(),
        reason: e.reason().to_string(),
        selected: e.buffer().is_selected(),
        can_decimal: e.buffer().allows_decimal(),
        can_step: e.step().is_some(),
        step_text: e.step().map(fmt_num).unwrap_or_default(),
    })
}
