//! Pairing charts for two cylinder sets without a team file (`chart --mine --buddy`):
//! every CSV cell equals `plan_team` of the two-diver team it stands for, in metric and
//! imperial, and bad SPECs name the form.

use proptest::prelude::*;
use turnsheet::cli::pair_chart_cmd::{ChartFormat, ChartUnits, PairArgs, csv, pair};
use turnsheet::plan::plan_team;

fn args(mine: &str, buddy: &str, units: ChartUnits) -> PairArgs {
    PairArgs {
        mine: Some(mine.into()),
        buddy: Some(buddy.into()),
        rule: "thirds".into(),
        step: None,
        from: None,
        to: None,
        every: None,
        units,
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
        let units = if imperial { ChartUnits::Imperial } else { ChartUnits::Metric };
        let (team, chart) = pair(&args(SPECS[m], SPECS[b], units)).unwrap();
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
        let e = pair(&args(bad, "2x12L@232bar", ChartUnits::Metric)).unwrap_err();
        assert!(e.message.contains("COUNTxSIZE@RATING"), "{bad}: {e}");
        assert_eq!(e.field, "--mine");
    }
}
