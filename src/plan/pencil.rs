//! One diver's content as a pencil sum: the figures a diver writes on the dock, each
//! rounded down to the decimal shown, that the hand check and the allowance both print.

use super::cylinders::CylinderSpec;
use super::gauge::PressureUnit;
use super::matching::TeamPlan;
use super::shown;
use super::team::TeamInput;
use super::units::{BAR_PER_PSI, LITRES_PER_CUFT, UnitSystem};

/// Round down to one decimal, tolerating float noise.
pub fn down1(x: f64) -> f64 {
    shown::down(x, 1)
}

/// Round up to one decimal, tolerating float noise.
pub fn up1(x: f64) -> f64 {
    shown::up(x, 1)
}

/// Diver `i`'s content sum and its result in the team's volume unit, as printed (one
/// decimal, rounded down).
pub fn pencil_content(team: &TeamInput, plan: &TeamPlan, i: usize) -> (String, f64) {
    let u = team.units;
    let d = &team.divers[i];
    let g = plan.divers[i].gauge;
    let start = g.value(d.start);
    let n = d.cylinders.count;
    let count = if n == 1 {
        String::new()
    } else {
        format!("{n} × ")
    };
    match d.cylinders.spec {
        CylinderSpec::Stamped { water_l, .. } => {
            let (bar, read) = match g.unit {
                PressureUnit::Bar => (start, String::new()),
                PressureUnit::Psi => {
                    let bar = down1(start * BAR_PER_PSI);
                    (
                        bar,
                        format!("{} psi = {} bar; ", shown::num(start), shown::num(bar)),
                    )
                }
            };
            let litres = down1(f64::from(n) * water_l * bar);
            let (tail, value) = match u {
                UnitSystem::Metric => (String::new(), litres),
                UnitSystem::Imperial => {
                    let cuft = down1(litres / LITRES_PER_CUFT);
                    (format!(" = {} cu ft", shown::num(cuft)), cuft)
                }
            };
            (
                format!(
                    "{read}{count}{} L × {} bar = {} L{tail}",
                    shown::num(water_l),
                    shown::num(bar),
                    shown::num(litres)
                ),
                value,
            )
        }
        CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        } => {
            let (psi, read) = match g.unit {
                PressureUnit::Psi => (start, String::new()),
                PressureUnit::Bar => {
                    // To a hundredth (rounded down), so the sums that follow agree with
                    // the plan's own hand content to the decimal shown.
                    let psi = shown::down(start / BAR_PER_PSI, 2);
                    (
                        psi,
                        format!("{} bar = {} psi; ", shown::num(start), shown::num(psi)),
                    )
                }
            };
            let cuft = down1(f64::from(n) * rated_cuft * psi / rated_psi);
            let (tail, value) = match u {
                UnitSystem::Imperial => (String::new(), cuft),
                UnitSystem::Metric => {
                    let litres = down1(cuft * LITRES_PER_CUFT);
                    (format!(" = {} L", shown::num(litres)), litres)
                }
            };
            (
                format!(
                    "{read}{count}{} cu ft × {} psi ÷ {} psi = {} cu ft{tail}",
                    shown::num(rated_cuft),
                    shown::num(psi),
                    shown::num(rated_psi),
                    shown::num(cuft)
                ),
                value,
            )
        }
    }
}
