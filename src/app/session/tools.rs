//! The fill-to-water check and the pairing chart selection, each with its own
//! methods, and the session actions that use them.

use crate::i18n::tr_with;
use crate::plan::{PairChart, pair_chart, starts_around};
use crate::plan::{Pressure, TeamInput, Temperature, UnitSystem};
use crate::plan::{TemperatureChange, pressure_after_temperature_change};

use super::Session;
use crate::plan::shown::whole_down;

/// The fill-to-water check: a fill pressure and the temperature at the fill station,
/// for one diver's gas.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FillCheck {
    pub diver: usize,
    pub pressure: Pressure,
    pub temperature: Temperature,
}

impl FillCheck {
    /// The first diver's set at its working pressure, filled 15 degrees above the water.
    pub fn for_team(input: &TeamInput) -> Self {
        FillCheck {
            diver: 0,
            pressure: input.divers[0].cylinders.working_pressure(),
            temperature: Temperature::from_celsius(input.water_temp.celsius() + 15.0),
        }
    }

    /// The diver checked, within a team of `n`.
    pub fn diver(&self, n: usize) -> usize {
        self.diver.min(n - 1)
    }

    /// After a diver left the team of now `n`.
    pub fn keep_within(&mut self, n: usize) {
        self.diver = self.diver(n);
    }

    /// The next (`dir` > 0) or previous diver of a team of `n`, round the team.
    pub fn cycle(&mut self, n: usize, dir: i32) {
        self.diver = ((self.diver as i32 + dir).rem_euclid(n as i32)) as usize;
    }

    /// One degree warmer or cooler, in the team's unit, kept within −20 to 60 °C.
    pub fn nudge_temperature(&mut self, u: UnitSystem, dir: i32) {
        let v = u.temperature_value(self.temperature).round() + f64::from(dir.signum());
        let t = u.temperature(v);
        if (-20.0..=60.0).contains(&t.celsius()) {
            self.temperature = t;
        }
    }

    /// Predicted pressure once the gas has reached the team's water temperature.
    pub fn prediction(&self, input: &TeamInput) -> TemperatureChange {
        pressure_after_temperature_change(
            input.divers[self.diver(input.divers.len())].mix,
            self.pressure,
            self.temperature,
            input.water_temp,
        )
    }

    /// The predicted real-gas pressure as a start: rounded down to a whole unit.
    /// The prediction rounded down to a whole number on the diver's own gauge.
    pub fn usable_start(&self, input: &TeamInput) -> Pressure {
        let g = input.gauge_of(self.diver(input.divers.len()));
        g.pressure(whole_down(g.value(self.prediction(input).real)))
    }
}

/// The pairing chart shown: one diver against one teammate, always two different
/// divers of the team.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct ChartPair {
    me: usize,
    other: usize,
}

impl Default for ChartPair {
    fn default() -> Self {
        ChartPair { me: 0, other: 1 }
    }
}

impl ChartPair {
    /// (diver, teammate) within a team of `n`, or None when they coincide.
    pub fn pair(&self, n: usize) -> Option<(usize, usize)> {
        let (me, other) = (self.me.min(n - 1), self.other.min(n - 1));
        (me != other).then_some((me, other))
    }

    /// Step the diver (`teammate` false) or the teammate through a team of `n`,
    /// skipping the other one.
    pub fn cycle(&mut self, n: usize, teammate: bool, dir: i32) {
        let (mut me, mut other) = (self.me.min(n - 1), self.other.min(n - 1));
        let step = |x: usize| ((x as i32 + dir).rem_euclid(n as i32)) as usize;
        if teammate {
            other = step(other);
            if other == me {
                other = step(other);
            }
        } else {
            me = step(me);
            if me == other {
                other = step(other);
                if other == me {
                    other = step(other);
                }
            }
        }
        *self = ChartPair { me, other };
    }

    /// The chart of the pair around their planned starts: rows from two graduations
    /// above the diver's start to seven below, columns from one above the teammate's to
    /// three below (two when their gauge reads four digits), so it fits a phone's width.
    pub fn chart(&self, input: &TeamInput) -> Option<PairChart> {
        let (me, other) = self.pair(input.divers.len())?;
        let g = |i: usize| input.gauge_of(i);
        let start = |i: usize| g(i).value(input.divers[i].start);
        let (above, below) = CHART_ROWS;
        let rows = starts_around(start(me), g(me).step, above, below);
        let (above, below) = chart_columns(start(other));
        let columns = starts_around(start(other), g(other).step, above, below);
        pair_chart(input, me, other, &rows, &columns).ok()
    }
}

/// Graduations above and below the diver's start shown as rows of the app's chart.
pub const CHART_ROWS: (usize, usize) = (2, 7);

/// Graduations above and below the teammate's start shown as columns of the app's chart:
/// fewer for a four-digit gauge (psi), so the columns fit a 360 px phone.
pub fn chart_columns(teammate_start: f64) -> (usize, usize) {
    if teammate_start >= 1000.0 {
        (1, 2)
    } else {
        (1, 3)
    }
}

impl Session {
    /// Plan with the predicted in-water pressure (rounded down) as the diver's start,
    /// marked as a prediction until the gauge is read in the water.
    pub fn fill_use_as_start(&mut self) {
        let d = self.fill.diver(self.team.len());
        let start = self.fill.usable_start(self.team.input());
        let r = self.team.set_start(d, start);
        if r.is_ok() {
            self.team.mark_predicted(d, self.now);
            let name = self.team.input().divers[d].name.clone();
            let g = self.team.input().gauge_of(d);
            self.status.push(tr_with(
                "The start of {0} is now the prediction, {1} {2}, marked \"predicted\" until the gauge is read in the water.",
                &[&name, &crate::plan::shown::num(g.value(start)), &g.label()],
            ));
        }
        self.team_result(r);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_chart_pair_is_always_two_divers() {
        let mut c = ChartPair::default();
        c.cycle(3, true, 1);
        assert_eq!(c.pair(3), Some((0, 2)));
        c.cycle(3, false, 1);
        c.cycle(3, false, 1);
        assert_eq!(c.pair(3), Some((2, 0)), "the teammate moves on");
        c.cycle(2, true, -1);
        assert_eq!(c.pair(2), Some((1, 0)));
    }

    #[test]
    fn the_fill_check_cycles_round_the_team_and_keeps_its_range() {
        let input = crate::formats::team_file::TeamFile::parse(super::super::DEMO_TEAM)
            .unwrap()
            .to_input()
            .unwrap();
        let mut f = FillCheck::for_team(&input);
        f.cycle(3, -1);
        assert_eq!(f.diver, 2);
        f.keep_within(2);
        assert_eq!(f.diver, 1);
        f.temperature = Temperature::from_celsius(60.0);
        f.nudge_temperature(UnitSystem::Metric, 1);
        assert_eq!(f.temperature.celsius(), 60.0);
        let start = f.usable_start(&input);
        assert!(
            start.bar() < f.pressure.bar(),
            "a warm fill reads lower in the water"
        );
        assert_eq!(start.bar().fract(), 0.0);
    }
}
