//! `turnsheet chart TEAM.json`: pairing charts for every diver against every teammate.

use std::path::Path;

use serde::Serialize;

use crate::plan::InputError;
use crate::plan::shown;
use crate::plan::team_charts;

use super::plan_cmd::{named, read_named_team};

#[derive(Serialize, Debug)]
struct JsonChart {
    diver: String,
    teammate: String,
    /// The diver's gauge unit: rows and cells.
    unit: String,
    /// The teammate's gauge unit: columns.
    teammate_unit: String,
    diver_starts: Vec<f64>,
    teammate_starts: Vec<f64>,
    /// turns[row][column]: the diver's turn for diver_starts[row] and teammate_starts[column].
    turns: Vec<Vec<Option<f64>>>,
}

pub fn run(path: &Path, above: usize, below: usize, json: bool) -> Result<String, InputError> {
    if above + below > 40 {
        return Err(InputError::new(
            "--above/--below",
            "at most 41 rows and columns (above + below ≤ 40)",
        ));
    }
    let (team, labels) = read_named_team(path)?;
    // A chart pairs a diver with a teammate: a team of one (or none) has none to print.
    team.validate().map_err(|e| named(e, &team))?;
    let charts = team_charts(&team, above, below).map_err(|e| named(e, &team))?;
    let name = |i: usize| team.divers[i].name.clone();
    if json {
        let out: Vec<JsonChart> = charts
            .iter()
            .map(|c| JsonChart {
                diver: name(c.me),
                teammate: name(c.buddy),
                unit: c.my_gauge.label().to_string(),
                teammate_unit: c.buddy_gauge.label().to_string(),
                diver_starts: c.my_starts.clone(),
                teammate_starts: c.buddy_starts.clone(),
                turns: c.turns.clone(),
            })
            .collect();
        return Ok(serde_json::to_string_pretty(&out).unwrap_or_default() + "\n");
    }
    Ok(chart_text(&team, &charts, &labels))
}

/// Charts as text, each on its own divers' gauges, each set by its one name.
pub fn chart_text(
    team: &crate::plan::TeamInput,
    charts: &[crate::plan::PairChart],
    labels: &crate::plan::SetLabels,
) -> String {
    let u = team.units;
    let mut s = format!(
        "Pairing charts: rule of {}, water {} {}.\n\
         Each chart gives the first diver's turn for their start (rows) and the teammate's start (columns),\n\
         each on their own gauge. With more than one teammate, keep the HIGHEST turn of your charts.\n\
         Between lines, read the next higher own start and the next lower teammate start.\n",
        team.rule.name(),
        shown::degrees(u.temperature_value(team.water_temp)),
        u.temperature_label()
    );
    let width = charts
        .iter()
        .flat_map(|c| c.buddy_starts.iter().chain(c.my_starts.iter()))
        .map(|v| shown::num(*v).len())
        .max()
        .unwrap_or(3)
        .max(3)
        + 1;
    for c in charts {
        let me = &team.divers[c.me];
        let buddy = &team.divers[c.buddy];
        s.push_str(&format!(
            "\n{} ({}, {}) with {} ({}, {})\n",
            me.name,
            labels.set_name(team, c.me),
            me.mix.label(),
            buddy.name,
            labels.set_name(team, c.buddy),
            buddy.mix.label()
        ));
        let (mu, bu) = (c.my_gauge.label(), c.buddy_gauge.label());
        // No possessive of a name ("Me's start" for the chart of two sets): the start
        // is "read by" a diver, the turn is "for" one.
        s.push_str(&format!(
            "rows: start read by {} ({mu}); columns: start read by {} ({bu}); cells: turn for {} ({mu}, on {} {mu} marks)\n",
            me.name,
            buddy.name,
            me.name,
            shown::num(c.my_gauge.step)
        ));
        s.push_str(&format!("{:>w$} │", format!("{mu}\\{bu}"), w = width + 2));
        for b in &c.buddy_starts {
            s.push_str(&format!("{:>width$}", shown::num(*b)));
        }
        s.push('\n');
        s.push_str(&format!(
            "{}┼{}\n",
            "─".repeat(width + 3),
            "─".repeat(width * c.buddy_starts.len())
        ));
        for (r, mine) in c.my_starts.iter().enumerate() {
            s.push_str(&format!("{:>w$} │", shown::num(*mine), w = width + 2));
            for cell in &c.turns[r] {
                let text = cell.map(shown::turn).unwrap_or_else(|| "-".into());
                s.push_str(&format!("{text:>width$}"));
            }
            s.push('\n');
        }
    }
    s.push_str("\n'-' marks a start that does not fit the cylinders. Check by hand; turn at the first limit.\n");
    s
}
