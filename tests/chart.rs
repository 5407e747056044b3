//! Pairing charts: every cell is the planning core's answer for that pair of starts,
//! the chart is monotone, and "keep the highest turn over your charts" reproduces the
//! full team plan (the team allowance is the smallest of all; a smaller allowance only
//! raises a turn).

use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::{Mix, plan_team};
use turnsheet::plan::{pair_chart, starts_around, team_charts};

fn demo() -> turnsheet::plan::TeamInput {
    TeamFile::parse(include_str!("../examples/hollowmere-team.json"))
        .unwrap()
        .to_input()
        .unwrap()
}

#[test]
fn cells_are_the_core_plan_of_the_pair() {
    let team = demo();
    let mine = starts_around(220.0, 10.0, 1, 4);
    let theirs = starts_around(205.0, 10.0, 1, 4);
    let chart = pair_chart(&team, 0, 1, &mine, &theirs).unwrap();
    for (r, m) in mine.iter().enumerate() {
        for (c, b) in theirs.iter().enumerate() {
            let mut pair = team.clone();
            pair.divers = vec![team.divers[0].clone(), team.divers[1].clone()];
            pair.divers[0].start = turnsheet::plan::Pressure::from_bar(*m);
            pair.divers[1].start = turnsheet::plan::Pressure::from_bar(*b);
            for d in &mut pair.divers {
                d.stage = None;
            }
            let expected = plan_team(&pair).unwrap().divers[0].turn_shown_value;
            assert_eq!(chart.turns[r][c], Some(expected), "row {m} column {b}");
        }
    }
}

#[test]
fn charts_are_monotone() {
    let mut team = demo();
    team.divers[1].mix = Mix::trimix(0.21, 0.35);
    for chart in team_charts(&team, 2, 7).unwrap() {
        for r in 0..chart.my_starts.len() {
            for c in 1..chart.buddy_starts.len() {
                // Columns go to lower teammate starts: my turn never drops.
                let (a, b) = (chart.turns[r][c - 1].unwrap(), chart.turns[r][c].unwrap());
                assert!(b >= a, "row {r}: {a} then {b}");
            }
        }
        for c in 0..chart.buddy_starts.len() {
            for r in 1..chart.my_starts.len() {
                // Rows go to lower own starts: my turn never rises.
                let (a, b) = (chart.turns[r - 1][c].unwrap(), chart.turns[r][c].unwrap());
                assert!(b <= a, "column {c}: {a} then {b}");
                assert!(b <= chart.my_starts[r]);
            }
        }
    }
}

#[test]
fn highest_turn_over_pair_charts_is_the_team_turn() {
    let mut team = demo();
    // Starts on the gauge step so that they are cells of the charts.
    for (d, s) in team.divers.iter_mut().zip([220.0, 200.0, 280.0]) {
        d.start = turnsheet::plan::Pressure::from_bar(s);
        d.stage = None;
    }
    team.divers[2].mix = Mix::trimix(0.18, 0.45);
    let plan = plan_team(&team).unwrap();
    let charts = team_charts(&team, 2, 2).unwrap();
    for (i, d) in plan.divers.iter().enumerate() {
        let highest = charts
            .iter()
            .filter(|c| c.me == i)
            .map(|c| {
                let r = c
                    .my_starts
                    .iter()
                    .position(|v| *v == team.divers[i].start.bar())
                    .unwrap();
                let col = c
                    .buddy_starts
                    .iter()
                    .position(|v| *v == team.divers[c.buddy].start.bar())
                    .unwrap();
                c.turns[r][col].unwrap()
            })
            .fold(f64::MIN, f64::max);
        assert_eq!(highest, d.turn_shown_value, "{}", d.name);
    }
}

#[test]
fn reading_between_grid_lines_toward_safety_never_gives_a_lower_turn() {
    // Own start between rows → the row above; teammate's start between columns → the
    // column below. The chart cell must be at least the exact plan's turn.
    let team = demo(); // Ines starts at 218 bar, Bram at 205 bar: both between grid lines.
    let charts = team_charts(&team, 2, 7).unwrap();
    for c in charts.iter().filter(|c| c.me == 0 && c.buddy == 1) {
        let mine = team.divers[0].start.bar();
        let theirs = team.divers[1].start.bar();
        let r = c.my_starts.iter().rposition(|x| *x >= mine).unwrap();
        let col = c.buddy_starts.iter().position(|x| *x <= theirs).unwrap();
        let mut pair = team.clone();
        pair.divers.truncate(2);
        for d in &mut pair.divers {
            d.stage = None;
        }
        let exact = plan_team(&pair).unwrap().divers[0].turn_shown_value;
        assert!(c.turns[r][col].unwrap() >= exact);
    }
}

#[test]
fn mixed_gauge_cells_are_the_core_plan_of_the_pair() {
    // Bram reads psi on 50 psi, Ines bar on 5 bar (invented team): rows, columns and
    // cells are each on their own diver's gauge, and every cell is plan_team of that pair.
    use turnsheet::plan::{Gauge, PressureUnit};
    let mut team = demo();
    team.divers[0].gauge = Some(Gauge {
        unit: PressureUnit::Bar,
        step: 5.0,
    });
    team.divers[1].gauge = Some(Gauge {
        unit: PressureUnit::Psi,
        step: 50.0,
    });
    for (me, buddy) in [(0, 1), (1, 0)] {
        let (gm, gb) = (team.gauge_of(me), team.gauge_of(buddy));
        let mine = starts_around(gm.value(team.divers[me].start), gm.step, 3, 30);
        let theirs = starts_around(gb.value(team.divers[buddy].start), gb.step, 3, 30);
        let chart = pair_chart(&team, me, buddy, &mine, &theirs).unwrap();
        assert_eq!((chart.my_gauge, chart.buddy_gauge), (gm, gb));
        let mut some = 0;
        for (r, m) in mine.iter().enumerate() {
            for (c, b) in theirs.iter().enumerate() {
                let mut pair = team.clone();
                pair.divers = vec![team.divers[me].clone(), team.divers[buddy].clone()];
                pair.divers[0].start = gm.pressure(*m);
                pair.divers[1].start = gb.pressure(*b);
                for d in &mut pair.divers {
                    d.stage = None;
                }
                let expected = plan_team(&pair).ok().map(|p| p.divers[0].turn_shown_value);
                assert_eq!(chart.turns[r][c], expected, "{me}: row {m} column {b}");
                if let Some(t) = expected {
                    assert!(t == *m || (t / gm.step - (t / gm.step).round()).abs() < 1e-9);
                    some += 1;
                }
            }
        }
        assert!(some > 100, "{some} cells planned");
    }
}
