//! The table pane: stations (or airfoils, controls) one row each, the selected cell
//! highlighted, an edited cell drawn with the live editor and any refusal beneath it.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::Widget;

use super::{block, fit, focused, put};
use crate::text::inert;
use crate::tui::app::{App, Mode};
use crate::tui::cells::{self, Field, Sheet};
use crate::tui::editor::Purpose;

/// Width of the row-number column.
const INDEX_WIDTH: u16 = 3;

/// The sheet the table pane shows: the focused one, or stations while the condition bar
/// has the focus.
#[must_use]
pub fn sheet(app: &App) -> Sheet {
    match app.doc().cursor.sheet {
        Sheet::Condition => Sheet::Stations,
        s => s,
    }
}

/// The width the pane would like: every column plus borders.
#[must_use]
pub fn width(app: &App) -> u16 {
    let cols: u16 = app.columns(sheet(app)).iter().map(|f| f.width() + 1).sum();
    INDEX_WIDTH + cols + 2
}

/// Draws the table pane.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let sheet = sheet(app);
    let doc = app.doc();
    let is_focused = focused(app, sheet);
    let rows = cells::rows(&doc.wing, sheet);
    let columns = app.columns(sheet);
    let room = area.width.saturating_sub(2 + INDEX_WIDTH);
    let first = first_visible_column(&columns, doc.cursor.col, room);
    let end = visible_end(&columns, first, room);
    let mut title = vec![
        Span::styled(format!(" {} ", sheet.name()), app.theme.header),
        Span::styled(
            format!("{}/{} ", (doc.cursor.row + 1).min(rows), rows),
            app.theme.dim,
        ),
    ];
    if first > 0 || end < columns.len() {
        // Say that there are more columns than shown, and which ones these are.
        title.push(Span::styled(
            format!("cols {}-{} of {} ", first + 1, end, columns.len()),
            app.theme.dim,
        ));
    }
    let outer = block(app, Line::from(title), is_focused);
    let inner = outer.inner(area);
    outer.render(area, buf);
    if inner.width <= INDEX_WIDTH || inner.height < 2 {
        return;
    }
    header(app, &columns[first..], inner, buf);
    let body = inner.height - 1;
    let offset = if doc.cursor.row >= usize::from(body) {
        doc.cursor.row + 1 - usize::from(body)
    } else {
        0
    };
    for (line, row) in (offset..rows).take(usize::from(body)).enumerate() {
        let y = inner.y + 1 + u16::try_from(line).unwrap_or(0);
        draw_row(
            app,
            sheet,
            row,
            &columns,
            first,
            Rect {
                y,
                height: 1,
                ..inner
            },
            buf,
        );
    }
    if rows == 0 {
        put(
            buf,
            inner.x,
            inner.y + 1,
            inner.width,
            "(none: press i to add one)",
            app.theme.dim,
        );
    }
    refusal(app, sheet, offset, inner, buf);
}

/// The first column to draw so the cursor's column fits in `room` columns.
fn first_visible_column(columns: &[Field], cursor: usize, room: u16) -> usize {
    let mut first = 0;
    while first < cursor {
        let used: u16 = columns[first..=cursor.min(columns.len() - 1)]
            .iter()
            .map(|f| f.width() + 1)
            .sum();
        if used <= room {
            break;
        }
        first += 1;
    }
    first
}

/// One past the last column, from `first`, that fits whole in `room` columns.
fn visible_end(columns: &[Field], first: usize, room: u16) -> usize {
    let mut used = 0;
    let mut end = first;
    for field in columns.iter().skip(first) {
        used += field.width() + 1;
        if used > room {
            break;
        }
        end += 1;
    }
    end
}

fn header(app: &App, columns: &[Field], inner: Rect, buf: &mut Buffer) {
    let mut x = put(
        buf,
        inner.x,
        inner.y,
        INDEX_WIDTH,
        &fit("#", 3, true),
        app.theme.header,
    );
    for field in columns {
        if x + 1 + field.width() > inner.right() {
            break;
        }
        let text = format!(
            " {}",
            fit(field.title(), usize::from(field.width()), !field.is_text())
        );
        x = put(
            buf,
            x,
            inner.y,
            inner.right().saturating_sub(x),
            &text,
            app.theme.header,
        );
    }
}

fn draw_row(
    app: &App,
    sheet: Sheet,
    row: usize,
    columns: &[Field],
    first: usize,
    line: Rect,
    buf: &mut Buffer,
) {
    let doc = app.doc();
    let t = &app.theme;
    let index = fit(&(row + 1).to_string(), usize::from(INDEX_WIDTH), true);
    let mut x = put(buf, line.x, line.y, INDEX_WIDTH, &index, t.dim);
    for (col, field) in columns.iter().enumerate().skip(first) {
        let w = field.width();
        // A number cut short would read as another number: draw whole columns only.
        if x + 1 + w > line.right() {
            break;
        }
        x = put(buf, x, line.y, 1, " ", t.text);
        let room = w;
        let selected = focused(app, sheet) && doc.cursor.row == row && doc.cursor.col == col;
        if selected {
            if let Mode::Edit(editor) = &app.mode {
                if matches!(editor.purpose, Purpose::Cell { .. }) {
                    let cell = Rect::new(x, line.y, room, 1);
                    let mut area = editor.area.clone();
                    if editor.error.is_some() {
                        area.set_style(t.invalid);
                    }
                    (&area).render(cell, buf);
                    x += room;
                    continue;
                }
            }
        }
        let text = inert(&cells::display(&doc.wing, row, *field));
        let style = if selected { t.selected } else { t.text };
        x = put(
            buf,
            x,
            line.y,
            room,
            &fit(&text, usize::from(w), !field.is_text()),
            style,
        );
    }
}

/// While an edit is refused, the reason sits on the line under the edited cell.
fn refusal(app: &App, sheet: Sheet, offset: usize, inner: Rect, buf: &mut Buffer) {
    let Mode::Edit(editor) = &app.mode else {
        return;
    };
    let (Purpose::Cell { sheet: s, row, .. }, Some(reason)) = (editor.purpose, &editor.error)
    else {
        return;
    };
    if s != sheet {
        return;
    }
    let line = u16::try_from(row.saturating_sub(offset) + 2).unwrap_or(u16::MAX);
    let y = if line < inner.height {
        inner.y + line
    } else {
        inner.y + 1
    };
    let marker = app.theme.glyphs.refused;
    put(
        buf,
        inner.x,
        y,
        inner.width,
        &fit(
            &format!("{marker}{reason}"),
            usize::from(inner.width),
            false,
        ),
        app.theme.invalid,
    );
}
