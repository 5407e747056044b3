//! The checks on a team's inputs: ranges of counts, sizes, mixes, graduations and starts,
//! each error naming its field, and the warnings a start earns against its set's working
//! pressure.

use super::cylinders::{CylinderSet, CylinderSpec};
use super::error::{InputError, check_range};
use super::gas_model::ModelKind;
use super::gauge::{Gauge, PressureUnit};
use super::mix::Mix;
use super::shown;
use super::units::{Pressure, UnitSystem};
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

/// A start compared with the working pressure on the diver's own gauge: above it by more
/// than half a graduation, an overfill of more than 10 %, or under half of it.
pub(super) fn fill_warning(
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
pub(super) fn validate_supply(
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
