//! The bad-file corpus (tests/data/, written by tests/data/make_corpus.py), plus files over
//! the size limit made here. Every file gives no panic and a clear one-line message. Files
//! the app owns (locker, settings, last team) are kept aside byte-identical; team files
//! the user owns are never touched.

use std::path::{Path, PathBuf};
use std::process::Command;

use turnsheet::app::session::Session;
use turnsheet::storage::Store;
use turnsheet::storage::atomic::kept_aside;
use turnsheet::storage::settings::Settings;
use turnsheet::storage::store::{LOCKER_FILE, SETTINGS_FILE, TEAM_FILE};

/// `turnsheet locker list --json` on a data folder holding `bytes` as its locker.
fn list_locker(bytes: &[u8]) -> (tempfile::TempDir, std::process::Output) {
    let dir = tempfile::tempdir().unwrap();
    std::fs::write(dir.path().join(LOCKER_FILE), bytes).unwrap();
    let out = Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .env("TURNSHEET_DATA_DIR", dir.path())
        .args(["locker", "list", "--json"])
        .output()
        .unwrap();
    (dir, out)
}

fn corpus(kind: &str) -> Vec<(String, Vec<u8>)> {
    let dir = PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("tests/data")
        .join(kind);
    let mut files: Vec<(String, Vec<u8>)> = std::fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .map(|p| {
            (
                p.file_name().unwrap().to_str().unwrap().to_string(),
                std::fs::read(&p).unwrap(),
            )
        })
        .collect();
    files.sort();
    files
}

/// Made here rather than kept in the repository: over the 1 MB limit.
fn oversized() -> Vec<u8> {
    let mut v = br#"{"schema": 1, "entries": [], "pad": ""#.to_vec();
    v.extend(std::iter::repeat_n(b'x', 1024 * 1024));
    v.extend(b"\"}");
    v
}

/// What each team file must say (besides naming a field or the file).
fn team_expectation(name: &str) -> &'static str {
    match name {
        "binary-garbage.json" => "byte 128 (line 2, column 118)",
        "latin1-name.json" => "not valid UTF-8",
        "count-overflow.json" => "divers[0].cylinders.count",
        "deep-nesting.json" => "divers[0][0]: invalid type: sequence",
        "duplicate-key.json" => "duplicate field",
        "huge-start.json" => "divers[0].start (Ines): 1e308 bar",
        "long-name.json" => "divers[0].name",
        "many-divers.json" => "divers: a team has 2 to 6 divers",
        "nan-literal.json" => "divers[0].start",
        "number-overflow.json" => "number out of range",
        "top-level-array.json" => "team file",
        "unknown-key.json" => "unknown field `colour`",
        "lone-surrogate.json" => "divers[0].name: unexpected end of hex escape",
        "empty.json" | "whitespace-only.json" | "truncated.json" => "EOF",
        other => panic!("add an expectation for tests/data/team/{other}"),
    }
}

fn run(args: &[&str], file: &Path, data_dir: &Path) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .env("TURNSHEET_DATA_DIR", data_dir)
        .args(args)
        .arg(file)
        .output()
        .unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn team_files_are_refused_with_a_clear_line_and_left_untouched() {
    let dir = tempfile::tempdir().unwrap();
    let mut files = corpus("team");
    assert!(files.len() >= 15);
    let mut big = serde_json::to_vec(&serde_json::json!({"units": "metric"})).unwrap();
    big.extend(std::iter::repeat_n(b' ', 1024 * 1024));
    files.push(("oversized.json".to_string(), big));
    for (name, bytes) in &files {
        let path = dir.path().join(name);
        std::fs::write(&path, bytes).unwrap();
        for cmd in [&["plan"][..], &["plan", "--json"], &["chart"]] {
            let t0 = std::time::Instant::now();
            let (code, out, err) = run(cmd, &path, dir.path());
            assert!(t0.elapsed().as_secs() < 5, "{name} is slow");
            assert_eq!(code, 2, "{name} {cmd:?}: {err}");
            assert!(out.is_empty(), "{name}: no plan on bad input");
            assert_eq!(err.lines().count(), 1, "{name}: {err}");
            assert!(err.starts_with("turnsheet: "), "{name}: {err}");
            assert!(!err.contains("panicked"), "{name}: {err}");
            let want = if name == "oversized.json" {
                "the limit is 1 MB"
            } else {
                team_expectation(name)
            };
            assert!(err.contains(want), "{name}: wanted '{want}' in: {err}");
            assert!(err.len() < 700, "{name}: a readable length: {err}");
            assert_eq!(&std::fs::read(&path).unwrap(), bytes, "{name}: untouched");
        }
    }
}

#[test]
fn locker_files_are_kept_aside_byte_identical_and_the_locker_starts_empty() {
    let mut files = corpus("locker");
    assert!(files.len() >= 14);
    files.push(("oversized.json".to_string(), oversized()));
    for (name, bytes) in &files {
        if name == "negative-id.json" {
            // An id that is not a whole number does not make the locker unreadable: the
            // sets are numbered again, said once, and the file stays where it is.
            let (dir, out) = list_locker(bytes);
            let err = String::from_utf8_lossy(&out.stderr);
            assert_eq!(out.status.code(), Some(0), "{name}: {err}");
            assert!(err.contains("numbered again"), "{name}: {err}");
            assert!(kept_aside(dir.path(), LOCKER_FILE).is_empty(), "{name}");
            let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
            assert_eq!(v["sets"].as_array().unwrap().len(), 1, "{name}");
            continue;
        }
        // Through the command line.
        let (dir, out) = list_locker(bytes);
        let err = String::from_utf8_lossy(&out.stderr);
        // The locker could not be read this time: the list (empty) is printed, and the
        // exit code says so.
        assert_eq!(out.status.code(), Some(4), "{name}: {err}");
        assert_eq!(err.lines().count(), 1, "{name}: {err}");
        assert!(
            err.contains("cylinder locker file could not be read"),
            "{name}: {err}"
        );
        let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
        assert_eq!(v["sets"].as_array().unwrap().len(), 0, "{name}");
        let kept = kept_aside(dir.path(), LOCKER_FILE);
        assert_eq!(kept.len(), 1, "{name}");
        assert!(
            err.contains(&*kept[0].to_string_lossy()),
            "{name}: says where: {err}"
        );
        assert_eq!(
            &std::fs::read(&kept[0]).unwrap(),
            bytes,
            "{name}: byte-identical"
        );

        // Through the app's store.
        let dir = tempfile::tempdir().unwrap();
        std::fs::write(dir.path().join(LOCKER_FILE), bytes).unwrap();
        let loaded = Store::new(dir.path()).load();
        assert!(loaded.locker.entries.is_empty(), "{name}");
        assert_eq!(loaded.report.messages.len(), 1, "{name}");
        let kept = kept_aside(dir.path(), LOCKER_FILE);
        assert_eq!(
            &std::fs::read(&kept[0]).unwrap(),
            bytes,
            "{name}: byte-identical"
        );
    }
}

/// Settings files with one field that is not usable (a wrong type, an unknown name, a value
/// out of range): that field, named in the message. Every other field of these files is kept.
fn settings_field_problem(name: &str) -> Option<&'static str> {
    match name {
        "unknown-units.json" => Some("units: \"furlongs\""),
        "unknown-key.json" => Some("colour: not a setting"),
        "wrong-type.json" => Some("water_temp_c: \"warm\""),
        "hot-water.json" => {
            Some("water_temp_c: 300.0 is not usable (allowed -2 to 40 °C); back to 20 °C")
        }
        "zero-step.json" => {
            Some("gauge_step_bar: 0 is not usable (allowed 1 to 50 bar); back to 10 bar")
        }
        "unknown-rule.json" => Some("rule: \"tenths\""),
        _ => None,
    }
}

#[test]
fn settings_files_are_kept_aside_byte_identical_and_the_app_opens() {
    let mut files = corpus("settings");
    assert!(files.len() >= 13);
    files.push(("oversized.json".to_string(), oversized()));
    for (name, bytes) in &files {
        let dir = tempfile::tempdir().unwrap();
        std::fs::write(dir.path().join(SETTINGS_FILE), bytes).unwrap();
        let session = Session::open(Store::new(dir.path()));
        let said = session.status.text();
        let kept = kept_aside(dir.path(), SETTINGS_FILE);
        assert_eq!(kept.len(), 1, "{name}");
        assert!(said.contains(&*kept[0].to_string_lossy()), "{name}: {said}");
        assert_eq!(
            &std::fs::read(&kept[0]).unwrap(),
            bytes,
            "{name}: byte-identical"
        );
        assert_eq!(said.lines().count(), 1, "{name}: {said}");
        match settings_field_problem(name) {
            None => {
                assert!(
                    said.contains("settings file could not be read"),
                    "{name}: {said}"
                );
                assert!(!dir.path().join(SETTINGS_FILE).exists(), "{name}");
            }
            Some(field) => {
                assert!(said.contains(field), "{name}: wanted '{field}' in: {said}");
                assert!(said.contains("The other settings were kept"), "{name}");
                // The good fields are kept, and saved again at once.
                let found: serde_json::Value = serde_json::from_slice(bytes).unwrap();
                let saved: serde_json::Value =
                    serde_json::from_slice(&std::fs::read(dir.path().join(SETTINGS_FILE)).unwrap())
                        .unwrap();
                let defaults = serde_json::to_value(Settings::default()).unwrap();
                for (key, value) in saved.as_object().unwrap() {
                    // A field the file did not have (written before it existed)
                    // takes its default.
                    let want = if field.starts_with(&format!("{key}:")) {
                        &defaults[key]
                    } else {
                        found.get(key).unwrap_or(&defaults[key])
                    };
                    assert_eq!(
                        value.as_f64().map_or(value.clone(), |x| x.into()),
                        want.as_f64().map_or(want.clone(), |x| x.into()),
                        "{name}: {key}"
                    );
                }
            }
        }
    }
}

/// The team corpus as the app's saved last team: every one is kept aside byte-identical,
/// whether it fails to read or reads but does not plan, and the demo team opens instead.
#[test]
fn last_team_files_are_kept_aside_byte_identical_and_the_app_opens() {
    let mut files = corpus("team");
    files.push(("oversized.json".to_string(), oversized()));
    for (name, team) in &files {
        let mut bytes = br#"{"schema": 1, "team": "#.to_vec();
        bytes.extend(team);
        bytes.extend(b"}");
        let dir = tempfile::tempdir().unwrap();
        std::fs::write(dir.path().join(TEAM_FILE), &bytes).unwrap();
        let session = Session::open(Store::new(dir.path()));
        let said = session.status.text();
        assert!(said.contains("last team"), "{name}: {said}");
        let kept = kept_aside(dir.path(), TEAM_FILE);
        assert_eq!(kept.len(), 1, "{name}: {said}");
        assert_eq!(
            std::fs::read(&kept[0]).unwrap(),
            bytes,
            "{name}: byte-identical"
        );
        assert!(
            session.team.plan().divers.len() >= 2,
            "{name}: a team is shown"
        );
    }
}
