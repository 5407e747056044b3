//! Whether each diver's start pressure is a reading taken in the water for this dive.
//!
//! A turn pressure is only as good as its start. A start nobody read, one typed more
//! than three hours ago, or one taken from a fill prediction must never look like a
//! fresh gauge reading. Age is elapsed time only: a start read at 23:58 is still fresh
//! at 00:05. The team's plan still needs a number for every
//! start, so the team keeps one; this record says what that number is worth, and the
//! views show turns only when every start is fresh (a prediction is shown, marked).

use chrono::{Datelike, Local, TimeZone};

use crate::i18n::{tr, tr_with};

pub use crate::storage::team_state::{Source, StartReading};

/// What a start is worth right now.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum StartStatus {
    /// Nobody has entered a start for this diver.
    Missing,
    /// Read on the gauge within the last three hours.
    Fresh,
    /// Predicted from a fill within the last three hours: usable, marked.
    Predicted,
    /// Entered at `at`, more than three hours ago (or after `now`: a clock set back):
    /// check it.
    Old {
        /// Unix time, seconds.
        at: i64,
    },
}

impl StartStatus {
    /// Whether turns may be computed from this start.
    pub fn usable(self) -> bool {
        matches!(self, StartStatus::Fresh | StartStatus::Predicted)
    }
}

/// How long a start stays fresh (seconds of elapsed time).
pub const FRESH_FOR_S: i64 = 3 * 3600;

/// The starts of a team, one entry per diver in team order.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct Readings {
    starts: Vec<Option<StartReading>>,
}

impl Readings {
    /// `n` divers, none read.
    pub fn unread(n: usize) -> Self {
        Readings {
            starts: vec![None; n],
        }
    }

    /// From what was saved, fitted to `n` divers (missing entries are unread).
    pub fn from_saved(saved: &[Option<StartReading>], n: usize) -> Self {
        let mut starts = saved.to_vec();
        starts.resize(n, None);
        Readings { starts }
    }

    /// What to save.
    pub fn saved(&self) -> &[Option<StartReading>] {
        &self.starts
    }

    /// Diver `i`'s start was just entered (or confirmed) from `source`.
    pub fn mark(&mut self, i: usize, now: i64, source: Source) {
        if let Some(s) = self.starts.get_mut(i) {
            *s = Some(StartReading { at: now, source });
        }
    }

    /// Diver `i`'s start is no longer a reading (for example: the gauge changed unit).
    pub fn clear(&mut self, i: usize) {
        if let Some(s) = self.starts.get_mut(i) {
            *s = None;
        }
    }

    /// A diver was added at the end, unread.
    pub fn push_unread(&mut self) {
        self.starts.push(None);
    }

    /// Diver `i` was removed.
    pub fn remove(&mut self, i: usize) {
        if i < self.starts.len() {
            self.starts.remove(i);
        }
    }

    /// Put a removed diver's record back at `i` (undo).
    pub fn insert(&mut self, i: usize, r: Option<StartReading>) {
        let i = i.min(self.starts.len());
        self.starts.insert(i, r);
    }

    /// Diver `i`'s record.
    pub fn get(&self, i: usize) -> Option<StartReading> {
        self.starts.get(i).copied().flatten()
    }

    /// Diver `i`'s status at `now` (unix seconds).
    pub fn status(&self, i: usize, now: i64) -> StartStatus {
        status_of(self.get(i), now)
    }

    /// Every record unread (the next dive of the same team).
    pub fn clear_all(&mut self) {
        for s in &mut self.starts {
            *s = None;
        }
    }

    /// Whether every start may make turns at `now`.
    pub fn all_usable(&self, now: i64) -> bool {
        (0..self.starts.len()).all(|i| self.status(i, now).usable())
    }

    /// The divers whose start stops the turns at `now`, in team order.
    pub fn blocking(&self, now: i64) -> Vec<usize> {
        (0..self.starts.len())
            .filter(|&i| !self.status(i, now).usable())
            .collect()
    }
}

/// The status of one record at `now`: fresh for three hours of elapsed time, whatever
/// the calendar says; a record from the future (a clock set back) is old.
pub fn status_of(r: Option<StartReading>, now: i64) -> StartStatus {
    let Some(r) = r else {
        return StartStatus::Missing;
    };
    let age = now.saturating_sub(r.at);
    if !(0..=FRESH_FOR_S).contains(&age) {
        return StartStatus::Old { at: r.at };
    }
    match r.source {
        Source::Gauge => StartStatus::Fresh,
        Source::Prediction => StartStatus::Predicted,
    }
}

/// "09:42": the local time of a reading, for "read 09:42".
pub fn clock_text(at: i64) -> String {
    match Local.timestamp_opt(at, 0).single() {
        Some(t) => t.format("%H:%M").to_string(),
        None => "--:--".to_string(),
    }
}

/// "today 09:40", "yesterday 18:05" or "3 Dec 18:05": when an old start was entered.
pub fn when_text(at: i64, now: i64) -> String {
    let (Some(t), Some(n)) = (
        Local.timestamp_opt(at, 0).single(),
        Local.timestamp_opt(now, 0).single(),
    ) else {
        return tr("at an unknown time");
    };
    let days = (n.date_naive() - t.date_naive()).num_days();
    match days {
        0 => tr_with("today {0}", &[&t.format("%H:%M")]),
        1 => tr_with("yesterday {0}", &[&t.format("%H:%M")]),
        _ => format!("{} {}", day_month(&t), t.format("%H:%M")),
    }
}

/// The day and the month's short name in the language shown: "5 Dec".
pub fn day_month<T: Datelike>(t: &T) -> String {
    let month = match t.month() {
        1 => tr("Jan"),
        2 => tr("Feb"),
        3 => tr("Mar"),
        4 => tr("Apr"),
        5 => tr("May"),
        6 => tr("Jun"),
        7 => tr("Jul"),
        8 => tr("Aug"),
        9 => tr("Sep"),
        10 => tr("Oct"),
        11 => tr("Nov"),
        _ => tr("Dec"),
    };
    format!("{} {month}", t.day())
}

#[cfg(test)]
mod tests {
    use super::*;

    /// 2 December 2026 at h:m, UTC (elapsed time does not depend on the zone).
    fn at(h: u32, m: u32, day: u32) -> i64 {
        chrono::Utc
            .with_ymd_and_hms(2026, 12, day, h, m, 0)
            .unwrap()
            .timestamp()
    }

    #[test]
    fn fresh_for_three_hours_of_elapsed_time_across_midnight() {
        let r = |t, source| Some(StartReading { at: t, source });
        assert_eq!(status_of(None, at(9, 0, 2)), StartStatus::Missing);
        let read = r(at(9, 0, 2), Source::Gauge);
        assert_eq!(status_of(read, at(11, 59, 2)), StartStatus::Fresh);
        assert_eq!(
            status_of(read, at(12, 0, 2)),
            StartStatus::Fresh,
            "exactly 3 h"
        );
        assert_eq!(
            status_of(read, at(12, 1, 2)),
            StartStatus::Old { at: at(9, 0, 2) }
        );
        // Read at 23:58, diving at 00:05: the same dive.
        let late = r(at(23, 58, 2), Source::Gauge);
        assert_eq!(status_of(late, at(0, 5, 3)), StartStatus::Fresh);
        assert!(matches!(
            status_of(late, at(2, 59, 3)),
            StartStatus::Old { .. }
        ));
        let predicted = r(at(9, 0, 2), Source::Prediction);
        assert_eq!(status_of(predicted, at(9, 30, 2)), StartStatus::Predicted);
        assert!(StartStatus::Predicted.usable() && !StartStatus::Missing.usable());
        // A clock set back before the entry is not fresh either.
        assert!(matches!(
            status_of(read, at(8, 0, 2)),
            StartStatus::Old { .. }
        ));
    }

    #[test]
    fn records_follow_the_divers() {
        let mut r = Readings::unread(2);
        let now = at(10, 0, 2);
        assert_eq!(r.blocking(now), vec![0, 1]);
        r.mark(0, now, Source::Gauge);
        r.mark(1, now, Source::Prediction);
        assert!(r.all_usable(now));
        r.push_unread();
        assert_eq!(r.blocking(now), vec![2]);
        let removed = r.get(0);
        r.remove(0);
        assert_eq!(r.status(0, now), StartStatus::Predicted);
        r.insert(0, removed);
        assert_eq!(r.status(0, now), StartStatus::Fresh);
        r.clear(0);
        assert_eq!(r.status(0, now), StartStatus::Missing);
        let back = Readings::from_saved(r.saved(), 4);
        assert_eq!(back.blocking(now), vec![0, 2, 3]);
        r.mark(0, now, Source::Gauge);
        r.clear_all();
        assert_eq!(r.blocking(now), vec![0, 1, 2]);
    }
}
