//! The app session: every user action, on plain Rust state. The Slint adapters call
//! these methods and then redraw from the state; nothing here touches the toolkit.

use crate::formats::team_file::TeamFile;
use crate::plan::catalogue::{Material, presets};
use crate::plan::error::{InputError, fmt_num};
use crate::plan::{Depth, Mix, Rule, Temperature, UnitSystem};
use crate::storage::settings::Settings;
use crate::storage::{LoadReport, Store};

use super::keypad::KeypadBuffer;
use super::locker_controller::LockerController;
use super::nav::{NavController, Screen};
use super::team_controller::{TeamController, step_options};

mod entry;
mod pickers;
mod tools;

/// The demo team of an invented scenario, for the first launch.
pub const DEMO_TEAM: &str = include_str!("../../../examples/hollowmere-team.json");
const DEMO_STAGE_LABELS: [&str; 3] = ["Aluminium 40", "", "Single 7 L 232 bar"];
const DEMO_LABELS: [&str; 3] = [
    "Twin 12 L 232 bar",
    "Sidemount 2× aluminium 80",
    "Twin 8.5 L 300 bar",
];

/// What the open keypad is entering.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum EntryTarget {
    Start(usize),
    StageStart(usize),
    Sac(usize),
    Depth,
    WaterTemp,
    DiverName(usize),
    LockerName,
    LockerNote,
    LockerFirst,
    LockerSecond,
    FillPressure,
    FillTemp,
}

#[derive(Clone, Debug)]
pub struct Entry {
    pub target: EntryTarget,
    pub buffer: KeypadBuffer,
    pub original: String,
    pub title: String,
    pub unit: String,
    /// Why the current text cannot be used; empty when it can.
    pub reason: String,
}

/// The fill-to-water check: a fill pressure and the temperature at the fill station,
/// for one diver's gas.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FillCheck {
    pub diver: usize,
    pub pressure: crate::plan::Pressure,
    pub temperature: Temperature,
}

/// An open picker, for a diver's main gas or stage.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Picker {
    None,
    Cylinders {
        diver: usize,
        stage: bool,
    },
    /// O2 and He in percent.
    Mix {
        diver: usize,
        stage: bool,
        o2: i32,
        he: i32,
    },
}

pub struct Session {
    pub store: Store,
    pub settings: Settings,
    pub team: TeamController,
    pub locker: LockerController,
    pub nav: NavController,
    pub entry: Option<Entry>,
    pub picker: Picker,
    pub fill: FillCheck,
    /// The wet-notes chart shown: (diver, teammate).
    pub chart: (usize, usize),
    pub status: Vec<String>,
}

fn demo_team(settings: &Settings) -> TeamController {
    let state = crate::storage::team_state::TeamState {
        schema: crate::storage::team_state::TEAM_SCHEMA,
        team: TeamFile::parse(DEMO_TEAM).expect("the bundled demo team is valid"),
        cylinder_labels: DEMO_LABELS.iter().map(|s| s.to_string()).collect(),
        stage_labels: DEMO_STAGE_LABELS.iter().map(|s| s.to_string()).collect(),
    };
    let mut t = TeamController::from_state(&state).expect("the bundled demo team plans");
    let _ = t.set_rule(settings.rule);
    let _ = t.set_units(settings.units);
    let _ = t.set_gauge_step(settings.gauge_step());
    t
}

impl Session {
    /// Load everything from the data directory; unreadable files are set aside and
    /// reported; the first launch gets the demo team and the cautions page.
    pub fn open(store: Store) -> Session {
        let mut store = store;
        let loaded = store.load();
        let LoadReport {
            mut messages,
            first_launch,
        } = loaded.report;
        let settings = loaded.settings;
        let team = match loaded.team {
            Some(state) => match TeamController::from_state(&state) {
                Ok(t) => t,
                Err(e) => {
                    let kept = store.set_aside_team(&e.to_string());
                    messages.push(match kept {
                        Some(p) => format!(
                            "The last team could not be planned ({e}). It was kept as {} and the demo team is shown instead.",
                            p.display()
                        ),
                        None => format!(
                            "The last team could not be planned ({e}). It was left untouched and will not be overwritten; the demo team is shown instead."
                        ),
                    });
                    demo_team(&settings)
                }
            },
            None => demo_team(&settings),
        };
        let first = if first_launch || !settings.cautions_acknowledged {
            Screen::Cautions
        } else {
            Screen::Team
        };
        let fill = FillCheck {
            diver: 0,
            pressure: team.input().divers[0].cylinders.working_pressure(),
            temperature: Temperature::from_celsius(team.input().water_temp.celsius() + 15.0),
        };
        Session {
            store,
            settings,
            fill,
            chart: (0, 1),
            team,
            locker: LockerController::new(loaded.locker),
            nav: NavController::new(first),
            entry: None,
            picker: Picker::None,
            status: messages,
        }
    }

    /// Read the files again if another program changed them since they were last read
    /// or written (on resume). The page stays where it was. Returns whether it reloaded.
    pub fn reload_if_changed(&mut self) -> bool {
        if !self.store.changed_on_disk() {
            return false;
        }
        let page = self.nav.current();
        let dir = self.store.dir().to_path_buf();
        let fresh = Session::open(Store::new(dir));
        let nav = self.nav.clone();
        *self = fresh;
        if page != Screen::Cautions && self.settings.cautions_acknowledged {
            self.nav = nav;
        }
        true
    }

    pub fn units(&self) -> UnitSystem {
        self.team.input().units
    }

    fn report(&mut self, r: Result<(), String>) {
        if let Err(e) = r {
            self.status.push(e);
        }
    }

    /// Write everything (used on edits and on Android lifecycle events).
    pub fn save_all(&mut self) {
        self.save_team();
        self.save_locker();
        self.save_settings();
    }
    pub fn save_team(&mut self) {
        let r = self.store.save_team(&self.team.to_state());
        self.report(r);
    }
    pub fn save_locker(&mut self) {
        let r = self.store.save_locker(&self.locker.file);
        self.report(r);
    }
    pub fn save_settings(&mut self) {
        let r = self.store.save_settings(&self.settings);
        self.report(r);
    }

    fn team_result(&mut self, r: Result<(), InputError>) {
        match r {
            Ok(()) => self.save_team(),
            Err(e) => self.status.push(e.to_string()),
        }
    }

    // ---- navigation -------------------------------------------------------------

    pub fn go(&mut self, s: Screen) {
        self.nav.go(s);
    }

    /// Back: closes an entry or picker first, then goes one page back.
    pub fn back(&mut self) -> bool {
        if self.entry.is_some() {
            self.cancel_entry();
            return true;
        }
        if self.picker != Picker::None {
            self.picker = Picker::None;
            return true;
        }
        if self.nav.current() == Screen::LockerEdit {
            self.locker.draft = None;
        }
        self.nav.back()
    }

    pub fn acknowledge_cautions(&mut self) {
        self.settings.cautions_acknowledged = true;
        self.save_settings();
        self.nav.reset(Screen::Team);
    }

    pub fn dismiss_status(&mut self) {
        self.status.clear();
    }

    // ---- team page ---------------------------------------------------------------

    pub fn set_rule(&mut self, idx: usize) {
        if let Some(rule) = Rule::ALL.get(idx).copied() {
            let r = self.team.set_rule(rule);
            self.team_result(r);
        }
    }

    pub fn set_step(&mut self, idx: usize) {
        if let Some(step) = step_options(self.units()).get(idx).copied() {
            let r = self.team.set_gauge_step(step);
            self.team_result(r);
        }
    }

    pub fn toggle_water(&mut self) {
        let r = self.team.toggle_water();
        self.team_result(r);
    }

    pub fn nudge_start(&mut self, i: usize, dir: i32) {
        if i < self.team.len() {
            let r = self.team.nudge_start(i, dir);
            self.team_result(r);
        }
    }

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
            let r = self.team.remove_diver(i);
            self.team_result(r);
            self.fill.diver = self.fill.diver.min(self.team.len() - 1);
            self.chart = (0, 1);
        }
    }

    /// A fresh two-diver team from the settings' defaults; both start with my set.
    pub fn new_team(&mut self) {
        let (set, label) = self
            .locker
            .mine()
            .unwrap_or_else(|| (presets()[0].set, presets()[0].name.to_string()));
        let mut t = demo_team(&self.settings);
        while t.len() > 2 {
            let _ = t.remove_diver(t.len() - 1);
        }
        for (i, name) in ["Me", "Buddy"].into_iter().enumerate() {
            let _ = t.set_name(i, name);
            let _ = t.set_cylinders(i, set, &label);
            let _ = t.set_mix(i, Mix::AIR);
            let _ = t.set_sac(i, None);
            let _ = t.set_stage_cylinders(i, None, "");
            let wp = set.working_pressure();
            let u = t.input().units;
            let start = crate::plan::matching::round_down_to_step(
                u.pressure_value(wp),
                t.input().gauge_step,
            );
            let _ = t.set_start(i, u.pressure(start));
        }
        let _ = t.set_depth(None);
        let _ = t.set_water_temp(Temperature::from_celsius(self.settings.water_temp_c));
        self.team = t;
        self.save_team();
    }

    // ---- settings ----------------------------------------------------------------

    pub fn set_units(&mut self, units: UnitSystem) {
        self.settings.units = units;
        self.save_settings();
        let r = self.team.set_units(units);
        self.team_result(r);
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

    pub fn nudge_water_temp(&mut self, dir: i32) {
        let u = self.units();
        let current = u.temperature_value(Temperature::from_celsius(self.settings.water_temp_c));
        let next = current.round() + f64::from(dir.signum());
        self.set_water_temp_value(next);
    }

    /// Set the water temperature from a number in the team's unit.
    fn set_water_temp_value(&mut self, v: f64) -> Option<InputError> {
        let t = self.units().temperature(v);
        match self.team.set_water_temp(t) {
            Ok(()) => {
                self.settings.water_temp_c = t.celsius();
                self.save_settings();
                self.save_team();
                None
            }
            Err(e) => {
                let msg = e.clone();
                self.status.push(e.to_string());
                Some(msg)
            }
        }
    }

    // ---- locker ------------------------------------------------------------------

    pub fn locker_new(&mut self) {
        self.locker.start_new();
        self.nav.go(Screen::LockerEdit);
    }
    pub fn locker_edit(&mut self, id: u64) {
        self.locker.start_edit(id);
        if self.locker.draft.is_some() {
            self.nav.go(Screen::LockerEdit);
        }
    }
    pub fn locker_copy_preset(&mut self, idx: usize) {
        if let Some(p) = presets().get(idx) {
            self.locker.start_from_preset(p);
            self.nav.go(Screen::LockerEdit);
        }
    }
    pub fn locker_delete(&mut self, id: u64) {
        if self.locker.delete(id).is_some() {
            self.save_locker();
        }
    }
    pub fn locker_undo(&mut self) {
        if self.locker.undo_delete() {
            self.save_locker();
        }
    }
    pub fn locker_make_mine(&mut self, id: u64) {
        self.locker.make_mine(id);
        self.save_locker();
    }
    pub fn locker_save(&mut self) -> Result<(), InputError> {
        self.locker.save_draft()?;
        self.save_locker();
        self.nav.back();
        Ok(())
    }
    pub fn draft_count(&mut self, delta: i32) {
        if let Some(d) = self.locker.draft.as_mut() {
            d.count = (i32::from(d.count) + delta).clamp(1, 4) as u8;
        }
    }
    pub fn draft_rated(&mut self, rated: bool) {
        if let Some(d) = self.locker.draft.as_mut()
            && d.rated != rated
        {
            d.rated = rated;
            d.first = None;
            d.second = None;
        }
    }
    pub fn draft_material(&mut self, idx: usize) {
        if let (Some(d), Some(m)) = (self.locker.draft.as_mut(), Material::ALL.get(idx)) {
            d.material = *m;
        }
    }
}

/// Depth helper for tests and adapters.
pub fn depth_text(d: Option<Depth>, u: UnitSystem) -> String {
    match d {
        None => "Depth —".to_string(),
        Some(d) => format!(
            "{} {}",
            fmt_num(match u {
                UnitSystem::Metric => d.metres(),
                UnitSystem::Imperial => d.feet().round(),
            }),
            u.depth_label()
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_saved_team_that_no_longer_plans_is_kept_aside() {
        let dir = tempfile::tempdir().unwrap();
        let text = crate::app::session::DEMO_TEAM.replace("\"Sol\"", "\"Ines\"");
        let saved = format!("{{\"schema\": 1, \"team\": {text}}}");
        std::fs::write(dir.path().join("last-team.json"), &saved).unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        assert!(
            s.status.iter().any(|m| m.contains("could not be planned")),
            "{:?}",
            s.status
        );
        s.save_all();
        let kept = crate::storage::atomic::kept_aside(dir.path(), "last-team.json");
        assert_eq!(kept.len(), 1);
        assert_eq!(std::fs::read_to_string(&kept[0]).unwrap(), saved);
    }
}
