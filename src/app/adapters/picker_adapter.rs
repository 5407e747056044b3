//! PickerAdapter: cylinder picker (with the custom set) and mix picker.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::ui::{AppWindow, CustomSetView, MixItem, MixRow, PickRow, PickerAdapter};
use super::super::view_models as vm;
use super::{Shared, act, handles, model};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<PickerAdapter>();
    let (w, st) = handles(ui, s);
    a.on_pick_locker(move |i| act(&w, &st, |x| x.pick_locker(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_pick_preset(move |i| act(&w, &st, |x| x.pick_preset(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_open_custom(move || act(&w, &st, |x| x.open_custom_cylinders()));
    let (w, st) = handles(ui, s);
    a.on_custom_count(move |n| act(&w, &st, |x| x.edit_custom(|c| c.set_count(n as u8))));
    let (w, st) = handles(ui, s);
    a.on_custom_independent(move |b| act(&w, &st, |x| x.edit_custom(|c| c.independent = b)));
    let (w, st) = handles(ui, s);
    a.on_custom_rated(move |b| act(&w, &st, |x| x.edit_custom(|c| c.set_rated(b))));
    let (w, st) = handles(ui, s);
    a.on_custom_edit(move |first| {
        act(&w, &st, |x| {
            x.open_entry(if first {
                EntryTarget::CustomFirst
            } else {
                EntryTarget::CustomSecond
            })
        })
    });
    let (w, st) = handles(ui, s);
    a.on_custom_list(move || act(&w, &st, |x| x.custom_to_list()));
    let (w, st) = handles(ui, s);
    a.on_custom_done(move || act(&w, &st, |x| x.custom_done()));
    let (w, st) = handles(ui, s);
    a.on_mix_choice(move |i| act(&w, &st, |x| x.pick_mix_choice(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_edit_o2(move || act(&w, &st, |x| x.open_entry(EntryTarget::MixO2)));
    let (w, st) = handles(ui, s);
    a.on_edit_he(move || act(&w, &st, |x| x.open_entry(EntryTarget::MixHe)));
    let (w, st) = handles(ui, s);
    a.on_mix_done(move || act(&w, &st, |x| x.mix_done()));
    let (w, st) = handles(ui, s);
    a.on_close(move || act(&w, &st, |x| x.picker.close()));
    let (w, st) = handles(ui, s);
    a.on_no_stage(move || act(&w, &st, |x| x.pick_no_stage()));
}

fn rows(rows: Vec<vm::PickRowVm>) -> slint::ModelRc<PickRow> {
    model(
        rows.into_iter()
            .map(|r| PickRow {
                title: vm::keep_units_together(&r.title).into(),
                detail: vm::keep_units_together(&r.detail).into(),
                mine: r.mine,
                count: r.count.into(),
                index: r.index as i32,
            })
            .collect(),
    )
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<PickerAdapter>();
    let p = vm::picker(s);
    a.set_cylinders_open(p.cylinders_open);
    a.set_custom_open(p.custom.is_some());
    a.set_stage_mode(p.stage_mode);
    a.set_mix_open(p.mix_open);
    a.set_title(vm::keep_units_together(&p.title).into());
    if p.cylinders_open {
        a.set_locker(rows(p.locker));
        a.set_singles(rows(p.singles));
        a.set_pairs(rows(p.pairs));
    }
    if let Some(c) = p.custom {
        a.set_custom(CustomSetView {
            count: c.count,
            independent: c.independent,
            rated: c.rated,
            first_caption: c.first_caption.into(),
            second_caption: c.second_caption.into(),
            first_name: c.first_name.into(),
            second_name: c.second_name.into(),
            first_value: c.first_value.into(),
            second_value: c.second_value.into(),
            summary: vm::keep_units_together(&c.summary).into(),
            problem: c.problem.into(),
        });
    }
    if let Some((o2, he, text, reason)) = p.mix {
        a.set_o2(o2);
        a.set_he(he);
        a.set_mix_text(text.into());
        a.set_mix_reason(vm::keep_units_together(&reason).into());
        a.set_mix_rows(model(
            p.mix_rows
                .into_iter()
                .map(|r| MixRow {
                    heading: r.heading.into(),
                    items: model(
                        r.items
                            .into_iter()
                            .map(|(text, index)| MixItem {
                                text: text.into(),
                                index,
                            })
                            .collect(),
                    ),
                })
                .collect(),
        ));
    }
}
