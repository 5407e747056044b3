#![warn(missing_docs)]
//! The planning core: units, gas models, cylinders and the team plan.
//! Pure Rust: no user interface, no file or network I/O.

pub mod catalogue;
pub mod chart;
pub mod cylinders;
pub mod error;
pub mod gas_model;
pub mod hand_check;
pub mod matching;
pub mod mix;
pub mod out_of_gas;
pub mod real_gas;
pub mod rounding;
pub mod rule;
pub mod supply;
pub mod team;
pub mod temperature;
pub mod text;
pub mod units;
pub mod warning;

pub use cylinders::{CylinderSet, CylinderSpec};
pub use error::InputError;
pub use gas_model::{ContentModel, HandModel, ModelKind};
pub use matching::{DiverPlan, StagePlan, TeamPlan, plan_team};
pub use mix::Mix;
pub use real_gas::RealGasModel;
pub use rule::Rule;
pub use team::{DiverInput, StageInput, TeamInput};
pub use units::{Depth, Gauge, Pressure, PressureUnit, Temperature, UnitSystem, Volume, Water};
pub use warning::Warning;
