//! Volume matching: each diver's turn pressure from the team's smallest allowance.

use super::cylinders::CylinderSet;
use super::error::InputError;
use super::gas_model::ModelKind;
use super::gauge::Gauge;
use super::mix::Mix;
use super::out_of_gas::{StressCheck, stress_check};
use super::supply::SupplyModels;
use super::team::TeamInput;
use super::units::{Pressure, UnitSystem, Volume};
use super::warning::Warning;

/// Per-diver results.
#[derive(Clone, Debug, PartialEq)]
pub struct DiverPlan {
    /// The diver's name, as entered.
    pub name: String,
    /// Gas at start, real-gas model (free litres at 1 atm, water temperature).
    pub content_real: Volume,
    /// Gas at start, tank-factor model.
    pub content_hand: Volume,
    /// Exact real-gas turn pressure (gauge), before rounding.
    pub turn_real: Pressure,
    /// Exact tank-factor turn pressure (gauge), before rounding.
    pub turn_hand: Pressure,
    /// Turn shown to the diver: the higher exact turn rounded UP to the diver's
    /// graduation, never above start.
    pub turn_shown: Pressure,
    /// The shown turn as a number on the diver's gauge (exactly on its graduation, or
    /// the start).
    pub turn_shown_value: f64,
    /// The gauge the diver reads: every shown pressure of theirs is in its unit.
    pub gauge: Gauge,
    /// Which model's exact turn was higher and so set the shown turn.
    pub set_by: ModelKind,
    /// Real gas used from start to the shown turn.
    pub used_real: Volume,
    /// Whether this diver holds the team's smallest real-gas content and so sets the
    /// real-gas allowance (the first such diver on a tie).
    pub controlling: bool,
    /// Minutes from start to the shown turn at the given SAC and depth, if known.
    pub minutes_to_turn: Option<f64>,
    /// Start pressure (gauge), as entered.
    pub start: Pressure,
    /// The stage plan, for a diver who carries a stage.
    pub stage: Option<StagePlan>,
}

/// A stage's drop pressure: the stage is breathed from its start down to the drop
/// pressure, then left for the way out.
#[derive(Clone, Debug, PartialEq)]
pub struct StagePlan {
    /// Gas in the stage at its start, real-gas model (free litres at 1 atm, water
    /// temperature).
    pub content_real: Volume,
    /// Exact real-gas drop pressure (gauge), before rounding.
    pub drop_real: Pressure,
    /// Exact tank-factor drop pressure (gauge), before rounding.
    pub drop_hand: Pressure,
    /// Drop shown to the diver: the higher exact drop rounded UP to the diver's
    /// graduation, never above the stage's start.
    pub drop_shown: Pressure,
    /// On the diver's gauge, on its graduation (or the start).
    pub drop_shown_value: f64,
    /// Which model's exact drop was higher and so set the shown drop.
    pub set_by: ModelKind,
    /// This stage holds the smallest allowance among the team's stages.
    pub controlling: bool,
    /// The stage's start pressure (gauge), as entered.
    pub start: Pressure,
}

/// A team's plan.
#[derive(Clone, Debug, PartialEq)]
pub struct TeamPlan {
    /// The team's unit system, as in the input.
    pub units: UnitSystem,
    /// Per-diver results, in input order.
    pub divers: Vec<DiverPlan>,
    /// Index of the controlling diver (smallest real-gas allowance).
    pub controlling: usize,
    /// Gas each diver may spend before turning, real-gas model: the rule's fraction of
    /// the smallest real-gas content in the team.
    pub team_allowance_real: Volume,
    /// The same under the tank-factor model: the rule's fraction of the smallest
    /// tank-factor content, which may belong to a different diver.
    pub team_allowance_hand: Volume,
    /// The out-of-gas check with every diver at their own shown turn, each having used
    /// their `used_real`.
    pub stress: StressCheck,
    /// The same check at the moment the team actually turns (the first diver reaches
    /// their turn) when every breathing rate and the depth are known: the others have
    /// used less by then, so this margin is never below `stress.margin`.
    pub stress_at_first_turn: Option<StressCheck>,
    /// Index of the diver who reaches turn first, where times are known for all.
    pub first_to_turn: Option<usize>,
    /// Observations that do not stop the plan.
    pub warnings: Vec<Warning>,
}

impl TeamPlan {
    /// The results of the controlling diver.
    pub fn controlling_diver(&self) -> &DiverPlan {
        &self.divers[self.controlling]
    }

    /// The divers' names, in input order.
    pub fn names(&self) -> Vec<String> {
        self.divers.iter().map(|d| d.name.clone()).collect()
    }

    /// Every warning in words, each led by its diver's name where it has one.
    pub fn warning_texts(&self) -> Vec<String> {
        let names = self.names();
        self.warnings.iter().map(|w| w.describe(&names)).collect()
    }

    /// The out-of-gas check in words (all allowances used).
    pub fn margin_text(&self) -> String {
        super::out_of_gas::describe_margin(&self.stress, &self.names())
    }

    /// The check in words at the moment the first diver turns; empty when unknown.
    pub fn margin_at_first_turn_text(&self) -> String {
        super::out_of_gas::describe_margin_at_first_turn(
            self.stress_at_first_turn.as_ref(),
            self.first_to_turn,
            self.first_to_turn
                .and_then(|i| self.divers[i].minutes_to_turn),
            &self.names(),
        )
    }
}

/// One gas supply to match: a diver's main cylinders or a stage.
struct Supply<'a> {
    cylinders: &'a CylinderSet,
    mix: Mix,
    start: Pressure,
    gauge: Gauge,
}

/// Matching results for one supply.
struct Matched {
    content_real: Volume,
    content_hand: Volume,
    turn_real: Pressure,
    turn_hand: Pressure,
    turn_shown: Pressure,
    turn_shown_value: f64,
    set_by: ModelKind,
    used_real: Volume,
}

/// Match a group of supplies on volume under both models: the smallest allowance
/// governs; each supply's turn is the higher exact turn, rounded up to its own gauge's
/// graduation in its own unit, never above its start. Returns the results and the
/// controlling index.
fn match_group(team: &TeamInput, supplies: &[Supply<'_>]) -> (Vec<Matched>, usize, Volume, Volume) {
    let f = team.rule.fraction();
    let models: Vec<SupplyModels> = supplies
        .iter()
        .map(|s| SupplyModels::new(s.cylinders, s.mix, team.water_temp, s.gauge))
        .collect();
    let contents: Vec<(Volume, Volume)> = supplies
        .iter()
        .zip(&models)
        .map(|(s, m)| m.contents(s.start))
        .collect();
    let content_real: Vec<Volume> = contents.iter().map(|c| c.0).collect();
    let content_hand: Vec<Volume> = contents.iter().map(|c| c.1).collect();
    let (controlling, allowance_real) = smallest(&content_real, f);
    let (_, allowance_hand) = smallest(&content_hand, f);

    let matched = supplies
        .iter()
        .zip(&models)
        .zip(&contents)
        .map(|((s, m), &c)| {
            let t = m.turn(s.start, c, (allowance_real, allowance_hand));
            let used_real = (c.0 - m.real_content(t.shown)).max_zero();
            Matched {
                content_real: c.0,
                content_hand: c.1,
                turn_real: t.real,
                turn_hand: t.hand,
                turn_shown: t.shown,
                turn_shown_value: t.shown_value,
                set_by: t.set_by,
                used_real,
            }
        })
        .collect();
    (matched, controlling, allowance_real, allowance_hand)
}

/// Plan the team: validate, then match on volume under both models.
pub fn plan_team(team: &TeamInput) -> Result<TeamPlan, InputError> {
    team.validate()?;
    let supplies: Vec<Supply<'_>> = team
        .divers
        .iter()
        .enumerate()
        .map(|(i, d)| Supply {
            cylinders: &d.cylinders,
            mix: d.mix,
            start: d.start,
            gauge: team.gauge_of(i),
        })
        .collect();
    let (matched, controlling, allowance_real, allowance_hand) = match_group(team, &supplies);
    let content_real: Vec<Volume> = matched.iter().map(|m| m.content_real).collect();

    let mut divers: Vec<DiverPlan> = team
        .divers
        .iter()
        .zip(matched)
        .enumerate()
        .map(|(i, (d, m))| DiverPlan {
            name: d.name.clone(),
            content_real: m.content_real,
            content_hand: m.content_hand,
            turn_real: m.turn_real,
            turn_hand: m.turn_hand,
            turn_shown: m.turn_shown,
            turn_shown_value: m.turn_shown_value,
            gauge: team.gauge_of(i),
            set_by: m.set_by,
            used_real: m.used_real,
            controlling: i == controlling,
            minutes_to_turn: None,
            start: d.start,
            stage: None,
        })
        .collect();

    // Stages: matched among the divers who carry one, on the same rule.
    let with_stage: Vec<usize> = (0..team.divers.len())
        .filter(|&i| team.divers[i].stage.is_some())
        .collect();
    let stage_supplies: Vec<Supply<'_>> = with_stage
        .iter()
        .filter_map(|&i| team.divers[i].stage.as_ref().map(|st| (i, st)))
        .map(|(i, st)| Supply {
            cylinders: &st.cylinders,
            mix: st.mix,
            start: st.start,
            gauge: team.gauge_of(i),
        })
        .collect();
    if !stage_supplies.is_empty() {
        let (stage_matched, stage_ctrl, _, _) = match_group(team, &stage_supplies);
        for (k, (i, m)) in with_stage.iter().zip(stage_matched).enumerate() {
            divers[*i].stage = Some(StagePlan {
                content_real: m.content_real,
                drop_real: m.turn_real,
                drop_hand: m.turn_hand,
                drop_shown: m.turn_shown,
                drop_shown_value: m.turn_shown_value,
                set_by: m.set_by,
                controlling: k == stage_ctrl,
                start: stage_supplies[k].start,
            });
        }
    }

    let mut first_to_turn = None;
    if let Some(depth) = team.depth {
        let ambient = team.water.ambient_atm(depth);
        let mut best = f64::INFINITY;
        for (i, d) in team.divers.iter().enumerate() {
            if let Some(sac) = d.sac_l_per_min {
                let minutes = divers[i].used_real.litres() / (sac * ambient);
                divers[i].minutes_to_turn = Some(minutes);
                if minutes < best {
                    best = minutes;
                    first_to_turn = Some(i);
                }
            }
        }
        if divers.iter().any(|d| d.minutes_to_turn.is_none()) {
            first_to_turn = None;
        }
    }

    let used: Vec<Volume> = divers.iter().map(|d| d.used_real).collect();
    let stress = stress_check(&content_real, &used);
    let stress_at_first_turn = first_to_turn.and_then(|first| {
        let t_first = divers[first].minutes_to_turn?;
        let used_then: Option<Vec<Volume>> = divers
            .iter()
            .map(|d| {
                let own = d.minutes_to_turn?;
                // Linear in time at a constant rate: the share of the own turn reached.
                let share = if own > 0.0 {
                    (t_first / own).min(1.0)
                } else {
                    1.0
                };
                Some(d.used_real.scaled(share))
            })
            .collect();
        used_then.map(|u| stress_check(&content_real, &u))
    });

    let mut warnings = team.warnings();
    for (i, d) in divers.iter().enumerate() {
        if d.turn_shown_value >= d.gauge.value(d.start) - 1e-9 {
            warnings.push(Warning::TurnEqualsStart { diver: i });
        }
    }
    if stress.margin.is_infinite() {
        warnings.push(Warning::NoGasSpent);
    }

    Ok(TeamPlan {
        units: team.units,
        divers,
        controlling,
        team_allowance_real: allowance_real,
        team_allowance_hand: allowance_hand,
        stress,
        stress_at_first_turn,
        first_to_turn,
        warnings,
    })
}

/// The index and allowance of the diver with the smallest allowance (first on ties).
pub(crate) fn smallest(contents: &[Volume], fraction: f64) -> (usize, Volume) {
    let mut best = 0;
    for (i, c) in contents.iter().enumerate() {
        if c.litres() < contents[best].litres() {
            best = i;
        }
    }
    (best, contents[best].scaled(fraction))
}

trait MaxZero {
    fn max_zero(self) -> Self;
}

impl MaxZero for Volume {
    fn max_zero(self) -> Volume {
        Volume::from_litres(self.litres().max(0.0))
    }
}
