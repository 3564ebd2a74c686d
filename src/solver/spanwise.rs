//! Local values along the span from the sine-series coefficients.

use super::controls::ControlSpan;
use super::fourier::{series_at, series_pair_at, SpanMap};
use crate::wing::Wing;

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
}

/// Evaluates local values for one wing and speed.
pub struct Evaluator {
    map: SpanMap,
    mean_chord: f64,
    speed: f64,
    controls: Vec<ControlSpan>,
    sections: crate::wing::Sections,
}

impl Evaluator {
    pub fn new(wing: &Wing, map: SpanMap, mean_chord: f64, speed: f64) -> Self {
        Self {
            map,
            mean_chord,
            speed,
            controls: super::controls::spans(&wing.controls),
            sections: crate::wing::Sections::of(wing),
        }
    }

    /// Local values at angle `theta` for coefficients `a`.
    ///
    /// cl = 2 Gamma/(V c) = 4 b sum A_n sin(n theta) / c where the chord is non-zero; at a
    /// pointed tip the section's own lift curve gives the limit,
    /// cl = a0 (alpha_eff) with alpha_eff from the lifting-line equation.
    /// `alpha` (radians) is the reference angle that `a` belongs to, used only at a pointed tip.
    /// `ratios` is scratch space of the series' length.
    pub fn at_theta(&self, a: &[f64], theta: f64, alpha: f64, ratios: &mut [f64]) -> SpanPoint {
        let (load, induced) = series_at(a, theta, ratios);
        let y = self.map.y(theta);
        let section = self.sections.at(y);
        let span = 2.0 * self.map.half_span;
        let ccl = 4.0 * span * load;
        let cl = if section.chord > 1e-9 {
            ccl / section.chord
        } else {
            let shift: f64 = self
                .controls
                .iter()
                .filter(|c| (c.y_from..=c.y_to).contains(&y))
                .map(|c| c.alpha_increase)
                .sum();
            let zero_lift = section.airfoil.alpha_zero_lift_deg.to_radians();
            section.airfoil.lift_slope * (alpha + section.twist - zero_lift + shift - induced)
        };
        let cl_max = section.airfoil.cl_max;
        SpanPoint {
            y,
            chord: section.chord,
            cl,
            span_load: ccl / self.mean_chord,
            alpha_i_deg: induced.to_degrees(),
            gamma: 2.0 * span * self.speed * load,
            cl_max,
            cl_ratio: cl / cl_max,
        }
    }

    /// The section cl at `theta` split as `(d cl / d alpha, cl at zero alpha, cl_max, y)` from
    /// the two responses; `None` where the chord is zero (a pointed tip).
    pub fn cl_parts(
        &self,
        per_alpha: &[f64],
        at_zero: &[f64],
        theta: f64,
        ratios: &mut [f64],
    ) -> Option<(f64, f64, f64, f64)> {
        let y = self.map.y(theta);
        let section = self.sections.at(y);
        if section.chord <= 1e-9 {
            return None;
        }
        let [(slope, _), (zero, _)] = series_pair_at(per_alpha, at_zero, theta, ratios);
        let scale = 8.0 * self.map.half_span / section.chord;
        Some((scale * slope, scale * zero, section.airfoil.cl_max, y))
    }
}
