//! Design questions answered with the solver: the twist that gives a chosen loading, the
//! washout that minimises induced drag or makes the root stall first, the spar loads at a load
//! factor, roll authority and one-parameter trade studies.
//!
//! Pure like the solver: no I/O, no terminal. Every function that needs a solution takes a
//! [`SolveFn`], so the caller chooses the numerical method.

pub mod loads;
pub mod roll;
pub mod study;
pub mod twist;
pub mod washout;

use crate::solver::{Solution, SolveError};
use crate::wing::{Condition, Wing};

/// Solves a wing at a condition with the caller's method and settings.
pub type SolveFn<'a> = &'a (dyn Fn(&Wing, &Condition) -> Result<Solution, SolveError> + Sync);

/// Why a design question has no answer.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum DesignError {
    /// The solver refused the wing or condition.
    #[error("{0}")]
    Solve(#[from] SolveError),
    /// The question itself cannot be answered (a bad value, an impossible loading).
    #[error("{0}")]
    Impossible(String),
}

/// The wing's condition at a target lift coefficient.
#[must_use]
pub fn at_cl(wing: &Wing, cl: f64) -> Condition {
    Condition {
        target_cl: Some(cl),
        ..wing.condition
    }
}
