//! A second dive of the same team, and when each start was read.

use crate::app::readings::{Source, StartStatus, clock_text};
use crate::i18n::{tr, tr_with};

use super::Session;

impl Session {
    /// "Next dive": the same divers, cylinders, mixes and gauges; every start and stage
    /// start unread, so no turn of the last dive can look current. Undo puts the last
    /// dive's readings back.
    pub fn next_dive(&mut self) {
        let before = self.team.to_state();
        self.team.forget_readings();
        self.save_team();
        self.offer_undo(
            tr("Next dive: every start is unread. Read each gauge in the water."),
            before,
        );
    }

    /// Between actions: read the clock, and say whether any start or stage start changed
    /// what it is worth since the last look (then the views must be drawn again).
    pub fn tick(&mut self) -> bool {
        self.begin_action();
        let now = self.now;
        let seen: Vec<(StartStatus, Option<StartStatus>)> = (0..self.team.len())
            .map(|i| {
                (
                    self.team.start_status(i, now),
                    self.team.stage_status(i, now),
                )
            })
            .collect();
        let changed = seen != self.seen_statuses;
        self.seen_statuses = seen;
        changed
    }

    /// "read 09:42" (or "predicted 09:42") for a start usable now; empty otherwise.
    pub fn read_text(&self, i: usize) -> String {
        let Some(r) = self.team.readings().get(i) else {
            return String::new();
        };
        match (self.team.start_status(i, self.now), r.source) {
            (StartStatus::Fresh, Source::Gauge) => tr_with("read {0}", &[&clock_text(r.at)]),
            (StartStatus::Predicted, Source::Prediction) => {
                tr_with("predicted {0}", &[&clock_text(r.at)])
            }
            _ => String::new(),
        }
    }
}

#[cfg(test)]
mod tests {
    use std::rc::Rc;

    use crate::app::clock::ManualClock;
    use crate::app::readings::StartStatus;
    use crate::app::session::Session;
    use crate::storage::Store;

    /// 3 December 2026, 23:58 UTC.
    const LATE: i64 = 1_796_342_280;

    fn session_at(clock: &ManualClock) -> (tempfile::TempDir, Session) {
        let dir = tempfile::tempdir().unwrap();
        let s = Session::open_with_clock(Store::new(dir.path()), Rc::new(clock.clone()));
        (dir, s)
    }

    #[test]
    fn starts_read_before_midnight_still_plan_after_it() {
        let clock = ManualClock::at(LATE);
        let (_dir, mut s) = session_at(&clock);
        s.begin_action();
        for i in 0..s.team.len() {
            s.confirm_start(i);
        }
        clock.advance(7 * 60); // 00:05 the next day
        s.begin_action();
        assert!(
            s.team.turns_ready(s.now()),
            "seven minutes later, a new day"
        );
        assert!(s.read_text(0).starts_with("read "), "{}", s.read_text(0));
        clock.advance(3 * 3600 - 7 * 60 + 1); // three hours and a second after reading
        s.begin_action();
        assert!(!s.team.turns_ready(s.now()));
        assert_eq!(s.read_text(0), "", "an old start says no read time");
    }

    #[test]
    fn a_tick_says_when_a_start_ages_out() {
        let clock = ManualClock::at(LATE);
        let (_dir, mut s) = session_at(&clock);
        s.begin_action();
        s.confirm_start(0);
        assert!(s.tick(), "the first look sees new statuses");
        clock.advance(60);
        assert!(!s.tick(), "a minute later nothing changed");
        clock.advance(3 * 3600);
        assert!(s.tick(), "three hours later the start is old");
        assert!(matches!(
            s.team.start_status(0, s.now()),
            StartStatus::Old { .. }
        ));
    }

    #[test]
    fn the_clock_is_read_once_per_action() {
        let clock = ManualClock::at(LATE);
        let (_dir, mut s) = session_at(&clock);
        s.begin_action();
        s.confirm_start(0);
        clock.advance(4 * 3600);
        assert_eq!(
            s.team.start_status(0, s.now()),
            StartStatus::Fresh,
            "until the next action begins, the time stands"
        );
        s.begin_action();
        assert!(matches!(
            s.team.start_status(0, s.now()),
            StartStatus::Old { .. }
        ));
    }

    #[test]
    fn next_dive_keeps_the_team_and_unreads_every_start_with_undo() {
        let clock = ManualClock::at(LATE);
        let (dir, mut s) = session_at(&clock);
        s.begin_action();
        for i in 0..s.team.len() {
            s.confirm_start(i);
            if s.team.input().divers[i].stage.is_some() {
                s.team.mark_stage_read(i, s.now());
            }
        }
        let before = s.team.to_state();
        clock.advance(600);
        s.begin_action();
        s.next_dive();
        assert_eq!(
            s.team.input(),
            &before.team.to_input().unwrap(),
            "same divers"
        );
        assert_eq!(s.team.labels(), &before.cylinder_labels[..]);
        assert_eq!(s.team.readings().blocking(s.now()).len(), s.team.len());
        assert!(
            s.team.stages_blocking(s.now()).contains(&0),
            "stage unread too"
        );
        assert!(s.undo_text().contains("Next dive"), "{}", s.undo_text());
        // Saved: a restart shows the next dive, not the last one.
        let again = Session::open_with_clock(Store::new(dir.path()), Rc::new(clock.clone()));
        assert!(!again.team.turns_ready(again.now()));
        s.undo();
        assert_eq!(s.team.to_state(), before, "undo puts the readings back");
    }
}
