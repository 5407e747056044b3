//! PickerAdapter: cylinder and mix pickers.

use slint::ComponentHandle;

use super::super::session::Session;
use super::super::view_models as vm;
use super::super::{AppWindow, PickRow, PickerAdapter};
use super::{Shared, act, handles, model};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<PickerAdapter>();
    let (w, st) = handles(ui, s);
    a.on_pick_locker(move |i| act(&w, &st, |x| x.pick_locker(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_pick_preset(move |i| act(&w, &st, |x| x.pick_preset(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_nudge_o2(move |d| act(&w, &st, |x| x.picker.nudge_mix(d, 0)));
    let (w, st) = handles(ui, s);
    a.on_nudge_he(move |d| act(&w, &st, |x| x.picker.nudge_mix(0, d)));
    let (w, st) = handles(ui, s);
    a.on_quick_mix(move |i| act(&w, &st, |x| x.picker.quick_mix(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_mix_done(move || act(&w, &st, |x| x.mix_done()));
    let (w, st) = handles(ui, s);
    a.on_close(move || act(&w, &st, |x| x.picker.close()));
    let (w, st) = handles(ui, s);
    a.on_no_stage(move || act(&w, &st, |x| x.pick_no_stage()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<PickerAdapter>();
    let p = vm::picker(s);
    a.set_cylinders_open(p.cylinders_open);
    a.set_stage_mode(p.stage_mode);
    a.set_mix_open(p.mix_open);
    a.set_title(p.title.into());
    if p.cylinders_open {
        a.set_locker(model(
            vm::locker_pick_rows(s)
                .into_iter()
                .map(|(title, detail, mine)| PickRow {
                    title: title.into(),
                    detail: detail.into(),
                    mine,
                })
                .collect(),
        ));
        a.set_presets(model(
            vm::preset_rows()
                .into_iter()
                .map(|(title, detail)| PickRow {
                    title: title.into(),
                    detail: detail.into(),
                    mine: false,
                })
                .collect(),
        ));
    }
    if let Some((o2, he, text, reason)) = p.mix {
        a.set_o2(o2);
        a.set_he(he);
        a.set_mix_text(text.into());
        a.set_mix_reason(reason.into());
    }
}
