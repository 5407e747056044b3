//! The cylinder locker and its editor.

use super::super::session::Session;
use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::{CylinderSpec, Material, ModelKind, Preset, presets};

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
            // A name made from the sizes or a preset's, in the reader's language.
            name: match e.cylinders.to_set("locker") {
                Ok(set) => crate::plan::shown_label(&e.name, &set),
                Err(_) => e.name.clone(),
            },
            detail: format!(
                "{} · {}",
                e.cylinders
                    .to_set("locker")
                    .map(|x| x.describe())
                    .unwrap_or_else(|err| err.to_string()),
                e.material.shown_name()
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
        .map(|n| tr_with("Deleted “{0}”.", &[&n]))
        .unwrap_or_default()
}

pub struct LockerEditVm {
    pub title: String,
    pub name: String,
    /// The name was typed for other sizes; empty otherwise.
    pub name_warning: String,
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
        v.map(|v| format!("{} {unit}", shown::num(v)))
            .unwrap_or_default()
    };
    Some(LockerEditVm {
        title: if d.id.is_some() {
            tr("Edit set")
        } else {
            tr("New set")
        },
        name: d.name.clone(),
        name_warning: d.name_warning().unwrap_or_default(),
        count: i32::from(d.count),
        rated: d.rated,
        first_label: specs[0].0.clone(),
        second_label: specs[1].0.clone(),
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
                tr_with(
                    "{0} · {1} L of water in all",
                    &[&set.describe(), &crate::plan::shown::fixed(w, 1)],
                )
            })
            .unwrap_or_default(),
    })
}

pub fn preset_rows() -> Vec<(String, String)> {
    presets()
        .iter()
        .map(|p| (p.shown_name(), preset_detail(p)))
        .collect()
}

/// A generic size's second line: its material and the figures stamped on each cylinder
/// (litres at bar) or its rating (cu ft at psi, with the water that gives it), which the
/// diver checks against the cylinder in hand.
pub fn preset_detail(p: &Preset) -> String {
    let each = |a: f64, ua: &str, b: f64, ub: &str| {
        tr_with(
            "{0} {1} at {2} {3}",
            &[&shown::num(a), &ua, &shown::num(b), &ub],
        )
    };
    match p.set.spec {
        CylinderSpec::Stamped {
            water_l,
            working_bar,
        } => tr_with(
            "{0} · each {1}",
            &[
                &p.material.shown_name(),
                &each(water_l, "L", working_bar, "bar"),
            ],
        ),
        CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        } => tr_with(
            "{0} · each {1} ({2} L water)",
            &[
                &p.material.shown_name(),
                &each(rated_cuft, "cu ft", rated_psi, "psi"),
                &shown::num(
                    (p.set.spec.water_per_cylinder(ModelKind::Real).litres() * 10.0).round() / 10.0,
                ),
            ],
        ),
    }
}
