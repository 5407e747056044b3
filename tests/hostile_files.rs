//! Two writers, full disks, odd files and odd names, through the real binary: nothing
//! the user saved is lost, nothing hangs, nothing hostile reaches the screen or the card.

use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};

struct Run {
    code: i32,
    out: String,
    err: String,
}

fn turnsheet(dir: &Path, args: &[&str]) -> Run {
    let out = Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .env("TURNSHEET_DATA_DIR", dir)
        .args(args)
        .stdin(Stdio::null())
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

/// Run with a deadline: a hang fails the test instead of stopping the suite.
fn turnsheet_within(dir: &Path, args: &[&str], limit: Duration) -> Run {
    let mut child = Command::new(env!("CARGO_BIN_EXE_turnsheet"))
        .env("TURNSHEET_DATA_DIR", dir)
        .args(args)
        .stdin(Stdio::null())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    let start = Instant::now();
    while child.try_wait().unwrap().is_none() {
        if start.elapsed() > limit {
            let _ = child.kill();
            let _ = child.wait();
            panic!("turnsheet {args:?} still running after {limit:?}");
        }
        std::thread::sleep(Duration::from_millis(10));
    }
    let out = child.wait_with_output().unwrap();
    Run {
        code: out.status.code().unwrap_or(-1),
        out: String::from_utf8_lossy(&out.stdout).into_owned(),
        err: String::from_utf8_lossy(&out.stderr).into_owned(),
    }
}

fn demo() -> String {
    std::fs::read_to_string(concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/examples/hollowmere-team.json"
    ))
    .unwrap()
}

fn mkfifo(p: &Path) {
    let st = Command::new("mkfifo").arg(p).status().unwrap();
    assert!(st.success());
}

fn locker_names(dir: &Path) -> Vec<String> {
    let text = std::fs::read_to_string(dir.join("locker.json")).unwrap();
    let v: serde_json::Value = serde_json::from_str(&text).unwrap();
    v["entries"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["name"].as_str().unwrap().to_string())
        .collect()
}

/// 8 processes × 50 `locker add` at once: 400 adds, all kept (the locker holds 500 sets).
/// Every add that says it succeeded is in the file, every other one said the locker is
/// full, and no set is lost or doubled.
#[test]
fn eight_writers_at_once_keep_every_set() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path().to_path_buf();
    let t0 = Instant::now();
    let mut accepted: Vec<String> = Vec::new();
    std::thread::scope(|scope| {
        let writers: Vec<_> = (0..8)
            .map(|w| {
                let dir = dir.clone();
                scope.spawn(move || {
                    let mut ok = Vec::new();
                    for i in 0..50 {
                        let name = format!("W{w} set {i}");
                        let r = turnsheet(&dir, &["locker", "add", &name, "2x12L@232bar"]);
                        match r.code {
                            0 => ok.push(name),
                            _ => assert!(r.err.contains("the locker is full"), "{}", r.err),
                        }
                    }
                    ok
                })
            })
            .collect();
        for w in writers {
            accepted.extend(w.join().unwrap());
        }
    });
    let mut names = locker_names(&dir);
    eprintln!(
        "8 concurrent writers × 50 adds: {} sets kept of {} accepted in {:.1} s",
        names.len(),
        accepted.len(),
        t0.elapsed().as_secs_f64()
    );
    assert_eq!(accepted.len(), 400, "every add was accepted");
    names.sort();
    accepted.sort();
    assert_eq!(names, accepted, "every accepted set is kept, once");
    let text = std::fs::read_to_string(dir.join("locker.json")).unwrap();
    let v: serde_json::Value = serde_json::from_str(&text).unwrap();
    let mut ids: Vec<u64> = v["entries"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["id"].as_u64().unwrap())
        .collect();
    ids.sort();
    ids.dedup();
    assert_eq!(ids.len(), 400, "every set has its own id");
}

/// 8 processes × 25 adds and 25 removes of their own sets at once: 400 changes, none lost.
#[test]
fn eight_writers_adding_and_removing_lose_no_change() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path().to_path_buf();
    std::thread::scope(|scope| {
        for w in 0..8 {
            let dir = dir.clone();
            scope.spawn(move || {
                for i in 0..25 {
                    let r = turnsheet(
                        &dir,
                        &["locker", "add", &format!("W{w} {i}"), "2x7L@232bar"],
                    );
                    assert_eq!(r.code, 0, "{}", r.err);
                    if i % 2 == 1 {
                        let r = turnsheet(&dir, &["locker", "remove", &format!("W{w} {}", i - 1)]);
                        assert_eq!(r.code, 0, "{}", r.err);
                    }
                }
            });
        }
    });
    let mut names = locker_names(&dir);
    names.sort();
    let mut expected: Vec<String> = (0..8)
        .flat_map(|w| {
            (0..25)
                .filter(|i| i % 2 == 1 || *i == 24)
                .map(move |i| format!("W{w} {i}"))
        })
        .collect();
    expected.sort();
    assert_eq!(names, expected);
}

#[test]
fn fifos_devices_and_folders_are_refused_at_once() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    mkfifo(&dir.join("locker.json"));
    let quick = Duration::from_secs(10);
    for args in [
        vec!["locker", "list"],
        vec!["locker", "add", "Twelves", "2x12L@232bar"],
        vec!["chart", "--mine", "Twelves", "--buddy", "2x12L@232bar"],
    ] {
        let r = turnsheet_within(dir, &args, quick);
        assert!(r.err.contains("FIFO"), "{args:?}: {}", r.err);
        assert!(r.err.contains("locker.json"), "{args:?}: {}", r.err);
    }
    let r = turnsheet_within(dir, &["locker", "add", "Twelves", "2x12L@232bar"], quick);
    assert_ne!(r.code, 0, "nothing is saved over a FIFO: {}", r.out);
    let fifo_type = std::fs::symlink_metadata(dir.join("locker.json")).unwrap();
    assert!(!fifo_type.is_file(), "the FIFO is left where it is");

    let team_fifo = dir.join("team.json");
    mkfifo(&team_fifo);
    for (path, kind) in [
        (team_fifo.clone(), "FIFO"),
        (PathBuf::from("/dev/zero"), "device"),
        (dir.to_path_buf(), "folder"),
    ] {
        for cmd in ["plan", "card", "chart"] {
            let r = turnsheet_within(dir, &[cmd, path.to_str().unwrap()], quick);
            assert_eq!(r.code, 2, "{cmd} {path:?}");
            assert!(
                r.err.contains(kind) && r.err.contains("not a regular file"),
                "{cmd} {path:?}: {}",
                r.err
            );
        }
    }
    let r = turnsheet_within(
        dir,
        &["locker", "import", team_fifo.to_str().unwrap()],
        quick,
    );
    assert_eq!(r.code, 2);
    assert!(r.err.contains("FIFO"), "{}", r.err);
}

#[test]
fn the_size_cap_is_checked_before_reading_and_the_largest_team_plans_quickly() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    const CAP: usize = 1024 * 1024;
    // The largest team the limits accept (six divers, each with a stage), padded with
    // white space to exactly the cap: read and planned.
    let mut team: serde_json::Value = serde_json::from_str(&demo()).unwrap();
    let divers = team["divers"].as_array().unwrap().clone();
    let mut six = Vec::new();
    for i in 0..6 {
        let mut x = divers[i % divers.len()].clone();
        x["name"] = serde_json::json!(format!("Diver {i}"));
        if x.get("stage").is_none() {
            x["stage"] = divers.iter().find_map(|d| d.get("stage").cloned()).unwrap();
        }
        six.push(x);
    }
    team["divers"] = serde_json::Value::Array(six);
    let mut text = serde_json::to_string_pretty(&team).unwrap();
    text.push_str(&" ".repeat(CAP - text.len()));
    let largest = dir.join("largest.json");
    std::fs::write(&largest, &text).unwrap();
    let t0 = Instant::now();
    let r = turnsheet(dir, &["plan", largest.to_str().unwrap()]);
    let took = t0.elapsed();
    assert_eq!(r.code, 0, "{}", r.err);
    eprintln!(
        "largest file read: {} bytes (6 divers, 6 stages); plan took {:.0} ms (process included)",
        text.len(),
        took.as_secs_f64() * 1e3
    );
    text.push(' ');
    std::fs::write(&largest, &text).unwrap();
    let r = turnsheet(dir, &["plan", largest.to_str().unwrap()]);
    assert_eq!(r.code, 2);
    assert!(r.err.contains("the limit is 1 MB"), "{}", r.err);
    eprintln!("refused: {} bytes: {}", text.len(), r.err.trim());
    // The locker and an import file: the same cap.
    std::fs::write(dir.join("import.json"), &text).unwrap();
    let r = turnsheet(
        dir,
        &[
            "locker",
            "import",
            dir.join("import.json").to_str().unwrap(),
        ],
    );
    assert_eq!(r.code, 2);
    assert!(r.err.contains("the limit is 1 MB"), "{}", r.err);
    std::fs::write(dir.join("locker.json"), &text).unwrap();
    let r = turnsheet(dir, &["locker", "list"]);
    assert!(r.err.contains("the limit is 1 MB"), "{}", r.err);
    assert!(
        r.err.contains("locker.json.unreadable-"),
        "says where: {}",
        r.err
    );
}

#[test]
fn text_after_the_team_document_is_refused_with_its_place() {
    let d = tempfile::tempdir().unwrap();
    let team = d.path().join("t.json");
    let text = demo();
    let lines = text.trim_end().lines().count();
    std::fs::write(
        &team,
        format!("{}\n {{\"junk\":1}} garbage", text.trim_end()),
    )
    .unwrap();
    let r = turnsheet(d.path(), &["plan", team.to_str().unwrap()]);
    assert_eq!(r.code, 2, "{}", r.out);
    assert!(
        r.err.contains(&format!(
            "text after the team's JSON document, at line {} column 2",
            lines + 1
        )),
        "{}",
        r.err
    );
    std::fs::write(&team, format!("{}\n\n  \n", text.trim_end())).unwrap();
    assert_eq!(
        turnsheet(d.path(), &["plan", team.to_str().unwrap()]).code,
        0
    );
}

/// `card -o` over a good card, with the file size limit hit: the old card is untouched.
#[cfg(unix)]
#[test]
fn a_card_write_that_fails_leaves_the_old_card() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let team = dir.join("team.json");
    std::fs::write(&team, demo()).unwrap();
    let out = dir.join("card.svg");
    let r = turnsheet(
        dir,
        &[
            "card",
            team.to_str().unwrap(),
            "--charts",
            "-o",
            out.to_str().unwrap(),
        ],
    );
    assert_eq!(r.code, 0, "{}", r.err);
    let good = std::fs::read(&out).unwrap();
    assert!(good.len() > 4096);
    let bin = env!("CARGO_BIN_EXE_turnsheet");
    // With SIGXFSZ ignored the write fails with an error; with it, the process is killed.
    for (trap, expect_message) in [("trap '' XFSZ;", true), ("", false)] {
        let script = format!("{trap} ulimit -f 2; exec \"$0\" card \"$1\" --charts -o \"$2\"");
        let o = Command::new("sh")
            .args([
                "-c",
                &script,
                bin,
                team.to_str().unwrap(),
                out.to_str().unwrap(),
            ])
            .env("TURNSHEET_DATA_DIR", dir)
            .output()
            .unwrap();
        assert!(!o.status.success());
        let err = String::from_utf8_lossy(&o.stderr);
        if expect_message {
            assert_eq!(o.status.code(), Some(3), "{err}");
            assert!(err.contains("is unchanged"), "{err}");
            assert!(!err.contains("panicked"), "{err}");
        }
        assert_eq!(
            std::fs::read(&out).unwrap(),
            good,
            "the old card is untouched"
        );
    }
    // The chart's output and an export go the same way: a folder in the way is refused.
    std::fs::create_dir(dir.join("in-the-way.svg")).unwrap();
    let r = turnsheet(
        dir,
        &[
            "chart",
            "--mine",
            "2x12L@232bar",
            "--buddy",
            "2x7L@300bar",
            "--format",
            "svg",
            "-o",
            dir.join("in-the-way.svg").to_str().unwrap(),
        ],
    );
    assert_eq!(r.code, 3, "{}", r.err);
    assert!(r.err.contains("not a regular file"), "{}", r.err);
}

#[test]
fn hostile_names_are_refused_naming_the_field() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let team = dir.join("t.json");
    for (bad, code) in [
        ("\u{1b}[2J\u{1b}[31mX", "U+001B"),
        ("Ann\u{ffff}", "U+FFFF"),
        ("Bo\u{202e}b", "U+202E"),
        ("Cy\u{2067}", "U+2067"),
    ] {
        let mut v: serde_json::Value = serde_json::from_str(&demo()).unwrap();
        v["divers"][1]["name"] = serde_json::json!(bad);
        std::fs::write(&team, v.to_string()).unwrap();
        for cmd in ["plan", "card", "chart"] {
            let r = turnsheet(dir, &[cmd, team.to_str().unwrap()]);
            assert_eq!(r.code, 2, "{cmd} {bad:?}");
            assert!(
                r.err.contains("divers[1].name") && r.err.contains(code),
                "{cmd}: {}",
                r.err
            );
            assert!(!r.err.contains(bad) && !r.out.contains(bad));
        }
        let r = turnsheet(dir, &["locker", "add", bad, "2x12L@232bar"]);
        assert_eq!(r.code, 2);
        assert!(r.err.contains("NAME") && r.err.contains(code), "{}", r.err);
        let r = turnsheet(
            dir,
            &["locker", "add", "Fine", "2x12L@232bar", "--note", bad],
        );
        assert_eq!(r.code, 2);
        assert!(
            r.err.contains("--note") && r.err.contains(code),
            "{}",
            r.err
        );
        let r = turnsheet(dir, &["card", team.to_str().unwrap(), "--dive", bad]);
        assert_eq!(r.code, 2);
    }
    // Two names that look the same are the same.
    assert_eq!(
        turnsheet(dir, &["locker", "add", "Jos\u{e9}", "2x12L@232bar"]).code,
        0
    );
    let r = turnsheet(dir, &["locker", "add", "Jose\u{301}", "2x7L@232bar"]);
    assert_eq!(r.code, 2, "{}", r.out);
    assert!(r.err.contains("already in the locker"), "{}", r.err);
}

#[test]
fn a_locker_set_aside_by_chart_is_said_and_repeated_ids_are_renumbered_once() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    std::fs::write(dir.join("locker.json"), "{broken").unwrap();
    let r = turnsheet(
        dir,
        &["chart", "--mine", "Twelves", "--buddy", "2x12L@232bar"],
    );
    assert_eq!(r.code, 2);
    assert!(
        r.err.contains("locker.json.unreadable-"),
        "says where: {}",
        r.err
    );
    let kept = turnsheet::storage::atomic::kept_aside(dir, "locker.json");
    assert_eq!(std::fs::read_to_string(&kept[0]).unwrap(), "{broken");

    let set = r#"{"count": 2, "water_l": 12.0, "working_bar": 232.0}"#;
    std::fs::write(
        dir.join("locker.json"),
        format!(
            r#"{{"schema": 1, "entries": [
            {{"id": 18446744073709551615, "name": "A", "cylinders": {set}, "mine": true}},
            {{"id": 18446744073709551615, "name": "B", "cylinders": {set}}}]}}"#
        ),
    )
    .unwrap();
    let r = turnsheet(dir, &["locker", "add", "C", "2x12L@232bar"]);
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(r.err.contains("numbered again"), "{}", r.err);
    let r = turnsheet(dir, &["locker", "add", "D", "2x12L@232bar"]);
    assert!(!r.err.contains("numbered again"), "said once: {}", r.err);
    let v: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(dir.join("locker.json")).unwrap()).unwrap();
    let ids: Vec<u64> = v["entries"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["id"].as_u64().unwrap())
        .collect();
    assert_eq!(ids, [1, 2, 3, 4]);
    let mine: Vec<bool> = v["entries"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["mine"].as_bool().unwrap())
        .collect();
    assert_eq!(
        mine,
        [true, false, false, false],
        "one set is mine, as before"
    );
}

#[test]
fn chart_needs_two_divers() {
    let d = tempfile::tempdir().unwrap();
    let team = d.path().join("t.json");
    for n in [0, 1] {
        let mut v: serde_json::Value = serde_json::from_str(&demo()).unwrap();
        let divers: Vec<_> = v["divers"]
            .as_array()
            .unwrap()
            .iter()
            .take(n)
            .cloned()
            .collect();
        v["divers"] = serde_json::Value::Array(divers);
        std::fs::write(&team, v.to_string()).unwrap();
        let r = turnsheet(d.path(), &["chart", team.to_str().unwrap()]);
        assert_eq!(r.code, 2, "{n} divers: {}", r.out);
        assert!(
            r.err
                .contains(&format!("a team has 2 to 6 divers; this one has {n}")),
            "{}",
            r.err
        );
    }
}

/// Characters that draw nothing or something private are refused in every name, and a
/// name must show something: "Bram" and "Bra<zero-width space>m" were two rows both
/// reading "Bram". Names compare case-blind, so "Bram" and "bram" are one name.
#[test]
fn invisible_characters_and_case_twins_are_refused() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let team = dir.join("t.json");
    let plan_with = |names: [&str; 2]| {
        let mut v: serde_json::Value = serde_json::from_str(&demo()).unwrap();
        v["divers"][0]["name"] = serde_json::json!(names[0]);
        v["divers"][1]["name"] = serde_json::json!(names[1]);
        std::fs::write(&team, v.to_string()).unwrap();
        turnsheet(dir, &["plan", team.to_str().unwrap()])
    };
    for u in [
        0x200B, 0x00AD, 0xFEFF, 0x2061, 0x034F, 0x180E, 0xE0001, 0xE0041, 0xF0000, 0x3164, 0x2800,
        0xFE0F,
    ] {
        let c = char::from_u32(u).unwrap();
        let code = format!("U+{u:04X}");
        let r = plan_with(["Bram", &format!("Bra{c}m")]);
        assert_eq!(r.code, 2, "{code}: {}", r.out);
        assert!(
            r.err.contains("divers[1].name") && r.err.contains(&code),
            "{code}: {}",
            r.err
        );
        let r = turnsheet(dir, &["locker", "add", &format!("Twin{c}"), "2x12L@232bar"]);
        assert_eq!(r.code, 2, "{code}: {}", r.out);
        assert!(r.err.contains("NAME") && r.err.contains(&code), "{}", r.err);
    }
    let r = plan_with(["Bram", "bram"]);
    assert_eq!(r.code, 2, "{}", r.out);
    assert!(
        r.err.contains("divers[1].name") && r.err.contains("already called"),
        "{}",
        r.err
    );
    let r = plan_with(["Bram", "\u{301}"]);
    assert_eq!(r.code, 2, "{}", r.out);
    assert!(r.err.contains("visible character"), "{}", r.err);
    let r = turnsheet(dir, &["locker", "add", "\u{3164}", "2x12L@232bar"]);
    assert_eq!(r.code, 2, "{}", r.out);
}

/// `-o` never makes a folder, prints the path with control characters escaped, and
/// writes through a symbolic link (the link is kept).
#[cfg(unix)]
#[test]
fn output_paths_make_no_folder_print_no_escape_and_follow_links() {
    let d = tempfile::tempdir().unwrap();
    let dir = d.path();
    let team = dir.join("t.json");
    std::fs::write(&team, demo()).unwrap();
    let missing = dir.join("missing");
    let through = format!("{}/../card.svg", missing.display());
    let r = turnsheet(dir, &["card", team.to_str().unwrap(), "-o", &through]);
    assert_eq!(r.code, 3, "{}", r.out);
    assert!(r.err.contains("does not exist"), "{}", r.err);
    assert!(!missing.exists(), "no folder is made");
    assert!(!dir.join("card.svg").exists());

    let odd = dir.join("a\u{1b}[2Jb.svg");
    let r = turnsheet(
        dir,
        &["card", team.to_str().unwrap(), "-o", odd.to_str().unwrap()],
    );
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(!r.out.contains('\u{1b}'), "{:?}", r.out);
    assert!(r.out.contains("a\\u{001b}[2Jb.svg"), "{}", r.out);
    assert!(odd.exists());

    let real = dir.join("real.svg");
    std::fs::write(&real, "old").unwrap();
    let link = dir.join("link.svg");
    std::os::unix::fs::symlink(&real, &link).unwrap();
    let r = turnsheet(
        dir,
        &["card", team.to_str().unwrap(), "-o", link.to_str().unwrap()],
    );
    assert_eq!(r.code, 0, "{}", r.err);
    assert!(
        std::fs::symlink_metadata(&link)
            .unwrap()
            .file_type()
            .is_symlink()
    );
    assert!(
        std::fs::read_to_string(&real).unwrap().starts_with("<?xml")
            || std::fs::read_to_string(&real).unwrap().contains("<svg")
    );
}
