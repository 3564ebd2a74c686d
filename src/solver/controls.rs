//! Control surfaces as a shift of the section zero-lift angle (thin-airfoil theory).

use crate::wing::{Control, ControlKind};

/// Thin-airfoil flap effectiveness tau_f = d(alpha_L0)/d(delta) magnitude for a plain flap of
/// chord ratio `e` = c_f/c: with cos(theta_h) = 2E - 1,
/// tau_f = 1 - (theta_h - sin(theta_h))/pi.
///
/// Source: Abbott & von Doenhoff, *Theory of Wing Sections* (1959), sec. 8.2; Houghton &
/// Carpenter, *Aerodynamics for Engineering Students*, eq. 4.52.
#[must_use]
pub fn thin_airfoil_effectiveness(chord_fraction: f64) -> f64 {
    let theta_h = (2.0 * chord_fraction - 1.0).clamp(-1.0, 1.0).acos();
    1.0 - (theta_h - theta_h.sin()) / std::f64::consts::PI
}

/// The effectiveness used for a control: the file's factor, or the thin-airfoil value.
#[must_use]
pub fn effectiveness(control: &Control) -> f64 {
    control
        .effectiveness
        .unwrap_or_else(|| thin_airfoil_effectiveness(control.chord_fraction))
}

/// One side of one control as an interval of y with its deflection (radians).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ControlSpan {
    /// Lower y edge, m.
    pub y_from: f64,
    /// Upper y edge, m.
    pub y_to: f64,
    /// Increase of the section's effective angle, radians (tau * delta).
    pub alpha_increase: f64,
}

/// Both halves of every control as y intervals: the right half as given, the left mirrored,
/// an aileron's left half deflected the opposite way.
#[must_use]
pub fn spans(controls: &[Control]) -> Vec<ControlSpan> {
    let mut out = Vec::with_capacity(2 * controls.len());
    for c in controls {
        let increase = effectiveness(c) * c.deflection_deg.to_radians();
        let left = match c.kind {
            ControlKind::Flap => increase,
            ControlKind::Aileron => -increase,
        };
        out.push(ControlSpan {
            y_from: c.y_inner,
            y_to: c.y_outer,
            alpha_increase: increase,
        });
        out.push(ControlSpan {
            y_from: -c.y_outer,
            y_to: -c.y_inner,
            alpha_increase: left,
        });
    }
    out
}
