//! Planform quantities computed exactly from the piecewise-linear stations.

use super::Wing;

/// Planform summary of a wing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Geometry {
    /// Span b, m.
    pub span: f64,
    /// Planform area S, m^2.
    pub area: f64,
    /// Aspect ratio b^2/S.
    pub aspect_ratio: f64,
    /// Tip chord over root chord (right tip, root at y = 0).
    pub taper_ratio: f64,
    /// Root chord (at y = 0), m.
    pub root_chord: f64,
    /// Right tip chord, m.
    pub tip_chord: f64,
    /// Mean chord S/b, m.
    pub mean_chord: f64,
    /// Mean aerodynamic chord (1/S) integral c^2 dy, m.
    pub mac: f64,
    /// Spanwise position of the mean aerodynamic chord on the right half, m.
    pub y_mac: f64,
    /// Largest quarter-chord sweep of any segment, degrees (absolute).
    pub max_sweep_deg: f64,
    /// Largest dihedral of any segment, degrees (absolute).
    pub max_dihedral_deg: f64,
    /// Midpoint of the span, m (zero for a mirrored wing).
    pub y_mid: f64,
}

/// One straight segment between two stations: `(y_a, c_a, y_b, c_b)`.
type Segment = (f64, f64, f64, f64);

impl Geometry {
    /// Computes the planform summary. The wing must have at least two stations.
    #[must_use]
    pub fn of(wing: &Wing) -> Self {
        let (left, right) = wing.span_ends();
        let span = right - left;
        let whole = segments(wing, f64::NEG_INFINITY);
        let right_half = segments(wing, 0.0);
        let area: f64 = whole.iter().map(|&s| integral_c(s)).sum();
        let c2: f64 = whole.iter().map(|&s| integral_c2(s)).sum();
        let half_area: f64 = right_half.iter().map(|&s| integral_c(s)).sum();
        let half_moment: f64 = right_half.iter().map(|&s| integral_cy(s)).sum();
        let root_chord = wing.section_at(0.0_f64.clamp(left, right)).chord;
        let tip_chord = wing.stations.last().map_or(0.0, |s| s.chord);
        let (max_sweep_deg, max_dihedral_deg) = max_angles(wing);
        Self {
            span,
            area,
            aspect_ratio: span * span / area,
            taper_ratio: tip_chord / root_chord,
            root_chord,
            tip_chord,
            mean_chord: area / span,
            mac: c2 / area,
            y_mac: if half_area > 0.0 {
                half_moment / half_area
            } else {
                0.0
            },
            max_sweep_deg,
            max_dihedral_deg,
            y_mid: 0.5 * (left + right),
        }
    }
}

/// Straight segments of the whole planform (mirrored if symmetric), clipped to `y >= from`.
fn segments(wing: &Wing, from: f64) -> Vec<Segment> {
    let mut out = Vec::new();
    for pair in wing.stations.windows(2) {
        let (a, b) = (&pair[0], &pair[1]);
        out.push((a.y, a.chord, b.y, b.chord));
        if wing.symmetric {
            out.push((-b.y, b.chord, -a.y, a.chord));
        }
    }
    out.into_iter().filter_map(|s| clip(s, from)).collect()
}

fn clip((ya, ca, yb, cb): Segment, from: f64) -> Option<Segment> {
    if yb <= from {
        return None;
    }
    if ya >= from {
        return Some((ya, ca, yb, cb));
    }
    let t = (from - ya) / (yb - ya);
    Some((from, ca + (cb - ca) * t, yb, cb))
}

/// Exact integral of a linear chord over a segment.
fn integral_c((ya, ca, yb, cb): Segment) -> f64 {
    0.5 * (ca + cb) * (yb - ya)
}

/// Exact integral of the chord squared over a segment.
fn integral_c2((ya, ca, yb, cb): Segment) -> f64 {
    (ca * ca + ca * cb + cb * cb) * (yb - ya) / 3.0
}

/// Exact integral of chord times y over a segment.
fn integral_cy((ya, ca, yb, cb): Segment) -> f64 {
    (2.0 * ca * ya + ca * yb + cb * ya + 2.0 * cb * yb) * (yb - ya) / 6.0
}

fn max_angles(wing: &Wing) -> (f64, f64) {
    let mut sweep: f64 = 0.0;
    let mut dihedral: f64 = 0.0;
    for pair in wing.stations.windows(2) {
        let (a, b) = (&pair[0], &pair[1]);
        let dy = b.y - a.y;
        let dx = (b.x_le + 0.25 * b.chord) - (a.x_le + 0.25 * a.chord);
        sweep = sweep.max(dx.atan2(dy).to_degrees().abs());
        dihedral = dihedral.max((b.z - a.z).atan2(dy).to_degrees().abs());
    }
    (sweep, dihedral)
}
