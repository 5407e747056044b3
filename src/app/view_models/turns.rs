//! The Turns page and the buddy view: each diver's turn, how it was set, stages, the
//! rule line, the stress margin and who turns first.

use super::super::session::Session;
use super::stage_drop::stage_text;
use super::{gauge_text, reading, temperature_text};
use crate::app::readings::{StartStatus, when_text};
use crate::i18n::{tr, tr_with};
use crate::plan::shown::turn as turn_text;
use crate::plan::{
    allowance_sentence, allowance_source_sentence, allowance_sources, hand_working, turn_how,
    turn_sentence,
};

pub struct TurnRowVm {
    pub name: String,
    /// The turn on the diver's gauge, or "—" while a start is not read.
    pub turn: String,
    pub unit: String,
    /// "Start 218 bar, read 09:42" (or why there is no usable start).
    pub read: String,
    /// One plain line: how the turn was found.
    pub how: String,
    /// The pencil sums and the real-gas comparison, one tap away.
    pub sums: String,
    /// Cylinders, mix and gauge.
    pub detail: String,
    pub minutes: String,
    pub controlling: bool,
    /// The turn comes from a start predicted from the fill, not read in the water.
    pub predicted: bool,
    pub stage: String,
    /// Short form for the buddy view: "drop stage at 160 bar".
    pub stage_short: String,
    /// "read 09:42" for the buddy view.
    pub read_short: String,
}

impl TurnRowVm {
    /// The buddy view's line under the turn: who controls, when the start was read, the
    /// stage drop.
    pub fn buddy_info(&self) -> String {
        let mut parts = Vec::new();
        if self.controlling {
            parts.push(tr("● controls: least gas"));
        }
        if !self.read_short.is_empty() {
            parts.push(self.read_short.clone());
        }
        if !self.stage_short.is_empty() {
            parts.push(self.stage_short.clone());
        }
        parts.join(" · ")
    }
}

/// Why there are no turns yet, naming each diver whose start is not a reading of this
/// dive; None when every start is (the controller's answer, worded).
pub fn starts_blocking(s: &Session) -> Option<String> {
    s.team.turns_gate(s.now()).sentence()
}

/// The divers whose gas sets an allowance that a shown turn uses.
pub fn controllers(s: &Session) -> Vec<usize> {
    let mut v: Vec<usize> = allowance_sources(s.team.input(), s.team.plan())
        .iter()
        .map(|a| a.diver)
        .collect();
    v.dedup();
    v
}

pub fn turn_rows(s: &Session) -> Vec<TurnRowVm> {
    let plan = s.team.plan();
    let input = s.team.input();
    let ready = starts_blocking(s).is_none();
    let now = s.now();
    let controllers = controllers(s);
    plan.divers
        .iter()
        .enumerate()
        .map(|(i, d)| {
            let g = d.gauge;
            let status = s.team.start_status(i, now);
            let predicted = status == StartStatus::Predicted;
            let hand = hand_working(input, plan, i);
            let start = format!("{} {}", reading(g, d.start), g.label());
            TurnRowVm {
                name: d.name.clone(),
                turn: if ready {
                    turn_text(d.turn_shown_value)
                } else {
                    "—".to_string()
                },
                unit: g.label().to_string(),
                read: match status {
                    StartStatus::Missing => tr("Start not read"),
                    StartStatus::Old { at } => {
                        tr_with("Start entered {0}: check the gauge", &[&when_text(at, now)])
                    }
                    StartStatus::Predicted => tr_with(
                        "Start {0}, {1} from the fill, not read",
                        &[&start, &s.read_text(i)],
                    ),
                    StartStatus::Fresh => tr_with("Start {0}, {1}", &[&start, &s.read_text(i)]),
                },
                how: if ready {
                    turn_how(plan, i)
                } else {
                    String::new()
                },
                sums: if ready {
                    tr_with(
                        "By hand: {0}. {1}. {2}. Exact figures: {3}.",
                        &[
                            &hand.content,
                            &allowance_sentence(input, plan),
                            &hand.turn,
                            &turn_sentence(plan, i),
                        ],
                    )
                } else {
                    String::new()
                },
                detail: tr_with(
                    "{0} · {1} · gauge {2}",
                    &[
                        &s.team.shown_label(i),
                        &input.divers[i].mix.label(),
                        &gauge_text(g),
                    ],
                ),
                minutes: match (ready, d.minutes_to_turn) {
                    (true, Some(m)) => tr_with(
                        "About {0} min to turn at the planned depth",
                        &[&crate::plan::shown::minutes(m)],
                    ),
                    _ => String::new(),
                },
                // Who controls follows from the starts: only once every one is read.
                controlling: ready && controllers.contains(&i),
                predicted: ready && predicted,
                stage: if ready {
                    stage_text(s, i)
                } else {
                    String::new()
                },
                stage_short: {
                    let mut parts = Vec::new();
                    if predicted {
                        parts.push(tr("start predicted"));
                    }
                    let stage_read = s.team.stage_status(i, now).is_some_and(|st| st.usable());
                    if d.stage.is_some() && ready && !stage_read {
                        parts.push(tr("stage: read its gauge"));
                    }
                    if let (Some(st), true) = (&d.stage, ready && stage_read) {
                        parts.push(tr_with(
                            "drop stage at {0} {1}",
                            &[&turn_text(st.drop_shown_value), &g.label()],
                        ));
                    }
                    parts.join(" · ")
                },
                read_short: s.read_text(i),
            }
        })
        .collect()
}

/// The rule and water the turns are made with: "Rule of thirds · fresh water 12 °C".
pub fn rule_head(s: &Session) -> String {
    let input = s.team.input();
    let args: [&dyn std::fmt::Display; 2] = [
        &input.rule.shown_name(),
        &temperature_text(input.units, input.water_temp),
    ];
    match input.water {
        crate::plan::Water::Fresh => tr_with("Rule of {0} · fresh water {1}", &args),
        crate::plan::Water::Salt => tr_with("Rule of {0} · salt water {1}", &args),
    }
}

/// The buddy view's top line: what the turns were made with.
pub fn buddy_heading(s: &Session) -> String {
    if s.team.is_demo() {
        tr_with(
            "DEMO, invented divers · TURNS · {0} · own gauges · tap to close",
            &[&rule_head(s)],
        )
    } else {
        tr_with("TURNS · {0} · own gauges · tap to close", &[&rule_head(s)])
    }
}

/// The rule line: the rule, the water and where each shown turn's allowance comes from.
/// While a start is not read, only the rule and the water.
pub fn rule_text(s: &Session) -> String {
    let input = s.team.input();
    let plan = s.team.plan();
    let head = rule_head(s);
    if starts_blocking(s).is_some() {
        return tr_with(
            "{0}. Who controls and how much each diver may use need every start read in the water.",
            &[&head],
        );
    }
    tr_with(
        "{0}. {1}",
        &[&head, &allowance_source_sentence(input, plan)],
    )
}

/// The out-of-gas check, once every start is read today.
pub fn margin_text(s: &Session) -> String {
    if starts_blocking(s).is_some() {
        return tr("Needs every start read in the water.");
    }
    let plan = s.team.plan();
    let at_turn = plan.margin_at_first_turn_text();
    if at_turn.is_empty() {
        plan.margin_text()
    } else {
        format!("{} {at_turn}", plan.margin_text())
    }
}

pub fn first_text(s: &Session) -> String {
    if starts_blocking(s).is_some() {
        return String::new();
    }
    let plan = s.team.plan();
    match plan.first_to_turn {
        Some(i) => tr_with(
            "{0} reaches turn first, after about {1} min.",
            &[
                &plan.divers[i].name,
                &crate::plan::shown::minutes(plan.divers[i].minutes_to_turn.unwrap_or(0.0)),
            ],
        ),
        None => String::new(),
    }
}

/// The plan's warnings, one sentence each.
pub fn warnings(s: &Session) -> Vec<String> {
    let names = s.team.plan().names();
    s.team
        .shown_warnings(s.now())
        .into_iter()
        .map(|w| w.describe(&names))
        .collect()
}

/// The team's default pressure unit: "bar" or "psi".
pub fn pressure_unit(s: &Session) -> String {
    s.units().pressure_label().to_string()
}
