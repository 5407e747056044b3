//! The Team page: one card per diver, the team's conditions and the one-line summary.

use super::super::session::Session;
use super::{
    depth_text, gauge_text, rate_text, reading, rule_index, rule_warning, step_index, step_labels,
    temperature_text,
};
use crate::app::readings::{StartStatus, when_text};
use crate::i18n::{tr, tr_n, tr_with};
use crate::plan::Water;
use crate::plan::shown;

/// The Team page besides the cards.
pub struct TeamPageVm {
    pub rule_index: i32,
    /// Why the chosen rule does not suit an overhead dive; empty when it does.
    pub rule_warning: String,
    pub step_options: Vec<String>,
    pub step_index: i32,
    pub depth_text: String,
    pub water_text: String,
    /// The water temperature of this dive.
    pub water_temp: String,
    /// The dive's settings in one line, for the folded settings button.
    pub settings_summary: String,
    /// "Bram removed." while the last removal or new team can be undone; else empty.
    pub undo: String,
    pub can_add: bool,
    pub can_remove: bool,
    pub summary: String,
}

pub fn team_page(s: &Session) -> TeamPageVm {
    let input = s.team.input();
    TeamPageVm {
        rule_index: rule_index(input.rule),
        rule_warning: rule_warning(input.rule),
        step_options: step_labels(input.units),
        step_index: step_index(input.units, input.gauge_step),
        depth_text: depth_label(s),
        water_text: water_text(s),
        water_temp: water_temp_text(s),
        settings_summary: {
            let args: [&dyn std::fmt::Display; 4] = [
                &super::rule_symbols()[rule_index(input.rule) as usize],
                &step_labels(input.units)
                    .get(step_index(input.units, input.gauge_step) as usize)
                    .cloned()
                    .unwrap_or_else(|| format!("{}", input.gauge_step)),
                &depth_label(s),
                &water_temp_text(s),
            ];
            match input.water {
                Water::Fresh => tr_with("{0} · {1} steps · {2} fresh · {3}", &args),
                Water::Salt => tr_with("{0} · {1} steps · {2} salt · {3}", &args),
            }
        },
        undo: s.undo_text().to_string(),
        can_add: s.team.can_add(),
        can_remove: s.team.can_remove(),
        summary: team_summary(s),
    }
}

pub struct DiverCardVm {
    pub name: String,
    pub cylinders: String,
    pub mix: String,
    /// The start on the diver's gauge, or "—" when nobody has read it.
    pub start: String,
    pub unit: String,
    /// The diver's gauge: "bar, 10 bar steps".
    pub gauge: String,
    /// What the start is worth: not read, entered earlier (check), predicted; empty when
    /// it was read today.
    pub start_note: String,
    /// "Still reads 220 bar" for a start entered earlier; empty otherwise.
    pub confirm: String,
    /// Beside the gauge when there is nothing to confirm: "read 09:42", "not read".
    pub read: String,
    /// The start is a usable reading of this dive.
    pub start_ok: bool,
    pub sac: String,
    pub error: String,
    pub has_stage: bool,
    pub stage: String,
    pub stage_mix: String,
    pub stage_start: String,
}

pub fn diver_cards(s: &Session) -> Vec<DiverCardVm> {
    let input = s.team.input();
    let u = input.units;
    let now = s.now();
    let warnings = s.team.shown_warnings(now);
    input
        .divers
        .iter()
        .enumerate()
        .map(|(i, d)| {
            let g = input.gauge_of(i);
            let status = s.team.start_status(i, now);
            let read = reading(g, d.start);
            DiverCardVm {
                name: d.name.clone(),
                cylinders: s.team.shown_label(i),
                mix: d.mix.label(),
                start: if status == StartStatus::Missing {
                    "—".to_string()
                } else {
                    read.clone()
                },
                unit: g.label().to_string(),
                gauge: gauge_text(g),
                start_note: match status {
                    StartStatus::Fresh => tr_with("Start {0}", &[&s.read_text(i)]),
                    _ => start_note(status, now),
                },
                read: match status {
                    StartStatus::Missing => tr("not read"),
                    StartStatus::Old { .. } => String::new(),
                    _ => s.read_text(i),
                },
                start_ok: status == StartStatus::Fresh,
                confirm: match status {
                    StartStatus::Old { .. } => tr_with("Still reads {0} {1}", &[&read, &g.label()]),
                    _ => String::new(),
                },
                sac: match d.sac_l_per_min {
                    Some(l) => tr_with("SAC {0} {1}/min", &[&rate_text(u, l), &u.volume_label()]),
                    None => tr("SAC — tap to add for time to turn"),
                },
                error: warnings
                    .iter()
                    .filter(|w| w.diver() == Some(i))
                    .map(|w| w.detail())
                    .collect::<Vec<_>>()
                    .join(" "),
                has_stage: d.stage.is_some(),
                stage: match &d.stage {
                    Some(_) => tr_with("Stage: {0}", &[&s.team.shown_stage_label(i)]),
                    None => tr("+ Stage (dropped on the way in)"),
                },
                stage_mix: d
                    .stage
                    .as_ref()
                    .map(|st| st.mix.label())
                    .unwrap_or_default(),
                // A stage start nobody read shows "—", as a main start does.
                stage_start: match (&d.stage, s.team.stage_status(i, now)) {
                    (Some(_), Some(StartStatus::Missing)) => "—".to_string(),
                    (Some(st), _) => reading(g, st.start),
                    _ => String::new(),
                },
            }
        })
        .collect()
}

/// A start's status in words for its card; empty for a start read today.
pub fn start_note(status: StartStatus, now: i64) -> String {
    match status {
        StartStatus::Fresh => String::new(),
        StartStatus::Missing => tr("Not read yet: read the gauge in the water"),
        StartStatus::Predicted => tr("Predicted from the fill: read the gauge in the water"),
        StartStatus::Old { at } => tr_with("Entered {0}: check the gauge", &[&when_text(at, now)]),
    }
}

pub fn team_summary(s: &Session) -> String {
    let plan = s.team.plan();
    if let Some(wait) = s.team.turns_gate(s.now()).short() {
        return wait;
    }
    let turns: Vec<String> = plan
        .divers
        .iter()
        .map(|d| {
            format!(
                "{} {} {}",
                d.name,
                crate::plan::shown::turn(d.turn_shown_value),
                d.gauge.label()
            )
        })
        .collect();
    let who: Vec<&str> = super::controllers(s)
        .into_iter()
        .map(|i| plan.divers[i].name.as_str())
        .collect();
    // The verb agrees with the divers named: "Ines controls", "Ines and Bram control".
    tr_n(
        "Turns: {0} · {1} controls (least usable gas) · {2}",
        "Turns: {0} · {1} control (least usable gas) · {2}",
        who.len() as u64,
        &[
            &turns.join(" · "),
            &super::and_list(&who),
            &super::rule_head(s),
        ],
    )
}

pub fn depth_label(s: &Session) -> String {
    depth_text(s.team.input().depth, s.units())
}

/// "Fresh" or "Salt".
pub fn water_text(s: &Session) -> String {
    match s.team.input().water {
        Water::Fresh => tr("Fresh"),
        Water::Salt => tr("Salt"),
    }
}

pub fn water_temp_text(s: &Session) -> String {
    temperature_text(s.units(), s.team.input().water_temp)
}

/// The line every page shows while the team is the demo; empty otherwise.
pub fn demo_note(s: &Session) -> String {
    if s.team.is_demo() {
        if s.page() == crate::app::nav::Screen::Team {
            tr("DEMO: invented divers. Tap New team at the top of this page to plan your own.")
        } else {
            tr("DEMO: invented divers. Tap New team on the Team page to plan your own.")
        }
    } else {
        String::new()
    }
}

/// The messages for the person, one a line; empty when there are none.
pub fn status(s: &Session) -> String {
    s.status.text()
}

/// The gauge chooser of a diver's card while it is open.
pub struct GaugeChooserVm {
    pub title: String,
    pub note: String,
    /// Text, accessible label ("gauge psi 100"), whether it is the diver's gauge now.
    pub choices: Vec<(String, String, bool)>,
}

pub fn gauge_chooser(s: &Session) -> Option<GaugeChooserVm> {
    let i = s.gauge_chooser?;
    let d = s.team.input().divers.get(i)?;
    let now = s.team.input().gauge_of(i);
    let read = s.team.start_status(i, s.now()) != StartStatus::Missing;
    Some(GaugeChooserVm {
        title: tr_with("Gauge of {0}", &[&d.name]),
        note: if read {
            tr_with(
                "The gauge {0} reads in the water. A gauge in the other unit makes the start unread: read it again on that gauge.",
                &[&d.name],
            )
        } else {
            tr_with("The gauge {0} reads in the water.", &[&d.name])
        },
        choices: crate::app::session::GAUGES
            .iter()
            .map(|g| {
                (
                    super::gauge_text(*g),
                    tr_with("gauge {0} {1}", &[&g.label(), &shown::num(g.step)]),
                    *g == now,
                )
            })
            .collect(),
    })
}
