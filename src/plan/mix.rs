//! Breathing gas mixtures: oxygen and helium fractions, the rest nitrogen.

use serde::{Deserialize, Serialize};

/// Mole fractions of a breathing gas. Air is modelled with its argon
/// (N2 0.7812 / O2 0.2096 / Ar 0.0092, standard dry air, from memory).
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Mix {
    /// Oxygen mole fraction, 0.05..=1.0.
    pub o2: f64,
    /// Helium mole fraction, 0.0..=0.95.
    #[serde(default)]
    pub he: f64,
}

/// Mole fractions of the species the gas model knows.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Composition {
    /// Nitrogen mole fraction.
    pub nitrogen: f64,
    /// Oxygen mole fraction.
    pub oxygen: f64,
    /// Helium mole fraction.
    pub helium: f64,
    /// Argon mole fraction (non-zero only for air).
    pub argon: f64,
}

impl Default for Mix {
    fn default() -> Self {
        Mix::AIR
    }
}

impl Mix {
    /// Air: 21 % oxygen, no helium; modelled with its argon (see [`Mix::composition`]).
    pub const AIR: Mix = Mix { o2: 0.21, he: 0.0 };

    /// Nitrox: oxygen fraction `o2` (e.g. 0.32), the rest nitrogen. Not range-checked
    /// here; a team's validation does that.
    pub fn nitrox(o2: f64) -> Mix {
        Mix { o2, he: 0.0 }
    }
    /// Trimix (or heliox): oxygen fraction `o2`, helium fraction `he`, the rest
    /// nitrogen. Not range-checked here; a team's validation does that.
    pub fn trimix(o2: f64, he: f64) -> Mix {
        Mix { o2, he }
    }

    /// Whether this mix is air (21 % O2 without helium).
    pub fn is_air(&self) -> bool {
        self.he == 0.0 && (self.o2 - 0.21).abs() < 0.0005
    }

    /// The species mole fractions handed to the equation of state.
    pub fn composition(&self) -> Composition {
        if self.is_air() {
            Composition {
                nitrogen: 0.7812,
                oxygen: 0.2096,
                helium: 0.0,
                argon: 0.0092,
            }
        } else {
            Composition {
                nitrogen: (1.0 - self.o2 - self.he).max(0.0),
                oxygen: self.o2,
                helium: self.he,
                argon: 0.0,
            }
        }
    }

    /// A short trade label, capitalised like a set name: "Air", "EAN32", "Tx 21/35", "Heliox 21/79".
    /// "Air" and "Oxygen" are in this thread's language; the mix codes are the same in all.
    pub fn label(&self) -> String {
        let o2 = (self.o2 * 100.0).round() as i64;
        let he = (self.he * 100.0).round() as i64;
        if self.is_air() {
            crate::i18n::tr("Air")
        } else if he == 0 {
            if o2 == 100 {
                crate::i18n::tr("Oxygen")
            } else {
                format!("EAN{o2}")
            }
        } else if o2 + he >= 100 {
            format!("Heliox {o2}/{he}")
        } else {
            format!("Tx {o2}/{he}")
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn compositions_sum_to_one() {
        for mix in [
            Mix::AIR,
            Mix::nitrox(0.32),
            Mix::trimix(0.18, 0.45),
            Mix::trimix(0.21, 0.79),
        ] {
            let c = mix.composition();
            let sum = c.nitrogen + c.oxygen + c.helium + c.argon;
            assert!((sum - 1.0).abs() < 1e-12, "{mix:?} sums to {sum}");
        }
    }

    #[test]
    fn labels() {
        assert_eq!(Mix::AIR.label(), "Air");
        assert_eq!(Mix::nitrox(0.32).label(), "EAN32");
        assert_eq!(Mix::trimix(0.21, 0.35).label(), "Tx 21/35");
        assert_eq!(Mix::trimix(0.21, 0.79).label(), "Heliox 21/79");
    }
}
