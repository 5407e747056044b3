//! Physical quantities as types, so that no bare number crosses the planning API
//! without its unit. Pressures are gauge unless a name says absolute.

use serde::{Deserialize, Serialize};

/// Standard atmosphere in bar (exact by definition).
pub const ATM_BAR: f64 = 1.01325;
/// One psi in bar.
pub const BAR_PER_PSI: f64 = 0.068_947_572_9;
/// One cubic foot in litres.
pub const LITRES_PER_CUFT: f64 = 28.316_846_592;

/// The unit system a team reads its gauges and cylinders in.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum UnitSystem {
    /// Bar, litres, metres and degrees Celsius (the default).
    #[default]
    Metric,
    /// Psi, cubic feet, feet and degrees Fahrenheit.
    Imperial,
}

impl UnitSystem {
    /// The pressure unit's label: "bar" or "psi".
    pub fn pressure_label(self) -> &'static str {
        match self {
            UnitSystem::Metric => "bar",
            UnitSystem::Imperial => "psi",
        }
    }
    /// The volume unit's label: "L" or "cu ft".
    pub fn volume_label(self) -> &'static str {
        match self {
            UnitSystem::Metric => "L",
            UnitSystem::Imperial => "cu ft",
        }
    }
    /// The depth unit's label: "m" or "ft".
    pub fn depth_label(self) -> &'static str {
        match self {
            UnitSystem::Metric => "m",
            UnitSystem::Imperial => "ft",
        }
    }
    /// The temperature unit's label: "°C" or "°F".
    pub fn temperature_label(self) -> &'static str {
        match self {
            UnitSystem::Metric => "°C",
            UnitSystem::Imperial => "°F",
        }
    }
    /// Pressure from a number read in this system's gauge unit.
    pub fn pressure(self, value: f64) -> Pressure {
        match self {
            UnitSystem::Metric => Pressure::from_bar(value),
            UnitSystem::Imperial => Pressure::from_psi(value),
        }
    }
    /// A pressure as a number in this system's gauge unit.
    pub fn pressure_value(self, p: Pressure) -> f64 {
        match self {
            UnitSystem::Metric => p.bar(),
            UnitSystem::Imperial => p.psi(),
        }
    }
    /// Volume from a number in this system's unit (litres or cubic feet).
    pub fn volume(self, value: f64) -> Volume {
        match self {
            UnitSystem::Metric => Volume::from_litres(value),
            UnitSystem::Imperial => Volume::from_cuft(value),
        }
    }
    /// A volume as a number in this system's unit (litres or cubic feet), unrounded.
    pub fn volume_value(self, v: Volume) -> f64 {
        match self {
            UnitSystem::Metric => v.litres(),
            UnitSystem::Imperial => v.cuft(),
        }
    }
    /// Depth from a number in this system's unit (metres or feet).
    pub fn depth(self, value: f64) -> Depth {
        match self {
            UnitSystem::Metric => Depth::from_metres(value),
            UnitSystem::Imperial => Depth::from_feet(value),
        }
    }
    /// Temperature from a number in this system's unit (°C or °F).
    pub fn temperature(self, value: f64) -> Temperature {
        match self {
            UnitSystem::Metric => Temperature::from_celsius(value),
            UnitSystem::Imperial => Temperature::from_fahrenheit(value),
        }
    }
    /// A temperature as a number in this system's unit (°C or °F), unrounded.
    pub fn temperature_value(self, t: Temperature) -> f64 {
        match self {
            UnitSystem::Metric => t.celsius(),
            UnitSystem::Imperial => t.fahrenheit(),
        }
    }
}

/// Gauge pressure, stored in bar.
#[derive(Clone, Copy, Debug, PartialEq, PartialOrd, Default)]
pub struct Pressure {
    bar: f64,
}

impl Pressure {
    /// Zero gauge (one standard atmosphere absolute): an empty cylinder.
    pub const ZERO: Pressure = Pressure { bar: 0.0 };
    /// Gauge pressure from a number of bar.
    pub fn from_bar(bar: f64) -> Self {
        Pressure { bar }
    }
    /// Gauge pressure from a number of psi (psig), converted with [`BAR_PER_PSI`].
    pub fn from_psi(psi: f64) -> Self {
        Pressure {
            bar: psi * BAR_PER_PSI,
        }
    }
    /// The gauge pressure in bar.
    pub fn bar(self) -> f64 {
        self.bar
    }
    /// The gauge pressure in psi.
    pub fn psi(self) -> f64 {
        self.bar / BAR_PER_PSI
    }
    /// Absolute pressure in bar (gauge + one standard atmosphere).
    pub fn absolute_bar(self) -> f64 {
        self.bar + ATM_BAR
    }
    /// The lower of two pressures (`self` when they are equal).
    pub fn min(self, other: Pressure) -> Pressure {
        if other.bar < self.bar { other } else { self }
    }
    /// The higher of two pressures (`self` when they are equal).
    pub fn max(self, other: Pressure) -> Pressure {
        if other.bar > self.bar { other } else { self }
    }
}

/// A volume of gas or water, stored in litres.
#[derive(Clone, Copy, Debug, PartialEq, PartialOrd, Default)]
pub struct Volume {
    litres: f64,
}

impl Volume {
    /// No volume at all.
    pub const ZERO: Volume = Volume { litres: 0.0 };
    /// Volume from a number of litres.
    pub fn from_litres(litres: f64) -> Self {
        Volume { litres }
    }
    /// Volume from a number of cubic feet, converted with [`LITRES_PER_CUFT`].
    pub fn from_cuft(cuft: f64) -> Self {
        Volume {
            litres: cuft * LITRES_PER_CUFT,
        }
    }
    /// The volume in litres.
    pub fn litres(self) -> f64 {
        self.litres
    }
    /// The volume in cubic feet.
    pub fn cuft(self) -> f64 {
        self.litres / LITRES_PER_CUFT
    }
    /// This volume multiplied by `factor` (a rule's fraction, a cylinder count).
    pub fn scaled(self, factor: f64) -> Volume {
        Volume {
            litres: self.litres * factor,
        }
    }
}

impl std::ops::Add for Volume {
    type Output = Volume;
    fn add(self, rhs: Volume) -> Volume {
        Volume::from_litres(self.litres + rhs.litres)
    }
}

impl std::ops::Sub for Volume {
    type Output = Volume;
    fn sub(self, rhs: Volume) -> Volume {
        Volume::from_litres(self.litres - rhs.litres)
    }
}

/// Temperature, stored in kelvin.
#[derive(Clone, Copy, Debug, PartialEq, PartialOrd)]
pub struct Temperature {
    kelvin: f64,
}

impl Temperature {
    /// Temperature from degrees Celsius: T/K = t/°C + 273.15 (NIST SP 811).
    pub fn from_celsius(c: f64) -> Self {
        Temperature { kelvin: c + 273.15 }
    }
    /// Temperature from degrees Fahrenheit: t/°C = (t/°F − 32) × 5/9 (NIST SP 811).
    pub fn from_fahrenheit(f: f64) -> Self {
        Self::from_celsius((f - 32.0) * 5.0 / 9.0)
    }
    /// The temperature in kelvin.
    pub fn kelvin(self) -> f64 {
        self.kelvin
    }
    /// The temperature in degrees Celsius.
    pub fn celsius(self) -> f64 {
        self.kelvin - 273.15
    }
    /// The temperature in degrees Fahrenheit.
    pub fn fahrenheit(self) -> f64 {
        self.celsius() * 9.0 / 5.0 + 32.0
    }
}

/// Depth of water, stored in metres.
#[derive(Clone, Copy, Debug, PartialEq, PartialOrd)]
pub struct Depth {
    metres: f64,
}

impl Depth {
    /// Depth from a number of metres.
    pub fn from_metres(m: f64) -> Self {
        Depth { metres: m }
    }
    /// Depth from a number of feet; 1 ft = 0.3048 m exactly (NIST SP 811).
    pub fn from_feet(ft: f64) -> Self {
        Depth {
            metres: ft * 0.3048,
        }
    }
    /// The depth in metres.
    pub fn metres(self) -> f64 {
        self.metres
    }
    /// The depth in feet.
    pub fn feet(self) -> f64 {
        self.metres / 0.3048
    }
}

/// Fresh or salt water: sets how fast pressure grows with depth.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum Water {
    /// Fresh water (the default): 0.0979 bar per metre.
    #[default]
    Fresh,
    /// Sea water: 0.1005 bar per metre.
    Salt,
}

impl Water {
    /// Bar per metre of depth: 0.0979 fresh, 0.1005 sea water
    /// (Common practice; 1.01325 bar / 10.35 m and / 10.08 m.)
    pub fn bar_per_metre(self) -> f64 {
        match self {
            Water::Fresh => 0.0979,
            Water::Salt => 0.1005,
        }
    }
    /// Ambient absolute pressure at a depth, in atmospheres.
    pub fn ambient_atm(self, depth: Depth) -> f64 {
        (ATM_BAR + self.bar_per_metre() * depth.metres()) / ATM_BAR
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn psi_bar_round_trip_matches_nist_factor() {
        // NIST SP 811: 1 psi = 6.894757e3 Pa.
        assert_relative_eq!(Pressure::from_psi(1.0).bar(), 0.06894757, epsilon = 1e-8);
        assert_relative_eq!(Pressure::from_psi(3000.0).psi(), 3000.0, epsilon = 1e-9);
        // 1 atm = 14.696 psi (NIST SP 811: 1 atm = 101 325 Pa)
        assert_relative_eq!(Pressure::from_bar(ATM_BAR).psi(), 14.696, epsilon = 1e-3);
    }

    #[test]
    fn cubic_foot_is_28_317_litres() {
        // NIST SP 811: 1 ft^3 = 2.831685e-2 m^3.
        assert_relative_eq!(Volume::from_cuft(1.0).litres(), 28.31685, epsilon = 1e-5);
    }

    #[test]
    fn temperatures_convert() {
        assert_relative_eq!(
            Temperature::from_fahrenheit(70.0).celsius(),
            21.1111,
            epsilon = 1e-4
        );
        assert_relative_eq!(
            Temperature::from_celsius(100.0).fahrenheit(),
            212.0,
            epsilon = 1e-9
        );
    }

    #[test]
    fn ambient_pressure_at_depth() {
        // Rule of thumb (common practice): 10 m of sea water adds about 1 atm.
        let atm = Water::Salt.ambient_atm(Depth::from_metres(10.0));
        assert!((atm - 2.0).abs() < 0.01, "{atm}");
        // 33 ft sea water is about 2 ATA (common practice).
        let atm = Water::Salt.ambient_atm(Depth::from_feet(33.0));
        assert!((atm - 2.0).abs() < 0.01, "{atm}");
    }
}
