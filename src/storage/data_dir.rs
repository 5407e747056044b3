//! Where the app keeps its files.

use std::path::PathBuf;

/// Environment variable that overrides the data directory (tests, CLI, power users).
pub const DATA_DIR_ENV: &str = "TURNSHEET_DATA_DIR";

/// The desktop data directory: `TURNSHEET_DATA_DIR` if set and not empty, else the
/// platform's per-user data directory for the app, else `./turnsheet-data`.
pub fn desktop_data_dir() -> PathBuf {
    resolve(
        std::env::var_os(DATA_DIR_ENV).map(PathBuf::from),
        platform_dir(),
    )
}

fn platform_dir() -> Option<PathBuf> {
    directories::ProjectDirs::from("org", "Turnsheet", "turnsheet")
        .map(|d| d.data_dir().to_path_buf())
}

/// Pick the data directory: an explicit override wins, then the platform directory.
pub fn resolve(override_dir: Option<PathBuf>, platform: Option<PathBuf>) -> PathBuf {
    override_dir
        .filter(|p| !p.as_os_str().is_empty())
        .or(platform)
        .unwrap_or_else(|| PathBuf::from("turnsheet-data"))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn override_wins_and_empty_is_ignored() {
        let a = PathBuf::from("/x");
        let b = PathBuf::from("/y");
        assert_eq!(resolve(Some(a.clone()), Some(b.clone())), a);
        assert_eq!(resolve(Some(PathBuf::new()), Some(b.clone())), b);
        assert_eq!(resolve(None, None), PathBuf::from("turnsheet-data"));
    }
}
