//! The random-tap robot: its actions, how it chooses them, and the shrinking of a failing
//! run to the shortest list of actions that still fails. The checks are in `checks.rs`.

mod checks;

use std::panic::{AssertUnwindSafe, catch_unwind};
use std::rc::Rc;
use std::time::{Duration, Instant};

use i_slint_backend_testing::{ElementHandle, ElementQuery};
use slint::ComponentHandle;
use slint::platform::{Key, PointerEventButton, WindowEvent};
use turnsheet::app::clock::ManualClock;
use turnsheet::app::session::GAUGES;
use turnsheet::app::ui::KeypadAdapter;
use turnsheet::app::{App, CLOCK_WATCH};

/// 3 December 2026, 23:20 UTC: the first readings of a run are taken before midnight
/// and the robot's clock jumps carry it past.
pub const START: i64 = 1_796_340_000;

#[derive(Clone, Copy, Debug)]
pub enum Team {
    /// The demo team (every diver on bar).
    Demo,
    /// The demo team with Bram on a psi gauge (100 psi) and Sol on 5 bar.
    MixedGauges,
}

#[derive(Clone, Copy, Debug)]
pub struct Config {
    pub team: Team,
    pub size: (f32, f32),
}

/// One thing the robot does. Replayable: a control is named by its accessible label.
#[derive(Clone, Debug)]
pub enum Action {
    /// The control's accessibility action (as a screen reader or a finger on it).
    Press(String),
    /// A pointer tap at the control's centre (exercises taps that land on moved controls).
    Tap(String),
    /// Back (Escape on the desktop, the system Back on Android).
    Back,
    /// The wall clock moves on by this many seconds; the window's clock watch runs.
    Clock(i64),
    /// Scroll the page under the first control by this many pixels.
    Scroll(f32),
    /// Time passes for animations and the tap guard (milliseconds).
    Wait(u64),
    /// Keys pressed one after another on the open keypad, as a diver types what the
    /// gauge reads: "clear", the digits, "done".
    Type(String),
    /// A screen reader's action on a control the testing backend lists (those scrolled
    /// into view), by its label rather than a finger: the robot saves cards this way, so
    /// that the card check has cards to read.
    Reach(String),
}

#[derive(Default)]
pub struct Report {
    pub actions: usize,
    pub checks: usize,
    pub violations: usize,
    /// Cards the robot had the app write (each one's turns checked against the core).
    pub cards: usize,
    /// Milliseconds from an action to the redrawn window, when timed.
    pub frame_ms: Vec<f64>,
}

/// A small deterministic generator (xorshift64*), so the robot needs no crate.
pub struct Rng(u64);

impl Rng {
    pub fn new(seed: u64) -> Self {
        Rng(seed.max(1))
    }
    pub fn next(&mut self) -> u64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        self.0.wrapping_mul(0x2545_f491_4f6c_dd1d)
    }
    pub fn below(&mut self, n: usize) -> usize {
        (self.next() % n.max(1) as u64) as usize
    }
    pub fn chance(&mut self, percent: u64) -> bool {
        self.next() % 100 < percent
    }
}

/// One labelled element as the robot saw it after an action.
#[derive(Clone)]
pub struct Seen {
    pub label: String,
    pub value: String,
    pub description: String,
    pub button: bool,
    pub enabled: bool,
    pub x: f32,
    pub y: f32,
    pub w: f32,
    pub h: f32,
    pub handle: ElementHandle,
}

/// The app under the robot, with its clock and data directory.
pub struct Robot {
    pub app: App,
    pub clock: ManualClock,
    pub dir: tempfile::TempDir,
    pub size: (f32, f32),
    /// Cards in the data directory at the last check.
    pub cards_seen: std::cell::Cell<usize>,
    /// Checks run so far (the whole-layout check runs on every `LAYOUT_EVERY`th).
    pub checks_run: std::cell::Cell<usize>,
}

impl Robot {
    pub fn new(config: Config) -> Robot {
        let clock = ManualClock::at(START);
        let dir = tempfile::tempdir().unwrap();
        let app = App::with_clock(dir.path(), Rc::new(clock.clone())).unwrap();
        app.window
            .window()
            .set_size(slint::LogicalSize::new(config.size.0, config.size.1));
        if let Team::MixedGauges = config.team {
            let mut s = app.session.borrow_mut();
            s.set_gauge(1, GAUGES[2]);
            s.set_gauge(2, GAUGES[1]);
        }
        turnsheet::app::adapters::refresh_all(&app.window, &app.session.borrow());
        Robot {
            app,
            clock,
            dir,
            size: config.size,
            cards_seen: std::cell::Cell::new(0),
            checks_run: std::cell::Cell::new(0),
        }
    }

    /// Every element with an accessible label, in one walk of the tree.
    pub fn look(&self) -> Vec<Seen> {
        ElementQuery::from_root(&self.app.window)
            .match_descendants()
            .find_all()
            .into_iter()
            .filter_map(|e| {
                let label = e.accessible_label()?.to_string();
                if label.is_empty() {
                    return None;
                }
                let p = e.absolute_position();
                let size = e.size();
                Some(Seen {
                    label,
                    value: e
                        .accessible_value()
                        .unwrap_or_default()
                        .replace('\u{a0}', " "),
                    description: e.accessible_description().unwrap_or_default().to_string(),
                    button: e.accessible_role()
                        == Some(i_slint_backend_testing::AccessibleRole::Button),
                    enabled: e.accessible_enabled() != Some(false),
                    x: p.x,
                    y: p.y,
                    w: size.width,
                    h: size.height,
                    handle: e,
                })
            })
            .collect()
    }

    /// Controls a finger could reach: enabled buttons with their centre in the window. The
    /// language choice is left out: the checks read the English accessible labels, so the
    /// robot stays in English (tests/ui_languages.rs and the small-phone test cover the
    /// other languages).
    pub fn buttons<'a>(&self, seen: &'a [Seen]) -> Vec<&'a Seen> {
        let (w, h) = self.size;
        seen.iter()
            .filter(|e| e.button && e.enabled && e.w > 0.0)
            .filter(|e| !e.label.starts_with("language "))
            .filter(|e| {
                (0.0..w).contains(&(e.x + e.w / 2.0)) && (0.0..h).contains(&(e.y + e.h / 2.0))
            })
            .collect()
    }

    fn find(&self, label: &str) -> Option<ElementHandle> {
        let seen = self.look();
        self.buttons(&seen)
            .into_iter()
            .find(|e| e.label == label)
            .map(|e| e.handle.clone())
    }

    /// Do `a`. A control that is no longer there makes it a no-op (replays stay valid).
    pub fn apply(&self, a: &Action) {
        match a {
            Action::Press(label) => {
                if let Some(e) = self.find(label) {
                    e.invoke_accessible_default_action();
                }
            }
            Action::Tap(label) => {
                if let Some(e) = self.find(label) {
                    e.mock_single_click(PointerEventButton::Left);
                }
            }
            Action::Back => {
                let w = self.app.window.window();
                w.dispatch_event(WindowEvent::KeyPressed {
                    text: Key::Escape.into(),
                });
                w.dispatch_event(WindowEvent::KeyReleased {
                    text: Key::Escape.into(),
                });
            }
            Action::Clock(s) => {
                self.clock.advance(*s);
                i_slint_backend_testing::mock_elapsed_time(CLOCK_WATCH);
            }
            Action::Scroll(dy) => {
                if let Some(e) = self.find_any() {
                    e.scroll(0.0, *dy);
                }
            }
            Action::Wait(ms) => {
                i_slint_backend_testing::mock_elapsed_time(Duration::from_millis(*ms));
            }
            Action::Type(digits) => {
                let keys = std::iter::once("clear".to_string())
                    .chain(digits.chars().map(String::from))
                    .chain(std::iter::once("done".to_string()));
                for key in keys {
                    if let Some(e) = self.find(&key) {
                        e.invoke_accessible_default_action();
                    }
                    slint::platform::update_timers_and_animations();
                }
            }
            Action::Reach(label) => {
                let seen = self.look();
                if let Some(e) = seen
                    .iter()
                    .find(|e| e.button && e.enabled && &e.label == label)
                {
                    e.handle.invoke_accessible_default_action();
                }
            }
        }
        slint::platform::update_timers_and_animations();
    }

    /// A control in the middle of the window, where the page scrolls (the header's and
    /// the fixed bottom button's would not), else any.
    fn find_any(&self) -> Option<ElementHandle> {
        let seen = self.look();
        let buttons = self.buttons(&seen);
        let h = self.size.1;
        buttons
            .iter()
            .find(|e| (0.3 * h..0.7 * h).contains(&(e.y + e.h / 2.0)))
            .or(buttons.first())
            .map(|e| e.handle.clone())
    }

    /// The next action, chosen from what is on screen (`seen`, after the last action).
    pub fn choose(&self, rng: &mut Rng, seen: &[Seen]) -> Action {
        let buttons = self.buttons(seen);
        let label = |rng: &mut Rng| {
            if buttons.is_empty() {
                None
            } else {
                Some(buttons[rng.below(buttons.len())].label.clone())
            }
        };
        if self.app.window.global::<KeypadAdapter>().get_open() {
            // Now and then a whole reading, in bar or psi (a wrong unit is refused).
            if rng.chance(30) {
                let readings = ["180", "210", "230", "250", "285", "2400", "2950", "3000"];
                return Action::Type(readings[rng.below(readings.len())].into());
            }
            let r = rng.below(100);
            return match r {
                0..=59 => Action::Press(format!("{}", rng.below(10))),
                60..=74 => Action::Press("done".into()),
                75..=79 => Action::Press("cancel entry".into()),
                80..=84 => Action::Back,
                _ => label(rng).map_or(Action::Back, Action::Press),
            };
        }
        // On the Turns page, now and then the card is saved (from wherever the page is
        // scrolled), so the card check has cards to read.
        if seen.iter().any(|e| e.label == "save card") && rng.chance(25) {
            return Action::Reach("save card".into());
        }
        // The locker's pages hold the robot long (each tap there opens more of them):
        // it goes back from them more often than from the others.
        let page = self
            .app
            .window
            .global::<turnsheet::app::ui::Nav>()
            .get_page();
        if matches!(
            page,
            turnsheet::app::ui::Page::Locker | turnsheet::app::ui::Page::LockerEdit
        ) && rng.chance(15)
        {
            return Action::Back;
        }
        match rng.below(100) {
            0..=5 => Action::Back,
            // The clock jumps less often than a diver reads three gauges, so the turns
            // of a whole team are shown (and checked) as well as withheld.
            6..=8 => Action::Clock(
                [
                    60,
                    20 * 60,
                    2 * 3600 + 50 * 60,
                    3 * 3600 + 5 * 60,
                    10 * 3600,
                ][rng.below(5)],
            ),
            9..=15 => Action::Scroll(if rng.chance(50) { -240.0 } else { 240.0 }),
            16..=19 => Action::Wait(rng.below(600) as u64),
            20..=29 => label(rng).map_or(Action::Back, Action::Tap),
            30..=31 if seen.iter().any(|e| e.label == "show turns") => {
                // Then the turns are looked at (and, above, the card saved).
                Action::Press("show turns".into())
            }
            32..=49 => {
                // Reading a gauge is what a diver does most on the dock: any diver's
                // the backend lists (half the time as a screen reader reaches it).
                let reach = rng.chance(50);
                let reading: Vec<&String> = seen
                    .iter()
                    .filter(|e| e.button && e.enabled)
                    .filter(|e| reach || buttons.iter().any(|b| b.label == e.label))
                    .map(|e| &e.label)
                    .filter(|l| {
                        l.starts_with("confirm start of")
                            || l.starts_with("start pressure of")
                            || l.starts_with("stage pressure of")
                    })
                    .collect();
                if reading.is_empty() {
                    label(rng).map_or(Action::Back, Action::Press)
                } else {
                    let l = reading[rng.below(reading.len())].clone();
                    if reach {
                        Action::Reach(l)
                    } else {
                        Action::Press(l)
                    }
                }
            }
            _ => label(rng).map_or(Action::Back, Action::Press),
        }
    }
}

/// Replay `actions` on a fresh robot; the first violation (or panic), if any.
fn replay(config: Config, actions: &[Action]) -> Option<String> {
    let robot = Robot::new(config);
    for a in actions {
        let r = catch_unwind(AssertUnwindSafe(|| {
            robot.apply(a);
            checks::check(&robot, &robot.look())
        }));
        match r {
            Ok(Ok(_)) => {}
            Ok(Err(v)) => return Some(v),
            Err(p) => return Some(format!("panic: {}", panic_text(&p))),
        }
    }
    None
}

fn panic_text(p: &Box<dyn std::any::Any + Send>) -> String {
    p.downcast_ref::<String>()
        .cloned()
        .or_else(|| p.downcast_ref::<&str>().map(|s| s.to_string()))
        .unwrap_or_default()
}

/// Shorten a failing list of actions: drop chunks (halves, then quarters, … then single
/// actions) while the run still fails, within `budget` of time, so a failure always ends
/// the test in bounded time, with the shortest list found so far.
fn shrink(config: Config, mut actions: Vec<Action>, budget: Duration) -> Vec<Action> {
    let t0 = Instant::now();
    let mut chunk = actions.len().div_ceil(2).max(1);
    loop {
        let mut i = 0;
        while i < actions.len() {
            if t0.elapsed() > budget {
                return actions;
            }
            let mut shorter = actions.clone();
            shorter.drain(i..(i + chunk).min(actions.len()));
            if replay(config, &shorter).is_some() {
                actions = shorter;
            } else {
                i += chunk;
            }
        }
        if chunk == 1 {
            return actions;
        }
        chunk = chunk.div_ceil(2);
    }
}

/// Seconds the shrinking of a failing run may take (`TURNSHEET_MONKEY_SHRINK_SECS`).
fn shrink_budget() -> Duration {
    Duration::from_secs(
        std::env::var("TURNSHEET_MONKEY_SHRINK_SECS")
            .ok()
            .and_then(|s| s.parse().ok())
            .unwrap_or(120),
    )
}

/// Run `total` actions spread over `configs`, each from its own seed.
pub fn run_all(configs: &[Config], seed: u64, total: usize) -> Report {
    i_slint_backend_testing::init_no_event_loop();
    let timed = std::env::var_os("TURNSHEET_MONKEY_TIMING").is_some();
    let per = total.div_ceil(configs.len());
    let mut report = Report::default();
    for (k, &config) in configs.iter().enumerate() {
        let timed_from = report.frame_ms.len();
        let seed = seed.wrapping_add(k as u64 * 0x9e37_79b9);
        let mut rng = Rng::new(seed);
        let robot = Robot::new(config);
        let mut done: Vec<Action> = Vec::new();
        let mut seen = robot.look();
        for _ in 0..per {
            let a = robot.choose(&mut rng, &seen);
            done.push(a.clone());
            let frame = std::cell::Cell::new(0.0);
            let r = catch_unwind(AssertUnwindSafe(|| {
                let t0 = Instant::now();
                robot.apply(&a);
                if timed {
                    // The software renderer draws the whole window, as after a tap.
                    let _ = robot.app.window.window().take_snapshot();
                    frame.set(t0.elapsed().as_secs_f64() * 1000.0);
                }
                seen = robot.look();
                checks::check(&robot, &seen)
            }));
            if timed {
                report.frame_ms.push(frame.get());
            }
            report.actions += 1;
            if report.actions.is_multiple_of(10_000) {
                println!(
                    "progress: {} actions, {} checks, {} violations",
                    report.actions, report.checks, report.violations
                );
            }
            let violation = match r {
                Ok(Ok(n)) => {
                    report.checks += n;
                    None
                }
                Ok(Err(v)) => Some(v),
                Err(p) => Some(format!("panic: {}", panic_text(&p))),
            };
            if let Some(v) = violation {
                report.violations += 1;
                println!(
                    "VIOLATION with seed {seed:#x} on {config:?} after {} actions: {v}",
                    done.len()
                );
                let short = shrink(config, done.clone(), shrink_budget());
                println!("shortest list found ({} actions): {short:#?}", short.len());
                break;
            }
        }
        report.cards += robot.cards_seen.get();
        if timed {
            print_times(&format!("{config:?}"), &report.frame_ms[timed_from..]);
        }
    }
    println!(
        "{} actions, {} checks, {} violations; {} cards written and read back",
        report.actions, report.checks, report.violations, report.cards
    );
    report
}

/// Median, 99th percentile and worst of `ms`.
fn print_times(what: &str, ms: &[f64]) {
    if ms.is_empty() {
        return;
    }
    let mut v = ms.to_vec();
    v.sort_by(f64::total_cmp);
    let at = |q: f64| v[((v.len() - 1) as f64 * q).round() as usize];
    println!(
        "{what}: action to redrawn window: median {:.2} ms, p99 {:.2} ms, worst {:.2} ms ({} actions)",
        at(0.5),
        at(0.99),
        v[v.len() - 1],
        v.len()
    );
}
