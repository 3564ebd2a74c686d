//! The lifting-line solvers: pure functions of (wing, condition, method). No I/O, no terminal.
//!
//! [`prepare`] readies a wing for one [`Method`]; the [`PreparedWing`] then solves any
//! condition and sweeps any alphas, and says whether it still fits an edited wing. Results
//! are method-neutral ([`Solution`]); what only one method knows travels in its
//! [`MethodReport`].

pub mod compressibility;
pub mod controls;
pub mod method;
pub mod moment;
pub mod series;
pub mod solution;
pub mod vortex;

use std::borrow::Cow;

use crate::wing::validate::Problem;
use crate::wing::{Condition, Geometry, Wing};

pub use method::{
    Method, DEFAULT_MAX_ITER, DEFAULT_PANELS, DEFAULT_TERMS, DEFAULT_TOL, MAX_PANELS, MAX_TERMS,
    MIN_PANELS, MIN_TERMS,
};
pub use solution::{
    ClMax, Coefficients, FirstStall, Flight, FreeStream, MethodReport, Solution, SpanPoint,
    StallFoundBy, SweepPoint,
};

/// Why a wing could not be solved.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SolveError {
    /// The wing or condition breaks a rule (see [`crate::wing::validate::problems`]).
    #[error("{0}")]
    Invalid(Problem),
    /// A method setting is out of range (the message names it).
    #[error("{0}")]
    Settings(String),
    /// The linear system could not be solved.
    #[error("the lifting-line system is singular for this wing")]
    Singular,
    /// A target CL that no angle of attack reaches (zero lift slope).
    #[error("cannot reach CL = {0}: the wing's lift slope is zero")]
    Unreachable(f64),
    /// A target CL whose angle of attack lies beyond
    /// [`MAX_ALPHA_DEG`](crate::wing::validate::MAX_ALPHA_DEG) either way.
    #[error("{}", alpha_out_of_range(*cl, *alpha_deg))]
    AlphaOutOfRange {
        /// The target CL.
        cl: f64,
        /// The angle of attack that would give it, degrees.
        alpha_deg: f64,
    },
    /// A free stream at or above Mach 1.
    #[error("Mach {0:.3}: subsonic lifting-line theory does not apply at Mach 1 or above")]
    Supersonic(f64),
    /// An iterative solve stopped before meeting its tolerance at this angle of attack.
    #[error("the solver did not converge at alpha {alpha_deg} deg: {iterations} iterations, residual {residual:.3e}")]
    NotConvergedAt {
        /// Angle of attack, degrees.
        alpha_deg: f64,
        /// Iterations taken.
        iterations: usize,
        /// Largest residual at the end.
        residual: f64,
    },
    /// The iterative solve stopped before meeting its tolerance.
    #[error("the solver did not converge: {iterations} iterations, residual {residual:.3e}")]
    NotConverged {
        /// Iterations taken.
        iterations: usize,
        /// Largest residual at the end.
        residual: f64,
    },
}

/// The message of [`SolveError::AlphaOutOfRange`]; an angle too large to print is not.
fn alpha_out_of_range(cl: f64, alpha_deg: f64) -> String {
    let cl = crate::text::significant(cl, 4);
    if alpha_deg.is_finite() {
        let alpha = crate::text::significant(alpha_deg, 4);
        format!("CL = {cl} needs alpha = {alpha} deg, beyond -90 to 90 deg")
    } else {
        format!("CL = {cl} is not reached at any alpha within -90 to 90 deg")
    }
}

/// A wing readied for one method: any condition, alpha or sweep is then cheap.
#[derive(Debug, Clone)]
pub struct PreparedWing {
    wing: Wing,
    method: Method,
    inner: Inner,
}

#[derive(Debug, Clone)]
enum Inner {
    Series(series::Prepared),
    Vortex(vortex::Prepared),
}

/// Readies `wing` for `method`, at the Mach number and roll rate of the wing's own condition.
///
/// # Errors
/// [`SolveError::Invalid`] for a wing that breaks a rule, [`SolveError::Settings`] for bad
/// method settings, [`SolveError::Supersonic`], [`SolveError::Singular`].
pub fn prepare(wing: &Wing, method: Method) -> Result<PreparedWing, SolveError> {
    method.check().map_err(SolveError::Settings)?;
    subsonic(&wing.condition)?;
    let inner = match method {
        Method::Glauert { terms } => {
            Inner::Series(series::prepare(wing, series::Options { terms })?)
        }
        Method::Vortex {
            panels,
            tol,
            max_iter,
        } => Inner::Vortex(vortex::prepare(
            wing,
            vortex::Options {
                panels,
                tol,
                max_iter,
            },
        )?),
    };
    Ok(PreparedWing {
        wing: wing.clone(),
        method,
        inner,
    })
}

/// Solves a wing at a condition.
///
/// # Errors
/// As [`prepare`] and [`PreparedWing::solve`].
pub fn solve(wing: &Wing, condition: &Condition, method: Method) -> Result<Solution, SolveError> {
    prepare(wing, method)?.solve(condition)
}

fn subsonic(condition: &Condition) -> Result<(), SolveError> {
    let mach = FreeStream::of(condition).mach;
    if mach >= compressibility::MAX_MACH {
        return Err(SolveError::Supersonic(mach));
    }
    Ok(())
}

impl PreparedWing {
    /// The planform.
    #[must_use]
    pub fn geometry(&self) -> &Geometry {
        match &self.inner {
            Inner::Series(p) => p.geometry(),
            Inner::Vortex(p) => p.geometry(),
        }
    }

    /// The method it was prepared for.
    #[must_use]
    pub const fn method(&self) -> Method {
        self.method
    }

    /// Where lifting-line theory, or this method, is weak for this wing (the condition's own
    /// warnings come with each solution).
    #[must_use]
    pub fn warnings(&self) -> &[String] {
        match &self.inner {
            Inner::Series(p) => p.warnings(),
            Inner::Vortex(p) => p.warnings(),
        }
    }

    /// Whether this prepared wing answers for `wing` with `method`: the same method, the
    /// same stations, airfoils and controls, and a condition that differs at most in what the
    /// preparation does not depend on (alpha, target CL, and speed and altitude as far as
    /// they leave the compressibility correction unchanged).
    #[must_use]
    pub fn fits(&self, wing: &Wing, method: Method) -> bool {
        let w = &self.wing;
        self.method == method
            && w.symmetric == wing.symmetric
            && w.stations == wing.stations
            && w.airfoils == wing.airfoils
            && w.controls == wing.controls
            && w.reference == wing.reference
            && self.condition_fits(&wing.condition)
    }

    fn condition_fits(&self, condition: &Condition) -> bool {
        let own = &self.wing.condition;
        compressibility::beta(own) == compressibility::beta(condition)
            && own.roll_rate == condition.roll_rate
    }

    /// The full solution at a condition (its target CL if it has one, else its alpha). A
    /// condition with another Mach correction or roll rate than the prepared one is
    /// prepared afresh, so the answer is always that of the condition given.
    ///
    /// # Errors
    /// [`SolveError::Invalid`] for a bad condition, [`SolveError::Unreachable`] or
    /// [`SolveError::AlphaOutOfRange`] for an unreachable target CL,
    /// [`SolveError::NotConverged`] for an iterative solve that fails.
    pub fn solve(&self, condition: &Condition) -> Result<Solution, SolveError> {
        subsonic(condition)?;
        let this = self.for_condition(condition)?;
        let solution = match &this.inner {
            Inner::Series(p) => p.solve(condition),
            Inner::Vortex(p) => p.solve(condition),
        }?;
        let alpha_deg = solution.coefficients.alpha_deg;
        match condition.target_cl {
            Some(cl)
                if alpha_deg.is_nan() || alpha_deg.abs() > crate::wing::validate::MAX_ALPHA_DEG =>
            {
                Err(SolveError::AlphaOutOfRange { cl, alpha_deg })
            }
            _ => Ok(solution),
        }
    }

    fn for_condition(&self, condition: &Condition) -> Result<Cow<'_, Self>, SolveError> {
        if self.condition_fits(condition) {
            return Ok(Cow::Borrowed(self));
        }
        let mut wing = self.wing.clone();
        wing.condition = *condition;
        prepare(&wing, self.method).map(Cow::Owned)
    }

    /// The coefficients at each angle of attack (degrees), at the prepared condition's Mach
    /// number and roll rate, each row with its count of stalled output points.
    ///
    /// # Errors
    /// [`SolveError::NotConverged`] when an iterative method fails at some alpha.
    pub fn sweep(&self, alphas_deg: &[f64]) -> Result<Vec<SweepPoint>, SolveError> {
        match &self.inner {
            Inner::Series(p) => Ok(p.sweep_points(alphas_deg)),
            Inner::Vortex(p) => p.sweep(alphas_deg),
        }
    }

    /// The wing's CL_max at the prepared condition's Mach number and roll rate: the vortex
    /// method steps alpha with continuation until the lift peaks or Newton fails; the linear
    /// series takes the first section to reach cl_max.
    ///
    /// # Errors
    /// [`SolveError::NotConverged`] when even the first solve fails.
    pub fn cl_max(&self) -> Result<ClMax, SolveError> {
        match &self.inner {
            Inner::Series(p) => Ok(p.cl_max()),
            Inner::Vortex(p) => p.cl_max(),
        }
    }
}
