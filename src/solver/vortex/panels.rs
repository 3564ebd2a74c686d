//! The vortex lattice along the span: panel edges, control points and their sections.
//!
//! Edges are cosine-spaced (evenly spaced in theta, y = y_mid - (b/2) cos theta) piece by piece
//! between hard points (every station, its mirror, the root and every control-surface end), so
//! no panel straddles a kink of the planform or a control edge; control points sit midway in
//! theta between their panel's edges (the lifting-line reference, sec. 6: this placement
//! converges as O(1/N^2), midway in y only as O(1/N)).

use std::f64::consts::PI;

use crate::solver::controls::ControlSpan;
use crate::wing::{Section, Sections, Wing};

/// A point or vector (x aft, y right, z up), m.
pub type Vec3 = [f64; 3];

/// The lattice of one wing.
#[derive(Debug, Clone)]
pub struct Panels {
    /// Panel edges on the quarter-chord line, left tip to right tip (N + 1 points).
    pub edges: Vec<Vec3>,
    /// One per panel, left to right.
    pub points: Vec<ControlPoint>,
}

/// A panel's control point and what the section there needs.
#[derive(Debug, Clone)]
pub struct ControlPoint {
    /// On the panel's bound vortex (quarter-chord line), m.
    pub at: Vec3,
    /// The section there (chord, twist, airfoil).
    pub section: Section,
    /// Unit vector along the bound vortex, left to right.
    pub along: Vec3,
    /// Unit section normal, (0, -l_z, l_y) normalised: up on a flat wing.
    pub normal: Vec3,
    /// Zero-lift shift of the controls there, radians (added to the section's angle).
    pub control_shift: f64,
}

/// Hard points of the lattice, in y: stations (mirrored), the root, control ends, tips.
fn hard_points(wing: &Wing, ends: (f64, f64), controls: &[ControlSpan]) -> Vec<f64> {
    let mut ys: Vec<f64> = wing.stations.iter().map(|s| s.y).collect();
    if wing.symmetric {
        ys.extend(wing.stations.iter().map(|s| -s.y));
    }
    ys.push(0.0);
    ys.extend(controls.iter().flat_map(|c| [c.y_from, c.y_to]));
    ys.extend([ends.0, ends.1]);
    ys.retain(|&y| y >= ends.0 && y <= ends.1);
    ys.sort_by(f64::total_cmp);
    ys.dedup_by(|a, b| (*a - *b).abs() < 1e-9 * (ends.1 - ends.0));
    ys
}

/// Splits `count` panels among pieces of the given widths in proportion (largest remainder),
/// each piece at least one.
fn share(widths: &[f64], count: usize) -> Vec<usize> {
    let total: f64 = widths.iter().sum();
    let count = count.max(widths.len());
    let spare = (count - widths.len()) as f64;
    let ideal: Vec<f64> = widths.iter().map(|w| spare * w / total).collect();
    let mut out: Vec<usize> = ideal.iter().map(|v| 1 + v.floor() as usize).collect();
    let mut left = count - out.iter().sum::<usize>();
    let mut order: Vec<usize> = (0..widths.len()).collect();
    order.sort_by(|&a, &b| (ideal[b] - ideal[b].floor()).total_cmp(&(ideal[a] - ideal[a].floor())));
    for i in order {
        if left == 0 {
            break;
        }
        out[i] += 1;
        left -= 1;
    }
    out
}

/// Edge angles theta (0 at the left tip, pi at the right), about `panels` of them, evenly
/// spaced within each piece between hard points. A mirrored wing gets exactly mirrored edges.
fn edge_angles(hard_thetas: &[f64], panels: usize, mirrored: bool) -> Vec<f64> {
    let widths: Vec<f64> = hard_thetas.windows(2).map(|p| p[1] - p[0]).collect();
    let counts = if mirrored {
        // Share the right half and mirror it, so both halves match exactly.
        let half = widths.len() / 2;
        let right = share(&widths[half..], panels.div_ceil(2));
        right.iter().rev().chain(&right).copied().collect()
    } else {
        share(&widths, panels)
    };
    let mut out = vec![hard_thetas[0]];
    for (pair, &k) in hard_thetas.windows(2).zip(&counts) {
        let step = (pair[1] - pair[0]) / k as f64;
        out.extend((1..=k).map(|m| {
            if m == k {
                pair[1]
            } else {
                pair[0] + m as f64 * step
            }
        }));
    }
    if mirrored {
        let n = out.len();
        for i in 0..n / 2 {
            out[n - 1 - i] = PI - out[i];
        }
    }
    out
}

/// Leading-edge height z at y, linear between stations, mirrored for a symmetric wing.
fn height_at(wing: &Wing, y: f64) -> f64 {
    let y = if wing.symmetric { y.abs() } else { y };
    let (upper, t) = crate::wing::bracket(&wing.stations, |s| s.y, y);
    let (a, b) = (&wing.stations[upper - 1], &wing.stations[upper]);
    a.z + (b.z - a.z) * t
}

/// The quarter-chord point at y, m.
fn quarter_chord(wing: &Wing, sections: &Sections, y: f64) -> Vec3 {
    let s = sections.at(y);
    [s.x_le + 0.25 * s.chord, y, height_at(wing, y)]
}

impl Panels {
    /// Lays out about `panels` panels on `wing` (more when the hard points need them: every
    /// piece between hard points gets at least one).
    #[must_use]
    pub fn of(wing: &Wing, sections: &Sections, panels: usize, controls: &[ControlSpan]) -> Self {
        let ends = wing.span_ends();
        let (y_mid, half) = (0.5 * (ends.0 + ends.1), 0.5 * (ends.1 - ends.0));
        let theta_of = |y: f64| ((y_mid - y) / half).clamp(-1.0, 1.0).acos();
        let y_of = |theta: f64| y_mid - half * f64::cos(theta);
        let hard: Vec<f64> = hard_points(wing, ends, controls)
            .into_iter()
            .map(theta_of)
            .collect();
        let mirrored = wing.symmetric;
        let thetas = edge_angles(&hard, panels, mirrored);
        let mut ys: Vec<f64> = thetas.iter().map(|&t| y_of(t)).collect();
        if mirrored {
            let n = ys.len();
            for i in 0..n / 2 {
                ys[i] = -ys[n - 1 - i];
            }
            if n % 2 == 1 {
                ys[n / 2] = 0.0;
            }
        }
        let edges: Vec<Vec3> = ys
            .iter()
            .map(|&y| quarter_chord(wing, sections, y))
            .collect();
        let mut middles: Vec<f64> = thetas
            .windows(2)
            .map(|t| y_of(0.5 * (t[0] + t[1])))
            .collect();
        if mirrored {
            let n = middles.len();
            for i in 0..n / 2 {
                middles[i] = -middles[n - 1 - i];
            }
        }
        let points = middles
            .iter()
            .zip(edges.windows(2))
            .map(|(&y, e)| control_point(sections, (e[0], e[1]), y, controls))
            .collect();
        Self { edges, points }
    }

    /// Number of panels.
    #[must_use]
    pub fn len(&self) -> usize {
        self.points.len()
    }

    /// True when there are no panels.
    #[must_use]
    pub fn is_empty(&self) -> bool {
        self.points.is_empty()
    }
}

fn control_point(
    sections: &Sections,
    (a, b): (Vec3, Vec3),
    y: f64,
    controls: &[ControlSpan],
) -> ControlPoint {
    let t = ((y - a[1]) / (b[1] - a[1])).clamp(0.0, 1.0);
    let at = std::array::from_fn(|k| a[k] + t * (b[k] - a[k]));
    let d: Vec3 = std::array::from_fn(|k| b[k] - a[k]);
    let length = norm(d);
    let along = d.map(|v| v / length);
    let n = [0.0, -along[2], along[1]];
    let normal = n.map(|v| v / norm(n));
    let control_shift = controls
        .iter()
        .filter(|c| c.y_from <= y && y <= c.y_to)
        .map(|c| c.alpha_increase)
        .sum();
    ControlPoint {
        at,
        section: sections.at(y),
        along,
        normal,
        control_shift,
    }
}

/// Euclidean length.
#[must_use]
pub fn norm(v: Vec3) -> f64 {
    dot(v, v).sqrt()
}

/// Dot product.
#[must_use]
pub fn dot(a: Vec3, b: Vec3) -> f64 {
    a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
}

/// Cross product.
#[must_use]
pub fn cross(a: Vec3, b: Vec3) -> Vec3 {
    [
        a[1] * b[2] - a[2] * b[1],
        a[2] * b[0] - a[0] * b[2],
        a[0] * b[1] - a[1] * b[0],
    ]
}
