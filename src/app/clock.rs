//! The wall clock, handed in. The session reads it once at the start of each action
//! (`Session::begin_action`) and every decision and text of that action uses that one
//! reading, so a start cannot be fresh in one line and old in the next, and tests can
//! put the session at any time they like.

use std::cell::Cell;
use std::rc::Rc;

/// A source of the time, unix seconds.
pub trait Clock {
    /// Now, in unix seconds.
    fn now(&self) -> i64;
}

/// The system's clock.
#[derive(Clone, Copy, Debug, Default)]
pub struct SystemClock;

impl Clock for SystemClock {
    fn now(&self) -> i64 {
        std::time::SystemTime::now()
            .duration_since(std::time::UNIX_EPOCH)
            .map(|d| d.as_secs() as i64)
            .unwrap_or(0)
    }
}

/// A clock that shows what it is told: for tests, and for the random-tap robot that
/// jumps ahead. Clones share the same time.
#[derive(Clone, Debug, Default)]
pub struct ManualClock(Rc<Cell<i64>>);

impl ManualClock {
    /// A clock stopped at `at` (unix seconds).
    pub fn at(at: i64) -> Self {
        ManualClock(Rc::new(Cell::new(at)))
    }

    /// Set the time.
    pub fn set(&self, at: i64) {
        self.0.set(at);
    }

    /// Move the time on by `seconds`.
    pub fn advance(&self, seconds: i64) {
        self.0.set(self.0.get().saturating_add(seconds));
    }
}

impl Clock for ManualClock {
    fn now(&self) -> i64 {
        self.0.get()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_manual_clock_is_shared_by_its_clones() {
        let c = ManualClock::at(1_000);
        let d = c.clone();
        d.advance(60);
        assert_eq!(c.now(), 1_060);
        c.set(5);
        assert_eq!(d.now(), 5);
        assert!(SystemClock.now() > 1_700_000_000, "a 2023 or later clock");
    }
}
