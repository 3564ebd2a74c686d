//! The wing bar: open wings, the current one marked, unsaved ones starred, the reference
//! tagged.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;

use super::put;
use crate::text::inert;
use crate::tui::app::App;

/// Longest name shown before it is cut.
const NAME_WIDTH: usize = 22;

/// Draws the wing bar.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    let mut x = put(buf, area.x, area.y, area.width, "wings ", t.header);
    for (i, doc) in app.docs.iter().enumerate() {
        let current = i == app.current;
        let name: String = inert(doc.title()).chars().take(NAME_WIDTH).collect();
        let pinned = app.reference.as_ref().is_some_and(|r| r.source == i);
        let label = format!(
            "{}{}:{}{}{}",
            if current { t.glyphs.current } else { " " },
            i + 1,
            name,
            if doc.unsaved() { "*" } else { "" },
            if pinned { " (ref)" } else { "" },
        );
        let style = if current { t.current } else { t.text };
        let room = area.right().saturating_sub(x);
        x = put(buf, x, area.y, room, &label, style);
        x = put(buf, x, area.y, area.right().saturating_sub(x), " ", t.text);
    }
}
