//! SettingsAdapter and CautionsAdapter.

use slint::ComponentHandle;

use super::super::cautions::CAUTIONS;
use super::super::session::{EntryTarget, Session};
use super::super::view_models as vm;
use super::super::{AppWindow, CautionsAdapter, SettingsAdapter};
use super::{Shared, act, handles, strings};
use crate::plan::{Rule, UnitSystem};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<SettingsAdapter>();
    let (w, st) = handles(ui, s);
    a.on_set_imperial(move |imp| {
        act(&w, &st, |x| {
            x.set_units(if imp {
                UnitSystem::Imperial
            } else {
                UnitSystem::Metric
            })
        })
    });
    let (w, st) = handles(ui, s);
    a.on_set_rule(move |i| act(&w, &st, |x| x.set_default_rule(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_set_step(move |i| act(&w, &st, |x| x.set_default_step(i as usize)));
    let (w, st) = handles(ui, s);
    a.on_nudge_temp(move |d| act(&w, &st, |x| x.nudge_water_temp(d)));
    let (w, st) = handles(ui, s);
    a.on_edit_temp(move || act(&w, &st, |x| x.open_entry(EntryTarget::WaterTemp)));
    let (w, st) = handles(ui, s);
    ui.global::<CautionsAdapter>()
        .on_acknowledge(move || act(&w, &st, |x| x.acknowledge_cautions()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<SettingsAdapter>();
    let cfg = &s.settings;
    a.set_imperial(cfg.units == UnitSystem::Imperial);
    a.set_rule_index(Rule::ALL.iter().position(|r| *r == cfg.rule).unwrap_or(1) as i32);
    a.set_step_options(strings(vm::step_labels(cfg.units)));
    a.set_step_index(vm::step_index(cfg.units, cfg.gauge_step()));
    a.set_water_temp(vm::water_temp_text(s).into());
    let cautions: Vec<String> = CAUTIONS.iter().map(|c| c.to_string()).collect();
    a.set_cautions(strings(cautions.clone()));
    a.set_about(
        format!(
            "Turnsheet {} · free software under the GNU GPL, version 3 or later · built with Slint {} (used under its GPL-3.0 licence) · real-gas contents by GERG-2008 (the aga8 crate) · Roboto fonts under the Apache License 2.0 · data in {}",
            env!("CARGO_PKG_VERSION"),
            "1.18.1",
            s.store.dir().display()
        )
        .into(),
    );
    ui.global::<CautionsAdapter>()
        .set_cautions(strings(cautions));
}
