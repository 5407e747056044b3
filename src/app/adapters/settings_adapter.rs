//! SettingsAdapter and CautionsAdapter.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::ui::{self, AppWindow, CautionsAdapter, SettingsAdapter, Theme};
use super::super::view_models as vm;
use super::{Shared, act, handles, strings};
use crate::plan::UnitSystem;
use crate::storage::settings::ThemeChoice;

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
    a.on_set_language(move |i| act(&w, &st, |x| x.choose_language(i.max(0) as usize)));
    let (w, st) = handles(ui, s);
    a.on_nudge_temp(move |d| act(&w, &st, |x| x.nudge_default_water_temp(d)));
    let (w, st) = handles(ui, s);
    a.on_edit_temp(move || act(&w, &st, |x| x.open_entry(EntryTarget::DefaultWaterTemp)));
    let (w, st) = handles(ui, s);
    a.on_set_theme(move |i| act(&w, &st, |x| x.set_theme(i as usize)));
    let (w, st) = handles(ui, s);
    ui.global::<CautionsAdapter>()
        .on_acknowledge(move || act(&w, &st, |x| x.acknowledge_cautions()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<SettingsAdapter>();
    let v = vm::settings(s);
    a.set_imperial(v.imperial);
    a.set_rule_options(strings(vm::rule_symbols()));
    a.set_rule_labels(strings(vm::rule_names()));
    a.set_rule_index(v.rule_index);
    a.set_step_options(strings(v.step_options));
    a.set_step_index(v.step_index);
    a.set_water_temp(v.water_temp.into());
    a.set_cautions(strings(vm::cautions()));
    a.set_about(v.about.into());
    a.set_language_options(strings(v.language_options));
    a.set_language_index(v.language_index);
    a.set_theme_index(v.theme_index);
    // Every page's colours follow this one property.
    ui.global::<Theme>().set_choice(match v.theme {
        ThemeChoice::System => ui::ThemeChoice::System,
        ThemeChoice::Dark => ui::ThemeChoice::Dark,
        ThemeChoice::Light => ui::ThemeChoice::Light,
    });
    ui.global::<CautionsAdapter>()
        .set_cautions(strings(vm::cautions()));
}
