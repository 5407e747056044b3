//! The command line: `plan` prints a team's turn pressures, `gas` a cylinder's contents,
//! `chart` pairing charts, `locker` the app's cylinder sets.
//! Exit codes: 0 ok, 2 bad input (the message names the field), 3 a file or the output
//! could not be written (full disk, closed pipe, read-only directory), 4 the locker could
//! not be read (set aside, or left in place; the message says which). Never a panic.

pub mod card_cmd;
pub mod chart_cmd;
pub mod gas_cmd;
pub mod locker_cmd;
pub mod locker_files;
pub mod pair_chart_cmd;
pub mod plan_cmd;
pub mod plan_report;

use std::io::Write;

use clap::{Parser, Subcommand};

use crate::plan::InputError;

/// Exit code for bad input.
pub const EXIT_BAD_INPUT: i32 = 2;
/// Exit code when the output or a file could not be written.
pub const EXIT_WRITE_FAILED: i32 = 3;
/// Exit code when the locker could not be read this time (`locker list`, `locker export`).
pub const EXIT_UNREADABLE: i32 = 4;

/// Why a command failed.
#[derive(Debug)]
pub enum CliError {
    /// Bad input: the message names the field.
    Input(InputError),
    /// A file could not be written (the message says which and why).
    Write(String),
    /// The locker could not be read (the lines on standard error say why and where it
    /// went); the text is still printed to standard output.
    Unreadable(String),
}

impl From<InputError> for CliError {
    fn from(e: InputError) -> Self {
        CliError::Input(e)
    }
}

#[derive(Parser, Debug)]
#[command(
    name = "turnsheet",
    version,
    about = "Team turn pressures for overhead dives with dissimilar cylinders, matched on gas volume.",
    long_about = "Team turn pressures for overhead dives with dissimilar cylinders, matched on gas volume.\n\n\
Without a command, opens the app. Every turn pressure shown is the higher (more conservative) of a \
real-gas (GERG-2008) and a tank-factor calculation, rounded up to each diver's own gauge graduation, in that diver's unit.\n\n\
A planning aid for trained divers: team protocol, training standards and local rules come first. \
Check the numbers by hand. No warranty."
)]
pub struct Cli {
    #[command(subcommand)]
    pub command: Option<Command>,
}

#[derive(Subcommand, Debug)]
pub enum Command {
    /// Plan a team from a team file and print each diver's turn pressure.
    ///
    /// Team file (JSON; pressures, gauge step, depth and SAC in the team's units):
    /// {"units": "metric"|"imperial", "rule": "thirds", "gauge_step": 10, "water_temp": 20,
    ///  "depth": 30, "water": "fresh"|"salt",
    ///  "divers": [{"name": "…", "cylinders": {"count": 2, "water_l": 12, "working_bar": 232},
    ///              "mix": {"o2": 0.32, "he": 0.0}, "start": 220, "sac": 18}]}
    /// Cylinders may instead be {"count": 2, "rated_cuft": 80, "rated_psi": 3000}; a pair
    /// that is not on a manifold (sidemount) adds "independent": true.
    /// A diver who reads another gauge adds "gauge": {"unit": "bar"|"psi", "step": 5};
    /// their start (and stage start) is then in that unit, and so are their turns.
    /// Without "step", a gauge in the other unit reads 10 bar or 100 psi.
    /// A diver may carry a stage: "stage": {"cylinders": {...}, "mix": {...}, "start": 200};
    /// stages are matched on volume among the divers who carry one and get a drop pressure.
    /// A diver (or a stage) may name the set: "set_name": "Cave 12s" (1 to 40 characters);
    /// without it a set is called as in the app: a generic size's name, else its sizes.
    /// water_temp is °C (metric) or °F (imperial); mix defaults to air; unknown keys are errors.
    /// The app's saved team (last-team.json in the data directory) is read too, with the
    /// names the app gave the sets.
    Plan {
        /// The team file (JSON).
        team: std::path::PathBuf,
        /// Print machine-readable JSON instead of a table.
        #[arg(long)]
        json: bool,
    },
    /// A printable team card (SVG, 100 × 150 mm, black on white) for a notebook page or a
    /// slate, with each diver's pairing charts on following pages if asked.
    Card(card_cmd::CardArgs),
    /// Gas content of a cylinder (both models), and its pressure after a temperature change.
    Gas(gas_cmd::GasArgs),
    /// Print pairing charts: each diver's turn for a range of own and teammate start
    /// pressures, to re-match a changed fill without a phone.
    ///
    /// With more than one teammate, read the chart against each teammate and keep the
    /// HIGHEST turn.
    Chart {
        /// The team file (JSON), as for `plan`; or give --mine and --buddy instead.
        team: Option<std::path::PathBuf>,
        /// Gauge steps above each planned start (team file).
        #[arg(long, default_value_t = 2)]
        above: usize,
        /// Gauge steps below each planned start (team file).
        #[arg(long, default_value_t = 7)]
        below: usize,
        /// Print machine-readable JSON (team file).
        #[arg(long)]
        json: bool,
        #[command(flatten)]
        pair: pair_chart_cmd::PairArgs,
    },
    /// Your cylinder sets (the app's locker): list, add, remove, and swap them with
    /// other divers through a file.
    ///
    /// The locker is locker.json in the data directory: TURNSHEET_DATA_DIR if set, else
    /// the per-user data directory (on Linux ~/.local/share/turnsheet). A locker file that
    /// cannot be read is moved aside (locker.json.unreadable-TIME), never overwritten,
    /// and the command carries on with an empty locker.
    #[command(
        after_help = "SPEC is COUNTxSIZE@RATING: 2x12L@232bar (two 12 L cylinders, 232 bar \
working pressure, twins on a manifold) or 1x80cuft@3000psi (one cylinder rated 80 cu ft at \
3000 psi). A pair of independent cylinders (sidemount) adds :indep: 2x11.1L@207bar:indep."
    )]
    Locker {
        #[command(subcommand)]
        action: locker_cmd::LockerAction,
    },
}

/// A pressure unit on the command line: `--units bar|psi` for `gas` and `chart`
/// (`--unit` is read too).
#[derive(clap::ValueEnum, Clone, Copy, Debug, PartialEq, Eq)]
pub enum PressureUnit {
    /// Bar (also read as `metric`).
    #[value(alias = "metric")]
    Bar,
    /// Psi (also read as `imperial`).
    #[value(alias = "imperial")]
    Psi,
}

/// Run a parsed command; returns the process exit code.
pub fn run(command: Command) -> i32 {
    let mut notes = Vec::new();
    let result = match command {
        Command::Card(args) => card_cmd::run(&args),
        Command::Plan { team, json } => plan_cmd::run(&team, json).map_err(CliError::from),
        Command::Gas(args) => gas_cmd::run(&args).map_err(CliError::from),
        Command::Chart {
            team,
            above,
            below,
            json,
            pair,
        } => match (team, &pair.mine, &pair.buddy) {
            (Some(team), None, None) => match pair.given_for_two_sets().as_slice() {
                [] => chart_cmd::run(&team, above, below, json).map_err(CliError::from),
                given => Err(CliError::Input(InputError::new(
                    given[0],
                    format!(
                        "only a chart of two sets (--mine and --buddy) reads {}; a team file's chart takes its rule, gases, water and gauges from the file and prints to standard output (use --above, --below, --json, or `card --charts` for paper)",
                        given.join(", ")
                    ),
                ))),
            },
            (None, Some(_), Some(_)) => pair_chart_cmd::run(&pair),
            _ => Err(CliError::Input(InputError::new(
                "chart",
                "give a team file, or --mine SPEC and --buddy SPEC (SPEC: a locker set's name or COUNTxSIZE@RATING, e.g. 2x12L@232bar, or 2x11.1L@207bar:indep for independent cylinders)",
            ))),
        },
        Command::Locker { action } => locker_cmd::run(
            &action,
            &crate::storage::data_dir::desktop_data_dir(),
            &mut notes,
        ),
    };
    for note in &notes {
        say(note);
    }
    match result {
        Ok(text) => match write_stdout(&text) {
            Ok(()) => 0,
            Err(e) => {
                say(&format!("could not write the output: {e}"));
                EXIT_WRITE_FAILED
            }
        },
        Err(CliError::Input(e)) => {
            say(&e.to_string());
            EXIT_BAD_INPUT
        }
        Err(CliError::Write(e)) => {
            say(&e);
            EXIT_WRITE_FAILED
        }
        Err(CliError::Unreadable(text)) => {
            if let Err(e) = write_stdout(&text) {
                say(&format!("could not write the output: {e}"));
            }
            EXIT_UNREADABLE
        }
    }
}

/// A path as printed to the terminal: control characters and the other characters refused
/// in names (bidirectional controls, invisible characters) are written as `\u{…}`, so
/// a file name can never drive the terminal or hide part of itself.
pub fn shown_path(path: &std::path::Path) -> String {
    path.display()
        .to_string()
        .chars()
        .map(|c| {
            if c.is_control() || crate::plan::text::refused_char(c).is_some() {
                format!("\\u{{{:04x}}}", c as u32)
            } else {
                c.to_string()
            }
        })
        .collect()
}

/// Write all of `text` to standard output and flush it; the error is returned, never a panic.
pub fn write_stdout(text: &str) -> std::io::Result<()> {
    let mut out = std::io::stdout().lock();
    out.write_all(text.as_bytes())?;
    out.flush()
}

/// One line on standard error, prefixed with the program name, cut to a readable length
/// (messages can quote a file). Failing to write it is ignored: there is nowhere left to
/// report it.
pub fn say(line: &str) {
    let line = crate::storage::atomic::one_line(line, 600);
    let _ = writeln!(std::io::stderr().lock(), "turnsheet: {line}");
}
