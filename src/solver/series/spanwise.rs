//! Local values along the span from the sine-series coefficients.
//!
//! Every local value is linear in alpha (the A_n are), so each output point is evaluated once
//! per geometry as a value at zero alpha plus a slope, and a solve only combines the two.

use super::fourier::PairSums;
use crate::solver::controls::ControlSpan;
use crate::solver::solution::SpanPoint;
use crate::wing::Section;

/// The zero-alpha inputs a pointed tip's limit needs besides its section.
#[derive(Debug, Clone, Copy)]
pub struct LocalInputs<'a> {
    /// Both halves of every control.
    pub controls: &'a [ControlSpan],
    /// Steady roll rate pb/2V.
    pub roll_rate: f64,
}

/// (value at zero alpha, value per radian of alpha).
type Linear = (f64, f64);

fn at(value: Linear, alpha: f64) -> f64 {
    value.0 + alpha * value.1
}

/// One output point with its local values as linear functions of alpha.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LinearPoint {
    /// Position, m.
    pub y: f64,
    /// Chord, m.
    pub chord: f64,
    /// Local section cl_max.
    pub cl_max: f64,
    /// Section lift coefficient.
    pub cl: Linear,
    /// c*cl/c_mean.
    pub span_load: Linear,
    /// Induced angle, radians.
    pub alpha_i: Linear,
    /// Circulation per unit airspeed, m.
    pub gamma_per_speed: Linear,
    /// Section cm about the quarter chord (the linear section's constant `cm0`).
    pub cm: f64,
}

impl LinearPoint {
    /// The local values at `alpha` (radians) and airspeed `speed` (m/s).
    #[must_use]
    pub fn at(&self, alpha: f64, speed: f64) -> SpanPoint {
        let cl = at(self.cl, alpha);
        SpanPoint {
            y: self.y,
            chord: self.chord,
            cl,
            span_load: at(self.span_load, alpha),
            alpha_i_deg: at(self.alpha_i, alpha).to_degrees(),
            gamma: speed * at(self.gamma_per_speed, alpha),
            cl_max: self.cl_max,
            cl_ratio: cl / self.cl_max,
            past_stall: cl.abs() > self.cl_max,
            cm: self.cm,
        }
    }
}

/// One output point at `y` with section `section`, from the series sums there.
///
/// cl = 2 Gamma/(V c) = 4 b sum A_n sin(n theta) / c where the chord is non-zero; at a
/// pointed tip the section's own lift curve gives the limit, cl = a0 alpha_eff with
/// alpha_eff = alpha + twist - alpha_L0 + control shift + roll - alpha_i from the lifting-line
/// equation (only the alpha and alpha_i terms belong to the slope).
#[must_use]
pub fn linear_point(
    (y, section): (f64, &Section),
    sum: &PairSums,
    (span, mean_chord): (f64, f64),
    inputs: LocalInputs,
) -> LinearPoint {
    let ccl = (4.0 * span * sum.load.0, 4.0 * span * sum.load.1);
    let cl = if section.chord > 1e-9 {
        (ccl.0 / section.chord, ccl.1 / section.chord)
    } else {
        let shift: f64 = inputs
            .controls
            .iter()
            .filter(|c| (c.y_from..=c.y_to).contains(&y))
            .map(|c| c.alpha_increase)
            .sum();
        let zero_lift = section.airfoil.alpha_zero_lift_deg.to_radians();
        let a0 = section.airfoil.lift_slope;
        let roll = inputs.roll_rate * 2.0 * y / span;
        (
            a0 * (section.twist - zero_lift + shift + roll - sum.induced.0),
            a0 * (1.0 - sum.induced.1),
        )
    };
    LinearPoint {
        y,
        chord: section.chord,
        cl_max: section.airfoil.cl_max,
        cl,
        span_load: (ccl.0 / mean_chord, ccl.1 / mean_chord),
        alpha_i: sum.induced,
        gamma_per_speed: (2.0 * span * sum.load.0, 2.0 * span * sum.load.1),
        cm: section.airfoil.cm0,
    }
}

/// [`linear_point`] at each of `ys` with its section and series sums.
#[must_use]
pub fn linear_points(
    ys: &[f64],
    sections: &[Section],
    sums: &[PairSums],
    scales: (f64, f64),
    inputs: LocalInputs,
) -> Vec<LinearPoint> {
    ys.iter()
        .zip(sections)
        .zip(sums)
        .map(|((&y, section), sum)| linear_point((y, section), sum, scales, inputs))
        .collect()
}
