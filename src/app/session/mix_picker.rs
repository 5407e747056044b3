//! The mix picker: its choices (this diver's recent mixes and the team's first, then
//! the common ones), the custom mix typed on the keypad, and Done.

use crate::i18n::tr_with;
use crate::plan::Mix;

use super::{Picker, Session};

/// Common mixes offered after the diver's own (common practice: air and the two
/// usual nitrox blends).
pub const COMMON_MIXES: [Mix; 3] = [
    Mix::AIR,
    Mix { o2: 0.32, he: 0.0 },
    Mix { o2: 0.36, he: 0.0 },
];

/// At most this many of the diver's and the team's mixes are offered (one row).
pub const OWN_CHOICES: usize = 4;

/// The mixes each diver chose in this session, newest first.
#[derive(Clone, Debug, Default, PartialEq)]
pub struct MixHistory {
    chosen: Vec<(String, Mix)>,
}

impl MixHistory {
    /// Remember that `diver` chose `mix` (newest first, each mix once per diver).
    pub fn record(&mut self, diver: &str, mix: Mix) {
        self.chosen
            .retain(|(d, m)| !(d == diver && same_mix(m, &mix)));
        self.chosen.insert(0, (diver.to_string(), mix));
        self.chosen.truncate(64);
    }

    /// What `diver` chose, newest first.
    pub fn of<'a>(&'a self, diver: &'a str) -> impl Iterator<Item = Mix> + 'a {
        self.chosen
            .iter()
            .filter(move |(d, _)| d == diver)
            .map(|(_, m)| *m)
    }
}

/// The same whole percents of O2 and He (what the picker shows).
fn same_mix(a: &Mix, b: &Mix) -> bool {
    percents(a) == percents(b)
}

fn percents(m: &Mix) -> (i32, i32) {
    ((m.o2 * 100.0).round() as i32, (m.he * 100.0).round() as i32)
}

/// The mix picker's quick choices: `own` (the diver's recent mixes, then those in the
/// team) and `common` (those of `COMMON_MIXES` not already offered).
#[derive(Clone, Debug, Default, PartialEq)]
pub struct MixChoices {
    pub own: Vec<Mix>,
    pub common: Vec<Mix>,
}

impl MixChoices {
    /// Choice `idx`, counting `own` first.
    pub fn get(&self, idx: usize) -> Option<Mix> {
        self.own.iter().chain(&self.common).nth(idx).copied()
    }
}

impl Session {
    /// The quick choices of the open mix picker (empty when it is closed).
    pub fn mix_choices(&self) -> MixChoices {
        let Picker::Mix { diver, .. } = self.picker else {
            return MixChoices::default();
        };
        let divers = &self.team.input().divers;
        let Some(me) = divers.get(diver) else {
            return MixChoices::default();
        };
        // This diver's first, then the others in team order.
        let team = std::iter::once(me)
            .chain(divers.iter())
            .flat_map(|d| std::iter::once(d.mix).chain(d.stage.as_ref().map(|st| st.mix)));
        let mut own: Vec<Mix> = Vec::new();
        for m in self.mix_history.of(&me.name).chain(team) {
            if own.len() < OWN_CHOICES && !own.iter().any(|o| same_mix(o, &m)) {
                own.push(m);
            }
        }
        let common = COMMON_MIXES
            .into_iter()
            .filter(|c| !own.iter().any(|o| same_mix(o, c)))
            .collect();
        MixChoices { own, common }
    }

    /// One of the quick choices (see `mix_choices`).
    pub fn pick_mix_choice(&mut self, idx: usize) {
        if let Some(m) = self.mix_choices().get(idx) {
            let (o2, he) = percents(&m);
            self.picker.set_mix_percent(Some(o2), Some(he));
        }
    }

    /// Use the mix picked; a mix the team refuses keeps the picker open.
    pub fn mix_done(&mut self) {
        if let (Picker::Mix { diver, stage, .. }, Some(mix)) = (self.picker, self.picker.mix()) {
            let before = self.before_change();
            let r = if stage {
                self.team.set_stage_mix(diver, mix)
            } else {
                self.team.set_mix(diver, mix)
            };
            match r {
                Ok(()) => {
                    let name = self.team.input().divers[diver].name.clone();
                    self.mix_history.record(&name, mix);
                    self.save_team();
                    self.picker = Picker::None;
                    let args: [&dyn std::fmt::Display; 2] = [&name, &mix.label()];
                    let what = if stage {
                        tr_with("Stage mix of {0} now {1}", &args)
                    } else {
                        tr_with("Mix of {0} now {1}", &args)
                    };
                    self.after_change(what, before);
                }
                Err(e) => self.status.push(e.to_string()),
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::storage::Store;

    fn labels(v: &[Mix]) -> Vec<String> {
        v.iter().map(|m| m.label()).collect()
    }

    #[test]
    fn the_divers_recent_mix_comes_first_then_the_team_then_common_nitrox() {
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        // The demo team breathes EAN32 throughout.
        s.open_mix_picker(0);
        let c = s.mix_choices();
        assert_eq!(labels(&c.own), ["EAN32"]);
        // Common practice: air, EAN32 and EAN36; EAN32 is offered once.
        assert_eq!(labels(&c.common), ["Air", "EAN36"]);
        // Ines breathes EAN28 for a dive, then Tx 18/45 (a custom mix each time).
        for (o2, he) in [(28, 0), (18, 45)] {
            s.open_mix_picker(0);
            s.picker.set_mix_percent(Some(o2), Some(he));
            s.mix_done();
        }
        s.open_mix_picker(0);
        let c = s.mix_choices();
        assert_eq!(labels(&c.own), ["Tx 18/45", "EAN28", "EAN32"]);
        // Bram's own history is empty: his mix and the team's come first.
        s.open_mix_picker(1);
        assert_eq!(labels(&s.mix_choices().own), ["EAN32", "Tx 18/45"]);
        s.pick_mix_choice(1);
        assert_eq!(
            s.picker.mix().map(|m| m.label()).as_deref(),
            Some("Tx 18/45")
        );
        s.pick_mix_choice(2);
        assert_eq!(s.picker.mix(), Some(Mix::AIR), "then the common ones");
        s.pick_mix_choice(99);
        assert_eq!(
            s.picker.mix(),
            Some(Mix::AIR),
            "out of range changes nothing"
        );
    }

    #[test]
    fn a_custom_mix_is_o2_then_he_on_the_keypad() {
        use crate::app::session::EntryTarget;
        let dir = tempfile::tempdir().unwrap();
        let mut s = Session::open(Store::new(dir.path()));
        s.open_mix_picker(2);
        s.open_entry(EntryTarget::MixO2);
        for k in ["clear", "1", "8"] {
            s.key(k);
        }
        s.entry_done();
        assert_eq!(
            s.entry.as_ref().map(|e| e.target()),
            Some(EntryTarget::MixHe)
        );
        for k in ["clear", "9", "9"] {
            s.key(k);
        }
        let e = s.entry.as_ref().unwrap();
        assert!(e.title().contains("helium (He)"), "{}", e.title());
        assert!(e.reason().contains("allowed 0 to 95 %"), "{}", e.reason());
        for k in ["del", "del", "4", "5"] {
            s.key(k);
        }
        s.entry_done();
        assert!(s.entry.is_none());
        // Trimix is worded as the mix labels word it.
        assert_eq!(
            s.picker.mix().map(|m| m.label()).as_deref(),
            Some("Tx 18/45")
        );
        s.mix_done();
        assert_eq!(s.team.input().divers[2].mix, Mix::trimix(0.18, 0.45));
    }

    #[test]
    fn the_history_keeps_each_mix_once_per_diver() {
        let mut h = MixHistory::default();
        h.record("Ines", Mix::AIR);
        h.record("Bram", Mix::nitrox(0.32));
        h.record("Ines", Mix::nitrox(0.32));
        h.record("Ines", Mix::AIR);
        let ines: Vec<_> = h.of("Ines").collect();
        assert_eq!(ines, [Mix::AIR, Mix::nitrox(0.32)]);
        assert_eq!(h.of("Sol").count(), 0);
    }
}
