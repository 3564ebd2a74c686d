//! The results strip: the integrated numbers, their change against the pinned reference,
//! and the first validity warning.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;

use super::put;
use crate::solver::Solution;
use crate::text::{fixed, inert, signed};
use crate::tui::app::App;

/// One number in the strip.
#[derive(Debug, Clone, PartialEq)]
pub struct Item {
    /// Its name.
    pub label: &'static str,
    /// The value, formatted.
    pub value: String,
    /// Change against the reference, formatted with sign.
    pub delta: Option<String>,
}

/// The strip's items for a solution, with deltas against `reference`.
#[must_use]
pub fn items(s: &Solution, reference: Option<&Solution>) -> Vec<Item> {
    let mut out = Vec::new();
    let c = &s.coefficients;
    let ld =
        |s: &Solution| (s.coefficients.cd > 0.0).then(|| s.coefficients.cl / s.coefficients.cd);
    let mut add = |label, v: Option<f64>, r: Option<f64>, digits: usize, unit: &str| {
        out.push(Item {
            label,
            value: v.map_or_else(|| "n/a".into(), |v| format!("{}{unit}", fixed(v, digits))),
            delta: match (v, r) {
                (Some(v), Some(r)) => Some(signed(v - r, digits)),
                _ => None,
            },
        });
    };
    let rc = reference.map(|r| r.coefficients);
    add("CL", Some(c.cl), rc.map(|r| r.cl), 4, "");
    add("CDi", Some(c.cdi), rc.map(|r| r.cdi), 5, "");
    add("e", c.e, rc.and_then(|r| r.e), 4, "");
    add(
        "CL_a",
        Some(s.cl_alpha),
        reference.map(|r| r.cl_alpha),
        3,
        "/rad",
    );
    add("CD", Some(c.cd), rc.map(|r| r.cd), 5, "");
    add("L/D", ld(s), reference.and_then(ld), 1, "");
    add("Cl_roll", Some(c.cl_roll), rc.map(|r| r.cl_roll), 5, "");
    add("Cn", Some(c.cn), rc.map(|r| r.cn), 5, "");
    add(
        "alpha",
        Some(c.alpha_deg),
        rc.map(|r| r.alpha_deg),
        2,
        " deg",
    );
    let stall_y = |s: &Solution| s.first_stall.map(|f| f.y);
    let stall_cl = |s: &Solution| s.first_stall.map(|f| f.cl_wing);
    add("stall y", stall_y(s), reference.and_then(stall_y), 3, " m");
    add("CL_stall", stall_cl(s), reference.and_then(stall_cl), 3, "");
    let m = |s: &Solution| Some(s.flight.right_root_bending_moment);
    add("M_root", m(s), reference.and_then(m), 1, " N m");
    out.push(Item {
        label: "method",
        value: format!("{} {}", s.method.short_name, s.method.resolution),
        delta: None,
    });
    out
}

/// Rows the strip needs: deltas against a reference take a row more.
#[must_use]
pub fn height(app: &App) -> u16 {
    if app.reference.is_some() {
        super::STRIP_HEIGHT + 1
    } else {
        super::STRIP_HEIGHT
    }
}

/// Draws the strip.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    if area.height == 0 {
        return;
    }
    let Some(s) = super::solution_or_reason(app, area, buf, "not solved:", false) else {
        return;
    };
    let reference = app.reference.as_ref().and_then(|r| r.solved.as_ref().ok());
    let delta_mark = t.glyphs.delta;
    let value_rows = area.height - 1;
    let (mut x, mut y) = (area.x, area.y);
    for item in items(s, reference) {
        let delta = item.delta.as_ref().map(|d| format!(" {delta_mark}{d}"));
        let width = item.label.len()
            + 1
            + item.value.chars().count()
            + delta.as_ref().map_or(0, |d| d.chars().count())
            + 3;
        let width = u16::try_from(width).unwrap_or(u16::MAX);
        if x > area.x && x + width > area.right() {
            x = area.x;
            y += 1;
        }
        if y >= area.y + value_rows {
            break;
        }
        x = put(buf, x, y, area.right() - x, item.label, t.dim);
        x = put(
            buf,
            x,
            y,
            area.right().saturating_sub(x),
            &format!(" {}", item.value),
            t.header,
        );
        if let Some(d) = delta {
            x = put(buf, x, y, area.right().saturating_sub(x), &d, t.reference);
        }
        x = put(buf, x, y, area.right().saturating_sub(x), "   ", t.text);
    }
    warnings(s, area, buf, t.warning, t.dim);
}

/// The first (most important) warning, cut to fit with the count of the others kept in view.
fn warnings(s: &Solution, area: Rect, buf: &mut Buffer, warn: Style, dim: Style) {
    let y = area.bottom() - 1;
    let Some(first) = s.warnings.first() else {
        put(
            buf,
            area.x,
            y,
            area.width,
            "no validity warnings for this case",
            dim,
        );
        return;
    };
    let more = match s.warnings.len() - 1 {
        0 => String::new(),
        n => format!(" (+{n} more)"),
    };
    let line = warning_line(&inert(first), &more, usize::from(area.width));
    put(buf, area.x, y, area.width, &line, warn);
}

/// `! warning (+n more)` in at most `width` characters: the warning is cut (marked `..`),
/// never the count.
#[must_use]
pub fn warning_line(warning: &str, more: &str, width: usize) -> String {
    let whole = format!("! {warning}{more}");
    if whole.chars().count() <= width {
        return whole;
    }
    let room = width.saturating_sub(2 + 2 + more.chars().count());
    let cut: String = warning.chars().take(room).collect();
    format!("! {}..{more}", cut.trim_end())
}
