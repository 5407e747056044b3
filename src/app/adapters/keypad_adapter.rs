//! KeypadAdapter: our own digit and letter pads.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::{AppWindow, KeypadAdapter};
use super::{Shared, act, handles};
use crate::plan::error::fmt_num;

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<KeypadAdapter>();
    let (w, st) = handles(ui, s);
    a.on_key(move |k| act(&w, &st, |x| x.key(k.as_str())));
    let (w, st) = handles(ui, s);
    a.on_done(move || act(&w, &st, |x| x.entry_done()));
    let (w, st) = handles(ui, s);
    a.on_cancel(move || act(&w, &st, |x| x.cancel_entry()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<KeypadAdapter>();
    match &s.entry {
        None => a.set_open(false),
        Some(e) => {
            a.set_open(true);
            a.set_letters(e.buffer.is_letters());
            a.set_title(e.title.clone().into());
            a.set_display(e.buffer.text().into());
            a.set_unit(e.unit.clone().into());
            a.set_reason(e.reason.clone().into());
            a.set_can_decimal(e.buffer.allows_decimal());
            let stepping = matches!(e.target, EntryTarget::Start(_));
            a.set_can_step(stepping);
            a.set_step_text(if stepping {
                fmt_num(s.team.input().gauge_step).into()
            } else {
                "".into()
            });
        }
    }
}
