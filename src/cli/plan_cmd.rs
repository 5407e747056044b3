//! `turnsheet plan TEAM.json [--json]`.

use std::path::Path;

use crate::formats::team_file::TeamFile;
use crate::plan::error::InputError;
use crate::plan::plan_team;
use crate::storage::atomic::{MAX_FILE_BYTES, TextReadError, read_text};

use super::plan_report;

/// Read and convert a team file; errors name the field. Files over 1 MB are refused
/// before they are read, and text that is not UTF-8 gets the position of the first bad byte.
pub fn read_team(path: &Path) -> Result<crate::plan::TeamInput, InputError> {
    let text = read_text(path, MAX_FILE_BYTES).map_err(|e| {
        let why = match e {
            TextReadError::Missing => "no such file".to_string(),
            TextReadError::Io(e) => e.to_string(),
            other => other.to_string(),
        };
        InputError::new(
            "TEAM",
            format!("cannot read team file {}: {why}", path.display()),
        )
    })?;
    // Refused here: serde would read a top-level array as the fields in order.
    if text.trim_start().starts_with('[') {
        return Err(InputError::new(
            "team file",
            "a team file is a JSON object: it starts with { (see turnsheet plan --help)",
        ));
    }
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
