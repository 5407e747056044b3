//! One name for a set: the app's diver cards, `turnsheet plan` (table and JSON),
//! `turnsheet card` and `turnsheet chart` name the demo team's sets alike, and a name the
//! diver gave (in the app, or in a team file) stays everywhere.

use std::path::{Path, PathBuf};
use std::process::Command;

use turnsheet::app::session::Session;
use turnsheet::storage::Store;

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_turnsheet"))
}

fn demo_path() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("examples/hollowmere-team.json")
}

/// Standard output of a command that must succeed.
fn run(args: &[&str], file: &Path) -> String {
    let out = bin().args(args).arg(file).output().unwrap();
    assert_eq!(
        out.status.code(),
        Some(0),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

/// The app on the first launch (the demo team): each diver's set and stage as the
/// diver cards show them.
fn app_names(data: &Path) -> (Session, Vec<String>, Vec<String>) {
    let app = Session::open(Store::new(data));
    let sets = (0..app.team.len())
        .map(|i| app.team.shown_label(i))
        .collect();
    let stages = (0..app.team.len())
        .map(|i| app.team.shown_stage_label(i))
        .collect();
    (app, sets, stages)
}

/// The table's line for a diver.
fn line<'a>(table: &'a str, name: &str) -> &'a str {
    table
        .lines()
        .find(|l| l.get(2..).is_some_and(|rest| rest.starts_with(name)))
        .unwrap_or_else(|| panic!("no line for {name}:\n{table}"))
}

#[test]
fn the_demo_team_names_its_sets_alike_in_the_app_and_on_the_command_line() {
    let data = tempfile::tempdir().unwrap();
    let (app, sets, stages) = app_names(data.path());
    assert!(app.team.is_demo());
    // The names the app has shown since the presets were named (not the made names).
    assert_eq!(
        sets,
        [
            "Twin 12 L 232 bar",
            "Sidemount aluminium 77.4 cu ft 3000 psi",
            "Twin 8.5 L 300 bar"
        ]
    );
    assert_eq!(
        stages,
        [
            "Single aluminium 40 cu ft 3000 psi",
            "",
            "Single 7 L 232 bar"
        ]
    );
    let demo = demo_path();
    let table = run(&["plan"], &demo);
    let json: serde_json::Value = serde_json::from_str(&run(&["plan", "--json"], &demo)).unwrap();
    let card = run(&["card", "--date", "today"], &demo);
    let charts = run(&["chart"], &demo);
    let input = app.team.input();
    for (i, d) in input.divers.iter().enumerate() {
        let (set, stage) = (&sets[i], &stages[i]);
        assert!(
            line(&table, &d.name).contains(set.as_str()),
            "{set}:\n{table}"
        );
        assert_eq!(json["divers"][i]["set_name"], set.as_str());
        assert!(card.contains(&format!(">{set}</text>")), "{set}");
        assert!(charts.contains(&format!("{} ({set}, ", d.name)), "{set}");
        if d.stage.is_some() {
            assert_eq!(json["divers"][i]["stage_set_name"], stage.as_str());
            assert!(card.contains(&format!("({stage}, ")), "{stage}");
            let drop_line = table
                .lines()
                .find(|l| {
                    l.get(2..).is_some_and(|r| r.starts_with(&d.name))
                        && l.contains("drop stage at")
                })
                .unwrap();
            assert!(drop_line.contains(&format!("({stage}, ")), "{drop_line}");
        } else {
            assert!(json["divers"][i]["stage_set_name"].is_null());
        }
    }
    // The names the core makes from the sizes alone are not used for a preset's set.
    for made in [
        "2 × 77.4 cu ft 3000 psi, independent",
        "Single 40 cu ft 3000 psi",
    ] {
        for (what, text) in [("plan", &table), ("card", &card), ("chart", &charts)] {
            assert!(!text.contains(made), "{what} says {made}");
        }
    }
}

#[test]
fn a_name_given_in_the_app_is_the_name_on_the_command_line() {
    let data = tempfile::tempdir().unwrap();
    let (app, _, _) = app_names(data.path());
    let mut state = app.team.to_state();
    state.cylinder_labels[1] = "Bram's doubles".into();
    // The app's saved team, as the app writes it.
    let saved = data.path().join("last-team.json");
    std::fs::write(&saved, serde_json::to_string_pretty(&state).unwrap()).unwrap();
    let table = run(&["plan"], &saved);
    assert!(line(&table, "Bram").contains("Bram's doubles"), "{table}");
    assert!(
        line(&table, "Ines").contains("Twin 12 L 232 bar"),
        "{table}"
    );
    let card = run(&["card", "--date", "today"], &saved);
    assert!(card.contains(">Bram&apos;s doubles</text>"), "{card}");
    // The app reads the same file back with the same names.
    let back = Session::open(Store::new(data.path()));
    assert_eq!(back.team.shown_label(1), "Bram's doubles");
}

#[test]
fn a_long_set_name_in_a_team_file_moves_no_column() {
    let mut team: serde_json::Value =
        serde_json::from_str(&std::fs::read_to_string(demo_path()).unwrap()).unwrap();
    let long = "Bram's long-hose sidemount rig, 2026";
    assert!(long.chars().count() > 26);
    team["divers"][1]["set_name"] = long.into();
    team["divers"][0]["stage"]["set_name"] = "Ines's deco bottle".into();
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("team.json");
    std::fs::write(&path, team.to_string()).unwrap();
    let table = run(&["plan"], &path);
    assert!(line(&table, "Bram").contains(long), "{table}");
    assert!(table.contains("(Ines's deco bottle, "), "{table}");
    // Every column after the set's starts where its heading does.
    let header = table.lines().find(|l| l.contains("cylinders")).unwrap();
    let at = |l: &str, word: &str| l.find(word).map(|b| l[..b].chars().count());
    let mix = at(header, "mix").unwrap();
    for name in ["Ines", "Bram", "Sol"] {
        assert_eq!(at(line(&table, name), "EAN32"), Some(mix), "{table}");
    }
    // A set name that is no name is refused with its field.
    team["divers"][1]["set_name"] = "x".repeat(41).into();
    std::fs::write(&path, team.to_string()).unwrap();
    let out = bin().arg("plan").arg(&path).output().unwrap();
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("divers[1].set_name (Bram)"), "{err}");
}
