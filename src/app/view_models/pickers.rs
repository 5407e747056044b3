//! The cylinder picker (the locker, then generic singles and pairs, or a custom set)
//! and the mix picker (quick choices in rows, the custom O2 and He).

use super::super::session::{Picker, Session};
use super::locker::preset_detail;
use crate::i18n::{tr, tr_with};
use crate::plan::ModelKind;
use crate::plan::presets;
use crate::plan::shown;
use crate::plan::text::first_upper;

/// Quick mixes per row: four fit a 360 px phone at 64 px or more each.
const MIXES_PER_ROW: usize = 4;

/// One set in the cylinder picker. `index` is what `pick_locker` / `pick_preset` take.
#[derive(Clone, Debug, PartialEq)]
pub struct PickRowVm {
    pub title: String,
    pub detail: String,
    pub mine: bool,
    /// How many cylinders, shown first in big type: "1×", "2×".
    pub count: String,
    pub index: usize,
}

/// The custom set being entered.
#[derive(Clone, Debug, PartialEq)]
pub struct CustomVm {
    pub count: i32,
    pub independent: bool,
    pub rated: bool,
    pub first_caption: String,
    pub second_caption: String,
    /// The captions in lower case, for screen readers.
    pub first_name: String,
    pub second_name: String,
    pub first_value: String,
    pub second_value: String,
    /// The set's name and its water, when it is complete.
    pub summary: String,
    /// Which field is missing or wrong; empty when the set can be used.
    pub problem: String,
}

/// A row of quick mixes: a heading on the first row of each group, (text, index).
#[derive(Clone, Debug, PartialEq)]
pub struct MixRowVm {
    pub heading: String,
    pub items: Vec<(String, i32)>,
}

/// The open picker: which one, for what, and what it offers.
pub struct PickerVm {
    pub cylinders_open: bool,
    pub stage_mode: bool,
    pub mix_open: bool,
    pub title: String,
    pub locker: Vec<PickRowVm>,
    pub singles: Vec<PickRowVm>,
    pub pairs: Vec<PickRowVm>,
    /// The custom entry, while it is shown instead of the list.
    pub custom: Option<CustomVm>,
    /// O2 and He in percent, the mix's name and why it cannot be used (mix picker only).
    pub mix: Option<(i32, i32, String, String)>,
    pub mix_rows: Vec<MixRowVm>,
}

pub fn picker(s: &Session) -> PickerVm {
    let list = matches!(s.picker, Picker::Cylinders { .. });
    let (singles, pairs) = if list {
        let all = presets();
        preset_picks()
            .into_iter()
            .partition(|r| all[r.index].set.count == 1)
    } else {
        (Vec::new(), Vec::new())
    };
    PickerVm {
        cylinders_open: list || matches!(s.picker, Picker::Custom { .. }),
        stage_mode: matches!(
            s.picker,
            Picker::Cylinders { stage: true, .. } | Picker::Custom { stage: true, .. }
        ),
        mix_open: matches!(s.picker, Picker::Mix { .. }),
        title: picker_title(s),
        locker: if list { locker_picks(s) } else { Vec::new() },
        singles,
        pairs,
        custom: custom(s),
        mix: match (s.picker, s.picker.mix()) {
            (Picker::Mix { o2, he, .. }, Some(mix)) => {
                Some((o2, he, mix.label(), s.picker.mix_reason()))
            }
            _ => None,
        },
        mix_rows: mix_rows(s),
    }
}

fn count_text(count: u8) -> String {
    format!("{count}×")
}

fn locker_picks(s: &Session) -> Vec<PickRowVm> {
    s.locker
        .entries()
        .iter()
        .enumerate()
        .map(|(index, e)| {
            let set = e.cylinders.to_set("locker");
            PickRowVm {
                title: match &set {
                    Ok(set) => crate::plan::shown_label(&e.name, set),
                    Err(_) => e.name.clone(),
                },
                detail: set
                    .as_ref()
                    .map(|set| set.describe())
                    .unwrap_or_else(|err| err.to_string()),
                mine: e.mine,
                count: set.map(|x| count_text(x.count)).unwrap_or_default(),
                index,
            }
        })
        .collect()
}

fn preset_picks() -> Vec<PickRowVm> {
    presets()
        .iter()
        .enumerate()
        .map(|(index, p)| PickRowVm {
            title: p.shown_name(),
            detail: preset_detail(p),
            mine: false,
            count: count_text(p.set.count),
            index,
        })
        .collect()
}

fn custom(s: &Session) -> Option<CustomVm> {
    let Picker::Custom { set, .. } = s.picker else {
        return None;
    };
    let [a, b] = set.field_specs();
    let value = |v: Option<f64>, unit: &str| {
        v.map(|v| format!("{} {unit}", shown::num(v)))
            .unwrap_or_else(|| "—".to_string())
    };
    let (summary, problem) = match set.to_set() {
        Ok(c) => (
            tr_with(
                "{0} · {1} L of water in all",
                &[
                    &set.label(&c),
                    &crate::plan::shown::fixed(c.water(ModelKind::Real).litres(), 1),
                ],
            ),
            String::new(),
        ),
        Err(e) => (String::new(), first_upper(&e.to_string())),
    };
    Some(CustomVm {
        count: i32::from(set.count),
        independent: set.independent,
        rated: set.rated,
        first_caption: a.0.clone(),
        second_caption: b.0.clone(),
        first_name: a.0.to_lowercase(),
        second_name: b.0.to_lowercase(),
        first_value: value(set.first, a.1),
        second_value: value(set.second, b.1),
        summary,
        problem,
    })
}

fn mix_rows(s: &Session) -> Vec<MixRowVm> {
    let choices = s.mix_choices();
    let mut rows = Vec::new();
    let mut index = 0;
    for (heading, mixes) in [
        (tr("RECENT AND IN THIS TEAM"), &choices.own),
        (tr("COMMON MIXES"), &choices.common),
    ] {
        for (n, chunk) in mixes.chunks(MIXES_PER_ROW).enumerate() {
            rows.push(MixRowVm {
                heading: if n == 0 {
                    heading.clone()
                } else {
                    String::new()
                },
                items: chunk
                    .iter()
                    .map(|m| {
                        index += 1;
                        (m.label(), index - 1)
                    })
                    .collect(),
            });
        }
    }
    rows
}

pub fn picker_title(s: &Session) -> String {
    let name = |i: usize| {
        s.team
            .input()
            .divers
            .get(i)
            .map(|d| d.name.clone())
            .unwrap_or_default()
    };
    match s.picker {
        Picker::Cylinders {
            diver,
            stage: false,
        } => tr_with("Cylinders for {0}", &[&name(diver)]),
        Picker::Cylinders { diver, stage: true } => tr_with("Stage for {0}", &[&name(diver)]),
        Picker::Custom {
            diver,
            stage: false,
            ..
        } => tr_with("Custom cylinders for {0}", &[&name(diver)]),
        Picker::Custom {
            diver, stage: true, ..
        } => tr_with("Custom stage for {0}", &[&name(diver)]),
        Picker::Mix {
            diver,
            stage: false,
            ..
        } => tr_with("Gas for {0}", &[&name(diver)]),
        Picker::Mix {
            diver, stage: true, ..
        } => tr_with("Stage gas for {0}", &[&name(diver)]),
        Picker::None => String::new(),
    }
}

#[cfg(test)]
#[path = "pickers_tests.rs"]
mod tests;
