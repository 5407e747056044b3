//! `turnsheet locker ...` against a throwaway data directory: list, add, remove, export,
//! import between two divers, and unreadable lockers kept aside byte-identical.

use std::path::Path;
use std::process::Command;

struct Run {
    code: i32,
    out: String,
    err: String,
}

fn locker(dir: &Path, args: &[&str]) -> Run {
    let out = Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .env("TURNSHEET_DATA_DIR", dir)
        .arg("locker")
        .args(args)
        .output()
        .unwrap();
    let r = Run {
        code: out.status.code().unwrap_or(-1),
        out: String::from_utf8_lossy(&out.stdout).into_owned(),
        err: String::from_utf8_lossy(&out.stderr).into_owned(),
    };
    assert!(!r.err.contains("panicked"), "{}", r.err);
    r
}

fn list_json(dir: &Path) -> serde_json::Value {
    let r = locker(dir, &["list", "--json"]);
    assert_eq!(r.code, 0, "{}", r.err);
    serde_json::from_str(&r.out).unwrap()
}

fn names(dir: &Path) -> Vec<String> {
    list_json(dir)["sets"]
        .as_array()
        .unwrap()
        .iter()
        .map(|s| s["name"].as_str().unwrap().to_string())
        .collect()
}

#[test]
fn add_list_remove() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let r = locker(dir, &["list"]);
    assert_eq!(r.code, 0);
    assert!(r.out.contains("The locker is empty"), "{}", r.out);
    assert!(!dir.join("locker.json").exists(), "listing writes nothing");

    let r = locker(dir, &["add", "Twin 12s", "2x12L@232bar"]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(
        r.out.contains("Added 'Twin 12s' (2x12L@232bar)"),
        "{}",
        r.out
    );
    assert!(
        !r.out.contains("mine"),
        "the first set is not made mine without asking: {}",
        r.out
    );
    let r = locker(
        dir,
        &[
            "add",
            "Side 80s",
            "2x80cuft@3000psi",
            "--material",
            "aluminium",
            "--note",
            "blue bands",
            "--mine",
        ],
    );
    assert_eq!(r.code, 0, "{}", r.err);
    let v = list_json(dir);
    let sets = v["sets"].as_array().unwrap();
    assert_eq!(sets.len(), 2);
    assert_eq!(sets[0]["spec"], "2x12L@232bar");
    assert_eq!(sets[0]["mine"], false);
    assert_eq!(sets[1]["spec"], "2x80cuft@3000psi");
    assert_eq!(sets[1]["material"], "aluminium");
    assert_eq!(sets[1]["note"], "blue bands");
    assert_eq!(sets[1]["mine"], true, "asked for with --mine");
    assert!(v["file"].as_str().unwrap().ends_with("locker.json"));
    let text = locker(dir, &["list"]).out;
    assert!(text.contains("2 sets in"), "{text}");
    assert!(text.contains("* Side 80s"), "{text}");

    // The same name again (any case) is refused; so is a bad SPEC, showing the form.
    let r = locker(dir, &["add", "twin 12S", "2x10L@300bar"]);
    assert_eq!(r.code, 2);
    assert!(
        r.err.contains("NAME") && r.err.contains("already"),
        "{}",
        r.err
    );
    let r = locker(dir, &["add", "Odd", "2x12@232"]);
    assert_eq!(r.code, 2);
    assert!(
        r.err.contains("SPEC") && r.err.contains("COUNTxSIZE@RATING"),
        "{}",
        r.err
    );
    let r = locker(dir, &["add", "Big", "2x45L@232bar"]);
    assert_eq!(r.code, 2);
    assert!(r.err.contains("SPEC.water_l"), "{}", r.err);
    let long = "n".repeat(41);
    let r = locker(dir, &["add", &long, "2x12L@232bar"]);
    assert_eq!(r.code, 2);
    assert!(
        r.err.contains("NAME: a name of 1 to 40 characters"),
        "{}",
        r.err
    );
    let r = locker(
        dir,
        &["add", "Noted", "1x7L@232bar", "--note", &"x".repeat(61)],
    );
    assert_eq!(r.code, 2);
    assert!(r.err.contains("--note"), "{}", r.err);
    assert_eq!(names(dir).len(), 2, "refused adds change nothing");

    let r = locker(dir, &["remove", "nobody"]);
    assert_eq!(r.code, 2);
    assert!(r.err.contains("Twin 12s, Side 80s"), "{}", r.err);
    let r = locker(dir, &["remove", "SIDE 80s"]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(r.out.contains("No set is marked as yours"), "{}", r.out);
    assert_eq!(names(dir), vec!["Twin 12s"]);
}

#[test]
fn export_then_import_between_two_divers() {
    let a = tempfile::tempdir().unwrap();
    let b = tempfile::tempdir().unwrap();
    for (name, spec) in [
        ("Twin 12s", "2x12L@232bar"),
        ("Deco 7", "1x7L@232bar"),
        ("Stage 80", "1x80cuft@3000psi"),
    ] {
        assert_eq!(locker(a.path(), &["add", name, spec]).code, 0);
    }
    assert_eq!(
        locker(b.path(), &["add", "Twin 12s", "2x12L@232bar", "--mine"]).code,
        0
    );
    assert_eq!(
        locker(b.path(), &["add", "Deco 7", "1x5.5L@232bar"]).code,
        0
    );
    let swap = tempfile::tempdir().unwrap();
    let file = swap.path().join("a-sets.json");
    let f = file.to_str().unwrap();
    let r = locker(a.path(), &["export", f]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(r.out.contains("Exported 3 sets"), "{}", r.out);
    // Never overwrite a file without being asked.
    let before = std::fs::read(&file).unwrap();
    let r = locker(a.path(), &["export", f]);
    assert_eq!(r.code, 2);
    assert!(
        r.err.contains("already exists") && r.err.contains("--force"),
        "{}",
        r.err
    );
    assert_eq!(std::fs::read(&file).unwrap(), before);
    assert_eq!(locker(a.path(), &["export", f, "--force"]).code, 0);

    let b_before = std::fs::read(b.path().join("locker.json")).unwrap();
    let r = locker(b.path(), &["import", f]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(
        r.out.contains("added    'Stage 80' (1x80cuft@3000psi)"),
        "{}",
        r.out
    );
    assert!(
        r.out.contains("renamed  'Deco 7' -> 'Deco 7 (2)'"),
        "{}",
        r.out
    );
    assert!(
        r.out
            .contains("skipped  'Twin 12s': the same set is already"),
        "{}",
        r.out
    );
    assert!(
        r.out.contains("2 added (1 of them renamed), 1 skipped"),
        "{}",
        r.out
    );
    assert_eq!(
        names(b.path()),
        vec!["Twin 12s", "Deco 7", "Deco 7 (2)", "Stage 80"]
    );
    let v = list_json(b.path());
    let mine: Vec<&str> = v["sets"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|s| s["mine"] == true)
        .map(|s| s["name"].as_str().unwrap())
        .collect();
    assert_eq!(
        mine,
        vec!["Twin 12s"],
        "importing never changes which set is mine"
    );
    assert_ne!(
        std::fs::read(b.path().join("locker.json")).unwrap(),
        b_before
    );

    // The same file again adds nothing and leaves the locker file as it was.
    let after = std::fs::read(b.path().join("locker.json")).unwrap();
    let r = locker(b.path(), &["import", f]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(
        r.out.contains("0 added") && r.out.contains("Nothing new"),
        "{}",
        r.out
    );
    assert_eq!(std::fs::read(b.path().join("locker.json")).unwrap(), after);
}

#[test]
fn bad_import_files_are_refused_and_change_nothing() {
    let d = tempfile::tempdir().unwrap();
    assert_eq!(
        locker(d.path(), &["add", "Twin 12s", "2x12L@232bar"]).code,
        0
    );
    let before = std::fs::read(d.path().join("locker.json")).unwrap();
    let src = tempfile::tempdir().unwrap();
    let nested = format!("{}{}", "[".repeat(200_000), "]".repeat(200_000));
    let many: Vec<serde_json::Value> = (0..=turnsheet::storage::locker::MAX_LOCKER_SETS)
        .map(|i| {
            serde_json::json!({"id": i, "name": format!("S{i}"),
                "cylinders": {"count": 1, "water_l": 12, "working_bar": 232}})
        })
        .collect();
    let cases: Vec<(&str, Vec<u8>, &str)> = vec![
        ("missing", Vec::new(), "no such file"),
        ("empty", b"".to_vec(), "not a locker file"),
        ("garbage", b"\x00\x01garbage".to_vec(), "not a locker file"),
        (
            "latin1",
            b"{\"schema\": 1, \"entries\": [\"caf\xe9\"]}".to_vec(),
            "byte 30",
        ),
        ("nested", nested.into_bytes(), "recursion limit"),
        ("huge", vec![b' '; 1024 * 1024 + 10], "the limit is 1 MB"),
        (
            "future",
            br#"{"schema": 7, "entries": []}"#.to_vec(),
            "newer version",
        ),
        (
            "shape",
            br#"{"schema": 1, "entries": [{"id": 1, "name": 5}]}"#.to_vec(),
            "entries[0].name",
        ),
        (
            "many",
            serde_json::to_vec(&serde_json::json!({"schema": 1, "entries": many})).unwrap(),
            "at most 500",
        ),
    ];
    for (name, bytes, why) in cases {
        let f = src.path().join(format!("{name}.json"));
        if name != "missing" {
            std::fs::write(&f, &bytes).unwrap();
        }
        let t0 = std::time::Instant::now();
        let r = locker(d.path(), &["import", f.to_str().unwrap()]);
        assert!(
            t0.elapsed() < std::time::Duration::from_secs(5),
            "{name} is slow"
        );
        assert_eq!(r.code, 2, "{name}: {}", r.err);
        assert!(r.err.contains(why), "{name}: {}", r.err);
        assert_eq!(r.err.lines().count(), 1, "{name}: {}", r.err);
        assert!(r.out.is_empty());
        assert_eq!(
            std::fs::read(d.path().join("locker.json")).unwrap(),
            before,
            "{name}"
        );
        if name != "missing" {
            assert_eq!(
                std::fs::read(&f).unwrap(),
                bytes,
                "the import file is not touched"
            );
        }
    }
}

/// Unreadable lockers in the data directory: moved aside byte-identical under a name
/// that says so, the command says where, `list` exits 0 and `add` then works.
#[test]
fn an_unreadable_locker_is_kept_aside_and_the_command_carries_on() {
    let long_name = format!(
        r#"{{"schema": 1, "entries": [{{"id": 1, "name": "{}", "cylinders": {{"count": 1, "water_l": 12, "working_bar": 232}}}}]}}"#,
        "n".repeat(500_000)
    );
    let cases: Vec<(&str, Vec<u8>)> = vec![
        ("empty", Vec::new()),
        ("garbage", b"\x7fELF garbage".to_vec()),
        (
            "truncated",
            br#"{"schema": 1, "entries": [{"id": 1, "na"#.to_vec(),
        ),
        (
            "not utf-8",
            b"{\"schema\": 1, \"entries\": [], \"x\": \"\xc0\"}".to_vec(),
        ),
        ("over the limit", vec![b'\n'; 1024 * 1024 + 1]),
        (
            "future schema",
            br#"{"schema": 99, "entries": []}"#.to_vec(),
        ),
        ("huge name", long_name.into_bytes()),
    ];
    for (what, bytes) in cases {
        let d = tempfile::tempdir().unwrap();
        let file = d.path().join("locker.json");
        std::fs::write(&file, &bytes).unwrap();
        let r = locker(d.path(), &["list"]);
        assert_eq!(r.code, 0, "{what}: {}", r.err);
        assert!(r.out.contains("The locker is empty"), "{what}: {}", r.out);
        let kept = turnsheet::storage::atomic::kept_aside(d.path(), "locker.json");
        assert_eq!(kept.len(), 1, "{what}");
        let kept_name = kept[0].file_name().unwrap().to_str().unwrap().to_string();
        assert!(
            kept_name.starts_with("locker.json.unreadable-"),
            "{kept_name}"
        );
        assert!(r.err.contains(&kept_name), "{what}: says where: {}", r.err);
        assert_eq!(r.err.lines().count(), 1, "{what}: {}", r.err);
        assert_eq!(
            std::fs::read(&kept[0]).unwrap(),
            bytes,
            "{what}: byte-identical"
        );
        assert!(!file.exists());

        let r = locker(d.path(), &["add", "Twin 12s", "2x12L@232bar"]);
        assert_eq!(r.code, 0, "{what}: {}", r.err);
        assert_eq!(names(d.path()), vec!["Twin 12s"]);
        assert_eq!(
            std::fs::read(&kept[0]).unwrap(),
            bytes,
            "{what}: still kept"
        );
    }
}

#[test]
fn a_locker_that_cannot_be_saved_exits_3_and_says_why() {
    let d = tempfile::tempdir().unwrap();
    // The data directory is a file: nothing can be saved in it.
    let not_a_dir = d.path().join("data");
    std::fs::write(&not_a_dir, "x").unwrap();
    let r = locker(&not_a_dir, &["add", "Twin 12s", "2x12L@232bar"]);
    assert_eq!(r.code, 3, "{}", r.err);
    assert!(r.err.contains("could not save locker.json"), "{}", r.err);
    assert_eq!(r.err.lines().count(), 1);
}
