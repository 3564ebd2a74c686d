//! What a solve reports, whichever method ran: coefficients, spanwise values, flight values,
//! warnings and a method report carrying the method's own numbers.

use crate::atmosphere;
use crate::wing::{Condition, Geometry};

/// Local values at one spanwise point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpanPoint {
    /// Position, m.
    pub y: f64,
    /// Chord, m.
    pub chord: f64,
    /// Section lift coefficient.
    pub cl: f64,
    /// Span load c*cl/c_mean, with c_mean = S/b.
    pub span_load: f64,
    /// Induced angle (downwash positive), degrees.
    pub alpha_i_deg: f64,
    /// Circulation, m^2/s.
    pub gamma: f64,
    /// Local section cl_max.
    pub cl_max: f64,
    /// cl / cl_max.
    pub cl_ratio: f64,
    /// Whether the method judges the stall here: false where cl/cl_max has no meaning that
    /// converges (next to a pointed tip, where the chord goes to zero).
    pub stall_judged: bool,
    /// Past the section's stall: cl beyond cl_max, or on the falling side of its lift curve.
    pub past_stall: bool,
    /// Section pitching-moment coefficient about the quarter chord, positive nose up.
    pub cm: f64,
}

impl SpanPoint {
    /// True when the section is past its stall.
    #[must_use]
    pub const fn stalled(&self) -> bool {
        self.past_stall
    }
}

/// The integrated coefficients at one angle of attack (what a sweep returns per point).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Coefficients {
    /// Angle of attack of the reference line, degrees.
    pub alpha_deg: f64,
    /// Lift coefficient CL = L/(q S).
    pub cl: f64,
    /// Induced drag coefficient CDi = Di/(q S).
    pub cdi: f64,
    /// Profile drag coefficient from the section polars.
    pub cdp: f64,
    /// CDi + CDp.
    pub cd: f64,
    /// Induced-drag factor delta = 1/e - 1 (`None` at zero lift).
    pub delta: Option<f64>,
    /// Span efficiency e = CL^2/(pi AR CDi) (`None` at zero lift).
    pub e: Option<f64>,
    /// Rolling moment, positive right wing down.
    pub cl_roll: f64,
    /// Yawing moment, positive nose right: induced plus profile.
    pub cn: f64,
    /// Induced part of Cn.
    pub cn_induced: f64,
    /// Profile part of Cn.
    pub cn_profile: f64,
    /// Pitching moment about the reference point, positive nose up: Cm = M/(q S_ref c_ref)
    /// ([`super::moment`]).
    pub cm: f64,
}

/// One row of an alpha sweep.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SweepPoint {
    /// The coefficients there.
    pub coefficients: Coefficients,
    /// How many output points are past their section cl_max (0: no section stalled).
    pub stalled_points: usize,
}

/// Where cl first reaches cl_max, by the linear critical-section estimate: the first of the
/// solver's spanwise points to get there (a collocation or output point, not a wing station).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FirstStall {
    /// Spanwise position of that point, m.
    pub y: f64,
    /// Wing CL when that section reaches cl_max.
    pub cl_wing: f64,
    /// Angle of attack when it does, degrees.
    pub alpha_deg: f64,
}

/// The free stream of a condition in the 1976 standard atmosphere.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FreeStream {
    /// True airspeed, m/s.
    pub speed: f64,
    /// Geopotential altitude, m.
    pub altitude: f64,
    /// The air there.
    pub air: atmosphere::Air,
    /// Dynamic pressure q = rho V^2 / 2, Pa.
    pub q: f64,
    /// Mach number.
    pub mach: f64,
}

impl FreeStream {
    /// The free stream of `condition`.
    #[must_use]
    pub fn of(condition: &Condition) -> Self {
        let air = atmosphere::at(condition.altitude);
        let v = condition.speed;
        Self {
            speed: v,
            altitude: condition.altitude,
            air,
            q: 0.5 * air.density * v * v,
            mach: v / air.speed_of_sound,
        }
    }
}

/// How a wing's CL_max was found.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StallFoundBy {
    /// Alpha stepped up until the wing lift peaked.
    LiftPeak,
    /// Alpha stepped up until the solver could no longer converge; the highest lift reached.
    NoConvergence,
    /// The lift never peaks (linear sections): the wing CL when the first section reaches
    /// its cl_max (critical-section estimate).
    FirstSection,
    /// No section's lift rises with alpha: no stall to find.
    NoStall,
}

impl StallFoundBy {
    /// The report text (JSON `stall_found_by`).
    #[must_use]
    pub const fn as_str(self) -> &'static str {
        match self {
            Self::LiftPeak => "lift peak",
            Self::NoConvergence => "solver stopped converging",
            Self::FirstSection => "first section at cl_max",
            Self::NoStall => "no stall",
        }
    }
}

/// The wing's maximum lift coefficient and how it was found.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ClMax {
    /// CL_max.
    pub cl_max: f64,
    /// The angle of attack where it is reached, degrees.
    pub alpha_deg: f64,
    /// How it was found.
    pub found_by: StallFoundBy,
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
    /// Root bending moment of the right half, N m (JSON key `root_bending_moment_Nm`, kept as
    /// a contract). For an asymmetric load the halves differ: see the left half's beside it.
    pub right_root_bending_moment: f64,
    /// Left-half root bending moment, N m.
    pub left_root_bending_moment: f64,
}

impl Flight {
    /// The dimensional values of coefficients `c` on planform `g` at `condition`, with each
    /// half's root bending moment over q given as `(right, left)` in m^3.
    #[must_use]
    pub fn of(
        condition: &Condition,
        g: &Geometry,
        c: &Coefficients,
        bending_per_q: (f64, f64),
    ) -> Self {
        let s = FreeStream::of(condition);
        Self {
            speed: s.speed,
            altitude: s.altitude,
            air: s.air,
            q: s.q,
            mach: s.mach,
            reynolds_mac: s.air.density * s.speed * g.mac / s.air.viscosity,
            lift: s.q * g.area * c.cl,
            drag: s.q * g.area * c.cd,
            right_root_bending_moment: s.q * bending_per_q.0,
            left_root_bending_moment: s.q * bending_per_q.1,
        }
    }
}

/// How the method reached its answer, and its own numbers.
#[derive(Debug, Clone, PartialEq)]
pub struct MethodReport {
    /// The method's name, as printed in reports.
    pub name: &'static str,
    /// Its short name (`series`, `vortex`), as on the command line.
    pub short_name: &'static str,
    /// What the resolution counts, as a report key (`terms`, `panels`).
    pub resolution_key: &'static str,
    /// The resolution (sine terms, panels).
    pub resolution: usize,
    /// Iterations taken (0 for a direct solve).
    pub iterations: usize,
    /// Final residual of an iterative solve (`None` for a direct solve).
    pub residual: Option<f64>,
    /// Method-specific arrays under their report keys (e.g. the series coefficients).
    pub extras: Vec<(&'static str, Vec<f64>)>,
}

impl MethodReport {
    /// A solution is only made from a converged solve; non-convergence is an error instead.
    #[must_use]
    pub const fn converged(&self) -> bool {
        true
    }
}

/// Everything a solve reports.
#[derive(Debug, Clone)]
pub struct Solution {
    /// Integrated coefficients.
    pub coefficients: Coefficients,
    /// Lift-curve slope at this alpha, per radian.
    pub cl_alpha: f64,
    /// Lift-slope factor tau from a = a0/(1 + (a0/(pi AR))(1 + tau)), with a0 the
    /// area-weighted section slope.
    pub tau: f64,
    /// Planform.
    pub geometry: Geometry,
    /// Spanwise centre of lift of the right half, m.
    pub center_of_lift_y: f64,
    /// Right-half root bending moment over dynamic pressure, m^3.
    pub right_root_bending_per_q: f64,
    /// The first spanwise point to reach cl_max (not necessarily a station).
    pub first_stall: Option<FirstStall>,
    /// Values at the output points, left tip to right tip.
    pub spanwise: Vec<SpanPoint>,
    /// Values at the wing's stations.
    pub stations: Vec<SpanPoint>,
    /// Dimensional values.
    pub flight: Flight,
    /// The method, its resolution and convergence, and its own numbers.
    pub method: MethodReport,
    /// The wing's CL_max, when it was asked for.
    pub cl_max: Option<ClMax>,
    /// The reference quantities of Cm (the `[reference]` table, planform defaults).
    pub reference: crate::wing::ReferenceValues,
    /// Where lifting-line theory is weak for this case.
    pub warnings: Vec<String>,
}

impl Solution {
    /// Every output point (spanwise points and stations) past its cl_max, by position.
    #[must_use]
    pub fn stalled_y(&self) -> Vec<f64> {
        let mut ys: Vec<f64> = self
            .spanwise
            .iter()
            .chain(&self.stations)
            .filter(|p| p.stalled())
            .map(|p| p.y)
            .collect();
        ys.sort_by(f64::total_cmp);
        ys.dedup();
        ys
    }
}

/// The lift-slope factor tau of a = a0/(1 + (a0/(pi AR))(1 + tau)) for wing slope `cl_alpha`
/// and area-weighted section slope `a0` (Anderson, *Fundamentals of Aerodynamics*, eq. 5.70).
#[must_use]
pub fn tau(cl_alpha: f64, a0: f64, aspect_ratio: f64) -> f64 {
    (a0 / cl_alpha - 1.0) * std::f64::consts::PI * aspect_ratio / a0 - 1.0
}

/// Warnings that follow from a solution's flight values and local lift, for any method.
pub fn flight_warnings(flight: &Flight, spanwise: &[SpanPoint], out: &mut Vec<String>) {
    if flight.mach > super::compressibility::WARN_MACH {
        out.push(format!(
            "Mach {:.2} above {}: the Prandtl-Glauert correction grows unreliable toward transonic speeds",
            flight.mach,
            super::compressibility::WARN_MACH
        ));
    }
    if let Some(stall) = stall_warning(spanwise) {
        // The most important warning goes first: the workbench shows only the first.
        out.insert(0, stall);
    }
}

/// The warning for sections past their cl_max, naming where cl/cl_max peaks.
#[must_use]
pub fn stall_warning(spanwise: &[SpanPoint]) -> Option<String> {
    let stalled: Vec<&SpanPoint> = spanwise.iter().filter(|p| p.stalled()).collect();
    let (first, last) = (stalled.first()?, stalled.last()?);
    let peak = stalled
        .iter()
        .max_by(|a, b| a.cl_ratio.abs().total_cmp(&b.cl_ratio.abs()))?;
    // Where it peaks first: on a narrow screen that is the part still in view.
    Some(format!(
        "cl exceeds cl_max, most at y = {:.3} m (cl/cl_max {:.2}); {} points from y = {:.3} \
         to {:.3} m: past the stall the results are estimates",
        peak.y,
        peak.cl_ratio.abs(),
        stalled.len(),
        first.y,
        last.y
    ))
}
