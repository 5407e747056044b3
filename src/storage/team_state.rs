//! The last team on the Team page, kept between launches.

use serde::{Deserialize, Serialize};

use super::atomic::WithinLimits;

use crate::formats::team_file::TeamFile;

pub const TEAM_SCHEMA: u32 = 1;

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct TeamState {
    pub schema: u32,
    pub team: TeamFile,
    /// The name of each diver's cylinder set, as picked (locker or preset).
    #[serde(default)]
    pub cylinder_labels: Vec<String>,
    /// The name of each diver's stage, as picked (empty without a stage).
    #[serde(default)]
    pub stage_labels: Vec<String>,
    /// When each diver's start was entered and from where (null: never read). Older
    /// files have none, so their starts count as unread.
    #[serde(default)]
    pub start_readings: Vec<Option<StartReading>>,
    /// The same for each diver's stage start (null: no stage, or not read).
    #[serde(default)]
    pub stage_readings: Vec<Option<StartReading>>,
    /// The bundled demo team with invented divers, until the user starts a team of
    /// their own or names a diver.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub demo: bool,
}

/// Where a start came from.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum Source {
    /// Read on the diver's gauge (typed, or confirmed as still reading that).
    Gauge,
    /// Predicted from a warm fill on the fill-to-water page.
    Prediction,
}

/// One diver's start: when it was entered and from where.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct StartReading {
    /// Unix time, seconds.
    pub at: i64,
    /// Gauge or prediction.
    pub source: Source,
}

/// The size limit on the file is enough; ranges are checked where the values are used.
impl WithinLimits for TeamState {}
