//! Real-gas content model: GERG-2008 (Kunz & Wagner 2012; the equation of state of
//! AGA Report No. 8 Part 1 and ISO 20765-2), through the `aga8` crate.

use aga8::composition::Composition as AgaComposition;
use aga8::gerg2008::Gerg2008;

use super::gas_model::{ContentModel, MAX_MODEL_PRESSURE_BAR, ModelKind, bracketed_pressure};
use super::mix::Mix;
use super::units::{ATM_BAR, Pressure, Temperature, Volume};

/// Molar gas constant, J/(mol·K), used only for the ideal-gas fallback.
const R_GAS: f64 = 8.314_462_618;

/// Real-gas model of one mix at one temperature.
#[derive(Clone)]
pub struct RealGasModel {
    template: Gerg2008,
    temperature: Temperature,
    /// Molar density at one standard atmosphere, mol/L.
    density_at_atm: f64,
    /// Molar density at the top of the model's bracket (400 bar gauge), mol/L.
    density_at_max: f64,
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
            density_at_max: 0.0,
        };
        model.density_at_atm = model.density_at(ATM_BAR, temperature);
        model.density_at_max = model.density_at(MAX_MODEL_PRESSURE_BAR + ATM_BAR, temperature);
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

    /// Direct inverse. Content = W × (ρ(p_abs) − ρ(1 atm)) / ρ(1 atm), so the density
    /// wanted is ρ(1 atm) × (1 + content / W), and GERG-2008 gives the pressure at that
    /// density and temperature in one evaluation. Same bracket as the bisection
    /// (0..=400 bar gauge, clamped at both ends) and never NaN.
    fn pressure_for(&self, water: Volume, content: Volume) -> Pressure {
        let (w, c) = (water.litres(), content.litres());
        if !(w.is_finite() && w > 0.0 && c.is_finite() && c > 0.0) {
            return Pressure::ZERO;
        }
        let target = self.density_at_atm * (1.0 + c / w);
        if !target.is_finite() || target >= self.density_at_max {
            return Pressure::from_bar(MAX_MODEL_PRESSURE_BAR);
        }
        let gauge = self.absolute_pressure_at(target, self.temperature) - ATM_BAR;
        if !gauge.is_finite() {
            // Not expected inside the bracket; the bisection always answers.
            return bracketed_pressure(|p| self.content(water, p).litres(), c);
        }
        Pressure::from_bar(gauge.clamp(0.0, MAX_MODEL_PRESSURE_BAR))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::plan::Volume;

    #[test]
    fn air_at_232_bar_holds_less_than_ideal() {
        // CoolProp 8.0.0 (HEOS reference equation; tests/reference/gas_content.csv): air at
        // 232 bar, 20 °C gives 218.03 L per litre of water capacity. The 0.3 % tolerance
        // is our own.
        let m = RealGasModel::new(Mix::AIR, Temperature::from_celsius(20.0));
        let l = m.litres_per_litre(Pressure::from_bar(232.0));
        assert!((l - 218.03).abs() < 218.03 * 0.003, "{l}");
        assert!(m.compressibility(Pressure::from_bar(232.0)) > 1.0);
    }

    /// The direct inverse against the bisection it replaced, over mixes, temperatures,
    /// capacities and contents from below empty to beyond the 400 bar bracket.
    #[test]
    fn direct_inverse_matches_the_bisection() {
        let mixes = [
            Mix::AIR,
            Mix::nitrox(0.32),
            Mix::trimix(0.21, 0.35),
            Mix::trimix(0.10, 0.70),
            Mix { o2: 1.0, he: 0.0 },
        ];
        let mut checked = 0;
        let mut worst: f64 = 0.0;
        for mix in mixes {
            for t in [-2.0, 12.0, 35.0] {
                let m = RealGasModel::new(mix, Temperature::from_celsius(t));
                for w in [0.5, 11.1, 48.0] {
                    let water = Volume::from_litres(w);
                    let full = m.content(water, Pressure::from_bar(MAX_MODEL_PRESSURE_BAR));
                    for k in -1..=21 {
                        let c = Volume::from_litres(full.litres() * f64::from(k) / 20.0);
                        let direct = m.pressure_for(water, c).bar();
                        let oracle =
                            bracketed_pressure(|p| m.content(water, p).litres(), c.litres()).bar();
                        assert!(direct.is_finite() && (0.0..=400.0).contains(&direct));
                        worst = worst.max((direct - oracle).abs());
                        assert!(
                            (direct - oracle).abs() < 1e-6,
                            "{mix:?} {t} °C {w} L content {}: direct {direct}, bisection {oracle}",
                            c.litres()
                        );
                        checked += 1;
                    }
                }
            }
        }
        eprintln!("direct vs bisection: {checked} points, worst difference {worst:.2e} bar");
        assert_eq!(checked, 5 * 3 * 3 * 23);
        assert!(worst < 1e-6, "{worst}");
    }

    #[test]
    fn direct_inverse_never_nan() {
        let m = RealGasModel::new(Mix::AIR, Temperature::from_celsius(20.0));
        let w = Volume::from_litres(12.0);
        for c in [f64::NAN, f64::INFINITY, f64::NEG_INFINITY, -1.0, 0.0, 1e300] {
            let p = m.pressure_for(w, Volume::from_litres(c)).bar();
            assert!((0.0..=400.0).contains(&p), "{c} -> {p}");
        }
        for w in [0.0, -1.0, f64::NAN] {
            let p = m.pressure_for(Volume::from_litres(w), Volume::from_litres(100.0));
            assert_eq!(p.bar(), 0.0);
        }
        assert_eq!(m.pressure_for(w, Volume::from_litres(1e300)).bar(), 400.0);
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
