//! The command line: the demo team, every validation error path, JSON keys.

use std::path::PathBuf;
use std::process::Command;

fn bin() -> Command {
    Command::new(env!("CARGO_BIN_EXE_turnsheet"))
}

fn demo_path() -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("examples/hollowmere-team.json")
}

fn demo() -> serde_json::Value {
    serde_json::from_str(&std::fs::read_to_string(demo_path()).unwrap()).unwrap()
}

fn plan_json(team: &serde_json::Value) -> (i32, String, String) {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("team.json");
    std::fs::write(&path, serde_json::to_string(team).unwrap()).unwrap();
    let out = bin().args(["plan", "--json"]).arg(&path).output().unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn demo_team_prints_a_table() {
    let out = bin().arg("plan").arg(demo_path()).output().unwrap();
    assert_eq!(out.status.code(), Some(0));
    let text = String::from_utf8(out.stdout).unwrap();
    for name in ["Ines", "Bram", "Sol"] {
        assert!(text.contains(name), "{text}");
    }
    assert!(text.contains("controlling diver"), "{text}");
    assert!(text.contains("Check by hand"), "{text}");
}

#[test]
fn json_output_has_the_documented_keys() {
    let (code, out, err) = plan_json(&demo());
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    for key in [
        "controlling",
        "team_allowance_l",
        "stress_margin",
        "warnings",
    ] {
        assert!(v.get(key).is_some(), "missing {key}");
    }
    let divers = v["divers"].as_array().unwrap();
    assert_eq!(divers.len(), 3);
    let mut controlling = 0;
    for d in divers {
        for key in [
            "name",
            "turn",
            "turn_real",
            "turn_hand",
            "turn_set_by",
            "content_l",
            "controlling",
            "minutes_to_turn",
        ] {
            assert!(d.get(key).is_some(), "missing divers[].{key}");
        }
        let turn = d["turn"].as_f64().unwrap();
        assert!(turn >= d["turn_real"].as_f64().unwrap() - 1e-9);
        assert!(turn >= d["turn_hand"].as_f64().unwrap() - 1e-9);
        assert_eq!(turn % 10.0, 0.0);
        assert!(["real", "hand"].contains(&d["turn_set_by"].as_str().unwrap()));
        assert!(d["minutes_to_turn"].as_f64().unwrap() > 0.0);
        if d["controlling"].as_bool().unwrap() {
            controlling += 1;
            assert_eq!(d["name"], v["controlling"]);
        }
    }
    assert_eq!(controlling, 1);
    assert!(v["stress_margin"].as_f64().unwrap() >= 1.0);
    // Every diver has a SAC and the team a depth: the margin at the first turn is known
    // and never below the all-used margin.
    assert!(
        v["stress_margin_at_first_turn"].as_f64().unwrap() >= v["stress_margin"].as_f64().unwrap()
    );
}

#[test]
fn without_sac_or_depth_minutes_are_null() {
    let mut t = demo();
    t.as_object_mut().unwrap().remove("depth");
    let (code, out, _) = plan_json(&t);
    assert_eq!(code, 0);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    assert!(v["divers"][0]["minutes_to_turn"].is_null());
}

/// Each edit of the demo team must exit 2 with a message naming the field.
#[test]
fn every_validation_error_names_the_field() {
    type Edit = fn(&mut serde_json::Value);
    let cases: Vec<(&str, Edit)> = vec![
        ("divers", |t| {
            t["divers"].as_array_mut().unwrap().truncate(1);
        }),
        ("divers", |t| {
            let d = t["divers"][0].clone();
            let a = t["divers"].as_array_mut().unwrap();
            while a.len() < 7 {
                a.push(d.clone());
            }
        }),
        ("divers[0].start", |t| t["divers"][0]["start"] = 0.into()),
        ("divers[0].start", |t| {
            t["divers"][0]["start"] = (-20).into()
        }),
        ("divers[0].start", |t| t["divers"][0]["start"] = 350.into()),
        ("divers[2].start", |t| {
            t["divers"][2]["cylinders"]["working_bar"] = 300.into();
            t["divers"][2]["start"] = 420.into();
        }),
        ("divers[0].cylinders.water_l", |t| {
            t["divers"][0]["cylinders"]["water_l"] = 0.4.into()
        }),
        ("divers[0].cylinders.water_l", |t| {
            t["divers"][0]["cylinders"]["water_l"] = 31.into()
        }),
        ("divers[0].cylinders.working_bar", |t| {
            t["divers"][0]["cylinders"]["working_bar"] = 0.into()
        }),
        ("divers[1].cylinders.rated_psi", |t| {
            t["divers"][1]["cylinders"]["rated_psi"] = 0.into()
        }),
        ("divers[1].cylinders.rated_cuft", |t| {
            t["divers"][1]["cylinders"]["rated_cuft"] = (-1).into()
        }),
        ("divers[0].cylinders.count", |t| {
            t["divers"][0]["cylinders"]["count"] = 0.into()
        }),
        ("divers[0].cylinders.count", |t| {
            t["divers"][0]["cylinders"]["count"] = 5.into()
        }),
        ("divers[0].cylinders", |t| {
            t["divers"][0]["cylinders"]["rated_psi"] = 3000.into()
        }),
        ("divers[0].mix.o2", |t| {
            t["divers"][0]["mix"]["o2"] = 0.04.into()
        }),
        ("divers[0].mix.he", |t| {
            t["divers"][0]["mix"]["o2"] = 0.3.into();
            t["divers"][0]["mix"]["he"] = 0.8.into();
        }),
        ("divers[0].name", |t| t["divers"][0]["name"] = "  ".into()),
        ("divers[2].name", |t| t["divers"][2]["name"] = "Ines".into()),
        ("divers[0].sac", |t| t["divers"][0]["sac"] = 0.into()),
        ("rule", |t| t["rule"] = "sevenths".into()),
        ("gauge_step", |t| t["gauge_step"] = 0.into()),
        ("gauge_step", |t| t["gauge_step"] = (-10).into()),
        ("water_temp", |t| t["water_temp"] = 80.into()),
        ("depth", |t| t["depth"] = (-5).into()),
        ("colour", |t| t["colour"] = "red".into()),
        ("tank", |t| t["divers"][0]["tank"] = 1.into()),
    ];
    for (field, edit) in cases {
        let mut t = demo();
        edit(&mut t);
        let (code, out, err) = plan_json(&t);
        assert_eq!(code, 2, "{field}: expected exit 2; stdout {out}");
        assert!(err.contains(field), "message does not name {field}: {err}");
        assert!(out.is_empty(), "no plan may be printed on bad input");
    }
}

#[test]
fn an_error_about_a_diver_gives_the_field_and_the_name() {
    let mut t = demo();
    t["divers"][1]["start"] = 0.into();
    let (code, _, err) = plan_json(&t);
    assert_eq!(code, 2);
    assert!(err.contains("divers[1].start (Bram):"), "{err}");
    // A blank name is not repeated after the field.
    let mut t = demo();
    t["divers"][0]["name"] = "  ".into();
    let (_, _, err) = plan_json(&t);
    assert!(err.contains("divers[0].name:"), "{err}");
}

#[test]
fn chart_and_gas_spell_the_unit_alike() {
    let chart = |unit_flag: &str, unit: &str| {
        let out = bin()
            .args(["chart", "--mine", "2x12L@232bar", "--buddy", "1x18L@232bar"])
            .args([unit_flag, unit, "--format", "csv"])
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(0), "{unit_flag} {unit}");
        String::from_utf8(out.stdout).unwrap()
    };
    let psi = chart("--units", "psi");
    assert!(psi.starts_with("mine psi\\buddy psi"), "{psi}");
    // The other spelling and the old values still work and mean the same.
    assert_eq!(chart("--unit", "psi"), psi);
    assert_eq!(chart("--units", "imperial"), psi);
    assert_eq!(chart("--units", "metric"), chart("--unit", "bar"));
    let gas = |unit_flag: &str| {
        let out = bin()
            .args([
                "gas",
                "--litres",
                "12",
                "--pressure",
                "3000",
                unit_flag,
                "psi",
            ])
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(0), "gas {unit_flag}");
        String::from_utf8(out.stdout).unwrap()
    };
    assert!(gas("--units").contains("at 3000 psi"));
    assert_eq!(gas("--unit"), gas("--units"));
    // Help shows the one spelling only, the same in both commands.
    for command in ["chart", "gas"] {
        let help = bin().args([command, "--help"]).output().unwrap();
        let help = String::from_utf8(help.stdout).unwrap();
        assert!(
            help.contains("--units <UNIT>") && !help.contains("--unit <") && !help.contains("old"),
            "{command}: {help}"
        );
    }
}

#[test]
fn a_spec_can_say_its_pair_is_independent() {
    let chart = |mine: &str| {
        let out = bin()
            .args(["chart", "--mine", mine, "--buddy", "1x18L@232bar"])
            .output()
            .unwrap();
        assert_eq!(out.status.code(), Some(0), "{mine}");
        String::from_utf8(out.stdout).unwrap()
    };
    let twins = chart("2x11.1L@207bar");
    assert!(twins.contains("Me (Twin 11.1 L 207 bar, "), "{twins}");
    // Sidemount: the generic size's name, as the app gives it; the same turns.
    let pair = chart("2x11.1L@207bar:indep");
    assert!(
        pair.contains("Me (Sidemount aluminium 11.1 L 207 bar, "),
        "{pair}"
    );
    let cells = |t: &str| {
        t.lines()
            .skip_while(|l| !l.starts_with("rows:"))
            .collect::<Vec<_>>()
            .join("\n")
    };
    assert_eq!(cells(&twins), cells(&pair));
    let out = bin()
        .args([
            "chart",
            "--mine",
            "1x11.1L@207bar:indep",
            "--buddy",
            "1x18L@232bar",
        ])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("only a pair"));
}

#[test]
fn free_gas_and_water_temperature_are_shown_as_everywhere_else() {
    // 11.1 L of air at 207 bar: about 2196 L free gas. Shown cu ft round down (gas on
    // hand): 1 cu ft = 28.316846592 L exactly (NIST SP 811, appendix B).
    let out = bin()
        .args(["gas", "--litres", "11.1", "--pressure", "207"])
        .output()
        .unwrap();
    let text = String::from_utf8(out.stdout).unwrap();
    let v: serde_json::Value = serde_json::from_slice(
        &bin()
            .args(["gas", "--litres", "11.1", "--pressure", "207", "--json"])
            .output()
            .unwrap()
            .stdout,
    )
    .unwrap();
    let litres = v["content_l"].as_f64().unwrap();
    let cuft = (litres / 28.316846592 * 10.0).floor() / 10.0;
    let real = text.lines().find(|l| l.contains("real gas")).unwrap();
    assert!(
        real.contains(&format!("{} L free gas ({cuft:.1} cu ft)", litres.floor())),
        "{real} ({litres} L)"
    );
    let hand: f64 = 11.1 * 207.0 / 28.316846592;
    let hand_line = text.lines().find(|l| l.contains("tank factor")).unwrap();
    assert!(
        hand_line.contains(&format!("({:.1} cu ft)", (hand * 10.0).floor() / 10.0)),
        "{hand_line}"
    );
    // Half a degree: the plan's table, its charts and the card round it alike.
    let mut team = demo();
    team["water_temp"] = 14.5.into();
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("team.json");
    std::fs::write(&path, team.to_string()).unwrap();
    let said = |args: &[&str]| {
        let out = bin().args(args).arg(&path).output().unwrap();
        String::from_utf8(out.stdout).unwrap()
    };
    assert!(said(&["plan"]).contains("water 15 °C"));
    assert!(said(&["chart"]).contains("water 15 °C"));
    assert!(said(&["card", "--date", "today"]).contains("water 15 °C"));
}

#[test]
fn unreadable_and_malformed_files_exit_2() {
    let out = bin()
        .args(["plan", "/nonexistent/team.json"])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("cannot read team file"));
    let dir = tempfile::tempdir().unwrap();
    let p = dir.path().join("bad.json");
    std::fs::write(&p, "{\"units\": \"metric\", ").unwrap();
    let out = bin().arg("plan").arg(&p).output().unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("team file"));
}

/// `turnsheet gas --litres L --pressure 232 --json`, parsed.
fn gas_232(litres: &str) -> serde_json::Value {
    let out = bin()
        .args(["gas", "--litres", litres, "--pressure", "232", "--json"])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(0));
    serde_json::from_slice(&out.stdout).unwrap()
}

#[test]
fn gas_command_reports_both_models_and_cooling() {
    // CoolProp 8.0.0 (HEOS reference equation, tests/reference/gas_content.csv): air at
    // 232 bar, 20 °C holds 218.03 L per litre.
    let v = gas_232("1");
    let real = v["content_l"].as_f64().unwrap();
    assert!((real - 218.0).abs() < 1.0, "{real}");
    // Pencil arithmetic (common practice): 1 L × 232 bar = 232 L.
    assert_eq!(v["content_hand_l"].as_f64().unwrap(), 232.0);
    assert!(v["pressure_after"].is_null());
    // Same reference: 232 bar at 35 °C cooled to 12 °C → 207.2 bar.
    let out = bin()
        .args([
            "gas",
            "--litres",
            "12",
            "--pressure",
            "232",
            "--temp",
            "35",
            "--to-temp",
            "12",
            "--json",
        ])
        .output()
        .unwrap();
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    assert!((v["pressure_after"].as_f64().unwrap() - 207.16).abs() < 0.5);
    let out = bin()
        .args(["gas", "--litres", "12", "--pressure", "0"])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("--pressure"));
    let out = bin()
        .args([
            "gas",
            "--litres",
            "12",
            "--pressure",
            "200",
            "--o2",
            "30",
            "--he",
            "80",
        ])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("--he"));
}

#[test]
fn help_explains_the_commands() {
    let out = bin().arg("--help").output().unwrap();
    assert_eq!(out.status.code(), Some(0));
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(text.contains("plan") && text.contains("gas"), "{text}");
}

#[test]
fn stages_get_a_drop_pressure() {
    let mut t = demo();
    t["divers"][0]["stage"] = serde_json::json!({
        "cylinders": {"water_l": 11.1, "working_bar": 207}, "mix": {"o2": 0.5}, "start": 200});
    t["divers"][2]["stage"] = serde_json::json!({
        "cylinders": {"water_l": 7, "working_bar": 232}, "mix": {"o2": 0.5}, "start": 200});
    let (code, out, err) = plan_json(&t);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    // Hand arithmetic as in tests/hand_method.rs: drops at 160 and 140 bar.
    assert_eq!(v["divers"][0]["stage_drop"].as_f64(), Some(160.0));
    assert_eq!(v["divers"][2]["stage_drop"].as_f64(), Some(140.0));
    assert_eq!(v["divers"][2]["stage_controlling"].as_bool(), Some(true));
    assert!(v["divers"][1]["stage_drop"].is_null());
    // A bad stage names its field.
    t["divers"][2]["stage"]["start"] = 400.into();
    let (code, _, err) = plan_json(&t);
    assert_eq!(code, 2);
    assert!(err.contains("divers[2].stage.start"), "{err}");
}

#[test]
fn chart_command_prints_every_pair() {
    let out = bin().arg("chart").arg(demo_path()).output().unwrap();
    assert_eq!(out.status.code(), Some(0));
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(text.contains("keep the HIGHEST turn"), "{text}");
    assert_eq!(text.matches("rows: ").count(), 6, "3 divers make 6 charts");
    // No possessive of a name ("Ines's start"): the start is read by a diver.
    assert!(text.contains("rows: start read by Ines (bar)"), "{text}");
    for name in ["Ines", "Bram", "Sol"] {
        assert!(!text.contains(&format!("{name}'s")), "{text}");
    }
    let out = bin()
        .args(["chart", "--json"])
        .arg(demo_path())
        .output()
        .unwrap();
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let charts = v.as_array().unwrap();
    assert_eq!(charts.len(), 6);
    let c = &charts[0];
    assert_eq!(
        c["turns"].as_array().unwrap().len(),
        c["diver_starts"].as_array().unwrap().len()
    );
    let out = bin().args(["chart", "/nonexistent.json"]).output().unwrap();
    assert_eq!(out.status.code(), Some(2));
}

#[test]
fn a_team_chart_refuses_the_options_of_a_two_set_chart() {
    // The team file holds the rule, gases and gauges: --rule halves, -o or --format svg
    // beside it would be quietly ignored, and the diver would read the wrong chart.
    let dir = tempfile::tempdir().unwrap();
    let svg = dir.path().join("chart.svg");
    for extra in [
        vec!["--rule", "halves"],
        vec!["--format", "svg"],
        vec!["-o", svg.to_str().unwrap()],
        vec!["--units", "psi"],
        vec!["--temp", "8"],
    ] {
        let out = bin()
            .arg("chart")
            .arg(demo_path())
            .args(&extra)
            .output()
            .unwrap();
        let err = String::from_utf8_lossy(&out.stderr);
        assert_eq!(out.status.code(), Some(2), "{extra:?}: {err}");
        assert!(out.stdout.is_empty(), "{extra:?}");
        let named = if extra[0] == "-o" {
            "--output"
        } else {
            extra[0]
        };
        assert!(err.contains(named), "{extra:?}: {err}");
        assert!(err.contains("--mine"), "{err}");
    }
    assert!(!svg.exists(), "nothing is written");
}

#[test]
fn hand_content_is_the_pencil_sum() {
    // Common practice: 12 L of water at 232 bar holds 12 × 232 = 2784 L by hand.
    let v = gas_232("12");
    assert_eq!(v["content_hand_l"].as_f64(), Some(2784.0));
    let out = bin()
        .args(["gas", "--litres", "12", "--pressure", "232"])
        .output()
        .unwrap();
    assert!(String::from_utf8_lossy(&out.stdout).contains("2784"));
}

#[test]
fn each_diver_is_planned_on_their_own_gauge() {
    // Invented team: Bram reads a psi gauge on 50 psi in a metric team.
    let mut t = demo();
    t["divers"][1]["start"] = 2950.into();
    t["divers"][1]["gauge"] = serde_json::json!({"unit": "psi", "step": 50});
    let (code, out, err) = plan_json(&t);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let bram = &v["divers"][1];
    assert_eq!(bram["unit"], "psi");
    assert_eq!(bram["step"].as_f64(), Some(50.0));
    let turn = bram["turn"].as_f64().unwrap();
    assert_eq!(turn % 50.0, 0.0);
    assert!(turn > 1000.0 && turn <= 2950.0, "{turn}");
    assert!(turn >= bram["turn_hand"].as_f64().unwrap());
    assert_eq!(v["divers"][0]["unit"], "bar");
    assert!(bram["hand_turn_working"].as_str().unwrap().contains("psi"));
    // The text table prints each diver's unit beside their turn.
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("team.json");
    std::fs::write(&path, t.to_string()).unwrap();
    let out = bin().arg("plan").arg(&path).output().unwrap();
    assert_eq!(out.status.code(), Some(0));
    let text = String::from_utf8_lossy(&out.stdout);
    let line = text.lines().find(|l| l.contains("Bram")).unwrap();
    assert!(line.contains(&format!(" {} psi", turn)), "{line}");
}

/// Run the binary with its standard output going to `stdout`.
fn run_into(args: &[&str], stdout: std::process::Stdio) -> (Option<i32>, String) {
    let out = bin()
        .args(args)
        .stdout(stdout)
        .stderr(std::process::Stdio::piped())
        .output()
        .unwrap();
    (
        out.status.code(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

fn demo_str() -> String {
    demo_path().to_str().unwrap().to_string()
}

#[test]
fn a_closed_pipe_ends_with_one_line_and_exit_3_never_a_panic() {
    let demo = demo_str();
    let commands: Vec<Vec<&str>> = vec![
        vec!["plan", &demo],
        vec!["plan", "--json", &demo],
        vec!["chart", &demo],
        vec!["gas", "--litres", "12", "--pressure", "232"],
        vec!["--help"],
    ];
    for args in commands {
        // The reading end is closed before the program starts: every write fails (EPIPE).
        let (reader, writer) = std::io::pipe().unwrap();
        drop(reader);
        let (code, err) = run_into(&args, writer.into());
        assert_eq!(code, Some(3), "{args:?}: {err}");
        assert!(!err.contains("panicked"), "{args:?}: {err}");
        assert_eq!(err.lines().count(), 1, "{args:?}: {err}");
        assert!(
            err.starts_with("turnsheet: could not write the output"),
            "{err}"
        );
    }
}

#[test]
fn a_full_disk_ends_with_one_line_and_exit_3_never_a_panic() {
    let demo = demo_str();
    for args in [
        vec!["plan", demo.as_str()],
        vec!["chart", "--json", demo.as_str()],
        vec!["gas", "--litres", "12", "--pressure", "232", "--json"],
    ] {
        let full = std::fs::OpenOptions::new()
            .write(true)
            .open("/dev/full")
            .unwrap();
        let (code, err) = run_into(&args, full.into());
        assert_eq!(code, Some(3), "{args:?}: {err}");
        assert!(!err.contains("panicked"), "{err}");
        assert_eq!(err.lines().count(), 1, "{err}");
        assert!(err.contains("No space left"), "{err}");
    }
}

#[test]
fn gas_takes_negative_temperatures_without_an_equals_sign() {
    let out = bin()
        .args([
            "gas",
            "--litres",
            "12",
            "--pressure",
            "232",
            "--temp",
            "-2",
            "--to-temp",
            "-1.5",
            "--json",
        ])
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    // Warming at constant density raises the pressure a little.
    let after = v["pressure_after"].as_f64().unwrap();
    assert!(after > 232.0 && after < 235.0, "{after}");
    // A negative pressure is our message naming the field, not a parsing error.
    let out = bin()
        .args(["gas", "--litres", "12", "--pressure", "-5"])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("--pressure: must be above 0"));
}

fn plan_text(text: &[u8]) -> (i32, String, String) {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("team.json");
    std::fs::write(&path, text).unwrap();
    let out = bin().arg("plan").arg(&path).output().unwrap();
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn parse_errors_are_said_once_and_name_the_place() {
    for text in ["", "{\"units\": \"metric\", ", "[1, 2]", "{\"units\": 7}"] {
        let (code, out, err) = plan_text(text.as_bytes());
        assert_eq!(code, 2, "{text}: {err}");
        assert!(out.is_empty());
        assert!(!err.contains("team file: team file"), "{text}: {err}");
        assert!(
            !err.contains("?:"),
            "{text}: an unknown place is not shown as ?: {err}"
        );
        assert_eq!(err.lines().count(), 1, "{err}");
    }
    let (_, _, err) = plan_text(b"{\"units\": 7}");
    assert!(err.starts_with("turnsheet: units: "), "{err}");
    let (_, _, err) = plan_text(b"{\"units\": \"metric\", ");
    assert!(err.starts_with("turnsheet: team file: EOF"), "{err}");
}

#[test]
fn a_team_file_that_is_not_utf8_gets_a_byte_position() {
    let mut bytes = std::fs::read(demo_path()).unwrap();
    let at = bytes.windows(4).position(|w| w == b"Ines").unwrap();
    bytes[at + 1] = 0xFF;
    let line = bytes[..at].iter().filter(|&&b| b == b'\n').count() + 1;
    let (code, _, err) = plan_text(&bytes);
    assert_eq!(code, 2);
    assert!(
        err.contains(&format!("byte {} (line {line}, column", at + 1)),
        "{err}"
    );
    assert!(err.contains("TEAM"), "{err}");
}

#[test]
fn an_oversized_team_file_is_refused_before_reading() {
    let mut text = serde_json::to_string(&demo()).unwrap();
    text.push_str(&" ".repeat(1024 * 1024));
    let t0 = std::time::Instant::now();
    let (code, _, err) = plan_text(text.as_bytes());
    assert_eq!(code, 2);
    assert!(err.contains("the limit is 1 MB"), "{err}");
    assert!(t0.elapsed() < std::time::Duration::from_secs(5));
}

#[test]
fn a_huge_start_is_printed_as_a_number_not_a_saturated_integer() {
    let mut t = demo();
    t["divers"][0]["start"] = serde_json::json!(1e308);
    let (code, _, err) = plan_json(&t);
    assert_eq!(code, 2);
    assert!(err.contains("divers[0].start"), "{err}");
    assert!(err.contains("1e308"), "{err}");
    assert!(!err.contains("9223372036854775807"), "{err}");
}

#[test]
fn a_byte_order_mark_is_not_an_error() {
    let mut bytes = "\u{feff}".as_bytes().to_vec();
    bytes.extend(std::fs::read(demo_path()).unwrap());
    let (code, out, err) = plan_text(&bytes);
    assert_eq!(code, 0, "{err}");
    assert!(out.contains("Ines"), "{out}");
}

#[test]
fn a_card_without_a_date_says_when_it_was_made() {
    let out = bin().arg("card").arg(demo_path()).output().unwrap();
    assert_eq!(out.status.code(), Some(0));
    let svg = String::from_utf8_lossy(&out.stdout);
    let year = chrono::Local::now().format("%Y").to_string();
    assert!(svg.contains("made "), "no date on the card");
    assert!(svg.contains(&year), "no year on the card");
    let out = bin()
        .args(["card", demo_str().as_str(), "--date", "5 Dec"])
        .output()
        .unwrap();
    let svg = String::from_utf8_lossy(&out.stdout);
    assert!(
        svg.contains("5 Dec") && !svg.contains("made "),
        "the date given is kept"
    );
}
