//! Session actions of our own keypads: what each entry edits, live validation on every
//! key press, Done and Cancel.

use crate::plan::error::{InputError, check_range, fmt_num};
use crate::plan::team::validate_start;
use crate::plan::{Temperature, UnitSystem};

use super::{Entry, EntryTarget, KeypadBuffer, Session};

impl Session {
    // ---- keypad entry ------------------------------------------------------------

    pub fn open_entry(&mut self, target: EntryTarget) {
        let u = self.units();
        let divers = &self.team.input().divers;
        let diver = |i: usize| divers.get(i).map(|d| d.name.clone()).unwrap_or_default();
        let (buffer, title, unit) = match target {
            EntryTarget::Start(i) => {
                let Some(d) = divers.get(i) else { return };
                (
                    KeypadBuffer::digits(&fmt_num(u.pressure_value(d.start).floor()), false),
                    format!(
                        "Start pressure for {} ({}), read in the water",
                        d.name,
                        self.team.labels()[i]
                    ),
                    u.pressure_label().to_string(),
                )
            }
            EntryTarget::StageStart(i) => {
                let Some((d, st)) = divers
                    .get(i)
                    .and_then(|d| d.stage.as_ref().map(|st| (d, st)))
                else {
                    return;
                };
                (
                    KeypadBuffer::digits(&fmt_num(u.pressure_value(st.start).floor()), false),
                    format!(
                        "Stage pressure for {} ({}), read in the water",
                        d.name,
                        self.team.stage_labels()[i]
                    ),
                    u.pressure_label().to_string(),
                )
            }
            EntryTarget::Sac(i) => {
                let Some(d) = divers.get(i) else { return };
                let text = d
                    .sac_l_per_min
                    .map(|s| fmt_num(u.volume_value(crate::plan::Volume::from_litres(s))))
                    .unwrap_or_default();
                (
                    KeypadBuffer::digits(&text, true),
                    format!(
                        "Surface breathing rate (SAC) for {}; leave empty for none",
                        d.name
                    ),
                    format!("{}/min", u.volume_label()),
                )
            }
            EntryTarget::Depth => {
                let text = self
                    .team
                    .input()
                    .depth
                    .map(|d| {
                        fmt_num(match u {
                            UnitSystem::Metric => d.metres(),
                            UnitSystem::Imperial => d.feet(),
                        })
                    })
                    .unwrap_or_default();
                (
                    KeypadBuffer::digits(&text, false),
                    "Planned depth for time to turn; leave empty for none".to_string(),
                    u.depth_label().to_string(),
                )
            }
            EntryTarget::WaterTemp => (
                KeypadBuffer::digits(
                    &fmt_num(u.temperature_value(self.team.input().water_temp).round()),
                    false,
                ),
                "Water temperature (the gas cools to it)".to_string(),
                u.temperature_label().to_string(),
            ),
            EntryTarget::FillPressure => (
                KeypadBuffer::digits(
                    &fmt_num(u.pressure_value(self.fill.pressure).floor()),
                    false,
                ),
                "Pressure at the fill station".to_string(),
                u.pressure_label().to_string(),
            ),
            EntryTarget::FillTemp => (
                KeypadBuffer::digits(
                    &fmt_num(u.temperature_value(self.fill.temperature).round()),
                    false,
                ),
                "Gas temperature at the fill (a warm cylinder)".to_string(),
                u.temperature_label().to_string(),
            ),
            EntryTarget::DiverName(i) => (
                KeypadBuffer::letters(&diver(i), 24),
                format!("Name for diver {}", i + 1),
                String::new(),
            ),
            EntryTarget::LockerName | EntryTarget::LockerNote => {
                let Some(d) = self.locker.draft.as_ref() else {
                    return;
                };
                if target == EntryTarget::LockerName {
                    (
                        KeypadBuffer::letters(&d.name, 40),
                        "Name of the cylinder set".to_string(),
                        String::new(),
                    )
                } else {
                    (
                        KeypadBuffer::letters(&d.note, 60),
                        "Note (serial, test date, valves…)".to_string(),
                        String::new(),
                    )
                }
            }
            EntryTarget::LockerFirst | EntryTarget::LockerSecond => {
                let Some(d) = self.locker.draft.as_ref() else {
                    return;
                };
                let first = target == EntryTarget::LockerFirst;
                let spec = d.field_specs()[if first { 0 } else { 1 }];
                let v = if first { d.first } else { d.second };
                let decimal = spec.1 == "L" || spec.1 == "cu ft";
                (
                    KeypadBuffer::digits(&v.map(fmt_num).unwrap_or_default(), decimal),
                    format!("{} ({})", capitalise(spec.0), spec.1),
                    spec.1.to_string(),
                )
            }
        };
        let original = buffer.text().to_string();
        self.entry = Some(Entry {
            target,
            buffer,
            original,
            title,
            unit,
            reason: String::new(),
        });
        self.validate_entry(false);
    }

    /// One key on the open keypad.
    pub fn key(&mut self, key: &str) {
        let Some(entry) = self.entry.as_mut() else {
            return;
        };
        if key == "+step" || key == "-step" {
            if let EntryTarget::Start(_) | EntryTarget::StageStart(_) = entry.target {
                let step = self.team.input().gauge_step;
                let v = entry.buffer.value().unwrap_or(0.0);
                let next = if key == "+step" {
                    round_down(v, step) + step
                } else {
                    (round_up(v, step) - step).max(0.0)
                };
                entry.buffer.set_text(fmt_num(next));
            }
        } else {
            entry.buffer.press(key);
        }
        self.validate_entry(true);
    }

    /// Check the typed text; apply live where the value drives the plan.
    fn validate_entry(&mut self, apply: bool) {
        let Some(entry) = self.entry.clone() else {
            return;
        };
        let u = self.units();
        let v = entry.buffer.value();
        let text = entry.buffer.text().trim().to_string();
        let result: Result<(), InputError> = match entry.target {
            EntryTarget::Start(i) => match v {
                None => Err(InputError::new(
                    "start",
                    "enter the pressure read in the water",
                )),
                Some(v) => {
                    let g = self.team.input().gauge_of(i);
                    let p = g.pressure(v);
                    let d = &self.team.input().divers[i];
                    validate_start(g, "start", p, d.cylinders.working_pressure()).and_then(|_| {
                        if apply {
                            self.team.set_start(i, p)
                        } else {
                            Ok(())
                        }
                    })
                }
            },
            EntryTarget::StageStart(i) => match (v, &self.team.input().divers[i].stage) {
                (None, _) => Err(InputError::new(
                    "stage start",
                    "enter the stage pressure read in the water",
                )),
                (_, None) => Err(InputError::new("stage", "this diver carries no stage")),
                (Some(v), Some(st)) => {
                    let g = self.team.input().gauge_of(i);
                    let p = g.pressure(v);
                    validate_start(g, "stage start", p, st.cylinders.working_pressure()).and_then(
                        |_| {
                            if apply {
                                self.team.set_stage_start(i, p)
                            } else {
                                Ok(())
                            }
                        },
                    )
                }
            },
            EntryTarget::Sac(i) => {
                let litres = v.map(|v| u.volume(v).litres());
                if apply {
                    self.team.set_sac(i, litres)
                } else {
                    Ok(())
                }
            }
            EntryTarget::Depth => {
                let depth = v.map(|v| u.depth(v));
                if apply {
                    self.team.set_depth(depth)
                } else {
                    Ok(())
                }
            }
            EntryTarget::WaterTemp => match v {
                None => Err(InputError::new("water temperature", "enter a temperature")),
                Some(v) => {
                    let t = u.temperature(v);
                    if apply {
                        self.team.set_water_temp(t)
                    } else {
                        Ok(())
                    }
                }
            },
            EntryTarget::DiverName(i) => {
                if text.is_empty() {
                    Err(InputError::new(
                        "name",
                        "a name of 1 to 24 characters is needed",
                    ))
                } else if self
                    .team
                    .input()
                    .divers
                    .iter()
                    .enumerate()
                    .any(|(j, d)| j != i && d.name == text)
                {
                    Err(InputError::new(
                        "name",
                        "another diver already has this name",
                    ))
                } else if apply {
                    self.team.set_name(i, &text)
                } else {
                    Ok(())
                }
            }
            EntryTarget::LockerName => {
                if text.is_empty() {
                    Err(InputError::new("name", "a name is needed"))
                } else {
                    Ok(())
                }
            }
            EntryTarget::LockerNote => Ok(()),
            EntryTarget::FillPressure => match v {
                None => Err(InputError::new("fill pressure", "enter a pressure")),
                Some(v) => {
                    let max = u
                        .pressure_value(crate::plan::Pressure::from_bar(400.0))
                        .floor();
                    check_range("fill pressure", v, 1.0, max, u.pressure_label())
                }
            },
            EntryTarget::FillTemp => match v {
                None => Err(InputError::new("fill temperature", "enter a temperature")),
                Some(v) => {
                    let lo = u.temperature_value(Temperature::from_celsius(0.0)).ceil();
                    let hi = u.temperature_value(Temperature::from_celsius(60.0)).floor();
                    check_range("fill temperature", v, lo, hi, u.temperature_label())
                }
            },
            EntryTarget::LockerFirst | EntryTarget::LockerSecond => {
                let first = entry.target == EntryTarget::LockerFirst;
                match self.locker.draft.as_ref() {
                    None => Ok(()),
                    Some(d) => {
                        let spec = d.field_specs()[if first { 0 } else { 1 }];
                        match v {
                            None => Err(InputError::new(spec.0.to_lowercase(), "enter a value")),
                            Some(v) => {
                                check_range(&spec.0.to_lowercase(), v, spec.2, spec.3, spec.1)
                            }
                        }
                    }
                }
            }
        };
        let failed = result.is_err();
        if let Some(e) = self.entry.as_mut() {
            e.reason = result.err().map(|e| e.message).unwrap_or_default();
        }
        // While the typed text is unusable, the plan shows the value the entry started from.
        if apply
            && failed
            && is_live(entry.target)
            && entry.buffer.text() != entry.original
            && let Some(e) = self.entry.as_mut()
        {
            let typed = e.buffer.text().to_string();
            let reason = e.reason.clone();
            e.buffer.set_text(e.original.clone());
            self.validate_entry(true);
            if let Some(e) = self.entry.as_mut() {
                e.buffer.set_text(typed);
                e.reason = reason;
            }
        }
    }

    /// Done: keep the value (only possible when it is valid) and close.
    pub fn entry_done(&mut self) {
        self.validate_entry(true);
        let Some(entry) = self.entry.clone() else {
            return;
        };
        if !entry.reason.is_empty() {
            return;
        }
        let text = entry.buffer.text().trim().to_string();
        let v = entry.buffer.value();
        match entry.target {
            EntryTarget::WaterTemp => {
                if let Some(v) = v {
                    self.set_water_temp_value(v);
                }
            }
            EntryTarget::LockerName => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.name = text;
                }
            }
            EntryTarget::LockerNote => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.note = text;
                }
            }
            EntryTarget::FillPressure => {
                if let Some(v) = v {
                    self.fill.pressure = self.units().pressure(v);
                }
            }
            EntryTarget::FillTemp => {
                if let Some(v) = v {
                    self.fill.temperature = self.units().temperature(v);
                }
            }
            EntryTarget::LockerFirst => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.first = v;
                }
            }
            EntryTarget::LockerSecond => {
                if let Some(d) = self.locker.draft.as_mut() {
                    d.second = v;
                }
            }
            _ => self.save_team(),
        }
        self.entry = None;
    }

    /// Cancel: put back the value the entry started from.
    pub fn cancel_entry(&mut self) {
        if let Some(mut entry) = self.entry.take()
            && is_live(entry.target)
        {
            entry.buffer.set_text(entry.original.clone());
            self.entry = Some(entry);
            self.validate_entry(true);
            self.entry = None;
        }
    }
}

/// Entries whose value drives the plan as it is typed.
fn is_live(t: EntryTarget) -> bool {
    matches!(
        t,
        EntryTarget::Start(_)
            | EntryTarget::StageStart(_)
            | EntryTarget::Sac(_)
            | EntryTarget::Depth
            | EntryTarget::WaterTemp
            | EntryTarget::DiverName(_)
    )
}

fn round_down(v: f64, step: f64) -> f64 {
    crate::plan::matching::round_down_to_step(v, step)
}
fn round_up(v: f64, step: f64) -> f64 {
    crate::plan::matching::round_up_to_step(v, step)
}

fn capitalise(s: &str) -> String {
    let lower = s.to_lowercase();
    let mut c = lower.chars();
    match c.next() {
        Some(f) => f.to_uppercase().collect::<String>() + c.as_str(),
        None => String::new(),
    }
}
