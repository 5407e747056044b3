//! The cylinder locker, its editor and the pickers.

use super::super::session::{Picker, Session};
use crate::plan::ModelKind;
use crate::plan::catalogue::{Material, presets};
use crate::plan::error::fmt_num;

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

/// (title, detail, mine) for the locker rows of the cylinder picker.
pub fn locker_pick_rows(s: &Session) -> Vec<(String, String, bool)> {
    s.locker
        .entries()
        .iter()
        .map(|e| {
            let detail = e
                .cylinders
                .to_set("locker")
                .map(|set| set.describe())
                .unwrap_or_else(|err| err.to_string());
            (e.name.clone(), detail, e.mine)
        })
        .collect()
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

/// The open picker: which one, for what, and the mix being picked.
pub struct PickerVm {
    pub cylinders_open: bool,
    pub stage_mode: bool,
    pub mix_open: bool,
    pub title: String,
    /// O2 and He in percent, the mix's name and why it cannot be used (mix picker only).
    pub mix: Option<(i32, i32, String, String)>,
}

pub fn picker(s: &Session) -> PickerVm {
    PickerVm {
        cylinders_open: matches!(s.picker, Picker::Cylinders { .. }),
        stage_mode: matches!(s.picker, Picker::Cylinders { stage: true, .. }),
        mix_open: matches!(s.picker, Picker::Mix { .. }),
        title: picker_title(s),
        mix: match (s.picker, s.picker.mix()) {
            (Picker::Mix { o2, he, .. }, Some(mix)) => {
                Some((o2, he, mix.label(), s.picker.mix_reason()))
            }
            _ => None,
        },
    }
}

pub fn picker_title(s: &Session) -> String {
    let name = |i: usize| {
        s.team
            .input()
            .divers
            .get(i)
            .map(|d| d.name.clone())
            .unwrap_or_default()
    };
    match s.picker {
        Picker::Cylinders {
            diver,
            stage: false,
        } => format!("Cylinders for {}", name(diver)),
        Picker::Cylinders { diver, stage: true } => format!("Stage for {}", name(diver)),
        Picker::Mix {
            diver,
            stage: false,
            ..
        } => format!("Gas for {}", name(diver)),
        Picker::Mix {
            diver, stage: true, ..
        } => format!("Stage gas for {}", name(diver)),
        Picker::None => String::new(),
    }
}
