//! Wet-notes charts: for a pair of divers, the turn pressure of one for a range of
//! start pressures of both, so a changed fill can be re-matched without a phone.
//!
//! With more than one teammate a diver reads the chart against each teammate and keeps
//! the HIGHEST turn: the team allowance is the smallest of all, and a smaller allowance
//! only raises a turn pressure.

use super::error::InputError;
use super::matching::{plan_team, round_down_to_step};
use super::team::TeamInput;

/// One chart: `turns[r][c]` is `me`'s shown turn when `me` starts at `my_starts[r]` and
/// the buddy at `buddy_starts[c]` (all in the team's unit). `None` where a start does
/// not fit the cylinders.
#[derive(Clone, Debug, PartialEq)]
pub struct PairChart {
    pub me: usize,
    pub buddy: usize,
    pub my_starts: Vec<f64>,
    pub buddy_starts: Vec<f64>,
    pub turns: Vec<Vec<Option<f64>>>,
}

/// Start pressures around a planned start: `above` gauge steps over it (rounded down to
/// the step) and `below` steps under it, highest first, all above zero.
pub fn starts_around(start_value: f64, step: f64, above: usize, below: usize) -> Vec<f64> {
    let base = round_down_to_step(start_value, step);
    (0..=above + below)
        .map(|k| base + step * above as f64 - step * k as f64)
        .filter(|v| *v > 0.0)
        .collect()
}

/// The chart of diver `me` against diver `buddy`, both with their own cylinders and
/// gases and the team's rule, step and water temperature. Stages are left out.
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
            "a chart needs two different divers of the team",
        ));
    }
    let u = team.units;
    let mut pair = team.clone();
    pair.divers = vec![team.divers[me].clone(), team.divers[buddy].clone()];
    for d in &mut pair.divers {
        d.stage = None;
    }
    let turns = my_starts
        .iter()
        .map(|&mine| {
            buddy_starts
                .iter()
                .map(|&theirs| {
                    let mut t = pair.clone();
                    t.divers[0].start = u.pressure(mine);
                    t.divers[1].start = u.pressure(theirs);
                    plan_team(&t).ok().map(|p| p.divers[0].turn_shown_value)
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
    })
}

/// Charts of every diver against every teammate, centred on the planned starts.
pub fn team_charts(
    team: &TeamInput,
    above: usize,
    below: usize,
) -> Result<Vec<PairChart>, InputError> {
    let u = team.units;
    let starts: Vec<Vec<f64>> = team
        .divers
        .iter()
        .map(|d| starts_around(u.pressure_value(d.start), team.gauge_step, above, below))
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
            starts_around(218.0, 10.0, 1, 2),
            vec![220.0, 210.0, 200.0, 190.0]
        );
        assert_eq!(starts_around(15.0, 10.0, 0, 3), vec![10.0]);
    }
}
