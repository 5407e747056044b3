//! Observations about a plan that do not stop it: typed values (which diver, which
//! kind, the figures), put into words only where they are shown.

use super::gauge::PressureUnit;
use super::shown;
use crate::i18n::{tr, tr_with};

/// Which of a diver's gas supplies a warning is about.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Supply {
    /// The main cylinders (back gas).
    Main,
    /// The stage.
    Stage,
}

/// One warning, with its figures in the diver's own gauge unit.
#[derive(Clone, Debug, PartialEq)]
pub enum Warning {
    /// The rule of halves was chosen: it keeps no reserve for a teammate.
    HalvesInOverhead,
    /// Only one diver carries a stage, so it is matched against nobody.
    LoneStage {
        /// The diver with the stage.
        diver: usize,
    },
    /// A start above the working pressure by more than half a graduation, up to 10 %.
    AboveWorking {
        /// The diver.
        diver: usize,
        /// Main gas or stage.
        supply: Supply,
        /// The start, in `unit`.
        start: f64,
        /// The working pressure, in `unit`.
        working: f64,
        /// The diver's gauge unit.
        unit: PressureUnit,
    },
    /// A start more than 10 % above the working pressure: an overfill.
    Overfill {
        /// The diver.
        diver: usize,
        /// Main gas or stage.
        supply: Supply,
        /// The start, in `unit`.
        start: f64,
        /// The working pressure, in `unit`.
        working: f64,
        /// The diver's gauge unit.
        unit: PressureUnit,
    },
    /// A start under half the working pressure.
    LowFill {
        /// The diver.
        diver: usize,
        /// Main gas or stage.
        supply: Supply,
        /// The start, in `unit`.
        start: f64,
        /// The diver's gauge unit.
        unit: PressureUnit,
    },
    /// The turn, rounded up to the graduation, reaches the start: nothing to spend.
    TurnEqualsStart {
        /// The diver.
        diver: usize,
    },
    /// Nobody spends gas before the turn, so the out-of-gas check tests nothing.
    NoGasSpent,
}

/// Share over the working pressure beyond which a fill is called an overfill
/// (common practice: a 10 % overfill mark is stamped on some low-pressure steel).
pub const OVERFILL_SHARE: f64 = 0.10;

impl Warning {
    /// The diver the warning is about, if it is about one.
    pub fn diver(&self) -> Option<usize> {
        match *self {
            Warning::HalvesInOverhead | Warning::NoGasSpent => None,
            Warning::LoneStage { diver }
            | Warning::AboveWorking { diver, .. }
            | Warning::Overfill { diver, .. }
            | Warning::LowFill { diver, .. }
            | Warning::TurnEqualsStart { diver } => Some(diver),
        }
    }

    /// The warning in words, without the diver's name (for a line on that diver's card).
    pub fn detail(&self) -> String {
        match *self {
            Warning::HalvesInOverhead => tr(
                "Halves is an open-water rule; it leaves no reserve for a teammate in an overhead environment.",
            ),
            Warning::LoneStage { .. } => tr(
                "Only one diver carries a stage: it is planned on its own, with no teammate's stage to match.",
            ),
            Warning::AboveWorking {
                supply,
                start,
                working,
                unit,
                ..
            } => {
                let [s, u, w] = figures(start, working, unit);
                let args: [&dyn std::fmt::Display; 3] = [&s, &u, &w];
                match supply {
                    Supply::Main => tr_with(
                        "Start {0} {1} is above the working pressure {2} {1}; check the fill and the cylinder's rating.",
                        &args,
                    ),
                    Supply::Stage => tr_with(
                        "Stage start {0} {1} is above the working pressure {2} {1}; check the fill and the cylinder's rating.",
                        &args,
                    ),
                }
            }
            Warning::Overfill {
                supply,
                start,
                working,
                unit,
                ..
            } => {
                let [s, u, w] = figures(start, working, unit);
                let args: [&dyn std::fmt::Display; 3] = [&s, &u, &w];
                match supply {
                    Supply::Main => tr_with(
                        "Overfill: start {0} {1} is more than 10 % above the working pressure {2} {1}. Check the cylinder is rated for it, or do not use it.",
                        &args,
                    ),
                    Supply::Stage => tr_with(
                        "Overfill: stage start {0} {1} is more than 10 % above the working pressure {2} {1}. Check the cylinder is rated for it, or do not use it.",
                        &args,
                    ),
                }
            }
            Warning::LowFill {
                supply,
                start,
                unit,
                ..
            } => {
                let [s, u, _] = figures(start, 0.0, unit);
                let args: [&dyn std::fmt::Display; 2] = [&s, &u];
                match supply {
                    Supply::Main => tr_with(
                        "Start {0} {1} is under half the working pressure; a low fill leaves little to share.",
                        &args,
                    ),
                    Supply::Stage => tr_with(
                        "Stage start {0} {1} is under half the working pressure; a low fill leaves little to share.",
                        &args,
                    ),
                }
            }
            Warning::TurnEqualsStart { .. } => tr(
                "The turn equals the start pressure; at this graduation there is no gas to spend.",
            ),
            Warning::NoGasSpent => {
                tr("No gas is spent before the turn; the out-of-gas check has nothing to test.")
            }
        }
    }

    /// The warning in a few words, for a place that already shows the value and whose
    /// supply it is (the keypad entering that start): a start's warnings name only the
    /// working pressure; every other warning is its [`detail`](Self::detail).
    pub fn brief(&self) -> String {
        match *self {
            Warning::AboveWorking { working, unit, .. } => {
                let [w, u, _] = figures(working, 0.0, unit);
                tr_with(
                    "Above the working pressure {0} {1}; check the fill.",
                    &[&w, &u],
                )
            }
            Warning::Overfill { working, unit, .. } => {
                let [w, u, _] = figures(working, 0.0, unit);
                tr_with(
                    "Overfill: more than 10 % above the working pressure {0} {1}.",
                    &[&w, &u],
                )
            }
            Warning::LowFill { .. } => tr("Under half the working pressure; little to share."),
            _ => self.detail(),
        }
    }

    /// The warning in words, led by the diver's name where it is about one diver.
    pub fn describe(&self, names: &[String]) -> String {
        match self.diver().and_then(|i| names.get(i)) {
            Some(name) => tr_with("{0}: {1}", &[name, &after_name(&self.detail())]),
            None => self.detail(),
        }
    }
}

/// A sentence as it follows "name:" in this thread's language. French, Spanish, Italian
/// and Portuguese go on in lower case after a colon; English and German keep the
/// sentence's capital (the languages' usual typography, from memory). A word in capitals
/// ("SAC", "EAN32") keeps them.
fn after_name(detail: &str) -> String {
    use crate::i18n::{Language, language};
    if matches!(language(), Language::English | Language::German) {
        return detail.to_string();
    }
    let mut c = detail.chars();
    match (c.next(), c.clone().next()) {
        (Some(first), Some(second)) if !second.is_uppercase() => {
            first.to_lowercase().collect::<String>() + c.as_str()
        }
        _ => detail.to_string(),
    }
}

/// A warning's figures as its sentences take them: {0} the start, {1} the unit, {2} the
/// working pressure.
fn figures(start: f64, working: f64, unit: PressureUnit) -> [String; 3] {
    [
        shown::num(start),
        unit.label().to_string(),
        shown::num(working),
    ]
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn words_name_the_diver_and_the_unit() {
        let w = Warning::Overfill {
            diver: 1,
            supply: Supply::Stage,
            start: 3400.0,
            working: 3000.0,
            unit: PressureUnit::Psi,
        };
        let names = vec!["Ines".to_string(), "Tomas".to_string()];
        let text = w.describe(&names);
        assert!(
            text.starts_with("Tomas: Overfill: stage start 3400 psi"),
            "{text}"
        );
        assert_eq!(w.diver(), Some(1));
        assert_eq!(
            Warning::NoGasSpent.describe(&names),
            Warning::NoGasSpent.detail()
        );
    }

    #[test]
    fn a_brief_warning_names_the_working_pressure_and_its_unit() {
        let w = Warning::Overfill {
            diver: 0,
            supply: Supply::Main,
            start: 300.0,
            working: 232.0,
            unit: PressureUnit::Bar,
        };
        assert_eq!(
            w.brief(),
            "Overfill: more than 10 % above the working pressure 232 bar."
        );
        assert!(w.brief().len() < w.detail().len());
        assert_eq!(Warning::NoGasSpent.brief(), Warning::NoGasSpent.detail());
    }

    #[test]
    fn each_language_sets_the_punctuation_after_the_name() {
        use crate::i18n::{Language, LanguageScope};
        let w = Warning::Overfill {
            diver: 0,
            supply: Supply::Main,
            start: 330.0,
            working: 300.0,
            unit: PressureUnit::Bar,
        };
        let names = vec!["Sol".to_string()];
        // French puts a no-break space before the colon and goes on in lower case.
        let fr = {
            let _fr = LanguageScope::new(Language::French);
            w.describe(&names)
        };
        assert!(fr.starts_with("Sol\u{a0}: "), "{fr}");
        let after = fr["Sol\u{a0}: ".len()..].chars().next().unwrap();
        assert!(after.is_lowercase(), "{fr}");
        // German keeps the capital of the noun after the colon.
        let de = {
            let _de = LanguageScope::new(Language::German);
            w.describe(&names)
        };
        assert!(de.starts_with("Sol: "), "{de}");
        assert!(de["Sol: ".len()..].starts_with(char::is_uppercase), "{de}");
        let _fr = LanguageScope::new(Language::French);
        assert_eq!(after_name("SAC unknown"), "SAC unknown");
        assert_eq!(after_name("Overfill"), "overfill");
    }
}
