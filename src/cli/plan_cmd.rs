//! `turnsheet plan TEAM.json [--json]`.

use std::path::Path;

use crate::formats::team_file::TeamFile;
use crate::plan::error::InputError;
use crate::plan::{TeamInput, TeamPlan, plan_team};
use crate::storage::atomic::{MAX_FILE_BYTES, TextReadError, read_text};

use super::plan_report;

/// Read and convert a team file; errors name the field. Files over 1 MB are refused
/// before they are read, and text that is not UTF-8 gets the position of the first bad byte.
pub fn read_team(path: &Path) -> Result<TeamInput, InputError> {
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
    let file = TeamFile::parse(&text)?;
    let names: Vec<&str> = file.divers.iter().map(|d| d.name.as_str()).collect();
    file.to_input().map_err(|e| with_diver_name(e, &names))
}

/// The field path of an error about one diver, with that diver's name after it:
/// `divers[1].start (Bram)`. Other errors, and a diver without a usable name, as they are.
pub fn with_diver_name(mut e: InputError, names: &[&str]) -> InputError {
    let index = e
        .field
        .strip_prefix("divers[")
        .and_then(|rest| rest.split_once(']'))
        .and_then(|(i, _)| i.parse::<usize>().ok());
    if let Some(name) = index.and_then(|i| names.get(i)).map(|n| n.trim())
        && !name.is_empty()
        && name.chars().count() <= 24
    {
        e.field = format!("{} ({name})", e.field);
    }
    e
}

/// `plan_team`, its errors naming the diver (see [`with_diver_name`]).
pub fn plan_named(team: &TeamInput) -> Result<TeamPlan, InputError> {
    plan_team(team).map_err(|e| named(e, team))
}

/// An error about `team`, naming the diver it concerns.
pub fn named(e: InputError, team: &TeamInput) -> InputError {
    let names: Vec<&str> = team.divers.iter().map(|d| d.name.as_str()).collect();
    with_diver_name(e, &names)
}

pub fn run(path: &Path, json: bool) -> Result<String, InputError> {
    let input = read_team(path)?;
    let plan = plan_named(&input)?;
    if json {
        let out = plan_report::json_report(&input, &plan);
        Ok(serde_json::to_string_pretty(&out).unwrap_or_default() + "\n")
    } else {
        Ok(plan_report::text_report(&input, &plan))
    }
}
