//! PickerAdapter: cylinder and mix pickers.

use slint::ComponentHandle;

use super::super::session::{Picker, Session};
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
    a.set_cylinders_open(matches!(s.picker, Picker::Cylinders { .. }));
    a.set_stage_mode(matches!(s.picker, Picker::Cylinders { stage: true, .. }));
    a.set_mix_open(matches!(s.picker, Picker::Mix { .. }));
    a.set_title(vm::picker_title(s).into());
    if let Picker::Cylinders { .. } = s.picker {
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
    if let (Picker::Mix { o2, he, .. }, Some(mix)) = (s.picker, s.picker.mix()) {
        a.set_o2(o2);
        a.set_he(he);
        a.set_mix_text(mix.label().into());
        a.set_mix_reason(s.picker.mix_reason().into());
    }
}
