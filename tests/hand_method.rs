//! Worked gas-matching cases done by hand with tank factors (common practice: the
//! volume-matching method taught for dissimilar cylinders). The tank-factor model must
//! reproduce the hand arithmetic exactly; the shown turn is never below it.

use turnsheet::plan::{
    CylinderSet, CylinderSpec, DiverInput, Mix, ModelKind, Pressure, Rule, TeamInput, Temperature,
    UnitSystem, Water, plan_team,
};

fn stamped(count: u8, water_l: f64, working_bar: f64) -> CylinderSet {
    CylinderSet {
        count,
        independent: false,
        spec: CylinderSpec::Stamped {
            water_l,
            working_bar,
        },
    }
}

fn rated(count: u8, rated_cuft: f64, rated_psi: f64) -> CylinderSet {
    CylinderSet {
        count,
        independent: false,
        spec: CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        },
    }
}

fn diver(name: &str, cylinders: CylinderSet, start: Pressure) -> DiverInput {
    DiverInput {
        name: name.into(),
        cylinders,
        mix: Mix::AIR,
        start,
        sac_l_per_min: None,
        stage: None,
        gauge: None,
    }
}

fn team(units: UnitSystem, rule: Rule, step: f64, divers: Vec<DiverInput>) -> TeamInput {
    TeamInput {
        units,
        rule,
        gauge_step: step,
        water_temp: Temperature::from_celsius(20.0),
        depth: None,
        water: Water::Fresh,
        divers,
    }
}

#[test]
fn identical_twins_turn_at_two_thirds_of_start() {
    // Common practice: identical cylinders and fills reduce to the gauge rule of thirds.
    // Twin 12 L at 210 bar: a third is 70 bar, turn at 140 bar.
    let t = team(
        UnitSystem::Metric,
        Rule::Thirds,
        10.0,
        vec![
            diver("A", stamped(2, 12.0, 232.0), Pressure::from_bar(210.0)),
            diver("B", stamped(2, 12.0, 232.0), Pressure::from_bar(210.0)),
        ],
    );
    let plan = plan_team(&t).unwrap();
    for d in &plan.divers {
        assert!(
            (d.turn_hand.bar() - 140.0).abs() < 1e-9,
            "{}",
            d.turn_hand.bar()
        );
        assert_eq!(d.turn_shown_value, 140.0);
        // Real gas says a little lower; the hand turn is kept.
        assert!(d.turn_real.bar() < 140.0);
        assert_eq!(d.set_by, ModelKind::Hand);
    }
    assert!(plan.stress.margin >= 1.0 - 1e-9);
}

#[test]
fn metric_worked_case_by_hand() {
    // Worked by hand (tank factor = water capacity, litres per bar):
    //   A: twin 12 L = 24 L/bar at 220 bar → 5280 L; a third = 1760 L
    //   B: twin 7 L = 14 L/bar at 280 bar → 3920 L; a third = 1306.7 L  → B controls
    //   A drops 1306.7 / 24 = 54.44 bar → turn 165.56 → shown 170 bar (round up to 10)
    //   B drops 1306.7 / 14 = 93.33 bar → turn 186.67 → shown 190 bar
    let t = team(
        UnitSystem::Metric,
        Rule::Thirds,
        10.0,
        vec![
            diver("A", stamped(2, 12.0, 232.0), Pressure::from_bar(220.0)),
            diver("B", stamped(2, 7.0, 300.0), Pressure::from_bar(280.0)),
        ],
    );
    let plan = plan_team(&t).unwrap();
    let allowance = 14.0 * 280.0 / 3.0;
    let a_turn = 220.0 - allowance / 24.0;
    let b_turn = 280.0 - allowance / 14.0;
    assert!((plan.divers[0].turn_hand.bar() - a_turn).abs() < 1e-9);
    assert!((plan.divers[1].turn_hand.bar() - b_turn).abs() < 1e-9);
    assert_eq!(plan.controlling, 1);
    assert!(plan.divers[0].turn_shown_value >= 170.0);
    assert!(plan.divers[1].turn_shown_value >= 190.0);
}

#[test]
fn tank_factors_are_the_rating_per_unit_of_pressure() {
    // Tank factors (common practice): cu ft per 100 psi is the rated volume over the
    // rated pressure times 100, and a metric cylinder holds its water capacity per bar.
    // Worked by hand, on sizes of our own choosing:
    //   aluminium 40 cu ft @ 3000 psi: 40 / 3000 × 100 = 1.3333 cu ft per 100 psi
    //   steel 95 cu ft @ 2640 psi:     95 / 2640 × 100 = 3.5985 cu ft per 100 psi
    //   7 L at 232 bar: 7 × 232 = 1624 L;  15 L at 232 bar: 15 × 232 = 3480 L
    use turnsheet::plan::{ContentModel, HandModel};
    let per_100_psi = |set: CylinderSet| {
        HandModel
            .content(set.water(ModelKind::Hand), Pressure::from_psi(100.0))
            .cuft()
    };
    assert!((per_100_psi(rated(1, 40.0, 3000.0)) - 1.3333).abs() < 1e-4);
    assert!((per_100_psi(rated(1, 95.0, 2640.0)) - 3.5985).abs() < 1e-4);
    // At the rated pressure a rated cylinder holds its rating, and half of it at half.
    let forty = rated(1, 40.0, 3000.0).water(ModelKind::Hand);
    assert!((HandModel.content(forty, Pressure::from_psi(3000.0)).cuft() - 40.0).abs() < 1e-9);
    assert!((HandModel.content(forty, Pressure::from_psi(1500.0)).cuft() - 20.0).abs() < 1e-9);
    let litres = |water_l: f64| {
        HandModel
            .content(
                stamped(1, water_l, 232.0).water(ModelKind::Hand),
                Pressure::from_bar(232.0),
            )
            .litres()
    };
    assert_eq!(litres(7.0), 1624.0);
    assert_eq!(litres(15.0), 3480.0);
}

#[test]
fn imperial_worked_case_by_hand() {
    // Worked by hand with tank factors (rated cu ft ÷ rated psi), an invented pairing:
    //   A: twin 63 cu ft @ 3000 psi = 4.2 cu ft per 100 psi; at 2900 psi 121.8 cu ft,
    //      a third 40.6 cu ft → A controls
    //   B: twin 120 cu ft @ 3442 psi = 6.9727 cu ft per 100 psi; at 3300 psi 230.1 cu ft
    //   A drops 40.6 / 4.2 × 100 = 966.7 psi → 1933.3 → shown 2000 psi
    //   B drops 40.6 / 6.9727 × 100 = 582.3 psi → 2717.7 → shown 2800 psi
    let t = team(
        UnitSystem::Imperial,
        Rule::Thirds,
        100.0,
        vec![
            diver("A", rated(2, 63.0, 3000.0), Pressure::from_psi(2900.0)),
            diver("B", rated(2, 120.0, 3442.0), Pressure::from_psi(3300.0)),
        ],
    );
    let plan = plan_team(&t).unwrap();
    let tf_a: f64 = 2.0 * 63.0 / 3000.0; // cu ft per psi
    let tf_b: f64 = 2.0 * 120.0 / 3442.0;
    let allowance = tf_a * 2900.0 / 3.0;
    assert!((allowance - 40.6).abs() < 1e-9);
    let a_turn = 2900.0 - allowance / tf_a;
    let b_turn = 3300.0 - allowance / tf_b;
    assert_eq!(plan.controlling, 0);
    assert!((plan.divers[0].turn_hand.psi() - a_turn).abs() < 1e-6);
    assert!((plan.divers[1].turn_hand.psi() - b_turn).abs() < 1e-6);
    assert!((b_turn - 2717.7).abs() < 0.05, "{b_turn}");
    assert!((plan.team_allowance_hand.cuft() - 40.6).abs() < 1e-6);
    // Shown turns: never below the hand turn rounded up to 100 psi.
    assert!(plan.divers[0].turn_shown_value >= 2000.0);
    assert!(plan.divers[1].turn_shown_value >= 2800.0);
}

/// The same physical team, a bar diver and a psi diver, planned as a metric team and as
/// an imperial team. Worked by hand (common practice tank factors):
///   A: twin 12 L at 220 bar (bar gauge, 10 bar) = 24 × 220 = 5280 L
///   B: twin 63 cu ft @ 3000 psi at 3000 psi (psi gauge, 100 psi) = 126 cu ft = 3567.9 L
///   B controls; a third = 42 cu ft = 1189.3 L
///   A drops 1189.3 / 24 = 49.55 bar → 170.45 → 180 bar; B drops 1000 psi → 2000 psi.
#[test]
fn mixed_bar_and_psi_team_by_hand_both_ways() {
    use turnsheet::plan::{Gauge, PressureUnit};
    let bar = Gauge {
        unit: PressureUnit::Bar,
        step: 10.0,
    };
    let psi = Gauge {
        unit: PressureUnit::Psi,
        step: 100.0,
    };
    for units in [UnitSystem::Metric, UnitSystem::Imperial] {
        let mut a = diver("A", stamped(2, 12.0, 232.0), Pressure::from_bar(220.0));
        a.gauge = Some(bar);
        let mut b = diver("B", rated(2, 63.0, 3000.0), Pressure::from_psi(3000.0));
        b.gauge = Some(psi);
        let t = team(units, Rule::Thirds, units.default_gauge_step(), vec![a, b]);
        let plan = plan_team(&t).unwrap();
        // 1 cu ft = 28.316846592 L exactly: the foot is 0.3048 m exactly (NIST SP 811,
        // 2008 edition, Appendix B), and 0.3048³ m³ = 0.028316846592 m³.
        let b_litres = 126.0 * 28.316_846_592;
        assert!((0.3048f64.powi(3) * 1000.0 - 28.316_846_592).abs() < 1e-12);
        assert_eq!(turnsheet::plan::LITRES_PER_CUFT, 28.316_846_592);
        assert!((plan.divers[0].content_hand.litres() - 5280.0).abs() < 1e-9);
        assert!((plan.divers[1].content_hand.litres() - b_litres).abs() < 1e-9);
        assert_eq!(plan.controlling, 1, "{units:?}");
        let allowance = b_litres / 3.0;
        assert!((plan.divers[0].turn_hand.bar() - (220.0 - allowance / 24.0)).abs() < 1e-9);
        assert!((plan.divers[1].turn_hand.psi() - 2000.0).abs() < 1e-6);
        // Each turn on its own gauge: A in bar on 10 bar, B in psi on 100 psi.
        assert_eq!(plan.divers[0].gauge, bar);
        assert_eq!(plan.divers[1].gauge, psi);
        assert!(plan.divers[0].turn_shown_value >= 180.0);
        assert_eq!(plan.divers[0].turn_shown_value % 10.0, 0.0);
        assert!(plan.divers[1].turn_shown_value >= 2000.0);
        assert_eq!(plan.divers[1].turn_shown_value % 100.0, 0.0);
    }
}

#[test]
fn stricter_rules_turn_earlier() {
    // Common practice: quarters and sixths keep more in reserve than thirds.
    let mk = |rule| {
        let t = team(
            UnitSystem::Metric,
            rule,
            5.0,
            vec![
                diver("A", stamped(2, 12.0, 232.0), Pressure::from_bar(220.0)),
                diver("B", stamped(1, 18.0, 232.0), Pressure::from_bar(210.0)),
                diver("C", stamped(2, 10.0, 300.0), Pressure::from_bar(290.0)),
            ],
        );
        plan_team(&t).unwrap()
    };
    let thirds = mk(Rule::Thirds);
    let quarters = mk(Rule::Quarters);
    let sixths = mk(Rule::Sixths);
    for i in 0..3 {
        assert!(quarters.divers[i].turn_shown_value >= thirds.divers[i].turn_shown_value);
        assert!(sixths.divers[i].turn_shown_value >= quarters.divers[i].turn_shown_value);
    }
    assert!(quarters.stress.margin >= 1.5 - 1e-9);
    assert!(sixths.stress.margin >= 2.5 - 1e-9);
}

#[test]
fn high_fill_real_gas_is_lower_than_hand_and_hand_is_kept() {
    // Common practice: at high fills exact real-gas thirds turn lower than the hand method;
    // the shown turn keeps the hand method's margin.
    let t = team(
        UnitSystem::Metric,
        Rule::Thirds,
        10.0,
        vec![
            diver("A", stamped(2, 12.0, 300.0), Pressure::from_bar(300.0)),
            diver("B", stamped(2, 15.0, 232.0), Pressure::from_bar(232.0)),
        ],
    );
    let plan = plan_team(&t).unwrap();
    for d in &plan.divers {
        assert!(d.turn_real.bar() < d.turn_hand.bar());
        assert!(d.turn_shown.bar() >= d.turn_hand.bar() - 1e-9);
    }
}

#[test]
fn stages_are_matched_on_volume_like_the_main_gas() {
    // Worked by hand (common practice: each stage on its own thirds, matched across the team):
    //   A: stage 11.1 L at 200 bar → 2220 L; a third 740 L
    //   B: stage 7 L at 200 bar → 1400 L; a third 466.7 L → B's stage controls
    //   A drops 466.7 / 11.1 = 42.04 bar → 157.96 → shown 160 bar
    //   B drops 466.7 / 7 = 66.67 bar → 133.33 → shown 140 bar
    use turnsheet::plan::StageInput;
    let mut t = team(
        UnitSystem::Metric,
        Rule::Thirds,
        10.0,
        vec![
            diver("A", stamped(2, 12.0, 232.0), Pressure::from_bar(220.0)),
            diver("B", stamped(2, 12.0, 232.0), Pressure::from_bar(220.0)),
            diver("C", stamped(2, 12.0, 232.0), Pressure::from_bar(220.0)),
        ],
    );
    t.divers[0].stage = Some(StageInput {
        cylinders: stamped(1, 11.1, 207.0),
        mix: Mix::nitrox(0.5),
        start: Pressure::from_bar(200.0),
    });
    t.divers[1].stage = Some(StageInput {
        cylinders: stamped(1, 7.0, 232.0),
        mix: Mix::nitrox(0.5),
        start: Pressure::from_bar(200.0),
    });
    let plan = plan_team(&t).unwrap();
    let allowance = 7.0 * 200.0 / 3.0;
    let a = plan.divers[0].stage.as_ref().unwrap();
    let b = plan.divers[1].stage.as_ref().unwrap();
    assert!((a.drop_hand.bar() - (200.0 - allowance / 11.1)).abs() < 1e-9);
    assert!((b.drop_hand.bar() - (200.0 - allowance / 7.0)).abs() < 1e-9);
    assert_eq!(a.drop_shown_value, 160.0);
    assert_eq!(b.drop_shown_value, 140.0);
    assert!(b.controlling && !a.controlling);
    assert!(plan.divers[2].stage.is_none());
    // The main gas plan is unchanged by stages.
    t.divers[0].stage = None;
    t.divers[1].stage = None;
    let without = plan_team(&t).unwrap();
    for (x, y) in plan.divers.iter().zip(&without.divers) {
        assert_eq!(x.turn_shown_value, y.turn_shown_value);
    }
}

#[test]
fn slower_breathers_have_used_less_when_the_team_turns() {
    // Common practice: the diver with the higher breathing rate reaches the
    // allowance first; at that moment the others have used less. Identical twins, SAC 20
    // and 10 L/min at one depth: when A turns, B has used half of A's gas.
    let mut t = team(
        UnitSystem::Metric,
        Rule::Thirds,
        10.0,
        vec![
            diver("A", stamped(2, 12.0, 232.0), Pressure::from_bar(210.0)),
            diver("B", stamped(2, 12.0, 232.0), Pressure::from_bar(210.0)),
        ],
    );
    t.depth = Some(turnsheet::plan::Depth::from_metres(20.0));
    t.divers[0].sac_l_per_min = Some(20.0);
    t.divers[1].sac_l_per_min = Some(10.0);
    let plan = plan_team(&t).unwrap();
    assert_eq!(plan.first_to_turn, Some(0));
    let c = plan.divers[0].content_real.litres();
    let u_a = plan.divers[0].used_real.litres();
    let u_b = u_a / 2.0;
    // Worst pair: B fails, A donates: (C - u_A) / (u_A + u_B).
    let expected = ((c - u_a) / (u_a + u_b)).min((c - u_b) / (u_a + u_b));
    let at_turn = plan.stress_at_first_turn.as_ref().unwrap().margin;
    assert!((at_turn - expected).abs() < 1e-9, "{at_turn} vs {expected}");
    assert!(at_turn > plan.stress.margin);
    // Without every breathing rate there is no such figure.
    t.divers[1].sac_l_per_min = None;
    assert!(plan_team(&t).unwrap().stress_at_first_turn.is_none());
}
