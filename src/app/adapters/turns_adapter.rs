//! TurnsAdapter and BuddyAdapter: the plan, shown.

use slint::ComponentHandle;

use super::super::session::Session;
use super::super::ui::{AppWindow, BuddyAdapter, BuddyRow, TurnRow, TurnsAdapter};
use super::super::view_models as vm;
use super::{Shared, act, handles, model, strings};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let (w, st) = handles(ui, s);
    ui.global::<TurnsAdapter>().on_save_card(move || {
        act(&w, &st, |x| {
            x.save_card();
        })
    });
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    let rows = vm::turn_rows(s);
    let a = ui.global::<TurnsAdapter>();
    a.set_rows(model(
        rows.iter()
            .map(|r| TurnRow {
                name: r.name.clone().into(),
                turn: r.turn.clone().into(),
                unit: r.unit.clone().into(),
                read: vm::keep_units_together(&r.read).into(),
                how: vm::keep_units_together(&r.how).into(),
                sums: vm::keep_units_together(&r.sums).into(),
                detail: vm::keep_units_together(&r.detail).into(),
                minutes: vm::keep_units_together(&r.minutes).into(),
                controlling: r.controlling,
                predicted: r.predicted,
                stage: vm::keep_units_together(&r.stage).into(),
            })
            .collect(),
    ));
    a.set_rule_text(vm::keep_units_together(&vm::rule_text(s)).into());
    a.set_margin_text(vm::keep_units_together(&vm::margin_text(s)).into());
    a.set_warnings(strings(
        vm::warnings(s)
            .iter()
            .map(|w| vm::keep_units_together(w))
            .collect(),
    ));
    a.set_first_text(vm::keep_units_together(&vm::first_text(s)).into());
    let blocking = vm::starts_blocking(s).unwrap_or_default();
    a.set_error(blocking.clone().into());
    let b = ui.global::<BuddyAdapter>();
    b.set_unit(vm::pressure_unit(s).into());
    b.set_heading(vm::keep_units_together(&vm::buddy_heading(s)).into());
    b.set_note(blocking.into());
    b.set_rows(model(
        rows.iter()
            .map(|r| BuddyRow {
                name: r.name.clone().into(),
                turn: r.turn.clone().into(),
                unit: r.unit.clone().into(),
                controlling: r.controlling,
                stage: vm::keep_units_together(&r.stage_short).into(),
                read: vm::keep_units_together(&r.read_short).into(),
                info: vm::keep_units_together(&r.buddy_info()).into(),
            })
            .collect(),
    ));
}
