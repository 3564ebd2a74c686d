//! The single-line editor used for cells and for the path prompts.

use crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use ratatui::style::{Modifier, Style};
use tui_textarea::{CursorMove, TextArea};

use super::cells::{Field, Sheet};

/// What the typed text is for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Purpose {
    /// A cell of the current wing.
    Cell {
        /// The pane.
        sheet: Sheet,
        /// The row.
        row: usize,
        /// The quantity.
        field: Field,
    },
    /// A wing file to open.
    Open,
    /// Where to save the current wing.
    SaveAs,
    /// Where the notebook lines go.
    Notebook,
}

impl Purpose {
    /// The prompt shown before a path prompt.
    #[must_use]
    pub const fn prompt(self) -> &'static str {
        match self {
            Self::Cell { .. } => "",
            Self::Open => "open wing file: ",
            Self::SaveAs => "save as: ",
            Self::Notebook => "notebook file: ",
        }
    }
}

/// A tui-textarea kept to one line, with the reason the last commit was refused.
#[derive(Debug, Clone)]
pub struct Editor {
    /// What the text is for.
    pub purpose: Purpose,
    /// The text area.
    pub area: TextArea<'static>,
    /// Why the last attempt to commit was refused; shown in the cell and the status line.
    pub error: Option<String>,
    /// A note under a path prompt: the names Tab could not choose between.
    pub note: Option<String>,
    /// The text the editor opened with.
    original: String,
}

impl Editor {
    /// An editor holding `text`, cursor at the end.
    #[must_use]
    pub fn new(purpose: Purpose, text: &str, style: Style) -> Self {
        let mut area = TextArea::new(vec![text.to_string()]);
        area.set_cursor_line_style(Style::new());
        area.set_style(style);
        area.move_cursor(CursorMove::End);
        Self {
            purpose,
            area,
            error: None,
            note: None,
            original: text.to_string(),
        }
    }

    /// An editor for a cell: the old value is selected, so typing replaces it, Backspace
    /// clears it and the arrows keep it for changing a digit.
    #[must_use]
    pub fn for_cell(purpose: Purpose, text: &str, style: Style) -> Self {
        let mut editor = Self::new(purpose, text, style);
        // Marked by modifiers, not colour, so it shows under NO_COLOR too.
        editor.area.set_selection_style(
            Style::new()
                .remove_modifier(Modifier::REVERSED)
                .add_modifier(Modifier::UNDERLINED | Modifier::BOLD),
        );
        editor.area.select_all();
        editor
    }

    /// Whether the text differs from what the editor opened with.
    #[must_use]
    pub fn changed(&self) -> bool {
        self.text() != self.original
    }

    /// The text typed so far (one line: Enter never reaches the text area).
    #[must_use]
    pub fn text(&self) -> String {
        self.area.lines().join("")
    }

    /// Passes a key to the text area; a change clears the last error.
    pub fn input(&mut self, key: KeyEvent) {
        // Ctrl-U clears to the start, as in a shell line (the text area would undo).
        let changed = if key.code == KeyCode::Char('u') && key.modifiers == KeyModifiers::CONTROL {
            self.area.cancel_selection();
            self.area.delete_line_by_head()
        } else {
            self.area.input(key)
        };
        if changed {
            self.error = None;
            self.note = None;
        }
    }

    /// Tab in a path prompt: completes the typed path as far as it is unambiguous; when it
    /// cannot go further, notes the names that still match. Cells are not paths: nothing.
    pub fn complete_path(&mut self) {
        if matches!(self.purpose, Purpose::Cell { .. }) {
            return;
        }
        let typed = self.text();
        let done = super::complete::complete(&typed, self.purpose == Purpose::Open);
        if done.text != typed {
            self.area = replaced(&self.area, &done.text);
            self.error = None;
            self.note = None;
        } else if done.candidates.is_empty() {
            self.note = Some("no file or folder starts so".to_string());
        } else {
            self.note = Some(done.candidates.join("  "));
        }
    }
}

/// A text area like `area` (same styles) holding `text`, the cursor at its end.
fn replaced(area: &TextArea<'static>, text: &str) -> TextArea<'static> {
    let mut next = TextArea::new(vec![text.to_string()]);
    next.set_cursor_line_style(area.cursor_line_style());
    next.set_style(area.style());
    next.move_cursor(CursorMove::End);
    next
}
