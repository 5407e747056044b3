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
}

/// The size limit on the file is enough; ranges are checked where the values are used.
impl WithinLimits for TeamState {}
