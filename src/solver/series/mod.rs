//! Glauert's sine-series solution of Prandtl's lifting-line equation, by collocation.
//!
//! [`prepare`] builds and factors the collocation system once per geometry and keeps two
//! responses (per radian of alpha, and at zero alpha) with the spanwise integrals as
//! polynomials in alpha; every angle of attack, target CL or sweep point after that is a
//! combination of the two ([`Prepared::solve`], [`Prepared::sweep`]).

pub mod fourier;
pub mod integrals;
mod spanwise;

use std::f64::consts::PI;

use super::controls;
use super::method::{MAX_TERMS, MIN_TERMS};
use super::solution::{
    self, Coefficients, FirstStall, Flight, MethodReport, Solution, SpanPoint, SweepPoint,
};
use super::SolveError;
use crate::solver::moment::MomentFrame;
use crate::wing::validate;
use crate::wing::ReferenceValues;
use crate::wing::{Condition, Geometry, Section, Sections, Wing};
use fourier::SpanMap;
use integrals::LoadIntegrals;

pub use super::method::DEFAULT_TERMS;

/// Name of the method, as printed in reports.
pub const METHOD: &str = "Glauert sine series, collocation";

/// Series settings.
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
    /// Local values at the edges of the judged part next to pointed tips (at most two).
    edge_points: Vec<spanwise::LinearPoint>,
    first_stall: Option<FirstStall>,
    warnings: Vec<String>,
    /// Cm at zero alpha and per radian (linear: every section's cm is its constant `cm0`).
    cm: (f64, f64),
    reference: ReferenceValues,
}

/// Builds and factors the collocation system of a wing, with its section lift slopes
/// corrected for the Mach number of its condition and the condition's roll rate folded into
/// the zero-alpha response (an antisymmetric input: on a mirrored wing it reaches only the
/// even half-system).
///
/// # Errors
/// [`SolveError::Invalid`] for a wing that breaks a rule, [`SolveError::Settings`] for a bad
/// term count, [`SolveError::Singular`] if the system cannot be solved.
pub fn prepare(wing: &Wing, options: Options) -> Result<Prepared, SolveError> {
    if let Some(p) = validate::problems(wing).into_iter().next() {
        return Err(SolveError::Invalid(p));
    }
    let n = options.terms;
    if !(MIN_TERMS..=MAX_TERMS).contains(&n) {
        return Err(SolveError::Settings(format!(
            "terms: must be between {MIN_TERMS} and {MAX_TERMS} (got {n})"
        )));
    }
    let wing = &*super::compressibility::corrected(wing);
    let geometry = Geometry::of(wing);
    let sections = Sections::of(wing);
    let map = SpanMap {
        y_mid: geometry.y_mid,
        half_span: 0.5 * geometry.span,
    };
    let control_spans = controls::spans(&wing.controls);
    let roll = wing.condition.roll_rate;
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
    warnings.extend(own_warnings(&geometry));
    warnings.extend(linear_table_notes(wing));
    let scales = (geometry.span, geometry.mean_chord);
    let tips = (
        sections.at(map.y_mid - map.half_span).chord,
        sections.at(map.y_mid + map.half_span).chord,
    );
    let inputs = spanwise::LocalInputs {
        controls: &control_spans,
        roll_rate: roll,
        stall_region: spanwise::StallRegion::of(map.y_mid, tips, geometry.mean_chord),
    };
    let sums = fourier::collocation_sums(pair.0, pair.1, at.system(wing.symmetric));
    let points = spanwise::linear_points(&at.ys, &at.sections, &sums, scales, inputs);
    let station_points = station_points(wing, &sections, map, pair, scales, inputs);
    let edge_points = edge_points(wing, &sections, map, pair, scales, inputs);
    let frame = MomentFrame::of(wing, &geometry);
    let cm_at = |alpha: f64| frame.cm(&points.iter().map(|p| p.at(alpha, 1.0)).collect::<Vec<_>>());
    let cm_zero = cm_at(0.0);
    let cm = (cm_zero, cm_at(1.0) - cm_zero);
    let mut prepared = Prepared {
        cm,
        reference: *frame.reference(),
        geometry,
        per_alpha: responses.per_alpha,
        at_zero: responses.at_zero,
        integrals,
        points,
        station_points,
        edge_points,
        first_stall: None,
        warnings,
    };
    prepared.first_stall = prepared.find_first_stall();
    Ok(prepared)
}

/// Where this method's own assumptions (a straight, flat wing) are broken.
fn own_warnings(geometry: &Geometry) -> Vec<String> {
    let mut out = Vec::new();
    if geometry.max_sweep_deg > 20.0 {
        out.push(format!(
            "quarter-chord sweep up to {:.1} deg: this solver ignores sweep, results are optimistic",
            geometry.max_sweep_deg
        ));
    }
    if geometry.max_dihedral_deg > 15.0 {
        out.push(format!(
            "dihedral up to {:.1} deg: this solver treats the wing as flat",
            geometry.max_dihedral_deg
        ));
    }
    out
}

/// This method is linear: each table airfoil stands in by its linear range.
fn linear_table_notes(wing: &Wing) -> Vec<String> {
    let tables = wing.airfoils.iter();
    let notes = tables.filter_map(|(key, a)| Some(a.table.as_ref()?.linear_note(key)));
    notes.collect()
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
        let roll = wing.condition.roll_rate;
        if roll != 0.0 {
            for (slot, &y) in rhs.iter_mut().zip(&ys) {
                *slot += roll * 2.0 * y / span;
            }
        }
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
    inputs: spanwise::LocalInputs,
) -> Vec<spanwise::LinearPoint> {
    let ys: Vec<f64> = wing.stations.iter().map(|s| s.y).collect();
    points_at(
        &ys,
        sections.rows(),
        map,
        (at_zero, per_alpha),
        scales,
        inputs,
    )
}

/// Local values at positions `ys` with their sections.
fn points_at(
    ys: &[f64],
    sections: &[Section],
    map: SpanMap,
    (at_zero, per_alpha): integrals::ResponsePair,
    scales: (f64, f64),
    inputs: spanwise::LocalInputs,
) -> Vec<spanwise::LinearPoint> {
    let angles: Vec<(f64, f64)> = ys
        .iter()
        .map(|&y| {
            let (sin, cos) = map.theta(y).sin_cos();
            (cos, sin)
        })
        .collect();
    let sums = fourier::pair_sums(at_zero, per_alpha, &angles);
    spanwise::linear_points(ys, sections, &sums, scales, inputs)
}

/// Local values where the judged part of the span ends next to a pointed tip, judged there
/// (the chord there is the floor itself, up to rounding).
fn edge_points(
    wing: &Wing,
    sections: &Sections,
    map: SpanMap,
    pair: integrals::ResponsePair,
    scales: (f64, f64),
    inputs: spanwise::LocalInputs,
) -> Vec<spanwise::LinearPoint> {
    let chords: Vec<(f64, f64)> = wing.stations.iter().map(|s| (s.y, s.chord)).collect();
    let ys = inputs.stall_region.edges(&chords, wing.symmetric);
    let edge_sections: Vec<Section> = ys.iter().map(|&y| sections.at(y)).collect();
    let mut points = points_at(&ys, &edge_sections, map, pair, scales, inputs);
    for p in &mut points {
        p.stall_judged = true;
    }
    points
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

/// Solves a wing at a condition.
///
/// # Errors
/// As [`prepare`] and [`Prepared::solve`].
pub fn solve(wing: &Wing, condition: &Condition, options: Options) -> Result<Solution, SolveError> {
    prepare(wing, options)?.solve(condition)
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
    /// [`SolveError::Unreachable`] when the lift slope is zero: below a billionth of the
    /// sections' mean slope (relative, so small but real slopes are not called zero).
    pub fn alpha_for_cl(&self, cl: f64) -> Result<f64, SolveError> {
        let slope = self.per_alpha[0];
        if self.cl_alpha().abs() <= 1e-9 * self.integrals.mean_lift_slope {
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
            cm: self.cm.0 + alpha * self.cm.1,
        }
    }

    /// Coefficients at each angle of attack (degrees): the integrals are polynomials in alpha
    /// prepared once, so each point is O(1).
    #[must_use]
    pub fn sweep(&self, alphas_deg: &[f64]) -> Vec<Coefficients> {
        alphas_deg
            .iter()
            .map(|a| self.coefficients(a.to_radians()))
            .collect()
    }

    /// [`Prepared::sweep`] with each row's count of output points past their cl_max.
    #[must_use]
    pub fn sweep_points(&self, alphas_deg: &[f64]) -> Vec<SweepPoint> {
        alphas_deg
            .iter()
            .map(|a| {
                let alpha = a.to_radians();
                SweepPoint {
                    coefficients: self.coefficients(alpha),
                    stalled_points: self.stalled_points(alpha),
                }
            })
            .collect()
    }

    /// How many output points are past their cl_max at `alpha` (radians).
    fn stalled_points(&self, alpha: f64) -> usize {
        self.judged_points().filter(|p| p.stalled_at(alpha)).count()
    }

    /// The points where the stall is judged: the output points and the judged part's edges.
    fn judged_points(&self) -> impl Iterator<Item = &spanwise::LinearPoint> {
        self.points.iter().chain(&self.edge_points)
    }

    /// The warnings of this wing and method that do not depend on the condition.
    #[must_use]
    pub fn warnings(&self) -> &[String] {
        &self.warnings
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
        let g = &self.geometry;
        let v = condition.speed;
        let right_lift = self.integrals.right_lift.at(alpha);
        let right_root_bending_per_q = self.integrals.right_moment.at(alpha);
        let bending = (
            right_root_bending_per_q,
            self.integrals.left_moment.at(alpha),
        );
        let flight = Flight::of(condition, g, &coefficients, bending);
        let spanwise: Vec<SpanPoint> = self.points.iter().map(|p| p.at(alpha, v)).collect();
        let stations = self.station_points.iter().map(|p| p.at(alpha, v)).collect();
        let cl_alpha = self.cl_alpha();
        let mut warnings = self.warnings.clone();
        let mut judged: Vec<SpanPoint> = self.judged_points().map(|p| p.at(alpha, v)).collect();
        judged.sort_by(|a, b| a.y.total_cmp(&b.y));
        solution::flight_warnings(&flight, &judged, &mut warnings);
        Solution {
            coefficients,
            cl_alpha,
            tau: solution::tau(cl_alpha, self.integrals.mean_lift_slope, g.aspect_ratio),
            geometry: *g,
            center_of_lift_y: if right_lift.abs() > 1e-12 {
                right_root_bending_per_q / right_lift
            } else {
                f64::NAN
            },
            right_root_bending_per_q,
            first_stall: self.first_stall,
            spanwise,
            stations,
            flight,
            method: MethodReport {
                name: METHOD,
                short_name: "series",
                resolution_key: "terms",
                resolution: self.per_alpha.len(),
                iterations: 0,
                residual: None,
                extras: vec![("fourier", self.fourier_at(alpha))],
            },
            cl_max: None,
            warnings,
            reference: self.reference,
        }
    }

    /// The wing's CL_max: the series is linear, so the first section to reach its cl_max
    /// decides (critical-section estimate).
    #[must_use]
    pub fn cl_max(&self) -> solution::ClMax {
        self.first_stall.map_or(
            solution::ClMax {
                cl_max: f64::NAN,
                alpha_deg: f64::NAN,
                found_by: solution::StallFoundBy::NoStall,
            },
            |s| solution::ClMax {
                cl_max: s.cl_wing,
                alpha_deg: s.alpha_deg,
                found_by: solution::StallFoundBy::FirstSection,
            },
        )
    }

    /// Linear critical-section estimate: each output point's cl is linear in alpha, so the
    /// alpha at which it reaches cl_max is found exactly; the least of these is the first
    /// stall. Points next to a pointed tip are not judged (see
    /// [`spanwise::POINTED_TIP_CHORD_FRACTION`]). Right-half points win ties, so a symmetric
    /// wing reports y >= 0.
    fn find_first_stall(&self) -> Option<FirstStall> {
        let mut best: Option<(f64, f64)> = None;
        // Edges first, then right to left: ties go to an edge, then to the right half.
        for p in self.edge_points.iter().chain(self.points.iter().rev()) {
            let Some(alpha) = p.stall_alpha() else {
                continue;
            };
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
