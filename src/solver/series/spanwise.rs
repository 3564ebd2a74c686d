//! Local values along the span from the sine-series coefficients.
//!
//! Every local value is linear in alpha (the A_n are), so each output point is evaluated once
//! per geometry as a value at zero alpha plus a slope, and a solve only combines the two.

use super::fourier::PairSums;
use crate::solver::controls::ControlSpan;
use crate::solver::solution::SpanPoint;
use crate::wing::Section;

/// The zero-alpha inputs a pointed tip's limit needs besides its section, and where cl/cl_max
/// means something.
#[derive(Debug, Clone, Copy)]
pub struct LocalInputs<'a> {
    /// Both halves of every control.
    pub controls: &'a [ControlSpan],
    /// Steady roll rate pb/2V.
    pub roll_rate: f64,
    /// Where the stall is judged.
    pub stall_region: StallRegion,
}

/// Fraction of the mean chord below which a section next to a pointed tip is left out of the
/// stall estimate.
///
/// Where the chord goes to zero the lifting-line cl = c cl / c has no finite limit: with a
/// chord that falls linearly to the tip the load does too, its slope jumps to zero at the
/// tip and the induced angle there is logarithmically infinite (an upwash), so cl grows
/// without bound toward the tip, and the series' cl near the tip grows like log N with the
/// term count. Judging cl/cl_max only where the chord is at least this fraction of the mean
/// chord gives a first-stall estimate that converges with N (docs/theory.md, section 6).
pub const POINTED_TIP_CHORD_FRACTION: f64 = 0.25;

/// The part of the span where cl/cl_max is judged: all of it, less the sections next to a
/// pointed tip whose chord is below a floor.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StallRegion {
    /// Span midpoint, m: the side of a point decides which tip it belongs to.
    pub y_mid: f64,
    /// Least chord judged on the left half (0 when its tip is not pointed), m.
    pub left_floor: f64,
    /// Least chord judged on the right half, m.
    pub right_floor: f64,
}

impl StallRegion {
    /// The region of a wing with these tip chords and this mean chord.
    #[must_use]
    pub fn of(y_mid: f64, (left_tip, right_tip): (f64, f64), mean_chord: f64) -> Self {
        let floor = |tip: f64| {
            if tip <= 1e-9 {
                POINTED_TIP_CHORD_FRACTION * mean_chord
            } else {
                0.0
            }
        };
        Self {
            y_mid,
            left_floor: floor(left_tip),
            right_floor: floor(right_tip),
        }
    }

    /// The edges of the judged part next to each pointed tip: the position nearest the tip
    /// where the chord of `stations` (sorted by y; the right half when `mirrored`) reaches
    /// the floor. The first stall of such a wing usually lies there, so it is judged there
    /// exactly rather than at whichever collocation point happens to fall near it.
    #[must_use]
    pub fn edges(&self, stations: &[(f64, f64)], mirrored: bool) -> Vec<f64> {
        let mut out = Vec::new();
        if self.right_floor > 0.0 {
            if let Some(y) = crossing(stations.iter().rev(), self.right_floor) {
                out.push(y);
                if mirrored {
                    out.push(2.0 * self.y_mid - y);
                }
            }
        }
        if self.left_floor > 0.0 && !mirrored {
            out.extend(crossing(stations.iter(), self.left_floor));
        }
        out
    }

    /// Whether cl/cl_max is judged at position `y` with chord `chord`.
    #[must_use]
    pub fn judges(&self, y: f64, chord: f64) -> bool {
        let floor = if y < self.y_mid {
            self.left_floor
        } else {
            self.right_floor
        };
        chord >= floor
    }
}

/// (value at zero alpha, value per radian of alpha).
type Linear = (f64, f64);

fn at(value: Linear, alpha: f64) -> f64 {
    value.0 + alpha * value.1
}

/// Walking from a tip inward over `(y, chord)` stations, where the chord first reaches
/// `floor` (linear between stations).
fn crossing<'a>(mut from_tip: impl Iterator<Item = &'a (f64, f64)>, floor: f64) -> Option<f64> {
    let mut outer = *from_tip.next()?;
    for &inner in from_tip {
        if inner.1 >= floor {
            let t = (floor - outer.1) / (inner.1 - outer.1);
            return Some(outer.0 + t * (inner.0 - outer.0));
        }
        outer = inner;
    }
    None
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
    /// Whether cl/cl_max is judged here (not next to a pointed tip).
    pub stall_judged: bool,
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
            stall_judged: self.stall_judged,
            past_stall: self.stall_judged && cl.abs() > self.cl_max,
            cm: self.cm,
        }
    }

    /// The alpha (radians) at which this point reaches its cl_max, if it is judged and its
    /// lift grows with alpha.
    #[must_use]
    pub fn stall_alpha(&self) -> Option<f64> {
        let (zero, slope) = self.cl;
        (self.stall_judged && slope > 1e-9).then(|| (self.cl_max - zero) / slope)
    }

    /// Whether this point is judged and past its cl_max (either sign) at `alpha`.
    #[must_use]
    pub fn stalled_at(&self, alpha: f64) -> bool {
        self.stall_judged && at(self.cl, alpha).abs() > self.cl_max
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
        stall_judged: inputs.stall_region.judges(y, section.chord),
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
