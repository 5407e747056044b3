//! The Android packaging metadata and resources, checked on desktop: no permissions,
//! a launcher icon at every density, a real application id and label.

use std::path::Path;

fn manifest() -> toml::Value {
    let text =
        std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("Cargo.toml")).unwrap();
    text.parse().unwrap()
}

fn android(m: &toml::Value) -> &toml::Value {
    &m["package"]["metadata"]["android"]
}

#[test]
fn no_permission_is_declared_anywhere() {
    let m = manifest();
    let a = android(&m);
    for key in ["uses_permission", "uses_feature", "permission"] {
        assert!(a.get(key).is_none(), "Cargo.toml declares android {key}");
    }
    fn walk(dir: &Path) {
        for e in std::fs::read_dir(dir).unwrap().flatten() {
            let p = e.path();
            if p.is_dir() {
                walk(&p);
            } else if p.extension().is_some_and(|x| x == "xml") {
                let text = std::fs::read_to_string(&p).unwrap();
                assert!(
                    !text.contains("uses-permission"),
                    "{} declares a permission",
                    p.display()
                );
            }
        }
    }
    walk(&Path::new(env!("CARGO_MANIFEST_DIR")).join("android"));
}

#[test]
fn identity_and_activity_settings() {
    let m = manifest();
    let a = android(&m);
    let id = a["package"].as_str().unwrap();
    assert!(
        id.split('.').count() >= 2
            && id
                .split('.')
                .all(|p| !p.is_empty() && p.chars().all(|c| c.is_ascii_alphanumeric() || c == '_')),
        "application id {id:?}"
    );
    assert!(
        !a["application"]["label"]
            .as_str()
            .unwrap()
            .trim()
            .is_empty()
    );
    assert_eq!(a["sdk"]["min_sdk_version"].as_integer(), Some(26));
    assert!(a["sdk"]["target_sdk_version"].as_integer().unwrap() >= 34);
    assert!(
        a["build_targets"]
            .as_array()
            .unwrap()
            .iter()
            .any(|t| t.as_str() == Some("aarch64-linux-android"))
    );
    let act = &a["application"]["activity"];
    assert_eq!(act["orientation"].as_str(), Some("portrait"));
    assert_eq!(act["launch_mode"].as_str(), Some("singleTop"));
    let changes = act["config_changes"].as_str().unwrap();
    for c in ["orientation", "screenSize", "keyboardHidden", "density"] {
        assert!(
            changes.split('|').any(|x| x == c),
            "config_changes lacks {c}"
        );
    }
    // The Android backend is enabled for Android targets only.
    let android_deps = &m["target"]["cfg(target_os = \"android\")"]["dependencies"]["slint"];
    assert!(
        android_deps["features"]
            .as_array()
            .unwrap()
            .iter()
            .any(|f| f.as_str() == Some("backend-android-activity-06"))
    );
    let desktop = &m["dependencies"]["slint"];
    assert!(desktop.get("features").is_none_or(|f| {
        !f.as_array()
            .unwrap()
            .iter()
            .any(|x| x.as_str().unwrap().starts_with("backend-android"))
    }));
    let crate_types = m["lib"]["crate-type"].as_array().unwrap();
    assert!(crate_types.iter().any(|t| t.as_str() == Some("cdylib")));
}

#[test]
fn launcher_icon_exists_at_every_density() {
    let m = manifest();
    let a = android(&m);
    let icon = a["application"]["icon"].as_str().unwrap();
    let name = icon.strip_prefix("@mipmap/").expect("icon is a mipmap");
    let res = Path::new(env!("CARGO_MANIFEST_DIR")).join(a["resources"].as_str().unwrap());
    for (density, px) in [
        ("mdpi", 48),
        ("hdpi", 72),
        ("xhdpi", 96),
        ("xxhdpi", 144),
        ("xxxhdpi", 192),
    ] {
        let path = res.join(format!("mipmap-{density}/{name}.png"));
        let file =
            std::fs::File::open(&path).unwrap_or_else(|_| panic!("missing {}", path.display()));
        let info = png::Decoder::new(std::io::BufReader::new(file))
            .read_info()
            .unwrap()
            .info()
            .clone();
        assert_eq!((info.width, info.height), (px, px), "{}", path.display());
    }
}
