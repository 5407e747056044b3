//! An exclusive lock beside a file (`locker.json.lock`), held while one writer re-reads,
//! changes and writes the file, so that two writers (the app and the command line, or
//! two commands) never lose each other's change. The lock is the standard library's
//! advisory file lock; the lock file itself stays empty and is never removed.

use std::fs;
use std::path::{Path, PathBuf};
use std::time::{Duration, Instant};

use crate::i18n::tr_with;

/// How long a writer waits for another one before giving up with a message.
pub const LOCK_WAIT: Duration = Duration::from_secs(20);

/// Held until dropped (closing the file releases the lock).
#[derive(Debug)]
pub struct FileLock {
    _file: Option<fs::File>,
}

/// `<path>.lock`.
pub fn lock_path(path: &Path) -> PathBuf {
    let name = path.file_name().and_then(|n| n.to_str()).unwrap_or("data");
    path.with_file_name(format!("{name}.lock"))
}

/// Take the exclusive lock on `<path>.lock`, waiting at most `wait`. The lock file must
/// be a regular file (never a link, FIFO or device: it is opened without following links
/// and without blocking). A file system without locks gives an unlocked `FileLock`: the
/// write is still atomic, only concurrent changes are not serialised there.
pub fn lock_beside(path: &Path, wait: Duration) -> Result<FileLock, String> {
    let lock = lock_path(path);
    if let Some(dir) = lock.parent() {
        let _ = fs::create_dir_all(dir);
    }
    let mut options = fs::OpenOptions::new();
    options.read(true).write(true).create(true).truncate(false);
    #[cfg(unix)]
    {
        use std::os::unix::fs::OpenOptionsExt;
        options.custom_flags(libc::O_NONBLOCK | libc::O_NOFOLLOW);
    }
    let file = options
        .open(&lock)
        .map_err(|e| format!("cannot open the lock file {}: {e}", lock.display()))?;
    let is_file = file.metadata().map(|m| m.is_file()).unwrap_or(false);
    if !is_file {
        return Err(tr_with(
            "{0} is not a regular file; move it away so that the locker can be changed",
            &[&lock.display()],
        ));
    }
    let start = Instant::now();
    let mut pause = Duration::from_millis(1);
    loop {
        match file.try_lock() {
            Ok(()) => return Ok(FileLock { _file: Some(file) }),
            Err(fs::TryLockError::WouldBlock) => {}
            Err(fs::TryLockError::Error(e)) if e.kind() == std::io::ErrorKind::Unsupported => {
                return Ok(FileLock { _file: None });
            }
            Err(fs::TryLockError::Error(e)) => {
                return Err(format!("cannot lock {}: {e}", lock.display()));
            }
        }
        if start.elapsed() >= wait {
            return Err(tr_with(
                "another Turnsheet has been changing {0} for {1} s; try again once it is done",
                &[&path.display(), &wait.as_secs()],
            ));
        }
        std::thread::sleep(pause);
        pause = (pause * 2).min(Duration::from_millis(20));
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_second_writer_waits_and_then_gives_up_with_a_message() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("locker.json");
        let held = lock_beside(&p, LOCK_WAIT).unwrap();
        let e = lock_beside(&p, Duration::from_millis(30)).unwrap_err();
        assert!(e.contains("another Turnsheet"), "{e}");
        drop(held);
        assert!(lock_beside(&p, Duration::from_millis(30)).is_ok());
        assert!(lock_path(&p).ends_with("locker.json.lock"));
    }

    #[cfg(unix)]
    #[test]
    fn a_lock_file_that_is_a_link_or_a_folder_is_refused() {
        let dir = tempfile::tempdir().unwrap();
        let p = dir.path().join("locker.json");
        std::fs::create_dir(lock_path(&p)).unwrap();
        let e = lock_beside(&p, LOCK_WAIT).unwrap_err();
        assert!(e.contains("locker.json.lock"), "{e}");
        std::fs::remove_dir(lock_path(&p)).unwrap();
        let outside = dir.path().join("elsewhere");
        std::os::unix::fs::symlink(&outside, lock_path(&p)).unwrap();
        assert!(lock_beside(&p, LOCK_WAIT).is_err());
        assert!(!outside.exists(), "a link is never followed");
    }
}
