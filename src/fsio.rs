//! Writing files so that nothing the user has is ever half-replaced or quietly changed in kind:
//! atomic replacement (exclusive temporary file with an unpredictable name in the same folder,
//! flushed, renamed over the target, folder flushed), through symbolic links to their target,
//! with the target's permission bits kept, and a read-only file refused unless asked.
//!
//! Also [`Stamp`]: what a file was when it was read, so a save can tell whether someone else
//! changed it since.

use std::fs::{self, File, Permissions};
use std::io::{self, Write};
use std::path::{Path, PathBuf};
use std::time::SystemTime;

use sha2::{Digest, Sha256};

/// Why a file was not written.
#[derive(Debug, thiserror::Error)]
pub enum WriteError {
    /// The file exists and its permissions forbid writing; writing it was not asked for.
    #[error("{} is read-only", path.display())]
    ReadOnly {
        /// The file (the link's target when it was reached through a link).
        path: PathBuf,
    },
    /// The system refused a step.
    #[error("{}: {source}", path.display())]
    Io {
        /// The file.
        path: PathBuf,
        /// What the system said.
        source: io::Error,
    },
}

impl From<WriteError> for io::Error {
    fn from(e: WriteError) -> Self {
        match e {
            WriteError::ReadOnly { .. } => Self::new(io::ErrorKind::PermissionDenied, e),
            WriteError::Io { source, .. } => source,
        }
    }
}

/// Replaces `path` with `bytes` atomically (see [`replace`]); a read-only file is refused.
///
/// # Errors
/// As [`replace`], as an `io::Error`.
pub fn write_atomic(path: &Path, bytes: &[u8]) -> io::Result<()> {
    replace(path, bytes, false).map(|_| ()).map_err(Into::into)
}

/// Replaces the file at `path` with `bytes` so that a reader sees either the old or the new
/// file, never a mix, and returns the path actually written (a link's target).
///
/// The temporary file is created exclusively (`O_EXCL`) under a random name in the target's
/// own folder (a rename across file systems is not atomic), gets the target's permission bits,
/// is flushed to disk and renamed over the target; then the folder entry is flushed. A
/// symbolic link is followed, so the link stays a link and its target gets the new content.
///
/// # Errors
/// [`WriteError::ReadOnly`] when the target exists, is read-only and `overwrite_read_only` is
/// false; [`WriteError::Io`] when a step fails. On failure the target is untouched and the
/// temporary file removed.
pub fn replace(
    path: &Path,
    bytes: &[u8],
    overwrite_read_only: bool,
) -> Result<PathBuf, WriteError> {
    let target = resolve_links(path).map_err(|source| WriteError::Io {
        path: path.to_path_buf(),
        source,
    })?;
    let io_err = |source: io::Error| WriteError::Io {
        path: target.clone(),
        source: plain(source),
    };
    let existing = match fs::metadata(&target) {
        Ok(m) => Some(m.permissions()),
        Err(e) if e.kind() == io::ErrorKind::NotFound => None,
        Err(e) => return Err(io_err(e)),
    };
    if existing.as_ref().is_some_and(Permissions::readonly) && !overwrite_read_only {
        return Err(WriteError::ReadOnly { path: target });
    }
    let folder = folder_of(&target);
    let name = target
        .file_name()
        .map_or_else(|| "file".into(), |n| n.to_string_lossy().into_owned());
    let prefix = format!(".{name}.");
    let mut builder = tempfile::Builder::new();
    builder.prefix(&prefix).suffix(".tmp");
    // A new file gets what any program's new file gets: 0666 less the user's umask, which
    // the system applies at creation (the temporary file's own default is 0600).
    #[cfg(unix)]
    builder.permissions(std::os::unix::fs::PermissionsExt::from_mode(0o666));
    let mut temp = builder.tempfile_in(&folder).map_err(io_err)?;
    if let Some(permissions) = existing {
        fs::set_permissions(temp.path(), permissions).map_err(io_err)?;
    }
    temp.write_all(bytes).map_err(io_err)?;
    temp.as_file().sync_all().map_err(io_err)?;
    // On failure the temporary file is dropped, which removes it.
    temp.persist(&target).map_err(|e| io_err(e.error))?;
    // Make the rename itself durable; not every platform can open a folder, so best effort.
    if let Ok(dir) = File::open(&folder) {
        let _ = dir.sync_all();
    }
    Ok(target)
}

/// The system's own message for an error, without the temporary file's name that some
/// wrappers add (the user never sees that file).
fn plain(e: io::Error) -> io::Error {
    match (e.raw_os_error(), e.get_ref().is_some()) {
        (Some(code), _) => io::Error::from_raw_os_error(code),
        (None, true) if e.kind() != io::ErrorKind::Other => io::Error::from(e.kind()),
        _ => e,
    }
}

/// The file a path finally names: symbolic links followed (a relative link from its own
/// folder), so a save replaces the target and leaves the link in place.
fn resolve_links(path: &Path) -> io::Result<PathBuf> {
    let mut current = path.to_path_buf();
    // A bound on the chain, as the system has, so a loop of links ends.
    for _ in 0..40 {
        match fs::symlink_metadata(&current) {
            Ok(m) if m.file_type().is_symlink() => {
                let link = fs::read_link(&current)?;
                current = folder_of(&current).join(link);
            }
            _ => return Ok(current),
        }
    }
    Err(io::Error::other("too many levels of symbolic links"))
}

/// The folder a file lives in (`.` for a bare name).
fn folder_of(path: &Path) -> PathBuf {
    match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    }
}

/// What a file was when it was read or written: size, content hash and modification time.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Stamp {
    /// Size in bytes.
    pub len: u64,
    /// SHA-256 of the content, lower-case hex.
    pub hash: String,
    /// Modification time, when the system gives one.
    pub modified: Option<SystemTime>,
}

impl Stamp {
    /// The stamp of `bytes` just read from or written to `path`.
    #[must_use]
    pub fn of(path: &Path, bytes: &[u8]) -> Self {
        Self {
            len: bytes.len() as u64,
            hash: hash_hex(bytes),
            modified: fs::metadata(path).and_then(|m| m.modified()).ok(),
        }
    }

    /// The stamp of the file at `path` as it is now; `None` when it cannot be read.
    #[must_use]
    pub fn now(path: &Path) -> Option<Self> {
        fs::read(path).ok().map(|bytes| Self::of(path, &bytes))
    }

    /// Whether the file at `path` still holds what this stamp recorded. A file that is gone
    /// has not been changed by someone else in a way a save could lose, so it counts as the
    /// same; an unreadable file counts as changed.
    #[must_use]
    pub fn still_matches(&self, path: &Path) -> bool {
        let Ok(meta) = fs::metadata(path) else {
            return !path.exists();
        };
        if meta.len() != self.len {
            return false;
        }
        Self::now(path).is_some_and(|now| now.hash == self.hash)
    }
}

/// SHA-256 of `bytes` as lower-case hex.
#[must_use]
pub fn hash_hex(bytes: &[u8]) -> String {
    use std::fmt::Write as _;
    Sha256::digest(bytes)
        .iter()
        .fold(String::with_capacity(64), |mut s, b| {
            let _ = write!(s, "{b:02x}");
            s
        })
}

#[cfg(all(test, unix))]
mod tests {
    use super::*;

    #[test]
    fn a_link_stays_a_link_and_its_target_gets_the_text() {
        let dir = tempfile::tempdir().expect("temp dir");
        let target = dir.path().join("real.toml");
        let link = dir.path().join("link.toml");
        fs::write(&target, "old").expect("write");
        std::os::unix::fs::symlink("real.toml", &link).expect("link");
        write_atomic(&link, b"new").expect("save");
        assert!(fs::symlink_metadata(&link)
            .expect("meta")
            .file_type()
            .is_symlink());
        assert_eq!(fs::read_to_string(&target).expect("read"), "new");
    }

    #[test]
    fn permission_bits_are_kept() {
        use std::os::unix::fs::PermissionsExt as _;
        let dir = tempfile::tempdir().expect("temp dir");
        let path = dir.path().join("w.toml");
        fs::write(&path, "old").expect("write");
        fs::set_permissions(&path, Permissions::from_mode(0o640)).expect("chmod");
        write_atomic(&path, b"new").expect("save");
        let mode = fs::metadata(&path).expect("meta").permissions().mode();
        assert_eq!(mode & 0o777, 0o640);
    }

    #[test]
    fn a_read_only_file_is_refused_unless_asked() {
        use std::os::unix::fs::PermissionsExt as _;
        let dir = tempfile::tempdir().expect("temp dir");
        let path = dir.path().join("w.toml");
        fs::write(&path, "old").expect("write");
        fs::set_permissions(&path, Permissions::from_mode(0o444)).expect("chmod");
        let refused = replace(&path, b"new", false);
        assert!(matches!(refused, Err(WriteError::ReadOnly { .. })));
        assert_eq!(fs::read_to_string(&path).expect("read"), "old");
        replace(&path, b"new", true).expect("asked");
        assert_eq!(fs::read_to_string(&path).expect("read"), "new");
        let mode = fs::metadata(&path).expect("meta").permissions().mode();
        assert_eq!(mode & 0o777, 0o444);
    }

    #[test]
    fn no_temporary_file_is_left_and_a_planted_one_is_not_used() {
        let dir = tempfile::tempdir().expect("temp dir");
        let path = dir.path().join("w.toml");
        // A file under the old predictable name must neither be written nor block the save.
        let planted = dir
            .path()
            .join(format!(".w.toml.tmp-{}", std::process::id()));
        fs::write(&planted, "planted").expect("plant");
        write_atomic(&path, b"new").expect("save");
        assert_eq!(fs::read_to_string(&planted).expect("read"), "planted");
        let names: Vec<String> = fs::read_dir(dir.path())
            .expect("list")
            .map(|e| e.expect("entry").file_name().to_string_lossy().into_owned())
            .collect();
        assert_eq!(names.len(), 2, "{names:?}");
    }

    #[test]
    fn a_stamp_sees_a_change_of_content() {
        let dir = tempfile::tempdir().expect("temp dir");
        let path = dir.path().join("w.toml");
        fs::write(&path, "one").expect("write");
        let stamp = Stamp::now(&path).expect("stamp");
        assert!(stamp.still_matches(&path));
        fs::write(&path, "two").expect("write");
        assert!(!stamp.still_matches(&path));
        fs::remove_file(&path).expect("remove");
        assert!(stamp.still_matches(&path));
    }
}
