//! The condition bar: alpha (or target CL), speed and altitude, edited in place; the
//! planform and flight numbers that go with them (AR, S, Mach, Reynolds number) beside.
//!
//! At 80 columns the bar uses short labels (`V` for speed, `alt` for altitude) and closes
//! up the derived numbers before it wraps them onto a second row, so every value and its
//! unit is always shown whole.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::widgets::Widget;

use super::put;
use crate::text::fixed;
use crate::tui::app::{App, Mode};
use crate::tui::cells::{self, Field, Sheet};
use crate::tui::editor::{Editor, Purpose};

/// Least width of a value while it is being edited, so the editor has room to type in.
const EDIT_WIDTH: usize = 9;
/// Most rows the bar takes.
const MAX_ROWS: u16 = 2;

/// One piece of a bar item.
#[derive(Debug, Clone)]
enum Piece {
    /// Plain text in a style.
    Text(String, Style),
    /// An editable value: its column in the condition sheet, the field, its width.
    Value(usize, Field, usize),
}

/// A label, value and unit that stay together on one row.
#[derive(Debug, Clone)]
struct Item {
    pieces: Vec<Piece>,
    /// Whether it is one of the derived (not editable) numbers.
    derived: bool,
}

impl Item {
    fn width(&self) -> usize {
        self.pieces
            .iter()
            .map(|p| match p {
                Piece::Text(t, _) => t.chars().count(),
                Piece::Value(_, _, w) => *w,
            })
            .sum()
    }
}

/// Rows the bar needs at `width` columns (one, or two when it must wrap).
#[must_use]
pub fn height(app: &App, width: u16) -> u16 {
    u16::try_from(layout(app, width).len())
        .unwrap_or(MAX_ROWS)
        .clamp(1, MAX_ROWS)
}

/// Draws the condition bar.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    for (i, row) in layout(app, area.width).iter().enumerate() {
        let y = area.y + u16::try_from(i).unwrap_or(u16::MAX);
        if y >= area.bottom() {
            break;
        }
        let mut x = area.x;
        for (gap, item) in row {
            x = put(
                buf,
                x,
                y,
                area.right().saturating_sub(x),
                &" ".repeat(*gap),
                app.theme.text,
            );
            for piece in &item.pieces {
                let room = area.right().saturating_sub(x);
                x = match piece {
                    Piece::Text(text, style) => put(buf, x, y, room, text, *style),
                    Piece::Value(col, field, w) => {
                        let w = u16::try_from(*w).unwrap_or(u16::MAX).min(room);
                        value(app, *col, *field, Rect::new(x, y, w, 1), buf)
                    }
                };
            }
        }
    }
}

/// The items placed in rows, each with the gap before it: on one row with wide gaps, else
/// with the derived numbers closed up, else wrapped.
fn layout(app: &App, width: u16) -> Vec<Vec<(usize, Item)>> {
    let width = usize::from(width);
    let items = items(app);
    for derived_gap in [2, 1] {
        let row = with_gaps(&items, derived_gap);
        if row.iter().map(|(g, i)| g + i.width()).sum::<usize>() <= width {
            return vec![row];
        }
    }
    wrap(items, width)
}

fn with_gaps(items: &[Item], derived_gap: usize) -> Vec<(usize, Item)> {
    items
        .iter()
        .enumerate()
        .map(|(i, item)| {
            let gap = match (i, item.derived, i > 0 && items[i - 1].derived) {
                (0, _, _) => 0,
                (_, true, true) => derived_gap,
                (_, true, false) => 3,
                _ => 2,
            };
            (gap, item.clone())
        })
        .collect()
}

/// Greedy wrap: the derived numbers start a new row, and any item that would pass the
/// right edge goes on the next row.
fn wrap(items: Vec<Item>, width: usize) -> Vec<Vec<(usize, Item)>> {
    let mut rows: Vec<Vec<(usize, Item)>> = vec![Vec::new()];
    let mut used = 0;
    let mut last_derived = false;
    for item in items {
        let new_group = item.derived && !last_derived;
        last_derived = item.derived;
        let gap = if used == 0 { 0 } else { 2 };
        if used > 0 && (new_group || used + gap + item.width() > width) {
            rows.push(Vec::new());
            used = 0;
        }
        let gap = if used == 0 { 0 } else { 2 };
        used += gap + item.width();
        if let Some(row) = rows.last_mut() {
            row.push((gap, item));
        }
    }
    rows
}

/// The bar's items: the editable condition, then the derived numbers when solved.
fn items(app: &App) -> Vec<Item> {
    let t = &app.theme;
    let doc = app.doc();
    let focus = doc.cursor.sheet == Sheet::Condition;
    let label_style = if focus { t.header } else { t.text };
    let mut out: Vec<Item> = app
        .columns(Sheet::Condition)
        .iter()
        .enumerate()
        .map(|(col, &field)| {
            let name = label(field);
            let unit = match field.unit() {
                "" => String::new(),
                unit => format!(" {unit}"),
            };
            let shown = cells::display(&doc.wing, 0, field).chars().count();
            let width = match editing(app, col) {
                Some(editor) => shown.max(editor.text().chars().count() + 1).max(EDIT_WIDTH),
                None => shown,
            };
            Item {
                pieces: vec![
                    Piece::Text(format!("{name} "), label_style),
                    Piece::Value(col, field, width),
                    Piece::Text(unit, t.dim),
                ],
                derived: false,
            }
        })
        .collect();
    if let Ok(s) = &doc.solved {
        let derived = [
            ("AR", fixed(s.geometry.aspect_ratio, 2), ""),
            ("S", area_text(s.geometry.area), " m2"),
            ("M", fixed(s.flight.mach, 2), ""),
            ("Re", format!("{:.1e}", s.flight.reynolds_mac), ""),
        ];
        out.extend(derived.into_iter().map(|(name, v, unit)| Item {
            pieces: vec![
                Piece::Text(format!("{name} "), t.dim),
                Piece::Text(v, t.text),
                Piece::Text(unit.to_string(), t.dim),
            ],
            derived: true,
        }));
    }
    out
}

/// The wing area with about four significant digits.
fn area_text(area: f64) -> String {
    let digits = match area.abs() {
        a if a >= 100.0 => 1,
        a if a >= 10.0 => 2,
        _ => 3,
    };
    fixed(area, digits)
}

/// A condition value's short name before it (its unit, from the field table, comes after).
const fn label(field: Field) -> &'static str {
    match field {
        Field::Alpha => "alpha",
        Field::TargetCl => "target CL",
        Field::Speed => "V",
        _ => "alt",
    }
}

/// The editor when the condition value in column `col` is being edited.
fn editing(app: &App, col: usize) -> Option<&Editor> {
    let doc = app.doc();
    if doc.cursor.sheet != Sheet::Condition || doc.cursor.col != col {
        return None;
    }
    match &app.mode {
        Mode::Edit(editor)
            if matches!(
                editor.purpose,
                Purpose::Cell {
                    sheet: Sheet::Condition,
                    ..
                }
            ) =>
        {
            Some(editor)
        }
        _ => None,
    }
}

fn value(app: &App, col: usize, field: Field, cell: Rect, buf: &mut Buffer) -> u16 {
    let t = &app.theme;
    if let Some(editor) = editing(app, col) {
        let mut area = editor.area.clone();
        if editor.error.is_some() {
            area.set_style(t.invalid);
        }
        (&area).render(cell, buf);
        return cell.right();
    }
    let doc = app.doc();
    let selected = doc.cursor.sheet == Sheet::Condition && doc.cursor.col == col;
    let text = cells::display(&doc.wing, 0, field);
    let style = if selected { t.selected } else { t.text };
    put(buf, cell.x, cell.y, cell.width, &text, style)
}
