//! The `?` overlay: the cautions, then every key of every mode, generated from the key table.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::text::{Line, Span};
use ratatui::widgets::Widget;

use super::{block, fit, overlay, put};
use crate::tui::app::{App, Mode};
use crate::tui::keymap::{self, ModeKind, CAUTIONS};

/// Width of the keys column.
const KEYS: usize = 18;

/// The help text, line by line: `(text, style kind)` where kind 0 is plain, 1 a heading,
/// 2 a caution.
#[must_use]
pub fn lines() -> Vec<(String, u8)> {
    let mut out: Vec<(String, u8)> = CAUTIONS.iter().map(|c| ((*c).to_string(), 2)).collect();
    for mode in ModeKind::ALL {
        out.push((String::new(), 0));
        out.push((mode.title().to_string(), 1));
        for (keys, help) in keymap::help(mode) {
            out.push((format!("{} {help}", fit(&keys, KEYS, false)), 0));
        }
    }
    out
}

/// Draws the overlay, scrolled by the help mode's offset.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let scroll = match app.mode {
        Mode::Help { scroll } => usize::from(scroll),
        _ => 0,
    };
    let t = &app.theme;
    let rect = overlay(area, 100, area.height, buf);
    let title = Line::from(vec![
        Span::styled(" keys ", t.header),
        Span::styled("(j/k scroll, Esc close) ", t.dim),
    ]);
    let outer = block(app, title, true);
    let inner = outer.inner(rect);
    outer.render(rect, buf);
    let all = lines();
    let max_scroll = all.len().saturating_sub(usize::from(inner.height));
    for (i, (text, kind)) in all
        .iter()
        .skip(scroll.min(max_scroll))
        .take(usize::from(inner.height))
        .enumerate()
    {
        let style: Style = match kind {
            1 => t.header,
            2 => t.warning,
            _ => t.text,
        };
        let y = inner.y + u16::try_from(i).unwrap_or(0);
        put(buf, inner.x, y, inner.width, text, style);
    }
}
