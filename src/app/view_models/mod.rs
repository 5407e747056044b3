//! Formatting the session for the views: the words around the numbers. Every number
//! a person reads is rounded and written by the core's `plan::shown` (turn pressures
//! up, start pressures and gas down, times down, the decimal separator). Adapters copy these texts into the Slint globals and do no arithmetic.
//!
//! `mod.rs` has the number helpers; the pages' view models are in `team.rs`,
//! `turns.rs` (with `stage_drop.rs`), `tools.rs` (fill check, chart), `locker.rs` (locker),
//! `pickers.rs` (cylinder and mix pickers),
//! `settings.rs` and `keypad.rs`.

use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::text::first_upper;
use crate::plan::{Depth, Gauge, Pressure, Rule, Temperature, UnitSystem, Volume};

use super::team_controller::step_options;

mod keypad;
mod locker;
mod pickers;
mod settings;
mod stage_drop;
mod team;
mod tools;
mod turns;

pub use keypad::{KeypadVm, keypad};
pub use locker::{LockerEditVm, LockerRowVm, locker_edit, locker_rows, preset_rows, undo_text};
pub use pickers::{CustomVm, MixRowVm, PickRowVm, PickerVm, picker, picker_title};
pub use settings::{SettingsVm, cautions, settings};
pub use stage_drop::stage_text;
pub use team::{
    DiverCardVm, GaugeChooserVm, TeamPageVm, demo_note, depth_label, diver_cards, gauge_chooser,
    status, team_page, team_summary, water_temp_text, water_text,
};
pub use tools::{ChartRowVm, ChartVm, FillVm, chart, fill};
pub use turns::{
    TurnRowVm, buddy_heading, controllers, first_text, margin_text, pressure_unit, rule_head,
    rule_text, starts_blocking, turn_rows, warnings,
};

/// Units that must stay on the line of their number.
const UNITS: [&str; 12] = [
    "L/min", "cu ft", "bar", "psi", "min", "°C", "°F", "L", "m", "ft", "×", "%",
];

/// The same text with a no-break space between each number and its unit (and inside
/// "cu ft"), so a narrow screen never puts "232" on one line and "bar" on the next.
pub fn keep_units_together(text: &str) -> String {
    const NBSP: char = '\u{a0}';
    let text = text.replace("cu ft", "cu\u{a0}ft");
    let chars: Vec<char> = text.chars().collect();
    let mut out = String::with_capacity(text.len());
    for (k, &c) in chars.iter().enumerate() {
        let after_number = k > 0 && chars[k - 1].is_ascii_digit();
        if c == ' ' && after_number {
            let rest: String = chars[k + 1..].iter().take(8).collect();
            let rest = rest.replace('\u{a0}', " ");
            let unit = UNITS.iter().any(|u| {
                rest.starts_with(u)
                    && rest[u.len()..]
                        .chars()
                        .next()
                        .is_none_or(|n| !n.is_alphanumeric())
            });
            if unit {
                out.push(NBSP);
                continue;
            }
        }
        out.push(c);
    }
    out
}

/// A start pressure as read: rounded down.
pub fn start_text(u: UnitSystem, p: Pressure) -> String {
    shown::start(u.pressure_value(p))
}

/// A pressure as read on a diver's gauge: rounded down, in the gauge's unit.
pub fn reading(g: Gauge, p: Pressure) -> String {
    shown::start(g.value(p))
}

/// A pressure rounded down, with its unit: "232 bar".
pub fn pressure_down_text(u: UnitSystem, p: Pressure) -> String {
    format!("{} {}", start_text(u, p), u.pressure_label())
}

/// A temperature to the nearest degree, without its unit.
pub fn degrees(u: UnitSystem, t: Temperature) -> String {
    shown::degrees(u.temperature_value(t))
}

/// A temperature to the nearest degree, with its unit: "12 °C".
pub fn temperature_text(u: UnitSystem, t: Temperature) -> String {
    format!("{} {}", degrees(u, t), u.temperature_label())
}

/// A volume rounded down to a whole litre or cubic foot, with its unit.
pub fn volume_down_text(u: UnitSystem, v: Volume) -> String {
    format!("{} {}", shown::start(u.volume_value(v)), u.volume_label())
}

/// A breathing rate in the team's unit, to two decimals at most.
pub fn rate_text(u: UnitSystem, litres_per_min: f64) -> String {
    shown::num((u.volume_value(Volume::from_litres(litres_per_min)) * 100.0).round() / 100.0)
}

/// A depth as typed: metres as they are, feet as they are (the keypad shows both exactly).
pub fn depth_value(u: UnitSystem, d: Depth) -> String {
    shown::num(match u {
        UnitSystem::Metric => d.metres(),
        UnitSystem::Imperial => d.feet(),
    })
}

/// A depth as shown on the Team page: feet to the nearest foot; no depth is "Depth —".
pub fn depth_text(d: Option<Depth>, u: UnitSystem) -> String {
    match d {
        None => tr("Depth —"),
        Some(d) => format!(
            "{} {}",
            shown::num(match u {
                UnitSystem::Metric => d.metres(),
                UnitSystem::Imperial => d.feet().round(),
            }),
            u.depth_label()
        ),
    }
}

/// The gauge steps offered, with their unit: "5 bar", "10 bar".
pub fn step_labels(u: UnitSystem) -> Vec<String> {
    step_options(u)
        .iter()
        .map(|s| format!("{} {}", shown::num(*s), u.pressure_label()))
        .collect()
}

/// The position of `step` among the offered steps, or −1.
pub fn step_index(u: UnitSystem, step: f64) -> i32 {
    step_options(u)
        .iter()
        .position(|s| (*s - step).abs() < 1e-9)
        .map(|i| i as i32)
        .unwrap_or(-1)
}

/// The rules on their buttons, in `Rule::ALL` order: "½", "⅓", …
pub fn rule_symbols() -> Vec<String> {
    Rule::ALL
        .iter()
        .map(|r| {
            match r.denominator() {
                2 => "½",
                3 => "⅓",
                4 => "¼",
                5 => "⅕",
                6 => "⅙",
                _ => "?",
            }
            .to_string()
        })
        .collect()
}

/// The rules' names for screen readers, in `Rule::ALL` order: "halves", "thirds", …
pub fn rule_names() -> Vec<String> {
    Rule::ALL.iter().map(|r| r.shown_name()).collect()
}

/// The position of `rule` in `Rule::ALL`.
pub fn rule_index(rule: Rule) -> i32 {
    Rule::ALL.iter().position(|r| *r == rule).unwrap_or(1) as i32
}

/// A warning under the rule choice for a rule not meant for overhead dives; empty
/// for the others.
pub fn rule_warning(rule: Rule) -> String {
    if rule.fit_for_overhead() {
        String::new()
    } else {
        tr_with(
            "{0} is an open-water rule, not for overhead dives.",
            &[&rule.title()],
        )
    }
}

/// Names joined as a person reads them: "Ines", "Ines and Bram".
pub fn and_list(names: &[&str]) -> String {
    let mut it = names.iter();
    let first = it.next().map(|n| n.to_string()).unwrap_or_default();
    it.fold(first, |acc, n| tr_with("{0} and {1}", &[&acc, n]))
}

/// The first letter upper case, the rest lower case.
pub fn capitalised(s: &str) -> String {
    first_upper(&s.to_lowercase())
}

/// A gauge with its graduation, each number with its unit: "bar, 10 bar steps" (the
/// diver card's gauge button, the Turns page, the status after a change).
pub fn gauge_text(g: Gauge) -> String {
    tr_with("{0}, {1} {0} steps", &[&g.label(), &shown::num(g.step)])
}

/// An input error in words for a person: the diver's name and the field in plain words
/// instead of a path like `divers[0].stage.start`.
pub fn error_for_people(names: &[String], e: &crate::plan::InputError) -> String {
    let mut field = e.field.as_str();
    let mut who = String::new();
    if let Some((n, tail)) = field
        .strip_prefix("divers[")
        .and_then(|rest| rest.split_once(']'))
    {
        if let Some(name) = n.parse::<usize>().ok().and_then(|i| names.get(i)) {
            who = name.clone();
        }
        field = tail.trim_start_matches('.');
    }
    let what = field_words(field);
    match (who.is_empty(), what.is_empty()) {
        (true, true) => first_upper(&e.message),
        (true, false) => tr_with("{0}: {1}", &[&first_upper(&what), &e.message]),
        (false, true) => tr_with("{0}: {1}", &[&who, &e.message]),
        (false, false) => tr_with("{0}, {1}: {2}", &[&who, &what, &e.message]),
    }
}

/// A field path (`stage.cylinders.water_l`) in the reader's words: the last part named,
/// each part before it wrapped around it by its own message ("stage {0}"), so every
/// language puts the words in its own order.
fn field_words(field: &str) -> String {
    let mut parts: Vec<&str> = field.split('.').filter(|p| !p.is_empty()).collect();
    let Some(leaf) = parts.pop() else {
        return String::new();
    };
    let mut what = match leaf {
        "water_l" => tr("water capacity"),
        "working_bar" => tr("working pressure"),
        "rated_cuft" => tr("rated volume"),
        "rated_psi" => tr("rated pressure"),
        "sac" => tr("breathing rate"),
        "gauge_step" => tr("gauge step"),
        "step" => tr("graduation"),
        "water_temp" => tr("water temperature"),
        "o2" => tr("oxygen"),
        "he" => tr("helium"),
        "count" => tr("number of cylinders"),
        "start" => tr("start"),
        "name" => tr("name"),
        "stage" => tr("stage"),
        "cylinders" => tr("cylinders"),
        "mix" => tr("mix"),
        "depth" => tr("depth"),
        "locker" => tr("locker"),
        other => other.to_string(),
    };
    for part in parts.iter().rev() {
        what = match *part {
            "stage" => tr_with("stage {0}", &[&what]),
            "cylinders" => tr_with("cylinders {0}", &[&what]),
            "mix" => tr_with("mix {0}", &[&what]),
            other => format!("{other} {what}"),
        };
    }
    what
}

#[cfg(test)]
mod tests;
