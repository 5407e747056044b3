//! FillAdapter: fill-to-water temperature prediction.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::{AppWindow, FillAdapter};
use super::{Shared, act, handles};
use crate::plan::error::fmt_num;

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<FillAdapter>();
    let (w, st) = handles(ui, s);
    a.on_cycle_diver(move |d| act(&w, &st, |x| x.fill_cycle(d)));
    let (w, st) = handles(ui, s);
    a.on_edit_pressure(move || act(&w, &st, |x| x.open_entry(EntryTarget::FillPressure)));
    let (w, st) = handles(ui, s);
    a.on_edit_temp(move || act(&w, &st, |x| x.open_entry(EntryTarget::FillTemp)));
    let (w, st) = handles(ui, s);
    a.on_nudge_temp(move |d| act(&w, &st, |x| x.nudge_fill_temp(d)));
    let (w, st) = handles(ui, s);
    a.on_edit_water(move || act(&w, &st, |x| x.open_entry(EntryTarget::WaterTemp)));
    let (w, st) = handles(ui, s);
    a.on_use_as_start(move || act(&w, &st, |x| x.fill_use_as_start()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<FillAdapter>();
    let u = s.units();
    let input = s.team.input();
    let d = &input.divers[s.fill.diver.min(input.divers.len() - 1)];
    let pu = u.pressure_label();
    let tu = u.temperature_label();
    let change = s.fill_prediction();
    let real = (u.pressure_value(change.real) + 1e-6).floor();
    let ideal = (u.pressure_value(change.ideal) + 1e-6).floor();
    let fill = u.pressure_value(s.fill.pressure);
    let dt = u.temperature_value(s.fill.temperature) - u.temperature_value(input.water_temp);
    a.set_diver(d.name.clone().into());
    a.set_mix(d.mix.label().into());
    a.set_fill_pressure(format!("{} {pu}", fmt_num(fill.floor())).into());
    a.set_fill_temp(
        format!(
            "{} {tu}",
            fmt_num(u.temperature_value(s.fill.temperature).round())
        )
        .into(),
    );
    a.set_water_temp(
        format!(
            "{} {tu}",
            fmt_num(u.temperature_value(input.water_temp).round())
        )
        .into(),
    );
    a.set_result(fmt_num(real).into());
    a.set_unit(pu.into());
    a.set_detail(
        if dt.abs() < 0.5 {
            "Filled at water temperature: no change expected.".to_string()
        } else {
            format!(
                "Real gas: {} {pu} per {} of temperature change; the ideal gas law would say {} {pu}.",
                fmt_num(((fill - real) / dt * 10.0).round() / 10.0),
                tu,
                fmt_num(ideal)
            )
        }
        .into(),
    );
    a.set_use_text(format!("Use {} {pu} as {}'s start", fmt_num(real), d.name).into());
}
