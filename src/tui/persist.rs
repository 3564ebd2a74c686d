//! Between the workbench and its session: what to open at start, and what to keep.

use std::path::{Path, PathBuf};

use super::app::{same_file, App, Reference, SessionState};
use super::cells::Sheet;
use super::doc::{self, Cursor, Doc};
use crate::fsio::Stamp;
use crate::session::{self, CursorState, Session, SessionReference, SessionWing};
use crate::solver::Method;
use crate::wing::file;

/// What the workbench starts with.
#[derive(Debug, Default)]
pub struct Start {
    /// Open wings.
    pub docs: Vec<Doc>,
    /// Current wing.
    pub current: usize,
    /// Pinned reference.
    pub reference: Option<Reference>,
    /// The notebook the session chose.
    pub notebook: Option<PathBuf>,
    /// Things to tell the user.
    pub notices: Vec<String>,
}

/// The bundled example wings: `./wings`, else the source tree's `wings` folder.
#[must_use]
pub fn examples_dir() -> Option<PathBuf> {
    [
        PathBuf::from("wings"),
        Path::new(env!("CARGO_MANIFEST_DIR")).join("wings"),
    ]
    .into_iter()
    .find(|p| p.is_dir())
}

/// Opens wing files; unreadable ones are reported and skipped.
#[must_use]
pub fn open_files(files: &[PathBuf], method: Method) -> Start {
    let mut start = Start::default();
    for path in files {
        // A file named twice (or by two names) opens once.
        if start
            .docs
            .iter()
            .any(|d| d.path.as_deref().is_some_and(|p| same_file(p, path)))
        {
            continue;
        }
        match Doc::read(path, method) {
            Ok(doc) => start.docs.push(doc),
            Err(e) => start.notices.push(e),
        }
    }
    start
}

/// Adds wings opened by name to those kept from the session, one tab per file: a file that is
/// already open (saved or with unsaved edits) keeps its tab. Returns the tab to show: that of
/// the first file named, else `current`.
pub fn add_opened(docs: &mut Vec<Doc>, opened: Vec<Doc>, current: usize) -> usize {
    let mut first = None;
    for doc in opened {
        let open_at = docs.iter().position(|d| {
            d.path
                .as_deref()
                .zip(doc.path.as_deref())
                .is_some_and(|(a, b)| same_file(a, b))
        });
        let at = open_at.unwrap_or_else(|| {
            docs.push(doc);
            docs.len() - 1
        });
        first.get_or_insert(at);
    }
    first.unwrap_or(current)
}

/// Every `*.toml` in the examples folder, sorted.
#[must_use]
pub fn example_files(dir: &Path) -> Vec<PathBuf> {
    let mut files: Vec<PathBuf> = std::fs::read_dir(dir)
        .map(|r| {
            r.filter_map(Result::ok)
                .map(|e| e.path())
                .filter(|p| p.extension().is_some_and(|x| x == "toml"))
                .collect()
        })
        .unwrap_or_default();
    files.sort();
    files
}

/// Rebuilds the workbench from a session. Recovery copies that no longer parse are written
/// aside into the session folder and reported; missing wing files are reported.
#[must_use]
pub fn restore(session: &Session, dir: &Path, method: Method) -> Start {
    let mut start = Start {
        notebook: session.notebook.clone(),
        ..Start::default()
    };
    // Where each session wing landed (`None`: it could not be restored).
    let mut index_map = Vec::new();
    for entry in &session.wings {
        let doc = restore_wing(entry, dir, method, &mut start.notices);
        index_map.push(doc.as_ref().map(|_| start.docs.len()));
        start.docs.extend(doc);
    }
    start.current = index_map
        .get(session.current)
        .copied()
        .flatten()
        .unwrap_or(0)
        .min(start.docs.len().saturating_sub(1));
    start.reference = session.reference.as_ref().and_then(|r| {
        let wing = file::parse(&r.wing, Path::new("reference")).ok()?;
        let solved = doc::solve(&wing, method);
        // The pinned wing's own tag, or none when that wing is gone.
        let source = index_map
            .get(r.source)
            .copied()
            .flatten()
            .unwrap_or(usize::MAX);
        Some(Reference {
            wing,
            solved,
            source,
        })
    });
    start
}

fn restore_wing(
    entry: &SessionWing,
    dir: &Path,
    method: Method,
    notices: &mut Vec<String>,
) -> Option<Doc> {
    let from_file = entry.path.as_ref().map(|p| file::read(p));
    let mut doc = match (&entry.recovery, from_file) {
        (Some(text), file_result) => {
            let name = entry
                .path
                .clone()
                .unwrap_or_else(|| PathBuf::from("recovered wing"));
            match file::parse(text, &name) {
                Ok(wing) => {
                    let mut doc = Doc::new(wing, entry.path.clone(), method);
                    doc.saved = file_result.and_then(Result::ok);
                    // The edits were made on the file as it was then; a save checks that
                    // it still is.
                    doc.disk = entry
                        .path
                        .as_deref()
                        .zip(entry.base.as_ref())
                        .map(|(p, hash)| based_on(p, hash));
                    doc
                }
                Err(e) => {
                    notices.push(set_recovery_aside(dir, text, &e.to_string()));
                    return None;
                }
            }
        }
        (None, Some(Ok(wing))) => Doc::new(wing, entry.path.clone(), method),
        (None, Some(Err(e))) => {
            notices.push(e.to_string());
            return None;
        }
        (None, None) => return None,
    };
    doc.cursor = Cursor {
        sheet: Sheet::from_name(&entry.cursor.sheet),
        row: entry.cursor.row,
        col: entry.cursor.column,
    };
    Some(doc)
}

fn set_recovery_aside(dir: &Path, text: &str, reason: &str) -> String {
    let backup = (1..10_000)
        .map(|n| dir.join(format!("recovery-{n}.toml")))
        .find(|p| !p.exists());
    match backup.map(|p| session::write_atomic(&p, text.as_bytes()).map(|()| p)) {
        Some(Ok(p)) => format!(
            "an unsaved wing could not be restored ({reason}); kept in {}",
            p.display()
        ),
        _ => format!("an unsaved wing could not be restored ({reason})"),
    }
}

/// The session that puts the workbench back as it is now.
#[must_use]
pub fn to_session(app: &App) -> Session {
    let wings = app
        .docs
        .iter()
        .map(|d| SessionWing {
            path: d.path.as_ref().map(|p| absolute(p)),
            recovery: d.unsaved().then(|| file::to_toml(&d.wing)),
            base: d
                .unsaved()
                .then(|| d.disk.as_ref().map(|s| s.hash.clone()))
                .flatten(),
            cursor: CursorState {
                sheet: d.cursor.sheet.name().to_string(),
                row: d.cursor.row,
                column: d.cursor.col,
            },
        })
        .collect();
    Session {
        version: session::VERSION,
        wings,
        current: app.current,
        reference: app.reference.as_ref().map(|r| SessionReference {
            wing: file::to_toml(&r.wing),
            source: r.source,
        }),
        notebook: Some(app.settings.notebook.clone()),
    }
}

/// The path made absolute, so a session started elsewhere still finds the file.
fn absolute(path: &Path) -> PathBuf {
    std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf())
}

/// The stamp of the file an unsaved wing was based on, known only by its hash.
fn based_on(path: &Path, hash: &str) -> Stamp {
    let mut stamp = Stamp::now(path).unwrap_or(Stamp {
        len: 0,
        hash: String::new(),
        modified: None,
    });
    stamp.hash = hash.to_string();
    stamp
}

/// Saves the session if there is a session folder this workbench may write; a failure is
/// reported in the status line and remembered, so quitting says the edits are only in memory.
pub fn save_session(app: &mut App) {
    app.session_changed = false;
    let Some(dir) = app.settings.session_dir.clone() else {
        app.session_state = SessionState::NotKept("no session folder".into());
        return;
    };
    if matches!(app.session_state, SessionState::Shared(_)) {
        return;
    }
    match session::save(&dir, &to_session(app)) {
        Ok(()) => app.session_state = SessionState::Kept,
        Err(e) => {
            let reason = format!("session not saved to {}: {e}", dir.display());
            // Said once when it starts failing, not over every later message.
            if app.session_state == SessionState::Kept {
                app.say(&reason, true);
            }
            app.session_state = SessionState::NotKept(reason);
        }
    }
}
