//! Text sparklines along the span: sampling a spanwise curve into columns and drawing it
//! one or more rows high with eighth-block (or ASCII) levels.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;

use crate::tui::theme::Glyphs;

/// Samples `points` (sorted by y) at the centres of `columns` equal bins over `[y0, y1]`
/// by linear interpolation; columns outside the curve's span are `None`.
#[must_use]
pub fn sample(points: &[(f64, f64)], y0: f64, y1: f64, columns: usize) -> Vec<Option<f64>> {
    let step = (y1 - y0) / columns.max(1) as f64;
    (0..columns)
        .map(|i| interpolate(points, y0 + (i as f64 + 0.5) * step))
        .collect()
}

fn interpolate(points: &[(f64, f64)], y: f64) -> Option<f64> {
    let upper = points.partition_point(|p| p.0 < y);
    if upper == 0 || upper == points.len() {
        // Past the outermost output point but inside the span: hold the end value.
        let tolerance = 0.02 * (points.last()?.0 - points.first()?.0).abs();
        let end = if upper == 0 {
            points.first()
        } else {
            points.last()
        };
        return end.filter(|p| (p.0 - y).abs() < tolerance).map(|p| p.1);
    }
    let (a, b) = (points[upper - 1], points[upper]);
    let t = if b.0 > a.0 {
        (y - a.0) / (b.0 - a.0)
    } else {
        0.0
    };
    Some(a.1 + t * (b.1 - a.1))
}

/// The `(min, max)` of the present values, `None` when there are none.
#[must_use]
pub fn range(values: &[Option<f64>]) -> Option<(f64, f64)> {
    values.iter().flatten().fold(None, |acc, &v| match acc {
        None => Some((v, v)),
        Some((lo, hi)) => Some((lo.min(v), hi.max(v))),
    })
}

/// Eighth-levels of `value` on a scale `[lo, hi]` drawn `rows` high.
#[must_use]
pub fn level(value: f64, lo: f64, hi: f64, rows: u16) -> u16 {
    let full = f64::from(rows) * 8.0;
    let t = if hi > lo {
        (value - lo) / (hi - lo)
    } else {
        0.5
    };
    // Saturating cast of a value already clamped to [0, full].
    (t.clamp(0.0, 1.0) * full).round() as u16
}

/// A line drawn across a plot at a value (the cl_max = 1 line).
#[derive(Debug, Clone, Copy)]
pub struct Limit {
    /// The value.
    pub at: f64,
    /// Style of the line where no bar covers it.
    pub line: Style,
    /// Style of bars that reach or pass it.
    pub over: Style,
}

/// Draws a sparkline `area.height` rows high over `[lo, hi]`.
pub fn draw(
    buf: &mut Buffer,
    area: Rect,
    values: &[Option<f64>],
    (lo, hi): (f64, f64),
    style: Style,
    limit: Option<Limit>,
    glyphs: &Glyphs,
) {
    let rows = area.height;
    let limit_level = limit.map(|l| level(l.at, lo, hi, rows));
    for (i, value) in values.iter().enumerate().take(usize::from(area.width)) {
        let x = area.x + u16::try_from(i).unwrap_or(u16::MAX);
        let Some(v) = value else { continue };
        let filled = level(*v, lo, hi, rows);
        let over = limit.is_some_and(|l| *v >= l.at);
        for k in 0..rows {
            let y = area.bottom() - 1 - k;
            let part = filled.saturating_sub(k * 8).min(8);
            let limit_row = limit_level.is_some_and(|ll| ll > k * 8 && ll <= (k + 1) * 8);
            let (glyph, cell_style) = match (part, limit_row, limit) {
                (0, true, Some(l)) => (glyphs.limit, l.line),
                (p, _, Some(l)) if over && p > 0 => (glyphs.levels[usize::from(p)], l.over),
                (p, _, _) => (glyphs.levels[usize::from(p)], style),
            };
            if let Some(cell) = buf.cell_mut((x, y)) {
                cell.set_symbol(glyph).set_style(cell_style);
            }
        }
    }
}
