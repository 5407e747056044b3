//! The cylinder and mix pickers (main gas and stage): the open picker with its own
//! methods, and the session actions that open it and apply the choice.

use crate::plan::Mix;
use crate::plan::catalogue::presets;
use crate::plan::team::validate_mix;

use super::Session;

/// An open picker, for a diver's main gas or stage.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Picker {
    None,
    Cylinders {
        diver: usize,
        stage: bool,
    },
    /// O2 and He in percent.
    Mix {
        diver: usize,
        stage: bool,
        o2: i32,
        he: i32,
    },
}

/// The quick choices of the mix picker: air, EAN32, EAN50, Tx 21/35, Tx 18/45.
const QUICK_MIXES: [(i32, i32); 5] = [(21, 0), (32, 0), (50, 0), (21, 35), (18, 45)];

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

    /// Change O2 and He by whole percents, within 5–100 % O2 and 0–95 % He.
    pub fn nudge_mix(&mut self, o2_delta: i32, he_delta: i32) {
        if let Picker::Mix { o2, he, .. } = self {
            *o2 = (*o2 + o2_delta).clamp(5, 100);
            *he = (*he + he_delta).clamp(0, 95);
        }
    }

    /// One of the quick choices (see `QUICK_MIXES`).
    pub fn quick_mix(&mut self, idx: usize) {
        if let (Picker::Mix { o2, he, .. }, Some((q_o2, q_he))) = (self, QUICK_MIXES.get(idx)) {
            *o2 = *q_o2;
            *he = *q_he;
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
            let r = self.team.set_stage_cylinders(diver, None, "");
            self.team_result(r);
            self.picker = Picker::None;
        }
    }

    fn apply_cylinders(
        &mut self,
        i: usize,
        stage: bool,
        set: crate::plan::CylinderSet,
        label: &str,
    ) {
        if stage {
            let r = self.team.set_stage_cylinders(i, Some(set), label);
            self.team_result(r);
            self.picker = Picker::None;
            return;
        }
        match self.team.set_cylinders(i, set, label) {
            Ok(reset) => {
                if reset {
                    self.status.push(format!(
                        "{}: the start pressure did not fit {label}; it is now the working pressure. Enter the pressure you read in the water.",
                        self.team.input().divers[i].name
                    ));
                }
                self.save_team();
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

    /// Use the mix picked; a mix the team refuses keeps the picker open.
    pub fn mix_done(&mut self) {
        if let (Picker::Mix { diver, stage, .. }, Some(mix)) = (self.picker, self.picker.mix()) {
            let r = if stage {
                self.team.set_stage_mix(diver, mix)
            } else {
                self.team.set_mix(diver, mix)
            };
            match r {
                Ok(()) => {
                    self.save_team();
                    self.picker = Picker::None;
                }
                Err(e) => self.status.push(e.to_string()),
            }
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
        p.nudge_mix(0, 200);
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
        p.quick_mix(2);
        assert_eq!(p.mix(), Some(Mix { o2: 0.5, he: 0.0 }));
        p.close();
        assert_eq!(p.mix(), None);
    }
}
