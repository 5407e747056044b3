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
/// that says so, the command says where, `list` prints the empty locker and exits 4 (the
/// locker could not be read this time), and `add` then works.
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
        assert_eq!(r.code, 4, "{what}: {}", r.err);
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

/// A locker of `n` sets, the last two sharing an id (so that reading it repairs it).
fn locker_with_repeated_id(n: usize) -> String {
    let set = r#""cylinders": {"count": 2, "water_l": 12, "working_bar": 232}"#;
    let entries: Vec<String> = (0..n)
        .map(|i| {
            let id = if i + 1 == n { i } else { i + 1 };
            format!(r#"{{"id": {id}, "name": "Set {i}", {set}}}"#)
        })
        .collect();
    format!(r#"{{"schema": 1, "entries": [{}]}}"#, entries.join(", "))
}

/// `list` repairs a locker with a repeated id while `add` runs: the repair is written
/// only under the lock, on the locker as it is then, so no add is lost. Each round
/// starts from the unrepaired file and runs eight `list`s and two `add`s at once (before
/// the fix, about half of the adds were lost this way, each reported as added).
#[test]
fn list_and_add_at_once_lose_no_add() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let rounds = 10;
    let mut lost = Vec::new();
    for round in 0..rounds {
        std::fs::write(dir.join("locker.json"), locker_with_repeated_id(60)).unwrap();
        let names = [format!("Round {round} a"), format!("Round {round} b")];
        let said = std::thread::scope(|scope| {
            let listers: Vec<_> = (0..8)
                .map(|_| scope.spawn(|| locker(dir, &["list"])))
                .collect();
            let adders: Vec<_> = names
                .iter()
                .map(|n| scope.spawn(move || locker(dir, &["add", n, "2x7L@232bar"])))
                .collect();
            let mut said = 0;
            for l in listers {
                let l = l.join().unwrap();
                assert_eq!(l.code, 0, "{}", l.err);
                said += usize::from(l.err.contains("numbered again"));
            }
            for a in adders {
                let a = a.join().unwrap();
                assert_eq!(a.code, 0, "{}", a.err);
                assert!(a.out.contains("Added"), "{}", a.out);
                said += usize::from(a.err.contains("numbered again"));
            }
            said
        });
        assert_eq!(said, 1, "round {round}: the repair is said once");
        let now = file_names(dir);
        lost.extend(names.iter().filter(|n| !now.contains(n)).cloned());
        assert!(now.len() >= 60, "round {round}: {now:?}");
    }
    assert!(lost.is_empty(), "adds lost: {lost:?}");
}

/// The names in the locker file itself (no command run).
fn file_names(dir: &Path) -> Vec<String> {
    let v: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(dir.join("locker.json")).unwrap()).unwrap();
    v["entries"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["name"].as_str().unwrap().to_string())
        .collect()
}

/// Listing a locker that needs nothing writes nothing (the file is not even replaced).
#[test]
fn a_list_that_repairs_nothing_writes_nothing() {
    let d = tempfile::tempdir().unwrap();
    let r = locker(d.path(), &["add", "Twin 12s", "2x12L@232bar"]);
    assert_eq!(r.code, 0, "{}", r.err);
    let file = d.path().join("locker.json");
    let before = std::fs::metadata(&file).unwrap();
    std::thread::sleep(std::time::Duration::from_millis(20));
    let r = locker(d.path(), &["list"]);
    assert_eq!((r.code, r.err.as_str()), (0, ""));
    let after = std::fs::metadata(&file).unwrap();
    assert_eq!(before.modified().unwrap(), after.modified().unwrap());
    #[cfg(unix)]
    {
        use std::os::unix::fs::MetadataExt;
        assert_eq!(before.ino(), after.ino(), "not replaced");
    }
}

/// Ids that are not whole numbers in range, and two sets marked mine: repaired and said
/// once, never a locker set aside.
#[test]
fn bad_ids_and_two_mine_sets_are_repaired_and_said_once() {
    let set = r#""cylinders": {"count": 2, "water_l": 12, "working_bar": 232}"#;
    for bad in ["18446744073709551616", "-1", "1.5", "\"7\""] {
        let d = tempfile::tempdir().unwrap();
        std::fs::write(
            d.path().join("locker.json"),
            format!(
                r#"{{"schema": 1, "entries": [{{"id": {bad}, "name": "A", {set}, "mine": true}}, {{"id": 9, "name": "B", {set}, "mine": true}}, {{"id": 4, "name": "C", {set}}}]}}"#
            ),
        )
        .unwrap();
        let r = locker(d.path(), &["list", "--json"]);
        assert_eq!(r.code, 0, "{bad}: {}", r.err);
        assert!(r.err.contains("numbered again"), "{bad}: {}", r.err);
        assert!(r.err.contains("2 sets marked as yours"), "{bad}: {}", r.err);
        assert_eq!(r.err.lines().count(), 2, "{bad}: {}", r.err);
        assert!(
            turnsheet::storage::atomic::kept_aside(d.path(), "locker.json").is_empty(),
            "{bad}: never set aside"
        );
        let v: serde_json::Value = serde_json::from_str(&r.out).unwrap();
        let mine: Vec<bool> = v["sets"]
            .as_array()
            .unwrap()
            .iter()
            .map(|s| s["mine"].as_bool().unwrap())
            .collect();
        assert_eq!(
            mine,
            [true, false, false],
            "{bad}: the lowest id stays mine"
        );
        let r = locker(d.path(), &["list"]);
        assert_eq!((r.code, r.err.as_str()), (0, ""), "{bad}: said once");
    }
}

/// A locker that cannot be read for a reason other than its content (here a symbolic
/// link loop: an I/O error even for root) is left where it is; `list` exits 4 and `add`
/// refuses to write a fresh locker over it.
#[cfg(unix)]
#[test]
fn a_locker_that_cannot_be_opened_is_left_alone_and_never_written() {
    let d = tempfile::tempdir().unwrap();
    let file = d.path().join("locker.json");
    std::os::unix::fs::symlink("locker.json", &file).unwrap();
    let r = locker(d.path(), &["list"]);
    assert_eq!(r.code, 4, "{}", r.err);
    assert!(r.err.contains("left untouched"), "{}", r.err);
    let r = locker(d.path(), &["add", "Twin 12s", "2x12L@232bar"]);
    assert_eq!(r.code, 3, "{}", r.err);
    assert!(r.err.contains("was not changed"), "{}", r.err);
    assert!(
        std::fs::symlink_metadata(&file)
            .unwrap()
            .file_type()
            .is_symlink(),
        "the link is still there"
    );
    assert!(turnsheet::storage::atomic::kept_aside(d.path(), "locker.json").is_empty());

    // A data directory that is a file is an error, not an empty locker.
    let not_a_dir = d.path().join("data");
    std::fs::write(&not_a_dir, "x").unwrap();
    let r = locker(&not_a_dir, &["list"]);
    assert_eq!(r.code, 4, "{}", r.err);
    assert!(r.err.contains("is a file, not a folder"), "{}", r.err);
    assert_eq!(std::fs::read_to_string(&not_a_dir).unwrap(), "x");
}

/// After a locker was set aside, every locker command says so until it is dealt with;
/// `export` never writes an unreadable or empty locker over a file.
#[test]
fn a_set_aside_locker_is_mentioned_and_export_keeps_a_good_backup() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    assert_eq!(locker(dir, &["add", "Twin 12s", "2x12L@232bar"]).code, 0);
    let backup = dir.join("backup.json");
    let r = locker(dir, &["export", backup.to_str().unwrap()]);
    assert_eq!(r.code, 0, "{}", r.err);
    let good = std::fs::read(&backup).unwrap();

    std::fs::write(dir.join("locker.json"), "garbage").unwrap();
    let r = locker(dir, &["export", "--force", backup.to_str().unwrap()]);
    assert_eq!(r.code, 4, "{}", r.err);
    assert!(r.err.contains("nothing was exported"), "{}", r.err);
    assert_eq!(std::fs::read(&backup).unwrap(), good, "the backup is kept");

    // The locker is empty now: an empty export never replaces a file, even with --force.
    let r = locker(dir, &["export", "--force", backup.to_str().unwrap()]);
    assert_eq!(r.code, 2, "{}", r.err);
    assert!(r.err.contains("the locker is empty"), "{}", r.err);
    assert_eq!(std::fs::read(&backup).unwrap(), good, "the backup is kept");

    // Every locker command mentions the file set aside, in one line.
    for args in [vec!["list"], vec!["add", "Pony", "1x3L@200bar"]] {
        let r = locker(dir, &args);
        assert_eq!(r.code, 0, "{args:?}: {}", r.err);
        assert_eq!(r.err.lines().count(), 1, "{args:?}: {}", r.err);
        assert!(
            r.err.contains("set aside as unreadable") && r.err.contains("locker.json.unreadable-"),
            "{args:?}: {}",
            r.err
        );
    }
}

/// A write keeps the old file's permissions, writes through a symbolic link (the link
/// stays), and removes temp files left by a killed writer.
#[cfg(unix)]
#[test]
fn writes_keep_the_mode_follow_the_link_and_clean_up() {
    use std::os::unix::fs::PermissionsExt;
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    assert_eq!(locker(dir, &["add", "A", "2x12L@232bar"]).code, 0);
    let file = dir.join("locker.json");
    std::fs::set_permissions(&file, std::fs::Permissions::from_mode(0o600)).unwrap();
    let stale = dir.join(".locker.json.999999-1-0.tmp");
    std::fs::write(&stale, "half a locker").unwrap();
    assert_eq!(locker(dir, &["add", "B", "2x12L@232bar"]).code, 0);
    let mode = std::fs::metadata(&file).unwrap().permissions().mode() & 0o777;
    assert_eq!(mode, 0o600, "the mode is kept");
    assert!(
        !stale.exists(),
        "a temp file older than the lock is removed"
    );

    // locker.json as a link into another folder: the target is written, the link kept.
    let elsewhere = dir.join("synced");
    std::fs::create_dir(&elsewhere).unwrap();
    let target = elsewhere.join("my-locker.json");
    std::fs::rename(&file, &target).unwrap();
    std::os::unix::fs::symlink(&target, &file).unwrap();
    let r = locker(dir, &["add", "C", "2x12L@232bar"]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(
        std::fs::symlink_metadata(&file)
            .unwrap()
            .file_type()
            .is_symlink()
    );
    let v: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(&target).unwrap()).unwrap();
    assert_eq!(
        v["entries"].as_array().unwrap().len(),
        3,
        "written through the link"
    );
    let mode = std::fs::metadata(&target).unwrap().permissions().mode() & 0o777;
    assert_eq!(mode, 0o600);
}
