//! Session actions of the fill-to-water check and the wet-notes chart.

use super::Session;

impl Session {
    // ---- fill to water -----------------------------------------------------------

    /// Show the check for the next (`dir` > 0) or previous diver.
    pub fn fill_cycle(&mut self, dir: i32) {
        let n = self.team.len() as i32;
        self.fill.diver = ((self.fill.diver as i32 + dir).rem_euclid(n)) as usize;
    }

    pub fn nudge_fill_temp(&mut self, dir: i32) {
        let u = self.units();
        let v = u.temperature_value(self.fill.temperature).round() + f64::from(dir.signum());
        let t = u.temperature(v);
        if (-20.0..=60.0).contains(&t.celsius()) {
            self.fill.temperature = t;
        }
    }

    /// Predicted pressure once the gas has reached the water temperature.
    pub fn fill_prediction(&self) -> crate::plan::temperature::TemperatureChange {
        let d = self.fill.diver.min(self.team.len() - 1);
        crate::plan::temperature::pressure_after_temperature_change(
            self.team.input().divers[d].mix,
            self.fill.pressure,
            self.fill.temperature,
            self.team.input().water_temp,
        )
    }

    /// Use the predicted in-water pressure (rounded down) as the diver's start.
    pub fn fill_use_as_start(&mut self) {
        let d = self.fill.diver.min(self.team.len() - 1);
        let u = self.units();
        let v = (u.pressure_value(self.fill_prediction().real) + 1e-6).floor();
        let r = self.team.set_start(d, u.pressure(v));
        self.team_result(r);
    }

    // ---- wet-notes chart -----------------------------------------------------------

    /// Step the chart's diver (`teammate` false) or teammate through the team; the two
    /// are always different divers.
    pub fn chart_cycle(&mut self, teammate: bool, dir: i32) {
        let n = self.team.len();
        let (mut me, mut other) = (self.chart.0.min(n - 1), self.chart.1.min(n - 1));
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
        self.chart = (me, other);
    }

    /// The chart of the selected pair, centred on their planned starts.
    pub fn current_chart(&self) -> Option<crate::plan::chart::PairChart> {
        let n = self.team.len();
        let (me, other) = (self.chart.0.min(n - 1), self.chart.1.min(n - 1));
        if me == other {
            return None;
        }
        let input = self.team.input();
        let u = input.units;
        let around = |i: usize| {
            crate::plan::chart::starts_around(
                u.pressure_value(input.divers[i].start),
                input.gauge_step,
                2,
                7,
            )
        };
        crate::plan::chart::pair_chart(input, me, other, &around(me), &around(other)).ok()
    }
}
