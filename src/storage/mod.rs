//! Storage: the app's JSON files (locker, settings, last team) in one data directory.
//! Writes are atomic (temp file, sync, rename). A file that cannot be read is moved
//! aside, never overwritten, and the caller gets a message to show.

pub mod atomic;
pub mod data_dir;
pub mod exchange;
pub mod lock;
pub mod locker;
pub mod locker_merge;
pub mod reading;
pub mod settings;
pub mod store;
pub mod team_state;

pub use store::{LoadReport, Store};
