//! Drawing: a pure function of `&App` into a buffer, one file per pane.

pub mod condition;
pub mod help;
pub mod picker;
pub mod plots;
pub mod results;
pub mod sparkline;
pub mod status;
pub mod table;
pub mod wingbar;

use ratatui::buffer::Buffer;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::style::Style;
use ratatui::text::Line;
use ratatui::widgets::{Block, Clear, Paragraph, Widget, Wrap};

use super::app::{App, Mode};
use super::cells::Sheet;
use super::layout_rules::{self, MIN_HEIGHT, MIN_WIDTH};
pub use super::wrap::fit;
use crate::solver::Solution;

/// Rows of the results strip without a reference.
pub const STRIP_HEIGHT: u16 = 4;

/// Draws the whole workbench into `area` of `buf`.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    if layout_rules::too_small(area.as_size()) {
        too_small(app, area, buf);
        return;
    }
    let status_rows = status::height(app, area.width).max(1);
    let [wings, condition, main, strip, status, footer] = Layout::vertical([
        Constraint::Length(1),
        Constraint::Length(condition::height(app, area.width)),
        Constraint::Min(8),
        Constraint::Length(results::height(app)),
        Constraint::Length(status_rows),
        Constraint::Length(u16::from(status_rows == 1)),
    ])
    .areas(area);
    let table_width = table::width(app).min(area.width * 3 / 5);
    let [table_area, plots_area] =
        Layout::horizontal([Constraint::Length(table_width), Constraint::Min(20)]).areas(main);
    wingbar::render(app, wings, buf);
    condition::render(app, condition, buf);
    table::render(app, table_area, buf);
    plots::render(app, plots_area, buf);
    results::render(app, strip, buf);
    status::render(app, status, buf);
    status::footer(app, footer, buf);
    match &app.mode {
        Mode::Help { .. } => help::render(app, area, buf),
        Mode::Picker(p) => picker::render(app, p, area, buf),
        _ => {}
    }
}

/// The only screen below the least size: what is wrong, which keys still work, and the
/// quit question when it is being asked.
fn too_small(app: &App, area: Rect, buf: &mut Buffer) {
    if area.area() == 0 {
        return;
    }
    let t = &app.theme;
    let mut lines = vec![
        Line::styled(
            format!(
                "terminal too small: {}x{}, the workbench needs {MIN_WIDTH}x{MIN_HEIGHT}",
                area.width, area.height
            ),
            t.text,
        ),
        Line::styled("keys wait until it grows; q quits", t.dim),
    ];
    if matches!(app.mode, Mode::Confirm) {
        // First, so it is seen even on a very small screen.
        let (question, advice) = app.quit_question();
        if let Some(advice) = advice {
            lines.insert(0, Line::styled(advice, t.invalid));
        }
        lines.insert(0, Line::styled(question, t.warning));
    }
    Paragraph::new(lines)
        .wrap(Wrap { trim: true })
        .render(area, buf);
}

/// Writes `text` at `(x, y)`, cut to `width` columns (never outside the buffer's area).
pub fn put(buf: &mut Buffer, x: u16, y: u16, width: u16, text: &str, style: Style) -> u16 {
    let area = buf.area;
    if y < area.top() || y >= area.bottom() || x >= area.right() || width == 0 {
        return x;
    }
    let width = width.min(area.right() - x);
    let (end, _) = buf.set_stringn(x, y, text, usize::from(width), style);
    end
}

/// The current wing's solution; when there is none, `label` and the reason are written at the
/// top of `area` in the invalid style (the reason on the next row when `own_row`) and `None`
/// comes back, so the pane draws nothing else.
pub fn solution_or_reason<'a>(
    app: &'a App,
    area: Rect,
    buf: &mut Buffer,
    label: &str,
    own_row: bool,
) -> Option<&'a Solution> {
    let reason = match &app.doc().solved {
        Ok(s) => return Some(s),
        Err(reason) => reason,
    };
    let style = app.theme.invalid;
    if own_row {
        put(buf, area.x, area.y, area.width, label, style);
        put(buf, area.x, area.y + 1, area.width, reason, style);
    } else {
        let text = format!("{label} {reason}");
        put(buf, area.x, area.y, area.width, &text, style);
    }
    None
}

/// A bordered block with the theme's border glyphs; the title is highlighted when focused.
#[must_use]
pub fn block<'a>(app: &App, title: Line<'a>, focused: bool) -> Block<'a> {
    let t = &app.theme;
    Block::bordered()
        .border_set(t.glyphs.border)
        .border_style(if focused { t.header } else { t.dim })
        .title(title)
}

/// A centred rectangle of at most `width` x `height` inside `area`, cleared for an overlay.
pub fn overlay(area: Rect, width: u16, height: u16, buf: &mut Buffer) -> Rect {
    let w = width.min(area.width);
    let h = height.min(area.height);
    let rect = Rect::new(
        area.x + (area.width - w) / 2,
        area.y + (area.height - h) / 2,
        w,
        h,
    );
    Clear.render(rect, buf);
    rect
}

/// Whether the cursor is in the given sheet (so that pane shows the selection).
#[must_use]
pub fn focused(app: &App, sheet: Sheet) -> bool {
    app.doc().cursor.sheet == sheet
}
