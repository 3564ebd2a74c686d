//! The quick picker overlay: open wings, then saved wing files.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::Widget;

use super::{block, fit, overlay, put};
use crate::text::inert;
use crate::tui::app::App;
use crate::tui::picker::Picker;

/// Draws the picker.
pub fn render(app: &App, picker: &Picker, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    let height = u16::try_from(picker.entries.len() + 2)
        .unwrap_or(u16::MAX)
        .max(3);
    let rect = overlay(area, 72, height.min(area.height.saturating_sub(4)), buf);
    let title = Line::from(vec![
        Span::styled(" wings ", t.header),
        Span::styled("(Enter open, Esc close) ", t.dim),
    ]);
    let outer = block(app, title, true);
    let inner = outer.inner(rect);
    outer.render(rect, buf);
    if inner.height == 0 {
        return;
    }
    let rows = usize::from(inner.height);
    let offset = picker.selected.saturating_sub(rows - 1);
    for (i, entry) in picker.entries.iter().enumerate().skip(offset).take(rows) {
        let y = inner.y + u16::try_from(i - offset).unwrap_or(0);
        let style = if i == picker.selected {
            t.selected
        } else {
            t.text
        };
        let text = fit(&inert(&entry.label), usize::from(inner.width), false);
        put(buf, inner.x, y, inner.width, &text, style);
    }
    if picker.entries.is_empty() {
        put(buf, inner.x, inner.y, inner.width, "no wings found", t.dim);
    }
}
