//! Spanwise integrals of the load, as polynomials in the angle of attack.
//!
//! Because every A_n is linear in alpha, the local c*cl and alpha_i are linear in alpha and
//! the profile drag, induced yaw and bending moment are polynomials of degree two at most.
//! Their coefficients are integrated once per geometry, so an alpha sweep costs almost nothing.

use super::fourier::{pair_sums, SpanMap};
use crate::wing::Wing;

/// p0 + p1 alpha + p2 alpha^2 (alpha in radians).
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Quadratic {
    /// Constant term.
    pub p0: f64,
    /// Linear term.
    pub p1: f64,
    /// Quadratic term.
    pub p2: f64,
}

impl Quadratic {
    /// Value at `alpha` (radians).
    #[must_use]
    pub fn at(self, alpha: f64) -> f64 {
        self.p0 + alpha * (self.p1 + alpha * self.p2)
    }

    fn add_product(&mut self, w: f64, (u0, u1): (f64, f64), (v0, v1): (f64, f64)) {
        self.p0 += w * u0 * v0;
        self.p1 += w * (u0 * v1 + u1 * v0);
        self.p2 += w * u1 * v1;
    }
}

/// The integrals a solution needs, each as a polynomial in alpha.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct LoadIntegrals {
    /// CDp = (1/S) integral c cd(cl) dy.
    pub cdp: Quadratic,
    /// Profile part of Cn = (1/(S b)) integral c cd(cl) y dy.
    pub cn_profile: Quadratic,
    /// Induced part of Cn = (1/(S b)) integral c cl alpha_i y dy.
    pub cn_induced: Quadratic,
    /// CDi by quadrature, (1/S) integral c cl alpha_i dy (a check on pi AR sum n A_n^2).
    pub cdi: Quadratic,
    /// Right-half root bending moment over q, integral_0^tip c cl y dy, m^3.
    pub right_moment: Quadratic,
    /// Left-half root bending moment over q, -integral_tip^0 c cl y dy, m^3.
    pub left_moment: Quadratic,
    /// Right-half lift over q, integral_0^tip c cl dy, m^2.
    pub right_lift: Quadratic,
    /// (1/S) integral c a0 dy: the area-weighted section lift slope, per radian.
    pub mean_lift_slope: f64,
}

/// Five-point Gauss-Legendre nodes and weights on [-1, 1]
/// (Abramowitz & Stegun, *Handbook of Mathematical Functions*, 1964, table 25.4).
const GAUSS5: [(f64, f64); 5] = [
    (-0.906_179_845_938_664, 0.236_926_885_056_189_1),
    (-0.538_469_310_105_683_1, 0.478_628_670_499_366_5),
    (0.0, 0.568_888_888_888_888_9),
    (0.538_469_310_105_683_1, 0.478_628_670_499_366_5),
    (0.906_179_845_938_664, 0.236_926_885_056_189_1),
];

/// Breakpoints in theta: the tips, every station (mirrored), the root and control edges,
/// with cells no wider than pi / `cells`, so each piece is smooth.
fn breakpoints(wing: &Wing, map: SpanMap, edges: &[f64], cells: usize) -> Vec<f64> {
    let mut ys: Vec<f64> = wing.stations.iter().map(|s| s.y).collect();
    if wing.symmetric {
        ys.extend(wing.stations.iter().map(|s| -s.y));
    }
    ys.push(0.0);
    ys.extend_from_slice(edges);
    let mut thetas: Vec<f64> = ys.into_iter().map(|y| map.theta(y)).collect();
    let step = std::f64::consts::PI / cells as f64;
    thetas.extend((0..=cells).map(|i| i as f64 * step));
    thetas.sort_by(f64::total_cmp);
    thetas.dedup_by(|a, b| (*a - *b).abs() < 1e-12);
    thetas
}

/// The section properties the integrals need, at one point.
#[derive(Debug, Clone, Copy)]
struct Local {
    chord: f64,
    lift_slope: f64,
    cd0: f64,
    cd1: f64,
    cd2: f64,
}

impl Local {
    fn at(wing: &Wing, y: f64) -> Self {
        let s = wing.section_at(y);
        Self {
            chord: s.chord,
            lift_slope: s.airfoil.lift_slope,
            cd0: s.airfoil.cd0,
            cd1: s.airfoil.cd1,
            cd2: s.airfoil.cd2,
        }
    }

    /// Linear interpolation, fraction `t` of the way from `self` to `other`.
    fn lerp(self, other: Self, t: f64) -> Self {
        let mix = |p: f64, q: f64| p + (q - p) * t;
        Self {
            chord: mix(self.chord, other.chord),
            lift_slope: mix(self.lift_slope, other.lift_slope),
            cd0: mix(self.cd0, other.cd0),
            cd1: mix(self.cd1, other.cd1),
            cd2: mix(self.cd2, other.cd2),
        }
    }
}

/// Integrates the load polynomials for the responses `per_alpha` and `at_zero`.
///
/// Every station (and its mirror) is a breakpoint, so inside a cell the section varies
/// linearly in y: the sections are looked up once per breakpoint and interpolated at the
/// Gauss nodes, which gives the same values as looking each node up.
#[must_use]
pub fn integrate(
    wing: &Wing,
    map: SpanMap,
    area: f64,
    per_alpha: &[f64],
    at_zero: &[f64],
    control_edges: &[f64],
) -> LoadIntegrals {
    let span = 2.0 * map.half_span;
    let cells = (per_alpha.len() / 2).max(16);
    let thetas = breakpoints(wing, map, control_edges, cells);
    let ends: Vec<(f64, Local)> = thetas
        .iter()
        .map(|&t| {
            let y = map.y(t);
            (y, Local::at(wing, y))
        })
        .collect();
    let mut nodes = Vec::with_capacity(GAUSS5.len() * thetas.len());
    let mut angles = Vec::with_capacity(GAUSS5.len() * thetas.len());
    for (pair, end) in thetas.windows(2).zip(ends.windows(2)) {
        let (lo, hi) = (pair[0], pair[1]);
        let ((y_lo, s_lo), (y_hi, s_hi)) = (end[0], end[1]);
        let half = 0.5 * (hi - lo);
        for (node, weight) in GAUSS5 {
            let theta = lo + half * (1.0 + node);
            let (sin, cos) = theta.sin_cos();
            let y = map.y_at_cos(cos);
            let t = if y_hi == y_lo {
                0.0
            } else {
                ((y - y_lo) / (y_hi - y_lo)).clamp(0.0, 1.0)
            };
            // dy = (b/2) sin(theta) d(theta)
            let w = weight * half * map.half_span * sin;
            nodes.push((w, y, s_lo.lerp(s_hi, t)));
            angles.push((cos, sin));
        }
    }
    let sums = pair_sums(at_zero, per_alpha, &angles);
    let mut out = LoadIntegrals::default();
    for (&(w, y, section), sum) in nodes.iter().zip(&sums) {
        // c*cl = 4 b sum A_n sin(n theta)
        let ccl = (4.0 * span * sum.load.0, 4.0 * span * sum.load.1);
        add_point(&mut out, (w, y), section, ccl, sum.induced, (area, span));
    }
    out
}

fn add_point(
    out: &mut LoadIntegrals,
    (w, y): (f64, f64),
    section: Local,
    ccl: (f64, f64),
    induced: (f64, f64),
    (area, span): (f64, f64),
) {
    let c = section.chord;
    // c*cd = c cd0 + cd1 (c cl) + cd2 (c cl)^2 / c
    let ccd_linear = (c * section.cd0 + section.cd1 * ccl.0, section.cd1 * ccl.1);
    let mut profile = Quadratic {
        p0: ccd_linear.0,
        p1: ccd_linear.1,
        p2: 0.0,
    };
    if c > 0.0 {
        profile.add_product(section.cd2 / c, ccl, ccl);
    }
    for (target, scale) in [
        (&mut out.cdp, w / area),
        (&mut out.cn_profile, w * y / (area * span)),
    ] {
        target.p0 += scale * profile.p0;
        target.p1 += scale * profile.p1;
        target.p2 += scale * profile.p2;
    }
    out.cn_induced
        .add_product(w * y / (area * span), ccl, induced);
    out.cdi.add_product(w / area, ccl, induced);
    if y >= 0.0 {
        out.right_moment.add_product(w * y, ccl, (1.0, 0.0));
        out.right_lift.add_product(w, ccl, (1.0, 0.0));
    } else {
        out.left_moment.add_product(-w * y, ccl, (1.0, 0.0));
    }
    out.mean_lift_slope += w * c * section.lift_slope / area;
}
