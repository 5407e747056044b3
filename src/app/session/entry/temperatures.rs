//! Keypad fields of temperatures: the water of this dive (Team and Fill pages), the
//! water a new team starts with (Settings), and the cylinder's temperature at the fill.

use crate::app::keypad::KeypadBuffer;
use crate::app::view_models as vm;
use crate::i18n::tr;
use crate::plan::WATER_TEMP_RANGE_C;
use crate::plan::{InputError, check_range};
use crate::plan::{Temperature, UnitSystem};

use super::super::Session;
use super::{Apply, Check, Field, Typed, apply, check};

/// The water temperature of this dive: live, every diver's plan follows it.
pub fn dive_water(s: &Session) -> Field {
    let u = s.units();
    temperature_field(
        u,
        s.team.input().water_temp,
        tr("Water temperature of this dive: the gas cools to it, and every diver's plan uses it"),
        true,
        check(|_, t| {
            t.number("water temperature", &tr("enter a temperature"))
                .map(|_| ())
        }),
        apply(move |s, t| s.team.set_water_temp(temperature(u, t)?)),
    )
}

/// The water temperature a new team starts with (Settings): applied on Done.
pub fn default_water(s: &Session) -> Field {
    let u = s.units();
    temperature_field(
        u,
        Temperature::from_celsius(s.settings.water_temp_c),
        tr("Water temperature a new team starts with (each dive sets its own on the Team page)"),
        false,
        check(move |_, t| {
            let v = u.temperature_value(temperature(u, t)?);
            let (lo_c, hi_c) = WATER_TEMP_RANGE_C;
            let lo = u.temperature_value(Temperature::from_celsius(lo_c)).floor();
            let hi = u.temperature_value(Temperature::from_celsius(hi_c)).ceil();
            check_range("water temperature", v, lo, hi, u.temperature_label())
        }),
        apply(move |s, t| {
            s.remember_water_temp(temperature(u, t)?);
            Ok(())
        }),
    )
}

/// The cylinder's temperature when the fill pressure was read (an estimate).
pub fn fill(s: &Session) -> Field {
    let u = s.units();
    temperature_field(
        u,
        s.fill.temperature,
        tr(
            "Cylinder temperature when that pressure was read: your estimate (hand on the cylinder)",
        ),
        false,
        check(move |_, t| {
            let v = t.number("fill temperature", &tr("enter a temperature"))?;
            let lo = u.temperature_value(Temperature::from_celsius(0.0)).ceil();
            let hi = u.temperature_value(Temperature::from_celsius(60.0)).floor();
            check_range("fill temperature", v, lo, hi, u.temperature_label())
        }),
        apply(move |s, t| {
            s.fill.temperature = temperature(u, t)?;
            Ok(())
        }),
    )
}

/// The typed temperature, in the team's unit.
fn temperature(u: UnitSystem, t: Typed) -> Result<Temperature, InputError> {
    Ok(u.temperature(t.number("temperature", &tr("enter a temperature"))?))
}

/// A temperature field opening on `shown` in the team's unit: applied as typed when
/// `live`, else on Done.
fn temperature_field(
    u: UnitSystem,
    shown: Temperature,
    title: String,
    live: bool,
    check: Check,
    apply: Apply,
) -> Field {
    Field {
        buffer: KeypadBuffer::digits(&vm::degrees(u, shown), false),
        title,
        hint: None,
        unit: u.temperature_label().to_string(),
        live,
        step: None,
        revert: None,
        check,
        apply,
        on_done: None,
    }
}
