//! Compiles the Slint views. The material style without a fixed scheme, so that
//! `Palette.color-scheme` reports the system's dark or light setting (ui/theme.slint
//! follows it when the settings say so); desktop and phone look the same. Debug builds
//! carry element debug info, which the UI tests' element queries need.

fn main() {
    // TURNSHEET_UI_DEBUG_INFO=1 keeps it in an optimised build too, so the random-tap
    // robot can time real actions in a release test build (BENCHMARKS.md).
    let debug = std::env::var("PROFILE")
        .map(|p| p == "debug")
        .unwrap_or(false)
        || std::env::var_os("TURNSHEET_UI_DEBUG_INFO").is_some();
    let config = slint_build::CompilerConfiguration::new()
        .with_style("material".into())
        .with_debug_info(debug)
        // The gettext catalogues, one per language; the Rust side reads the same files,
        // so messages carry no context (one msgid, one meaning, app-wide).
        .with_bundled_translations("lang")
        .with_default_translation_context(slint_build::DefaultTranslationContext::None);
    slint_build::compile_with_config("ui/app_window.slint", config).expect("Slint build failed");
    println!("cargo:rerun-if-changed=ui");
    println!("cargo:rerun-if-changed=lang");
    println!("cargo:rerun-if-env-changed=TURNSHEET_UI_DEBUG_INFO");
}
