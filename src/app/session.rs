//! The app session: every user action, on plain Rust state. The Slint adapters call
//! these methods and then redraw from the state; nothing here touches the toolkit.

use crate::formats::team_file::TeamFile;
use crate::plan::catalogue::{Material, presets};
use crate::plan::error::{InputError, check_range, fmt_num};
use crate::plan::team::{validate_mix, validate_start};
use crate::plan::{Depth, Mix, Rule, Temperature, UnitSystem};
use crate::storage::settings::Settings;
use crate::storage::{LoadReport, Store};

use super::keypad::KeypadBuffer;
use super::locker_controller::LockerController;
use super::nav::{NavController, Screen};
use super::team_controller::{TeamController, step_options};

/// The demo team of an invented scenario, for the first launch.
pub const DEMO_TEAM: &str = include_str!("../../examples/hollowmere-team.json");
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

    // ---- pickers -----------------------------------------------------------------

    pub fn open_cylinder_picker(&mut self, i: usize) {
        if i < self.team.len() {
            self.picker = Picker::Cylinders {
                diver: i,
                stage: false,
            };
        }
    }

    pub fn open_stage_picker(&mut self, i: usize) {
        if i < self.team.len() {
            self.picker = Picker::Cylinders {
                diver: i,
                stage: true,
            };
        }
    }

    pub fn pick_locker(&mut self, idx: usize) {
        let Picker::Cylinders { diver, stage } = self.picker else {
            return;
        };
        let Some(e) = self.locker.file.entries.get(idx).cloned() else {
            return;
        };
        match e.cylinders.to_set("locker") {
            Ok(set) => self.apply_cylinders(diver, stage, set, &e.name),
            Err(err) => self.status.push(err.to_string()),
        }
    }

    pub fn pick_preset(&mut self, idx: usize) {
        let Picker::Cylinders { diver, stage } = self.picker else {
            return;
        };
        if let Some(p) = presets().get(idx) {
            self.apply_cylinders(diver, stage, p.set, p.name);
        }
    }

    /// Take a diver's stage away.
    pub fn pick_no_stage(&mut self) {
        if let Picker::Cylinders { diver, stage: true } = self.picker {
            let r = self.team.set_stage_cylinders(diver, None, "");
            self.team_result(r);
            self.picker = Picker::None;
        }
    }

    fn apply_cylinders(
        &mut self,
        i: usize,
        stage: bool,
        set: crate::plan::CylinderSet,
        label: &str,
    ) {
        if stage {
            let r = self.team.set_stage_cylinders(i, Some(set), label);
            self.team_result(r);
            self.picker = Picker::None;
            return;
        }
        match self.team.set_cylinders(i, set, label) {
            Ok(reset) => {
                if reset {
                    self.status.push(format!(
                        "{}: the start pressure did not fit {label}; it is now the working pressure. Enter the pressure you read in the water.",
                        self.team.input().divers[i].name
                    ));
                }
                self.save_team();
            }
            Err(e) => self.status.push(e.to_string()),
        }
        self.picker = Picker::None;
    }

    pub fn open_mix_picker(&mut self, i: usize) {
        if let Some(d) = self.team.input().divers.get(i) {
            self.picker = Picker::Mix {
                diver: i,
                stage: false,
                o2: (d.mix.o2 * 100.0).round() as i32,
                he: (d.mix.he * 100.0).round() as i32,
            };
        }
    }

    pub fn open_stage_mix_picker(&mut self, i: usize) {
        if let Some(st) = self
            .team
            .input()
            .divers
            .get(i)
            .and_then(|d| d.stage.as_ref())
        {
            self.picker = Picker::Mix {
                diver: i,
                stage: true,
                o2: (st.mix.o2 * 100.0).round() as i32,
                he: (st.mix.he * 100.0).round() as i32,
            };
        }
    }

    pub fn picker_mix(&self) -> Option<Mix> {
        match self.picker {
            Picker::Mix { o2, he, .. } => Some(Mix {
                o2: f64::from(o2) / 100.0,
                he: f64::from(he) / 100.0,
            }),
            _ => None,
        }
    }

    pub fn mix_reason(&self) -> String {
        match self.picker_mix() {
            Some(m) => validate_mix("mix", &m)
                .err()
                .map(|e| e.message)
                .unwrap_or_default(),
            None => String::new(),
        }
    }

    pub fn nudge_mix(&mut self, o2_delta: i32, he_delta: i32) {
        if let Picker::Mix { o2, he, .. } = &mut self.picker {
            *o2 = (*o2 + o2_delta).clamp(5, 100);
            *he = (*he + he_delta).clamp(0, 95);
        }
    }

    /// The quick choices of the mix picker: air, EAN32, EAN50, Tx 21/35, Tx 18/45.
    pub fn quick_mix(&mut self, idx: usize) {
        const QUICK: [(i32, i32); 5] = [(21, 0), (32, 0), (50, 0), (21, 35), (18, 45)];
        if let (Picker::Mix { o2, he, .. }, Some((q_o2, q_he))) = (&mut self.picker, QUICK.get(idx))
        {
            *o2 = *q_o2;
            *he = *q_he;
        }
    }

    pub fn mix_done(&mut self) {
        if let (Picker::Mix { diver, stage, .. }, Some(mix)) = (self.picker, self.picker_mix()) {
            let r = if stage {
                self.team.set_stage_mix(diver, mix)
            } else {
                self.team.set_mix(diver, mix)
            };
            match r {
                Ok(()) => {
                    self.save_team();
                    self.picker = Picker::None;
                }
                Err(e) => self.status.push(e.to_string()),
            }
        }
    }

    pub fn close_picker(&mut self) {
        self.picker = Picker::None;
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

    // ---- keypad entry ------------------------------------------------------------

    pub fn open_entry(&mut self, target: EntryTarget) {
        let u = self.units();
        let divers = &self.team.input().divers;
        let diver = |i: usize| divers.get(i).map(|d| d.name.clone()).unwrap_or_default();
        let (buffer, title, unit) = match target {
            EntryTarget::Start(i) => {
                let Some(d) = divers.get(i) else { return };
                (
                    KeypadBuffer::digits(&fmt_num(u.pressure_value(d.start).floor()), false),
                    format!(
                        "Start pressure for {} ({}), read in the water",
                        d.name,
                        self.team.labels()[i]
                    ),
                    u.pressure_label().to_string(),
                )
            }
            EntryTarget::StageStart(i) => {
                let Some((d, st)) = divers
                    .get(i)
                    .and_then(|d| d.stage.as_ref().map(|st| (d, st)))
                else {
                    return;
                };
                (
                    KeypadBuffer::digits(&fmt_num(u.pressure_value(st.start).floor()), false),
                    format!(
                        "Stage pressure for {} ({}), read in the water",
                        d.name,
                        self.team.stage_labels()[i]
                    ),
                    u.pressure_label().to_string(),
                )
            }
            EntryTarget::Sac(i) => {
                let Some(d) = divers.get(i) else { return };
                let text = d
                    .sac_l_per_min
                    .map(|s| fmt_num(u.volume_value(crate::plan::Volume::from_litres(s))))
                    .unwrap_or_default();
                (
                    KeypadBuffer::digits(&text, true),
                    format!(
                        "Surface breathing rate (SAC) for {}; leave empty for none",
                        d.name
                    ),
                    format!("{}/min", u.volume_label()),
                )
            }
            EntryTarget::Depth => {
                let text = self
                    .team
                    .input()
                    .depth
                    .map(|d| {
                        fmt_num(match u {
                            UnitSystem::Metric => d.metres(),
                            UnitSystem::Imperial => d.feet(),
                        })
                    })
                    .unwrap_or_default();
                (
                    KeypadBuffer::digits(&text, false),
                    "Planned depth for time to turn; leave empty for none".to_string(),
                    u.depth_label().to_string(),
                )
            }
            EntryTarget::WaterTemp => (
                KeypadBuffer::digits(
                    &fmt_num(u.temperature_value(self.team.input().water_temp).round()),
                    false,
                ),
                "Water temperature (the gas cools to it)".to_string(),
                u.temperature_label().to_string(),
            ),
            EntryTarget::FillPressure => (
                KeypadBuffer::digits(
                    &fmt_num(u.pressure_value(self.fill.pressure).floor()),
                    false,
                ),
                "Pressure at the fill station".to_string(),
                u.pressure_label().to_string(),
            ),
            EntryTarget::FillTemp => (
                KeypadBuffer::digits(
                    &fmt_num(u.temperature_value(self.fill.temperature).round()),
                    false,
                ),
                "Gas temperature at the fill (a warm cylinder)".to_string(),
                u.temperature_label().to_string(),
            ),
            EntryTarget::DiverName(i) => (
                KeypadBuffer::letters(&diver(i), 24),
                format!("Name for diver {}", i + 1),
                String::new(),
            ),
            EntryTarget::LockerName | EntryTarget::LockerNote => {
                let Some(d) = self.locker.draft.as_ref() else {
                    return;
                };
                if target == EntryTarget::LockerName {
                    (
                        KeypadBuffer::letters(&d.name, 40),
                        "Name of the cylinder set".to_string(),
                        String::new(),
                    )
                } else {
                    (
                        KeypadBuffer::letters(&d.note, 60),
                        "Note (serial, test date, valves…)".to_string(),
                        String::new(),
                    )
                }
            }
            EntryTarget::LockerFirst | EntryTarget::LockerSecond => {
                let Some(d) = self.locker.draft.as_ref() else {
                    return;
                };
                let first = target == EntryTarget::LockerFirst;
                let spec = d.field_specs()[if first { 0 } else { 1 }];
                let v = if first { d.first } else { d.second };
                let decimal = spec.1 == "L" || spec.1 == "cu ft";
                (
                    KeypadBuffer::digits(&v.map(fmt_num).unwrap_or_default(), decimal),
                    format!("{} ({})", capitalise(spec.0), spec.1),
                    spec.1.to_string(),
                )
            }
        };
        let original = buffer.text().to_string();
        self.entry = Some(Entry {
            target,
            buffer,
            original,
            title,
            unit,
            reason: String::new(),
        });
        self.validate_entry(false);
    }

    /// One key on the open keypad.
    pub fn key(&mut self, key: &str) {
        let Some(entry) = self.entry.as_mut() else {
            return;
        };
        if key == "+step" || key == "-step" {
            if let EntryTarget::Start(_) | EntryTarget::StageStart(_) = entry.target {
                let step = self.team.input().gauge_step;
                let v = entry.buffer.value().unwrap_or(0.0);
                let next = if key == "+step" {
                    round_down(v, step) + step
                } else {
                    (round_up(v, step) - step).max(0.0)
                };
                entry.buffer.set_text(fmt_num(next));
            }
        } else {
            entry.buffer.press(key);
        }
        self.validate_entry(true);
    }

    /// Check the typed text; apply live where the value drives the plan.
    fn validate_entry(&mut self, apply: bool) {
        let Some(entry) = self.entry.clone() else {
            return;
        };
        let u = self.units();
        let v = entry.buffer.value();
        let text = entry.buffer.text().trim().to_string();
        let result: Result<(), InputError> = match entry.target {
            EntryTarget::Start(i) => match v {
                None => Err(InputError::new(
                    "start",
                    "enter the pressure read in the water",
                )),
                Some(v) => {
                    let p = u.pressure(v);
                    let d = &self.team.input().divers[i];
                    validate_start(u, "start", p, d.cylinders.working_pressure()).and_then(|_| {
                        if apply {
                            self.team.set_start(i, p)
                        } else {
                            Ok(())
                        }
                    })
                }
            },
            EntryTarget::StageStart(i) => match (v, &self.team.input().divers[i].stage) {
                (None, _) => Err(InputError::new(
                    "stage start",
                    "enter the stage pressure read in the water",
                )),
                (_, None) => Err(InputError::new("stage", "this diver carries no stage")),
                (Some(v), Some(st)) => {
                    let p = u.pressure(v);
                    validate_start(u, "stage start", p, st.cylinders.working_pressure()).and_then(
                        |_| {
                            if apply {
                                self.team.set_stage_start(i, p)
                            } else {
                                Ok(())
                            }
                        },
                    )
                }
            },
            EntryTarget::Sac(i) => {
                let litres = v.map(|v| u.volume(v).litres());
                if apply {
                    self.team.set_sac(i, litres)
                } else {
                    Ok(())
                }
            }
            EntryTarget::Depth => {
                let depth = v.map(|v| u.depth(v));
                if apply {
                    self.team.set_depth(depth)
                } else {
                    Ok(())
                }
            }
            EntryTarget::WaterTemp => match v {
                None => Err(InputError::new("water temperature", "enter a temperature")),
                Some(v) => {
                    let t = u.temperature(v);
                    if apply {
                        self.team.set_water_temp(t)
                    } else {
                        Ok(())
                    }
                }
            },
            EntryTarget::DiverName(i) => {
                if text.is_empty() {
                    Err(InputError::new(
                        "name",
                        "a name of 1 to 24 characters is needed",
                    ))
                } else if self
                    .team
                    .input()
                    .divers
                    .iter()
                    .enumerate()
                    .any(|(j, d)| j != i && d.name == text)
                {
                    Err(InputError::new(
                        "name",
                        "another diver already has this name",
                    ))
                } else if apply {
                    self.team.set_name(i, &text)
                } else {
                    Ok(())
                }
            }
            EntryTarget::LockerName => {
                if text.is_empty() {
                    Err(InputError::new("name", "a name is needed"))
                } else {
                    Ok(())
                }
            }
            EntryTarget::LockerNote => Ok(()),
            EntryTarget::FillPressure => match v {
                None => Err(InputError::new("fill pressure", "enter a pressure")),
                Some(v) => {
                    let max = u
                        .pressure_value(crate::plan::Pressure::from_bar(400.0))
                        .floor();
                    check_range("fill pressure", v, 1.0, max, u.pressure_label())
                }
            },
            EntryTarget::FillTemp => match v {
                None => Err(InputError::new("fill temperature", "enter a temperature")),
                Some(v) => {
                    let lo = u.temperature_value(Temperature::from_celsius(0.0)).ceil();
                    let hi = u.temperature_value(Temperature::from_celsius(60.0)).floor();
                    check_range("fill temperature", v, lo, hi, u.temperature_label())
                }
            },
            EntryTarget::LockerFirst | EntryTarget::LockerSecond => {
                let first = entry.target == EntryTarget::LockerFirst;
                match self.locker.draft.as_ref() {
                    None => Ok(()),
                    Some(d) => {
                        let spec = d.field_specs()[if first { 0 } else { 1 }];
                        match v {
                            None => Err(InputError::new(spec.0.to_lowercase(), "enter a value")),
                            Some(v) => {
                                check_range(&spec.0.to_lowercase(), v, spec.2, spec.3, spec.1)
                            }
                        }
                    }
                }
            }
        };
        let failed = result.is_err();
        if let Some(e) = self.entry.as_mut() {
            e.reason = result.err().map(|e| e.message).unwrap_or_default();
        }
        // While the typed text is unusable, the plan shows the value the entry started from.
        if apply
            && failed
            && is_live(entry.target)
            && entry.buffer.text() != entry.original
            && let Some(e) = self.entry.as_mut()
        {
            let typed = e.buffer.text().to_string();
            let reason = e.reason.clone();
            e.buffer.set_text(e.original.clone());
            self.validate_entry(true);
            if let Some(e) = self.entry.as_mut() {
                e.buffer.set_text(typed);
                e.reason = reason;
            }
        }
    }

    /// Done: keep the value (only possible when it is valid) and close.
    pub fn entry_done(&mut self) {
        self.validate_entry(true);
        let Some(entry) = self.entry.clone() else {
            return;
        };
        if !entry.reason.is_empty() {
            return;
        }
        let text = entry.buffer.text().trim().to_string();
        let v = entry.buffer.value();
        match entry.target {
            EntryTarget::WaterTemp => {
                if let Some(v) = v {
                    self.set_water_temp_value(v);
                }
            }
            EntryTarget::LockerName => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.name = text;
                }
            }
            EntryTarget::LockerNote => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.note = text;
                }
            }
            EntryTarget::FillPressure => {
                if let Some(v) = v {
                    self.fill.pressure = self.units().pressure(v);
                }
            }
            EntryTarget::FillTemp => {
                if let Some(v) = v {
                    self.fill.temperature = self.units().temperature(v);
                }
            }
            EntryTarget::LockerFirst => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.first = v;
                }
            }
            EntryTarget::LockerSecond => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.second = v;
                }
            }
            _ => self.save_team(),
        }
        self.entry = None;
    }

    /// Cancel: put back the value the entry started from.
    pub fn cancel_entry(&mut self) {
        if let Some(mut entry) = self.entry.take()
            && is_live(entry.target)
        {
            entry.buffer.set_text(entry.original.clone());
            self.entry = Some(entry);
            self.validate_entry(true);
            self.entry = None;
        }
    }
}

/// Entries whose value drives the plan as it is typed.
fn is_live(t: EntryTarget) -> bool {
    matches!(
        t,
        EntryTarget::Start(_)
            | EntryTarget::StageStart(_)
            | EntryTarget::Sac(_)
            | EntryTarget::Depth
            | EntryTarget::WaterTemp
            | EntryTarget::DiverName(_)
    )
}

fn round_down(v: f64, step: f64) -> f64 {
    crate::plan::matching::round_down_to_step(v, step)
}
fn round_up(v: f64, step: f64) -> f64 {
    crate::plan::matching::round_up_to_step(v, step)
}

fn capitalise(s: &str) -> String {
    let lower = s.to_lowercase();
    let mut c = lower.chars();
    match c.next() {
        Some(f) => f.to_uppercase().collect::<String>() + c.as_str(),
        None => String::new(),
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
