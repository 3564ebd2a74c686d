//! Workbench sessions: which wings were open, the current one, the pinned reference, cursor
//! positions and unsaved edits as recovery copies, kept in one JSON file that is replaced
//! atomically so a killed process never leaves a half-written session.
//!
//! Nothing here touches the terminal; the workbench decides when to save (debounced).

use std::fs::{self, File, OpenOptions};
use std::io;
use std::io::{Read as _, Write as _};
use std::path::{Path, PathBuf};
use std::sync::Arc;

use serde::{Deserialize, Serialize};

/// Environment variable that overrides the session folder (tests use it).
pub const DIR_ENV: &str = "GAMMALINE_SESSION_DIR";
/// File name of the session inside its folder.
pub const FILE_NAME: &str = "session.json";
/// Format version written into every session.
pub const VERSION: u32 = 1;

/// Where a cursor sits in one wing's panes.
#[derive(Debug, Clone, Default, PartialEq, Eq, Serialize, Deserialize)]
pub struct CursorState {
    /// The pane's name (`stations`, `airfoils`, `controls`, `condition`).
    pub sheet: String,
    /// Row in that pane.
    pub row: usize,
    /// Column in that pane.
    pub column: usize,
}

/// One open wing.
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
pub struct SessionWing {
    /// The wing file, if the wing has one.
    pub path: Option<PathBuf>,
    /// The unsaved wing in the wing-file format, when it differs from the file.
    pub recovery: Option<String>,
    /// SHA-256 (hex) of the file the unsaved edits were made on, so a later save can tell
    /// whether the file changed since.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub base: Option<String>,
    /// Cursor position.
    pub cursor: CursorState,
}

/// A pinned reference wing, kept as wing-file text so it survives edits to its source.
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
pub struct SessionReference {
    /// The wing in the wing-file format.
    pub wing: String,
    /// Index of the open wing it was pinned from.
    #[serde(default)]
    pub source: usize,
}

/// Everything needed to put the workbench back as it was.
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
pub struct Session {
    /// Format version.
    pub version: u32,
    /// Open wings in wing-bar order.
    pub wings: Vec<SessionWing>,
    /// Index of the current wing.
    pub current: usize,
    /// The pinned reference.
    pub reference: Option<SessionReference>,
    /// The notebook file, when the user chose one.
    pub notebook: Option<PathBuf>,
}

/// The result of looking for a session at start.
#[derive(Debug, Default)]
pub struct Loaded {
    /// The session, if there was a readable one.
    pub session: Option<Session>,
    /// Something the user must be told (a corrupt session moved aside, an unreadable folder).
    pub notice: Option<String>,
}

/// The session folder: the `--session` flag, else `GAMMALINE_SESSION_DIR`, else the user's
/// configuration folder for gammaline. `None` when no home folder can be found.
#[must_use]
pub fn dir(flag: Option<&Path>) -> Option<PathBuf> {
    if let Some(p) = flag {
        return Some(p.to_path_buf());
    }
    if let Some(p) = std::env::var_os(DIR_ENV).filter(|v| !v.is_empty()) {
        return Some(PathBuf::from(p));
    }
    directories::ProjectDirs::from("", "", "gammaline").map(|d| d.config_dir().to_path_buf())
}

/// Reads the session in `dir`. A missing file is no session; a file that cannot be parsed
/// is renamed to `session.json.corrupt-<n>` and reported, and the workbench starts anyway.
#[must_use]
pub fn load(dir: &Path) -> Loaded {
    let path = dir.join(FILE_NAME);
    let text = match fs::read_to_string(&path) {
        Ok(text) => text,
        Err(e) if e.kind() == io::ErrorKind::NotFound => return Loaded::default(),
        Err(e) => {
            return Loaded {
                session: None,
                notice: Some(format!("cannot read session {}: {e}", path.display())),
            }
        }
    };
    match serde_json::from_str::<Session>(&text) {
        Ok(session) if session.version == VERSION => Loaded {
            session: Some(session),
            notice: None,
        },
        Ok(session) => set_aside(
            &path,
            &format!("unknown session version {}", session.version),
        ),
        Err(e) => set_aside(&path, &e.to_string()),
    }
}

fn set_aside(path: &Path, reason: &str) -> Loaded {
    let notice = match move_aside(path) {
        Ok(backup) => format!(
            "session was unreadable ({reason}); moved aside to {}",
            backup.display()
        ),
        Err(e) => format!("session was unreadable ({reason}) and could not be moved aside: {e}"),
    };
    Loaded {
        session: None,
        notice: Some(notice),
    }
}

/// Renames `path` to the first free `<name>.corrupt-<n>` beside it and returns the new path.
///
/// # Errors
/// When the rename fails.
pub fn move_aside(path: &Path) -> io::Result<PathBuf> {
    let name = path
        .file_name()
        .map_or_else(|| "file".to_string(), |n| n.to_string_lossy().into_owned());
    let backup = (1..10_000)
        .map(|n| path.with_file_name(format!("{name}.corrupt-{n}")))
        .find(|p| !p.exists())
        .ok_or_else(|| io::Error::other("too many backups"))?;
    fs::rename(path, &backup)?;
    Ok(backup)
}

/// Writes the session into `dir` atomically, creating the folder if needed.
///
/// # Errors
/// When the folder or file cannot be written.
pub fn save(dir: &Path, session: &Session) -> io::Result<()> {
    fs::create_dir_all(dir)?;
    let text = serde_json::to_string_pretty(session).map_err(io::Error::other)?;
    write_atomic(&dir.join(FILE_NAME), text.as_bytes())
}

/// Atomic replacement, kept here for callers that know it by this name.
pub use crate::fsio::write_atomic;

/// File name of the lock beside the session.
pub const LOCK_NAME: &str = "session.lock";

/// A hold on a session folder: while any clone of it lives, no other workbench writes the
/// session there. The system lets go of it when the process ends, however it ends.
#[derive(Debug, Clone)]
pub struct Lock {
    _file: Arc<File>,
}

/// What came of asking for a session folder.
#[derive(Debug, Clone)]
pub enum Claim {
    /// This workbench may write the session.
    Held(Lock),
    /// Another workbench holds it (its process id, when it wrote one).
    Taken(Option<u32>),
    /// No lock could be taken (the folder cannot be written); writes will say why.
    Unavailable(String),
}

/// Takes the session folder's lock without waiting, creating the folder if needed.
#[must_use]
pub fn claim(dir: &Path) -> Claim {
    let path = dir.join(LOCK_NAME);
    let opened = fs::create_dir_all(dir).and_then(|()| {
        OpenOptions::new()
            .read(true)
            .write(true)
            .create(true)
            .truncate(false)
            .open(&path)
    });
    let mut file = match opened {
        Ok(f) => f,
        Err(e) => return Claim::Unavailable(format!("{}: {e}", path.display())),
    };
    match file.try_lock() {
        Ok(()) => {
            // The holder's process id, so a second workbench can say who has the session.
            let _ = file.set_len(0);
            let _ = write!(file, "{}", std::process::id());
            Claim::Held(Lock {
                _file: Arc::new(file),
            })
        }
        Err(fs::TryLockError::WouldBlock) => {
            let mut text = String::new();
            let _ = file.read_to_string(&mut text);
            Claim::Taken(text.trim().parse().ok())
        }
        Err(fs::TryLockError::Error(e)) => Claim::Unavailable(format!("{}: {e}", path.display())),
    }
}
