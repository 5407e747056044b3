//! `turnsheet gas`: content of a cylinder under both models, and temperature change.

use serde::Serialize;

use crate::plan::pressure_after_temperature_change;
use crate::plan::shown;
use crate::plan::{ContentModel, HandModel, Mix, Pressure, RealGasModel, Temperature, Volume};
use crate::plan::{InputError, check_range};

use super::PressureUnit;

#[derive(clap::Args, Debug)]
pub struct GasArgs {
    /// Water capacity in litres (all cylinders of the set together).
    #[arg(long, allow_negative_numbers = true)]
    pub litres: f64,
    /// Gauge pressure, in --units.
    #[arg(long, allow_negative_numbers = true)]
    pub pressure: f64,
    /// Pressure unit: bar or psi (as for `chart --units`).
    #[arg(long = "units", alias = "unit", value_enum, default_value_t = PressureUnit::Bar)]
    pub unit: PressureUnit,
    /// Oxygen, percent.
    #[arg(long, default_value_t = 21.0, allow_negative_numbers = true)]
    pub o2: f64,
    /// Helium, percent.
    #[arg(long, default_value_t = 0.0, allow_negative_numbers = true)]
    pub he: f64,
    /// Gas temperature now, °C.
    #[arg(long, default_value_t = 20.0, allow_negative_numbers = true)]
    pub temp: f64,
    /// Predict the pressure once the gas reaches this temperature, °C.
    #[arg(long, allow_negative_numbers = true)]
    pub to_temp: Option<f64>,
    /// Print machine-readable JSON.
    #[arg(long)]
    pub json: bool,
}

#[derive(Serialize, Debug)]
pub struct GasJson {
    pub mix: String,
    pub content_l: f64,
    pub content_hand_l: f64,
    pub pressure_after: Option<f64>,
    pub pressure_after_ideal: Option<f64>,
    pub unit: String,
}

/// Free gas in cu ft as shown: gas on hand, so rounded down, to a tenth.
fn cuft(v: Volume) -> String {
    shown::fixed(shown::down(v.cuft(), 1), 1)
}

pub fn run(a: &GasArgs) -> Result<String, InputError> {
    check_range("--litres", a.litres, 0.5, 120.0, "L")?;
    let (p, unit) = match a.unit {
        PressureUnit::Bar => (Pressure::from_bar(a.pressure), "bar"),
        PressureUnit::Psi => (Pressure::from_psi(a.pressure), "psi"),
    };
    if !(p.bar() > 0.0 && p.bar() <= 400.0) {
        return Err(InputError::new(
            "--pressure",
            format!(
                "must be above 0 and at most 400 bar (5801 psi); got {} {unit}",
                a.pressure
            ),
        ));
    }
    check_range("--o2", a.o2, 5.0, 100.0, "%")?;
    check_range("--he", a.he, 0.0, 95.0, "%")?;
    if a.o2 + a.he > 100.0 {
        return Err(InputError::new("--he", "O2 + He is above 100 %"));
    }
    check_range("--temp", a.temp, -20.0, 60.0, "°C")?;
    if let Some(t) = a.to_temp {
        check_range("--to-temp", t, -20.0, 60.0, "°C")?;
    }
    let mix = Mix {
        o2: a.o2 / 100.0,
        he: a.he / 100.0,
    };
    let w = Volume::from_litres(a.litres);
    let real = RealGasModel::new(mix, Temperature::from_celsius(a.temp)).content(w, p);
    let hand = HandModel.content(w, p);
    let after = a.to_temp.map(|t2| {
        pressure_after_temperature_change(
            mix,
            p,
            Temperature::from_celsius(a.temp),
            Temperature::from_celsius(t2),
        )
    });
    let in_unit = |p: Pressure| match a.unit {
        PressureUnit::Bar => p.bar(),
        PressureUnit::Psi => p.psi(),
    };
    let out = GasJson {
        mix: mix.label(),
        content_l: (real.litres() * 1000.0).round() / 1000.0,
        content_hand_l: (hand.litres() * 1000.0).round() / 1000.0,
        pressure_after: after.map(|c| (in_unit(c.real) * 1000.0).round() / 1000.0),
        pressure_after_ideal: after.map(|c| (in_unit(c.ideal) * 1000.0).round() / 1000.0),
        unit: unit.to_string(),
    };
    if a.json {
        return Ok(serde_json::to_string_pretty(&out).unwrap_or_default() + "\n");
    }
    let mut s = format!(
        "{} L of {} at {} {unit}, {} °C:\n  real gas (GERG-2008): {} L free gas ({} cu ft)\n  tank factor (by hand): {} L × {} bar = {} L free gas ({} cu ft)\n",
        a.litres,
        out.mix,
        a.pressure,
        a.temp,
        shown::start(real.litres()),
        cuft(real),
        shown::num(a.litres),
        shown::num(shown::down(p.bar(), 1)),
        shown::num(shown::down(hand.litres(), 1)),
        cuft(hand)
    );
    if let (Some(c), Some(t2)) = (after, a.to_temp) {
        s.push_str(&format!(
            "  at {t2} °C: {} {unit} (real gas); {} {unit} (ideal gas)\n",
            shown::start(in_unit(c.real)),
            shown::start(in_unit(c.ideal))
        ));
    }
    Ok(s)
}
