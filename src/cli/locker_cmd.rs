//! `turnsheet locker ...`: the app's cylinder locker from the command line, and the
//! exchange of sets between divers through a locker file.

use std::path::{Path, PathBuf};

use serde::Serialize;

use crate::formats::cylinder_spec::{SPEC_FORM, format_cylinder_spec, parse_cylinder_spec};
use crate::formats::team_file::CylindersFile;
use crate::plan::InputError;
use crate::plan::Material;
use crate::plan::text;
use crate::storage::Store;
use crate::storage::exchange::sets_word;
use crate::storage::locker::{
    LockerEntry, LockerFile, MAX_LOCKER_SETS, check_set_name, check_set_note,
};
use crate::storage::store::LOCKER_FILE;

use super::locker_files::{describe, locker_error};
use super::{CliError, shown_path};

#[derive(clap::Subcommand, Debug)]
pub enum LockerAction {
    /// List the sets in the locker.
    List {
        /// Print machine-readable JSON.
        #[arg(long)]
        json: bool,
    },
    /// Add a set: `turnsheet locker add "Twin 12s" 2x12L@232bar`.
    Add {
        /// The set's name (1 to 40 characters, unique in the locker).
        name: String,
        /// The cylinders, COUNTxSIZE@RATING: 2x12L@232bar (water litres at working bar) or
        /// 1x80cuft@3000psi (rated cubic feet at rated psi).
        spec: String,
        /// What the cylinders are made of.
        #[arg(long, value_enum, default_value_t = MaterialArg::Steel)]
        material: MaterialArg,
        /// A note (serial, test date...), at most 60 characters.
        #[arg(long, default_value = "")]
        note: String,
        /// Make this "mine": the set a new team and an added diver start with. No set is
        /// made mine without asking, not even the first.
        #[arg(long)]
        mine: bool,
    },
    /// Remove the set with this name.
    Remove {
        /// The set's name (case is ignored).
        name: String,
    },
    /// Write the locker to a file, to give to another diver or keep as a copy.
    Export {
        /// The file to write (JSON, the locker's own format).
        file: PathBuf,
        /// Replace the file if it exists.
        #[arg(long)]
        force: bool,
    },
    /// Merge the sets of an exported locker file into the locker, by name.
    ///
    /// A set whose name is new is added. The same name with the same cylinders is
    /// skipped. The same name with different cylinders is added as "NAME (2)". Entries
    /// that break a rule are skipped with the reason. The locker is saved once, and
    /// which set is yours does not change.
    Import {
        /// The locker file to read (at most 1 MB).
        file: PathBuf,
    },
}

#[derive(clap::ValueEnum, Clone, Copy, Debug, PartialEq, Eq)]
pub enum MaterialArg {
    Steel,
    Aluminium,
    Composite,
}

impl From<MaterialArg> for Material {
    fn from(m: MaterialArg) -> Material {
        match m {
            MaterialArg::Steel => Material::Steel,
            MaterialArg::Aluminium => Material::Aluminium,
            MaterialArg::Composite => Material::Composite,
        }
    }
}

/// One set as `locker list --json` prints it.
#[derive(Serialize, Debug)]
pub struct SetJson {
    pub name: String,
    /// COUNTxSIZE@RATING, or null if the stored cylinders are not a usable set.
    pub spec: Option<String>,
    /// Why the stored cylinders are not usable, if they are not.
    pub problem: Option<String>,
    pub cylinders: CylindersFile,
    pub material: Material,
    pub note: String,
    pub mine: bool,
}

#[derive(Serialize, Debug)]
pub struct ListJson {
    pub file: String,
    pub sets: Vec<SetJson>,
}

/// Run a locker action against the store in `data_dir`. Lines for standard error
/// (files set aside, ids repaired) go to `notes`, even when the action then fails.
/// Changes go through `Store::update_locker`: under the lock, on the locker as it is now.
pub fn run(
    action: &LockerAction,
    data_dir: &Path,
    notes: &mut Vec<String>,
) -> Result<String, CliError> {
    let mut store = Store::new(data_dir);
    let result = act(action, &mut store, notes);
    kept_aside_note(&store, notes);
    result
}

/// One line while lockers set aside earlier are still there (those named in this run's
/// lines are not repeated): their sets are not in the locker until someone looks.
fn kept_aside_note(store: &Store, notes: &mut Vec<String>) {
    let kept: Vec<_> = store
        .kept_aside_lockers()
        .into_iter()
        .filter(|k| {
            let name = k.file_name().unwrap_or_default().to_string_lossy();
            !notes.iter().any(|n| n.contains(&*name))
        })
        .collect();
    if let Some(newest) = kept.last() {
        notes.push(format!(
            "{} set aside as unreadable earlier {} still beside the locker (newest: {}); sets in {} are not in the locker: look at {}, then move or delete {}",
            if kept.len() == 1 { "1 locker file".to_string() } else { format!("{} locker files", kept.len()) },
            if kept.len() == 1 { "is" } else { "are" },
            shown_path(newest),
            if kept.len() == 1 { "it" } else { "them" },
            if kept.len() == 1 { "it" } else { "them" },
            if kept.len() == 1 { "it" } else { "them" },
        ));
    }
}

fn act(
    action: &LockerAction,
    store: &mut Store,
    notes: &mut Vec<String>,
) -> Result<String, CliError> {
    let path = store.path_of(LOCKER_FILE);
    match action {
        LockerAction::List { json } => {
            let found = store.load_locker();
            notes.extend(found.messages.iter().cloned());
            let out = list(&found.locker, &path, *json);
            if found.unreadable() {
                return Err(CliError::Unreadable(out));
            }
            Ok(out)
        }
        LockerAction::Add {
            name,
            spec,
            material,
            note,
            mine,
        } => {
            let new = NewSet {
                name,
                spec,
                material: (*material).into(),
                note,
                mine: *mine,
            };
            add(store, notes, &path, &new)
        }
        LockerAction::Remove { name } => remove(store, notes, &path, name),
        LockerAction::Export { file, force } => {
            let found = store.load_locker();
            notes.extend(found.messages.iter().cloned());
            if found.unreadable() {
                notes.push(format!(
                    "nothing was exported: the locker could not be read; {} was not written",
                    shown_path(file)
                ));
                return Err(CliError::Unreadable(String::new()));
            }
            super::locker_files::export(&found.locker, file, *force)
        }
        LockerAction::Import { file } => super::locker_files::import(store, notes, &path, file),
    }
}

/// What `locker add` was asked to add.
struct NewSet<'a> {
    name: &'a str,
    spec: &'a str,
    material: Material,
    note: &'a str,
    mine: bool,
}

fn list(locker: &LockerFile, path: &Path, json: bool) -> String {
    if json {
        let out = ListJson {
            file: path.display().to_string(),
            sets: locker
                .entries
                .iter()
                .enumerate()
                .map(|(i, e)| {
                    let (spec, problem) = describe(e, i);
                    SetJson {
                        name: e.name.clone(),
                        spec,
                        problem,
                        cylinders: e.cylinders.clone(),
                        material: e.material,
                        note: e.note.clone(),
                        mine: e.mine,
                    }
                })
                .collect(),
        };
        return serde_json::to_string_pretty(&out).unwrap_or_default() + "\n";
    }
    if locker.entries.is_empty() {
        return format!(
            "The locker is empty ({}).\nAdd a set with: turnsheet locker add NAME {SPEC_FORM}\n",
            shown_path(path)
        );
    }
    let rows: Vec<(&LockerEntry, String)> = locker
        .entries
        .iter()
        .enumerate()
        .map(|(i, e)| {
            let (spec, problem) = describe(e, i);
            let spec =
                spec.unwrap_or_else(|| format!("not usable: {}", problem.unwrap_or_default()));
            (e, spec)
        })
        .collect();
    let name_width = rows.iter().map(|(e, _)| e.name.chars().count()).max();
    let spec_width = rows.iter().map(|(_, s)| s.chars().count()).max();
    let mut s = format!(
        "{} in {}:\n",
        sets_word(locker.entries.len()),
        shown_path(path)
    );
    for (e, spec) in &rows {
        let mark = if e.mine { "*" } else { " " };
        let name_pad = name_width.unwrap_or(0) - e.name.chars().count();
        let spec_pad = spec_width.unwrap_or(0) - spec.chars().count();
        s.push_str(&format!(
            "{mark} {}{}  {spec}{}  {}",
            e.name,
            " ".repeat(name_pad),
            " ".repeat(spec_pad),
            e.material.name()
        ));
        if !e.note.is_empty() {
            s.push_str(&format!("  ({})", e.note));
        }
        s.push('\n');
    }
    if locker.mine().is_some() {
        s.push_str("* the set a new team starts with\n");
    }
    s
}

fn add(
    store: &mut Store,
    notes: &mut Vec<String>,
    path: &Path,
    new: &NewSet,
) -> Result<String, CliError> {
    check_set_name("NAME", new.name)?;
    check_set_note("--note", new.note)?;
    let name = text::nfc(new.name.trim());
    let set = parse_cylinder_spec(new.spec)?;
    let (count, _) = store
        .update_locker(notes, |locker, _| {
            if !locker.find_by_name(&name).is_empty() {
                return Err(InputError::new(
                    "NAME",
                    format!(
                        "a set called '{name}' is already in the locker; choose another name, or remove it first"
                    ),
                ));
            }
            if locker.entries.len() >= MAX_LOCKER_SETS {
                return Err(InputError::new(
                    "NAME",
                    format!(
                        "the locker is full: it holds at most {MAX_LOCKER_SETS} sets; remove one first"
                    ),
                ));
            }
            let id = locker.next_id();
            locker.entries.push(LockerEntry {
                id,
                name: name.clone(),
                cylinders: CylindersFile::from_set(&set),
                material: new.material,
                note: text::nfc(new.note.trim()),
                mine: false,
            });
            if new.mine {
                locker.set_mine(id);
            }
            Ok(locker.entries.len())
        })
        .map_err(locker_error)?;
    let mut s = format!(
        "Added '{name}' ({}) to {}; {} now.\n",
        format_cylinder_spec(&set),
        shown_path(path),
        sets_word(count)
    );
    if new.mine {
        s.push_str("It is now mine: a new team and an added diver start with this set.\n");
    }
    Ok(s)
}

fn remove(
    store: &mut Store,
    notes: &mut Vec<String>,
    path: &Path,
    name: &str,
) -> Result<String, CliError> {
    let ((removed, i), locker) = store
        .update_locker(notes, |locker, _| remove_named(locker, name))
        .map_err(locker_error)?;
    let mut s = format!(
        "Removed '{}' ({}) from {}; {} left.\n",
        removed.name,
        describe(&removed, i)
            .0
            .unwrap_or_else(|| "not a usable set".to_string()),
        shown_path(path),
        sets_word(locker.entries.len())
    );
    if removed.mine {
        s.push_str("No set is marked as yours now: a new team starts with a preset.\n");
    }
    Ok(s)
}

/// Remove the one set called `name`: the set and where it was.
fn remove_named(locker: &mut LockerFile, name: &str) -> Result<(LockerEntry, usize), InputError> {
    let found = locker.find_by_name(name);
    let i = match found.as_slice() {
        [i] => *i,
        [] => {
            let names: Vec<&str> = locker.entries.iter().map(|e| e.name.as_str()).collect();
            let known = if names.is_empty() {
                "the locker is empty".to_string()
            } else {
                format!("the locker has: {}", names.join(", "))
            };
            return Err(InputError::new(
                "NAME",
                format!("no set is called '{}'; {known}", name.trim()),
            ));
        }
        many => {
            return Err(InputError::new(
                "NAME",
                format!(
                    "{} sets are called '{}'; rename all but one in the app first, so the right one is removed",
                    many.len(),
                    name.trim()
                ),
            ));
        }
    };
    Ok((locker.entries.remove(i), i))
}
