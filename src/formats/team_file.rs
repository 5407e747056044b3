//! The team file: a team's inputs in the team's own units, as JSON.
//! Unknown keys are errors, so a typo never silently drops a value.

use serde::{Deserialize, Serialize};

use crate::plan::InputError;
use crate::plan::{
    CylinderSet, CylinderSpec, DiverInput, Gauge, Mix, PressureUnit, Rule, SetLabels, StageInput,
    TeamInput, UnitSystem, Water,
};

/// Longest set name a team file gives, in characters (a locker set's limit).
pub const MAX_SET_NAME_CHARS: usize = 40;

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct TeamFile {
    pub units: UnitSystem,
    #[serde(default = "default_rule")]
    pub rule: String,
    /// In the team's pressure unit; defaults to 10 bar / 100 psi.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub gauge_step: Option<f64>,
    /// °C for metric, °F for imperial; defaults to 20 °C / 68 °F.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub water_temp: Option<f64>,
    /// m for metric, ft for imperial.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub depth: Option<f64>,
    #[serde(default)]
    pub water: Water,
    pub divers: Vec<DiverFile>,
}

fn default_rule() -> String {
    "thirds".to_string()
}

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct DiverFile {
    pub name: String,
    /// What the diver calls these cylinders ("Cave 12s"); without it, the set's one name
    /// (`plan::set_name`).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub set_name: Option<String>,
    pub cylinders: CylindersFile,
    #[serde(default)]
    pub mix: Mix,
    /// Start pressure read in the water, in the diver's gauge unit.
    pub start: f64,
    /// Surface breathing rate in L/min (metric) or cu ft/min (imperial).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub sac: Option<f64>,
    /// An optional stage, dropped on the way in.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub stage: Option<StageFile>,
    /// The gauge this diver reads. Their `start` and stage `start` are in its unit.
    /// Without it the team's unit and `gauge_step` apply.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub gauge: Option<GaugeFile>,
}

/// A diver's own gauge: `{"unit": "bar"|"psi", "step": N}`. Without `step`, a gauge in
/// the team's unit reads the team's `gauge_step`; one in the other unit reads
/// 10 bar or 100 psi.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct GaugeFile {
    pub unit: PressureUnit,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub step: Option<f64>,
}

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct StageFile {
    /// What the diver calls the stage, as `set_name` of the diver.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub set_name: Option<String>,
    pub cylinders: CylindersFile,
    #[serde(default)]
    pub mix: Mix,
    /// Stage pressure read in the water, in the diver's gauge unit.
    pub start: f64,
}

#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct CylindersFile {
    #[serde(default = "one")]
    pub count: u8,
    /// A pair of independent cylinders (sidemount) rather than twins; only written
    /// when true, and read as false from files that do not have it.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub independent: bool,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub water_l: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub working_bar: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated_cuft: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub rated_psi: Option<f64>,
}

fn one() -> u8 {
    1
}

impl CylindersFile {
    pub fn from_set(set: &CylinderSet) -> Self {
        let mut f = CylindersFile {
            count: set.count,
            independent: set.is_independent_pair(),
            water_l: None,
            working_bar: None,
            rated_cuft: None,
            rated_psi: None,
        };
        match set.spec {
            CylinderSpec::Stamped {
                water_l,
                working_bar,
            } => {
                f.water_l = Some(water_l);
                f.working_bar = Some(working_bar);
            }
            CylinderSpec::Rated {
                rated_cuft,
                rated_psi,
            } => {
                f.rated_cuft = Some(rated_cuft);
                f.rated_psi = Some(rated_psi);
            }
        }
        f
    }

    pub fn to_set(&self, field: &str) -> Result<CylinderSet, InputError> {
        let spec = match (
            self.water_l,
            self.working_bar,
            self.rated_cuft,
            self.rated_psi,
        ) {
            (Some(water_l), Some(working_bar), None, None) => CylinderSpec::Stamped {
                water_l,
                working_bar,
            },
            (None, None, Some(rated_cuft), Some(rated_psi)) => CylinderSpec::Rated {
                rated_cuft,
                rated_psi,
            },
            _ => {
                return Err(InputError::new(
                    field,
                    "give either water_l and working_bar, or rated_cuft and rated_psi",
                ));
            }
        };
        Ok(CylinderSet {
            count: self.count,
            independent: self.independent && self.count == 2,
            spec,
        })
    }
}

/// A set name from a file: trimmed and normalised, 1 to [`MAX_SET_NAME_CHARS`]
/// characters, checked like a diver's name; the error names `field`.
pub fn check_set_label(field: &str, name: &str) -> Result<String, InputError> {
    let t = crate::plan::text::nfc(name.trim());
    let n = t.chars().count();
    if n == 0 || n > MAX_SET_NAME_CHARS {
        return Err(InputError::new(
            field,
            format!("a set name of 1 to {MAX_SET_NAME_CHARS} characters; got {n}"),
        ));
    }
    crate::plan::text::check_text(field, &t)?;
    Ok(t)
}

impl TeamFile {
    /// Parse JSON text; syntax errors and unknown keys name the place.
    /// Anything but white space after the document is refused with its line and column.
    pub fn parse(text: &str) -> Result<TeamFile, InputError> {
        let de = &mut serde_json::Deserializer::from_str(text);
        let file = serde_path_to_error::deserialize(&mut *de).map_err(|e| {
            // An unknown last segment (`?`, e.g. at the end of the text) names its parent.
            let path = e.path().to_string();
            let path = path.trim_end_matches('?').trim_end_matches('.');
            let field = if path.is_empty() {
                "team file".to_string()
            } else {
                path.to_string()
            };
            InputError::new(field, e.inner().to_string())
        })?;
        de.end().map_err(|e| {
            InputError::new(
                "team file",
                format!(
                    "text after the team's JSON document, at line {} column {}: a team file holds one JSON object and nothing after it",
                    e.line(),
                    e.column()
                ),
            )
        })?;
        Ok(file)
    }

    /// Convert to planning inputs (ranges are checked by `TeamInput::validate`).
    pub fn to_input(&self) -> Result<TeamInput, InputError> {
        let u = self.units;
        let rule = Rule::parse(&self.rule).ok_or_else(|| {
            InputError::new(
                "rule",
                format!(
                    "unknown rule '{}'; allowed: halves, thirds, quarters, fifths, sixths",
                    self.rule
                ),
            )
        })?;
        let team_step = self.gauge_step.unwrap_or(u.default_gauge_step());
        let divers = self
            .divers
            .iter()
            .enumerate()
            .map(|(i, d)| {
                let gauge = d.gauge.as_ref().map(|g| Gauge {
                    unit: g.unit,
                    step: g.step.unwrap_or(if g.unit == u.pressure_unit() {
                        team_step
                    } else {
                        g.unit.default_step()
                    }),
                });
                let unit = gauge.map_or(u.pressure_unit(), |g| g.unit);
                Ok(DiverInput {
                    name: crate::plan::text::nfc(&d.name),
                    cylinders: d.cylinders.to_set(&format!("divers[{i}].cylinders"))?,
                    mix: d.mix,
                    start: unit.pressure(d.start),
                    gauge,
                    sac_l_per_min: d.sac.map(|s| u.volume(s).litres()),
                    stage: match &d.stage {
                        None => None,
                        Some(st) => Some(StageInput {
                            cylinders: st
                                .cylinders
                                .to_set(&format!("divers[{i}].stage.cylinders"))?,
                            mix: st.mix,
                            start: unit.pressure(st.start),
                        }),
                    },
                })
            })
            .collect::<Result<Vec<_>, InputError>>()?;
        Ok(TeamInput {
            units: u,
            rule,
            gauge_step: team_step,
            water_temp: u.temperature(self.water_temp.unwrap_or(match u {
                UnitSystem::Metric => 20.0,
                UnitSystem::Imperial => 68.0,
            })),
            depth: self.depth.map(|d| u.depth(d)),
            water: self.water,
            divers,
        })
    }

    /// The set names the file gives (`set_name` of each diver and stage), in team order;
    /// empty where it gives none. A name is 1 to 40 characters once trimmed, checked like
    /// a diver's name.
    pub fn set_labels(&self) -> Result<SetLabels, InputError> {
        let label = |field: String, name: &Option<String>| match name {
            None => Ok(String::new()),
            Some(name) => check_set_label(&field, name),
        };
        let mut labels = SetLabels::default();
        for (i, d) in self.divers.iter().enumerate() {
            labels
                .sets
                .push(label(format!("divers[{i}].set_name"), &d.set_name)?);
            let stage = d.stage.as_ref().and_then(|st| st.set_name.clone());
            labels
                .stages
                .push(label(format!("divers[{i}].stage.set_name"), &stage)?);
        }
        Ok(labels)
    }

    /// The file form of planning inputs.
    pub fn from_input(t: &TeamInput) -> TeamFile {
        let u = t.units;
        TeamFile {
            units: u,
            rule: t.rule.name().to_string(),
            gauge_step: Some(t.gauge_step),
            water_temp: Some(round6(u.temperature_value(t.water_temp))),
            depth: t.depth.map(|d| {
                round6(match u {
                    UnitSystem::Metric => d.metres(),
                    UnitSystem::Imperial => d.feet(),
                })
            }),
            water: t.water,
            divers: t
                .divers
                .iter()
                .enumerate()
                .map(|(i, d)| {
                    let g = t.gauge_of(i);
                    DiverFile {
                        name: d.name.clone(),
                        set_name: None,
                        cylinders: CylindersFile::from_set(&d.cylinders),
                        mix: d.mix,
                        start: round6(g.value(d.start)),
                        gauge: d.gauge.map(|g| GaugeFile {
                            unit: g.unit,
                            step: Some(g.step),
                        }),
                        sac: d
                            .sac_l_per_min
                            .map(|s| round6(u.volume_value(crate::plan::Volume::from_litres(s)))),
                        stage: d.stage.as_ref().map(|st| StageFile {
                            set_name: None,
                            cylinders: CylindersFile::from_set(&st.cylinders),
                            mix: st.mix,
                            start: round6(g.value(st.start)),
                        }),
                    }
                })
                .collect(),
        }
    }
}

fn round6(x: f64) -> f64 {
    (x * 1e6).round() / 1e6
}

#[cfg(test)]
mod tests;
