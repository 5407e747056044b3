//! KeypadAdapter: our own digit and letter pads.

use slint::ComponentHandle;

use super::super::session::Session;
use super::super::ui::{AppWindow, KeypadAdapter};
use super::super::view_models as vm;
use super::{Shared, act, handles};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<KeypadAdapter>();
    let (w, st) = handles(ui, s);
    a.on_key(move |k| act(&w, &st, |x| x.key(k.as_str())));
    let (w, st) = handles(ui, s);
    a.on_typed(move |t| {
        let mut used = false;
        act(&w, &st, |x| used = x.keyboard(t.as_str()));
        used
    });
    let (w, st) = handles(ui, s);
    a.on_done(move || act(&w, &st, |x| x.entry_done()));
    let (w, st) = handles(ui, s);
    a.on_cancel(move || act(&w, &st, |x| x.cancel_entry()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<KeypadAdapter>();
    match vm::keypad(s) {
        None => a.set_open(false),
        Some(k) => {
            a.set_open(true);
            a.set_letters(k.letters);
            a.set_title(vm::keep_units_together(&k.title).into());
            a.set_display(k.display.into());
            a.set_unit(k.unit.into());
            a.set_reason(vm::keep_units_together(&k.reason).into());
            a.set_hint(vm::keep_units_together(&k.hint).into());
            a.set_warning(vm::keep_units_together(&k.warning).into());
            a.set_selected(k.selected);
            a.set_can_decimal(k.can_decimal);
            a.set_decimal_mark(k.decimal_mark.into());
            a.set_can_step(k.can_step);
            a.set_step_text(k.step_text.into());
        }
    }
}
