//! FillAdapter: fill-to-water temperature prediction.

use slint::ComponentHandle;

use super::super::session::{EntryTarget, Session};
use super::super::ui::{AppWindow, FillAdapter};
use super::super::view_models as vm;
use super::{Shared, act, handles};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<FillAdapter>();
    let (w, st) = handles(ui, s);
    a.on_cycle_diver(move |d| act(&w, &st, |x| x.fill.cycle(x.team.len(), d)));
    let (w, st) = handles(ui, s);
    a.on_edit_pressure(move || act(&w, &st, |x| x.open_entry(EntryTarget::FillPressure)));
    let (w, st) = handles(ui, s);
    a.on_edit_temp(move || act(&w, &st, |x| x.open_entry(EntryTarget::FillTemp)));
    let (w, st) = handles(ui, s);
    a.on_nudge_temp(move |d| act(&w, &st, |x| x.fill.nudge_temperature(x.units(), d)));
    let (w, st) = handles(ui, s);
    a.on_edit_water(move || act(&w, &st, |x| x.open_entry(EntryTarget::WaterTemp)));
    let (w, st) = handles(ui, s);
    a.on_use_as_start(move || act(&w, &st, |x| x.fill_use_as_start()));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let a = ui.global::<FillAdapter>();
    let f = vm::fill(s);
    a.set_diver(f.diver.into());
    a.set_mix(f.mix.into());
    a.set_fill_pressure(f.fill_pressure.into());
    a.set_fill_temp(f.fill_temp.into());
    a.set_water_temp(f.water_temp.into());
    a.set_result(f.result.into());
    a.set_unit(f.unit.into());
    a.set_detail(vm::keep_units_together(&f.detail).into());
    a.set_use_text(vm::keep_units_together(&f.use_text).into());
    a.set_warning(vm::keep_units_together(&f.warning).into());
}
