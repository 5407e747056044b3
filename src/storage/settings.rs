//! App settings.

use serde::de::DeserializeOwned;
use serde::{Deserialize, Serialize};
use serde_json::{Map, Value};

use super::atomic::{WithinLimits, one_line};

use crate::plan::WATER_TEMP_RANGE_C;
use crate::plan::shown;
use crate::plan::{PressureUnit, Rule, UnitSystem};

pub const SETTINGS_SCHEMA: u32 = 1;

/// The screen's colours: the system's dark or light setting, or one of them always
/// (light for bright sun).
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum ThemeChoice {
    #[default]
    System,
    Dark,
    Light,
}

impl ThemeChoice {
    /// In the order the Settings page offers them.
    pub const ALL: [ThemeChoice; 3] = [ThemeChoice::Dark, ThemeChoice::Light, ThemeChoice::System];
}

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Settings {
    pub schema: u32,
    pub units: UnitSystem,
    /// Default gauge step for metric teams, bar.
    pub gauge_step_bar: f64,
    /// Default gauge step for imperial teams, psi.
    pub gauge_step_psi: f64,
    pub rule: Rule,
    /// Water temperature, °C (shown in °F for imperial).
    pub water_temp_c: f64,
    /// The cautions were read and acknowledged.
    pub cautions_acknowledged: bool,
    /// The language chosen in Settings (a catalogue code such as "de"); none follows
    /// the system's.
    #[serde(default)]
    pub language: Option<String>,
    /// Screen colours. Files written before it existed follow the system.
    #[serde(default)]
    pub theme: ThemeChoice,
}

impl Default for Settings {
    fn default() -> Self {
        Settings {
            schema: SETTINGS_SCHEMA,
            units: UnitSystem::Metric,
            gauge_step_bar: 10.0,
            gauge_step_psi: 100.0,
            rule: Rule::Thirds,
            water_temp_c: 20.0,
            cautions_acknowledged: false,
            language: None,
            theme: ThemeChoice::System,
        }
    }
}

impl Settings {
    pub fn gauge_step(&self) -> f64 {
        match self.units {
            UnitSystem::Metric => self.gauge_step_bar,
            UnitSystem::Imperial => self.gauge_step_psi,
        }
    }
}

/// The size limit on the file is enough; ranges are checked where the values are used.
impl WithinLimits for Settings {}

/// A settings file as found: any JSON object. `Settings::from_found` checks each field
/// on its own, so that one bad value does not cost the others.
#[derive(Debug, Deserialize)]
#[serde(transparent)]
pub struct FoundSettings(pub Map<String, Value>);

impl WithinLimits for FoundSettings {}

/// One field: its value if it has the right type and passes `check`, else the default
/// and a message naming the field. A missing field takes the default quietly (a file
/// written before the field existed).
fn field<T: DeserializeOwned>(
    found: &mut Map<String, Value>,
    key: &str,
    default: T,
    shown_default: &str,
    check: impl Fn(&T) -> Result<(), String>,
    notes: &mut Vec<String>,
) -> T {
    let Some(v) = found.remove(key) else {
        return default;
    };
    let shown = one_line(&v.to_string(), 40);
    let why = match serde_json::from_value::<T>(v) {
        Ok(x) => match check(&x) {
            Ok(()) => return x,
            Err(why) => why,
        },
        Err(e) => one_line(&e.to_string(), 120),
    };
    notes.push(format!(
        "{key}: {shown} is not usable ({why}); back to {shown_default}"
    ));
    default
}

/// Any value of the right type.
fn any<T>(_: &T) -> Result<(), String> {
    Ok(())
}

fn within(lo: f64, hi: f64, unit: &'static str) -> impl Fn(&f64) -> Result<(), String> {
    move |x: &f64| {
        if x.is_finite() && (lo..=hi).contains(x) {
            Ok(())
        } else {
            Err(format!(
                "allowed {} to {} {unit}",
                shown::num(lo),
                shown::num(hi)
            ))
        }
    }
}

impl Settings {
    /// Settings from a file's fields. A field of the wrong type, an unknown name or a
    /// value out of range goes back to its default; every other field is kept. Returns
    /// one message per field reset (and per unknown field dropped).
    pub fn from_found(found: FoundSettings) -> (Settings, Vec<String>) {
        let mut m = found.0;
        let d = Settings::default();
        let mut notes = Vec::new();
        m.remove("schema");
        let units = field(&mut m, "units", d.units, "metric", any, &mut notes);
        let (blo, bhi) = PressureUnit::Bar.step_range();
        let (plo, phi) = PressureUnit::Psi.step_range();
        let gauge_step_bar = field(
            &mut m,
            "gauge_step_bar",
            d.gauge_step_bar,
            "10 bar",
            within(blo, bhi, "bar"),
            &mut notes,
        );
        let gauge_step_psi = field(
            &mut m,
            "gauge_step_psi",
            d.gauge_step_psi,
            "100 psi",
            within(plo, phi, "psi"),
            &mut notes,
        );
        let rule = field(&mut m, "rule", d.rule, "thirds", any, &mut notes);
        let (tlo, thi) = WATER_TEMP_RANGE_C;
        let water_temp_c = field(
            &mut m,
            "water_temp_c",
            d.water_temp_c,
            "20 °C",
            within(tlo, thi, "°C"),
            &mut notes,
        );
        let cautions_acknowledged = field(
            &mut m,
            "cautions_acknowledged",
            false,
            "not yet read",
            any,
            &mut notes,
        );
        let language = field(
            &mut m,
            "language",
            None,
            "the system's",
            |code: &Option<String>| match code {
                Some(c) if crate::i18n::Language::from_code(c).is_none() => {
                    Err("not a language the app speaks".to_string())
                }
                _ => Ok(()),
            },
            &mut notes,
        );
        let theme = field(&mut m, "theme", d.theme, "system", any, &mut notes);
        for key in m.keys() {
            notes.push(format!("{}: not a setting; left out", one_line(key, 40)));
        }
        let settings = Settings {
            schema: SETTINGS_SCHEMA,
            units,
            gauge_step_bar,
            gauge_step_psi,
            rule,
            water_temp_c,
            cautions_acknowledged,
            language,
            theme,
        };
        (settings, notes)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn found(v: serde_json::Value) -> FoundSettings {
        FoundSettings(v.as_object().unwrap().clone())
    }

    #[test]
    fn a_bad_field_goes_back_to_its_default_and_the_rest_stay() {
        let good = serde_json::json!({"schema": 1, "units": "imperial", "gauge_step_bar": 5.0,
            "gauge_step_psi": 50.0, "rule": "quarters", "water_temp_c": 12.0,
            "cautions_acknowledged": true});
        let (s, notes) = Settings::from_found(found(good.clone()));
        assert!(notes.is_empty(), "{notes:?}");
        assert_eq!(
            (s.units, s.rule, s.gauge_step_psi),
            (UnitSystem::Imperial, Rule::Quarters, 50.0)
        );

        let mut bad = good.clone();
        bad["water_temp_c"] = serde_json::json!(300.0);
        bad["gauge_step_bar"] = serde_json::json!(0);
        bad["rule"] = serde_json::json!("tenths");
        let (s, notes) = Settings::from_found(found(bad));
        assert_eq!(notes.len(), 3, "{notes:?}");
        assert!(
            notes.iter().any(|n| n.starts_with(
                "water_temp_c: 300.0 is not usable (allowed -2 to 40 °C); back to 20 °C"
            )),
            "{notes:?}"
        );
        assert!(
            notes.iter().any(|n| n.starts_with("gauge_step_bar: 0")),
            "{notes:?}"
        );
        assert!(
            notes
                .iter()
                .any(|n| n.starts_with("rule: \"tenths\"") && n.contains("unknown variant")),
            "{notes:?}"
        );
        assert_eq!(s.water_temp_c, 20.0);
        assert_eq!(s.gauge_step_bar, 10.0);
        assert_eq!(s.rule, Rule::Thirds);
        assert_eq!(s.units, UnitSystem::Imperial, "the good fields stay");
        assert_eq!(s.gauge_step_psi, 50.0);
        assert!(s.cautions_acknowledged);

        let (s, notes) =
            Settings::from_found(found(serde_json::json!({"schema": 1, "colour": "red"})));
        assert_eq!(s, Settings::default());
        assert_eq!(notes, ["colour: not a setting; left out"]);
    }

    #[test]
    fn the_theme_is_kept_and_an_older_file_follows_the_system() {
        // A file written before the theme setting existed: every field as it was, the
        // theme follows the system, and nothing is reported.
        let old = serde_json::json!({"schema": 1, "units": "metric", "gauge_step_bar": 5.0,
            "gauge_step_psi": 100.0, "rule": "thirds", "water_temp_c": 14.0,
            "cautions_acknowledged": true});
        let (s, notes) = Settings::from_found(found(old.clone()));
        assert!(notes.is_empty(), "{notes:?}");
        assert_eq!(s.theme, ThemeChoice::System);
        assert_eq!((s.gauge_step_bar, s.water_temp_c), (5.0, 14.0));
        let direct: Settings = serde_json::from_value(old).unwrap();
        assert_eq!(direct.theme, ThemeChoice::System);

        let light = Settings {
            theme: ThemeChoice::Light,
            ..Settings::default()
        };
        let text = serde_json::to_string(&light).unwrap();
        assert!(text.contains("\"theme\":\"light\""), "{text}");
        let back: serde_json::Value = serde_json::from_str(&text).unwrap();
        let (s, notes) = Settings::from_found(found(back));
        assert!(notes.is_empty(), "{notes:?}");
        assert_eq!(s.theme, ThemeChoice::Light);

        let (s, notes) = Settings::from_found(found(serde_json::json!({"theme": "sepia"})));
        assert_eq!(s.theme, ThemeChoice::System);
        assert!(notes[0].starts_with("theme: \"sepia\""), "{notes:?}");
        assert!(notes[0].ends_with("back to system"), "{notes:?}");
    }
}
