//! The stations' section properties with airfoils resolved once, for fast repeated look-ups.

use super::{Section, Wing};

/// Every station's [`Section`], in station order, interpolated like [`Wing::section_at`]
/// without looking airfoils up by key at each point (the solver asks hundreds of times).
#[derive(Debug, Clone)]
pub struct Sections {
    symmetric: bool,
    ys: Vec<f64>,
    rows: Vec<Section>,
}

impl Sections {
    /// Resolves a wing's stations. The wing must have at least two stations.
    #[must_use]
    pub fn of(wing: &Wing) -> Self {
        Self {
            symmetric: wing.symmetric,
            ys: wing.stations.iter().map(|s| s.y).collect(),
            rows: wing
                .stations
                .iter()
                .map(|s| wing.station_section(s))
                .collect(),
        }
    }

    /// Section properties at `y` (m), linear between stations, mirrored for a symmetric wing,
    /// clamped past the tips: the same rule as [`Wing::section_at`].
    #[must_use]
    pub fn at(&self, y: f64) -> Section {
        let y = if self.symmetric { y.abs() } else { y };
        let (upper, t) = super::model::bracket(&self.ys, |&s| s, y);
        self.rows[upper - 1].lerp(&self.rows[upper], t)
    }

    /// True when the stations describe the right half, mirrored.
    #[must_use]
    pub const fn symmetric(&self) -> bool {
        self.symmetric
    }

    /// Station positions, m, in increasing order (the right half for a symmetric wing).
    #[must_use]
    pub fn ys(&self) -> &[f64] {
        &self.ys
    }

    /// The section at each station, in station order.
    #[must_use]
    pub fn rows(&self) -> &[Section] {
        &self.rows
    }
}
