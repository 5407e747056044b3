//! The keypad field of a pressure read in the water: a diver's start or stage start.

use crate::app::keypad::KeypadBuffer;
use crate::app::view_models as vm;
use crate::plan::{Gauge, Pressure};

use super::{Apply, Check, Field};

/// A pressure read in the water on a diver's gauge (a main or a stage start).
pub struct Reading {
    pub gauge: Gauge,
    /// The start the plan has now.
    pub start: Pressure,
    /// Nobody read it for this dive: the keypad opens empty, so the number must come
    /// from the gauge.
    pub unread: bool,
    pub title: String,
    pub hint: Option<String>,
    pub step: Option<f64>,
}

/// The keypad field of a reading: it drives the plan as it is typed, goes back to the
/// start the plan had on Cancel (even when it opened empty), and Done (`read_now`)
/// records a reading taken now.
pub fn reading_field(r: Reading, check: Check, apply: Apply, read_now: Apply) -> Field {
    Field {
        buffer: KeypadBuffer::digits(
            &if r.unread {
                String::new()
            } else {
                vm::reading(r.gauge, r.start)
            },
            false,
        ),
        title: r.title,
        hint: r.hint,
        unit: r.gauge.label().to_string(),
        live: true,
        step: r.step,
        revert: Some(vm::reading(r.gauge, r.start)),
        check,
        apply,
        on_done: Some(read_now),
    }
}
