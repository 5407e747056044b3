//! The team being planned: always a valid input and its plan. Edits that would make
//! the team invalid are refused with the core's error, and the plan stays as it was.

use crate::formats::team_file::TeamFile;
use crate::plan::error::InputError;
use crate::plan::matching::{round_down_to_step, round_up_to_step};
use crate::plan::team::{MAX_DIVERS, MIN_DIVERS};
use crate::plan::{
    CylinderSet, DiverInput, Mix, Pressure, Rule, TeamInput, TeamPlan, UnitSystem, plan_team,
};
use crate::storage::team_state::{TEAM_SCHEMA, TeamState};

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
        Ok(TeamController {
            input,
            labels,
            stage_labels,
            plan,
        })
    }

    pub fn from_state(state: &TeamState) -> Result<Self, InputError> {
        let mut t = Self::new(state.team.to_input()?, state.cylinder_labels.clone())?;
        for (i, l) in state.stage_labels.iter().enumerate() {
            if i < t.stage_labels.len() && !l.is_empty() && t.input.divers[i].stage.is_some() {
                t.stage_labels[i] = l.clone();
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
        }
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

    /// Give a diver a stage set, or take it away. A new stage starts full (its working
    /// pressure); a changed set keeps the start if it still fits.
    pub fn set_stage_cylinders(
        &mut self,
        i: usize,
        set: Option<CylinderSet>,
        label: &str,
    ) -> Result<(), InputError> {
        match set {
            None => {
                self.try_update(|t| t.divers[i].stage = None)?;
                self.stage_labels[i].clear();
            }
            Some(set) => {
                let u = self.input.units;
                let full = u.pressure(round_down_to_step(
                    u.pressure_value(set.working_pressure()),
                    self.input.gauge_step,
                ));
                let old = self.input.divers[i].stage.clone();
                let kept = old.as_ref().map(|st| st.start).filter(|p| {
                    p.bar() <= set.working_pressure().bar() * crate::plan::team::MAX_FILL_RATIO
                });
                let mix = old.map(|st| st.mix).unwrap_or(Mix::nitrox(0.5));
                self.try_update(|t| {
                    t.divers[i].stage = Some(crate::plan::StageInput {
                        cylinders: set,
                        mix,
                        start: kept.unwrap_or(full),
                    })
                })?;
                self.stage_labels[i] = label.to_string();
            }
        }
        Ok(())
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

    /// Move a start pressure to the next gauge step up (`dir` > 0) or down.
    pub fn nudge_start(&mut self, i: usize, dir: i32) -> Result<(), InputError> {
        let u = self.input.units;
        let step = self.input.gauge_step;
        let v = u.pressure_value(self.input.divers[i].start);
        let next = if dir > 0 {
            round_down_to_step(v, step) + step
        } else {
            round_up_to_step(v, step) - step
        };
        self.set_start(i, u.pressure(next))
    }

    pub fn set_name(&mut self, i: usize, name: &str) -> Result<(), InputError> {
        let name = name.trim().to_string();
        self.try_update(|t| t.divers[i].name = name)
    }

    pub fn set_mix(&mut self, i: usize, mix: Mix) -> Result<(), InputError> {
        self.try_update(|t| t.divers[i].mix = mix)
    }

    pub fn set_sac(&mut self, i: usize, litres_per_min: Option<f64>) -> Result<(), InputError> {
        self.try_update(|t| t.divers[i].sac_l_per_min = litres_per_min)
    }

    /// Give a diver a cylinder set. If the start pressure does not fit the new set, the
    /// start becomes the set's working pressure; the returned flag says so.
    pub fn set_cylinders(
        &mut self,
        i: usize,
        set: CylinderSet,
        label: &str,
    ) -> Result<bool, InputError> {
        let first = self.try_update(|t| t.divers[i].cylinders = set);
        let reset = match first {
            Ok(()) => false,
            Err(_) => {
                let wp = set.working_pressure();
                self.try_update(|t| {
                    t.divers[i].cylinders = set;
                    t.divers[i].start = wp;
                })?;
                true
            }
        };
        self.labels[i] = label.to_string();
        Ok(reset)
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
    /// the gauge step moves to the matching option of the new system.
    pub fn set_units(&mut self, units: UnitSystem) -> Result<(), InputError> {
        let old = self.input.units;
        if old == units {
            return Ok(());
        }
        let idx = step_options(old)
            .iter()
            .position(|s| (*s - self.input.gauge_step).abs() < 1e-9)
            .unwrap_or(1);
        let step = step_options(units)[idx];
        self.try_update(|t| {
            t.units = units;
            t.gauge_step = step;
        })
    }

    pub fn can_add(&self) -> bool {
        self.len() < MAX_DIVERS
    }
    pub fn can_remove(&self) -> bool {
        self.len() > MIN_DIVERS
    }

    /// Add a diver with the given set, full to working pressure (on the gauge step).
    pub fn add_diver(&mut self, set: CylinderSet, label: &str) -> Result<(), InputError> {
        if !self.can_add() {
            return Err(InputError::new(
                "divers",
                format!("a team has at most {MAX_DIVERS} divers"),
            ));
        }
        let n = self.len() + 1;
        let mut name = format!("Diver {n}");
        let mut k = n;
        while self.input.divers.iter().any(|d| d.name == name) {
            k += 1;
            name = format!("Diver {k}");
        }
        let u = self.input.units;
        let start = u.pressure(round_down_to_step(
            u.pressure_value(set.working_pressure()),
            self.input.gauge_step,
        ));
        let mix = self.input.divers.last().map(|d| d.mix).unwrap_or_default();
        self.try_update(|t| {
            t.divers.push(DiverInput {
                name,
                cylinders: set,
                mix,
                start,
                sac_l_per_min: None,
                stage: None,
                gauge: None,
            })
        })?;
        self.labels.push(label.to_string());
        self.stage_labels.push(String::new());
        Ok(())
    }

    pub fn remove_diver(&mut self, i: usize) -> Result<(), InputError> {
        if !self.can_remove() {
            return Err(InputError::new(
                "divers",
                format!("a team has at least {MIN_DIVERS} divers"),
            ));
        }
        self.try_update(|t| {
            t.divers.remove(i);
        })?;
        self.labels.remove(i);
        self.stage_labels.remove(i);
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn demo() -> TeamController {
        let f = TeamFile::parse(include_str!("../../examples/hollowmere-team.json")).unwrap();
        TeamController::new(f.to_input().unwrap(), vec![]).unwrap()
    }

    #[test]
    fn invalid_edit_keeps_the_plan() {
        let mut t = demo();
        let before = t.plan().clone();
        let e = t.set_start(0, Pressure::from_bar(400.0)).unwrap_err();
        assert_eq!(e.field, "divers[0].start");
        assert_eq!(t.plan(), &before);
    }

    #[test]
    fn nudges_land_on_the_step() {
        let mut t = demo();
        t.nudge_start(0, 1).unwrap();
        assert!((t.input().divers[0].start.bar() - 220.0).abs() < 1e-9);
        t.nudge_start(0, -1).unwrap();
        t.nudge_start(0, -1).unwrap();
        assert!((t.input().divers[0].start.bar() - 200.0).abs() < 1e-9);
    }

    #[test]
    fn units_switch_keeps_physical_pressures() {
        let mut t = demo();
        let bar = t.input().divers[1].start.bar();
        t.set_units(UnitSystem::Imperial).unwrap();
        assert_eq!(t.input().gauge_step, 100.0);
        assert!((t.input().divers[1].start.bar() - bar).abs() < 1e-9);
        assert_eq!(t.plan().units, UnitSystem::Imperial);
    }

    #[test]
    fn add_and_remove_respect_team_size() {
        let mut t = demo();
        let set = t.input().divers[0].cylinders;
        for _ in 0..3 {
            t.add_diver(set, "x").unwrap();
        }
        assert!(t.add_diver(set, "x").is_err());
        assert_eq!(t.len(), 6);
        assert_eq!(t.labels().len(), 6);
        for _ in 0..4 {
            t.remove_diver(0).unwrap();
        }
        assert!(t.remove_diver(0).is_err());
    }
}
