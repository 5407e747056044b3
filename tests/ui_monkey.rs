//! A seeded robot that drives the real UI through the testing backend, as a random-input
//! tester drives a phone: taps on any enabled control (through its accessibility action or
//! as a pointer tap at its centre), keypad digits, Back, scrolling, pauses, and a clock
//! that jumps ahead. After every action it checks that nothing on screen comes from a start
//! that is not a reading of this dive, that every turn shown equals the planning core's for
//! the session's team, that the buddy view names the rule, that no text leaves the window,
//! and that nothing panicked.
//!
//! `cargo test --test ui_monkey` runs at least 5,000 actions; `-- --ignored` runs 100,000
//! (`TURNSHEET_MONKEY_ACTIONS` sets either; `TURNSHEET_MONKEY_SEED` the seed). It prints
//! "N actions, M checks, 0 violations"; on a violation, the seed and the shortest list of
//! actions that shows it.

mod layout_check;
mod monkey;

use monkey::{Config, Team, run_all};

/// The robot's seed: fixed, so a failure is the same on every machine.
fn seed() -> u64 {
    std::env::var("TURNSHEET_MONKEY_SEED")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(0x7e57_5eed)
}

fn actions(default: usize) -> usize {
    std::env::var("TURNSHEET_MONKEY_ACTIONS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(default)
}

fn configs() -> Vec<Config> {
    let mut v = Vec::new();
    for team in [Team::Demo, Team::MixedGauges] {
        for size in [(412.0, 915.0), (360.0, 640.0)] {
            v.push(Config { team, size });
        }
    }
    v
}

#[test]
fn the_robot_finds_no_wrong_or_stale_turn() {
    let report = run_all(&configs(), seed(), actions(5_000));
    assert!(report.actions >= 5_000 || std::env::var("TURNSHEET_MONKEY_ACTIONS").is_ok());
    assert_eq!(report.violations, 0, "see the action list above");
}

#[test]
#[ignore = "long: 100,000 actions (about an hour on 2 cores)"]
fn the_robot_finds_nothing_in_a_long_run() {
    let report = run_all(&configs(), seed() ^ 0x5151, actions(100_000));
    assert_eq!(report.violations, 0, "see the action list above");
}
