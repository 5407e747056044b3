//! Real-gas content model: GERG-2008 (Kunz & Wagner 2012; the equation of state of
//! AGA Report No. 8 Part 1 and ISO 20765-2), through the `aga8` crate.

use aga8::composition::Composition as AgaComposition;
use aga8::gerg2008::Gerg2008;

use super::gas_model::{ContentModel, ModelKind};
use super::mix::Mix;
use super::units::{ATM_BAR, Pressure, Temperature};

/// Molar gas constant, J/(mol·K), used only for the ideal-gas fallback.
const R_GAS: f64 = 8.314_462_618;

/// Real-gas model of one mix at one temperature.
#[derive(Clone)]
pub struct RealGasModel {
    template: Gerg2008,
    temperature: Temperature,
    /// Molar density at one standard atmosphere, mol/L.
    density_at_atm: f64,
}

impl std::fmt::Debug for RealGasModel {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("RealGasModel")
            .field("temperature_c", &self.temperature.celsius())
            .finish()
    }
}

impl RealGasModel {
    /// The model of `mix` at `temperature`: the gas is taken to be at that temperature
    /// both in the cylinder and as free gas at one atmosphere. If GERG-2008 refuses the
    /// composition a warning is logged, and any density it cannot give comes from the
    /// ideal gas.
    pub fn new(mix: Mix, temperature: Temperature) -> Self {
        let c = mix.composition();
        let comp = AgaComposition {
            nitrogen: c.nitrogen,
            oxygen: c.oxygen,
            helium: c.helium,
            argon: c.argon,
            ..Default::default()
        };
        let mut template = Gerg2008::new();
        // A composition is validated upstream; should GERG refuse it, the
        // model still answers from the ideal-gas fallback in `density_at`.
        if template.set_composition(&comp).is_err() {
            log::warn!("GERG-2008 refused composition {c:?}");
        }
        let mut model = RealGasModel {
            template,
            temperature,
            density_at_atm: 0.0,
        };
        model.density_at_atm = model.density_at(ATM_BAR, temperature);
        model
    }

    /// The gas temperature the model was built for.
    pub fn temperature(&self) -> Temperature {
        self.temperature
    }

    /// Molar density (mol/L) at an absolute pressure in bar and a temperature.
    pub fn density_at(&self, absolute_bar: f64, t: Temperature) -> f64 {
        let mut g = self.template;
        g.p = absolute_bar * 100.0; // kPa
        g.t = t.kelvin();
        g.d = 0.0;
        match g.density(0) {
            Ok(()) if g.d.is_finite() && g.d > 0.0 => g.d,
            _ => {
                log::warn!("GERG-2008 density failed at {absolute_bar} bar; using ideal gas");
                absolute_bar * 100.0 / (R_GAS * t.kelvin())
            }
        }
    }

    /// Absolute pressure (bar) of the gas at a molar density (mol/L) and temperature.
    pub fn absolute_pressure_at(&self, density: f64, t: Temperature) -> f64 {
        let mut g = self.template;
        g.d = density;
        g.t = t.kelvin();
        let kpa = g.pressure();
        if kpa.is_finite() {
            kpa / 100.0
        } else {
            density * R_GAS * t.kelvin() / 100.0
        }
    }

    /// Compressibility factor Z at a gauge pressure.
    pub fn compressibility(&self, p: Pressure) -> f64 {
        let d = self.density_at(p.absolute_bar(), self.temperature);
        p.absolute_bar() * 100.0 / (d * R_GAS * self.temperature.kelvin())
    }
}

impl ContentModel for RealGasModel {
    fn kind(&self) -> ModelKind {
        ModelKind::Real
    }
    fn litres_per_litre(&self, p: Pressure) -> f64 {
        if p.bar() <= 0.0 {
            return 0.0;
        }
        let d = self.density_at(p.absolute_bar(), self.temperature);
        (d / self.density_at_atm - 1.0).max(0.0)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::plan::units::Volume;

    #[test]
    fn air_at_232_bar_holds_less_than_ideal() {
        // CoolProp 8.0.0 (HEOS reference equation): air at 232 bar, 20 °C, about 219 L per litre.
        let m = RealGasModel::new(Mix::AIR, Temperature::from_celsius(20.0));
        let l = m.litres_per_litre(Pressure::from_bar(232.0));
        assert!((l - 219.0).abs() < 1.5, "{l}");
        assert!(m.compressibility(Pressure::from_bar(232.0)) > 1.0);
    }

    #[test]
    fn inverse_round_trips() {
        let m = RealGasModel::new(Mix::trimix(0.21, 0.35), Temperature::from_celsius(12.0));
        let w = Volume::from_litres(24.0);
        for bar in [5.0, 50.0, 133.0, 232.0, 300.0] {
            let c = m.content(w, Pressure::from_bar(bar));
            let back = m.pressure_for(w, c);
            assert!((back.bar() - bar).abs() < 1e-6, "{bar} -> {}", back.bar());
        }
    }
}
