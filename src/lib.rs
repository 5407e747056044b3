//! Turnsheet: team gas matching for overhead diving.
//!
//! Layers: `plan` (pure planning core) → `storage` (JSON files) → `app`
//! (controllers and Slint adapters) → `ui/` views.

pub mod app;
pub mod cli;
pub mod formats;
pub mod i18n;
pub mod plan;
pub mod platform;
pub mod storage;
