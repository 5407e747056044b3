//! A cylinder set's one name, the same in the app, on the command line, on the card and
//! in the plan: decided here and nowhere else.
//!
//! - A name the diver typed stays as typed.
//! - A preset's name (or an old name of one) is that preset's name, in the reader's
//!   language.
//! - A set with no typed name, whose cylinders are exactly one preset's (count, twins or
//!   independent, stamp or rating), is called by that preset's name.
//! - Any other set gets the name made from its sizes ([`CylinderSet::describe`]).
//!
//! A "made" label (one written by [`CylinderSet::describe`] in any language) counts as no
//! label: it follows the set and the reader's language.

use super::catalogue::{current_preset_name, presets};
use super::cylinders::CylinderSet;
use super::team::TeamInput;
use crate::i18n::{Language, LanguageScope};

/// The set's name as people read it in this thread's language, given the label a person
/// gave it (typed, picked from the presets or the locker), if any.
pub fn set_name(label: Option<&str>, set: &CylinderSet) -> String {
    if let Some(label) = label.map(str::trim).filter(|l| !l.is_empty()) {
        let label = current_preset_name(label);
        if let Some(p) = presets().into_iter().find(|p| p.name == label) {
            return p.shown_name();
        }
        if !is_made_name(label, set) {
            return label.to_string();
        }
    }
    let all = presets();
    let mut same = all.iter().filter(|p| p.set == *set);
    match (same.next(), same.next()) {
        (Some(p), None) => p.shown_name(),
        _ => set.describe(),
    }
}

/// A label as people read it in this thread's language: [`set_name`] of a label that may
/// be empty.
pub fn shown_label(label: &str, set: &CylinderSet) -> String {
    set_name(Some(label), set)
}

/// Whether `label` is the name [`CylinderSet::describe`] makes for `set` in some language.
/// Older versions called an independent pair "Twin …" when they made its name: that name
/// counts as made too.
pub fn is_made_name(label: &str, set: &CylinderSet) -> bool {
    let twins = CylinderSet {
        independent: false,
        ..*set
    };
    Language::ALL.iter().any(|&l| {
        let _scope = LanguageScope::new(l);
        set.describe() == label || twins.describe() == label
    })
}

/// What people called a team's sets: per diver, in team order, the label of the main
/// cylinders and of the stage (empty, or missing, where nobody gave one).
#[derive(Clone, Debug, Default, PartialEq)]
pub struct SetLabels {
    /// Each diver's label for their main cylinders.
    pub sets: Vec<String>,
    /// Each diver's label for their stage.
    pub stages: Vec<String>,
}

impl SetLabels {
    /// Diver `i`'s cylinders by their one name ([`set_name`]).
    pub fn set_name(&self, team: &TeamInput, i: usize) -> String {
        let label = self.sets.get(i).map(String::as_str);
        set_name(label, &team.divers[i].cylinders)
    }

    /// Diver `i`'s stage by its one name; None without a stage.
    pub fn stage_name(&self, team: &TeamInput, i: usize) -> Option<String> {
        let stage = team.divers[i].stage.as_ref()?;
        let label = self.stages.get(i).map(String::as_str);
        Some(set_name(label, &stage.cylinders))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::plan::CylinderSpec;

    fn rated(count: u8, independent: bool, rated_cuft: f64) -> CylinderSet {
        CylinderSet {
            count,
            independent,
            spec: CylinderSpec::Rated {
                rated_cuft,
                rated_psi: 3000.0,
            },
        }
    }

    #[test]
    fn typed_names_stay_and_every_other_set_gets_one_name() {
        let sidemount = rated(2, true, 77.4);
        let name = "Sidemount aluminium 77.4 cu ft 3000 psi";
        // No label, a made label, the preset's name and an old one: the preset's name.
        for label in [
            None,
            Some(""),
            Some("2 × 77.4 cu ft 3000 psi, independent"),
            Some("Twin 77.4 cu ft 3000 psi"),
            Some(name),
            Some("Sidemount 2 × aluminium 80"),
        ] {
            assert_eq!(set_name(label, &sidemount), name, "{label:?}");
        }
        assert_eq!(set_name(Some(" Bram's pair "), &sidemount), "Bram's pair");
        // The same cylinders on a manifold are no preset: the made name.
        let twins = rated(2, false, 77.4);
        assert_eq!(set_name(None, &twins), "Twin 77.4 cu ft 3000 psi");
        // A single 40 is the one preset of its set.
        assert_eq!(
            set_name(None, &rated(1, false, 40.0)),
            "Single aluminium 40 cu ft 3000 psi"
        );
        assert_eq!(
            set_name(None, &rated(3, false, 40.0)),
            "3 × 40 cu ft 3000 psi"
        );
        // Every preset's cylinders, unnamed, are called by that preset's name: no two
        // presets hold the same set.
        for p in presets() {
            assert_eq!(set_name(None, &p.set), p.name);
        }
    }

    #[test]
    fn set_names_are_written_in_the_readers_language_unless_typed() {
        let sm = presets()
            .into_iter()
            .find(|p| p.name == "Sidemount aluminium 77.4 cu ft 3000 psi")
            .unwrap();
        let twin = CylinderSet::new(
            2,
            CylinderSpec::Stamped {
                water_l: 11.1,
                working_bar: 232.0,
            },
        );
        let made_in_english = twin.describe();
        let _de = LanguageScope::new(Language::German);
        // A preset, a name made in English, an old preset name, a typed name.
        let preset = shown_label(sm.name, &sm.set);
        assert!(
            preset.contains("77,4") && preset.contains("Aluminium"),
            "{preset}"
        );
        let made = shown_label(&made_in_english, &twin);
        assert!(made.contains("11,1") && made != made_in_english, "{made}");
        assert_eq!(shown_label("Sidemount 2 × aluminium 80", &sm.set), preset);
        assert_eq!(shown_label("My 11.1 doubles", &twin), "My 11.1 doubles");
        assert_eq!(set_name(None, &sm.set), preset);
    }
}
