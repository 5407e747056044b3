//! A team's planning inputs, in the team's own units, and their validation.

use super::cylinders::CylinderSet;
use super::error::{InputError, check_range};
use super::gauge::Gauge;
use super::mix::Mix;
use super::rule::Rule;
use super::units::{Depth, Pressure, Temperature, UnitSystem, Water};
use super::warning::{Supply, Warning};
use crate::i18n::{tr, tr_with};

pub use super::team_checks::{
    LOW_FILL_RATIO, MAX_CYLINDERS, MAX_DIVERS, MAX_FILL_RATIO, MAX_START_BAR, MAX_WATER_L,
    MIN_DIVERS, MIN_WATER_L, WATER_TEMP_RANGE_C, validate_start, validate_step,
};
use super::team_checks::{fill_warning, validate_supply};
pub(crate) use super::team_checks::{validate_cylinders, validate_mix};

/// A stage cylinder (or a pair) carried and dropped on the way in. Common practice:
/// each stage is planned on its own rule and matched on volume across the team, giving
/// each stage-carrying diver a drop pressure.
#[derive(Clone, Debug, PartialEq)]
pub struct StageInput {
    /// The stage cylinders.
    pub cylinders: CylinderSet,
    /// The gas in the stage.
    pub mix: Mix,
    /// Stage pressure read in the water (gauge).
    pub start: Pressure,
}

/// One diver's inputs.
#[derive(Clone, Debug, PartialEq)]
pub struct DiverInput {
    /// The diver's name: 1 to 24 characters once trimmed, and unlike every teammate's.
    pub name: String,
    /// The diver's main cylinders (back-mounted or sidemount), the stage left out.
    pub cylinders: CylinderSet,
    /// The gas in the main cylinders.
    pub mix: Mix,
    /// Start pressure read in the water (gauge).
    pub start: Pressure,
    /// Surface breathing rate, free litres per minute.
    pub sac_l_per_min: Option<f64>,
    /// An optional stage.
    pub stage: Option<StageInput>,
    /// The gauge this diver reads (unit and graduation); `None` follows the team's
    /// units and gauge step.
    pub gauge: Option<Gauge>,
}

/// A team's inputs.
#[derive(Clone, Debug, PartialEq)]
pub struct TeamInput {
    /// The team's unit system: the default gauge unit, and the unit in which water
    /// temperature, depth and breathing rates are checked and named in errors.
    pub units: UnitSystem,
    /// The gas rule: the fraction of the smallest supply each diver may spend going in.
    pub rule: Rule,
    /// Gauge step in the team's pressure unit, for divers without a gauge of their own.
    pub gauge_step: f64,
    /// Water temperature; the gas in every cylinder is taken to be at it. Accepted from
    /// −2 °C to 40 °C, in the team's unit widened out to whole degrees.
    pub water_temp: Temperature,
    /// Planned depth, if known (0 to 300 m, or 0 to 1000 ft): with a diver's breathing
    /// rate it gives the minutes to that diver's turn.
    pub depth: Option<Depth>,
    /// Fresh or sea water, for the ambient pressure at `depth`.
    pub water: Water,
    /// The divers, [`MIN_DIVERS`] to [`MAX_DIVERS`] of them. Errors and results name a
    /// diver by their index in this list.
    pub divers: Vec<DiverInput>,
}

impl TeamInput {
    /// Reject every out-of-range value with an error naming the field.
    pub fn validate(&self) -> Result<(), InputError> {
        let u = self.units;
        if self.divers.len() < MIN_DIVERS || self.divers.len() > MAX_DIVERS {
            return Err(InputError::new(
                "divers",
                tr_with(
                    "a team has {0} to {1} divers; this one has {2}",
                    &[&MIN_DIVERS, &MAX_DIVERS, &self.divers.len()],
                ),
            ));
        }
        validate_step("gauge_step", u.pressure_unit(), self.gauge_step)?;
        let (tlo, thi) = (
            u.temperature_value(Temperature::from_celsius(WATER_TEMP_RANGE_C.0)),
            u.temperature_value(Temperature::from_celsius(WATER_TEMP_RANGE_C.1)),
        );
        check_range(
            "water_temp",
            u.temperature_value(self.water_temp),
            tlo.floor(),
            thi.ceil(),
            u.temperature_label(),
        )?;
        if let Some(d) = self.depth {
            let hi = match u {
                UnitSystem::Metric => 300.0,
                UnitSystem::Imperial => 1000.0,
            };
            let v = match u {
                UnitSystem::Metric => d.metres(),
                UnitSystem::Imperial => d.feet(),
            };
            check_range("depth", v, 0.0, hi, u.depth_label())?;
        }
        for (i, d) in self.divers.iter().enumerate() {
            if let Some(g) = d.gauge {
                validate_step(&format!("divers[{i}].gauge.step"), g.unit, g.step)?;
            }
            validate_diver(u, self.gauge_of(i), i, d)?;
            if self.divers[..i]
                .iter()
                .any(|o| super::text::same_text(&o.name, &d.name))
            {
                return Err(InputError::new(
                    format!("divers[{i}].name"),
                    tr_with(
                        "another diver is already called {0}; names must differ",
                        &[&d.name.trim()],
                    ),
                ));
            }
        }
        Ok(())
    }

    /// The team's default gauge: its unit system's pressure unit and `gauge_step`.
    pub fn default_gauge(&self) -> Gauge {
        Gauge {
            unit: self.units.pressure_unit(),
            step: self.gauge_step,
        }
    }

    /// The gauge diver `i` reads: their own, or the team's default.
    pub fn gauge_of(&self, i: usize) -> Gauge {
        self.divers
            .get(i)
            .and_then(|d| d.gauge)
            .unwrap_or_else(|| self.default_gauge())
    }

    /// Non-fatal observations about the inputs, in each diver's own gauge unit.
    pub fn warnings(&self) -> Vec<Warning> {
        let mut w = Vec::new();
        if !self.rule.fit_for_overhead() {
            w.push(Warning::HalvesInOverhead);
        }
        let with_stage: Vec<usize> = (0..self.divers.len())
            .filter(|&i| self.divers[i].stage.is_some())
            .collect();
        if let [only] = with_stage[..] {
            w.push(Warning::LoneStage { diver: only });
        }
        for (i, d) in self.divers.iter().enumerate() {
            let g = self.gauge_of(i);
            fill_warning(
                &mut w,
                i,
                Supply::Main,
                g,
                d.start,
                d.cylinders.working_pressure(),
            );
            if let Some(st) = &d.stage {
                fill_warning(
                    &mut w,
                    i,
                    Supply::Stage,
                    g,
                    st.start,
                    st.cylinders.working_pressure(),
                );
            }
        }
        w
    }
}

fn validate_diver(u: UnitSystem, g: Gauge, i: usize, d: &DiverInput) -> Result<(), InputError> {
    let f = format!("divers[{i}]");
    let name = d.name.trim();
    if name.is_empty() || name.chars().count() > 24 {
        return Err(InputError::new(
            format!("{f}.name"),
            tr("a name of 1 to 24 characters is needed"),
        ));
    }
    super::text::check_name(&format!("{f}.name"), name)?;
    validate_supply(u, g, &f, &d.cylinders, &d.mix, d.start)?;
    if let Some(st) = &d.stage {
        validate_supply(
            u,
            g,
            &format!("{f}.stage"),
            &st.cylinders,
            &st.mix,
            st.start,
        )?;
    }
    if let Some(sac) = d.sac_l_per_min {
        let (v, lo, hi) = match u {
            UnitSystem::Metric => (sac, 3.0, 100.0),
            UnitSystem::Imperial => (sac / super::units::LITRES_PER_CUFT, 0.1, 3.5),
        };
        check_range(
            &format!("{f}.sac"),
            v,
            lo,
            hi,
            &format!("{}/min", u.volume_label()),
        )?;
    }
    Ok(())
}
