//! The open keypad: what it is for, what was typed and why it cannot be used yet.

use super::super::session::{EntryTarget, Session};
use crate::plan::shown;
use crate::plan::{Supply, Warning};

pub struct KeypadVm {
    pub letters: bool,
    pub title: String,
    pub display: String,
    pub unit: String,
    pub reason: String,
    /// How to read the value, shown while there is no reason or warning.
    pub hint: String,
    /// The plan's warnings about the value typed (a start above the working pressure, an
    /// overfill, a low fill), in the core's words; empty when there are none.
    pub warning: String,
    /// The opening value is selected: the first key replaces it.
    pub selected: bool,
    pub can_decimal: bool,
    /// The decimal key's face: the separator of the language shown ("." or ",").
    pub decimal_mark: String,
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
        // A sentence on its own line: it starts with a capital ("⚠ Enter …").
        reason: crate::plan::text::first_upper(e.reason()),
        hint: e.hint().unwrap_or_default().to_string(),
        warning: entry_warnings(s, e.target()).join(" "),
        selected: e.buffer().is_selected(),
        can_decimal: e.buffer().allows_decimal(),
        decimal_mark: shown::decimal().mark().to_string(),
        can_step: e.step().is_some(),
        step_text: e.step().map(shown::num).unwrap_or_default(),
    })
}

/// The plan's warnings about the supply a start keypad enters: the same list the Team and
/// Turns pages, the CLI and the card show, so a value is never accepted without them.
fn entry_warnings(s: &Session, target: EntryTarget) -> Vec<String> {
    let (diver, supply) = match target {
        EntryTarget::Start(i) => (i, Supply::Main),
        EntryTarget::StageStart(i) => (i, Supply::Stage),
        _ => return Vec::new(),
    };
    s.team
        .plan()
        .warnings
        .iter()
        .filter(|w| {
            w.diver() == Some(diver)
                && matches!(
                    w,
                    Warning::AboveWorking { supply: x, .. }
                        | Warning::Overfill { supply: x, .. }
                        | Warning::LowFill { supply: x, .. } if *x == supply
                )
        })
        .map(Warning::brief)
        .collect()
}
