//! Cylinder content models: how much free gas a cylinder of a given water
//! capacity delivers from a gauge pressure down to empty (0 gauge).
//!
//! Content is expressed as free gas at one standard atmosphere and the gas
//! temperature the model was built for.

use super::units::{Pressure, Volume};

/// Highest pressure any model is asked to invert to.
pub const MAX_MODEL_PRESSURE_BAR: f64 = 400.0;

/// Which content model produced a number.
#[derive(Clone, Copy, Debug, PartialEq, Eq, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum ModelKind {
    /// Real gas, GERG-2008 equation of state.
    Real,
    /// Hand ("tank factor") model, linear in gauge pressure.
    Hand,
}

impl ModelKind {
    /// The model's name in words, in this thread's language: "real gas" or "tank factor".
    pub fn describe(self) -> String {
        match self {
            ModelKind::Real => crate::i18n::tr("real gas"),
            ModelKind::Hand => crate::i18n::tr("tank factor"),
        }
    }
}

/// A content model: free gas delivered per litre of water capacity.
pub trait ContentModel {
    /// Which model this is.
    fn kind(&self) -> ModelKind;

    /// Free litres (at 1 atm) delivered per litre of water capacity from `p` down to 0 gauge.
    fn litres_per_litre(&self, p: Pressure) -> f64;

    /// Free gas in a cylinder set of `water` litres capacity at gauge pressure `p`.
    fn content(&self, water: Volume, p: Pressure) -> Volume {
        Volume::from_litres(water.litres() * self.litres_per_litre(p))
    }

    /// The gauge pressure at which a set of `water` capacity holds `content`.
    /// A bracketed bisection over 0..=400 bar: monotone, never NaN; contents
    /// outside the bracket clamp to its ends.
    fn pressure_for(&self, water: Volume, content: Volume) -> Pressure {
        bracketed_pressure(|p| self.content(water, p).litres(), content.litres())
    }
}

/// Solve `f(p) = target` for a non-decreasing `f` over 0..=400 bar by bisection.
pub fn bracketed_pressure(f: impl Fn(Pressure) -> f64, target: f64) -> Pressure {
    let mut lo = 0.0_f64;
    let mut hi = MAX_MODEL_PRESSURE_BAR;
    if !target.is_finite() || target <= f(Pressure::from_bar(lo)) {
        return Pressure::from_bar(lo);
    }
    if target >= f(Pressure::from_bar(hi)) {
        return Pressure::from_bar(hi);
    }
    // 40 halvings of 400 bar reach 4e-10 bar.
    for _ in 0..40 {
        let mid = 0.5 * (lo + hi);
        if f(Pressure::from_bar(mid)) < target {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    Pressure::from_bar(0.5 * (lo + hi))
}

/// The hand ("tank factor") model, the trade's pencil arithmetic (common practice):
/// free litres = water litres × gauge bar, the bar taken as one atmosphere
/// (12 L at 232 bar = 2784 L). Linear in gauge pressure.
#[derive(Clone, Copy, Debug, Default)]
pub struct HandModel;

impl ContentModel for HandModel {
    fn kind(&self) -> ModelKind {
        ModelKind::Hand
    }
    fn litres_per_litre(&self, p: Pressure) -> f64 {
        p.bar()
    }
    fn pressure_for(&self, water: Volume, content: Volume) -> Pressure {
        if water.litres() <= 0.0 {
            return Pressure::ZERO;
        }
        Pressure::from_bar(content.litres() / water.litres())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn hand_model_is_tank_factor_arithmetic() {
        // Common practice, by pencil: 12 L of water at 232 bar holds 12 × 232 = 2784 L.
        let c = HandModel.content(Volume::from_litres(12.0), Pressure::from_bar(232.0));
        assert_eq!(c.litres(), 2784.0);
        let c = HandModel.content(Volume::from_litres(12.0), Pressure::from_bar(200.0));
        let p = HandModel.pressure_for(Volume::from_litres(12.0), c);
        assert!((p.bar() - 200.0).abs() < 1e-9);
    }

    #[test]
    fn bracketed_solve_clamps_and_inverts() {
        let f = |p: Pressure| 2.0 * p.bar();
        assert_eq!(bracketed_pressure(f, -5.0).bar(), 0.0);
        assert_eq!(bracketed_pressure(f, 1e9).bar(), 400.0);
        assert_eq!(bracketed_pressure(f, f64::NAN).bar(), 0.0);
        assert!((bracketed_pressure(f, 300.0).bar() - 150.0).abs() < 1e-8);
    }
}
