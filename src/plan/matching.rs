//! Volume matching: each diver's turn pressure from the team's smallest allowance.

use super::error::InputError;
use super::gas_model::{ContentModel, HandModel, ModelKind};
use super::out_of_gas::{StressCheck, stress_check};
use super::real_gas::RealGasModel;
use super::team::TeamInput;
use super::units::{Pressure, UnitSystem, Volume};

/// Per-diver results.
#[derive(Clone, Debug, PartialEq)]
pub struct DiverPlan {
    pub name: String,
    /// Gas at start, real-gas model (free litres at 1 atm, water temperature).
    pub content_real: Volume,
    /// Gas at start, tank-factor model.
    pub content_hand: Volume,
    /// Exact turn pressures of each model.
    pub turn_real: Pressure,
    pub turn_hand: Pressure,
    /// Turn shown to the diver: the higher exact turn rounded UP to the gauge step,
    /// never above start.
    pub turn_shown: Pressure,
    /// The shown turn as a number in the team's unit (exactly on the gauge step, or the start).
    pub turn_shown_value: f64,
    /// Which model's exact turn was higher and so set the shown turn.
    pub set_by: ModelKind,
    /// Real gas used from start to the shown turn.
    pub used_real: Volume,
    pub controlling: bool,
    /// Minutes from start to the shown turn at the given SAC and depth, if known.
    pub minutes_to_turn: Option<f64>,
    pub start: Pressure,
}

/// A team's plan.
#[derive(Clone, Debug, PartialEq)]
pub struct TeamPlan {
    pub units: UnitSystem,
    pub divers: Vec<DiverPlan>,
    /// Index of the controlling diver (smallest real-gas allowance).
    pub controlling: usize,
    pub team_allowance_real: Volume,
    pub team_allowance_hand: Volume,
    pub stress: StressCheck,
    /// Index of the diver who reaches turn first, where times are known for all.
    pub first_to_turn: Option<usize>,
    pub warnings: Vec<String>,
}

impl TeamPlan {
    pub fn controlling_diver(&self) -> &DiverPlan {
        &self.divers[self.controlling]
    }
}

/// Round `value` up to a multiple of `step`, tolerating float noise of 1e-9 steps.
pub fn round_up_to_step(value: f64, step: f64) -> f64 {
    let k = (value / step - 1e-9).ceil();
    k * step
}

/// Round `value` down to a multiple of `step`, tolerating float noise of 1e-9 steps.
pub fn round_down_to_step(value: f64, step: f64) -> f64 {
    let k = (value / step + 1e-9).floor();
    k * step
}

/// Plan the team: validate, then match on volume under both models.
pub fn plan_team(team: &TeamInput) -> Result<TeamPlan, InputError> {
    team.validate()?;
    let u = team.units;
    let f = team.rule.fraction();
    let hand = HandModel;
    let reals: Vec<RealGasModel> = team
        .divers
        .iter()
        .map(|d| RealGasModel::new(d.mix, team.water_temp))
        .collect();

    let water_real: Vec<Volume> = team
        .divers
        .iter()
        .map(|d| d.cylinders.water(ModelKind::Real))
        .collect();
    let water_hand: Vec<Volume> = team
        .divers
        .iter()
        .map(|d| d.cylinders.water(ModelKind::Hand))
        .collect();
    let content_real: Vec<Volume> = team
        .divers
        .iter()
        .enumerate()
        .map(|(i, d)| reals[i].content(water_real[i], d.start))
        .collect();
    let content_hand: Vec<Volume> = team
        .divers
        .iter()
        .enumerate()
        .map(|(i, d)| hand.content(water_hand[i], d.start))
        .collect();

    let (controlling, allowance_real) = smallest(&content_real, f);
    let (_, allowance_hand) = smallest(&content_hand, f);

    let mut divers = Vec::with_capacity(team.divers.len());
    for (i, d) in team.divers.iter().enumerate() {
        let turn_real = reals[i].pressure_for(water_real[i], content_real[i] - allowance_real);
        let turn_hand = hand.pressure_for(water_hand[i], content_hand[i] - allowance_hand);
        let (higher, set_by) = if turn_hand.bar() > turn_real.bar() {
            (turn_hand, ModelKind::Hand)
        } else {
            (turn_real, ModelKind::Real)
        };
        let start_value = u.pressure_value(d.start);
        let rounded = round_up_to_step(u.pressure_value(higher), team.gauge_step);
        let shown_value = rounded.min(start_value);
        let turn_shown = u.pressure(shown_value);
        let used_real = (content_real[i] - reals[i].content(water_real[i], turn_shown)).max_zero();
        divers.push(DiverPlan {
            name: d.name.clone(),
            content_real: content_real[i],
            content_hand: content_hand[i],
            turn_real,
            turn_hand,
            turn_shown,
            turn_shown_value: shown_value,
            set_by,
            used_real,
            controlling: i == controlling,
            minutes_to_turn: None,
            start: d.start,
        });
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

    let mut warnings = team.warnings();
    for d in &divers {
        if d.turn_shown_value >= u.pressure_value(d.start) - 1e-9 {
            warnings.push(format!(
                "{}: the turn equals the start pressure; at this gauge step there is no gas to spend.",
                d.name
            ));
        }
    }
    if stress.margin.is_infinite() {
        warnings.push(
            "No gas is spent before the turn; the out-of-gas check has nothing to test."
                .to_string(),
        );
    }

    Ok(TeamPlan {
        units: u,
        divers,
        controlling,
        team_allowance_real: allowance_real,
        team_allowance_hand: allowance_hand,
        stress,
        first_to_turn,
        warnings,
    })
}

/// The index and allowance of the diver with the smallest allowance (first on ties).
fn smallest(contents: &[Volume], fraction: f64) -> (usize, Volume) {
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rounding_toward_safety() {
        assert_eq!(round_up_to_step(143.3, 10.0), 150.0);
        assert_eq!(round_up_to_step(150.0, 10.0), 150.0);
        assert_eq!(round_up_to_step(150.000_000_000_01, 10.0), 150.0);
        assert_eq!(round_up_to_step(1501.0, 100.0), 1600.0);
        assert_eq!(round_down_to_step(79.9, 5.0), 75.0);
        assert_eq!(round_down_to_step(80.0, 5.0), 80.0);
    }
}
