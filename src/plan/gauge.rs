//! The gauge a diver reads: bar or psi, and its graduation.

use serde::{Deserialize, Serialize};

use super::units::{Pressure, UnitSystem};

/// The unit a diver's gauge reads.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum PressureUnit {
    /// Bar.
    #[default]
    Bar,
    /// Pounds per square inch.
    Psi,
}

impl PressureUnit {
    /// Both units, bar first.
    pub const ALL: [PressureUnit; 2] = [PressureUnit::Bar, PressureUnit::Psi];

    /// "bar" or "psi".
    pub fn label(self) -> &'static str {
        match self {
            PressureUnit::Bar => "bar",
            PressureUnit::Psi => "psi",
        }
    }
    /// Parse "bar" or "psi" (any case).
    pub fn parse(text: &str) -> Option<PressureUnit> {
        match text.trim().to_ascii_lowercase().as_str() {
            "bar" => Some(PressureUnit::Bar),
            "psi" => Some(PressureUnit::Psi),
            _ => None,
        }
    }
    /// A pressure from a number read in this unit.
    pub fn pressure(self, value: f64) -> Pressure {
        match self {
            PressureUnit::Bar => Pressure::from_bar(value),
            PressureUnit::Psi => Pressure::from_psi(value),
        }
    }
    /// A pressure as a number in this unit.
    pub fn value(self, p: Pressure) -> f64 {
        match self {
            PressureUnit::Bar => p.bar(),
            PressureUnit::Psi => p.psi(),
        }
    }
    /// The usual graduation (common practice: 10 bar, 100 psi).
    pub fn default_step(self) -> f64 {
        match self {
            PressureUnit::Bar => 10.0,
            PressureUnit::Psi => 100.0,
        }
    }
    /// The graduations a diver picks from in the app (common practice: 5 or 10 bar,
    /// 50 or 100 psi).
    pub fn usual_steps(self) -> [f64; 2] {
        match self {
            PressureUnit::Bar => [5.0, 10.0],
            PressureUnit::Psi => [50.0, 100.0],
        }
    }
    /// Allowed graduation, inclusive: 1 to 50 bar, 10 to 500 psi.
    pub fn step_range(self) -> (f64, f64) {
        match self {
            PressureUnit::Bar => (1.0, 50.0),
            PressureUnit::Psi => (10.0, 500.0),
        }
    }
    /// The unit system whose volumes go with this unit.
    pub fn system(self) -> UnitSystem {
        match self {
            PressureUnit::Bar => UnitSystem::Metric,
            PressureUnit::Psi => UnitSystem::Imperial,
        }
    }
}

/// The gauge one diver reads: its unit and its graduation (step) in that unit.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
pub struct Gauge {
    /// Bar or psi.
    pub unit: PressureUnit,
    /// The graduation, in `unit`.
    pub step: f64,
}

impl Gauge {
    /// A gauge of `unit` with its usual graduation.
    pub fn usual(unit: PressureUnit) -> Gauge {
        Gauge {
            unit,
            step: unit.default_step(),
        }
    }
    /// A pressure as a number on this gauge's unit.
    pub fn value(self, p: Pressure) -> f64 {
        self.unit.value(p)
    }
    /// A pressure from a number read on this gauge.
    pub fn pressure(self, value: f64) -> Pressure {
        self.unit.pressure(value)
    }
    /// "bar" or "psi".
    pub fn label(self) -> &'static str {
        self.unit.label()
    }
}

impl UnitSystem {
    /// The usual gauge step for this system (common practice: 10 bar / 100 psi).
    pub fn default_gauge_step(self) -> f64 {
        self.pressure_unit().default_step()
    }
    /// The gauge unit this system reads by default.
    pub fn pressure_unit(self) -> PressureUnit {
        match self {
            UnitSystem::Metric => PressureUnit::Bar,
            UnitSystem::Imperial => PressureUnit::Psi,
        }
    }
}
