//! The team's allowance as the shown turns use it: the pencil figures of the hand
//! method (each figure the one printed elsewhere on the page), which diver's gas sets the
//! allowance in each model, and the words that say so.

use super::matching::TeamPlan;
use super::pencil::{down1, pencil_content};
use super::shown;
use super::team::TeamInput;
use crate::i18n::tr_with;

/// The team's hand allowance as the pencil gets it: the smallest of the divers' pencil
/// contents (each as `hand_working` prints it), and that content × the rule's fraction,
/// rounded down to one decimal. Every figure is the one printed elsewhere on the page.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct PencilAllowance {
    /// The diver whose content is smallest (the first on a tie).
    pub diver: usize,
    /// That content, in the team's volume unit, as printed.
    pub content: f64,
    /// The allowance, in the team's volume unit, as printed.
    pub allowance: f64,
}

/// The pencil allowance of the team.
pub fn pencil_allowance(team: &TeamInput, plan: &TeamPlan) -> PencilAllowance {
    let (diver, content) = (0..plan.divers.len())
        .map(|i| (i, pencil_content(team, plan, i).1))
        .fold(
            (0, f64::INFINITY),
            |best, c| if c.1 < best.1 { c } else { best },
        );
    let content = if content.is_finite() { content } else { 0.0 };
    PencilAllowance {
        diver,
        content,
        allowance: down1(content / f64::from(team.rule.denominator())),
    }
}

/// The team's hand allowance sentence, e.g. "Allowance by hand: the smallest content
/// 3920 L (Tomas) ÷ 3 = 1306.6 L".
pub fn allowance_sentence(team: &TeamInput, plan: &TeamPlan) -> String {
    let vu = team.units.volume_label();
    let a = pencil_allowance(team, plan);
    tr_with(
        "Allowance by hand: the smallest content {0} {1} ({2}) ÷ {3} = {4} {1}",
        &[
            &shown::num(a.content),
            &vu,
            &plan.divers[a.diver].name,
            &team.rule.denominator(),
            &shown::num(a.allowance),
        ],
    )
}

/// Whose gas sets the allowance that a group of shown turns uses.
#[derive(Clone, Debug, PartialEq)]
pub struct AllowanceSource {
    /// The model whose allowance these turns use.
    pub model: super::gas_model::ModelKind,
    /// The diver with the least gas in that model.
    pub diver: usize,
    /// The smallest content, in the team's volume unit, rounded down.
    pub content: f64,
    /// The allowance, in the team's volume unit, rounded down.
    pub allowance: f64,
    /// The divers whose shown turn this allowance sets, in team order.
    pub turns: Vec<usize>,
}

/// The allowances the shown turns use: one entry per model that sets at least one
/// shown turn (hand first). The hand entry's figures are the pencil figures.
pub fn allowance_sources(team: &TeamInput, plan: &TeamPlan) -> Vec<AllowanceSource> {
    use super::gas_model::ModelKind;
    let u = team.units;
    let by = |m: ModelKind| -> Vec<usize> {
        (0..plan.divers.len())
            .filter(|&i| plan.divers[i].set_by == m)
            .collect()
    };
    let mut out = Vec::new();
    let hand = by(ModelKind::Hand);
    if !hand.is_empty() {
        let a = pencil_allowance(team, plan);
        out.push(AllowanceSource {
            model: ModelKind::Hand,
            diver: a.diver,
            content: a.content,
            allowance: a.allowance,
            turns: hand,
        });
    }
    let real = by(ModelKind::Real);
    if !real.is_empty() {
        let c = plan.controlling;
        out.push(AllowanceSource {
            model: ModelKind::Real,
            diver: c,
            content: down1(u.volume_value(plan.divers[c].content_real)),
            allowance: down1(u.volume_value(plan.team_allowance_real)),
            turns: real,
        });
    }
    out
}

/// Where the shown turns' allowance comes from and who controls, in words: "Each diver
/// may use 1412 L going in: 4237 L (Bram) ÷ 3 = 1412 L, by hand. Bram controls: least
/// usable gas." When the hand method and real gas set different divers' turns, both
/// sums and both controlling divers. Whole units, rounded down.
pub fn allowance_source_sentence(team: &TeamInput, plan: &TeamPlan) -> String {
    use super::gas_model::ModelKind;
    let vu = team.units.volume_label();
    let n = team.rule.denominator();
    let whole = |x: f64| shown::num(shown::whole_down(x));
    let sources = allowance_sources(team, plan);
    let sum = |a: &AllowanceSource| {
        format!(
            "{} {vu} ({}) ÷ {n} = {} {vu}",
            whole(a.content),
            plan.divers[a.diver].name,
            whole(a.allowance)
        )
    };
    let names = |v: &[usize]| {
        v.iter()
            .map(|&i| plan.divers[i].name.as_str())
            .collect::<Vec<_>>()
            .join(", ")
    };
    match sources.as_slice() {
        [] => String::new(),
        [a] => {
            let args: [&dyn std::fmt::Display; 3] = [&whole(a.allowance), &vu, &sum(a)];
            let controls = &plan.divers[a.diver].name;
            match a.model {
                ModelKind::Hand => tr_with(
                    "Each diver may use {0} {1} going in: {2}, by hand. {3} controls: least usable gas.",
                    &[args[0], args[1], args[2], controls],
                ),
                ModelKind::Real => tr_with(
                    "Each diver may use {0} {1} going in: {2}, by real gas. {3} controls: least usable gas.",
                    &[args[0], args[1], args[2], controls],
                ),
            }
        }
        _ => {
            let parts: Vec<String> = sources
                .iter()
                .map(|a| {
                    let (who, how) = (names(&a.turns), sum(a));
                    match a.model {
                        ModelKind::Hand => tr_with(
                            "Turns of {0} use the allowance by hand: {1}.",
                            &[&who, &how],
                        ),
                        ModelKind::Real => tr_with(
                            "Turns of {0} use the allowance by real gas: {1}.",
                            &[&who, &how],
                        ),
                    }
                })
                .collect();
            let mut who: Vec<usize> = sources.iter().map(|a| a.diver).collect();
            who.dedup();
            let verdict = match who.split_last() {
                Some((last, [])) => tr_with(
                    "{0} controls: least usable gas in each method.",
                    &[&plan.divers[*last].name],
                ),
                Some((last, rest)) => tr_with(
                    "{0} and {1} control: least usable gas in each method.",
                    &[&names(rest), &plan.divers[*last].name],
                ),
                None => String::new(),
            };
            format!("{} {verdict}", parts.join(" "))
        }
    }
}
