//! The team being planned: always a valid input and its plan. Edits that would make
//! the team invalid are refused with the core's error, and the plan stays as it was.

use crate::formats::team_file::TeamFile;
use crate::plan::InputError;
use crate::plan::next_step;
use crate::plan::round_down_to_step;
use crate::plan::{
    Gauge, Mix, Pressure, Rule, SetLabels, TeamInput, TeamPlan, UnitSystem, current_preset_name,
    plan_team,
};
use crate::storage::team_state::{TEAM_SCHEMA, TeamState};

use super::readings::Readings;

pub use gate::{Held, Holder, TurnsGate};

/// The gauge steps offered, per unit system.
pub fn step_options(units: UnitSystem) -> [f64; 2] {
    match units {
        UnitSystem::Metric => [5.0, 10.0],
        UnitSystem::Imperial => [50.0, 100.0],
    }
}

#[derive(Clone, Debug)]
pub struct TeamController {
    input: TeamInput,
    labels: Vec<String>,
    stage_labels: Vec<String>,
    plan: TeamPlan,
    /// Whether each start is a reading taken today.
    readings: Readings,
    /// The same for each diver's stage start.
    stage_readings: Readings,
    /// The demo team of invented divers (until a new team or a diver is named).
    demo: bool,
}

impl TeamController {
    /// A controller over a team that must plan without error.
    pub fn new(input: TeamInput, labels: Vec<String>) -> Result<Self, InputError> {
        let plan = plan_team(&input)?;
        let mut labels = labels;
        labels.resize_with(input.divers.len(), String::new);
        for (i, l) in labels.iter_mut().enumerate() {
            if l.is_empty() {
                *l = input.divers[i].cylinders.describe();
            }
        }
        let stage_labels = input
            .divers
            .iter()
            .map(|d| {
                d.stage
                    .as_ref()
                    .map(|st| st.cylinders.describe())
                    .unwrap_or_default()
            })
            .collect();
        let readings = Readings::unread(input.divers.len());
        Ok(TeamController {
            input,
            labels,
            stage_labels,
            plan,
            stage_readings: readings.clone(),
            readings,
            demo: false,
        })
    }

    pub fn from_state(state: &TeamState) -> Result<Self, InputError> {
        // A label that names a preset by an old name gets the preset's name now.
        let now = |l: &String| current_preset_name(l).to_string();
        let labels = state.cylinder_labels.iter().map(now).collect();
        let mut t = Self::new(state.team.to_input()?, labels)?;
        t.readings = Readings::from_saved(&state.start_readings, t.len());
        t.stage_readings = Readings::from_saved(&state.stage_readings, t.len());
        t.demo = state.demo;
        for (i, l) in state.stage_labels.iter().enumerate() {
            if i < t.stage_labels.len() && !l.is_empty() && t.input.divers[i].stage.is_some() {
                t.stage_labels[i] = now(l);
            }
        }
        Ok(t)
    }

    pub fn to_state(&self) -> TeamState {
        TeamState {
            schema: TEAM_SCHEMA,
            team: TeamFile::from_input(&self.input),
            cylinder_labels: self.labels.clone(),
            stage_labels: self.stage_labels.clone(),
            start_readings: self.readings.saved().to_vec(),
            stage_readings: self.stage_readings.saved().to_vec(),
            demo: self.demo,
        }
    }

    /// Whether this is the demo team of invented divers.
    pub fn is_demo(&self) -> bool {
        self.demo
    }

    pub fn input(&self) -> &TeamInput {
        &self.input
    }
    pub fn plan(&self) -> &TeamPlan {
        &self.plan
    }
    pub fn labels(&self) -> &[String] {
        &self.labels
    }
    pub fn stage_labels(&self) -> &[String] {
        &self.stage_labels
    }
    /// Every diver's labels, for the card and the plan's other front ends.
    pub fn set_labels(&self) -> SetLabels {
        SetLabels {
            sets: self.labels.clone(),
            stages: self.stage_labels.clone(),
        }
    }
    /// Diver `i`'s set by its one name, in this language (see [`crate::plan::set_name`]).
    pub fn shown_label(&self, i: usize) -> String {
        crate::plan::set_name(Some(&self.labels[i]), &self.input.divers[i].cylinders)
    }
    /// Diver `i`'s stage by its one name, in this language; empty without a stage.
    pub fn shown_stage_label(&self, i: usize) -> String {
        match &self.input.divers[i].stage {
            Some(st) => crate::plan::set_name(Some(&self.stage_labels[i]), &st.cylinders),
            None => String::new(),
        }
    }

    pub fn set_stage_start(&mut self, i: usize, p: Pressure) -> Result<(), InputError> {
        self.try_update(|t| {
            if let Some(st) = t.divers[i].stage.as_mut() {
                st.start = p;
            }
        })
    }

    pub fn set_stage_mix(&mut self, i: usize, mix: Mix) -> Result<(), InputError> {
        self.try_update(|t| {
            if let Some(st) = t.divers[i].stage.as_mut() {
                st.mix = mix;
            }
        })
    }
    pub fn len(&self) -> usize {
        self.input.divers.len()
    }
    pub fn is_empty(&self) -> bool {
        self.input.divers.is_empty()
    }

    /// Apply an edit if the edited team plans; otherwise leave everything unchanged.
    pub fn try_update(&mut self, edit: impl FnOnce(&mut TeamInput)) -> Result<(), InputError> {
        let mut candidate = self.input.clone();
        edit(&mut candidate);
        let plan = plan_team(&candidate)?;
        self.input = candidate;
        self.plan = plan;
        Ok(())
    }

    pub fn set_start(&mut self, i: usize, p: Pressure) -> Result<(), InputError> {
        self.try_update(|t| t.divers[i].start = p)
    }

    /// Move a start pressure to the next graduation of the diver's gauge, up (`dir` > 0)
    /// or down.
    pub fn nudge_start(&mut self, i: usize, dir: i32) -> Result<(), InputError> {
        let g = self.input.gauge_of(i);
        let v = g.value(self.input.divers[i].start);
        self.set_start(i, g.pressure(next_step(v, g.step, dir)))
    }

    pub fn set_name(&mut self, i: usize, name: &str) -> Result<(), InputError> {
        let name = crate::plan::text::nfc(name.trim());
        let r = self.try_update(|t| t.divers[i].name = name);
        if r.is_ok() {
            // A diver of one's own: no longer the demo.
            self.demo = false;
        }
        r
    }

    pub fn set_mix(&mut self, i: usize, mix: Mix) -> Result<(), InputError> {
        self.try_update(|t| t.divers[i].mix = mix)
    }

    pub fn set_sac(&mut self, i: usize, litres_per_min: Option<f64>) -> Result<(), InputError> {
        self.try_update(|t| t.divers[i].sac_l_per_min = litres_per_min)
    }

    pub fn set_rule(&mut self, rule: Rule) -> Result<(), InputError> {
        self.try_update(|t| t.rule = rule)
    }

    pub fn set_gauge_step(&mut self, step: f64) -> Result<(), InputError> {
        self.try_update(|t| t.gauge_step = step)
    }

    pub fn set_depth(&mut self, depth: Option<crate::plan::Depth>) -> Result<(), InputError> {
        self.try_update(|t| t.depth = depth)
    }

    pub fn toggle_water(&mut self) -> Result<(), InputError> {
        self.try_update(|t| {
            t.water = match t.water {
                crate::plan::Water::Fresh => crate::plan::Water::Salt,
                crate::plan::Water::Salt => crate::plan::Water::Fresh,
            }
        })
    }

    pub fn set_water_temp(&mut self, t: crate::plan::Temperature) -> Result<(), InputError> {
        self.try_update(|x| x.water_temp = t)
    }

    /// Switch units. Pressures, depth and breathing rates keep their physical value;
    /// the gauge step moves to the matching option of the new system. A diver whose start
    /// was entered keeps the gauge it was read on, so their start is never shown as a
    /// number their gauge does not show; divers without a reading follow the team.
    pub fn set_units(&mut self, units: UnitSystem) -> Result<(), InputError> {
        let old = self.input.units;
        if old == units {
            return Ok(());
        }
        let pinned: Vec<Option<Gauge>> = (0..self.len())
            .map(|i| {
                let d = &self.input.divers[i];
                match (d.gauge, self.readings.get(i)) {
                    (Some(g), _) => Some(g),
                    (None, Some(_)) => Some(self.input.default_gauge()),
                    (None, None) => None,
                }
            })
            .collect();
        let idx = step_options(old)
            .iter()
            .position(|s| (*s - self.input.gauge_step).abs() < 1e-9)
            .unwrap_or(1);
        let step = step_options(units)[idx];
        let new_unit = units.pressure_unit();
        self.try_update(|t| {
            t.units = units;
            t.gauge_step = step;
            for (d, g) in t.divers.iter_mut().zip(&pinned) {
                d.gauge = *g;
                if g.is_none() {
                    // An unread placeholder: on the new unit's graduation.
                    let v = round_down_to_step(new_unit.value(d.start), step).max(step);
                    d.start = new_unit.pressure(v);
                }
            }
        })
    }
}

mod gate;
mod gauges;
mod roster;

#[cfg(test)]
mod tests;
