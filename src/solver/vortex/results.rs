//! Coefficients, spanwise values and the solution from a converged vortex state.
//!
//! Lift from the Kutta-Joukowski force in the freestream, CL = (2/S) sum g_i dy_i; induced drag
//! in the Trefftz plane, CDi = -(1/S) sum g_i v_n,i ds_i, with v_n the normal velocity of the
//! trailing legs taken as infinite lines (Katz & Plotkin, *Low-Speed Aerodynamics*, 2nd ed.,
//! sec. 8.3); the lifting-line induced angle is half the Trefftz-plane downwash.

use super::panels::Vec3;
use super::{Prepared, State, METHOD};
use crate::solver::solution::{
    self, Coefficients, FirstStall, Flight, MethodReport, Solution, SpanPoint,
};
use crate::wing::Condition;

/// One panel's share of the integrals.
struct Strip {
    y: f64,
    z: f64,
    dy: f64,
    dz: f64,
    ds: f64,
}

/// Past the stall: cl beyond cl_max, or a lifting section on the falling side of its curve.
fn past_stall((cl, slope): (f64, f64), cl_max: f64) -> bool {
    cl.abs() > cl_max || (slope <= 0.0 && cl != 0.0)
}

impl Prepared {
    fn strips(&self) -> Vec<Strip> {
        self.panels
            .edges
            .windows(2)
            .zip(&self.panels.points)
            .map(|(e, p)| {
                let d: Vec3 = std::array::from_fn(|k| e[1][k] - e[0][k]);
                Strip {
                    y: p.at[1],
                    z: p.at[2],
                    dy: d[1],
                    dz: d[2],
                    ds: d[1].hypot(d[2]),
                }
            })
            .collect()
    }

    /// The lifting-line induced angle at each control point, radians, downwash positive.
    fn induced_angles(&self, g: &[f64]) -> Vec<f64> {
        let n = g.len();
        (0..n)
            .map(|i| {
                let row = &self.influence.trefftz[i * n..(i + 1) * n];
                -0.5 * row.iter().zip(g).map(|(t, gj)| t * gj).sum::<f64>()
            })
            .collect()
    }

    /// Integrated coefficients of a converged state.
    pub(super) fn coefficients(&self, state: &State) -> Coefficients {
        let g = &state.g;
        let (area, span) = (self.geometry.area, self.geometry.span);
        let alpha_i = self.induced_angles(g);
        let strips = self.strips();
        let (mut cl, mut cdi, mut cdp, mut roll, mut cn_i, mut cn_p) =
            (0.0, 0.0, 0.0, 0.0, 0.0, 0.0);
        for (i, s) in strips.iter().enumerate() {
            let p = &self.panels.points[i];
            // A linear section's polar is taken at the solved cl (Mach-corrected); a table's
            // cd at the section's own angle.
            let cd = if p.section.curves.is_some() {
                p.section.profile_drag(state.alpha_eff[i])
            } else {
                let (a, cl) = (&p.section.airfoil, state.cl[i].0);
                a.cd0 + a.cd1 * cl + a.cd2 * cl * cl
            };
            cl += 2.0 * g[i] * s.dy;
            cdi += 2.0 * g[i] * alpha_i[i] * s.ds;
            cdp += p.section.chord * cd * s.ds;
            roll -= 2.0 * g[i] * (s.y * s.dy + s.z * s.dz);
            cn_i += 2.0 * g[i] * alpha_i[i] * s.y * s.ds;
            cn_p += p.section.chord * cd * s.y * s.ds;
        }
        let (cl, cdi, cdp) = (cl / area, cdi / area, cdp / area);
        let ar = self.geometry.aspect_ratio;
        let e =
            (cl.abs() > 1e-11 && cdi > 0.0).then(|| cl * cl / (std::f64::consts::PI * ar * cdi));
        let (cn_induced, cn_profile) = (cn_i / (area * span), cn_p / (area * span));
        let cm = self.moment.cm(&self.span_points(state, 1.0, &alpha_i));
        Coefficients {
            alpha_deg: state.alpha.to_degrees(),
            cl,
            cdi,
            cdp,
            cd: cdi + cdp,
            delta: e.map(|e| 1.0 / e - 1.0),
            e,
            cl_roll: roll / (area * span),
            cn: cn_induced + cn_profile,
            cn_induced,
            cn_profile,
            cm,
        }
    }

    /// Control points past their section cl_max.
    pub(super) fn stalled_points(&self, state: &State) -> usize {
        self.panels
            .points
            .iter()
            .zip(&state.cl)
            .filter(|(p, &cl)| past_stall(cl, p.section.airfoil.cl_max))
            .count()
    }

    /// The critical-section estimate from the local linearisation: each control point's cl
    /// moves by 2 (dg/dalpha) / c per radian; the first to reach cl_max, and the wing CL then.
    pub(super) fn first_stall(&self, state: &State) -> Option<FirstStall> {
        let cl_alpha = self.lift_of(&state.g_per_alpha);
        let mut best: Option<(f64, f64)> = None;
        for (i, p) in self.panels.points.iter().enumerate().rev() {
            let chord = p.section.chord;
            if chord <= 1e-9 {
                continue;
            }
            let slope = 2.0 * state.g_per_alpha[i] / chord;
            if slope <= 1e-9 {
                continue;
            }
            let step = (p.section.airfoil.cl_max - state.cl[i].0) / slope;
            if best.is_none_or(|(s, _)| step < s - 1e-12) {
                best = Some((step, p.at[1]));
            }
        }
        best.map(|(step, y)| FirstStall {
            y,
            cl_wing: self.lift_of(&state.g) + cl_alpha * step,
            alpha_deg: (state.alpha + step).to_degrees(),
        })
    }

    /// Where a section runs outside the angles its airfoil table gives (the table's end values
    /// are held there, so the result rests on no data): the first such point, as a warning.
    fn beyond_table_warning(&self, state: &State) -> Option<String> {
        self.panels
            .points
            .iter()
            .zip(&state.alpha_eff)
            .find_map(|(p, &alpha)| {
                let (low, high) = p.section.data_range()?;
                (alpha < low || alpha > high).then(|| {
                    format!(
                        "section angle of attack {:.1} deg at y = {:.3} m is beyond its airfoil \
                         table ({:.1} to {:.1} deg): the table's end values are held there",
                        alpha.to_degrees(),
                        p.at[1],
                        low.to_degrees(),
                        high.to_degrees()
                    )
                })
            })
    }

    fn span_points(&self, state: &State, speed: f64, alpha_i: &[f64]) -> Vec<SpanPoint> {
        let mean_chord = self.geometry.mean_chord;
        self.panels
            .points
            .iter()
            .enumerate()
            .map(|(i, p)| {
                let cl = state.cl[i].0;
                let cl_max = p.section.airfoil.cl_max;
                SpanPoint {
                    y: p.at[1],
                    chord: p.section.chord,
                    cl,
                    span_load: 2.0 * state.g[i] / mean_chord,
                    alpha_i_deg: alpha_i[i].to_degrees(),
                    gamma: speed * state.g[i],
                    cl_max,
                    cl_ratio: cl / cl_max,
                    stall_judged: true,
                    past_stall: past_stall(state.cl[i], cl_max),
                    cm: p.section.moment(state.alpha_eff[i]),
                }
            })
            .collect()
    }

    /// Values at the stations, linear in y between the control points, the circulation going
    /// to zero at the tips.
    fn station_points(&self, points: &[SpanPoint]) -> Vec<SpanPoint> {
        let edges = &self.panels.edges;
        let (left, right) = (edges[0][1], edges[edges.len() - 1][1]);
        let mut knots: Vec<SpanPoint> = Vec::with_capacity(points.len() + 2);
        let tip = |y: f64, near: &SpanPoint| SpanPoint {
            y,
            gamma: 0.0,
            span_load: 0.0,
            ..*near
        };
        knots.push(tip(left, &points[0]));
        knots.extend_from_slice(points);
        knots.push(tip(right, &points[points.len() - 1]));
        self.station_chords
            .iter()
            .map(|&(y, chord)| {
                let (upper, t) = crate::wing::bracket(&knots, |k| k.y, y);
                let (a, b) = (&knots[upper - 1], &knots[upper]);
                let mix = |p: f64, q: f64| p + (q - p) * t;
                let gamma = mix(a.gamma, b.gamma);
                let span_load = mix(a.span_load, b.span_load);
                let cl = if chord > 1e-9 {
                    span_load * self.geometry.mean_chord / chord
                } else {
                    mix(a.cl, b.cl)
                };
                let cl_max = mix(a.cl_max, b.cl_max);
                SpanPoint {
                    y,
                    chord,
                    cl,
                    span_load,
                    alpha_i_deg: mix(a.alpha_i_deg, b.alpha_i_deg),
                    gamma,
                    cl_max,
                    cl_ratio: cl / cl_max,
                    stall_judged: a.stall_judged && b.stall_judged,
                    past_stall: cl.abs() > cl_max || (a.past_stall && b.past_stall),
                    cm: mix(a.cm, b.cm),
                }
            })
            .collect()
    }

    /// The full solution of a converged state at `condition`.
    pub(super) fn solution(&self, state: &State, condition: &Condition) -> Solution {
        let coefficients = self.coefficients(state);
        let g = &self.geometry;
        let alpha_i = self.induced_angles(&state.g);
        let spanwise = self.span_points(state, condition.speed, &alpha_i);
        let stations = self.station_points(&spanwise);
        let (mut right_lift, mut right, mut left) = (0.0, 0.0, 0.0);
        for (s, gi) in self.strips().iter().zip(&state.g) {
            let lift = 2.0 * gi * s.dy;
            if s.y > 0.0 {
                right_lift += lift;
                right += lift * s.y;
            } else {
                left -= lift * s.y;
            }
        }
        let flight = Flight::of(condition, g, &coefficients, (right, left));
        let cl_alpha = self.lift_of(&state.g_per_alpha);
        let mean_slope: f64 = self
            .panels
            .points
            .iter()
            .zip(self.strips())
            .zip(&state.cl)
            .map(|((p, s), cl)| p.section.chord * cl.1 * s.dy)
            .sum::<f64>()
            / g.area;
        let mut warnings = self.warnings.clone();
        solution::flight_warnings(&flight, &spanwise, &mut warnings);
        warnings.extend(self.beyond_table_warning(state));
        Solution {
            coefficients,
            cl_alpha,
            tau: solution::tau(cl_alpha, mean_slope, g.aspect_ratio),
            geometry: *g,
            center_of_lift_y: if right_lift.abs() > 1e-12 {
                right / right_lift
            } else {
                f64::NAN
            },
            right_root_bending_per_q: right,
            first_stall: self.first_stall(state),
            spanwise,
            stations,
            flight,
            method: MethodReport {
                name: METHOD,
                short_name: "vortex",
                resolution_key: "panels",
                resolution: self.panels.len(),
                iterations: state.iterations,
                residual: Some(state.residual),
                extras: Vec::new(),
            },
            cl_max: None,
            reference: *self.moment.reference(),
            warnings,
        }
    }
}
