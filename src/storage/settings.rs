//! App settings.

use serde::{Deserialize, Serialize};

use super::atomic::WithinLimits;

use crate::plan::{Rule, UnitSystem};

pub const SETTINGS_SCHEMA: u32 = 1;

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Settings {
    pub schema: u32,
    pub units: UnitSystem,
    /// Default gauge step for metric teams, bar.
    pub gauge_step_bar: f64,
    /// Default gauge step for imperial teams, psi.
    pub gauge_step_psi: f64,
    pub rule: Rule,
    /// Water temperature, °C (shown in °F for imperial).
    pub water_temp_c: f64,
    /// The cautions were read and acknowledged.
    pub cautions_acknowledged: bool,
}

impl Default for Settings {
    fn default() -> Self {
        Settings {
            schema: SETTINGS_SCHEMA,
            units: UnitSystem::Metric,
            gauge_step_bar: 10.0,
            gauge_step_psi: 100.0,
            rule: Rule::Thirds,
            water_temp_c: 20.0,
            cautions_acknowledged: false,
        }
    }
}

impl Settings {
    pub fn gauge_step(&self) -> f64 {
        match self.units {
            UnitSystem::Metric => self.gauge_step_bar,
            UnitSystem::Imperial => self.gauge_step_psi,
        }
    }
}

/// The size limit on the file is enough; ranges are checked where the values are used.
impl WithinLimits for Settings {}
