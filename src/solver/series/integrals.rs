//! Spanwise integrals of the load, as polynomials in the angle of attack.
//!
//! Because every A_n is linear in alpha, the local c*cl and alpha_i are linear in alpha and
//! the profile drag, induced yaw and bending moment are polynomials of degree two at most.
//! Their coefficients are integrated once per geometry, so an alpha sweep costs almost nothing.

use std::f64::consts::PI;

use super::fourier::{load_weights, parity_sums, SpanMap};
use crate::wing::{Section, Sections};

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
}

/// The integrals a solution needs, each as a polynomial in alpha.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct LoadIntegrals {
    /// CDp = (1/S) integral c cd(cl) dy.
    pub cdp: Quadratic,
    /// Profile part of Cn = (1/(S b)) integral c cd(cl) y dy.
    pub cn_profile: Quadratic,
    /// Induced part of Cn = (1/(S b)) integral c cl alpha_i y dy, in closed form.
    pub cn_induced: Quadratic,
    /// sum n A_n^2, so that CDi = pi AR times this (Anderson, *Fundamentals of Aerodynamics*,
    /// eq. 5.61): a sweep point then costs O(1).
    pub induced_sum: Quadratic,
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

/// Sine-series coefficients as two responses: `(at zero alpha, per radian)`.
pub type ResponsePair<'a> = (&'a [f64], &'a [f64]);

/// Integrates the load polynomials of a wing whose sine-series coefficients are
/// A_n(alpha) = `at_zero[n] + alpha * per_alpha[n]`.
///
/// The lift and bending moments of each half and the induced yaw are linear or quadratic
/// forms in the A_n with closed-form weights; the parts of the profile drag that do not
/// depend on the load are integrated exactly station segment by segment. Only the
/// load-dependent part of the section polars (cd1, cd2) needs quadrature, and a mirrored wing
/// evaluates it on the right half only, taking each left node from the same recurrence.
#[must_use]
pub fn integrate(
    sections: &Sections,
    map: SpanMap,
    area: f64,
    responses: ResponsePair,
    control_edges: &[f64],
) -> LoadIntegrals {
    let span = 2.0 * map.half_span;
    let mut out = LoadIntegrals::default();
    let exact = segment_integrals(sections);
    out.mean_lift_slope = exact.lift_slope / area;
    out.cdp.p0 = exact.drag / area;
    out.cn_profile.p0 = exact.drag_moment / (area * span);
    let halves = HalfLoads::of(map, responses);
    out.right_lift = halves.right_lift;
    out.right_moment = halves.right_moment;
    out.left_moment = halves.left_moment;
    out.cn_induced = induced_yaw(map, area, responses);
    out.induced_sum = Quadratic::of_form(weighted_dot, responses);
    if sections
        .rows()
        .iter()
        .any(|s| s.airfoil.cd1 != 0.0 || s.airfoil.cd2 != 0.0)
    {
        let (cdp, cn) = load_dependent_profile_drag(sections, map, responses, control_edges);
        out.cdp.add(cdp, 1.0 / area);
        out.cn_profile.add(cn, 1.0 / (area * span));
    }
    out
}

impl Quadratic {
    fn add(&mut self, other: Self, scale: f64) {
        self.p0 += scale * other.p0;
        self.p1 += scale * other.p1;
        self.p2 += scale * other.p2;
    }

    /// The quadratic form sum_n sum_m w_nm A_n A_m with A = z + alpha p, given the bilinear
    /// form `form(u, v)` = sum w_nm u_n v_m.
    fn of_form(form: impl Fn(&[f64], &[f64]) -> f64, (z, p): ResponsePair) -> Self {
        Self {
            p0: form(z, z),
            p1: form(z, p) + form(p, z),
            p2: form(p, p),
        }
    }

    /// The linear form sum_n w_n A_n with A = z + alpha p.
    fn of_weights(weights: &[f64], (z, p): ResponsePair) -> Self {
        let dot = |a: &[f64]| a.iter().zip(weights).map(|(a, w)| a * w).sum::<f64>();
        Self {
            p0: dot(z),
            p1: dot(p),
            p2: 0.0,
        }
    }
}

/// Integrals over the planform that do not depend on the load, exact on each straight
/// segment (Simpson's rule is exact for the quadratic and cubic integrands).
struct SegmentIntegrals {
    /// integral c a0 dy, m per radian.
    lift_slope: f64,
    /// integral c cd0 dy, m^2.
    drag: f64,
    /// integral c cd0 y dy, m^3.
    drag_moment: f64,
}

fn segment_integrals(sections: &Sections) -> SegmentIntegrals {
    let mut out = SegmentIntegrals {
        lift_slope: 0.0,
        drag: 0.0,
        drag_moment: 0.0,
    };
    let ys = sections.ys();
    let rows = sections.rows();
    for (y, s) in ys.windows(2).zip(rows.windows(2)) {
        let middle = s[0].lerp(&s[1], 0.5);
        let y_mid = 0.5 * (y[0] + y[1]);
        let simpson = |f: &dyn Fn(&Section, f64) -> f64| {
            (y[1] - y[0]) / 6.0 * (f(&s[0], y[0]) + 4.0 * f(&middle, y_mid) + f(&s[1], y[1]))
        };
        out.lift_slope += simpson(&|s, _| s.chord * s.airfoil.lift_slope);
        out.drag += simpson(&|s, _| s.chord * s.airfoil.cd0);
        out.drag_moment += simpson(&|s, y| s.chord * s.airfoil.cd0 * y);
    }
    if sections.symmetric() {
        // The left half mirrors the right: twice the area integrals, no net moment.
        out.lift_slope *= 2.0;
        out.drag *= 2.0;
        out.drag_moment = 0.0;
    }
    out
}

/// Lift and root bending moment of each half, as linear forms in the A_n.
///
/// With c cl = 4 b sum A_n sin(n theta), y = y_mid - (b/2) cos(theta) and
/// dy = (b/2) sin(theta) d(theta), each half's integral is a sum of
/// integral sin(n theta) sin(k theta) d(theta) for k = 1, 2 between the tip and the root
/// angle theta_0, which have closed forms.
struct HalfLoads {
    right_lift: Quadratic,
    right_moment: Quadratic,
    left_moment: Quadratic,
}

impl HalfLoads {
    fn of(map: SpanMap, responses: ResponsePair) -> Self {
        let terms = responses.0.len();
        let h = map.half_span;
        let scale = 8.0 * h * h; // 4 b (b/2)
        let theta_root = map.theta(0.0);
        let sines = multiple_sines(theta_root, terms + 2);
        let mut right_lift = Vec::with_capacity(terms);
        let mut right_moment = Vec::with_capacity(terms);
        let mut left_moment = Vec::with_capacity(terms);
        for n in 1..=terms {
            // Left part [0, theta_0] and right part [theta_0, pi] of each integral.
            let left_1 = sine_product_integral(n, 1, theta_root, &sines);
            let left_2 = 0.5 * sine_product_integral(n, 2, theta_root, &sines);
            let right_1 = sine_product_integral(n, 1, PI, &[]) - left_1;
            let right_2 = 0.5 * sine_product_integral(n, 2, PI, &[]) - left_2;
            right_lift.push(scale * right_1);
            right_moment.push(scale * (map.y_mid * right_1 - h * right_2));
            left_moment.push(-scale * (map.y_mid * left_1 - h * left_2));
        }
        Self {
            right_lift: Quadratic::of_weights(&right_lift, responses),
            right_moment: Quadratic::of_weights(&right_moment, responses),
            left_moment: Quadratic::of_weights(&left_moment, responses),
        }
    }
}

/// sin(m theta) for m = 0..=`count` by the recurrence
/// sin(m theta) = 2 cos(theta) sin((m-1) theta) - sin((m-2) theta).
fn multiple_sines(theta: f64, count: usize) -> Vec<f64> {
    let (sin, cos) = theta.sin_cos();
    let mut out = Vec::with_capacity(count + 1);
    out.push(0.0);
    out.push(sin);
    for m in 2..=count {
        out.push(2.0 * cos * out[m - 1] - out[m - 2]);
    }
    out
}

/// integral_0^theta sin(n t) sin(k t) dt, with `sines`[m] = sin(m theta)
/// (empty when theta = pi, where every sin(m pi) is zero):
/// (1/2)[sin((n-k) theta)/(n-k) - sin((n+k) theta)/(n+k)] for n != k,
/// (1/2)[theta - sin(2 k theta)/(2 k)] for n = k.
fn sine_product_integral(n: usize, k: usize, theta: f64, sines: &[f64]) -> f64 {
    let sine = |m: usize| sines.get(m).copied().unwrap_or(0.0);
    if n == k {
        0.5 * (theta - sine(2 * k) / (2 * k) as f64)
    } else {
        let difference = n.abs_diff(k);
        0.5 * (sine(difference) / difference as f64 - sine(n + k) / (n + k) as f64)
    }
}

/// sum n u_n v_n: the bilinear form behind sum n A_n^2.
fn weighted_dot(u: &[f64], v: &[f64]) -> f64 {
    u.iter()
        .zip(v)
        .enumerate()
        .map(|(i, (a, b))| (i + 1) as f64 * a * b)
        .sum()
}

/// Induced yawing moment in closed form, from the orthogonality of the sines:
/// integral c cl alpha_i dy = pi b^2 sum n A_n^2 and
/// integral c cl alpha_i (y - y_mid) dy = -(pi b^3/4) sum (2n+1) A_n A_{n+1}
/// (from integral_0^pi sin(m t) sin(n t) cos(t) dt = (pi/4)[m = n+1 or m = n-1]; derived in
/// docs/theory.md sec. 5), both over S b.
fn induced_yaw(map: SpanMap, area: f64, responses: ResponsePair) -> Quadratic {
    let span = 2.0 * map.half_span;
    let form = |u: &[f64], v: &[f64]| {
        let drag = weighted_dot(u, v);
        let mut offset = 0.0;
        for i in 0..u.len().saturating_sub(1) {
            offset += (2 * i + 3) as f64 * u[i] * v[i + 1];
        }
        PI * span * span * (map.y_mid * drag - 0.25 * span * offset) / (area * span)
    };
    Quadratic::of_form(form, responses)
}

/// Breakpoints in theta over [`from`, pi]: every station (mirrored on a whole-span range),
/// the root and the control edges, so each piece is smooth; each piece wider than
/// pi / `cells` is split evenly into as few cells as keep them that narrow.
fn breakpoints(
    sections: &Sections,
    map: SpanMap,
    edges: &[f64],
    from: f64,
    cells: usize,
) -> Vec<f64> {
    let mut ys: Vec<f64> = sections.ys().to_vec();
    if sections.symmetric() {
        ys.extend(sections.ys().iter().map(|y| -y));
    }
    ys.push(0.0);
    ys.extend_from_slice(edges);
    let mut hard: Vec<f64> = ys.into_iter().map(|y| map.theta(y)).collect();
    hard.extend([from, PI]);
    hard.retain(|&t| t >= from - 1e-12);
    hard.sort_by(f64::total_cmp);
    hard.dedup_by(|a, b| (*a - *b).abs() < 1e-12);
    let widest = PI / cells as f64;
    let mut out = Vec::with_capacity(hard.len() + cells);
    for pair in hard.windows(2) {
        let (lo, hi) = (pair[0], pair[1]);
        let pieces = ((hi - lo) / widest - 1e-9).ceil().max(1.0);
        let step = (hi - lo) / pieces;
        out.extend((0..pieces as usize).map(|i| lo + i as f64 * step));
    }
    out.extend(hard.last());
    out
}

/// One Gauss node: weight (with dy/dtheta), y, and the section there.
struct Node {
    weight: f64,
    y: f64,
    polar: LoadPolar,
}

/// The section data the load-dependent drag needs: chord and the polar's cd1, cd2.
#[derive(Debug, Clone, Copy)]
struct LoadPolar {
    chord: f64,
    cd1: f64,
    cd2: f64,
}

impl LoadPolar {
    fn of(section: &Section) -> Self {
        Self {
            chord: section.chord,
            cd1: section.airfoil.cd1,
            cd2: section.airfoil.cd2,
        }
    }

    fn lerp(self, other: Self, t: f64) -> Self {
        let mix = |p: f64, q: f64| p + (q - p) * t;
        Self {
            chord: mix(self.chord, other.chord),
            cd1: mix(self.cd1, other.cd1),
            cd2: mix(self.cd2, other.cd2),
        }
    }
}

/// Gauss nodes on the cells between `thetas`, with their `(cos theta, sin theta)`.
///
/// Every station is a breakpoint, so inside a cell the section varies linearly in y: the
/// sections are looked up once per breakpoint and interpolated at the nodes.
fn gauss_nodes(
    sections: &Sections,
    map: SpanMap,
    thetas: &[f64],
) -> (Vec<Node>, Vec<f64>, Vec<f64>) {
    let ends: Vec<(f64, LoadPolar)> = thetas
        .iter()
        .map(|&t| {
            let y = map.y(t);
            (y, LoadPolar::of(&sections.at(y)))
        })
        .collect();
    let count = GAUSS5.len() * thetas.len();
    let mut nodes = Vec::with_capacity(count);
    let mut cosines = Vec::with_capacity(count);
    let mut sines = Vec::with_capacity(count);
    for (pair, end) in thetas.windows(2).zip(ends.windows(2)) {
        let (lo, hi) = (pair[0], pair[1]);
        let ((y_lo, s_lo), (y_hi, s_hi)) = (&end[0], &end[1]);
        let half = 0.5 * (hi - lo);
        for ((_, weight), (sin, cos)) in GAUSS5.into_iter().zip(node_angles(lo, half)) {
            let y = map.y_at_cos(cos);
            let t = if y_hi == y_lo {
                0.0
            } else {
                ((y - y_lo) / (y_hi - y_lo)).clamp(0.0, 1.0)
            };
            nodes.push(Node {
                // dy = (b/2) sin(theta) d(theta)
                weight: weight * half * map.half_span * sin,
                y,
                polar: s_lo.lerp(*s_hi, t),
            });
            cosines.push(cos);
            sines.push(sin);
        }
    }
    (nodes, cosines, sines)
}

/// `(sin, cos)` of the Gauss nodes of the cell centred on `lo + half`: the angle-sum formulas
/// from the centre, with the nodes placed symmetrically, need three sine-cosine pairs, not five.
fn node_angles(lo: f64, half: f64) -> [(f64, f64); 5] {
    let (sin_mid, cos_mid) = (lo + half).sin_cos();
    let offsets: [(f64, f64); 2] = std::array::from_fn(|i| (half * GAUSS5[4 - i].0).sin_cos());
    std::array::from_fn(|i| {
        let (sin_d, cos_d) = match i {
            0 | 1 => (-offsets[i].0, offsets[i].1),
            2 => (0.0, 1.0),
            _ => offsets[4 - i],
        };
        (
            sin_mid * cos_d + cos_mid * sin_d,
            cos_mid * cos_d - sin_mid * sin_d,
        )
    })
}

/// integral c (cd1 cl + cd2 cl^2) dy and the same with a factor y, by composite Gauss
/// quadrature in theta on about N/2 cells split at every station and control edge.
fn load_dependent_profile_drag(
    sections: &Sections,
    map: SpanMap,
    (at_zero, per_alpha): ResponsePair,
    control_edges: &[f64],
) -> (Quadratic, Quadratic) {
    let span = 2.0 * map.half_span;
    let cells = (per_alpha.len() / 2).max(16);
    let mirrored = sections.symmetric();
    let from = if mirrored { map.theta(0.0) } else { 0.0 };
    let thetas = breakpoints(sections, map, control_edges, from, cells);
    let (nodes, cosines, sines) = gauss_nodes(sections, map, &thetas);
    let sums = parity_sums(&load_weights(at_zero, per_alpha), &cosines);
    let mut drag = Quadratic::default();
    let mut moment = Quadratic::default();
    for ((node, sum), sin) in nodes.iter().zip(&sums).zip(&sines) {
        // c*cl = 4 b sum A_n sin(n theta)
        let load = |s: [f64; 2]| (4.0 * span * s[0] * sin, 4.0 * span * s[1] * sin);
        let here = load_dependent_drag(node.polar, load(sum.at_angle()));
        if mirrored {
            // The left node at -y has the same section and weight.
            let there = load_dependent_drag(node.polar, load(sum.at_mirror()));
            drag.add(here, node.weight);
            drag.add(there, node.weight);
            moment.add(here, node.weight * node.y);
            moment.add(there, -node.weight * node.y);
        } else {
            drag.add(here, node.weight);
            moment.add(here, node.weight * node.y);
        }
    }
    (drag, moment)
}

/// c (cd1 cl + cd2 cl^2) = cd1 (c cl) + cd2 (c cl)^2 / c, as a quadratic in alpha, for the
/// local load `ccl` = c cl as (value at zero alpha, value per radian).
fn load_dependent_drag(polar: LoadPolar, ccl: (f64, f64)) -> Quadratic {
    let mut out = Quadratic {
        p0: polar.cd1 * ccl.0,
        p1: polar.cd1 * ccl.1,
        p2: 0.0,
    };
    if polar.chord > 0.0 {
        let k = polar.cd2 / polar.chord;
        out.p0 += k * ccl.0 * ccl.0;
        out.p1 += 2.0 * k * ccl.0 * ccl.1;
        out.p2 += k * ccl.1 * ccl.1;
    }
    out
}
