//! `turnsheet plan TEAM.json [--json]`.

use std::path::Path;

use crate::formats::team_file::TeamFile;
use crate::plan::error::InputError;
use crate::plan::plan_team;

use super::plan_report;

/// Read and convert a team file; errors name the field.
pub fn read_team(path: &Path) -> Result<crate::plan::TeamInput, InputError> {
    let text = std::fs::read_to_string(path).map_err(|e| {
        InputError::new(
            "TEAM",
            format!("cannot read team file {}: {e}", path.display()),
        )
    })?;
    TeamFile::parse(&text)?.to_input()
}

pub fn run(path: &Path, json: bool) -> Result<String, InputError> {
    let input = read_team(path)?;
    let plan = plan_team(&input)?;
    if json {
        let out = plan_report::json_report(&input, &plan);
        Ok(serde_json::to_string_pretty(&out).unwrap_or_default() + "\n")
    } else {
        Ok(plan_report::text_report(&input, &plan))
    }
}
