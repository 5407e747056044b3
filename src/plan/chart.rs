//! Pairing charts: for a pair of divers, the turn pressure of one for a range of
//! start pressures of both, so a changed fill can be re-matched without a phone.
//!
//! With more than one teammate a diver reads the chart against each teammate and keeps
//! the HIGHEST turn: the team allowance is the smallest of all, and a smaller allowance
//! only raises a turn pressure.

use super::error::InputError;
use super::gauge::Gauge;
use super::rounding::round_down_to_step;
use super::supply::SupplyModels;
use super::team::{DiverInput, TeamInput};
use super::team_checks::validate_start;
use super::units::{Pressure, Volume};

/// One chart: `turns[r][c]` is `me`'s shown turn when `me` starts at `my_starts[r]` and
/// the buddy at `buddy_starts[c]`. My starts and turns are on my gauge (`my_gauge`), the
/// buddy's starts on theirs (`buddy_gauge`). `None` where a start does not fit the
/// cylinders.
#[derive(Clone, Debug, PartialEq)]
pub struct PairChart {
    /// Index of the diver the chart is for.
    pub me: usize,
    /// Index of the teammate it is read against.
    pub buddy: usize,
    /// Row headings: `me`'s start pressures on `my_gauge`, as asked for.
    pub my_starts: Vec<f64>,
    /// Column headings: the buddy's start pressures on `buddy_gauge`, as asked for.
    pub buddy_starts: Vec<f64>,
    /// One row per entry of `my_starts`, one cell per entry of `buddy_starts`: `me`'s
    /// shown turn on `my_gauge`, or `None` where either start would be refused.
    pub turns: Vec<Vec<Option<f64>>>,
    /// The gauge `me` reads: rows and cells are in its unit.
    pub my_gauge: Gauge,
    /// The gauge the buddy reads: columns are in its unit.
    pub buddy_gauge: Gauge,
}

/// Start pressures around a planned start: `above` gauge steps over it (rounded down to
/// the step) and `below` steps under it, highest first, all above zero. A planned start
/// off the step is a row (or column) of its own, so the planned pairing is in the chart.
pub fn starts_around(start_value: f64, step: f64, above: usize, below: usize) -> Vec<f64> {
    let base = round_down_to_step(start_value, step);
    let mut starts: Vec<f64> = (0..=above + below)
        .map(|k| base + step * above as f64 - step * k as f64)
        .filter(|v| *v > 0.0)
        .collect();
    if start_value > 0.0 && !starts.iter().any(|v| (v - start_value).abs() < 1e-9) {
        let at = starts
            .iter()
            .position(|v| *v < start_value)
            .unwrap_or(starts.len());
        starts.insert(at, start_value);
    }
    starts
}

/// The chart of diver `me` against diver `buddy`, both with their own cylinders, gases
/// and gauges, and the team's rule and water temperature. Stages are left out.
///
/// Each row's and column's contents are computed once; a cell is then the same
/// matching as `plan_team` of that pair (the smaller allowance governs), through the same
/// `SupplyModels::turn`, so the chart cannot disagree with the plan.
pub fn pair_chart(
    team: &TeamInput,
    me: usize,
    buddy: usize,
    my_starts: &[f64],
    buddy_starts: &[f64],
) -> Result<PairChart, InputError> {
    team.validate()?;
    if me == buddy || me >= team.divers.len() || buddy >= team.divers.len() {
        return Err(InputError::new(
            "divers",
            crate::i18n::tr("a chart needs two different divers of the team"),
        ));
    }
    let (my_gauge, buddy_gauge) = (team.gauge_of(me), team.gauge_of(buddy));
    let (mine_d, buddy_d) = (&team.divers[me], &team.divers[buddy]);
    let my_models = SupplyModels::new(&mine_d.cylinders, mine_d.mix, team.water_temp, my_gauge);
    let buddy_models = SupplyModels::new(
        &buddy_d.cylinders,
        buddy_d.mix,
        team.water_temp,
        buddy_gauge,
    );
    // A start that the plan would refuse gives no row or column.
    let usable = |g: Gauge, v: f64, d: &DiverInput| {
        let p = g.pressure(v);
        validate_start(g, "start", p, d.cylinders.working_pressure())
            .ok()
            .map(|_| p)
    };
    let rows: Vec<Option<(Pressure, (Volume, Volume))>> = my_starts
        .iter()
        .map(|&v| usable(my_gauge, v, mine_d).map(|p| (p, my_models.contents(p))))
        .collect();
    let cols: Vec<Option<(Volume, Volume)>> = buddy_starts
        .iter()
        .map(|&v| usable(buddy_gauge, v, buddy_d).map(|p| buddy_models.contents(p)))
        .collect();
    let f = team.rule.fraction();
    let turns = rows
        .iter()
        .map(|row| {
            cols.iter()
                .map(|col| {
                    let ((start, mine), theirs) = ((*row)?, (*col)?);
                    let allowance = (
                        smaller(mine.0, theirs.0).scaled(f),
                        smaller(mine.1, theirs.1).scaled(f),
                    );
                    Some(my_models.turn(start, mine, allowance).shown_value)
                })
                .collect()
        })
        .collect();
    Ok(PairChart {
        me,
        buddy,
        my_starts: my_starts.to_vec(),
        buddy_starts: buddy_starts.to_vec(),
        turns,
        my_gauge,
        buddy_gauge,
    })
}

fn smaller(a: Volume, b: Volume) -> Volume {
    if b.litres() < a.litres() { b } else { a }
}

/// Charts of every diver against every teammate, centred on the planned starts.
pub fn team_charts(
    team: &TeamInput,
    above: usize,
    below: usize,
) -> Result<Vec<PairChart>, InputError> {
    let starts: Vec<Vec<f64>> = team
        .divers
        .iter()
        .enumerate()
        .map(|(i, d)| {
            let g = team.gauge_of(i);
            starts_around(g.value(d.start), g.step, above, below)
        })
        .collect();
    let mut charts = Vec::new();
    for me in 0..team.divers.len() {
        for buddy in 0..team.divers.len() {
            if me != buddy {
                charts.push(pair_chart(team, me, buddy, &starts[me], &starts[buddy])?);
            }
        }
    }
    Ok(charts)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn starts_are_on_the_step_highest_first() {
        assert_eq!(
            starts_around(220.0, 10.0, 1, 2),
            vec![230.0, 220.0, 210.0, 200.0]
        );
        // A planned start off the step is a row of its own.
        assert_eq!(
            starts_around(218.0, 10.0, 1, 2),
            vec![220.0, 218.0, 210.0, 200.0, 190.0]
        );
        assert_eq!(starts_around(15.0, 10.0, 0, 3), vec![15.0, 10.0]);
    }
}
