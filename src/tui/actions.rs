//! Actions that touch files or the clipboard: open, save, save as, revert, copy.

use std::path::{Path, PathBuf};

use super::app::{App, Settings};
use super::clipboard;
use super::doc::Doc;
use crate::fsio::{self, Stamp, WriteError};
use crate::report;
use crate::solver::Method;
use crate::text::inert;
use crate::wing::file;

/// Reads the wing file at `path` (`~` expanded) for the workbench; `App::update` adds it (or
/// switches to it when it is already open).
///
/// # Errors
/// The file's first problem, one line.
pub fn open(path: &Path, method: Method) -> Result<Doc, String> {
    if path.as_os_str().is_empty() {
        return Err("type a path to a wing file".into());
    }
    Doc::read(&expand_home(path), method)
}

/// Reads a wing file; a missing file or a folder is said plainly, a broken file by its
/// first problem.
///
/// # Errors
/// One line naming the path and what is wrong.
pub fn read_wing(path: &Path) -> Result<crate::wing::Wing, String> {
    super::doc::read_stamped(path).map(|(wing, _)| wing)
}

/// What `s` does with the current wing.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum SavePlan {
    /// Write it to its file.
    Write(PathBuf),
    /// Ask for another file, opening the prompt with `start` and saying `reason`.
    AskSaveAs {
        /// The prompt's first text.
        start: String,
        /// Why the wing's own file is not written (`None`: it has none).
        reason: Option<String>,
    },
    /// Refuse for now (the file changed on disk); `s` again overwrites.
    Changed(PathBuf),
}

/// Decides what `s` does: a wing without a file, a bundled example or a read-only file goes
/// to save-as; a file changed on disk since it was read is not written without a second `s`.
#[must_use]
pub fn plan_save(app: &App, overwrite_changed: bool) -> SavePlan {
    let doc = app.doc();
    let Some(path) = doc.path.clone() else {
        return SavePlan::AskSaveAs {
            start: String::new(),
            reason: None,
        };
    };
    if is_example(app, &path) {
        return SavePlan::AskSaveAs {
            start: copy_name(&path),
            // The file name alone, so the advice fits an 80-column status line.
            reason: Some(format!(
                "{} is a bundled example, never overwritten: save as a new file",
                path.file_name().unwrap_or(path.as_os_str()).display()
            )),
        };
    }
    if is_read_only(&path) {
        return SavePlan::AskSaveAs {
            start: path.display().to_string(),
            reason: Some(format!(
                "{} is read-only: save as another file (Enter on its own path asks to overwrite it)",
                path.display()
            )),
        };
    }
    let changed = match &doc.disk {
        Some(stamp) => !stamp.still_matches(&path),
        // Never read (an old session's recovery copy): a file there is someone else's.
        None => path.exists(),
    };
    if changed && !overwrite_changed {
        return SavePlan::Changed(path);
    }
    SavePlan::Write(path)
}

/// Saves the current wing to its file, or asks where (see [`plan_save`]). `overwrite_changed`
/// is true for the `s` that follows a warning that the file changed on disk.
pub fn save(app: &mut App, overwrite_changed: bool) {
    match plan_save(app, overwrite_changed) {
        SavePlan::Write(path) => {
            if let Err(e) = write(app, &path, false) {
                // A folder or file the system will not let us write: ask for another place.
                let reason = format!("not saved: {e}; give another path");
                let start = path.display().to_string();
                app.ask_save_as(&start, Some(&reason));
            }
        }
        SavePlan::AskSaveAs { start, reason } => app.ask_save_as(&start, reason.as_deref()),
        SavePlan::Changed(path) => {
            app.say(&changed_message(&path), true);
            app.overwrite_armed = true;
        }
    }
}

/// What a save says when the file changed on disk since it was read, and what can be done.
#[must_use]
pub fn changed_message(path: &Path) -> String {
    format!(
        "{} changed on disk since it was read: s again overwrites it (those changes lost), \
         R reloads it (yours lost; u brings them back), S saves yours as another file",
        path.display()
    )
}

/// Saves the current wing to `path` and makes that its file. `asked` is the question the
/// prompt showed last (Enter on the same path again answers it with yes).
///
/// # Errors
/// When the file cannot or may not be written, or a question must be asked first.
pub fn save_as(app: &mut App, path: PathBuf, asked: Option<&str>) -> Result<(), String> {
    if path.as_os_str().is_empty() {
        return Err("type a path to save to".into());
    }
    let path = expand_home(&path);
    if path.is_dir() {
        return Err(format!("{} is a folder: add a file name", path.display()));
    }
    if let Some(folder) = path.parent().filter(|f| !f.as_os_str().is_empty()) {
        if !folder.is_dir() {
            return Err(format!(
                "cannot save: there is no folder {}",
                folder.display()
            ));
        }
    }
    if is_example(app, &path) {
        return Err(format!(
            "{} is a bundled example and is never overwritten: give another name",
            path.display()
        ));
    }
    let own = app
        .doc()
        .path
        .as_ref()
        .is_some_and(|p| super::app::same_file(p, &path));
    let question = if is_read_only(&path) {
        Some(read_only_question(&path))
    } else if path.exists() && !own {
        Some(replace_question(&path))
    } else if own && plan_save(app, false) == SavePlan::Changed(path.clone()) {
        Some(changed_message(&path))
    } else {
        None
    };
    if let Some(q) = question {
        if asked != Some(inert(&q).as_str()) {
            return Err(q);
        }
    }
    write(app, &path, true).map_err(|e| e.to_string())?;
    let doc = app.current_doc_mut();
    doc.path = Some(path);
    Ok(())
}

/// What save-as says before replacing another file; Enter again on it confirms.
#[must_use]
pub fn replace_question(path: &Path) -> String {
    format!(
        "{} exists: Enter again replaces it, Esc keeps it",
        path.display()
    )
}

/// What save-as says before replacing a read-only file; Enter again on it confirms.
#[must_use]
pub fn read_only_question(path: &Path) -> String {
    format!(
        "{} is read-only: Enter again overwrites it anyway (its permissions stay), Esc keeps it",
        path.display()
    )
}

/// Whether the file exists and its permissions forbid writing it.
fn is_read_only(path: &Path) -> bool {
    std::fs::metadata(path).is_ok_and(|m| m.permissions().readonly())
}

/// Whether `path` is one of the bundled example wings (in the repository's `wings` folder,
/// not in a `wings` folder of the user's own).
#[must_use]
pub fn is_example(app: &App, path: &Path) -> bool {
    let Some(examples) = &app.settings.examples else {
        return false;
    };
    let folder = |p: &Path| p.parent().map(Path::to_path_buf);
    let (Some(file), Some(dir)) = (path.canonicalize().ok(), examples.canonicalize().ok()) else {
        return false;
    };
    // A `wings` folder of the user's own in the working folder is offered in the picker like
    // the examples, but its files are the user's to save.
    let repository = Path::new(env!("CARGO_MANIFEST_DIR")).join("wings");
    let own = Path::new("wings").canonicalize().ok() == Some(dir.clone())
        && repository.canonicalize().ok() != Some(dir.clone());
    !own && folder(&file).is_some_and(|f| f == dir)
}

/// A new file name for a copy of `path`, in the current folder.
fn copy_name(path: &Path) -> String {
    let stem = path
        .file_stem()
        .map_or_else(|| "wing".into(), |s| s.to_string_lossy().into_owned());
    format!("{stem}-variant.toml")
}

/// `~/...` made relative to the home folder, as a shell would.
#[must_use]
pub fn expand_home(path: &Path) -> PathBuf {
    let home = std::env::var_os("HOME").filter(|h| !h.is_empty());
    match (path.strip_prefix("~"), home) {
        (Ok(rest), Some(home)) => PathBuf::from(home).join(rest),
        _ => path.to_path_buf(),
    }
}

/// The text a wing is saved as: the file it came from edited in place (its comments and
/// layout kept) when that file still reads, else the wing written afresh.
fn saved_text(app: &App, wing: &crate::wing::Wing) -> String {
    match app
        .doc()
        .path
        .as_ref()
        .and_then(|p| std::fs::read_to_string(p).ok())
    {
        Some(original) => file::edit_toml(&original, wing),
        None => file::to_toml(wing),
    }
}

fn write(app: &mut App, path: &Path, overwrite_read_only: bool) -> Result<(), WriteError> {
    // Values a step of arithmetic left a hair off (0.5800000000000001) are saved as typed.
    let wing = file::tidy_numbers(&app.doc().wing);
    let text = saved_text(app, &wing);
    // A wing saved into another folder must still find the CSV tables it names.
    let folder = |p: &Path| {
        p.parent()
            .filter(|f| !f.as_os_str().is_empty())
            .map_or_else(|| PathBuf::from("."), Path::to_path_buf)
    };
    let text = match app.doc().path.as_deref() {
        Some(old) if folder(old) != folder(path) => {
            file::rebase_tables(&text, &folder(old), &folder(path))
        }
        _ => text,
    };
    let target = fsio::replace(path, text.as_bytes(), overwrite_read_only)?;
    let doc = app.current_doc_mut();
    if doc.wing != wing {
        doc.wing.clone_from(&wing);
    }
    doc.saved = Some(wing);
    doc.disk = Some(Stamp::of(&target, text.as_bytes()));
    let msg = if target == path {
        format!("saved {}", path.display())
    } else {
        format!(
            "saved {} (through the link, into {})",
            path.display(),
            target.display()
        )
    };
    app.say(&msg, false);
    Ok(())
}

/// The wing and stamp of `doc`'s file as it is now on disk, for `R`; `App::update` puts them
/// in place (the discarded edits stay in the undo history).
///
/// # Errors
/// When the wing has no file, or its file no longer reads (its first problem, one line).
pub fn revert(doc: &Doc) -> Result<(PathBuf, crate::wing::Wing, Stamp), String> {
    let path = doc
        .path
        .clone()
        .ok_or_else(|| "this wing has no file to revert to".to_string())?;
    let (wing, stamp) = super::doc::read_stamped(&path)?;
    Ok((path, wing, stamp))
}

/// What copying did, for `App::update` to apply: the OSC 52 escape to write to the terminal
/// and the status message.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Copied {
    /// The OSC 52 escape carrying the line.
    pub escape: String,
    /// What is said in the status line.
    pub message: String,
    /// Whether the message reports a failure (the notebook not written).
    pub failed: bool,
}

/// Sends `doc`'s result line to tmux's buffer inside tmux and appends it to the notebook
/// file; the OSC 52 escape comes back for the terminal.
///
/// # Errors
/// When there is no result to copy (the reason, one line).
pub fn copy(doc: &Doc, settings: &Settings) -> Result<Copied, String> {
    let line = match &doc.solved {
        Ok(s) => {
            let target = doc.wing.condition.target_cl;
            report::notebook_line(&doc.wing, s, target, doc.path.as_deref(), doc.unsaved())
        }
        Err(reason) => return Err(format!("nothing to copy: {reason}")),
    };
    let mut via = "OSC 52".to_string();
    if settings.in_tmux {
        match clipboard::tmux_load_buffer(&line) {
            Ok(()) => via.push_str(" + tmux buffer"),
            Err(e) => via.push_str(&format!(", tmux failed: {e}")),
        }
    }
    let notebook = &settings.notebook;
    let note = match clipboard::append_notebook(notebook, &clipboard::timestamp_now(), &line) {
        Ok(()) => format!("line appended to {}", notebook.display()),
        Err(e) => format!("notebook {} not written: {e}", notebook.display()),
    };
    Ok(Copied {
        escape: clipboard::osc52(&line),
        failed: note.starts_with("notebook"),
        message: format!("sent to clipboard ({via}); {note}"),
    })
}
