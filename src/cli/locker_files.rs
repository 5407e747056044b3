//! `turnsheet locker export|import`: swapping sets with other divers through a file.

use std::path::Path;

use crate::formats::cylinder_spec::format_cylinder_spec;
use crate::plan::InputError;
use crate::storage::Store;
use crate::storage::exchange::{export_locker, sets_word};
use crate::storage::locker::{LockerEntry, LockerFile, read_locker_file};
use crate::storage::store::LockerError;

use super::{CliError, shown_path};

/// Write the locker to `file` (whole or not at all); an existing file only with `force`.
pub fn export(locker: &LockerFile, file: &Path, force: bool) -> Result<String, CliError> {
    if file.is_dir() {
        return Err(InputError::new(
            "FILE",
            format!("{} is a directory; give a file name", shown_path(file)),
        )
        .into());
    }
    if file.exists() && !force {
        return Err(InputError::new(
            "FILE",
            format!(
                "{} already exists; choose another name, or add --force to replace it",
                shown_path(file)
            ),
        )
        .into());
    }
    if locker.entries.is_empty() && file.exists() {
        return Err(InputError::new(
            "FILE",
            format!(
                "the locker is empty; {} was not replaced (an empty export would only lose what it holds)",
                shown_path(file)
            ),
        )
        .into());
    }
    export_locker(locker, file).map_err(CliError::Write)?;
    Ok(format!(
        "Exported {} to {}.\n",
        sets_word(locker.entries.len()),
        shown_path(file)
    ))
}

/// Merge `file` into the locker as it is when the lock is taken; saved once, if changed.
pub fn import(
    store: &mut Store,
    notes: &mut Vec<String>,
    path: &Path,
    file: &Path,
) -> Result<String, CliError> {
    let incoming = read_locker_file(file)?;
    let (report, merged) = store
        .update_locker(notes, |locker, _| {
            let (merged, report) = locker.merge(&incoming)?;
            *locker = merged;
            Ok(report)
        })
        .map_err(locker_error)?;
    let mut s = format!("Imported {} into {}:\n", shown_path(file), shown_path(path));
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

/// A locker change refused or not written, as the command's error.
pub(super) fn locker_error(e: LockerError) -> CliError {
    match e {
        LockerError::Input(e) => CliError::Input(e),
        LockerError::Write(e) => CliError::Write(e),
    }
}

/// A set of the locker as the command prints it: its size, or why it cannot be used.
pub(super) fn describe(e: &LockerEntry, i: usize) -> (Option<String>, Option<String>) {
    match e.set(&format!("entries[{i}]")) {
        Ok(set) => (Some(format_cylinder_spec(&set)), None),
        Err(err) => (None, Some(err.to_string())),
    }
}
