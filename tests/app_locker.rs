//! The app's locker and the command line's, changing the same file in turn: nothing is
//! lost. And the app's import: saved first, then moved; links never followed.

use std::path::Path;

use turnsheet::app::session::Session;
use turnsheet::cli::CliError;
use turnsheet::cli::locker_cmd::{LockerAction, MaterialArg, run};
use turnsheet::storage::Store;

fn cli(dir: &Path, action: LockerAction) -> Result<String, String> {
    let mut notes = Vec::new();
    run(&action, dir, &mut notes).map_err(|e| match e {
        CliError::Input(e) => e.to_string(),
        CliError::Write(e) => e,
        CliError::Unreadable(_) => "the locker could not be read".to_string(),
    })
}

fn cli_add(dir: &Path, name: &str, spec: &str) {
    cli(
        dir,
        LockerAction::Add {
            name: name.into(),
            spec: spec.into(),
            material: MaterialArg::Steel,
            note: String::new(),
            mine: false,
        },
    )
    .unwrap();
}

fn app_add(s: &mut Session, name: &str, litres: f64) {
    s.locker_new();
    s.locker.edit_draft(|d| {
        d.name = name.to_string();
        d.first = Some(litres);
        d.second = Some(232.0);
    });
    s.locker_save().unwrap();
}

fn names_on_disk(dir: &Path) -> Vec<String> {
    let l = Store::new(dir).load_locker().locker;
    let mut v: Vec<String> = l.entries.iter().map(|e| e.name.clone()).collect();
    v.sort();
    v
}

fn names_in(s: &Session) -> Vec<String> {
    let mut v: Vec<String> = s.locker.entries().iter().map(|e| e.name.clone()).collect();
    v.sort();
    v
}

#[test]
fn the_app_and_the_command_line_change_the_locker_in_turn_and_lose_nothing() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let mut app = Session::open(Store::new(dir));
    app.acknowledge_cautions();
    app_add(&mut app, "App one", 12.0);
    cli_add(dir, "Cli one", "2x7L@232bar");
    app_add(&mut app, "App two", 10.0);
    assert_eq!(names_on_disk(dir), ["App one", "App two", "Cli one"]);
    assert_eq!(
        names_in(&app),
        ["App one", "App two", "Cli one"],
        "the save re-read it"
    );

    // The command line removes a set the app still shows; the app's next save does not
    // bring it back, and saving everything on close loses nothing either.
    cli(
        dir,
        LockerAction::Remove {
            name: "App one".into(),
        },
    )
    .unwrap();
    cli_add(dir, "Cli two", "1x80cuft@3000psi");
    let id = app
        .locker
        .entries()
        .iter()
        .find(|e| e.name == "App two")
        .unwrap()
        .id;
    app.locker_make_mine(id);
    assert_eq!(names_on_disk(dir), ["App two", "Cli one", "Cli two"]);
    cli_add(dir, "Cli three", "2x12L@232bar");
    app.save_all();
    assert_eq!(
        names_on_disk(dir),
        ["App two", "Cli one", "Cli three", "Cli two"]
    );
    let l = Store::new(dir).load_locker().locker;
    assert_eq!(l.mine().map(|e| e.name.as_str()), Some("App two"));

    // Focus or resume re-reads what the command line did.
    cli_add(dir, "Cli four", "2x12L@232bar");
    assert!(app.reload_if_changed() || names_in(&app).contains(&"Cli four".to_string()));
    assert!(
        names_in(&app).contains(&"Cli four".to_string()),
        "{:?}",
        names_in(&app)
    );

    // The same set changed in both places: both kept, and the app says so.
    let edit_id = app
        .locker
        .entries()
        .iter()
        .find(|e| e.name == "Cli one")
        .unwrap()
        .id;
    cli(
        dir,
        LockerAction::Remove {
            name: "Cli one".into(),
        },
    )
    .unwrap();
    cli_add(dir, "Cli one", "2x8.5L@232bar");
    app.locker_edit(edit_id);
    app.locker.edit_draft(|d| d.note = "new valves".into());
    app.locker_save().unwrap();
    let on_disk = names_on_disk(dir);
    assert!(on_disk.contains(&"Cli one".to_string()), "{on_disk:?}");
    assert!(on_disk.contains(&"Cli one (2)".to_string()), "{on_disk:?}");
    assert!(on_disk.contains(&"App two".to_string()));
    assert_eq!(on_disk.len(), 6, "{on_disk:?}");
}

#[cfg(unix)]
#[test]
fn import_never_follows_a_link_and_moves_files_only_after_the_save() {
    let d = tempfile::tempdir().unwrap();
    let data = d.path().join("data");
    let mut app = Session::open(Store::new(&data));
    app.acknowledge_cautions();
    // An export from another diver, outside the data folder.
    let other = d.path().join("other");
    cli_add(&other, "Their twelves", "2x12L@232bar");
    let export = d.path().join("export.json");
    cli(
        &other,
        LockerAction::Export {
            file: export.clone(),
            force: false,
        },
    )
    .unwrap();

    app.locker_import();
    let import = app.exchange.import_dir.clone();
    // A link to a file outside the data folder: not read, not moved.
    std::os::unix::fs::symlink(&export, import.join("link.json")).unwrap();
    app.locker_import();
    assert!(
        app.exchange
            .message
            .contains("link.json is a symbolic link"),
        "{}",
        app.exchange.message
    );
    assert!(export.exists(), "the file outside stays where it is");
    assert!(app.locker.entries().is_empty());
    std::fs::remove_file(import.join("link.json")).unwrap();

    // A save that fails (a FIFO holds the locker's place): the file stays in import/.
    std::fs::copy(&export, import.join("theirs.json")).unwrap();
    let locker = data.join("locker.json");
    assert!(
        std::process::Command::new("mkfifo")
            .arg(&locker)
            .status()
            .unwrap()
            .success()
    );
    app.reload_if_changed();
    app.locker_import();
    assert!(
        app.exchange.message.contains("could not be saved"),
        "{}",
        app.exchange.message
    );
    assert!(import.join("theirs.json").exists(), "left where it was");
    assert!(!import.join("imported/theirs.json").exists());

    // The locker is usable again: the import is saved, then the file moved.
    std::fs::remove_file(&locker).unwrap();
    app.locker_import();
    assert!(
        import.join("imported/theirs.json").exists(),
        "{}",
        app.exchange.message
    );
    assert_eq!(names_on_disk(&data), ["Their twelves"]);

    // An imported/ folder that is a link out of the data folder is not used.
    std::fs::rename(import.join("imported"), d.path().join("moved")).unwrap();
    std::os::unix::fs::symlink(d.path(), import.join("imported")).unwrap();
    std::fs::copy(&export, import.join("again.json")).unwrap();
    app.locker_import();
    assert!(
        import.join("again.json").exists(),
        "{}",
        app.exchange.message
    );
    assert!(
        app.exchange.message.contains("symbolic link"),
        "{}",
        app.exchange.message
    );
}
