//! Shared helpers for the workbench tests: a fixture wing, an app over it, key presses and
//! buffers as text.
#![allow(dead_code)]

use std::path::{Path, PathBuf};

use crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use gammaline::solver::Method;
use gammaline::tui::app::{App, Settings};
use gammaline::tui::doc::Doc;
use gammaline::tui::theme::{Theme, UNICODE};
use gammaline::wing::{file, Wing};
use ratatui::buffer::Buffer;
use ratatui::layout::Rect;

/// A three-station tapered wing with washout, two airfoils and an aileron.
pub const TAPERED: &str = r#"name = "Tapered trainer"
symmetric = true

[[station]]
y = 0.0
chord = 1.6
twist = 0.0
airfoil = "root"

[[station]]
y = 2.5
chord = 1.3
twist = -1.0
airfoil = "root"

[[station]]
y = 5.0
chord = 0.8
twist = -3.0
airfoil = "tip"

[airfoil.root]
lift_slope = 6.1
alpha_zero_lift = -2.5
cl_max = 1.5
cd0 = 0.007
cd2 = 0.005

[airfoil.tip]
lift_slope = 6.0
alpha_zero_lift = -1.5
cl_max = 1.3
cd0 = 0.008
cd2 = 0.006

[[control]]
name = "aileron"
kind = "aileron"
y_inner = 3.2
y_outer = 4.8
chord_fraction = 0.25
deflection = 0.0

[condition]
alpha = 6.0
speed = 35.0
altitude = 500.0
"#;

/// The fixture wing.
pub fn tapered() -> Wing {
    file::parse(TAPERED, Path::new("tapered.toml")).expect("fixture parses")
}

/// Writes the fixture into `dir` and returns its path.
pub fn write_tapered(dir: &Path) -> PathBuf {
    let path = dir.join("tapered.toml");
    std::fs::write(&path, TAPERED).expect("write fixture");
    path
}

/// Settings that keep everything inside `dir`.
pub fn settings(dir: &Path) -> Settings {
    Settings {
        method: Method::default(),
        notebook: dir.join("notebook.txt"),
        session_dir: Some(dir.join("session")),
        in_tmux: false,
        examples: None,
    }
}

/// An app over the fixture (read from a file in `dir`), monochrome Unicode theme.
pub fn app(dir: &Path) -> App {
    let path = write_tapered(dir);
    let doc = Doc::new(tapered(), Some(path), Method::default());
    App::new(vec![doc], Theme::monochrome(UNICODE), settings(dir))
}

/// An app over any wing without a file.
pub fn app_with(wing: Wing, theme: Theme, dir: &Path) -> App {
    let doc = Doc::new(wing, None, Method::default());
    App::new(vec![doc], theme, settings(dir))
}

/// A key press.
pub fn key(code: KeyCode) -> KeyEvent {
    KeyEvent::new(code, KeyModifiers::NONE)
}

/// Presses each character of `keys` (use `\n` for Enter and `\x1b` for Esc).
pub fn press(app: &mut App, keys: &str) {
    for c in keys.chars() {
        let code = match c {
            '\n' => KeyCode::Enter,
            '\u{1b}' => KeyCode::Esc,
            '\t' => KeyCode::Tab,
            c => KeyCode::Char(c),
        };
        app.handle_key(key(code));
    }
}

/// Types text into the editor after clearing what it holds.
pub fn retype(app: &mut App, text: &str) {
    for _ in 0..40 {
        app.handle_key(key(KeyCode::Backspace));
    }
    press(app, text);
}

/// The whole workbench drawn at `width` x `height`.
pub fn draw(app: &App, width: u16, height: u16) -> Buffer {
    let area = Rect::new(0, 0, width, height);
    let mut buf = Buffer::empty(area);
    gammaline::tui::view::render(app, area, &mut buf);
    buf
}

/// A buffer's rows as strings (trailing spaces kept).
pub fn lines(buf: &Buffer) -> Vec<String> {
    let a = buf.area;
    (a.top()..a.bottom())
        .map(|y| {
            (a.left()..a.right())
                .map(|x| buf[(x, y)].symbol())
                .collect()
        })
        .collect()
}

/// The whole buffer as one string, rows joined by newlines.
pub fn text(buf: &Buffer) -> String {
    lines(buf).join("\n")
}

/// The CL shown in the results strip.
pub fn shown_cl(buf: &Buffer) -> Option<f64> {
    let all = text(buf);
    let at = all.find("CL ")?;
    all[at + 3..].split_whitespace().next()?.parse().ok()
}

/// The text in the open editor ("" when none is open).
pub fn editor_text(app: &App) -> String {
    match &app.mode {
        gammaline::tui::app::Mode::Edit(e) => e.text(),
        _ => String::new(),
    }
}
