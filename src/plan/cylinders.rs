//! Cylinder sets: one to four cylinders of one kind, described either by water
//! capacity and working pressure (metric stamp) or by rated free-gas volume at
//! rated pressure (imperial rating).

use serde::{Deserialize, Serialize};

use super::gas_model::{ContentModel, ModelKind};
use super::mix::Mix;
use super::real_gas::RealGasModel;
use super::units::{Pressure, Temperature, Volume};
use crate::i18n::tr_with;

/// How one cylinder of the set is described.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
#[serde(untagged, deny_unknown_fields)]
pub enum CylinderSpec {
    /// Metric stamp: water capacity in litres, working pressure in bar.
    Stamped {
        /// Water capacity of one cylinder, litres.
        water_l: f64,
        /// Working pressure, bar (gauge).
        working_bar: f64,
    },
    /// Imperial rating: free gas in cubic feet at the rated pressure in psi.
    Rated {
        /// Free gas one cylinder holds at `rated_psi`, cubic feet; the real-gas model
        /// reads it as air at 70 °F (see [`rating_temperature`]).
        rated_cuft: f64,
        /// Rated pressure, psi (gauge).
        rated_psi: f64,
    },
}

/// The temperature at which imperial ratings are taken to hold their rated volume (70 °F).
pub fn rating_temperature() -> Temperature {
    Temperature::from_fahrenheit(70.0)
}

/// Real air at the rating temperature, built once: every rated cylinder in every plan uses it.
fn rating_air() -> &'static RealGasModel {
    static AIR_AT_RATING: std::sync::OnceLock<RealGasModel> = std::sync::OnceLock::new();
    AIR_AT_RATING.get_or_init(|| RealGasModel::new(Mix::AIR, rating_temperature()))
}

impl CylinderSpec {
    /// Working pressure of one cylinder (gauge): the stamped bar or the rated psi.
    pub fn working_pressure(&self) -> Pressure {
        match *self {
            CylinderSpec::Stamped { working_bar, .. } => Pressure::from_bar(working_bar),
            CylinderSpec::Rated { rated_psi, .. } => Pressure::from_psi(rated_psi),
        }
    }

    /// Water capacity of one cylinder as the given model sees it.
    ///
    /// A stamped cylinder has its stamped capacity in both models. A rated cylinder's
    /// capacity is derived so that the model's content at rated pressure equals the
    /// rating: linearly for the tank-factor model, with real air at 70 °F for the
    /// real-gas model (ratings appear to include compressibility).
    pub fn water_per_cylinder(&self, kind: ModelKind) -> Volume {
        match *self {
            CylinderSpec::Stamped { water_l, .. } => Volume::from_litres(water_l),
            CylinderSpec::Rated {
                rated_cuft,
                rated_psi,
            } => {
                let rating = Volume::from_cuft(rated_cuft).litres();
                let p = Pressure::from_psi(rated_psi);
                let per_litre = match kind {
                    // Pencil arithmetic: rated cu ft × gauge psi / rated psi, so the
                    // tank-factor water is the rating per bar of rated pressure.
                    ModelKind::Hand => p.bar(),
                    ModelKind::Real => rating_air().litres_per_litre(p),
                };
                if per_litre > 0.0 {
                    Volume::from_litres(rating / per_litre)
                } else {
                    Volume::ZERO
                }
            }
        }
    }

    /// Short description in the spec's own units, e.g. "12 L 232 bar" or "80 cu ft 3000 psi".
    pub fn describe(&self) -> String {
        match *self {
            CylinderSpec::Stamped {
                water_l,
                working_bar,
            } => format!("{} L {} bar", trim(water_l), trim(working_bar)),
            CylinderSpec::Rated {
                rated_cuft,
                rated_psi,
            } => format!("{} cu ft {} psi", trim(rated_cuft), trim(rated_psi)),
        }
    }
}

fn trim(x: f64) -> String {
    super::shown::num((x * 10.0).round() / 10.0)
}

/// One to four identical cylinders breathed as one supply for planning
/// (manifolded twins and independent sidemount sum the same way).
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
pub struct CylinderSet {
    /// How many identical cylinders: 1 to
    /// [`MAX_CYLINDERS`](crate::plan::MAX_CYLINDERS), checked when a team is
    /// validated.
    pub count: u8,
    /// For a pair: two independent cylinders (sidemount, independent doubles) rather
    /// than twins on a manifold. Planning sums both alike; only the name differs.
    /// Meaningless for one, three or four cylinders.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub independent: bool,
    /// What each cylinder is; in a file its fields sit beside `count`.
    #[serde(flatten)]
    pub spec: CylinderSpec,
}

impl CylinderSet {
    /// `count` cylinders of `spec`; a pair is manifolded twins.
    pub const fn new(count: u8, spec: CylinderSpec) -> Self {
        CylinderSet {
            count,
            independent: false,
            spec,
        }
    }
    /// One cylinder of `spec`.
    pub fn single(spec: CylinderSpec) -> Self {
        CylinderSet::new(1, spec)
    }
    /// Two cylinders of `spec` on a manifold (twins).
    pub fn twins(spec: CylinderSpec) -> Self {
        CylinderSet::new(2, spec)
    }
    /// Two independent cylinders of `spec` (sidemount, independent doubles).
    pub const fn independent_pair(spec: CylinderSpec) -> Self {
        CylinderSet {
            count: 2,
            independent: true,
            spec,
        }
    }
    /// Whether this is a pair of independent cylinders (not twins on a manifold).
    pub fn is_independent_pair(&self) -> bool {
        self.count == 2 && self.independent
    }
    /// Total water capacity of the set as the given model sees it.
    pub fn water(&self, kind: ModelKind) -> Volume {
        self.spec
            .water_per_cylinder(kind)
            .scaled(f64::from(self.count))
    }
    /// Working pressure of the set (gauge): that of each of its cylinders.
    pub fn working_pressure(&self) -> Pressure {
        self.spec.working_pressure()
    }
    /// The name made from the sizes: "Single 15 L 232 bar", "Twin 12 L 232 bar",
    /// "2 × 12 L 232 bar, independent", "3 × 40 cu ft 3000 psi". The words are in this
    /// thread's language, the figures with its decimal separator. Front ends write a set
    /// by its one name, [`crate::plan::set_name`], which falls back on this one.
    pub fn describe(&self) -> String {
        let one = self.spec.describe();
        match self.count {
            1 => tr_with("Single {0}", &[&one]),
            2 if self.independent => tr_with("2 × {0}, independent", &[&one]),
            2 => tr_with("Twin {0}", &[&one]),
            n => format!("{n} × {one}"),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn imperial_rating_back_calculates_water_capacity() {
        // Trade fact, from memory: an aluminium "80" rated 77.4 cu ft at
        // 3000 psi is 11.1 L of water, which only real gas explains.
        let al80 = CylinderSpec::Rated {
            rated_cuft: 77.4,
            rated_psi: 3000.0,
        };
        let real = al80.water_per_cylinder(ModelKind::Real).litres();
        let hand = al80.water_per_cylinder(ModelKind::Hand).litres();
        assert!((real - 11.1).abs() < 0.15, "real {real}");
        assert!(hand < real - 0.4, "hand {hand}");
        // Pencil arithmetic (common practice): rated cu ft × gauge psi / rated psi.
        use crate::plan::{ContentModel, HandModel};
        let at = |psi: f64| {
            HandModel
                .content(
                    CylinderSet::single(al80).water(ModelKind::Hand),
                    Pressure::from_psi(psi),
                )
                .cuft()
        };
        assert!((at(3000.0) - 77.4).abs() < 1e-9, "{}", at(3000.0));
        assert!((at(1500.0) - 38.7).abs() < 1e-9, "{}", at(1500.0));
    }

    #[test]
    fn twins_double_the_water() {
        let s = CylinderSpec::Stamped {
            water_l: 12.0,
            working_bar: 232.0,
        };
        assert_eq!(CylinderSet::twins(s).water(ModelKind::Real).litres(), 24.0);
        let side = CylinderSet::independent_pair(s);
        assert_eq!(side.water(ModelKind::Real).litres(), 24.0);
    }

    #[test]
    fn a_set_has_one_name_that_tells_twins_from_independent_pairs() {
        let s = CylinderSpec::Stamped {
            water_l: 12.0,
            working_bar: 232.0,
        };
        assert_eq!(CylinderSet::twins(s).describe(), "Twin 12 L 232 bar");
        assert_eq!(
            CylinderSet::independent_pair(s).describe(),
            "2 × 12 L 232 bar, independent"
        );
        assert_eq!(CylinderSet::single(s).describe(), "Single 12 L 232 bar");
        let forty = CylinderSpec::Rated {
            rated_cuft: 40.0,
            rated_psi: 3000.0,
        };
        assert_eq!(
            CylinderSet::new(3, forty).describe(),
            "3 × 40 cu ft 3000 psi"
        );
        // Only a pair can be independent; the flag is not written for twins.
        let mut three = CylinderSet::new(3, forty);
        three.independent = true;
        assert!(!three.is_independent_pair());
        let json = serde_json::to_string(&CylinderSet::twins(s)).unwrap();
        assert!(!json.contains("independent"), "{json}");
    }
}
