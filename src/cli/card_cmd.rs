//! `turnsheet card TEAM.json [-o card.svg] [--charts] [--lang CODE]`: the printable team
//! card, in English or in another language the app speaks.

use std::path::{Path, PathBuf};

use crate::formats::card_svg::{CardHeading, card_svg};
use crate::i18n::{Language, LanguageScope, tr_with};
use crate::plan::InputError;
use crate::plan::team_charts;

use super::CliError;
use super::plan_cmd::{named, plan_named, read_named_team};

/// Arguments of `card`.
#[derive(clap::Args, Debug)]
pub struct CardArgs {
    /// The team file (JSON), as for `plan`.
    pub team: PathBuf,
    /// Write the SVG here instead of standard output.
    #[arg(short = 'o', long = "output")]
    pub output: Option<PathBuf>,
    /// Add each diver's pairing charts against every teammate, one page each.
    #[arg(long)]
    pub charts: bool,
    /// The dive's name, printed on top.
    #[arg(long)]
    pub dive: Option<String>,
    /// The date, printed on top as written (default: when the card is made, so an old
    /// card never looks current).
    #[arg(long)]
    pub date: Option<String>,
    /// The card's language, by catalogue code: en, es, fr, de, it or pt_BR (default en).
    /// Words and decimal separators follow it; messages on the terminal stay English.
    #[arg(long, value_name = "CODE")]
    pub lang: Option<String>,
}

/// The language asked for with `--lang`; an unknown code is refused with the list.
fn language(code: Option<&str>) -> Result<Language, InputError> {
    let Some(code) = code else {
        return Ok(Language::English);
    };
    Language::from_code(code.trim()).ok_or_else(|| {
        let codes: Vec<&str> = Language::ALL.iter().map(|l| l.code()).collect();
        InputError::new(
            "--lang",
            format!(
                "'{}' is not a language the card is written in; use one of {}",
                crate::plan::text::shown(code),
                codes.join(", ")
            ),
        )
    })
}

/// The card's SVG text for a team file.
pub fn card_text(args: &CardArgs) -> Result<String, InputError> {
    let lang = language(args.lang.as_deref())?;
    let (team, labels) = read_named_team(&args.team)?;
    let plan = plan_named(&team)?;
    let charts = if args.charts {
        team_charts(&team, 2, 7).map_err(|e| named(e, &team))?
    } else {
        Vec::new()
    };
    for (flag, v) in [("--dive", &args.dive), ("--date", &args.date)] {
        if let Some(v) = v {
            if v.chars().count() > 40 {
                return Err(InputError::new(flag, "at most 40 characters"));
            }
            crate::plan::text::check_text(flag, v)?;
        }
    }
    let _lang = LanguageScope::new(lang);
    // Month names come from the clock's library in English: other languages get figures.
    let made = match lang {
        Language::English => chrono::Local::now().format("%-d %b %Y %H:%M"),
        _ => chrono::Local::now().format("%Y-%m-%d %H:%M"),
    };
    let heading = CardHeading {
        dive: args.dive.clone(),
        date: Some(
            args.date
                .clone()
                .unwrap_or_else(|| tr_with("made {0}", &[&made])),
        ),
        read_at: Vec::new(),
        labels,
    };
    Ok(card_svg(&heading, &team, &plan, &charts))
}

/// Run `card`: the SVG to standard output, or to the file with a line saying where.
pub fn run(args: &CardArgs) -> Result<String, CliError> {
    let svg = card_text(args)?;
    match &args.output {
        None => Ok(svg),
        Some(path) => {
            write(path, &svg)?;
            Ok(format!("card written to {}\n", super::shown_path(path)))
        }
    }
}

/// Write an output file whole or not at all (`storage::atomic::write_text`): on failure
/// the file that was there is untouched, and the message says so.
pub fn write(path: &Path, text: &str) -> Result<(), CliError> {
    crate::storage::atomic::write_text(path, text)
        .map_err(|e| CliError::Write(format!("cannot write {}: {e}", super::shown_path(path))))
}
