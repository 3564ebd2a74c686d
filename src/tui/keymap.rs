//! The one key table: it dispatches keys to actions and generates the `?` help overlay and
//! the footer hints, so the documentation of a key cannot drift from what the key does.

use crossterm::event::{KeyCode, KeyEvent, KeyModifiers};

/// Which keys are live: each mode has its own bindings.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ModeKind {
    /// Moving around the panes.
    Normal,
    /// Typing into a cell or a prompt.
    Edit,
    /// Choosing a wing from the quick picker.
    Picker,
    /// Reading the help overlay.
    Help,
    /// Answering the quit question.
    Confirm,
}

impl ModeKind {
    /// Every mode, in help order.
    pub const ALL: [Self; 5] = [
        Self::Normal,
        Self::Edit,
        Self::Picker,
        Self::Help,
        Self::Confirm,
    ];

    /// Heading used in the help overlay and the docs.
    #[must_use]
    pub const fn title(self) -> &'static str {
        match self {
            Self::Normal => "Moving and changing",
            Self::Edit => "Editing a cell or a prompt",
            Self::Picker => "Wing picker",
            Self::Help => "Help",
            Self::Confirm => "Quit question",
        }
    }
}

/// A direction of movement.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Dir {
    /// Previous row.
    Up,
    /// Next row.
    Down,
    /// Previous column.
    Left,
    /// Next column.
    Right,
}

/// Everything a key can ask for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Action {
    /// Move the cursor (or the picker selection).
    Move(Dir),
    /// Down (true) or up a page.
    Page(bool),
    /// First row of the pane.
    Top,
    /// Last row of the pane.
    Bottom,
    /// Next (true) or previous pane: stations, airfoils, controls, condition.
    Pane(bool),
    /// Start editing the selected cell.
    Edit,
    /// Accept the typed text or the picker choice.
    Commit,
    /// Leave the editor, prompt, picker or overlay without changes.
    Cancel,
    /// Nudge the selected value by this many small steps.
    Nudge(i32),
    /// Insert a row interpolated between the selected one and the next.
    Insert,
    /// Duplicate the selected row.
    Duplicate,
    /// Delete the selected row.
    Delete,
    /// Undo the last change to this wing.
    Undo,
    /// Redo the last undone change.
    Redo,
    /// Next (true) or previous open wing.
    Wing(bool),
    /// Open the quick picker of open and saved wings.
    Picker,
    /// Prompt for a wing file to open.
    Open,
    /// Pin the current wing as the reference (or unpin).
    Pin,
    /// Copy the result line to the clipboard and the notebook.
    Copy,
    /// Save the current wing to its file.
    Save,
    /// Save the current wing to a new file.
    SaveAs,
    /// Throw away unsaved changes to the current wing.
    Revert,
    /// Switch the condition between a fixed alpha and a target CL.
    ToggleTarget,
    /// Show or hide the x_le and z columns.
    ToggleOffsets,
    /// Switch the solution method (series, vortex).
    SwitchMethod,
    /// Find the current wing's CL_max (on demand: it solves the wing at many angles).
    FindClMax,
    /// Prompt for the notebook file.
    Notebook,
    /// Show the help overlay.
    Help,
    /// Quit (asks first when unsaved work would be lost).
    Quit,
    /// Quit without asking again (from the quit question).
    QuitNow,
    /// Complete the path typed in a prompt.
    Complete,
}

/// A key as the table spells it.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Key {
    /// The key.
    pub code: KeyCode,
    /// Whether Ctrl is held.
    pub ctrl: bool,
}

const fn k(c: char) -> Key {
    Key {
        code: KeyCode::Char(c),
        ctrl: false,
    }
}

const fn ctrl(c: char) -> Key {
    Key {
        code: KeyCode::Char(c),
        ctrl: true,
    }
}

const fn code(code: KeyCode) -> Key {
    Key { code, ctrl: false }
}

impl Key {
    /// The key's name on screen (ASCII only, so it reads the same in every mode).
    #[must_use]
    pub fn label(self) -> String {
        let base = match self.code {
            KeyCode::Char(' ') => "Space".to_string(),
            KeyCode::Char(c) => c.to_string(),
            KeyCode::Up => "Up".into(),
            KeyCode::Down => "Down".into(),
            KeyCode::Left => "Left".into(),
            KeyCode::Right => "Right".into(),
            KeyCode::Enter => "Enter".into(),
            KeyCode::Esc => "Esc".into(),
            KeyCode::Tab => "Tab".into(),
            KeyCode::BackTab => "Shift-Tab".into(),
            KeyCode::Delete => "Del".into(),
            KeyCode::Home => "Home".into(),
            KeyCode::End => "End".into(),
            KeyCode::PageUp => "PgUp".into(),
            KeyCode::PageDown => "PgDn".into(),
            other => format!("{other:?}"),
        };
        if self.ctrl {
            format!("Ctrl-{base}")
        } else {
            base
        }
    }

    fn matches(self, event: &KeyEvent) -> bool {
        let ctrl = event.modifiers.contains(KeyModifiers::CONTROL);
        if ctrl != self.ctrl {
            return false;
        }
        match (self.code, event.code) {
            // Terminals report letters with Shift already applied; ignore the flag.
            (KeyCode::Char(a), KeyCode::Char(b)) => {
                a == b || (self.ctrl && a == b.to_ascii_lowercase())
            }
            (a, b) => a == b,
        }
    }
}

/// One row of the key table.
#[derive(Debug, Clone, Copy)]
pub struct Binding {
    /// Modes in which the binding is live.
    pub modes: &'static [ModeKind],
    /// Keys that trigger it.
    pub keys: &'static [Key],
    /// What it does.
    pub action: Action,
    /// Help text.
    pub help: &'static str,
    /// Short footer hint, for the few keys that matter most in that mode.
    pub hint: Option<&'static str>,
}

use ModeKind::{Confirm, Edit, Help, Normal, Picker};

const fn bind(
    modes: &'static [ModeKind],
    keys: &'static [Key],
    action: Action,
    help: &'static str,
    hint: Option<&'static str>,
) -> Binding {
    Binding {
        modes,
        keys,
        action,
        help,
        hint,
    }
}

/// The key table, in help order.
pub const BINDINGS: &[Binding] = &[
    bind(
        &[Normal, Picker, Help],
        &[k('k'), code(KeyCode::Up)],
        Action::Move(Dir::Up),
        "up one row",
        None,
    ),
    bind(
        &[Normal, Picker, Help],
        &[k('j'), code(KeyCode::Down)],
        Action::Move(Dir::Down),
        "down one row",
        None,
    ),
    bind(
        &[Normal],
        &[k('h'), code(KeyCode::Left)],
        Action::Move(Dir::Left),
        "left one column",
        None,
    ),
    bind(
        &[Normal],
        &[k('l'), code(KeyCode::Right)],
        Action::Move(Dir::Right),
        "right one column",
        None,
    ),
    bind(
        &[Normal, Help],
        &[code(KeyCode::PageDown), ctrl('d')],
        Action::Page(true),
        "down a page",
        None,
    ),
    bind(
        &[Normal, Help],
        &[code(KeyCode::PageUp), ctrl('u')],
        Action::Page(false),
        "up a page",
        None,
    ),
    bind(
        &[Normal, Help],
        &[k('g'), code(KeyCode::Home)],
        Action::Top,
        "first row",
        None,
    ),
    bind(
        &[Normal, Help],
        &[k('G'), code(KeyCode::End)],
        Action::Bottom,
        "last row",
        None,
    ),
    bind(
        &[Normal],
        &[code(KeyCode::Tab)],
        Action::Pane(true),
        "next pane: stations, airfoils, controls, condition",
        Some("pane"),
    ),
    bind(
        &[Normal],
        &[code(KeyCode::BackTab)],
        Action::Pane(false),
        "previous pane",
        None,
    ),
    bind(
        &[Normal],
        &[code(KeyCode::Enter)],
        Action::Edit,
        "edit the selected cell",
        Some("edit"),
    ),
    bind(
        &[Edit, Picker],
        &[code(KeyCode::Enter)],
        Action::Commit,
        "accept (an invalid value is refused, with the reason)",
        Some("accept"),
    ),
    bind(
        &[Edit],
        &[code(KeyCode::Tab)],
        Action::Complete,
        "complete the file or folder name (in a path prompt; again: list the choices)",
        None,
    ),
    bind(
        &[Edit, Picker, Help, Confirm],
        &[code(KeyCode::Esc)],
        Action::Cancel,
        "cancel",
        Some("cancel"),
    ),
    bind(
        &[Help],
        &[k('?'), k('q')],
        Action::Cancel,
        "close the help",
        None,
    ),
    bind(
        &[Normal],
        &[k('+'), k('=')],
        Action::Nudge(1),
        "nudge the value up a small step (next airfoil)",
        Some("nudge"),
    ),
    bind(
        &[Normal],
        &[k('-')],
        Action::Nudge(-1),
        "nudge the value down a small step",
        None,
    ),
    bind(
        &[Normal],
        &[k('>')],
        Action::Nudge(10),
        "nudge up a large step (ten small)",
        None,
    ),
    bind(
        &[Normal],
        &[k('<')],
        Action::Nudge(-10),
        "nudge down a large step",
        None,
    ),
    bind(
        &[Normal],
        &[k('i')],
        Action::Insert,
        "insert a row (a station halfway to the next, interpolated)",
        None,
    ),
    bind(
        &[Normal],
        &[k('D')],
        Action::Duplicate,
        "duplicate the selected row",
        None,
    ),
    bind(
        &[Normal],
        &[k('d'), code(KeyCode::Delete)],
        Action::Delete,
        "delete the selected row",
        None,
    ),
    bind(&[Normal], &[k('u')], Action::Undo, "undo", Some("undo")),
    bind(&[Normal], &[ctrl('r'), k('U')], Action::Redo, "redo", None),
    bind(
        &[Normal],
        &[k(']')],
        Action::Wing(true),
        "next open wing",
        None,
    ),
    bind(
        &[Normal],
        &[k('[')],
        Action::Wing(false),
        "previous open wing",
        None,
    ),
    bind(
        &[Normal],
        &[k('w')],
        Action::Picker,
        "pick a wing: open ones and saved files",
        Some("wings"),
    ),
    bind(
        &[Normal],
        &[k('o')],
        Action::Open,
        "open a wing file by path",
        None,
    ),
    bind(
        &[Normal],
        &[k('p')],
        Action::Pin,
        "pin this wing as the reference (again: unpin)",
        Some("pin"),
    ),
    bind(
        &[Normal],
        &[k('y')],
        Action::Copy,
        "copy the result line to the clipboard and notebook",
        Some("copy"),
    ),
    bind(
        &[Normal],
        &[k('s')],
        Action::Save,
        "save the wing to its file",
        Some("save"),
    ),
    bind(
        &[Normal],
        &[k('S')],
        Action::SaveAs,
        "save the wing as a new file",
        None,
    ),
    bind(
        &[Normal],
        &[k('R')],
        Action::Revert,
        "revert to the saved file (undo brings it back)",
        None,
    ),
    bind(
        &[Normal],
        &[k('t')],
        Action::ToggleTarget,
        "switch the condition between alpha and target CL",
        None,
    ),
    bind(
        &[Normal],
        &[k('x')],
        Action::ToggleOffsets,
        "show or hide the x_le and z columns",
        None,
    ),
    bind(
        &[Normal],
        &[k('N')],
        Action::Notebook,
        "choose the notebook file",
        None,
    ),
    bind(
        &[Normal],
        &[k('?')],
        Action::Help,
        "this help",
        Some("help"),
    ),
    bind(
        &[Normal],
        &[k('m')],
        Action::SwitchMethod,
        "switch the method: Glauert series / vortex lifting line (sweep, dihedral)",
        Some("method"),
    ),
    bind(
        &[Normal],
        &[k('M')],
        Action::FindClMax,
        "find the wing's CL_max (steps alpha until the lift peaks)",
        None,
    ),
    bind(
        &[Normal],
        &[k('q'), ctrl('c')],
        Action::Quit,
        "quit (asks when unsaved work would be lost)",
        Some("quit"),
    ),
    bind(
        &[Confirm],
        &[k('y'), k('Y')],
        Action::QuitNow,
        "quit; unsaved wings stay only if the session was written",
        Some("quit"),
    ),
    bind(
        &[Confirm],
        &[k('n'), k('N')],
        Action::Cancel,
        "stay",
        Some("stay"),
    ),
];

/// The action bound to a key in a mode.
#[must_use]
pub fn lookup(mode: ModeKind, event: &KeyEvent) -> Option<Action> {
    binding(mode, event).map(|b| b.action)
}

fn binding(mode: ModeKind, event: &KeyEvent) -> Option<&'static Binding> {
    BINDINGS
        .iter()
        .filter(|b| b.modes.contains(&mode))
        .find(|b| b.keys.iter().any(|key| key.matches(event)))
}

/// What the status line says about a key that does nothing in `mode`, so no key is silently
/// ignored: when the same letter in the other case is a key, it is named with its help.
#[must_use]
pub fn unbound_message(mode: ModeKind, event: &KeyEvent) -> String {
    let pressed = Key {
        code: event.code,
        ctrl: event.modifiers.contains(KeyModifiers::CONTROL),
    };
    let other_case = match event.code {
        KeyCode::Char(c) if c.is_lowercase() => c.to_uppercase().next(),
        KeyCode::Char(c) => c.to_lowercase().next(),
        _ => None,
    };
    let hint = other_case
        .and_then(|c| {
            let b = binding(mode, &KeyEvent::new(KeyCode::Char(c), event.modifiers))?;
            Some(format!("; {c} does: {}", b.help))
        })
        .unwrap_or_default();
    format!(
        "{} is not a key here{hint} (? lists the keys)",
        pressed.label()
    )
}

/// The keys of a binding joined for display, e.g. `k Up`.
#[must_use]
pub fn keys_label(binding: &Binding) -> String {
    binding
        .keys
        .iter()
        .map(|key| key.label())
        .collect::<Vec<_>>()
        .join(" ")
}

/// The footer hints of a mode: `(first key, hint)` pairs.
#[must_use]
pub fn hints(mode: ModeKind) -> Vec<(String, &'static str)> {
    BINDINGS
        .iter()
        .filter(|b| b.modes.contains(&mode))
        .filter_map(|b| Some((b.keys.first()?.label(), b.hint?)))
        .collect()
}

/// The help of a mode: `(keys, help)` rows.
#[must_use]
pub fn help(mode: ModeKind) -> Vec<(String, &'static str)> {
    BINDINGS
        .iter()
        .filter(|b| b.modes.contains(&mode))
        .map(|b| (keys_label(b), b.help))
        .collect()
}

/// The cautions every help screen carries.
pub const CAUTIONS: &[&str] = &[
    "Results are preliminary design estimates.",
    "Lifting-line theory is weak at low aspect ratio, with sweep, near the stall and at high Mach.",
    "Verify by test and licensed engineering practice; local airworthiness rules and codes govern.",
];

/// The whole key reference as Markdown (used by docs/workbench.md and checked by a test).
#[must_use]
pub fn markdown() -> String {
    let mut out = String::new();
    for mode in ModeKind::ALL {
        out.push_str(&format!(
            "### {}\n\n| keys | action |\n|---|---|\n",
            mode.title()
        ));
        for (keys, help) in help(mode) {
            out.push_str(&format!("| `{}` | {help} |\n", keys.replace(' ', "` `")));
        }
        out.push('\n');
    }
    out
}
