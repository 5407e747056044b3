//! The Settings and Cautions pages.

use super::super::session::Session;
use super::{rule_index, step_index, step_labels, temperature_text};
use crate::i18n::{Language, tr_with};
use crate::plan::{Temperature, UnitSystem};
use crate::storage::settings::ThemeChoice;

pub struct SettingsVm {
    pub imperial: bool,
    pub rule_index: i32,
    pub step_options: Vec<String>,
    pub step_index: i32,
    pub water_temp: String,
    pub about: String,
    /// "System (Deutsch)", then each language in its own name.
    pub language_options: Vec<String>,
    pub language_index: i32,
    /// The screen's colours, by place in `ThemeChoice::ALL`.
    pub theme_index: i32,
    pub theme: ThemeChoice,
}

pub fn settings(s: &Session) -> SettingsVm {
    let cfg = &s.settings;
    SettingsVm {
        imperial: cfg.units == UnitSystem::Imperial,
        rule_index: rule_index(cfg.rule),
        step_options: step_labels(cfg.units),
        step_index: step_index(cfg.units, cfg.gauge_step()),
        water_temp: temperature_text(cfg.units, Temperature::from_celsius(cfg.water_temp_c)),
        language_options: std::iter::once(tr_with(
            "System ({0})",
            &[&s.system_language.own_name()],
        ))
        .chain(Language::ALL.iter().map(|l| l.own_name().to_string()))
        .collect(),
        language_index: s.language_choice() as i32,
        theme_index: ThemeChoice::ALL
            .iter()
            .position(|t| *t == cfg.theme)
            .unwrap_or(0) as i32,
        theme: cfg.theme,
        about: tr_with(
            "Turnsheet {0} · free software under the GNU GPL, version 3 or later · built with Slint {1} (used under its GPL-3.0 licence) · real-gas contents by GERG-2008 (the aga8 crate) · Roboto fonts under the Apache License 2.0 · data in {2}",
            &[
                &env!("CARGO_PKG_VERSION"),
                &"1.18.1",
                &s.data_dir().display(),
            ],
        ),
    }
}

/// The cautions, one paragraph each.
pub fn cautions() -> Vec<String> {
    super::super::cautions::cautions()
}
