//! Teams whose divers read different gauges (bar and psi, different graduations), checked
//! against turns computed independently with CoolProp (PyPI `coolprop`, HEOS reference
//! equations) by `tests/reference/make_mixed_teams.py`; the version is in the file's
//! "source" field. The teams in it are invented.

use serde_json::Value;
use turnsheet::formats::team_file::TeamFile;
use turnsheet::plan::{PressureUnit, plan_team};

fn unit(v: &Value) -> PressureUnit {
    PressureUnit::parse(v.as_str().unwrap()).unwrap()
}

/// Distance from `x` to the nearest multiple of `step`.
fn off_grid(x: f64, step: f64) -> f64 {
    let r = x - (x / step).round() * step;
    r.abs()
}

#[test]
fn mixed_gauge_teams_match_the_coolprop_reference() {
    let text = include_str!("reference/mixed_teams.json");
    let data: Value = serde_json::from_str(text).unwrap();
    let source = data["source"].as_str().unwrap();
    assert!(source.starts_with("CoolProp "), "source must be recorded");
    let mut checked = 0;
    for case in data["teams"].as_array().unwrap() {
        let file: TeamFile = serde_json::from_value(case["team"].clone()).unwrap();
        let input = file.to_input().unwrap();
        let plan = plan_team(&input).unwrap();
        let helium = file
            .divers
            .iter()
            .any(|d| d.mix.he > 0.0 || d.stage.as_ref().is_some_and(|s| s.mix.he > 0.0));
        for (d, e) in plan.divers.iter().zip(case["expected"].as_array().unwrap()) {
            assert_eq!(d.name, e["name"].as_str().unwrap());
            assert_eq!(d.gauge.unit, unit(&e["unit"]), "{}", d.name);
            assert_eq!(d.gauge.step, e["step"].as_f64().unwrap(), "{}", d.name);
            let (er, eh, et) = (
                e["turn_real"].as_f64().unwrap(),
                e["turn_hand"].as_f64().unwrap(),
                e["turn"].as_f64().unwrap(),
            );
            // Pencil arithmetic is exact; real gas within the GERG-2008 / HEOS agreement
            // (0.3 % of the start for air and nitrox, 1.5 % with helium in the team: our
            // own tolerances).
            let start = d.gauge.value(d.start);
            let tol = start * if helium { 0.015 } else { 0.003 };
            assert!(
                (d.gauge.value(d.turn_hand) - eh).abs() < 1e-3,
                "{}: hand {} vs {eh}",
                d.name,
                d.gauge.value(d.turn_hand)
            );
            assert!(
                (d.gauge.value(d.turn_real) - er).abs() < tol,
                "{}: real {} vs {er}",
                d.name,
                d.gauge.value(d.turn_real)
            );
            // The shown turn is equal unless the reference's exact turn sits so near a
            // graduation that the two equations of state may round it apart.
            let higher = er.max(eh);
            if off_grid(higher, d.gauge.step) > tol {
                assert_eq!(d.turn_shown_value, et, "{}", d.name);
            } else {
                assert!(
                    (d.turn_shown_value - et).abs() <= d.gauge.step,
                    "{}",
                    d.name
                );
            }
            assert!(
                off_grid(d.turn_shown_value, d.gauge.step) < 1e-9 || d.turn_shown_value == start
            );
            if let Some(drop) = e.get("stage_drop").and_then(Value::as_f64) {
                let st = d.stage.as_ref().expect("stage plan");
                let eh = e["stage_drop_hand"].as_f64().unwrap();
                assert!(
                    (d.gauge.value(st.drop_hand) - eh).abs() < 1e-3,
                    "{}",
                    d.name
                );
                let er = e["stage_drop_real"].as_f64().unwrap();
                if off_grid(er.max(eh), d.gauge.step) > tol {
                    assert_eq!(st.drop_shown_value, drop, "{} stage", d.name);
                }
            }
            checked += 1;
        }
    }
    assert!(checked >= 8, "only {checked} divers checked");
}
