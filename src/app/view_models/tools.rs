//! The fill-to-water check and the pairing chart.

use super::super::session::Session;
use super::{pressure_down_text, temperature_text};
use crate::i18n::{tr, tr_with};
use crate::plan::Warning;
use crate::plan::shown;
use crate::plan::shown::whole_down;

pub struct FillVm {
    pub diver: String,
    pub mix: String,
    pub fill_pressure: String,
    pub fill_temp: String,
    pub water_temp: String,
    /// The predicted in-water pressure, rounded down (the start "Use as start" sets).
    pub result: String,
    pub unit: String,
    pub detail: String,
    pub use_text: String,
    /// The core's warnings about the predicted start in this diver's set (an overfill);
    /// empty when there are none.
    pub warning: String,
}

pub fn fill(s: &Session) -> FillVm {
    let u = s.units();
    let input = s.team.input();
    let i = s.fill.diver(input.divers.len());
    let d = &input.divers[i];
    // The prediction on the diver's own gauge, as "Plan with" sets it.
    let g = input.gauge_of(i);
    let pu = g.label();
    let tu = u.temperature_label();
    let change = s.fill.prediction(input);
    let real = whole_down(g.value(change.real));
    let ideal = whole_down(g.value(change.ideal));
    let fill = g.value(s.fill.pressure);
    let dt = u.temperature_value(s.fill.temperature) - u.temperature_value(input.water_temp);
    FillVm {
        diver: d.name.clone(),
        mix: d.mix.label(),
        fill_pressure: pressure_down_text(u, s.fill.pressure),
        fill_temp: temperature_text(u, s.fill.temperature),
        water_temp: temperature_text(u, input.water_temp),
        result: shown::num(real),
        unit: pu.to_string(),
        detail: if dt.abs() < 0.5 {
            tr("Filled at water temperature: no change expected.")
        } else {
            tr_with(
                "Real gas: {0} {1} per {2} of temperature change; the ideal gas law would say {3} {1}.",
                &[
                    &shown::num(((fill - real) / dt * 10.0).round() / 10.0),
                    &pu,
                    &tu,
                    &shown::num(ideal),
                ],
            )
        },
        use_text: tr_with(
            "Plan with {0} {1} for {2} until the gauge is read in the water",
            &[&shown::num(real), &pu, &d.name],
        ),
        warning: {
            // The team as it would be with the prediction as this diver's start: the
            // same warnings the Team and Turns pages, the card and the CLI give.
            let mut team = input.clone();
            team.divers[i].start = s.fill.usable_start(input);
            team.warnings()
                .iter()
                .filter(|w| w.diver() == Some(i) && is_main_fill(w))
                .map(|w| w.detail())
                .collect::<Vec<_>>()
                .join(" ")
        },
    }
}

/// A warning about a main start against its set's working pressure.
fn is_main_fill(w: &Warning) -> bool {
    use crate::plan::Supply::Main;
    matches!(
        w,
        Warning::AboveWorking { supply: Main, .. }
            | Warning::Overfill { supply: Main, .. }
            | Warning::LowFill { supply: Main, .. }
    )
}

pub struct ChartRowVm {
    pub start: String,
    pub cells: Vec<String>,
    /// The row of the diver's planned start.
    pub planned: bool,
}

pub struct ChartVm {
    pub diver: String,
    pub teammate: String,
    /// The unit of the rows and cells (my gauge).
    pub unit: String,
    /// The unit of the columns (the teammate's gauge).
    pub column_unit: String,
    pub columns: Vec<String>,
    /// The column of the teammate's planned start, or −1.
    pub planned_column: i32,
    pub rows: Vec<ChartRowVm>,
    pub note: String,
}

/// The chart of the selected pair (about a hundred plans: build it only when shown).
pub fn chart(s: &Session) -> Option<ChartVm> {
    let input = s.team.input();
    let chart = s.chart.chart(input)?;
    // Rows and cells on my gauge, columns on the teammate's, each in its own unit.
    // Conservative reading: own start rounded UP to a row, the teammate's DOWN to a column
    // (a higher own start or a lower teammate start never lowers the turn).
    // The planned starts are boxed only where they are readings of this dive, as the
    // Turns page shows turns only from them.
    let now = s.now();
    let usable = |i: usize| s.team.start_status(i, now).usable();
    let mine = chart.my_gauge.value(input.divers[chart.me].start);
    let theirs = chart.buddy_gauge.value(input.divers[chart.buddy].start);
    let my_row = chart
        .my_starts
        .iter()
        .rposition(|x| *x >= mine - 1e-9)
        .filter(|_| usable(chart.me));
    let their_col = chart
        .buddy_starts
        .iter()
        .position(|x| *x <= theirs + 1e-9)
        .filter(|_| usable(chart.buddy));
    let unread: Vec<&str> = [chart.me, chart.buddy]
        .iter()
        .filter(|&&i| !usable(i))
        .map(|&i| input.divers[i].name.as_str())
        .collect();
    let how_to_read = if input.divers.len() > 2 {
        tr(
            "With more than one teammate, read your chart against each and keep the HIGHEST turn. Between rows, read the higher start; between columns, the lower teammate start.",
        )
    } else {
        tr(
            "Between two rows, read the higher start; between two columns, the lower teammate start.",
        )
    };
    let note = if unread.is_empty() {
        how_to_read
    } else {
        let why = tr_with(
            "No planned start is boxed: the start of {0} is not a reading of this dive (read it in the water; a reading counts for three hours).",
            &[&super::and_list(&unread)],
        );
        format!("{why} {how_to_read}")
    };
    Some(ChartVm {
        diver: input.divers[chart.me].name.clone(),
        teammate: input.divers[chart.buddy].name.clone(),
        unit: chart.my_gauge.label().to_string(),
        column_unit: chart.buddy_gauge.label().to_string(),
        columns: chart.buddy_starts.iter().map(|v| shown::num(*v)).collect(),
        planned_column: their_col.map(|c| c as i32).unwrap_or(-1),
        rows: chart
            .my_starts
            .iter()
            .enumerate()
            .map(|(r, v)| ChartRowVm {
                start: shown::num(*v),
                cells: chart.turns[r]
                    .iter()
                    .map(|c| c.map(shown::turn).unwrap_or_else(|| "–".into()))
                    .collect(),
                planned: Some(r) == my_row,
            })
            .collect(),
        note,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    #[test]
    fn the_fill_result_shown_is_the_start_used() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        let shown = fill(&s);
        s.fill_use_as_start();
        let start = s.team.input().divers[0].start;
        assert_eq!(shown.result, super::super::start_text(s.units(), start));
        assert_eq!(shown.unit, "bar");
    }

    #[test]
    fn the_chart_marks_the_planned_starts_only_once_read() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        // The demo's starts were read by nobody: nothing boxed, and the note says whose.
        let c = chart(&s).unwrap();
        assert_eq!(c.rows.iter().filter(|r| r.planned).count(), 0);
        assert_eq!(c.planned_column, -1);
        assert!(c.note.contains("Ines and Bram"), "{}", c.note);
        s.confirm_start(0);
        let c = chart(&s).unwrap();
        assert_eq!(c.rows.iter().filter(|r| r.planned).count(), 1);
        assert_eq!(c.planned_column, -1, "Bram is still unread");
        assert!(
            c.note
                .starts_with("No planned start is boxed: the start of Bram ")
        );
        s.confirm_start(1);
        let c = chart(&s).unwrap();
        assert!(!c.note.contains("boxed"), "{}", c.note);
        assert!(c.planned_column >= 0);
        assert_eq!(c.rows[0].cells.len(), c.columns.len());
    }

    #[test]
    fn a_chart_across_bar_and_psi_boxes_both_planned_starts_in_their_units() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        // Bram (the teammate of Ines's chart) reads psi; both read their gauges.
        s.set_gauge(1, crate::app::session::GAUGES[2]);
        s.confirm_start(0);
        s.confirm_start(1);
        let c = chart(&s).unwrap();
        assert_eq!((c.unit.as_str(), c.column_unit.as_str()), ("bar", "psi"));
        let bram = s
            .team
            .input()
            .gauge_of(1)
            .value(s.team.input().divers[1].start);
        let col = c.planned_column;
        assert!(col >= 0, "Bram's planned column is boxed");
        let v: f64 = c.columns[col as usize].parse().unwrap();
        assert!(v <= bram + 1e-9, "the column read is at or below his start");
        // Bram's own chart: rows in psi, the boxed row at or above his start.
        s.chart.cycle(3, false, 1);
        let c = chart(&s).unwrap();
        assert_eq!((c.unit.as_str(), c.column_unit.as_str()), ("psi", "bar"));
        let row = c.rows.iter().position(|r| r.planned).unwrap();
        let v: f64 = c.rows[row].start.parse().unwrap();
        assert!(
            v >= bram - 1e-9 && v - bram < 100.0,
            "{v} for a start of {bram}"
        );
    }
}
