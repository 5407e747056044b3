//! `turnsheet plan TEAM.json [--json]`.

use std::path::Path;

use crate::formats::team_file::TeamFile;
use crate::plan::error::InputError;
use crate::plan::plan_team;

use super::plan_report;

pub fn run(path: &Path, json: bool) -> Result<String, InputError> {
    let text = std::fs::read_to_string(path).map_err(|e| {
        InputError::new(
            "TEAM",
            format!("cannot read team file {}: {e}", path.display()),
        )
    })?;
    let file = TeamFile::parse(&text)?;
    let input = file.to_input()?;
    let plan = plan_team(&input)?;
    if json {
        let out = plan_report::json_report(&input, &plan);
        Ok(serde_json::to_string_pretty(&out).unwrap_or_default() + "\n")
    } else {
        Ok(plan_report::text_report(&input, &plan))
    }
}
