//! Which solution method to run, with its settings.

/// Default number of sine terms, chosen from the convergence study in docs/theory.md.
pub const DEFAULT_TERMS: usize = 60;
/// Fewest terms accepted.
pub const MIN_TERMS: usize = 2;
/// Most terms accepted (the dense factorisation grows as N^3).
pub const MAX_TERMS: usize = 1000;

/// Default number of vortex panels across the span, from the grid study in docs/theory.md.
pub const DEFAULT_PANELS: usize = 60;
/// Fewest panels accepted.
pub const MIN_PANELS: usize = 4;
/// Most panels accepted (each Newton step factors an N x N Jacobian).
pub const MAX_PANELS: usize = 1000;
/// Default Newton tolerance on the largest circulation residual, in the equation's own
/// dimensionless form (lift-coefficient units).
pub const DEFAULT_TOL: f64 = 1e-10;
/// Default Newton iteration cap.
pub const DEFAULT_MAX_ITER: usize = 100;

/// A lifting-line solution method and its settings.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Method {
    /// Glauert's sine series by collocation: linear sections, flat straight wing.
    Glauert {
        /// Number of sine terms (and collocation points).
        terms: usize,
    },
    /// Numerical lifting line of horseshoe vortices, Newton on the circulation residual.
    Vortex {
        /// Number of spanwise panels.
        panels: usize,
        /// Convergence tolerance on the largest residual.
        tol: f64,
        /// Iteration cap.
        max_iter: usize,
    },
}

impl Default for Method {
    fn default() -> Self {
        Self::Glauert {
            terms: DEFAULT_TERMS,
        }
    }
}

impl Method {
    /// The series method with `terms` sine terms.
    #[must_use]
    pub const fn series(terms: usize) -> Self {
        Self::Glauert { terms }
    }

    /// The vortex method with `panels` panels and the default tolerance and iteration cap.
    #[must_use]
    pub const fn vortex(panels: usize) -> Self {
        Self::Vortex {
            panels,
            tol: DEFAULT_TOL,
            max_iter: DEFAULT_MAX_ITER,
        }
    }

    /// The short name used on the command line and on screen (`series`, `vortex`).
    #[must_use]
    pub const fn short_name(self) -> &'static str {
        match self {
            Self::Glauert { .. } => "series",
            Self::Vortex { .. } => "vortex",
        }
    }

    /// The method's full name, as printed in reports.
    #[must_use]
    pub const fn name(self) -> &'static str {
        match self {
            Self::Glauert { .. } => super::series::METHOD,
            Self::Vortex { .. } => super::vortex::METHOD,
        }
    }

    /// The other method at its default settings (the workbench's method switch).
    #[must_use]
    pub const fn other(self) -> Self {
        match self {
            Self::Glauert { .. } => Self::vortex(DEFAULT_PANELS),
            Self::Vortex { .. } => Self::series(DEFAULT_TERMS),
        }
    }

    /// Why these settings cannot run, if they cannot.
    ///
    /// # Errors
    /// A one-line reason naming the setting.
    pub fn check(self) -> Result<(), String> {
        match self {
            Self::Glauert { terms } if !(MIN_TERMS..=MAX_TERMS).contains(&terms) => Err(format!(
                "terms: must be between {MIN_TERMS} and {MAX_TERMS} (got {terms})"
            )),
            Self::Vortex { panels, .. } if !(MIN_PANELS..=MAX_PANELS).contains(&panels) => Err(
                format!("panels: must be between {MIN_PANELS} and {MAX_PANELS} (got {panels})"),
            ),
            Self::Vortex { tol, .. } if !(tol.is_finite() && tol > 0.0) => {
                Err(format!("tol: must be a positive number (got {tol})"))
            }
            Self::Vortex { max_iter: 0, .. } => Err("max_iter: must be at least 1".into()),
            _ => Ok(()),
        }
    }
}
