//! `turnsheet chart --mine SPEC --buddy SPEC`: a pairing chart for two cylinder sets,
//! without a team file, as text, CSV or SVG. Cells come from the same core and rules
//! as `plan` (same matching, same two models, same rounding).

use std::path::PathBuf;

use crate::formats::card_svg::charts_svg;
use crate::formats::cylinder_spec::parse_cylinder_spec;
use crate::plan::round_down_to_step;
use crate::plan::shown;
use crate::plan::validate_step;
use crate::plan::{
    CylinderSet, DiverInput, Mix, Rule, SetLabels, TeamInput, Temperature, UnitSystem, Water,
};
use crate::plan::{InputError, check_range};
use crate::plan::{PairChart, pair_chart};
use crate::storage::Store;

use super::{CliError, PressureUnit};

/// Output format of a pairing chart.
#[derive(clap::ValueEnum, Clone, Copy, Debug, PartialEq, Eq)]
pub enum ChartFormat {
    Text,
    Csv,
    Svg,
}

/// The options of a pairing chart for two sets.
#[derive(clap::Args, Debug, Clone)]
pub struct PairArgs {
    /// My set: a locker set's name, or COUNTxSIZE@RATING (2x12L@232bar, 1x80cuft@3000psi;
    /// a pair of independent cylinders adds :indep, 2x11.1L@207bar:indep).
    #[arg(long)]
    pub mine: Option<String>,
    /// The buddy's set, written the same way.
    #[arg(long)]
    pub buddy: Option<String>,
    /// The rule: thirds, quarters, fifths, sixths (halves is not for overhead).
    #[arg(long, default_value = "thirds")]
    pub rule: String,
    /// Gauge graduation (default 10 bar or 100 psi).
    #[arg(long)]
    pub step: Option<f64>,
    /// One end of the range of starts, both sets (default: each set's working pressure).
    #[arg(long, allow_negative_numbers = true)]
    pub from: Option<f64>,
    /// The other end (default: half of each set's working pressure). The two ends may be
    /// given in either order: the chart runs from the higher down to the lower.
    #[arg(long, allow_negative_numbers = true)]
    pub to: Option<f64>,
    /// Distance between rows and columns (default: the step).
    #[arg(long)]
    pub every: Option<f64>,
    /// Pressure unit: bar or psi (as for `gas --units`).
    #[arg(long = "units", alias = "unit", value_enum, default_value_t = PressureUnit::Bar)]
    pub unit: PressureUnit,
    /// Oxygen in both sets, percent.
    #[arg(long, default_value_t = 21.0)]
    pub o2: f64,
    /// Helium in both sets, percent.
    #[arg(long, default_value_t = 0.0)]
    pub he: f64,
    /// Water temperature, °C.
    #[arg(long, default_value_t = 20.0, allow_negative_numbers = true)]
    pub temp: f64,
    /// text, csv or svg.
    #[arg(long, value_enum, default_value = "text")]
    pub format: ChartFormat,
    /// Write here instead of standard output.
    #[arg(short = 'o', long = "output")]
    pub output: Option<PathBuf>,
}

impl PairArgs {
    /// The options given that only a chart of two sets reads (a team file brings its own
    /// rule, gases, water and gauges), by their command-line names.
    pub fn given_for_two_sets(&self) -> Vec<&'static str> {
        let mut given = Vec::new();
        let mut note = |is: bool, name: &'static str| {
            if is {
                given.push(name);
            }
        };
        note(self.rule != "thirds", "--rule");
        note(self.step.is_some(), "--step");
        note(self.from.is_some(), "--from");
        note(self.to.is_some(), "--to");
        note(self.every.is_some(), "--every");
        note(self.unit != PressureUnit::Bar, "--units");
        note(self.o2 != 21.0, "--o2");
        note(self.he != 0.0, "--he");
        note(self.temp != 20.0, "--temp");
        note(self.format != ChartFormat::Text, "--format");
        note(self.output.is_some(), "--output");
        given
    }
}

/// A set from a SPEC or, failing that, a locker set of that name (with the name).
fn set_of(field: &str, text: &str) -> Result<(CylinderSet, String), InputError> {
    match parse_cylinder_spec(text) {
        Ok(set) => Ok((set, String::new())),
        Err(spec_error) => {
            let mut store = Store::new(crate::storage::data_dir::desktop_data_dir());
            let found = store.load_locker();
            found.messages.iter().for_each(|m| super::say(m));
            let locker = found.locker;
            match locker.find_by_name(text).first() {
                Some(&k) => {
                    let e = &locker.entries[k];
                    Ok((e.cylinders.to_set(field)?, e.name.clone()))
                }
                None => Err(InputError::new(
                    field,
                    format!("no locker set is called that, and {}", spec_error.message),
                )),
            }
        }
    }
}

/// Starts from `from` down to `to` by `every`, highest first.
fn starts(from: f64, to: f64, every: f64) -> Vec<f64> {
    let mut v = Vec::new();
    let mut x = from;
    while x >= to - 1e-9 && v.len() < 41 {
        v.push(x);
        x -= every;
    }
    v
}

/// The two-diver team and the chart of "Me" against "Buddy".
pub fn pair(args: &PairArgs) -> Result<(TeamInput, PairChart), InputError> {
    pair_named(args).map(|(team, _, chart)| (team, chart))
}

/// [`pair`], with the locker names of the two sets (empty for a SPEC).
pub fn pair_named(args: &PairArgs) -> Result<(TeamInput, SetLabels, PairChart), InputError> {
    let (mine, my_name) = set_of("--mine", args.mine.as_deref().unwrap_or_default())?;
    let (buddy, buddy_name) = set_of("--buddy", args.buddy.as_deref().unwrap_or_default())?;
    let units = match args.unit {
        PressureUnit::Bar => UnitSystem::Metric,
        PressureUnit::Psi => UnitSystem::Imperial,
    };
    let unit = units.pressure_unit();
    let step = args.step.unwrap_or(unit.default_step());
    validate_step("--step", unit, step)?;
    let rule = Rule::parse(&args.rule).ok_or_else(|| {
        InputError::new(
            "--rule",
            "allowed: halves, thirds, quarters, fifths, sixths",
        )
    })?;
    check_range("--o2", args.o2, 5.0, 100.0, "%")?;
    check_range("--he", args.he, 0.0, 95.0, "%")?;
    if args.o2 + args.he > 100.0 {
        return Err(InputError::new("--he", "O2 + He is above 100 %"));
    }
    check_range("--temp", args.temp, -2.0, 40.0, "°C")?;
    let every = args.every.unwrap_or(step);
    check_range(
        "--every",
        every,
        step.min(1.0),
        unit.step_range().1 * 4.0,
        unit.label(),
    )?;
    let range = |set: &CylinderSet| -> Result<Vec<f64>, InputError> {
        let wp = unit.value(set.working_pressure());
        let from = args.from.unwrap_or(round_down_to_step(wp, step));
        let to = args.to.unwrap_or(round_down_to_step(wp / 2.0, step));
        let top = unit.value(crate::plan::Pressure::from_bar(400.0));
        check_range("--from", from, step, top, unit.label())?;
        check_range("--to", to, step, top, unit.label())?;
        // Either order: the rows run from the higher end down.
        Ok(starts(from.max(to), from.min(to), every))
    };
    let (rows, cols) = (range(&mine)?, range(&buddy)?);
    let mix = Mix {
        o2: args.o2 / 100.0,
        he: args.he / 100.0,
    };
    let diver = |name: &str, set: CylinderSet, start: f64| DiverInput {
        name: name.into(),
        cylinders: set,
        mix,
        start: unit.pressure(start),
        sac_l_per_min: None,
        stage: None,
        gauge: None,
    };
    let team = TeamInput {
        units,
        rule,
        gauge_step: step,
        water_temp: Temperature::from_celsius(args.temp),
        depth: None,
        water: Water::Fresh,
        divers: vec![diver("Me", mine, rows[0]), diver("Buddy", buddy, cols[0])],
    };
    let chart = pair_chart(&team, 0, 1, &rows, &cols)?;
    let labels = SetLabels {
        sets: vec![my_name, buddy_name],
        stages: Vec::new(),
    };
    Ok((team, labels, chart))
}

/// The chart as CSV: first row the buddy's starts, first column mine, cells my turn.
pub fn csv(chart: &PairChart) -> String {
    let mut s = format!(
        "mine {}\\buddy {}",
        chart.my_gauge.label(),
        chart.buddy_gauge.label()
    );
    for b in &chart.buddy_starts {
        s.push(',');
        s.push_str(&shown::num(*b));
    }
    s.push('\n');
    for (r, m) in chart.my_starts.iter().enumerate() {
        s.push_str(&shown::num(*m));
        for cell in &chart.turns[r] {
            s.push(',');
            if let Some(t) = cell {
                s.push_str(&shown::num(*t));
            }
        }
        s.push('\n');
    }
    s
}

/// Run the pairing chart.
pub fn run(args: &PairArgs) -> Result<String, CliError> {
    let (team, labels, chart) = pair_named(args)?;
    let text = match args.format {
        ChartFormat::Csv => csv(&chart),
        ChartFormat::Svg => charts_svg(&team, std::slice::from_ref(&chart)),
        ChartFormat::Text => {
            super::chart_cmd::chart_text(&team, std::slice::from_ref(&chart), &labels)
        }
    };
    match &args.output {
        None => Ok(text),
        Some(path) => {
            super::card_cmd::write(path, &text)?;
            Ok(format!("chart written to {}\n", super::shown_path(path)))
        }
    }
}
