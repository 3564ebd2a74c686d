//! The plots pane: span load with the elliptic load of the same lift (and the reference's),
//! induced angle, and cl/cl_max with the cl_max line, all on one y axis.

use std::f64::consts::PI;

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::text::{Line, Span};
use ratatui::widgets::Widget;

use super::sparkline::{self, Limit};
use super::{block, put};
use crate::solver::Solution;
use crate::text::fixed;
use crate::tui::app::App;

/// Width of the series label at the left of each row.
const LABEL: u16 = 4;

/// One curve to draw.
struct Series {
    label: &'static str,
    values: Vec<Option<f64>>,
    style: Style,
}

/// Draws the plots pane.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let outer = block(
        app,
        Line::from(Span::styled(" spanwise ", app.theme.header)),
        false,
    );
    let inner = outer.inner(area);
    outer.render(area, buf);
    if inner.width <= LABEL + 2 || inner.height < 6 {
        return;
    }
    let Some(s) = super::solution_or_reason(app, inner, buf, "no solution:", true) else {
        return;
    };
    let reference = app.reference.as_ref().and_then(|r| r.solved.as_ref().ok());
    let (y0, y1) = y_range(s, reference);
    let columns = usize::from(inner.width - LABEL);
    let mut loads = vec![
        Series {
            label: "now",
            values: sparkline::sample(&points(s, |p| p.span_load), y0, y1, columns),
            style: app.theme.load,
        },
        Series {
            label: "ell",
            values: elliptic(s, y0, y1, columns),
            style: app.theme.elliptic,
        },
    ];
    if let Some(r) = reference {
        loads.push(Series {
            label: "ref",
            values: sparkline::sample(&points(r, |p| p.span_load), y0, y1, columns),
            style: app.theme.reference,
        });
    }
    let alpha_i = sparkline::sample(&points(s, |p| p.alpha_i_deg), y0, y1, columns);
    // Only where the solver judges the stall: next to a pointed tip cl/cl_max has no limit.
    let judged: Vec<(f64, f64)> = s
        .spanwise
        .iter()
        .filter(|p| p.stall_judged)
        .map(|p| (p.y, p.cl_ratio))
        .collect();
    let ratio = sparkline::sample(&judged, y0, y1, columns);
    // Rows: three titles and the axis, then the curves; cl/cl_max gets the extra rows.
    let curves = inner.height - 4;
    let n = u16::try_from(loads.len()).unwrap_or(3) + 2;
    let per = (curves / (n + 1)).max(1);
    let ratio_rows = curves.saturating_sub(per * (n - 1)).max(2);
    let mut y = inner.y;
    let load_range = joint_range(&loads);
    y = title(
        app,
        inner,
        y,
        ["span load c*cl/c_mean", "span load"],
        load_range,
        buf,
    );
    for series in &loads {
        y = curve(app, inner, y, per, series, load_range, None, buf);
    }
    let ai = Series {
        label: "a_i",
        values: alpha_i,
        style: app.theme.load,
    };
    let ai_range = joint_range(std::slice::from_ref(&ai));
    y = title(app, inner, y, ["alpha_i deg", "a_i deg"], ai_range, buf);
    y = curve(app, inner, y, per, &ai, ai_range, None, buf);
    let cr = Series {
        label: "cl/m",
        values: ratio,
        style: app.theme.load,
    };
    let cr_range = joint_range(std::slice::from_ref(&cr));
    let top = cr_range.map_or(1.25, |(_, hi)| hi.max(1.0) * 1.25);
    let limit = Limit {
        at: 1.0,
        line: app.theme.stall,
        over: app.theme.stall,
    };
    let rows = ratio_rows.min(inner.bottom().saturating_sub(y + 2)).max(1);
    let with_line = format!("cl/cl_max ({}=1)", app.theme.glyphs.limit.repeat(2));
    y = title(app, inner, y, [&with_line, "cl/cl_max"], cr_range, buf);
    y = curve(app, inner, y, rows, &cr, Some((0.0, top)), Some(limit), buf);
    axis(app, s, inner, y.min(inner.bottom() - 1), (y0, y1), buf);
}

fn points(s: &Solution, f: impl Fn(&crate::solver::SpanPoint) -> f64) -> Vec<(f64, f64)> {
    s.spanwise.iter().map(|p| (p.y, f(p))).collect()
}

/// The y range covering this wing and the reference.
fn y_range(s: &Solution, reference: Option<&Solution>) -> (f64, f64) {
    let ends = |s: &Solution| {
        let g = &s.geometry;
        (g.y_mid - 0.5 * g.span, g.y_mid + 0.5 * g.span)
    };
    let (a, b) = ends(s);
    reference.map_or((a, b), |r| {
        let (c, d) = ends(r);
        (a.min(c), b.max(d))
    })
}

/// The elliptic span load of the same CL and span: (4 CL / pi) sqrt(1 - eta^2), since
/// the integral of c*cl/c_mean over the span is CL b.
fn elliptic(s: &Solution, y0: f64, y1: f64, columns: usize) -> Vec<Option<f64>> {
    let g = &s.geometry;
    let half = 0.5 * g.span;
    let step = (y1 - y0) / columns.max(1) as f64;
    (0..columns)
        .map(|i| {
            let eta = (y0 + (i as f64 + 0.5) * step - g.y_mid) / half;
            (eta.abs() <= 1.0).then(|| 4.0 * s.coefficients.cl / PI * (1.0 - eta * eta).sqrt())
        })
        .collect()
}

fn joint_range(series: &[Series]) -> Option<(f64, f64)> {
    let all: Vec<Option<f64>> = series
        .iter()
        .flat_map(|s| s.values.iter().copied())
        .collect();
    sparkline::range(&all)
}

/// A plot's heading: its name, then its min and max right-aligned. The longest wording
/// that fits the width is used, so the numbers are never cut.
fn title(
    app: &App,
    inner: Rect,
    y: u16,
    names: [&str; 2],
    range: Option<(f64, f64)>,
    buf: &mut Buffer,
) -> u16 {
    if y >= inner.bottom() {
        return y;
    }
    let (name, numbers) = heading(names, range, usize::from(inner.width));
    put(buf, inner.x, y, inner.width, &name, app.theme.header);
    let len = u16::try_from(numbers.chars().count()).unwrap_or(u16::MAX);
    let x = inner.right().saturating_sub(len).max(inner.x);
    put(buf, x, y, inner.right() - x, &numbers, app.theme.dim);
    y + 1
}

/// The name and the range text for a heading `width` wide: the full name with "min .. max"
/// where it fits, else the short name, else the short name with "lo..hi", else the range.
#[must_use]
pub fn heading(names: [&str; 2], range: Option<(f64, f64)>, width: usize) -> (String, String) {
    let Some((lo, hi)) = range else {
        return (names[1].to_string(), String::new());
    };
    let long = format!("min {} max {}", short(lo), short(hi));
    let compact = format!("{}..{}", short(lo), short(hi));
    let fits =
        |name: &str, numbers: &str| name.chars().count() + 2 + numbers.chars().count() <= width;
    for numbers in [&long, &compact] {
        for name in names {
            if fits(name, numbers) {
                return (name.to_string(), numbers.clone());
            }
        }
    }
    (String::new(), compact)
}

/// Draws one series `rows` high; the scale starts at zero unless the curve goes negative.
#[allow(
    clippy::too_many_arguments,
    reason = "a drawing helper with plain inputs"
)]
fn curve(
    app: &App,
    inner: Rect,
    y: u16,
    rows: u16,
    series: &Series,
    range: Option<(f64, f64)>,
    limit: Option<Limit>,
    buf: &mut Buffer,
) -> u16 {
    let rows = rows.min(inner.bottom().saturating_sub(y));
    if rows == 0 {
        return y;
    }
    put(
        buf,
        inner.x,
        y + rows - 1,
        LABEL,
        series.label,
        app.theme.dim,
    );
    let (lo, hi) = range.unwrap_or((0.0, 1.0));
    let scale = (
        lo.min(0.0),
        if hi > lo.min(0.0) {
            hi
        } else {
            lo.min(0.0) + 1.0
        },
    );
    if let Some(l) = limit {
        // Name the cl_max line at its row, so it reads even when the heading is short.
        let at = sparkline::level(l.at, scale.0, scale.1, rows);
        let row_from_bottom = at.saturating_sub(1) / 8;
        if at > 0 && row_from_bottom > 0 && row_from_bottom < rows {
            put(
                buf,
                inner.x,
                y + rows - 1 - row_from_bottom,
                LABEL,
                " =1",
                app.theme.dim,
            );
        }
    }
    let area = Rect::new(inner.x + LABEL, y, inner.width - LABEL, rows);
    sparkline::draw(
        buf,
        area,
        &series.values,
        scale,
        series.style,
        limit,
        &app.theme.glyphs,
    );
    y + rows
}

/// The y axis: its ends (unit in the label column) and the first spanwise point to stall. The
/// marker always sits at its own column. When it would cover an end's number, both ends are
/// written together as a range (`-5.00 to 5.00`) on the side away from the marker, so no
/// end is hidden and no number is moved past the marker (where it would read as lying
/// inside the span, or the marker outside it).
fn axis(app: &App, s: &Solution, inner: Rect, y: u16, (y0, y1): (f64, f64), buf: &mut Buffer) {
    let width = inner.width - LABEL;
    let x0 = inner.x + LABEL;
    let dim = app.theme.dim;
    put(buf, inner.x, y, LABEL, "y m", dim);
    let stall = s
        .first_stall
        .and_then(|stall| stall_column(stall.y, (y0, y1), width));
    let (left, right) = (short(y0), short(y1));
    let len = |t: &str| u16::try_from(t.chars().count()).unwrap_or(u16::MAX);
    let right_at = width.saturating_sub(len(&right));
    // One blank column between a number and the marker keeps both readable.
    let left_clear = stall.is_none_or(|col| col > len(&left));
    let right_clear = stall.is_none_or(|col| col + 1 < right_at);
    if left_clear && right_clear {
        put(buf, x0, y, width, &left, dim);
        if right_at > len(&left) {
            put(buf, x0 + right_at, y, len(&right), &right, dim);
        }
    } else if let Some(col) = stall {
        let range = format!("{left} to {right}");
        let room_left = col.saturating_sub(1);
        let room_right = width.saturating_sub(col + 2);
        if !right_clear && len(&range) <= room_left {
            put(buf, x0, y, len(&range), &range, dim);
        } else if !left_clear && len(&range) <= room_right {
            let at = width - len(&range);
            put(buf, x0 + at, y, len(&range), &range, dim);
        }
    }
    if let Some(col) = stall {
        put(buf, x0 + col, y, 1, app.theme.glyphs.stall, app.theme.stall);
    }
}

/// The plot column (0 at the left end) of a spanwise position, `None` off the plot.
#[must_use]
pub fn stall_column(y: f64, (y0, y1): (f64, f64), width: u16) -> Option<u16> {
    let t = (y - y0) / (y1 - y0);
    // Saturating cast of a value already clamped to the plot's columns.
    (0.0..=1.0)
        .contains(&t)
        .then(|| ((t * f64::from(width)).floor() as u16).min(width.saturating_sub(1)))
}

/// A number in at most about six characters.
#[must_use]
pub fn short(v: f64) -> String {
    let a = v.abs();
    if a != 0.0 && !(0.01..10_000.0).contains(&a) {
        format!("{v:.1e}")
    } else if a >= 100.0 {
        fixed(v, 0)
    } else {
        fixed(v, 2)
    }
}
