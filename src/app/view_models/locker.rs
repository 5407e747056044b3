//! The cylinder locker and its editor.

use super::super::session::Session;
use crate::plan::ModelKind;
use crate::plan::error::fmt_num;
use crate::plan::{Material, presets};

pub struct LockerRowVm {
    pub id: i32,
    pub name: String,
    pub detail: String,
    pub note: String,
    pub mine: bool,
}

pub fn locker_rows(s: &Session) -> Vec<LockerRowVm> {
    s.locker
        .entries()
        .iter()
        .map(|e| LockerRowVm {
            id: e.id as i32,
            name: e.name.clone(),
            detail: format!(
                "{} · {}",
                e.cylinders
                    .to_set("locker")
                    .map(|x| x.describe())
                    .unwrap_or_else(|err| err.to_string()),
                e.material.name()
            ),
            note: e.note.clone(),
            mine: e.mine,
        })
        .collect()
}

/// "Deleted “name”." while Undo can bring an entry back; else empty.
pub fn undo_text(s: &Session) -> String {
    s.locker
        .undo_name()
        .map(|n| format!("Deleted “{n}”."))
        .unwrap_or_default()
}

pub struct LockerEditVm {
    pub title: String,
    pub name: String,
    pub count: i32,
    pub rated: bool,
    pub first_label: String,
    pub second_label: String,
    pub first_value: String,
    pub second_value: String,
    pub material_index: i32,
    pub note: String,
    pub summary: String,
}

/// The editor of the open draft, if one is open.
pub fn locker_edit(s: &Session) -> Option<LockerEditVm> {
    let d = s.locker.draft()?;
    let specs = d.field_specs();
    let with_unit = |v: Option<f64>, unit: &str| {
        v.map(|v| format!("{} {unit}", fmt_num(v)))
            .unwrap_or_default()
    };
    Some(LockerEditVm {
        title: if d.id.is_some() {
            "Edit set"
        } else {
            "New set"
        }
        .to_string(),
        name: d.name.clone(),
        count: i32::from(d.count),
        rated: d.rated,
        first_label: specs[0].0.to_string(),
        second_label: specs[1].0.to_string(),
        first_value: with_unit(d.first, specs[0].1),
        second_value: with_unit(d.second, specs[1].1),
        material_index: Material::ALL
            .iter()
            .position(|m| *m == d.material)
            .unwrap_or(0) as i32,
        note: d.note.clone(),
        summary: d
            .to_set()
            .map(|set| {
                let w = set.water(ModelKind::Real).litres();
                format!("{} · {:.1} L of water in all", set.describe(), w)
            })
            .unwrap_or_default(),
    })
}

pub fn preset_rows() -> Vec<(String, String)> {
    presets()
        .iter()
        .map(|p| {
            let water = p.set.spec.water_per_cylinder(ModelKind::Real);
            (
                p.name.to_string(),
                format!(
                    "{} · {} L water each",
                    p.material.name(),
                    fmt_num((water.litres() * 10.0).round() / 10.0)
                ),
            )
        })
        .collect()
}
