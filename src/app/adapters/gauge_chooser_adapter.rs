//! GaugeChooserAdapter: the gauge chooser of a diver's card.

use slint::ComponentHandle;

use super::super::session::Session;
use super::super::ui::{AppWindow, GaugeChoice, GaugeChooserAdapter};
use super::super::view_models as vm;
use super::{Shared, act, handles, model};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<GaugeChooserAdapter>();
    let (w, st) = handles(ui, s);
    a.on_choose(move |i| act(&w, &st, |x| x.choose_gauge(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_close(move || act(&w, &st, |x| x.close_gauge_chooser()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<GaugeChooserAdapter>();
    match vm::gauge_chooser(s) {
        Some(c) => {
            a.set_title(c.title.into());
            a.set_note(c.note.into());
            a.set_choices(model(
                c.choices
                    .into_iter()
                    .map(|(text, label, current)| GaugeChoice {
                        text: text.into(),
                        label: label.into(),
                        current,
                    })
                    .collect(),
            ));
            a.set_open(true);
        }
        None => a.set_open(false),
    }
}
