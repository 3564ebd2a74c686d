//! The linear washout (twist added from 0 at the root to -w at the tips) that minimises
//! induced drag at a design CL, or the least that makes the root stall first by a margin.

use super::study::Key;
use super::{at_cl, DesignError, SolveFn};
use crate::solver::Solution;
use crate::wing::Wing;

/// Most washout the root-first search tries, degrees.
const MOST_WASHOUT_DEG: f64 = 15.0;
/// Bisection steps of the root-first search (15 deg / 2^40: far below any use).
const BISECTIONS: usize = 40;

/// What the washout is for.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Goal {
    /// Least induced drag at the design CL.
    MinDrag,
    /// Least washout that keeps cl/cl_max everywhere on the outer half of each semispan at
    /// least this much below the root's at the first-stall CL (see [`stall_margin`]).
    RootFirst(f64),
}

impl Goal {
    /// Reads `min-drag` or `root-first:MARGIN` with MARGIN in [0, 1).
    ///
    /// # Errors
    /// A one-line message for anything else.
    pub fn parse(text: &str) -> Result<Self, String> {
        if text == "min-drag" {
            return Ok(Self::MinDrag);
        }
        let margin = text
            .strip_prefix("root-first:")
            .and_then(|m| m.parse::<f64>().ok())
            .ok_or_else(|| {
                format!("--washout: expected min-drag or root-first:MARGIN (got `{text}`)")
            })?;
        if (0.0..1.0).contains(&margin) {
            Ok(Self::RootFirst(margin))
        } else {
            Err(format!(
                "--washout root-first:MARGIN needs MARGIN in [0, 1) (got {margin})"
            ))
        }
    }

    /// How the goal is named on output.
    #[must_use]
    pub fn label(self) -> String {
        match self {
            Self::MinDrag => "min-drag".into(),
            Self::RootFirst(m) => format!("root-first:{m}"),
        }
    }
}

/// What a wing does at the design CL and at its first stall.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Outcome {
    /// Induced drag coefficient at the design CL.
    pub cdi: f64,
    /// Span efficiency at the design CL.
    pub e: Option<f64>,
    /// At the first-stall CL: the root's cl/cl_max less the highest on the outer halves
    /// (positive: the root stalls first); `None` when no section stalls.
    pub stall_margin: Option<f64>,
    /// Where the first section stalls, m.
    pub first_stall_y: Option<f64>,
}

/// The washout found and the wing before and after.
#[derive(Debug, Clone, PartialEq)]
pub struct WashoutDesign {
    /// Linear washout added, degrees (root 0, tips -this).
    pub washout_deg: f64,
    /// The wing with it.
    pub wing: Wing,
    /// Before.
    pub before: Outcome,
    /// After.
    pub after: Outcome,
}

/// Finds the washout for `goal` at design lift coefficient `cl`.
///
/// CDi at a fixed CL is a quadratic in the washout for a linear method (the loading is affine
/// in it), so three solves give the minimum; one more round about it absorbs any
/// nonlinearity. The root-first margin is found by bisection, assuming it grows with washout.
///
/// # Errors
/// [`DesignError::Impossible`] when CDi has no minimum in the washout or no washout up to
/// 15 deg gives the margin; solver errors as they come.
pub fn search(
    wing: &Wing,
    cl: f64,
    goal: Goal,
    solve: SolveFn,
) -> Result<WashoutDesign, DesignError> {
    let before = outcome(wing, cl, solve)?;
    let washout_deg = match goal {
        Goal::MinDrag => least_drag(wing, cl, solve)?,
        Goal::RootFirst(margin) => least_for_margin(wing, margin, solve)?,
    };
    let washed = with_washout(wing, washout_deg);
    let after = outcome(&washed, cl, solve)?;
    Ok(WashoutDesign {
        washout_deg,
        wing: washed,
        before,
        after,
    })
}

fn with_washout(wing: &Wing, washout_deg: f64) -> Wing {
    // The washout key cannot fail: it names nothing the wing might lack.
    Key::Washout
        .apply(wing, washout_deg)
        .unwrap_or_else(|_| wing.clone())
}

fn cdi_at(wing: &Wing, cl: f64, washout_deg: f64, solve: SolveFn) -> Result<f64, DesignError> {
    let w = with_washout(wing, washout_deg);
    Ok(solve(&w, &at_cl(&w, cl))?.coefficients.cdi)
}

fn least_drag(wing: &Wing, cl: f64, solve: SolveFn) -> Result<f64, DesignError> {
    let mut centre = 0.0;
    for _ in 0..2 {
        let c0 = cdi_at(wing, cl, centre - 1.0, solve)?;
        let c1 = cdi_at(wing, cl, centre, solve)?;
        let c2 = cdi_at(wing, cl, centre + 1.0, solve)?;
        let curvature = 0.5 * (c0 - 2.0 * c1 + c2);
        if curvature <= 0.0 || !curvature.is_finite() {
            return Err(DesignError::Impossible(
                "induced drag has no minimum in the washout for this wing".into(),
            ));
        }
        centre -= 0.5 * (c2 - c0) / (2.0 * curvature);
    }
    Ok(centre)
}

fn least_for_margin(wing: &Wing, margin: f64, solve: SolveFn) -> Result<f64, DesignError> {
    let margin_at = |w: f64| -> Result<f64, DesignError> {
        let washed = with_washout(wing, w);
        Ok(stall_margin(&washed, solve)?.unwrap_or(f64::NEG_INFINITY))
    };
    if margin_at(0.0)? >= margin {
        return Ok(0.0);
    }
    let most = margin_at(MOST_WASHOUT_DEG)?;
    if most < margin {
        return Err(DesignError::Impossible(format!(
            "even {MOST_WASHOUT_DEG} deg of washout leaves the root-first margin at {}: \
             taper or a different tip section is needed",
            crate::text::fixed(most, 3)
        )));
    }
    let (mut low, mut high) = (0.0, MOST_WASHOUT_DEG);
    for _ in 0..BISECTIONS {
        let mid = 0.5 * (low + high);
        if margin_at(mid)? >= margin {
            high = mid;
        } else {
            low = mid;
        }
    }
    Ok(high)
}

/// The root-first margin of a wing: solved at its first-stall CL, the root station's
/// cl/cl_max less the highest cl/cl_max on the outer half of either semispan (|2y/b| >= 1/2,
/// where the ailerons work; points next to the root cannot differ from it by any margin).
///
/// # Errors
/// As the solver.
pub fn stall_margin(wing: &Wing, solve: SolveFn) -> Result<Option<f64>, DesignError> {
    let first = solve(wing, &wing.condition)?.first_stall;
    let Some(stall) = first else {
        return Ok(None);
    };
    let at_stall = solve(wing, &at_cl(wing, stall.cl_wing))?;
    Ok(margin_of(&at_stall))
}

fn margin_of(s: &Solution) -> Option<f64> {
    let root = s
        .stations
        .iter()
        .min_by(|a, b| a.y.abs().total_cmp(&b.y.abs()))?;
    let g = &s.geometry;
    let outer = s
        .spanwise
        .iter()
        .filter(|p| (p.y - g.y_mid).abs() >= 0.25 * g.span)
        .map(|p| p.cl_ratio)
        .fold(f64::NEG_INFINITY, f64::max);
    outer.is_finite().then_some(root.cl_ratio - outer)
}

fn outcome(wing: &Wing, cl: f64, solve: SolveFn) -> Result<Outcome, DesignError> {
    let s = solve(wing, &at_cl(wing, cl))?;
    Ok(Outcome {
        cdi: s.coefficients.cdi,
        e: s.coefficients.e,
        stall_margin: stall_margin(wing, solve)?,
        first_stall_y: s.first_stall.map(|f| f.y),
    })
}
