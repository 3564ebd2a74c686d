//! The numerical lifting line: horseshoe vortices with the full 3-D segment induced velocity,
//! each section's own cl(alpha_eff), Newton's method on the circulation residual (Phillips &
//! Snyder, "Modern adaptation of Prandtl's classic lifting-line theory", J. Aircraft 37(4),
//! 2000), with the bound vortices' sweep and dihedral effect taken at the three-quarter chord
//! so swept wings converge on the grid ([`influence::Influence::of`], docs/theory.md).

pub mod influence;
pub mod newton;
pub mod panels;
mod results;

use super::controls;
use super::method::{MAX_PANELS, MIN_PANELS};
use super::solution::{ClMax, Solution, StallFoundBy, SweepPoint};
use super::SolveError;
use crate::wing::validate;
use crate::wing::{Condition, Geometry, Section, Sections, Wing};
use influence::Influence;
use newton::{LiftLaw, Problem};
use panels::Panels;

/// Name of the method, as printed in reports.
pub const METHOD: &str = "numerical lifting line, horseshoe vortices";

/// Quarter-chord sweep beyond which the method's answer is an extrapolation.
const SWEEP_LIMIT_DEG: f64 = 30.0;

/// Vortex settings.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Options {
    /// Number of panels across the span (more when stations and control edges need them).
    pub panels: usize,
    /// Tolerance on the largest residual, lift-coefficient units.
    pub tol: f64,
    /// Iteration cap.
    pub max_iter: usize,
}

/// A wing with its vortex lattice and influences computed, ready for any angle of attack.
#[derive(Debug, Clone)]
pub struct Prepared {
    geometry: Geometry,
    panels: Panels,
    influence: Influence,
    options: Options,
    roll_rate: f64,
    lift: LiftLaw,
    lift_scale: f64,
    /// Each station's (y, chord).
    station_chords: Vec<(f64, f64)>,
    moment: crate::solver::moment::MomentFrame,
    warnings: Vec<String>,
}

/// A converged state at one angle of attack.
#[derive(Debug, Clone)]
pub struct State {
    /// Angle of attack, radians.
    pub alpha: f64,
    /// Circulation over airspeed at each panel, m.
    pub g: Vec<f64>,
    /// d g / d alpha, m per radian.
    pub g_per_alpha: Vec<f64>,
    /// Section lift coefficient and slope at each control point.
    pub cl: Vec<(f64, f64)>,
    /// Effective angle of attack at each control point, radians.
    pub alpha_eff: Vec<f64>,
    /// Newton iterations taken.
    pub iterations: usize,
    /// Final residual.
    pub residual: f64,
}

/// Lays out the lattice and computes its influences.
///
/// # Errors
/// [`SolveError::Invalid`] for a wing that breaks a rule, [`SolveError::Settings`] for a bad
/// panel count.
pub fn prepare(wing: &Wing, options: Options) -> Result<Prepared, SolveError> {
    if let Some(p) = validate::problems(wing).into_iter().next() {
        return Err(SolveError::Invalid(p));
    }
    if !(MIN_PANELS..=MAX_PANELS).contains(&options.panels) {
        return Err(SolveError::Settings(format!(
            "panels: must be between {MIN_PANELS} and {MAX_PANELS} (got {})",
            options.panels
        )));
    }
    let geometry = Geometry::of(wing);
    let sections = Sections::of(wing);
    let spans = controls::spans(&wing.controls);
    let mut panels = Panels::of(wing, &sections, options.panels, &spans);
    // Prandtl-Glauert scales each whole section curve (table or linear) and its cl_max.
    let lift_scale = 1.0 / super::compressibility::beta(&wing.condition);
    for p in &mut panels.points {
        p.section.airfoil.cl_max *= lift_scale;
    }
    let influence = Influence::of(&panels);
    let mut warnings = validate::warnings(wing, &geometry);
    if geometry.max_sweep_deg > SWEEP_LIMIT_DEG {
        warnings.push(format!(
            "quarter-chord sweep up to {:.1} deg: beyond {SWEEP_LIMIT_DEG} deg lifting-line theory is extrapolated",
            geometry.max_sweep_deg
        ));
    }
    if panels.len() > options.panels.next_multiple_of(2) {
        warnings.push(format!(
            "{} panels used: every station and control edge is a panel edge",
            panels.len()
        ));
    }
    Ok(Prepared {
        geometry,
        panels,
        influence,
        options,
        roll_rate: wing.condition.roll_rate,
        lift: Section::lift,
        lift_scale,
        station_chords: wing.stations.iter().map(|s| (s.y, s.chord)).collect(),
        moment: crate::solver::moment::MomentFrame::of(wing, &geometry),
        warnings,
    })
}

impl Prepared {
    /// The planform.
    #[must_use]
    pub const fn geometry(&self) -> &Geometry {
        &self.geometry
    }

    /// The warnings of this wing and method that do not depend on the condition.
    #[must_use]
    pub fn warnings(&self) -> &[String] {
        &self.warnings
    }

    /// Number of panels in the lattice.
    #[must_use]
    pub fn panel_count(&self) -> usize {
        self.panels.len()
    }

    /// The same prepared wing with another section lift law (for sections whose lift curve
    /// is not the airfoil's linear one).
    #[must_use]
    pub fn with_lift_law(mut self, lift: LiftLaw) -> Self {
        self.lift = lift;
        self
    }

    /// alpha n_z + roll + twist + control shift at each section: the roll's onset velocity
    /// (0, -k z, k y), k = 2 (pb/2V)/b, projected on the section normal.
    fn onset(&self, alpha: f64) -> Vec<f64> {
        let k = 2.0 * self.roll_rate / self.geometry.span;
        self.panels
            .points
            .iter()
            .map(|p| {
                let n = p.normal;
                let roll = k * (p.at[1] * n[2] - p.at[2] * n[1]);
                alpha * n[2] + roll + p.section.twist + p.control_shift
            })
            .collect()
    }

    fn problem(&self, onset: Vec<f64>) -> Problem<'_> {
        Problem {
            points: &self.panels.points,
            influence: &self.influence,
            onset,
            lift: self.lift,
            chord_scale: self.geometry.mean_chord,
            lift_scale: self.lift_scale,
        }
    }

    /// The converged state at `alpha` (radians), Newton started from `start` (zero
    /// circulation when `None`).
    ///
    /// # Errors
    /// [`SolveError::NotConverged`] or [`SolveError::Singular`].
    pub fn state_at(&self, alpha: f64, start: Option<&[f64]>) -> Result<State, SolveError> {
        let problem = self.problem(self.onset(alpha));
        let zero = vec![0.0; self.panels.len()];
        let o = &self.options;
        let done = problem.solve(start.unwrap_or(&zero), o.tol, o.max_iter)?;
        let g_per_alpha = problem.rate(&done)?;
        Ok(State {
            alpha,
            g_per_alpha,
            alpha_eff: done.angles,
            cl: done.cl,
            g: done.g,
            iterations: done.iterations,
            residual: done.residual,
        })
    }

    /// The state that gives wing lift coefficient `target`, by Newton on alpha from the
    /// lift slope at each step.
    ///
    /// # Errors
    /// [`SolveError::Unreachable`] when the lift slope vanishes; as [`Prepared::state_at`].
    pub fn state_for_cl(&self, target: f64) -> Result<State, SolveError> {
        let mut state = self.state_at(0.0, None)?;
        for _ in 0..50 {
            let (cl, slope) = (self.lift_of(&state.g), self.lift_of(&state.g_per_alpha));
            if (cl - target).abs() <= 1e-12 * target.abs().max(1.0) {
                return Ok(state);
            }
            if slope.abs() < 1e-9 {
                break;
            }
            let next = state.alpha + (target - cl) / slope;
            state = self.state_at(next, Some(&state.g))?;
        }
        Err(SolveError::Unreachable(target))
    }

    /// CL = (2 / S) sum g_i dy_i for circulations (or their rates) `g`.
    fn lift_of(&self, g: &[f64]) -> f64 {
        let e = &self.panels.edges;
        let sum: f64 = g
            .iter()
            .zip(e.windows(2))
            .map(|(gi, p)| gi * (p[1][1] - p[0][1]))
            .sum();
        2.0 * sum / self.geometry.area
    }

    /// Full solution at a flight condition (target CL if it has one, else its alpha).
    ///
    /// # Errors
    /// [`SolveError::Invalid`] for a bad condition; as [`Prepared::state_at`] and
    /// [`Prepared::state_for_cl`].
    pub fn solve(&self, condition: &Condition) -> Result<Solution, SolveError> {
        if let Some(p) = validate::condition_rules(condition).into_iter().next() {
            return Err(SolveError::Invalid(p));
        }
        let state = match condition.target_cl {
            Some(cl) => self.state_for_cl(cl)?,
            None => self.state_at(condition.alpha_deg.to_radians(), None)?,
        };
        Ok(self.solution(&state, condition))
    }

    /// The coefficients at each angle of attack (degrees), each solve started from the
    /// previous one's circulation (continuation), so the sweep follows the branch through the
    /// stall; each row counts its control points past cl_max.
    ///
    /// # Errors
    /// [`SolveError::NotConverged`] naming the first angle where Newton fails.
    pub fn sweep(&self, alphas_deg: &[f64]) -> Result<Vec<SweepPoint>, SolveError> {
        let mut out = Vec::with_capacity(alphas_deg.len());
        let mut previous: Option<Vec<f64>> = None;
        for &a in alphas_deg {
            let state = self
                .state_at(a.to_radians(), previous.as_deref())
                .map_err(|e| at_alpha(e, a))?;
            out.push(SweepPoint {
                coefficients: self.coefficients(&state),
                stalled_points: self.stalled_points(&state),
            });
            previous = Some(state.g);
        }
        Ok(out)
    }

    /// The wing's CL_max: alpha stepped up from zero with continuation until the lift peaks
    /// (the drop bracketed to 0.01 deg, then the peak found by golden section to 0.001 deg
    /// over the last step either side) or Newton fails (the step halved to 0.01 deg first); when the
    /// sections' lift never bends, the first section to reach cl_max decides instead.
    ///
    /// # Errors
    /// As [`Prepared::state_at`] at zero alpha.
    pub fn cl_max(&self) -> Result<ClMax, SolveError> {
        let mut state = self.state_at(0.0, None)?;
        let mut best = (self.lift_of(&state.g), 0.0_f64);
        let mut step = 1.0_f64.to_radians();
        // The step that reached the best point: the peak lies within it behind, or ahead.
        let mut came_by = step;
        let finest = 0.01_f64.to_radians();
        let limit = crate::wing::validate::MAX_ALPHA_DEG.to_radians() * 0.5;
        let mut found_by = None;
        while state.alpha < limit {
            match self.state_at(state.alpha + step, Some(&state.g)) {
                Ok(next) => {
                    let cl = self.lift_of(&next.g);
                    if cl < best.0 {
                        if step <= finest {
                            found_by = Some(StallFoundBy::LiftPeak);
                            let around = (state.alpha - came_by, state.alpha + step);
                            best = self.refine_peak(&state, around, best);
                            break;
                        }
                        step *= 0.25;
                        continue;
                    }
                    best = (cl, next.alpha);
                    came_by = step;
                    state = next;
                }
                Err(SolveError::NotConverged { .. }) if step > finest => step *= 0.25,
                Err(SolveError::NotConverged { .. }) => {
                    found_by = Some(StallFoundBy::NoConvergence);
                    break;
                }
                Err(e) => return Err(e),
            }
        }
        Ok(match found_by {
            Some(by) => ClMax {
                cl_max: best.0,
                alpha_deg: best.1.to_degrees(),
                found_by: by,
            },
            None => self.first_section_cl_max()?,
        })
    }

    /// Golden-section search for the lift peak on `(lo, hi)` (radians), each solve started
    /// from the state near the peak; keeps `best` (CL, alpha) if nothing beats it.
    fn refine_peak(
        &self,
        near: &State,
        (mut lo, mut hi): (f64, f64),
        best: (f64, f64),
    ) -> (f64, f64) {
        const GOLDEN: f64 = 0.618_033_988_749_894_9;
        let lift = |alpha: f64| {
            self.state_at(alpha, Some(&near.g))
                .map_or(f64::NEG_INFINITY, |s| self.lift_of(&s.g))
        };
        let mut out = best;
        let (mut a, mut b) = (hi - GOLDEN * (hi - lo), lo + GOLDEN * (hi - lo));
        let (mut fa, mut fb) = (lift(a), lift(b));
        while hi - lo > 1e-3_f64.to_radians() {
            if fa > fb {
                (hi, b, fb) = (b, a, fa);
                a = hi - GOLDEN * (hi - lo);
                fa = lift(a);
            } else {
                (lo, a, fa) = (a, b, fb);
                b = lo + GOLDEN * (hi - lo);
                fb = lift(b);
            }
        }
        for (cl, alpha) in [(fa, a), (fb, b)] {
            if cl > out.0 {
                out = (cl, alpha);
            }
        }
        out
    }

    fn first_section_cl_max(&self) -> Result<ClMax, SolveError> {
        let state = self.state_at(0.0, None)?;
        let stall = self.first_stall(&state);
        Ok(stall.map_or(
            ClMax {
                cl_max: f64::NAN,
                alpha_deg: f64::NAN,
                found_by: StallFoundBy::NoStall,
            },
            |s| ClMax {
                cl_max: s.cl_wing,
                alpha_deg: s.alpha_deg,
                found_by: StallFoundBy::FirstSection,
            },
        ))
    }
}

/// A non-convergence error that names the angle of attack it happened at.
fn at_alpha(e: SolveError, alpha_deg: f64) -> SolveError {
    match e {
        SolveError::NotConverged {
            iterations,
            residual,
        } => SolveError::NotConvergedAt {
            alpha_deg,
            iterations,
            residual,
        },
        other => other,
    }
}
