//! The team file read and written back.

use super::*;

const TEXT: &str = r#"{"units":"imperial","rule":"quarters","gauge_step":100,"water_temp":68,"depth":90,"water":"salt",
  "divers":[{"name":"A","cylinders":{"count":2,"rated_cuft":80,"rated_psi":3000},"start":3000,"sac":0.6},
            {"name":"B","cylinders":{"count":1,"water_l":12,"working_bar":232},"mix":{"o2":0.32,"he":0},"start":3300,
             "stage":{"cylinders":{"rated_cuft":40,"rated_psi":3000},"mix":{"o2":0.5},"start":3000}}]}"#;

#[test]
fn round_trips_through_input() {
    let f = TeamFile::parse(TEXT).unwrap();
    let input = f.to_input().unwrap();
    assert_eq!(input.rule, Rule::Quarters);
    let back = TeamFile::from_input(&input);
    assert_eq!(back.to_input().unwrap(), input);
    assert_eq!(back.divers[0].sac, Some(0.6));
}

#[test]
fn a_diver_may_read_another_unit() {
    // Diver B reads a bar gauge in an imperial team: start 232 is bar, step 5 bar.
    let t = TEXT.replace(
        "\"start\":3300,",
        "\"start\":232,\"gauge\":{\"unit\":\"bar\",\"step\":5},",
    );
    let input = TeamFile::parse(&t).unwrap().to_input().unwrap();
    let b = &input.divers[1];
    assert!((b.start.bar() - 232.0).abs() < 1e-9);
    assert_eq!(
        input.gauge_of(1),
        Gauge {
            unit: PressureUnit::Bar,
            step: 5.0
        }
    );
    // Diver A has no gauge: the team's psi and step.
    assert_eq!(input.gauge_of(0).unit, PressureUnit::Psi);
    assert_eq!(input.gauge_of(0).step, 100.0);
    let back = TeamFile::from_input(&input);
    assert_eq!(back.divers[1].start, 232.0);
    assert_eq!(back.to_input().unwrap(), input);
    // No step, other unit: the usual 10 bar.
    let t = t.replace(",\"step\":5", "");
    let input = TeamFile::parse(&t).unwrap().to_input().unwrap();
    assert_eq!(input.gauge_of(1).step, 10.0);
}

#[test]
fn set_names_are_read_and_checked() {
    let t = TEXT.replace(r#"{"name":"A","#, r#"{"name":"A","set_name":" Cave 80s ","#);
    let f = TeamFile::parse(&t).unwrap();
    let labels = f.set_labels().unwrap();
    assert_eq!(labels.sets, ["Cave 80s", ""]);
    assert_eq!(labels.stages, ["", ""]);
    let long = t.replace("Cave 80s", &"x".repeat(41));
    let e = TeamFile::parse(&long).unwrap().set_labels().unwrap_err();
    assert_eq!(e.field, "divers[0].set_name", "{e}");
    let stage = TEXT.replace(r#""stage":{"#, r#""stage":{"set_name":"","#);
    let e = TeamFile::parse(&stage).unwrap().set_labels().unwrap_err();
    assert_eq!(e.field, "divers[1].stage.set_name", "{e}");
}

#[test]
fn unknown_key_is_an_error() {
    let e = TeamFile::parse(&TEXT.replace("\"water\":\"salt\"", "\"watr\":\"salt\"")).unwrap_err();
    assert!(e.message.contains("watr"), "{e}");
}

#[test]
fn type_errors_name_the_field() {
    let e = TeamFile::parse(&TEXT.replace("\"count\":2", "\"count\":300")).unwrap_err();
    assert_eq!(e.field, "divers[0].cylinders.count", "{e}");
    let e = TeamFile::parse(&TEXT.replace("\"start\":3300", "\"start\":\"full\"")).unwrap_err();
    assert_eq!(e.field, "divers[1].start", "{e}");
}

#[test]
fn half_a_cylinder_spec_is_an_error() {
    let t = TEXT.replace("\"rated_psi\":3000", "\"working_bar\":200");
    let e = TeamFile::parse(&t).unwrap().to_input().unwrap_err();
    assert_eq!(e.field, "divers[0].cylinders");
}
