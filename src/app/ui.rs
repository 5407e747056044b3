//! The Slint views, compiled from `ui/app_window.slint` by `build.rs`: the window, each
//! page's adapter global and the row structs they exchange. Only the adapters and the
//! frame (`App`) use these types; controllers and view models never do.

slint::include_modules!();
