//! The Turns page and the buddy view: each diver's turn, how it was set, stages, the
//! rule line, the stress margin and who turns first.

use super::super::session::Session;
use super::{start_text, temperature_text, turn_text, volume_down_text};
use crate::plan::ModelKind;
use crate::plan::error::fmt_num;

/// "Stage: drop at 160 bar …" for a diver with a stage, else empty.
pub fn stage_text(s: &Session, i: usize) -> String {
    let plan = s.team.plan();
    let u = s.units();
    match (&plan.divers[i].stage, &s.team.input().divers[i].stage) {
        (Some(st), Some(si)) => format!(
            "Stage: drop at {} {} · {} {} from {} · {}{}",
            turn_text(st.drop_shown_value),
            u.pressure_label(),
            s.team.stage_labels()[i],
            si.mix.label(),
            start_text(u, st.start),
            st.set_by.describe(),
            if st.controlling {
                " · ▶ controls stages"
            } else {
                ""
            }
        ),
        _ => String::new(),
    }
}

pub struct TurnRowVm {
    pub name: String,
    pub turn: String,
    pub unit: String,
    pub detail: String,
    pub set_by: String,
    pub minutes: String,
    pub controlling: bool,
    pub stage: String,
    /// Short form for the buddy view: "stage 160" (the stage drop pressure).
    pub stage_short: String,
}

pub fn turn_rows(s: &Session) -> Vec<TurnRowVm> {
    let plan = s.team.plan();
    let input = s.team.input();
    let u = input.units;
    plan.divers
        .iter()
        .enumerate()
        .map(|(i, d)| {
            let other = match d.set_by {
                ModelKind::Hand => d.turn_real,
                ModelKind::Real => d.turn_hand,
            };
            TurnRowVm {
                name: d.name.clone(),
                turn: turn_text(d.turn_shown_value),
                unit: u.pressure_label().to_string(),
                detail: format!(
                    "{} → {} {} · {} · {}",
                    start_text(u, d.start),
                    turn_text(d.turn_shown_value),
                    u.pressure_label(),
                    s.team.labels()[i],
                    input.divers[i].mix.label()
                ),
                set_by: format!(
                    "Set by {} (exact {:.0}; {} says {:.0})",
                    d.set_by.describe(),
                    u.pressure_value(match d.set_by {
                        ModelKind::Hand => d.turn_hand,
                        ModelKind::Real => d.turn_real,
                    }),
                    match d.set_by {
                        ModelKind::Hand => ModelKind::Real.describe(),
                        ModelKind::Real => ModelKind::Hand.describe(),
                    },
                    u.pressure_value(other)
                ),
                minutes: d
                    .minutes_to_turn
                    .map(|m| {
                        format!(
                            "About {} min to turn at the planned depth",
                            m.floor() as i64
                        )
                    })
                    .unwrap_or_default(),
                controlling: d.controlling,
                stage: stage_text(s, i),
                stage_short: d
                    .stage
                    .as_ref()
                    .map(|st| format!("stage {}", turn_text(st.drop_shown_value)))
                    .unwrap_or_default(),
            }
        })
        .collect()
}

pub fn rule_text(s: &Session) -> String {
    let input = s.team.input();
    let u = input.units;
    let plan = s.team.plan();
    format!(
        "Rule of {} · gauge step {} {} · water {} · team allowance {} ({} controls)",
        input.rule.name(),
        fmt_num(input.gauge_step),
        u.pressure_label(),
        temperature_text(u, input.water_temp),
        volume_down_text(u, plan.team_allowance_real),
        plan.controlling_diver().name
    )
}

pub fn margin_text(s: &Session) -> String {
    let plan = s.team.plan();
    let at_turn = plan.margin_at_first_turn_text();
    if at_turn.is_empty() {
        plan.margin_text()
    } else {
        format!("{} {at_turn}", plan.margin_text())
    }
}

pub fn first_text(s: &Session) -> String {
    let plan = s.team.plan();
    match plan.first_to_turn {
        Some(i) => format!(
            "{} reaches turn first, after about {} min.",
            plan.divers[i].name,
            plan.divers[i].minutes_to_turn.unwrap_or(0.0).floor() as i64
        ),
        None => String::new(),
    }
}

/// The plan's warnings, one sentence each.
pub fn warnings(s: &Session) -> Vec<String> {
    s.team.plan().warning_texts()
}

/// The team's pressure unit: "bar" or "psi".
pub fn pressure_unit(s: &Session) -> String {
    s.units().pressure_label().to_string()
}
