//! LockerAdapter and LockerEditAdapter: the cylinder locker and its editor.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::ui::{AppWindow, LockerAdapter, LockerEditAdapter, LockerRow, PresetRow};
use super::super::view_models as vm;
use super::{Shared, act, handles, model};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<LockerAdapter>();
    let (w, st) = handles(ui, s);
    a.on_add_new(move || act(&w, &st, |x| x.locker_new()));
    let (w, st) = handles(ui, s);
    a.on_edit(move |id| act(&w, &st, |x| x.locker_edit(id as u64)));
    let (w, st) = handles(ui, s);
    a.on_remove(move |id| act(&w, &st, |x| x.locker_delete(id as u64)));
    let (w, st) = handles(ui, s);
    a.on_make_mine(move |id| act(&w, &st, |x| x.locker_make_mine(id as u64)));
    let (w, st) = handles(ui, s);
    a.on_undo(move || act(&w, &st, |x| x.locker_undo()));
    let (w, st) = handles(ui, s);
    a.on_copy_preset(move |i| act(&w, &st, |x| x.locker_copy_preset(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_export_locker(move || act(&w, &st, |x| x.locker_export()));
    let (w, st) = handles(ui, s);
    a.on_import_sets(move || act(&w, &st, |x| x.locker_import()));
    let (w, st) = handles(ui, s);
    a.on_dismiss_exchange(move || act(&w, &st, |x| x.dismiss_exchange_message()));

    let e = ui.global::<LockerEditAdapter>();
    let (w, st) = handles(ui, s);
    e.on_edit_name(move || act(&w, &st, |x| x.open_entry(EntryTarget::LockerName)));
    let (w, st) = handles(ui, s);
    e.on_edit_note(move || act(&w, &st, |x| x.open_entry(EntryTarget::LockerNote)));
    let (w, st) = handles(ui, s);
    e.on_edit_first(move || act(&w, &st, |x| x.open_entry(EntryTarget::LockerFirst)));
    let (w, st) = handles(ui, s);
    e.on_edit_second(move || act(&w, &st, |x| x.open_entry(EntryTarget::LockerSecond)));
    let (w, st) = handles(ui, s);
    e.on_change_count(move |n| act(&w, &st, |x| x.locker.edit_draft(|d| d.change_count(n))));
    let (w, st) = handles(ui, s);
    e.on_set_rated(move |r| act(&w, &st, |x| x.locker.edit_draft(|d| d.set_rated(r))));
    let (w, st) = handles(ui, s);
    e.on_set_material(move |i| {
        act(&w, &st, |x| {
            x.locker.edit_draft(|d| d.set_material(i as usize))
        })
    });
    let (w, st) = handles(ui, s);
    let weak = ui.as_weak();
    e.on_save(move || {
        let mut error = String::new();
        act(&w, &st, |x| {
            if let Err(err) = x.locker_save() {
                error = err.to_string();
            }
        });
        if let Some(ui) = weak.upgrade() {
            ui.global::<LockerEditAdapter>().set_error(error.into());
        }
    });
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<LockerAdapter>();
    a.set_entries(model(
        vm::locker_rows(s)
            .into_iter()
            .map(|r| LockerRow {
                id: r.id,
                name: vm::keep_units_together(&r.name).into(),
                detail: vm::keep_units_together(&r.detail).into(),
                note: r.note.into(),
                mine: r.mine,
            })
            .collect(),
    ));
    a.set_presets(model(
        vm::preset_rows()
            .into_iter()
            .map(|(name, detail)| PresetRow {
                name: vm::keep_units_together(&name).into(),
                detail: vm::keep_units_together(&detail).into(),
            })
            .collect(),
    ));
    a.set_undo_text(vm::keep_units_together(&vm::undo_text(s)).into());
    a.set_exchange_hint(s.exchange.hint().into());
    a.set_exchange_text(s.exchange.message.clone().into());

    let e = ui.global::<LockerEditAdapter>();
    if let Some(d) = vm::locker_edit(s) {
        e.set_title(vm::keep_units_together(&d.title).into());
        e.set_name(d.name.into());
        e.set_name_warning(d.name_warning.into());
        e.set_count(d.count);
        e.set_rated(d.rated);
        e.set_first_label(d.first_label.into());
        e.set_second_label(d.second_label.into());
        e.set_first_value(d.first_value.into());
        e.set_second_value(d.second_value.into());
        e.set_material_index(d.material_index);
        e.set_note(d.note.into());
        e.set_summary(vm::keep_units_together(&d.summary).into());
    }
}
