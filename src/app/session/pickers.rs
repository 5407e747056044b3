//! The cylinder and mix pickers (main gas and stage): the open picker with its own
//! methods, and the session actions that open it and apply the choice. The custom
//! set is in `custom_set.rs`; the mix choices and Done in `mix_picker.rs`.

use crate::i18n::tr_with;
use crate::plan::Mix;
use crate::plan::presets;
use crate::plan::validate_mix;

use super::Session;
use super::custom_set::CustomSet;

/// An open picker, for a diver's main gas or stage.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Picker {
    None,
    Cylinders {
        diver: usize,
        stage: bool,
    },
    /// "Custom…": a set typed on the keypad (see `custom_set.rs`).
    Custom {
        diver: usize,
        stage: bool,
        set: CustomSet,
    },
    /// O2 and He in percent.
    Mix {
        diver: usize,
        stage: bool,
        o2: i32,
        he: i32,
    },
}

impl Picker {
    /// The mix picker, starting from `mix`.
    fn for_mix(diver: usize, stage: bool, mix: Mix) -> Picker {
        Picker::Mix {
            diver,
            stage,
            o2: (mix.o2 * 100.0).round() as i32,
            he: (mix.he * 100.0).round() as i32,
        }
    }

    /// The mix being picked, if the mix picker is open.
    pub fn mix(&self) -> Option<Mix> {
        match *self {
            Picker::Mix { o2, he, .. } => Some(Mix {
                o2: f64::from(o2) / 100.0,
                he: f64::from(he) / 100.0,
            }),
            _ => None,
        }
    }

    /// Why the mix being picked cannot be used; empty when it can.
    pub fn mix_reason(&self) -> String {
        match self.mix() {
            Some(m) => validate_mix("mix", &m)
                .err()
                .map(|e| e.message)
                .unwrap_or_default(),
            None => String::new(),
        }
    }

    /// Set O2 and/or He in whole percents, kept within 5–100 % O2 and 0–95 % He.
    pub fn set_mix_percent(&mut self, new_o2: Option<i32>, new_he: Option<i32>) {
        if let Picker::Mix { o2, he, .. } = self {
            *o2 = new_o2.unwrap_or(*o2).clamp(5, 100);
            *he = new_he.unwrap_or(*he).clamp(0, 95);
        }
    }

    pub fn close(&mut self) {
        *self = Picker::None;
    }
}

impl Session {
    pub fn open_cylinder_picker(&mut self, i: usize) {
        if i < self.team.len() {
            self.picker = Picker::Cylinders {
                diver: i,
                stage: false,
            };
        }
    }

    pub fn open_stage_picker(&mut self, i: usize) {
        if i < self.team.len() {
            self.picker = Picker::Cylinders {
                diver: i,
                stage: true,
            };
        }
    }

    pub fn pick_locker(&mut self, idx: usize) {
        let Picker::Cylinders { diver, stage } = self.picker else {
            return;
        };
        let Some(e) = self.locker.entries().get(idx).cloned() else {
            return;
        };
        match e.cylinders.to_set("locker") {
            Ok(set) => self.apply_cylinders(diver, stage, set, &e.name),
            Err(err) => self.status.push(err.to_string()),
        }
    }

    pub fn pick_preset(&mut self, idx: usize) {
        let Picker::Cylinders { diver, stage } = self.picker else {
            return;
        };
        if let Some(p) = presets().get(idx) {
            self.apply_cylinders(diver, stage, p.set, p.name);
        }
    }

    /// Take a diver's stage away.
    pub fn pick_no_stage(&mut self) {
        if let Picker::Cylinders { diver, stage: true } = self.picker {
            let name = self.team.input().divers[diver].name.clone();
            self.change_plan(
                |t| t.set_stage_cylinders(diver, None, ""),
                |_| tr_with("{0} carries no stage now", &[&name]),
            );
            self.picker = Picker::None;
        }
    }

    pub(super) fn apply_cylinders(
        &mut self,
        i: usize,
        stage: bool,
        set: crate::plan::CylinderSet,
        label: &str,
    ) {
        if stage {
            let name = self.team.input().divers[i].name.clone();
            self.change_plan(
                |t| t.set_stage_cylinders(i, Some(set), label),
                |s| {
                    tr_with(
                        "Stage of {0} now {1}",
                        &[&name, &s.team.shown_stage_label(i)],
                    )
                },
            );
            self.picker = Picker::None;
            return;
        }
        let before = self.before_change();
        match self.team.set_cylinders(i, set, label) {
            Ok(reset) => {
                let name = self.team.input().divers[i].name.clone();
                if reset {
                    self.status.push(tr_with(
                        "{0}: the start pressure did not fit {1}; it is now the working pressure. Enter the pressure you read in the water.",
                        &[&name, &label],
                    ));
                }
                self.save_team();
                let shown = self.team.shown_label(i);
                self.after_change(
                    tr_with("Cylinders of {0} now {1}", &[&name, &shown]),
                    before,
                );
            }
            Err(e) => self.status.push(e.to_string()),
        }
        self.picker = Picker::None;
    }

    pub fn open_mix_picker(&mut self, i: usize) {
        if let Some(d) = self.team.input().divers.get(i) {
            self.picker = Picker::for_mix(i, false, d.mix);
        }
    }

    pub fn open_stage_mix_picker(&mut self, i: usize) {
        if let Some(st) = self
            .team
            .input()
            .divers
            .get(i)
            .and_then(|d| d.stage.as_ref())
        {
            self.picker = Picker::for_mix(i, true, st.mix);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_mix_picker_stays_in_range_and_explains_a_bad_mix() {
        let mut p = Picker::for_mix(0, false, Mix::AIR);
        assert_eq!(p.mix_reason(), "");
        p.set_mix_percent(None, Some(200));
        assert_eq!(
            p,
            Picker::Mix {
                diver: 0,
                stage: false,
                o2: 21,
                he: 95
            }
        );
        assert_ne!(p.mix_reason(), "", "21 + 95 is more than 100 %");
        p.set_mix_percent(Some(50), Some(0));
        assert_eq!(p.mix(), Some(Mix { o2: 0.5, he: 0.0 }));
        p.close();
        assert_eq!(p.mix(), None);
    }
}
