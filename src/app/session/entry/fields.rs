//! Every keypad field, in one place: one match arm per field says what the keypad
//! opens with, its title and unit, whether the value drives the plan as it is typed,
//! its step buttons, its check and what it changes. A new field is a new `EntryTarget`
//! and one arm in `field`.

use crate::app::keypad::KeypadBuffer;
use crate::app::readings::StartStatus;
use crate::app::view_models as vm;
use crate::i18n::{tr, tr_with};
use crate::plan::shown;
use crate::plan::validate_start;
use crate::plan::{InputError, check_range};
use crate::plan::{Pressure, PressureUnit, Volume};

use super::super::Session;
use super::reading::{Reading, reading_field};
use super::{Field, Typed, apply, check, no_check, sizes, temperatures};

/// What the open keypad is entering.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum EntryTarget {
    Start(usize),
    StageStart(usize),
    Sac(usize),
    Depth,
    /// The water temperature of this dive (the team's; Team and Fill pages).
    WaterTemp,
    /// The water temperature a new team starts with (Settings page).
    DefaultWaterTemp,
    DiverName(usize),
    LockerName,
    LockerNote,
    LockerFirst,
    LockerSecond,
    /// One cylinder's water litres or rated cu ft, in the picker's custom set.
    CustomFirst,
    /// One cylinder's working bar or rated psi, in the picker's custom set.
    CustomSecond,
    /// O2 % of the mix being picked (Done goes on to He).
    MixO2,
    /// He % of the mix being picked.
    MixHe,
    FillPressure,
    FillTemp,
}

/// The field behind `target`; None when its diver or draft is gone.
pub fn field(s: &Session, target: EntryTarget) -> Option<Field> {
    let u = s.units();
    let input = s.team.input();
    let draft = s.locker.draft();
    Some(match target {
        EntryTarget::Start(i) => {
            let d = input.divers.get(i)?;
            let g = input.gauge_of(i);
            let label = s.team.shown_label(i);
            // Two or more cylinders not on a manifold each have a gauge.
            let separate = d.cylinders.independent || d.cylinders.count > 2;
            let title_args: [&dyn std::fmt::Display; 2] = [&d.name, &label];
            reading_field(
                Reading {
                    gauge: g,
                    start: d.start,
                    unread: s.team.start_status(i, s.now()) == StartStatus::Missing,
                    title: tr_with("Start for {0} ({1}), read in the water", &title_args),
                    hint: separate
                        .then(|| tr("Balance the cylinders; enter what each gauge reads")),
                    step: Some(g.step),
                },
                check(move |s, t| {
                    let v = t.number("start", &tr("enter the pressure read in the water"))?;
                    let working = s.team.input().divers[i].cylinders.working_pressure();
                    validate_start(g, "start", g.pressure(v), working)
                }),
                apply(move |s, t| s.team.set_start(i, pressure(g.unit, t)?)),
                apply(move |s, _| {
                    s.team.mark_read(i, s.now());
                    Ok(())
                }),
            )
        }
        EntryTarget::StageStart(i) => {
            let d = input.divers.get(i)?;
            let st = d.stage.as_ref()?;
            let g = input.gauge_of(i);
            reading_field(
                Reading {
                    gauge: g,
                    start: st.start,
                    unread: s.team.stage_status(i, s.now()) == Some(StartStatus::Missing),
                    title: tr_with(
                        "Stage pressure for {0} ({1}), read in the water",
                        &[&d.name, &s.team.shown_stage_label(i)],
                    ),
                    hint: None,
                    step: None,
                },
                check(move |s, t| {
                    let v = t.number(
                        "stage start",
                        &tr("enter the stage pressure read in the water"),
                    )?;
                    let Some(st) = &s.team.input().divers[i].stage else {
                        return Err(InputError::new("stage", tr("this diver carries no stage")));
                    };
                    let working = st.cylinders.working_pressure();
                    validate_start(g, "stage start", g.pressure(v), working)
                }),
                apply(move |s, t| s.team.set_stage_start(i, pressure(g.unit, t)?)),
                apply(move |s, _| {
                    s.team.mark_stage_read(i, s.now());
                    Ok(())
                }),
            )
        }
        EntryTarget::Sac(i) => {
            let d = input.divers.get(i)?;
            let litres = d.sac_l_per_min.map(Volume::from_litres);
            Field {
                buffer: KeypadBuffer::digits(
                    &litres
                        .map(|l| shown::num(u.volume_value(l)))
                        .unwrap_or_default(),
                    true,
                ),
                title: tr_with(
                    "Surface breathing rate (SAC) for {0}; leave empty for none",
                    &[&d.name],
                ),
                hint: None,
                unit: format!("{}/min", u.volume_label()),
                live: true,
                step: None,
                revert: None,
                check: no_check(),
                apply: apply(move |s, t| s.team.set_sac(i, t.value.map(|v| u.volume(v).litres()))),
                on_done: None,
            }
        }
        EntryTarget::Depth => Field {
            buffer: KeypadBuffer::digits(
                &input
                    .depth
                    .map(|d| vm::depth_value(u, d))
                    .unwrap_or_default(),
                false,
            ),
            title: tr("Planned depth for time to turn; leave empty for none"),
            hint: None,
            unit: u.depth_label().to_string(),
            live: true,
            step: None,
            revert: None,
            check: no_check(),
            apply: apply(move |s, t| s.team.set_depth(t.value.map(|v| u.depth(v)))),
            on_done: None,
        },
        EntryTarget::WaterTemp => temperatures::dive_water(s),
        EntryTarget::DefaultWaterTemp => temperatures::default_water(s),
        EntryTarget::DiverName(i) => Field {
            buffer: KeypadBuffer::letters(&input.divers.get(i)?.name, 32),
            title: tr_with("Name for diver {0}", &[&(i + 1)]),
            hint: None,
            unit: String::new(),
            live: true,
            step: None,
            revert: None,
            check: check(move |s, t| {
                let taken = s
                    .team
                    .input()
                    .divers
                    .iter()
                    .enumerate()
                    .any(|(j, d)| j != i && d.name == t.text);
                if t.text.is_empty() {
                    Err(InputError::new(
                        "name",
                        tr("a name of 1 to 24 characters is needed"),
                    ))
                } else if taken {
                    Err(InputError::new(
                        "name",
                        tr("another diver already has this name"),
                    ))
                } else {
                    Ok(())
                }
            }),
            apply: apply(move |s, t| s.team.set_name(i, t.text)),
            on_done: None,
        },
        EntryTarget::LockerName => Field {
            buffer: KeypadBuffer::letters(&draft?.name, crate::storage::locker::MAX_SET_NAME_CHARS),
            title: tr("Name of the cylinder set"),
            hint: None,
            unit: String::new(),
            live: false,
            step: None,
            revert: None,
            check: check(|_, t| {
                if t.text.is_empty() {
                    Err(InputError::new("name", tr("a name is needed")))
                } else {
                    Ok(())
                }
            }),
            apply: apply(|s, t| {
                s.locker.edit_draft(|d| d.name = t.text.to_string());
                Ok(())
            }),
            on_done: None,
        },
        EntryTarget::LockerNote => Field {
            buffer: KeypadBuffer::letters(&draft?.note, crate::storage::locker::MAX_SET_NOTE_CHARS),
            title: tr("Note (serial, test date, valves…)"),
            hint: None,
            unit: String::new(),
            live: false,
            step: None,
            revert: None,
            check: no_check(),
            apply: apply(|s, t| {
                s.locker.edit_draft(|d| d.note = t.text.to_string());
                Ok(())
            }),
            on_done: None,
        },
        EntryTarget::LockerFirst => sizes::locker(s, true)?,
        EntryTarget::LockerSecond => sizes::locker(s, false)?,
        EntryTarget::CustomFirst => sizes::custom(s, true)?,
        EntryTarget::CustomSecond => sizes::custom(s, false)?,
        EntryTarget::MixO2 => sizes::mix_percent(s, false)?,
        EntryTarget::MixHe => sizes::mix_percent(s, true)?,
        EntryTarget::FillPressure => Field {
            buffer: KeypadBuffer::digits(&vm::start_text(u, s.fill.pressure), false),
            title: tr("Pressure read at the fill station, cylinder still warm"),
            hint: None,
            unit: u.pressure_label().to_string(),
            live: false,
            step: None,
            revert: None,
            check: check(move |_, t| {
                let v = t.number("fill pressure", &tr("enter a pressure"))?;
                let max = u.pressure_value(Pressure::from_bar(400.0)).floor();
                check_range("fill pressure", v, 1.0, max, u.pressure_label())
            }),
            apply: apply(move |s, t| {
                s.fill.pressure = pressure(u.pressure_unit(), t)?;
                Ok(())
            }),
            on_done: None,
        },
        EntryTarget::FillTemp => temperatures::fill(s),
    })
}

/// The typed pressure, read in `unit`.
fn pressure(unit: PressureUnit, t: Typed) -> Result<Pressure, InputError> {
    Ok(unit.pressure(t.number("pressure", &tr("enter a pressure"))?))
}
