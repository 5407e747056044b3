//! Merging lockers: another diver's exported sets into this locker (`merge`, by name),
//! and the app's copy into the file as another program left it (`merge_changes`, by id),
//! so that no set is lost when two programs change the locker.

use std::collections::HashMap;

use super::atomic::WithinLimits;
use super::locker::{
    LockerEntry, LockerFile, MAX_LOCKER_SETS, MAX_SET_NAME_CHARS, numbered_name, same_name,
};
use crate::i18n::{tr, tr_with};
use crate::plan::InputError;
use crate::plan::text;

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

impl LockerFile {
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
            let shown = text::shown(
                &e.name
                    .trim()
                    .chars()
                    .take(MAX_SET_NAME_CHARS)
                    .collect::<String>(),
            );
            if let Err(why) = e
                .check_text(&field)
                .and_then(|()| e.set(&field).map(|_| ()))
            {
                report.skipped.push((shown, why.to_string()));
                continue;
            }
            let name = text::nfc(e.name.trim());
            let already = out.entries.iter().any(|x| {
                x.cylinders == e.cylinders && x.material == e.material && variant_of(&x.name, &name)
            });
            let name_given = if already {
                report
                    .skipped
                    .push((name, tr("the same set is already in the locker")));
                continue;
            } else if out.find_by_name(&name).is_empty() {
                name.clone()
            } else {
                match out.free_name(&name) {
                    Some(n) => n,
                    None => {
                        report.skipped.push((
                            name,
                            tr("the name is taken and no free variant of it was found"),
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
                note: text::nfc(e.note.trim()),
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
                tr_with(
                    "importing would make {0} sets; a locker holds at most {1}. Nothing was imported",
                    &[&out.entries.len(), &MAX_LOCKER_SETS],
                ),
            ));
        }
        Ok((out, report))
    }
}

/// A set's content, without whether it is mine: what "changed" means for a merge.
fn same_set(a: &LockerEntry, b: &LockerEntry) -> bool {
    a.name == b.name && a.cylinders == b.cylinders && a.material == b.material && a.note == b.note
}

/// Put `e` into `out` under an id and a name not in use there; the name it got.
fn add_as_new(out: &mut LockerFile, mut e: LockerEntry) -> String {
    if out.entries.iter().any(|x| x.id == e.id) {
        e.id = out.next_id();
    }
    if !out.find_by_name(&e.name).is_empty()
        && let Some(free) = out.free_name(&e.name)
    {
        e.name = free;
    }
    e.mine = false;
    let name = e.name.clone();
    out.entries.push(e);
    name
}

/// Merge the app's copy of the locker (`ours`, edited from `base`, the file as the app
/// last read or wrote it) into `theirs`, the file as it is now. Every change made on
/// either side is kept and nothing is removed unless one side removed it and the other
/// left it alone:
/// - a set changed on one side takes that change;
/// - a set changed differently on both sides is kept twice (theirs, and ours under a
///   free name), and a line says so;
/// - a set removed on one side and changed on the other is kept, and a line says so;
/// - sets added on either side are all kept (an identical one once; a different one
///   under a taken name gets a free name, and a line says so);
/// - which set is mine follows the side that changed it (ours if both did).
///
/// Errors, changing nothing, if the result would hold more than `MAX_LOCKER_SETS` sets.
pub fn merge_changes(
    base: &LockerFile,
    ours: &LockerFile,
    theirs: &LockerFile,
) -> Result<(LockerFile, Vec<String>), InputError> {
    if theirs == base {
        return Ok((ours.clone(), Vec::new()));
    }
    let by_id = |l: &LockerFile| -> HashMap<u64, LockerEntry> {
        l.entries.iter().map(|e| (e.id, e.clone())).collect()
    };
    let (b, o) = (by_id(base), by_id(ours));
    let mut out = theirs.clone();
    let mut notes = Vec::new();
    let mut later = Vec::new();
    for be in &base.entries {
        let pos = out.entries.iter().position(|x| x.id == be.id);
        match (o.get(&be.id), pos) {
            (Some(oe), Some(k)) => {
                let te = &out.entries[k];
                if same_set(oe, be) || same_set(oe, te) {
                } else if same_set(te, be) {
                    let mine = te.mine;
                    out.entries[k] = LockerEntry { mine, ..oe.clone() };
                } else {
                    later.push((oe.clone(), Some(Conflict::ChangedBoth)));
                }
            }
            (None, Some(k)) => {
                if same_set(&out.entries[k], be) {
                    out.entries.remove(k);
                } else {
                    notes.push(tr_with(
                        "“{0}” was deleted here but changed in another program: it is kept",
                        &[&out.entries[k].name],
                    ));
                }
            }
            (Some(oe), None) => {
                if !same_set(oe, be) {
                    later.push((oe.clone(), Some(Conflict::DeletedThere)));
                }
            }
            (None, None) => {}
        }
    }
    for oe in ours.entries.iter().filter(|e| !b.contains_key(&e.id)) {
        let twin = out.entries.iter().any(|x| {
            same_name(&x.name, &oe.name) && x.cylinders == oe.cylinders && x.material == oe.material
        });
        if !twin {
            later.push((oe.clone(), None));
        }
    }
    let mut given = HashMap::new();
    for (e, why) in later {
        let (id, wanted) = (e.id, e.name.clone());
        let name = add_as_new(&mut out, e);
        given.insert(id, out.entries.last().map_or(0, |x| x.id));
        let names: [&dyn std::fmt::Display; 2] = [&wanted, &name];
        let renamed = name != wanted;
        let note = match (why, renamed) {
            (Some(Conflict::ChangedBoth), false) => tr_with(
                "“{0}” was changed here and in another program: both versions are kept",
                &names,
            ),
            (Some(Conflict::ChangedBoth), true) => tr_with(
                "“{0}” was changed here and in another program: both versions are kept (this one as “{1}”)",
                &names,
            ),
            (Some(Conflict::DeletedThere), false) => tr_with(
                "“{0}” was deleted in another program but changed here: it is kept",
                &names,
            ),
            (Some(Conflict::DeletedThere), true) => tr_with(
                "“{0}” was deleted in another program but changed here: it is kept (this one as “{1}”)",
                &names,
            ),
            (None, true) => tr_with(
                "“{0}” was also added in another program with other cylinders: both are kept, this one as “{1}”",
                &names,
            ),
            (None, false) => continue,
        };
        notes.push(note);
    }
    let mine_of = |l: &LockerFile| l.mine().map(|e| e.id);
    let ours_mine = mine_of(ours);
    if ours_mine != mine_of(base) {
        match ours_mine {
            Some(id) => out.set_mine(given.get(&id).copied().unwrap_or(id)),
            None => out.entries.iter_mut().for_each(|e| e.mine = false),
        }
    }
    if out.entries.len() > MAX_LOCKER_SETS {
        return Err(InputError::new(
            "locker",
            tr_with(
                "with the sets added in another program the locker would hold {0}; it holds at most {1}. Delete some first",
                &[&out.entries.len(), &MAX_LOCKER_SETS],
            ),
        ));
    }
    debug_assert!(out.within_limits().is_ok());
    Ok((out, notes))
}

/// Why a set of ours is added again after a sync: changed on both sides, or deleted in
/// the other program while changed here.
#[derive(Clone, Copy)]
enum Conflict {
    ChangedBoth,
    DeletedThere,
}

#[cfg(test)]
#[path = "locker_merge_tests.rs"]
mod tests;
