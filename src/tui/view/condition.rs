//! The condition bar: alpha (or target CL), speed and altitude, edited in place; the
//! planform and flight numbers that go with them to the right.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::widgets::Widget;

use super::put;
use crate::text::fixed;
use crate::tui::app::{App, Mode};
use crate::tui::cells::{self, Field, Sheet};
use crate::tui::editor::Purpose;

/// Width of each value.
const VALUE_WIDTH: u16 = 9;

/// Draws the condition bar.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    let doc = app.doc();
    let focus = doc.cursor.sheet == Sheet::Condition;
    let label_style = if focus { t.header } else { t.dim };
    let mut x = put(buf, area.x, area.y, area.width, "condition ", label_style);
    for (col, field) in app.columns(Sheet::Condition).iter().enumerate() {
        let (name, unit) = label_and_unit(*field);
        x = put(buf, x, area.y, area.right().saturating_sub(x), name, t.text);
        x = put(buf, x, area.y, area.right().saturating_sub(x), " ", t.text);
        let selected = focus && doc.cursor.col == col;
        x = value(
            app,
            *field,
            selected,
            Rect::new(
                x,
                area.y,
                VALUE_WIDTH.min(area.right().saturating_sub(x)),
                1,
            ),
            buf,
        );
        x = put(buf, x, area.y, area.right().saturating_sub(x), unit, t.dim);
    }
    if let Ok(s) = &doc.solved {
        let extra = format!(
            "   AR {}  S {} m2  M {}  Re {:.2e}",
            fixed(s.geometry.aspect_ratio, 2),
            fixed(s.geometry.area, 3),
            fixed(s.flight.mach, 3),
            s.flight.reynolds_mac
        );
        put(
            buf,
            x,
            area.y,
            area.right().saturating_sub(x),
            &extra,
            t.dim,
        );
    }
}

/// A condition value's name before it and its unit after it.
const fn label_and_unit(field: Field) -> (&'static str, &'static str) {
    match field {
        Field::Alpha => (" alpha", " deg"),
        Field::TargetCl => (" target CL", ""),
        Field::Speed => (" speed", " m/s"),
        _ => (" altitude", " m"),
    }
}

fn value(app: &App, field: Field, selected: bool, cell: Rect, buf: &mut Buffer) -> u16 {
    let t = &app.theme;
    if selected {
        if let Mode::Edit(editor) = &app.mode {
            if matches!(
                editor.purpose,
                Purpose::Cell {
                    sheet: Sheet::Condition,
                    ..
                }
            ) {
                let mut area = editor.area.clone();
                if editor.error.is_some() {
                    area.set_style(t.invalid);
                }
                (&area).render(cell, buf);
                return cell.right();
            }
        }
    }
    let text = cells::display(&app.doc().wing, 0, field);
    let style = if selected { t.selected } else { t.text };
    put(buf, cell.x, cell.y, cell.width, &text, style)
}
