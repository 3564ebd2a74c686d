//! The `?` overlay: draws the help text laid out by [`crate::tui::layout_rules`] (the
//! cautions, then every key of every mode, wrapped to the overlay's width).

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::text::{Line, Span};
use ratatui::widgets::Widget;

use super::{block, overlay, put};
use crate::tui::app::{App, Mode};
use crate::tui::layout_rules::{help_frame, HelpKind};
/// The help text and its scroll limit, under the names the overlay's callers know.
pub use crate::tui::layout_rules::{help_lines as lines, help_max_scroll as max_scroll};

/// Draws the overlay, scrolled by the help mode's offset.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    let f = help_frame(area);
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
            HelpKind::Heading => t.header,
            HelpKind::Caution => t.warning,
            HelpKind::Plain => t.text,
        };
        let y = inner.y + u16::try_from(i).unwrap_or(0);
        put(buf, inner.x, y, inner.width, text, style);
    }
}
