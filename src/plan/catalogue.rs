//! Generic cylinder presets by trade size (no brands). Trade facts, many from memory:
//! divers should check their own stamps.

use super::cylinders::{CylinderSet, CylinderSpec};
use crate::i18n::{tr, tr_with};

/// Cylinder material, for the locker's description.
#[derive(Clone, Copy, Debug, PartialEq, Eq, serde::Serialize, serde::Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum Material {
    /// Steel (the default).
    #[default]
    Steel,
    /// Aluminium.
    Aluminium,
    /// Composite.
    Composite,
}

impl Material {
    /// Every material: steel, aluminium, composite.
    pub const ALL: [Material; 3] = [Material::Steel, Material::Aluminium, Material::Composite];
    /// The lowercase name: "steel", "aluminium" or "composite".
    pub fn name(self) -> &'static str {
        match self {
            Material::Steel => "steel",
            Material::Aluminium => "aluminium",
            Material::Composite => "composite",
        }
    }

    /// The material's word as people read it, in this thread's language ("steel" in
    /// English); names and files keep [`Material::name`].
    pub fn shown_name(self) -> String {
        match self {
            Material::Steel => tr("steel"),
            Material::Aluminium => tr("aluminium"),
            Material::Composite => tr("composite"),
        }
    }
}

/// One generic preset.
#[derive(Clone, Debug, PartialEq)]
pub struct Preset {
    /// Display name, e.g. "Twin 12 L 232 bar".
    pub name: &'static str,
    /// The cylinders: count and each one's stamp or rating.
    pub set: CylinderSet,
    /// What the cylinders are made of.
    pub material: Material,
}

impl Preset {
    /// The preset's name as people read it, in this thread's language; in English the
    /// same as [`Preset::name`], which is what files, the locker and labels keep.
    pub fn shown_name(&self) -> String {
        let size = self.set.spec.describe();
        let named = self.name.contains(self.material.name());
        match (self.set.count, self.set.independent, named, self.material) {
            (2, true, _, Material::Aluminium) => tr_with("Sidemount aluminium {0}", &[&size]),
            (2, false, true, Material::Steel) => tr_with("Twin steel {0}", &[&size]),
            (1, _, true, Material::Aluminium) => tr_with("Single aluminium {0}", &[&size]),
            (1, _, true, Material::Steel) => tr_with("Single steel {0}", &[&size]),
            _ => self.set.describe(),
        }
    }
}

const fn stamped(count: u8, water_l: f64, working_bar: f64) -> CylinderSet {
    CylinderSet::new(
        count,
        CylinderSpec::Stamped {
            water_l,
            working_bar,
        },
    )
}

const fn rated(count: u8, rated_cuft: f64, rated_psi: f64) -> CylinderSet {
    CylinderSet::new(
        count,
        CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        },
    )
}

/// A sidemount pair: two independent cylinders.
const fn sidemount(set: CylinderSet) -> CylinderSet {
    CylinderSet::independent_pair(set.spec)
}

/// Preset names given up, and the name each preset has now: a team or locker saved
/// with an old name still finds its preset.
const RENAMED: [(&str, &str); 4] = [
    ("Aluminium 80", "Single aluminium 77.4 cu ft 3000 psi"),
    ("Aluminium 40", "Single aluminium 40 cu ft 3000 psi"),
    (
        "Sidemount 2 × aluminium 80",
        "Sidemount aluminium 77.4 cu ft 3000 psi",
    ),
    (
        "Sidemount 2 × aluminium 11.1 L 207 bar",
        "Sidemount aluminium 11.1 L 207 bar",
    ),
];

/// The name a preset has now, for a name that may be an old one; any other name as it is.
pub fn current_preset_name(name: &str) -> &str {
    RENAMED
        .iter()
        .find(|(old, _)| *old == name)
        .map_or(name, |(_, now)| now)
}

/// The catalogue: metric stamps first, then imperial ratings. Each name gives the count
/// (single, twin, sidemount pair), the material where it is not steel or the rating is
/// imperial, and the water capacity and working pressure, or the rated volume and
/// pressure.
pub fn presets() -> Vec<Preset> {
    use Material::*;
    vec![
        Preset {
            name: "Twin 12 L 232 bar",
            set: stamped(2, 12.0, 232.0),
            material: Steel,
        },
        Preset {
            name: "Twin 10 L 300 bar",
            set: stamped(2, 10.0, 300.0),
            material: Steel,
        },
        Preset {
            name: "Twin 7 L 232 bar",
            set: stamped(2, 7.0, 232.0),
            material: Steel,
        },
        Preset {
            name: "Twin 8.5 L 300 bar",
            set: stamped(2, 8.5, 300.0),
            material: Steel,
        },
        Preset {
            name: "Single 12 L 232 bar",
            set: stamped(1, 12.0, 232.0),
            material: Steel,
        },
        Preset {
            name: "Single 15 L 232 bar",
            set: stamped(1, 15.0, 232.0),
            material: Steel,
        },
        Preset {
            name: "Single 18 L 232 bar",
            set: stamped(1, 18.0, 232.0),
            material: Steel,
        },
        Preset {
            name: "Single 10 L 200 bar",
            set: stamped(1, 10.0, 200.0),
            material: Steel,
        },
        Preset {
            name: "Sidemount aluminium 11.1 L 207 bar",
            set: sidemount(stamped(2, 11.1, 207.0)),
            material: Aluminium,
        },
        Preset {
            name: "Sidemount aluminium 77.4 cu ft 3000 psi",
            set: sidemount(rated(2, 77.4, 3000.0)),
            material: Aluminium,
        },
        Preset {
            name: "Single aluminium 77.4 cu ft 3000 psi",
            set: rated(1, 77.4, 3000.0),
            material: Aluminium,
        },
        Preset {
            name: "Single aluminium 40 cu ft 3000 psi",
            set: rated(1, 40.0, 3000.0),
            material: Aluminium,
        },
        Preset {
            name: "Twin steel 85 cu ft 2640 psi",
            set: rated(2, 85.0, 2640.0),
            material: Steel,
        },
        Preset {
            name: "Twin steel 95 cu ft 2640 psi",
            set: rated(2, 95.0, 2640.0),
            material: Steel,
        },
        Preset {
            name: "Twin steel 104 cu ft 2640 psi",
            set: rated(2, 104.0, 2640.0),
            material: Steel,
        },
        Preset {
            name: "Twin steel 100 cu ft 3442 psi",
            set: rated(2, 100.0, 3442.0),
            material: Steel,
        },
        Preset {
            name: "Twin steel 120 cu ft 3442 psi",
            set: rated(2, 120.0, 3442.0),
            material: Steel,
        },
        Preset {
            name: "Twin steel 130 cu ft 3442 psi",
            set: rated(2, 130.0, 3442.0),
            material: Steel,
        },
        Preset {
            name: "Single steel 100 cu ft 3442 psi",
            set: rated(1, 100.0, 3442.0),
            material: Steel,
        },
    ]
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::plan::ModelKind;

    #[test]
    fn presets_are_valid_and_water_matches_trade_tables() {
        // Trade facts, from memory: low-pressure steel 85 / 104 cu ft ~13.4 / 16.5 L,
        // high-pressure steel 100 / 130 cu ft ~12.9 / 16.7 L of water per cylinder.
        let expect = [
            ("Twin steel 85 cu ft 2640 psi", 13.4),
            ("Twin steel 104 cu ft 2640 psi", 16.5),
            ("Twin steel 100 cu ft 3442 psi", 12.9),
            ("Twin steel 130 cu ft 3442 psi", 16.7),
        ];
        let all = presets();
        for (name, litres) in expect {
            let p = all.iter().find(|p| p.name == name).unwrap();
            let w = p.set.spec.water_per_cylinder(ModelKind::Real).litres();
            assert!(
                (w - litres).abs() / litres < 0.05,
                "{name}: {w:.2} L vs {litres} L"
            );
        }
        for p in &all {
            // Sidemount presets are independent pairs; twins are not.
            assert_eq!(
                p.set.independent,
                p.name.starts_with("Sidemount"),
                "{}",
                p.name
            );
            crate::plan::validate_cylinders(crate::plan::UnitSystem::Metric, p.name, &p.set)
                .unwrap_or_else(|e| panic!("{e}"));
        }
    }

    #[test]
    fn old_preset_names_still_find_their_preset() {
        let all = presets();
        for (old, now) in RENAMED {
            assert_eq!(current_preset_name(old), now);
            assert!(all.iter().any(|p| p.name == now), "{now}");
            assert!(all.iter().all(|p| p.name != old), "{old}");
        }
        assert_eq!(current_preset_name("My twins"), "My twins");
        // In English a preset is shown by its own name.
        for p in &all {
            assert_eq!(p.shown_name(), p.name);
        }
        // Every name fits a locker entry's name (40 characters).
        assert!(all.iter().all(|p| p.name.chars().count() <= 40));
    }
}
