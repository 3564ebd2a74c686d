//! Spar loads at a load factor: the lift that carries N times the weight, less the wing's own
//! weight at the same load factor (inertia relief), integrated into shear force and bending
//! moment along each half.
//!
//! Shear S(y) = integral_y^tip p dy' and bending M(y) = integral_y^tip p (y' - y) dy' with
//! p = l - N g m' the net upward load per unit span (beam statics, any strength-of-materials
//! text; common practice, no single source). The aerodynamic part is integrated from the
//! solution's spanwise circulation, l = rho V Gamma (Kutta-Joukowski), in the angle
//! y = y_mid - (b/2) cos(theta), where the load is smooth up to the tips; the inertia part is
//! integrated exactly over the piecewise-linear chords.

use super::{at_cl, DesignError, SolveFn};
use crate::atmosphere::{self, G0};
use crate::solver::Solution;
use crate::wing::{Geometry, Wing};

/// How the wing's own mass is spread along the span.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MassDistribution {
    /// The same mass per metre of span everywhere.
    Uniform,
    /// Mass per metre proportional to the local chord.
    Chord,
}

/// The load case: aircraft mass, load factor and the wing's own mass.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LoadCase {
    /// Aircraft mass, kg (the wing's included).
    pub mass_kg: f64,
    /// Load factor N (lift over weight).
    pub load_factor: f64,
    /// Wing mass, kg, relieving the lift at the same load factor.
    pub wing_mass_kg: f64,
    /// How the wing mass is spread.
    pub distribution: MassDistribution,
}

/// Shear and bending at one spanwise position.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LoadRow {
    /// Position, m.
    pub y: f64,
    /// Net upward load outboard of `y`, N.
    pub shear: f64,
    /// Bending moment of the load outboard of `y` about `y`, N m (lift up positive on either
    /// half).
    pub bending: f64,
}

/// The spar loads of one case.
#[derive(Debug, Clone)]
pub struct SparLoads {
    /// The solution at the lift coefficient that carries the case.
    pub solution: Solution,
    /// Right-half root shear, N.
    pub root_shear: f64,
    /// Right-half root bending moment, N m.
    pub root_bending: f64,
    /// Left-half root shear, N.
    pub left_root_shear: f64,
    /// Left-half root bending moment, N m.
    pub left_root_bending: f64,
    /// Right-half root bending moment the wing's weight removes, N m.
    pub relief_root_bending: f64,
    /// Rows from the left tip to the right tip, the root included.
    pub rows: Vec<LoadRow>,
}

/// The lift coefficient that carries N m g at dynamic pressure `q` on area `area`.
#[must_use]
pub fn required_cl(case: &LoadCase, q: f64, area: f64) -> f64 {
    case.load_factor * case.mass_kg * G0 / (q * area)
}

/// Solves the wing at the lift coefficient the case needs (at the wing's condition: speed
/// and altitude) and integrates its spar loads.
///
/// # Errors
/// [`DesignError::Impossible`] for a bad case or a lift coefficient beyond the first-stall
/// CL; solver errors as they come.
pub fn spar_loads(wing: &Wing, case: &LoadCase, solve: SolveFn) -> Result<SparLoads, DesignError> {
    check_case(case)?;
    let air = atmosphere::at(wing.condition.altitude);
    let q = 0.5 * air.density * wing.condition.speed.powi(2);
    let area = Geometry::of(wing).area;
    let cl = required_cl(case, q, area);
    let solution = solve(wing, &at_cl(wing, cl))?;
    if let Some(stall) = solution.first_stall {
        if cl > stall.cl_wing {
            return Err(DesignError::Impossible(format!(
                "carrying {} x {} kg at {} m/s needs CL {}, beyond the wing's CL_max {} \
                 (first stall at y = {} m): fly faster or lower the load factor",
                case.load_factor,
                case.mass_kg,
                wing.condition.speed,
                crate::text::fixed(cl, 3),
                crate::text::fixed(stall.cl_wing, 3),
                crate::text::fixed(stall.y, 3)
            )));
        }
    }
    Ok(integrate(wing, solution, case))
}

fn check_case(case: &LoadCase) -> Result<(), DesignError> {
    let bad = |what: &str, v: f64| {
        Err(DesignError::Impossible(format!(
            "{what} must be a finite number > 0 (got {v})"
        )))
    };
    if !(case.mass_kg.is_finite() && case.mass_kg > 0.0) {
        return bad("--mass", case.mass_kg);
    }
    if !case.load_factor.is_finite() || case.load_factor == 0.0 {
        return Err(DesignError::Impossible(format!(
            "--load-factor must be a finite non-zero number (got {})",
            case.load_factor
        )));
    }
    if !(case.wing_mass_kg.is_finite() && (0.0..=case.mass_kg).contains(&case.wing_mass_kg)) {
        return Err(DesignError::Impossible(format!(
            "--wing-mass must be between 0 and --mass {} (got {})",
            case.mass_kg, case.wing_mass_kg
        )));
    }
    Ok(())
}

/// Shear and bending of a solved wing under `case`.
#[must_use]
pub fn integrate(wing: &Wing, solution: Solution, case: &LoadCase) -> SparLoads {
    let nodes = Nodes::of(&solution);
    let relief = Relief::of(wing, case, &solution.geometry);
    let root = nodes.ys[nodes.root];
    let (right_f0, right_f1) = nodes.cumulative_right();
    let (left_f0, left_f1) = nodes.cumulative_left();
    let rows: Vec<LoadRow> = nodes
        .ys
        .iter()
        .enumerate()
        .map(|(i, &y)| {
            let (r0, r1) = relief.outboard(y, root);
            if i >= nodes.root {
                LoadRow {
                    y,
                    shear: right_f0[i] - r0,
                    bending: right_f1[i] - y * right_f0[i] - r1,
                }
            } else {
                LoadRow {
                    y,
                    shear: left_f0[i] - r0,
                    bending: y * left_f0[i] - left_f1[i] - r1,
                }
            }
        })
        .collect();
    let right = rows[nodes.root];
    let left_relief = relief.left_of_root(root);
    let i = nodes.root;
    let left_shear = left_f0[i] - left_relief.0;
    let left_bending = root * left_f0[i] - left_f1[i] - left_relief.1;
    SparLoads {
        root_shear: right.shear,
        root_bending: right.bending,
        left_root_shear: left_shear,
        left_root_bending: left_bending,
        relief_root_bending: relief.outboard(root, root).1,
        rows,
        solution,
    }
}

/// The spanwise load at quadrature nodes in theta, the tips and the root included.
struct Nodes {
    thetas: Vec<f64>,
    ys: Vec<f64>,
    /// dF/dtheta of the shear integral: l (b/2) sin(theta), N per radian.
    load: Vec<f64>,
    /// Index of the root node.
    root: usize,
}

impl Nodes {
    fn of(s: &Solution) -> Self {
        let half = 0.5 * s.geometry.span;
        let y_mid = s.geometry.y_mid;
        let theta_of = |y: f64| (-(y - y_mid) / half).clamp(-1.0, 1.0).acos();
        let rho_v = s.flight.air.density * s.flight.speed;
        let mut points: Vec<(f64, f64)> = s
            .spanwise
            .iter()
            .map(|p| {
                let t = theta_of(p.y);
                (t, rho_v * p.gamma * half * t.sin())
            })
            .collect();
        points.push((0.0, 0.0));
        points.push((std::f64::consts::PI, 0.0));
        points.sort_by(|a, b| a.0.total_cmp(&b.0));
        points.dedup_by(|a, b| (a.0 - b.0).abs() < 1e-14);
        let (left, right) = (y_mid - half, y_mid + half);
        let root_theta = theta_of(0.0_f64.clamp(left, right));
        let root = points.partition_point(|p| p.0 < root_theta - 1e-12);
        if points
            .get(root)
            .is_none_or(|p| (p.0 - root_theta).abs() > 1e-12)
        {
            let value = interpolate(&points, root_theta);
            points.insert(root, (root_theta, value));
        }
        let thetas: Vec<f64> = points.iter().map(|p| p.0).collect();
        Self {
            ys: thetas.iter().map(|t| y_mid - half * t.cos()).collect(),
            load: points.iter().map(|p| p.1).collect(),
            thetas,
            root,
        }
    }

    /// integral_{node}^{right tip} of (load, load y) dtheta for every node from the root out.
    fn cumulative_right(&self) -> (Vec<f64>, Vec<f64>) {
        let n = self.thetas.len();
        let (mut f0, mut f1) = (vec![0.0; n], vec![0.0; n]);
        for i in (self.root..n - 1).rev() {
            let (a0, a1) = self.interval(i);
            f0[i] = f0[i + 1] + a0;
            f1[i] = f1[i + 1] + a1;
        }
        (f0, f1)
    }

    /// integral_{left tip}^{node} of (load, load y) dtheta for every node up to the root.
    fn cumulative_left(&self) -> (Vec<f64>, Vec<f64>) {
        let n = self.thetas.len();
        let (mut f0, mut f1) = (vec![0.0; n], vec![0.0; n]);
        for i in 1..=self.root {
            let (a0, a1) = self.interval(i - 1);
            f0[i] = f0[i - 1] + a0;
            f1[i] = f1[i - 1] + a1;
        }
        (f0, f1)
    }

    /// The integrals of load and load * y over [theta_i, theta_(i+1)]: the mean of the two
    /// quadratics through this interval and a neighbour node (one where only one exists),
    /// which is fourth-order on an even grid.
    fn interval(&self, i: usize) -> (f64, f64) {
        let n = self.thetas.len();
        let mut sums = (0.0, 0.0);
        let mut count = 0.0;
        for start in [i.checked_sub(1), (i + 2 < n).then_some(i)]
            .into_iter()
            .flatten()
        {
            let idx = [start, start + 1, start + 2];
            let x = idx.map(|k| self.thetas[k]);
            let f = idx.map(|k| self.load[k]);
            let g = idx.map(|k| self.load[k] * self.ys[k]);
            let (a, b) = (self.thetas[i], self.thetas[i + 1]);
            sums.0 += quadratic_integral(x, f, a, b);
            sums.1 += quadratic_integral(x, g, a, b);
            count += 1.0;
        }
        if count == 0.0 {
            let h = self.thetas[i + 1] - self.thetas[i];
            let g = |k: usize| self.load[k] * self.ys[k];
            return (
                0.5 * h * (self.load[i] + self.load[i + 1]),
                0.5 * h * (g(i) + g(i + 1)),
            );
        }
        (sums.0 / count, sums.1 / count)
    }
}

/// integral_a^b of the quadratic through (x_k, f_k), by three-point Gauss-Legendre (exact
/// for a quadratic).
fn quadratic_integral(x: [f64; 3], f: [f64; 3], a: f64, b: f64) -> f64 {
    let lagrange = |t: f64| {
        (0..3)
            .map(|k| {
                let mut w = f[k];
                for j in 0..3 {
                    if j != k {
                        w *= (t - x[j]) / (x[k] - x[j]);
                    }
                }
                w
            })
            .sum::<f64>()
    };
    let (mid, half) = (0.5 * (a + b), 0.5 * (b - a));
    let r = (0.6_f64).sqrt();
    half * (5.0 * lagrange(mid - half * r) + 8.0 * lagrange(mid) + 5.0 * lagrange(mid + half * r))
        / 9.0
}

/// The cubic through the four nodes around `theta` (fewer near the ends), evaluated there.
fn interpolate(points: &[(f64, f64)], theta: f64) -> f64 {
    let upper = points.partition_point(|p| p.0 < theta);
    let start = upper.saturating_sub(2).min(points.len().saturating_sub(4));
    let window = &points[start..(start + 4).min(points.len())];
    window
        .iter()
        .enumerate()
        .map(|(k, &(xk, fk))| {
            window
                .iter()
                .enumerate()
                .filter(|&(j, _)| j != k)
                .fold(fk, |w, (_, &(xj, _))| w * (theta - xj) / (xk - xj))
        })
        .sum()
}

/// The wing's weight at the load factor, as load per unit span.
struct Relief<'a> {
    wing: &'a Wing,
    /// N g times the mass per metre (uniform) or per square metre of planform (chord).
    scale: f64,
    distribution: MassDistribution,
    ends: (f64, f64),
}

impl<'a> Relief<'a> {
    fn of(wing: &'a Wing, case: &LoadCase, g: &Geometry) -> Self {
        let per = match case.distribution {
            MassDistribution::Uniform => g.span,
            MassDistribution::Chord => g.area,
        };
        Self {
            wing,
            scale: case.load_factor * G0 * case.wing_mass_kg / per,
            distribution: case.distribution,
            ends: wing.span_ends(),
        }
    }

    /// Mass weighting at y: 1 (uniform) or the chord.
    fn weight(&self, y: f64) -> f64 {
        match self.distribution {
            MassDistribution::Uniform => 1.0,
            MassDistribution::Chord => self.wing.section_at(y).chord,
        }
    }

    /// (shear, bending) of the relief outboard of `y`: toward the right tip when `y` is at or
    /// right of the root, toward the left tip otherwise.
    fn outboard(&self, y: f64, root: f64) -> (f64, f64) {
        if y >= root {
            self.integral(y, self.ends.1, y)
        } else {
            let (s, m) = self.integral(self.ends.0, y, y);
            (s, -m)
        }
    }

    /// (shear, bending) of the relief on the left half at the root.
    fn left_of_root(&self, root: f64) -> (f64, f64) {
        let (s, m) = self.integral(self.ends.0, root, root);
        (s, -m)
    }

    /// scale * (integral_a^b w dy', integral_a^b w (y' - about) dy'), exact: Simpson's rule on
    /// each piece between station positions (the integrand is at most quadratic there).
    fn integral(&self, a: f64, b: f64, about: f64) -> (f64, f64) {
        if self.scale == 0.0 || b <= a {
            return (0.0, 0.0);
        }
        let mut breaks: Vec<f64> = vec![a, b];
        for s in &self.wing.stations {
            for y in [s.y, -s.y] {
                if y > a && y < b && (self.wing.symmetric || y == s.y) {
                    breaks.push(y);
                }
            }
        }
        if a < 0.0 && b > 0.0 {
            breaks.push(0.0);
        }
        breaks.sort_by(f64::total_cmp);
        let (mut s0, mut s1) = (0.0, 0.0);
        for pair in breaks.windows(2) {
            let (p, r) = (pair[0], pair[1]);
            let m = 0.5 * (p + r);
            let w = [self.weight(p), self.weight(m), self.weight(r)];
            let h6 = (r - p) / 6.0;
            s0 += h6 * (w[0] + 4.0 * w[1] + w[2]);
            s1 += h6 * (w[0] * (p - about) + 4.0 * w[1] * (m - about) + w[2] * (r - about));
        }
        (self.scale * s0, self.scale * s1)
    }
}
