//! The diver's own cylinder sets.

use std::path::Path;

use serde::{Deserialize, Serialize};

use super::atomic::{MAX_FILE_BYTES, WithinLimits, check_envelope, one_line, read_text};
use crate::formats::team_file::CylindersFile;
use crate::plan::Material;
use crate::plan::error::InputError;
use crate::plan::validate_cylinders;
use crate::plan::{CylinderSet, UnitSystem};

pub const LOCKER_SCHEMA: u32 = 1;

/// Most sets a locker holds.
pub const MAX_LOCKER_SETS: usize = 200;
/// Longest set name, in characters (after trimming).
pub const MAX_SET_NAME_CHARS: usize = 40;
/// Longest note on a set, in characters.
pub const MAX_SET_NOTE_CHARS: usize = 60;

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

impl LockerEntry {
    /// Name and note within their limits; `field` is where the entry sits, e.g. `entries[3]`.
    pub fn check_text(&self, field: &str) -> Result<(), InputError> {
        check_set_name(&format!("{field}.name"), &self.name)?;
        let n = self.note.chars().count();
        if n > MAX_SET_NOTE_CHARS {
            return Err(InputError::new(
                format!("{field}.note"),
                format!("{n} characters is too long; at most {MAX_SET_NOTE_CHARS}"),
            ));
        }
        Ok(())
    }

    /// The cylinder set, checked by the planning core's ranges.
    pub fn set(&self, field: &str) -> Result<CylinderSet, InputError> {
        let f = format!("{field}.cylinders");
        let set = self.cylinders.to_set(&f)?;
        validate_cylinders(UnitSystem::Metric, &f, &set)?;
        Ok(set)
    }
}

/// A set name: 1 to 40 characters once trimmed, no control characters.
pub fn check_set_name(field: &str, name: &str) -> Result<(), InputError> {
    let t = name.trim();
    let n = t.chars().count();
    if n == 0 || n > MAX_SET_NAME_CHARS {
        return Err(InputError::new(
            field,
            format!("a name of 1 to {MAX_SET_NAME_CHARS} characters is needed; got {n}"),
        ));
    }
    if t.chars().any(char::is_control) {
        return Err(InputError::new(
            field,
            "control characters (tabs, line breaks...) are not allowed in a name",
        ));
    }
    Ok(())
}

/// The same name, as people read it: trimmed, case ignored.
fn same_name(a: &str, b: &str) -> bool {
    a.trim().to_lowercase() == b.trim().to_lowercase()
}

/// `NAME (n)`, shortened so that it fits the name limit.
fn numbered_name(name: &str, n: usize) -> String {
    let suffix = format!(" ({n})");
    let keep = MAX_SET_NAME_CHARS.saturating_sub(suffix.chars().count());
    let base: String = name.trim().chars().take(keep).collect();
    format!("{}{suffix}", base.trim_end())
}

/// `existing` is `name` itself or the name an earlier import gave it (`NAME (n)`), so that
/// importing the same file twice adds nothing the second time.
fn variant_of(existing: &str, name: &str) -> bool {
    if same_name(existing, name) {
        return true;
    }
    let t = existing.trim();
    let Some(open) = t.strip_suffix(')').and_then(|x| x.rfind(" (")) else {
        return false;
    };
    match t[open + 2..t.len() - 1].parse::<usize>() {
        Ok(n) if n >= 2 => same_name(existing, &numbered_name(name, n)),
        _ => false,
    }
}

/// What an import did, entry by entry.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct MergeReport {
    /// Names added as they were.
    pub added: Vec<String>,
    /// (name in the imported file, name given) for sets whose name was taken by a different set.
    pub renamed: Vec<(String, String)>,
    /// (name, reason) for entries not imported.
    pub skipped: Vec<(String, String)>,
}

impl MergeReport {
    pub fn changed(&self) -> bool {
        !self.added.is_empty() || !self.renamed.is_empty()
    }
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

    /// Merge another locker's sets into this one, by name, without duplicates:
    /// - a name not in this locker is added;
    /// - the same name with the same cylinders and material is skipped (already here);
    /// - the same name with a different set is added under a free name, `NAME (2)`...;
    /// - an entry whose name, note or cylinders break the rules is skipped with the reason.
    ///
    /// Imported sets get new ids and are never marked as mine: which set is the diver's
    /// own does not change by importing. Errors (nothing merged) if the result would
    /// hold more than `MAX_LOCKER_SETS` sets.
    pub fn merge(&self, incoming: &LockerFile) -> Result<(LockerFile, MergeReport), InputError> {
        let mut out = self.clone();
        let mut report = MergeReport::default();
        for (i, e) in incoming.entries.iter().enumerate() {
            let field = format!("entries[{i}]");
            let shown = e
                .name
                .trim()
                .chars()
                .take(MAX_SET_NAME_CHARS)
                .collect::<String>();
            if let Err(why) = e
                .check_text(&field)
                .and_then(|()| e.set(&field).map(|_| ()))
            {
                report.skipped.push((shown, why.to_string()));
                continue;
            }
            let name = e.name.trim().to_string();
            let already = out.entries.iter().any(|x| {
                x.cylinders == e.cylinders && x.material == e.material && variant_of(&x.name, &name)
            });
            let name_given = if already {
                report
                    .skipped
                    .push((name, "the same set is already in the locker".to_string()));
                continue;
            } else if out.find_by_name(&name).is_empty() {
                name.clone()
            } else {
                match out.free_name(&name) {
                    Some(n) => n,
                    None => {
                        report.skipped.push((
                            name,
                            "the name is taken and no free variant of it was found".to_string(),
                        ));
                        continue;
                    }
                }
            };
            let id = out.next_id();
            out.entries.push(LockerEntry {
                id,
                name: name_given.clone(),
                cylinders: e.cylinders.clone(),
                material: e.material,
                note: e.note.trim().to_string(),
                mine: false,
            });
            if name_given == name {
                report.added.push(name);
            } else {
                report.renamed.push((name, name_given));
            }
        }
        if out.entries.len() > MAX_LOCKER_SETS {
            return Err(InputError::new(
                "entries",
                format!(
                    "importing would make {} sets; a locker holds at most {MAX_LOCKER_SETS}. Nothing was imported",
                    out.entries.len()
                ),
            ));
        }
        Ok((out, report))
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
    fn merge_adds_skips_and_renames_by_name() {
        let mut mine = entry(1, "Twelves", 12.0);
        mine.mine = true;
        let own = locker(vec![mine, entry(2, "Sevens", 7.0)]);
        let mut theirs_mine = entry(9, "Fifteens", 15.0);
        theirs_mine.mine = true;
        let incoming = locker(vec![
            entry(1, " twelves ", 12.0), // the same set: skipped
            entry(2, "Sevens", 8.5),     // a different set with a taken name: renamed
            theirs_mine,                 // new: added, never mine
            entry(4, "Sevens", 9.0),     // taken twice now: renamed again
            entry(5, "", 12.0),          // bad name: skipped
            entry(6, "Huge", 90.0),      // out of range: skipped
            entry(7, "Fifteens", 15.0),  // duplicate inside the file: skipped
        ]);
        let (merged, report) = own.merge(&incoming).unwrap();
        assert_eq!(report.added, vec!["Fifteens".to_string()]);
        assert_eq!(
            report.renamed,
            vec![
                ("Sevens".to_string(), "Sevens (2)".to_string()),
                ("Sevens".to_string(), "Sevens (3)".to_string())
            ]
        );
        let skipped: Vec<&str> = report.skipped.iter().map(|(n, _)| n.as_str()).collect();
        assert_eq!(skipped, vec!["twelves", "", "Huge", "Fifteens"]);
        assert!(
            report.skipped[1].1.contains("entries[4].name"),
            "{:?}",
            report.skipped
        );
        assert!(report.skipped[2].1.contains("entries[5].cylinders.water_l"));
        assert_eq!(merged.entries.len(), 5);
        assert_eq!(merged.entries.iter().filter(|e| e.mine).count(), 1);
        assert!(merged.entries[0].mine, "which set is mine does not change");
        let mut ids: Vec<u64> = merged.entries.iter().map(|e| e.id).collect();
        ids.sort();
        ids.dedup();
        assert_eq!(ids.len(), 5, "ids stay unique");
        // Importing the result, or the same file, again changes nothing.
        let (again, report) = merged.merge(&merged).unwrap();
        assert_eq!(again, merged);
        assert!(!report.changed());
        assert_eq!(report.skipped.len(), 5);
        let (again, report) = merged.merge(&incoming).unwrap();
        assert_eq!(again, merged);
        assert!(!report.changed(), "{report:?}");
    }

    #[test]
    fn renamed_names_fit_the_limit_and_a_full_locker_refuses() {
        let long = "L".repeat(MAX_SET_NAME_CHARS);
        let own = locker(vec![entry(1, &long, 12.0)]);
        let (merged, report) = own.merge(&locker(vec![entry(1, &long, 10.0)])).unwrap();
        let given = &report.renamed[0].1;
        assert_eq!(given.chars().count(), MAX_SET_NAME_CHARS);
        assert!(given.ends_with(" (2)"));
        assert!(merged.within_limits().is_ok());

        let full = locker(
            (0..MAX_LOCKER_SETS as u64)
                .map(|i| entry(i + 1, &format!("Set {i}"), 12.0))
                .collect(),
        );
        assert!(full.within_limits().is_ok());
        let e = full
            .merge(&locker(vec![entry(1, "One more", 12.0)]))
            .unwrap_err();
        assert!(e.message.contains("at most 200"), "{e}");
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
    }
}
