//! The diver's own cylinder sets.

use serde::{Deserialize, Serialize};

use crate::formats::team_file::CylindersFile;
use crate::plan::catalogue::Material;

pub const LOCKER_SCHEMA: u32 = 1;

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LockerEntry {
    pub id: u64,
    pub name: String,
    pub cylinders: CylindersFile,
    #[serde(default)]
    pub material: Material,
    #[serde(default)]
    pub note: String,
    /// The set the Team page starts the first diver with.
    #[serde(default)]
    pub mine: bool,
}

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LockerFile {
    pub schema: u32,
    pub entries: Vec<LockerEntry>,
}

impl Default for LockerFile {
    fn default() -> Self {
        LockerFile {
            schema: LOCKER_SCHEMA,
            entries: Vec::new(),
        }
    }
}

impl LockerFile {
    pub fn next_id(&self) -> u64 {
        self.entries.iter().map(|e| e.id).max().unwrap_or(0) + 1
    }
    pub fn mine(&self) -> Option<&LockerEntry> {
        self.entries.iter().find(|e| e.mine)
    }
    /// Mark one entry as mine (and no other).
    pub fn set_mine(&mut self, id: u64) {
        for e in &mut self.entries {
            e.mine = e.id == id;
        }
    }
}
