//! Pressure change of a sealed cylinder whose gas cools or warms: the gas keeps
//! its density, so its pressure follows the temperature.

use super::mix::Mix;
use super::real_gas::RealGasModel;
use super::units::{ATM_BAR, Pressure, Temperature};

/// Predicted gauge pressures after a temperature change, both models.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct TemperatureChange {
    /// Real gas: density from (p1, T1), then pressure at that density and T2.
    pub real: Pressure,
    /// Ideal gas: p2_abs = p1_abs × T2 / T1.
    pub ideal: Pressure,
}

/// The gauge pressure of a sealed cylinder of `mix` that reads `p1` (gauge) at `t1`,
/// once its gas has cooled or warmed to `t2`: real-gas and ideal-gas answers.
pub fn pressure_after_temperature_change(
    mix: Mix,
    p1: Pressure,
    t1: Temperature,
    t2: Temperature,
) -> TemperatureChange {
    let model = RealGasModel::new(mix, t1);
    let density = model.density_at(p1.absolute_bar(), t1);
    let real_abs = model.absolute_pressure_at(density, t2);
    let ideal_abs = p1.absolute_bar() * t2.kelvin() / t1.kelvin();
    TemperatureChange {
        real: Pressure::from_bar(real_abs - ATM_BAR),
        ideal: Pressure::from_bar(ideal_abs - ATM_BAR),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn warm_fill_cools_in_the_water() {
        // CoolProp 8.0.0 (HEOS): air filled to 232 bar at 35 °C, cooled to 12 °C → about 207 bar;
        // ideal says about 215.
        let c = pressure_after_temperature_change(
            Mix::AIR,
            Pressure::from_bar(232.0),
            Temperature::from_celsius(35.0),
            Temperature::from_celsius(12.0),
        );
        assert!((c.real.bar() - 207.0).abs() < 1.5, "{}", c.real.bar());
        assert!((c.ideal.bar() - 214.6).abs() < 0.5, "{}", c.ideal.bar());
    }
}
