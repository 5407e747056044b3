//! Each diver's start as a reading and each diver's gauge: whether a start was read
//! today, and what changing a gauge does to it.

use crate::app::readings::{Readings, Source, StartStatus};
use crate::plan::InputError;
use crate::plan::round_down_to_step;
use crate::plan::{Gauge, Supply, Warning};

use super::TeamController;

impl TeamController {
    /// The plan's warnings that may be shown at `now`: one about a start's fill (above
    /// the working pressure, an overfill, a low fill) only once that start was read,
    /// since it would quote a number nobody read.
    pub fn shown_warnings(&self, now: i64) -> Vec<&Warning> {
        self.plan()
            .warnings
            .iter()
            .filter(|w| {
                let about = match w {
                    Warning::AboveWorking { diver, supply, .. }
                    | Warning::Overfill { diver, supply, .. }
                    | Warning::LowFill { diver, supply, .. } => Some((*diver, *supply)),
                    _ => None,
                };
                match about {
                    Some((i, Supply::Main)) => self.start_status(i, now) != StartStatus::Missing,
                    Some((i, Supply::Stage)) => {
                        self.stage_status(i, now) != Some(StartStatus::Missing)
                    }
                    None => true,
                }
            })
            .collect()
    }

    /// Whether each start is a reading taken today.
    pub fn readings(&self) -> &Readings {
        &self.readings
    }

    /// Diver `i`'s start status at `now` (unix seconds).
    pub fn start_status(&self, i: usize, now: i64) -> StartStatus {
        self.readings.status(i, now)
    }

    /// Whether every start may make turns at `now`.
    pub fn turns_ready(&self, now: i64) -> bool {
        self.readings.all_usable(now)
    }

    /// Diver `i`'s start was just read on the gauge (typed, nudged or confirmed).
    pub fn mark_read(&mut self, i: usize, now: i64) {
        self.readings.mark(i, now, Source::Gauge);
    }

    /// Diver `i`'s start was set from a fill prediction.
    pub fn mark_predicted(&mut self, i: usize, now: i64) {
        self.readings.mark(i, now, Source::Prediction);
    }

    /// Diver `i`'s stage start status at `now`; None without a stage.
    pub fn stage_status(&self, i: usize, now: i64) -> Option<StartStatus> {
        self.input.divers.get(i)?.stage.as_ref()?;
        Some(self.stage_readings.status(i, now))
    }

    /// Diver `i`'s stage start was just read on the gauge.
    pub fn mark_stage_read(&mut self, i: usize, now: i64) {
        self.stage_readings.mark(i, now, Source::Gauge);
    }

    /// The divers whose stage start is not a reading taken today, in team order.
    pub fn stages_blocking(&self, now: i64) -> Vec<usize> {
        (0..self.len())
            .filter(|&i| self.stage_status(i, now).is_some_and(|st| !st.usable()))
            .collect()
    }

    /// Every start unread (a new team, the demo).
    pub fn forget_readings(&mut self) {
        self.readings = Readings::unread(self.len());
        self.stage_readings = Readings::unread(self.len());
    }

    /// Give diver `i` a gauge. A change of unit makes the start unread (a reading on
    /// one unit is not a reading on the other); it is kept as a placeholder rounded down
    /// to the new graduation. A change of graduation keeps the reading.
    pub fn set_gauge(&mut self, i: usize, gauge: Gauge) -> Result<(), InputError> {
        let old = self.input.gauge_of(i);
        let start = self.input.divers[i].start;
        let placeholder =
            gauge.pressure(round_down_to_step(gauge.value(start), gauge.step).max(gauge.step));
        let unit_changed = old.unit != gauge.unit;
        self.try_update(|t| {
            t.divers[i].gauge = Some(gauge);
            if unit_changed {
                t.divers[i].start = placeholder;
            }
        })?;
        if unit_changed {
            self.readings.clear(i);
            self.stage_readings.clear(i);
        }
        Ok(())
    }
}
