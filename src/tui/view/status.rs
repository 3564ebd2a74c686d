//! The status line (messages, prompts, the quit question) and the footer of key hints.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::widgets::Widget;

use super::put;
use crate::text::inert;
use crate::tui::app::{App, Mode};
use crate::tui::editor::Purpose;
use crate::tui::keymap;
use crate::tui::wrap::{fit_paths, wrap};

/// Draws the status line.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    match &app.mode {
        Mode::Edit(editor) if !matches!(editor.purpose, Purpose::Cell { .. }) => {
            let x = put(
                buf,
                area.x,
                area.y,
                area.width,
                editor.purpose.prompt(),
                t.header,
            );
            let rest = Rect::new(x, area.y, area.right().saturating_sub(x), 1);
            let mut field = editor.area.clone();
            if editor.error.is_some() {
                field.set_style(t.invalid);
            }
            (&field).render(rest, buf);
            return;
        }
        Mode::Confirm => {
            let (question, _) = app.quit_question();
            put(buf, area.x, area.y, area.width, &question, t.warning);
            return;
        }
        _ => {}
    }
    let style = if app.status.error { t.invalid } else { t.text };
    for (i, line) in message_lines(app, area.width).iter().enumerate() {
        let y = area.y + u16::try_from(i).unwrap_or(u16::MAX);
        if y < area.bottom() {
            put(buf, area.x, y, area.width, line, style);
        }
    }
}

/// Most rows a long message takes (the footer's row, then one of the panes').
pub const MAX_ROWS: usize = 3;

/// The status message fitted to `width`: paths in it shortened from the left first; a
/// message still too long wraps onto up to [`MAX_ROWS`] lines (the footer gives up its row).
#[must_use]
pub fn message_lines(app: &App, width: u16) -> Vec<String> {
    let ellipsis = app.theme.glyphs.ellipsis;
    let width = usize::from(width);
    let text = &app.status.text;
    let fitted = fit_paths(text, width, ellipsis);
    if fitted.chars().count() <= width {
        return vec![fitted];
    }
    // Several lines: whole paths when they fit so, shortened ones otherwise.
    let whole = wrap(text, width);
    let mut lines = if whole.len() <= MAX_ROWS {
        whole
    } else {
        wrap(&fitted, width)
    };
    lines.truncate(MAX_ROWS);
    lines
}

/// Rows the status line needs: more than one while a long message is shown in normal mode.
#[must_use]
pub fn height(app: &App, width: u16) -> u16 {
    match app.mode {
        Mode::Normal => u16::try_from(message_lines(app, width).len()).unwrap_or(1),
        _ => 1,
    }
}

/// Draws the footer: the few keys that matter in the current mode.
pub fn footer(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    if let Mode::Edit(editor) = &app.mode {
        if let (false, Some(reason)) = (
            matches!(editor.purpose, Purpose::Cell { .. }),
            &editor.error,
        ) {
            // A refused path: the prompt holds the status line, so the reason goes here.
            let text = fit_paths(reason, usize::from(area.width), t.glyphs.ellipsis);
            put(buf, area.x, area.y, area.width, &text, t.invalid);
            return;
        }
        if let Some(note) = &editor.note {
            put(buf, area.x, area.y, area.width, &inert(note), t.dim);
            return;
        }
    }
    if let (Mode::Confirm, (_, Some(advice))) = (&app.mode, app.quit_question()) {
        // Unsaved work would be lost for good: what to do instead takes the footer.
        let text = fit_paths(&advice, usize::from(area.width), t.glyphs.ellipsis);
        put(buf, area.x, area.y, area.width, &text, t.invalid);
        return;
    }
    let mut x = area.x;
    for (key, hint) in keymap::hints(app.mode.kind()) {
        let need = u16::try_from(key.len() + hint.len() + 3).unwrap_or(u16::MAX);
        if x + need > area.right() {
            break;
        }
        x = put(buf, x, area.y, area.right() - x, &key, t.key);
        x = put(
            buf,
            x,
            area.y,
            area.right() - x,
            &format!(" {hint}  "),
            t.dim,
        );
    }
}
