//! `turnsheet locker ...`: the app's cylinder locker from the command line, and the
//! exchange of sets between divers through a locker file.

use std::path::{Path, PathBuf};

use serde::Serialize;

use crate::formats::cylinder_spec::{SPEC_FORM, format_cylinder_spec, parse_cylinder_spec};
use crate::formats::team_file::CylindersFile;
use crate::plan::Material;
use crate::plan::error::InputError;
use crate::storage::Store;
use crate::storage::atomic::WithinLimits;
use crate::storage::exchange::{export_locker, import_locker, sets_word};
use crate::storage::locker::{LockerEntry, LockerFile, MAX_LOCKER_SETS, check_set_name};
use crate::storage::store::LOCKER_FILE;

use super::CliError;

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
/// (files set aside) go to `notes`, even when the action then fails.
pub fn run(
    action: &LockerAction,
    data_dir: &Path,
    notes: &mut Vec<String>,
) -> Result<String, CliError> {
    let mut store = Store::new(data_dir);
    let (locker, messages) = store.load_locker();
    notes.extend(messages);
    let path = store.path_of(LOCKER_FILE);
    match action {
        LockerAction::List { json } => Ok(list(&locker, &path, *json)),
        LockerAction::Add {
            name,
            spec,
            material,
            note,
            mine,
        } => add(
            &mut store,
            locker,
            &path,
            name,
            spec,
            (*material).into(),
            note,
            *mine,
        ),
        LockerAction::Remove { name } => remove(&mut store, locker, &path, name),
        LockerAction::Export { file, force } => export(&locker, file, *force),
        LockerAction::Import { file } => import(&mut store, locker, &path, file),
    }
}

fn describe(e: &LockerEntry, i: usize) -> (Option<String>, Option<String>) {
    match e.set(&format!("entries[{i}]")) {
        Ok(set) => (Some(format_cylinder_spec(&set)), None),
        Err(err) => (None, Some(err.to_string())),
    }
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
            path.display()
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
        path.display()
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

fn save(store: &mut Store, locker: &LockerFile) -> Result<(), CliError> {
    store.save_locker(locker).map_err(CliError::Write)
}

#[allow(clippy::too_many_arguments)]
fn add(
    store: &mut Store,
    mut locker: LockerFile,
    path: &Path,
    name: &str,
    spec: &str,
    material: Material,
    note: &str,
    mine: bool,
) -> Result<String, CliError> {
    check_set_name("NAME", name)?;
    let name = name.trim().to_string();
    if !locker.find_by_name(&name).is_empty() {
        return Err(InputError::new(
            "NAME",
            format!(
                "a set called '{name}' is already in the locker; choose another name, or remove it first"
            ),
        )
        .into());
    }
    let set = parse_cylinder_spec(spec)?;
    if locker.entries.len() >= MAX_LOCKER_SETS {
        return Err(InputError::new(
            "NAME",
            format!(
                "the locker is full: it holds at most {MAX_LOCKER_SETS} sets; remove one first"
            ),
        )
        .into());
    }
    let entry = LockerEntry {
        id: locker.next_id(),
        name: name.clone(),
        cylinders: CylindersFile::from_set(&set),
        material,
        note: note.trim().to_string(),
        mine: false,
    };
    entry.check_text("NAME").map_err(|e| {
        // The note is the only other text checked; name it as the option.
        if e.field.ends_with(".note") {
            InputError::new("--note", e.message)
        } else {
            e
        }
    })?;
    let id = entry.id;
    locker.entries.push(entry);
    if mine {
        locker.set_mine(id);
    }
    save(store, &locker)?;
    let mut s = format!(
        "Added '{name}' ({}) to {}; {} now.\n",
        format_cylinder_spec(&set),
        path.display(),
        sets_word(locker.entries.len())
    );
    if mine {
        s.push_str("It is now mine: a new team and an added diver start with this set.\n");
    }
    Ok(s)
}

fn remove(
    store: &mut Store,
    mut locker: LockerFile,
    path: &Path,
    name: &str,
) -> Result<String, CliError> {
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
            )
            .into());
        }
        many => {
            return Err(InputError::new(
                "NAME",
                format!(
                    "{} sets are called '{}'; rename all but one in the app first, so the right one is removed",
                    many.len(),
                    name.trim()
                ),
            )
            .into());
        }
    };
    let removed = locker.entries.remove(i);
    save(store, &locker)?;
    let mut s = format!(
        "Removed '{}' ({}) from {}; {} left.\n",
        removed.name,
        describe(&removed, i)
            .0
            .unwrap_or_else(|| "not a usable set".to_string()),
        path.display(),
        sets_word(locker.entries.len())
    );
    if removed.mine {
        s.push_str("No set is marked as yours now: a new team starts with a preset.\n");
    }
    Ok(s)
}

fn export(locker: &LockerFile, file: &Path, force: bool) -> Result<String, CliError> {
    if file.exists() && !force {
        return Err(InputError::new(
            "FILE",
            format!(
                "{} already exists; choose another name, or add --force to replace it",
                file.display()
            ),
        )
        .into());
    }
    if file.is_dir() {
        return Err(InputError::new(
            "FILE",
            format!("{} is a directory; give a file name", file.display()),
        )
        .into());
    }
    export_locker(locker, file).map_err(CliError::Write)?;
    Ok(format!(
        "Exported {} to {}.\n",
        sets_word(locker.entries.len()),
        file.display()
    ))
}

fn import(
    store: &mut Store,
    locker: LockerFile,
    path: &Path,
    file: &Path,
) -> Result<String, CliError> {
    let (merged, report) = import_locker(&locker, file)?;
    debug_assert!(merged.within_limits().is_ok());
    if report.changed() {
        save(store, &merged)?;
    }
    let mut s = format!("Imported {} into {}:\n", file.display(), path.display());
    for n in &report.added {
        let spec = merged
            .find_by_name(n)
            .first()
            .and_then(|&k| describe(&merged.entries[k], k).0)
            .unwrap_or_default();
        s.push_str(&format!("  added    '{n}' ({spec})\n"));
    }
    for (from, to) in &report.renamed {
        s.push_str(&format!(
            "  renamed  '{from}' -> '{to}' (a different set already has that name)\n"
        ));
    }
    for (n, why) in &report.skipped {
        s.push_str(&format!("  skipped  '{n}': {why}\n"));
    }
    s.push_str(&report.summary(merged.entries.len()));
    s.push('\n');
    if !report.changed() {
        s.push_str("Nothing new: the locker file was not changed.\n");
    }
    Ok(s)
}
