//! Roll authority of a wing with ailerons: roll damping, aileron power and the steady roll
//! rate they give together.
//!
//! Sign conventions of the shared reference, section 1: Cl_roll positive right wing down,
//! roll rate pb/2V positive right wing down, aileron deflection the right half's, trailing
//! edge down positive. Roll damping Clp = dCl_roll/d(pb/2V) is negative; in a steady roll the
//! rolling moment is zero, so pb/2V = -Cl_roll(delta, p = 0)/Clp (Etkin & Reid, *Dynamics of
//! Flight*, 3rd ed., 1996, sec. 6.8, the steady-roll balance; from memory).

use super::{DesignError, SolveFn};
use crate::wing::{Condition, ControlKind, Wing};

/// Roll-rate step for the difference quotient of Clp (the linear methods are exact for any
/// step; the central difference keeps a nonlinear method second-order accurate).
const RATE_STEP: f64 = 0.01;
/// Aileron deflection step for Cl_delta, degrees.
const DEFLECTION_STEP_DEG: f64 = 1.0;

/// Roll damping, aileron power and steady roll rate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RollAuthority {
    /// Clp = dCl_roll/d(pb/2V), per unit pb/2V.
    pub clp: f64,
    /// dCl_roll/d(delta) with every aileron deflected together, per radian.
    pub cl_delta_per_rad: f64,
    /// Steady roll rate pb/2V at the file's deflections.
    pub pb_2v: f64,
}

/// The roll authority of `wing` at `condition` (its alpha or target CL; its own roll rate
/// ignored), or `None` for a wing with no aileron.
///
/// # Errors
/// As the solver.
pub fn roll_authority(
    wing: &Wing,
    condition: &Condition,
    solve: SolveFn,
) -> Result<Option<RollAuthority>, DesignError> {
    if !wing.controls.iter().any(|c| c.kind == ControlKind::Aileron) {
        return Ok(None);
    }
    let still = Condition {
        roll_rate: 0.0,
        ..*condition
    };
    let rolling = |rate: f64| Condition {
        roll_rate: rate,
        ..still
    };
    let cl_roll = |w: &Wing, c: &Condition| solve(w, c).map(|s| s.coefficients.cl_roll);
    let clp = (cl_roll(wing, &rolling(RATE_STEP))? - cl_roll(wing, &rolling(-RATE_STEP))?)
        / (2.0 * RATE_STEP);
    let up = cl_roll(&ailerons_moved(wing, DEFLECTION_STEP_DEG), &still)?;
    let down = cl_roll(&ailerons_moved(wing, -DEFLECTION_STEP_DEG), &still)?;
    let cl_delta_per_rad = (up - down) / (2.0 * DEFLECTION_STEP_DEG.to_radians());
    let pb_2v = if clp == 0.0 {
        0.0
    } else {
        -cl_roll(wing, &still)? / clp
    };
    Ok(Some(RollAuthority {
        clp,
        cl_delta_per_rad,
        pb_2v,
    }))
}

/// The wing with every aileron's deflection moved by `step_deg`.
fn ailerons_moved(wing: &Wing, step_deg: f64) -> Wing {
    let mut w = wing.clone();
    for c in &mut w.controls {
        if c.kind == ControlKind::Aileron {
            // The difference is taken about a deflection that keeps both ends within the
            // valid range; the model is linear in deflection, so the slope is the same.
            let limit = crate::wing::validate::MAX_ALPHA_DEG - DEFLECTION_STEP_DEG;
            c.deflection_deg = c.deflection_deg.clamp(-limit, limit) + step_deg;
        }
    }
    w
}
