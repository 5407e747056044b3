//! ChartAdapter: the wet-notes chart of one diver against one teammate.

use slint::ComponentHandle;

use super::super::nav::Screen;
use super::super::session::Session;
use super::super::{AppWindow, ChartAdapter, ChartRow};
use super::{Shared, act, handles, model, strings};
use crate::plan::error::fmt_num;

pub fn connect(ui: &AppWindow, s: &Shared) {
    let a = ui.global::<ChartAdapter>();
    let (w, st) = handles(ui, s);
    a.on_cycle(move |teammate, dir| act(&w, &st, |x| x.chart_cycle(teammate, dir)));
}

pub fn refresh(ui: &AppWindow, s: &Session) {
    // The chart costs a hundred plans: only build it while it is on screen.
    if s.nav.current() != Screen::Chart {
        return;
    }
    let a = ui.global::<ChartAdapter>();
    let Some(chart) = s.current_chart() else {
        return;
    };
    let input = s.team.input();
    let u = input.units;
    // Conservative reading: own start rounded UP to a row, the teammate's DOWN to a column
    // (a higher own start or a lower teammate start never lowers the turn).
    let mine = u.pressure_value(input.divers[chart.me].start);
    let theirs = u.pressure_value(input.divers[chart.buddy].start);
    let my_row = chart.my_starts.iter().rposition(|x| *x >= mine - 1e-9);
    let their_col = chart.buddy_starts.iter().position(|x| *x <= theirs + 1e-9);
    a.set_diver(input.divers[chart.me].name.clone().into());
    a.set_teammate(input.divers[chart.buddy].name.clone().into());
    a.set_unit(u.pressure_label().into());
    a.set_columns(strings(
        chart.buddy_starts.iter().map(|v| fmt_num(*v)).collect(),
    ));
    a.set_planned_column(their_col.map(|c| c as i32).unwrap_or(-1));
    a.set_rows(model(
        chart
            .my_starts
            .iter()
            .enumerate()
            .map(|(r, v)| ChartRow {
                start: fmt_num(*v).into(),
                cells: strings(
                    chart.turns[r]
                        .iter()
                        .map(|c| c.map(fmt_num).unwrap_or_else(|| "–".into()))
                        .collect(),
                ),
                planned: Some(r) == my_row,
            })
            .collect(),
    ));
    a.set_note(
        if input.divers.len() > 2 {
            "With more than one teammate, read your chart against each and keep the HIGHEST turn. Between rows, read the higher start; between columns, the lower teammate start."
        } else {
            "Between two rows, read the higher start; between two columns, the lower teammate start."
        }
        .into(),
    );
}
