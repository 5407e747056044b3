//! Generic cylinder presets by trade size (no brands). Trade facts, many from memory:
//! divers should check their own stamps.

use super::cylinders::{CylinderSet, CylinderSpec};

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

const fn stamped(count: u8, water_l: f64, working_bar: f64) -> CylinderSet {
    CylinderSet {
        count,
        spec: CylinderSpec::Stamped {
            water_l,
            working_bar,
        },
    }
}

const fn rated(count: u8, rated_cuft: f64, rated_psi: f64) -> CylinderSet {
    CylinderSet {
        count,
        spec: CylinderSpec::Rated {
            rated_cuft,
            rated_psi,
        },
    }
}

/// The catalogue: metric stamps first, then imperial ratings.
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
            name: "Sidemount 2 × aluminium 11.1 L 207 bar",
            set: stamped(2, 11.1, 207.0),
            material: Aluminium,
        },
        Preset {
            name: "Sidemount 2 × aluminium 80",
            set: rated(2, 77.4, 3000.0),
            material: Aluminium,
        },
        Preset {
            name: "Aluminium 80",
            set: rated(1, 77.4, 3000.0),
            material: Aluminium,
        },
        Preset {
            name: "Aluminium 40",
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
            crate::plan::validate_cylinders(crate::plan::UnitSystem::Metric, p.name, &p.set)
                .unwrap_or_else(|e| panic!("{e}"));
        }
    }
}
