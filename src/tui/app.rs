//! Workbench state and `update(Action)`: the only place state changes. Drawing reads `&App`.

use std::path::{Path, PathBuf};

use crossterm::event::{KeyCode, KeyEvent, KeyEventKind};
use ratatui::layout::Size;

use super::cells::{self, Field, Sheet};
pub use super::doc::same_file;
use super::doc::{Cursor, Doc};
use super::editor::{Editor, Purpose};
use super::keymap::{self, Action, Dir, ModeKind};
use super::layout_rules;
use super::picker::{self, Picker, Target};
use super::rows::{self, NewRow};
use super::theme::Theme;
use crate::solver::{Method, Solution};
use crate::text::inert;
use crate::wing::{validate, Wing};

/// What the keyboard is doing.
#[derive(Debug, Clone)]
pub enum Mode {
    /// Moving around.
    Normal,
    /// Typing into a cell or a prompt.
    Edit(Box<Editor>),
    /// Choosing a wing.
    Picker(Picker),
    /// The help overlay, scrolled by this many lines.
    Help {
        /// First line shown.
        scroll: u16,
    },
    /// Asking whether to quit with unsaved wings.
    Confirm,
}

impl SessionState {
    /// Why the session does not keep unsaved work (`None`: it does).
    #[must_use]
    pub fn why_not(&self) -> Option<&str> {
        match self {
            Self::Kept => None,
            Self::NotKept(why) | Self::Shared(why) => Some(why),
        }
    }
}

impl Mode {
    /// The key-table mode.
    #[must_use]
    pub const fn kind(&self) -> ModeKind {
        match self {
            Self::Normal => ModeKind::Normal,
            Self::Edit(_) => ModeKind::Edit,
            Self::Picker(_) => ModeKind::Picker,
            Self::Help { .. } => ModeKind::Help,
            Self::Confirm => ModeKind::Confirm,
        }
    }
}

/// The status line: what just happened.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Status {
    /// The message (already clean).
    pub text: String,
    /// Whether it reports a failure.
    pub error: bool,
    /// Whether a frame showing it has been drawn (so the user has had the chance to read it).
    pub shown: bool,
    /// Counts messages said, so an action can tell whether it said anything.
    pub serial: u64,
}

/// A pinned wing to compare against.
#[derive(Debug, Clone)]
pub struct Reference {
    /// The wing as it was when pinned.
    pub wing: Wing,
    /// Its solution.
    pub solved: Result<Solution, String>,
    /// Index of the open wing it was pinned from.
    pub source: usize,
}

/// Settings fixed at launch (some changeable from the workbench).
#[derive(Debug, Clone)]
pub struct Settings {
    /// The solution method.
    pub method: Method,
    /// Where copied lines are appended.
    pub notebook: PathBuf,
    /// Where the session is kept (`None`: no session is kept).
    pub session_dir: Option<PathBuf>,
    /// Whether `$TMUX` is set, so copies also go through tmux.
    pub in_tmux: bool,
    /// The bundled example wings, offered in the picker.
    pub examples: Option<PathBuf>,
}

/// The whole workbench state.
#[derive(Debug, Clone)]
pub struct App {
    /// Open wings; never empty.
    pub docs: Vec<Doc>,
    /// Index of the current wing.
    pub current: usize,
    /// The pinned reference.
    pub reference: Option<Reference>,
    /// What the keyboard is doing.
    pub mode: Mode,
    /// The status line.
    pub status: Status,
    /// Styles and glyphs.
    pub theme: Theme,
    /// Whether x_le and z are shown (on when any station uses them).
    pub offsets: bool,
    /// Launch settings.
    pub settings: Settings,
    /// Escape sequences to write to the terminal after the next frame (OSC 52).
    pub outbox: Vec<String>,
    /// Set when the user has asked to quit.
    pub quit: bool,
    /// Set by every action; the event loop saves the session after a short quiet time.
    pub session_changed: bool,
    /// The terminal's size, kept up to date by the event loop (scrolling needs it).
    pub size: Size,
    /// Set when a save was refused because the file changed on disk: the next `s` (and only
    /// the very next key) overwrites it.
    pub overwrite_armed: bool,
    /// Whether the session keeps unsaved work, and if not why.
    pub session_state: SessionState,
    /// The hold on the session folder while this workbench writes it.
    pub session_lock: Option<crate::session::Lock>,
}

/// Whether the session keeps what is not saved to files.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub enum SessionState {
    /// The session is written (or will be at the next quiet moment).
    #[default]
    Kept,
    /// The session is not written: unsaved edits exist only in memory. Says why.
    NotKept(String),
    /// Another workbench holds the session: this one reads it but never writes it. Says so.
    Shared(String),
}

impl App {
    /// A workbench over `docs` (a starter wing is added when it is empty).
    #[must_use]
    pub fn new(mut docs: Vec<Doc>, theme: Theme, settings: Settings) -> Self {
        if docs.is_empty() {
            docs.push(Doc::new(super::starter::wing(), None, settings.method));
        }
        let offsets = docs.iter().any(|d| cells::offsets_used(&d.wing));
        Self {
            docs,
            current: 0,
            reference: None,
            mode: Mode::Normal,
            status: Status::default(),
            theme,
            offsets,
            settings,
            outbox: Vec::new(),
            quit: false,
            session_changed: false,
            size: Size::new(layout_rules::MIN_WIDTH, layout_rules::MIN_HEIGHT),
            overwrite_armed: false,
            session_state: SessionState::Kept,
            session_lock: None,
        }
    }

    /// The current wing.
    #[must_use]
    pub fn doc(&self) -> &Doc {
        &self.docs[self.current.min(self.docs.len() - 1)]
    }

    fn doc_mut(&mut self) -> &mut Doc {
        let i = self.current.min(self.docs.len() - 1);
        &mut self.docs[i]
    }

    /// The columns of a sheet of the current wing.
    #[must_use]
    pub fn columns(&self, sheet: Sheet) -> Vec<Field> {
        cells::columns(&self.doc().wing, sheet, self.offsets)
    }

    /// The field under the cursor.
    #[must_use]
    pub fn field(&self) -> Option<Field> {
        let c = self.doc().cursor;
        self.columns(c.sheet).get(c.col).copied()
    }

    /// Sets the status line (cleaning the text).
    ///
    /// A failure the user has not seen yet (keys typed ahead are handled before the next
    /// frame) is not replaced: a later failure is put before it, later good news is dropped.
    pub fn say(&mut self, text: &str, error: bool) {
        let text = inert(text);
        if self.status.error && !self.status.shown {
            if error && !self.status.text.contains(&text) {
                self.status.text = format!("{text}; before that: {}", self.status.text);
                self.status.serial += 1;
            }
            return;
        }
        self.status = Status {
            text,
            error,
            shown: false,
            serial: self.status.serial + 1,
        };
    }

    /// Called after each frame is drawn: the status message has been on screen.
    pub fn status_drawn(&mut self) {
        self.status.shown = true;
    }

    /// A message the user has seen no longer applies once the cursor, pane, wing or cell
    /// changes without a new message: it is cleared, so the line never describes a cell
    /// or a file state that is no longer the one in view.
    fn clear_stale_status(&mut self, said_before: u64, action: Action) {
        let stays = matches!(action, Action::Help | Action::Picker | Action::Quit);
        if !stays && self.status.shown && self.status.serial == said_before {
            self.status = Status {
                serial: self.status.serial,
                ..Status::default()
            };
        }
    }

    /// The quit question, and when the unsaved wings are not kept anywhere, what to do
    /// instead (the edits exist only in memory).
    #[must_use]
    pub fn quit_question(&self) -> (String, Option<String>) {
        let n = self.docs.iter().filter(|d| d.unsaved()).count();
        match self.session_state.why_not() {
            None => (
                format!("{n} wing(s) not saved to file (the session keeps them): quit anyway? y/n"),
                None,
            ),
            Some(why) => (
                format!("{n} unsaved wing(s) exist only in memory, not in the session: quit? y/n"),
                Some(inert(&format!(
                    "n, then s saves or S saves as a new file; {why}"
                ))),
            ),
        }
    }

    /// Handles one key event: the key table first, then (when typing) the editor.
    pub fn handle_key(&mut self, event: KeyEvent) {
        if event.kind == KeyEventKind::Release {
            return;
        }
        if self.too_small() {
            self.key_while_too_small(&event);
            return;
        }
        match keymap::lookup(self.mode.kind(), &event) {
            Some(action) => self.update(action),
            None => match &mut self.mode {
                Mode::Edit(editor) => editor.input(event),
                // A typed character that does nothing says so; Esc and the like stay quiet.
                Mode::Normal if matches!(event.code, KeyCode::Char(_)) => {
                    let msg = keymap::unbound_message(ModeKind::Normal, &event);
                    self.say(&msg, false);
                }
                _ => {}
            },
        }
    }

    /// Whether the terminal is below the size the workbench lays out in (only "terminal too
    /// small" is shown then).
    #[must_use]
    pub fn too_small(&self) -> bool {
        layout_rules::too_small(self.size)
    }

    /// While nothing but "terminal too small" can be seen, a key must not change what the
    /// user cannot see: only quit works, and its question is shown on that screen.
    fn key_while_too_small(&mut self, event: &KeyEvent) {
        let answer = keymap::lookup(ModeKind::Confirm, event);
        match (&self.mode, keymap::lookup(ModeKind::Normal, event)) {
            (Mode::Confirm, _) => {
                if let Some(action) = answer {
                    self.update(action);
                }
            }
            (_, Some(Action::Quit)) => {
                self.mode = Mode::Normal;
                self.update(Action::Quit);
            }
            _ => {}
        }
    }

    /// Applies one action.
    pub fn update(&mut self, action: Action) {
        self.session_changed = true;
        let overwrite = std::mem::take(&mut self.overwrite_armed) && action == Action::Save;
        match self.mode.kind() {
            ModeKind::Normal => {
                let said_before = self.status.serial;
                if action == Action::Save {
                    super::actions::save(self, overwrite);
                } else {
                    self.normal(action);
                }
                self.clear_stale_status(said_before, action);
            }
            ModeKind::Edit => match action {
                Action::Commit => self.commit_edit(),
                Action::Cancel => self.mode = Mode::Normal,
                Action::Complete => {
                    if let Mode::Edit(editor) = &mut self.mode {
                        editor.complete_path();
                    }
                }
                _ => {}
            },
            ModeKind::Picker => self.picker(action),
            ModeKind::Help => self.help(action),
            ModeKind::Confirm => match action {
                Action::QuitNow => self.quit = true,
                Action::Cancel => self.mode = Mode::Normal,
                _ => {}
            },
        }
    }

    /// Scrolls the help, never past its last line (so Up answers at once after a long Down).
    fn help(&mut self, action: Action) {
        let max = layout_rules::help_max_scroll(self.size);
        let page = i32::from(self.size.height.saturating_sub(3).max(1));
        let Mode::Help { scroll } = &mut self.mode else {
            return;
        };
        let by = match action {
            Action::Cancel => {
                self.mode = Mode::Normal;
                return;
            }
            Action::Move(Dir::Down) => 1,
            Action::Move(Dir::Up) => -1,
            Action::Page(true) => page,
            Action::Page(false) => -page,
            Action::Top => -i32::from(max),
            Action::Bottom => i32::from(max),
            _ => 0,
        };
        let next = (i32::from(*scroll) + by).clamp(0, i32::from(max));
        *scroll = u16::try_from(next).unwrap_or(0);
    }

    /// Rows a page key moves in the table: about half the screen.
    fn page_rows(&self) -> usize {
        usize::from(self.size.height / 2).max(1)
    }

    fn normal(&mut self, action: Action) {
        match action {
            Action::Move(dir) => self.move_cursor(dir),
            Action::Page(down) => {
                let rows = self.page_rows();
                let c = &mut self.doc_mut().cursor;
                c.row = if down {
                    c.row + rows
                } else {
                    c.row.saturating_sub(rows)
                };
                self.clamp_cursor();
            }
            Action::Top => self.doc_mut().cursor.row = 0,
            Action::Bottom => {
                let d = self.doc();
                let last = cells::rows(&d.wing, d.cursor.sheet).saturating_sub(1);
                self.doc_mut().cursor.row = last;
            }
            Action::Pane(forward) => {
                let c = &mut self.doc_mut().cursor;
                c.sheet = c.sheet.cycle(forward);
                c.row = 0;
                c.col = 0;
            }
            Action::Edit => self.start_edit(),
            Action::Nudge(steps) => self.nudge(steps),
            Action::Insert => self.add_row(NewRow::Insert),
            Action::Duplicate => self.add_row(NewRow::Duplicate),
            Action::Delete => self.delete_row(),
            Action::Undo => {
                let method = self.settings.method;
                let ok = self.doc_mut().undo(method);
                self.after_history(ok, "undone", "nothing to undo");
            }
            Action::Redo => {
                let method = self.settings.method;
                let ok = self.doc_mut().redo(method);
                self.after_history(ok, "redone", "nothing to redo");
            }
            Action::Wing(forward) => self.switch_wing(forward),
            Action::Picker => {
                let examples = self.settings.examples.as_deref();
                self.mode = Mode::Picker(picker::build(&self.docs, self.current, examples));
            }
            Action::Open => self.prompt(Purpose::Open, ""),
            Action::SaveAs => {
                let start = self.doc().path.as_ref().map(|p| p.display().to_string());
                self.ask_save_as(&start.unwrap_or_default(), None);
            }
            Action::Notebook => {
                let start = self.settings.notebook.display().to_string();
                self.prompt(Purpose::Notebook, &start);
            }
            Action::Pin => self.pin(),
            Action::Copy => self.copy(),
            Action::Revert => self.revert(),
            Action::ToggleTarget => self.toggle_target(),
            Action::ToggleOffsets => {
                self.offsets = !self.offsets;
                self.clamp_cursor();
            }
            Action::SwitchMethod => self.switch_method(),
            Action::FindClMax => self.find_cl_max(),
            Action::Help => self.mode = Mode::Help { scroll: 0 },
            Action::Quit => {
                if self.docs.iter().any(Doc::unsaved) {
                    // Write the session now, so the question can say truly whether it keeps
                    // the unsaved wings.
                    super::persist::save_session(self);
                    self.mode = Mode::Confirm;
                } else {
                    self.quit = true;
                }
            }
            Action::Save | Action::Commit | Action::Cancel | Action::QuitNow | Action::Complete => {
            }
        }
    }

    fn move_cursor(&mut self, dir: Dir) {
        let c = &mut self.doc_mut().cursor;
        match dir {
            Dir::Up => c.row = c.row.saturating_sub(1),
            Dir::Down => c.row += 1,
            Dir::Left => c.col = c.col.saturating_sub(1),
            Dir::Right => c.col += 1,
        }
        self.clamp_cursor();
    }

    /// Keeps the cursor inside the current sheet.
    pub fn clamp_cursor(&mut self) {
        let d = self.doc();
        let rows = cells::rows(&d.wing, d.cursor.sheet);
        let cols = self.columns(d.cursor.sheet).len();
        let c = &mut self.doc_mut().cursor;
        c.row = c.row.min(rows.saturating_sub(1));
        c.col = c.col.min(cols.saturating_sub(1));
    }

    fn after_history(&mut self, ok: bool, done: &str, none: &str) {
        self.clamp_cursor();
        self.say(if ok { done } else { none }, !ok);
    }

    /// Opens the save-as prompt with `start`, showing `reason` (why the wing's own file is not
    /// written) under it.
    pub fn ask_save_as(&mut self, start: &str, reason: Option<&str>) {
        self.prompt(Purpose::SaveAs, start);
        if let Some(reason) = reason {
            let reason = inert(reason);
            self.say(&reason, true);
            if let Mode::Edit(editor) = &mut self.mode {
                editor.error = Some(reason);
            }
        }
    }

    fn prompt(&mut self, purpose: Purpose, start: &str) {
        self.mode = Mode::Edit(Box::new(Editor::new(purpose, start, self.theme.text)));
    }

    fn start_edit(&mut self) {
        let Cursor { sheet, row, .. } = self.doc().cursor;
        let Some(field) = self.field() else { return };
        if cells::rows(&self.doc().wing, sheet) == 0 {
            self.say("this pane is empty: press i to add a row", true);
            return;
        }
        if cells::from_table(&self.doc().wing, row, field) {
            self.say(&format!("{}: {}", field.key(), cells::TABLE_FIELD), true);
            return;
        }
        let text = cells::edit_text(&self.doc().wing, row, field);
        let purpose = Purpose::Cell { sheet, row, field };
        self.mode = Mode::Edit(Box::new(Editor::for_cell(
            purpose,
            &text,
            self.theme.selected,
        )));
    }

    fn commit_edit(&mut self) {
        let Mode::Edit(editor) = &self.mode else {
            return;
        };
        let (purpose, text) = (editor.purpose, editor.text());
        if matches!(purpose, Purpose::Cell { .. }) && !editor.changed() {
            // Enter on an untouched cell changes nothing (not even the last digit).
            self.mode = Mode::Normal;
            return;
        }
        let outcome = match purpose {
            Purpose::Cell { row, field, .. } => self.commit_cell(row, field, &text),
            Purpose::Open => self.open(Path::new(text.trim())),
            Purpose::SaveAs => {
                let path = PathBuf::from(text.trim());
                let asked = editor.error.clone();
                super::actions::save_as(self, path, asked.as_deref())
            }
            Purpose::Notebook => {
                self.settings.notebook = PathBuf::from(text.trim());
                let msg = format!("notebook lines go to {}", self.settings.notebook.display());
                self.say(&msg, false);
                Ok(())
            }
        };
        match outcome {
            Ok(()) => {
                if matches!(self.mode, Mode::Edit(_)) {
                    self.mode = Mode::Normal;
                }
            }
            Err(reason) => {
                let reason = inert(&reason);
                self.say(&reason, true);
                if let Mode::Edit(editor) = &mut self.mode {
                    editor.error = Some(reason);
                }
            }
        }
    }

    fn commit_cell(&mut self, row: usize, field: Field, text: &str) -> Result<(), String> {
        let mut wing = self.doc().wing.clone();
        cells::set(&mut wing, row, field, text).map_err(|r| format!("{}: {r}", field.key()))?;
        self.accept(wing)?;
        let shown = cells::display(&self.doc().wing, row, field);
        self.say(&format!("{} = {shown}", field.key()), false);
        Ok(())
    }

    /// Takes an edited wing if it breaks no rule the current wing keeps; else the reason.
    fn accept(&mut self, wing: Wing) -> Result<(), String> {
        let before: Vec<String> = validate::problems(&self.doc().wing)
            .iter()
            .map(ToString::to_string)
            .collect();
        if let Some(p) = validate::problems(&wing)
            .into_iter()
            .find(|p| !before.contains(&p.to_string()))
        {
            return Err(p.to_string());
        }
        let method = self.settings.method;
        self.doc_mut().change(wing, method);
        self.clamp_cursor();
        Ok(())
    }

    fn refuse_or(&mut self, result: Result<(), String>, done: &str) {
        match result {
            Ok(()) => self.say(done, false),
            Err(reason) => self.say(&format!("not changed: {reason}"), true),
        }
    }

    fn nudge(&mut self, steps: i32) {
        let Cursor { row, .. } = self.doc().cursor;
        let Some(field) = self.field() else { return };
        let mut wing = self.doc().wing.clone();
        if cells::from_table(&wing, row, field) {
            self.say(&format!("{}: {}", field.key(), cells::TABLE_FIELD), true);
            return;
        }
        if !cells::nudge(&mut wing, row, field, steps) {
            self.say(
                &format!("{} cannot be nudged; press Enter to edit", field.key()),
                true,
            );
            return;
        }
        let result = self.accept(wing);
        let shown = cells::display(&self.doc().wing, row, field);
        self.refuse_or(result, &format!("{} = {shown}", field.key()));
    }

    fn add_row(&mut self, how: NewRow) {
        let Cursor { sheet, row, .. } = self.doc().cursor;
        let mut wing = self.doc().wing.clone();
        let before: std::collections::BTreeSet<String> = wing.airfoils.keys().cloned().collect();
        let new_row = match rows::add_row(&mut wing, sheet, row, how) {
            Ok(new_row) => new_row,
            Err(why) => {
                self.say(&why, true);
                return;
            }
        };
        let result = self.accept(wing);
        if result.is_ok() {
            self.doc_mut().cursor.row = new_row;
        }
        let blended = self
            .doc()
            .wing
            .airfoils
            .keys()
            .find(|k| result.is_ok() && !before.contains(k.as_str()) && k.ends_with("-blend"));
        let done = match (how, blended) {
            (NewRow::Insert, Some(key)) => format!(
                "row inserted with airfoil `{key}`, the halfway blend of its neighbours' \
                 airfoils, so the wing is unchanged"
            ),
            (NewRow::Insert, None) => "row inserted".into(),
            (NewRow::Duplicate, _) => "row duplicated".into(),
        };
        self.refuse_or(result, &done);
    }

    fn delete_row(&mut self) {
        let Cursor { sheet, row, .. } = self.doc().cursor;
        let mut wing = self.doc().wing.clone();
        if let Err(reason) = rows::remove_row(&mut wing, sheet, row) {
            self.say(&reason, true);
            return;
        }
        let result = self.accept(wing);
        self.refuse_or(result, "row deleted (u brings it back)");
    }

    fn switch_wing(&mut self, forward: bool) {
        let n = self.docs.len();
        self.current = if forward {
            (self.current + 1) % n
        } else {
            (self.current + n - 1) % n
        };
        self.clamp_cursor();
        let name = self.doc().title().to_string();
        self.say(&name, false);
    }

    fn pin(&mut self) {
        let d = self.doc();
        if self
            .reference
            .as_ref()
            .is_some_and(|r| r.wing == d.wing && r.source == self.current)
        {
            self.reference = None;
            self.say("reference unpinned", false);
            return;
        }
        let msg = format!("pinned {} as the reference", d.title());
        self.reference = Some(Reference {
            wing: d.wing.clone(),
            solved: d.solved.clone(),
            source: self.current,
        });
        self.say(&msg, false);
    }

    /// The current wing's CL_max, said in the status line.
    fn find_cl_max(&mut self) {
        let (text, error) = match self.doc().cl_max() {
            Some(Ok(m)) if m.cl_max.is_finite() => (
                format!(
                    "CL_max {:.4} at alpha {:.2} deg ({}, {})",
                    m.cl_max,
                    m.alpha_deg,
                    m.found_by.as_str(),
                    self.settings.method.short_name()
                ),
                false,
            ),
            Some(Ok(m)) => (format!("CL_max: {}", m.found_by.as_str()), false),
            Some(Err(e)) => (format!("CL_max: {e}"), true),
            None => ("CL_max: the wing is not solved".to_string(), true),
        };
        self.say(&text, error);
    }

    /// Every open wing re-solved by the other method.
    fn switch_method(&mut self) {
        let method = self.settings.method.other();
        self.settings.method = method;
        for doc in &mut self.docs {
            doc.resolve(method);
        }
        self.say(&format!("method: {}", method.name()), false);
    }

    fn toggle_target(&mut self) {
        let d = self.doc();
        let mut wing = d.wing.clone();
        // Rounded to what the bar shows, so the switched value reads as typed.
        let round = |v: f64, unit: f64| (v / unit).round() * unit;
        match (wing.condition.target_cl, &d.solved) {
            (Some(_), Ok(s)) => {
                wing.condition.alpha_deg = round(s.coefficients.alpha_deg, 0.01);
                wing.condition.target_cl = None;
            }
            (Some(_), Err(_)) => wing.condition.target_cl = None,
            (None, Ok(s)) => wing.condition.target_cl = Some(round(s.coefficients.cl, 0.001)),
            (None, Err(_)) => wing.condition.target_cl = Some(0.0),
        }
        let result = self.accept(wing);
        self.refuse_or(result, "condition switched");
    }

    fn picker(&mut self, action: Action) {
        let Mode::Picker(p) = &mut self.mode else {
            return;
        };
        match action {
            Action::Move(Dir::Up) => p.selected = p.selected.saturating_sub(1),
            Action::Move(Dir::Down) => {
                p.selected = (p.selected + 1).min(p.entries.len().saturating_sub(1));
            }
            Action::Commit => {
                let chosen = p.entries.get(p.selected).map(|e| e.target.clone());
                self.mode = Mode::Normal;
                if let Some(target) = chosen {
                    self.choose(target);
                }
            }
            Action::Cancel => self.mode = Mode::Normal,
            _ => {}
        }
    }

    /// Acts on a chosen picker entry.
    fn choose(&mut self, target: Target) {
        match target {
            Target::Open(i) if i < self.docs.len() => {
                self.current = i;
                self.clamp_cursor();
            }
            Target::Open(_) => {}
            Target::File(path) => {
                if let Err(reason) = self.open(&path) {
                    self.say(&reason, true);
                }
            }
        }
    }

    /// Opens a wing file as a new document (or switches to it when it is already open).
    fn open(&mut self, path: &Path) -> Result<(), String> {
        let doc = super::actions::open(path, self.settings.method)?;
        let msg = format!("opened {}", doc.path.as_deref().unwrap_or(path).display());
        self.add_doc(doc);
        self.clamp_cursor();
        self.say(&msg, false);
        Ok(())
    }

    /// Reloads the current wing from its file; the discarded edits stay in the undo history.
    fn revert(&mut self) {
        match super::actions::revert(self.doc()) {
            Ok((path, wing, stamp)) => {
                let method = self.settings.method;
                let doc = self.doc_mut();
                doc.change(wing.clone(), method);
                doc.saved = Some(wing);
                doc.disk = Some(stamp);
                self.clamp_cursor();
                let msg = format!("reverted to {} (u undoes the revert)", path.display());
                self.say(&msg, false);
            }
            Err(e) => self.say(&e, true),
        }
    }

    /// Sends the result line to the clipboard and the notebook, and says how it went.
    fn copy(&mut self) {
        match super::actions::copy(self.doc(), &self.settings) {
            Ok(copied) => {
                self.outbox.push(copied.escape);
                self.say(&copied.message, copied.failed);
            }
            Err(reason) => self.say(&reason, true),
        }
    }

    /// Adds an open wing (or switches to it if that file is already open) and makes it
    /// current.
    pub fn add_doc(&mut self, doc: Doc) {
        let same = doc.path.as_ref().and_then(|p| {
            self.docs
                .iter()
                .position(|d| d.path.as_ref().is_some_and(|q| same_file(p, q)))
        });
        self.current = match same {
            Some(i) => i,
            None => {
                self.offsets |= cells::offsets_used(&doc.wing);
                self.docs.push(doc);
                self.docs.len() - 1
            }
        };
    }

    /// Mutable access to the current wing for file actions.
    pub(super) fn current_doc_mut(&mut self) -> &mut Doc {
        self.doc_mut()
    }
}
