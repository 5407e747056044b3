//! Whether the turns may be shown: the one answer, as data (which divers hold them back,
//! and why), worded here once for every page, the card and the shared plan.

use crate::app::readings::{StartStatus, when_text};
use crate::i18n::{tr, tr_with};

use super::TeamController;

/// Why a diver's start holds the turns back.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Held {
    /// Not read in the water for this dive.
    NotRead,
    /// Entered at `at` (unix seconds), too long ago to be this dive's reading.
    Old { at: i64 },
}

/// A diver whose start holds the turns back.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct Holder {
    pub diver: usize,
    pub why: Held,
}

/// The answer at one moment: empty when every start is a reading of this dive.
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct TurnsGate {
    pub holders: Vec<Holder>,
    names: Vec<String>,
    now: i64,
}

impl TeamController {
    /// May the turns be shown at `now`, and if not, which divers hold them back and why.
    pub fn turns_gate(&self, now: i64) -> TurnsGate {
        let holders = self
            .readings()
            .blocking(now)
            .into_iter()
            .filter(|&i| i < self.len())
            .map(|i| Holder {
                diver: i,
                why: match self.start_status(i, now) {
                    StartStatus::Old { at } => Held::Old { at },
                    _ => Held::NotRead,
                },
            })
            .collect();
        TurnsGate {
            holders,
            names: self.input.divers.iter().map(|d| d.name.clone()).collect(),
            now,
        }
    }
}

impl TurnsGate {
    /// Every start is a reading of this dive: the turns may be shown.
    pub fn open(&self) -> bool {
        self.holders.is_empty()
    }

    /// Why there are no turns yet, naming each diver; None when the turns may be shown.
    pub fn sentence(&self) -> Option<String> {
        if self.open() {
            return None;
        }
        let why: Vec<String> = self
            .holders
            .iter()
            .map(|h| {
                let name = &self.names[h.diver];
                match h.why {
                    Held::Old { at } => tr_with(
                        "{0} (start entered {1}: check)",
                        &[name, &when_text(at, self.now)],
                    ),
                    Held::NotRead => tr_with("{0} (start not read)", &[name]),
                }
            })
            .collect();
        Some(tr_with(
            "No turn pressures until every start is read in the water today: {0}.",
            &[&why.join(", ")],
        ))
    }

    /// The same in a few words, for the Team page's one-line summary: "No turns yet. Read
    /// in the water: Ines, Bram. Check the gauge: Sol."
    pub fn short(&self) -> Option<String> {
        if self.open() {
            return None;
        }
        let names = |old: bool| -> Vec<&str> {
            self.holders
                .iter()
                .filter(|h| matches!(h.why, Held::Old { .. }) == old)
                .map(|h| self.names[h.diver].as_str())
                .collect()
        };
        let (read, check) = (names(false), names(true));
        let mut text = tr("No turns yet.");
        if !read.is_empty() {
            text += " ";
            text += &tr_with("Read in the water: {0}.", &[&read.join(", ")]);
        }
        if !check.is_empty() {
            text += " ";
            text += &tr_with("Check the gauge: {0}.", &[&check.join(", ")]);
        }
        Some(text)
    }
}
