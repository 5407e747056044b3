//! Formatting the session for the views. Numbers shown to a diver round toward
//! safety: turn pressures up, start pressures and gas down, times down.

use crate::plan::catalogue::presets;
use crate::plan::error::fmt_num;
use crate::plan::{ModelKind, Pressure, UnitSystem, Volume};

use super::session::{Picker, Session, depth_text};
use super::team_controller::step_options;

/// A shown turn pressure: already on the gauge step; rounded up against float noise.
pub fn turn_text(value: f64) -> String {
    format!("{}", (value - 1e-6).ceil() as i64)
}

/// A start pressure as read: rounded down.
pub fn start_text(u: UnitSystem, p: Pressure) -> String {
    format!("{}", (u.pressure_value(p) + 1e-6).floor() as i64)
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
                Some(l) => format!(
                    "SAC {} {}/min",
                    fmt_num((u.volume_value(Volume::from_litres(l)) * 100.0).round() / 100.0),
                    u.volume_label()
                ),
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
        "Rule of {} · gauge step {} {} · water {} {} · team allowance {} {} ({} controls)",
        input.rule.name(),
        fmt_num(input.gauge_step),
        u.pressure_label(),
        fmt_num(u.temperature_value(input.water_temp).round()),
        u.temperature_label(),
        fmt_num(u.volume_value(plan.team_allowance_real).floor()),
        u.volume_label(),
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

pub fn step_labels(u: UnitSystem) -> Vec<String> {
    step_options(u)
        .iter()
        .map(|s| format!("{} {}", fmt_num(*s), u.pressure_label()))
        .collect()
}

pub fn step_index(u: UnitSystem, step: f64) -> i32 {
    step_options(u)
        .iter()
        .position(|s| (*s - step).abs() < 1e-9)
        .map(|i| i as i32)
        .unwrap_or(-1)
}

pub fn depth_label(s: &Session) -> String {
    depth_text(s.team.input().depth, s.units())
}

pub fn water_temp_text(s: &Session) -> String {
    let u = s.units();
    format!(
        "{} {}",
        fmt_num(u.temperature_value(s.team.input().water_temp).round()),
        u.temperature_label()
    )
}

/// (title, detail, mine) for the locker rows of the cylinder picker.
pub fn locker_pick_rows(s: &Session) -> Vec<(String, String, bool)> {
    s.locker
        .file
        .entries
        .iter()
        .map(|e| {
            let detail = e
                .cylinders
                .to_set("locker")
                .map(|set| set.describe())
                .unwrap_or_else(|err| err.to_string());
            (e.name.clone(), detail, e.mine)
        })
        .collect()
}

pub fn preset_rows() -> Vec<(String, String)> {
    presets()
        .iter()
        .map(|p| {
            let water = p.set.spec.water_per_cylinder(crate::plan::ModelKind::Real);
            (
                p.name.to_string(),
                format!(
                    "{} · {} L water each",
                    p.material.name(),
                    fmt_num((water.litres() * 10.0).round() / 10.0)
                ),
            )
        })
        .collect()
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
        } => format!("Cylinders for {}", name(diver)),
        Picker::Cylinders { diver, stage: true } => format!("Stage for {}", name(diver)),
        Picker::Mix {
            diver,
            stage: false,
            ..
        } => format!("Gas for {}", name(diver)),
        Picker::Mix {
            diver, stage: true, ..
        } => format!("Stage gas for {}", name(diver)),
        Picker::None => String::new(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn display_rounding_is_conservative() {
        assert_eq!(turn_text(150.0000001), "150");
        assert_eq!(turn_text(150.2), "151");
        assert_eq!(
            start_text(UnitSystem::Metric, Pressure::from_bar(217.9)),
            "217"
        );
        assert_eq!(
            start_text(UnitSystem::Imperial, Pressure::from_psi(3000.0)),
            "3000"
        );
    }
}
