//! A team's planning inputs, in the team's own units, and their validation.

use super::cylinders::{CylinderSet, CylinderSpec};
use super::error::{InputError, check_range};
use super::gas_model::ModelKind;
use super::mix::Mix;
use super::rule::Rule;
use super::shown;
use super::units::{Depth, Gauge, Pressure, PressureUnit, Temperature, UnitSystem, Water};
use super::warning::{OVERFILL_SHARE, Supply, Warning};
use crate::i18n::{tr, tr_with};

/// Fewest divers in a team.
pub const MIN_DIVERS: usize = 2;
/// Most divers in a team.
pub const MAX_DIVERS: usize = 6;
/// Most cylinders in one set (a diver's main set or a stage).
pub const MAX_CYLINDERS: u8 = 4;
/// Highest start pressure accepted, bar (gauge); also the highest stamped working
/// pressure.
pub const MAX_START_BAR: f64 = 400.0;
/// Highest start pressure as a multiple of working pressure. Cave fills of
/// low-pressure steel run about 1.36× (common practice).
pub const MAX_FILL_RATIO: f64 = 1.5;
/// Smallest water capacity of one cylinder, litres. For a rated cylinder the
/// capacity checked is the one the real-gas model derives from the rating.
pub const MIN_WATER_L: f64 = 0.5;
/// Largest water capacity of one cylinder, litres (checked as for [`MIN_WATER_L`]).
pub const MAX_WATER_L: f64 = 30.0;
/// Below this share of working pressure a start pressure draws a low-fill warning.
pub const LOW_FILL_RATIO: f64 = 0.5;

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

/// A start compared with the working pressure on the diver's own gauge: above it by more
/// than half a graduation, an overfill of more than 10 %, or under half of it.
fn fill_warning(
    out: &mut Vec<Warning>,
    diver: usize,
    supply: Supply,
    g: Gauge,
    start: Pressure,
    working: Pressure,
) {
    let (s, wp) = (g.value(start), g.value(working));
    // Shown figures: the start rounded down, the working pressure to the nearest unit.
    let (start, working, unit) = (shown::whole_down(s), wp.round(), g.unit);
    if s > wp * (1.0 + OVERFILL_SHARE) + 1e-9 {
        out.push(Warning::Overfill {
            diver,
            supply,
            start,
            working,
            unit,
        });
    } else if s > wp + g.step / 2.0 + 1e-9 {
        out.push(Warning::AboveWorking {
            diver,
            supply,
            start,
            working,
            unit,
        });
    } else if s < wp * LOW_FILL_RATIO {
        out.push(Warning::LowFill {
            diver,
            supply,
            start,
            unit,
        });
    }
}

/// Water temperatures a team accepts, °C (the settings' default temperature too).
pub const WATER_TEMP_RANGE_C: (f64, f64) = (-2.0, 40.0);

/// A graduation within its unit's range (1 to 50 bar, 10 to 500 psi).
pub fn validate_step(field: &str, unit: PressureUnit, step: f64) -> Result<(), InputError> {
    let (lo, hi) = unit.step_range();
    check_range(field, step, lo, hi, unit.label())
}

pub(crate) fn validate_cylinders(
    units: UnitSystem,
    field: &str,
    set: &CylinderSet,
) -> Result<(), InputError> {
    if set.count < 1 || set.count > MAX_CYLINDERS {
        return Err(InputError::new(
            format!("{field}.count"),
            tr_with(
                "{0} cylinders is out of range; allowed 1 to {1}",
                &[&set.count, &MAX_CYLINDERS],
            ),
        ));
    }
    match set.spec {
        CylinderSpec::Stamped {
            water_l,
            working_bar,
        } => {
            check_range(
                &format!("{field}.water_l"),
                water_l,
                MIN_WATER_L,
                MAX_WATER_L,
                "L",
            )?;
            check_range(
                &format!("{field}.working_bar"),
                working_bar,
                50.0,
                MAX_START_BAR,
                "bar",
            )?;
        }
        CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        } => {
            check_range(
                &format!("{field}.rated_cuft"),
                rated_cuft,
                5.0,
                400.0,
                "cu ft",
            )?;
            check_range(
                &format!("{field}.rated_psi"),
                rated_psi,
                700.0,
                5800.0,
                "psi",
            )?;
            let w = set.spec.water_per_cylinder(ModelKind::Real).litres();
            if !(MIN_WATER_L..=MAX_WATER_L).contains(&w) {
                return Err(InputError::new(
                    format!("{field}.rated_cuft"),
                    tr_with(
                        "{0} cu ft at {1} psi means {2} L of water per cylinder; allowed {3} to {4} L",
                        &[
                            &shown::num(rated_cuft),
                            &shown::num(rated_psi),
                            &shown::fixed(w, 1),
                            &shown::num(MIN_WATER_L),
                            &shown::num(MAX_WATER_L),
                        ],
                    ),
                ));
            }
        }
    }
    let _ = units;
    Ok(())
}

pub(crate) fn validate_mix(field: &str, mix: &Mix) -> Result<(), InputError> {
    let fraction = tr("(fraction)");
    check_range(&format!("{field}.o2"), mix.o2, 0.05, 1.0, &fraction)?;
    check_range(&format!("{field}.he"), mix.he, 0.0, 0.95, &fraction)?;
    if mix.o2 + mix.he > 1.0 + 1e-9 {
        return Err(InputError::new(
            format!("{field}.he"),
            tr_with(
                "O2 {0} % + He {1} % is above 100 %",
                &[
                    &format!("{:.0}", mix.o2 * 100.0),
                    &format!("{:.0}", mix.he * 100.0),
                ],
            ),
        ));
    }
    Ok(())
}

/// One gas supply (a diver's main set or stage): cylinders, mix and start pressure,
/// with fields named under `prefix`.
fn validate_supply(
    u: UnitSystem,
    g: Gauge,
    prefix: &str,
    cylinders: &CylinderSet,
    mix: &Mix,
    start: Pressure,
) -> Result<(), InputError> {
    validate_cylinders(u, &format!("{prefix}.cylinders"), cylinders)?;
    validate_mix(&format!("{prefix}.mix"), mix)?;
    validate_start(
        g,
        &format!("{prefix}.start"),
        start,
        cylinders.working_pressure(),
    )
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
    super::text::check_text(&format!("{f}.name"), name)?;
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

/// Check a start pressure, read on gauge `g`: at least one graduation, at most 400 bar
/// and 1.5 × the working pressure.
pub fn validate_start(
    g: Gauge,
    field: &str,
    start: Pressure,
    working: Pressure,
) -> Result<(), InputError> {
    let unit = g.label();
    let v = g.value(start);
    if !v.is_finite() {
        return Err(InputError::new(field, tr("must be a number")));
    }
    if v < g.step - 1e-9 {
        return Err(InputError::new(
            field,
            tr_with(
                "{0} {1} is not a fill; a start pressure is at least one graduation ({2} {1})",
                &[&shown::num(shown::down(v, 2)), &unit, &shown::num(g.step)],
            ),
        ));
    }
    let cap = working.bar() * MAX_FILL_RATIO;
    if start.bar() > cap + 1e-9 {
        return Err(InputError::new(
            field,
            tr_with(
                "{0} {1} is more than 1.5 × the {2} {1} working pressure (limit {3} {1}): check the gauge and bar or psi",
                &[
                    &shown::num(v.round()),
                    &unit,
                    &shown::num(shown::down(g.value(working), 1)),
                    &shown::start(g.value(Pressure::from_bar(cap))),
                ],
            ),
        ));
    }
    if start.bar() > MAX_START_BAR + 1e-9 {
        return Err(InputError::new(
            field,
            tr_with(
                "{0} {1} is above the highest pressure planned for ({2} {1})",
                &[
                    &shown::num(v.round()),
                    &unit,
                    &shown::start(g.value(Pressure::from_bar(MAX_START_BAR))),
                ],
            ),
        ));
    }
    Ok(())
}
