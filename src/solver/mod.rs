//! The lifting-line solver: a pure function of (wing, condition, options). No I/O, no terminal.
//!
//! [`prepare`] builds and factors the collocation system once per geometry; every angle of
//! attack, target CL or sweep point after that is a back-substitution ([`Prepared::solve`],
//! [`Prepared::sweep`]).

pub mod controls;
pub mod fourier;
pub mod integrals;
mod spanwise;

use std::f64::consts::PI;

use crate::atmosphere;
use crate::wing::validate::{self, Problem};
use crate::wing::{Condition, Geometry, Section, Sections, Wing};
use fourier::SpanMap;
use integrals::LoadIntegrals;

pub use spanwise::SpanPoint;

/// Default number of sine terms, chosen from the convergence study in docs/theory.md.
pub const DEFAULT_TERMS: usize = 60;
/// Fewest terms accepted.
pub const MIN_TERMS: usize = 2;
/// Most terms accepted (the dense factorisation grows as N^3).
pub const MAX_TERMS: usize = 1000;

/// Name of the method, as printed in reports.
pub const METHOD: &str = "Glauert sine series, collocation";

/// Solver settings.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Options {
    /// Number of sine terms (and collocation points).
    pub terms: usize,
}

impl Default for Options {
    fn default() -> Self {
        Self {
            terms: DEFAULT_TERMS,
        }
    }
}

/// Why a wing could not be solved.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SolveError {
    /// The wing or condition breaks a rule (see [`validate::problems`]).
    #[error("{0}")]
    Invalid(Problem),
    /// The term count is outside [`MIN_TERMS`]..=[`MAX_TERMS`].
    #[error("terms: must be between {MIN_TERMS} and {MAX_TERMS} (got {0})")]
    Terms(usize),
    /// The collocation matrix could not be factored.
    #[error("the lifting-line system is singular for this wing")]
    Singular,
    /// A target CL that no angle of attack reaches (zero lift slope).
    #[error("cannot reach CL = {0}: the wing's lift slope is zero")]
    Unreachable(f64),
}

/// A wing with its collocation system factored, ready for any angle of attack.
#[derive(Debug, Clone)]
pub struct Prepared {
    geometry: Geometry,
    per_alpha: Vec<f64>,
    at_zero: Vec<f64>,
    integrals: LoadIntegrals,
    /// Local values at the collocation points, left tip to right tip.
    points: Vec<spanwise::LinearPoint>,
    /// Local values at the wing's stations.
    station_points: Vec<spanwise::LinearPoint>,
    first_stall: Option<FirstStall>,
    warnings: Vec<String>,
}

/// Builds and factors the collocation system of a wing.
///
/// # Errors
/// [`SolveError::Invalid`] for a wing that breaks a rule, [`SolveError::Terms`] for a bad term
/// count, [`SolveError::Singular`] if the system cannot be solved.
pub fn prepare(wing: &Wing, options: Options) -> Result<Prepared, SolveError> {
    if let Some(p) = validate::problems(wing).into_iter().next() {
        return Err(SolveError::Invalid(p));
    }
    let n = options.terms;
    if !(MIN_TERMS..=MAX_TERMS).contains(&n) {
        return Err(SolveError::Terms(n));
    }
    let geometry = Geometry::of(wing);
    let sections = Sections::of(wing);
    let map = SpanMap {
        y_mid: geometry.y_mid,
        half_span: 0.5 * geometry.span,
    };
    let control_spans = controls::spans(&wing.controls);
    let at = CollocationPoints::of(wing, &sections, map, n, &control_spans);
    let responses = fourier::solve_collocation(&at.thetas, &at.mu, &at.rhs, wing.symmetric)
        .ok_or(SolveError::Singular)?;
    let edges: Vec<f64> = control_spans
        .iter()
        .flat_map(|s| [s.y_from, s.y_to])
        .collect();
    let pair = (responses.at_zero.as_slice(), responses.per_alpha.as_slice());
    let integrals = integrals::integrate(&sections, map, geometry.area, pair, &edges);
    let mut warnings = validate::warnings(wing, &geometry);
    warnings.extend(linear_table_notes(wing));
    let scales = (geometry.span, geometry.mean_chord);
    let sums = fourier::collocation_sums(pair.0, pair.1, at.system(wing.symmetric));
    let points = spanwise::linear_points(&at.ys, &at.sections, &sums, scales, &control_spans);
    let station_points = station_points(wing, &sections, map, pair, scales, &control_spans);
    let mut prepared = Prepared {
        geometry,
        per_alpha: responses.per_alpha,
        at_zero: responses.at_zero,
        integrals,
        points,
        station_points,
        first_stall: None,
        warnings,
    };
    prepared.first_stall = prepared.find_first_stall();
    Ok(prepared)
}

/// The collocation points of a wing and the inputs of its system there.
struct CollocationPoints {
    thetas: Vec<f64>,
    /// `(cos theta, sin theta)`.
    angles: Vec<(f64, f64)>,
    ys: Vec<f64>,
    sections: Vec<Section>,
    /// mu_k = 4 b / (a0_k c_k).
    mu: Vec<f64>,
    /// The zero-alpha right-hand side: twist - alpha_L0 + control shift.
    rhs: Vec<f64>,
}

impl CollocationPoints {
    fn of(
        wing: &Wing,
        sections: &Sections,
        map: SpanMap,
        n: usize,
        control_spans: &[controls::ControlSpan],
    ) -> Self {
        let thetas = fourier::collocation_angles(n);
        let angles: Vec<(f64, f64)> = thetas
            .iter()
            .map(|t| {
                let (sin, cos) = t.sin_cos();
                (cos, sin)
            })
            .collect();
        let mut ys: Vec<f64> = angles.iter().map(|&(cos, _)| map.y_at_cos(cos)).collect();
        if wing.symmetric {
            mirror_positions(&mut ys);
        }
        let sections: Vec<Section> = ys.iter().map(|&y| sections.at(y)).collect();
        let span = 2.0 * map.half_span;
        let mu = sections
            .iter()
            .map(|s| 4.0 * span / (s.airfoil.lift_slope * s.chord))
            .collect();
        let mut rhs: Vec<f64> = sections
            .iter()
            .map(|s| s.twist - s.airfoil.alpha_zero_lift_deg.to_radians())
            .collect();
        add_control_shifts(wing.symmetric, map, &thetas, control_spans, &mut rhs);
        Self {
            thetas,
            angles,
            ys,
            sections,
            mu,
            rhs,
        }
    }

    fn system(&self, mirrored: bool) -> fourier::Collocation<'_> {
        fourier::Collocation {
            angles: &self.angles,
            mu: &self.mu,
            rhs: &self.rhs,
            mirrored,
        }
    }
}

/// Adds every control's zero-lift shift to the right-hand side; on a mirrored wing each
/// control's left half (every odd entry of `spans`) is taken as the exact mirror of its right.
fn add_control_shifts(
    mirrored: bool,
    map: SpanMap,
    thetas: &[f64],
    spans: &[controls::ControlSpan],
    rhs: &mut [f64],
) {
    if mirrored {
        for pair in spans.chunks_exact(2) {
            fourier::add_mirrored_control_shift(map, thetas, &pair[0], pair[1].alpha_increase, rhs);
        }
    } else {
        for span in spans {
            fourier::add_control_shift(map, thetas, span, rhs);
        }
    }
}

/// Local values at the wing's own stations.
fn station_points(
    wing: &Wing,
    sections: &Sections,
    map: SpanMap,
    (at_zero, per_alpha): integrals::ResponsePair,
    scales: (f64, f64),
    control_spans: &[controls::ControlSpan],
) -> Vec<spanwise::LinearPoint> {
    let ys: Vec<f64> = wing.stations.iter().map(|s| s.y).collect();
    let angles: Vec<(f64, f64)> = ys
        .iter()
        .map(|&y| {
            let (sin, cos) = map.theta(y).sin_cos();
            (cos, sin)
        })
        .collect();
    let sums = fourier::pair_sums(at_zero, per_alpha, &angles);
    spanwise::linear_points(&ys, sections.rows(), &sums, scales, control_spans)
}

/// Makes the collocation positions of a mirrored wing exactly antisymmetric (the left half
/// the negative of the right, the middle point at the root), so its symmetric inputs carry no
/// rounding-level antisymmetric part and a wing with no deflected aileron has no even terms.
fn mirror_positions(ys: &mut [f64]) {
    let n = ys.len();
    for i in 0..n / 2 {
        ys[i] = -ys[n - 1 - i];
    }
    if n % 2 == 1 {
        ys[n / 2] = 0.0;
    }
}

/// Solves a wing at a condition with default options.
///
/// # Errors
/// As [`prepare`] and [`Prepared::solve`].
pub fn solve(wing: &Wing, condition: &Condition, options: Options) -> Result<Solution, SolveError> {
    prepare(wing, options)?.solve(condition)
}

/// The integrated coefficients at one angle of attack (what a sweep returns per point).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Coefficients {
    /// Angle of attack of the reference line, degrees.
    pub alpha_deg: f64,
    /// Lift coefficient, CL = pi AR A_1.
    pub cl: f64,
    /// Induced drag coefficient, CDi = pi AR sum n A_n^2.
    pub cdi: f64,
    /// Profile drag coefficient from the section polars.
    pub cdp: f64,
    /// CDi + CDp.
    pub cd: f64,
    /// Induced-drag factor delta = sum_{n>=2} n (A_n/A_1)^2 (`None` at zero lift).
    pub delta: Option<f64>,
    /// Span efficiency e = 1/(1 + delta) = CL^2/(pi AR CDi) (`None` at zero lift).
    pub e: Option<f64>,
    /// Rolling moment, positive right wing down.
    pub cl_roll: f64,
    /// Yawing moment, positive nose right: induced plus profile.
    pub cn: f64,
    /// Induced part of Cn.
    pub cn_induced: f64,
    /// Profile part of Cn.
    pub cn_profile: f64,
}

/// The first section to reach its cl_max, by the linear critical-section estimate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FirstStall {
    /// Where, m.
    pub y: f64,
    /// Wing CL when that section reaches cl_max.
    pub cl_wing: f64,
    /// Angle of attack when it does, degrees.
    pub alpha_deg: f64,
}

/// Dimensional values at the flight condition (1976 standard atmosphere).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Flight {
    /// True airspeed, m/s.
    pub speed: f64,
    /// Geopotential altitude, m.
    pub altitude: f64,
    /// The air there.
    pub air: atmosphere::Air,
    /// Dynamic pressure, Pa.
    pub q: f64,
    /// Mach number.
    pub mach: f64,
    /// Reynolds number on the mean aerodynamic chord.
    pub reynolds_mac: f64,
    /// Lift, N.
    pub lift: f64,
    /// Drag (induced plus profile), N.
    pub drag: f64,
    /// Right-half root bending moment, N m.
    pub root_bending_moment: f64,
    /// Left-half root bending moment, N m.
    pub left_root_bending_moment: f64,
}

/// Everything a solve reports.
#[derive(Debug, Clone)]
pub struct Solution {
    /// Integrated coefficients.
    pub coefficients: Coefficients,
    /// Lift-curve slope, per radian.
    pub cl_alpha: f64,
    /// Lift-slope factor tau from a = a0/(1 + (a0/(pi AR))(1 + tau)), with a0 the
    /// area-weighted section slope.
    pub tau: f64,
    /// The sine-series coefficients A_1..A_N.
    pub fourier: Vec<f64>,
    /// Planform.
    pub geometry: Geometry,
    /// Spanwise centre of lift of the right half, m.
    pub center_of_lift_y: f64,
    /// Right-half root bending moment over dynamic pressure, m^3.
    pub root_bending_per_q: f64,
    /// First section to stall.
    pub first_stall: Option<FirstStall>,
    /// Values at the output points (the collocation points), left tip to right tip.
    pub spanwise: Vec<SpanPoint>,
    /// Values at the wing's stations.
    pub stations: Vec<SpanPoint>,
    /// Dimensional values.
    pub flight: Flight,
    /// Number of sine terms.
    pub terms: usize,
    /// Where lifting-line theory is weak for this case.
    pub warnings: Vec<String>,
}

impl Prepared {
    /// The planform.
    #[must_use]
    pub const fn geometry(&self) -> &Geometry {
        &self.geometry
    }

    /// Lift-curve slope dCL/dalpha, per radian.
    #[must_use]
    pub fn cl_alpha(&self) -> f64 {
        PI * self.geometry.aspect_ratio * self.per_alpha[0]
    }

    /// The angle of attack (radians) that gives lift coefficient `cl`.
    ///
    /// # Errors
    /// [`SolveError::Unreachable`] when the lift slope is zero.
    pub fn alpha_for_cl(&self, cl: f64) -> Result<f64, SolveError> {
        let slope = self.per_alpha[0];
        if slope.abs() < 1e-14 {
            return Err(SolveError::Unreachable(cl));
        }
        Ok((cl / (PI * self.geometry.aspect_ratio) - self.at_zero[0]) / slope)
    }

    /// A_n at angle of attack `alpha` (radians).
    #[must_use]
    pub fn fourier_at(&self, alpha: f64) -> Vec<f64> {
        self.per_alpha
            .iter()
            .zip(&self.at_zero)
            .map(|(p, z)| alpha * p + z)
            .collect()
    }

    /// The integrated coefficients at `alpha` (radians): O(1) work, every integral being a
    /// polynomial in alpha prepared once.
    #[must_use]
    pub fn coefficients(&self, alpha: f64) -> Coefficients {
        let ar = self.geometry.aspect_ratio;
        let a1 = alpha * self.per_alpha[0] + self.at_zero[0];
        let a2 = self
            .per_alpha
            .get(1)
            .zip(self.at_zero.get(1))
            .map_or(0.0, |(p, z)| alpha * p + z);
        let sum_n_a2 = self.integrals.induced_sum.at(alpha).max(0.0);
        let cl = PI * ar * a1;
        let cdi = PI * ar * sum_n_a2;
        let delta = (a1.abs() > 1e-12).then(|| (sum_n_a2 / (a1 * a1) - 1.0).max(0.0));
        let cdp = self.integrals.cdp.at(alpha);
        let cn_induced = self.integrals.cn_induced.at(alpha);
        let cn_profile = self.integrals.cn_profile.at(alpha);
        Coefficients {
            alpha_deg: alpha.to_degrees(),
            cl,
            cdi,
            cdp,
            cd: cdi + cdp,
            delta,
            e: delta.map(|d| 1.0 / (1.0 + d)),
            // (pi AR / 4) A_2 about the span midpoint, moved to y = 0.
            cl_roll: PI * ar / 4.0 * a2 - cl * self.geometry.y_mid / self.geometry.span,
            cn: cn_induced + cn_profile,
            cn_induced,
            cn_profile,
        }
    }

    /// Coefficients at each angle of attack (degrees): one back-substitution already done,
    /// so each point is O(N).
    #[must_use]
    pub fn sweep(&self, alphas_deg: &[f64]) -> Vec<Coefficients> {
        alphas_deg
            .iter()
            .map(|a| self.coefficients(a.to_radians()))
            .collect()
    }

    /// Full solution at a flight condition (target CL if it has one, else its alpha).
    ///
    /// # Errors
    /// [`SolveError::Invalid`] for a bad condition, [`SolveError::Unreachable`] for an
    /// unreachable target CL.
    pub fn solve(&self, condition: &Condition) -> Result<Solution, SolveError> {
        if let Some(p) = validate::condition_rules(condition).into_iter().next() {
            return Err(SolveError::Invalid(p));
        }
        let alpha = match condition.target_cl {
            Some(cl) => self.alpha_for_cl(cl)?,
            None => condition.alpha_deg.to_radians(),
        };
        Ok(self.solution_at(alpha, condition))
    }

    fn solution_at(&self, alpha: f64, condition: &Condition) -> Solution {
        let coefficients = self.coefficients(alpha);
        let fourier = self.fourier_at(alpha);
        let g = &self.geometry;
        let air = atmosphere::at(condition.altitude);
        let v = condition.speed;
        let q = 0.5 * air.density * v * v;
        let right_lift = self.integrals.right_lift.at(alpha);
        let root_bending_per_q = self.integrals.right_moment.at(alpha);
        let flight = Flight {
            speed: v,
            altitude: condition.altitude,
            air,
            q,
            mach: v / air.speed_of_sound,
            reynolds_mac: air.density * v * g.mac / air.viscosity,
            lift: q * g.area * coefficients.cl,
            drag: q * g.area * coefficients.cd,
            root_bending_moment: q * root_bending_per_q,
            left_root_bending_moment: q * self.integrals.left_moment.at(alpha),
        };
        let spanwise: Vec<SpanPoint> = self.points.iter().map(|p| p.at(alpha, v)).collect();
        let stations = self.station_points.iter().map(|p| p.at(alpha, v)).collect();
        let mean_slope = self.integrals.mean_lift_slope;
        let cl_alpha = self.cl_alpha();
        let mut warnings = self.warnings.clone();
        flight_warnings(&flight, &spanwise, &mut warnings);
        Solution {
            coefficients,
            cl_alpha,
            tau: (mean_slope / cl_alpha - 1.0) * PI * g.aspect_ratio / mean_slope - 1.0,
            fourier,
            geometry: *g,
            center_of_lift_y: if right_lift.abs() > 1e-12 {
                root_bending_per_q / right_lift
            } else {
                f64::NAN
            },
            root_bending_per_q,
            first_stall: self.first_stall,
            spanwise,
            stations,
            flight,
            terms: self.per_alpha.len(),
            warnings,
        }
    }

    /// Linear critical-section estimate: each output point's cl is linear in alpha, so the
    /// alpha at which it reaches cl_max is found exactly; the least of these is the first
    /// stall. Right-half points win ties, so a symmetric wing reports y >= 0.
    fn find_first_stall(&self) -> Option<FirstStall> {
        let mut best: Option<(f64, f64)> = None;
        for p in self.points.iter().rev() {
            let (zero, slope) = p.cl;
            if slope <= 1e-9 {
                continue;
            }
            let alpha = (p.cl_max - zero) / slope;
            if best.is_none_or(|(a, _)| alpha < a - 1e-12) {
                best = Some((alpha, p.y));
            }
        }
        best.map(|(alpha, y)| FirstStall {
            y,
            cl_wing: self.coefficients(alpha).cl,
            alpha_deg: alpha.to_degrees(),
        })
    }
}

/// The series method is linear: each table airfoil stands in by its linear range.
fn linear_table_notes(wing: &Wing) -> Vec<String> {
    let tables = wing.airfoils.iter();
    let notes = tables.filter_map(|(key, a)| Some(a.table.as_ref()?.linear_note(key)));
    notes.collect()
}

fn flight_warnings(flight: &Flight, spanwise: &[SpanPoint], out: &mut Vec<String>) {
    if flight.mach > 0.3 {
        out.push(format!(
            "Mach {:.2} above 0.3: incompressible lifting-line theory underestimates the loads",
            flight.mach
        ));
    }
    if let Some(p) = spanwise.iter().find(|p| p.cl_ratio > 1.0) {
        out.push(format!(
            "cl exceeds cl_max (at y = {:.3} m): past the stall the linear theory does not hold",
            p.y
        ));
    }
}
