//! The pitching moment about the reference point, integrated from a solution's spanwise
//! values: the same module for every method, which feeds it its output points.
//!
//! Each section's lift acts at its quarter chord `x_le + c/4`, and the section adds its own
//! moment about that point, `q c^2 cm`. With x aft and the moment positive nose up,
//!
//! M / q = integral of [ c^2 cm - (x_le + c/4 - x_ref) c cl ] dy,   Cm = M / (q S_ref c_ref)
//!
//! (the strip form of the pitching moment: Anderson, *Fundamentals of Aerodynamics*, the
//! moment about a point from the aerodynamic-centre lift and cm_ac, applied strip by strip;
//! common practice). Left out: the drag's and the dihedral heights' lever arms, and the tilt of
//! the lift with alpha, all second order at the angles lifting-line theory serves.

use super::solution::SpanPoint;
use crate::wing::{Geometry, ReferenceValues, Sections, Wing};

/// What the moment integral needs of a wing besides the spanwise values.
#[derive(Debug, Clone)]
pub struct MomentFrame {
    reference: ReferenceValues,
    sections: Sections,
    /// `(y_left_tip, y_right_tip)`.
    tips: (f64, f64),
}

impl MomentFrame {
    /// The frame of a wing: its reference quantities and sections.
    #[must_use]
    pub fn of(wing: &Wing, geometry: &Geometry) -> Self {
        Self {
            reference: wing.reference.values(wing, geometry),
            sections: Sections::of(wing),
            tips: wing.span_ends(),
        }
    }

    /// The reference quantities used.
    #[must_use]
    pub const fn reference(&self) -> &ReferenceValues {
        &self.reference
    }

    /// Cm from output points spread along the span (any order, any spacing, tips excluded or
    /// not). The lift term is integrated by the trapezoid rule in theta, y = y_mid -
    /// (b/2) cos(theta), where the load's square-root fall to the tips is smooth and the
    /// integrand vanishes at both ends; the sections' own moments by the trapezoid rule in y,
    /// out to the tips with the outermost points' cm.
    #[must_use]
    pub fn cm(&self, points: &[SpanPoint]) -> f64 {
        let mut sorted: Vec<&SpanPoint> = points.iter().collect();
        sorted.sort_by(|a, b| a.y.total_cmp(&b.y));
        let r = &self.reference;
        (self.own_moments(&sorted) - self.lift_moment(&sorted)) / (r.area * r.chord)
    }

    /// integral of (x_le + c/4 - x_ref) c cl dy.
    fn lift_moment(&self, sorted: &[&SpanPoint]) -> f64 {
        let (left, right) = self.tips;
        let (mid, half) = (0.5 * (left + right), 0.5 * (right - left));
        let mut nodes = vec![(0.0, 0.0)];
        for p in sorted {
            let theta = (-(p.y - mid) / half).clamp(-1.0, 1.0).acos();
            let arm = self.sections.at(p.y).x_le + 0.25 * p.chord - self.reference.x;
            nodes.push((theta, arm * p.chord * p.cl * half * theta.sin()));
        }
        nodes.push((std::f64::consts::PI, 0.0));
        trapezoid(&nodes)
    }

    /// integral of c^2 cm dy.
    fn own_moments(&self, sorted: &[&SpanPoint]) -> f64 {
        let (Some(first), Some(last)) = (sorted.first(), sorted.last()) else {
            return 0.0;
        };
        let (left, right) = self.tips;
        let edge = |y: f64, cm: f64| {
            let c = self.sections.at(y).chord;
            (y, c * c * cm)
        };
        let mut nodes = vec![edge(left, first.cm)];
        nodes.extend(sorted.iter().map(|p| (p.y, p.chord * p.chord * p.cm)));
        nodes.push(edge(right, last.cm));
        trapezoid(&nodes)
    }
}

/// The trapezoid rule over `(x, f)` nodes in increasing x.
fn trapezoid(nodes: &[(f64, f64)]) -> f64 {
    nodes
        .windows(2)
        .map(|w| 0.5 * (w[1].0 - w[0].0) * (w[0].1 + w[1].1))
        .sum()
}
