//! One open wing: its model, file, unsaved state, undo history, cursor and latest solution.

use std::path::{Path, PathBuf};

use super::cells::Sheet;
use crate::fsio::Stamp;
use crate::solver::{self, Method, PreparedWing, Solution};
use crate::wing::file;
use crate::wing::Wing;

/// Most undo steps kept per wing.
const UNDO_LIMIT: usize = 500;

/// Where the cursor is in a wing's panes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Cursor {
    /// The focused pane.
    pub sheet: Sheet,
    /// Row in that pane.
    pub row: usize,
    /// Column in that pane.
    pub col: usize,
}

impl Default for Cursor {
    fn default() -> Self {
        Self {
            sheet: Sheet::Stations,
            row: 0,
            col: 0,
        }
    }
}

/// An open wing.
#[derive(Debug, Clone)]
pub struct Doc {
    /// The wing as edited.
    pub wing: Wing,
    /// Its file, if it has one.
    pub path: Option<PathBuf>,
    /// The wing as last read or saved (`None` for a wing never saved).
    pub saved: Option<Wing>,
    /// What the file held when it was last read or written, so a save can tell whether
    /// someone changed it since (`None`: no file, or it could not be read).
    pub disk: Option<Stamp>,
    /// Earlier states, newest last.
    undo: Vec<Wing>,
    /// Undone states, newest last.
    redo: Vec<Wing>,
    /// Cursor.
    pub cursor: Cursor,
    /// The solution of `wing`, or why there is none (already cleaned for display).
    pub solved: Result<Solution, String>,
    /// The prepared wing behind `solved`, kept so a change of the condition alone (alpha,
    /// target CL, speed, altitude) re-solves without preparing again when the method allows.
    prepared: Option<PreparedWing>,
}

/// Reads a wing file and stamps the bytes read; a missing file or a folder is said plainly, a
/// broken file by its first problem.
///
/// # Errors
/// One line naming the path and what is wrong.
pub fn read_stamped(path: &Path) -> Result<(Wing, Stamp), String> {
    if path.is_dir() {
        return Err(format!(
            "{} is a folder: give a wing file's path (w lists the wings nearby)",
            path.display()
        ));
    }
    if !path.exists() {
        return Err(format!("no such file: {}", path.display()));
    }
    let text = file::read_text(path).map_err(|e| e.to_string())?;
    let wing = file::parse(&text, path).map_err(|e| e.to_string())?;
    Ok((wing, Stamp::of(path, text.as_bytes())))
}

/// Solves a wing at its own condition; the error is one line for the status area.
pub fn solve(wing: &Wing, method: Method) -> Result<Solution, String> {
    solver::prepare(wing, method)
        .and_then(|p| p.solve(&wing.condition))
        .map_err(|e| crate::text::inert(&e.to_string()))
}

impl Doc {
    /// A wing just read from `path` (or never saved, with `None`); the file's stamp is taken
    /// now (use [`Doc::read`] to stamp exactly the bytes that were parsed).
    #[must_use]
    pub fn new(wing: Wing, path: Option<PathBuf>, method: Method) -> Self {
        let saved = path.as_ref().map(|_| wing.clone());
        let disk = path.as_deref().and_then(Stamp::now);
        let mut doc = Self {
            wing,
            path,
            saved,
            disk,
            undo: Vec::new(),
            redo: Vec::new(),
            cursor: Cursor::default(),
            solved: Err(String::new()),
            prepared: None,
        };
        doc.resolve(method);
        doc
    }

    /// Reads the wing file at `path`, stamping exactly the bytes it parsed.
    ///
    /// # Errors
    /// One line naming the path and what is wrong.
    pub fn read(path: &Path, method: Method) -> Result<Self, String> {
        let (wing, stamp) = read_stamped(path)?;
        let mut doc = Self::new(wing, Some(path.to_path_buf()), method);
        doc.disk = Some(stamp);
        Ok(doc)
    }

    /// True when the wing differs from its file (or has no file).
    #[must_use]
    pub fn unsaved(&self) -> bool {
        self.saved.as_ref() != Some(&self.wing)
    }

    /// The name to show (raw; clean before drawing).
    #[must_use]
    pub fn title(&self) -> &str {
        &self.wing.name
    }

    /// Replaces the wing with an edited one, keeping the old one for undo, and re-solves.
    pub fn change(&mut self, wing: Wing, method: Method) {
        if wing == self.wing {
            return;
        }
        let old = std::mem::replace(&mut self.wing, wing);
        self.undo.push(old);
        if self.undo.len() > UNDO_LIMIT {
            self.undo.remove(0);
        }
        self.redo.clear();
        self.resolve(method);
    }

    /// Steps back one change; false when there is none.
    pub fn undo(&mut self, method: Method) -> bool {
        let Some(previous) = self.undo.pop() else {
            return false;
        };
        self.redo.push(std::mem::replace(&mut self.wing, previous));
        self.resolve(method);
        true
    }

    /// Steps forward one undone change; false when there is none.
    pub fn redo(&mut self, method: Method) -> bool {
        let Some(next) = self.redo.pop() else {
            return false;
        };
        self.undo.push(std::mem::replace(&mut self.wing, next));
        self.resolve(method);
        true
    }

    /// Re-solves the current wing, reusing the prepared system when only the condition (or
    /// the name) changed.
    pub fn resolve(&mut self, method: Method) {
        if !self
            .prepared
            .as_ref()
            .is_some_and(|p| p.fits(&self.wing, method))
        {
            self.prepared = None;
            match solver::prepare(&self.wing, method) {
                Ok(prepared) => self.prepared = Some(prepared),
                Err(e) => {
                    self.solved = Err(crate::text::inert(&e.to_string()));
                    return;
                }
            }
        }
        if let Some(p) = &self.prepared {
            self.solved = p
                .solve(&self.wing.condition)
                .map_err(|e| crate::text::inert(&e.to_string()));
        }
    }

    /// The wing's CL_max by its prepared method (`None` when it has no prepared system).
    #[must_use]
    pub fn cl_max(&self) -> Option<Result<solver::ClMax, solver::SolveError>> {
        self.prepared.as_ref().map(PreparedWing::cl_max)
    }
}

/// Whether two paths name the same file (by canonical path when both exist).
#[must_use]
pub fn same_file(a: &Path, b: &Path) -> bool {
    match (a.canonicalize(), b.canonicalize()) {
        (Ok(x), Ok(y)) => x == y,
        _ => a == b,
    }
}
