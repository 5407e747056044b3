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

use super::matching::TeamPlan;
use super::pencil::{down1, pencil_content, up1};
use super::rounding::round_up_to_step;
use super::shown;
use super::team::TeamInput;
use crate::i18n::{tr, tr_with};

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

/// Diver `i`'s pencil sums. Each figure is written once and used as written: the turn
/// sum divides by the content the content sum ends with, and by the allowance the
/// allowance sentence ends with.
pub fn hand_working(team: &TeamInput, plan: &TeamPlan, i: usize) -> HandWorking {
    let vu = team.units.volume_label();
    let g = plan.divers[i].gauge;
    let gu = g.label();
    let start = g.value(team.divers[i].start);
    let (content, c) = pencil_content(team, plan, i);
    let a = super::allowance::pencil_allowance(team, plan).allowance;
    let drop = if c > 0.0 { down1(start * a / c) } else { 0.0 };
    let exact = up1(start - drop);
    let rounded = round_up_to_step(exact, g.step).min(start);
    let turn = tr_with(
        "{0} {1} × {2} {3} ÷ {4} {3} = {5} {1} to spend; {0} − {5} = {6} {1}",
        &[
            &shown::num(start),
            &gu,
            &shown::num(a),
            &vu,
            &shown::num(c),
            &shown::num(drop),
            &shown::num(exact),
        ],
    );
    HandWorking {
        content,
        turn,
        hand_exact: exact,
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
    let turn = shown::num(p.turn_shown_value);
    let capped = p.turn_shown_value >= start - 1e-9;
    let (own, other) = match p.set_by {
        super::gas_model::ModelKind::Hand => (hand, real),
        super::gas_model::ModelKind::Real => (real, hand),
    };
    let (own, other) = (shown::num(up1(own)), shown::num(up1(other)));
    let mark = shown::num(if capped { start } else { g.step });
    let args: [&dyn std::fmt::Display; 5] = [&own, &turn, &gu, &mark, &other];
    match (p.set_by, capped) {
        (super::gas_model::ModelKind::Hand, false) => tr_with(
            "hand {0} → {1} {2} (rounded up to {3} {2}); real gas {4} {2} is lower, not used",
            &args,
        ),
        (super::gas_model::ModelKind::Hand, true) => tr_with(
            "hand {0} → {1} {2} (capped at the start {3} {2}); real gas {4} {2} is lower, not used",
            &args,
        ),
        (super::gas_model::ModelKind::Real, false) => tr_with(
            "real gas {0} → {1} {2} (rounded up to {3} {2}), higher than hand {4} {2}, so real gas sets it",
            &args,
        ),
        (super::gas_model::ModelKind::Real, true) => tr_with(
            "real gas {0} → {1} {2} (capped at the start {3} {2}), higher than hand {4} {2}, so real gas sets it",
            &args,
        ),
    }
}

/// The one plain line under a turn: how it was found, without figures (the sums are
/// in `hand_working` and `turn_sentence`).
pub fn turn_how(plan: &TeamPlan, i: usize) -> String {
    let p = &plan.divers[i];
    let g = p.gauge;
    if p.turn_shown_value >= g.value(p.start) - 1e-9 {
        return tr("The turn is the start itself: almost no gas to spend before turning.");
    }
    let (step, unit) = (shown::num(g.step), g.label());
    match p.set_by {
        super::gas_model::ModelKind::Hand => tr_with(
            "By hand (tank factor), rounded up to the next {0} {1} mark.",
            &[&step, &unit],
        ),
        super::gas_model::ModelKind::Real => tr_with(
            "By real gas, more careful here than the hand method, rounded up to the next {0} {1} mark.",
            &[&step, &unit],
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::super::allowance::{allowance_sentence, allowance_sources};
    use super::*;
    use crate::plan::{
        CylinderSet, CylinderSpec, DiverInput, Gauge, Mix, Pressure, PressureUnit, Rule,
        Temperature, UnitSystem, Water, plan_team,
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

    fn stamped_twins(water_l: f64, working_bar: f64) -> CylinderSet {
        CylinderSet::twins(CylinderSpec::Stamped {
            water_l,
            working_bar,
        })
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
                stamped_twins(12.0, 232.0),
                Pressure::from_bar(220.0),
                None,
            ),
            diver(
                "Tomas",
                stamped_twins(7.0, 300.0),
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
        let sources = allowance_sources(&t, &plan);
        let hand = sources
            .iter()
            .find(|a| a.model == crate::plan::gas_model::ModelKind::Hand)
            .expect("at 220 and 280 bar the hand method sets a turn");
        assert_eq!(
            (hand.diver, hand.content, hand.allowance),
            (1, 3920.0, 1306.6)
        );
        let used: usize = sources.iter().map(|a| a.turns.len()).sum();
        assert_eq!(used, 2, "every shown turn has one source");
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
        // One figure per quantity: the turn sum divides by the content as printed.
        assert!(w.turn.contains("÷ 2265.3 L"), "{}", w.turn);
    }

    #[test]
    fn a_psi_gauge_on_stamped_twins_uses_the_printed_content_once() {
        // 2950 psi on twin 12 L: 2950 × 0.0689476 = 203.39 bar (NIST SP 811 psi factor),
        // written 203.3 bar; 2 × 12 × 203.3 = 4879.2 L. The turn sum divides by 4879.2 L,
        // not by the unrounded 4881.4 L.
        let t = metric_team(vec![
            diver(
                "Bram",
                stamped_twins(12.0, 232.0),
                Pressure::from_psi(2950.0),
                Some(Gauge {
                    unit: PressureUnit::Psi,
                    step: 100.0,
                }),
            ),
            diver(
                "Sol",
                stamped_twins(10.0, 300.0),
                Pressure::from_bar(230.0),
                None,
            ),
        ]);
        let plan = plan_team(&t).unwrap();
        let w = hand_working(&t, &plan, 0);
        assert!(w.content.ends_with("= 4879.2 L"), "{}", w.content);
        assert!(w.turn.contains("÷ 4879.2 L"), "{}", w.turn);
        // Sol holds the smallest content: 2 × 10 × 230 = 4600 L, ÷ 3 = 1533.3 L.
        assert!(w.turn.contains("× 1533.3 L"), "{}", w.turn);
        assert!(allowance_sentence(&t, &plan).contains("4600 L (Sol) ÷ 3 = 1533.3 L"));
    }
}
