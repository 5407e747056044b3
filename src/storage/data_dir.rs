//! Where the app keeps its files.

use std::path::{Path, PathBuf};

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

/// Where the Locker page's "Import sets" looks: `<data dir>/import`.
pub fn import_dir(data_dir: &Path) -> PathBuf {
    data_dir.join("import")
}

/// Where the Locker page's "Export locker" writes. Desktop: the user's Downloads folder
/// if it exists, else the home folder, else the data directory. Android: the data
/// directory (app storage; sharing it is for later).
pub fn export_dir(data_dir: &Path) -> PathBuf {
    if cfg!(target_os = "android") {
        return data_dir.to_path_buf();
    }
    let user = directories::UserDirs::new();
    pick_export_dir(
        user.as_ref()
            .and_then(|u| u.download_dir().map(Path::to_path_buf)),
        user.as_ref().map(|u| u.home_dir().to_path_buf()),
        data_dir,
    )
}

/// The first of Downloads and home that is an existing folder, else the data directory.
pub fn pick_export_dir(downloads: Option<PathBuf>, home: Option<PathBuf>, data: &Path) -> PathBuf {
    [downloads, home]
        .into_iter()
        .flatten()
        .find(|p| p.is_dir())
        .unwrap_or_else(|| data.to_path_buf())
}

/// Where cards go unless the platform start says otherwise: `<data dir>/cards`.
pub fn data_card_dir(data_dir: &Path) -> PathBuf {
    data_dir.join("cards")
}

/// Where the app's team cards go so that their owner can open them. Desktop: the
/// user's Documents folder if it exists, else Downloads, else `<data dir>/cards`.
/// Android: `<data dir>/cards` (app storage), the copy the app keeps; the platform start
/// also hands each card to the shared Downloads collection (Download/Turnsheet, through
/// the media store: `platform/android_share.rs`, `Exchange::publish_card`), where the
/// phone's file apps open it.
pub fn user_card_dir(data_dir: &Path) -> PathBuf {
    if cfg!(target_os = "android") {
        return data_card_dir(data_dir);
    }
    let user = directories::UserDirs::new();
    pick_card_dir(
        user.as_ref()
            .and_then(|u| u.document_dir().map(Path::to_path_buf)),
        user.as_ref()
            .and_then(|u| u.download_dir().map(Path::to_path_buf)),
        data_dir,
    )
}

/// The first of Documents and Downloads that is an existing folder, else
/// `<data dir>/cards`.
pub fn pick_card_dir(
    documents: Option<PathBuf>,
    downloads: Option<PathBuf>,
    data: &Path,
) -> PathBuf {
    [documents, downloads]
        .into_iter()
        .flatten()
        .find(|p| p.is_dir())
        .unwrap_or_else(|| data_card_dir(data))
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

    #[test]
    fn exports_go_to_an_existing_folder() {
        let t = tempfile::tempdir().unwrap();
        let data = t.path().join("data");
        let home = t.path().to_path_buf();
        let downloads = t.path().join("Downloads");
        assert_eq!(
            pick_export_dir(Some(downloads.clone()), Some(home.clone()), &data),
            home,
            "no Downloads folder: home"
        );
        std::fs::create_dir(&downloads).unwrap();
        assert_eq!(
            pick_export_dir(Some(downloads.clone()), Some(home), &data),
            downloads
        );
        assert_eq!(pick_export_dir(None, None, &data), data);
        assert_eq!(import_dir(&data), data.join("import"));
    }

    #[test]
    fn cards_go_to_documents_else_downloads_else_the_data_dir() {
        let t = tempfile::tempdir().unwrap();
        let data = t.path().join("data");
        let documents = t.path().join("Documents");
        let downloads = t.path().join("Downloads");
        let pick = || pick_card_dir(Some(documents.clone()), Some(downloads.clone()), &data);
        assert_eq!(pick(), data.join("cards"), "neither folder exists");
        std::fs::create_dir(&downloads).unwrap();
        assert_eq!(pick(), downloads);
        std::fs::create_dir(&documents).unwrap();
        assert_eq!(pick(), documents);
        assert_eq!(pick_card_dir(None, None, &data), data_card_dir(&data));
    }
}
