//! A solver's refusal as one line: located in the wing file (line:column, place, key) when the
//! file set what was refused, naming the flag when the command line did. `check` and `solve`
//! share it, so `check` reports what `solve` would refuse, at the same place.

use std::path::Path;

use super::commands::shown;
use crate::solver::{Solution, SolveError};
use crate::wing::file::Origin;
use crate::wing::validate::Place;

/// Which condition values came from the command line rather than the file.
#[derive(Debug, Clone, Copy, Default)]
pub(super) struct Overrides {
    pub alpha: bool,
    pub cl: bool,
    pub speed: bool,
    pub altitude: bool,
}

impl Overrides {
    fn flag(self, field: &str) -> Option<&'static str> {
        match field {
            "alpha" if self.alpha => Some("--alpha"),
            "cl" if self.cl => Some("--cl"),
            "speed" if self.speed => Some("--speed"),
            "altitude" if self.altitude => Some("--altitude"),
            _ => None,
        }
    }
}

/// The message for `e`, solving the wing read from `path`.
pub(super) fn refusal(path: &Path, origin: &Origin, e: &SolveError, flags: Overrides) -> String {
    let (place, field, reason) = match e {
        SolveError::Invalid(p) => (p.place.clone(), p.field, p.reason.clone()),
        SolveError::Unreachable(_) | SolveError::AlphaOutOfRange { .. } => {
            (Place::Condition, "cl", e.to_string())
        }
        SolveError::Supersonic(_) => (Place::Condition, "speed", e.to_string()),
        SolveError::Singular => (Place::Wing, "station", e.to_string()),
        SolveError::Settings(_)
        | SolveError::NotConverged { .. }
        | SolveError::NotConvergedAt { .. } => {
            return format!("{}: {e}", shown(path));
        }
    };
    match flags.flag(field).filter(|_| place == Place::Condition) {
        Some(flag) => format!("{}: {flag}: {reason}", shown(path)),
        None => origin.error(&place, field, reason).to_string(),
    }
}

/// Refuses a solution holding a number that is not finite: no command prints inf or NaN.
/// Validation keeps every input in its physical range, so this is a last guard.
pub(super) fn finite(origin: &Origin, s: &Solution) -> Result<(), String> {
    match crate::report::non_finite(s) {
        None => Ok(()),
        Some(key) => {
            let reason = format!("the result `{key}` is not a finite number for this wing");
            Err(origin.error(&Place::Wing, "station", reason).to_string())
        }
    }
}
