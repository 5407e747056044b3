//! The plan as a text table and as JSON.

use serde::Serialize;

use crate::plan::out_of_gas::margin_for_display;
use crate::plan::{TeamInput, TeamPlan, UnitSystem};

#[derive(Serialize, Debug)]
pub struct JsonPlan {
    pub units: UnitSystem,
    pub rule: String,
    pub pressure_unit: String,
    pub gauge_step: f64,
    pub controlling: String,
    /// Team allowance, real gas, free litres at 1 atm and water temperature.
    pub team_allowance_l: f64,
    pub team_allowance_hand_l: f64,
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
    pub start: f64,
    /// Shown turn, on the gauge step (or the start), in the team's unit.
    pub turn: f64,
    pub turn_real: f64,
    pub turn_hand: f64,
    pub turn_set_by: String,
    pub content_l: f64,
    pub content_hand_l: f64,
    pub used_l: f64,
    pub controlling: bool,
    pub minutes_to_turn: Option<f64>,
    /// Stage drop pressure (shown, on the gauge step), or null without a stage.
    pub stage_drop: Option<f64>,
    pub stage_drop_real: Option<f64>,
    pub stage_drop_hand: Option<f64>,
    pub stage_set_by: Option<String>,
    pub stage_controlling: Option<bool>,
}

fn r3(x: f64) -> f64 {
    (x * 1000.0).round() / 1000.0
}

pub fn json_report(input: &TeamInput, plan: &TeamPlan) -> JsonPlan {
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
        warnings: plan.warnings.clone(),
        divers: plan
            .divers
            .iter()
            .map(|d| JsonDiver {
                name: d.name.clone(),
                start: r3(u.pressure_value(d.start)),
                turn: r3(d.turn_shown_value),
                turn_real: r3(u.pressure_value(d.turn_real)),
                turn_hand: r3(u.pressure_value(d.turn_hand)),
                turn_set_by: format!("{:?}", d.set_by).to_lowercase(),
                content_l: r3(d.content_real.litres()),
                content_hand_l: r3(d.content_hand.litres()),
                used_l: r3(d.used_real.litres()),
                controlling: d.controlling,
                minutes_to_turn: d.minutes_to_turn.map(r3),
                stage_drop: d.stage.as_ref().map(|st| r3(st.drop_shown_value)),
                stage_drop_real: d
                    .stage
                    .as_ref()
                    .map(|st| r3(u.pressure_value(st.drop_real))),
                stage_drop_hand: d
                    .stage
                    .as_ref()
                    .map(|st| r3(u.pressure_value(st.drop_hand))),
                stage_set_by: d
                    .stage
                    .as_ref()
                    .map(|st| format!("{:?}", st.set_by).to_lowercase()),
                stage_controlling: d.stage.as_ref().map(|st| st.controlling),
            })
            .collect(),
    }
}

pub fn text_report(input: &TeamInput, plan: &TeamPlan) -> String {
    let u = input.units;
    let pu = u.pressure_label();
    let vu = u.volume_label();
    let mut s = String::new();
    s.push_str(&format!(
        "Turn pressures, rule of {}, gauge step {} {pu}, water {:.0} {}\n\n",
        input.rule.name(),
        crate::plan::error::fmt_num(input.gauge_step),
        u.temperature_value(input.water_temp),
        u.temperature_label()
    ));
    s.push_str(&format!(
        "  {:<16} {:<26} {:<10} {:>7} {:>7}  {:<12} {:>9} {:>8}\n",
        "diver",
        "cylinders",
        "mix",
        "start",
        "TURN",
        "set by",
        format!("gas {vu}"),
        "min"
    ));
    for (i, d) in plan.divers.iter().enumerate() {
        let inp = &input.divers[i];
        let mark = if d.controlling { "▶" } else { " " };
        let minutes = d
            .minutes_to_turn
            .map(|m| format!("{}", m.floor() as i64))
            .unwrap_or_else(|| "-".into());
        s.push_str(&format!(
            "{mark} {:<16} {:<26} {:<10} {:>7} {:>7}  {:<12} {:>9} {:>8}\n",
            d.name,
            inp.cylinders.describe(),
            inp.mix.label(),
            format!("{:.0}", u.pressure_value(d.start)),
            format!("{:.0}", d.turn_shown_value),
            d.set_by.describe(),
            format!("{:.0}", u.volume_value(d.content_real).floor()),
            minutes
        ));
    }
    let c = plan.controlling_diver();
    s.push_str(&format!(
        "\n▶ controlling diver: {} (smallest allowance, {:.0} {vu} real gas)\n",
        c.name,
        u.volume_value(plan.team_allowance_real).floor()
    ));
    s.push_str(
        "Turn the dive when the FIRST diver reaches their turn pressure, or at any other limit.\n",
    );
    let names = plan.names();
    s.push_str(&plan.margin_text());
    s.push('\n');
    if plan.stress.margin.is_finite() {
        s.push_str(&format!(
            "Stress margin {:.2} (the rule guarantees at least {:.2}).\n",
            margin_for_display(plan.stress.margin),
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
            if let (Some(st), Some(si)) = (&d.stage, &input.divers[i].stage) {
                s.push_str(&format!(
                    "{} {:<16} {:<26} {:<10} {:>7} → drop {:>5} {pu}  ({})\n",
                    if st.controlling { "▶" } else { " " },
                    d.name,
                    si.cylinders.describe(),
                    si.mix.label(),
                    format!("{:.0}", u.pressure_value(st.start)),
                    format!("{:.0}", st.drop_shown_value),
                    st.set_by.describe()
                ));
            }
        }
    }
    if let Some(i) = plan.first_to_turn {
        s.push_str(&format!(
            "First to reach turn: {} after about {} min at the planned depth.\n",
            names[i],
            plan.divers[i].minutes_to_turn.unwrap_or(0.0).floor() as i64
        ));
    }
    for w in &plan.warnings {
        s.push_str(&format!("warning: {w}\n"));
    }
    s.push_str("\nPlanning aid for trained divers; team protocol, training standards and local rules come first. Check by hand.\n");
    s
}
