//! The app session: every user action, on plain Rust state. The Slint adapters call
//! these methods and then redraw from the state; nothing here touches the toolkit.
//!
//! The session holds its pieces, each with its own methods and tests:
//! - the team being planned (`TeamController`), with the team and settings actions in
//!   `team_actions.rs`;
//! - the cylinder locker and its draft (`LockerController`), actions in `locker_actions.rs`;
//! - navigation and status (`NavController`, `Status`), here;
//! - the open keypad entry (`entry/`) and picker (`pickers.rs`, with the custom set in
//!   `custom_set.rs` and the mix choices in `mix_picker.rs`);
//! - the fill-to-water check and the pairing chart selection (`tools.rs`);
//! - the screen's colours (`appearance.rs`).

use crate::i18n::tr_with;
use crate::plan::InputError;
use crate::plan::UnitSystem;
use crate::storage::settings::Settings;
use crate::storage::{LoadReport, Store};

use std::rc::Rc;

use super::clock::{Clock, SystemClock};
use super::locker_controller::LockerController;
use super::nav::{NavController, Screen, Status};
use super::team_controller::TeamController;

mod appearance;
mod card;
mod changes;
mod custom_set;
mod dives;
mod entry;
mod gauge_chooser;
mod language;
mod locker_actions;
mod locker_exchange;
mod mix_picker;
mod pickers;
mod prompts;
mod saving;
mod share;
mod team_actions;
mod tools;
mod undo;

pub use custom_set::CustomSet;
pub use entry::{Entry, EntryTarget};
pub use gauge_chooser::GAUGES;
pub use locker_exchange::Exchange;
pub use mix_picker::{MixChoices, MixHistory};
pub use pickers::Picker;
pub use prompts::{AfterPrompt, Answer, Prompt};
pub use saving::{SavedFile, Unsaved};
pub use team_actions::DEMO_TEAM;
pub use tools::{CHART_ROWS, ChartPair, FillCheck, chart_columns};

pub struct Session {
    store: Store,
    /// The wall clock, handed in (tests and the robot use a `ManualClock`).
    clock: Rc<dyn Clock>,
    /// The clock's reading for the action under way (`begin_action`).
    now: i64,
    /// What each start was worth at the last `tick`.
    seen_statuses: Vec<(
        crate::app::readings::StartStatus,
        Option<crate::app::readings::StartStatus>,
    )>,
    pub settings: Settings,
    pub team: TeamController,
    pub locker: LockerController,
    pub nav: NavController,
    pub entry: Option<Entry>,
    pub picker: Picker,
    /// The diver whose gauge chooser is open.
    pub gauge_chooser: Option<usize>,
    /// The plan's QR code was opened (`share.rs`; shown only while turns are).
    plan_qr: bool,
    /// The mixes each diver chose since the app started (the mix picker offers them).
    pub mix_history: MixHistory,
    pub fill: FillCheck,
    pub chart: ChartPair,
    pub status: Status,
    /// Undo for the last diver removed or the team replaced, until the team changes.
    undo: Option<undo::UndoOffer>,
    /// The team before a keypad entry that changes the plan as it is typed (depth, water
    /// temperature), to say what Done changed.
    pending_change: Option<changes::Before>,
    /// Files whose last save failed; written again on every save.
    pub unsaved: Unsaved,
    /// The question on screen, if any.
    pub prompt: Prompt,
    /// Where locker exports go and imports come from.
    pub exchange: Exchange,
    /// The system's language (the platform says; English until it does).
    pub system_language: crate::i18n::Language,
}

impl Session {
    /// Load everything from the data directory; unreadable files are set aside and
    /// reported; the first launch gets the demo team and the cautions page.
    pub fn open(store: Store) -> Session {
        Session::open_with_clock(store, Rc::new(SystemClock))
    }

    /// The same, reading the time from `clock`.
    pub fn open_with_clock(store: Store, clock: Rc<dyn Clock>) -> Session {
        let now = clock.now();
        let mut store = store;
        let loaded = store.load();
        let LoadReport {
            mut messages,
            first_launch,
            settings_repaired,
        } = loaded.report;
        let settings = loaded.settings;
        let team = match loaded.team {
            Some(state) => match TeamController::from_state(&state) {
                Ok(t) => t,
                Err(e) => {
                    let kept = store.set_aside_team(&e.to_string());
                    messages.push(match kept {
                        Some(p) => tr_with(
                            "The last team could not be planned ({0}). It was kept as {1} and the demo team is shown instead.",
                            &[&e, &p.display()],
                        ),
                        None => tr_with(
                            "The last team could not be planned ({0}). It was left untouched and will not be overwritten; the demo team is shown instead.",
                            &[&e],
                        ),
                    });
                    team_actions::demo_team(&settings)
                }
            },
            None => team_actions::demo_team(&settings),
        };
        let first = if first_launch || !settings.cautions_acknowledged {
            Screen::Cautions
        } else {
            Screen::Team
        };
        let mut session = Session {
            clock,
            now,
            seen_statuses: Vec::new(),
            exchange: Exchange::for_data_dir(store.dir()),
            store,
            settings,
            fill: FillCheck::for_team(team.input()),
            chart: ChartPair::default(),
            team,
            locker: LockerController::new(loaded.locker),
            nav: NavController::new(first),
            entry: None,
            picker: Picker::None,
            gauge_chooser: None,
            plan_qr: false,
            mix_history: MixHistory::default(),
            status: Status::new(messages),
            undo: None,
            pending_change: None,
            unsaved: Unsaved::default(),
            prompt: Prompt::None,
            system_language: crate::i18n::Language::English,
        };
        if settings_repaired {
            session.save_settings();
        }
        session
    }

    /// Read the files again if another program changed them since they were last read
    /// or written (on resume). The page stays where it was. Returns whether it reloaded.
    /// Never while changes are unsaved: they would be lost (the locker is then merged,
    /// `refresh_locker`).
    pub fn reload_if_changed(&mut self) -> bool {
        if !self.all_saved() || !self.store.changed_on_disk() {
            return self.refresh_locker();
        }
        let page = self.nav.current();
        let dir = self.store.dir().to_path_buf();
        let fresh = Session::open_with_clock(Store::new(dir), self.clock.clone());
        let nav = self.nav.clone();
        let exchange = std::mem::take(&mut self.exchange);
        let history = std::mem::take(&mut self.mix_history);
        *self = fresh;
        self.exchange = exchange;
        self.mix_history = history;
        if page != Screen::Cautions && self.settings.cautions_acknowledged {
            self.nav = nav;
        }
        true
    }

    /// Read the clock for the action that starts now; every decision and text of the
    /// action uses this one reading.
    pub fn begin_action(&mut self) {
        self.now = self.clock.now();
    }

    /// The time of the action under way (unix seconds).
    pub fn now(&self) -> i64 {
        self.now
    }

    pub fn units(&self) -> UnitSystem {
        self.team.input().units
    }

    /// The data directory, for the about text.
    pub fn data_dir(&self) -> &std::path::Path {
        self.store.dir()
    }

    /// The page on screen.
    pub fn page(&self) -> Screen {
        self.nav.current()
    }

    /// Save the team after an accepted edit; report a refused one.
    fn team_result(&mut self, r: Result<(), InputError>) {
        match r {
            Ok(()) => self.save_team(),
            Err(e) => {
                let names: Vec<String> = self
                    .team
                    .input()
                    .divers
                    .iter()
                    .map(|d| d.name.clone())
                    .collect();
                self.status
                    .push(super::view_models::error_for_people(&names, &e))
            }
        }
    }

    // ---- navigation and status ---------------------------------------------------

    pub fn go(&mut self, s: Screen) {
        self.plan_qr = false;
        self.nav.go(s);
    }

    /// Back: closes a question (the safe answer), an entry or a picker first, then goes
    /// one page back. Leaving a changed locker edit asks first.
    pub fn back(&mut self) -> bool {
        if self.prompt != Prompt::None {
            self.prompt = Prompt::None;
            return true;
        }
        if self.entry.is_some() {
            self.cancel_entry();
            return true;
        }
        if self.picker != Picker::None {
            self.picker = Picker::None;
            return true;
        }
        if self.gauge_chooser.is_some() {
            self.gauge_chooser = None;
            return true;
        }
        if self.plan_qr_open() {
            self.plan_qr = false;
            return true;
        }
        self.plan_qr = false;
        if self.nav.current() == Screen::LockerEdit {
            return self.leave_locker_edit();
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
}

/// A session over a fresh temporary data directory (the demo team), for unit tests.
#[cfg(test)]
pub(crate) fn test_session() -> (tempfile::TempDir, Session) {
    let dir = tempfile::tempdir().unwrap();
    let s = Session::open(Store::new(dir.path()));
    (dir, s)
}

#[cfg(test)]
mod session_tests;
#[cfg(test)]
mod team_actions_tests;
