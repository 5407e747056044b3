//! The diver's own cylinder sets.

use std::path::Path;

use serde::{Deserialize, Serialize};

use super::atomic::{MAX_FILE_BYTES, WithinLimits, check_envelope, one_line, read_text};
use crate::formats::team_file::CylindersFile;
use crate::i18n::{tr_n, tr_with};
use crate::plan::InputError;
use crate::plan::Material;
use crate::plan::text;
use crate::plan::validate_cylinders;
use crate::plan::{CylinderSet, UnitSystem};

pub const LOCKER_SCHEMA: u32 = 1;

/// Most sets a locker holds.
pub const MAX_LOCKER_SETS: usize = 500;
/// Longest set name, in characters (after trimming).
pub const MAX_SET_NAME_CHARS: usize = 40;
/// Longest note on a set, in characters.
pub const MAX_SET_NOTE_CHARS: usize = 60;
/// Highest set id kept (2^53 − 1, the largest integer every JSON reader holds exactly).
pub const MAX_SET_ID: u64 = (1 << 53) - 1;

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LockerEntry {
    /// Read leniently: anything that is not a whole number from 1 to `MAX_SET_ID`
    /// (a string, a fraction, a negative or too large number, nothing) reads as 0, which
    /// `LockerFile::repair` renumbers, so that one bad id never makes a locker unreadable.
    #[serde(default, deserialize_with = "lenient_id")]
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

/// Any JSON value as an id: a whole number that fits, else 0 (renumbered on repair).
fn lenient_id<'de, D: serde::Deserializer<'de>>(d: D) -> Result<u64, D::Error> {
    let v = serde_json::Value::deserialize(d)?;
    Ok(v.as_u64().unwrap_or(0))
}

impl LockerEntry {
    /// Name and note within their limits; `field` is where the entry sits, e.g. `entries[3]`.
    pub fn check_text(&self, field: &str) -> Result<(), InputError> {
        check_set_name(&format!("{field}.name"), &self.name)?;
        check_set_note(&format!("{field}.note"), &self.note)
    }

    /// The cylinder set, checked by the planning core's ranges.
    pub fn set(&self, field: &str) -> Result<CylinderSet, InputError> {
        let f = format!("{field}.cylinders");
        let set = self.cylinders.to_set(&f)?;
        validate_cylinders(UnitSystem::Metric, &f, &set)?;
        Ok(set)
    }
}

/// A set name: 1 to 40 characters once trimmed, only characters the core's one text
/// check accepts, and at least one visible (`plan::text::check_name`).
pub fn check_set_name(field: &str, name: &str) -> Result<(), InputError> {
    let t = name.trim();
    let n = t.chars().count();
    if n == 0 || n > MAX_SET_NAME_CHARS {
        return Err(InputError::new(
            field,
            format!("a name of 1 to {MAX_SET_NAME_CHARS} characters is needed; got {n}"),
        ));
    }
    text::check_name(field, t)
}

/// A note: at most 60 characters, checked like a name.
pub fn check_set_note(field: &str, note: &str) -> Result<(), InputError> {
    let n = note.trim().chars().count();
    if n > MAX_SET_NOTE_CHARS {
        return Err(InputError::new(
            field,
            format!("{n} characters is too long; at most {MAX_SET_NOTE_CHARS}"),
        ));
    }
    text::check_text(field, note.trim())
}

/// The same name, as people read it: trimmed, normalised, case ignored.
pub(crate) fn same_name(a: &str, b: &str) -> bool {
    text::same_text(a, b)
}

/// `NAME (n)`, shortened so that it fits the name limit.
pub(crate) fn numbered_name(name: &str, n: usize) -> String {
    let suffix = format!(" ({n})");
    let keep = MAX_SET_NAME_CHARS.saturating_sub(suffix.chars().count());
    let base: String = name.trim().chars().take(keep).collect();
    format!("{}{suffix}", base.trim_end())
}

impl WithinLimits for LockerFile {
    fn within_limits(&self) -> Result<(), String> {
        if self.entries.len() > MAX_LOCKER_SETS {
            return Err(format!(
                "entries: {} sets; a locker holds at most {MAX_LOCKER_SETS}",
                self.entries.len()
            ));
        }
        for (i, e) in self.entries.iter().enumerate() {
            e.check_text(&format!("entries[{i}]"))
                .map_err(|e| e.to_string())?;
        }
        Ok(())
    }
}

impl LockerFile {
    /// Index of the entry called `name` (trimmed, case ignored), if exactly one is.
    pub fn find_by_name(&self, name: &str) -> Vec<usize> {
        self.entries
            .iter()
            .enumerate()
            .filter(|(_, e)| same_name(&e.name, name))
            .map(|(i, _)| i)
            .collect()
    }

    /// `NAME (2)`, `NAME (3)`... the first not in use, shortened to fit the name limit.
    pub fn free_name(&self, name: &str) -> Option<String> {
        (2..=MAX_LOCKER_SETS + 2).find_map(|n| {
            let candidate = numbered_name(name, n);
            self.find_by_name(&candidate)
                .is_empty()
                .then_some(candidate)
        })
    }

    /// One more than the highest id; never wraps: past `MAX_SET_ID` the smallest free id.
    pub fn next_id(&self) -> u64 {
        let max = self.entries.iter().map(|e| e.id).max().unwrap_or(0);
        match max.checked_add(1) {
            Some(id) if id <= MAX_SET_ID => id,
            _ => (1..=MAX_SET_ID)
                .find(|id| self.entries.iter().all(|e| e.id != *id))
                .unwrap_or(1),
        }
    }

    /// Make a locker as read safe to use: names and notes trimmed and normalised (NFC);
    /// if two sets share an id or an id is not usable (0, above `MAX_SET_ID`, or not a
    /// whole number in the file), every set numbered again from 1 in its order; if more
    /// than one set is marked mine, only the one with the lowest id stays mine. Returns
    /// the lines to show (empty when nothing but the text changed).
    pub fn repair(&mut self) -> Vec<String> {
        for e in &mut self.entries {
            e.name = text::nfc(e.name.trim());
            e.note = text::nfc(e.note.trim());
        }
        let mut said = Vec::new();
        let mut seen = std::collections::HashSet::new();
        let bad = self
            .entries
            .iter()
            .any(|e| e.id == 0 || e.id > MAX_SET_ID || !seen.insert(e.id));
        if bad {
            for (i, e) in self.entries.iter_mut().enumerate() {
                e.id = i as u64 + 1;
            }
            said.push(tr_n(
                "The locker held repeated or out-of-range set numbers; its {n} set were numbered again from 1 (names and cylinders unchanged).",
                "The locker held repeated or out-of-range set numbers; its {n} sets were numbered again from 1 (names and cylinders unchanged).",
                self.entries.len() as u64,
                &[],
            ));
        }
        let marked = self.entries.iter().filter(|e| e.mine).count();
        if marked > 1 {
            let keep = self
                .entries
                .iter()
                .filter(|e| e.mine)
                .min_by_key(|e| e.id)
                .map(|e| (e.id, e.name.clone()));
            if let Some((id, name)) = keep {
                self.set_mine(id);
                said.push(tr_with(
                    "The locker had {0} sets marked as yours; only '{1}' (the first) is yours now.",
                    &[&marked, &text::shown(&name)],
                ));
            }
        }
        said
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

/// Read a locker file to import (one exported by `locker export` or copied from another
/// diver's data directory). Nothing is set aside: the file is not the app's. Errors name the
/// file and the field; files over 1 MB or nested too deep are refused before parsing.
pub fn read_locker_file(file: &Path) -> Result<LockerFile, InputError> {
    let shown = file.display().to_string();
    let text = read_text(file, MAX_FILE_BYTES)
        .map_err(|e| InputError::new("FILE", format!("{shown}: {e}")))?;
    check_envelope(&text, LOCKER_SCHEMA)
        .map_err(|why| InputError::new("FILE", format!("{shown} is not a locker file: {why}")))?;
    let de = &mut serde_json::Deserializer::from_str(&text);
    let parsed: LockerFile = serde_path_to_error::deserialize(de).map_err(|e| {
        let at = e.path().to_string();
        let at = at.trim_end_matches('?').trim_end_matches('.');
        let field = if at.is_empty() {
            "FILE".to_string()
        } else {
            at.to_string()
        };
        InputError::new(
            field,
            format!(
                "{shown} is not a locker file: {}",
                one_line(&e.inner().to_string(), 200)
            ),
        )
    })?;
    if parsed.entries.len() > MAX_LOCKER_SETS {
        return Err(InputError::new(
            "entries",
            format!(
                "{shown} has {} sets; a locker holds at most {MAX_LOCKER_SETS}",
                parsed.entries.len()
            ),
        ));
    }
    Ok(parsed)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn entry(id: u64, name: &str, water_l: f64) -> LockerEntry {
        LockerEntry {
            id,
            name: name.to_string(),
            cylinders: CylindersFile {
                count: 2,
                independent: false,
                water_l: Some(water_l),
                working_bar: Some(232.0),
                rated_cuft: None,
                rated_psi: None,
            },
            material: Material::Steel,
            note: String::new(),
            mine: false,
        }
    }

    fn locker(entries: Vec<LockerEntry>) -> LockerFile {
        LockerFile {
            schema: LOCKER_SCHEMA,
            entries,
        }
    }

    #[test]
    fn limits_name_the_entry() {
        let mut l = locker(vec![entry(1, "A", 12.0), entry(2, &"n".repeat(41), 12.0)]);
        let e = l.within_limits().unwrap_err();
        assert!(e.starts_with("entries[1].name"), "{e}");
        l.entries[1].name = "B".into();
        l.entries[1].note = "x".repeat(61);
        assert!(
            l.within_limits()
                .unwrap_err()
                .starts_with("entries[1].note")
        );
        l.entries[1].note.clear();
        l.entries[1].name = "Tab\there".into();
        assert!(l.within_limits().unwrap_err().contains("control"));
        l.entries[1].name = "B".into();
        l.entries[1].note = "a\u{202e}b".into();
        let e = l.within_limits().unwrap_err();
        assert!(
            e.starts_with("entries[1].note: character 2 is U+202E"),
            "{e}"
        );
    }

    #[test]
    fn ids_are_repaired_once_and_never_wrap() {
        let mut l = locker(vec![
            entry(MAX_SET_ID, "A", 12.0),
            entry(5, "Jose\u{301}", 12.0),
        ]);
        assert!(l.repair().is_empty(), "ids in range and unique are kept");
        assert_eq!(l.entries[1].name, "Jos\u{e9}", "stored composed");
        let next = l.next_id();
        assert!(next != MAX_SET_ID && next != 5 && next >= 1, "{next}");
        l.entries[1].id = MAX_SET_ID;
        let said = l.repair();
        assert_eq!(said.len(), 1, "a duplicate is renumbered: {said:?}");
        assert!(said[0].contains("numbered again"), "{said:?}");
        let ids: Vec<u64> = l.entries.iter().map(|e| e.id).collect();
        assert_eq!(ids, [1, 2]);
        assert!(l.repair().is_empty(), "said once");
        l.entries[0].id = u64::MAX;
        assert!(!l.repair().is_empty(), "beyond the highest id kept");
        l.entries[0].id = 0;
        assert!(!l.repair().is_empty());
        assert_eq!(l.next_id(), 3);
    }

    #[test]
    fn two_sets_marked_mine_keep_the_lowest_id_once() {
        let mut l = locker(vec![
            entry(7, "A", 12.0),
            entry(3, "B", 12.0),
            entry(5, "C", 7.0),
        ]);
        l.entries[0].mine = true;
        l.entries[1].mine = true;
        let said = l.repair();
        assert_eq!(said.len(), 1, "{said:?}");
        assert!(said[0].contains("2 sets marked as yours"), "{said:?}");
        assert!(said[0].contains("'B'"), "{said:?}");
        assert_eq!(l.mine().map(|e| e.id), Some(3));
        assert_eq!(l.entries.iter().filter(|e| e.mine).count(), 1);
        assert!(l.repair().is_empty(), "said once");
    }

    #[test]
    fn ids_that_are_not_whole_numbers_are_read_and_renumbered() {
        let set = r#""cylinders": {"count": 1, "water_l": 12, "working_bar": 232}"#;
        for bad in ["18446744073709551616", "-1", "1.5", "\"7\"", "null", "[]"] {
            let text = format!(
                r#"{{"schema": 1, "entries": [{{"id": {bad}, "name": "A", {set}}}, {{"id": 2, "name": "B", {set}}}]}}"#
            );
            let mut l: LockerFile =
                serde_json::from_str(&text).unwrap_or_else(|e| panic!("{bad}: {e}"));
            let said = l.repair();
            assert_eq!(said.len(), 1, "{bad}: {said:?}");
            let ids: Vec<u64> = l.entries.iter().map(|e| e.id).collect();
            assert_eq!(ids, [1, 2], "{bad}");
        }
        let text = format!(r#"{{"schema": 1, "entries": [{{"name": "A", {set}}}]}}"#);
        let mut l: LockerFile = serde_json::from_str(&text).unwrap();
        assert_eq!(l.repair().len(), 1, "a missing id is renumbered too");
    }
}
