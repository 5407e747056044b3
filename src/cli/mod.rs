//! The command line: `plan` prints a team's turn pressures, `gas` a cylinder's contents.
//! Exit codes: 0 ok, 2 bad input (the message names the field).

pub mod card_cmd;
pub mod chart_cmd;
pub mod gas_cmd;
pub mod plan_cmd;
pub mod plan_report;

use clap::{Parser, Subcommand};

/// Exit code for bad input.
pub const EXIT_BAD_INPUT: i32 = 2;

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
    /// Cylinders may instead be {"count": 2, "rated_cuft": 80, "rated_psi": 3000}.
    /// A diver who reads another gauge adds "gauge": {"unit": "bar"|"psi", "step": 5};
    /// their start (and stage start) is then in that unit, and so are their turns.
    /// Without "step", a gauge in the other unit reads 10 bar or 100 psi.
    /// A diver may carry a stage: "stage": {"cylinders": {...}, "mix": {...}, "start": 200};
    /// stages are matched on volume among the divers who carry one and get a drop pressure.
    /// water_temp is °C (metric) or °F (imperial); mix defaults to air; unknown keys are errors.
    Plan {
        /// The team file (JSON).
        team: std::path::PathBuf,
        /// Print machine-readable JSON instead of a table.
        #[arg(long)]
        json: bool,
    },
    /// A printable team card (SVG, 100 × 150 mm, black on white) for wet notes, with
    /// each diver's pairing charts on following pages if asked.
    Card(card_cmd::CardArgs),
    /// Gas content of a cylinder (both models), and its pressure after a temperature change.
    Gas(gas_cmd::GasArgs),
    /// Print wet-notes charts: each diver's turn for a range of own and teammate start
    /// pressures, to re-match a changed fill without a phone.
    ///
    /// With more than one teammate, read the chart against each teammate and keep the
    /// HIGHEST turn.
    Chart {
        /// The team file (JSON), as for `plan`.
        team: std::path::PathBuf,
        /// Gauge steps above each planned start.
        #[arg(long, default_value_t = 2)]
        above: usize,
        /// Gauge steps below each planned start.
        #[arg(long, default_value_t = 7)]
        below: usize,
        /// Print machine-readable JSON.
        #[arg(long)]
        json: bool,
    },
}

#[derive(clap::ValueEnum, Clone, Copy, Debug, PartialEq, Eq)]
pub enum PressureUnit {
    Bar,
    Psi,
}

/// Run a parsed command; returns the process exit code.
pub fn run(command: Command) -> i32 {
    let result = match command {
        Command::Plan { team, json } => plan_cmd::run(&team, json),
        Command::Gas(args) => gas_cmd::run(&args),
        Command::Card(args) => card_cmd::run(&args),
        Command::Chart {
            team,
            above,
            below,
            json,
        } => chart_cmd::run(&team, above, below, json),
    };
    match result {
        Ok(text) => {
            print!("{text}");
            0
        }
        Err(e) => {
            eprintln!("turnsheet: {e}");
            EXIT_BAD_INPUT
        }
    }
}
