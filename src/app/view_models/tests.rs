//! Tests of the shown texts: units kept together, rounding toward safety, rules and
//! errors in plain words.

use super::*;

#[test]
fn numbers_keep_their_units() {
    let t = keep_units_together("Twin 12 L 232 bar · 2 × 77.4 cu ft 3000 psi; 12 Liters");
    assert_eq!(
        t,
        "Twin 12\u{a0}L 232\u{a0}bar · 2\u{a0}× 77.4\u{a0}cu\u{a0}ft 3000\u{a0}psi; 12 Liters"
    );
    assert_eq!(
        keep_units_together("about 23 min to turn"),
        "about 23\u{a0}min to turn"
    );
}

#[test]
fn shown_pressures_round_toward_safety() {
    assert_eq!(
        start_text(UnitSystem::Metric, Pressure::from_bar(217.9)),
        "217"
    );
    assert_eq!(
        start_text(UnitSystem::Imperial, Pressure::from_psi(3000.0)),
        "3000"
    );
    let v = volume_down_text(UnitSystem::Metric, Volume::from_litres(4237.9));
    assert_eq!(v, "4237 L");
}

#[test]
fn rules_come_from_the_core() {
    assert_eq!(rule_symbols().len(), Rule::ALL.len());
    assert_eq!(rule_names()[1], "thirds");
    assert_eq!(
        rule_warning(Rule::Halves),
        "Halves is an open-water rule, not for overhead dives."
    );
    assert_eq!(rule_warning(Rule::Thirds), "");
    assert_eq!(rule_index(Rule::Quarters), 2);
}

#[test]
fn errors_read_without_field_paths() {
    let names = vec!["Ines".to_string(), "Bram".to_string()];
    let e = crate::plan::InputError::new("divers[1].stage.start", "5 bar is not a fill");
    assert_eq!(
        error_for_people(&names, &e),
        "Bram, stage start: 5 bar is not a fill"
    );
    let e = crate::plan::InputError::new("divers[0].cylinders.water_l", "too big");
    assert_eq!(
        error_for_people(&names, &e),
        "Ines, cylinders water capacity: too big"
    );
    let e = crate::plan::InputError::new("gauge_step", "out of range");
    assert_eq!(error_for_people(&names, &e), "Gauge step: out of range");
}

#[test]
fn locker_names_made_from_sizes_are_shown_in_the_readers_language() {
    use crate::i18n::{Language, LanguageScope};
    use crate::plan::{CylinderSet, CylinderSpec, Material};
    let (_dir, mut s) = crate::app::session::test_session();
    let set = CylinderSet::new(
        2,
        CylinderSpec::Stamped {
            water_l: 11.1,
            working_bar: 232.0,
        },
    );
    // Made in English, as a set saved from a diver's card is named.
    s.locker
        .add_set(&set.describe(), &set, Material::Steel)
        .unwrap();
    s.locker
        .add_set("Bram's doubles", &set, Material::Steel)
        .unwrap();
    let _de = LanguageScope::new(Language::German);
    let names: Vec<String> = super::locker_rows(&s).into_iter().map(|r| r.name).collect();
    assert!(
        names
            .iter()
            .any(|n| n.starts_with("Doppelgerät") && n.contains("11,1")),
        "{names:?}"
    );
    assert!(names.iter().any(|n| n == "Bram's doubles"), "{names:?}");
}

#[test]
fn field_names_in_errors_are_in_the_readers_language() {
    use crate::i18n::{Language, LanguageScope};
    let names = vec!["Ines".to_string(), "Bram".to_string()];
    let e = crate::plan::InputError::new("divers[1].stage.start", "x");
    let _de = LanguageScope::new(Language::German);
    assert_eq!(
        error_for_people(&names, &e),
        "Bram, Startdruck der Stage: x"
    );
    let e = crate::plan::InputError::new("divers[0].cylinders.water_l", "x");
    assert_eq!(
        error_for_people(&names, &e),
        "Ines, Wasservolumen der Flaschen: x"
    );
}
