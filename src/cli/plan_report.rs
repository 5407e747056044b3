//! The plan as a text table and as JSON.

use serde::Serialize;

use crate::plan::margin_for_display;
use crate::plan::shown;
use crate::plan::{PressureUnit, SetLabels, TeamInput, TeamPlan, UnitSystem};
use crate::plan::{allowance_sentence, hand_working, turn_sentence};

#[derive(Serialize, Debug)]
pub struct JsonPlan {
    pub units: UnitSystem,
    pub rule: String,
    /// The team's default gauge unit and step (each diver has their own `unit` and `step`).
    pub pressure_unit: String,
    pub gauge_step: f64,
    pub controlling: String,
    /// Team allowance, real gas, free litres at 1 atm and water temperature.
    pub team_allowance_l: f64,
    pub team_allowance_hand_l: f64,
    pub team_allowance_hand_working: String,
    /// Minimum over diver pairs; null when no gas is spent.
    pub stress_margin: Option<f64>,
    pub stress_text: String,
    /// The margin when the first diver turns, given every breathing rate and the depth.
    pub stress_margin_at_first_turn: Option<f64>,
    pub first_to_turn: Option<String>,
    pub warnings: Vec<String>,
    pub divers: Vec<JsonDiver>,
}

#[derive(Serialize, Debug)]
pub struct JsonDiver {
    pub name: String,
    /// The cylinders' one name, as the app and the card write it.
    pub set_name: String,
    /// The diver's gauge unit: `start`, `turn*` and `stage_*` pressures are in it.
    pub unit: PressureUnit,
    /// The diver's graduation, in `unit`.
    pub step: f64,
    pub start: f64,
    /// Shown turn, on the diver's graduation (or the start), in `unit`.
    pub turn: f64,
    pub turn_real: f64,
    pub turn_hand: f64,
    pub turn_set_by: String,
    pub content_l: f64,
    pub content_hand_l: f64,
    pub used_l: f64,
    /// The pencil sums behind `turn_hand` (common practice tank-factor arithmetic).
    pub hand_content_working: String,
    pub hand_turn_working: String,
    /// How the shown turn follows from the two exact turns.
    pub turn_reason: String,
    pub controlling: bool,
    pub minutes_to_turn: Option<f64>,
    /// Stage drop pressure (shown, on the gauge step), or null without a stage.
    pub stage_drop: Option<f64>,
    /// The stage's one name, or null without a stage.
    pub stage_set_name: Option<String>,
    pub stage_drop_real: Option<f64>,
    pub stage_drop_hand: Option<f64>,
    pub stage_set_by: Option<String>,
    pub stage_controlling: Option<bool>,
}

fn r3(x: f64) -> f64 {
    (x * 1000.0).round() / 1000.0
}

pub fn json_report(input: &TeamInput, plan: &TeamPlan, labels: &SetLabels) -> JsonPlan {
    let u = input.units;
    let names = plan.names();
    JsonPlan {
        units: u,
        rule: input.rule.name().to_string(),
        pressure_unit: u.pressure_label().to_string(),
        gauge_step: input.gauge_step,
        controlling: plan.controlling_diver().name.clone(),
        team_allowance_l: r3(plan.team_allowance_real.litres()),
        team_allowance_hand_l: r3(plan.team_allowance_hand.litres()),
        team_allowance_hand_working: allowance_sentence(input, plan),
        stress_margin: plan
            .stress
            .margin
            .is_finite()
            .then(|| r3(plan.stress.margin)),
        stress_text: plan.margin_text(),
        stress_margin_at_first_turn: plan
            .stress_at_first_turn
            .as_ref()
            .filter(|c| c.margin.is_finite())
            .map(|c| r3(c.margin)),
        first_to_turn: plan.first_to_turn.map(|i| names[i].clone()),
        warnings: plan.warning_texts(),
        divers: plan
            .divers
            .iter()
            .enumerate()
            .map(|(i, d)| {
                let g = d.gauge;
                let hand = hand_working(input, plan, i);
                JsonDiver {
                    name: d.name.clone(),
                    set_name: labels.set_name(input, i),
                    unit: g.unit,
                    step: g.step,
                    start: r3(g.value(d.start)),
                    turn: r3(d.turn_shown_value),
                    turn_real: r3(g.value(d.turn_real)),
                    turn_hand: r3(g.value(d.turn_hand)),
                    turn_set_by: format!("{:?}", d.set_by).to_lowercase(),
                    content_l: r3(d.content_real.litres()),
                    content_hand_l: r3(d.content_hand.litres()),
                    used_l: r3(d.used_real.litres()),
                    hand_content_working: hand.content,
                    hand_turn_working: hand.turn,
                    turn_reason: turn_sentence(plan, i),
                    controlling: d.controlling,
                    minutes_to_turn: d.minutes_to_turn.map(r3),
                    stage_drop: d.stage.as_ref().map(|st| r3(st.drop_shown_value)),
                    stage_set_name: labels.stage_name(input, i),
                    stage_drop_real: d.stage.as_ref().map(|st| r3(g.value(st.drop_real))),
                    stage_drop_hand: d.stage.as_ref().map(|st| r3(g.value(st.drop_hand))),
                    stage_set_by: d
                        .stage
                        .as_ref()
                        .map(|st| format!("{:?}", st.set_by).to_lowercase()),
                    stage_controlling: d.stage.as_ref().map(|st| st.controlling),
                }
            })
            .collect(),
    }
}

/// The plan as a table: one line per diver, the set and diver columns as wide as their
/// longest entry so no column moves.
pub fn text_report(input: &TeamInput, plan: &TeamPlan, labels: &SetLabels) -> String {
    let u = input.units;
    let vu = u.volume_label();
    let mut s = String::new();
    s.push_str(&format!(
        "Turn pressures, rule of {}, water {} {}; each diver's start and TURN on their own gauge, in the unit shown\n\n",
        input.rule.name(),
        shown::degrees(u.temperature_value(input.water_temp)),
        u.temperature_label()
    ));
    let set_names: Vec<String> = (0..plan.divers.len())
        .map(|i| labels.set_name(input, i))
        .collect();
    let widest = |lens: Vec<usize>, least: usize| lens.into_iter().max().unwrap_or(0).max(least);
    let nw = widest(
        plan.divers.iter().map(|d| d.name.chars().count()).collect(),
        16,
    );
    let cw = widest(set_names.iter().map(|n| n.chars().count()).collect(), 26);
    s.push_str(&format!(
        "  {:<nw$} {:<cw$} {:<10} {:>7} {:>7} {:<4} {:<9} {:<12} {:>14} {:>8}\n",
        "diver",
        "cylinders",
        "mix",
        "start",
        "TURN",
        "unit",
        "gauge",
        "set by",
        format!("real gas {vu}"),
        "min"
    ));
    let controllers: Vec<usize> = crate::plan::allowance_sources(input, plan)
        .iter()
        .map(|a| a.diver)
        .collect();
    for (i, d) in plan.divers.iter().enumerate() {
        let inp = &input.divers[i];
        let g = d.gauge;
        let mark = if controllers.contains(&i) { "*" } else { " " };
        let minutes = d
            .minutes_to_turn
            .map(shown::minutes)
            .unwrap_or_else(|| "-".into());
        s.push_str(&format!(
            "{mark} {:<nw$} {:<cw$} {:<10} {:>7} {:>7} {:<4} {:<9} {:<12} {:>14} {:>8}\n",
            d.name,
            set_names[i],
            inp.mix.label(),
            shown::start(g.value(d.start)),
            shown::turn(d.turn_shown_value),
            g.label(),
            format!("{} {}", shown::num(g.step), g.label()),
            d.set_by.describe(),
            shown::start(u.volume_value(d.content_real)),
            minutes
        ));
    }
    s.push_str(&format!(
        "\n* controlling diver: {}\n",
        crate::plan::allowance_source_sentence(input, plan)
    ));
    s.push_str(
        "Turn the dive when the FIRST diver reaches their turn pressure, or at any other limit.\n",
    );
    let names = plan.names();
    s.push_str(&plan.margin_text());
    s.push('\n');
    if plan.stress.margin.is_finite() {
        s.push_str(&format!(
            "Stress margin {:.2} (the rule of {} gives at least {:.2}).\n",
            margin_for_display(plan.stress.margin),
            input.rule.name(),
            input.rule.guaranteed_margin()
        ));
    }
    let at_turn = plan.margin_at_first_turn_text();
    if !at_turn.is_empty() {
        s.push_str(&at_turn);
        s.push('\n');
    }
    if plan.divers.iter().any(|d| d.stage.is_some()) {
        s.push_str(&format!(
            "\nStages ({} each, matched on volume): breathe down to the drop pressure, then leave the stage.\n",
            input.rule.name()
        ));
        for (i, d) in plan.divers.iter().enumerate() {
            if let (Some(st), Some(si), Some(stage_name)) = (
                &d.stage,
                &input.divers[i].stage,
                labels.stage_name(input, i),
            ) {
                let g = d.gauge;
                s.push_str(&format!(
                    "{} {:<nw$} drop stage at {} {u} ({}, {}, start {} {u}; {})\n",
                    if st.controlling { "*" } else { " " },
                    d.name,
                    shown::turn(st.drop_shown_value),
                    stage_name,
                    si.mix.label(),
                    shown::start(g.value(st.start)),
                    st.set_by.describe(),
                    u = g.label(),
                ));
            }
        }
    }
    if let Some(i) = plan.first_to_turn {
        s.push_str(&format!(
            "First to reach turn: {} after about {} min at the planned depth.\n",
            names[i],
            shown::minutes(plan.divers[i].minutes_to_turn.unwrap_or(0.0))
        ));
    }
    s.push_str("\nCheck by hand (tank factors; bar taken as atmospheres):\n");
    for (i, d) in plan.divers.iter().enumerate() {
        s.push_str(&format!(
            "  {}: {}\n",
            d.name,
            hand_working(input, plan, i).content
        ));
    }
    s.push_str(&format!("  {}\n", allowance_sentence(input, plan)));
    for (i, d) in plan.divers.iter().enumerate() {
        let w = hand_working(input, plan, i);
        s.push_str(&format!("  {}: {}\n", d.name, w.turn));
        s.push_str(&format!("    turn {}\n", turn_sentence(plan, i)));
    }
    for w in plan.warning_texts() {
        s.push_str(&format!("warning: {w}\n"));
    }
    s.push_str("\nPlanning aid for trained divers; team protocol, training standards and local rules come first. Check by hand.\n");
    s
}
