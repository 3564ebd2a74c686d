//! Workbench sessions: which wings were open, the current one, the pinned reference, cursor
//! positions and unsaved edits as recovery copies, kept in one JSON file that is replaced
//! atomically so a killed process never leaves a half-written session.
//!
//! Nothing here touches the terminal; the workbench decides when to save (debounced).

use std::fs::{self, File};
use std::io::{self, Write};
use std::path::{Path, PathBuf};

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

/// Replaces `path` with `bytes` so that a reader sees either the old or the new file, never
/// a mix: write a temporary file in the same folder (a rename across file systems is not
/// atomic), flush it to disk, rename it over the target, then flush the folder entry.
///
/// # Errors
/// When any step fails; the temporary file is removed and the target left untouched.
pub fn write_atomic(path: &Path, bytes: &[u8]) -> io::Result<()> {
    let folder = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    };
    let name = path
        .file_name()
        .map_or_else(|| "file".into(), |n| n.to_string_lossy().into_owned());
    let temp = folder.join(format!(".{name}.tmp-{}", std::process::id()));
    let result = (|| {
        let mut file = File::create(&temp)?;
        file.write_all(bytes)?;
        file.sync_all()?;
        drop(file);
        fs::rename(&temp, path)
    })();
    if result.is_err() {
        let _ = fs::remove_file(&temp);
    }
    result?;
    // Make the rename itself durable; not every platform can open a folder, so best effort.
    if let Ok(dir) = File::open(&folder) {
        let _ = dir.sync_all();
    }
    Ok(())
}
