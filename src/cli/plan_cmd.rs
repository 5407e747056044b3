//! `turnsheet plan TEAM.json [--json]`.

use std::path::Path;

use crate::formats::team_file::{TeamFile, check_set_label};
use crate::plan::InputError;
use crate::plan::{SetLabels, TeamInput, TeamPlan, plan_team};
use crate::storage::atomic::{MAX_FILE_BYTES, TextReadError, read_text};
use crate::storage::team_state::{TEAM_SCHEMA, TeamState};

use super::plan_report;

/// Read and convert a team file; errors name the field. Files over 1 MB are refused
/// before they are read, and text that is not UTF-8 gets the position of the first bad byte.
pub fn read_team(path: &Path) -> Result<TeamInput, InputError> {
    read_named_team(path).map(|(team, _)| team)
}

/// [`read_team`], with the names the file gives the sets. The app's saved team
/// (`last-team.json`, a team file under `team` with the app's names beside it) is read
/// too, so its plan and card name the sets as the app does.
pub fn read_named_team(path: &Path) -> Result<(TeamInput, SetLabels), InputError> {
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
    let (file, app_labels) = if saved_by_the_app(&text) {
        let state: TeamState = serde_json::from_str(&text)
            .map_err(|e| InputError::new("team file", format!("the app's saved team: {e}")))?;
        if state.schema != TEAM_SCHEMA {
            return Err(InputError::new(
                "schema",
                format!(
                    "the app's saved team has schema {}; this version reads {TEAM_SCHEMA}",
                    state.schema
                ),
            ));
        }
        let labels = SetLabels {
            sets: checked_labels("cylinder_labels", &state.cylinder_labels)?,
            stages: checked_labels("stage_labels", &state.stage_labels)?,
        };
        (state.team, labels)
    } else {
        (TeamFile::parse(&text)?, SetLabels::default())
    };
    let names: Vec<&str> = file.divers.iter().map(|d| d.name.as_str()).collect();
    let named = |e| with_diver_name(e, &names);
    let input = file.to_input().map_err(named)?;
    let mut labels = file.set_labels().map_err(named)?;
    // A name in the team file comes first; else the app's.
    for (own, app) in [
        (&mut labels.sets, app_labels.sets),
        (&mut labels.stages, app_labels.stages),
    ] {
        for (l, a) in own.iter_mut().zip(app) {
            if l.is_empty() {
                *l = a;
            }
        }
    }
    Ok((input, labels))
}

/// Whether the text is the app's saved team: an object with `schema` and `team`.
fn saved_by_the_app(text: &str) -> bool {
    serde_json::from_str::<serde_json::Map<String, serde_json::Value>>(text)
        .is_ok_and(|m| m.contains_key("schema") && m.contains_key("team"))
}

/// The app's labels, each checked as a set name; an empty one stays empty.
fn checked_labels(field: &str, labels: &[String]) -> Result<Vec<String>, InputError> {
    labels
        .iter()
        .enumerate()
        .map(|(i, l)| {
            if l.trim().is_empty() {
                Ok(String::new())
            } else {
                check_set_label(&format!("{field}[{i}]"), l)
            }
        })
        .collect()
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
    let (input, labels) = read_named_team(path)?;
    let plan = plan_named(&input)?;
    if json {
        let out = plan_report::json_report(&input, &plan, &labels);
        Ok(serde_json::to_string_pretty(&out).unwrap_or_default() + "\n")
    } else {
        Ok(plan_report::text_report(&input, &plan, &labels))
    }
}
