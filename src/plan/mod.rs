#![deny(missing_docs)]
//! The planning core: units, gas models, cylinders and the team plan.
//! Pure Rust: no user interface, no file or network I/O.
//!
//! Everything a front end needs is named in the list below; the files behind it are
//! private. A two-diver team on the rule of thirds, planned in both gas models:
//!
//! ```
//! use turnsheet::plan::{
//!     CylinderSet, CylinderSpec, Depth, DiverInput, Mix, Pressure, Rule, Temperature,
//!     TeamInput, UnitSystem, Water, plan_team,
//! };
//!
//! let diver = |name: &str, water_l: f64, start_bar: f64| DiverInput {
//!     name: name.into(),
//!     cylinders: CylinderSet::twins(CylinderSpec::Stamped { water_l, working_bar: 232.0 }),
//!     mix: Mix::AIR,
//!     start: Pressure::from_bar(start_bar),
//!     sac_l_per_min: None,
//!     stage: None,
//!     gauge: None,
//! };
//! let team = TeamInput {
//!     units: UnitSystem::Metric,
//!     rule: Rule::Thirds,
//!     gauge_step: 10.0,
//!     water_temp: Temperature::from_celsius(12.0),
//!     depth: Some(Depth::from_metres(20.0)),
//!     water: Water::Fresh,
//!     divers: vec![diver("Ines", 12.0, 220.0), diver("Tomas", 7.0, 230.0)],
//! };
//! let plan = plan_team(&team)?;
//! // The smaller supply sets the allowance; every turn sits on the gauge graduation,
//! // between what is spent going in and the start.
//! assert_eq!(plan.controlling, 1);
//! for d in &plan.divers {
//!     assert_eq!(d.turn_shown_value % 10.0, 0.0);
//!     assert!(d.turn_shown.bar() < d.start.bar());
//! }
//! assert!(plan.divers[0].turn_shown.bar() > plan.divers[1].turn_shown.bar());
//! # Ok::<(), turnsheet::plan::InputError>(())
//! ```

mod allowance;
mod catalogue;
mod chart;
mod cylinders;
mod error;
mod gas_model;
mod gauge;
mod hand_check;
mod matching;
mod mix;
mod naming;
mod out_of_gas;
mod pencil;
mod real_gas;
mod rounding;
mod rule;
/// Shown numbers: rounding toward safety and the decimal separator, decided once for
/// the app, the command line and the card.
pub mod shown;
mod supply;
mod team;
mod team_checks;
mod temperature;
/// The check of names and notes, and small text helpers.
pub mod text;
mod units;
mod warning;

// Units and gauges: every quantity carries its unit in its type.
pub use gauge::{Gauge, PressureUnit};
pub use units::{
    ATM_BAR, BAR_PER_PSI, Depth, LITRES_PER_CUFT, Pressure, Temperature, UnitSystem, Volume, Water,
};
// Rounding to the gauge graduation: turns up, starts down, nudges to the next mark.
pub use rounding::{next_step, round_down_to_step, round_up_to_step};
// Gases and cylinders, and the generic presets.
pub use catalogue::{Material, Preset, current_preset_name, presets};
// A set's one name, for every front end.
pub use cylinders::{CylinderSet, CylinderSpec, rating_temperature};
pub use mix::{Composition, Mix};
pub use naming::{SetLabels, is_made_name, set_name, shown_label};
// The two gas models: tank factors (pencil arithmetic) and real gas (GERG-2008).
pub use gas_model::{
    ContentModel, HandModel, MAX_MODEL_PRESSURE_BAR, ModelKind, bracketed_pressure,
};
pub use real_gas::RealGasModel;
// The team's inputs, their limits and the checks that name the field.
pub use error::{InputError, check_range};
pub use rule::Rule;
pub use team::{
    DiverInput, LOW_FILL_RATIO, MAX_CYLINDERS, MAX_DIVERS, MAX_FILL_RATIO, MAX_START_BAR,
    MAX_WATER_L, MIN_DIVERS, MIN_WATER_L, StageInput, TeamInput, WATER_TEMP_RANGE_C,
    validate_start, validate_step,
};
pub(crate) use team::{validate_cylinders, validate_mix};
// The plan: turns, stage drops, the out-of-gas margin and the warnings.
pub use matching::{DiverPlan, StagePlan, TeamPlan, plan_team};
pub use out_of_gas::{StressCheck, margin_for_display};
pub use warning::{OVERFILL_SHARE, Supply, Warning};
// Pencil sums beside the plan, pairing charts, and a pressure after a temperature change.
pub use allowance::{
    AllowanceSource, PencilAllowance, allowance_sentence, allowance_source_sentence,
    allowance_sources, pencil_allowance,
};
pub use chart::{PairChart, pair_chart, starts_around, team_charts};
pub use hand_check::{HandWorking, hand_working, turn_how, turn_sentence};
pub use temperature::{TemperatureChange, pressure_after_temperature_change};
