//! The hand check: each diver's tank-factor turn written out as the pencil sums a diver
//! does on the dock (common practice), with the figures the plan used, so that every
//! hand figure on screen can be redone with a pencil.
//!
//! - content: water litres × gauge bar (12 L at 232 bar = 2784 L), or for an imperial
//!   rating, rated cu ft × gauge psi ÷ rated psi;
//! - the team allowance: the smallest content × the rule's fraction;
//! - each diver's drop: start × allowance ÷ own content (the content is a straight line
//!   in gauge pressure), and the hand turn = start − drop, rounded up to the graduation.
//!
//! Figures are written to one decimal, each rounded toward safety: contents, the
//! allowance and drops down, turns up.

use super::cylinders::CylinderSpec;
use super::error::fmt_num;
use super::matching::TeamPlan;
use super::rounding::round_up_to_step;
use super::team::TeamInput;
use super::units::{BAR_PER_PSI, LITRES_PER_CUFT, PressureUnit, UnitSystem};

/// One diver's pencil sums.
#[derive(Clone, Debug, PartialEq)]
pub struct HandWorking {
    /// The content sum, e.g. "2 × 12 L × 220 bar = 5280 L".
    pub content: String,
    /// The drop and turn sum, e.g. "220 × 1306.6 ÷ 5280 = 54.4 bar; 220 − 54.4 = 165.6".
    pub turn: String,
    /// The hand turn exactly, in the diver's unit, rounded up to 0.1.
    pub hand_exact: f64,
    /// The hand turn rounded up to the diver's graduation (never above the start).
    pub hand_rounded: f64,
}

/// Round down to one decimal, tolerating float noise.
pub fn down1(x: f64) -> f64 {
    ((x * 10.0) + 1e-6).floor() / 10.0
}

/// Round up to one decimal, tolerating float noise.
pub fn up1(x: f64) -> f64 {
    ((x * 10.0) - 1e-6).ceil() / 10.0
}

/// The team's hand allowance sentence, e.g. "a third of the smallest hand content:
/// 3920 L ÷ 3 = 1306.6 L (Tomas)".
pub fn allowance_sentence(team: &TeamInput, plan: &TeamPlan) -> String {
    let u = team.units;
    let vu = u.volume_label();
    let (ci, c) = plan
        .divers
        .iter()
        .enumerate()
        .min_by(|a, b| {
            a.1.content_hand
                .litres()
                .total_cmp(&b.1.content_hand.litres())
        })
        .map(|(i, d)| (i, d.content_hand))
        .unwrap_or((0, plan.divers[0].content_hand));
    format!(
        "Allowance by hand: the smallest content {} {vu} ({}) ÷ {} = {} {vu}",
        fmt_num(down1(u.volume_value(c))),
        plan.divers[ci].name,
        team.rule.denominator(),
        fmt_num(down1(u.volume_value(plan.team_allowance_hand)))
    )
}

/// Diver `i`'s pencil sums.
pub fn hand_working(team: &TeamInput, plan: &TeamPlan, i: usize) -> HandWorking {
    let u = team.units;
    let vu = u.volume_label();
    let d = &team.divers[i];
    let p = &plan.divers[i];
    let g = p.gauge;
    let gu = g.label();
    let start = g.value(d.start);
    let n = d.cylinders.count;
    let count = if n == 1 {
        String::new()
    } else {
        format!("{n} × ")
    };
    let content = match d.cylinders.spec {
        CylinderSpec::Stamped { water_l, .. } => {
            let (bar, read) = match g.unit {
                PressureUnit::Bar => (start, String::new()),
                PressureUnit::Psi => {
                    let bar = down1(start * BAR_PER_PSI);
                    (
                        bar,
                        format!("{} psi = {} bar; ", fmt_num(start), fmt_num(bar)),
                    )
                }
            };
            let litres = f64::from(n) * water_l * bar;
            let tail = match u {
                UnitSystem::Metric => String::new(),
                UnitSystem::Imperial => {
                    format!(" = {} cu ft", fmt_num(down1(litres / LITRES_PER_CUFT)))
                }
            };
            format!(
                "{read}{count}{} L × {} bar = {} L{tail}",
                fmt_num(water_l),
                fmt_num(bar),
                fmt_num(down1(litres))
            )
        }
        CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        } => {
            let (psi, read) = match g.unit {
                PressureUnit::Psi => (start, String::new()),
                PressureUnit::Bar => {
                    // To a hundredth (rounded down), so the sums that follow agree with
                    // the plan's own hand content to the decimal shown.
                    let psi = ((start / BAR_PER_PSI) * 100.0 + 1e-6).floor() / 100.0;
                    (
                        psi,
                        format!("{} bar = {} psi; ", fmt_num(start), fmt_num(psi)),
                    )
                }
            };
            let cuft = f64::from(n) * rated_cuft * psi / rated_psi;
            let tail = match u {
                UnitSystem::Imperial => String::new(),
                UnitSystem::Metric => {
                    format!(" = {} L", fmt_num(down1(cuft * LITRES_PER_CUFT)))
                }
            };
            format!(
                "{read}{count}{} cu ft × {} psi ÷ {} psi = {} cu ft{tail}",
                fmt_num(rated_cuft),
                fmt_num(psi),
                fmt_num(rated_psi),
                fmt_num(down1(cuft))
            )
        }
    };
    let c = u.volume_value(p.content_hand);
    let a = u.volume_value(plan.team_allowance_hand);
    let drop = if c > 0.0 { start * a / c } else { 0.0 };
    let exact = g.value(p.turn_hand);
    let rounded = round_up_to_step(exact, g.step).min(start);
    let turn = format!(
        "{} {gu} × {} {vu} ÷ {} {vu} = {} {gu} to spend; {} − {} = {} {gu}",
        fmt_num(start),
        fmt_num(down1(a)),
        fmt_num(down1(c)),
        fmt_num(down1(drop)),
        fmt_num(start),
        fmt_num(down1(drop)),
        fmt_num(up1(exact)),
    );
    HandWorking {
        content,
        turn,
        hand_exact: up1(exact),
        hand_rounded: rounded,
    }
}

/// How the shown turn follows from the two exact turns, in one line a diver reads one
/// way: the hand figure and its rounding, then the real-gas figure and whether it set
/// the turn. E.g. "hand 165.6 → 170 bar (rounded up to 10 bar); real gas 163.2 bar is
/// lower, not used".
pub fn turn_sentence(plan: &TeamPlan, i: usize) -> String {
    let p = &plan.divers[i];
    let g = p.gauge;
    let gu = g.label();
    let start = g.value(p.start);
    let hand = g.value(p.turn_hand);
    let real = g.value(p.turn_real);
    let shown = fmt_num(p.turn_shown_value);
    let capped = p.turn_shown_value >= start - 1e-9;
    let rounding = if capped {
        format!("(capped at the start {} {gu})", fmt_num(start))
    } else {
        format!("(rounded up to {} {gu})", fmt_num(g.step))
    };
    match p.set_by {
        super::gas_model::ModelKind::Hand => format!(
            "hand {} → {shown} {gu} {rounding}; real gas {} {gu} is lower, not used",
            fmt_num(up1(hand)),
            fmt_num(up1(real))
        ),
        super::gas_model::ModelKind::Real => format!(
            "real gas {} → {shown} {gu} {rounding}, higher than hand {} {gu}, so real gas sets it",
            fmt_num(up1(real)),
            fmt_num(up1(hand))
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::plan::{
        CylinderSet, DiverInput, Gauge, Mix, Pressure, Rule, Temperature, Water, plan_team,
    };

    fn diver(name: &str, set: CylinderSet, start: Pressure, gauge: Option<Gauge>) -> DiverInput {
        DiverInput {
            name: name.into(),
            cylinders: set,
            mix: Mix::AIR,
            start,
            sac_l_per_min: None,
            stage: None,
            gauge,
        }
    }

    fn metric_team(divers: Vec<DiverInput>) -> TeamInput {
        TeamInput {
            units: UnitSystem::Metric,
            rule: Rule::Thirds,
            gauge_step: 10.0,
            water_temp: Temperature::from_celsius(15.0),
            depth: None,
            water: Water::Fresh,
            divers,
        }
    }

    #[test]
    fn pencil_sums_match_the_plan() {
        // Worked by hand (common practice): twin 12 L at 220 bar = 5280 L; twin 7 L at
        // 280 bar = 3920 L, a third 1306.6 L; 220 × 1306.6 ÷ 5280 = 54.4 bar; turn 165.6.
        let t = metric_team(vec![
            diver(
                "Ines",
                CylinderSet::twins(CylinderSpec::Stamped {
                    water_l: 12.0,
                    working_bar: 232.0,
                }),
                Pressure::from_bar(220.0),
                None,
            ),
            diver(
                "Tomas",
                CylinderSet::twins(CylinderSpec::Stamped {
                    water_l: 7.0,
                    working_bar: 300.0,
                }),
                Pressure::from_bar(280.0),
                None,
            ),
        ]);
        let plan = plan_team(&t).unwrap();
        let w = hand_working(&t, &plan, 0);
        assert_eq!(w.content, "2 × 12 L × 220 bar = 5280 L");
        assert_eq!(
            w.turn,
            "220 bar × 1306.6 L ÷ 5280 L = 54.4 bar to spend; 220 − 54.4 = 165.6 bar"
        );
        assert_eq!(w.hand_rounded, 170.0);
        assert!(allowance_sentence(&t, &plan).contains("3920 L (Tomas) ÷ 3 = 1306.6 L"));
        let s = turn_sentence(&plan, 0);
        assert!(
            s.starts_with("hand 165.6 → 170 bar (rounded up to 10 bar)"),
            "{s}"
        );
    }

    #[test]
    fn a_psi_gauge_on_a_rated_cylinder_in_a_metric_team() {
        // Rated 40 cu ft at 3000 psi, read 3000 psi: 40 cu ft = 1132.6 L by pencil
        // (1 cu ft = 28.317 L, NIST SP 811).
        let t = metric_team(vec![
            diver(
                "A",
                CylinderSet::twins(CylinderSpec::Rated {
                    rated_cuft: 40.0,
                    rated_psi: 3000.0,
                }),
                Pressure::from_psi(3000.0),
                Some(Gauge {
                    unit: PressureUnit::Psi,
                    step: 50.0,
                }),
            ),
            diver(
                "B",
                CylinderSet::single(CylinderSpec::Stamped {
                    water_l: 12.0,
                    working_bar: 232.0,
                }),
                Pressure::from_bar(200.0),
                None,
            ),
        ]);
        let plan = plan_team(&t).unwrap();
        let w = hand_working(&t, &plan, 0);
        assert_eq!(
            w.content,
            "2 × 40 cu ft × 3000 psi ÷ 3000 psi = 80 cu ft = 2265.3 L"
        );
        assert_eq!(w.hand_rounded % 50.0, 0.0);
        assert!(turn_sentence(&plan, 0).contains(" psi "));
    }
}
