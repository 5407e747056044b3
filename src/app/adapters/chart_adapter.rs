//! ChartAdapter: the pairing chart of one diver against one teammate.

use slint::ComponentHandle;

use super::super::nav::Screen;
use super::super::session::Session;
use super::super::ui::{AppWindow, ChartAdapter, ChartRow};
use super::super::view_models as vm;
use super::{Shared, act, handles, model, strings};

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<ChartAdapter>();
    let (w, st) = handles(ui, s);
    a.on_cycle(move |teammate, dir| act(&w, &st, |x| x.chart.cycle(x.team.len(), teammate, dir)));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    // The chart costs a hundred plans: only build it while it is on screen.
    if s.page() != Screen::Chart {
        return;
    }
    let Some(c) = vm::chart(s) else {
        return;
    };
    let a = ui.global::<ChartAdapter>();
    a.set_diver(c.diver.into());
    a.set_teammate(c.teammate.into());
    a.set_unit(c.unit.into());
    a.set_column_unit(c.column_unit.into());
    a.set_columns(strings(c.columns));
    a.set_planned_column(c.planned_column);
    a.set_rows(model(
        c.rows
            .into_iter()
            .map(|r| ChartRow {
                start: r.start.into(),
                cells: strings(r.cells),
                planned: r.planned,
            })
            .collect(),
    ));
    a.set_note(c.note.into());
}
