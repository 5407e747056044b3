//! The Team page: one card per diver, the team's conditions and the one-line summary.

use super::super::session::Session;
use super::{
    depth_text, rate_text, rule_index, rule_warning, start_text, step_index, step_labels,
    temperature_text, turn_text,
};
use crate::plan::Water;

/// The Team page besides the cards.
pub struct TeamPageVm {
    pub rule_index: i32,
    /// Why the chosen rule does not suit an overhead dive; empty when it does.
    pub rule_warning: String,
    pub step_options: Vec<String>,
    pub step_index: i32,
    pub depth_text: String,
    pub water_text: String,
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
        can_add: s.team.can_add(),
        can_remove: s.team.can_remove(),
        summary: team_summary(s),
    }
}

pub struct DiverCardVm {
    pub name: String,
    pub cylinders: String,
    pub mix: String,
    pub start: String,
    pub unit: String,
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
    let warnings = &s.team.plan().warnings;
    input
        .divers
        .iter()
        .enumerate()
        .map(|(i, d)| DiverCardVm {
            name: d.name.clone(),
            cylinders: s.team.labels()[i].clone(),
            mix: d.mix.label(),
            start: start_text(u, d.start),
            unit: u.pressure_label().to_string(),
            sac: match d.sac_l_per_min {
                Some(l) => format!("SAC {} {}/min", rate_text(u, l), u.volume_label()),
                None => "SAC — tap to add for time to turn".to_string(),
            },
            error: warnings
                .iter()
                .filter(|w| w.diver() == Some(i))
                .map(|w| w.detail())
                .collect::<Vec<_>>()
                .join(" "),
            has_stage: d.stage.is_some(),
            stage: match &d.stage {
                Some(_) => format!("Stage: {}", s.team.stage_labels()[i]),
                None => "+ Stage (dropped on the way in)".to_string(),
            },
            stage_mix: d
                .stage
                .as_ref()
                .map(|st| st.mix.label())
                .unwrap_or_default(),
            stage_start: d
                .stage
                .as_ref()
                .map(|st| start_text(u, st.start))
                .unwrap_or_default(),
        })
        .collect()
}

pub fn team_summary(s: &Session) -> String {
    let plan = s.team.plan();
    let u = s.units();
    let turns: Vec<String> = plan
        .divers
        .iter()
        .map(|d| format!("{} {}", d.name, turn_text(d.turn_shown_value)))
        .collect();
    format!(
        "Turns ({}): {} · ▶ {} controls",
        u.pressure_label(),
        turns.join(" · "),
        plan.controlling_diver().name
    )
}

pub fn depth_label(s: &Session) -> String {
    depth_text(s.team.input().depth, s.units())
}

/// "Fresh" or "Salt".
pub fn water_text(s: &Session) -> String {
    match s.team.input().water {
        Water::Fresh => "Fresh",
        Water::Salt => "Salt",
    }
    .to_string()
}

pub fn water_temp_text(s: &Session) -> String {
    temperature_text(s.units(), s.team.input().water_temp)
}

/// The messages for the person, one a line; empty when there are none.
pub fn status(s: &Session) -> String {
    s.status.text()
}
