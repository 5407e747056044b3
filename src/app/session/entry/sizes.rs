//! Keypad fields of a cylinder's size (the locker editor's draft and the picker's
//! custom set share them) and of the mix picker's O2 and He percents. `fields::field`
//! has one arm for each, calling these.

use crate::app::keypad::KeypadBuffer;
use crate::app::view_models as vm;
use crate::i18n::{tr, tr_with};
use crate::plan::check_range;
use crate::plan::shown;

use super::super::{Picker, Session};
use super::{EntryTarget, Field, apply, check};

/// (caption, unit, allowed range) of the two size fields.
type Specs = [(String, &'static str, f64, f64); 2];

/// The first (litres or cu ft) or second (bar or psi) size field. `specs` reads the
/// fields' captions and ranges from the session (None when the set is gone) and
/// `set` stores a value.
fn size_field(
    now: Specs,
    value: Option<f64>,
    first: bool,
    custom: bool,
    specs: fn(&Session) -> Option<Specs>,
    set: fn(&mut Session, bool, Option<f64>),
) -> Field {
    let which = usize::from(!first);
    let (caption, unit, _, _) = &now[which];
    let unit = *unit;
    Field {
        buffer: KeypadBuffer::digits(
            &value.map(shown::num).unwrap_or_default(),
            unit == "L" || unit == "cu ft",
        ),
        title: if custom {
            tr_with("Custom set: {0} ({1})", &[&vm::capitalised(caption), &unit])
        } else {
            format!("{} ({unit})", vm::capitalised(caption))
        },
        hint: None,
        unit: unit.to_string(),
        live: false,
        step: None,
        revert: None,
        check: check(move |s, t| match specs(s) {
            None => Ok(()),
            Some(specs) => {
                let (caption, unit, lo, hi) = &specs[which];
                let name = caption.to_lowercase();
                check_range(
                    &name,
                    t.number(&name, &tr("enter a value"))?,
                    *lo,
                    *hi,
                    unit,
                )
            }
        }),
        apply: apply(move |s, t| {
            set(s, first, t.value);
            Ok(())
        }),
        on_done: None,
    }
}

/// A size of the locker editor's draft.
pub fn locker(s: &Session, first: bool) -> Option<Field> {
    let d = s.locker.draft()?;
    let value = if first { d.first } else { d.second };
    Some(size_field(
        d.field_specs(),
        value,
        first,
        false,
        |s| s.locker.draft().map(|d| d.field_specs()),
        |s, first, v| {
            s.locker.edit_draft(|d| {
                if first {
                    d.first = v;
                } else {
                    d.second = v;
                }
            })
        },
    ))
}

/// A size of the picker's custom set.
pub fn custom(s: &Session, first: bool) -> Option<Field> {
    let Picker::Custom { set, .. } = s.picker else {
        return None;
    };
    let value = if first { set.first } else { set.second };
    Some(size_field(
        set.field_specs(),
        value,
        first,
        true,
        |s| match s.picker {
            Picker::Custom { set, .. } => Some(set.field_specs()),
            _ => None,
        },
        |s, first, v| {
            s.edit_custom(|c| {
                if first {
                    c.first = v;
                } else {
                    c.second = v;
                }
            })
        },
    ))
}

/// O2 (5–100 %) or He (0–95 %) of the mix being picked, in whole percents. Done on
/// O2 goes on to He, so a custom mix is two entries in a row.
pub fn mix_percent(s: &Session, helium: bool) -> Option<Field> {
    let Picker::Mix { o2, he, .. } = s.picker else {
        return None;
    };
    let (name, value, lo, hi) = if helium {
        (tr("helium (He)"), he, 0.0, 95.0)
    } else {
        (tr("oxygen (O2)"), o2, 5.0, 100.0)
    };
    Some(Field {
        buffer: KeypadBuffer::digits(&value.to_string(), false),
        title: tr_with("Custom mix: {0} in %", &[&name]),
        hint: None,
        unit: "%".to_string(),
        live: false,
        step: None,
        revert: None,
        check: check({
            let name = name.clone();
            move |_, t| {
                let v = t.number(&name, &tr("enter a whole percent"))?;
                check_range(&name, v, lo, hi, "%")
            }
        }),
        apply: apply(move |s, t| {
            let v = t.number(&name, &tr("enter a whole percent"))?.round() as i32;
            if helium {
                s.picker.set_mix_percent(None, Some(v));
            } else {
                s.picker.set_mix_percent(Some(v), None);
            }
            Ok(())
        }),
        on_done: (!helium).then(|| {
            apply(|s, _| {
                s.open_entry(EntryTarget::MixHe);
                Ok(())
            })
        }),
    })
}
