//! LockerAdapter and LockerEditAdapter: the cylinder locker and its editor.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::view_models as vm;
use super::super::{AppWindow, LockerAdapter, LockerEditAdapter, LockerRow, PresetRow};
use super::{Shared, act, handles, model};
use crate::plan::catalogue::Material;
use crate::plan::error::fmt_num;

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
    e.on_change_count(move |d| act(&w, &st, |x| x.draft_count(d)));
    let (w, st) = handles(ui, s);
    e.on_set_rated(move |r| act(&w, &st, |x| x.draft_rated(r)));
    let (w, st) = handles(ui, s);
    e.on_set_material(move |i| act(&w, &st, |x| x.draft_material(i as usize)));
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
        s.locker
            .file
            .entries
            .iter()
            .map(|e| LockerRow {
                id: e.id as i32,
                name: e.name.clone().into(),
                detail: format!(
                    "{} · {}",
                    e.cylinders
                        .to_set("locker")
                        .map(|x| x.describe())
                        .unwrap_or_else(|err| err.to_string()),
                    e.material.name()
                )
                .into(),
                note: e.note.clone().into(),
                mine: e.mine,
            })
            .collect(),
    ));
    a.set_presets(model(
        vm::preset_rows()
            .into_iter()
            .map(|(name, detail)| PresetRow {
                name: name.into(),
                detail: detail.into(),
            })
            .collect(),
    ));
    a.set_undo_text(match &s.locker.undo {
        Some((_, e)) => format!("Deleted “{}”.", e.name).into(),
        None => "".into(),
    });

    let e = ui.global::<LockerEditAdapter>();
    if let Some(d) = &s.locker.draft {
        let specs = d.field_specs();
        e.set_title(
            if d.id.is_some() {
                "Edit set"
            } else {
                "New set"
            }
            .into(),
        );
        e.set_name(d.name.clone().into());
        e.set_count(i32::from(d.count));
        e.set_rated(d.rated);
        e.set_first_label(specs[0].0.into());
        e.set_second_label(specs[1].0.into());
        e.set_first_value(
            d.first
                .map(|v| format!("{} {}", fmt_num(v), specs[0].1))
                .unwrap_or_default()
                .into(),
        );
        e.set_second_value(
            d.second
                .map(|v| format!("{} {}", fmt_num(v), specs[1].1))
                .unwrap_or_default()
                .into(),
        );
        e.set_material_index(
            Material::ALL
                .iter()
                .position(|m| *m == d.material)
                .unwrap_or(0) as i32,
        );
        e.set_note(d.note.clone().into());
        e.set_summary(
            d.to_set()
                .map(|set| {
                    let w = set.water(crate::plan::ModelKind::Real).litres();
                    format!("{} · {:.1} L of water in all", set.describe(), w)
                })
                .unwrap_or_default()
                .into(),
        );
    }
}
