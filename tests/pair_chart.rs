//! Pairing charts for two cylinder sets without a team file (`chart --mine --buddy`):
//! every CSV cell equals `plan_team` of the two-diver team it stands for, in metric and
//! imperial, and bad SPECs name the form.

use proptest::prelude::*;
use turnsheet::cli::PressureUnit;
use turnsheet::cli::pair_chart_cmd::{ChartFormat, PairArgs, csv, pair};
use turnsheet::plan::plan_team;

fn args(mine: &str, buddy: &str, unit: PressureUnit) -> PairArgs {
    PairArgs {
        mine: Some(mine.into()),
        buddy: Some(buddy.into()),
        rule: "thirds".into(),
        step: None,
        from: None,
        to: None,
        every: None,
        unit,
        o2: 32.0,
        he: 0.0,
        temp: 15.0,
        format: ChartFormat::Csv,
        output: None,
    }
}

const SPECS: [&str; 6] = [
    "2x12L@232bar",
    "1x18L@232bar",
    "2x8.5L@300bar",
    "2x77.4cuft@3000psi",
    "1x40cuft@3000psi",
    "2x104cuft@2640psi",
];

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]

    #[test]
    fn csv_cells_are_the_plan_of_the_pair(
        m in 0usize..SPECS.len(),
        b in 0usize..SPECS.len(),
        imperial in any::<bool>(),
        r in 0usize..40,
        c in 0usize..40,
    ) {
        let unit = if imperial { PressureUnit::Psi } else { PressureUnit::Bar };
        let (team, chart) = pair(&args(SPECS[m], SPECS[b], unit)).unwrap();
        let text = csv(&chart);
        let lines: Vec<Vec<&str>> = text.lines().map(|l| l.split(',').collect()).collect();
        let r = r % chart.my_starts.len();
        let c = c % chart.buddy_starts.len();
        // Header and first column carry the starts.
        let mine: f64 = lines[r + 1][0].parse().unwrap();
        let theirs: f64 = lines[0][c + 1].parse().unwrap();
        prop_assert_eq!(mine, chart.my_starts[r]);
        prop_assert_eq!(theirs, chart.buddy_starts[c]);
        let mut t = team.clone();
        t.divers[0].start = t.default_gauge().pressure(mine);
        t.divers[1].start = t.default_gauge().pressure(theirs);
        let expected = plan_team(&t).ok().map(|p| p.divers[0].turn_shown_value);
        let cell = lines[r + 1][c + 1];
        match expected {
            Some(turn) => prop_assert_eq!(cell.parse::<f64>().unwrap(), turn),
            None => prop_assert_eq!(cell, ""),
        }
    }
}

#[test]
fn a_bad_spec_shows_the_form() {
    // A SPEC that does not parse is looked up as a locker set's name: use an empty
    // data directory of our own, never the user's. Only this test reads the variable.
    let dir = tempfile::tempdir().unwrap();
    unsafe { std::env::set_var("TURNSHEET_DATA_DIR", dir.path()) };
    for bad in ["2x12@232", "twelve", "3x12L@3000psi", ""] {
        let e = pair(&args(bad, "2x12L@232bar", PressureUnit::Bar)).unwrap_err();
        assert!(e.message.contains("COUNTxSIZE@RATING"), "{bad}: {e}");
        assert_eq!(e.field, "--mine");
    }
}

#[test]
fn the_range_of_starts_may_be_given_in_either_order() {
    let mut a = args("2x12L@232bar", "1x18L@232bar", PressureUnit::Bar);
    (a.from, a.to) = (Some(220.0), Some(150.0));
    let (_, down) = pair(&a).unwrap();
    (a.from, a.to) = (Some(150.0), Some(220.0));
    let (_, up) = pair(&a).unwrap();
    assert_eq!(down.my_starts, up.my_starts);
    assert_eq!(down.turns, up.turns);
    assert_eq!(up.my_starts.first(), Some(&220.0));
    assert_eq!(up.my_starts.last(), Some(&150.0));
    // Each end is still checked on its own and names its option.
    (a.from, a.to) = (Some(150.0), Some(900.0));
    assert_eq!(pair(&a).unwrap_err().field, "--to");
}
