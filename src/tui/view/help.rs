//! The `?` overlay: the cautions, then every key of every mode, generated from the key table
//! and wrapped to the overlay's width so every line can be read at the smallest size.

use ratatui::buffer::Buffer;
use ratatui::layout::{Rect, Size};
use ratatui::style::Style;
use ratatui::text::{Line, Span};
use ratatui::widgets::Widget;

use super::wrap::wrap;
use super::{block, fit, overlay, put};
use crate::tui::app::{App, Mode};
use crate::tui::keymap::{self, ModeKind, CAUTIONS};

/// Width of the keys column.
const KEYS: usize = 18;
/// Widest the overlay grows.
const MAX_WIDTH: u16 = 100;

/// What a help line is, for its style.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Kind {
    /// A key and what it does.
    Plain,
    /// A mode's heading.
    Heading,
    /// One of the cautions.
    Caution,
}

/// The help text wrapped to `width` columns, line by line. A key's description that does
/// not fit continues under the description column.
#[must_use]
pub fn lines(width: u16) -> Vec<(String, Kind)> {
    let width = usize::from(width).max(1);
    let mut out: Vec<(String, Kind)> = CAUTIONS
        .iter()
        .flat_map(|c| wrap(c, width))
        .map(|l| (l, Kind::Caution))
        .collect();
    // Too narrow for two columns: the keys go on a line of their own.
    let indent = if width >= KEYS + 21 { KEYS + 1 } else { 2 };
    for mode in ModeKind::ALL {
        out.push((String::new(), Kind::Plain));
        out.extend(
            wrap(mode.title(), width)
                .into_iter()
                .map(|l| (l, Kind::Heading)),
        );
        for (keys, help) in keymap::help(mode) {
            let mut rest = wrap(help, width - indent.min(width - 1)).into_iter();
            if indent > KEYS && keys.chars().count() <= KEYS {
                let first = rest.next().unwrap_or_default();
                out.push((format!("{} {first}", fit(&keys, KEYS, false)), Kind::Plain));
            } else {
                out.extend(wrap(&keys, width).into_iter().map(|l| (l, Kind::Plain)));
            }
            let pad = " ".repeat(indent.min(width - 1));
            out.extend(rest.map(|l| (format!("{pad}{l}"), Kind::Plain)));
        }
    }
    out
}

/// The overlay's rectangle in a screen of `area`.
fn frame(area: Rect) -> Rect {
    Rect {
        width: MAX_WIDTH.min(area.width),
        ..area
    }
}

/// The text area inside the overlay's border for a screen of `size`.
fn inner_size(size: Size) -> Size {
    let rect = frame(Rect::new(0, 0, size.width, size.height));
    Size::new(rect.width.saturating_sub(2), rect.height.saturating_sub(2))
}

/// The furthest the help can scroll on a screen of `size` (the last line at the bottom).
#[must_use]
pub fn max_scroll(size: Size) -> u16 {
    let inner = inner_size(size);
    let total = lines(inner.width).len();
    u16::try_from(total.saturating_sub(usize::from(inner.height))).unwrap_or(u16::MAX)
}

/// Draws the overlay, scrolled by the help mode's offset.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    let f = frame(area);
    let rect = overlay(area, f.width, f.height, buf);
    let inner_width = rect.width.saturating_sub(2);
    let all = lines(inner_width);
    let rows = usize::from(rect.height.saturating_sub(2));
    let max_scroll = all.len().saturating_sub(rows);
    let scroll = match app.mode {
        Mode::Help { scroll } => usize::from(scroll).min(max_scroll),
        _ => 0,
    };
    let position = if max_scroll == 0 {
        String::new()
    } else {
        format!(
            "{}-{} of {} ",
            scroll + 1,
            (scroll + rows).min(all.len()),
            all.len()
        )
    };
    let title = Line::from(vec![
        Span::styled(" keys ", t.header),
        Span::styled("(j/k PgDn/PgUp scroll, Esc close) ", t.dim),
        Span::styled(position, t.dim),
    ]);
    let outer = block(app, title, true);
    let inner = outer.inner(rect);
    outer.render(rect, buf);
    for (i, (text, kind)) in all.iter().skip(scroll).take(rows).enumerate() {
        let style: Style = match kind {
            Kind::Heading => t.header,
            Kind::Caution => t.warning,
            Kind::Plain => t.text,
        };
        let y = inner.y + u16::try_from(i).unwrap_or(0);
        put(buf, inner.x, y, inner.width, text, style);
    }
}
