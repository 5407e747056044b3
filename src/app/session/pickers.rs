//! Session actions of the cylinder and mix pickers (main gas and stage).

use crate::plan::Mix;
use crate::plan::catalogue::presets;
use crate::plan::team::validate_mix;

use super::{Picker, Session};

impl Session {
    // ---- pickers -----------------------------------------------------------------

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
        let Some(e) = self.locker.file.entries.get(idx).cloned() else {
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
            self.picker = Picker::Mix {
                diver: i,
                stage: false,
                o2: (d.mix.o2 * 100.0).round() as i32,
                he: (d.mix.he * 100.0).round() as i32,
            };
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
            self.picker = Picker::Mix {
                diver: i,
                stage: true,
                o2: (st.mix.o2 * 100.0).round() as i32,
                he: (st.mix.he * 100.0).round() as i32,
            };
        }
    }

    pub fn picker_mix(&self) -> Option<Mix> {
        match self.picker {
            Picker::Mix { o2, he, .. } => Some(Mix {
                o2: f64::from(o2) / 100.0,
                he: f64::from(he) / 100.0,
            }),
            _ => None,
        }
    }

    pub fn mix_reason(&self) -> String {
        match self.picker_mix() {
            Some(m) => validate_mix("mix", &m)
                .err()
                .map(|e| e.message)
                .unwrap_or_default(),
            None => String::new(),
        }
    }

    pub fn nudge_mix(&mut self, o2_delta: i32, he_delta: i32) {
        if let Picker::Mix { o2, he, .. } = &mut self.picker {
            *o2 = (*o2 + o2_delta).clamp(5, 100);
            *he = (*he + he_delta).clamp(0, 95);
        }
    }

    /// The quick choices of the mix picker: air, EAN32, EAN50, Tx 21/35, Tx 18/45.
    pub fn quick_mix(&mut self, idx: usize) {
        const QUICK: [(i32, i32); 5] = [(21, 0), (32, 0), (50, 0), (21, 35), (18, 45)];
        if let (Picker::Mix { o2, he, .. }, Some((q_o2, q_he))) = (&mut self.picker, QUICK.get(idx))
        {
            *o2 = *q_o2;
            *he = *q_he;
        }
    }

    pub fn mix_done(&mut self) {
        if let (Picker::Mix { diver, stage, .. }, Some(mix)) = (self.picker, self.picker_mix()) {
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

    pub fn close_picker(&mut self) {
        self.picker = Picker::None;
    }
}
