//! Who is in the team and what they carry: adding and removing divers, cylinder sets
//! and stages.

use super::TeamController;
use crate::i18n::{tr, tr_with};
use crate::plan::InputError;
use crate::plan::round_down_to_step;
use crate::plan::{CylinderSet, DiverInput, Mix, Temperature};
use crate::plan::{MAX_DIVERS, MIN_DIVERS};

impl TeamController {
    /// Give a diver a cylinder set. If the start pressure does not fit the new set, the
    /// start becomes the set's working pressure; the returned flag says so.
    pub fn set_cylinders(
        &mut self,
        i: usize,
        set: CylinderSet,
        label: &str,
    ) -> Result<bool, InputError> {
        let first = self.try_update(|t| t.divers[i].cylinders = set);
        let reset = match first {
            Ok(()) => false,
            Err(_) => {
                let wp = set.working_pressure();
                self.try_update(|t| {
                    t.divers[i].cylinders = set;
                    t.divers[i].start = wp;
                })?;
                // The working pressure stands in for a start nobody read.
                self.readings.clear(i);
                true
            }
        };
        self.labels[i] = label.to_string();
        self.gauge_for_new_set(i, set);
        Ok(reset)
    }

    /// A diver whose start is not read yet gets the gauge that goes with the set: psi for
    /// an imperial rating, bar for a metric stamp (the team's graduation when the team
    /// reads that unit). A diver with a reading keeps the gauge it was read on.
    fn gauge_for_new_set(&mut self, i: usize, set: CylinderSet) {
        if self.readings.get(i).is_some() {
            return;
        }
        let unit = match set.spec {
            crate::plan::CylinderSpec::Rated { .. } => crate::plan::PressureUnit::Psi,
            crate::plan::CylinderSpec::Stamped { .. } => crate::plan::PressureUnit::Bar,
        };
        let team = self.input.default_gauge();
        let gauge = if unit == team.unit {
            team
        } else {
            crate::plan::Gauge::usual(unit)
        };
        if gauge != self.input.gauge_of(i) {
            let _ = self.set_gauge(i, gauge);
        }
    }

    /// Give a diver a stage set, or take it away. A new stage starts full (its working
    /// pressure); a changed set keeps the start if it still fits.
    pub fn set_stage_cylinders(
        &mut self,
        i: usize,
        set: Option<CylinderSet>,
        label: &str,
    ) -> Result<(), InputError> {
        match set {
            None => {
                self.try_update(|t| t.divers[i].stage = None)?;
                self.stage_labels[i].clear();
                self.stage_readings.clear(i);
            }
            Some(set) => {
                let u = self.input.units;
                let full = u.pressure(round_down_to_step(
                    u.pressure_value(set.working_pressure()),
                    self.input.gauge_step,
                ));
                let old = self.input.divers[i].stage.clone();
                let kept = old.as_ref().map(|st| st.start).filter(|p| {
                    p.bar() <= set.working_pressure().bar() * crate::plan::MAX_FILL_RATIO
                });
                let mix = old.map(|st| st.mix).unwrap_or(Mix::nitrox(0.5));
                self.try_update(|t| {
                    t.divers[i].stage = Some(crate::plan::StageInput {
                        cylinders: set,
                        mix,
                        start: kept.unwrap_or(full),
                    })
                })?;
                self.stage_labels[i] = label.to_string();
                // Another stage: its gauge has not been read.
                self.stage_readings.clear(i);
            }
        }
        Ok(())
    }

    pub fn can_add(&self) -> bool {
        self.len() < MAX_DIVERS
    }
    pub fn can_remove(&self) -> bool {
        self.len() > MIN_DIVERS
    }

    /// Add a diver with the given set, full to working pressure (on the gauge step).
    pub fn add_diver(&mut self, set: CylinderSet, label: &str) -> Result<(), InputError> {
        if !self.can_add() {
            return Err(InputError::new(
                "divers",
                tr_with("a team has at most {0} divers", &[&MAX_DIVERS]),
            ));
        }
        let n = self.len() + 1;
        let mut name = tr_with("Diver {0}", &[&n]);
        let mut k = n;
        while self.input.divers.iter().any(|d| d.name == name) {
            k += 1;
            name = tr_with("Diver {0}", &[&k]);
        }
        let u = self.input.units;
        let start = u.pressure(round_down_to_step(
            u.pressure_value(set.working_pressure()),
            self.input.gauge_step,
        ));
        let mix = self.input.divers.last().map(|d| d.mix).unwrap_or_default();
        self.try_update(|t| {
            t.divers.push(DiverInput {
                name,
                cylinders: set,
                mix,
                start,
                sac_l_per_min: None,
                stage: None,
                gauge: None,
            })
        })?;
        self.labels.push(label.to_string());
        self.stage_labels.push(String::new());
        // The start is a placeholder until someone reads the gauge in the water.
        self.readings.push_unread();
        self.stage_readings.push_unread();
        Ok(())
    }

    pub fn remove_diver(&mut self, i: usize) -> Result<(), InputError> {
        if !self.can_remove() {
            return Err(InputError::new(
                "divers",
                tr_with("a team has at least {0} divers", &[&MIN_DIVERS]),
            ));
        }
        self.try_update(|t| {
            t.divers.remove(i);
        })?;
        self.labels.remove(i);
        self.stage_labels.remove(i);
        self.readings.remove(i);
        self.stage_readings.remove(i);
        Ok(())
    }

    /// Turn this team into a fresh two-diver team: "Me" and "Buddy", both with `set`
    /// full to its working pressure (on the gauge step), air, no breathing rate, no
    /// stage, no depth, at `water_temp`. Rule, units and gauge step are kept.
    pub fn start_afresh(&mut self, set: CylinderSet, label: &str, water_temp: Temperature) {
        while self.len() > 2 {
            let _ = self.remove_diver(self.len() - 1);
        }
        for (i, name) in [tr("Me"), tr("Buddy")].into_iter().enumerate() {
            let _ = self.set_name(i, &name);
            let _ = self.set_cylinders(i, set, label);
            let _ = self.set_mix(i, Mix::AIR);
            let _ = self.set_sac(i, None);
            let _ = self.set_stage_cylinders(i, None, "");
            let u = self.input.units;
            let start = round_down_to_step(
                u.pressure_value(set.working_pressure()),
                self.input.gauge_step,
            );
            let _ = self.set_start(i, u.pressure(start));
        }
        let _ = self.set_depth(None);
        let _ = self.set_water_temp(water_temp);
        self.forget_readings();
        self.demo = false;
    }
}
