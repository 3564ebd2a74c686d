//! The one-line result copied to the clipboard and the notebook.
//!
//! Temporary: this stands in for `crate::report::line` (the same line `solve --format line`
//! prints) until that lands; [`result_line`] is the only caller-facing function, so the swap
//! is one line.

use super::sanitize::clean;
use crate::solver::Solution;
use crate::wing::Wing;

/// The result line of a solved wing (inert text: the wing name is cleaned).
#[must_use]
pub fn result_line(wing: &Wing, s: &Solution) -> String {
    let c = &s.coefficients;
    let condition = match wing.condition.target_cl {
        Some(cl) => format!("CL target {cl} (alpha {:.3} deg)", c.alpha_deg),
        None => format!("alpha {} deg", wing.condition.alpha_deg),
    };
    let ld = if c.cd > 0.0 {
        format!("{:.1}", c.cl / c.cd)
    } else {
        "n/a".into()
    };
    let e = c.e.map_or_else(|| "n/a".into(), |e| format!("{e:.4}"));
    let stall = s.first_stall.map_or_else(
        || "stall n/a".to_string(),
        |f| format!("stall y {:.3} m at CL {:.3}", f.y, f.cl_wing),
    );
    format!(
        "{name} | {condition}, V {v} m/s, h {h} m | CL {cl:.4} CDi {cdi:.5} CD {cd:.5} L/D {ld} \
         e {e} CLa {cla:.3}/rad Cl_roll {roll:.5} Mroot {m:.1} N m {stall} | N={n}",
        name = clean(&wing.name),
        v = wing.condition.speed,
        h = wing.condition.altitude,
        cl = c.cl,
        cdi = c.cdi,
        cd = c.cd,
        cla = s.cl_alpha,
        roll = c.cl_roll,
        m = s.flight.root_bending_moment,
        n = s.terms,
    )
}
