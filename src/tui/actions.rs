//! Actions that touch files or the clipboard: open, save, save as, revert, copy.

use std::path::{Path, PathBuf};

use super::app::App;
use super::clipboard;
use super::doc::Doc;
use crate::report;
use crate::session::write_atomic;
use crate::wing::file;

/// Opens a wing file (or switches to it when it is already open).
///
/// # Errors
/// The file's first problem, one line.
pub fn open(app: &mut App, path: &Path) -> Result<(), String> {
    if path.as_os_str().is_empty() {
        return Err("type a path to a wing file".into());
    }
    let path = &expand_home(path);
    let wing = read_wing(path)?;
    app.add_doc(Doc::new(
        wing,
        Some(path.to_path_buf()),
        app.settings.method,
    ));
    app.clamp_cursor();
    let msg = format!("opened {}", path.display());
    app.say(&msg, false);
    Ok(())
}

/// Reads a wing file; a missing file or a folder is said plainly, a broken file by its
/// first problem.
///
/// # Errors
/// One line naming the path and what is wrong.
pub fn read_wing(path: &Path) -> Result<crate::wing::Wing, String> {
    if path.is_dir() {
        return Err(format!(
            "{} is a folder: give a wing file's path (w lists the wings nearby)",
            path.display()
        ));
    }
    if !path.exists() {
        return Err(format!("no such file: {}", path.display()));
    }
    file::read(path).map_err(|e| e.to_string())
}

/// Saves the current wing to its file; a wing without a file asks for one.
pub fn save(app: &mut App) {
    let Some(path) = app.doc().path.clone() else {
        app.update(super::keymap::Action::SaveAs);
        return;
    };
    if let Err(reason) = write(app, &path) {
        app.say(&reason, true);
    }
}

/// Saves the current wing to `path` and makes that its file.
///
/// # Errors
/// When the file cannot be written.
pub fn save_as(app: &mut App, path: PathBuf, confirmed: bool) -> Result<(), String> {
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
    let own = app
        .doc()
        .path
        .as_ref()
        .is_some_and(|p| super::app::same_file(p, &path));
    if path.exists() && !own && !confirmed {
        return Err(replace_question(&path));
    }
    write(app, &path)?;
    app.current_doc_mut().path = Some(path);
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
fn saved_text(app: &App) -> String {
    let doc = app.doc();
    match doc
        .path
        .as_ref()
        .and_then(|p| std::fs::read_to_string(p).ok())
    {
        Some(original) => file::edit_toml(&original, &doc.wing),
        None => file::to_toml(&doc.wing),
    }
}

fn write(app: &mut App, path: &Path) -> Result<(), String> {
    let text = saved_text(app);
    write_atomic(path, text.as_bytes())
        .map_err(|e| format!("cannot save {}: {e}", path.display()))?;
    let doc = app.current_doc_mut();
    doc.saved = Some(doc.wing.clone());
    let msg = format!("saved {}", path.display());
    app.say(&msg, false);
    Ok(())
}

/// Reloads the current wing from its file; the discarded edits stay in the undo history.
pub fn revert(app: &mut App) {
    let Some(path) = app.doc().path.clone() else {
        app.say("this wing has no file to revert to", true);
        return;
    };
    match file::read(&path) {
        Ok(wing) => {
            let method = app.settings.method;
            let doc = app.current_doc_mut();
            doc.change(wing.clone(), method);
            doc.saved = Some(wing);
            app.clamp_cursor();
            let msg = format!("reverted to {} (u undoes the revert)", path.display());
            app.say(&msg, false);
        }
        Err(e) => app.say(&e.to_string(), true),
    }
}

/// Sends the result line to the clipboard (OSC 52, and tmux's buffer inside tmux) and
/// appends it to the notebook file.
pub fn copy(app: &mut App) {
    let line = match &app.doc().solved {
        Ok(s) => report::line(&app.doc().wing, s, app.doc().wing.condition.target_cl),
        Err(reason) => {
            let msg = format!("nothing to copy: {reason}");
            app.say(&msg, true);
            return;
        }
    };
    app.outbox.push(clipboard::osc52(&line));
    let mut via = "OSC 52".to_string();
    if app.settings.in_tmux {
        match clipboard::tmux_load_buffer(&line) {
            Ok(()) => via.push_str(" + tmux buffer"),
            Err(e) => via.push_str(&format!(", tmux failed: {e}")),
        }
    }
    let notebook = app.settings.notebook.clone();
    let note = match clipboard::append_notebook(&notebook, &clipboard::timestamp_now(), &line) {
        Ok(()) => format!("line appended to {}", notebook.display()),
        Err(e) => format!("notebook {} not written: {e}", notebook.display()),
    };
    let failed = note.starts_with("notebook");
    app.say(&format!("sent to clipboard ({via}); {note}"), failed);
}
