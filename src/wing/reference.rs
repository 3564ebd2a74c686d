//! The reference quantities of the pitching moment: area, span, chord and the moment point,
//! each given in the wing file's `[reference]` table or taken from the planform.

use super::{Geometry, Wing};

/// The `[reference]` table as given: each value is optional.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Reference {
    /// Reference area, m^2 (default: the planform area).
    pub area: Option<f64>,
    /// Reference span, m (default: the span).
    pub span: Option<f64>,
    /// Reference chord, m (default: the mean aerodynamic chord).
    pub chord: Option<f64>,
    /// x of the moment point, m aft (default: the quarter chord of the mean aerodynamic
    /// chord, at its spanwise station).
    pub x: Option<f64>,
}

/// The reference quantities with every default filled in.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ReferenceValues {
    /// Area, m^2.
    pub area: f64,
    /// Span, m.
    pub span: f64,
    /// Chord, m.
    pub chord: f64,
    /// x of the moment point, m.
    pub x: f64,
}

impl Reference {
    /// True when the file gives none of the values.
    #[must_use]
    pub fn is_empty(&self) -> bool {
        *self == Self::default()
    }

    /// The values, defaults taken from the wing's planform.
    #[must_use]
    pub fn values(&self, wing: &Wing, geometry: &Geometry) -> ReferenceValues {
        ReferenceValues {
            area: self.area.unwrap_or(geometry.area),
            span: self.span.unwrap_or(geometry.span),
            chord: self.chord.unwrap_or(geometry.mac),
            x: self.x.unwrap_or_else(|| default_x(wing, geometry)),
        }
    }
}

/// The quarter chord of the mean aerodynamic chord, placed at the station `y_mac` of the
/// planform (its leading edge there, plus a quarter of the MAC).
fn default_x(wing: &Wing, geometry: &Geometry) -> f64 {
    wing.section_at(geometry.y_mac).x_le + 0.25 * geometry.mac
}
