//! A process killed while saving never leaves a broken locker.
//!
//! The parent starts a child (this same test binary, running `child_saves_forever`) that
//! saves large lockers through `Store::save_locker` as fast as it can, each one different
//! (numbered), and reports each completed save on its standard output. After the first
//! save the parent waits a random moment and SIGKILLs it. Then `locker.json` must parse
//! and be exactly the last save the child reported (the old content) or the one after it
//! (the new content, written but not yet reported), and nothing may be set aside.
//! `TURNSHEET_KILL_ROUNDS` sets the number of kills (default 200), `TURNSHEET_KILL_SEED`
//! replays a run.

use std::io::{BufRead, BufReader};
use std::path::Path;
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};

use turnsheet::formats::team_file::CylindersFile;
use turnsheet::plan::Material;
use turnsheet::storage::Store;
use turnsheet::storage::atomic::{ReadOutcome, kept_aside, read_json};
use turnsheet::storage::locker::{
    LOCKER_SCHEMA, LockerEntry, LockerFile, MAX_LOCKER_SETS, MAX_SET_NAME_CHARS, MAX_SET_NOTE_CHARS,
};
use turnsheet::storage::store::LOCKER_FILE;

const CHILD_DIR: &str = "TURNSHEET_KILL_TEST_DIR";
const CHILD_BASE: &str = "TURNSHEET_KILL_TEST_BASE";

/// A full locker (the most sets, long names and notes), numbered `n`: the number is in the
/// first set's name and the file's length changes with it.
fn big_locker(n: u64) -> LockerFile {
    let entries = (0..MAX_LOCKER_SETS)
        .map(|i| {
            let name = if i == 0 {
                format!("Save {n}")
            } else {
                let head = format!("S{i:03} ");
                format!("{head}{}", "n".repeat(MAX_SET_NAME_CHARS - head.len()))
            };
            LockerEntry {
                id: i as u64 + 1,
                name,
                cylinders: CylindersFile {
                    count: 1 + (i % 4) as u8,
                    independent: false,
                    water_l: Some(3.0 + ((i as u64 + n) % 25) as f64),
                    working_bar: Some(if n.is_multiple_of(2) { 232.0 } else { 300.0 }),
                    rated_cuft: None,
                    rated_psi: None,
                },
                material: Material::Steel,
                note: "x".repeat(if i == 0 {
                    (n % 61) as usize
                } else {
                    MAX_SET_NOTE_CHARS
                }),
                mine: i == 0,
            }
        })
        .collect();
    LockerFile {
        schema: LOCKER_SCHEMA,
        entries,
    }
}

fn number_of(l: &LockerFile) -> Option<u64> {
    l.entries.first()?.name.strip_prefix("Save ")?.parse().ok()
}

/// The child: save lockers base, base + 1, ... until killed, printing each number once
/// saved. Ignored: only the kill test runs it (with `--ignored` and its environment).
#[test]
#[ignore = "the kill test's child process; the kill test starts it"]
fn child_saves_forever() {
    let (Some(dir), Some(base)) = (std::env::var_os(CHILD_DIR), std::env::var(CHILD_BASE).ok())
    else {
        return;
    };
    let base: u64 = base.parse().expect("a number");
    let mut store = Store::new(dir);
    let mut out = std::io::stdout().lock();
    for n in base.. {
        store
            .save_locker(&big_locker(n))
            .expect("the child can save");
        use std::io::Write;
        writeln!(out, "{n}")
            .and_then(|()| out.flush())
            .expect("the parent listens");
    }
}

/// xorshift64*: a small random generator, seeded from the clock (printed for replay).
struct Rng(u64);
impl Rng {
    fn next(&mut self) -> u64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        self.0.wrapping_mul(0x2545_F491_4F6C_DD1D)
    }
}

fn read_locker(dir: &Path) -> LockerFile {
    match read_json::<LockerFile>(&dir.join(LOCKER_FILE), LOCKER_SCHEMA) {
        ReadOutcome::Missing => panic!("the locker vanished"),
        ReadOutcome::Loaded(l) => l,
        ReadOutcome::SetAside { kept_as, reason } => {
            panic!(
                "the locker was broken ({reason}); kept as {}",
                kept_as.display()
            )
        }
        ReadOutcome::LeftInPlace { reason } => panic!("the locker could not be read ({reason})"),
    }
}

#[test]
fn killed_while_saving_the_locker_is_the_old_or_the_new_one() {
    let rounds: u64 = std::env::var("TURNSHEET_KILL_ROUNDS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(200);
    let seed = std::env::var("TURNSHEET_KILL_SEED")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or_else(|| {
            std::time::SystemTime::now()
                .duration_since(std::time::UNIX_EPOCH)
                .unwrap()
                .as_nanos() as u64
                | 1
        });
    eprintln!("kill test: {rounds} rounds, seed {seed}");
    let mut rng = Rng(seed);
    let size = serde_json::to_string_pretty(&big_locker(0)).unwrap().len();
    assert!(size > 50_000, "large lockers: {size} bytes");
    let dir = tempfile::tempdir().unwrap();
    let exe = std::env::current_exe().unwrap();
    let (mut old, mut new, mut saves) = (0u64, 0u64, 0u64);
    let started = Instant::now();
    for round in 0..rounds {
        let base = round * 1_000_000;
        let mut child = Command::new(&exe)
            .args([
                "child_saves_forever",
                "--exact",
                "--ignored",
                "--nocapture",
                "--test-threads=1",
            ])
            .env(CHILD_DIR, dir.path())
            .env(CHILD_BASE, base.to_string())
            .stdout(Stdio::piped())
            .stderr(Stdio::null())
            .spawn()
            .unwrap();
        let mut lines = BufReader::new(child.stdout.take().unwrap()).lines();
        // Wait for the first save, then kill at a random moment among the next ones.
        // The harness prints its own lines first ("running 1 test"...): numbers only.
        let mut reported: Vec<u64> = Vec::new();
        for line in lines.by_ref().map_while(Result::ok) {
            // The first number shares its line with the harness's "test ... " prefix.
            if let Some(Ok(n)) = line.split_whitespace().last().map(str::parse) {
                reported.push(n);
                break;
            }
        }
        assert_eq!(reported, vec![base], "round {round}: the child saved once");
        std::thread::sleep(Duration::from_micros(rng.next() % 20_000));
        child.kill().unwrap(); // SIGKILL
        let status = child.wait().unwrap();
        assert!(!status.success(), "round {round}: the child was killed");
        reported.extend(
            lines
                .map_while(Result::ok)
                .filter_map(|l| l.split_whitespace().last()?.parse::<u64>().ok()),
        );
        let last = *reported.last().unwrap();
        saves += reported.len() as u64;
        let on_disk = read_locker(dir.path());
        let n = number_of(&on_disk).expect("a numbered locker");
        assert!(
            n == last || n == last + 1,
            "round {round} (seed {seed}): saved up to {last}, found {n}"
        );
        assert!(
            on_disk == big_locker(n),
            "round {round}: locker {n} is intact"
        );
        if n == last {
            old += 1
        } else {
            new += 1
        }
        assert!(
            kept_aside(dir.path(), LOCKER_FILE).is_empty(),
            "round {round}: nothing is ever set aside"
        );
    }
    eprintln!(
        "kill test: {rounds} kills in {:.1} s, {saves} completed saves of {size} bytes; \
         after the kill the file held the last reported save {old} times and the one in \
         flight {new} times",
        started.elapsed().as_secs_f64()
    );
    // Kills landed both before and after the rename of a save in flight.
    assert!(old > 0 && new > 0, "old {old}, new {new}");
}

/// The same save stopped at every step of the one writer (`write_steps`): killed there
/// (nothing cleaned up) or failing there (an I/O error, as on a full disk). The locker is
/// then the old one or the new one, never neither, and the next save works.
#[test]
fn a_save_stopped_at_every_write_step_leaves_the_old_or_the_new_locker() {
    use turnsheet::storage::atomic::{Interrupt, WriteStep, write_steps};
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join(LOCKER_FILE);
    let mut store = Store::new(dir.path());
    let mut steps_seen = 0;
    let (mut kept_old, mut kept_new) = (0, 0);
    for n in 0..2u64 {
        store.save_locker(&big_locker(n)).unwrap();
        let new = big_locker(n + 1);
        let bytes = serde_json::to_string_pretty(&new).unwrap() + "\n";
        // Every step this write takes, in order.
        let mut all = Vec::new();
        let probe = dir.path().join("probe.json");
        write_steps(&probe, bytes.as_bytes(), &mut |s| {
            all.push(s);
            Ok(())
        })
        .unwrap();
        assert!(
            all.iter()
                .filter(|s| matches!(s, WriteStep::Write(_)))
                .count()
                > 1
        );
        for (k, stop_at) in all.iter().enumerate() {
            for kill in [true, false] {
                store.save_locker(&big_locker(n)).unwrap();
                let r = write_steps(&path, bytes.as_bytes(), &mut |s| {
                    if s != *stop_at {
                        Ok(())
                    } else if kill {
                        Err(Interrupt::Kill)
                    } else {
                        Err(Interrupt::Fail(std::io::Error::other(
                            "disk full (simulated)",
                        )))
                    }
                });
                let e = r.expect_err("stopped");
                if !kill && *stop_at != WriteStep::SyncFolder {
                    assert!(e.to_string().contains("is unchanged"), "{stop_at:?}: {e}");
                }
                let on_disk = read_locker(dir.path());
                let after_rename = k > all.iter().position(|s| *s == WriteStep::Rename).unwrap();
                if after_rename {
                    assert_eq!(on_disk, new, "{stop_at:?}: the new locker once renamed");
                    kept_new += 1;
                } else {
                    assert_eq!(on_disk, big_locker(n), "{stop_at:?}: the old locker before");
                    kept_old += 1;
                }
                steps_seen += 1;
            }
        }
    }
    // The next save works, whatever temp files a killed writer left.
    store.save_locker(&big_locker(9)).unwrap();
    assert_eq!(read_locker(dir.path()), big_locker(9));
    eprintln!(
        "write steps: {steps_seen} stops (kill and failure at each step); old kept {kept_old}, new kept {kept_new}"
    );
    assert!(kept_new > 0 && kept_old > 0);
}
