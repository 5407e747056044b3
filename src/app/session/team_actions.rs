//! Session actions on the team being planned (Team page) and on the settings that
//! give a new team its defaults (Settings page).

use crate::formats::team_file::TeamFile;
use crate::i18n::{tr, tr_with};
use crate::plan::presets;
use crate::plan::{Rule, Temperature, UnitSystem};
use crate::storage::settings::Settings;
use crate::storage::team_state::{TEAM_SCHEMA, TeamState};

use super::super::team_controller::{TeamController, step_options};
use super::{ChartPair, Session};

/// The demo team of an invented scenario, for the first launch.
pub const DEMO_TEAM: &str = include_str!("../../../examples/hollowmere-team.json");
const DEMO_STAGE_LABELS: [&str; 3] = [
    "Single aluminium 40 cu ft 3000 psi",
    "",
    "Single 7 L 232 bar",
];
const DEMO_LABELS: [&str; 3] = [
    "Twin 12 L 232 bar",
    "Sidemount aluminium 77.4 cu ft 3000 psi",
    "Twin 8.5 L 300 bar",
];

/// The demo team with the rule, units and gauge step of the settings.
pub(super) fn demo_team(settings: &Settings) -> TeamController {
    let state = TeamState {
        schema: TEAM_SCHEMA,
        team: TeamFile::parse(DEMO_TEAM).expect("the bundled demo team is valid"),
        cylinder_labels: DEMO_LABELS.iter().map(|s| s.to_string()).collect(),
        stage_labels: DEMO_STAGE_LABELS.iter().map(|s| s.to_string()).collect(),
        // The demo's starts were read by nobody.
        start_readings: Vec::new(),
        stage_readings: Vec::new(),
        demo: true,
    };
    let mut t = TeamController::from_state(&state).expect("the bundled demo team plans");
    let _ = t.set_rule(settings.rule);
    let _ = t.set_units(settings.units);
    let _ = t.set_gauge_step(settings.gauge_step());
    t
}

impl Session {
    // ---- team page ---------------------------------------------------------------

    pub fn set_step(&mut self, idx: usize) {
        if let Some(step) = step_options(self.units()).get(idx).copied() {
            self.change_plan(
                |t| t.set_gauge_step(step),
                |s| {
                    tr_with(
                        "Gauge step now {0} {1}",
                        &[&crate::plan::shown::num(step), &s.units().pressure_label()],
                    )
                },
            );
        }
    }

    pub fn toggle_water(&mut self) {
        self.change_plan(
            |t| t.toggle_water(),
            |s| match s.team.input().water {
                crate::plan::Water::Fresh => tr("Water now fresh"),
                crate::plan::Water::Salt => tr("Water now salt"),
            },
        );
    }

    /// The − and + beside a start pressure: one graduation down or up. Setting the
    /// start by hand is entering a reading. A start not read today (never, or entered
    /// earlier) is not stepped from: the keypad opens, so the number comes from the
    /// gauge ("Still reads N" confirms an earlier one as it is).
    pub fn nudge_start(&mut self, i: usize, dir: i32) {
        use crate::app::readings::StartStatus;
        if i < self.team.len() {
            if matches!(
                self.team.start_status(i, self.now),
                StartStatus::Missing | StartStatus::Old { .. }
            ) {
                self.open_entry(super::EntryTarget::Start(i));
                return;
            }
            let r = self.team.nudge_start(i, dir);
            if r.is_ok() {
                self.team.mark_read(i, self.now);
            }
            self.team_result(r);
        }
    }

    /// "Still reads N": the diver's gauge shows the start that was entered earlier.
    pub fn confirm_start(&mut self, i: usize) {
        if i < self.team.len() {
            self.team.mark_read(i, self.now);
            self.save_team();
        }
    }

    /// A gauge chosen in the gauge chooser of diver `i`'s card.
    pub fn set_gauge(&mut self, i: usize, gauge: crate::plan::Gauge) {
        if i < self.team.len() {
            self.gauge_chooser = None;
            if self.team.input().gauge_of(i) == gauge {
                return;
            }
            let name = self.team.input().divers[i].name.clone();
            self.change_plan(
                |t| t.set_gauge(i, gauge),
                |_| {
                    tr_with(
                        "Gauge of {0} now {1}",
                        &[&name, &crate::app::view_models::gauge_text(gauge)],
                    )
                },
            );
        }
    }

    /// A new diver carries my set, or else the same as the last diver.
    pub fn add_diver(&mut self) {
        let (set, label) = self.locker.mine().unwrap_or_else(|| {
            let last = self.team.len() - 1;
            (
                self.team.input().divers[last].cylinders,
                self.team.labels()[last].clone(),
            )
        });
        let r = self.team.add_diver(set, &label);
        self.team_result(r);
    }

    pub fn remove_diver(&mut self, i: usize) {
        if i < self.team.len() {
            let before = self.before_change();
            let state = self.team.to_state();
            let shown = self.team.turns_ready(self.now);
            let name = self.team.input().divers[i].name.clone();
            let r = self.team.remove_diver(i);
            let removed = r.is_ok();
            self.team_result(r);
            self.fill.keep_within(self.team.len());
            self.chart = ChartPair::default();
            if removed {
                if shown {
                    self.after_change(tr_with("{0} removed", &[&name]), before);
                } else {
                    self.offer_undo(tr_with("{0} removed.", &[&name]), state);
                }
            }
        }
    }

    /// A fresh two-diver team from the settings' defaults; both start with my set.
    pub fn new_team(&mut self) {
        let (set, label) = self
            .locker
            .mine()
            .unwrap_or_else(|| (presets()[0].set, presets()[0].name.to_string()));
        let before = self.team.to_state();
        let mut t = demo_team(&self.settings);
        t.start_afresh(
            set,
            &label,
            Temperature::from_celsius(self.settings.water_temp_c),
        );
        self.team = t;
        self.fill = super::FillCheck::for_team(self.team.input());
        self.chart = ChartPair::default();
        self.save_team();
        let names: Vec<&str> = before.team.divers.iter().map(|d| d.name.as_str()).collect();
        let text = tr_with(
            "New team started; the team of {0} was cleared.",
            &[&names.join(", ")],
        );
        self.offer_undo(text, before);
    }

    // ---- settings ----------------------------------------------------------------

    pub fn set_units(&mut self, units: UnitSystem) {
        self.settings.units = units;
        self.save_settings();
        self.change_plan(
            |t| t.set_units(units),
            |s| tr_with("Team units now {0}", &[&s.units().pressure_label()]),
        );
    }

    pub fn set_default_rule(&mut self, idx: usize) {
        if let Some(rule) = Rule::ALL.get(idx).copied() {
            self.settings.rule = rule;
            self.save_settings();
        }
    }

    pub fn set_default_step(&mut self, idx: usize) {
        let opts = step_options(self.settings.units);
        if let Some(step) = opts.get(idx).copied() {
            match self.settings.units {
                UnitSystem::Metric => self.settings.gauge_step_bar = step,
                UnitSystem::Imperial => self.settings.gauge_step_psi = step,
            }
            self.save_settings();
        }
    }

    /// One degree colder or warmer: the water of this dive (Team page).
    pub fn nudge_water_temp(&mut self, dir: i32) {
        let u = self.units();
        let current = u.temperature_value(self.team.input().water_temp);
        let t = u.temperature(current.round() + f64::from(dir.signum()));
        self.change_plan(
            |team| team.set_water_temp(t),
            |s| {
                tr_with(
                    "Water now {0}",
                    &[&crate::app::view_models::water_temp_text(s)],
                )
            },
        );
    }

    /// One degree colder or warmer: the water a new team starts with (Settings page).
    /// Kept within the range a team accepts.
    pub fn nudge_default_water_temp(&mut self, dir: i32) {
        let u = self.settings.units;
        let current = u.temperature_value(Temperature::from_celsius(self.settings.water_temp_c));
        let t = u.temperature(current.round() + f64::from(dir.signum()));
        let c = t.celsius();
        let (lo, hi) = crate::plan::WATER_TEMP_RANGE_C;
        if (lo..=hi).contains(&c) || (c > hi && dir < 0) || (c < lo && dir > 0) {
            self.remember_water_temp(t);
        }
    }

    /// Keep a water temperature as the default for new teams.
    pub(super) fn remember_water_temp(&mut self, t: Temperature) {
        self.settings.water_temp_c = t.celsius();
        self.save_settings();
    }
}
