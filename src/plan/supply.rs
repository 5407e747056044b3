//! One gas supply's models (a diver's main cylinders or a stage): its water capacity in
//! each model, its gas and the gauge it is read on, and the turn for an allowance.
//! Both the team plan and the pairing charts go through here, so they cannot differ.

use super::cylinders::CylinderSet;
use super::gas_model::{ContentModel, HandModel, ModelKind};
use super::gauge::Gauge;
use super::mix::Mix;
use super::real_gas::RealGasModel;
use super::rounding::round_up_to_step;
use super::units::{Pressure, Temperature, Volume};

/// A supply's models, built once and reused for any start pressure.
#[derive(Clone, Debug)]
pub struct SupplyModels {
    real: RealGasModel,
    water_real: Volume,
    water_hand: Volume,
    /// The gauge the supply is read on.
    pub gauge: Gauge,
}

/// The turn (or stage drop) of one supply for a team allowance.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Turn {
    /// Exact real-gas turn.
    pub real: Pressure,
    /// Exact tank-factor turn.
    pub hand: Pressure,
    /// The model whose exact turn is higher and so sets the shown turn.
    pub set_by: ModelKind,
    /// The higher exact turn rounded up to the gauge's graduation, never above the start,
    /// as a number on the gauge.
    pub shown_value: f64,
    /// The same as a pressure.
    pub shown: Pressure,
}

impl SupplyModels {
    /// Models for `cylinders` filled with `mix` at the water temperature.
    pub fn new(cylinders: &CylinderSet, mix: Mix, water_temp: Temperature, gauge: Gauge) -> Self {
        SupplyModels {
            real: RealGasModel::new(mix, water_temp),
            water_real: cylinders.water(ModelKind::Real),
            water_hand: cylinders.water(ModelKind::Hand),
            gauge,
        }
    }

    /// Free gas at `start`: (real gas, tank factor).
    pub fn contents(&self, start: Pressure) -> (Volume, Volume) {
        (
            self.real.content(self.water_real, start),
            HandModel.content(self.water_hand, start),
        )
    }

    /// Real gas held at pressure `p`.
    pub fn real_content(&self, p: Pressure) -> Volume {
        self.real.content(self.water_real, p)
    }

    /// The turn from `start`, holding `contents` there, after spending the team's
    /// `allowance` (real gas, tank factor).
    pub fn turn(
        &self,
        start: Pressure,
        contents: (Volume, Volume),
        allowance: (Volume, Volume),
    ) -> Turn {
        let real = self
            .real
            .pressure_for(self.water_real, contents.0 - allowance.0);
        let hand = HandModel.pressure_for(self.water_hand, contents.1 - allowance.1);
        let (higher, set_by) = if hand.bar() > real.bar() {
            (hand, ModelKind::Hand)
        } else {
            (real, ModelKind::Real)
        };
        let g = self.gauge;
        let shown_value = round_up_to_step(g.value(higher), g.step).min(g.value(start));
        Turn {
            real,
            hand,
            set_by,
            shown_value,
            shown: g.pressure(shown_value),
        }
    }
}
